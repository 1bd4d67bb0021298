package server

import (
	"bufio"
	"bytes"
	"context"
	"io"
	"strings"
	"testing"

	"go.lsp.dev/jsonrpc2"
)

// FuzzStream feeds arbitrary bytes to the server's reader: it must never
// panic, must end (every Read consumes input or fails), and every frame it
// cannot read must be answered with a JSON-RPC error frame.
//
//	go test ./server -run XXX -fuzz FuzzStream -fuzztime 60s
func FuzzStream(f *testing.F) {
	f.Add([]byte(frame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{}}`)))
	f.Add([]byte(frame(`{"jsonrpc":"2.0","method":"exit"}`) + frame(`{bad`)))
	f.Add([]byte("Content-Length: 5\r\n\r\n{}{}{"))
	f.Add([]byte("Content-Length: -3\r\n\r\n"))
	f.Add([]byte("Content-Length: 99999999999\r\n\r\nxx"))
	f.Add([]byte("\r\n\r\nno header"))
	f.Add([]byte(frame(`{"jsonrpc":"2.0","id":[1],"method":"x"}`)))
	f.Fuzz(func(t *testing.T, data []byte) {
		var out bytes.Buffer
		s := &stream{in: bufio.NewReader(bytes.NewReader(data)), out: &out, closer: io.NopCloser(nil), limit: 1 << 16}
		for i := 0; ; i++ {
			if i > len(data)+1 {
				t.Fatalf("more reads (%d) than input bytes (%d): the reader does not advance", i, len(data))
			}
			msg, _, err := s.Read(context.Background())
			if err != nil {
				break
			}
			if msg == nil {
				t.Fatal("nil message without an error")
			}
		}
		// Whatever was answered is well-framed JSON-RPC.
		r := &stream{in: bufio.NewReader(&out)}
		for {
			body, _, err := r.readFrame()
			if err != nil {
				break
			}
			if !strings.Contains(string(body), `"error":{"code":-32`) {
				t.Fatalf("answer %q is not a JSON-RPC error", body)
			}
			if _, err := jsonrpc2.DecodeMessage(body); err != nil && !strings.Contains(string(body), `"id":null`) {
				t.Fatalf("answer %q does not decode: %v", body, err)
			}
		}
	})
}

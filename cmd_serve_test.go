package main

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"
)

// `walden serve` speaks LSP on stdout and nothing else: every byte it
// writes there belongs to a Content-Length frame, its log goes to stderr,
// and it exits 0 after shutdown and exit (LSP 3.17, "exit Notification").
func TestServeWritesOnlyFramesToStdout(t *testing.T) {
	in, toServer := io.Pipe()
	var stdout, stderr bytes.Buffer
	done := make(chan int, 1)
	go func() { done <- run([]string{"serve"}, in, &stdout, &stderr) }()
	send := func(body string) {
		fmt.Fprintf(toServer, "Content-Length: %d\r\n\r\n%s", len(body), body)
	}
	send(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`)
	send(`{"jsonrpc":"2.0","method":"initialized","params":{}}`)
	send(`{"jsonrpc":"2.0","method":"textDocument/didOpen","params":{"textDocument":{"uri":"file:///lab/p.md","languageId":"markdown","version":1,"text":"` + "```reaction\\nCCBr + NaI, acetone\\n```\\n" + `"}}}`)
	send(`{"jsonrpc":"2.0","id":2,"method":"shutdown"}`)
	send(`{"jsonrpc":"2.0","method":"exit"}`)
	select {
	case code := <-done:
		if code != 0 {
			t.Errorf("exit code %d after shutdown and exit, want 0", code)
		}
	case <-time.After(20 * time.Second):
		t.Fatal("walden serve did not exit")
	}
	toServer.Close()

	r := bufio.NewReader(&stdout)
	header := regexp.MustCompile(`^Content-Length: (\d+)\r\n$`)
	var replies int
	for {
		line, err := r.ReadString('\n')
		if err == io.EOF && line == "" {
			break
		}
		m := header.FindStringSubmatch(line)
		if m == nil {
			t.Fatalf("stdout holds %q where a Content-Length header belongs", line)
		}
		if blank, _ := r.ReadString('\n'); blank != "\r\n" {
			t.Fatalf("header not followed by a blank line: %q", blank)
		}
		n, _ := strconv.Atoi(m[1])
		body := make([]byte, n)
		if _, err := io.ReadFull(r, body); err != nil {
			t.Fatalf("frame body: %v", err)
		}
		if strings.Contains(string(body), `"id":`) {
			replies++
		}
	}
	if replies != 2 {
		t.Errorf("%d replies on stdout, want 2 (initialize and shutdown)", replies)
	}
	if !strings.Contains(stderr.String(), "walden serve started") {
		t.Errorf("stderr lacks the start-up log line: %q", stderr.String())
	}
}

package main

import (
	"bufio"
	"fmt"
	"io"
	"os"
	"os/exec"
	"strconv"
	"strings"
	"syscall"
	"testing"
	"time"
)

// TestServeExitsWithSocketStdio checks "exit" the way editors deliver it.
// Neovim and VS Code (both on libuv) give the server a socket pair, not a
// pipe, as stdin and stdout, and keep it open after sending exit; the LSP
// specification still expects the server to end then, with code 0 after
// shutdown. A server that waits for its stdin to close hangs here, which
// the Neovim test shows as "did not exit"; this test shows it without an
// editor, in a second.
func TestServeExitsWithSocketStdio(t *testing.T) {
	bin := buildWalden(t, t.TempDir())

	// One socket pair per direction, blocking, as a libuv parent leaves
	// the child's ends.
	pair := func() (ours, theirs *os.File) {
		fds, err := syscall.Socketpair(syscall.AF_UNIX, syscall.SOCK_STREAM, 0)
		if err != nil {
			t.Skipf("no socket pairs here: %v", err)
		}
		return os.NewFile(uintptr(fds[0]), "editor end"), os.NewFile(uintptr(fds[1]), "server end")
	}
	toServer, serverIn := pair()
	fromServer, serverOut := pair()
	defer toServer.Close()
	defer fromServer.Close()

	cmd := exec.Command(bin, "serve")
	cmd.Stdin, cmd.Stdout = serverIn, serverOut
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	serverIn.Close()
	serverOut.Close()
	done := make(chan error, 1)
	go func() { done <- cmd.Wait() }()
	defer cmd.Process.Kill()

	replies := bufio.NewReader(fromServer)
	send := func(msg string) {
		if _, err := fmt.Fprintf(toServer, "Content-Length: %d\r\n\r\n%s", len(msg), msg); err != nil {
			t.Fatalf("writing to walden serve: %v", err)
		}
	}
	// await reads messages until the reply with the given id.
	await := func(id int) {
		want := fmt.Sprintf(`"id":%d`, id)
		for {
			n := 0
			for {
				line, err := replies.ReadString('\n')
				if err != nil {
					t.Fatalf("reading from walden serve: %v", err)
				}
				line = strings.TrimSpace(line)
				if line == "" {
					break
				}
				if v, ok := strings.CutPrefix(line, "Content-Length:"); ok {
					n, _ = strconv.Atoi(strings.TrimSpace(v))
				}
			}
			body := make([]byte, n)
			if _, err := io.ReadFull(replies, body); err != nil {
				t.Fatalf("reading from walden serve: %v", err)
			}
			if strings.Contains(strings.ReplaceAll(string(body), " ", ""), want) {
				return
			}
		}
	}
	send(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"processId":null,"rootUri":null,"capabilities":{}}}`)
	await(1)
	send(`{"jsonrpc":"2.0","method":"initialized","params":{}}`)
	send(`{"jsonrpc":"2.0","id":2,"method":"shutdown"}`)
	await(2)
	send(`{"jsonrpc":"2.0","method":"exit"}`)

	select {
	case err := <-done:
		if err != nil {
			t.Errorf("walden serve after shutdown and exit: %v, want exit code 0", err)
		}
	case <-time.After(5 * time.Second):
		t.Fatal("walden serve did not end within 5 s of exit while its stdin stayed open: " +
			"after exit the server must return without waiting for the read of stdin to end " +
			"(closing a blocking stdin does not interrupt a read in progress)")
	}
}

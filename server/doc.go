// Package server is walden's language server: it speaks the Language Server
// Protocol over a JSON-RPC stream and presents the reports of package
// analyze to editors.
//
// The wiring follows the usual shape of a small go.lsp.dev server: a stream
// (wire.go) feeds a jsonrpc2 connection whose handler is a middleware chain
// (middleware.go: swallow, cancel, pin, async, log, recover) ending in a method
// table (route.go). Every document version becomes an immutable snapshot
// (snapshot.go); the analysis of a snapshot is computed once, on demand, and
// shared by the publisher (publish.go) and the request handlers. Each LSP
// feature lives in its own small file.
//
// Architecture Invariant: the server knows no chemistry rule. Handlers take
// a snapshot, ask package analyze and convert at the boundary; all byte
// offset ↔ line/UTF-16 conversions go through grammar/source's one mapper
// (position.go). Nothing but JSON-RPC is written to the stream.
package server

package server

import (
	"bytes"
	"errors"
	"sync"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

// publisher publishes the diagnostics of one unit (a page, a plan file or
// a notebook). One goroutine at most runs per unit, and it always takes
// the newest snapshot, so results reach the client in version order and a
// stale result is never published over a newer one: snapshots that are
// replaced before their turn are skipped, not queued. No debounce: the
// Engine re-analyses only changed steps, which costs less than a timer's
// delay (see bench_test.go).
type publisher struct {
	s *Server

	mu      sync.Mutex
	latest  *snapshot // nil: the unit was closed
	dirty   bool      // latest has not been published
	running bool

	// Only the loop touches these.
	shown map[protocol.DocumentURI]shown      // what the client holds
	lines map[protocol.DocumentURI]*lineCache // each document's diagnostics as JSON, per line
	buf   []byte                              // reused for the message
	body  []byte                              // reused for the diagnostics
}

// shown is what was last published for one document.
type shown struct {
	version int32
	body    []byte // the JSON array of its diagnostics
}

// kick records snap as the unit's newest state and makes sure the loop
// runs.
func (p *publisher) kick(snap *snapshot) {
	p.mu.Lock()
	defer p.mu.Unlock()
	p.latest, p.dirty = snap, true
	if !p.running {
		p.running = true
		p.s.pubWG.Add(1)
		go p.loop()
	}
}

func (p *publisher) loop() {
	defer p.s.pubWG.Done()
	for {
		p.mu.Lock()
		if !p.dirty || p.s.ctx.Err() != nil {
			p.running = false
			p.mu.Unlock()
			return
		}
		p.dirty = false
		snap := p.latest
		p.mu.Unlock()

		if snap == nil {
			p.publish(nil, nil)
			continue
		}
		reps, err := snap.analysis(p.s.ctx)
		if err != nil {
			if !errors.Is(err, errSuperseded) && p.s.ctx.Err() == nil {
				p.s.log.Error("analysis failed", "unit", snap.key, "err", err)
			}
			continue
		}
		p.mu.Lock()
		stale := p.latest != snap
		p.mu.Unlock()
		if !stale {
			p.publish(snap, reps)
		}
	}
}

// publish sends the diagnostics of every document of snap that changed
// since the last publication, and empty lists for documents that left the
// unit (closed, or cells removed). snap nil clears everything.
func (p *publisher) publish(snap *snapshot, reps []*analyze.Report) {
	var keep map[protocol.DocumentURI]bool
	if snap != nil {
		keep = make(map[protocol.DocumentURI]bool, len(snap.docs))
		for i, d := range snap.docs {
			keep[d.uri] = true
			lc := p.lines[d.uri]
			if lc == nil {
				lc = newLineCache()
				p.lines[d.uri] = lc
			}
			p.body = lc.appendDiagnostics(p.body[:0], d, reps[i])
			old, ok := p.shown[d.uri]
			if ok && old.version == d.version && bytes.Equal(old.body, p.body) {
				continue
			}
			v := d.version
			p.buf = p.s.publishEncoded(p.buf, d.uri, &v, p.body)
			// The array sent is kept as shown, and the one it replaces
			// becomes the buffer of the next: no copy of a long page's
			// diagnostics on each publication.
			p.shown[d.uri] = shown{version: d.version, body: p.body}
			p.body = old.body
		}
	}
	for uri := range p.shown {
		if !keep[uri] {
			p.buf = p.s.publishDiagnostics(p.buf, &publishDiagnosticsParams{URI: uri, Diagnostics: []protocol.Diagnostic{}})
			delete(p.shown, uri)
			delete(p.lines, uri)
		}
	}
	if cap(p.body) > 16<<20 {
		p.body = nil // do not keep a huge buffer after one huge page
	}
}

package server

import (
	"context"
	"errors"
	"sync"

	"go.lsp.dev/protocol"

	"walden/analyze"
)

// snapshot is one analysis unit at one moment: a Markdown page or a plan
// file at one version, or the Markdown cells of a notebook at one version
// of each. It never changes once made. Its analysis is computed at most
// once, when first asked for, and shared by everyone who asks.
type snapshot struct {
	key    protocol.DocumentURI // the page's, the plan file's or the notebook's URI
	docs   []*document          // the sources, in order
	engine *analyze.Engine

	// ctx is cancelled when a newer snapshot of the same unit replaces this
	// one, or the unit is closed, so that nobody waits for stale work.
	ctx    context.Context
	cancel context.CancelFunc

	once    sync.Once
	done    chan struct{}
	reports []*analyze.Report
	err     error
}

// errSuperseded says that a snapshot's analysis was abandoned because the
// document changed; requests answer it with ContentModified, as the LSP
// specification asks of a server whose result would be outdated.
var errSuperseded = errors.New("the document changed while it was being analysed")

func newSnapshot(parent context.Context, key protocol.DocumentURI, docs []*document, engine *analyze.Engine) *snapshot {
	ctx, cancel := context.WithCancel(parent)
	return &snapshot{key: key, docs: docs, engine: engine, ctx: ctx, cancel: cancel, done: make(chan struct{})}
}

// sources returns the snapshot's documents as analysis sources.
func (s *snapshot) sources() []analyze.Source {
	srcs := make([]analyze.Source, len(s.docs))
	for i, d := range s.docs {
		srcs[i] = analyze.Source{Name: string(d.uri), Kind: d.kind, Text: d.text()}
	}
	return srcs
}

// analysis returns one report per document, starting the analysis if
// nobody has. It returns ctx's error if ctx ends first, and errSuperseded
// if the snapshot was replaced before its analysis finished.
func (s *snapshot) analysis(ctx context.Context) ([]*analyze.Report, error) {
	s.once.Do(func() { go s.run() })
	select {
	case <-s.done:
		return s.reports, s.err
	case <-ctx.Done():
		return nil, ctx.Err()
	}
}

func (s *snapshot) run() {
	defer close(s.done)
	defer func() {
		if r := recover(); r != nil {
			s.reports, s.err = nil, &panicError{what: "analysis of " + string(s.key), value: r, stack: stack()}
		}
	}()
	// Publications read each line's findings (Report.AppendLines); requests
	// ask for the full Report (snapshot.report).
	reps, err := s.engine.AnalyzeLines(s.ctx, s.sources())
	switch {
	case s.ctx.Err() != nil:
		s.err = errSuperseded
	case err != nil:
		s.err = err
	case len(reps) != len(s.docs):
		s.err = errors.New("the analysis returned a different number of reports than it was given sources")
	default:
		s.reports = reps
	}
}

// report returns the full analysis of document i of the snapshot.
func (s *snapshot) report(ctx context.Context, i int) (*analyze.Report, error) {
	rep, err := s.lineReport(ctx, i)
	if err != nil {
		return nil, err
	}
	return rep.Full(), nil
}

// lineReport returns the analysis of document i as the publisher reads
// it, without the Steps and Diagnostics that Report.Full builds for the
// whole page: Hover and Complete need neither.
func (s *snapshot) lineReport(ctx context.Context, i int) (*analyze.Report, error) {
	reps, err := s.analysis(ctx)
	if err != nil {
		return nil, err
	}
	return reps[i], nil
}

// world is everything the requests may read: the latest snapshot of every
// open unit and where each open text document lives. It never changes
// once made; each document notification makes a new one, and a request
// reads the world as it was when the request arrived.
type world struct {
	units map[protocol.DocumentURI]*snapshot
	where map[protocol.DocumentURI]place // text document (page, plan file, cell) → its unit
}

// place locates a text document in its unit's snapshot.
type place struct {
	unit  protocol.DocumentURI
	index int // into the snapshot's docs
}

// lookup returns the snapshot holding the text document uri and the
// document's index in it. ok is false for a document the server does not
// analyse (not open, not a Markdown page, plan file or Markdown cell).
func (w *world) lookup(uri protocol.DocumentURI) (snap *snapshot, index int, ok bool) {
	p, ok := w.where[uri]
	if !ok {
		return nil, 0, false
	}
	snap, ok = w.units[p.unit]
	if !ok || p.index >= len(snap.docs) {
		return nil, 0, false
	}
	return snap, p.index, true
}

// with returns a copy of w in which unit's snapshot is snap (nil removes
// the unit). Documents of the unit's old snapshot are dropped from where
// and those of snap added.
func (w *world) with(unit protocol.DocumentURI, snap *snapshot) *world {
	n := &world{
		units: make(map[protocol.DocumentURI]*snapshot, len(w.units)+1),
		where: make(map[protocol.DocumentURI]place, len(w.where)+1),
	}
	for k, v := range w.units {
		if k != unit {
			n.units[k] = v
		}
	}
	for k, v := range w.where {
		if v.unit != unit {
			n.where[k] = v
		}
	}
	if snap != nil {
		n.units[unit] = snap
		for i, d := range snap.docs {
			n.where[d.uri] = place{unit: unit, index: i}
		}
	}
	return n
}

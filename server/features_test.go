package server

import (
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strings"
	"testing"
	"unicode/utf8"
	"walden/internal/golden"

	"go.lsp.dev/protocol"

	"walden/grammar/source"
)

// Feature tests read like documents. Each testdata/features/*.txtar holds
// pages, plan files or notebook cells with inline markers under the lines
// they point at, and the golden file beside it holds what an editor would
// show: every diagnostic, hover text, fix, completion, inlay hint and
// symbol. Run with -update to rewrite the golden files, then read the diff.
//
// A marker line is carets under the characters it means, then one
// directive; it is removed before the text reaches the server:
//
//	CC(C)Br + NaN3, EtOH
//	          ^^^^ @diag solvent-protic     a diagnostic with this code exactly here
//	^ @hover                                the hover at the first caret
//	          ^^^^ @fix                     the code actions for this range
//	            ^ @complete                 the completions at the first caret
//
// Every diagnostic the server publishes must sit under a @diag marker with
// its code, and every @diag marker must be met: a stray or missing finding
// fails the test even before the golden file is compared.
//
// Files named NAME.ipynb/N.md are the Markdown cells of one notebook, in
// the order of N, sent through notebookDocument/didOpen; NAME.ipynb/N.py
// is a code cell.

var markerLine = regexp.MustCompile(`^\s*(\^+)\s+@(\w+)\s*(.*?)\s*$`)

// marker is one parsed marker.
type marker struct {
	file  string
	span  source.Span // in the file's text without marker lines
	verb  string
	arg   string
	lineN int // 1-based line of the marker in the archive file, for messages
}

// stripMarkers removes marker lines from text and returns the clean text
// and the markers, positioned in it.
func stripMarkers(t *testing.T, file, text string) (string, []marker) {
	var clean strings.Builder
	var marks []marker
	prevStart, prevLine := -1, ""
	for i, line := range strings.SplitAfter(text, "\n") {
		if m := markerLine.FindStringSubmatchIndex(strings.TrimRight(line, "\r\n")); m != nil {
			if prevStart < 0 {
				t.Fatalf("%s:%d: marker with no line above it", file, i+1)
			}
			col := utf8.RuneCountInString(line[:m[2]])
			width := m[3] - m[2]
			start, end := runeOffset(prevLine, col), runeOffset(prevLine, col+width)
			trimmed := strings.TrimRight(line, "\r\n")
			marks = append(marks, marker{file: file, lineN: i + 1,
				span: source.Span{Start: source.Pos(prevStart + start), End: source.Pos(prevStart + end)},
				verb: trimmed[m[4]:m[5]], arg: trimmed[m[6]:m[7]]})
			continue
		}
		prevStart, prevLine = clean.Len(), strings.TrimRight(line, "\r\n")
		clean.WriteString(line)
	}
	return clean.String(), marks
}

// runeOffset returns the byte offset of the n-th rune of s (its length
// when s is shorter).
func runeOffset(s string, n int) int {
	for i := range s {
		if n == 0 {
			return i
		}
		n--
	}
	return len(s)
}

// featureDoc is one document of a feature test as sent to the server.
type featureDoc struct {
	name   string // as in the archive
	uri    protocol.DocumentURI
	text   string
	mapper *source.Mapper
	marks  []marker
}

func (d *featureDoc) pos(p source.Pos) string {
	l, c := d.mapper.Position(p)
	return fmt.Sprintf("%d:%d", l, c)
}

func (d *featureDoc) rangeString(r protocol.Range) string {
	return fmt.Sprintf("%d:%d-%d:%d", r.Start.Line, r.Start.Character, r.End.Line, r.End.Character)
}

func (d *featureDoc) lspSpan(sp source.Span) protocol.Range { return lspRange(d.mapper, sp) }

func TestFeatures(t *testing.T) {
	files, _ := filepath.Glob(filepath.Join("testdata", "features", "*.txtar"))
	if len(files) == 0 {
		t.Fatal("no feature tests found")
	}
	for _, file := range files {
		t.Run(strings.TrimSuffix(filepath.Base(file), ".txtar"), func(t *testing.T) {
			runFeature(t, file)
		})
	}
}

func runFeature(t *testing.T, file string) {
	data, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	ar := parseArchive(string(data))
	c := start(t)
	var docs []*featureDoc
	notebooks := map[string][]*featureDoc{}
	var nbOrder []string
	for _, f := range ar.Files {
		text, marks := stripMarkers(t, f.Name, string(f.Data))
		d := &featureDoc{name: f.Name, text: text, mapper: source.NewMapper([]byte(text)), marks: marks}
		if nb, cell, ok := strings.Cut(f.Name, ".ipynb/"); ok {
			d.uri = protocol.DocumentURI("vscode-notebook-cell:/lab/" + nb + ".ipynb#" + strings.TrimSuffix(cell, filepath.Ext(cell)))
			if notebooks[nb] == nil {
				nbOrder = append(nbOrder, nb)
			}
			notebooks[nb] = append(notebooks[nb], d)
		} else {
			d.uri = protocol.DocumentURI("file:///lab/" + f.Name)
			lang := "markdown"
			if strings.HasSuffix(f.Name, PlanFileExt) {
				lang = PlanLanguageID
			}
			c.open(d.uri, lang, 1, text)
		}
		docs = append(docs, d)
	}
	for _, nb := range nbOrder {
		cells := notebooks[nb]
		p := didOpenNotebookParams{NotebookDocument: notebookDocument{
			URI: protocol.DocumentURI("file:///lab/" + nb + ".ipynb"), NotebookType: "jupyter-notebook", Version: 1}}
		for _, d := range cells {
			kind, lang := cellMarkup, "markdown"
			if strings.HasSuffix(d.name, ".py") {
				kind, lang = cellCode, "python"
			}
			p.NotebookDocument.Cells = append(p.NotebookDocument.Cells, notebookCell{Kind: kind, Document: d.uri})
			p.CellTextDocuments = append(p.CellTextDocuments, protocol.TextDocumentItem{URI: d.uri, LanguageID: protocol.LanguageIdentifier(lang), Version: 1, Text: d.text})
		}
		c.notify(methodNotebookDidOpen, &p)
	}

	var out strings.Builder
	fmt.Fprintf(&out, "# %s: what an editor shows (positions are LSP line:character, 0-based, UTF-16)\n", filepath.Base(file))
	for _, d := range docs {
		fmt.Fprintf(&out, "\n== %s\n", d.name)
		if strings.HasSuffix(d.name, ".py") {
			continue
		}
		checkDiagnostics(t, c, d, &out)
		for _, m := range d.marks {
			switch m.verb {
			case "diag":
			case "hover":
				showHover(t, c, d, m, &out)
			case "fix":
				showFixes(t, c, d, m, &out)
			case "complete":
				showCompletions(t, c, d, m, &out)
			default:
				t.Errorf("%s:%d: unknown marker @%s", d.name, m.lineN, m.verb)
			}
		}
		showInlays(t, c, d, &out)
		showSymbols(t, c, d, &out)
		showTokens(t, c, d, &out)
	}
	golden.Check(t, strings.TrimSuffix(file, ".txtar")+".golden", out.String())
}

// checkDiagnostics matches published diagnostics with @diag markers.
func checkDiagnostics(t *testing.T, c *testClient, d *featureDoc, out *strings.Builder) {
	t.Helper()
	diags := c.diagnosticsFor(d.uri, 1)
	want := map[string]bool{}
	for _, m := range d.marks {
		if m.verb == "diag" {
			want[d.rangeString(d.lspSpan(m.span))+" "+m.arg] = false
		}
	}
	sort.SliceStable(diags, func(i, j int) bool { return less(diags[i].Range, diags[j].Range) })
	for _, g := range diags {
		key := d.rangeString(g.Range) + " " + fmt.Sprint(g.Code)
		if _, ok := want[key]; ok {
			want[key] = true
		} else {
			t.Errorf("%s: unexpected diagnostic %s: %s", d.name, key, g.Message)
		}
		fmt.Fprintf(out, "diagnostic %s %s %v: %s\n", d.rangeString(g.Range), severityName(g.Severity), g.Code, g.Message)
		for _, r := range g.RelatedInformation {
			fmt.Fprintf(out, "  related %s: %s\n", d.rangeString(r.Location.Range), r.Message)
		}
		if len(g.Tags) > 0 {
			fmt.Fprintf(out, "  tags %v\n", g.Tags)
		}
	}
	for key, met := range want {
		if !met {
			t.Errorf("%s: expected diagnostic %s was not published", d.name, key)
		}
	}
}

func less(a, b protocol.Range) bool {
	if a.Start.Line != b.Start.Line {
		return a.Start.Line < b.Start.Line
	}
	return a.Start.Character < b.Start.Character
}

func severityName(s protocol.DiagnosticSeverity) string {
	return map[protocol.DiagnosticSeverity]string{1: "error", 2: "warning", 3: "info", 4: "hint"}[s]
}

func position(d *featureDoc, p source.Pos) protocol.TextDocumentPositionParams {
	return protocol.TextDocumentPositionParams{TextDocument: protocol.TextDocumentIdentifier{URI: d.uri}, Position: lspPosition(d.mapper, p)}
}

func showHover(t *testing.T, c *testClient, d *featureDoc, m marker, out *strings.Builder) {
	var h *protocol.Hover
	c.call("textDocument/hover", &protocol.HoverParams{TextDocumentPositionParams: position(d, m.span.Start)}, &h)
	if h == nil {
		fmt.Fprintf(out, "hover %s: none\n", d.pos(m.span.Start))
		return
	}
	// The first line is the headline; the rest is analyze's own text,
	// checked by analyze's tests, and only counted here so that wording
	// there does not churn the server's golden files.
	lines := strings.Split(strings.TrimRight(h.Contents.Value, "\n"), "\n")
	fmt.Fprintf(out, "hover %s (range %s):\n%s", d.pos(m.span.Start), d.rangeString(*h.Range), indent(lines[0]))
}

func showFixes(t *testing.T, c *testClient, d *featureDoc, m marker, out *strings.Builder) {
	var actions []protocol.CodeAction
	c.call("textDocument/codeAction", &protocol.CodeActionParams{TextDocument: protocol.TextDocumentIdentifier{URI: d.uri},
		Range: d.lspSpan(m.span)}, &actions)
	if len(actions) == 0 {
		fmt.Fprintf(out, "fixes %s: none\n", d.rangeString(d.lspSpan(m.span)))
	}
	for _, a := range actions {
		pref := ""
		if a.IsPreferred {
			pref = " (preferred)"
		}
		fmt.Fprintf(out, "fix %s %s %q%s:\n", d.rangeString(d.lspSpan(m.span)), a.Kind, a.Title, pref)
		fmt.Fprint(out, indent(applyEdits(t, d, a.Edit.Changes[d.uri])))
	}
}

// applyEdits returns the lines of d touched by edits, after the edits.
func applyEdits(t *testing.T, d *featureDoc, edits []protocol.TextEdit) string {
	text := d.text
	sort.SliceStable(edits, func(i, j int) bool { return less(edits[j].Range, edits[i].Range) })
	first, last := 1<<30, -1
	for _, e := range edits {
		sp, err := span(d.mapper, e.Range)
		if err != nil {
			t.Errorf("%s: edit range %v: %v", d.name, e.Range, err)
			continue
		}
		text = text[:sp.Start] + e.NewText + text[sp.End:]
		first = min(first, int(e.Range.Start.Line))
		last = max(last, int(e.Range.Start.Line)+strings.Count(e.NewText, "\n"))
	}
	lines := strings.Split(text, "\n")
	if last < 0 || first >= len(lines) {
		return "(no edits)\n"
	}
	return strings.Join(lines[first:min(last+1, len(lines))], "\n") + "\n"
}

func showCompletions(t *testing.T, c *testClient, d *featureDoc, m marker, out *strings.Builder) {
	var list protocol.CompletionList
	c.call("textDocument/completion", &protocol.CompletionParams{TextDocumentPositionParams: position(d, m.span.Start)}, &list)
	fmt.Fprintf(out, "completions %s: %d\n", d.pos(m.span.Start), len(list.Items))
	for i, it := range list.Items {
		if i == 8 {
			fmt.Fprintf(out, "  …\n")
			break
		}
		fmt.Fprintf(out, "  %s — %s (replaces %s)\n", it.Label, it.Detail, d.rangeString(it.TextEdit.Range))
	}
}

func showInlays(t *testing.T, c *testClient, d *featureDoc, out *strings.Builder) {
	var hints []inlayHint
	c.call(methodInlayHint, &inlayHintParams{TextDocument: protocol.TextDocumentIdentifier{URI: d.uri},
		Range: lspRange(d.mapper, source.Span{Start: 0, End: source.Pos(len(d.text))})}, &hints)
	for _, h := range hints {
		fmt.Fprintf(out, "inlay %d:%d %q\n", h.Position.Line, h.Position.Character, h.Label)
	}
}

func showSymbols(t *testing.T, c *testClient, d *featureDoc, out *strings.Builder) {
	var syms []protocol.DocumentSymbol
	c.call("textDocument/documentSymbol", &protocol.DocumentSymbolParams{TextDocument: protocol.TextDocumentIdentifier{URI: d.uri}}, &syms)
	for _, s := range syms {
		fmt.Fprintf(out, "symbol %q %s", s.Name, d.rangeString(s.Range))
		if s.Detail != "" {
			fmt.Fprintf(out, " — %s", s.Detail)
		}
		fmt.Fprintln(out)
	}
}

// showTokens decodes the semantic tokens into one line per step line:
// "tokens L: char+length type, …".
func showTokens(t *testing.T, c *testClient, d *featureDoc, out *strings.Builder) {
	var toks protocol.SemanticTokens
	c.call(methodSemanticTokensFull, &protocol.SemanticTokensParams{TextDocument: protocol.TextDocumentIdentifier{URI: d.uri}}, &toks)
	if len(toks.Data)%5 != 0 {
		t.Fatalf("%s: %d semantic token numbers, not a multiple of 5", d.name, len(toks.Data))
	}
	var line, char uint32
	cur := -1
	for i := 0; i < len(toks.Data); i += 5 {
		dl, dc, n, typ := toks.Data[i], toks.Data[i+1], toks.Data[i+2], toks.Data[i+3]
		if dl > 0 {
			line, char = line+dl, dc
		} else {
			char += dc
		}
		if int(line) != cur {
			if cur >= 0 {
				fmt.Fprintln(out)
			}
			fmt.Fprintf(out, "tokens %d:", line)
			cur = int(line)
		}
		name := "?"
		if int(typ) < len(legend.TokenTypes) {
			name = string(legend.TokenTypes[typ])
		}
		fmt.Fprintf(out, " %d+%d %s", char, n, name)
	}
	if cur >= 0 {
		fmt.Fprintln(out)
	}
}

func indent(s string) string {
	var b strings.Builder
	for _, l := range strings.Split(strings.TrimRight(s, "\n"), "\n") {
		b.WriteString("  | " + l + "\n")
	}
	return b.String()
}

// archive is a txtar-style file: a comment, then files each introduced
// by a line "-- NAME --".
type archive struct {
	Comment string
	Files   []archiveFile
}

type archiveFile struct {
	Name string
	Data []byte
}

var fileHeader = regexp.MustCompile(`(?m)^-- (.+?) --\r?\n`)

func parseArchive(s string) archive {
	var ar archive
	heads := fileHeader.FindAllStringSubmatchIndex(s, -1)
	if len(heads) == 0 {
		ar.Comment = s
		return ar
	}
	ar.Comment = s[:heads[0][0]]
	for i, h := range heads {
		end := len(s)
		if i+1 < len(heads) {
			end = heads[i+1][0]
		}
		ar.Files = append(ar.Files, archiveFile{Name: s[h[2]:h[3]], Data: []byte(s[h[1]:end])})
	}
	return ar
}

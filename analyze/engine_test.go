package analyze

import (
	"context"
	"fmt"
	"strings"
	"sync"
	"testing"

	"walden/grammar/source"
)

func page(lines ...string) Source {
	return Source{Name: "page.md", Kind: MarkdownPage, Text: []byte("# page\n\n```reaction\n" + strings.Join(lines, "\n") + "\n```\n")}
}

func analyse(t *testing.T, e *Engine, srcs ...Source) []*Report {
	t.Helper()
	reps, err := e.Analyze(context.Background(), srcs)
	if err != nil {
		t.Fatal(err)
	}
	return reps
}

// TestCacheReanalysesOnlyChangedSteps counts analyses: an unchanged step
// is never analysed twice, a step moved by an edit above it neither, and
// an edit re-analyses the changed step and the steps that use its label.
func TestCacheReanalysesOnlyChangedSteps(t *testing.T) {
	e := NewEngine(Config{})
	a := "a: CCCCBr + NaN3, DMF -> CCCCN=[N+]=[N-]"
	b := "@a + PPh3, THF"
	c := "CCCBr + NaI, acetone"
	analyse(t, e, page(a, b, c))
	if n := e.Analysed(); n != 3 {
		t.Fatalf("first run analysed %d steps, want 3", n)
	}
	analyse(t, e, page(a, b, c))
	if n := e.Analysed(); n != 3 {
		t.Errorf("unchanged text analysed again: %d, want 3", n)
	}
	moved := page(a, b, c)
	moved.Text = append([]byte("Some prose added above.\n\n"), moved.Text...)
	reps := analyse(t, e, moved)
	if n := e.Analysed(); n != 3 {
		t.Errorf("moving the lines analysed again: %d, want 3", n)
	}
	for _, st := range reps[0].Steps {
		line := string(moved.Text[st.Span.Start:st.Span.End])
		if line != a && line != b && line != c {
			t.Errorf("step span after the move marks %q", line)
		}
	}
	analyse(t, e, page(a, b, "CCCBr + NaI, acetone, 40 °C"))
	if n := e.Analysed(); n != 4 {
		t.Errorf("editing one independent step: %d analyses, want 4", n)
	}
	analyse(t, e, page("a: CCCCBr + NaN3, DMF -> CCCCCN=[N+]=[N-]", b, "CCCBr + NaI, acetone, 40 °C"))
	if n := e.Analysed(); n != 6 {
		t.Errorf("editing a labelled step: %d analyses, want 6 (it and the step using its label)", n)
	}
}

// TestConcurrentAnalyze runs analyses of overlapping documents at once
// (run with -race).
func TestConcurrentAnalyze(t *testing.T) {
	e := NewEngine(Config{})
	var wg sync.WaitGroup
	for g := range 8 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range 20 {
				analyse(t, e, page(fmt.Sprintf("x%d: CCCCBr + NaN3, DMF", (g+i)%5), "@x1 + NaI, acetone", "CCBr + NaCN, DMSO"))
			}
		}()
	}
	wg.Wait()
}

// TestCancelled returns the context's error without finishing.
func TestCancelled(t *testing.T) {
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	_, err := NewEngine(Config{}).Analyze(ctx, []Source{page("CCCCBr + NaN3, DMF")})
	if err != context.Canceled {
		t.Errorf("err = %v, want context.Canceled", err)
	}
}

// TestLabelsAcrossSources resolves a label defined in an earlier cell.
func TestLabelsAcrossSources(t *testing.T) {
	e := NewEngine(Config{})
	cell1 := Source{Name: "nb.ipynb", Kind: MarkdownCell, Text: []byte("```reaction\nms: CCCCO + MsCl + Et3N, DCM -> CCCCOS(C)(=O)=O\n```\n")}
	cell2 := Source{Name: "nb.ipynb", Kind: MarkdownCell, Text: []byte("```reaction\n@ms + NaN3, DMF\n@mz + NaN3, DMF\n```\n")}
	reps := analyse(t, e, cell1, cell2)
	var codes []string
	for _, d := range reps[1].Diagnostics {
		codes = append(codes, d.Code)
		if d.Code == CodeLabelUnresolved && !strings.Contains(d.Message, "'ms'") {
			t.Errorf("no suggestion of the close label: %s", d.Message)
		}
	}
	if strings.Count(strings.Join(codes, " "), CodeLabelUnresolved) != 1 {
		t.Errorf("codes in cell 2 = %v, want exactly one %s (for @mz)", codes, CodeLabelUnresolved)
	}
	if got := reps[1].Complete(reps[1].Steps[0].Span.Start + 2); len(got) != 1 || got[0].Label != "@ms" {
		t.Errorf("label completion after '@m' = %+v, want @ms", got)
	}
}

// TestUnknownNameFix offers the closest name as the preferred fix.
func TestUnknownNameFix(t *testing.T) {
	reps := analyse(t, NewEngine(Config{}), page("CCCCBr + NaN3, DMFF, 25 °C"))
	for _, d := range reps[0].Diagnostics {
		if d.Code != CodeUnknownName {
			continue
		}
		if len(d.Fixes) == 0 || d.Fixes[0].Edits[0].NewText != "DMF" || !d.Fixes[0].Preferred {
			t.Errorf("fixes = %+v, want DMF first", d.Fixes)
		}
		return
	}
	t.Errorf("no %s diagnostic", CodeUnknownName)
}

// TestDisabledCodes drops what the settings disable.
func TestDisabledCodes(t *testing.T) {
	reps := analyse(t, NewEngine(Config{Disabled: []string{CodeUnknownName}}), page("CCCCBr + NaN3, DMFF, 25 °C"))
	for _, d := range reps[0].Diagnostics {
		if d.Code == CodeUnknownName {
			t.Errorf("disabled code reported: %s", d.Message)
		}
	}
}

// TestHoverOnReagent shows the dictionary entry with its sources.
func TestHoverOnReagent(t *testing.T) {
	src := page("CCCCBr + NaN3, DMF, 25 °C")
	reps := analyse(t, NewEngine(Config{}), src)
	at := strings.Index(string(src.Text), "NaN3")
	md, span, ok := reps[0].Hover(source.Pos(at + 1))
	if !ok || string(src.Text[span.Start:span.End]) != "NaN3" || !strings.Contains(md, "azide") {
		t.Errorf("hover on NaN3 = %v %q %q", ok, src.Text[span.Start:span.End], md)
	}
	at = strings.Index(string(src.Text), "DMF")
	md, _, ok = reps[0].Hover(source.Pos(at))
	if !ok || !strings.Contains(md, "solvent") {
		t.Errorf("hover on DMF = %v %q", ok, md)
	}
}

// TestCompleteNames offers dictionary names for the word being typed.
func TestCompleteNames(t *testing.T) {
	src := page("CCCCBr + NaN, DMF")
	reps := analyse(t, NewEngine(Config{}), src)
	at := strings.Index(string(src.Text), "NaN,") + 3
	got := reps[0].Complete(source.Pos(at))
	found := false
	for _, c := range got {
		if c.Label == "NaN3" && c.Kind == CompleteReagent && c.Doc != "" && string(src.Text[c.Span.Start:c.Span.End]) == "NaN" {
			found = true
		}
	}
	if !found {
		t.Errorf("completions at 'NaN|' do not offer NaN3 replacing 'NaN': %d offered", len(got))
	}
}

// TestNeverPanics feeds odd lines; every one gets a report.
func TestNeverPanics(t *testing.T) {
	for _, l := range []string{"", "+", "->", "@", "@@", "a:", ":", "[x]", "C(((((", "CCBr + , , ,", "→ →", "\x00\xff", strings.Repeat("C", 5000) + "Br + NaI"} {
		analyse(t, NewEngine(Config{}), page(l), Source{Kind: PlanFile, Text: []byte(l)})
	}
}

// TestHoverOnAtom gives the CIP label and the role of a substrate atom.
// (S)-(3-bromobutyl)benzene: C2 is S (checked with RDKit 2022.09
// rdCIPLabeler) and bears the leaving group.
func TestHoverOnAtom(t *testing.T) {
	src := page("C[C@H](Br)CCc1ccccc1 + NaN3, DMF, 60 °C")
	reps := analyse(t, NewEngine(Config{}), src)
	at := strings.Index(string(src.Text), "[C@H]")
	md, span, ok := reps[0].Hover(source.Pos(at + 2))
	if !ok || string(src.Text[span.Start:span.End]) != "[C@H]" {
		t.Fatalf("hover on the stereocentre: %v %q", ok, md)
	}
	for _, want := range []string{"atom 2", "CIP **S**", "reacting carbon", "S → R (inverted)"} {
		if !strings.Contains(md, want) {
			t.Errorf("atom hover lacks %q:\n%s", want, md)
		}
	}
}

// TestDefaultSolvent: the settings' solvent is used and said once.
func TestDefaultSolvent(t *testing.T) {
	rep := analyse(t, NewEngine(Config{DefaultSolvent: "DMSO"}), Source{Kind: PlanFile, Text: []byte("CCCCBr + NaN3")})[0]
	var codes []string
	for _, d := range rep.Diagnostics {
		codes = append(codes, d.Code)
	}
	got := strings.Join(codes, " ")
	if !strings.Contains(got, CodeDefaultSolvent) || strings.Contains(got, "no-solvent") {
		t.Errorf("codes %q: want %s and not the outcome's no-solvent", got, CodeDefaultSolvent)
	}
}

// TestHoverOnProductAtom labels the atoms of a product written after
// '->': C[C@H](N=[N+]=[N-])CCc1ccccc1 is the S azide (RDKit 2022.09
// rdCIPLabeler).
func TestHoverOnProductAtom(t *testing.T) {
	src := page("C[C@H](Br)CCc1ccccc1 + NaN3, DMF, 60 °C -> C[C@H](N=[N+]=[N-])CCc1ccccc1")
	reps := analyse(t, NewEngine(Config{}), src)
	at := strings.LastIndex(string(src.Text), "[C@H]")
	md, _, ok := reps[0].Hover(source.Pos(at + 1))
	if !ok || !strings.Contains(md, "CIP **S**") {
		t.Errorf("hover on the product's stereocentre: %v %q", ok, md)
	}
}

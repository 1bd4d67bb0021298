package analyze

import (
	"context"
	"os"
	"reflect"
	"testing"

	"walden/analyze/caution"
	"walden/analyze/outcome"
)

// memoLines are steps that take the memo's less common ways: an
// electrophile written second, names and SMILES that do not read, a
// solvent written as SMILES, a reagent that is also the solvent, more
// reagents than a kept key holds, mixtures, sealed vessels and labels.
const memoLines = `CI + C[C@H](O)CCc1ccccc1 + NaH (1.2 eq), THF, 0 °C to rt
CI + C[C@H](O)CCc1ccccc1 + NaH (1.2 eq), DMF, 0 °C to rt
a1: CCCCBr + NaN3, CN(C)C=O, 60 °C
@a1 + NaN3, DMF, 60 °C
CCCCBr + NaN3, DMFF, 60 °C
CCCCBr + NaN3 + C1CC(, DMF, 60 °C
CC(C)(C)Br + EtOH, reflux
CC(C)(C)Br + EtOH, reflux
C[C@H](Br)CC + NaN3 + NaI + KI + TBAI + 18-crown-6, DMF, 60 °C
C[C@H](Br)CC + NaN3 + NaI + KI + TBAI + 18-crown-6, DMF, 60 °C
CCBr + NaN3, DCM/water, 40 °C, sealed tube
CCBr + NaN3, DCM/water, 40 °C, sealed tube
CCCCCl + NaCN + HCl, DMSO, 80 °C
CCCCCl + NaCN + HCl, DMSO, 90 °C
C[C@H](O)CCc1ccccc1 + PPh3 (1.5 eq) + DIAD (1.5 eq) + PhCO2H (1.5 eq), THF, 0 °C to rt, 16 h
C[C@H](O)CCc1ccccc1 + PPh3 (1.5 eq) + DIAD (1.5 eq) + PhCO2H (1.5 eq), THF, 0 °C to rt, 16 h
sm: CC(Br)c1ccccc1
@sm + KOtBu, THF, 60 °C
@sm + KOtBu, THF, 60 °C
`

// TestMemoAnswersAsWithout analyses pages through an Engine's memo, twice
// so that the second time is answered from it, and checks every step,
// diagnostic and hover against an Engine that keeps nothing between
// steps. A memo key that leaves out something the chemistry reads shows
// here as a step answered for another.
func TestMemoAnswersAsWithout(t *testing.T) {
	srcs := []Source{
		{Name: "bench.md", Kind: MarkdownPage, Text: benchNotebook(400)},
		{Name: "memo.steps", Kind: PlanFile, Text: []byte(memoLines)},
	}
	for _, f := range []struct {
		name string
		kind SourceKind
	}{{"kestrel.md", MarkdownPage}, {"kestrel-ethers.steps", PlanFile}} {
		text, err := os.ReadFile("../testdata/demo/" + f.name)
		if err != nil {
			t.Fatal(err)
		}
		srcs = append(srcs, Source{Name: f.name, Kind: f.kind, Text: text})
	}
	plain := NewEngine(Config{})
	plain.memo = nil
	want, _ := plain.Analyze(context.Background(), srcs)
	// The second round is a new Engine with the first one's memo: every
	// step is analysed again, and answered from the memo.
	m := newMemo()
	for round := range 2 {
		kept := NewEngine(Config{})
		kept.memo = m
		got, _ := kept.Analyze(context.Background(), srcs)
		for k := range want {
			if !reflect.DeepEqual(got[k].Steps, want[k].Steps) {
				t.Errorf("round %d, %s: steps differ from an Engine without a memo", round, srcs[k].Name)
			}
			if !reflect.DeepEqual(got[k].Diagnostics, want[k].Diagnostics) {
				t.Errorf("round %d, %s: diagnostics differ from an Engine without a memo:\n%s", round, srcs[k].Name, firstDiff(got[k].Diagnostics, want[k].Diagnostics))
			}
			for _, st := range want[k].Steps {
				for _, tok := range st.Tokens {
					g, gs, gok := got[k].Hover(tok.Span.Start)
					w, ws, wok := want[k].Hover(tok.Span.Start)
					if g != w || gs != ws || gok != wok {
						t.Fatalf("round %d, %s: hover at %d is\n%s\nwant\n%s", round, srcs[k].Name, tok.Span.Start, g, w)
					}
				}
			}
		}
	}
}

// TestMemoKeysCoverTheirInputs fails when a field is added to a struct a
// memo key stands for, so that whoever adds it extends the key
// (outcomeKey in memo.go, cautionKey in memo_cautions.go).
func TestMemoKeysCoverTheirInputs(t *testing.T) {
	for _, c := range []struct {
		v    any
		want int
	}{
		{outcome.Step{}, 6},      // Substrate, Reagents, Solvents, TempC, Reflux, Cache
		{caution.Step{}, 5},      // Substances, TempC, HasTemp, Reflux, Sealed
		{caution.Substance{}, 8}, // all from cautionPart and the role and index
		{stepInput{}, 12},        // cautionsFor reads the parties and tempC, hasTemp, reflux, sealed
	} {
		if n := reflect.TypeOf(c.v).NumField(); n != c.want {
			t.Errorf("%T has %d fields, the memo keys were written for %d: check outcomeKey and cautionKey", c.v, n, c.want)
		}
	}
}

package notation

import (
	"regexp"
	"strings"
	"testing"
	"unsafe"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"walden/grammar/source"
)

// shape summarises a step in one line, so that a table can say by hand
// what the parser must make of a line. Parts are separated by " | ":
// "mark:done", "label:azide", "R:" reactant, "C:" condition, "P:" product,
// "->" the arrow, "//text" the comment. A term shows its substance as
// kind=text (mix(a,b;ratio) for mixtures) and its quantities in brackets.
func shape(st Step) string {
	var parts []string
	if m, ok := st.Mark(); ok {
		parts = append(parts, "mark:"+m.State.String())
	}
	if l, ok := st.Label(); ok {
		parts = append(parts, "label:"+l.Name)
	}
	terms := func(tag string, ts Terms) {
		for k := range ts.Len() {
			t := ts.At(k)
			s := tag + ":"
			if sub, ok := t.Substance(); ok {
				s += substanceShape(sub)
			}
			qs := t.Quantities()
			for k := range qs.Len() {
				s += "[" + qs.At(k).Describe() + "]"
			}
			ns := t.Notes()
			for k := range ns.Len() {
				s += "(" + ns.At(k).Text + ")"
			}
			parts = append(parts, s)
		}
	}
	terms("R", st.Reactants())
	terms("C", st.Conditions())
	if _, ok := st.Arrow(); ok {
		parts = append(parts, "->")
	}
	terms("P", st.Products())
	if c, ok := st.Comment(); ok {
		parts = append(parts, "//"+c.Text)
	}
	return strings.Join(parts, " | ")
}

func substanceShape(s Substance) string {
	switch s.Kind() {
	case Mixture:
		var ps []string
		parts := s.Parts()
		for k := range parts.Len() {
			ps = append(ps, parts.At(k).Text())
		}
		r := ""
		if q, ok := s.Ratio(); ok {
			r = ";" + q.Describe()
		}
		return "mix(" + strings.Join(ps, ",") + r + ")"
	case Reference:
		return "@" + s.Text()
	case Phrase:
		return "phrase=" + s.Text()
	}
	return s.Text()
}

// TestValid: lines a chemist writes, each with the reading the notation
// promises (doc.go). None may give an error.
func TestValid(t *testing.T) {
	for _, tc := range []struct{ line, want string }{
		// The Kestrel plan: (S)-4-phenylbutan-2-ol to the mesylate, the
		// azide with inversion, the amine, and ethers.
		{"mesylate: C[C@H](O)CCc1ccccc1 + MsCl (1.2 eq) + Et3N (1.5 eq), CH2Cl2, 0 °C, 1 h -> C[C@H](OS(C)(=O)=O)CCc1ccccc1",
			"label:mesylate | R:C[C@H](O)CCc1ccccc1 | R:MsCl[1.2 eq] | R:Et3N[1.5 eq] | C:CH2Cl2 | C:[0 °C] | C:[1 h] | -> | P:C[C@H](OS(C)(=O)=O)CCc1ccccc1"},
		{"[x] azide: @mesylate + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1 // 2026-03-02, 81%",
			"mark:done | label:azide | R:@mesylate | R:NaN3[1.5 eq] | C:DMF | C:[60 °C] | C:[12 h] | -> | P:C[C@@H](N=[N+]=[N-])CCc1ccccc1 | //2026-03-02, 81%"},
		{"[-] @mesylate + 1.5 equiv. [Na+].[N-]=[N+]=[N-], DMSO, rt, overnight",
			"mark:skipped | R:@mesylate | R:[Na+].[N-]=[N+]=[N-][1.5 eq] | C:DMSO | C:[rt] | C:[overnight]"},
		{"[ ] amine: @azide + PPh3, THF/water, reflux",
			"mark:open | label:amine | R:@azide | R:PPh3 | C:mix(THF,water) | C:[reflux]"},
		{"(S)-4-phenylbutan-2-ol + potassium phthalimide, acetone–water 4:1, 0 °C to rt, 2 d",
			"R:(S)-4-phenylbutan-2-ol | R:phrase=potassium phthalimide | C:mix(acetone,water;4:1) | C:[0 °C to rt] | C:[2 d]"},
		{"ether1: @mesylate + NaOEt, EtOH, 60 C, 30 min",
			"label:ether1 | R:@mesylate | R:NaOEt | C:EtOH | C:[60 °C] | C:[30 min]"},
		{"@mesylate + KOtBu (2 equiv), THF, −78 °C -> rt, 3 h",
			"R:@mesylate | R:KOtBu[2 eq] | C:THF | C:[-78 °C to rt] | C:[3 h]"},
		{"CCBr + NaI, acetone, 60°C, 3 mol% TBAI, 18-crown-6",
			"R:CCBr | R:NaI | C:acetone | C:[60 °C] | C:TBAI[3 mol%] | C:18-crown-6"},
		{"CCBr + NaCN, 1,4-dioxane, N,N-dimethylformamide, -78 ºC",
			"R:CCBr | R:NaCN | C:1,4-dioxane | C:N,N-dimethylformamide | C:[-78 °C]"},
		{"CCBr + NaN3 1.5 eq., DMF, 25 degC, 16h",
			"R:CCBr | R:NaN3[1.5 eq] | C:DMF | C:[25 °C] | C:[16 h]"},
		{"CCBr + 2x NaN3, DMF, 0–25 °C, 12–16 h",
			"R:CCBr | R:NaN3[2 eq] | C:DMF | C:[0 °C to 25 °C] | C:[12 h to 16 h]"},
		{"CCBr + cat. TBAI + excess NaN3, acetic acid/water 1:1 v/v, at reflux, for 2 hrs",
			"R:CCBr | R:TBAI[cat] | R:NaN3[excess] | C:mix(acetic acid,water;1:1) | C:[reflux] | C:[2 h]"},
		{"F/C=C/CBr + NaN3, THF / water ->",
			"R:F/C=C/CBr | R:NaN3 | C:mix(THF,water) | ->"},
		{"CCBr + NaN3 (1.5 eq, 3.2 mmol), DMF (5 mL), room temperature",
			"R:CCBr | R:NaN3[1.5 eq][3.2 mmol] | C:DMF[5 mL] | C:[rt]"},
		{"CCBr + NaN3 (freshly dried), DMF → CCN=[N+]=[N-] (85 %)",
			"R:CCBr | R:NaN3(freshly dried) | C:DMF | -> | P:CCN=[N+]=[N-][85 %]"},
		{"CCBr + NaN3 -> CCN=[N+]=[N-] + NaBr",
			"R:CCBr | R:NaN3 | -> | P:CCN=[N+]=[N-] | P:NaBr"},
		{"  CCBr   +   NaN3 ,  DMF  ", "R:CCBr | R:NaN3 | C:DMF"},
		{"CCBr + NaN3, DMF,\u00a060\u2009°C", "R:CCBr | R:NaN3 | C:DMF | C:[60 °C]"},
		{"CCBr + NaN3, DMF 60 °C", "R:CCBr | R:NaN3 | C:DMF[60 °C]"}, // a quantity may follow its solvent
		{"3a': CC(C)(C)Br + NaOMe, MeOH, 25 K", "label:3a' | R:CC(C)(C)Br | R:NaOMe | C:MeOH | C:[25 K]"},
		{"CCBr + 4 Å MS, 2 M HCl", "R:CCBr | R:phrase=4 Å MS | C:HCl[2 M]"},
		{"// a whole-line comment", "//a whole-line comment"},
		{"", ""},
		{"C#N + CC#C, C1CC%10CC1 // '#' and '%' stay in SMILES", "R:C#N | R:CC#C | C:C1CC%10CC1 | //'#' and '%' stay in SMILES"},
		{"CCBr + NaN3, DMF,60 °C", "R:CCBr | R:NaN3 | C:DMF | C:[60 °C]"},
		{"CCBr + NaN3, 5 bar, 20 wt%", "R:CCBr | R:NaN3 | C:[5 bar] | C:[20 wt%]"},
		{"CCBr + NaN3, DMF, 60 °C, 3 mol %", "R:CCBr | R:NaN3 | C:DMF | C:[60 °C] | C:[3 mol%]"},
		{"1. C[C@H](O)CCc1ccccc1 + TsCl, pyridine", "label:1 | R:C[C@H](O)CCc1ccccc1 | R:TsCl | C:pyridine"},
		{"2) @1 + NaN3, DMF", "label:2 | R:@1 | R:NaN3 | C:DMF"},
		{"2. equiv NaN3 + CCBr", "R:NaN3[2 eq] | R:CCBr"},
		{"CCBr + NaN3, THF/water (4:1), KOtBu (1.0 M in THF)", "R:CCBr | R:NaN3 | C:mix(THF,water;4:1) | C:KOtBu(1.0 M in THF)"},
		// The forms README.md promises.
		{"CCBr + NaN3, MeOH / CH2Cl2 1:9 v/v, 60 ℃, 0 to 25 °C, o/n", "R:CCBr | R:NaN3 | C:mix(MeOH,CH2Cl2;1:9) | C:[60 °C] | C:[0 °C to 25 °C] | C:[overnight]"},
		{"CCBr + 2× NaN3, at 60 °C, 298 K, 1 atm, 250 mg, 5 mL, 2 M, 60 oC, 3 hours", "R:CCBr | R:NaN3[2 eq] | C:[60 °C] | C:[298 K] | C:[1 atm] | C:[250 mg] | C:[5 mL] | C:[2 M] | C:[60 °C] | C:[3 h]"},
		{"CCBr + NaN3 (1.5 eq, 3.2 mmol), r.t., for 2 h, 2 days, 30 s", "R:CCBr | R:NaN3[1.5 eq][3.2 mmol] | C:[rt] | C:[2 h] | C:[2 d] | C:[30 s]"},
		{"CCBr + [K+].[C-]#N, tert-butanol, 2-propanol", "R:CCBr | R:[K+].[C-]#N | C:tert-butanol | C:2-propanol"},
		{"(+)-camphor + (±)-2-butanol, (R)-BINAP (5 mol%)", "R:(+)-camphor | R:(±)-2-butanol | C:(R)-BINAP[5 mol%]"},
	} {
		st, errs := Parse([]byte(tc.line), 0)
		assert.Empty(t, errs, "%q", tc.line)
		assert.Equal(t, tc.want, shape(st), "%q", tc.line)
	}
}

// marker is an expected error written inline in a test line, as
// «code» or «code ~regexp» just before the first byte the error must
// point at.
var marker = regexp.MustCompile(`«([a-z0-9-]+)(?: ~([^»]*))?»`)

type wantError struct {
	at   int
	code string
	msg  *regexp.Regexp
}

// stripMarkers removes the markers of line and returns the clean line
// and the errors the markers expect.
func stripMarkers(line string) (string, []wantError) {
	var clean strings.Builder
	var wants []wantError
	last := 0
	for _, m := range marker.FindAllStringSubmatchIndex(line, -1) {
		clean.WriteString(line[last:m[0]])
		w := wantError{at: clean.Len(), code: line[m[2]:m[3]]}
		if m[4] >= 0 {
			w.msg = regexp.MustCompile(line[m[4]:m[5]])
		}
		wants = append(wants, w)
		last = m[1]
	}
	clean.WriteString(line[last:])
	return clean.String(), wants
}

// TestErrors: each line carries inline markers «code ~message-regexp»
// standing where its errors must start. Every error must be marked and
// every marker matched; the shape checks the partial tree.
func TestErrors(t *testing.T) {
	for _, tc := range []struct{ line, want string }{
		// Half-typed lines.
		{"CC(Br)C «missing-term ~expected a reactant after '\\+', found the end of the line»+", "R:CC(Br)C"},
		{"CCBr + NaN3, DM", "R:CCBr | R:NaN3 | C:DM"}, // no syntax error: analyze/ says "unknown name"
		{"CCBr + NaN3«missing-term ~expected a condition», ", "R:CCBr | R:NaN3"},
		{"CCBr + NaN3, DMF, 60 °C, «missing-unit ~'12' has no unit»12", "R:CCBr | R:NaN3 | C:DMF | C:[60 °C] | C:[12]"},
		{"CCBr + NaN3 «unclosed-paren ~not closed; write '\\)' after '1.5 eq'»(1.5 eq", "R:CCBr | R:NaN3[1.5 eq]"},
		{"CCBr + NaN3, DMF, 0 °C «range-end ~upper end»to", "R:CCBr | R:NaN3 | C:DMF | C:[0 °C]"},
		{"«missing-substrate ~names no step»azide: ", "label:azide"},
		{"«missing-substrate»[x]", "mark:done"},
		{"CCBr + «reference-empty ~label of an earlier step»@, DMF", "R:CCBr | R:@ | C:DMF"},
		{"CCBr + NaN3, THF«mixture-part ~after '/'»/", "R:CCBr | R:NaN3 | C:mix(THF)"},
		// Separators.
		{"«missing-substrate ~before '\\+'»+ NaN3, DMF", "R:NaN3 | C:DMF"},
		{"CCBr «empty-term ~nothing between '\\+' and ','»+ , DMF", "R:CCBr | C:DMF"},
		{"CCBr + NaN3, DMF «empty-term», , 60 °C", "R:CCBr | R:NaN3 | C:DMF | C:[60 °C]"},
		{"CCBr + NaN3 -> CCN «second-arrow»-> CC", "R:CCBr | R:NaN3 | -> | P:CCN | P:CC"},
		{"CCBr + NaN3 «missing-product ~after '->', found ','»->, DMF", "R:CCBr | R:NaN3 | C:DMF | ->"},
		{"CCBr«plus-spaces ~'CCBr \\+ NaN3'»+NaN3, DMF", "R:CCBr+NaN3 | C:DMF"},
		{"CCBr.[Na+].[N-]=[N+]=[N-]«reaction-smiles ~reaction SMILES»>>CCN=[N+]=[N-]", "R:CCBr.[Na+].[N-]=[N+]=[N-]>>CCN=[N+]=[N-]"},
		{"CCBr + NaN3 DMF, THF 60 °C «two-substances ~second substance 'water' in one term after 'THF'»water", "R:CCBr | R:phrase=NaN3 DMF | C:THF[60 °C]"},
		{"CCBr + NaN3 «empty-parens»()", "R:CCBr | R:NaN3"},
		{"CCBr + NaN3 «unclosed-paren ~write an amount and»(", "R:CCBr | R:NaN3"},
		{"CCBr + NaN3 «half-arrow ~write '->'»-", "R:CCBr | R:phrase=NaN3 -"},
		// Marks and labels.
		{"«mark-space ~put a space after the mark»[x]CCBr + NaN3", "mark:done | R:CCBr | R:NaN3"},
		{"«label-bad ~holds '@'»a@b: CCBr + NaN3", "label:a@b | R:CCBr | R:NaN3"},
		{"«label-empty»: CCBr", "label: | R:CCBr"},
		{"«missing-substrate ~step number '3\\.'»3.", "label:3"},
		{"CCBr + @az«reference-bad ~holds '\\['»[1]", "R:CCBr | R:@az[1]"},
		// Bytes.
		{"CCBr + Na«invalid-utf8 ~0xFF»\xffN3", "R:CCBr | R:Na\xffN3"},
		{"CCBr«control-character ~U\\+0000»\x00 + NaN3", "R:CCBr\x00 | R:NaN3"},
	} {
		line, wants := stripMarkers(tc.line)
		const base = 100 // positions are host offsets: test a non-zero base
		st, errs := Parse([]byte(line), base)
		assert.Equal(t, tc.want, shape(st), "%q", line)
		matched := make([]bool, len(errs))
		for _, w := range wants {
			found := false
			for i, e := range errs {
				if !matched[i] && e.Code == w.code && e.Span.Start == source.Pos(base+w.at) && (w.msg == nil || w.msg.MatchString(e.Msg)) {
					matched[i], found = true, true
					break
				}
			}
			assert.True(t, found, "%q: no error %s at %d; got:\n%s", line, w.code, w.at, errs)
		}
		for i, e := range errs {
			assert.True(t, matched[i], "%q: unexpected error %s %v", line, e.Code, e)
			assert.True(t, e.Span.Start >= base && e.Span.End <= source.Pos(base+len(line)) && e.Span.Start <= e.Span.End,
				"%q: span %v outside the line", line, e.Span)
		}
	}
}

// TestSpans checks that every node lies inside its line and that the
// spans of words are the words, at a non-zero base.
func TestSpans(t *testing.T) {
	line := "[x] azide: @mesylate + NaN3 (1.5 eq), acetone–water 4:1, −78 °C -> rt -> C[C@@H](N=[N+]=[N-])CCc1ccccc1 // ok"
	const base = 1000
	st, errs := Parse([]byte(line), base)
	require.Empty(t, errs)
	text := func(n Node) string { return line[n.Pos()-base : n.End()-base] }
	must := func(n Node, ok bool) Node {
		t.Helper()
		require.True(t, ok)
		return n
	}
	mark, ok := st.Mark()
	assert.Equal(t, "[x]", text(must(mark, ok)))
	label, ok := st.Label()
	assert.Equal(t, "azide:", text(must(label, ok)))
	assert.Equal(t, "azide", line[label.NameSpan.Start-base:label.NameSpan.End-base])
	sub, ok := st.Reactants().At(0).Substance()
	assert.Equal(t, "@mesylate", text(must(sub, ok)))
	r1 := st.Reactants().At(1)
	assert.Equal(t, "NaN3 (1.5 eq)", text(r1))
	q := r1.Quantities().At(0)
	assert.Equal(t, "1.5 eq", text(q))
	assert.Equal(t, "eq", line[q.UnitSpan().Start-base:q.UnitSpan().End-base])
	sep, ok := r1.Sep()
	assert.Equal(t, "+", text(must(sep, ok)))
	mix, ok := st.Conditions().At(0).Substance()
	assert.Equal(t, "acetone–water", text(must(mix, ok)))
	assert.Equal(t, "water", text(mix.Parts().At(1)))
	ratio, ok := mix.Ratio()
	assert.Equal(t, "4:1", text(must(ratio, ok)))
	temp := st.Conditions().At(1).Quantities().At(0)
	assert.Equal(t, "−78 °C -> rt", text(temp))
	to, ok := temp.To()
	assert.Equal(t, "rt", text(must(to, ok)))
	arrow, ok := st.Arrow()
	assert.Equal(t, "->", text(must(arrow, ok)))
	comment, ok := st.Comment()
	assert.Equal(t, "// ok", text(must(comment, ok)))
	var prev source.Pos = base
	Inspect(st, func(n Node) bool {
		assert.True(t, n.Pos() >= base && n.End() <= base+source.Pos(len(line)) && n.Pos() <= n.End(), "%T %d-%d", n, n.Pos(), n.End())
		if _, ok := n.(Step); !ok {
			assert.GreaterOrEqual(t, n.Pos(), prev, "%T %q out of order", n, text(n))
			prev = n.Pos()
		}
		return true
	})
}

func TestLongLine(t *testing.T) {
	line := []byte(strings.Repeat("C", 10<<20))
	st, errs := Parse(line, 0)
	require.Len(t, errs, 1)
	assert.Equal(t, "line-too-long", errs[0].Code)
	assert.True(t, st.Blank())
	// Just under the limit: parsed in full.
	st, errs = Parse(line[:MaxLineLength], 0)
	assert.Empty(t, errs)
	sub, ok := st.Substrate()
	require.True(t, ok)
	assert.Equal(t, MaxLineLength, len(sub.Text()))
}

func TestManyErrors(t *testing.T) {
	st, errs := Parse([]byte(strings.Repeat("\x01", 1000)), 0)
	assert.Equal(t, source.Span{End: 1000}, st.Span())
	assert.LessOrEqual(t, len(errs), maxErrors+1)
	codes := map[string]int{}
	for _, e := range errs {
		codes[e.Code]++
	}
	assert.Equal(t, map[string]int{"control-character": maxErrors, "too-many-errors": 1}, codes)
}

// TestParseLines: the batch parser gives the same trees and errors as
// Parse, line by line, at host offsets.
func TestParseLines(t *testing.T) {
	var text strings.Builder
	var spans []source.Span
	lines := []string{
		"[x] azide: @mesylate + NaN3 (1.5 eq), DMF, 60 °C, 12 h -> C[C@@H](N=[N+]=[N-])CCc1ccccc1 // ok",
		"CC(Br)C +", "", "@ + ,, NaN3 (1.5 eq", "(S)-4-phenylbutan-2-ol + potassium phthalimide, acetone–water 4:1, 0 °C to rt",
		strings.Repeat("C", MaxLineLength+1), "CCBr«x»\xff",
	}
	// Enough lines to reuse the drafts many times and, on a machine of two
	// cores or more, to be cut into runs parsed at once.
	for i := 0; i < 2*parallelLines+100; i++ {
		l := lines[i%len(lines)]
		text.WriteString("  ")
		start := source.Pos(text.Len())
		text.WriteString(l)
		spans = append(spans, source.Span{Start: start, End: start + source.Pos(len(l))})
		text.WriteString("\n")
	}
	host := []byte(text.String())
	steps, errs := ParseLines(host, spans)
	require.Len(t, steps, len(spans))
	var wantAll source.ErrorList
	for i, sp := range spans {
		want, wantErrs := Parse(host[sp.Start:sp.End], sp.Start)
		assert.Equal(t, want.String(), steps[i].String())
		wantAll = append(wantAll, wantErrs...)
	}
	assert.Equal(t, wantAll, errs)
}

func TestParseLinesBadSpan(t *testing.T) {
	steps, errs := ParseLines([]byte("CCBr"), []source.Span{{Start: 2, End: 9}, {Start: 3, End: 1}, {Start: 0, End: 4}})
	require.Len(t, steps, 3)
	require.Len(t, errs, 2)
	assert.Equal(t, "bad-span", errs[0].Code)
	assert.Equal(t, source.Span{Start: 2, End: 9}, errs[0].Span)
	assert.Equal(t, "bad-span", errs[1].Code)
	assert.Equal(t, source.Span{Start: 3, End: 1}, errs[1].Span)
	sub, ok := steps[2].Substrate()
	require.True(t, ok)
	assert.Equal(t, "CCBr", sub.Text())
	assert.Equal(t, source.Span{Start: 2, End: 9}, steps[0].Span())
}

// TestTexts: the texts the Tree derives from the source rather than
// keeps: a phrase's words joined by one space whatever spaces stood
// between them, a mixture's parts joined by '/' whatever joined them, a
// comment without its spaces (no-break ones included).
func TestTexts(t *testing.T) {
	for _, tc := range []struct {
		line  string
		texts []string // every substance's kind and text, in Inspect order
		note  string   // the comment
	}{
		{"potassium\u00a0 phthalimide + NaN3, acetone – water\t4:1 // \u00a0note\u00a0",
			[]string{"phrase potassium phthalimide", "word NaN3", "mixture acetone/water", "word acetone", "word water"}, "note"},
		{"CCBr + NaN3, THF / water, MeOH/CH2Cl2 1:9",
			[]string{"word CCBr", "word NaN3", "mixture THF/water", "word THF", "word water", "mixture MeOH/CH2Cl2", "word MeOH", "word CH2Cl2"}, ""},
		{"@sm + NaN3, acetic  acid/water",
			[]string{"reference sm", "word NaN3", "mixture acetic acid/water", "phrase acetic acid", "word water"}, ""},
	} {
		st, errs := Parse([]byte(tc.line), 0)
		require.Empty(t, errs, "%q", tc.line)
		var got []string
		Inspect(st, func(n Node) bool {
			if s, ok := n.(Substance); ok {
				got = append(got, s.Kind().String()+" "+s.Text())
			}
			return true
		})
		assert.Equal(t, tc.texts, got, "%q", tc.line)
		c, ok := st.Comment()
		assert.Equal(t, tc.note != "", ok)
		assert.Equal(t, tc.note, c.Text)
	}
}

// TestNodeSize: a node is 24 bytes, as treeNodes and the Tree's doc
// assume; a field added carelessly would make every page's tree larger.
func TestNodeSize(t *testing.T) {
	assert.Equal(t, uintptr(24), unsafe.Sizeof(node{}))
	assert.LessOrEqual(t, treeNodes*int(unsafe.Sizeof(node{})), 32<<10)
	assert.Greater(t, (treeNodes+1)*int(unsafe.Sizeof(node{})), 32<<10)
}

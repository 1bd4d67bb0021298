package cip

import (
	"testing"

	"walden/analyze/smiles"
)

// fixture is the digraph of one centre of a small molecule, with the
// root's edges by neighbour atom (molecule.Implicit for the hydrogen).
type fixture struct {
	l     *Labeller
	g     *digraph
	edges map[int]int32
}

func newFixture(t *testing.T, smi string, atom int, withAux bool) fixture {
	t.Helper()
	m, err := smiles.Parse(smi)
	if err != nil {
		t.Fatalf("%s: %v", smi, err)
	}
	l := &Labeller{}
	l.units = units(m, nil)
	l.prepare(m)
	l.g.reset(&l.v, atom, DefaultNodeLimit)
	if withAux {
		found := false
		for i, u := range l.units {
			if u.atoms[0] == atom && u.kind == centre {
				l.setAux(i)
				l.g.reroot(0)
				found = true
			}
		}
		if !found {
			t.Fatalf("%s: atom %d is not a written centre", smi, atom)
		}
	}
	f := fixture{l, &l.g, map[int]int32{}}
	for _, e := range l.g.out(0, nil) {
		f.edges[l.g.atomOf(e)] = e
	}
	return f
}

// both returns rule r's verdict on ligands a and b, and on b and a.
func (f fixture) both(t *testing.T, r ruleID, a, b int) (int, int) {
	t.Helper()
	ea, ok1 := f.edges[a]
	eb, ok2 := f.edges[b]
	if !ok1 || !ok2 {
		t.Fatalf("atoms %d, %d are not both ligands of the root", a, b)
	}
	rl := rule{r, None}
	return f.g.explore(rl, ea, eb), f.g.explore(rl, eb, ea)
}

// TestRules checks each sequence rule alone on small molecules, in both
// orders. Expected rankings follow from the rule texts of P-92.1.4 (IUPAC
// 2013) quoted in each rule's file, applied by hand; the source of each
// case is named beside it.
func TestRules(t *testing.T) {
	const H = -1
	tests := []struct {
		name     string
		smi      string
		centre   int
		rule     ruleID
		a, b     int
		want     int // verdict on (a, b); (b, a) must be its negation
		needsAux bool
	}{
		// Rule 1a, sphere 1: Br (35) above Cl (17); P-92.1.4 rule 1a.
		{"1a Br>Cl", "Cl[C@H](Br)F", 1, rule1a, 2, 0, 1, false},
		// Rule 1a, sphere 1: F above the hydrogen.
		{"1a F>H", "Cl[C@H](Br)F", 1, rule1a, 3, H, 1, false},
		// Rule 1a, sphere 2: ethyl {C,H,H} above methyl {H,H,H}; the
		// butan-2-ol example of P-92.1.4 (common textbook case).
		{"1a ethyl>methyl", "C[C@H](O)CC", 1, rule1a, 3, 0, 1, false},
		// Rule 1a with a duplicate atom: vinyl {C,(C),H} ties isopropyl
		// {C,C,H} at sphere 2, and wins at sphere 3 with its duplicated
		// carbon against hydrogen; P-92.1.4.2 (common textbook case).
		{"1a vinyl>isopropyl", "C=C[C@H](O)C(C)C", 2, rule1a, 1, 4, 1, false},
		// Rule 1a, a tie: two methyls of the same centre.
		{"1a tie", "CC(C)(O)CC", 1, rule1a, 0, 2, 0, false},
		// Rule 1a, mancude duplicate: pyridin-2-yl carries a duplicate of
		// (7+6)/2 = 6.5, below the imine carbon's duplicate nitrogen (7);
		// P-92.1.4.4, suite entry VS032 (Hanson et al. 2018).
		{"1a mancude", "O[C@H](/C=N\\C)C1=NC=CC=C1", 1, rule1a, 2, 5, 1, false},
		// Rule 2: deuterium (2.014) above hydrogen (1.008); P-92.1.4 rule 2.
		{"2 D>H", "C[C@H](O)[2H]", 1, rule2, 3, H, 1, false},
		// Rule 2: 13C above natural carbon; suite entry VS178.
		{"2 13C>C", "C[C@]([13CH2]C)(CC)O", 1, rule2, 2, 4, 1, false},
		// Rule 3: the (Z)-propenyl branch above the (E)-propenyl one;
		// P-92.1.4 rule 3 ("Z precedes E").
		{"3 Z>E", "C/C=C/[C@@H](O)/C=C\\C", 3, rule3, 5, 2, 1, true},
		// Rule 4a: a branch with a chiral centre above the same branch
		// written without one; P-92.1.4 rule 4a.
		{"4a chiral>none", "C[C@@H](Cl)C[C@H](O)CC(C)Cl", 4, rule4a, 3, 6, 1, true},
		// Rule 4b: the N bearing two R centres (like pair) above the N
		// bearing R and S (unlike pair); suite entry VS202 (3R).
		{"4b like>unlike", "O=C([C@@H](N([C@@H](C)O)[C@@H](C)O)N([C@@H](C)O)[C@H](C)O)O", 2, rule4b, 3, 10, 1, true},
		// Rule 5: R above S, answered as an enantiomorphic pair (±2):
		// the pseudo-asymmetric C3 of 2,4-dichloropentan-3-ol type; P-92.1.4
		// rule 5, suite entry VS228 (4s).
		{"5 R>S", "O=C([C@H]([C@H]([C@H](C(O)=O)Cl)Cl)Cl)O", 3, rule5, 2, 4, 2, true},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			f := newFixture(t, tc.smi, tc.centre, tc.needsAux)
			ab, ba := f.both(t, tc.rule, tc.a, tc.b)
			if ab != tc.want || ba != -tc.want {
				t.Errorf("compare(a,b) = %d, compare(b,a) = %d; want %d and %d", ab, ba, tc.want, -tc.want)
			}
		})
	}
}

// TestAuxRulesByHand checks rules 3, 4a and 4c on auxiliary descriptors
// set by hand, in both orders: Z > E > none (rule 3), chiral > pseudo-
// asymmetric > none (4a), r > s and m > p (4c); P-92.1.4.
func TestAuxRulesByHand(t *testing.T) {
	tests := []struct {
		rule ruleID
		x, y Letter
		want int
	}{
		{rule3, Z, E, 1}, {rule3, E, None, 1}, {rule3, Z, None, 1},
		{rule4a, R, LowerR, 1}, {rule4a, S, None, 1}, {rule4a, LowerS, None, 1}, {rule4a, R, S, 0},
		{rule4c, LowerR, LowerS, 1}, {rule4c, LowerM, LowerP, 1}, {rule4c, LowerS, None, 1}, {rule4c, R, S, 0},
	}
	for _, tc := range tests {
		f := newFixture(t, "CC(C)O", 1, false) // two methyls to carry the descriptors
		g := f.g
		ea, eb := f.edges[0], f.edges[2]
		g.nodes[g.edges[ea].end].aux = tc.x
		g.nodes[g.edges[eb].end].aux = tc.y
		ab, ba := g.compare(rule{tc.rule, None}, ea, eb), g.compare(rule{tc.rule, None}, eb, ea)
		if ab != tc.want || ba != -tc.want {
			t.Errorf("rule %d: %v vs %v: got %d/%d, want %d/%d", tc.rule, tc.x, tc.y, ab, ba, tc.want, -tc.want)
		}
	}
}

// TestRule1bAnd6Needed checks that entries the suite marks as needing
// rule 1b (VS172) and rule 6 (VS288) are tied before that rule and get
// the suite's descriptor with it (Hanson et al. 2018, suite columns 3
// and 6).
func TestRule1bAnd6Needed(t *testing.T) {
	tests := []struct {
		smi    string
		centre int
		before *ruleSeq
		with   *ruleSeq
		want   Letter
	}{
		{"C1[C@H]2CC=C[C@@H]12", 1, prefixes[rule1a], prefixes[rule1b], R}, // VS172: 2R
		{"O=C1[C@@]2(CCCC2=O)CCC1", 2, prefixes[rule5], allRules, S},       // VS288: 3S
	}
	for _, tc := range tests {
		m, err := smiles.Parse(tc.smi)
		if err != nil {
			t.Fatal(err)
		}
		l := &Labeller{}
		l.units = units(m, nil)
		l.prepare(m)
		var u *unit
		for i := range l.units {
			if l.units[i].atoms[0] == tc.centre {
				u = &l.units[i]
				if tc.with == allRules {
					l.g.reset(&l.v, tc.centre, DefaultNodeLimit)
					l.setAux(i)
				}
			}
		}
		if u == nil {
			t.Fatalf("%s: no centre at %d", tc.smi, tc.centre)
		}
		if tc.with != allRules {
			l.g.reset(&l.v, tc.centre, DefaultNodeLimit)
		}
		if d, tied := l.labelAt(u, 0, tc.before); d != None || !tied {
			t.Errorf("%s: before the rule: got %v (tied %v), want a tie", tc.smi, d, tied)
		}
		l.g.reroot(0)
		if d, _ := l.labelAt(u, 0, tc.with); d != tc.want {
			t.Errorf("%s: with the rule: got %v, want %v", tc.smi, d, tc.want)
		}
	}
}

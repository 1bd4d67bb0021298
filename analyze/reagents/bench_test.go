package reagents

import "testing"

// The language server calls Lookup and Suggest while the user types: Lookup
// must not allocate, Suggest must stay well under a millisecond.

func BenchmarkLookup(b *testing.B) {
	Builtin()
	names := []string{"NaN3", "potassium tert-butoxide", "dmf", "Et₃N", "no such thing"}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Lookup(names[i%len(names)])
	}
}

func TestLookupDoesNotAllocate(t *testing.T) {
	Builtin()
	for _, n := range []string{"NaN3", "potassium tert-butoxide", "dmf", "Et₃N", "no such thing"} {
		if a := testing.AllocsPerRun(100, func() { Lookup(n) }); a != 0 {
			t.Errorf("Lookup(%q) allocates %v times", n, a)
		}
	}
}

func BenchmarkSuggest(b *testing.B) {
	Builtin()
	names := []string{"sodium azde", "KOBut", "tetrahydrofurane", "Na", "qqqqqqqqqqqqqq"}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Suggest(names[i%len(names)], 5)
	}
}

func BenchmarkBuiltinTables(b *testing.B) {
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		bt := loadTables()
		build(bt.reagents, bt.solvents)
	}
}

func BenchmarkLoadLabFile(b *testing.B) {
	text := []byte(`reagent Boc-piperazine: smiles=CC(C)(C)OC(=O)N1CCNCC1 roles=nucleophile,base pKaH=8.5 source="from memory"
solvent CPME-dry: smiles=COC1CCCC1 dielectric=4.76 protic=no bp=106 source="from memory"
alias Huenig = DIPEA
`)
	Builtin()
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		Load(text, "lab")
	}
}

package perceive

import (
	"cmp"
	_ "embed"
	"slices"
	"strings"

	"walden/analyze/reagents"
)

//go:embed solvents.tsv
var solventTable string

// SolventEffect is one row of the solvent-effect table.
type SolventEffect struct {
	Names       []string
	SMILES      string
	Class       string // "polar protic", "polar aprotic", "nonpolar"
	Protic      bool
	Dielectric  float64
	BoilingC    float64
	Anion       float64 // log10 SN2 speed-up for anionic nucleophiles relative to methanol (Parker)
	Y           float64 // Grunwald–Winstein ionising power
	Nucleophile string  // SMILES of the solvent as a nucleophile, "" when it is not one
	Source      string
}

var solventEffects = func() []SolventEffect {
	var out []SolventEffect
	for _, r := range readTSV(solventTable) {
		e := SolventEffect{Names: strings.Split(r["names"], "|"), SMILES: r["smiles"], Class: r["class"], Protic: r["protic"] == "yes", Nucleophile: r["nucleophile"], Source: r["source"]}
		e.Dielectric, _ = num(r["dielectric"])
		e.BoilingC, _ = num(r["boiling"])
		e.Anion, _ = num(r["anion"])
		e.Y, _ = num(r["Y"])
		out = append(out, e)
	}
	return out
}()

// SolventEffects lists the table rows.
func SolventEffects() []SolventEffect { return solventEffects }

// LookupSolvent finds the table row answering to name (case-insensitive)
// or to the SMILES smiles.
func LookupSolvent(name, smiles string) (SolventEffect, bool) {
	for _, e := range solventEffects {
		for _, n := range e.Names {
			if strings.EqualFold(n, name) {
				return e, true
			}
		}
		if smiles != "" && e.SMILES == smiles {
			return e, true
		}
	}
	return SolventEffect{}, false
}

// DefaultSolvent is the solvent assumed when a step names none: DMF, the
// commonest solvent for alkylations with salts (common practice).
const DefaultSolvent = "DMF"

// DefaultTempC is the temperature assumed when a step gives none.
const DefaultTempC = 25.0

// SolventShare is one solvent of a step with its volume fraction.
type SolventShare struct {
	Solvent  *reagents.Solvent
	Fraction float64 // 0 when not given (shares are then equal)
}

// Medium is the solvent and temperature of a step as the rules see them.
type Medium struct {
	Parts      []SolventEffect // the solvents, largest share first
	Shares     []float64
	Name       string  // for messages ("DMF", "water/acetone")
	Protic     bool    // a protic solvent makes up at least a tenth of the mixture
	Class      string  // class of the main solvent
	Dielectric float64 // share-weighted
	Anion      float64 // log10 SN2 speed-up for anions relative to methanol
	Y          float64 // ionising power
	Water      float64 // volume fraction of water
	TempC      float64
	Reflux     bool
	Defaulted  bool     // no solvent given: DefaultSolvent assumed
	NoTemp     bool     // no temperature given: DefaultTempC assumed
	Estimated  []string // solvents not in the table, whose effects were estimated from their class
}

// PerceiveMedium combines the solvents of a step and its temperature.
func PerceiveMedium(solvents []SolventShare, tempC *float64, reflux bool) Medium {
	return PerceiveSolvents(solvents).AtTemp(tempC, reflux)
}

// PerceiveSolvents is PerceiveMedium without the temperature (TempC,
// NoTemp and Reflux are left zero; AtTemp sets them). A caller that keeps
// the answer for steps with the same solvents at other temperatures
// shares its lists, which must then not be changed.
func PerceiveSolvents(solvents []SolventShare) Medium {
	var md Medium
	type part struct {
		e SolventEffect
		f float64
	}
	// A step names few solvents: their working list and names stay on
	// the stack, and the Medium gets its two lists at their final size.
	var partBuf [4]part
	parts := partBuf[:0]
	for _, s := range solvents {
		if s.Solvent == nil {
			continue
		}
		e, ok := effectOf(s.Solvent)
		if !ok {
			md.Estimated = append(md.Estimated, displayName(s.Solvent))
		}
		parts = append(parts, part{e, s.Fraction})
	}
	if len(parts) == 0 {
		e, _ := LookupSolvent(DefaultSolvent, "")
		parts = append(parts, part{e, 1})
		md.Defaulted = true
	}
	total := 0.0
	for _, p := range parts {
		total += p.f
	}
	for i := range parts {
		if total == 0 {
			parts[i].f = 1 / float64(len(parts))
		} else {
			parts[i].f /= total
		}
	}
	// Largest share first, stably.
	slices.SortStableFunc(parts, func(a, b part) int { return cmp.Compare(b.f, a.f) })
	var nameBuf [4]string
	names := nameBuf[:0]
	md.Parts = make([]SolventEffect, len(parts))
	md.Shares = make([]float64, len(parts))
	var co *part
	for i, p := range parts {
		md.Parts[i] = p.e
		md.Shares[i] = p.f
		names = append(names, p.e.Names[0])
		md.Dielectric += p.f * p.e.Dielectric
		if p.e.Protic && p.f >= 0.1 {
			md.Protic = true
		}
		if p.e.SMILES == "O" {
			md.Water += p.f
		} else if co == nil {
			co = &parts[i]
		}
	}
	md.Name = strings.Join(names, "/")
	md.Class = parts[0].e.Class
	// Anions: a protic component of a tenth or more hydrogen-bonds them
	// (Parker 1969); otherwise the share-weighted value.
	md.Anion = 0
	if md.Protic {
		best := -99.0
		for _, p := range parts {
			if p.e.Protic && p.f >= 0.1 && p.e.Anion > best {
				best = p.e.Anion
			}
		}
		md.Anion = best
	} else {
		for _, p := range parts {
			md.Anion += p.f * p.e.Anion
		}
	}
	switch {
	case md.Water > 0 && co != nil:
		md.Y = aqueousY(co.e, md.Water)
	default:
		for _, p := range parts {
			md.Y += p.f * p.e.Y
		}
	}
	return md
}

// AtTemp returns md at temperature tempC (nil when not given) or at
// reflux: the temperature fields of PerceiveMedium.
func (md Medium) AtTemp(tempC *float64, reflux bool) Medium {
	md.TempC = DefaultTempC
	md.NoTemp = false
	switch {
	case tempC != nil:
		md.TempC = *tempC
	case reflux:
		// The mixture boils near its lowest-boiling main component.
		bp := 0.0
		for i := range md.Parts {
			if e := &md.Parts[i]; md.Shares[i] >= 0.2 && e.BoilingC > 0 && (bp == 0 || e.BoilingC < bp) {
				bp = e.BoilingC
			}
		}
		if bp > 0 {
			md.TempC = bp
		}
	default:
		md.NoTemp = true
	}
	md.Reflux = reflux
	return md
}

// effectOf finds the table row for a dictionary solvent, or estimates
// one from the dictionary's class when the table has no row.
func effectOf(s *reagents.Solvent) (SolventEffect, bool) {
	for _, n := range s.Names {
		if e, ok := LookupSolvent(n, s.SMILES); ok {
			return e, true
		}
	}
	if e, ok := LookupSolvent("", s.SMILES); ok {
		return e, true
	}
	e := SolventEffect{Names: append([]string{displayName(s)}, s.Names...), SMILES: s.SMILES, Class: s.Class, Protic: s.Protic, Source: "estimated from the solvent's class (no row in the solvent-effect table)"}
	e.Dielectric = s.Dielectric.V
	e.BoilingC = s.BoilingC.V
	switch {
	case s.Protic:
		e.Anion, e.Y = 0, -2
	case s.Class == "polar aprotic" || s.Dielectric.V >= 20:
		e.Anion, e.Y = 3, -6
	default:
		e.Anion, e.Y = 0.5, -9
	}
	return e, false
}

func displayName(s *reagents.Solvent) string {
	if len(s.Names) > 0 {
		return s.Names[0]
	}
	return s.SMILES
}

// aqueousY interpolates the ionising power of a water mixture from the
// Grunwald–Winstein values of aqueous ethanol (protic co-solvents) and
// aqueous acetone (aprotic ones): Fainberg, A. H.; Winstein, S. J. Am.
// Chem. Soc. 1956, 78, 2770 (from memory).
func aqueousY(co SolventEffect, water float64) float64 {
	type pt struct{ w, y float64 }
	var curve []pt
	if co.Protic {
		shift := co.Y - (-2.03)
		curve = []pt{{0, -2.03 + shift}, {0.2, 0 + 0.8*shift}, {0.5, 1.66 + 0.5*shift}, {1, 3.49}}
	} else {
		curve = []pt{{0, co.Y}, {0.1, -1.86}, {0.2, -0.67}, {0.3, 0.13}, {0.5, 1.4}, {1, 3.49}}
	}
	for i := 1; i < len(curve); i++ {
		if water <= curve[i].w {
			a, b := curve[i-1], curve[i]
			return a.y + (b.y-a.y)*(water-a.w)/(b.w-a.w)
		}
	}
	return 3.49
}

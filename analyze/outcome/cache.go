package outcome

import (
	"walden/analyze/molecule"
	"walden/analyze/perceive"
	"walden/analyze/smiles"
	"walden/internal/bounded"
)

// Cache keeps the parts of a prediction that do not depend on the
// conditions, for a caller that predicts many steps on the same
// molecules (a notebook whose steps differ in temperature or amounts):
// the perception of a substrate, ionised reagents, the perceived
// solvents and the solvent's nucleophile, the products of each pathway
// and of sulfonylations, CIP letters, the symmetry classes of
// nucleophiles and the texts of reasons.
//
// A Cache knows molecules and solvent entries by identity: a caller that
// sets Step.Cache promises that the substrate and reagent molecules and
// the solvent entries are never changed afterwards (Predict itself only
// reads them, and the products it hands out through a Cache are shared
// and must not be changed either). Keys hold the molecules they name, so
// an address is never reused while an entry lives. Each table is bounded
// (internal/bounded). A Cache is safe for concurrent use; the zero value
// is an empty Cache. A nil *Cache caches nothing.
type Cache struct {
	subs     bounded.Table[*molecule.Molecule, *perceive.Substrate]
	ionised  bounded.Table[*molecule.Molecule, *molecule.Molecule]
	solvNu   bounded.Table[string, solventNu]
	reagents bounded.Table[reagentsKey, perceive.Reagents]
	products bounded.Table[productKey, []Product]
	labels   bounded.Table[labelKey, string]
	syms     bounded.Table[*molecule.Molecule, []uint64]
	media    bounded.Table[solventsKey, perceive.Medium]
	esters   bounded.Table[sulfonateKey, sulfonateEster]
	texts    texts // reason texts, shared between predictions
}

// NewCache returns an empty Cache. Its tables are made on first use: a
// caller that predicts one step should not pay for them.
func NewCache() *Cache { return &Cache{} }

// Substrate returns perceive.PerceiveSubstrate(m), once per molecule. The
// answer is shared: callers must not change it.
func (c *Cache) Substrate(m *molecule.Molecule) *perceive.Substrate {
	if c == nil {
		return perceive.PerceiveSubstrate(m)
	}
	return c.subs.Do(m, func() *perceive.Substrate { return perceive.PerceiveSubstrate(m) })
}

// ionise returns perceive.Ionise(m), once per molecule.
func (c *Cache) ionise(m *molecule.Molecule) *molecule.Molecule {
	if c == nil {
		return perceive.Ionise(m)
	}
	return c.ionised.Do(m, func() *molecule.Molecule { return perceive.Ionise(m) })
}

// cachedReagents is the most reagents a step may have for their
// perception to be kept; longer steps are rare and perceived each time.
const cachedReagents = 4

// reagentsKey is the (ionised) reagents of a step: molecules and entries
// by identity, equivalents by value.
type reagentsKey struct {
	rs [cachedReagents]Reactant
	n  int
}

// perceiveReagents returns perceive.PerceiveReagents(rs), once per
// distinct list. The answer is shared: callers must not change it.
func (c *Cache) perceiveReagents(rs []Reactant) perceive.Reagents {
	if c == nil || len(rs) > cachedReagents {
		return perceive.PerceiveReagents(rs)
	}
	k := reagentsKey{n: len(rs)}
	copy(k.rs[:], rs)
	return c.reagents.Do(k, func() perceive.Reagents { return perceive.PerceiveReagents(rs) })
}

// solventsKey is the solvents of a step: dictionary entries by identity,
// shares by value.
type solventsKey struct {
	ss [cachedReagents]SolventShare
	n  int
}

// solvents returns perceive.PerceiveSolvents(ss), once per distinct
// list: the steps of a page mostly differ in temperature, not solvent.
// The answer's lists are shared: callers must not change them.
func (c *Cache) solvents(ss []SolventShare) perceive.Medium {
	if c == nil || len(ss) > len(solventsKey{}.ss) {
		return perceive.PerceiveSolvents(ss)
	}
	k := solventsKey{n: len(ss)}
	copy(k.ss[:], ss)
	return c.media.Do(k, func() perceive.Medium { return perceive.PerceiveSolvents(ss) })
}

// solventNu is the nucleophile of a solvent, read from its SMILES.
type solventNu struct {
	nu  *perceive.Nucleophile // nil when the SMILES does not read or has none
	mol *molecule.Molecule
}

// solventNucleophile returns the nucleophile perceived in a solvent's
// SMILES, once per text. The caller gets its own copy of the
// Nucleophile; the molecule is shared.
func (c *Cache) solventNucleophile(smi string) (*perceive.Nucleophile, *molecule.Molecule) {
	if c == nil {
		return nil, nil
	}
	s := c.solvNu.Do(smi, func() solventNu {
		m, err := smiles.Parse(smi)
		if err != nil {
			return solventNu{}
		}
		g := perceive.PerceiveReagents([]Reactant{{Mol: m}})
		if g.Nucleophile == nil {
			return solventNu{}
		}
		return solventNu{g.Nucleophile, m}
	})
	if s.nu == nil {
		return nil, nil
	}
	nu := *s.nu
	return &nu, s.mol
}

// productKey is everything substitute and eliminate read to build the
// products of one pathway: the substrate and the nucleophile's molecule
// by identity, the site and the nucleophile's site by value. The rest of
// the site (class, β-carbons, rings, symmetry) follows from the
// substrate's perception.
type productKey struct {
	sub            *molecule.Molecule
	pathway        Mechanism
	carbon, attach int
	kind           perceive.LeavingKind
	inRing         bool
	nuMol          *molecule.Molecule
	nuAtom         int
	nuKind         perceive.NucKind
	deprotonated   bool
	protonFrom     int
	centre         int
	shift          string
	migrant        int
	hofmann        bool
}

// pathwayProducts returns the products of pathway p for the scoring c,
// each with its share within the pathway, its configuration settled and
// its canonical SMILES; built once per distinct key. The molecules are
// shared: callers must not change them.
func (c *Cache) pathwayProducts(sub *molecule.Molecule, sc *scoring, p Mechanism) []Product {
	k := productKey{sub: sub, pathway: p, carbon: sc.site.Carbon, attach: sc.site.Leaving.Attach,
		kind: sc.site.Leaving.Kind, inRing: sc.site.Leaving.InRing, nuMol: sc.nuMol,
		centre: sc.cation.centre, shift: sc.cation.shift, migrant: sc.cation.migrant}
	if sc.nu != nil {
		k.nuAtom, k.nuKind, k.deprotonated, k.protonFrom = sc.nu.Atom, sc.nu.Kind, sc.nu.Deprotonated, sc.nu.ProtonFrom
	}
	if p == E2 {
		k.hofmann = hofmannConditions(sc)
	}
	if c == nil {
		return buildProducts(sub, sc, p)
	}
	return c.products.Do(k, func() []Product { return buildProducts(sub, sc, p) })
}

// sulfonate returns buildSulfonate(k), once per key. The molecule is
// shared: callers must not change it.
func (c *Cache) sulfonate(k sulfonateKey) sulfonateEster {
	if c == nil {
		return buildSulfonate(k)
	}
	return c.esters.Do(k, func() sulfonateEster { return buildSulfonate(k) })
}

// symmetry returns perceive.SymmetryClasses(m), once per molecule. The
// answer is shared: callers must not change it.
func (c *Cache) symmetry(m *molecule.Molecule) []uint64 {
	if c == nil {
		return perceive.SymmetryClasses(m)
	}
	return c.syms.Do(m, func() []uint64 { return perceive.SymmetryClasses(m) })
}

// labelKey names one atom of one molecule.
type labelKey struct {
	m    *molecule.Molecule
	atom int
}

// label returns the CIP letter of atom a of m, once per atom.
func (c *Cache) label(m *molecule.Molecule, a int) string {
	if c == nil {
		return label(m, a)
	}
	return c.labels.Do(labelKey{m, a}, func() string { return label(m, a) })
}

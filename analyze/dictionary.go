package analyze

import (
	"sync"

	"walden/analyze/molecule"
	"walden/analyze/reagents"
	"walden/analyze/smiles"
	"walden/grammar/source"
)

// dictionary is the Engine's view of the reagent and solvent dictionary:
// the built-in tables plus the lab's own names file.
type dictionary struct {
	mols      sync.Map // SMILES of an entry → *molecule.Molecule, read once and shared (never changed)
	d         *reagents.Dictionary
	errs      source.ErrorList // problems in the lab's names file, positioned in it
	canonOnce sync.Once
	canon     map[string]entry // canonical SMILES → entry, for entries written as SMILES
	namesOnce sync.Once
	names     []reagents.Name // for completion, sorted; made on first use
}

// entry is what a name stands for: a reagent, a solvent, or both
// (pyridine, water and methanol are each).
type entry struct {
	reagent *reagents.Reagent
	solvent *reagents.Solvent
}

// dictionaries shares one dictionary per names file content between
// Engines (walden check makes one Engine per file): the molecules and the
// SMILES index are read once per process.
var dictionaries sync.Map // LabNamesFile + "\x00" + LabNames → *dictionary

func newDictionary(cfg Config) *dictionary {
	key := cfg.LabNamesFile + "\x00" + string(cfg.LabNames)
	if d, ok := dictionaries.Load(key); ok {
		return d.(*dictionary)
	}
	d, _ := dictionaries.LoadOrStore(key, readDictionary(cfg))
	return d.(*dictionary)
}

func readDictionary(cfg Config) *dictionary {
	d := &dictionary{d: reagents.Builtin()}
	if len(cfg.LabNames) > 0 {
		nd, errs := reagents.Load(cfg.LabNames, cfg.LabNamesFile)
		d.d = nd
		for _, e := range errs {
			d.errs.Add(e.Span, CodeSettings, e.Msg)
		}
	}
	return d
}

// lookup finds a name (the dictionary's own rules on case and spelling).
func (d *dictionary) lookup(name string) entry {
	e, ok := d.d.Lookup(name)
	if !ok {
		return entry{}
	}
	return entry{e.Reagent, e.Solvent}
}

// asSolvent finds a name as a solvent only.
func (d *dictionary) asSolvent(name string) *reagents.Solvent { return d.lookup(name).solvent }

// suggest returns up to n known names closest to name.
func (d *dictionary) suggest(name string, n int) []string { return d.d.Suggest(name, n) }

// molecule returns the molecule of a dictionary entry's SMILES, read once:
// the same reagent appears in thousands of steps. The molecule is shared
// and must not be changed; nil when the SMILES does not read.
func (d *dictionary) molecule(smi string) *molecule.Molecule {
	if smi == "" {
		return nil
	}
	if m, ok := d.mols.Load(smi); ok {
		return m.(*molecule.Molecule)
	}
	m, err := smiles.Parse(smi)
	if err != nil {
		m = nil
	}
	d.mols.Store(smi, m)
	return m
}

// allNames returns every name with its detail, for completion.
func (d *dictionary) allNames() []reagents.Name {
	d.namesOnce.Do(func() { d.names = d.d.Names() })
	return d.names
}

// bySMILES finds the entry whose SMILES (as weighed out, or the solvent's)
// is the same structure as m.
func (d *dictionary) bySMILES(m *molecule.Molecule) entry {
	d.canonOnce.Do(func() {
		d.canon = map[string]entry{}
		for _, s := range d.d.Solvents() {
			if mol := d.molecule(s.SMILES); mol != nil {
				e := d.canon[smiles.Canonical(mol)]
				if e.solvent == nil {
					e.solvent = s
				}
				d.canon[smiles.Canonical(mol)] = e
			}
		}
		for _, r := range d.d.Reagents() {
			if mol := d.molecule(r.Whole); mol != nil {
				k := smiles.Canonical(mol)
				e := d.canon[k]
				if e.reagent == nil {
					e.reagent = r
				}
				d.canon[k] = e
			}
		}
	})
	return d.canon[smiles.Canonical(m)]
}

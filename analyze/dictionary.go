package analyze

import (
	"walden/analyze/reagents"
	"walden/grammar/source"
)

// dictionary is the Engine's view of the reagent and solvent dictionary:
// the built-in tables plus the lab's own names file.
type dictionary struct {
	d     *reagents.Dictionary
	errs  source.ErrorList // problems in the lab's names file, positioned in it
	names []reagents.Name  // for completion, sorted
}

// entry is what a name stands for: a reagent, a solvent, or both
// (pyridine, water and methanol are each).
type entry struct {
	reagent *reagents.Reagent
	solvent *reagents.Solvent
}

func newDictionary(cfg Config) *dictionary {
	d := &dictionary{d: reagents.Builtin()}
	if len(cfg.LabNames) > 0 {
		nd, errs := reagents.Load(cfg.LabNames, cfg.LabNamesFile)
		d.d = nd
		for _, e := range errs {
			d.errs.Add(e.Span, CodeSettings, e.Msg)
		}
	}
	d.names = d.d.Names()
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

package reagents

import (
	"strconv"
	"strings"
)

// Mixture describes a solvent mixture such as "THF/water" or
// "acetone–water 4:1" from its components and their volume parts (equal
// parts when parts is nil or does not match). It is an estimate, and says
// so in its sources:
//
//   - the dielectric constant is the volume-fraction average of the
//     components' — a common first approximation; measured values of
//     aqueous mixtures deviate from it by several units;
//   - the mixture is protic when a protic component makes up at least a
//     tenth of it (a little water or alcohol already solvates anions);
//   - the boiling point given is the lowest of the components', where a
//     mixture starts to reflux (azeotropes aside).
//
// It returns nil when parts has no positive part.
func Mixture(components []*Solvent, parts []float64) *Solvent {
	if len(components) == 0 {
		return nil
	}
	if len(parts) != len(components) {
		parts = make([]float64, len(components))
		for i := range parts {
			parts[i] = 1
		}
	}
	total := 0.0
	for _, p := range parts {
		if p > 0 {
			total += p
		}
	}
	if total == 0 {
		return nil
	}
	m := &Solvent{Origin: "mixture", Source: "estimate from the components (see Mixture)", DielectricTempC: 25}
	var names, ratio, smiles []string
	eps, epsKnown := 0.0, true
	bp, bpKnown := 0.0, false
	for i, s := range components {
		f := max(parts[i], 0) / total
		if s == nil || f == 0 {
			continue
		}
		names = append(names, s.Name())
		ratio = append(ratio, strconv.FormatFloat(parts[i], 'g', 4, 64))
		smiles = append(smiles, s.SMILES)
		if s.Dielectric.Known {
			eps += f * s.Dielectric.V
		} else {
			epsKnown = false
		}
		if s.Protic && f >= 0.1 {
			m.Protic = true
		}
		if s.BoilingC.Known && (!bpKnown || s.BoilingC.V < bp) {
			bp, bpKnown = s.BoilingC.V, true
		}
		m.Hazards = mergeNames(m.Hazards, s.Hazards)
	}
	if len(names) == 0 {
		return nil
	}
	m.Names = []string{strings.Join(names, "/") + " " + strings.Join(ratio, ":")}
	m.SMILES = strings.Join(smiles, ".")
	if epsKnown {
		m.Dielectric = Value{V: eps, Known: true, Source: "estimate: volume-fraction average of the components (measured mixture values deviate)"}
	}
	if bpKnown {
		m.BoilingC = Value{V: bp, Known: true, Source: "estimate: lowest boiling point of the components"}
	}
	m.Class = defaultClass(m)
	return m
}

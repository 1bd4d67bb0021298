package analyze

// Prediction is the outcome of one step as walden predict and the server
// show it: the mechanism, the products, what happened at each stereocentre
// of the substrate's reacting carbon, and the reasons.
type Prediction struct {
	Mechanism   string // "SN2", "SN1", "E2", "E1" or "none"
	NotAnalysed string // why the rules cannot decide; "" when they can
	Products    []PredictedProduct
	Stereo      []StereoChange
	Reasons     []string
	// Distribution is each pathway's predicted share, largest first.
	Distribution []PathwayShare
	// Through is the configuration through the plan up to and including
	// this step, e.g. ["k1 retained (S)", "k2 inverted (R)"].
	Through []string
}

// PredictedProduct is one product with its predicted share.
type PredictedProduct struct {
	SMILES    string // canonical, isomeric
	Fraction  float64
	Major     bool
	Mechanism string
}

// StereoChange is what happened at one stereocentre of the substrate.
type StereoChange struct {
	Atom          int    // 0-based index in the substrate (SMILES input order)
	Before, After string // CIP letters; "" when the centre has none
	Outcome       string // "inverted", "retained" or "lost"
	LetterChanged bool   // true only when both letters exist and differ
	// Why says why a lost centre is lost ("the carbon becomes part of the
	// double bond"); "" for inverted and retained centres.
	Why string
}

// Describe says in words what happened at the centre, the same way in
// every output: "S → R, inverted (the CIP letter changes)".
func (c StereoChange) Describe() string {
	return stereoChange{before: c.Before, after: c.After, outcome: c.Outcome, why: c.Why}.describe()
}

// PathwayShare is one mechanism's share of the outcome.
type PathwayShare struct {
	Mechanism string
	Fraction  float64
}

// public converts the package's prediction into the exported form.
func (p *prediction) public(through []string) *Prediction {
	out := &Prediction{Mechanism: orNone(p.mechanism), NotAnalysed: p.notAnalysed, Reasons: p.reasons}
	// Each list is made at its size (nil when empty, as appending made
	// them): every step of a page makes one.
	if len(p.products) > 0 {
		out.Products = make([]PredictedProduct, len(p.products))
		for i, x := range p.products {
			out.Products[i] = PredictedProduct{SMILES: x.smiles, Fraction: x.fraction, Major: x.major, Mechanism: x.mechanism}
		}
	}
	if len(p.stereo) > 0 {
		out.Stereo = make([]StereoChange, len(p.stereo))
		for i, c := range p.stereo {
			out.Stereo[i] = StereoChange{Atom: c.atom, Before: c.before, After: c.after, Outcome: c.outcome, LetterChanged: c.letterChanged, Why: c.why}
		}
	}
	if len(p.distribution) > 0 {
		out.Distribution = make([]PathwayShare, len(p.distribution))
		for i, s := range p.distribution {
			out.Distribution[i] = PathwayShare{s.mechanism, s.fraction}
		}
	}
	out.Through = through
	return out
}

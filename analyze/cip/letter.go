package cip

// Letter is a CIP stereodescriptor.
type Letter uint8

// The descriptors walden assigns. r, s, m and p mark pseudo-asymmetric
// units (P-93.5.1.3): their ranking depends on enantiomorphic ligands. e
// and z are seqTrans and seqCis of a double bond that has such a pair of
// enantiomorphic ligands on one end only, so that its descriptor changes
// on reflection (P-93.5.1.4.2.2); the CIP validation suite writes them in
// lower case.
const (
	None   Letter = iota // no descriptor: not a stereogenic unit, or undecided
	R                    // rectus
	S                    // sinister
	LowerR               // pseudo-asymmetric r
	LowerS               // pseudo-asymmetric s
	E                    // entgegen (seqTrans)
	Z                    // zusammen (seqCis)
	LowerE               // seqTrans that depends on enantiomorphic ligands
	LowerZ               // seqCis that depends on enantiomorphic ligands
	M                    // minus (helicity), axial; same sense as Ra
	P                    // plus, axial; same sense as Sa
	LowerM               // pseudo-asymmetric m
	LowerP               // pseudo-asymmetric p
)

var letterNames = [...]string{"", "R", "S", "r", "s", "E", "Z", "e", "z", "M", "P", "m", "p"}

// String returns the descriptor as written ("R", "s", "E", "" for None).
func (l Letter) String() string {
	if int(l) < len(letterNames) {
		return letterNames[l]
	}
	return "?"
}

// ParseLetter reads a descriptor written as String writes it.
func ParseLetter(s string) (Letter, bool) {
	for i, n := range letterNames {
		if i > 0 && n == s {
			return Letter(i), true
		}
	}
	return None, false
}

// Flip returns the descriptor after the unit's geometry is inverted in
// place (the other ligands unchanged): R↔S, r↔s, M↔P, m↔p, E↔Z, e↔z.
func (l Letter) Flip() Letter {
	switch l {
	case R:
		return S
	case S:
		return R
	case LowerR:
		return LowerS
	case LowerS:
		return LowerR
	case E:
		return Z
	case Z:
		return E
	case LowerE:
		return LowerZ
	case LowerZ:
		return LowerE
	case M:
		return P
	case P:
		return M
	case LowerM:
		return LowerP
	case LowerP:
		return LowerM
	}
	return l
}

// refLetter folds a descriptor onto its reference class for rules 4b and
// 5 (P-92.5.2, P-92.6): R, M and chirality-dependent seqCis count as
// "R"; S, P and seqTrans as "S"; every other descriptor has no class.
func refLetter(l Letter) Letter {
	switch l {
	case R, M, LowerZ:
		return R
	case S, P, LowerE:
		return S
	}
	return None
}

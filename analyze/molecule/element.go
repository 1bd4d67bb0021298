package molecule

import "strings"

// Element is an atomic number; 0 is the SMILES wildcard '*'.
type Element uint8

// Elements the chemistry refers to by name.
const (
	H  Element = 1
	B  Element = 5
	C  Element = 6
	N  Element = 7
	O  Element = 8
	F  Element = 9
	Si Element = 14
	P  Element = 15
	S  Element = 16
	Cl Element = 17
	Ge Element = 32
	As Element = 33
	Se Element = 34
	Br Element = 35
	I  Element = 53
)

// symbols lists element symbols by atomic number (IUPAC periodic table).
var symbols = strings.Fields(`*
H He
Li Be B C N O F Ne
Na Mg Al Si P S Cl Ar
K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Br Kr
Rb Sr Y Zr Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe
Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb Bi Po At Rn
Fr Ra Ac Th Pa U Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds Rg Cn Nh Fl Mc Lv Ts Og`)

var bySymbol = func() map[string]Element {
	m := make(map[string]Element, len(symbols))
	for i, s := range symbols {
		m[s] = Element(i)
	}
	return m
}()

// MaxElement is the highest atomic number known.
const MaxElement = Element(118)

// Symbol returns the element symbol ("C", "Cl"; "*" for the wildcard).
func (e Element) Symbol() string {
	if int(e) < len(symbols) {
		return symbols[e]
	}
	return "?"
}

func (e Element) String() string { return e.Symbol() }

// ElementBySymbol looks up an element by its exact symbol ("Cl", not "CL").
func ElementBySymbol(s string) (Element, bool) {
	e, ok := bySymbol[s]
	return e, ok
}

// DefaultValences returns the normal valences of the OpenSMILES organic
// subset (B, C, N, O, P, S, F, Cl, Br, I), lowest first; nil for any other
// element. Source: OpenSMILES specification, section 3.1.5 (implicit
// hydrogens).
func (e Element) DefaultValences() []int {
	switch e {
	case B:
		return []int{3}
	case C:
		return []int{4}
	case N, P:
		return []int{3, 5}
	case O:
		return []int{2}
	case S:
		return []int{2, 4, 6}
	case F, Cl, Br, I:
		return []int{1}
	}
	return nil
}

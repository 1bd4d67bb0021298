package analyze

import (
	"sort"

	"walden/analyze/caution"
	"walden/analyze/outcome"
)

// CodeDoc documents one diagnostic code: what it means and how severe it
// is by default. The README's diagnostics reference is written from this
// list, and SARIF output lists the codes it uses from it.
type CodeDoc struct {
	Code     string
	Severity Severity
	Title    string // one line
}

// The codes the analyze package itself emits. Chemistry findings carry the
// outcome engine's own codes, cautions those of package caution.
const (
	CodeSyntax          = "syntax"           // the notation parser's errors (its own code is kept when it has one)
	CodeSMILES          = "smiles-invalid"   // a substance that looks like SMILES but does not read
	CodeUnknownName     = "unknown-name"     // a word that is neither a known name nor SMILES
	CodeNoSubstrate     = "no-substrate"     // a step without a substrate
	CodeLabelUnresolved = "label-unresolved" // a reference to a label no earlier step defines
	CodeLabelDuplicate  = "label-duplicate"  // a label defined twice
	CodeLabelForward    = "label-forward"    // a reference to a label defined later
	CodeLabelNoProduct  = "label-no-product" // a reference to a step that has no product to hand on
	CodeProductMismatch = "product-mismatch" // the written product differs from the predicted one
	CodeProductStereo   = "product-stereo"   // same constitution, different configuration
	CodeNotAnalysed     = "not-analysed"     // the rules cannot decide this step
	CodeDefaultSolvent  = "solvent-assumed"  // no solvent given; the default is used
	CodeUnreadable      = "file-unreadable"  // binary, too large, or not UTF-8
	CodeSettings        = "settings"         // an error in the settings file
)

var ownCodes = []CodeDoc{
	{CodeSyntax, Error, "the step line does not follow the notation"},
	{CodeSMILES, Error, "a substance written as SMILES cannot be read"},
	{CodeUnknownName, Error, "unknown reagent or solvent name (the closest known names are suggested)"},
	{CodeNoSubstrate, Error, "the step names no substrate"},
	{CodeLabelUnresolved, Error, "a reference to a step label that no earlier step defines"},
	{CodeLabelDuplicate, Error, "a step label defined twice"},
	{CodeLabelForward, Error, "a reference to a step label defined only further down"},
	{CodeLabelNoProduct, Warning, "a reference to a step that yields no product to use"},
	{CodeProductMismatch, Warning, "the product written after '->' is not the predicted major product"},
	{CodeProductStereo, Warning, "the product written after '->' has the predicted constitution but another configuration"},
	{CodeNotAnalysed, Info, "the rules cannot decide this step; it is reported, not guessed"},
	{CodeDefaultSolvent, Info, "no solvent given; the prediction assumes the default solvent"},
	{CodeUnreadable, Error, "a file that cannot be read as text (binary, too large, not UTF-8)"},
	{CodeSettings, Error, "an error in the settings file"},
}

// Codes returns every diagnostic code walden can emit, sorted.
func Codes() []CodeDoc {
	out := append([]CodeDoc(nil), ownCodes...)
	for _, r := range caution.Rules() {
		out = append(out, CodeDoc{r.Code, Warning, r.Title})
	}
	for _, c := range outcome.Codes {
		if c.Code != outcome.CodeNotAnalysed { // the same code as ours
			out = append(out, CodeDoc{string(c.Code), Severity(c.Severity), c.Meaning})
		}
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Code < out[j].Code })
	return out
}

// CodeTitle returns the one-line title of code, or "".
func CodeTitle(code string) string {
	for _, c := range Codes() {
		if c.Code == code {
			return c.Title
		}
	}
	return ""
}

// String names a severity as people and JSON output write it.
func (s Severity) String() string {
	switch s {
	case Error:
		return "error"
	case Warning:
		return "warning"
	case Info:
		return "info"
	case Hint:
		return "hint"
	}
	return "unknown"
}

package smiles

// Limits that keep hostile input within bounded time and memory. Input
// beyond them is refused with a positioned message, never truncated
// silently. Real molecules stay far below every one of them: the largest
// entry of the CIP validation suite has under 200 atoms.
const (
	// MaxLength is the longest SMILES string read, in bytes.
	MaxLength = 1 << 16
	// MaxAtoms is the largest number of atoms in one string.
	MaxAtoms = 5000
	// MaxBranchDepth is the deepest nesting of parentheses.
	MaxBranchDepth = 256
	// MaxErrors stops reading after this many errors: past it a string
	// is not SMILES and further messages would only repeat.
	MaxErrors = 50
	// kekuleBudget bounds the steps spent finding a Kekulé structure.
	kekuleBudget = 20_000_000
)

// Package cip assigns Cahn–Ingold–Prelog stereodescriptors (R/S, r/s, E/Z,
// M/P, m/p) to the stereo configurations written on a molecule.
//
// It follows the 2013 IUPAC recommendations (P-92) as made
// machine-implementable by Hanson, Musacchio, Mayfield, Vainio, Yerin and
// Redkin, "Algorithmic Analysis of Cahn–Ingold–Prelog Rules of
// Stereochemistry", J. Chem. Inf. Model. 2018, 58, 1755–1765: every
// stereogenic unit gets a hierarchical digraph, expanded lazily from the
// unit outwards, with duplicate nodes at ring closures and multiple bonds
// (mancude rings get duplicates with an averaged atomic number). Ligands
// are ranked by the sequence rules 1a, 1b, 2, 3, 4a, 4b, 4c, 5 and 6, each
// in its own file, applied in order: the constitutional rules (1a, 1b, 2)
// first over the whole digraph, the stereo rules only when those leave a
// tie, after auxiliary descriptors have been assigned inside the digraph.
//
// Only true stereogenic units get a label: a centre with two ligands that
// no rule can tell apart gets none. Axial chirality of biaryls and the
// helicity of helicenes need coordinates and cannot be read from SMILES;
// the package never guesses them (see Undecided).
package cip

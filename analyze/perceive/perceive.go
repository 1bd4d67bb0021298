// Package perceive reads what a reaction step's participants are, in the
// terms the outcome rules need: on the substrate every carbon bearing a
// leaving group with its class and β-hydrogens; on the reagents the
// nucleophilic atom, its charge once a base present has acted, its
// strength, basicity and bulk; on the solvent its proticity, polarity and
// what it does to anions and to ionisation.
//
// It works on molecules and dictionary entries only: no notation, no
// positions, no IO. Every number it uses comes from an embedded table with
// a source column.
package perceive

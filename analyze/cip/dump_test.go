package cip

import (
	"fmt"
	"os"
	"testing"

	"walden/analyze/smiles"
)

func TestDumpParse(t *testing.T) {
	s := os.Getenv("SMI")
	if s == "" {
		t.Skip("set SMI to dump one molecule")
	}
	m, err := smiles.Parse(s)
	fmt.Println("err:", err)
	if m == nil {
		return
	}
	fmt.Printf("%+v\n%+v\n%+v\n", m.Tetrahedral, m.CisTrans, m.Axial)
	ds, err := Label(m)
	fmt.Println(ds, err)
}

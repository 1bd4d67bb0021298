package smiles

import (
	"fmt"
	"math/rand"
	"os"
	"strings"
	"testing"
)

func TestDebugWrite(t *testing.T) {
	s := os.Getenv("SMI")
	if s == "" {
		t.Skip()
	}
	for _, x := range strings.Fields(s) {
		m, err := Parse(x)
		fmt.Println(x, "->", Canonical(m), err)
		r := rand.New(rand.NewSource(1))
		for range 5 {
			y := WriteRandom(m, r)
			m2, err := Parse(y)
			fmt.Println("   ", y, Canonical(m2), err)
		}
	}
}

func TestDebugAllene(t *testing.T) {
	if os.Getenv("ALL") == "" {
		t.Skip()
	}
	for _, x := range []string{"C1CCCCCC(=[C@]=C1)C", "[C@]1(=CCCCCCCC=1C)", "C1CCCCCCC(C)=[C@]=1", "C=1CCCCCCC(C)=[C@]=1"} {
		m, err := Parse(x)
		fmt.Println(x, err, m.Axial, Canonical(m))
	}
}

func TestDebugRandom(t *testing.T) {
	s := os.Getenv("RND")
	if s == "" {
		t.Skip()
	}
	m, _ := Parse(s)
	want := Canonical(m)
	fmt.Println(want, m.Axial)
	r := rand.New(rand.NewSource(1))
	for range 200 {
		y := WriteRandom(m, r)
		m2, err := Parse(y)
		if got := Canonical(m2); got != want {
			fmt.Println("BAD", y, got, err, m2.Axial)
		}
	}
}

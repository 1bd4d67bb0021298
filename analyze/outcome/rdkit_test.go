package outcome

import (
	"os/exec"
	"strings"
)

// rdkitLetters asks RDKit (the oracle) for the CIP letters of the second
// column of each line, formatted as letterList does: "(2S,5R)".
func rdkitLetters(lines []string) ([]string, error) {
	var smis []string
	for _, l := range lines {
		smis = append(smis, strings.Split(l, "\t")[1])
	}
	script := `
import sys
from rdkit import Chem
from rdkit.Chem import rdCIPLabeler
for s in sys.argv[1:]:
    m = Chem.MolFromSmiles(s)
    rdCIPLabeler.AssignCIPLabels(m)
    parts = []
    for a in m.GetAtoms():
        if a.HasProp('_CIPCode'):
            parts.append('%d%s' % (a.GetIdx()+1, a.GetProp('_CIPCode')))
    print('(' + ','.join(parts) + ')' if parts else '')
`
	out, err := exec.Command("/usr/bin/python3", append([]string{"-c", script}, smis...)...).Output()
	if err != nil {
		return nil, err
	}
	res := strings.Split(strings.TrimRight(string(out), "\n"), "\n")
	return res, nil
}

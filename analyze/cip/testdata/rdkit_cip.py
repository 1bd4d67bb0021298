"""Oracle for walden's CIP differential test: RDKit's new CIP labeller.

Reads lines "index<TAB>smiles<TAB>walden_canonical" on standard input and
writes one JSON object per line:
  {"i": index, "labels": [[atom, atom2, "R"], ...], "same_canonical": bool}
or {"i": index, "error": "..."}.
Atoms are 0-based in SMILES input order; atom2 is -1 for centres.
Run with Debian's /usr/bin/python3 (python3-rdkit).
"""
import json
import sys

from rdkit import Chem, RDLogger
from rdkit.Chem import rdCIPLabeler

RDLogger.DisableLog("rdApp.*")


PARAMS = Chem.SmilesParserParams()
PARAMS.removeHs = False  # keep [H] atoms so that atom numbers match walden's


def canon(smi):
    m = Chem.MolFromSmiles(smi)
    if m is None:
        return None
    return Chem.MolToSmiles(m)


def main():
    out = sys.stdout
    for line in sys.stdin:
        line = line.rstrip("\n")
        if not line:
            continue
        idx, smi, wcanon = (line.split("\t") + ["", ""])[:3]
        rec = {"i": int(idx)}
        try:
            m = Chem.MolFromSmiles(smi, PARAMS)
            if m is None:
                rec["error"] = "rdkit cannot read it"
            else:
                rdCIPLabeler.AssignCIPLabels(m)
                labels = []
                for a in m.GetAtoms():
                    if a.HasProp("_CIPCode"):
                        labels.append([a.GetIdx(), -1, a.GetProp("_CIPCode")])
                for b in m.GetBonds():
                    if b.HasProp("_CIPCode"):
                        i, j = sorted((b.GetBeginAtomIdx(), b.GetEndAtomIdx()))
                        labels.append([i, j, b.GetProp("_CIPCode")])
                rec["labels"] = labels
                if wcanon:
                    mine = canon(smi)
                    rec["same_canonical"] = canon(wcanon) == mine
                    rec["rdkit_canonical"] = mine
        except Exception as e:  # report, never stop the batch
            rec["error"] = "%s: %s" % (type(e).__name__, e)
        out.write(json.dumps(rec) + "\n")


if __name__ == "__main__":
    main()

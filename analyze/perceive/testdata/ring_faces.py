# Oracle for TestRingFacesAgainstRDKit: for each SMILES, embed in 3D with RDKit and say for each
# hydrogen on a ring neighbour of the halogen-bearing carbon whether it is on the same face (cis) as the halogen.
from rdkit import Chem
from rdkit.Chem import AllChem
import numpy as np, sys
for smi in sys.argv[1:]:
    m=Chem.AddHs(Chem.MolFromSmiles(smi))
    AllChem.EmbedMolecule(m,randomSeed=11)
    P=m.GetConformer().GetPositions()
    x=[a.GetIdx() for a in m.GetAtoms() if a.GetSymbol() in('Br','Cl')][0]
    c1=m.GetAtomWithIdx(x).GetNeighbors()[0].GetIdx()
    ring=[r for r in m.GetRingInfo().AtomRings() if c1 in r][0]
    R=P[list(ring)]; cen=R.mean(0); _,_,vt=np.linalg.svd(R-cen); n=vt[2]
    sx=np.sign((P[x]-P[c1])@n)
    out=[]
    for b in m.GetAtomWithIdx(c1).GetNeighbors():
        if b.GetIdx() not in ring: continue
        for h in b.GetNeighbors():
            if h.GetSymbol()=='H':
                out.append((b.GetIdx(),'cis' if np.sign((P[h.GetIdx()]-P[b.GetIdx()])@n)==sx else 'trans'))
    print(smi,out)

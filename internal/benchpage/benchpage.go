// Package benchpage makes the long notebook pages the speed benchmarks
// of the analyser and the language server share, so that both measure the
// same load. The steps are invented, for load only.
package benchpage

import (
	"fmt"
	"strings"
)

// Worst returns a Markdown page of about n lines, and the lines of its
// steps: prose paragraphs and reaction blocks with labelled steps,
// references to them, conditions and expected products, in which every
// step has findings.
func Worst(n int) (text string, stepLines []int) {
	substrates := []string{"CCBr", "CC(C)Br", "C[C@@H](Br)CC", "CC(C)(C)Cl", "BrCc1ccccc1", "C[C@H](OS(C)(=O)=O)CCc1ccccc1", "ClCC=C", "CCCCI"}
	reagents := []string{"NaN3", "NaCN", "NaI", "KOtBu", "NaOEt", "KSAc", "NaOMe", "DBU"}
	solvents := []string{"DMF", "acetone", "EtOH", "DMSO", "THF", "MeOH", "MeCN", "toluene"}
	var pg page
	add := pg.add
	add("# Route scouting, notebook 7")
	for k := 0; pg.lines < n; k++ {
		add("")
		add(fmt.Sprintf("## Entry %d", k+1))
		add("The substrate was dried over sieves; the reagent was weighed under nitrogen and added in portions.")
		add("")
		add("```reaction")
		for j := 0; j < 8 && pg.lines < n-1; j++ {
			i := k*8 + j
			step := fmt.Sprintf("s%d: %s + %s (1.5 eq), %s, %d °C", i, substrates[i%len(substrates)], reagents[(i/3)%len(reagents)], solvents[(i/7)%len(solvents)], 20+i%60)
			if j > 0 && j%3 == 0 {
				step = fmt.Sprintf("s%d: @s%d + %s, %s, rt", i, i-1, reagents[(i/5)%len(reagents)], solvents[(i/2)%len(solvents)])
			}
			stepLines = append(stepLines, pg.lines)
			add(step)
		}
		add("```")
	}
	return pg.b.String(), stepLines
}

// Typical returns a Markdown page of about n lines as a working
// notebook holds them: headings, prose, and reaction blocks in which
// about 40% of the page's lines are steps and about 30% of the steps have
// findings. The steps come from a few templates whose substrates vary
// (chain length, end group) with the temperature, so that nearly every
// step text is distinct, as on a real page. Invented, for load only.
func Typical(n int) (text string, stepLines []int) {
	// %s is the substrate's chain, %d the temperature.
	clean := []string{
		"%sCBr + NaN3 (1.5 eq), DMF, %d °C",
		"%sCBr + NaI, acetone, %d °C",
		"%sCO + TsCl (1.2 eq) + pyridine, DCM, 0 °C to rt, %d h",
		"%sCBr + KSAc, DMF, %d °C",
		"%sCI + NaN3, MeCN, %d °C",
		"C[C@H](Br)C%s + NaN3, DMF, %d °C",
		"%sCCl + NaI (2 eq), acetone, %d °C",
	}
	flagged := []string{
		"%sCBr + NaN3, EtOH, %d °C",           // protic solvent slows SN2
		"CC(C)(Br)C%s + KOtBu, THF, %d °C",    // the bulky base eliminates
		"%sCO + NaN3, DMF, %d °C",             // OH does not leave
		"CC(Br)C%s + NaOEt, EtOH, %d °C",      // elimination, undefined configuration
		"%sCBr + NaCN, DMSO, %d °C",           // ambident nucleophile (a note)
		"BrCc1ccc(C%s)cc1 + NaN3, DMF, %d °C", // benzylic halide caution
	}
	tails := []string{"C", "CC", "CCC", "CCCC", "CC(C)C", "CCOC", "CCc1ccccc1", "CCCCC", "CCC(C)C", "CCCOC"}
	prose := []string{
		"The flask was flame-dried and cooled under nitrogen before the substrate was added.",
		"TLC (hexane/ethyl acetate 4:1) showed the starting material gone after the stated time.",
		"Work-up: diluted with water, extracted three times with ether, dried over MgSO4 and concentrated.",
		"Yield and NMR to follow; the crude material was carried on without purification.",
	}
	var pg page
	add := pg.add
	add("# Substitution series, notebook 12")
	i := 0
	for k := 0; pg.lines < n; k++ {
		add("")
		add(fmt.Sprintf("## Entry %d", k+1))
		for p := range 4 {
			add(prose[(k+p)%len(prose)])
		}
		add("")
		add("```reaction")
		for j := 0; j < 8 && pg.lines < n-1; j++ {
			tail := tails[(i/7)%len(tails)] + strings.Repeat("C", (i/70)%6)
			temp := 20 + (i*7)%61
			var step string
			if i%10 < 3 {
				step = fmt.Sprintf(flagged[(i/10)%len(flagged)], tail, temp)
			} else {
				step = fmt.Sprintf(clean[i%len(clean)], tail, temp)
			}
			if j == 0 {
				step = fmt.Sprintf("t%d: %s", i, step)
			}
			stepLines = append(stepLines, pg.lines)
			add(step)
			i++
		}
		add("```")
	}
	return pg.b.String(), stepLines
}

// page is a text written line by line, with the count of its lines.
type page struct {
	b     strings.Builder
	lines int
}

func (p *page) add(s string) {
	p.b.WriteString(s)
	p.b.WriteByte('\n')
	p.lines++
}

package outcome

// Code is a stable finding code. Codes are kebab-case words; they never
// change meaning once released (docs/outcome.md lists them).
type Code string

// CodeDoc documents one finding code.
type CodeDoc struct {
	Code     Code
	Severity Severity
	Meaning  string
	Fix      string
}

// The finding codes of the outcome engine.
const (
	CodeTertiarySN2      Code = "tertiary-no-sn2"
	CodeHinderedBackside Code = "hindered-backside"
	CodeSp2Leaving       Code = "sp2-leaving-group"
	CodeBridgehead       Code = "bridgehead-carbon"
	CodePoorLeaving      Code = "poor-leaving-group"
	CodeBaseEliminates   Code = "base-eliminates"
	CodeProticSlows      Code = "protic-solvent-slows"
	CodeWeakNucleophile  Code = "weak-nucleophile"
	CodeRacemises        Code = "sn1-racemises"
	CodeRearranges       Code = "cation-rearranges"
	CodeUndefinedConfig  Code = "undefined-configuration"
	CodeCompetingSites   Code = "competing-sites"
	CodeNucleophileSites Code = "close-nucleophile-sites"
	CodeOverAlkylation   Code = "over-alkylation"
	CodeInsoluble        Code = "reagent-insoluble"
	CodeNoSolvent        Code = "no-solvent"
	CodeNoReaction       Code = "no-reaction"
	CodeSlow             Code = "slow-reaction"
	CodeAmbident         Code = "ambident-nucleophile"
	CodeNotAnalysed      Code = "not-analysed"
)

// Codes lists every finding code with its meaning and the usual fix, in
// the order docs/outcome.md shows them.
var Codes = []CodeDoc{
	{CodeTertiarySN2, Warning, "A nucleophile meets a tertiary carbon: backside attack is blocked, so SN2 cannot happen; the step goes by elimination or ionisation.", "Make the bond the other way round (tertiary alkoxide or amine + primary electrophile), or accept the SN1/E1 product."},
	{CodeHinderedBackside, Warning, "The reacting carbon is neopentyl-like or β-branched: SN2 is 10^2 to 10^5 times slower than at an unbranched carbon.", "Use a better leaving group (triflate), a dipolar aprotic solvent and heat, or another disconnection."},
	{CodeSp2Leaving, Error, "The leaving group sits on a vinylic or aromatic carbon: neither SN2 nor SN1 takes place.", "Use a cross-coupling or SNAr (activated arene) instead."},
	{CodeBridgehead, Error, "The leaving group sits on a bridgehead: no backside approach and no planar cation.", "Choose another route to the bridgehead substituent."},
	{CodePoorLeaving, Error, "The group on the carbon (OH, OR, ester O, NH2) does not leave under these conditions.", "Activate it first: sulfonylation (TsCl or MsCl with a base) keeps the configuration; Mitsunobu or Appel conditions substitute with inversion; HX gives the halide (SN1 at tertiary centres)."},
	{CodeBaseEliminates, Warning, "The reagent is a strong or bulky base for this carbon: elimination (E2) competes with or beats substitution.", "Use a less basic nucleophile (azide, thiolate, carboxylate, cyanide), a lower temperature, or a primary substrate."},
	{CodeProticSlows, Warning, "A protic solvent hydrogen-bonds the anionic nucleophile and slows SN2, by the factor Parker measured.", "Use a dipolar aprotic solvent (DMF, DMSO, acetonitrile, acetone)."},
	{CodeWeakNucleophile, Info, "The nucleophile is weak: substitution is slow unless the carbon ionises.", "Use the anion (add a base) or a stronger nucleophile."},
	{CodeRacemises, Warning, "The step goes through a planar carbocation: the configuration at the reacting carbon is lost (racemic, often with a small excess of inversion).", "For a single configuration use SN2 conditions (good nucleophile, dipolar aprotic solvent) on a secondary carbon."},
	{CodeRearranges, Warning, "The carbocation can become more stable by a 1,2-hydride or 1,2-alkyl shift: the product is rearranged.", "Avoid cations: activate as a sulfonate and displace by SN2, or use Appel conditions."},
	{CodeUndefinedConfig, Info, "The reacting carbon is a stereocentre whose configuration is not written: the product's configuration cannot be predicted.", "Write the configuration with @ or @@ if it is known."},
	{CodeCompetingSites, Warning, "The substrate has more than one carbon bearing a leaving group: the reagent may react at either.", "Use one equivalent and the more reactive site, or protect the other."},
	{CodeNucleophileSites, Warning, "The nucleophile has two sites of similar reactivity: a mixture of regioisomers may form.", "Protect one site or choose conditions that favour one (base strength, solvent)."},
	{CodeOverAlkylation, Warning, "Ammonia or a primary amine is alkylated (or a secondary amine by a methyl, allylic or benzylic electrophile): the product amine reacts again.", "Use a large excess of the amine, reductive amination, or a protected nitrogen (Gabriel, azide then reduction)."},
	{CodeInsoluble, Warning, "An ionic reagent will hardly dissolve in any solvent of the step (not reported for suspensions such as NaH, or with a crown ether or phase-transfer catalyst).", "Use a polar solvent, or add a crown ether or a phase-transfer catalyst."},
	{CodeNoSolvent, Info, "The step names no solvent: the prediction assumes DMF.", "Name the solvent."},
	{CodeNoReaction, Warning, "No pathway is fast enough under these conditions.", "See the other findings for what to change."},
	{CodeSlow, Info, "The predicted pathway is slow under these conditions.", "Heat, use a better leaving group or a dipolar aprotic solvent."},
	{CodeAmbident, Info, "The nucleophile is ambident: the atom that attacks depends on the counter-ion and solvent.", "Alkali-metal cyanide in DMSO for nitriles; silver salts for isocyanides."},
	{CodeNotAnalysed, Info, "The rules cannot decide this step.", "Check the literature for this case."},
}

// Doc returns the documentation of code c.
func Doc(c Code) (CodeDoc, bool) {
	for _, d := range Codes {
		if d.Code == c {
			return d, true
		}
	}
	return CodeDoc{}, false
}

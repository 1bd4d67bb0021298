package reagents

// Hazard tags carried by reagents and solvents. The caution rules match
// these words; they are reminders of what the trade knows to hurt people
// (common practice), never a safety assessment: the lab's safety rules, the
// safety data sheets and local regulations decide.
const (
	HazardAzide          = "azide"           // toxic; explosive heavy-metal azides; diazidomethane with CH2Cl2; HN3 with acid
	HazardCyanide        = "cyanide"         // HCN with acid
	HazardPyrophoric     = "pyrophoric"      // ignites in air
	HazardWaterReactive  = "water-reactive"  // reacts with water, often giving a flammable or toxic gas
	HazardLachrymator    = "lachrymator"     // tear gas
	HazardAlkylating     = "alkylating"      // potent alkylating agent: assume mutagenic
	HazardCorrosive      = "corrosive"       // burns skin and eyes
	HazardToxicGas       = "toxic-gas"       // is or releases a toxic gas
	HazardToxic          = "toxic"           // toxic by the usual routes
	HazardOxidiser       = "oxidiser"        // feeds a fire; reacts with reductants
	HazardExplosive      = "explosive"       // shock- or heat-sensitive
	HazardCarcinogen     = "carcinogen"      // known or suspected
	HazardFlammable      = "flammable"       // flammable liquid, solid or gas
	HazardStench         = "stench"          // thiols, sulfides, phosphines
	HazardPeroxideFormer = "peroxide-former" // ethers that form explosive peroxides on storage
	HazardHalogenated    = "halogenated"     // halogenated solvent (azide: diazidomethane risk)
)

// hazardWords is the vocabulary the tables and lab files may use.
var hazardWords = [...]string{
	HazardAzide, HazardCyanide, HazardPyrophoric, HazardWaterReactive,
	HazardLachrymator, HazardAlkylating, HazardCorrosive, HazardToxicGas,
	HazardToxic, HazardOxidiser, HazardExplosive, HazardCarcinogen,
	HazardFlammable, HazardStench, HazardPeroxideFormer, HazardHalogenated,
}

// HazardWords returns the accepted hazard tags.
func HazardWords() []string { return append([]string(nil), hazardWords[:]...) }

func isHazard(w string) bool { return contains(hazardWords[:], w) }

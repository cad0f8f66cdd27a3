package catalog_test

import (
	"math"
	"slices"
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/whichreg/whichreg/catalog"
)

// markingCase is one real marking: what is printed (or what a technician
// reads off a worn part) and the family, voltages and outline it must
// decode to.
type markingCase struct {
	marking string
	family  string
	vout    []float64 // nil = the marking says no voltage
	outline string    // "" = the marking names no package
	source  string
}

// Sources named below (the makers' ordering-information tables):
//
//	onsemi MC7800/D      "MC7800, MC7800A, MC7800AE, NCV7800 1.0 A Positive Voltage Regulators" Rev 27 (2014): T = TO-220 (case 221A), D2T = D2PAK (case 936); grades A, B, C
//	onsemi MC78M00/D     Rev 16 (Nov 2005): T = TO-220 (case 221A), DT = DPAK-3 (case 369C)
//	onsemi MC78L00A/D    Rev 13 (Sep 2007): P = TO-92 (case 029), D = SOIC-8 (case 751)
//	onsemi LM337/D       Rev 10 (Jan 2015): T = TO-220AB, D2T = D2PAK
//	Motorola MC7900      "Three-Terminal Negative Voltage Regulators": T = TO-220, K = TO-3 (case 1-03)
//	ST L78 DS0422        "L78 Positive voltage regulator ICs" Rev 36 (Sep 2018): CV = TO-220, CP = TO-220FP, CD2T = D2PAK, CDT = DPAK; grades AB, AC
//	ST L7800 (1998)      "L7800 series positive voltage regulators", Dec 1998 / Aug 2006 Rev 13: TO-220 (V), ISOWATT220 (P), TO-3 (T), D2PAK (D2T)
//	ST L78S (1993/2008)  "L78S00 series 2 A": CV = TO-220, T / CT = TO-3
//	SGS L78M00 (1994)    "L78M00 series": CV = TO-220, CDT = DPAK
//	ST L4940 (1999)      "L4940 series very low drop 1.5 A": V5/V85/V10/V12 = TO-220, D2T5 … = D2PAK
//	ST LD1117 (2004)     "LD1117 series" Rev 16 (Oct 2004): V = TO-220, S = SOT-223, DT = DPAK; voltage code after the package
//	ST LM317 Doc ID 2154 Rev 17 (Nov 2011): LM317T, LM317K (TO-3), LM317D2T, LM317P (TO-220FP)
//	Natl LM78XX          "LM78XX Series Voltage Regulators" (Feb 1995 / May 2000): T = TO-220, K = TO-3 (aluminium, KC02A)
//	Natl LM340 / TI SNOSBT0: T = TO-220, K = TO-3 (K02A), S = TO-263, MP = SOT-223; voltage after a dash
//	Natl LM109/LM309     DS007138 (Apr 1998): H = TO-39 (H03A), K = TO-3 (K02A)
//	Natl LM2940          LM2940/LM2940C: T = TO-220, S = TO-263, MP = SOT-223 (LM2940IMP); voltage after a dash
//	Natl LM1117          DS100919 (Apr 2006): MP(X) = SOT-223, DT(X) = TO-252, T = TO-220, S = TO-263; -ADJ, -1.8 … -5.0
//	TI µA7800 / TL783    SLVS056, SLVS036: KC, KCS = TO-220
//	TI LM317L            SLCS144: LP = TO-92, D = SOIC-8
//	TI LM138/LM338       SNVS771C: K = TO-3
//	LT1083/84/85, LT1086 Linear Technology datasheets: CT = TO-220, CM = TO-263 (DD), K = TO-3
//	onsemi MC78T00       "MC78T00 Series 3.0 A Positive Voltage Regulators": CT = TO-220
//	LT1086 / LT1083/84/85 Fixed: -3.3, -3.6, -5 after the package letters
//	ST LFxx Doc ID 2574  "LFxxAB, LFxxC very low drop voltage regulators with inhibit" Rev 25 (Feb 2012): LF15…LF120 + AB/C
//	onsemi LP2950/D      "LP2950, LP2951 100 mA low power LDO": Z = TO-92 (case 29), DT = DPAK (case 369C)
//	practice             /work/shared/reference/practice.md §8: a four-digit group beside the number is usually a date code (year, week)
var markingCases = []markingCase{
	// Maker prefixes and package suffixes.
	{"LM7805CT", "78xx", []float64{5}, "TO-220", "Natl LM78XX: LM7805CT"},
	{"LM7805CK", "78xx", []float64{5}, "TO-3", "Natl LM78XX: LM7805CK aluminium TO-3"},
	{"MC7805CT", "78xx", []float64{5}, "TO-220", "onsemi MC7800/D"},
	{"MC7805BT", "78xx", []float64{5}, "TO-220", "onsemi MC7800/D (B = −40 °C grade)"},
	{"MC7805ACT", "78xx", []float64{5}, "TO-220", "onsemi MC7800/D (A = 2 % grade)"},
	{"MC7812CD2T", "78xx", []float64{12}, "D2PAK", "onsemi MC7800/D"},
	{"MC7815ABD2TR4G", "78xx", []float64{15}, "D2PAK", "onsemi MC7800/D order code MC7815ABD2TR4G (R4 reel, G Pb-free)"},
	{"MC7818BTG", "78xx", []float64{18}, "TO-220", "onsemi MC7800/D order code MC7818BTG"},
	{"MC7805CK", "78xx", []float64{5}, "TO-3", "Motorola MC7800 K = TO-3, from memory"},
	{"L7805CV", "78xx", []float64{5}, "TO-220", "ST L78 DS0422"},
	{"L7812CV", "78xx", []float64{12}, "TO-220", "ST L78 DS0422"},
	{"L7805CP", "78xx", []float64{5}, "TO-220FP", "ST L78 DS0422 (CP = TO-220FP), letter from memory"},
	{"L7809CD2T-TR", "78xx", []float64{9}, "D2PAK", "ST L78 DS0422 order code L7809CD2T-TR"},
	{"L7805CT", "78xx", []float64{5}, "TO-3", "ST L7800 (1998): TO-3 = T; confirmed for L78S in ST L78S, for L7800 from memory"},
	{"L7805ABV", "78xx", []float64{5}, "TO-220", "ST L7800AB/AC (Mar 2004) L7805AB, V = TO-220"},
	{"L78S05CV", "78Sxx", []float64{5}, "TO-220", "ST L78S: L78SxxCV = TO-220"},
	{"L78S12CT", "78Sxx", []float64{12}, "TO-3", "ST L78S: L78SxxCT = TO-3"},
	{"L78M05CDT", "78Mxx", []float64{5}, "DPAK", "SGS L78M00 (1994): CDT = DPAK"},
	{"L78M12CV", "78Mxx", []float64{12}, "TO-220", "SGS L78M00 (1994): CV = TO-220"},
	{"MC78M05CDT", "78Mxx", []float64{5}, "DPAK", "onsemi MC78M00/D: DT = DPAK-3"},
	{"MC78M15CT", "78Mxx", []float64{15}, "TO-220", "onsemi MC78M00/D: T = TO-220"},
	{"LM78L05ACZ", "78Lxx", []float64{5}, "TO-92", "Natl LM78LXX: ACZ = TO-92, from memory"},
	{"L78L05ACZ", "78Lxx", []float64{5}, "TO-92", "ST L78L DocID2145: ACZ = TO-92, from memory"},
	{"MC78L05ACP", "78Lxx", []float64{5}, "TO-92", "onsemi MC78L00A/D: P = TO-92 (case 029)"},
	{"MC78L12ACD", "78Lxx", []float64{12}, "SO-8", "onsemi MC78L00A/D: D = SOIC-8 (case 751)"},
	{"UA78L05ACLP", "78Lxx", []float64{5}, "TO-92", "TI µA78L00: LP = TO-92 (TI package code, as TI LM317L SLCS144)"},
	{"µA7805CKC", "78xx", []float64{5}, "TO-220", "TI µA7800 SLVS056: KC = TO-220"},
	{"UA7812CKCS", "78xx", []float64{12}, "TO-220", "TI µA7800 SLVS056: KCS = TO-220"},
	{"µA7805KC", "78xx", []float64{5}, "TO-3", "Fairchild µA7800: package letter first, KC = TO-3 metal can, from memory"},
	{"UA7812UC", "78xx", []float64{12}, "TO-220", "Fairchild µA7800: UC = TO-220, from memory"},
	{"KA7805", "78xx", []float64{5}, "", "Fairchild KA78XX: no package letter on the TO-220 part"},
	{"KA7912", "79xx", []float64{12}, "", "Fairchild KA79XX Rev 1.1.1"},
	{"LM7912CT", "79xx", []float64{12}, "TO-220", "Fairchild LM79XX Rev 1.0.3"},
	{"LM7906CT", "79xx", []float64{6}, "TO-220", "Fairchild LM79XX Rev 1.0.3 (LM7906CT)"},
	{"MC7905CT", "79xx", []float64{5}, "TO-220", "Motorola MC7900"},
	{"MC7915CK", "79xx", []float64{15}, "TO-3", "Motorola MC7900: K = TO-3 (case 1-03)"},
	{"MC79L05ACP", "79Lxx", []float64{5}, "TO-92", "onsemi MC79L00A: P = TO-92, from memory"},
	{"NJM7805FA", "78xx", []float64{5}, "TO-220FP", "JRC NJM7800: FA = TO-220F, from memory"},
	{"AN7812", "78xx", []float64{12}, "", "Panasonic AN7800, from memory"},
	{"uPC7805H", "78xx", []float64{5}, "TO-220", "NEC µPC7800: H = TO-220, from memory"},
	{"KIA7805AP", "78xx", []float64{5}, "", "KEC KIA7800: AP names no outline we can confirm"},
	{"TA78L005AP", "78Lxx", []float64{5}, "", "Toshiba TA78L000AP: three-digit voltage code 005, from memory"},
	{"LM317T", "317", nil, "TO-220", "ST LM317 Doc ID 2154 / Natl LM317: T = TO-220"},
	{"LM317K", "317", nil, "TO-3", "ST LM317 Doc ID 2154 Rev 17: LM317K"},
	{"LM317D2T", "317", nil, "D2PAK", "ST LM317 Doc ID 2154 Rev 17: LM317D2T"},
	{"LM317P", "317", nil, "TO-220FP", "ST LM317 Doc ID 2154 Rev 17: P = TO-220FP, letter from memory"},
	{"LM317H", "317", nil, "TO-39", "Natl LM117/LM317: H = TO-39"},
	{"LM317MP", "317", nil, "SOT-223", "Natl LM317: MP = SOT-223, from memory"},
	{"LM317LZ", "317L", nil, "TO-92", "Natl LM317L: Z = TO-92, from memory"},
	{"LM317LD", "317L", nil, "SO-8", "ST LM317L: LM317LD-TR = SO-8"},
	{"LM317HVK", "317HV", nil, "TO-3", "Natl LM117HV/LM317HV: K = TO-3, from memory"},
	{"LM337T", "337", nil, "TO-220", "onsemi LM337/D Rev 10"},
	{"LM337D2T", "337", nil, "D2PAK", "onsemi LM337/D Rev 10"},
	{"LM337K", "337", nil, "TO-3", "Semelab LM337 (TO-3, case = VIN)"},
	{"LM338K", "338", nil, "TO-3", "TI LM138/LM338 SNVS771C"},
	{"LM350T", "350", nil, "TO-220", "Natl LM350: T = TO-220, from memory"},
	{"LM323T", "323", []float64{5}, "TO-220", "ST LM323 (1993): LM323T"},
	{"LM309K", "309", []float64{5}, "TO-3", "Natl LM109/LM309 DS007138"},
	{"LM309H", "309", []float64{5}, "TO-39", "Natl LM109/LM309 DS007138"},
	{"LM340T-5.0", "340", []float64{5}, "TO-220", "Natl LM340 / TI SNOSBT0"},
	{"LM340K-12", "340", []float64{12}, "TO-3", "Natl LM340 / TI SNOSBT0"},
	{"LM340S-5.0", "340", []float64{5}, "D2PAK", "Natl LM340 / TI SNOSBT0: S = TO-263"},
	{"LM340MP-5.0", "340", []float64{5}, "SOT-223", "Natl LM340 / TI SNOSBT0: MP = SOT-223"},
	{"TL783CKC", "783", nil, "TO-220", "TI TL783 SLVS036: KC = TO-220"},
	// Voltage codes after the number.
	{"LM2940CT-5.0", "2940", []float64{5}, "TO-220", "Natl LM2940: T = TO-220"},
	{"LM2940S-12", "2940", []float64{12}, "D2PAK", "Natl LM2940: S = TO-263"},
	{"LM2940IMP-5.0", "2940", []float64{5}, "SOT-223", "Natl LM2940: LM2940IMP = SOT-223"},
	{"LM2937ET-5.0", "2937", []float64{5}, "TO-220", "TI LM2937: ET = TO-220, from memory"},
	{"L4940V5", "4940", []float64{5}, "TO-220", "ST L4940 (1999): L4940V5"},
	{"L4940V85", "4940", []float64{8.5}, "TO-220", "ST L4940 (1999): L4940V85"},
	{"L4940D2T12", "4940", []float64{12}, "D2PAK", "ST L4940 (1999): L4940D2T12"},
	{"LD1117V33", "1117", []float64{3.3}, "TO-220", "ST LD1117 (2004): V = TO-220"},
	{"LD1117S33", "1117", []float64{3.3}, "SOT-223", "ST LD1117 (2004): S = SOT-223"},
	{"LD1117DT50", "1117", []float64{5}, "DPAK", "ST LD1117 (2002/2004): DT = DPAK"},
	{"LM1117MPX-3.3", "1117", []float64{3.3}, "SOT-223", "Natl LM1117 DS100919: LM1117MPX-3.3"},
	{"LM1117DTX-5.0", "1117", []float64{5}, "DPAK", "Natl LM1117 DS100919: DT = TO-252"},
	{"LM1117T-2.85", "1117", []float64{2.85}, "TO-220", "Natl LM1117 DS100919: T = TO-220"},
	{"AMS1117-3.3", "1117", []float64{3.3}, "", "AMS1117, from memory"},
	{"AZ1117-3.3", "1117", []float64{3.3}, "", "BCD / Diodes AZ1117, from memory"},
	{"NCV7805BTG", "78xx", []float64{5}, "TO-220", "onsemi MC7800/D: NCV prefix for automotive, B grade, T = TO-220, G Pb-free"},
	{"LT1084CT", "1084", nil, "TO-220", "LT1083/84/85: CT = TO-220"},
	{"LT1085CT", "1085", nil, "TO-220", "LT1083/84/85: CT = TO-220"},
	{"LT1086CM", "1086", nil, "D2PAK", "LT1086: CM = TO-263 (DD), from memory"},
	{"LM2941CT", "2941", nil, "TO-220-5", "Natl LM2941: T = the five-lead TO-220, from memory"},
	{"LM2990T-5.0", "2990", []float64{5}, "TO-220", "Natl LM2990: T = TO-220, from memory"},
	// Families added with issue 11.
	{"MC78T05CT", "78Txx", []float64{5}, "TO-220", "onsemi MC78T00 (MC78T05CT)"},
	{"MC78T12CT", "78Txx", []float64{12}, "TO-220", "onsemi MC78T00"},
	{"MC78T05", "78Txx", []float64{5}, "", "onsemi MC78T00: a 3 A part is no 78Sxx (issue 11)"},
	{"LM78H05KC", "78Hxx", []float64{5}, "TO-3", "Natl LM78H05: KC = TO-3, from memory"},
	{"LM337LZ", "337L", nil, "TO-92", "Natl LM337L: Z = TO-92, from memory"},
	{"LM1117T-ADJ", "1117-adj", nil, "TO-220", "Natl LM1117 DS100919: LM1117T-ADJ"},
	{"LM1117MPX-ADJ", "1117-adj", nil, "SOT-223", "Natl LM1117 DS100919: LM1117MPX-ADJ"},
	{"LT1084CT-5", "1084-fixed", []float64{5}, "TO-220", "LT1083/84/85 Fixed: LT1084CT-5"},
	{"LT1086CT-3.3", "1086-fixed", []float64{3.3}, "TO-220", "LT1086: LT1086CT-3.3"},
	{"LT1086CM-3.6", "1086-fixed", []float64{3.6}, "D2PAK", "LT1086: LT1086CM-3.6 (CM = TO-263, from memory)"},
	{"LP2950CZ-5.0", "2950", []float64{5}, "TO-92", "onsemi LP2950/D: Z = TO-92 (case 29)"},
	{"LP2950ACZ-3.3", "2950", []float64{3.3}, "TO-92", "onsemi LP2950/D: Z = TO-92, A = ±0.5 % grade"},
	{"LM2931AZ-5.0", "2931", []float64{5}, "TO-92", "Natl / onsemi LM2931: Z = TO-92, from memory"},
	{"LM2931T-5.0", "2931", []float64{5}, "TO-220", "Natl LM2931: T = TO-220, from memory"},
	{"LM2931M-5.0", "2931", []float64{5}, "SO-8", "Natl LM2931: M = SO-8, from memory"},
	{"LM3940IT-3.3", "3940", []float64{3.3}, "TO-220", "Natl LM3940: IT = TO-220, from memory"},
	{"LM3940IMP-3.3", "3940", []float64{3.3}, "SOT-223", "Natl LM3940: IMP = SOT-223, from memory"},
	{"LF33CV", "LFxx", []float64{3.3}, "TO-220", "ST LFxx Doc ID 2574 Rev 25: LF33C; V = TO-220 as ST L78, from memory"},
	{"LF50CDT", "LFxx", []float64{5}, "DPAK", "ST LFxx Doc ID 2574 Rev 25: LF50C; DT = DPAK as ST L78, from memory"},
	{"LF120CV", "LFxx", []float64{12}, "TO-220", "ST LFxx Doc ID 2574 Rev 25: LF120C; V = TO-220, from memory"},
	{"LF85CP", "LFxx", []float64{8.5}, "TO-220FP", "ST LFxx Doc ID 2574 Rev 25: LF85C; P = TO-220FP as ST L78, from memory"},
	{"HT7333", "73xx", []float64{3.3}, "", "Holtek HT73xx: 33 = 3.3 V, from memory"},
	{"HT7350", "73xx", []float64{5}, "", "Holtek HT73xx: 50 = 5.0 V, from memory"},
	{"XC6206P332MR", "6206", []float64{3.3}, "SOT-23", "Torex XC6206: P, 33, accuracy 2, MR = SOT-23, from memory"},
	{"MCP1700T-3302E/TT", "1700", []float64{3.3}, "SOT-23", "Microchip MCP1700: 33 = 3.3 V, 02 = ±2 %, TT = SOT-23, from memory"},
	{"MCP1700-5002E/TO", "1700", []float64{5}, "TO-92", "Microchip MCP1700: TO = TO-92, from memory"},
	// Five-lead parts: SOT-23-5 LDOs with enable and the L200.
	{"LP2985-33DBVR", "2985", []float64{3.3}, "SOT-23-5", "TI LP2992/LP2985 series: DBV = SOT-23-5, 33 = 3.3 V (order code from memory)"},
	{"LP2985IM5-5.0", "2985", []float64{5}, "SOT-23-5", "National LP2985: IM5 = SOT-23-5, from memory"},
	{"MIC5205-3.3BM5", "5205", []float64{3.3}, "SOT-23-5", "Micrel MIC5205 M9999-020806 ordering table: MIC5205-3.3BM5, SOT-23-5"},
	{"MIC5205-5.0YM5-TR", "5205", []float64{5}, "SOT-23-5", "Microchip MIC5205 DS20005785A: YM5 lead-free SOT-23-5, -TR reel (from memory)"},
	{"AP2112K-3.3TRG1", "2112", []float64{3.3}, "SOT-23-5", "Diodes AP2112: K = SOT-23-5 as AP2127K-4.75TRG1 (DS36478); TR reel, G1 green, from memory"},
	{"L200CV", "L200", nil, "TO-220-5", "ST L200: CV = Pentawatt (five-lead TO-220), from memory"},
	{"LM345K-5.0", "345", []float64{5}, "TO-3", "National LM145/LM345 TL/H/7785: LM345K-5.0"},
	{"LM333K", "333", nil, "TO-3", "National LM133/LM333 DS009065: LM333K STEEL"},
	{"LM333T", "333", nil, "TO-220", "National LM133/LM333 DS009065: LM333T"},
	{"LM78M05CH", "78Mxx", []float64{5}, "TO-39", "National LM341/LM78MXX TL/H/10484: LM78M05CH, TO-39 (H03A)"},
	{"LT1083CK", "1083", nil, "TO-3", "Linear Technology LT1083/84/85: LT1083CK (TO-3, commercial)"},
	{"LM2930T-5.0", "2930", []float64{5}, "TO-220", "National LM2930 DS005539: LM2930T-5.0"},
	{"LM2930S-8.0", "2930", []float64{8}, "D2PAK", "National LM2930 DS005539: LM2930S-8.0 (TO-263)"},
	// Date codes beside the number (practice §8).
	{"LM317T 7812", "317", nil, "TO-220", "practice: 7812 = 1978 week 12, not a 12 V 78xx"},
	{"LM7805CT 8523", "78xx", []float64{5}, "TO-220", "practice: 8523 = 1985 week 23"},
	{"L7815CV 9402", "78xx", []float64{15}, "TO-220", "practice: 9402 = 1994 week 2; ST L78 DS0422"},
	// Logos read as letters.
	{"STL7805CV", "78xx", []float64{5}, "TO-220", "ST logo read as ST; ST L78 DS0422"},
	{"MMC7812CT", "78xx", []float64{12}, "TO-220", "Motorola batwing read as M; onsemi MC7800/D"},
	{"NLM317T", "317", nil, "TO-220", "National logo read as N; Natl LM317"},
	// Worn and look-alike characters (common practice, no source).
	{"78O5", "78xx", []float64{5}, "", "O read for 0"},
	{"LM3I7T", "317", nil, "TO-220", "I read for 1"},
	{"LM78l2CT", "78xx", []float64{12}, "TO-220", "a lower-case l for 1"},
	{"L7BO5CV", "78xx", []float64{5}, "TO-220", "B for 8, O for 0"},
	{"79I5", "79xx", []float64{15}, "", "I for 1"},
	{"LM7?05CT", "78xx", []float64{5}, "TO-220", "the 8 worn away (78xx before the rarer 79xx)"},
	{"?M3?7", "317", nil, "", "worn LM317 (317 before the rarer 337)"},
	{"L?78??", "78xx", nil, "", "only L and 78 legible"},
	{"L?8M05CDT", "78Mxx", []float64{5}, "DPAK", "the 7 worn away; SGS L78M00 (1994)"},
	{"MC78?2CT", "78xx", []float64{12}, "TO-220", "one digit worn: 7802 does not exist"},
	{"*2940*", "2940", nil, "", "a fragment"},
}

// firstHit returns the first hit, or nil.
func firstHit(hits []catalog.Hit) *catalog.Hit {
	if len(hits) == 0 {
		return nil
	}
	return &hits[0]
}

func TestMarkingTable(t *testing.T) {
	c := builtinCatalog(t)
	if len(markingCases) < 60 {
		t.Fatalf("only %d markings in the table, want at least 60", len(markingCases))
	}
	for _, tt := range markingCases {
		t.Run(tt.marking, func(t *testing.T) {
			h := firstHit(catalog.Find(c, tt.marking))
			if h == nil {
				t.Fatalf("Find(%q) found nothing, want %s (%s)", tt.marking, tt.family, tt.source)
			}
			if h.Family.ID != tt.family {
				t.Fatalf("Find(%q) first = %s (%s), want %s (%s)", tt.marking, h.Family.ID, h.Detail, tt.family, tt.source)
			}
			if !slices.Equal(h.VoutV, tt.vout) {
				t.Errorf("Find(%q) voltages = %v, want %v (%s; %s)", tt.marking, h.VoutV, tt.vout, tt.source, h.Detail)
			}
			if h.Outline != tt.outline {
				t.Errorf("Find(%q) outline = %q, want %q (%s; %s)", tt.marking, h.Outline, tt.outline, tt.source, h.Detail)
			}
		})
	}
}

// TestMarkingNoRegulator: transistor numbers that share digits with
// regulator families find no regulator (BC337 is an NPN transistor, IRF7805
// an N-channel MOSFET, 2N6338 an NPN power transistor; Pro Electron, makers'
// and JEDEC type numbers).
func TestMarkingNoRegulator(t *testing.T) {
	c := builtinCatalog(t)
	for _, q := range []string{"BC337", "BC337-40", "IRF7805", "2N6338", "TIP31C", "2N3055", "MJE340", "BD139", "IRFZ44N", "BC327", "2SC5200", "BUK9508", "TIP120", "MJ2955", "ST BD140"} {
		hits := catalog.Find(c, q)
		for _, h := range hits {
			if !h.Family.NonRegulator() {
				t.Errorf("Find(%q) found regulator %s (%s)", q, h.Family.ID, h.Detail)
			}
		}
		if len(hits) == 0 {
			t.Errorf("Find(%q) found nothing; want the look-alike families", q)
		}
	}
}

// TestMarkingStar: a star may not stand for the digits that make a family:
// LM3*K (an LM3-something in TO-3) finds the 3xx families, never 78xx,
// 79xx, 1117 or 2990.
func TestMarkingStar(t *testing.T) {
	c := builtinCatalog(t)
	hits := catalog.Find(c, "LM3*K")
	var ids []string
	for _, h := range hits {
		ids = append(ids, h.Family.ID)
		if !strings.HasPrefix(h.Family.ID, "3") {
			t.Errorf("LM3*K found %s (%s)", h.Family.ID, h.Detail)
		}
		if h.Outline != "TO-3" {
			t.Errorf("LM3*K: %s outline %q, want TO-3 (K)", h.Family.ID, h.Outline)
		}
	}
	for _, want := range []string{"317", "337", "338", "350", "323", "309", "340"} {
		if !slices.Contains(ids, want) {
			t.Errorf("LM3*K did not find %s; found %v", want, ids)
		}
	}
}

// TestMarkingDateCode: the date code is reported and left out.
func TestMarkingDateCode(t *testing.T) {
	c := builtinCatalog(t)
	d := catalog.DecodeMarking(c, "LM317T 7812")
	if !slices.Equal(d.DateCodes, []string{"7812"}) {
		t.Errorf("date codes = %v, want [7812]", d.DateCodes)
	}
	if _, ok := d.Hit("78xx"); ok {
		t.Errorf("LM317T 7812 decoded as 78xx")
	}
	// Alone, 7812 is the part number.
	if h := firstHit(catalog.Find(c, "7812")); h == nil || h.Family.ID != "78xx" || !slices.Equal(h.VoutV, []float64{12}) {
		t.Errorf("7812 alone: %+v, want 78xx 12 V", h)
	}
}

// TestMarkingFits: the decoded voltage and outline select the variant.
func TestMarkingFits(t *testing.T) {
	c := builtinCatalog(t)
	h := firstHit(catalog.Find(c, "LM7812CT"))
	if h == nil {
		t.Fatal("LM7812CT found nothing")
	}
	for _, tt := range []struct {
		outline     string
		vout        float64
		volt, outOK bool
	}{
		{"TO-220", 12, true, true},
		{"TO-220AB", 12, true, true}, // an alias
		{"TO-3", 12, true, false},
		{"TO-220", 5, false, true},
	} {
		v, o := h.Fits(c.Outline(tt.outline), tt.vout)
		if v != tt.volt || o != tt.outOK {
			t.Errorf("Fits(%s, %g) = %v, %v; want %v, %v", tt.outline, tt.vout, v, o, tt.volt, tt.outOK)
		}
	}
}

// FuzzDecodeMarking: the decoder is a parser; it must not panic, loop or
// report what it cannot have read.
func FuzzDecodeMarking(f *testing.F) {
	for _, tt := range markingCases {
		f.Add(tt.marking)
	}
	for _, s := range []string{"", "*", "**?*", "LM3*K", "BC337", "-5.0", "1234 5678", "µA78l05", "L?7805", strings.Repeat("7*", 40), strings.Repeat("?", 100)} {
		f.Add(s)
	}
	c := builtinCatalog(f)
	f.Fuzz(func(t *testing.T, s string) {
		if !utf8.ValidString(s) {
			return
		}
		d := catalog.DecodeMarking(c, s)
		for i, h := range d.Hits {
			if math.IsNaN(h.Score) || math.IsInf(h.Score, 0) {
				t.Fatalf("%q: score %v", s, h.Score)
			}
			if i > 0 && d.Hits[i-1].Score < h.Score {
				t.Fatalf("%q: hits not sorted", s)
			}
			if d.Transistor != "" && !h.Family.NonRegulator() && !mixed(s) {
				t.Fatalf("%q: transistor %s found regulator %s", s, d.Transistor, h.Family.ID)
			}
			for _, v := range h.VoutV {
				if h.Family.Kind == catalog.KindFixed && !slices.Contains(h.Family.OutputsV, v) {
					t.Fatalf("%q: %s voltage %g not the family's", s, h.Family.ID, v)
				}
			}
			if h.Outline != "" && c.Outline(h.Outline) == nil && h.How != "prefix" {
				// An outline the catalog lacks may be named, but never invented.
				t.Logf("%q: outline %q not in the catalog", s, h.Outline)
			}
		}
		_ = catalog.Find(c, s)
	})
}

// mixed reports whether a marking has more than one group (a transistor
// number beside a regulator number).
func mixed(s string) bool { return len(strings.Fields(s)) > 1 }

func TestResolve(t *testing.T) {
	c := builtinCatalog(t)
	for _, tt := range []struct{ name, want string }{
		{"317", "317"}, {"78xx", "78xx"}, {"7805", "78xx"}, {"LM7912CT", "79xx"}, {"LD1117V33", "1117"},
		{"LM3*K", ""}, // several 3xx families, equally
		{"QQZZX", ""},
	} {
		f, _, _ := catalog.Resolve(c, tt.name)
		got := ""
		if f != nil {
			got = f.ID
		}
		if got != tt.want {
			t.Errorf("Resolve(%q) = %q, want %q", tt.name, got, tt.want)
		}
	}
}

// TestMarkingGroups: a number split over two groups is read as one; a
// transistor number split so is still no regulator.
func TestMarkingGroups(t *testing.T) {
	c := builtinCatalog(t)
	for _, tt := range []struct{ q, family, outline string }{
		{"LM 317T", "317", "TO-220"},
		{"7805 CT", "78xx", "TO-220"},
		{"ST L7805CV", "78xx", "TO-220"},
	} {
		h := firstHit(catalog.Find(c, tt.q))
		if h == nil || h.Family.ID != tt.family || h.Outline != tt.outline {
			t.Errorf("Find(%q) = %+v, want %s %s", tt.q, h, tt.family, tt.outline)
		}
	}
	for _, h := range catalog.Find(c, "BC 337") {
		if !h.Family.NonRegulator() {
			t.Errorf("BC 337 found regulator %s", h.Family.ID)
		}
	}
}

// TestMarkingOrderCodes: every order code the built-in catalog lists for a
// package (taken by the catalog from the makers' ordering tables) decodes
// to its family, and never to another outline than the package's. Two
// families with the same marking patterns (1085 and 1085-fixed) cannot be
// told apart by the number alone; the voltage suffix decides.
func TestMarkingOrderCodes(t *testing.T) {
	c := builtinCatalog(t)
	n := 0
	for _, f := range c.Sorted() {
		for _, p := range f.Packages {
			for _, oc := range p.OrderCodes {
				n++
				d := catalog.DecodeMarking(c, oc)
				h, ok := d.Hit(f.ID)
				if !ok {
					t.Errorf("%s (%s %s) does not decode to %s; hits %v", oc, f.ID, p.Outline, f.ID, ids(d.Hits))
					continue
				}
				if top := d.Hits[0]; top.Family != h.Family && top.Score > h.Score && !slices.Equal(top.Family.Markings, f.Markings) {
					t.Errorf("%s (%s %s) decodes first to %s: %s", oc, f.ID, p.Outline, top.Family.ID, top.Detail)
				}
				if h.Outline != "" && c.Outline(h.Outline) != c.Outline(p.Outline) {
					t.Errorf("%s (%s %s) decodes to outline %s: %s (extend the package codes in catalog/marking_suffix.go)", oc, f.ID, p.Outline, h.Outline, h.Detail)
				}
			}
		}
	}
	if n == 0 {
		t.Skip("no order codes in the built-in catalog")
	}
}

func ids(hits []catalog.Hit) []string {
	var out []string
	for _, h := range hits {
		out = append(out, h.Family.ID)
	}
	return out
}

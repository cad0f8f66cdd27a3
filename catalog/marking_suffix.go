package catalog

import (
	"fmt"
	"strconv"
	"strings"
)

// packageCode is one package letter code of a maker's ordering table: the
// letters after the grade letters that say the outline.
type packageCode struct {
	code    string
	outline string   // catalog outline name; "" = known code, outline not in the catalog
	makers  []string // maker prefixes the reading holds for; nil = every maker
	source  string
	where   int // anywhere, atStart (nothing before it), afterGrade (a grade letter before it)
}

// Where a package code may stand in the suffix, for makers whose order
// differs: Fairchild wrote the package letter first (µA7805KC), TI the grade
// first (µA7805CKC).
const (
	anywhere   = 0
	atStart    = 1
	afterGrade = 2
)

// packageCodes are read longest first; where makers disagree on a code the
// reading is tied to their prefixes and an unknown maker gets no outline.
var packageCodes = []packageCode{
	{"D2T", "D2PAK", nil, "ST L78 DS0422 and onsemi MC7800/D, LM337/D: D2T = D2PAK (case 936)", anywhere},
	{"DT", "DPAK", nil, "SGS L78M00 (1994) CDT = DPAK; onsemi MC78M00/D Rev 16 DT = DPAK-3 (case 369C); National LM1117 DS100919 DT = TO-252", anywhere},
	{"KTT", "D2PAK", []string{"LM", "UA", "TL", "TLV", "REG"}, "TI TL783 SLVS036 and LM317 SLVS044: KTT = TO-263", anywhere},
	{"KVU", "DPAK", []string{"LM", "UA", "TL", "TLV"}, "TI µA78M00 and LM317: KVU = TO-252, from memory", anywhere},
	{"KCS", "TO-220", []string{"LM", "UA", "TL"}, "TI TL783 SLVS036 and µA7800 SLVS056: KCS = TO-220", anywhere},
	{"KCT", "TO-220", []string{"LM", "UA", "TL"}, "TI LM317 SLVS044: KCT = TO-220", anywhere},
	{"KC", "TO-220", []string{"UA", "TL"}, "TI µA7800 SLVS056 and TL783 SLVS036: CKC = TO-220 (grade C first)", afterGrade},
	{"KC", "TO-3", []string{"UA"}, "Fairchild µA7800 (1970s-80s): KC = TO-3 metal can, package letter first, from memory", atStart},
	{"UC", "TO-220", []string{"UA"}, "Fairchild µA7800: UC = TO-220 plastic, from memory", atStart},
	{"KC", "TO-3", []string{"LM"}, "National LM78XX (1995/2000): LM7805CK aluminium TO-3, package KC02A; LM340KC, from memory", anywhere},
	{"KTE", "", []string{"UA", "TL", "LM"}, "TI PowerFLEX (KTE), not in the catalog", anywhere},
	{"DCY", "SOT-223", []string{"LM", "UA", "TL", "TLV", "REG"}, "TI LM340 / LM317 SOT-223 drawing DCY", anywhere},
	{"EMP", "SOT-223", []string{"LM"}, "TI LM317 SLVS044: EMP = SOT-223, from memory", anywhere},
	{"MP", "SOT-223", nil, "National LM340 / LM2940 / LM1117: MP = SOT-223 (TI SNOSBT0, LM2940 DS)", anywhere},
	{"ST", "SOT-223", []string{"LT", "NCP", "NCV"}, "Linear Technology LT1117 CST and onsemi NCP1117 ST = SOT-223, from memory", anywhere},
	{"LP", "TO-92", nil, "TI LM317L SLCS144 and µA78L00: LP = TO-92", anywhere},
	{"PK", "SOT-89", []string{"UA"}, "TI µA78L00: PK = SOT-89, from memory", anywhere},
	{"FP", "TO-220FP", nil, "fully moulded TO-220 (FP), from memory", anywhere},
	{"FA", "TO-220FP", []string{"NJM"}, "JRC NJM78xx FA = TO-220F, from memory", anywhere},
	{"DBV", "SOT-23-5", []string{"LP", "TLV", "TPS", "LM"}, "TI LP2992 / LP2980-ADJ pin tables: DBV = SOT-23-5 (LP2985-33DBVR)", anywhere},
	{"YM5", "SOT-23-5", []string{"MIC"}, "Micrel/Microchip MIC5205: YM5 = SOT-23-5, lead-free (MIC5205-3.3YM5-TR), from memory", anywhere},
	{"BM5", "SOT-23-5", []string{"MIC"}, "Micrel MIC5205 (2006) ordering table: BM5 = SOT-23-5 (MIC5205-3.3BM5)", anywhere},
	{"M5", "SOT-23-5", []string{"LP", "LM"}, "National LP2985IM5-3.3: M5 = SOT-23-5, from memory", anywhere},
	{"K", "SOT-23-5", []string{"AP"}, "Diodes AP2127K-4.75TRG1 (DS36478): K = SOT-23-5", anywhere},
	{"MR", "SOT-23", []string{"XC"}, "Torex XC6206 MR = SOT-23, from memory", anywhere},
	{"PR", "SOT-89", []string{"XC"}, "Torex XC6206 PR = SOT-89, from memory", anywhere},
	{"TT", "SOT-23", []string{"MCP"}, "Microchip MCP1700 TT = SOT-23, from memory", anywhere},
	{"MB", "SOT-89", []string{"MCP"}, "Microchip MCP1700 MB = SOT-89, from memory", anywhere},
	{"TO", "TO-92", []string{"MCP"}, "Microchip MCP1700 TO = TO-92, from memory", anywhere},
	{"T", "TO-3", []string{"L"}, "ST L78 / L78S (1993, 1998): T and CT = TO-3, CV = TO-220", anywhere},
	{"T", "TO-220", nil, "National LM78xx/LM340/LM317 T = TO-220; onsemi MC7800/D CT = TO-220; Fairchild LM78XX CT", anywhere},
	{"V", "TO-220", nil, "ST L78 CV, LD1117 V, L4940 V = TO-220", anywhere},
	{"P", "TO-220FP", []string{"L", "LM", "LD", "LF"}, "ST L7800 (1998) ISOWATT220 CP; ST LM317 P = TO-220FP", anywhere},
	{"P", "TO-92", []string{"MC"}, "onsemi MC78L00A/D: P = TO-92 (case 029)", anywhere},
	{"K", "TO-3", nil, "National LM309K, LM317K, LM340K (K02A); Motorola MC7900 CK (case 1-03)", anywhere},
	{"H", "SOT-89", []string{"MC"}, "onsemi MC78L00 ACH = SOT-89, from memory", anywhere},
	{"HF", "TO-220FP", []string{"UPC"}, "NEC µPC7800 HF = isolated TO-220, from memory", anywhere},
	{"H", "TO-220", []string{"UPC"}, "NEC µPC7800 H = TO-220, from memory", anywhere},
	{"H", "TO-39", nil, "National LM109H/LM309H, LM317H (H03A); Linear Technology LT1086 H", anywhere},
	{"Z", "TO-92", nil, "National LM78L05ACZ, LM317LZ; ST L78L ACZ; onsemi LP2950/D Z = TO-92 (case 29)", anywhere},
	{"D", "SO-8", nil, "TI LM317L SLCS144 (D = SOIC-8); onsemi MC78L00A/D D = SOIC-8 (case 751)", anywhere},
	{"M", "D2PAK", []string{"LT"}, "Linear Technology LT1085 / LT1086 CM = DD (TO-263), from memory", anywhere},
	{"M", "SO-8", []string{"LM", "LP"}, "National LM78L05ACM, LM317LM, LM2931M = SO-8, from memory", anywhere},
	{"S", "SOT-223", []string{"LD"}, "ST LD1117 (2004) S = SOT-223", anywhere},
	{"S", "D2PAK", []string{"LM", "LP"}, "National LM340 / LM2940: S = TO-263 (TI SNOSBT0, LM2940 DS)", anywhere},
	{"U", "SOT-89", []string{"L"}, "ST L78L ACUTR = SOT-89, from memory", anywhere},
	{"U", "D2PAK", []string{"MIC"}, "Micrel MIC2940A BU = TO-263, from memory", anywhere},
	{"R", "DPAK", []string{"KA"}, "Fairchild KA78M05R = D-PAK, from memory", anywhere},
	{"DBZ", "SOT-23", []string{"TL", "LM", "UA", "TLV", "LP"}, "TI package designator DBZ = SOT-23 (TL431ACDBZR), from memory", anywhere},
	{"S", "D2PAK", []string{"IRF", "IRL"}, "International Rectifier IRF540NS = D2PAK, from memory", anywhere},
	{"N", "", nil, "plastic DIP (N), no regulator outline", anywhere},
}

// gradeLetters stand before the package code: temperature range and
// tolerance grades (A tighter tolerance, B/I/E extended temperature, C
// commercial). onsemi MC7800/D (MC7805ACT, MC7805BT); ST L78 (L7805ABV).
const gradeLetters = "ABCIE"

// trailer is a code after (or, for some makers, among) the grade and
// package letters that says nothing about the part's function: packing,
// lead finish, a maker's type or tolerance letter.
type trailer struct {
	code   string
	makers []string // nil = every maker (then only after the first letter)
}

// trailers: onsemi G (Pb-free) and R4/T4/T3/T1/R2/RK (reel: MC7805BDTRKG,
// MC79L05ACDR2G in the makers' order tables), TA (ammo pack, BC547BTA), TI
// /NOPB, -TR tape and reel, IR TRL/TRR and PBF (lead-free), X (National
// tape), E3 (finish); Torex XC6206
// P (positive fixed type) and the accuracy digit after the voltage code;
// Microchip MCP1700 T (tape), the 0x tolerance code and the E/I
// temperature letter; Diodes AP2112 G1 (green, lead-free: AP2112K-3.3TRG1).
// The maker-specific rows are from memory.
var trailers = []trailer{
	{"NOPB", nil}, {"PBF", nil}, {"TR", nil}, {"R4", nil}, {"T4", nil}, {"T3", nil}, {"T1", nil},
	{"RK", nil}, {"R2", nil}, {"TA", nil}, {"TRL", nil}, {"TRR", nil},
	{"E3", nil}, {"G", nil}, {"X", nil}, {"R", nil},
	{"P", []string{"XC"}}, {"1", []string{"XC"}}, {"2", []string{"XC"}},
	{"G1", []string{"AP"}},
	{"T", []string{"MCP"}}, {"01", []string{"MCP"}}, {"02", []string{"MCP"}}, {"E", []string{"MCP"}}, {"I", []string{"MCP"}},
}

// Costs of characters the suffix tables do not explain.
const (
	unknownLetterCost = 0.5
	unknownDigitCost  = 1.0
	otherMakerCost    = 0.25 // a package code read as another maker's
	threeDigitCost    = 0.1  // a three-digit voltage code (285) is rarer than two digits and a tolerance digit
	maxSuffixLen      = 16
)

// suffixRead is what the characters after a family's number say.
type suffixRead struct {
	outline string
	code    string    // the package code read, "" when none
	volts   []float64 // what the voltage code can mean
	vtext   string    // the voltage code as printed
	adj     bool      // ADJ
	date    string    // a date code run on to the number
	cost    float64
	known   int      // characters the tables explain
	text    string   // the suffix as read, "" when empty
	notes   []string // what was not understood
}

// readSuffix reads s (upper case, separators kept) for the given maker.
func readSuffix(s, maker string) suffixRead {
	r := suffixRead{text: strings.Trim(s, "-./+")}
	if len(s) > maxSuffixLen {
		r.cost += unknownLetterCost * float64(len(s)-maxSuffixLen)
		r.notes = append(r.notes, "a long suffix, not read past its first 16 characters")
		s = s[:maxSuffixLen]
	}
	p := &suffixParser{s: s, maker: maker}
	best := p.parse(0, stPre)
	r.outline, r.code, r.volts, r.vtext, r.adj, r.date = best.outline, best.code, best.volts, best.vtext, best.adj, best.date
	r.cost += best.cost
	r.known = best.known
	if best.unknown != "" {
		r.notes = append(r.notes, fmt.Sprintf("%q not understood", best.unknown))
	}
	return r
}

// Parser states, bits: grade letters come only before the package code and
// the voltage; a second package code costs.
const (
	stPre    = 0
	stClosed = 1 // no more grade letters
	stPkg    = 2 // a package code has been read
)

type parse struct {
	cost    float64
	outline string
	code    string
	volts   []float64
	vtext   string
	adj     bool
	date    string
	unknown string
	known   int // characters explained, to break ties
	tokens  int // codes read: of two equal readings the one with fewer, longer codes wins
}

type suffixParser struct {
	s     string
	maker string
	memo  map[[2]int]parse
}

func (p *suffixParser) parse(i, st int) parse {
	if p.memo == nil {
		p.memo = map[[2]int]parse{}
	}
	k := [2]int{i, st}
	if r, ok := p.memo[k]; ok {
		return r
	}
	r := p.parse1(i, st)
	p.memo[k] = r
	return r
}

func better(a, b parse) bool {
	if a.cost != b.cost {
		return a.cost < b.cost
	}
	if a.known != b.known {
		return a.known > b.known
	}
	return a.tokens < b.tokens
}

func (p *suffixParser) parse1(i, st int) parse {
	s := p.s
	if i >= len(s) {
		return parse{}
	}
	ch := s[i]
	switch ch {
	case '-', '.', '/', '+', '?', '*':
		return p.parse(i+1, st)
	}
	// The fallback: this character is not understood.
	best := p.parse(i+1, st)
	if ch >= '0' && ch <= '9' {
		best.cost += unknownDigitCost
	} else {
		best.cost += unknownLetterCost
	}
	best.unknown = string(ch) + best.unknown
	try := func(n int, nextSt int, set func(*parse) bool) {
		r := p.parse(i+n, nextSt)
		if !set(&r) {
			return
		}
		r.known += n
		r.tokens++
		if better(r, best) {
			best = r
		}
	}
	if st&stClosed == 0 && strings.IndexByte(gradeLetters, ch) >= 0 {
		try(1, st, func(*parse) bool { return true })
	}
	start := strings.Trim(s[:i], "-./+") == ""
	for _, pc := range packageCodes {
		if !strings.HasPrefix(s[i:], pc.code) || (pc.where == atStart && !start) ||
			(pc.where == afterGrade && (start || strings.IndexByte(gradeLetters, s[i-1]) < 0)) {
			continue
		}
		outline, cost := pc.outline, 0.0
		if pc.makers != nil && !hasString(pc.makers, p.maker) {
			// Another maker's code: likely a code, but it says no outline here.
			outline, cost = "", otherMakerCost
		}
		code := pc.code
		if st&stPkg != 0 {
			cost++ // two package codes
		}
		try(len(code), st|stClosed|stPkg, func(r *parse) bool {
			r.code, r.outline = code, outline
			r.cost += cost
			return true
		})
	}
	for _, t := range trailers {
		if !strings.HasPrefix(s[i:], t.code) {
			continue
		}
		if t.makers == nil {
			try(len(t.code), st|stClosed, func(*parse) bool { return true })
		}
		if t.makers != nil && hasString(t.makers, p.maker) {
			try(len(t.code), st, func(*parse) bool { return true })
		}
	}
	if strings.HasPrefix(s[i:], "ADJ") {
		try(3, st|stClosed, func(r *parse) bool { r.adj = true; return len(r.volts) == 0 })
	}
	if i == 0 || !isDigit(s[i-1]) {
		for _, vc := range voltCodes(s[i:]) {
			vc := vc
			try(vc.n, st|stClosed, func(r *parse) bool {
				if len(r.volts) > 0 || r.adj {
					return false
				}
				r.volts, r.vtext = vc.volts, vc.text
				if len(vc.text) == 3 {
					r.cost += threeDigitCost
				}
				return true
			})
		}
	}
	if n := dateRun(s[i:]); n > 0 && i > 0 {
		try(n, st|stClosed, func(r *parse) bool { r.date = s[i : i+4]; return true })
	}
	return best
}

// voltCode is one way to read a voltage code at the start of a suffix.
type voltCode struct {
	n     int       // characters used
	volts []float64 // the voltages it can mean
	text  string    // as printed
}

// voltCodes returns the readings of a voltage code at the start of s: "5.0",
// "3.3", "12", "33" (3.3 or 33 V), "285" (2.85 V); for a run of digits, its
// first one, two and three digits (the rest may be a maker's tolerance
// code: 332 = 3.3 V, ±2 %).
func voltCodes(s string) []voltCode {
	n := 0
	for n < len(s) && isDigit(s[n]) {
		n++
	}
	if n == 0 {
		return nil
	}
	if n <= 2 && n < len(s) && s[n] == '.' && n+1 < len(s) && isDigit(s[n+1]) {
		m := n + 1
		for m < len(s) && m < n+3 && isDigit(s[m]) {
			m++
		}
		v, err := strconv.ParseFloat(s[:m], 64)
		if err != nil || v == 0 {
			return nil
		}
		return []voltCode{{m, []float64{v}, s[:m]}}
	}
	var out []voltCode
	for k := 1; k <= min(n, 3); k++ {
		if vs := codeVolts(s[:k]); len(vs) > 0 {
			out = append(out, voltCode{k, vs, s[:k]})
		}
	}
	return out
}

// codeVolts returns what a voltage code of one to three digits can mean.
func codeVolts(d string) []float64 {
	x, _ := strconv.Atoi(d)
	if x == 0 {
		return nil
	}
	switch len(d) {
	case 1:
		return []float64{float64(x)}
	case 2:
		if d[0] == '0' {
			return []float64{float64(x)} // 05 = 5 V
		}
		return []float64{float64(x) / 10, float64(x)} // 33 = 3.3 V; 12 = 1.2 or 12 V
	case 3:
		return []float64{float64(x) / 100, float64(x) / 10} // 285 = 2.85 V, 120 = 12.0 V
	}
	return nil
}

// dateRun is 4 when s opens with a four-digit year-and-week group that ends
// the suffix.
func dateRun(s string) int {
	if len(s) == 4 && isDateCode([]byte(s)) {
		return 4
	}
	return 0
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func hasString(ss []string, s string) bool {
	for _, x := range ss {
		if x == s {
			return true
		}
	}
	return false
}

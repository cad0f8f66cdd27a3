package catalog

import (
	"fmt"
	"math"
	"sort"
	"strings"
)

// Decoded is what a marking says, read against a catalog by [DecodeMarking].
type Decoded struct {
	// Query is the marking as given.
	Query string
	// Hits are the families the marking can be, best first.
	Hits []Hit
	// DateCodes are the four-digit groups beside the part number that were
	// read as date codes (year and week) and left out of the decoding.
	DateCodes []string
	// Transistor is the transistor type prefix the part number opens with
	// ("BC", "2N", "IRF"), or "" when it opens with none. Such a marking is
	// matched against the non-regulator families only.
	Transistor string
}

// Hit returns the decoded hit of the family with the given id.
func (d *Decoded) Hit(id string) (Hit, bool) {
	for _, h := range d.Hits {
		if h.Family.ID == id {
			return h, true
		}
	}
	return Hit{}, false
}

// Limits that keep the decoder's work bounded on any input.
const (
	maxTokens    = 8    // groups of a marking that are read (a part has a few lines)
	maxTokenLen  = 48   // characters of one marking group that are read
	maxMatchWork = 4000 // steps of the core matcher per pattern and token
	lookalikeVal = 0.5  // a look-alike character counts half a confirmed one
)

// token is one group of a marking (groups are separated by spaces).
type token struct {
	raw  string // upper-case, separators (- . /) kept
	q    []byte // compact: letters, digits, ? and *
	alt  []byte // the look-alike of each character of q, 0 when none
	pos  []int  // index in raw of each character of q
	tran string // transistor prefix it opens with, or ""
}

// lookalikes pairs characters a worn or hand-copied marking confuses
// (O/0, I/1, B/8, S/5, Z/2, G/6; a lower-case l is read as L or 1).
// Common practice, no source.
var lookalikes = map[byte]byte{'O': '0', '0': 'O', 'I': '1', '1': 'I', 'B': '8', '8': 'B', 'S': '5', '5': 'S', 'Z': '2', '2': 'Z', 'G': '6', '6': 'G'}

// splitMarking cuts a marking into tokens, upper-cased, µ read as U.
func splitMarking(s string) []token {
	if len(s) > maxTokens*(maxTokenLen+8) {
		s = s[:maxTokens*(maxTokenLen+8)]
	}
	var out []token
	for _, f := range strings.FieldsFunc(s, func(r rune) bool { return r == ' ' || r == '\t' || r == '\n' || r == '\r' || r == ',' || r == ';' }) {
		var t token
		var raw []byte
		for _, r := range f {
			if len(t.q) >= maxTokenLen {
				break
			}
			switch {
			case r == 'µ' || r == 'μ':
				r = 'U'
			case r == 'l':
				t.q, t.alt, t.pos = append(t.q, 'L'), append(t.alt, '1'), append(t.pos, len(raw))
				raw = append(raw, 'L')
				continue
			case r >= 'a' && r <= 'z':
				r -= 'a' - 'A'
			}
			switch {
			case r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '?' || r == '*':
				b := byte(r)
				if b == '*' && len(t.q) > 0 && t.q[len(t.q)-1] == '*' {
					continue // a run of stars is one star
				}
				t.q, t.alt, t.pos = append(t.q, b), append(t.alt, lookalikes[b]), append(t.pos, len(raw))
				raw = append(raw, b)
			case r == '-' || r == '.' || r == '/' || r == '+':
				raw = append(raw, byte(r))
			}
		}
		if len(t.q) == 0 {
			continue
		}
		t.raw = string(raw)
		t.tran = transistorPrefix(t.q)
		out = append(out, t)
		if len(out) == maxTokens {
			break
		}
	}
	return out
}

// isDateCode reports whether a token is a four-digit year-and-week group.
func isDateCode(q []byte) bool {
	if len(q) != 4 {
		return false
	}
	for _, c := range q {
		if c < '0' || c > '9' {
			return false
		}
	}
	wk := int(q[2]-'0')*10 + int(q[3]-'0')
	return wk >= 1 && wk <= 53
}

// core is one marking pattern of a family, reduced to what lies between its
// outer stars, with the voltage code filled in.
type core struct {
	pattern  string  // as written in the catalog
	text     []byte  // normalised, code filled in
	vout     float64 // the voltage whose code was filled in; 0 when none
	anchorL  bool    // the pattern does not open with a star: nothing may precede
	anchorR  bool    // the pattern does not close with a star: nothing may follow
	tailCode string  // letters after the pattern's last digit ("K" in *309K*)
	lead     int     // letters of a maker prefix the pattern opens with ("LM" in *LM309*)
}

// cores returns the cores of a family's marking patterns.
func (f *Family) cores() []core {
	var out []core
	for _, m := range f.Markings {
		if strings.Contains(m, VoltageToken) {
			for _, v := range f.OutputsV {
				out = append(out, makeCore(m, strings.ReplaceAll(m, VoltageToken, VoltageCode(v)), v))
			}
			continue
		}
		out = append(out, makeCore(m, m, 0))
	}
	return out
}

func makeCore(pattern, filled string, vout float64) core {
	n := NormalizeMarking(filled)
	c := core{pattern: pattern, vout: vout, anchorL: !strings.HasPrefix(n, "*"), anchorR: !strings.HasSuffix(n, "*")}
	n = strings.Trim(n, "*")
	c.text = []byte(n)
	letters := 0
	for letters < len(n) && n[letters] >= 'A' && n[letters] <= 'Z' {
		letters++
	}
	for k := letters; k > 0; k-- {
		if _, ok := makerPrefixes[n[:k]]; ok {
			c.lead = k // the pattern spells a maker prefix (*LM309*, *LF??C*)
			break
		}
		if _, ok := transistorPrefixes[n[:k]]; ok {
			c.lead = k // or a transistor's type prefix (IRF5*)
			break
		}
	}
	last := strings.LastIndexAny(n, "0123456789")
	if last >= 0 && last < len(n)-1 {
		tail := n[last+1:]
		if strings.Trim(tail, "ABCDEFGHIJKLMNOPQRSTUVWXYZ") == "" {
			c.tailCode = tail
		}
	}
	return c
}

// matcher finds where a core can sit in a token.
type matcher struct {
	q, alt, c []byte
	lo, hi    int       // characters of c that count: c[lo:hi] (the number proper)
	best      []float64 // best score per end position, NaN = none
	steps     int
}

func (m *matcher) walk(k, j int, score float64) {
	m.steps++
	if m.steps > maxMatchWork {
		return
	}
	if k == len(m.c) {
		if math.IsNaN(m.best[j]) || score > m.best[j] {
			m.best[j] = score
		}
		return
	}
	if j < len(m.q) && m.q[j] == '*' {
		m.walk(k+1, j, score) // the star stands for this character of the number
		m.walk(k, j+1, score) // the star ends here
		return
	}
	c := m.c[k]
	if c == '*' {
		m.walk(k+1, j, score)
		if j < len(m.q) {
			m.walk(k, j+1, score)
		}
		return
	}
	if j >= len(m.q) {
		return
	}
	w := 1.0
	if k < m.lo || k >= m.hi {
		w = 0 // a maker prefix or package letters written into the pattern
	}
	switch q := m.q[j]; {
	case q == c:
		m.walk(k+1, j+1, score+w)
	case c == '?' || q == '?':
		m.walk(k+1, j+1, score)
	case m.alt[j] == c:
		m.walk(k+1, j+1, score+lookalikeVal*w)
	}
}

// startOK reports whether the number can begin at q[i]: its first character
// must be read there, never stand inside a star.
func startOK(q, alt []byte, i int, c byte) bool {
	if q[i] == '*' {
		return false
	}
	return c == '?' || c == '*' || q[i] == '?' || q[i] == c || alt[i] == c
}

// DecodeMarking reads a marking as printed on a part (maker prefix, number,
// grade and package suffix, voltage suffix; date codes and logos beside it)
// against the catalog's marking patterns. ? stands for one unreadable
// character, * for any run; a star never stands for the first character of
// a family's number. Groups are separated by spaces; the first 8 groups and
// the first 48 characters of each are read.
func DecodeMarking(c *Catalog, text string) Decoded {
	d := Decoded{Query: text}
	toks := splitMarking(text)
	var parts []token
	number := hasPartNumber(toks)
	for _, t := range toks {
		if isDateCode(t.q) && number {
			d.DateCodes = append(d.DateCodes, t.raw)
			continue
		}
		parts = append(parts, t)
	}
	parts = joinGroups(parts)
	for _, t := range parts {
		if t.tran != "" && d.Transistor == "" {
			d.Transistor = t.tran
		}
	}
	r := newReader(c, parts)
	for _, f := range c.Sorted() {
		if h, ok := r.family(f); ok {
			d.Hits = append(d.Hits, h)
		}
	}
	if d.Transistor != "" && !hasNonRegulator(d.Hits) {
		// No look-alike's pattern fits: the prefix alone says what kind of part.
		d.Hits = append(d.Hits, r.byDevice(d.Hits)...)
	}
	if len(d.DateCodes) > 0 {
		note := fmt.Sprintf(", %s a date code (year, week), left out", strings.Join(d.DateCodes, " "))
		for i := range d.Hits {
			d.Hits[i].Detail += note
		}
	}
	sort.SliceStable(d.Hits, func(i, j int) bool {
		a, b := d.Hits[i], d.Hits[j]
		if a.Score != b.Score {
			return a.Score > b.Score
		}
		return a.Family.Commonness > b.Family.Commonness
	})
	return d
}

// joinGroups adds, for two neighbouring groups of which one has no digit,
// the two read as one ("LM 317T", "7805 CT": a number split over two lines
// or typed with a space).
func joinGroups(toks []token) []token {
	n := len(toks)
	for i := 0; i+1 < n; i++ {
		a, b := toks[i], toks[i+1]
		if hasDigit(a.q) && hasDigit(b.q) {
			continue
		}
		j := token{raw: a.raw + b.raw}
		j.q = append(append([]byte(nil), a.q...), b.q...)
		j.alt = append(append([]byte(nil), a.alt...), b.alt...)
		j.pos = append([]int(nil), a.pos...)
		for _, p := range b.pos {
			j.pos = append(j.pos, p+len(a.raw))
		}
		j.tran = transistorPrefix(j.q)
		if j.tran != "" {
			// BC 337 is a transistor: neither half is a regulator.
			toks[i].tran, toks[i+1].tran = j.tran, j.tran
		}
		toks = append(toks, j)
	}
	return toks
}

func hasDigit(q []byte) bool {
	for _, c := range q {
		if c >= '0' && c <= '9' {
			return true
		}
	}
	return false
}

func hasNonRegulator(hits []Hit) bool {
	for _, h := range hits {
		if h.Family.NonRegulator() {
			return true
		}
	}
	return false
}

// hasPartNumber reports whether a marking has a group that is not a date code.
func hasPartNumber(toks []token) bool {
	for _, t := range toks {
		if !isDateCode(t.q) && strings.ContainsAny(string(t.q), "0123456789") {
			return true
		}
	}
	return false
}

// Resolve returns the family a name stands for: the family with that id,
// else the one family a part number decodes to ([DecodeMarking]) ahead of
// every other. When no family fits, or several fit equally well, f is nil
// and alts lists the best equal readings (none when nothing fits).
func Resolve(c *Catalog, name string) (f *Family, read Hit, alts []Hit) {
	if f := c.Family(name); f != nil {
		return f, Hit{}, nil
	}
	hits := DecodeMarking(c, name).Hits
	if len(hits) == 0 {
		return nil, Hit{}, nil
	}
	if len(hits) == 1 || hits[1].Score < hits[0].Score {
		return hits[0].Family, hits[0], nil
	}
	for _, h := range hits {
		if h.Score == hits[0].Score {
			alts = append(alts, h)
		}
	}
	return nil, Hit{}, alts
}

package catalog

import (
	"fmt"
	"math"
	"strings"
)

// reader decodes the tokens of one marking against families, caching the
// readings of prefixes and suffixes, which do not depend on the family.
type reader struct {
	c       *Catalog
	toks    []token
	prefix  map[[2]int]prefixRead
	suffix  map[suffixKey]suffixRead
	m       matcher
	regular bool // some token is no transistor number
}

type suffixKey struct {
	tok, at int
	maker   string
	tail    string
}

func newReader(c *Catalog, toks []token) *reader {
	r := &reader{c: c, toks: toks, prefix: map[[2]int]prefixRead{}, suffix: map[suffixKey]suffixRead{}}
	for _, t := range toks {
		if t.tran == "" {
			r.regular = true
		}
	}
	return r
}

// candidate is one reading of a token as a family's marking.
type candidate struct {
	score   float64
	core    *core
	pre     prefixRead
	suf     suffixRead
	volts   []float64
	outline string
	notes   []string
	tok     *token
	start   int
	end     int
}

// coreCode returns the digits the query has where the pattern has a run of
// ? (the voltage code of *LF??C*), when the number was read one character
// for one (no star in either).
func (r *reader) coreCode(cr *core, t *token, i, j int) (string, bool) {
	c := cr.text
	if cr.vout > 0 || j-i != len(c) || strings.IndexByte(string(c), '*') >= 0 || strings.IndexByte(string(t.q[i:j]), '*') >= 0 {
		return "", false
	}
	a := strings.IndexByte(string(c), '?')
	if a < 0 {
		return "", false
	}
	b := a
	for b < len(c) && c[b] == '?' {
		b++
	}
	code := string(t.q[i+a : i+b])
	for k := 0; k < len(code); k++ {
		if !isDigit(code[k]) {
			return "", false
		}
	}
	return code, true
}

// known is how many characters around the number the tables explain: of
// two readings with the same score, the one that explains more wins
// ("7805 CT" read as one group names the package).
func (cd *candidate) known() int { return cd.pre.known + cd.suf.known }

// family returns the family's best reading of the marking, if any.
func (r *reader) family(f *Family) (Hit, bool) {
	nonReg := f.NonRegulator()
	if !nonReg && !r.regular {
		return Hit{}, false
	}
	var best *candidate
	var ties []float64 // voltages of readings as good as the best
	cores := f.cores()
	for ci := range cores {
		cr := &cores[ci]
		if len(cr.text) == 0 {
			continue
		}
		for ti := range r.toks {
			t := &r.toks[ti]
			if t.tran != "" && !nonReg {
				continue // a transistor number is never a regulator
			}
			for i := range t.q {
				if cr.anchorL && i > 0 {
					break
				}
				if !startOK(t.q, t.alt, i, cr.text[0]) {
					continue
				}
				pre := r.readPrefix(ti, i)
				if !pre.ok && !nonReg {
					continue
				}
				if !pre.ok {
					pre = prefixRead{ok: true}
				}
				r.match(t, cr, i)
				for j, s := range r.m.best {
					if math.IsNaN(s) || s < 1 {
						continue
					}
					if cr.anchorR && j < len(t.q) && t.q[j] != '*' {
						continue
					}
					cd := r.judge(f, cr, ti, i, j, s, pre)
					switch {
					case best == nil || cd.score > best.score+1e-9 ||
						(math.Abs(cd.score-best.score) < 1e-9 && cd.known() > best.known() && cd.core.vout == best.core.vout):
						cdc := cd
						best, ties = &cdc, append(ties[:0], cd.volts...)
					case math.Abs(cd.score-best.score) < 1e-9 && cr.vout > 0 && best.core.vout > 0:
						ties = append(ties, cd.volts...)
					}
				}
			}
		}
	}
	if best == nil {
		return Hit{}, false
	}
	if best.core.vout > 0 {
		best.volts = uniqueSorted(ties)
		if len(best.volts) == len(f.OutputsV) && len(f.OutputsV) > 1 {
			best.volts = nil // the code is not legible: it says nothing
		}
	}
	return r.hit(f, best), true
}

func (r *reader) readPrefix(ti, i int) prefixRead {
	k := [2]int{ti, i}
	p, ok := r.prefix[k]
	if !ok {
		p = readPrefix(r.toks[ti].q[:i])
		r.prefix[k] = p
	}
	return p
}

// match runs the core matcher from start i; r.m.best holds the scores.
func (r *reader) match(t *token, cr *core, i int) {
	m := &r.m
	m.q, m.alt, m.c, m.steps = t.q, t.alt, cr.text, 0
	m.lo, m.hi = cr.lead, len(cr.text)-len(cr.tailCode)
	if cap(m.best) < len(t.q)+1 {
		m.best = make([]float64, len(t.q)+1)
	}
	m.best = m.best[:len(t.q)+1]
	for j := range m.best {
		m.best[j] = math.NaN()
	}
	m.walk(0, i, 0)
}

// judge scores one placement of a family's number in a token: the
// characters it confirms, less the cost of the prefix and suffix, less the
// cost of a voltage or outline the family does not have.
func (r *reader) judge(f *Family, cr *core, ti, i, j int, s float64, pre prefixRead) candidate {
	t := &r.toks[ti]
	cd := candidate{core: cr, pre: pre, tok: t, start: i, end: j, score: s - pre.cost}
	at := len(t.raw)
	if j < len(t.q) {
		at = t.pos[j]
	}
	maker := pre.maker
	if maker == "" && cr.lead > 0 {
		maker = string(cr.text[:cr.lead]) // the pattern spells the prefix (*LM340*)
	}
	k := suffixKey{ti, at, maker, cr.tailCode}
	suf, ok := r.suffix[k]
	if !ok {
		suf = readSuffix(t.raw[at:], maker)
		if suf.outline == "" && cr.tailCode != "" {
			if tail := readSuffix(cr.tailCode, maker); tail.outline != "" {
				suf.outline, suf.code = tail.outline, tail.code
			}
		}
		r.suffix[k] = suf
	}
	cd.suf = suf
	cd.score -= suf.cost
	cd.outline = suf.outline
	if code, ok := r.coreCode(cr, t, i, j); ok && f.Kind == KindFixed {
		// The pattern leaves the voltage code open (*LF??C*): read it.
		for _, v := range codeVolts(code) {
			if containsV(f.OutputsV, v) {
				cd.volts = append(cd.volts, v)
			}
		}
		if len(cd.volts) > 0 {
			cd.score += float64(len(code))
		} else {
			cd.score--
			cd.notes = append(cd.notes, fmt.Sprintf("the voltage code %s is not among the family's voltages", code))
		}
		return r.outlineCheck(f, cd)
	}
	switch {
	case cr.vout > 0:
		cd.volts = []float64{cr.vout}
		if len(suf.volts) > 0 && !containsV(suf.volts, cr.vout) {
			cd.score--
			cd.notes = append(cd.notes, fmt.Sprintf("the suffix %s does not repeat %g V", suf.vtext, cr.vout))
		}
	case suf.adj:
		if f.Kind == KindFixed {
			cd.score -= 2
			cd.notes = append(cd.notes, "ADJ, but the family is fixed")
		}
	case len(suf.volts) > 0:
		switch {
		case f.Kind == KindFixed:
			for _, v := range suf.volts {
				if containsV(f.OutputsV, v) {
					cd.volts = append(cd.volts, v)
				}
			}
			if len(cd.volts) == 0 {
				cd.score--
				cd.notes = append(cd.notes, fmt.Sprintf("the voltage code %s is not among the family's voltages", suf.vtext))
			}
		case f.Kind == KindAdjustable:
			cd.score--
			cd.notes = append(cd.notes, fmt.Sprintf("the voltage code %s marks a fixed version, the family is adjustable", suf.vtext))
		}
	}
	if len(cd.volts) == 0 && len(suf.volts) == 0 && !suf.adj && f.Kind == KindFixed && len(f.OutputsV) == 1 {
		cd.volts = []float64{f.OutputsV[0]} // a family of one voltage
	}
	return r.outlineCheck(f, cd)
}

// outlineCheck names the outline as the family has it and costs an outline
// the family is not sold in.
func (r *reader) outlineCheck(f *Family, cd candidate) candidate {
	if cd.outline != "" && len(f.Packages) > 0 && f.Package(r.c, cd.outline) == nil {
		// T on a five-lead part is the five-lead TO-220 (LM2941CT), S the
		// five-lead TO-263 (D2PAK-5).
		if o := r.c.Outline(cd.outline); o != nil {
			for _, p := range f.Packages {
				if po := r.c.Outline(p.Outline); po != nil && fiveLeadOf(o, po) {
					cd.outline = po.Name
					break
				}
			}
		}
	}
	if cd.outline != "" && len(f.Packages) > 0 && f.Package(r.c, cd.outline) == nil {
		cd.score--
		cd.notes = append(cd.notes, fmt.Sprintf("no %s version in the catalog", cd.outline))
	}
	return cd
}

func (r *reader) hit(f *Family, cd *candidate) Hit {
	h := Hit{Family: f, How: "wildcard", Pattern: cd.core.pattern, VoutV: cd.volts, Outline: cd.outline, Score: math.Round(cd.score*100) / 100}
	if cd.core.vout > 0 && len(cd.volts) == 1 {
		h.Expanded = string(cd.core.text) // one voltage's pattern, when one fits
	}
	t := cd.tok
	var parts []string
	pre := string(t.q[:cd.start])
	num := string(t.q[cd.start:min(cd.end, len(t.q))])
	if l := cd.core.lead; pre == "" && l > 0 && len(num) > l && num[:l] == string(cd.core.text[:l]) {
		pre, num = num[:l], num[l:] // the pattern spells the maker prefix
	}
	head := "read as " + strings.Join(nonEmpty(pre, num, cd.suf.text), " + ")
	if cd.pre.text != "" {
		parts = append(parts, cd.pre.text)
	}
	var looks []string
	if c := cd.core.text; cd.end-cd.start == len(c) && !strings.ContainsRune(string(t.q[cd.start:cd.end])+string(c), '*') {
		for k := range c {
			if q := t.q[cd.start+k]; q != c[k] && t.alt[cd.start+k] == c[k] {
				looks = append(looks, fmt.Sprintf("%c as %c", q, c[k]))
			}
		}
	}
	if len(looks) > 0 {
		parts = append(parts, strings.Join(looks, ", "))
	}
	p := cd.core.pattern
	switch {
	case h.Expanded != "":
		p += " as " + h.Expanded
	case cd.core.vout > 0 && len(h.VoutV) == 0:
		p += ", voltage code not legible"
	}
	parts = append(parts, p)
	if len(h.VoutV) > 0 {
		var vs []string
		for _, v := range h.VoutV {
			vs = append(vs, fmt.Sprintf("%g V", v))
		}
		parts = append(parts, strings.Join(vs, " or "))
	}
	if cd.suf.code != "" && h.Outline != "" {
		parts = append(parts, fmt.Sprintf("%s = %s", cd.suf.code, h.Outline))
	}
	if cd.suf.adj {
		parts = append(parts, "ADJ = adjustable")
	}
	parts = append(parts, cd.suf.notes...)
	parts = append(parts, cd.notes...)
	h.Detail = head + ": " + strings.Join(parts, ", ")
	return h
}

// byDevice adds, for a transistor number no non-regulator family's marking
// fits, the non-regulator families of the devices its prefix names.
func (r *reader) byDevice(have []Hit) []Hit {
	var out []Hit
	seen := map[string]bool{}
	for _, h := range have {
		seen[h.Family.ID] = true
	}
	for ti := range r.toks {
		t := &r.toks[ti]
		if t.tran == "" || transistorPrefix(t.q) != t.tran {
			continue
		}
		for _, f := range r.c.Sorted() {
			if seen[f.ID] || !f.NonRegulator() || !deviceIn(f, transistorPrefixes[t.tran]) {
				continue
			}
			seen[f.ID] = true
			out = append(out, Hit{Family: f, How: "prefix", Pattern: t.tran, Score: float64(len(t.tran)),
				Detail: fmt.Sprintf("read as %s + %s: %s is a transistor type prefix, this is no regulator", t.tran, afterPrefix(t), t.tran)})
		}
	}
	return out
}

// afterPrefix returns what follows a token's transistor prefix.
func afterPrefix(t *token) string {
	q := string(t.q)
	if i := strings.Index(q, t.tran); i >= 0 {
		return q[i+len(t.tran):]
	}
	return q
}

// fiveLeadOf reports whether po is a many-lead form of o: one of po's names
// is one of o's names followed by a dash (TO-220-5, D2PAK-5).
func fiveLeadOf(o, po *Outline) bool {
	for _, a := range append([]string{o.Name}, o.Aliases...) {
		for _, b := range append([]string{po.Name}, po.Aliases...) {
			if strings.HasPrefix(b, a+"-") {
				return true
			}
		}
	}
	return false
}

func deviceIn(f *Family, ds []Device) bool {
	for _, d := range ds {
		if f.Device == d {
			return true
		}
	}
	return false
}

func containsV(vs []float64, v float64) bool {
	for _, x := range vs {
		if math.Abs(x-v) < 1e-6 {
			return true
		}
	}
	return false
}

func uniqueSorted(vs []float64) []float64 {
	var out []float64
	for _, v := range vs {
		if !containsV(out, v) {
			out = append(out, v)
		}
	}
	for i := 1; i < len(out); i++ {
		for j := i; j > 0 && out[j] < out[j-1]; j-- {
			out[j], out[j-1] = out[j-1], out[j]
		}
	}
	return out
}

func nonEmpty(ss ...string) []string {
	var out []string
	for _, s := range ss {
		if s != "" {
			out = append(out, s)
		}
	}
	return out
}

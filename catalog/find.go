package catalog

import (
	"fmt"
	"sort"
	"strings"
	"unicode"

	"github.com/sahilm/fuzzy"
)

// StripWildcards returns s without its ? and * characters.
func StripWildcards(s string) string {
	return strings.Map(func(r rune) rune {
		if r == '?' || r == '*' {
			return -1
		}
		return r
	}, s)
}

// VoltageToken stands in a fixed family's marking for the voltage code.
const VoltageToken = "{VV}"

// Hit is one family found by [Find].
type Hit struct {
	// Family is the family found.
	Family *Family
	// How is "wildcard" (a marking pattern and the query can read the same)
	// or "fuzzy" (the query's legible characters appear, in order, in a pattern).
	How string
	// Pattern is the catalog pattern that matched, as written in the catalog.
	Pattern string
	// Expanded is the pattern with the voltage code filled in ("" when the
	// pattern has no code).
	Expanded string
	// VoutV lists the output voltages whose code matched (fixed families); empty
	// when the marking says nothing about the voltage.
	VoutV []float64
	// Score orders hits of the same kind: for wildcard hits the number of
	// legible characters of the query the pattern confirms ([Agreement]), for
	// fuzzy hits the fuzzy score.
	Score int
	// Detail says in words what matched.
	Detail string
}

// NormalizeMarking upper-cases a marking and drops spaces, dashes, dots and
// slashes, keeping letters, digits and the wildcards ? and *.
func NormalizeMarking(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch {
		case r == '?' || r == '*':
			b.WriteRune(r)
		case r < unicode.MaxASCII && (unicode.IsLetter(r) || unicode.IsDigit(r)):
			b.WriteRune(unicode.ToUpper(r))
		}
	}
	return b.String()
}

// Legible reports whether a normalised marking has at least one character
// that is not a wildcard.
func Legible(s string) bool {
	return strings.Trim(s, "?*") != "" && strings.ContainsFunc(s, func(r rune) bool { return r != '?' && r != '*' })
}

func checkPattern(p string, fixed bool) error {
	if p == "" {
		return fmt.Errorf("empty marking pattern; remove it")
	}
	if strings.Contains(p, VoltageToken) && !fixed {
		return fmt.Errorf("pattern %q uses %s, which only fixed families have", p, VoltageToken)
	}
	rest := strings.ReplaceAll(p, VoltageToken, "")
	for _, r := range rest {
		if !(r == '?' || r == '*' || r == '-' || r == '.' || r == '/' || (r < unicode.MaxASCII && (unicode.IsLetter(r) || unicode.IsDigit(r)))) {
			return fmt.Errorf("pattern %q: %q is not allowed (letters, digits, ?, * and %s only)", p, string(r), VoltageToken)
		}
	}
	return nil
}

// Compatible reports whether two wildcard patterns (? = one character,
// * = any run) can describe the same string. Both should be normalised.
func Compatible(p, q string) bool {
	_, ok := Agreement(p, q)
	return ok
}

// Agreement returns, for two compatible wildcard patterns, the greatest number
// of literal characters of p that can be read against literal characters of q
// in a string both describe: how much of the legible marking q the pattern p
// confirms. ok is false when no string fits both.
func Agreement(p, q string) (n int, ok bool) {
	a, b := []rune(p), []rune(q)
	la, lb := len(a), len(b)
	const none = -1
	// m[i][j]: best agreement of a[i:] and b[j:], or none.
	m := make([][]int, la+1)
	for i := range m {
		m[i] = make([]int, lb+1)
	}
	best := func(x, y int) int {
		if x > y {
			return x
		}
		return y
	}
	m[la][lb] = 0
	for j := lb - 1; j >= 0; j-- {
		m[la][j] = none
		if b[j] == '*' {
			m[la][j] = m[la][j+1]
		}
	}
	for i := la - 1; i >= 0; i-- {
		m[i][lb] = none
		if a[i] == '*' {
			m[i][lb] = m[i+1][lb]
		}
		for j := lb - 1; j >= 0; j-- {
			switch {
			case a[i] == '*':
				m[i][j] = best(m[i+1][j], m[i][j+1])
			case b[j] == '*':
				m[i][j] = best(m[i][j+1], m[i+1][j])
			case a[i] == b[j] || a[i] == '?' || b[j] == '?':
				m[i][j] = none
				if r := m[i+1][j+1]; r != none {
					if a[i] != '?' && b[j] != '?' {
						r++
					}
					m[i][j] = r
				}
			default:
				m[i][j] = none
			}
		}
	}
	if m[0][0] == none {
		return 0, false
	}
	return m[0][0], true
}

// Expansion is one marking pattern with the voltage code filled in.
type Expansion struct {
	Pattern  string  // as written in the catalog
	Expanded string  // normalised, code filled in
	VoutV    float64 // the voltage whose code was filled in; 0 when the pattern has none
}

// Expand returns the normalised patterns of a family, one per output voltage
// for patterns with the voltage code.
func (f *Family) Expand() []Expansion {
	var out []Expansion
	for _, m := range f.Markings {
		if strings.Contains(m, VoltageToken) {
			for _, v := range f.OutputsV {
				out = append(out, Expansion{m, NormalizeMarking(strings.ReplaceAll(m, VoltageToken, VoltageCode(v))), v})
			}
			continue
		}
		out = append(out, Expansion{m, NormalizeMarking(m), 0})
	}
	return out
}

// MatchMarking returns the best wildcard match of query against the family's
// patterns, considering only expansions for vout when vout > 0. ok is false
// when no pattern is compatible.
func (f *Family) MatchMarking(query string, vout float64) (Expansion, bool) {
	e, _, ok := BestMatch(f.Expand(), NormalizeMarking(query), vout)
	return e, ok
}

// BestMatch is [Family.MatchMarking] on expansions already made and a
// normalised query; it also returns the [Agreement] of the match.
func BestMatch(exps []Expansion, q string, vout float64) (Expansion, int, bool) {
	best, bestN, found := Expansion{}, 0, false
	for _, e := range exps {
		if vout > 0 && e.VoutV > 0 && abs(e.VoutV-vout) > 1e-6 {
			continue
		}
		if n, ok := Agreement(e.Expanded, q); ok && (!found || n > bestN) {
			best, bestN, found = e, n, true
		}
	}
	return best, bestN, found
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

// Find returns the families whose markings fit the partial marking query,
// best first: wildcard matches (those confirming more legible characters
// first, then more common families), then fuzzy matches of the legible characters. A query with no
// legible character finds nothing.
func Find(c *Catalog, query string) []Hit {
	q := NormalizeMarking(query)
	if !Legible(q) {
		return nil
	}
	var hits []Hit
	matched := map[string]bool{}
	for _, f := range c.Sorted() {
		var best *Hit
		for _, e := range f.Expand() {
			s, ok := Agreement(e.Expanded, q)
			if !ok {
				continue
			}
			if best != nil && s < best.Score {
				continue
			}
			if best != nil && s == best.Score && best.Pattern == e.Pattern {
				if e.VoutV > 0 {
					best.VoutV = append(best.VoutV, e.VoutV)
				}
				continue
			}
			if best == nil || s > best.Score {
				h := Hit{Family: f, How: "wildcard", Pattern: e.Pattern, Score: s}
				if e.VoutV > 0 {
					h.Expanded, h.VoutV = e.Expanded, []float64{e.VoutV}
				}
				best = &h
			}
		}
		if best != nil {
			best.Detail = wildcardDetail(best, q)
			hits = append(hits, *best)
			matched[f.ID] = true
		}
	}
	sort.SliceStable(hits, func(i, j int) bool {
		if hits[i].Score != hits[j].Score {
			return hits[i].Score > hits[j].Score
		}
		return hits[i].Family.Commonness > hits[j].Family.Commonness
	})
	lit := StripWildcards(q)
	if len(lit) < 2 {
		return hits
	}
	var targets []string
	var owners []*Family
	var pats []string
	for _, f := range c.Sorted() {
		if matched[f.ID] {
			continue
		}
		for _, m := range f.Markings {
			t := StripWildcards(NormalizeMarking(strings.ReplaceAll(m, VoltageToken, "")))
			if t == "" {
				continue
			}
			targets, owners, pats = append(targets, t), append(owners, f), append(pats, m)
		}
	}
	seen := map[string]bool{}
	var fz []Hit
	for _, m := range fuzzy.Find(lit, targets) {
		f := owners[m.Index]
		if seen[f.ID] {
			continue
		}
		seen[f.ID] = true
		fz = append(fz, Hit{Family: f, How: "fuzzy", Pattern: pats[m.Index], Score: m.Score,
			Detail: fmt.Sprintf("the legible characters %q appear in order in %q (fuzzy score %d)", lit, m.Str, m.Score)})
	}
	sort.SliceStable(fz, func(i, j int) bool { return fz[i].Score > fz[j].Score })
	return append(hits, fz...)
}

func wildcardDetail(h *Hit, q string) string {
	p := h.Pattern
	if h.Expanded != "" {
		p = fmt.Sprintf("%s (as %s)", h.Pattern, h.Expanded)
	}
	s := fmt.Sprintf("%q and marking pattern %s can read the same", q, p)
	if len(h.VoutV) > 0 {
		var vs []string
		for _, v := range h.VoutV {
			vs = append(vs, fmt.Sprintf("%g V", v))
		}
		s += "; voltage code gives " + strings.Join(vs, ", ")
	}
	return s
}

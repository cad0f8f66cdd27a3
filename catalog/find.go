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

// Hit is one family found by [Find] or [DecodeMarking].
type Hit struct {
	// Family is the family found.
	Family *Family
	// How is "wildcard" (the marking decodes as one of the family's patterns:
	// prefix, number, suffix), "prefix" (a transistor type prefix names the
	// kind of part) or "fuzzy" (the legible characters appear, in order, in a
	// pattern).
	How string
	// Pattern is the catalog pattern that matched, as written in the catalog
	// (the transistor prefix for "prefix" hits).
	Pattern string
	// Expanded is the pattern with the voltage code filled in ("" when the
	// pattern has no code).
	Expanded string
	// VoutV lists the output voltages the marking says (from the voltage code
	// in the number or in the suffix); empty when it says nothing about them.
	VoutV []float64
	// Outline is the package the suffix names ("" when it names none).
	Outline string
	// Score orders hits: for wildcard hits the characters of the number the
	// marking confirms (a look-alike character counts half), less the cost
	// of letters the prefix and suffix tables do not explain and of a
	// voltage or package the family does not have; for prefix hits the
	// letters of the transistor prefix; for fuzzy hits the fuzzy score.
	Score float64
	// Detail says in words how the marking was read.
	Detail string
}

// Fits reports whether the hit agrees with one variant of its family: the
// decoded voltages include vout (or say nothing, or vout is 0), and the
// decoded outline is o, by name or alias (or none was decoded, or o is nil).
func (h *Hit) Fits(o *Outline, vout float64) (voltOK, outlineOK bool) {
	voltOK = len(h.VoutV) == 0 || vout == 0 || containsV(h.VoutV, vout)
	outlineOK = h.Outline == "" || o == nil || strings.EqualFold(h.Outline, o.Name)
	if o != nil && !outlineOK {
		for _, a := range o.Aliases {
			if strings.EqualFold(a, h.Outline) {
				outlineOK = true
			}
		}
	}
	return voltOK, outlineOK
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

// Find returns the families a partial marking can be, best first: the
// decoded hits of [DecodeMarking], then fuzzy matches of the legible
// characters for families the decoder did not find (none for a transistor
// number). A query with no legible character finds nothing.
func Find(c *Catalog, query string) []Hit {
	if !Legible(NormalizeMarking(query)) {
		return nil
	}
	d := DecodeMarking(c, query)
	hits := d.Hits
	if d.Transistor != "" {
		return hits
	}
	return append(hits, fuzzyHits(c, query, hits)...)
}

// fuzzyHits finds families not yet found whose markings hold the legible
// characters of query in order.
func fuzzyHits(c *Catalog, query string, found []Hit) []Hit {
	lit := StripWildcards(NormalizeMarking(query))
	if len(lit) < 2 {
		return nil
	}
	matched := map[string]bool{}
	for _, h := range found {
		matched[h.Family.ID] = true
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
		fz = append(fz, Hit{Family: f, How: "fuzzy", Pattern: pats[m.Index], Score: float64(m.Score),
			Detail: fmt.Sprintf("read loosely: the legible characters %q appear in order in %q (fuzzy score %d)", lit, m.Str, m.Score)})
	}
	sort.SliceStable(fz, func(i, j int) bool { return fz[i].Score > fz[j].Score })
	return fz
}

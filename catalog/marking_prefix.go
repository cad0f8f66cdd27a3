package catalog

import (
	"fmt"
	"strings"
)

// transistorPrefix returns the transistor prefix q opens with (after a logo
// read as letters), followed by a digit, or "".
func transistorPrefix(q []byte) string {
	s := string(q)
	try := func(s string) string {
		best := ""
		for p := range transistorPrefixes {
			if len(s) > len(p) && strings.HasPrefix(s, p) && s[len(p)] >= '0' && s[len(p)] <= '9' && len(p) > len(best) {
				best = p
			}
		}
		return best
	}
	if p := try(s); p != "" {
		return p
	}
	for _, l := range logos {
		if strings.HasPrefix(s, l) {
			if p := try(s[len(l):]); p != "" {
				return p
			}
		}
	}
	return ""
}

// prefixRead is how the letters before a family's number read.
type prefixRead struct {
	ok    bool
	maker string  // the maker prefix recognised ("LM"), "" when none
	known int     // characters a logo or maker prefix explains
	cost  float64 // unknown letters
	text  string
}

// readPrefix reads the characters before the number: empty, a logo, a
// maker's prefix, or a few unknown letters. Digits are never a prefix (the
// number would then be another one: 2N6338 is not a 338).
func readPrefix(p []byte) prefixRead {
	if len(p) == 0 {
		return prefixRead{ok: true}
	}
	if i := strings.LastIndexByte(string(p), '*'); i >= 0 {
		// Whatever the star stands for, the rest must still be letters.
		r := readPrefix(p[i+1:])
		r.cost = 0
		return r
	}
	for _, c := range p {
		if c >= '0' && c <= '9' {
			if _, known := makerPrefixes[string(p)]; !known {
				return prefixRead{}
			}
		}
	}
	s := string(p)
	if m, ok := matchMaker(s); ok {
		return prefixRead{ok: true, maker: m, text: "maker " + s, known: len(s)}
	}
	for _, l := range logos {
		if strings.HasPrefix(s, l) {
			rest := s[len(l):]
			if rest == "" {
				return prefixRead{ok: true, text: "logo " + l, known: len(l)}
			}
			if m, ok := matchMaker(rest); ok {
				return prefixRead{ok: true, maker: m, text: "logo " + l + ", maker " + rest, known: len(s)}
			}
		}
	}
	if len(p) > maxUnknownPrefix {
		return prefixRead{}
	}
	n := 0
	for _, c := range p {
		if c != '?' {
			n++
		}
	}
	return prefixRead{ok: true, cost: unknownPrefixCost * float64(n), text: fmt.Sprintf("unknown prefix %s", s)}
}

// matchMaker finds the maker prefix s spells, ? standing for any letter.
// fits is true when some maker prefix fits; a prefix with ? names the maker
// only when it has a legible letter and one maker fits.
func matchMaker(s string) (maker string, fits bool) {
	if _, ok := makerPrefixes[s]; ok {
		return s, true
	}
	if !strings.Contains(s, "?") || strings.Trim(s, "?") == "" {
		return "", false
	}
	found, n := "", 0
	for m := range makerPrefixes {
		if len(m) != len(s) {
			continue
		}
		fit := true
		for i := range s {
			if s[i] != '?' && s[i] != m[i] {
				fit = false
				break
			}
		}
		if fit {
			found, n = m, n+1
		}
	}
	if n != 1 {
		found = ""
	}
	return found, n > 0
}

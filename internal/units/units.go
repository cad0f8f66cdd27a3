// Package units parses the numbers a bench technician writes: plain decimals,
// SI prefixes ("2200u", "4.7k", "330m") and the IEC 60062 RKM code, in which the
// prefix letter stands in for the decimal point ("4k7", "0R22", "2u2", "R47").
//
// One parser serves command-line flags and evidence files, so that "4k7" means
// the same thing wherever it is typed.
//
// # Prefixes
//
//	p 1e-12   n 1e-9   u µ 1e-6   m 1e-3   R r 1 (RKM decimal mark only)
//	k K 1e3   M 1e6    G 1e9
//
// "m" is milli and "M" is mega, as in the SI; "k" and "K" are both kilo, as
// IEC 60062 writes "4K7" for resistors.
package units

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// ErrSyntax reports a string that is not a number with an optional prefix and unit.
var ErrSyntax = errors.New("not a number")

var prefixes = map[rune]float64{
	'p': 1e-12, 'n': 1e-9, 'u': 1e-6, 'µ': 1e-6, 'μ': 1e-6, 'm': 1e-3,
	'R': 1, 'r': 1, 'k': 1e3, 'K': 1e3, 'M': 1e6, 'G': 1e9,
}

// unitWords lists the unit spellings accepted after a number, by SI symbol.
var unitWords = map[string][]string{
	"V":   {"volts", "volt", "v"},
	"A":   {"amps", "amp", "a"},
	"Ω":   {"ohms", "ohm", "Ω", "ω"},
	"F":   {"farads", "farad", "f"},
	"Hz":  {"hz"},
	"W":   {"watts", "watt", "w"},
	"s":   {"s"},
	"°C":  {"°c", "degc", "c"},
	"mm":  {"mm"},
	"C/W": {"°c/w", "c/w", "k/w"},
}

// Parse returns the value of s in SI base units. unit is the SI symbol the
// caller expects ("V", "A", "Ω", "F", "Hz", "W", "°C", "mm", "C/W" or "" for a
// plain number); a matching unit word after the number is accepted and dropped.
// A bare number is returned as it is. The result is always finite.
//
// Parse returns an error wrapping [ErrSyntax] for anything else, including
// "NaN" and "Inf".
func Parse(s, unit string) (float64, error) {
	v, _, err := parse(s, unit)
	return v, err
}

// ParseIn returns the value of s expressed in a unit that is scale times the
// SI unit (for example scale = 1e-6 for a field in microfarads). A bare number
// is taken to be in that unit already: ParseIn("2200", "F", 1e-6) is 2200, and
// so is ParseIn("2200u", "F", 1e-6) and ParseIn("2m2", "F", 1e-6).
func ParseIn(s, unit string, scale float64) (float64, error) {
	v, marked, err := parse(s, unit)
	if err != nil {
		return 0, err
	}
	if !marked {
		return v, nil
	}
	return v / scale, nil
}

// parse returns the value and whether it carried a prefix or a unit word.
func parse(s, unit string) (float64, bool, error) {
	orig := s
	s = strings.TrimSpace(normalize.Replace(s))
	if s == "" {
		return 0, false, fmt.Errorf("%w: empty string", ErrSyntax)
	}
	switch strings.ToLower(strings.TrimLeft(s, "+-")) {
	case "nan", "inf", "infinity":
		return 0, false, fmt.Errorf("%w: %q is not a finite number", ErrSyntax, orig)
	}
	marked := false
	if rest, ok := trimUnit(s, unit); ok {
		s, marked = rest, true
	}
	if s == "" {
		return 0, false, fmt.Errorf("%w: %q has a unit but no number", ErrSyntax, orig)
	}
	s = joinPrefix(s)
	mult := 1.0
	// Find the first letter that is not part of a decimal exponent.
	idx := -1
	runes := []rune(s)
	for i, r := range runes {
		if unicode.IsLetter(r) {
			if (r == 'e' || r == 'E') && i > 0 && unicode.IsDigit(runes[i-1]) && i+1 < len(runes) &&
				(unicode.IsDigit(runes[i+1]) || runes[i+1] == '-' || runes[i+1] == '+') {
				continue
			}
			idx = i
			break
		}
	}
	num := s
	if idx >= 0 {
		p, ok := prefixes[runes[idx]]
		if !ok {
			return 0, false, fmt.Errorf("%w: %q: unknown prefix %q (use p n u m k M G, or R as the decimal mark)", ErrSyntax, orig, string(runes[idx]))
		}
		before, after := string(runes[:idx]), string(runes[idx+1:])
		if after != "" {
			if strings.ContainsAny(before, ".eE") || strings.ContainsAny(after, ".+-eE") {
				return 0, false, fmt.Errorf("%w: %q: an RKM code like 4k7 has no other decimal point", ErrSyntax, orig)
			}
			for _, r := range after {
				if !unicode.IsDigit(r) {
					return 0, false, fmt.Errorf("%w: %q", ErrSyntax, orig)
				}
			}
			if before == "" || before == "-" || before == "+" {
				before += "0"
			}
			num = before + "." + after
		} else {
			num = before
		}
		mult = p
		marked = true
	}
	if num == "" || strings.ContainsAny(num, "_") {
		return 0, false, fmt.Errorf("%w: %q", ErrSyntax, orig)
	}
	for _, r := range num {
		if !(unicode.IsDigit(r) || r == '.' || r == '-' || r == '+' || r == 'e' || r == 'E') {
			return 0, false, fmt.Errorf("%w: %q", ErrSyntax, orig)
		}
	}
	f, err := strconv.ParseFloat(num, 64)
	if err != nil {
		return 0, false, fmt.Errorf("%w: %q", ErrSyntax, orig)
	}
	f *= mult
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return 0, false, fmt.Errorf("%w: %q is out of range", ErrSyntax, orig)
	}
	return f, marked, nil
}

// normalize maps the look-alike characters a printed value may carry to the
// ones the parser knows: the minus sign (U+2212) to "-", the ohm sign
// (U+2126) to the Greek capital omega, the Greek small mu to the micro sign.
var normalize = strings.NewReplacer("\u2212", "-", "\u2126", "Ω", "μ", "µ")

// joinPrefix removes the spaces between a number and its prefix letter
// ("4.7 k" → "4.7k"), so that printed values such as "4.7 kΩ" read back.
func joinPrefix(s string) string {
	i := strings.IndexFunc(s, unicode.IsSpace)
	if i < 0 {
		return s
	}
	rest := strings.TrimLeftFunc(s[i:], unicode.IsSpace)
	r, _ := utf8.DecodeRuneInString(rest)
	if _, ok := prefixes[r]; ok && len(rest) == utf8.RuneLen(r) && r != 'R' && r != 'r' {
		return s[:i] + rest
	}
	return s
}

// trimUnit removes a trailing unit word for unit from s.
func trimUnit(s, unit string) (string, bool) {
	words := unitWords[unit]
	low := strings.ToLower(s)
	if len(low) != len(s) {
		return s, false
	}
	for _, w := range words {
		if strings.HasSuffix(low, w) {
			rest := strings.TrimSpace(s[:len(s)-len(w)])
			if rest == "" {
				return s, false
			}
			return rest, true
		}
	}
	return s, false
}

// Format writes v (in SI base units) with an SI prefix and the unit symbol,
// to three significant figures: Format(4700, "Ω") is "4.7 kΩ".
func Format(v float64, unit string) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return strconv.FormatFloat(v, 'g', 3, 64) + " " + unit
	}
	type pre struct {
		s string
		m float64
	}
	steps := []pre{{"G", 1e9}, {"M", 1e6}, {"k", 1e3}, {"", 1}, {"m", 1e-3}, {"µ", 1e-6}, {"n", 1e-9}, {"p", 1e-12}}
	a := math.Abs(v)
	for _, p := range steps {
		if a >= p.m*0.9995 {
			return strconv.FormatFloat(v/p.m, 'g', 3, 64) + " " + p.s + unit
		}
	}
	return strconv.FormatFloat(v, 'g', 3, 64) + " " + unit
}

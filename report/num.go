package report

import (
	"math"
	"strconv"
	"strings"
)

// meterCounts is the display range of the meter whose resolution numbers are
// rounded to: a 4000-count (3¾-digit) handheld multimeter, the common bench
// instrument (common practice, no source). 12.15 V shows as 12.15 V, 3.9994
// V as 3.999 V, 5.0013 V as 5 V (5.00 V on the 40 V range), 48.77 V as 48.8 V.
const meterCounts = 4000

// prefix is an SI prefix and its multiplier.
type prefix struct {
	sym  string
	mul  float64
	from float64 // the smallest magnitude written with it; 0: mul
}

var (
	allPrefixes = []prefix{{"G", 1e9, 0}, {"M", 1e6, 0}, {"k", 1e3, 0}, {"", 1, 0}, {"m", 1e-3, 0}, {"µ", 1e-6, 0}, {"n", 1e-9, 0}, {"p", 1e-12, 0}}
	// Capacitors are written in µF, nF and pF by the trade, never mF
	// (2200 µF, not 2.2 mF); farads themselves for supercapacitors.
	capPrefixes = []prefix{{"", 1, 0.1}, {"µ", 1e-6, 0}, {"n", 1e-9, 0}, {"p", 1e-12, 0}}
)

// prefixed lists the units written with SI prefixes; every other unit (°C,
// °C/W, %) is written as it is.
var prefixed = map[string][]prefix{
	"V": allPrefixes, "A": allPrefixes, "Ω": allPrefixes, "W": allPrefixes, "Hz": allPrefixes,
	"s": allPrefixes, "F": capPrefixes, "V p-p": allPrefixes, "V rms": allPrefixes, "A rms": allPrefixes,
}

// Num writes v (in SI base units: volts, amperes, ohms, farads, watts,
// hertz, seconds; or degrees Celsius, °C/W, percent) with the unit and, for
// the units that take one, an SI prefix, rounded to a 4000-count meter's
// resolution and without trailing zeros: Num(4700, "Ω") is "4.7 kΩ",
// Num(0.45, "A") is "450 mA", Num(2.2e-3, "F") is "2200 µF", Num(-15.02,
// "V") is "-15.02 V". The text parses back with the units package. NaN
// and infinities are written as "unknown". An empty unit writes the bare
// number.
func Num(v float64, unit string) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "unknown"
	}
	s, p := mantissa(v, prefixed[unit])
	if unit == "" && p == "" {
		return s
	}
	return s + " " + p + unit
}

// Signed is [Num] with an explicit + on positive values ("+5 V", "-15 V",
// "0 V").
func Signed(v float64, unit string) string {
	s := Num(v, unit)
	if v > 0 && !strings.HasPrefix(s, "0 ") && s != "0" {
		return "+" + s
	}
	return s
}

// Percent writes a fraction as a percentage ("12.5 %").
func Percent(frac float64) string { return Num(100*frac, "%") }

// mantissa picks a prefix from ps (none when ps is empty) and rounds.
func mantissa(v float64, ps []prefix) (string, string) {
	a := math.Abs(v)
	p := prefix{"", 1, 0}
	if a != 0 && len(ps) > 0 {
		p = ps[len(ps)-1]
		for _, q := range ps {
			from := q.from
			if from == 0 {
				// 0.9995 so that 999.96 m rounds up into the next prefix.
				from = q.mul * 0.9995
			}
			if a >= from {
				p = q
				break
			}
		}
	}
	m := v / p.mul
	if len(ps) == 0 {
		return format(m, 3, 2), ""
	}
	if a != 0 && p.mul == ps[0].mul && math.Abs(m) >= 1000 {
		return format(m, 4, 0), p.sym // beyond the largest prefix
	}
	return format(m, 0, 3), p.sym
}

// format rounds m. With sig > 0 it keeps sig significant figures (at most
// maxDec decimals); with sig == 0 it keeps as many decimals (at most
// maxDec) as a 4000-count display shows for m.
func format(m float64, sig, maxDec int) string {
	a := math.Abs(m)
	dec := 0
	if sig > 0 {
		if a > 0 {
			dec = sig - 1 - int(math.Floor(math.Log10(a)))
		}
	} else {
		for dec < maxDec && math.Round(a*math.Pow(10, float64(dec+1))) < meterCounts {
			dec++
		}
	}
	dec = min(max(dec, 0), maxDec)
	s := strconv.FormatFloat(m, 'f', dec, 64)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	if s == "-0" {
		s = "0"
	}
	return s
}

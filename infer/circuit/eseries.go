package circuit

import (
	"fmt"
	"math"
	"sort"
	"strings"
)

// IEC 60063 preferred-number series, one decade each, as the standard
// tabulates them. E24 and E12 are written out because several members
// (2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2) are not rounded geometric steps.
var (
	E12 = []float64{1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2}
	E24 = []float64{1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1}
	E48 = []float64{1.00, 1.05, 1.10, 1.15, 1.21, 1.27, 1.33, 1.40, 1.47, 1.54, 1.62, 1.69, 1.78, 1.87, 1.96, 2.05,
		2.15, 2.26, 2.37, 2.49, 2.61, 2.74, 2.87, 3.01, 3.16, 3.32, 3.48, 3.65, 3.83, 4.02, 4.22, 4.42, 4.64, 4.87,
		5.11, 5.36, 5.62, 5.90, 6.19, 6.49, 6.81, 7.15, 7.50, 7.87, 8.25, 8.66, 9.09, 9.53}
	E96 = []float64{1.00, 1.02, 1.05, 1.07, 1.10, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.30, 1.33, 1.37, 1.40, 1.43,
		1.47, 1.50, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74, 1.78, 1.82, 1.87, 1.91, 1.96, 2.00, 2.05, 2.10, 2.15, 2.21,
		2.26, 2.32, 2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.80, 2.87, 2.94, 3.01, 3.09, 3.16, 3.24, 3.32, 3.40,
		3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12, 4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23,
		5.36, 5.49, 5.62, 5.76, 5.90, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32, 7.50, 7.68, 7.87, 8.06,
		8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76}
)

// Series returns a copy of the decade table named "E12", "E24", "E48" or "E96".
func Series(name string) ([]float64, error) {
	switch strings.ToUpper(name) {
	case "E12":
		return append([]float64(nil), E12...), nil
	case "E24":
		return append([]float64(nil), E24...), nil
	case "E48":
		return append([]float64(nil), E48...), nil
	case "E96":
		return append([]float64(nil), E96...), nil
	}
	return nil, fmt.Errorf("unknown resistor series %q (use E12, E24, E48 or E96)", name)
}

// Values returns every member of the series from loOhm to hiOhm, ascending.
func Values(series []float64, loOhm, hiOhm float64) []float64 {
	var out []float64
	for dec := math.Floor(math.Log10(loOhm)) - 1; dec <= math.Ceil(math.Log10(hiOhm)); dec++ {
		m := math.Pow(10, dec)
		for _, v := range series {
			x := roundSig(v*m, 3)
			if x >= loOhm*(1-1e-9) && x <= hiOhm*(1+1e-9) {
				out = append(out, x)
			}
		}
	}
	sort.Float64s(out)
	return out
}

func roundSig(x float64, n int) float64 {
	if x == 0 {
		return 0
	}
	p := math.Pow(10, float64(n)-math.Ceil(math.Log10(math.Abs(x))))
	return math.Round(x*p) / p
}

// Nearest returns the members of values just below and just above x (equal
// to x when x is a member). values must be ascending; ok is false outside.
func Nearest(values []float64, x float64) (lo, hi float64, ok bool) {
	i := sort.SearchFloat64s(values, x)
	if i < len(values) && math.Abs(values[i]-x) <= 1e-9*x {
		return values[i], values[i], true
	}
	if i == 0 || i == len(values) {
		return 0, 0, false
	}
	return values[i-1], values[i], true
}

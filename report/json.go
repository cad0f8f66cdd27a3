package report

import (
	"encoding/json"
	"io"
	"math"
)

// Schema returns the schema name of a command's JSON document,
// "whichreg/<command>/v1"; command is the command path with spaces turned
// into dashes ("catalog-list", "calc-rectifier").
func Schema(command string) string { return "whichreg/" + command + "/v1" }

// WriteJSON writes v as indented JSON followed by a newline. v should be an
// output struct whose first field is the schema name.
func WriteJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// NonZero returns a pointer to x, or nil (JSON null: unknown) when x is
// zero (the zero value of a figure not given) or not finite.
func NonZero(x float64) *float64 {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return nil
	}
	return &x
}

// Sig rounds x to 6 significant figures, so that JSON does not carry a
// solver's last bits; zero, NaN and infinities are returned as they are.
func Sig(x float64) float64 {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return x
	}
	e := 5 - math.Floor(math.Log10(math.Abs(x)))
	var r float64
	if e >= 0 {
		p := math.Pow(10, e)
		r = math.Round(x*p) / p
	} else {
		q := math.Pow(10, -e)
		r = math.Round(x/q) * q
	}
	if math.IsNaN(r) || math.IsInf(r, 0) {
		return x
	}
	return r
}

package main

import (
	"io"
	"math"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/report"
)

// The helpers every JSON document of the commands shares: writing, and
// turning figures into JSON numbers (rounded, signed, null when unknown).

// writeJSON writes a JSON document (report.WriteJSON).
func writeJSON(w io.Writer, v any) error { return report.WriteJSON(w, v) }

// finite returns x rounded to digits decimals, or nil when x is not finite.
func finite(x float64, digits int) *float64 {
	if math.IsNaN(x) || math.IsInf(x, 0) {
		return nil
	}
	r := round(x, digits)
	return &r
}

// orNull returns nil for the empty string.
func orNull(s string) *string {
	if s == "" {
		return nil
	}
	return &s
}

// nonNil returns s, or an empty list for nil (JSON [] rather than null).
func nonNil[T any](s []T) []T {
	if s == nil {
		return []T{}
	}
	return s
}

// signedVout returns a hypothesis's output voltage with its sign
// (negative regulators below zero).
func signedVout(h infer.Hypothesis) float64 {
	if h.Family.Negative() {
		return -h.VoutV
	}
	return h.VoutV
}

// round rounds x to digits decimals.
func round(x float64, digits int) float64 {
	p := math.Pow(10, float64(digits))
	return math.Round(x*p) / p
}

// positive returns a pointer to x scaled, or nil when x is zero (not given).
func positive(x, scale float64) *float64 {
	if x == 0 {
		return nil
	}
	v := round(x*scale, 12)
	return &v
}

// sigPtr rounds *p to 6 significant figures; nil for nil or not finite.
func sigPtr(p *float64) *float64 {
	if p == nil || math.IsNaN(*p) || math.IsInf(*p, 0) {
		return nil
	}
	v := report.Sig(*p)
	return &v
}

package infer

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/internal/units"
)

// unitSpec names a unit for [Q]: its symbol and its size in SI base units.
type unitSpec interface {
	symbol() string
	scale() float64
}

type (
	volt       struct{}
	amp        struct{}
	ohm        struct{}
	microfarad struct{}
	hertz      struct{}
	fraction   struct{}
	millimetre struct{}
	celsius    struct{}
	cPerW      struct{}
)

func (volt) symbol() string       { return "V" }
func (volt) scale() float64       { return 1 }
func (amp) symbol() string        { return "A" }
func (amp) scale() float64        { return 1 }
func (ohm) symbol() string        { return "Ω" }
func (ohm) scale() float64        { return 1 }
func (microfarad) symbol() string { return "F" }
func (microfarad) scale() float64 { return 1e-6 }
func (hertz) symbol() string      { return "Hz" }
func (hertz) scale() float64      { return 1 }
func (fraction) symbol() string   { return "" }
func (fraction) scale() float64   { return 1 }
func (millimetre) symbol() string { return "mm" }
func (millimetre) scale() float64 { return 1 }
func (celsius) symbol() string    { return "°C" }
func (celsius) scale() float64    { return 1 }
func (cPerW) symbol() string      { return "C/W" }
func (cPerW) scale() float64      { return 1 }

// Q is an optional measured quantity in the unit U. V is the value in that
// unit (volts, amperes, ohms, microfarads, hertz, a fraction, millimetres,
// °C or °C/W); Set is false when the key was left out. In a file it may be a
// number or a string with an SI prefix or RKM code ("4k7", "2200u", "0R22").
type Q[U unitSpec] struct {
	V   float64 // the value in the unit U; 0 when not given
	Set bool    // the key was given
}

// Quantity types of the evidence file.
type (
	Volts       = Q[volt]
	Amps        = Q[amp]
	Ohms        = Q[ohm]
	Microfarads = Q[microfarad]
	Hertz       = Q[hertz]
	Fraction    = Q[fraction]
	Millimetres = Q[millimetre]
	Celsius     = Q[celsius]
	CPerW       = Q[cPerW]
)

// UnmarshalTOML decodes a number or a string with units.
func (q *Q[U]) UnmarshalTOML(v any) error {
	var u U
	switch x := v.(type) {
	case int64:
		q.V = float64(x)
	case float64:
		q.V = x
	case string:
		f, err := units.ParseIn(x, u.symbol(), u.scale())
		if err != nil {
			return err
		}
		q.V = f
	default:
		return fmt.Errorf("want a number or a string such as \"4k7\", got %T", v)
	}
	if math.IsNaN(q.V) || math.IsInf(q.V, 0) {
		return fmt.Errorf("%v is not a finite number", v)
	}
	q.Set = true
	return nil
}

// Or returns the value, or def when it was not given.
func (q Q[U]) Or(def float64) float64 {
	if q.Set {
		return q.V
	}
	return def
}

// MarshalJSON writes the value, or null when it was not given.
func (q Q[U]) MarshalJSON() ([]byte, error) {
	if !q.Set {
		return []byte("null"), nil
	}
	return []byte(fmt.Sprintf("%g", q.V)), nil
}

package infer_test

import (
	"errors"
	"fmt"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
)

// ParseVariant reads the ID[:OUTLINE[:VOUT]] form a technician types after
// --original or --choose; a family or outline the catalog lacks is an
// error matching ErrUnknownVariant.
func ExampleParseVariant() {
	c := builtin.Catalog()
	h, err := infer.ParseVariant(c, "79xx:TO-220:-12")
	fmt.Println(h.Label(), err)
	_, err = infer.ParseVariant(c, "78xx:TO-999")
	fmt.Println(errors.Is(err, infer.ErrUnknownVariant))
	// Output:
	// 79xx TO-220 -12 V <nil>
	// true
}

// OperatingPoint solves the rectifier of the evidence's [input] table at
// nominal mains and at its worst corners: the regulator's input is lowest
// at low mains, full load and a low filter capacitor.
func ExampleOperatingPoint() {
	ev, err := infer.LoadEvidence("psu.toml", []byte(`
[input]
rectifier = "bridge"
secondary_vrms = 12
filter_uf = 2200
mains_hz = 50
[output]
amps = 0.5
`), builtin.Catalog())
	if err != nil {
		fmt.Println(err)
		return
	}
	op, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepAll})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("source %s, nominal trough %.3g V\n", op.Source, op.Nominal.TroughV)
	fmt.Printf("worst trough %.3g V at %s\n", op.Trough.V, op.Trough.At)
	// Output:
	// source rectifier, nominal trough 12.5 V
	// worst trough 10.6 V at low mains, full load, low C
}

// Evidence built in Go (a second front end's form, say) is checked with
// Check before use, as LoadEvidence checks a file; Lead and Leads read the
// Pins map directly.
func ExampleEvidence_Check() {
	c := builtin.Catalog()
	ev := &infer.Evidence{
		File:    "form",
		Package: "TO-220",
		Pins: map[string]infer.PinEvidence{
			"1": {WiredTo: infer.WiredUnregulated, Volts: infer.Volts{V: 11.8, Set: true}},
			"3": {WiredTo: infer.WiredLoad, Volts: infer.Volts{V: 5.02, Set: true}},
		},
	}
	fmt.Println(ev.Check(c))
	p, _ := ev.Lead(3)
	fmt.Println(ev.Leads(), p.WiredTo, p.Volts.V)
	ev.Pins["7"] = infer.PinEvidence{WiredTo: infer.WiredGround}
	fmt.Println(ev.Check(c))
	// Output:
	// <nil>
	// [1 3] load 5.02
	// form: pins.7: lead 7: the package has only 3 leads (numbered by the convention 'whichreg catalog show' draws)
}

package record_test

import (
	"fmt"
	"time"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
	"github.com/whichreg/whichreg/record"
)

// Build assembles the record of one decision from the identification, the
// replacement checks and the part chosen; Guard refuses an unsuitable
// choice unless an override reason is given; WriteMarkdown and WriteJSON
// render it.
func ExampleBuild() {
	c := builtin.Catalog()
	src := []byte(`ref = "U7"
equipment = "workshop intercom, power board"
package = "TO-220"
[pins.1]
wired_to = "unregulated"
volts = 10.8
[pins.2]
wired_to = "ground"
[pins.3]
wired_to = "load"
volts = 5.02
[case]
tied_to_pin = 2
[output]
amps = 0.3
`)
	ev, _ := infer.LoadEvidence("u7.toml", src, c)
	res, _ := infer.Identify(c, ev, infer.Options{})
	orig, _ := infer.ChooseOriginal(res, nil)
	sres, _ := replace.Swap(c, ev, orig, replace.Options{})
	chosen := &sres.Replacements[0]
	if err := record.Guard(chosen, ""); err != nil {
		fmt.Println(err)
		return
	}
	rec := record.Build(record.Input{Catalog: c, Evidence: ev, EvidenceSource: src, Identification: res,
		Swap: sres, Chosen: chosen, Date: time.Date(2026, 3, 14, 0, 0, 0, 0, time.UTC), Tool: "whichreg example"})
	fmt.Println(rec.Ref, rec.Date)
	fmt.Println("original:", rec.Original.Family, rec.Original.Package)
	fmt.Println("chosen:", rec.Chosen.Family, rec.Chosen.Package, rec.Chosen.Verdict)
	fmt.Println("runners-up:", len(rec.RunnersUp) > 0)
	// Output:
	// U7 2026-03-14
	// original: 78xx TO-220
	// chosen: 78xx TO-220 drop-in
	// runners-up: true
}

package record_test

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"strings"
	"testing"
	"time"

	"github.com/google/go-cmp/cmp"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
	"github.com/whichreg/whichreg/record"
)

func TestBenchNotes(t *testing.T) {
	src := `# U4 on the bench supply: the fan was running during the readings
# and the lid was off.
# [pins.1]
# wired_to = "unregulated"
ref = "U4"   # silkscreen half gone
[pins.2]
volts = 5.01 # measured with the load on
marking = "A#7"   # the # in the marking is not a comment
#
[mount]
insulator = "mica" # cracked at one corner
# want: 78xx TO-220 5
# want: not-in-catalog
# expect: LFxx:TO-220 needs-work cout=work
# original: 337:TO-220
# shortfall: dropout value=1.2 limit=1.4
# expect: hum at low mains until the new part went in
# want: a spare fuse in the kit
# expect: 78xx 5 V (lifted by one diode)
# expect: 2 V more at low mains
`
	got := record.BenchNotes([]byte(src))
	want := []string{
		"U4 on the bench supply: the fan was running during the readings and the lid was off.",
		"ref: silkscreen half gone",
		"pins.2.volts: measured with the load on",
		"pins.2.marking: the # in the marking is not a comment",
		"mount.insulator: cracked at one corner",
		"expect: hum at low mains until the new part went in",
		"want: a spare fuse in the kit",
		"expect: 2 V more at low mains",
	}
	if d := cmp.Diff(want, got); d != "" {
		t.Errorf("BenchNotes (-want +got):\n%s", d)
	}
}

func FuzzBenchNotes(f *testing.F) {
	f.Add([]byte("# a note\nkey = \"x#y\" # tail\n[t]\nk = 1\n"))
	f.Add([]byte("#\n# k = 1\n[a.b] # table\n"))
	f.Fuzz(func(t *testing.T, src []byte) {
		for _, n := range record.BenchNotes(src) {
			if n == "" {
				t.Fatal("an empty note")
			}
		}
	})
}

// build makes a record of choice in the named swap case.
func build(t *testing.T, file, spec, choice, override string) (record.Record, *replace.Replacement, error) {
	t.Helper()
	c := builtin.Catalog()
	src, err := os.ReadFile(file)
	if err != nil {
		t.Fatal(err)
	}
	ev, err := infer.LoadEvidence(file, src, c)
	if err != nil {
		t.Fatal(err)
	}
	res, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		t.Fatal(err)
	}
	h, err := infer.ParseVariant(c, spec)
	if err != nil {
		t.Fatal(err)
	}
	orig, err := infer.ChooseOriginal(res, &h)
	if err != nil {
		t.Fatal(err)
	}
	sres, err := replace.Swap(c, ev, orig, replace.Options{All: true})
	if err != nil {
		t.Fatal(err)
	}
	want, _ := infer.ParseVariant(c, choice)
	for i := range sres.Replacements {
		r := &sres.Replacements[i]
		if r.Family == want.Family && r.Package == want.Package {
			if err := record.Guard(r, override); err != nil {
				return record.Record{}, r, err
			}
			return record.Build(record.Input{Catalog: c, Evidence: ev, EvidenceSource: src, Identification: res, Swap: sres,
				Chosen: r, Override: override, Date: time.Date(2026, 3, 14, 0, 0, 0, 0, time.UTC), Tool: "whichreg test"}), r, nil
		}
	}
	t.Fatalf("%s is not a candidate", choice)
	return record.Record{}, nil, nil
}

func TestGuardAndOverride(t *testing.T) {
	_, r, err := build(t, "../testdata/swap/adj-vin-max.toml", "317:TO-220", "317:TO-220", "")
	if !errors.Is(err, record.ErrUnsuitable) || !strings.Contains(err.Error(), "vin_max") {
		t.Fatalf("an unsuitable choice: %v; want ErrUnsuitable naming vin_max", err)
	}
	rec, _, err := build(t, "../testdata/swap/adj-vin-max.toml", "317:TO-220", "317:TO-220", "bench test only")
	if err != nil {
		t.Fatal(err)
	}
	var md bytes.Buffer
	if err := record.WriteMarkdown(&md, rec, record.Images{}); err != nil {
		t.Fatal(err)
	}
	s := md.String()
	if !strings.HasPrefix(strings.SplitN(s, "\n\n", 2)[1], "> **OVERRIDE") || !strings.Contains(s, "bench test only") {
		t.Errorf("no override banner at the top:\n%s", s[:300])
	}
	for _, ins := range r.Install {
		if strings.Contains(s, ins) {
			t.Errorf("an unsuitable part's install note is in the record: %s", ins)
		}
	}
}

func TestRecordContents(t *testing.T) {
	rec, _, err := build(t, "../testdata/swap/to3-to-to220.toml", "78xx:TO-3:5", "78xx:TO-220", "")
	if err != nil {
		t.Fatal(err)
	}
	if !rec.Chosen.Rewire || len(rec.Chosen.OrderCodes) < 2 {
		t.Errorf("TO-3 → TO-220: rewire %v, order codes %v", rec.Chosen.Rewire, rec.Chosen.OrderCodes)
	}
	// TO-3 can: 1 IN, 2 OUT, can GND (onsemi MC7800 TO-3); TO-220: IN GND OUT.
	want := []replace.Link{{New: 1, Old: 1, Fn: "IN"}, {New: 2, Old: 3, Fn: "GND"}, {New: 3, Old: 2, Fn: "OUT"}}
	if d := cmp.Diff(want, rec.Chosen.LeadMap); d != "" {
		t.Errorf("lead map (-want +got):\n%s", d)
	}
	var md bytes.Buffer
	_ = record.WriteMarkdown(&md, rec, record.Images{Pinout: "r-pinout.svg"})
	for _, s := range []string{"![old and new pinouts with the lead mapping](r-pinout.svg)", "new 2 (GND) → old pad 3", "Order codes"} {
		if !strings.Contains(md.String(), s) {
			t.Errorf("the record lacks %q", s)
		}
	}
	rec.Equipment = ""
	md.Reset()
	_ = record.WriteMarkdown(&md, rec, record.Images{})
	if strings.Contains(md.String(), "Equipment") {
		t.Error("an empty equipment is written as a row")
	}
	if rec.Conditions.HeatsinkCW == 0 && !strings.Contains(md.String(), "free air") {
		t.Error("no heat sink is not written as free air")
	}
	c := builtin.Catalog()
	oldH, _ := infer.ParseVariant(c, "78xx:TO-3:5")
	newH, _ := infer.ParseVariant(c, "78xx:TO-220")
	svg := string(record.PinoutSVG(oldH, newH))
	for _, s := range []string{"<svg", ">can<", ">GND<", "Old 78xx TO-3"} {
		if !strings.Contains(svg, s) {
			t.Errorf("the pinout drawing lacks %q", s)
		}
	}
}

func TestLowConfidenceWarning(t *testing.T) {
	rec, _, err := build(t, "../testdata/swap/why-same-part-80.toml", "78xx:TO-220:5", "78xx:TO-220", "")
	if err != nil {
		t.Fatal(err)
	}
	if len(rec.Warnings) != 0 {
		t.Errorf("a named original warns: %v", rec.Warnings)
	}
	if len(rec.BenchNotes) == 0 || !strings.Contains(strings.Join(rec.BenchNotes, " "), "80 %") {
		t.Errorf("the evidence file's comments are not carried: %v", rec.BenchNotes)
	}
}

func ExampleBenchNotes() {
	for _, n := range record.BenchNotes([]byte("# the fan was off\n[output]\namps = 0.4 # clamp meter\n")) {
		fmt.Println(n)
	}
	// Output:
	// the fan was off
	// output.amps: clamp meter
}

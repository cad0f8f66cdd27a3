package infer_test

import (
	"errors"
	"fmt"
	"testing"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/infer"
)

func TestParseVariant(t *testing.T) {
	c := builtin.Catalog()
	for _, tt := range []struct {
		spec    string
		label   string
		unknown bool
	}{
		{"78xx:TO-3:5", "78xx TO-3 5 V", false},
		{"79xx:TO-220:-12V", "79xx TO-220 -12 V", false}, // a sign and a unit are accepted; the rail keeps its sign
		{"317", "317 TO-220", false},
		{"78xx:TO-999", "", true},
		{"nosuch", "", true},
		{"78xx:TO-220:five", "", true},
		{"78xx:TO-220:NaN", "", true},
	} {
		h, err := infer.ParseVariant(c, tt.spec)
		if tt.unknown {
			if !errors.Is(err, infer.ErrUnknownVariant) {
				t.Errorf("%s: %v; want ErrUnknownVariant", tt.spec, err)
			}
			continue
		}
		if err != nil || h.Label() != tt.label {
			t.Errorf("%s: %q, %v; want %q", tt.spec, h.Label(), err, tt.label)
		}
	}
}

func FuzzParseVariant(f *testing.F) {
	c := builtin.Catalog()
	for _, s := range []string{"78xx:TO-3:5", "317", "79xx::-12", ":", "1117:SOT-223:3.3V"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, spec string) {
		h, err := infer.ParseVariant(c, spec)
		if err == nil && (h.Family == nil || h.Package == nil || !(h.VoutV >= 0 && h.VoutV <= 1000)) {
			t.Fatalf("%q: %+v without an error", spec, h)
		}
	})
}

func ExampleChooseOriginal() {
	c := builtin.Catalog()
	ev, _ := infer.LoadEvidence("u1.toml", []byte("package = \"TO-220\"\n[pins.1]\nwired_to = \"unregulated\"\nvolts = 11.5\n[pins.2]\nwired_to = \"ground\"\n[pins.3]\nwired_to = \"load\"\nvolts = 5.0\n"), c)
	res, _ := infer.Identify(c, ev, infer.Options{})
	named, _ := infer.ParseVariant(c, "78xx:TO-220")
	o, _ := infer.ChooseOriginal(res, &named)
	fmt.Println(o.Label(), o.Named)
	// Output: 78xx TO-220 5 V true
}

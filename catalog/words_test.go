package catalog_test

import (
	"encoding"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/catalog"
)

// TestWords checks that every vocabulary type takes its own words back from
// its text and refuses others, naming the allowed words.
func TestWords(t *testing.T) {
	type word interface {
		encoding.TextUnmarshaler
		encoding.TextMarshaler
	}
	cases := []struct {
		name   string
		new    func() word
		good   []string
		bad    string
		allows string // a word the refusal must list
	}{
		{"polarity", func() word { return new(catalog.Polarity) }, []string{"positive", "negative"}, "neg", `"negative"`},
		{"kind", func() word { return new(catalog.Kind) }, []string{"fixed", "adjustable", "non-regulator"}, "transistor", `"non-regulator"`},
		{"pass", func() word { return new(catalog.Pass) }, []string{"", "npn", "npn-ldo", "pnp", "switching"}, "nmos", `"npn-ldo"`},
		{"status", func() word { return new(catalog.Status) }, []string{"", "active", "obsolete", "scarce"}, "discontinued", `"scarce"`},
		{"device", func() word { return new(catalog.Device) }, []string{"", "npn", "pnp-darlington", "shunt-ref", "buck"}, "triode", `"nmos"`},
		{"lead function", func() word { return new(catalog.Pin) }, []string{"IN", "none", "SENSE", "B", "REF", "K"}, "VIN", `"GND"`},
	}
	for _, c := range cases {
		for _, g := range c.good {
			w := c.new()
			if err := w.UnmarshalText([]byte(g)); err != nil {
				t.Errorf("%s %q: %v", c.name, g, err)
				continue
			}
			if back, _ := w.MarshalText(); string(back) != g {
				t.Errorf("%s %q comes back as %q", c.name, g, back)
			}
		}
		err := c.new().UnmarshalText([]byte(c.bad))
		if err == nil || !strings.Contains(err.Error(), c.name) || !strings.Contains(err.Error(), c.allows) {
			t.Errorf("%s %q: got error %v, want one naming the %s and listing %s", c.name, c.bad, err, c.name, c.allows)
		}
	}
	if err := new(catalog.Kind).UnmarshalText(nil); err == nil {
		t.Error("an empty kind was accepted")
	}
}

// TestDevicePolarity pins the polarity each device declares.
func TestDevicePolarity(t *testing.T) {
	for _, d := range catalog.Devices() {
		want := catalog.Positive
		switch d {
		case catalog.DevicePNP, catalog.DevicePNPDarlington, catalog.DevicePMOS:
			want = catalog.Negative
		}
		if got := d.Polarity(); got != want {
			t.Errorf("%s: polarity %s, want %s", d, got, want)
		}
	}
}

package guide

import (
	"testing"

	"github.com/whichreg/whichreg/catalog/builtin"
)

// FuzzReply types any lines into a session: it must never panic, and every
// document it saves must load with the evidence loader.
func FuzzReply(f *testing.F) {
	for _, seed := range []string{
		"pins.3.volts = 5.02", "gro", "skip", "back", "list", "1", "why", "help",
		"output.amps = 450m", "pins.9.volts = 3", "case.tied_to_pin = 2", `marking = "?M3?7"`,
		"pins.1.wired_to = nowhere", "year = 1983", "outline.metal_can = yes", "=", "pins = 3",
	} {
		f.Add(seed, "12.1")
	}
	id := Infer{Catalog: builtin.Catalog()}
	f.Fuzz(func(t *testing.T, a, b string) {
		var bad error
		s, err := New(id, "u7.toml", []byte(start), Options{Save: func(name string, doc []byte) error {
			if _, err := id.Rank(name, doc); err != nil {
				bad = err
			}
			return nil
		}})
		if err != nil {
			t.Fatal(err)
		}
		for _, line := range []string{a, b, a} {
			if _, err := s.Reply(line); err != nil {
				t.Fatal(err)
			}
			if bad != nil {
				t.Fatalf("saved a document that does not load: %v", bad)
			}
			s.Next()
		}
	})
}

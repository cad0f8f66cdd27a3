package infer_test

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/BurntSushi/toml"

	"github.com/whichreg/whichreg/infer"
)

// TestNextNamesEvidenceKeys: every suggested measurement of every scenario
// names an evidence key that the file accepts with an answer of its kind
// appended, says whether it is powered (with the caution), and never asks
// for a lead the named outline lacks or a ripple trough of a DC supply.
func TestNextNamesEvidenceKeys(t *testing.T) {
	c := builtinCatalog(t)
	files, _ := filepath.Glob("../testdata/infer/*.toml")
	demo, _ := filepath.Glob("../testdata/demo/*.toml")
	seen := map[string]bool{}
	for _, name := range append(files, demo...) {
		ev := load(t, c, name)
		res, err := infer.Identify(c, ev, infer.Options{NextCount: 20})
		if err != nil {
			t.Fatal(err)
		}
		data, _ := os.ReadFile(name)
		for _, m := range res.Next {
			seen[m.Kind.String()] = true
			if m.Prompt == "" || m.Measure == "" {
				t.Errorf("%s: %s has no prompt", name, m.Key)
			}
			if m.Powered != (m.Safety != "") {
				t.Errorf("%s: %s powered %v with safety %q", name, m.Key, m.Powered, m.Safety)
			}
			var value any
			switch m.Kind {
			case infer.AskChoice:
				if len(m.Choices) == 0 {
					t.Fatalf("%s: %s is a choice without choices", name, m.Key)
				}
				value = m.Choices[len(m.Choices)-1]
				if m.Key == "case.tied_to_pin" {
					var n int64
					fmt.Sscanf(m.Choices[len(m.Choices)-1], "%d", &n)
					value = n
				}
			case infer.AskNumber:
				value = 1.0
				if m.Unit == "" {
					t.Errorf("%s: %s is a number without a unit", name, m.Key)
				}
			case infer.AskText:
				value = "78?05"
			default:
				t.Fatalf("%s: %s has kind %q", name, m.Key, m.Kind)
			}
			if ev.Input != nil && ev.Input.Rectifier.DC() && m.Key == "input.trough_volts" {
				t.Errorf("%s: a ripple trough asked of a DC supply", name)
			}
			o := c.Outline(ev.Package)
			if ev.Outline != nil && ev.Outline.Leads != nil {
				o = nil // the measured outline rules a package name that disagrees
			}
			if o != nil && strings.HasPrefix(m.Key, "pins.") {
				var n int
				fmt.Sscanf(strings.TrimPrefix(m.Key, "pins."), "%d", &n)
				if n > o.Leads {
					t.Errorf("%s: asks %s of a %d-lead %s", name, m.Key, o.Leads, o.Name)
				}
			}
			if o != nil && m.Key == "case.tied_to_pin" && !o.Tab && !o.MetalCan {
				t.Errorf("%s: asks the tab of a %s", name, o.Name)
			}
			// The answer, set at its key, must load.
			var doc map[string]any
			if _, err := toml.Decode(string(data), &doc); err != nil {
				t.Fatal(err)
			}
			path := strings.Split(m.Key, ".")
			at := doc
			for _, p := range path[:len(path)-1] {
				next, ok := at[p].(map[string]any)
				if !ok {
					next = map[string]any{}
					at[p] = next
				}
				at = next
			}
			at[path[len(path)-1]] = value
			var buf bytes.Buffer
			if err := toml.NewEncoder(&buf).Encode(doc); err != nil {
				t.Fatal(err)
			}
			if _, err := infer.LoadEvidence(name, buf.Bytes(), c); err != nil {
				t.Errorf("%s: answering %s = %v: %v", name, m.Key, value, err)
			}
		}
	}
	for _, k := range []string{"choice", "number", "text"} {
		if !seen[k] {
			t.Errorf("no scenario was asked a %s", k)
		}
	}
}

// TestNextSeparatesLiftedGround: with the output read at 6.04 V and the
// common lead not yet, a 6 V part predicts the common lead at about 0 V and
// a 5 V part lifted by a volt about +1 V (the output less the part's own
// voltage), so reading it is offered and its outcomes name both.
func TestNextSeparatesLiftedGround(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/infer/six-volts-or-lifted.toml")
	res, err := infer.Identify(c, ev, infer.Options{NextCount: 20, Tests: infer.ReadingsOnly})
	if err != nil {
		t.Fatal(err)
	}
	for _, m := range res.Next {
		if m.Key != "pins.2.volts" {
			continue
		}
		all := strings.Join(m.Outcomes, "\n")
		if !strings.Contains(all, "lead 2 reads about 0 V") || !strings.Contains(all, "lead 2 reads about +1 V") {
			t.Errorf("pins.2.volts outcomes do not separate a 6 V part from a lifted 5 V part:\n%s", all)
		}
		return
	}
	t.Errorf("pins.2.volts not offered: %+v", res.Next)
}

// TestNextAsksTheCan: on a two-lead can whose leads are out of reach, where
// the can goes is offered (it is the third terminal).
func TestNextAsksTheCan(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/demo/controller-to3-case.toml")
	ev.Case.WiredTo = ""
	res, err := infer.Identify(c, ev, infer.Options{NextCount: 20, Tests: infer.ReadingsOnly})
	if err != nil {
		t.Fatal(err)
	}
	for _, m := range res.Next {
		if m.Key == "case.wired_to" {
			return
		}
	}
	t.Errorf("case.wired_to not offered on a TO-3: %+v", res.Next)
}

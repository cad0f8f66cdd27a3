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

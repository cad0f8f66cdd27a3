package infer_test

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"github.com/BurntSushi/toml"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/internal/tomlpos"
)

// TestEvidenceBuiltInGo: evidence built in Go (no file) is read through
// Pins, checked by Check with the key named, and identified as a loaded file
// with the same content is.
func TestEvidenceBuiltInGo(t *testing.T) {
	c := builtinCatalog(t)
	v := func(x float64) infer.Volts { return infer.Volts{V: x, Set: true} }
	ev := &infer.Evidence{Package: "TO-92", Pins: map[string]infer.PinEvidence{
		"1": {WiredTo: infer.WiredLoad, Volts: v(5)},
		"2": {WiredTo: infer.WiredGround},
		"3": {WiredTo: infer.WiredUnregulated, Volts: v(9)},
	}}
	if err := ev.Check(c); err != nil {
		t.Fatalf("Check: %v", err)
	}
	if p, ok := ev.Lead(3); !ok || p.Volts.V != 9 {
		t.Errorf("Lead(3) = %+v, %v", p, ok)
	}
	if got := fmt.Sprint(ev.Leads()); got != "[1 2 3]" {
		t.Errorf("Leads() = %s", got)
	}
	fromGo, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		t.Fatal(err)
	}
	fromFile, err := infer.Identify(c, load(t, c, "../testdata/infer/go-built-twin.toml"), infer.Options{})
	if err != nil {
		t.Fatal(err)
	}
	for i := range 5 {
		a, b := fromGo.Candidates[i], fromFile.Candidates[i]
		if a.Label() != b.Label() || a.Score != b.Score {
			t.Errorf("rank %d: Go %s %.4f, file %s %.4f", i, a.Label(), a.Score, b.Label(), b.Score)
		}
	}

	bad := &infer.Evidence{File: "bench notes", Pins: map[string]infer.PinEvidence{"2": {WiredTo: "vcc"}, "x": {}},
		Network: &infer.NetworkEvidence{ZenerVolts: v(-1)}}
	err = bad.Check(c)
	var list tomlpos.ErrorList
	if !errors.As(err, &list) {
		t.Fatalf("Check = %v, want a tomlpos.ErrorList", err)
	}
	var keys []string
	for _, e := range list {
		keys = append(keys, e.Key)
		if e.File != "bench notes" || e.Line != 0 {
			t.Errorf("%v: want the file name and no line", e)
		}
	}
	if got := strings.Join(keys, " "); got != "pins.2.wired_to pins.x network.zener_volts" {
		t.Errorf("keys %q", got)
	}
}

// TestTemplateMeasuresNothing: the template decodes, and every one of its
// commented measurement lines, uncommented on its own, is a valid key; the
// untouched template is prior-only.
func TestTemplateMeasuresNothing(t *testing.T) {
	c := builtinCatalog(t)
	ev, err := infer.LoadEvidence("template.toml", []byte(infer.Template), c)
	if err != nil {
		t.Fatal(err)
	}
	res, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if !res.PriorOnly {
		t.Errorf("the untouched template is not prior-only")
	}
	// Uncomment everything: every example is a valid evidence key and value
	// (DC and rectifier examples are exclusive, so the DC lines go apart).
	var all, dc []string
	for i, line := range strings.Split(infer.Template, "\n") {
		if n := len([]rune(line)); n > 80 {
			t.Errorf("template line %d is %d columns wide", i+1, n)
		}
		if !strings.HasPrefix(line, "# ") {
			all = append(all, line)
			continue
		}
		body := strings.TrimPrefix(line, "# ")
		if !(strings.HasPrefix(body, "[") || strings.Contains(body, " = ")) {
			continue
		}
		if strings.HasPrefix(body, "dc_volts") {
			dc = append(dc, body)
			continue
		}
		all = append(all, body)
	}
	full := strings.Join(all, "\n")
	if _, err := infer.LoadEvidence("full.toml", []byte(full), c); err != nil {
		t.Errorf("the template with every line uncommented: %v", err)
	}
	var m map[string]any
	if _, err := toml.Decode(full, &m); err != nil {
		t.Fatal(err)
	}
	for _, key := range []string{"diode_drops", "zener_volts"} {
		if _, ok := m["network"].(map[string]any)[key]; !ok {
			t.Errorf("template lacks network.%s", key)
		}
	}
	for _, key := range []string{"transistor", "r_sense_ohms"} {
		if _, ok := m["booster"].(map[string]any)[key]; !ok {
			t.Errorf("template lacks booster.%s", key)
		}
	}
	dcFile := "[input]\nrectifier = \"dc\"\n" + strings.Join(dc, "\n") + "\n"
	if _, err := infer.LoadEvidence("dc.toml", []byte(dcFile), c); err != nil {
		t.Errorf("the template's DC lines: %v", err)
	}
	if len(dc) != 3 {
		t.Errorf("want dc_volts, dc_volts_min, dc_volts_max in the template, found %q", dc)
	}
}

// TestWordsAgree: the insulator words of the evidence file are those of the
// thermal model, and every typed word round-trips through text.
func TestWordsAgree(t *testing.T) {
	c := builtinCatalog(t)
	for _, w := range []string{"none", "grease", "mica", "silicone", "unknown"} {
		ev, err := infer.LoadEvidence("m.toml", []byte("[mount]\ninsulator = \""+w+"\"\n"), c)
		if err != nil {
			t.Errorf("insulator %q: %v", w, err)
			continue
		}
		b, _ := ev.Mount.Insulator.MarshalText()
		if string(b) != w || ev.Mount.Insulator.String() != w {
			t.Errorf("insulator %q round-trips as %q", w, b)
		}
	}
	for _, w := range infer.Wirings() {
		var got infer.Wiring
		if err := got.UnmarshalText([]byte(w.String())); err != nil || got != w {
			t.Errorf("wiring %q: %v", w, err)
		}
	}
	var k infer.InputKind
	if err := k.UnmarshalText([]byte("dc")); err != nil || !k.DC() {
		t.Errorf("dc: %v", err)
	}
	if _, ok := k.Topology(); ok {
		t.Errorf("dc has a rectifier topology")
	}
	if err := k.UnmarshalText([]byte("full-wave")); err == nil {
		t.Errorf("full-wave accepted")
	}
}

package infer

import (
	"sort"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/internal/tomlpos"
)

// Words allowed for where a lead (or the case) goes on the board.
const (
	WiredUnregulated = "unregulated" // the rectifier and filter capacitor
	WiredLoad        = "load"        // the regulated rail
	WiredGround      = "ground"      // board ground
	WiredNetwork     = "network"     // resistors, a zener or a trimmer
	WiredOpen        = "open"        // nothing
)

var wiredWords = []string{WiredUnregulated, WiredLoad, WiredGround, WiredNetwork, WiredOpen}

// OutlineEvidence is the package as measured with calipers.
type OutlineEvidence struct {
	Leads         *int        `toml:"leads" json:"leads,omitempty"`           // leads counted, not the tab
	PitchMM       Millimetres `toml:"pitch_mm" json:"pitch_mm"`               // centre to centre of adjacent leads
	HoleSpacingMM Millimetres `toml:"hole_spacing_mm" json:"hole_spacing_mm"` // between two mounting holes
	MetalCan      *bool       `toml:"metal_can" json:"metal_can,omitempty"`   // a metal can
}

// PinEvidence is what one lead is connected to and what it reads.
type PinEvidence struct {
	// WiredTo is where the lead goes (ohmmeter, power off): unregulated,
	// load, ground, network or open; "" = not checked.
	WiredTo string `toml:"wired_to" json:"wired_to,omitempty"`
	// Volts is the DC voltage to board ground, powered, at normal load.
	Volts Volts `toml:"volts" json:"volts"`
}

// CaseEvidence is the tab or metal can.
type CaseEvidence struct {
	// TiedToPin is the lead the case has continuity to; 0 = none.
	TiedToPin *int   `toml:"tied_to_pin" json:"tied_to_pin,omitempty"`
	WiredTo   string `toml:"wired_to" json:"wired_to,omitempty"` // where the case goes on the board (same words as the leads)
	Volts     Volts  `toml:"volts" json:"volts"`                 // DC volts of the case to board ground
}

// InputEvidence is what feeds the part.
type InputEvidence struct {
	Rectifier           string      `toml:"rectifier" json:"rectifier,omitempty"`             // bridge | center-tap | half-wave | dc
	SecondaryVrms       Volts       `toml:"secondary_vrms" json:"secondary_vrms"`             // loaded secondary, V RMS (per half for center-tap)
	SecondaryRegulation Fraction    `toml:"secondary_regulation" json:"secondary_regulation"` // default 0.10
	FilterUF            Microfarads `toml:"filter_uf" json:"filter_uf"`                       // reservoir capacitor, µF
	MainsHz             Hertz       `toml:"mains_hz" json:"mains_hz"`                         // default 50
	MainsTolerance      Fraction    `toml:"mains_tolerance" json:"mains_tolerance"`           // default 0.10
	DCVolts             Volts       `toml:"dc_volts" json:"dc_volts"`                         // rectifier = "dc"
	TroughVolts         Volts       `toml:"trough_volts" json:"trough_volts"`                 // measured with a scope
}

// OutputEvidence is the regulated rail.
type OutputEvidence struct {
	Amps    Amps        `toml:"amps" json:"amps"`                   // normal (maximum) load, A
	MinAmps Amps        `toml:"min_amps" json:"min_amps"`           // lightest load, A
	CapUF   Microfarads `toml:"cap_uf" json:"cap_uf"`               // capacitor at the output, µF
	CapType string      `toml:"cap_type" json:"cap_type,omitempty"` // ceramic | tantalum | electrolytic | none
}

// BypassEvidence is a resistor from input to output.
type BypassEvidence struct {
	Ohms Ohms `toml:"ohms" json:"ohms"` // 0 = none
}

// NetworkEvidence is the divider on the common/ADJ lead.
type NetworkEvidence struct {
	RTopOhms      Ohms  `toml:"r_top_ohms" json:"r_top_ohms"`           // output to common/ADJ
	RBottomOhms   Ohms  `toml:"r_bottom_ohms" json:"r_bottom_ohms"`     // common/ADJ to the return rail
	BottomToVolts Volts `toml:"bottom_to_volts" json:"bottom_to_volts"` // the return rail
	Trimmer       *bool `toml:"trimmer" json:"trimmer,omitempty"`       // the network has a trimmer
}

// MountEvidence is how the part is cooled.
type MountEvidence struct {
	HeatsinkCPerW   CPerW   `toml:"heatsink_c_per_w" json:"heatsink_c_per_w"`           // 0 = free air
	Insulator       string  `toml:"insulator" json:"insulator,omitempty"`               // none | mica | silicone | unknown
	ChassisHeatsink *bool   `toml:"chassis_heatsink" json:"chassis_heatsink,omitempty"` // the heat sink is bonded to chassis or ground
	AmbientC        Celsius `toml:"ambient_c" json:"ambient_c"`                         // air around the heat sink, °C
}

// Evidence is one evidence file: every field is optional.
type Evidence struct {
	Ref       string                 `toml:"ref" json:"ref,omitempty"`             // board reference, e.g. "U4"
	Equipment string                 `toml:"equipment" json:"equipment,omitempty"` // what it is and which board
	Marking   string                 `toml:"marking" json:"marking,omitempty"`     // what is legible; ? one unreadable character, * any run
	Package   string                 `toml:"package" json:"package,omitempty"`     // an outline name or alias from the catalog
	Year      int                    `toml:"year" json:"year,omitempty"`           // year the equipment was made; 0 = unknown
	Outline   *OutlineEvidence       `toml:"outline" json:"outline,omitempty"`     // measured outline
	Pins      map[string]PinEvidence `toml:"pins" json:"pins,omitempty"`           // by lead number "1", "2", …
	Case      *CaseEvidence          `toml:"case" json:"case,omitempty"`           // the tab or can
	Input     *InputEvidence         `toml:"input" json:"input,omitempty"`         // what feeds the part
	Output    *OutputEvidence        `toml:"output" json:"output,omitempty"`       // the regulated rail
	Bypass    *BypassEvidence        `toml:"bypass" json:"bypass,omitempty"`       // a resistor from input to output
	Network   *NetworkEvidence       `toml:"network" json:"network,omitempty"`     // the divider on the common/ADJ lead
	Mount     *MountEvidence         `toml:"mount" json:"mount,omitempty"`         // how the part is cooled

	// File is the name the evidence was loaded from.
	File string `toml:"-" json:"-"`
	// leads maps lead numbers to their evidence (from Pins).
	leads map[int]PinEvidence
}

const evidenceHint = "the known keys are in the template that `whichreg evidence init` writes"

// LoadEvidence decodes and checks an evidence file against the catalog's
// outlines. It returns every problem as a positioned [tomlpos.ErrorList]:
// unknown keys, wrong types, words that are not allowed, lead numbers the
// outline lacks and impossible values.
func LoadEvidence(name string, data []byte, c *catalog.Catalog) (*Evidence, error) {
	ev := &Evidence{File: name}
	ix, errs, ok := tomlpos.Decode(name, data, ev, evidenceHint)
	if !ok {
		return nil, errs
	}
	add := func(key, format string, args ...any) { errs.Add(name, ix, key, format, args...) }
	maxLeads := 0
	if ev.Package != "" {
		o := c.Outline(ev.Package)
		if o == nil {
			var names []string
			for _, ol := range c.Outlines {
				names = append(names, ol.Name)
			}
			add("package", "unknown package %q; use an outline name from the catalog (%s), or leave it out and give [outline]", ev.Package, strings.Join(names, ", "))
		} else {
			maxLeads = o.Leads
		}
	}
	if ev.Outline != nil && ev.Outline.Leads != nil {
		n := *ev.Outline.Leads
		if n < 1 || n > 16 {
			add("outline.leads", "leads = %d is impossible; count the leads (1 to 16), not the tab", n)
		} else if maxLeads == 0 {
			maxLeads = n
		} else if n != maxLeads {
			add("outline.leads", "leads = %d but package %s has %d leads; correct one of them", n, ev.Package, maxLeads)
		}
	}
	if ev.Outline != nil {
		positive(&errs, name, ix, "outline.pitch_mm", ev.Outline.PitchMM.Set, ev.Outline.PitchMM.V, 0.1, 50, "mm")
		positive(&errs, name, ix, "outline.hole_spacing_mm", ev.Outline.HoleSpacingMM.Set, ev.Outline.HoleSpacingMM.V, 1, 100, "mm")
	}
	if ev.Year != 0 && (ev.Year < 1900 || ev.Year > 2100) {
		add("year", "year = %d is not a plausible year of manufacture", ev.Year)
	}
	ev.leads = map[int]PinEvidence{}
	keys := make([]string, 0, len(ev.Pins))
	for k := range ev.Pins {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		p := ev.Pins[k]
		n, err := strconv.Atoi(k)
		key := "pins." + k
		if err != nil || n < 1 {
			add(key, "[pins.%s]: leads are numbered 1, 2, 3 … as the outline's convention numbers them", k)
			continue
		}
		if maxLeads > 0 && n > maxLeads {
			add(key, "lead %d: the package has only %d leads (numbered by the convention 'whichreg catalog show' draws)", n, maxLeads)
			continue
		}
		if p.WiredTo != "" && !oneOf(p.WiredTo, wiredWords) {
			add(key+".wired_to", "wired_to %q is not one of %s", p.WiredTo, strings.Join(wiredWords, ", "))
		}
		volts(&errs, name, ix, key+".volts", p.Volts)
		ev.leads[n] = p
	}
	if ev.Case != nil {
		if t := ev.Case.TiedToPin; t != nil && (*t < 0 || (maxLeads > 0 && *t > maxLeads) || *t > 16) {
			add("case.tied_to_pin", "tied_to_pin = %d: give a lead number of the package, or 0 for none", *t)
		}
		if ev.Case.WiredTo != "" && !oneOf(ev.Case.WiredTo, wiredWords) {
			add("case.wired_to", "wired_to %q is not one of %s", ev.Case.WiredTo, strings.Join(wiredWords, ", "))
		}
		volts(&errs, name, ix, "case.volts", ev.Case.Volts)
	}
	if in := ev.Input; in != nil {
		if in.Rectifier != "" && !oneOf(in.Rectifier, []string{"bridge", "center-tap", "half-wave", "dc"}) {
			add("input.rectifier", "rectifier %q is not one of bridge, center-tap, half-wave, dc", in.Rectifier)
		}
		positive(&errs, name, ix, "input.secondary_vrms", in.SecondaryVrms.Set, in.SecondaryVrms.V, 0.5, 2000, "V")
		fractionRange(&errs, name, ix, "input.secondary_regulation", in.SecondaryRegulation, 1)
		positive(&errs, name, ix, "input.filter_uf", in.FilterUF.Set, in.FilterUF.V, 0.001, 1e7, "µF")
		positive(&errs, name, ix, "input.mains_hz", in.MainsHz.Set, in.MainsHz.V, 10, 1000, "Hz")
		fractionRange(&errs, name, ix, "input.mains_tolerance", in.MainsTolerance, 0.5)
		volts(&errs, name, ix, "input.dc_volts", in.DCVolts)
		volts(&errs, name, ix, "input.trough_volts", in.TroughVolts)
		if in.Rectifier == "dc" && !in.DCVolts.Set {
			add("input.dc_volts", "rectifier = \"dc\" needs dc_volts")
		}
	}
	if out := ev.Output; out != nil {
		nonNeg(&errs, name, ix, "output.amps", out.Amps.Set, out.Amps.V, 1000, "A")
		nonNeg(&errs, name, ix, "output.min_amps", out.MinAmps.Set, out.MinAmps.V, 1000, "A")
		nonNeg(&errs, name, ix, "output.cap_uf", out.CapUF.Set, out.CapUF.V, 1e7, "µF")
		if out.MinAmps.Set && out.Amps.Set && out.MinAmps.V > out.Amps.V {
			add("output.min_amps", "min_amps %g A is above amps %g A; amps is the normal (maximum) load", out.MinAmps.V, out.Amps.V)
		}
		if out.CapType != "" && !oneOf(out.CapType, []string{"ceramic", "tantalum", "electrolytic", "none"}) {
			add("output.cap_type", "cap_type %q is not one of ceramic, tantalum, electrolytic, none", out.CapType)
		}
	}
	if b := ev.Bypass; b != nil {
		nonNeg(&errs, name, ix, "bypass.ohms", b.Ohms.Set, b.Ohms.V, 1e9, "Ω")
	}
	if nw := ev.Network; nw != nil {
		nonNeg(&errs, name, ix, "network.r_top_ohms", nw.RTopOhms.Set, nw.RTopOhms.V, 1e9, "Ω")
		nonNeg(&errs, name, ix, "network.r_bottom_ohms", nw.RBottomOhms.Set, nw.RBottomOhms.V, 1e9, "Ω")
		if nw.RTopOhms.Set && nw.RTopOhms.V == 0 {
			add("network.r_top_ohms", "r_top_ohms = 0 would short the output to the common lead; leave it out if unknown")
		}
		volts(&errs, name, ix, "network.bottom_to_volts", nw.BottomToVolts)
	}
	if m := ev.Mount; m != nil {
		nonNeg(&errs, name, ix, "mount.heatsink_c_per_w", m.HeatsinkCPerW.Set, m.HeatsinkCPerW.V, 1000, "°C/W")
		if m.Insulator != "" && !oneOf(m.Insulator, []string{"none", "mica", "silicone", "unknown"}) {
			add("mount.insulator", "insulator %q is not one of none, mica, silicone, unknown", m.Insulator)
		}
		if m.AmbientC.Set && (m.AmbientC.V < -60 || m.AmbientC.V > 150) {
			add("mount.ambient_c", "ambient_c = %g °C is not a plausible ambient", m.AmbientC.V)
		}
	}
	errs.Sort()
	if len(errs) > 0 {
		return nil, errs
	}
	return ev, nil
}

func oneOf(v string, set []string) bool {
	for _, s := range set {
		if v == s {
			return true
		}
	}
	return false
}

func volts(errs *tomlpos.ErrorList, file string, ix tomlpos.Locator, key string, v Volts) {
	if v.Set && (v.V < -10000 || v.V > 10000) {
		errs.Add(file, ix, key, "%g V is outside ±10 kV; give volts to board ground", v.V)
	}
}

func positive(errs *tomlpos.ErrorList, file string, ix tomlpos.Locator, key string, set bool, v, lo, hi float64, unit string) {
	if set && (v < lo || v > hi) {
		errs.Add(file, ix, key, "%g %s is outside %g to %g %s", v, unit, lo, hi, unit)
	}
}

func nonNeg(errs *tomlpos.ErrorList, file string, ix tomlpos.Locator, key string, set bool, v, hi float64, unit string) {
	if set && (v < 0 || v > hi) {
		errs.Add(file, ix, key, "%g %s is impossible (0 to %g %s)", v, unit, hi, unit)
	}
}

func fractionRange(errs *tomlpos.ErrorList, file string, ix tomlpos.Locator, key string, f Fraction, hi float64) {
	if f.Set && (f.V < 0 || f.V > hi) {
		errs.Add(file, ix, key, "%g is not a fraction from 0 to %g (write 0.10 for 10 %%)", f.V, hi)
	}
}

// Lead returns the evidence for lead n (1-based) and whether there is any.
func (e *Evidence) Lead(n int) (PinEvidence, bool) {
	p, ok := e.leads[n]
	return p, ok
}

// Leads returns the lead numbers that have evidence, ascending.
func (e *Evidence) Leads() []int {
	var out []int
	for n := range e.leads {
		out = append(out, n)
	}
	sort.Ints(out)
	return out
}

// Template is a commented evidence file; `whichreg evidence init` writes it.
const Template = `# Evidence about one unmarked three-terminal regulator, for 'whichreg infer'.
# Every field is optional: leave out what you have not measured, and never guess.
# Numbers may carry units and prefixes: "4k7", "0R22", "2200u", "12.6".
#
# SAFETY: measure voltages with the equipment powered only with care: mains
# wiring is live, filter capacitors hold their charge after switch-off, and the
# regulator's tab or can may be live. Discharge capacitors before probing for
# continuity.

ref       = "U1"                    # board reference
equipment = "what it is, which board"
marking   = ""                      # what is legible; ? = one unreadable character, * = any run
package   = "TO-220"                # an outline name from 'whichreg catalog list'; or give [outline]
year      = 1985                    # when the equipment was made (date codes of nearby parts)

# [outline]                         # measured, when the package name is in doubt
# leads = 3
# pitch_mm = 2.54                   # centre to centre of adjacent leads
# hole_spacing_mm = 30.2            # between the mounting holes of a TO-3/TO-66 can
# metal_can = false

# One table per lead, numbered as 'whichreg catalog show' draws the outline
# (TO-220: marked face toward you, leads down, 1-2-3 from the left).
[pins.1]
wired_to = "unregulated"            # unregulated | load | ground | network | open (power off, ohmmeter)
volts = 12.0                        # DC volts to board ground, powered, at normal load
[pins.2]
wired_to = "ground"
volts = 0
[pins.3]
wired_to = "load"
volts = 5.0

[case]                              # the tab or metal can
tied_to_pin = 2                     # continuity to which lead; 0 = tied to no lead
# wired_to = "ground"               # on a TO-3 the can is the third terminal: where it goes
# volts = 0

[input]                             # what feeds the part
rectifier = "bridge"                # bridge | center-tap | half-wave | dc
secondary_vrms = 12.6               # transformer secondary, loaded (per half for center-tap)
secondary_regulation = 0.10         # no-load rise as a fraction
filter_uf = 2200
mains_hz = 50
mains_tolerance = 0.10              # fraction either way
# dc_volts = 0                      # for rectifier = "dc"
# trough_volts = 0                  # scope: lowest input voltage under load

[output]
amps = 0.5                          # normal (maximum) load current
min_amps = 0.05                     # lightest load
cap_uf = 10                         # capacitor at the output
cap_type = "electrolytic"           # ceramic | tantalum | electrolytic | none

# [bypass]
# ohms = 0                          # resistor from input to output (current booster); 0 = none

# [network]                         # resistors on the common/ADJ lead
# r_top_ohms = 240                  # output to common/ADJ
# r_bottom_ohms = 720               # common/ADJ to the return rail
# bottom_to_volts = 0               # the return rail (0 = ground)
# trimmer = false

[mount]
heatsink_c_per_w = 0                # 0 = free air
insulator = "none"                  # none | mica | silicone | unknown
chassis_heatsink = false            # the heat sink is bonded to chassis or ground
ambient_c = 40
`

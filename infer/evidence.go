package infer

import (
	"errors"
	"slices"
	"sort"
	"strconv"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/internal/tomlpos"
)

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
	WiredTo Wiring `toml:"wired_to" json:"wired_to,omitempty"`
	// Volts is the DC voltage to board ground, powered, at normal load.
	Volts Volts `toml:"volts" json:"volts"`
}

// CaseEvidence is the tab or metal can.
type CaseEvidence struct {
	// TiedToPin is the lead the case has continuity to; 0 = none.
	TiedToPin *int   `toml:"tied_to_pin" json:"tied_to_pin,omitempty"`
	WiredTo   Wiring `toml:"wired_to" json:"wired_to,omitempty"` // where the case goes on the board (same words as the leads)
	Volts     Volts  `toml:"volts" json:"volts"`                 // DC volts of the case to board ground
}

// InputEvidence is what feeds the part.
type InputEvidence struct {
	Rectifier           InputKind   `toml:"rectifier" json:"rectifier,omitempty"`             // bridge | center-tap | half-wave | dc
	SecondaryVrms       Volts       `toml:"secondary_vrms" json:"secondary_vrms"`             // loaded secondary, V RMS (per half for center-tap)
	SecondaryRegulation Fraction    `toml:"secondary_regulation" json:"secondary_regulation"` // default 0.10
	FilterUF            Microfarads `toml:"filter_uf" json:"filter_uf"`                       // reservoir capacitor, µF
	MainsHz             Hertz       `toml:"mains_hz" json:"mains_hz"`                         // default 50
	MainsTolerance      Fraction    `toml:"mains_tolerance" json:"mains_tolerance"`           // default 0.10
	DCVolts             Volts       `toml:"dc_volts" json:"dc_volts"`                         // rectifier = "dc": nominal
	DCVoltsMin          Volts       `toml:"dc_volts_min" json:"dc_volts_min"`                 // rectifier = "dc": lowest (weak battery, brown-out)
	DCVoltsMax          Volts       `toml:"dc_volts_max" json:"dc_volts_max"`                 // rectifier = "dc": highest (charging, fault)
	TransientVolts      Volts       `toml:"transient_volts" json:"transient_volts"`           // surges the part must survive (load dump)
	TroughVolts         Volts       `toml:"trough_volts" json:"trough_volts"`                 // measured with a scope
}

// OutputEvidence is the regulated rail.
type OutputEvidence struct {
	Amps    Amps        `toml:"amps" json:"amps"`                   // normal (maximum) load, A
	MinAmps Amps        `toml:"min_amps" json:"min_amps"`           // lightest load, A
	CapUF   Microfarads `toml:"cap_uf" json:"cap_uf"`               // capacitor at the output, µF
	CapType CapType     `toml:"cap_type" json:"cap_type,omitempty"` // ceramic | tantalum | electrolytic | none
}

// BypassEvidence is a resistor from input to output.
type BypassEvidence struct {
	Ohms Ohms `toml:"ohms" json:"ohms"` // 0 = none
}

// NetworkEvidence is the divider on the common/ADJ lead.
type NetworkEvidence struct {
	RTopOhms      Ohms  `toml:"r_top_ohms" json:"r_top_ohms"`             // output to common/ADJ
	RBottomOhms   Ohms  `toml:"r_bottom_ohms" json:"r_bottom_ohms"`       // common/ADJ to the return rail
	BottomToVolts Volts `toml:"bottom_to_volts" json:"bottom_to_volts"`   // the return rail
	Trimmer       *bool `toml:"trimmer" json:"trimmer,omitempty"`         // the network has a trimmer
	DiodeDrops    *int  `toml:"diode_drops" json:"diode_drops,omitempty"` // silicon diodes in series in the common lead (lifted ground); 0 = none
	ZenerVolts    Volts `toml:"zener_volts" json:"zener_volts"`           // a zener (or LED string) in the common lead; 0 = none
}

// BoosterEvidence is an external pass transistor around the regulator.
type BoosterEvidence struct {
	Transistor Transistor `toml:"transistor" json:"transistor,omitempty"` // pnp | npn
	RSenseOhms Ohms       `toml:"r_sense_ohms" json:"r_sense_ohms"`       // the resistor whose drop turns the transistor on
}

// BenchEvidence is what a powered bench test found, with a current-limited
// bench supply in place of the part's input.
type BenchEvidence struct {
	// DropoutVolts is the input − output difference (magnitude) at which
	// the output first falls by 2 % as the supply is lowered, at normal load.
	DropoutVolts Volts `toml:"dropout_volts" json:"dropout_volts"`
	// HoldsAmps is the largest test load on the output at which the output
	// stayed within 2 % for ten seconds, raising the load in steps until
	// the output falls (or up to the largest rating identification names).
	HoldsAmps Amps `toml:"holds_amps" json:"holds_amps"`
}

// MountEvidence is how the part is cooled.
type MountEvidence struct {
	HeatsinkCPerW   CPerW     `toml:"heatsink_c_per_w" json:"heatsink_c_per_w"`           // 0 = free air
	Insulator       Insulator `toml:"insulator" json:"insulator,omitempty"`               // one of circuit.Insulators
	ChassisHeatsink *bool     `toml:"chassis_heatsink" json:"chassis_heatsink,omitempty"` // the heat sink is bonded to chassis or ground
	AmbientC        Celsius   `toml:"ambient_c" json:"ambient_c"`                         // air around the heat sink, °C
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
	Booster   *BoosterEvidence       `toml:"booster" json:"booster,omitempty"`     // an external pass transistor
	Bench     *BenchEvidence         `toml:"bench" json:"bench,omitempty"`         // a powered bench test
	Mount     *MountEvidence         `toml:"mount" json:"mount,omitempty"`         // how the part is cooled

	// File is the name the evidence was loaded from.
	File string `toml:"-" json:"-"`
	// loc finds keys in the file for positioned errors; nil for evidence
	// built in Go.
	loc tomlpos.Locator
	// memo keeps the rectifier solves made for this evidence (see
	// [solveMemo]); nil for evidence built in Go, which then solves afresh.
	memo *solveMemo
}

const evidenceHint = "the known keys are in the template that `whichreg evidence init` writes"

// LoadEvidence decodes an evidence file and checks it against the catalog
// ([Evidence.Check]). It returns every problem as a positioned
// [tomlpos.ErrorList]: unknown keys, wrong types, words that are not
// allowed, lead numbers the outline lacks and impossible values.
func LoadEvidence(name string, data []byte, c *catalog.Catalog) (*Evidence, error) {
	ev := &Evidence{File: name}
	ix, errs, ok := tomlpos.Decode(name, data, ev, evidenceHint)
	if !ok {
		return nil, errs
	}
	ev.loc = ix
	ev.memo = &solveMemo{}
	if err := ev.Check(c); err != nil {
		var more tomlpos.ErrorList
		if errors.As(err, &more) {
			errs = append(errs, more...)
		}
	}
	errs.Sort()
	if len(errs) > 0 {
		return nil, errs
	}
	return ev, nil
}

// Lead returns the evidence for lead n (1-based) and whether there is any.
// It reads [Evidence.Pins], so evidence built in Go works as a loaded file.
func (e *Evidence) Lead(n int) (PinEvidence, bool) {
	if p, ok := e.Pins[strconv.Itoa(n)]; ok {
		return p, true
	}
	for k, p := range e.Pins {
		if m, err := strconv.Atoi(k); err == nil && m == n {
			return p, true
		}
	}
	return PinEvidence{}, false
}

// Leads returns the lead numbers that have evidence, ascending (keys of
// [Evidence.Pins] that are not lead numbers are left out; Check reports them).
func (e *Evidence) Leads() []int {
	var out []int
	for k := range e.Pins {
		if n, err := strconv.Atoi(k); err == nil && n >= 1 && !slices.Contains(out, n) {
			out = append(out, n)
		}
	}
	sort.Ints(out)
	return out
}

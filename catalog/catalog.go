package catalog

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/internal/tomlpos"
)

// Error is a problem at a place in a catalog file; see [tomlpos.Error].
type Error = tomlpos.Error

// ErrorList is a list of [*Error], sorted by position.
type ErrorList = tomlpos.ErrorList

// Outline is a package body as it can be recognised on the bench.
type Outline struct {
	// Name is the trade name, e.g. "TO-220".
	Name string `toml:"name" json:"name"`
	// Aliases are other names for the same outline (JEDEC registrations, makers' names).
	Aliases []string `toml:"aliases" json:"aliases,omitempty"`
	// Leads is the number of leads, not counting a tab or can.
	Leads int `toml:"leads" json:"leads"`
	// PitchMM is the centre-to-centre spacing of adjacent leads, in millimetres.
	PitchMM float64 `toml:"pitch_mm" json:"pitch_mm"`
	// HoleSpacingMM is the distance between the two mounting holes of a flanged
	// can (TO-3, TO-66), in millimetres; 0 when there are not two holes.
	HoleSpacingMM float64 `toml:"hole_spacing_mm" json:"hole_spacing_mm,omitempty"`
	// Tab is true when the body has a metal mounting tab or pad.
	Tab bool `toml:"tab" json:"tab"`
	// MetalCan is true for metal cans (TO-3, TO-66, TO-39).
	MetalCan bool `toml:"metal_can" json:"metal_can"`
	// MountingHole is true when the body or tab has a hole for a screw
	// (TO-220, TO-126, TO-3); surface-mount outlines have none.
	MountingHole bool `toml:"mounting_hole" json:"mounting_hole,omitempty"`
	// RoundCan is true for a round metal can with its leads on a circle
	// (TO-39, TO-5).
	RoundCan bool `toml:"round_can" json:"round_can,omitempty"`
	// CaseTerminal is true when the can is one of the part's three terminals
	// (TO-3 and TO-66: two leads plus the case).
	CaseTerminal bool `toml:"case_terminal" json:"case_terminal,omitempty"`
	// Isolated is true when the mounting surface is insulated from every lead.
	Isolated bool `toml:"isolated" json:"isolated,omitempty"`
	// Commonness is 1 (rare) to 5 (everywhere) among regulators: how a
	// family's prior is shared among its packages. 0 means 3.
	Commonness int `toml:"commonness" json:"commonness,omitempty"`
	// SMD is true for surface-mount outlines.
	SMD bool `toml:"smd" json:"smd,omitempty"`
	// View is the viewing convention under which leads are numbered 1..n.
	View string `toml:"view" json:"view"`
	// Source names the drawing the dimensions come from.
	Source string `toml:"source" json:"source"`

	// Origin is the file the outline was loaded from.
	Origin string `toml:"-" json:"origin"`
	pos    position
}

// COut is a family's output-capacitor requirement for stability.
type COut struct {
	// MinUF is the least output capacitance for stability, in microfarads; 0 = none needed.
	MinUF float64 `toml:"min_uf" json:"min_uf"`
	// ESRMinOhm is the least ESR the loop needs, in ohms; 0 = no lower limit.
	ESRMinOhm float64 `toml:"esr_min_ohm" json:"esr_min_ohm"`
	// ESRMaxOhm is the greatest ESR the loop tolerates, in ohms; 0 = no upper limit.
	ESRMaxOhm float64 `toml:"esr_max_ohm" json:"esr_max_ohm"`
	// CeramicOK is true when the part is stable with ceramic capacitors alone.
	CeramicOK bool `toml:"ceramic_ok" json:"ceramic_ok"`
	// MaxUF is the most output capacitance the part starts into, in
	// microfarads (switching modules); 0 = no limit.
	MaxUF float64 `toml:"max_uf" json:"max_uf,omitempty"`
}

// Package is one package variant of a family.
type Package struct {
	// Outline is an [Outline.Name] (or alias).
	Outline string `toml:"outline" json:"outline"`
	// Variant names this pinout when a family has more than one on the same
	// outline (e.g. "BC547 order" and "2N3904 order" on TO-92); "" otherwise.
	Variant string `toml:"variant" json:"variant,omitempty"`
	// Source names the datasheet of this variant when it differs from the
	// family's (another maker's pinout or rating); required with Variant.
	Source string `toml:"source" json:"source,omitempty"`
	// Pins lists the function of leads 1..n (IN, OUT, GND, ADJ, NC, EN, … and
	// B, C, E, G, D, S, REF, A, K for look-alikes), numbered by the outline's
	// convention ([Outline.View]).
	Pins []string `toml:"pins" json:"pins"`
	// Tab is the function the tab, pad or can is tied to, or "none" when it is
	// insulated or absent. On a case-terminal can it is the third terminal.
	Tab string `toml:"tab" json:"tab"`
	// ThetaJC is the junction-to-case thermal resistance, °C/W.
	ThetaJC float64 `toml:"theta_jc" json:"theta_jc"`
	// ThetaJA is the junction-to-ambient thermal resistance in free air, °C/W.
	ThetaJA float64 `toml:"theta_ja" json:"theta_ja"`
	// CurrentA overrides the family's rated current for this package; 0 = the family's.
	CurrentA float64 `toml:"current_a" json:"current_a,omitempty"`
	// Status overrides the family's production status for this package; "" = the family's.
	Status Status `toml:"status" json:"status,omitempty"`
	// Note is a remark on this variant (pinout caveats, sources of doubt).
	Note string `toml:"note" json:"note,omitempty"`
	// OrderCodes are two or three current order codes for this package, as
	// examples from the makers' ordering tables (one voltage where the family
	// has several); empty for parts no longer made.
	OrderCodes []string `toml:"order_codes" json:"order_codes,omitempty"`
}

// Family is a group of parts sold under one generic designation.
type Family struct {
	// ID is the trade's generic designation without a maker prefix, e.g. "317".
	ID string `toml:"id" json:"id"`
	// Title is a short description.
	Title string `toml:"title" json:"title"`
	// Polarity is "positive" or "negative".
	Polarity Polarity `toml:"polarity" json:"polarity"`
	// Kind is "fixed", "adjustable" or "non-regulator" (a look-alike: a
	// transistor, shunt reference or switching IC that sits where a regulator
	// might; never a replacement).
	Kind Kind `toml:"kind" json:"kind"`
	// Device says what a non-regulator family is ([Device]); "" for regulators.
	Device Device `toml:"device" json:"device,omitempty"`
	// ControlDropV is a transistor's conducting control-to-output drop
	// magnitude as [low, high] volts: base to emitter (VBE(on)) or gate to
	// source (VGS) over its working range, from the datasheet.
	ControlDropV []float64 `toml:"control_drop_v" json:"control_drop_v,omitempty"`
	// Pass is the pass element: "npn" (classic, ≈2 V headroom), "npn-ldo"
	// (quasi-LDO, ≈1.3 V), "pnp" (LDO), "pmos" (CMOS LDO), "switching"
	// (drop-in module). "" = npn.
	Pass Pass `toml:"pass" json:"pass,omitempty"`
	// OutputsV are the standard output voltages of a fixed family, as magnitudes in volts.
	OutputsV []float64 `toml:"outputs_v" json:"outputs_v"`
	// VrefV is an adjustable part's reference (OUT minus ADJ, magnitude), volts;
	// for a shunt reference REF minus A, for a switching IC its feedback voltage.
	VrefV float64 `toml:"vref_v" json:"vref_v"`
	// VoutMaxV is the highest output an adjustable part is specified for, volts; 0 = not stated.
	VoutMaxV float64 `toml:"vout_max_v" json:"vout_max_v,omitempty"`
	// Tolerance is the output (or reference) tolerance over line, load and
	// temperature, as a fraction.
	Tolerance float64 `toml:"tolerance" json:"tolerance"`
	// Tolerance25C is the tighter tolerance the datasheet gives at 25 °C
	// junction temperature, as a fraction; 0 = not stated. Checks use
	// Tolerance, the overall figure.
	Tolerance25C float64 `toml:"tolerance_25c" json:"tolerance_25c,omitempty"`
	// CurrentA is the rated output current, amperes.
	CurrentA float64 `toml:"current_a" json:"current_a"`
	// VinMaxV is a fixed part's absolute maximum input (magnitude), volts;
	// for a non-regulator the maximum collector, drain, cathode or input voltage.
	// For fixed families with several ranges it is the value for the lowest
	// outputs; VinMaxHighV applies from VinMaxHighFromV up.
	VinMaxV float64 `toml:"vin_max_v" json:"vin_max_v"`
	// VinMaxHighV is the absolute maximum input of the higher-voltage members, volts; 0 = same as VinMaxV.
	VinMaxHighV float64 `toml:"vin_max_high_v" json:"vin_max_high_v,omitempty"`
	// VinMaxHighFromV is the output voltage from which VinMaxHighV applies.
	VinMaxHighFromV float64 `toml:"vin_max_high_from_v" json:"vin_max_high_from_v,omitempty"`
	// TransientMaxV is the surge (a car's load dump) the datasheet rates the
	// input to survive for a short time, volts (magnitude), above the steady
	// maximum; 0 = no transient rating, the absolute maximum holds for surges too.
	TransientMaxV float64 `toml:"transient_max_v" json:"transient_max_v,omitempty"`
	// VdiffMaxV is an adjustable part's maximum input-output differential, volts.
	VdiffMaxV float64 `toml:"vdiff_max_v" json:"vdiff_max_v"`
	// DropoutV is the worst-case input-output differential at rated current, volts.
	DropoutV float64 `toml:"dropout_v" json:"dropout_v"`
	// IqMA is a fixed part's ground-lead (quiescent) current, maximum, milliamperes.
	IqMA float64 `toml:"iq_ma" json:"iq_ma"`
	// IqTypMA is the typical ground-lead current, milliamperes; 0 = not stated.
	IqTypMA float64 `toml:"iq_typ_ma" json:"iq_typ_ma,omitempty"`
	// IadjUA is an adjustable part's ADJ-lead current, maximum, microamperes.
	IadjUA float64 `toml:"iadj_ua" json:"iadj_ua"`
	// IadjTypUA is the typical ADJ-lead current, microamperes; 0 = not stated.
	IadjTypUA float64 `toml:"iadj_typ_ua" json:"iadj_typ_ua,omitempty"`
	// MinLoadMA is the least load for regulation, milliamperes (adjustables: maximum figure).
	MinLoadMA float64 `toml:"min_load_ma" json:"min_load_ma"`
	// TjMaxC is the maximum operating junction temperature, °C.
	TjMaxC float64 `toml:"tj_max_c" json:"tj_max_c"`
	// Cout is the output-capacitor requirement.
	Cout COut `toml:"cout" json:"cout"`
	// Status is "active", "obsolete" or "scarce".
	Status Status `toml:"status" json:"status"`
	// Since is the year the family appeared; 0 = unknown.
	Since int `toml:"since" json:"since"`
	// Commonness is 1 (rare) to 5 (everywhere); it sets the prior in identification.
	Commonness int `toml:"commonness" json:"commonness"`
	// Markings are wildcard patterns of what is printed on such parts.
	Markings []string `toml:"markings" json:"markings"`
	// Source names the datasheet(s) the values come from, and any value from memory.
	Source string `toml:"source" json:"source"`
	// Efficiency is a switching module's efficiency as a fraction (0 for linear parts).
	Efficiency float64 `toml:"efficiency" json:"efficiency,omitempty"`
	// Notes are remarks a technician should read.
	Notes []string `toml:"notes" json:"notes,omitempty"`
	// Packages are the package variants.
	Packages []Package `toml:"package" json:"package"`

	// Origin is the file the family was loaded from.
	Origin string `toml:"-" json:"origin"`
	// Replaces is the origin of a family with the same id that this one replaced; "" = none.
	Replaces string `toml:"-" json:"replaces,omitempty"`
	pos      position
}

// position is where an entry stands in its file, for lint messages.
type position struct {
	file string
	ix   tomlpos.Locator
	path string // "family[3]"
}

// Catalog is a merged set of outlines and families.
type Catalog struct {
	Outlines []Outline // every outline, in load order
	Families []Family  // every family, in load order (a replacement takes the replaced one's place)
}

// Family returns the family with the given id (case-insensitive), or nil.
func (c *Catalog) Family(id string) *Family {
	for i := range c.Families {
		if strings.EqualFold(c.Families[i].ID, id) {
			return &c.Families[i]
		}
	}
	return nil
}

// Outline returns the outline whose name or alias is name (case-insensitive), or nil.
func (c *Catalog) Outline(name string) *Outline {
	for i := range c.Outlines {
		o := &c.Outlines[i]
		if strings.EqualFold(o.Name, name) {
			return o
		}
		for _, a := range o.Aliases {
			if strings.EqualFold(a, name) {
				return o
			}
		}
	}
	return nil
}

// Sorted returns the families ordered by id, for stable listings.
func (c *Catalog) Sorted() []*Family {
	out := make([]*Family, len(c.Families))
	for i := range c.Families {
		out[i] = &c.Families[i]
	}
	sort.Slice(out, func(i, j int) bool { return out[i].ID < out[j].ID })
	return out
}

// Weight returns the outline's share weight for the prior (its commonness, 3 if unset).
func (o *Outline) Weight() float64 {
	if o == nil || o.Commonness == 0 {
		return 3
	}
	return float64(o.Commonness)
}

// Negative reports whether the family regulates a negative rail.
func (f *Family) Negative() bool { return f.Polarity == Negative }

// Adjustable reports whether the family is adjustable.
func (f *Family) Adjustable() bool { return f.Kind == KindAdjustable }

// Switching reports whether the family is a switching drop-in module.
func (f *Family) Switching() bool { return f.Pass == PassSwitching }

// NonRegulator reports whether the family is a look-alike (a transistor, a
// shunt reference, a switching-regulator IC): it is never offered as a
// replacement.
func (f *Family) NonRegulator() bool { return f.Kind == KindNonRegulator }

// Current returns the rated current of package p, amperes.
func (f *Family) Current(p *Package) float64 {
	if p != nil && p.CurrentA > 0 {
		return p.CurrentA
	}
	return f.CurrentA
}

// StatusOf returns the production status of package p.
func (f *Family) StatusOf(p *Package) Status {
	if p != nil && p.Status != "" {
		return p.Status
	}
	return f.Status
}

// VinMax returns a fixed part's absolute maximum input for output vout
// (magnitudes, volts). For adjustable parts it returns 0: their limit is
// [Family.VdiffMaxV].
func (f *Family) VinMax(vout float64) float64 {
	if f.VinMaxHighV > 0 && vout >= f.VinMaxHighFromV-1e-9 {
		return f.VinMaxHighV
	}
	return f.VinMaxV
}

// Package returns the variant in the given outline, or nil.
func (f *Family) Package(c *Catalog, outline string) *Package {
	o := c.Outline(outline)
	for i := range f.Packages {
		p := &f.Packages[i]
		if strings.EqualFold(p.Outline, outline) || (o != nil && c.Outline(p.Outline) == o) {
			return p
		}
	}
	return nil
}

// Terminals returns the function of every terminal of p: the leads, then the
// case when the outline makes it a terminal.
func (p *Package) Terminals(o *Outline) []string {
	t := append([]string(nil), p.Pins...)
	if o != nil && o.CaseTerminal && p.Tab != TabNone {
		t = append(t, p.Tab)
	}
	return t
}

// Lead returns the 1-based number of the first lead with function fn, or 0.
func (p *Package) Lead(fn string) int {
	for i, f := range p.Pins {
		if f == fn {
			return i + 1
		}
	}
	return 0
}

// Common returns the function of the family's common lead: GND or ADJ.
func (f *Family) Common(p *Package) string {
	if p.Lead(PinGnd) > 0 || p.Tab == PinGnd {
		return PinGnd
	}
	return PinAdj
}

// VoltageCode returns the two-digit code a fixed part's marking uses for vout:
// "05" for 5 V, "12" for 12 V, "85" for 8.5 V, "33" for 3.3 V.
func VoltageCode(vout float64) string {
	if math.Abs(vout-math.Round(vout)) < 1e-9 {
		return fmt.Sprintf("%02d", int(math.Round(vout)))
	}
	s := strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.2f", vout), "0"), ".")
	return strings.ReplaceAll(s, ".", "")
}

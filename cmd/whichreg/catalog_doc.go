package main

import (
	"github.com/whichreg/whichreg/catalog"
)

// familyDoc is a catalog family in JSON documents (catalog list and show):
// SI units with the unit in the key, null for what the catalog leaves out.
// The TOML keys of the catalog file keep their own units (iq_ma, min_uf):
// they are a contract of their own.
type familyDoc struct {
	ID       string  `json:"id"`
	Title    string  `json:"title"`
	Polarity string  `json:"polarity"`
	Kind     string  `json:"kind"`
	Device   *string `json:"device"`
	Pass     string  `json:"pass"`
	// OutputsV are a fixed family's voltages, signed.
	OutputsV        []float64    `json:"outputs_v"`
	VrefV           *float64     `json:"vref_v"`
	VoutMaxV        *float64     `json:"vout_max_v"`
	Tolerance       float64      `json:"tolerance"`
	CurrentA        float64      `json:"current_a"`
	VinMaxV         *float64     `json:"vin_max_v"`
	VinMaxHighV     *float64     `json:"vin_max_high_v"`
	VinMaxHighFromV *float64     `json:"vin_max_high_from_v"`
	TransientMaxV   *float64     `json:"transient_max_v"`
	VdiffMaxV       *float64     `json:"vdiff_max_v"`
	DropoutV        float64      `json:"dropout_v"`
	IqA             *float64     `json:"iq_a"`
	IqTypA          *float64     `json:"iq_typ_a"`
	IadjA           *float64     `json:"iadj_a"`
	IadjTypA        *float64     `json:"iadj_typ_a"`
	MinLoadA        float64      `json:"min_load_a"`
	TjMaxC          float64      `json:"tj_max_c"`
	Cout            coutDoc      `json:"cout"`
	Efficiency      *float64     `json:"efficiency"`
	Status          string       `json:"status"`
	Since           *int         `json:"since"`
	Commonness      int          `json:"commonness"`
	Markings        []string     `json:"markings"`
	Source          string       `json:"source"`
	Notes           []string     `json:"notes"`
	Packages        []packageDoc `json:"packages"`
	// Origin is the file the family comes from ("builtin:…" for the built-in catalog).
	Origin   string  `json:"origin"`
	Replaces *string `json:"replaces"`
}

// coutDoc is the output-capacitor requirement, in farads and ohms; null
// where there is no limit.
type coutDoc struct {
	MinF      *float64 `json:"min_f"`
	MaxF      *float64 `json:"max_f"`
	ESRMinOhm *float64 `json:"esr_min_ohm"`
	ESRMaxOhm *float64 `json:"esr_max_ohm"`
	CeramicOK bool     `json:"ceramic_ok"`
}

// packageDoc is a family as sold in one outline.
type packageDoc struct {
	Outline string `json:"outline"`
	// Variant names the pinout when one outline has several; null otherwise.
	Variant *string `json:"variant"`
	// Leads are the functions of leads 1..n in the outline's numbering.
	LeadFunctions []string `json:"lead_functions"`
	Tab           string   `json:"tab"`
	ThetaJCCPerW  float64  `json:"theta_jc_c_per_w"`
	ThetaJACPerW  float64  `json:"theta_ja_c_per_w"`
	CurrentA      float64  `json:"current_a"`
	Status        string   `json:"status"`
	Note          *string  `json:"note"`
}

// outlineDoc is a package outline.
type outlineDoc struct {
	Name         string   `json:"name"`
	Aliases      []string `json:"aliases"`
	Leads        int      `json:"leads"`
	PitchM       float64  `json:"pitch_m"`
	HoleSpacingM *float64 `json:"hole_spacing_m"`
	Tab          bool     `json:"tab"`
	MetalCan     bool     `json:"metal_can"`
	CaseTerminal bool     `json:"case_terminal"`
	Isolated     bool     `json:"isolated"`
	SMD          bool     `json:"smd"`
	View         string   `json:"view"`
	Source       string   `json:"source"`
	Origin       string   `json:"origin"`
}

func familyDocOf(f *catalog.Family) familyDoc {
	sign := 1.0
	if f.Negative() {
		sign = -1
	}
	d := familyDoc{ID: f.ID, Title: f.Title, Polarity: string(f.Polarity), Kind: string(f.Kind), Device: orNull(string(f.Device)),
		Pass: string(f.Pass), OutputsV: []float64{}, VrefV: positive(f.VrefV, 1), VoutMaxV: positive(f.VoutMaxV, 1),
		Tolerance: f.Tolerance, CurrentA: f.CurrentA, VinMaxV: positive(f.VinMaxV, 1), VinMaxHighV: positive(f.VinMaxHighV, 1),
		VinMaxHighFromV: positive(f.VinMaxHighFromV, 1), TransientMaxV: positive(f.TransientMaxV, 1),
		VdiffMaxV: positive(f.VdiffMaxV, 1), DropoutV: f.DropoutV,
		IqA: positive(f.IqMA, 1e-3), IqTypA: positive(f.IqTypMA, 1e-3), IadjA: positive(f.IadjUA, 1e-6), IadjTypA: positive(f.IadjTypUA, 1e-6),
		MinLoadA: round(f.MinLoadMA*1e-3, 12), TjMaxC: f.TjMaxC, Efficiency: positive(f.Efficiency, 1), Status: string(f.Status),
		Commonness: f.Commonness, Markings: nonNil(f.Markings), Source: f.Source, Notes: nonNil(f.Notes), Packages: []packageDoc{},
		Origin: f.Origin, Replaces: orNull(f.Replaces),
		Cout: coutDoc{MinF: positive(f.Cout.MinUF, 1e-6), MaxF: positive(f.Cout.MaxUF, 1e-6), ESRMinOhm: positive(f.Cout.ESRMinOhm, 1),
			ESRMaxOhm: positive(f.Cout.ESRMaxOhm, 1), CeramicOK: f.Cout.CeramicOK},
	}
	if d.Pass == "" && f.Kind != "non-regulator" {
		d.Pass = "npn"
	}
	for _, v := range f.OutputsV {
		d.OutputsV = append(d.OutputsV, sign*v)
	}
	if f.Since > 0 {
		y := f.Since
		d.Since = &y
	}
	for i := range f.Packages {
		p := &f.Packages[i]
		d.Packages = append(d.Packages, packageDoc{Outline: p.Outline, Variant: orNull(p.Variant), LeadFunctions: nonNil(p.Pins), Tab: p.Tab,
			ThetaJCCPerW: p.ThetaJC, ThetaJACPerW: p.ThetaJA, CurrentA: f.Current(p), Status: string(f.StatusOf(p)), Note: orNull(p.Note)})
	}
	return d
}

func outlineDocOf(o *catalog.Outline) outlineDoc {
	return outlineDoc{Name: o.Name, Aliases: nonNil(o.Aliases), Leads: o.Leads, PitchM: round(o.PitchMM*1e-3, 9),
		HoleSpacingM: positive(o.HoleSpacingMM, 1e-3), Tab: o.Tab, MetalCan: o.MetalCan, CaseTerminal: o.CaseTerminal,
		Isolated: o.Isolated, SMD: o.SMD, View: o.View, Source: o.Source, Origin: o.Origin}
}

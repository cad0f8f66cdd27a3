package replace

import (
	"math"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
)

// cand is one candidate with the figures several checks read, worked out
// once by prepareCandidate before any check runs.
type cand struct {
	infer.Hypothesis // VoutV: the part's nominal output (a fixed part's standard voltage, an adjustable's setting)

	outV float64 // what it will make here (magnitude): on a lifted ground, nominal plus the lift

	sameHoles bool // its leads go into the old holes in the old order
	// tabV is the candidate's tab or can potential here (signed volts); nil
	// when it has none or it is insulated.
	tabV *float64
	// kit: the tab must be insulated from the heat sink and the board's
	// insulator does not do it.
	kit bool
	// thetaCS is the case-to-sink resistance the thermal path uses.
	thetaCS float64
	// iregA is the regulator's own current at full load and lowest input
	// (the bypass resistor's share taken off).
	iregA float64
	// bypass is the bypass resistor's solution (nil without one).
	bypass *circuit.BypassResult
	// powerW is the worst dissipation over the mean-input range, atV where.
	powerW, atV float64
	// divider is the new divider an adjustable candidate needs (nil when it
	// reuses the old one or needs none); dividerErr why none was found.
	divider    *circuit.DividerChoice
	dividerErr error
}

// prepareCandidate works out a candidate's shared figures.
func prepareCandidate(in *Input, h infer.Hypothesis) cand {
	c := cand{Hypothesis: h}
	f, cd := h.Family, &in.Cond
	oo, o := in.Orig.Outline, h.Outline
	c.sameHoles = sameHoles(oo, o)
	// The output it will make.
	c.VoutV = nominalOf(in, h)
	c.outV = c.VoutV
	switch {
	case f.Adjustable():
		if !(in.Orig.Family.Adjustable() && in.Network.Resistors()) {
			d, err := chooseFor(f, cd.VoutV)
			if err == nil {
				c.divider = &d
			}
			c.dividerErr = err
		}
	case in.Lifted:
		c.outV = c.VoutV + in.Network.Lift(c.VoutV, iqTypA(f)) // as the datasheet's typical part makes it
	}
	// Tab potential and insulation.
	c.tabV, c.kit = tabPotential(in, h)
	ins := cd.Insulator
	if c.kit {
		ins = "mica" // the kit fitted: greased mica washer and bushing
	}
	size := circuit.SmallTab
	if o != nil && o.CaseTerminal {
		size = circuit.LargeCan
	}
	c.thetaCS, _ = circuit.CaseToSink(ins, size)
	// Current and dissipation, with the bypass resistor's share.
	vout := cd.VoutV
	c.iregA = in.RegLoadA
	if cd.BypassOhm > 0 {
		b := circuit.Bypass{ROhm: cd.BypassOhm, VinMinV: math.Min(cd.TroughV, cd.ColdInV), VinMaxV: math.Max(cd.PeakV, cd.HotInV), VoutV: vout,
			LoadMinA: math.Min(cd.LoadMinA, in.RegLoadA), LoadMaxA: in.RegLoadA, RegMinA: f.MinLoadMA * 1e-3}
		if r, err := b.Solve(); err == nil {
			c.bypass = &r
			c.iregA = math.Max(0, r.RegulatorMaxA)
		}
	}
	c.powerW, c.atV = dissipation(in, f, vout)
	return c
}

// dissipation is the regulator's worst dissipation over the mean input from
// low to high mains at full load: P = (Vin − Vout)·I + Vin·Ignd, with a
// bypass resistor taking (Vin − Vout)/R of the load, which puts the worst
// case inside the range where (Vin − Vout) = I·R/2 ([circuit.Bypass]).
func dissipation(in *Input, f *catalog.Family, vout float64) (w, atV float64) {
	cd := &in.Cond
	if f.Switching() {
		return vout * in.RegLoadA * (1/f.Efficiency - 1), cd.HotInV
	}
	lo, hi := math.Min(cd.ColdInV, cd.HotInV), math.Max(cd.ColdInV, cd.HotInV)
	if cd.BypassOhm <= 0 {
		return circuit.RegulatorDissipation(hi, vout, in.RegLoadA, f.GroundCurrentA(in.RegLoadA)), hi
	}
	b := circuit.Bypass{ROhm: cd.BypassOhm, VinMinV: lo, VinMaxV: hi, VoutV: vout, LoadMaxA: in.RegLoadA}
	return b.RegulatorPowerMax(f.GroundCurrentA(in.RegLoadA))
}

// sameHoles reports whether a candidate in outline o goes into the holes of
// a part in outline oo, lead for lead: the same outline, or the same number
// of through-hole leads at the same pitch.
func sameHoles(oo, o *catalog.Outline) bool {
	if oo == nil || o == nil {
		return false
	}
	return oo == o || (o.Leads == oo.Leads && math.Abs(o.PitchMM-oo.PitchMM) < 0.15 && !o.SMD && !oo.SMD && !o.CaseTerminal && !oo.CaseTerminal)
}

// tabPotential returns the candidate's tab potential in this circuit (nil
// for none or insulated) and whether an insulating kit must be fitted: the
// potential differs from what the heat sink is at (chassis, or the old tab's
// potential on a floating sink) and the board's insulator does not cover it.
func tabPotential(in *Input, h infer.Hypothesis) (*float64, bool) {
	o, p := h.Outline, h.Package
	if o == nil || !(o.Tab || o.MetalCan) || o.Isolated || p.Tab == catalog.TabNone || o.SMD {
		return nil, false
	}
	v, ok := potential(in, h.Family, p.Tab, nominalOf(in, h))
	if !ok {
		return nil, false
	}
	cd := &in.Cond
	if cd.OldTabV != nil && sameNode(in, h) && h.Family == in.Orig.Family {
		v = *cd.OldTabV // the same part on the same net: what was measured there
	}
	if !hasHeatsink(in) {
		return &v, false // nothing to touch: no heat sink
	}
	sink := 0.0
	if !cd.Grounded {
		if cd.OldTabV == nil || sameNode(in, h) {
			return &v, false // a floating heat sink on the same net as before
		}
		sink = *cd.OldTabV
	}
	insulated := cd.Insulator == "mica" || cd.Insulator == "silicone"
	return &v, math.Abs(v-sink) >= liveV && !insulated
}

// liveV is the potential difference from which a tab counts as live
// against its heat sink: a lifted ground of a diode drop or more, any rail
// (common practice, no source: 50 mV is far below any lift or rail and above
// the drop of a ground return).
const liveV = 0.05

// nominalOf returns the nominal output of a fixed candidate (its standard
// voltage nearest the original's nominal, or the set output when the
// original is adjustable or its voltage unknown), or the target of an
// adjustable one.
func nominalOf(in *Input, h infer.Hypothesis) float64 {
	if h.Family.Adjustable() {
		return in.Cond.VoutV
	}
	v, _ := nearestOutput(h.Family, wantedNominal(in))
	return v
}

// wantedNominal is the fixed output a replacement should have: the
// original's nominal, or the set output when the original is adjustable
// or its voltage unknown.
func wantedNominal(in *Input) float64 {
	if in.Orig.Family.Adjustable() || in.Orig.VoutV == 0 {
		return in.Cond.VoutV
	}
	return in.Orig.VoutV
}

// chooseFor picks the E24 divider an adjustable family needs for vout.
func chooseFor(f *catalog.Family, vout float64) (circuit.DividerChoice, error) {
	return circuit.ChooseDivider(circuit.DividerSpec{TargetV: vout, VrefV: f.VrefV, ITypA: f.IadjTypUA * 1e-6,
		IMaxA: f.IadjUA * 1e-6, MinLoadA: f.MinLoadMA * 1e-3, Tolerance: f.Tolerance})
}

// nearestOutput returns the family's standard output nearest to v, and
// whether it is within 2 %.
func nearestOutput(f *catalog.Family, v float64) (float64, bool) {
	best := 0.0
	for _, o := range f.OutputsV {
		if best == 0 || math.Abs(o-v) < math.Abs(best-v) {
			best = o
		}
	}
	return best, best > 0 && math.Abs(best-v) <= 0.02*v
}

// iqTypA is the typical ground current (the maximum when no typical is given).
func iqTypA(f *catalog.Family) float64 {
	if f.IqTypMA > 0 {
		return f.IqTypMA * 1e-3
	}
	return f.IqMA * 1e-3
}

// hasHeatsink reports whether the part is bolted to a heat sink (a θSA, or
// the evidence says whether the heat sink is bonded to chassis).
func hasHeatsink(in *Input) bool {
	return in.Cond.HeatsinkCW > 0 || (in.Ev.Mount != nil && in.Ev.Mount.ChassisHeatsink != nil)
}

// sameNode reports whether the candidate's tab is tied to the same net as
// the old part's: the same function (the common lead counting as one) in
// the same kind of circuit (a fixed part's lifted ground is not an
// adjustable part's ADJ node).
func sameNode(in *Input, h infer.Hypothesis) bool {
	o := in.Orig
	return o.Package.Tab != catalog.TabNone && common(o.Package.Tab) == common(h.Package.Tab) && o.Family.Adjustable() == h.Family.Adjustable()
}

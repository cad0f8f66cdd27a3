package replace

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
)

// Conditions are the circuit's numbers every check uses (magnitudes; the
// original's polarity gives the sign).
type Conditions struct {
	VoutV       float64           `json:"vout_v"`           // target output
	LoadMaxA    float64           `json:"load_max_a"`       // full load, given or assumed
	LoadAssumed bool              `json:"load_assumed"`     // the full load was not given (see the assumptions)
	LoadMinA    float64           `json:"load_min_a"`       // lightest load
	Source      infer.InputSource `json:"input_source"`     // rectifier, dc, reading
	TroughV     float64           `json:"trough_v"`         // lowest input: low mains, full load, low C
	TroughAt    string            `json:"trough_at"`        // the corner or measurement it comes from
	PeakV       float64           `json:"peak_v"`           // highest input: high mains, light load
	PeakAt      string            `json:"peak_at"`          //
	HotInV      float64           `json:"hot_in_v"`         // mean input at high mains, full load
	ColdInV     float64           `json:"cold_in_v"`        // mean input at low mains, full load
	TransientV  float64           `json:"transient_v"`      // a surge the part must survive; 0 = none stated
	AmbientC    float64           `json:"ambient_c"`        //
	HeatsinkCW  float64           `json:"heatsink_c_per_w"` // θSA; 0 = free air (no heat sink)
	Insulator   string            `json:"insulator"`        // the old part's insulator
	Grounded    bool              `json:"grounded"`         // heat sink bonded to chassis/ground (or not known: taken as bonded)
	BypassOhm   float64           `json:"bypass_ohm"`       // 0 = none
	// InputConflict says why the [input] description was set aside for the
	// IN lead's reading ("" when they agree or only one is given).
	InputConflict string `json:"input_conflict,omitempty"`
	// OldTabV is the potential of the old part's tab or can, volts, signed;
	// null when it has none or nothing says.
	OldTabV *float64 `json:"old_tab_v"`
	// Corners is the rectifier sweep, when the evidence describes the rectifier.
	Corners *circuit.CornerResult `json:"corners,omitempty"`
	// Rectifier is the nominal rectifier circuit (nil when not described).
	Rectifier *circuit.Rectifier `json:"-"`
}

// Network is the original's common-lead network: an adjustable part's
// divider, or the resistors, diodes and zener lifting a fixed part's ground.
type Network struct {
	RTopOhm    float64 // OUT to the common lead; 0 = none
	RBottomOhm float64 // common lead to the return rail; 0 = none
	BottomV    float64 // the return rail, magnitude
	DiodeDrops int     // silicon diodes in series in the common lead
	ZenerV     float64 // a zener in the common lead
}

// Resistors reports whether the network has both resistors.
func (n *Network) Resistors() bool { return n != nil && n.RTopOhm > 0 && n.RBottomOhm > 0 }

// diodeDropV is a small silicon diode's forward drop at a regulator's
// ground current (1N4148/1N400x at a few mA: 0.6–0.7 V; common practice).
const diodeDropV = 0.65

// Lift returns the common lead's potential above the return rail with a
// ground (or ADJ) current of iA flowing into the network and nominal output
// vnom across OUT to common: the resistors' share ([circuit.DividerVout]
// less vnom) plus the diodes and zener.
func (n *Network) Lift(vnomV, iA float64) float64 {
	fixed := float64(n.DiodeDrops)*diodeDropV + n.ZenerV
	if !n.Resistors() {
		return fixed
	}
	v, err := circuit.DividerVout(vnomV, iA, n.RTopOhm, n.RBottomOhm, n.BottomV+fixed)
	if err != nil {
		return fixed
	}
	return v - vnomV
}

// Cap is the board's output capacitor as the evidence gives it.
type Cap struct {
	UF     float64       // microfarads; meaningful when UFSet
	UFSet  bool          // the evidence gives a capacitance
	Type   infer.CapType // "" when not given
	Silent bool          // nothing at all is said about it
}

// Input is everything the checks read: prepared once per swap.
type Input struct {
	Ev   *infer.Evidence // the evidence as loaded
	Orig infer.Original  // the part being replaced
	Op   infer.Operating // the input and load at every corner
	Cond Conditions      // the conditions every candidate is checked under
	// Network is the original's common-lead network (nil when none).
	Network *Network
	// SourceA is the current the original sets when it is wired as a
	// current source ([infer.CurrentSourceA]); 0 = a voltage regulator.
	SourceA float64
	// Lifted is true when a fixed original sits on a common-lead network.
	Lifted bool
	Cap    Cap
	// RegLoadA is what the regulator itself carries at full load: the load,
	// or with an external pass transistor ([booster]) at most the current
	// whose drop across the sense resistor turns the transistor on.
	RegLoadA float64
	// Booster is true when an external pass transistor carries the rest.
	Booster bool
}

// boosterVBEV is the base-emitter voltage at which a booster transistor
// takes over, at its highest (a power transistor near its rated current;
// TIP32C/MJ2955 VBE(on) up to about 0.8–1 V, common practice): the
// regulator carries up to VBE/R_sense.
const boosterVBEV = 0.8

// Prepare builds the checks' input from the evidence and the original. It
// fails when the output or the input voltage cannot be known.
func Prepare(ev *infer.Evidence, orig infer.Original) (*Input, []string, error) {
	in := &Input{Ev: ev, Orig: orig}
	cd := &in.Cond
	tv := infer.TerminalVolts(orig.Hypothesis, ev)
	cd.VoutV = orig.VoutV
	if v, ok := tv[catalog.PinOut]; ok && math.Abs(v) > 0 {
		cd.VoutV = math.Abs(v)
	}
	if cd.VoutV == 0 {
		return nil, nil, fmt.Errorf("the output voltage is unknown: give the OUT lead's volts or the [network] resistors")
	}
	opts := infer.OperatingOptions{Sweep: infer.SweepAll, AssumedLoadA: orig.Family.Current(orig.Package)}
	if ia, ok := infer.CurrentSourceA(orig.Hypothesis, ev); ok {
		in.SourceA = ia
		opts.AssumedLoadA = ia
		opts.AssumedLoadWhy = fmt.Sprintf("load not given: the part is wired as a current source (%s from OUT to its common lead, which feeds the load), so the load is taken as the current it sets, %.3g A, in the input model and in every check; the output's voltage follows the load", ohms(ev.Network.RTopOhms.V), ia)
	}
	op, err := infer.OperatingPoint(ev, opts)
	if err != nil {
		return nil, nil, err
	}
	in.Op = *op
	if vin, ok := tv[catalog.PinIn]; ok {
		in.Op, cd.InputConflict = in.Op.Reconcile(vin)
		in.Op = in.Op.FromReading(vin)
	}
	if in.Op.Source == infer.InputUnknown {
		return nil, nil, fmt.Errorf("the input voltage is unknown: give the IN lead's volts, or the [input] rectifier, secondary and filter (or a DC supply)")
	}
	o := &in.Op
	as := append([]string(nil), o.Assumptions...)
	cd.LoadMaxA, cd.LoadAssumed, cd.LoadMinA = o.LoadMaxA, o.LoadAssumed, o.LoadMinA
	cd.Source = o.Source
	cd.TroughV, cd.TroughAt = o.Trough.V, o.Trough.At
	cd.PeakV, cd.PeakAt = o.Peak.V, o.Peak.At
	cd.HotInV, cd.ColdInV = o.MeanHigh.V, o.MeanLow.V
	cd.TransientV = o.TransientV
	cd.Corners, cd.Rectifier = o.Corners, o.Rectifier
	if ev.Bypass != nil {
		cd.BypassOhm = ev.Bypass.Ohms.V
	}
	in.RegLoadA = cd.LoadMaxA
	if b := ev.Booster; b != nil {
		in.Booster = true
		if b.RSenseOhms.V > 0 {
			in.RegLoadA = math.Min(cd.LoadMaxA, boosterVBEV/b.RSenseOhms.V)
			as = append(as, fmt.Sprintf("external pass transistor: the regulator carries at most %.2g V / %s = %.3g A of the load (the transistor's turn-on voltage taken as %.2g V)",
				boosterVBEV, ohms(b.RSenseOhms.V), in.RegLoadA, boosterVBEV))
			if cd.Source != infer.InputReading {
				// The described supply feeds the sense resistor, not the
				// regulator: at full load its IN lead sits the resistor's
				// drop (up to the transistor's VBE) lower.
				drop := math.Min(cd.LoadMaxA*b.RSenseOhms.V, boosterVBEV)
				cd.TroughV -= drop
				cd.TroughAt += fmt.Sprintf(", less %.2g V across the booster's sense resistor", drop)
			}
		} else {
			as = append(as, "external pass transistor without its sense resistor: the regulator is taken to carry the whole load (give [booster] r_sense_ohms)")
		}
	}
	as = append(as, in.prepareMount()...)
	if nw := ev.Network; nw != nil {
		n := &Network{RTopOhm: nw.RTopOhms.V, RBottomOhm: nw.RBottomOhms.V, BottomV: math.Abs(nw.BottomToVolts.V), ZenerV: math.Abs(nw.ZenerVolts.V)}
		if nw.DiodeDrops != nil {
			n.DiodeDrops = *nw.DiodeDrops
		}
		if n.Resistors() || n.DiodeDrops > 0 || n.ZenerV > 0 {
			in.Network = n
			in.Lifted = !orig.Family.Adjustable()
		}
	}
	cd.OldTabV = oldTabPotential(in, tv)
	if out := ev.Output; out != nil {
		in.Cap = Cap{UF: out.CapUF.V, UFSet: out.CapUF.Set, Type: out.CapType}
		if out.CapType == infer.CapNone {
			in.Cap.UF, in.Cap.UFSet = 0, true
		}
	}
	in.Cap.Silent = !in.Cap.UFSet && in.Cap.Type == ""
	return in, as, nil
}

// prepareMount fills the mounting conditions and returns what it assumed.
func (in *Input) prepareMount() []string {
	var as []string
	cd, m := &in.Cond, in.Ev.Mount
	cd.AmbientC = 40
	if m != nil && m.AmbientC.Set {
		cd.AmbientC = m.AmbientC.V
	} else {
		as = append(as, "ambient 40 °C assumed (inside a closed cabinet)")
	}
	cd.Insulator = string(infer.InsulatorUnknown)
	if m != nil {
		cd.HeatsinkCW = m.HeatsinkCPerW.V
		if m.Insulator != "" {
			cd.Insulator = string(m.Insulator)
		}
	}
	if m == nil || !m.HeatsinkCPerW.Set {
		as = append(as, "no heat sink given: free air assumed")
	}
	switch {
	case m != nil && m.ChassisHeatsink != nil:
		cd.Grounded = *m.ChassisHeatsink
	case cd.HeatsinkCW > 0:
		cd.Grounded = true
		as = append(as, "the heat sink is taken as bonded to chassis (not said): a live tab on it needs insulating")
	}
	return as
}

// oldTabPotential is the potential of the old part's tab or can: measured,
// or the voltage of the function it is tied to (a lifted ground's lift, a
// negative part's input).
func oldTabPotential(in *Input, tv map[string]float64) *float64 {
	h := in.Orig.Hypothesis
	if h.Outline == nil || !(h.Outline.Tab || h.Outline.MetalCan) || h.Outline.Isolated || h.Package.Tab == catalog.TabNone {
		return nil
	}
	if c := in.Ev.Case; c != nil && c.Volts.Set {
		v := c.Volts.V
		return &v
	}
	if v, ok := tv[h.Package.Tab]; ok {
		return &v
	}
	v, ok := potential(in, h.Family, h.Package.Tab, h.VoutV)
	if !ok {
		return nil
	}
	return &v
}

// potential returns the signed voltage of terminal function fn of a part of
// family f with nominal output vnom (fixed parts) placed in this circuit.
func potential(in *Input, f *catalog.Family, fn string, vnom float64) (float64, bool) {
	cd := &in.Cond
	switch fn {
	case catalog.PinOut:
		return f.Signed(cd.VoutV), true
	case catalog.PinIn:
		return f.Signed(in.Op.Nominal.MeanV), true
	case catalog.PinGnd, catalog.PinAdj:
		if f.Adjustable() {
			return f.Signed(math.Max(0, cd.VoutV-f.VrefV)), true
		}
		if in.Lifted {
			return f.Signed(in.Network.Lift(vnom, f.GroundCurrentA(cd.LoadMaxA))), true
		}
		return 0, true
	}
	return 0, false
}

package main

import (
	"fmt"
	"io"
	"math"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/internal/units"
)

func newCalcCmd(app *App) *cobra.Command {
	cmd := &cobra.Command{
		Use:   "calc",
		Short: "Bench calculations: rectifier, bypass booster, heat sink, divider, test load",
		Long: `The electrical models behind the replacement checks, on their own. Values take
SI prefixes and IEC 60062 RKM code: 4k7, 0R22, 2u2, 2200u, 330m, 1.6A.`,
	}
	cmd.AddCommand(newCalcRectifierCmd(app, nil), newCalcBoostCmd(app, nil), newCalcHeatsinkCmd(app, nil),
		newCalcDividerCmd(app, nil), newCalcTestloadCmd(app, nil))
	return cmd
}

// requireFlags returns a usage error naming every one of the flags that was not given.
func requireFlags(cmd *cobra.Command, names ...string) error {
	var missing []string
	for _, n := range names {
		if !cmd.Flags().Changed(n) {
			missing = append(missing, "--"+n)
		}
	}
	if len(missing) == 0 {
		return nil
	}
	if len(missing) == 1 {
		return flagErrorf("%s is required", missing[0])
	}
	return flagErrorf("%s and %s are required", strings.Join(missing[:len(missing)-1], ", "), missing[len(missing)-1])
}

type calcRectifierOptions struct {
	app           *App
	Format        string
	Rectifier     string
	Vrms          float64
	Hz            float64
	Cap           float64
	ESR           float64
	Load          float64
	RLoad         float64
	MinLoad       float64
	Regulation    float64
	Rs            float64
	MainsTol      float64
	CapTol        float64
	Spice         bool
	regSet, rsSet bool
}

func newCalcRectifierCmd(app *App, runF func(*calcRectifierOptions) error) *cobra.Command {
	opts := &calcRectifierOptions{app: app}
	cmd := &cobra.Command{
		Use:   "rectifier",
		Short: "Simulate a rectifier and filter capacitor to its steady state, with mains and load corners",
		Long: `rectifier simulates the transformer secondary, rectifier diodes (1N4007 model),
filter capacitor and load to the periodic steady state, at nominal mains and at
every corner (mains low/high, load min/max, capacitor nominal/low).

--vrms is the secondary voltage measured at the load given (per half-winding for
a centre tap). The transformer's regulation turns it into an open-circuit EMF and
a winding resistance; or give the winding resistance itself with --rs, and
--vrms is then the open-circuit voltage.

With --spice it prints an ngspice netlist of the nominal case instead.`,
		Example: `  whichreg calc rectifier --rectifier bridge --vrms 12.6 --cap 2200u --load 0.8
  whichreg calc rectifier --rectifier center-tap --vrms 9 --hz 60 --cap 4700u --rload 10 --rs 0R3
  whichreg calc rectifier --rectifier bridge --vrms 12 --cap 2200u --load 1 --spice > check.cir`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.regSet = cmd.Flags().Changed("regulation")
			opts.rsSet = cmd.Flags().Changed("rs")
			if opts.regSet && opts.rsSet {
				return flagErrorf("give --regulation or --rs, not both")
			}
			if cmd.Flags().Changed("load") == cmd.Flags().Changed("rload") {
				return flagErrorf("give the load as --load AMPS (a regulator) or --rload OHMS (a resistor), one of them")
			}
			if err := requireFlags(cmd, "vrms", "cap"); err != nil {
				return err
			}
			if runF != nil {
				return runF(opts)
			}
			return calcRectifierRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	opts.Rectifier = "bridge"
	addEnumFlag(cmd, &opts.Rectifier, "rectifier", "rectifier", "bridge", "center-tap", "half-wave")
	addQuantity(cmd, &opts.Vrms, "vrms", "V", 0, "secondary voltage, V RMS, measured at the load (per half for center-tap)")
	addQuantity(cmd, &opts.Hz, "hz", "Hz", 50, "mains frequency")
	addQuantity(cmd, &opts.Cap, "cap", "F", 0, "filter capacitance, e.g. 2200u")
	addQuantity(cmd, &opts.ESR, "esr", "Ω", 0, "filter capacitor ESR")
	addQuantity(cmd, &opts.Load, "load", "A", 0, "load current (a regulator's load is a constant current)")
	addQuantity(cmd, &opts.RLoad, "rload", "Ω", 0, "load resistance")
	addQuantity(cmd, &opts.MinLoad, "min-load", "A", 0, "lightest load for the corners (with --load)")
	addQuantity(cmd, &opts.Regulation, "regulation", "", 0.10, "transformer regulation, fraction (no-load rise over loaded voltage)")
	addQuantity(cmd, &opts.Rs, "rs", "Ω", 0, "winding resistance per conducting path instead of --regulation")
	addQuantity(cmd, &opts.MainsTol, "mains-tolerance", "", 0.10, "mains tolerance either way, fraction (IEC 60038: 0.10)")
	addQuantity(cmd, &opts.CapTol, "cap-tolerance", "", 0.20, "capacitor tolerance downward, fraction")
	cmd.Flags().BoolVar(&opts.Spice, "spice", false, "print an ngspice netlist of the nominal case instead")
	return cmd
}

// rectifierJSON is the JSON contract of `calc rectifier` (DESIGN.md).
type rectifierJSON struct {
	Rectifier     string               `json:"rectifier"`
	EMFVrms       float64              `json:"emf_vrms"`
	SourceOhm     float64              `json:"source_ohm"`
	PeakV         float64              `json:"peak_v"`
	TroughV       float64              `json:"trough_v"`
	MeanV         float64              `json:"mean_v"`
	RippleVpp     float64              `json:"ripple_vpp"`
	CapRippleARMS float64              `json:"cap_ripple_a_rms"`
	DiodePeakA    float64              `json:"diode_peak_a"`
	ConductionDeg float64              `json:"conduction_deg"`
	Corners       circuit.CornerResult `json:"corners"`
}

func (o *calcRectifierOptions) circuit() (circuit.Rectifier, circuit.Load, error) {
	top, err := circuit.ParseTopology(o.Rectifier)
	if err != nil {
		return circuit.Rectifier{}, circuit.Load{}, flagErrorf("%v", err)
	}
	load := circuit.Load{Amps: o.Load, Ohms: o.RLoad}
	emf, rs := o.Vrms, o.Rs
	if !o.rsSet {
		idc := o.Load
		if idc == 0 && o.RLoad > 0 {
			idc = 1.2 * o.Vrms / o.RLoad // about the DC current a capacitor-input filter gives
		}
		emf, rs, err = circuit.FromRegulation(top, o.Vrms, o.Regulation, idc)
		if err != nil {
			return circuit.Rectifier{}, load, inputError(fmt.Errorf("--regulation: %v", err), "give --rs OHMS instead")
		}
	}
	return circuit.Rectifier{Topology: top, VrmsV: emf, Hz: o.Hz, CapF: o.Cap, ESROhm: o.ESR, SourceOhm: rs, Load: load}, load, nil
}

func calcRectifierRun(o *calcRectifierOptions) error {
	r, load, err := o.circuit()
	if err != nil {
		return err
	}
	res, err := r.Solve()
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	if o.Spice {
		net, err := r.Netlist(fmt.Sprintf("whichreg calc rectifier --rectifier %s --vrms %g --hz %g --cap %g", o.Rectifier, o.Vrms, o.Hz, o.Cap), res.SettleCycles)
		if err != nil {
			return inputError(err)
		}
		_, err = io.WriteString(out, net)
		return err
	}
	minLoad := circuit.Load{Amps: o.MinLoad}
	if o.RLoad > 0 {
		minLoad = circuit.Load{} // a resistive load's light corner is no load
	}
	cr, err := r.Corners(circuit.CornerSpec{MainsTol: o.MainsTol, CapTol: o.CapTol, LoadMin: minLoad, LoadMax: load})
	if err != nil {
		return inputError(err)
	}
	if o.Format == "json" {
		res = roundResult(res)
		rc := roundConditions(infer.Conditions{Corners: &cr}).Corners
		return writeJSON(out, rectifierJSON{o.Rectifier, sig(r.VrmsV), sig(r.SourceOhm), res.PeakV, res.TroughV, res.MeanV, res.RippleVpp,
			res.CapRippleARMS, res.DiodePeakA, res.ConductionDeg, *rc})
	}
	fmt.Fprintf(out, "%s rectifier, %s secondary EMF behind %s, %g Hz, %s filter",
		o.Rectifier, units.Format(r.VrmsV, "V rms"), units.Format(r.SourceOhm, "Ω"), o.Hz, units.Format(o.Cap, "F"))
	if o.ESR > 0 {
		fmt.Fprintf(out, " (ESR %s)", units.Format(o.ESR, "Ω"))
	}
	fmt.Fprintln(out)
	fmt.Fprintf(out, "nominal mains and load (%s):\n", loadText(load))
	fmt.Fprintf(out, "  peak %.3f V   trough %.3f V   mean %.3f V   ripple %.3f V p-p\n", res.PeakV, res.TroughV, res.MeanV, res.RippleVpp)
	fmt.Fprintf(out, "  capacitor ripple current %.3f A rms   diode peak %.3f A   conduction %.1f° per diode\n",
		res.CapRippleARMS, res.DiodePeakA, res.ConductionDeg)
	fmt.Fprintf(out, "corners (mains ±%g %%, capacitor −%g %%):\n", o.MainsTol*100, o.CapTol*100)
	for _, c := range cr.Corners {
		fmt.Fprintf(out, "  %-36s peak %7.3f V  trough %7.3f V  mean %7.3f V\n", c.Name, c.Result.PeakV, c.Result.TroughV, c.Result.MeanV)
	}
	fmt.Fprintf(out, "worst trough %.3f V (%s): the regulator's input must stay above Vout + dropout here\n", cr.WorstTrough.Result.TroughV, cr.WorstTrough.Name)
	fmt.Fprintf(out, "worst peak   %.3f V (%s): the regulator's input maximum must exceed this\n", cr.WorstPeak.Result.PeakV, cr.WorstPeak.Name)
	return nil
}

func loadText(l circuit.Load) string {
	switch {
	case l.Amps > 0:
		return units.Format(l.Amps, "A") + " constant"
	case l.Ohms > 0:
		return units.Format(l.Ohms, "Ω")
	}
	return "no load"
}

type calcBoostOptions struct {
	app                                               *App
	Format                                            string
	R, VinMin, VinMax, Vout, LoadMin, LoadMax, RegMin float64
}

func newCalcBoostCmd(app *App, runF func(*calcBoostOptions) error) *cobra.Command {
	opts := &calcBoostOptions{app: app}
	cmd := &cobra.Command{
		Use:   "boost",
		Short: "A bypass resistor from input to output: its current share and the minimum load it imposes",
		Long: `boost works out a resistor wired from a regulator's input to its output (an old
way to carry more current). The resistor passes (Vin − Vout)/R whatever the
load; a series regulator cannot sink current, so below that load the output
rises. Give the input at its lowest (ripple trough, low mains) and highest
(peak, high mains, light load).`,
		Example: `  whichreg calc boost --r 4R7 --vin-min 11 --vin-max 16 --vout 5 --load-min 1.5 --load-max 3`,
		Args:    cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			if err := requireFlags(cmd, "r", "vin-min", "vin-max", "vout"); err != nil {
				return err
			}
			if runF != nil {
				return runF(opts)
			}
			return calcBoostRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	addQuantity(cmd, &opts.R, "r", "Ω", 0, "bypass resistor")
	addQuantity(cmd, &opts.VinMin, "vin-min", "V", 0, "lowest regulator input")
	addQuantity(cmd, &opts.VinMax, "vin-max", "V", 0, "highest regulator input")
	addQuantity(cmd, &opts.Vout, "vout", "V", 0, "regulated output")
	addQuantity(cmd, &opts.LoadMin, "load-min", "A", 0, "lightest load")
	addQuantity(cmd, &opts.LoadMax, "load-max", "A", 0, "heaviest load")
	addQuantity(cmd, &opts.RegMin, "reg-min", "A", 0, "the regulator's own minimum load (adjustables: 10m)")
	return cmd
}

func calcBoostRun(o *calcBoostOptions) error {
	r, err := circuit.Bypass{ROhm: o.R, VinMinV: math.Abs(o.VinMin), VinMaxV: math.Abs(o.VinMax), VoutV: math.Abs(o.Vout),
		LoadMinA: o.LoadMin, LoadMaxA: o.LoadMax, RegMinA: o.RegMin}.Solve()
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		return writeJSON(out, r)
	}
	fmt.Fprintf(out, "resistor current %.3f A at %g V in, %.3f A at %g V in\n", r.ResistorMinA, o.VinMin, r.ResistorMaxA, o.VinMax)
	fmt.Fprintf(out, "resistor dissipation up to %.2f W: use a part rated at least %.0f W\n", r.ResistorMaxW, math.Ceil(2*r.ResistorMaxW))
	fmt.Fprintf(out, "regulator current up to %.3f A (full load, lowest input)\n", r.RegulatorMaxA)
	fmt.Fprintf(out, "minimum load for regulation %.3f A (highest input)\n", r.MinLoadA)
	if r.RegulatesLight {
		fmt.Fprintf(out, "the lightest load %.3f A keeps regulation\n", o.LoadMin)
	} else {
		fmt.Fprintf(out, "the lightest load %.3f A is below it: the output rises toward %.2f V\n", o.LoadMin, r.OutputRiseToV)
	}
	return nil
}

type calcHeatsinkOptions struct {
	app                                             *App
	Format                                          string
	Power, Vin, Vout, Load, Ignd                    float64
	Ambient, Tj, ThetaJC, ThetaCS, ThetaSA, ThetaJA float64
	Insulator                                       string
	LargeCan                                        bool
	saSet, csSet, jaSet                             bool
}

func newCalcHeatsinkCmd(app *App, runF func(*calcHeatsinkOptions) error) *cobra.Command {
	opts := &calcHeatsinkOptions{app: app}
	cmd := &cobra.Command{
		Use:   "heatsink",
		Short: "Junction temperature through the thermal path, or the heat sink a part needs",
		Long: `heatsink adds up the thermal path Tj = Ta + P·(θJC + θCS + θSA). Give the power
with --power, or the operating point with --vin, --vout, --load (and --ignd).
With --theta-sa it gives the junction temperature; without it, the largest θSA
that keeps the junction at --tj. --theta-ja gives the free-air temperature.`,
		Example: `  whichreg calc heatsink --vin 16 --vout 5 --load 0.8 --theta-jc 5 --insulator mica --theta-sa 8
  whichreg calc heatsink --power 6 --theta-jc 5 --tj 110`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.saSet, opts.csSet, opts.jaSet = cmd.Flags().Changed("theta-sa"), cmd.Flags().Changed("theta-cs"), cmd.Flags().Changed("theta-ja")
			if cmd.Flags().Changed("power") == cmd.Flags().Changed("vin") {
				return flagErrorf("give --power, or --vin with --vout and --load")
			}
			if runF != nil {
				return runF(opts)
			}
			return calcHeatsinkRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	addQuantity(cmd, &opts.Power, "power", "W", 0, "dissipation")
	addQuantity(cmd, &opts.Vin, "vin", "V", 0, "regulator input")
	addQuantity(cmd, &opts.Vout, "vout", "V", 0, "regulator output")
	addQuantity(cmd, &opts.Load, "load", "A", 0, "output current")
	addQuantity(cmd, &opts.Ignd, "ignd", "A", 0, "ground-lead current")
	addQuantity(cmd, &opts.Ambient, "ambient", "°C", 40, "ambient temperature around the heat sink")
	addQuantity(cmd, &opts.Tj, "tj", "°C", 125, "junction temperature limit")
	addQuantity(cmd, &opts.ThetaJC, "theta-jc", "C/W", 5, "junction to case")
	addQuantity(cmd, &opts.ThetaCS, "theta-cs", "C/W", 0, "case to sink (instead of --insulator)")
	addQuantity(cmd, &opts.ThetaSA, "theta-sa", "C/W", 0, "sink to air")
	addQuantity(cmd, &opts.ThetaJA, "theta-ja", "C/W", 0, "junction to air with no heat sink")
	opts.Insulator = "none"
	addEnumFlag(cmd, &opts.Insulator, "insulator", "interface between case and sink", circuit.Insulators()...)
	cmd.Flags().BoolVar(&opts.LargeCan, "large-can", false, "the case is a TO-3 or TO-66 can (lower θCS)")
	return cmd
}

// heatsinkJSON is the JSON of `calc heatsink`.
type heatsinkJSON struct {
	PowerW          float64  `json:"power_w"`
	ThetaCS         float64  `json:"theta_cs"`
	JunctionC       *float64 `json:"junction_c,omitempty"`
	FreeAirC        *float64 `json:"free_air_c,omitempty"`
	RequiredThetaSA *float64 `json:"required_theta_sa,omitempty"`
	TjLimitC        float64  `json:"tj_limit_c"`
}

func calcHeatsinkRun(o *calcHeatsinkOptions) error {
	p := o.Power
	if o.Vin != 0 {
		p = circuit.RegulatorDissipation(math.Abs(o.Vin), math.Abs(o.Vout), o.Load, o.Ignd)
	}
	if p < 0 || math.IsNaN(p) {
		return inputError(fmt.Errorf("dissipation %g W is impossible", p))
	}
	cs := o.ThetaCS
	if !o.csSet {
		var err error
		if cs, err = circuit.CaseToSink(o.Insulator, o.LargeCan); err != nil {
			return inputError(err)
		}
	}
	res := heatsinkJSON{PowerW: p, ThetaCS: cs, TjLimitC: o.Tj}
	if o.saSet {
		tj := circuit.JunctionTemp(p, o.Ambient, o.ThetaJC, cs, o.ThetaSA)
		res.JunctionC = &tj
	} else if p > 0 {
		sa, _ := circuit.RequiredThetaSA(p, o.Ambient, o.Tj, o.ThetaJC, cs)
		res.RequiredThetaSA = &sa
	}
	if o.jaSet {
		fa := circuit.FreeAirTemp(p, o.Ambient, o.ThetaJA)
		res.FreeAirC = &fa
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		return writeJSON(out, res)
	}
	fmt.Fprintf(out, "dissipation %.2f W; θJC %g + θCS %g (%s) °C/W; ambient %g °C\n", p, o.ThetaJC, cs, o.Insulator, o.Ambient)
	if res.JunctionC != nil {
		verdict := "within"
		if *res.JunctionC > o.Tj {
			verdict = "ABOVE"
		}
		fmt.Fprintf(out, "junction %.1f °C with θSA %g °C/W: %s the %g °C limit\n", *res.JunctionC, o.ThetaSA, verdict, o.Tj)
	}
	if res.RequiredThetaSA != nil {
		if *res.RequiredThetaSA <= 0 {
			fmt.Fprintf(out, "no heat sink can hold the junction at %g °C: reduce the dissipation\n", o.Tj)
		} else {
			fmt.Fprintf(out, "heat sink needed: θSA at most %.2f °C/W for a %g °C junction\n", *res.RequiredThetaSA, o.Tj)
		}
	}
	if res.FreeAirC != nil {
		fmt.Fprintf(out, "in free air (θJA %g °C/W): junction %.1f °C\n", o.ThetaJA, *res.FreeAirC)
	}
	fmt.Fprintln(out, "caution: heat sinks and regulators at these temperatures burn; let them cool before touching")
	return nil
}

type calcDividerOptions struct {
	app                                                  *App
	Format                                               string
	Target, Vref, Iadj, IadjMax, MinLoad, Bottom, R1, R2 float64
	Series                                               string
	evaluate                                             bool
}

func newCalcDividerCmd(app *App, runF func(*calcDividerOptions) error) *cobra.Command {
	opts := &calcDividerOptions{app: app}
	cmd := &cobra.Command{
		Use:   "divider",
		Short: "Resistor pair for an adjustable or lifted-ground regulator, or the output of a given pair",
		Long: `divider uses Vout = Vbottom + Vref·(1 + R2/R1) + I·R2, with R1 from the output
to the ADJ (or common) lead and R2 from there to the return rail. For an
adjustable part Vref is the reference and I the ADJ current; for a fixed part
with a lifted ground Vref is its nominal output and I its ground current.
With --r1 and --r2 it evaluates that pair; otherwise it chooses one from the
series with the divider current at least --min-load.`,
		Example: `  whichreg calc divider --target 12 --vref 1.25 --iadj 50u --iadj-max 100u --min-load 10m
  whichreg calc divider --vref 5 --iadj 5m --r1 470 --r2 150
  whichreg calc divider --target 9 --vref 1.25 --series E96`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.evaluate = cmd.Flags().Changed("r1") || cmd.Flags().Changed("r2")
			if opts.evaluate && !(cmd.Flags().Changed("r1") && cmd.Flags().Changed("r2")) {
				return flagErrorf("give both --r1 and --r2 to evaluate a pair")
			}
			if !opts.evaluate && !cmd.Flags().Changed("target") {
				return flagErrorf("give --target VOLTS to choose a pair, or --r1 and --r2 to evaluate one")
			}
			if runF != nil {
				return runF(opts)
			}
			return calcDividerRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	addQuantity(cmd, &opts.Target, "target", "V", 0, "wanted output (magnitude)")
	addQuantity(cmd, &opts.Vref, "vref", "V", 1.25, "reference (adjustable) or nominal output (lifted ground)")
	addQuantity(cmd, &opts.Iadj, "iadj", "A", 50e-6, "typical ADJ or ground-lead current")
	addQuantity(cmd, &opts.IadjMax, "iadj-max", "A", 100e-6, "greatest ADJ or ground-lead current")
	addQuantity(cmd, &opts.MinLoad, "min-load", "A", 0, "least divider current (the part's minimum load)")
	addQuantity(cmd, &opts.Bottom, "bottom", "V", 0, "rail the bottom resistor returns to")
	addQuantity(cmd, &opts.R1, "r1", "Ω", 0, "output to ADJ/common")
	addQuantity(cmd, &opts.R2, "r2", "Ω", 0, "ADJ/common to the return rail")
	opts.Series = "E24"
	addEnumFlag(cmd, &opts.Series, "series", "IEC 60063 series", "E12", "E24", "E48", "E96")
	return cmd
}

func calcDividerRun(o *calcDividerOptions) error {
	out := o.app.IO.Out
	if o.evaluate {
		v, err := circuit.DividerVout(o.Vref, o.Iadj, o.R1, o.R2, o.Bottom)
		if err != nil {
			return inputError(err)
		}
		lo, _ := circuit.DividerVout(o.Vref, 0, o.R1, o.R2, o.Bottom)
		hi, _ := circuit.DividerVout(o.Vref, o.IadjMax, o.R1, o.R2, o.Bottom)
		c := circuit.DividerChoice{R1Ohm: o.R1, R2Ohm: o.R2, VoutV: v, SpreadLowV: lo, SpreadHighV: hi, DividerA: o.Vref / o.R1}
		if o.Format == "json" {
			return writeJSON(out, c)
		}
		fmt.Fprintf(out, "R1 %s, R2 %s: output %.3f V (%.3f to %.3f V as the lead current goes 0 to %s); divider current %s\n",
			units.Format(o.R1, "Ω"), units.Format(o.R2, "Ω"), v, lo, hi, units.Format(o.IadjMax, "A"), units.Format(c.DividerA, "A"))
		return nil
	}
	series, err := circuit.Series(o.Series)
	if err != nil {
		return flagErrorf("%v", err)
	}
	c, err := circuit.ChooseDivider(circuit.DividerSpec{TargetV: o.Target, VrefV: o.Vref, ITypA: o.Iadj, IMaxA: o.IadjMax,
		MinLoadA: o.MinLoad, VbottomV: o.Bottom, Series: series})
	if err != nil {
		return inputError(err)
	}
	if o.Format == "json" {
		return writeJSON(out, c)
	}
	fmt.Fprintf(out, "%s: R1 %s (output to ADJ/common), R2 %s (to the return rail)\n", o.Series, units.Format(c.R1Ohm, "Ω"), units.Format(c.R2Ohm, "Ω"))
	fmt.Fprintf(out, "output %.3f V (error %+.3f V); %.3f to %.3f V over the lead-current spread; divider current %s\n",
		c.VoutV, c.ErrorV, c.SpreadLowV, c.SpreadHighV, units.Format(c.DividerA, "A"))
	return nil
}

type calcTestloadOptions struct {
	app                   *App
	Format                string
	Volts, Amps, Derating float64
	Series                string
}

func newCalcTestloadCmd(app *App, runF func(*calcTestloadOptions) error) *cobra.Command {
	opts := &calcTestloadOptions{app: app}
	cmd := &cobra.Command{
		Use:   "testload",
		Short: "A dummy load from stock resistors that draws at least a given current",
		Long: `testload picks up to three resistors (one value or mixed, in series or parallel)
from the E12 values at 0.25, 0.5, 1, 2, 5, 10, 25 and 50 W so that at the given
voltage they draw at least the given current, each run at no more than
(1 − derating) of its rating.`,
		Example: `  whichreg calc testload --volts 5 --amps 1
  whichreg calc testload --volts 12 --amps 0.6 --derating 0.6`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			if err := requireFlags(cmd, "volts", "amps"); err != nil {
				return err
			}
			if runF != nil {
				return runF(opts)
			}
			return calcTestloadRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	addQuantity(cmd, &opts.Volts, "volts", "V", 0, "voltage across the load")
	addQuantity(cmd, &opts.Amps, "amps", "A", 0, "least current to draw")
	addQuantity(cmd, &opts.Derating, "derating", "", 0.5, "fraction of each rating kept in reserve")
	opts.Series = "E12"
	addEnumFlag(cmd, &opts.Series, "series", "resistor values", "E12", "E24")
	return cmd
}

func calcTestloadRun(o *calcTestloadOptions) error {
	series, _ := circuit.Series(o.Series)
	p, err := circuit.PlanTestLoad(math.Abs(o.Volts), o.Amps, series, nil, o.Derating)
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		return writeJSON(out, p)
	}
	fmt.Fprintf(out, "needs at most %s (%.2f W) to draw %s at %g V\n", units.Format(p.NeedOhms, "Ω"), p.NeedWatts, units.Format(o.Amps, "A"), o.Volts)
	fmt.Fprintf(out, "%s: total %s, draws %.3f A, %.2f W\n", p.Arrangement, units.Format(p.TotalOhms, "Ω"), p.CurrentA, p.PowerW)
	for _, part := range p.Parts {
		fmt.Fprintf(out, "  %s %g W, dissipates %.2f W (%.0f %% margin)\n", units.Format(part.Ohms, "Ω"), part.Watts, part.DissipationW, part.Margin*100)
	}
	fmt.Fprintln(out, "caution: load resistors run hot; mount them clear of wiring and let them cool before touching")
	return nil
}

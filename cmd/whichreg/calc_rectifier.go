package main

import (
	"fmt"
	"io"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/infer/replace"
	"github.com/whichreg/whichreg/internal/units"
)

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
		rc := roundConditions(replace.Conditions{Corners: &cr}).Corners
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

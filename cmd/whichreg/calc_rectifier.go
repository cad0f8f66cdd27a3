package main

import (
	"fmt"
	"io"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/report"
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
		Short: "Simulate a rectifier and filter capacitor, with mains and load corners",
		Long: `rectifier simulates the transformer secondary, rectifier diodes (1N4007 model),
filter capacitor and load to the periodic steady state, at nominal mains and at
every corner (mains low/high, load min/max, capacitor nominal/low).

--vrms is the secondary voltage measured at the load given (per half-winding for
a center tap). The transformer's regulation turns it into an open-circuit EMF and
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
			if cmd.Flags().Changed("cap") && cmd.Flags().Changed("filter-uf") {
				return flagErrorf("give --cap or --filter-uf, not both")
			}
			if !cmd.Flags().Changed("filter-uf") {
				if err := requireFlags(cmd, "vrms", "cap"); err != nil {
					return err
				}
			} else if err := requireFlags(cmd, "vrms"); err != nil {
				return err
			}
			if opts.Spice && opts.Format != "text" {
				return flagErrorf("--spice prints a netlist: it has no --format %s", opts.Format)
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
	addQuantity(cmd, &opts.Vrms, "vrms", "V", 0, "secondary voltage, V RMS, measured at the load (per half for center-tap; also --secondary-vrms)")
	addQuantity(cmd, &opts.Hz, "hz", "Hz", 50, "mains frequency (also --mains-hz)")
	cmd.Flags().Var(&capFlag{quantityFlag{value: &opts.Cap, unit: "F"}}, "cap", "filter capacitance with its unit or prefix: 2200u, 2200uF, 2200 µF, 2m2")
	cmd.Flags().Var(&microFlag{value: &opts.Cap, unit: "F"}, "filter-uf", "filter capacitance in µF, as the evidence key input.filter_uf (instead of --cap)")
	addQuantity(cmd, &opts.ESR, "esr", "Ω", 0, "filter capacitor ESR")
	addQuantity(cmd, &opts.Load, "load", "A", 0, "load current (a regulator's load is a constant current; also --amps)")
	addQuantity(cmd, &opts.RLoad, "rload", "Ω", 0, "load resistance")
	addQuantity(cmd, &opts.MinLoad, "min-load", "A", 0, "lightest load for the corners, with --load (also --min-amps)")
	addQuantity(cmd, &opts.Regulation, "regulation", "", 0.10, "transformer regulation, fraction: no-load rise over loaded voltage (also --secondary-regulation)")
	addQuantity(cmd, &opts.Rs, "rs", "Ω", 0, "winding resistance per conducting path instead of --regulation")
	addQuantity(cmd, &opts.MainsTol, "mains-tolerance", "", 0.10, "mains tolerance either way, fraction (IEC 60038: 0.10)")
	addQuantity(cmd, &opts.CapTol, "cap-tolerance", "", 0.20, "capacitor tolerance downward, fraction")
	cmd.Flags().BoolVar(&opts.Spice, "spice", false, "print an ngspice netlist of the nominal case instead (text only)")
	flagAliases(cmd, map[string]string{"secondary-vrms": "vrms", "mains-hz": "hz", "amps": "load", "min-amps": "min-load",
		"secondary-regulation": "regulation"})
	return cmd
}

// calcRectifierDoc is the JSON document of `calc rectifier` (DESIGN.md
// contract: the nominal figures at the top, the corners under corners).
type calcRectifierDoc struct {
	Schema    string  `json:"schema"`
	Rectifier string  `json:"rectifier"`
	EMFVrms   float64 `json:"emf_v_rms"`
	SourceOhm float64 `json:"source_ohm"`
	Hz        float64 `json:"hz"`
	CapF      float64 `json:"cap_f"`
	ESROhm    float64 `json:"esr_ohm"`
	resultDoc
	Corners *cornersDoc `json:"corners"`
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
	return circuit.Rectifier{Topology: top, VrmsV: emf, Hz: o.Hz, CapF: report.Sig(o.Cap), ESROhm: o.ESR, SourceOhm: rs, Load: load}, load, nil
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
		return writeJSON(out, calcRectifierDoc{Schema: report.Schema("calc-rectifier"), Rectifier: o.Rectifier, EMFVrms: report.Sig(r.VrmsV),
			SourceOhm: report.Sig(r.SourceOhm), Hz: o.Hz, CapF: report.Sig(o.Cap), ESROhm: o.ESR, resultDoc: resultDocOf(res), Corners: cornersDocOf(&cr)})
	}
	width := o.app.Width()
	n, v := report.Num, func(x float64) string { return report.Num(x, "V") }
	head := fmt.Sprintf("%s rectifier, %s secondary EMF behind %s, %s, %s filter", o.Rectifier, n(r.VrmsV, "V rms"),
		n(r.SourceOhm, "Ω"), n(o.Hz, "Hz"), n(o.Cap, "F"))
	if o.ESR > 0 {
		head += " (ESR " + n(o.ESR, "Ω") + ")"
	}
	report.Fill(out, head, width, "", "  ")
	report.Fill(out, fmt.Sprintf("nominal mains and load (%s):", loadText(load)), width, "", "  ")
	report.Fill(out, fmt.Sprintf("peak %s, trough %s, mean %s, ripple %s; capacitor ripple current %s; diode peak %s; conduction %.1f° per diode",
		v(res.PeakV), v(res.TroughV), v(res.MeanV), n(res.RippleVpp, "V p-p"), n(res.CapRippleARMS, "A rms"), n(res.DiodePeakA, "A"), res.ConductionDeg),
		width, "  ", "  ")
	report.Fill(out, fmt.Sprintf("corners (mains ±%s; \"low C\" is the filter capacitor %s below its value):", report.Percent(o.MainsTol), report.Percent(o.CapTol)), width, "", "  ")
	t := &report.Table{Columns: []report.Column{{Header: "  corner", Wrap: true}, {Header: "peak", Align: report.Right},
		{Header: "trough", Align: report.Right}, {Header: "mean", Align: report.Right}}}
	for _, c := range cr.Corners {
		t.Row("  "+c.Name, v(c.Result.PeakV), v(c.Result.TroughV), v(c.Result.MeanV))
	}
	_ = t.Write(out, width)
	report.Fill(out, fmt.Sprintf("worst trough %s (%s): the regulator's input must stay above Vout + dropout here", v(cr.WorstTrough.Result.TroughV), cr.WorstTrough.Name), width, "", "  ")
	report.Fill(out, fmt.Sprintf("worst peak %s (%s): the regulator's input maximum must exceed this", v(cr.WorstPeak.Result.PeakV), cr.WorstPeak.Name), width, "", "  ")
	return nil
}

func loadText(l circuit.Load) string {
	switch {
	case l.Amps > 0:
		return report.Num(l.Amps, "A") + " constant"
	case l.Ohms > 0:
		return report.Num(l.Ohms, "Ω")
	}
	return "no load"
}

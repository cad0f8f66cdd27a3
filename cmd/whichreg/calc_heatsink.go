package main

import (
	"fmt"
	"math"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/report"
)

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
	addQuantity(cmd, &opts.Ambient, "ambient", "°C", 40, "ambient temperature around the heat sink (also --ambient-c)")
	addQuantity(cmd, &opts.Tj, "tj", "°C", 125, "junction temperature limit (also --tj-max-c, as the catalog key tj_max_c)")
	addQuantity(cmd, &opts.ThetaJC, "theta-jc", "C/W", 5, "junction to case")
	addQuantity(cmd, &opts.ThetaCS, "theta-cs", "C/W", 0, "case to sink (instead of --insulator)")
	addQuantity(cmd, &opts.ThetaSA, "theta-sa", "C/W", 0, "sink to air (also --heatsink-c-per-w, as the evidence key mount.heatsink_c_per_w)")
	addQuantity(cmd, &opts.ThetaJA, "theta-ja", "C/W", 0, "junction to air with no heat sink")
	opts.Insulator = "none"
	addEnumFlag(cmd, &opts.Insulator, "insulator", "interface between case and sink", circuit.Insulators()...)
	cmd.Flags().BoolVar(&opts.LargeCan, "large-can", false, "the case is a TO-3 or TO-66 can (lower θCS)")
	flagAliases(cmd, map[string]string{"heatsink-c-per-w": "theta-sa", "ambient-c": "ambient", "tj-max-c": "tj"})
	return cmd
}

// calcHeatsinkDoc is the JSON document of `calc heatsink`; what was not
// asked for is null.
type calcHeatsinkDoc struct {
	Schema               string   `json:"schema"`
	PowerW               float64  `json:"power_w"`
	AmbientC             float64  `json:"ambient_c"`
	ThetaJCCPerW         float64  `json:"theta_jc_c_per_w"`
	ThetaCSCPerW         float64  `json:"theta_cs_c_per_w"`
	ThetaSACPerW         *float64 `json:"theta_sa_c_per_w"`
	JunctionC            *float64 `json:"junction_c"`
	RequiredThetaSACPerW *float64 `json:"required_theta_sa_c_per_w"`
	ThetaJACPerW         *float64 `json:"theta_ja_c_per_w"`
	FreeAirJunctionC     *float64 `json:"free_air_junction_c"`
	TjLimitC             float64  `json:"tj_limit_c"`
}

func calcHeatsinkRun(o *calcHeatsinkOptions) error {
	p := o.Power
	if o.Vin != 0 {
		p = circuit.RegulatorDissipation(math.Abs(o.Vin), math.Abs(o.Vout), o.Load, o.Ignd)
	}
	if p < 0 || math.IsNaN(p) {
		return inputError(fmt.Errorf("dissipation %s is impossible", report.Num(p, "W")))
	}
	cs := o.ThetaCS
	if !o.csSet {
		var err error
		size := circuit.SmallTab
		if o.LargeCan {
			size = circuit.LargeCan
		}
		if cs, err = circuit.CaseToSink(o.Insulator, size); err != nil {
			return inputError(err)
		}
	}
	d := calcHeatsinkDoc{Schema: report.Schema("calc-heatsink"), PowerW: report.Sig(p), AmbientC: o.Ambient, ThetaJCCPerW: o.ThetaJC,
		ThetaCSCPerW: cs, TjLimitC: o.Tj}
	if o.saSet {
		d.ThetaSACPerW = finite(o.ThetaSA, 6)
		d.JunctionC = finite(circuit.JunctionTemp(p, o.Ambient, o.ThetaJC, cs, o.ThetaSA), 3)
	} else if p > 0 {
		sa, _ := circuit.RequiredThetaSA(p, o.Ambient, o.Tj, o.ThetaJC, cs)
		d.RequiredThetaSACPerW = finite(sa, 4)
	}
	if o.jaSet {
		d.ThetaJACPerW = finite(o.ThetaJA, 6)
		d.FreeAirJunctionC = finite(circuit.FreeAirTemp(p, o.Ambient, o.ThetaJA), 3)
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		return writeJSON(out, d)
	}
	width := o.app.Width()
	c, cw := func(x float64) string { return report.Num(x, "°C") }, func(x float64) string { return report.Num(x, "°C/W") }
	lines := []string{fmt.Sprintf("dissipation %s; θJC %s + θCS %s (%s); ambient %s", report.Num(p, "W"), cw(o.ThetaJC), cw(cs), o.Insulator, c(o.Ambient))}
	if d.JunctionC != nil {
		verdict := "within"
		if *d.JunctionC > o.Tj {
			verdict = "ABOVE"
		}
		lines = append(lines, fmt.Sprintf("junction %s with θSA %s: %s the %s limit", c(*d.JunctionC), cw(o.ThetaSA), verdict, c(o.Tj)))
	}
	if d.RequiredThetaSACPerW != nil {
		if *d.RequiredThetaSACPerW <= 0 {
			lines = append(lines, fmt.Sprintf("no heat sink can hold the junction at %s: reduce the dissipation", c(o.Tj)))
		} else {
			lines = append(lines, fmt.Sprintf("heat sink needed: θSA at most %s for a %s junction", cw(*d.RequiredThetaSACPerW), c(o.Tj)))
		}
	}
	if d.FreeAirJunctionC != nil {
		lines = append(lines, fmt.Sprintf("in free air (θJA %s): junction %s", cw(o.ThetaJA), c(*d.FreeAirJunctionC)))
	}
	lines = append(lines, "caution: heat sinks and regulators at these temperatures burn; let them cool before touching")
	for _, l := range lines {
		report.Fill(out, l, width, "", "  ")
	}
	return nil
}

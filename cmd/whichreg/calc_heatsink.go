package main

import (
	"fmt"
	"math"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
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

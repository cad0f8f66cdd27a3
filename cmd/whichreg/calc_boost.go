package main

import (
	"fmt"
	"math"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/report"
)

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
	addQuantity(cmd, &opts.R, "r", "Ω", 0, "bypass resistor (also --bypass-ohms, as the evidence key bypass.ohms)")
	addQuantity(cmd, &opts.VinMin, "vin-min", "V", 0, "lowest regulator input")
	addQuantity(cmd, &opts.VinMax, "vin-max", "V", 0, "highest regulator input")
	addQuantity(cmd, &opts.Vout, "vout", "V", 0, "regulated output")
	addQuantity(cmd, &opts.LoadMin, "load-min", "A", 0, "lightest load")
	addQuantity(cmd, &opts.LoadMax, "load-max", "A", 0, "heaviest load")
	addQuantity(cmd, &opts.RegMin, "reg-min", "A", 0, "the regulator's own minimum load (adjustables: 10m)")
	flagAliases(cmd, map[string]string{"bypass-ohms": "r"})
	return cmd
}

// calcBoostDoc is the JSON document of `calc boost`.
type calcBoostDoc struct {
	Schema         string  `json:"schema"`
	ROhm           float64 `json:"r_ohm"`
	ResistorMinA   float64 `json:"resistor_min_a"`
	ResistorMaxA   float64 `json:"resistor_max_a"`
	ResistorMaxW   float64 `json:"resistor_max_w"`
	RegulatorMaxA  float64 `json:"regulator_max_a"`
	RegulatorMinA  float64 `json:"regulator_min_a"`
	MinLoadA       float64 `json:"min_load_a"`
	RegulatesLight bool    `json:"regulates_light"`
	// OutputRiseToV is where the output rises at the lightest load; null
	// when the load keeps regulation.
	OutputRiseToV *float64 `json:"output_rise_to_v"`
}

func calcBoostRun(o *calcBoostOptions) error {
	r, err := circuit.Bypass{ROhm: o.R, VinMinV: math.Abs(o.VinMin), VinMaxV: math.Abs(o.VinMax), VoutV: math.Abs(o.Vout),
		LoadMinA: o.LoadMin, LoadMaxA: o.LoadMax, RegMinA: o.RegMin}.Solve()
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		s := report.Sig
		d := calcBoostDoc{Schema: report.Schema("calc-boost"), ROhm: o.R, ResistorMinA: s(r.ResistorMinA), ResistorMaxA: s(r.ResistorMaxA),
			ResistorMaxW: s(r.ResistorMaxW), RegulatorMaxA: s(r.RegulatorMaxA), RegulatorMinA: s(r.RegulatorMinA), MinLoadA: s(r.MinLoadA),
			RegulatesLight: r.RegulatesLight}
		if !r.RegulatesLight {
			d.OutputRiseToV = finite(report.Sig(r.OutputRiseToV), 6)
		}
		return writeJSON(out, d)
	}
	width := o.app.Width()
	a, v := func(x float64) string { return report.Num(x, "A") }, func(x float64) string { return report.Num(x, "V") }
	lines := []string{
		fmt.Sprintf("resistor current %s at %s in, %s at %s in", a(r.ResistorMinA), v(o.VinMin), a(r.ResistorMaxA), v(o.VinMax)),
		fmt.Sprintf("resistor dissipation up to %s: use a part rated at least %s", report.Num(r.ResistorMaxW, "W"), report.Num(math.Ceil(2*r.ResistorMaxW), "W")),
		fmt.Sprintf("regulator current up to %s (full load, lowest input)", a(r.RegulatorMaxA)),
		fmt.Sprintf("minimum load for regulation %s (highest input)", a(r.MinLoadA)),
	}
	if r.RegulatesLight {
		lines = append(lines, fmt.Sprintf("the lightest load %s keeps regulation", a(o.LoadMin)))
	} else {
		lines = append(lines, fmt.Sprintf("the lightest load %s is below it: the output rises toward %s", a(o.LoadMin), v(r.OutputRiseToV)))
	}
	for _, l := range lines {
		report.Fill(out, l, width, "", "  ")
	}
	return nil
}

package main

import (
	"fmt"
	"math"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
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

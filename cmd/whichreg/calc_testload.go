package main

import (
	"fmt"
	"math"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/internal/units"
)

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

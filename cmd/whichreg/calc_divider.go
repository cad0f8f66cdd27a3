package main

import (
	"fmt"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/internal/units"
)

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

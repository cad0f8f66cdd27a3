package main

import (
	"fmt"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/report"
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
	addQuantity(cmd, &opts.Bottom, "bottom", "V", 0, "rail the bottom resistor returns to (also --bottom-to-volts)")
	addQuantity(cmd, &opts.R1, "r1", "Ω", 0, "output to ADJ/common (also --r-top-ohms, as the evidence key network.r_top_ohms)")
	addQuantity(cmd, &opts.R2, "r2", "Ω", 0, "ADJ/common to the return rail (also --r-bottom-ohms)")
	opts.Series = "E24"
	addEnumFlag(cmd, &opts.Series, "series", "IEC 60063 series", "E12", "E24", "E48", "E96")
	flagAliases(cmd, map[string]string{"r-top-ohms": "r1", "r-bottom-ohms": "r2", "bottom-to-volts": "bottom"})
	return cmd
}

// calcDividerDoc is the JSON document of `calc divider`: the pair chosen
// from a series (series and error_v set) or the pair given (both null).
type calcDividerDoc struct {
	Schema      string   `json:"schema"`
	Series      *string  `json:"series"`
	R1Ohm       float64  `json:"r1_ohm"`
	R2Ohm       float64  `json:"r2_ohm"`
	VoutV       float64  `json:"vout_v"`
	ErrorV      *float64 `json:"error_v"`
	SpreadLowV  float64  `json:"spread_low_v"`
	SpreadHighV float64  `json:"spread_high_v"`
	DividerA    float64  `json:"divider_a"`
}

func dividerDocOf(c circuit.DividerChoice, series string, chosen bool) calcDividerDoc {
	s := report.Sig
	d := calcDividerDoc{Schema: report.Schema("calc-divider"), R1Ohm: c.R1Ohm, R2Ohm: c.R2Ohm, VoutV: s(c.VoutV),
		SpreadLowV: s(c.SpreadLowV), SpreadHighV: s(c.SpreadHighV), DividerA: s(c.DividerA)}
	if chosen {
		d.Series = &series
		d.ErrorV = finite(s(c.ErrorV), 9)
	}
	return d
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
			return writeJSON(out, dividerDocOf(c, "", false))
		}
		report.Fill(out, fmt.Sprintf("R1 %s, R2 %s: output %s (%s to %s as the lead current goes 0 to %s); divider current %s",
			report.Num(o.R1, "Ω"), report.Num(o.R2, "Ω"), report.Num(v, "V"), report.Num(lo, "V"), report.Num(hi, "V"),
			report.Num(o.IadjMax, "A"), report.Num(c.DividerA, "A")), o.app.Width(), "", "  ")
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
		return writeJSON(out, dividerDocOf(c, o.Series, true))
	}
	width := o.app.Width()
	report.Fill(out, fmt.Sprintf("%s: R1 %s (output to ADJ/common), R2 %s (to the return rail)", o.Series, report.Num(c.R1Ohm, "Ω"), report.Num(c.R2Ohm, "Ω")), width, "", "  ")
	report.Fill(out, fmt.Sprintf("output %s (error %s); %s to %s over the lead-current spread; divider current %s",
		report.Num(c.VoutV, "V"), report.Signed(c.ErrorV, "V"), report.Num(c.SpreadLowV, "V"), report.Num(c.SpreadHighV, "V"),
		report.Num(c.DividerA, "A")), width, "", "  ")
	return nil
}

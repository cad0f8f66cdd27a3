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
	Tolerance                                            float64
	Series, Family                                       string
	evaluate                                             bool
	changed                                              func(string) bool
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
series with the divider current between --min-load (the part's minimum
load; 5 mA when not given) and 2.5 times it, within --tolerance of the
target (the part's own tolerance) with the least current, and suggests a
trimmer when no pair is that close. The spread is the output from --iadj
(typical) to --iadj-max; each resistor's dissipation comes with a rating
(at least twice it). --family ID takes vref, the ADJ currents, the minimum
load and the tolerance from the catalog (flags given still win).`,
		Example: `  whichreg calc divider --target 12 --vref 1.25 --iadj 50u --iadj-max 100u --min-load 10m
  whichreg calc divider --vref 5 --iadj 5m --r1 470 --r2 150
  whichreg calc divider --target 9 --vref 1.25 --series E96
  whichreg calc divider --target 15 --family 317`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.changed = cmd.Flags().Changed
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
	addQuantity(cmd, &opts.MinLoad, "min-load", "A", 0, "least divider current, the part's minimum load (default the family's, else 5 mA)")
	addQuantity(cmd, &opts.Tolerance, "tolerance", "", 0.04, "the part's output tolerance, fraction (default the family's, else ±4 % as an LM317): pairs this close are good enough, beyond it a trimmer")
	cmd.Flags().StringVar(&opts.Family, "family", "", "take vref, ADJ currents, minimum load and tolerance from catalog family `ID`")
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
	MinLoadA    float64  `json:"min_load_a"`  // the least divider current asked for
	R1W         float64  `json:"r1_w"`        // R1's dissipation
	R2W         float64  `json:"r2_w"`        // R2's dissipation at the most lead current
	R1RatingW   float64  `json:"r1_rating_w"` // a rating for R1 (at least twice its dissipation)
	R2RatingW   float64  `json:"r2_rating_w"` // and for R2
	Trimmer     bool     `json:"trimmer"`     // the pair misses by more than the tolerance: use a trimmer
}

func dividerDocOf(c circuit.DividerChoice, spec circuit.DividerSpec, series string, chosen bool) calcDividerDoc {
	s := report.Sig
	d := calcDividerDoc{Schema: report.Schema("calc-divider"), R1Ohm: c.R1Ohm, R2Ohm: c.R2Ohm, VoutV: s(c.VoutV),
		SpreadLowV: s(c.SpreadLowV), SpreadHighV: s(c.SpreadHighV), DividerA: s(c.DividerA), MinLoadA: s(spec.MinLoadA),
		R1W: s(c.R1W), R2W: s(c.R2W), R1RatingW: c.R1RatingW, R2RatingW: c.R2RatingW, Trimmer: c.Trimmer}
	if chosen {
		d.Series = &series
		d.ErrorV = finite(s(c.ErrorV), 9)
	}
	return d
}

// spec is the divider spec from the flags, with the family's figures where
// a flag was not given.
func (o *calcDividerOptions) spec() (circuit.DividerSpec, error) {
	sp := circuit.DividerSpec{TargetV: o.Target, VrefV: o.Vref, ITypA: o.Iadj, IMaxA: o.IadjMax, MinLoadA: o.MinLoad,
		VbottomV: o.Bottom, Tolerance: o.Tolerance}
	if o.Family != "" {
		c, err := o.app.loadCatalog()
		if err != nil {
			return sp, err
		}
		f := c.Family(o.Family)
		if f == nil || !f.Adjustable() {
			return sp, inputError(fmt.Errorf("--family: %q is not an adjustable family in the catalog", o.Family), suggestIDs(c, o.Family))
		}
		set := func(flag string, dst *float64, v float64) {
			if !o.changed(flag) && v > 0 {
				*dst = v
			}
		}
		set("vref", &sp.VrefV, f.VrefV)
		set("iadj", &sp.ITypA, f.IadjTypUA*1e-6)
		set("iadj-max", &sp.IMaxA, f.IadjUA*1e-6)
		set("min-load", &sp.MinLoadA, f.MinLoadMA*1e-3)
		set("tolerance", &sp.Tolerance, f.Tolerance)
	}
	if sp.MinLoadA == 0 {
		sp.MinLoadA = circuit.DefaultMinLoadA
	}
	return sp, nil
}

func calcDividerRun(o *calcDividerOptions) error {
	out, width := o.app.IO.Out, o.app.Width()
	sp, err := o.spec()
	if err != nil {
		return err
	}
	if o.evaluate {
		c, err := sp.Evaluate(o.R1, o.R2)
		if err != nil {
			return inputError(err)
		}
		if o.Format == "json" {
			return writeJSON(out, dividerDocOf(c, sp, "", false))
		}
		report.Fill(out, fmt.Sprintf("R1 %s, R2 %s: output %s (%s to %s as the lead current goes from %s to %s); divider current %s",
			report.Num(o.R1, "Ω"), report.Num(o.R2, "Ω"), report.Num(c.VoutV, "V"), report.Num(c.SpreadLowV, "V"), report.Num(c.SpreadHighV, "V"),
			report.Num(sp.ITypA, "A"), report.Num(sp.IMaxA, "A"), report.Num(c.DividerA, "A")), width, "", "  ")
		writeDividerPower(o, c)
		return nil
	}
	series, err := circuit.Series(o.Series)
	if err != nil {
		return flagErrorf("%v", err)
	}
	sp.Series = series
	c, err := circuit.ChooseDivider(sp)
	if err != nil {
		return inputError(err)
	}
	if o.Format == "json" {
		return writeJSON(out, dividerDocOf(c, sp, o.Series, true))
	}
	report.Fill(out, fmt.Sprintf("%s: R1 %s (output to ADJ/common), R2 %s (to the return rail)", o.Series, report.Num(c.R1Ohm, "Ω"), report.Num(c.R2Ohm, "Ω")), width, "", "  ")
	report.Fill(out, fmt.Sprintf("output %s (error %s); %s to %s as the lead current goes from %s to %s; divider current %s (asked %s to %s)",
		report.Num(c.VoutV, "V"), report.Signed(c.ErrorV, "V"), report.Num(c.SpreadLowV, "V"), report.Num(c.SpreadHighV, "V"),
		report.Num(sp.ITypA, "A"), report.Num(sp.IMaxA, "A"), report.Num(c.DividerA, "A"),
		report.Num(sp.MinLoadA, "A"), report.Num(circuit.DividerSpan*sp.MinLoadA, "A")), width, "", "  ")
	writeDividerPower(o, c)
	if c.Trimmer {
		report.Fill(out, fmt.Sprintf("the nearest %s pair misses the target by more than ±%s: make part of R2 a trimmer and set the output", o.Series, report.Percent(sp.Tolerance)), width, "", "  ")
	}
	return nil
}

// writeDividerPower states each resistor's dissipation and a rating.
func writeDividerPower(o *calcDividerOptions, c circuit.DividerChoice) {
	report.Fill(o.app.IO.Out, fmt.Sprintf("power: R1 %s (a %s part), R2 %s (a %s part)",
		report.Num(c.R1W, "W"), report.Num(c.R1RatingW, "W"), report.Num(c.R2W, "W"), report.Num(c.R2RatingW, "W")), o.app.Width(), "", "  ")
}

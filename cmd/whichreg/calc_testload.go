package main

import (
	"fmt"
	"math"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/report"
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

// calcTestloadDoc is the JSON document of `calc testload`.
type calcTestloadDoc struct {
	Schema      string        `json:"schema"`
	VoltsV      float64       `json:"volts_v"`
	AmpsA       float64       `json:"amps_a"`
	NeedOhm     float64       `json:"need_ohm"`
	NeedW       float64       `json:"need_w"`
	Arrangement string        `json:"arrangement"`
	Parts       []loadPartDoc `json:"parts"`
	TotalOhm    float64       `json:"total_ohm"`
	CurrentA    float64       `json:"current_a"`
	PowerW      float64       `json:"power_w"`
}

// loadPartDoc is one resistor of a test load.
type loadPartDoc struct {
	Ohm          float64 `json:"ohm"`
	RatingW      float64 `json:"rating_w"`
	DissipationW float64 `json:"dissipation_w"`
	// Margin is 1 − dissipation/rating.
	Margin float64 `json:"margin"`
}

func calcTestloadRun(o *calcTestloadOptions) error {
	series, _ := circuit.Series(o.Series)
	p, err := circuit.PlanTestLoad(math.Abs(o.Volts), o.Amps, series, nil, o.Derating)
	if err != nil {
		return inputError(err)
	}
	out := o.app.IO.Out
	if o.Format == "json" {
		s := report.Sig
		d := calcTestloadDoc{Schema: report.Schema("calc-testload"), VoltsV: o.Volts, AmpsA: o.Amps, NeedOhm: s(p.NeedOhms), NeedW: s(p.NeedWatts),
			Arrangement: p.Arrangement, Parts: []loadPartDoc{}, TotalOhm: s(p.TotalOhms), CurrentA: s(p.CurrentA), PowerW: s(p.PowerW)}
		for _, part := range p.Parts {
			d.Parts = append(d.Parts, loadPartDoc{part.Ohms, part.Watts, s(part.DissipationW), round(part.Margin, 4)})
		}
		return writeJSON(out, d)
	}
	width := o.app.Width()
	n := report.Num
	report.Fill(out, fmt.Sprintf("needs at most %s (%s) to draw %s at %s", n(p.NeedOhms, "Ω"), n(p.NeedWatts, "W"), n(o.Amps, "A"), n(o.Volts, "V")), width, "", "  ")
	report.Fill(out, fmt.Sprintf("%s: total %s, draws %s, %s", p.Arrangement, n(p.TotalOhms, "Ω"), n(p.CurrentA, "A"), n(p.PowerW, "W")), width, "", "  ")
	for _, part := range p.Parts {
		report.Fill(out, fmt.Sprintf("%s %s, dissipates %s (%s margin)", n(part.Ohms, "Ω"), n(part.Watts, "W"), n(part.DissipationW, "W"), report.Percent(part.Margin)), width, "  ", "    ")
	}
	report.Fill(out, "caution: load resistors run hot; mount them clear of wiring and let them cool before touching", width, "", "  ")
	return nil
}

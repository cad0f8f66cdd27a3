package main

import (
	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/report"
)

// resultDoc is a rectifier's steady state in JSON documents (calc
// rectifier's nominal case, every corner, and swap's conditions).
type resultDoc struct {
	PeakV         float64 `json:"peak_v"`
	TroughV       float64 `json:"trough_v"`
	MeanV         float64 `json:"mean_v"`
	RippleVpp     float64 `json:"ripple_vpp"`
	CapRippleARMS float64 `json:"cap_ripple_a_rms"`
	DiodePeakA    float64 `json:"diode_peak_a"`
	ConductionDeg float64 `json:"conduction_deg"`
	LoadA         float64 `json:"load_a"`
}

func resultDocOf(r circuit.Result) resultDoc {
	s := report.Sig
	return resultDoc{s(r.PeakV), s(r.TroughV), s(r.MeanV), s(r.RippleVpp), s(r.CapRippleARMS), s(r.DiodePeakA), s(r.ConductionDeg), s(r.LoadA)}
}

// cornerDoc is one corner of the sweep: the multipliers on the mains and
// the capacitance, the load (a current or a resistance, the other null),
// and the steady state there.
type cornerDoc struct {
	Name       string   `json:"name"`
	Mains      float64  `json:"mains"`
	CapFactor  float64  `json:"cap_factor"`
	LoadSetA   *float64 `json:"load_set_a"`
	LoadSetOhm *float64 `json:"load_set_ohm"`
	resultDoc
}

func cornerDocOf(c circuit.Corner) cornerDoc {
	d := cornerDoc{Name: c.Name, Mains: report.Sig(c.Mains), CapFactor: report.Sig(c.CapFactor), resultDoc: resultDocOf(c.Result)}
	switch {
	case c.Load.Amps > 0:
		d.LoadSetA = finite(c.Load.Amps, 9)
	case c.Load.Ohms > 0:
		d.LoadSetOhm = finite(c.Load.Ohms, 9)
	}
	return d
}

// cornersDoc is the sweep: every corner and the two that decide.
type cornersDoc struct {
	Corners     []cornerDoc `json:"corners"`
	WorstTrough cornerDoc   `json:"worst_trough"`
	WorstPeak   cornerDoc   `json:"worst_peak"`
}

func cornersDocOf(cr *circuit.CornerResult) *cornersDoc {
	if cr == nil {
		return nil
	}
	d := &cornersDoc{Corners: []cornerDoc{}, WorstTrough: cornerDocOf(cr.WorstTrough), WorstPeak: cornerDocOf(cr.WorstPeak)}
	for _, c := range cr.Corners {
		d.Corners = append(d.Corners, cornerDocOf(c))
	}
	return d
}

// flagAliases lets a command take the evidence file's name for a quantity
// as another spelling of its flag ("--secondary-vrms" for "--vrms"): one
// name for one thing, without breaking the flags DESIGN.md fixes.
func flagAliases(cmd *cobra.Command, aliases map[string]string) {
	cmd.Flags().SetNormalizeFunc(func(f *pflag.FlagSet, name string) pflag.NormalizedName {
		if to, ok := aliases[name]; ok {
			name = to
		}
		return pflag.NormalizedName(name)
	})
}

package circuit

import (
	"fmt"
	"math"
)

// Bypass is a resistor from a series regulator's input to its output, which
// carries part of the load current (a "current booster" of old designs).
// Voltages are magnitudes.
type Bypass struct {
	ROhm     float64 // the resistor
	VinMinV  float64 // regulator input at its lowest (trough, low mains, full load)
	VinMaxV  float64 // regulator input at its highest (peak, high mains, light load)
	VoutV    float64 // regulated output
	LoadMinA float64 // lightest load
	LoadMaxA float64 // heaviest load
	RegMinA  float64 // the regulator's own minimum load (adjustables), A
}

// BypassResult gives the currents and powers at the corners.
//
//	I_R = (Vin − Vout)/R        the resistor's share, whatever the load
//	I_reg = I_load − I_R        what the regulator must source
//	I_load,min = (Vin,max − Vout)/R + I_reg,min   least load that keeps regulation
//	P_R = (Vin,max − Vout)²/R
//
// (derived in methods.md §4.4: a series regulator can only source current,
// so below the minimum load the output rises).
type BypassResult struct {
	ResistorMinA   float64 `json:"resistor_min_a"`   // share at VinMinV
	ResistorMaxA   float64 `json:"resistor_max_a"`   // share at VinMaxV
	RegulatorMaxA  float64 `json:"regulator_max_a"`  // regulator current at full load, low input
	RegulatorMinA  float64 `json:"regulator_min_a"`  // regulator current at light load, high input (negative: it would have to sink)
	MinLoadA       float64 `json:"min_load_a"`       // least load that keeps regulation
	ResistorMaxW   float64 `json:"resistor_max_w"`   // resistor dissipation at VinMaxV
	RegulatesLight bool    `json:"regulates_light"`  // LoadMinA ≥ MinLoadA
	OutputRiseToV  float64 `json:"output_rise_to_v"` // output at light load if it does not regulate (open-circuit divider)
}

// Solve evaluates the bypass resistor at the corners. It returns an error for
// a non-positive resistor or inconsistent voltages.
func (b Bypass) Solve() (BypassResult, error) {
	if !(b.ROhm > 0) || math.IsInf(b.ROhm, 0) {
		return BypassResult{}, fmt.Errorf("bypass resistor %g Ω must be positive", b.ROhm)
	}
	for _, v := range []float64{b.VinMinV, b.VinMaxV, b.VoutV, b.LoadMinA, b.LoadMaxA, b.RegMinA} {
		if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
			return BypassResult{}, fmt.Errorf("bypass: voltages and currents must be finite magnitudes")
		}
	}
	if b.VinMaxV < b.VinMinV {
		return BypassResult{}, fmt.Errorf("bypass: highest input %g V is below lowest %g V", b.VinMaxV, b.VinMinV)
	}
	share := func(vin float64) float64 { return math.Max(0, (vin-b.VoutV)/b.ROhm) }
	r := BypassResult{ResistorMinA: share(b.VinMinV), ResistorMaxA: share(b.VinMaxV)}
	r.RegulatorMaxA = b.LoadMaxA - r.ResistorMinA
	r.RegulatorMinA = b.LoadMinA - r.ResistorMaxA
	r.MinLoadA = r.ResistorMaxA + b.RegMinA
	r.ResistorMaxW = r.ResistorMaxA * r.ResistorMaxA * b.ROhm
	r.RegulatesLight = b.LoadMinA >= r.MinLoadA
	if !r.RegulatesLight {
		if b.LoadMinA > 0 {
			rl := b.VoutV / b.LoadMinA
			r.OutputRiseToV = b.VinMaxV * rl / (b.ROhm + rl)
		} else {
			r.OutputRiseToV = b.VinMaxV
		}
	}
	return r, nil
}

// RegulatorPowerMax returns the regulator's greatest dissipation, watts, at
// full load (LoadMaxA) over an input from VinMinV to VinMaxV (for heat, the
// mean input at low and high mains), and the input where it occurs. With
// the headroom h = Vin − Vout the regulator carries I − h/R, so
//
//	P(h) = h·(I − h/R) + Vin·Ignd
//
// which rises to its largest at h = I·R/2 and falls beyond: the worst case
// can lie inside the range, not at high mains (derived from the current
// share of methods.md §4.4). ignA is the ground current.
func (b Bypass) RegulatorPowerMax(ignA float64) (w, atV float64) {
	p := func(vin float64) float64 {
		h := math.Max(0, vin-b.VoutV)
		ireg := b.LoadMaxA
		if b.ROhm > 0 {
			ireg = math.Max(0, b.LoadMaxA-h/b.ROhm)
		}
		return h*ireg + vin*ignA
	}
	cands := []float64{b.VinMinV, b.VinMaxV}
	if b.ROhm > 0 {
		if v := b.VoutV + b.LoadMaxA*b.ROhm/2; v > b.VinMinV && v < b.VinMaxV {
			cands = append(cands, v)
		}
	}
	for _, v := range cands {
		if x := p(v); x > w || atV == 0 {
			w, atV = x, v
		}
	}
	return w, atV
}

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

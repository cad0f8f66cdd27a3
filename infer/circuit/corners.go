package circuit

import (
	"fmt"
	"math"
)

// WindingFormFactor returns the ratio of RMS winding current to DC load
// current used by [FromRegulation], or 0 for an unknown topology: from the
// ngspice reference runs in shared/reference/methods.md §7 (bridge brA_50
// 1.559 A / 0.843 A = 1.85; centre tap ctA_50 1.183 A / 0.900 A = 1.31 per
// half; half-wave hwA_50 1.860 A / 0.786 A = 2.37). It varies with ωCR and
// Rs/RL; these are typical.
func WindingFormFactor(t Topology) float64 {
	switch t {
	case Bridge:
		return 1.85
	case CenterTap:
		return 1.31
	case HalfWave:
		return 2.37
	}
	return 0
}

// FromRegulation turns a transformer's loaded secondary voltage and its
// regulation into the open-circuit EMF and winding resistance of the model:
//
//	regulation = (V_no-load − V_full-load) / V_full-load
//	EMF = V_loaded·(1 + regulation)
//	R   = V_loaded·regulation / (F·I_dc)
//
// where F is [WindingFormFactor] and I_dc the DC load current at which the
// secondary was measured. It returns an error when loadA is not positive.
func FromRegulation(t Topology, vrmsLoadedV, regulation, loadA float64) (emfV, rOhm float64, err error) {
	if regulation < 0 || regulation > 2 || math.IsNaN(regulation) {
		return 0, 0, fmt.Errorf("regulation %g is not a fraction between 0 and 2", regulation)
	}
	if regulation == 0 {
		return vrmsLoadedV, 0, nil
	}
	if !(loadA > 0) {
		return 0, 0, fmt.Errorf("regulation needs the load current the secondary was measured at")
	}
	f := WindingFormFactor(t)
	if f == 0 {
		return 0, 0, fmt.Errorf("unknown rectifier %q", t)
	}
	return vrmsLoadedV * (1 + regulation), vrmsLoadedV * regulation / (f * loadA), nil
}

// MatchSecondary returns r with its winding resistance set so that the
// model's own loaded secondary ([Result.SecondaryRMSV]) at r.Load equals
// vrmsLoadedV, the secondary voltage measured at that load; r.VrmsV is the
// open-circuit EMF (from the regulation, see [FromRegulation], whose
// resistance is the starting guess). The rectifier's peaky current drops
// less RMS voltage in the winding than I_rms·R suggests, so the simple
// formula leaves the loaded secondary a few per cent high; this removes
// that error by the secant method on R (to 0.01 % of the voltage).
func (r Rectifier) MatchSecondary(vrmsLoadedV float64) (Rectifier, error) {
	if !(vrmsLoadedV > 0) || vrmsLoadedV > r.VrmsV {
		return r, fmt.Errorf("loaded secondary %g V must be positive and not above the open-circuit %g V", vrmsLoadedV, r.VrmsV)
	}
	if vrmsLoadedV == r.VrmsV || r.SourceOhm <= 0 {
		return r, nil
	}
	f := func(rs float64) (float64, error) {
		q := r
		q.SourceOhm = rs
		// 500 steps a cycle: the secondary's RMS comes out within about
		// 1e-5 of the 2000-step figure, far inside the tolerance below.
		q.StepsPerCycle = 500
		res, err := q.Solve()
		return res.SecondaryRMSV - vrmsLoadedV, err
	}
	x0 := r.SourceOhm
	f0, err := f(x0)
	if err != nil {
		return r, err
	}
	// The winding drop grows nearly in proportion to R: scale R by the drop
	// wanted over the drop got, then refine by the secant method.
	x1 := x0 * 1.3
	if got := r.VrmsV - (f0 + vrmsLoadedV); got > 0 {
		x1 = x0 * (r.VrmsV - vrmsLoadedV) / got
	}
	f1, err := f(x1)
	if err != nil {
		return r, err
	}
	for it := 0; it < 30; it++ {
		if math.Abs(f1) < 1e-4*vrmsLoadedV {
			r.SourceOhm = x1
			return r, nil
		}
		if f1 == f0 {
			break
		}
		x2 := x1 - f1*(x1-x0)/(f1-f0)
		if !(x2 > 0) {
			x2 = x1 / 2
		}
		x0, f0 = x1, f1
		x1 = x2
		if f1, err = f(x1); err != nil {
			return r, err
		}
	}
	return r, fmt.Errorf("the winding resistance that gives %g V loaded could not be found", vrmsLoadedV)
}

// CornerSpec says which tolerances to sweep.
type CornerSpec struct {
	MainsTol float64 // mains tolerance either way, fraction (0.10 = ±10 %)
	CapTol   float64 // capacitor tolerance downward, fraction (0.20 = −20 %)
	LoadMin  Load    // lightest load
	LoadMax  Load    // heaviest load
	// Solve, when set, solves each corner in place of [Rectifier.Solve]
	// (a caller's memo of solves already made); it must give what
	// Rectifier.Solve gives.
	Solve func(Rectifier) (Result, error)
}

// Corner is one evaluated corner.
type Corner struct {
	Name      string  `json:"name"`       // e.g. "low mains, full load, low C"
	Mains     float64 `json:"mains"`      // multiplier on the secondary EMF
	CapFactor float64 `json:"cap_factor"` // multiplier on the capacitance
	Load      Load    `json:"load"`       // the load at this corner
	Result    Result  `json:"result"`     // the steady state at this corner
}

// CornerResult holds every corner and the two that decide the checks.
type CornerResult struct {
	Corners     []Corner `json:"corners"`      // every corner evaluated
	WorstTrough Corner   `json:"worst_trough"` // lowest trough: dropout
	WorstPeak   Corner   `json:"worst_peak"`   // highest peak: input maximum
}

// Corners solves r at every combination of mains low/high, load min/max and
// capacitance nominal/low, and returns the corners with the lowest trough and
// the highest peak. Corners that cannot carry their load are reported as an
// error naming the corner.
func (r Rectifier) Corners(spec CornerSpec) (CornerResult, error) {
	if spec.MainsTol < 0 || spec.MainsTol >= 1 || spec.CapTol < 0 || spec.CapTol >= 1 {
		return CornerResult{}, fmt.Errorf("tolerances must be fractions from 0 to below 1 (mains %g, capacitor %g)", spec.MainsTol, spec.CapTol)
	}
	solve := spec.Solve
	if solve == nil {
		solve = Rectifier.Solve
	}
	var out CornerResult
	first := true
	for _, m := range []struct {
		name string
		f    float64
	}{{"low mains", 1 - spec.MainsTol}, {"high mains", 1 + spec.MainsTol}} {
		for _, l := range []struct {
			name string
			load Load
		}{{"light load", spec.LoadMin}, {"full load", spec.LoadMax}} {
			for _, c := range []struct {
				name string
				f    float64
			}{{"nominal C", 1}, {"low C", 1 - spec.CapTol}} {
				if c.f == 1 && c.name == "low C" {
					continue
				}
				cn := Corner{Name: m.name + ", " + l.name + ", " + c.name, Mains: m.f, CapFactor: c.f, Load: l.load}
				res, err := solve(r.At(cn))
				if err != nil {
					return CornerResult{}, fmt.Errorf("%s: %w", cn.Name, err)
				}
				cn.Result = res
				out.Corners = append(out.Corners, cn)
				if first || res.TroughV < out.WorstTrough.Result.TroughV {
					out.WorstTrough = cn
				}
				if first || res.PeakV > out.WorstPeak.Result.PeakV {
					out.WorstPeak = cn
				}
				first = false
			}
		}
	}
	return out, nil
}

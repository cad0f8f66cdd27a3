package circuit

import (
	"fmt"
	"math"
	"sort"
)

// Resistor is a stock resistor.
type Resistor struct {
	Ohms  float64 `json:"ohms"`  // value, Ω
	Watts float64 `json:"watts"` // power rating, W
}

// DefaultRatings are the power ratings of the default stock, W.
var DefaultRatings = []float64{0.25, 0.5, 1, 2, 5, 10, 25, 50}

// LoadPart is one resistor of a plan, with what it dissipates.
type LoadPart struct {
	Resistor
	DissipationW float64 `json:"dissipation_w"` // what it dissipates in the plan, W
	Margin       float64 `json:"margin"`        // 1 − dissipation/rating
}

// LoadPlan is a dummy load built from stock resistors.
type LoadPlan struct {
	NeedOhms    float64    `json:"need_ohms"`   // the largest resistance that draws the current
	NeedWatts   float64    `json:"need_watts"`  // what it dissipates at that resistance
	Arrangement string     `json:"arrangement"` // "single", "2 series", "2 parallel", "3 series" or "3 parallel"
	Parts       []LoadPart `json:"parts"`       // the resistors, each with its dissipation
	TotalOhms   float64    `json:"total_ohms"`  // the combination's resistance, Ω
	CurrentA    float64    `json:"current_a"`   // what it draws at the voltage, A
	PowerW      float64    `json:"power_w"`     // what it dissipates in all, W
}

// PlanTestLoad chooses up to three resistors from the series values (one
// decade table, e.g. [E12]) with the given ratings, so that at voltsV they
// draw at least minA and no resistor runs above (1 − derating) of its rating:
//
//	R ≤ V/I_min,   P_k = I_k²·R_k ≤ (1 − derating)·rating_k
//
// Fewer parts win, then the current closest to minA, then the smallest total
// rating. It returns an error when no combination fits.
func PlanTestLoad(voltsV, minA float64, series, ratings []float64, derating float64) (LoadPlan, error) {
	if !(voltsV > 0) || !(minA > 0) || math.IsInf(voltsV, 0) || math.IsInf(minA, 0) {
		return LoadPlan{}, fmt.Errorf("test load: voltage and current must be positive")
	}
	if derating < 0 || derating >= 1 {
		return LoadPlan{}, fmt.Errorf("test load: derating %g must be a fraction from 0 to below 1", derating)
	}
	if series == nil {
		series = E12
	}
	if ratings == nil {
		ratings = DefaultRatings
	}
	rs := append([]float64(nil), ratings...)
	sort.Float64s(rs)
	need := voltsV / minA
	plan := LoadPlan{NeedOhms: need, NeedWatts: voltsV * minA}
	vals := Values(series, 0.1, 10e6)
	type cand struct {
		arr   string
		ohms  []float64
		parts int
		total float64
		amps  []float64 // current through each
	}
	var best *LoadPlan
	bestScore := math.Inf(1)
	try := func(c cand) {
		if c.total > need*(1+1e-9) || c.total <= 0 {
			return
		}
		var parts []LoadPart
		sumRating := 0.0
		for i, r := range c.ohms {
			p := c.amps[i] * c.amps[i] * r
			ok := false
			for _, w := range rs {
				if p <= (1-derating)*w {
					parts = append(parts, LoadPart{Resistor{r, w}, p, 1 - p/w})
					sumRating += w
					ok = true
					break
				}
			}
			if !ok {
				return
			}
		}
		i := voltsV / c.total
		excess := i/minA - 1
		score := float64(c.parts)*0.05 + excess + sumRating*1e-6
		if score < bestScore {
			bestScore = score
			p := plan
			p.Arrangement, p.Parts, p.TotalOhms, p.CurrentA, p.PowerW = c.arr, parts, c.total, i, voltsV*i
			best = &p
		}
	}
	below := func(x float64) (float64, bool) {
		j := sort.SearchFloat64s(vals, x*(1+1e-12))
		if j == 0 {
			return 0, false
		}
		return vals[j-1], true
	}
	above := func(x float64) (float64, bool) {
		j := sort.SearchFloat64s(vals, x*(1-1e-12))
		if j == len(vals) {
			return 0, false
		}
		return vals[j], true
	}
	i := voltsV
	// One resistor.
	if r, ok := below(need); ok {
		try(cand{"single", []float64{r}, 1, r, []float64{i / r}})
	}
	for _, a := range vals {
		// Two in series: a + b ≤ need.
		if a < need {
			if b, ok := below(need - a); ok && b <= a {
				t := a + b
				try(cand{"2 series", []float64{a, b}, 2, t, []float64{i / t, i / t}})
				// Three in series.
				for _, b2 := range vals {
					if b2 > a || a+b2 >= need {
						break
					}
					if c, ok := below(need - a - b2); ok && c <= b2 {
						t := a + b2 + c
						try(cand{"3 series", []float64{a, b2, c}, 3, t, []float64{i / t, i / t, i / t}})
					}
				}
			}
		}
		// Two in parallel: 1/a + 1/b ≥ 1/need.
		if a > need {
			if b, ok := below(1 / (1/need - 1/a)); ok && b <= a {
				t := a * b / (a + b)
				try(cand{"2 parallel", []float64{a, b}, 2, t, []float64{i / a, i / b}})
			}
		}
		if a >= need && a <= need*3.01 {
			// Three equal in parallel, or a ∥ b ∥ c with c solved.
			for _, b := range vals {
				if b > a {
					break
				}
				rem := 1/need - 1/a - 1/b
				if rem <= 0 {
					continue
				}
				if c, ok := above(1 / rem); ok && c <= b {
					if c2, ok2 := below(1 / rem); ok2 {
						c = c2
					}
					if c <= b {
						t := 1 / (1/a + 1/b + 1/c)
						try(cand{"3 parallel", []float64{a, b, c}, 3, t, []float64{i / a, i / b, i / c}})
					}
				}
			}
		}
		// (a ∥ b) + c and (a + b) ∥ c are left to the simpler arrangements above,
		// which cover the same resistances within a series step.
	}
	if best == nil {
		return LoadPlan{}, fmt.Errorf("no combination of up to three stock resistors draws %g A at %g V within the ratings (it needs %.3g W)", minA, voltsV, voltsV*minA)
	}
	return *best, nil
}

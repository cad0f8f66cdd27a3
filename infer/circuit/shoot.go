package circuit

// The steady-state solver of a [Rectifier]: implicit integration of the
// capacitor over one mains period, the diode current by Newton's method at
// every step, and shooting (Newton on the start voltage) for the periodic
// state.

import (
	"fmt"
	"math"
)

// state is the solver's view of the circuit.
type state struct {
	nd           float64 // diodes per path
	is, nvt, rsd float64
	rlin         float64 // source + ESR (scaled) in series with the diodes
	k            float64 // output-node divider for a resistive load
	c, esr       float64
	il, rl       float64
	vp, w        float64
	rs           float64 // winding resistance (for the terminal voltage)
	full         bool
}

// secondary returns the winding's terminal voltage at time t carrying path
// current id (rectified, like drive).
func (s *state) secondary(t, id float64) float64 { return s.drive(t) - id*s.rs }

// drive returns the rectified source EMF at time t.
func (s *state) drive(t float64) float64 {
	e := s.vp * math.Sin(s.w*t)
	if s.full {
		return math.Abs(e)
	}
	return e
}

// diodeCurrent solves nd·vj + i(vj)·R = a for the path current and returns
// it with di/da, by Newton's method on the convex function.
func (s *state) diodeCurrent(a float64, guess float64) (i, didA, vj float64) {
	if a <= 0 {
		return 0, 0, 0
	}
	r := s.nd*s.rsd + s.rlin
	hi := a / s.nd
	if r > 0 {
		if b := s.nvt * math.Log1p(a/(r*s.is)); b < hi {
			hi = b
		}
	}
	// Newton from a warm start; from below the first step overshoots above
	// the root, after which the iterates fall monotonically. Clamping to hi
	// keeps exp finite.
	v := hi
	if guess > 0 && guess < hi {
		v = guess
	}
	var ex float64
	for it := 0; it < 100; it++ {
		ex = math.Exp(v / s.nvt)
		g := s.nd*v + s.is*(ex-1)*r - a
		dg := s.nd + s.is*ex/s.nvt*r
		step := g / dg
		if math.Abs(step) < 1e-9*s.nvt {
			break
		}
		v -= step
		if v > hi {
			v = hi
		}
	}
	i = s.is * (ex - 1)
	if i < 0 {
		i = 0
	}
	didA = 1 / (s.nd*s.nvt/(i+s.is) + r)
	return i, didA, v
}

// capCurrent returns the capacitor current at capacitor voltage vc and time t,
// its derivative with respect to vc, the path current and the output voltage.
func (s *state) capCurrent(vc, t, guess float64) (ic, dic, id, vout, vj float64) {
	e := s.drive(t)
	if s.rl > 0 {
		a := e - s.k*vc
		var dida float64
		id, dida, vj = s.diodeCurrent(a, guess)
		ic = id*(1-s.k*s.esr/s.rl) - s.k*vc/s.rl
		dic = -s.k*dida*(1-s.k*s.esr/s.rl) - s.k/s.rl
		vout = s.k * (vc + s.esr*id)
		return
	}
	a := e - vc + s.esr*s.il
	var dida float64
	id, dida, vj = s.diodeCurrent(a, guess)
	ic = id - s.il
	dic = -dida
	vout = vc + s.esr*ic
	return
}

// cycle integrates one output period from vc0 with the trapezoidal rule and
// returns the final voltage and d(final)/d(vc0). When rec is non-nil it
// records the waveform.
func (s *state) cycle(vc0 float64, steps int, period float64, rec *Result) (float64, float64) {
	dt := period / float64(steps)
	dtc := dt / s.c // dv = dt·i/C
	vc := vc0
	sens := 1.0
	ic, dic, id, vout, vj := s.capCurrent(vc, 0, 0)
	var sumV, sumI2, sumE2 float64
	vs := s.secondary(0, id)
	peakV, troughV, peakI := vout, vout, id
	ids := make([]float64, 0)
	if rec != nil {
		ids = make([]float64, 0, steps+1)
		ids = append(ids, id)
	}
	for n := 1; n <= steps; n++ {
		t := float64(n) * dt
		// Solve x − vc − dt/(2C)·(ic + ic(x, t)) = 0 by Newton's method; h is increasing.
		x := vc + dtc*ic
		var icx, dicx, idx, voutx, vjx float64
		guess := vj
		for it := 0; it < 60; it++ {
			icx, dicx, idx, voutx, vjx = s.capCurrent(x, t, guess)
			guess = vjx
			h := x - vc - dtc/2*(ic+icx)
			dh := 1 - dtc/2*dicx
			step := h / dh
			if math.Abs(step) < 1e-11*math.Max(1, math.Abs(x)) {
				break // keep the values evaluated at x
			}
			x -= step
		}
		sens *= (1 + dtc/2*dic) / (1 - dtc/2*dicx)
		if rec != nil {
			sumV += dt / 2 * (vout + voutx)
			sumI2 += dt / 2 * (ic*ic + icx*icx)
			vsx := s.secondary(t, idx)
			sumE2 += dt / 2 * (vs*vs + vsx*vsx)
			vs = vsx
			peakV = math.Max(peakV, voutx)
			troughV = math.Min(troughV, voutx)
			peakI = math.Max(peakI, idx)
			ids = append(ids, idx)
		}
		vc, ic, dic, id, vout, vj = x, icx, dicx, idx, voutx, vjx
	}
	if rec != nil {
		rec.PeakV, rec.TroughV = peakV, troughV
		rec.MeanV = sumV / period
		rec.RippleVpp = peakV - troughV
		rec.CapRippleARMS = math.Sqrt(sumI2 / period)
		rec.SecondaryRMSV = math.Sqrt(sumE2 / period)
		rec.DiodePeakA = peakI
		on := 0
		for _, v := range ids[1:] {
			if v > 0.01*peakI {
				on++
			}
		}
		mains := 1 / s.w * 2 * math.Pi
		rec.ConductionDeg = float64(on) * dt / mains * 360
		if s.rl > 0 {
			rec.LoadA = rec.MeanV / s.rl
		} else {
			rec.LoadA = s.il
		}
	}
	return vc, sens
}

// shoot finds the capacitor voltage at the start of a periodic ripple period
// by Newton's method, and returns it with the sensitivity of one period.
// When rec is non-nil every cycle is recorded into it, so that on success it
// holds the converged cycle's figures.
func (s *state) shoot(steps int, period float64, rec *Result) (x, sens float64, converged bool) {
	x = math.Max(0, s.vp-s.nd*0.7)
	for it := 0; it < 60; it++ {
		var end float64
		end, sens = s.cycle(x, steps, period, rec)
		f := end - x
		// 1e-7 of the peak: far inside the 1 % the results are checked to.
		if math.Abs(f) < 1e-7*math.Max(1, s.vp) {
			return x, sens, true
		}
		den := sens - 1
		if math.Abs(den) < 1e-15 {
			return x, sens, false
		}
		nx := x - f/den
		if math.IsNaN(nx) || math.IsInf(nx, 0) {
			return x, sens, false
		}
		// Keep the iterate physical: between a deep discharge and the peak.
		x = math.Max(math.Min(nx, s.vp+1), -s.vp)
	}
	return x, sens, false
}

// newState sets up the solver for r and returns it with the steps per mains cycle.
func (r Rectifier) newState() (*state, int) {
	d := r.diode()
	s := &state{
		nd: float64(r.Topology.diodes()), is: d.IS, nvt: d.vt(), rsd: d.RS,
		c: r.CapF, esr: r.ESROhm, il: r.Load.Amps, vp: math.Sqrt2 * r.VrmsV,
		w: 2 * math.Pi * r.Hz, full: r.Topology.fullWave(), rs: r.SourceOhm,
	}
	if s.il == 0 && r.Load.Ohms > 0 {
		s.rl = r.Load.Ohms
		s.k = s.rl / (s.rl + s.esr)
		s.rlin = r.SourceOhm + s.k*s.esr
	} else {
		s.rlin = r.SourceOhm + s.esr
	}
	steps := r.StepsPerCycle
	if steps == 0 {
		steps = 2000
	}
	return s, steps
}

// Solve finds the periodic steady state by shooting: Newton's method on the
// capacitor voltage at the start of a ripple period, with the derivative
// carried through the time steps. It returns [ErrNoSteadyState] (wrapped)
// when it does not converge, and an error when the capacitor cannot hold up
// the load at all.
func (r Rectifier) Solve() (Result, error) {
	if err := r.Validate(); err != nil {
		return Result{}, err
	}
	s, steps := r.newState()
	period := 1 / r.Hz
	if s.full {
		period /= 2
		steps /= 2
	}
	var res Result
	_, sens, converged := s.shoot(steps, period, &res)
	if !converged {
		return Result{}, fmt.Errorf("rectifier: %w after 60 shooting iterations", ErrNoSteadyState)
	}
	if res.TroughV <= 0 {
		return Result{}, fmt.Errorf("rectifier: the filter cannot carry this load: the voltage falls to %.3g V each cycle (more capacitance or less load)", res.TroughV)
	}
	// Settling from an empty capacitor: sens per ripple period is the contraction rate.
	cyc := 20
	if sens > 0 && sens < 1 {
		n := math.Log(1e-6) / math.Log(sens)
		if s.full {
			n /= 2
		}
		cyc = int(math.Ceil(n)) + 10
	}
	res.SettleCycles = min(max(cyc, 20), 5000)
	return res, nil
}

// Waveform returns the steady-state filtered voltage over the given number of
// mains cycles, sampled at every time step: times in seconds from a zero
// crossing of the source, and volts.
func (r Rectifier) Waveform(cycles int) (times, volts []float64, err error) {
	if cycles < 1 || cycles > 20 {
		return nil, nil, fmt.Errorf("waveform: %d cycles is outside 1 to 20", cycles)
	}
	if _, err := r.Solve(); err != nil {
		return nil, nil, err
	}
	s, steps := r.newState()
	period := 1 / r.Hz
	ps, pst := period, steps
	if s.full {
		ps, pst = period/2, steps/2
	}
	x, _, _ := s.shoot(pst, ps, nil)
	dt := period / float64(steps)
	vc := x
	ic, _, _, vout, vj := s.capCurrent(vc, 0, 0)
	times = append(times, 0)
	volts = append(volts, vout)
	dtc := dt / s.c
	for n := 1; n <= steps*cycles; n++ {
		t := float64(n) * dt
		xn := vc + dtc*ic
		var icx, voutx, vjx float64
		for it := 0; it < 60; it++ {
			var dicx float64
			icx, dicx, _, voutx, vjx = s.capCurrent(xn, t, vj)
			h := xn - vc - dtc/2*(ic+icx)
			step := h / (1 - dtc/2*dicx)
			if math.Abs(step) < 1e-11*math.Max(1, math.Abs(xn)) {
				break
			}
			xn -= step
		}
		vc, ic, vj = xn, icx, vjx
		times = append(times, t)
		volts = append(volts, voutx)
	}
	return times, volts, nil
}

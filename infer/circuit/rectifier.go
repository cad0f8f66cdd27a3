package circuit

import (
	"errors"
	"fmt"
	"math"
)

// Topology is a rectifier arrangement.
type Topology string

// Rectifier topologies.
const (
	HalfWave  Topology = "half-wave"  // one diode, one pulse per mains cycle
	CenterTap Topology = "center-tap" // two diodes, centre-tapped secondary; Vrms is per half
	Bridge    Topology = "bridge"     // four diodes, two in each conducting path
)

// ParseTopology returns the topology named s ("bridge", "center-tap" or "ct", "half-wave" or "hw").
func ParseTopology(s string) (Topology, error) {
	switch s {
	case "bridge", "br", "full-wave-bridge":
		return Bridge, nil
	case "center-tap", "centre-tap", "ct":
		return CenterTap, nil
	case "half-wave", "hw":
		return HalfWave, nil
	}
	return "", fmt.Errorf("unknown rectifier %q (use bridge, center-tap or half-wave)", s)
}

// diodes returns the number of diodes in one conducting path.
func (t Topology) diodes() int {
	if t == Bridge {
		return 2
	}
	return 1
}

// fullWave reports whether the output has two pulses per mains cycle.
func (t Topology) fullWave() bool { return t == Bridge || t == CenterTap }

// Diode is a Shockley junction with series resistance:
//
//	i = IS·(exp(vj/(N·Vt)) − 1),   v = vj + i·RS,   Vt = k·T/q
//
// the static part of the SPICE diode model (junction capacitance and
// transit time are left out).
type Diode struct {
	IS    float64 // saturation current, A
	N     float64 // emission coefficient
	RS    float64 // series resistance, Ω
	TempC float64 // junction temperature, °C (27 if zero, as SPICE)
}

// Diode1N4007 is the widely circulated SPICE model of a 1N4007 rectifier
// (IS = 7.02767 nA, N = 1.80803, RS = 34.2 mΩ), the one behind the ngspice
// reference runs in shared/reference/spice.
var Diode1N4007 = Diode{IS: 7.02767e-9, N: 1.80803, RS: 0.0341512}

// boltzmannOverQ is k/q in V/K (CODATA 2018: k = 1.380649e-23 J/K, q = 1.602176634e-19 C).
const boltzmannOverQ = 1.380649e-23 / 1.602176634e-19

func (d Diode) vt() float64 {
	t := d.TempC
	if t == 0 {
		t = 27
	}
	return d.N * boltzmannOverQ * (t + 273.15)
}

// Load is what the filter capacitor feeds: a constant current (a series
// regulator draws its load current whatever its input), a resistance, or
// nothing (both zero).
type Load struct {
	Amps float64 `json:"a"`   // constant current, A; used when > 0
	Ohms float64 `json:"ohm"` // resistance, Ω; used when Amps is 0 and Ohms > 0
}

// Rectifier is a transformer secondary, rectifier, filter capacitor and load.
// The secondary is an ideal sine of RMS value VrmsV (per half-winding for a
// centre tap) behind SourceOhm (winding resistance per conducting path).
type Rectifier struct {
	Topology  Topology // half-wave, centre-tap or bridge
	VrmsV     float64  // open-circuit secondary EMF, V RMS (per half for CenterTap)
	Hz        float64  // mains frequency
	CapF      float64  // filter capacitance, F
	ESROhm    float64  // capacitor equivalent series resistance, Ω
	SourceOhm float64  // winding resistance per conducting path, Ω
	Load      Load     // what the capacitor feeds; the zero value is no load
	Diode     Diode    // zero value: Diode1N4007
	// StepsPerCycle is the number of time steps per mains cycle (2000 if zero).
	StepsPerCycle int
}

// Result is the periodic steady state of a [Rectifier].
type Result struct {
	PeakV         float64 `json:"peak_v"`           // highest filtered voltage
	TroughV       float64 `json:"trough_v"`         // lowest filtered voltage (the ripple valley)
	MeanV         float64 `json:"mean_v"`           // time average
	RippleVpp     float64 `json:"ripple_vpp"`       // PeakV − TroughV
	CapRippleARMS float64 `json:"cap_ripple_a_rms"` // RMS capacitor current
	DiodePeakA    float64 `json:"diode_peak_a"`     // peak current in one diode
	ConductionDeg float64 `json:"conduction_deg"`   // degrees of the mains cycle one diode carries more than 1 % of its peak
	LoadA         float64 `json:"load_a"`           // mean load current
	// SecondaryRMSV is the RMS voltage at the winding's terminals: the
	// source EMF less the winding resistance's drop while the diodes
	// conduct, what a true-RMS meter on the loaded secondary reads. For a
	// centre tap it is the conducting half's terminal on each half-cycle:
	// the primary's share of the resistance loads both halves alike, so a
	// meter on either half sees the drop on every half-cycle.
	SecondaryRMSV float64 `json:"secondary_rms_v"`
	// SettleCycles is how many mains cycles a simulation started from an
	// empty capacitor needs to come within 1e-6 of this state (from the
	// contraction rate the shooting method measured).
	SettleCycles int `json:"settle_cycles"`
}

// ErrNoSteadyState is returned when the solver could not find the periodic
// steady state.
var ErrNoSteadyState = errors.New("no periodic steady state found")

// Validate checks that the circuit is inside the documented ranges.
func (r Rectifier) Validate() error {
	fin := func(name string, v, lo, hi float64) error {
		if math.IsNaN(v) || math.IsInf(v, 0) || v < lo || v > hi {
			return fmt.Errorf("%s = %g is outside %g to %g", name, v, lo, hi)
		}
		return nil
	}
	switch r.Topology {
	case HalfWave, CenterTap, Bridge:
	default:
		return fmt.Errorf("unknown rectifier %q", r.Topology)
	}
	d := r.diode()
	for _, e := range []error{
		fin("secondary voltage (V RMS)", r.VrmsV, 0.5, 5000),
		fin("mains frequency (Hz)", r.Hz, 1, 1000),
		fin("filter capacitance (F)", r.CapF, 1e-9, 10),
		fin("capacitor ESR (Ω)", r.ESROhm, 0, 1000),
		fin("source resistance (Ω)", r.SourceOhm, 0, 1e5),
		fin("load current (A)", r.Load.Amps, 0, 1000),
		fin("load resistance (Ω)", r.Load.Ohms, 0, 1e9),
		fin("diode IS (A)", d.IS, 1e-18, 1e-3),
		fin("diode N", d.N, 0.01, 10),
		fin("diode RS (Ω)", d.RS, 0, 100),
	} {
		if e != nil {
			return e
		}
	}
	if r.Load.Ohms > 0 && r.Load.Ohms < 1e-3 {
		return fmt.Errorf("load resistance %g Ω is a short circuit", r.Load.Ohms)
	}
	if float64(r.Topology.diodes())*d.RS+r.SourceOhm+r.ESROhm < 1e-4 {
		return errors.New("the charging path has no resistance at all; give the winding resistance or the capacitor ESR")
	}
	if r.StepsPerCycle != 0 && (r.StepsPerCycle < 100 || r.StepsPerCycle > 200000) {
		return fmt.Errorf("steps per cycle %d is outside 100 to 200000", r.StepsPerCycle)
	}
	return nil
}

func (r Rectifier) diode() Diode {
	if r.Diode == (Diode{}) {
		return Diode1N4007
	}
	return r.Diode
}

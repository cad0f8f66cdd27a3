package circuit

import (
	"fmt"
	"math"
	"strings"
)

// Netlist returns a complete ngspice netlist of the circuit that
// "ngspice -b" runs as it is: the same source, diode (IS, N, RS), winding
// resistance, capacitance, ESR and load as the solver, the filtered node
// named vdc, a transient run of settleCycles mains cycles (use
// [Result.SettleCycles]; at least 20), and .meas results peak, trough and
// mean (of v(vdc)), icap (RMS capacitor current), idpk (peak current of
// one diode) and vsec (RMS of the winding's terminal voltage; for a centre
// tap the conducting half's) over the last whole mains cycle.
func (r Rectifier) Netlist(title string, settleCycles int) (string, error) {
	if err := r.Validate(); err != nil {
		return "", err
	}
	if settleCycles < 20 {
		settleCycles = 20
	}
	d := r.diode()
	temp := d.TempC
	if temp == 0 {
		temp = 27
	}
	steps := r.StepsPerCycle
	if steps == 0 {
		steps = 2000
	}
	vp := math.Sqrt2 * r.VrmsV
	period := 1 / r.Hz
	dt := period / float64(steps)
	stop := float64(settleCycles) * period
	g := func(x float64) string { return fmt.Sprintf("%.10g", x) }
	var b strings.Builder
	fmt.Fprintf(&b, "* %s\n", strings.ReplaceAll(title, "\n", " "))
	fmt.Fprintf(&b, "* whichreg rectifier: %s, %g V rms, %g Hz, C %g F, ESR %g ohm, Rs %g ohm\n", r.Topology, r.VrmsV, r.Hz, r.CapF, r.ESROhm, r.SourceOhm)
	rs := g(math.Max(r.SourceOhm, 1e-6))
	switch r.Topology {
	case Bridge:
		fmt.Fprintf(&b, "V1 s1x s2 SIN(0 %s %s 0 0 0)\n", g(vp), g(r.Hz))
		fmt.Fprintf(&b, "RW s1x s1y %s\nVD1 s1y s1 DC 0\n", rs)
		b.WriteString("D1 s1 vdc DREC\nD2 s2 vdc DREC\nD3 0 s1 DREC\nD4 0 s2 DREC\n")
		// A floating secondary needs a DC path to ground while every diode is off.
		b.WriteString("RLEAK s2 0 1e9\n")
		// The winding's terminal voltage as a node, for its RMS.
		b.WriteString("ESEC vsec 0 s1y s2 1\n")
	case CenterTap:
		fmt.Fprintf(&b, "V1 a 0 SIN(0 %s %s 0 0 0)\nV2 b 0 SIN(0 %s %s 0 0 180)\n", g(vp), g(r.Hz), g(vp), g(r.Hz))
		fmt.Fprintf(&b, "RWA a a1 %s\nRWB b b1 %s\nVD1 a1 a2 DC 0\nVD2 b1 b2 DC 0\n", rs, rs)
		b.WriteString("D1 a2 vdc DREC\nD2 b2 vdc DREC\n")
		// The conducting half's terminal voltage (the larger of the two).
		b.WriteString("BSEC vsec 0 V=max(v(a1),v(b1))\n")
	case HalfWave:
		fmt.Fprintf(&b, "V1 a 0 SIN(0 %s %s 0 0 0)\n", g(vp), g(r.Hz))
		fmt.Fprintf(&b, "RW a a1 %s\nVD1 a1 a2 DC 0\nD1 a2 vdc DREC\n", rs)
	}
	if r.ESROhm > 0 {
		fmt.Fprintf(&b, "C1 vdc cp %s\nRESR cp cq %s\nVIC cq 0 DC 0\n", g(r.CapF), g(r.ESROhm))
	} else {
		fmt.Fprintf(&b, "C1 vdc cp %s\nVIC cp 0 DC 0\n", g(r.CapF))
	}
	switch {
	case r.Load.Amps > 0:
		fmt.Fprintf(&b, "ILD vdc 0 DC %s\n", g(r.Load.Amps))
	case r.Load.Ohms > 0:
		fmt.Fprintf(&b, "RLD vdc 0 %s\n", g(r.Load.Ohms))
	}
	fmt.Fprintf(&b, ".model DREC D(IS=%s N=%s RS=%s)\n", g(d.IS), g(d.N), g(d.RS))
	fmt.Fprintf(&b, ".options reltol=1e-4 abstol=1e-10 vntol=1e-7 itl4=100 temp=%s tnom=%s\n", g(temp), g(temp))
	fmt.Fprintf(&b, ".tran %s %s 0 %s uic\n", g(dt), g(stop), g(dt))
	from, to := g(stop-period), g(stop)
	// The winding's terminal voltage, after its resistance.
	vsec := map[Topology]string{Bridge: "v(vsec)", CenterTap: "v(vsec)", HalfWave: "v(a1)"}[r.Topology]
	for _, m := range []struct{ name, fn, what string }{
		{"peak", "MAX", "v(vdc)"}, {"trough", "MIN", "v(vdc)"}, {"mean", "AVG", "v(vdc)"},
		{"icap", "RMS", "i(VIC)"}, {"idpk", "MAX", "i(VD1)"}, {"vsec", "RMS", vsec},
	} {
		fmt.Fprintf(&b, ".meas tran %s %s %s FROM=%s TO=%s\n", m.name, m.fn, m.what, from, to)
	}
	b.WriteString(".end\n")
	return b.String(), nil
}

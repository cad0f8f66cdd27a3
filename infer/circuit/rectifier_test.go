package circuit

import (
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"testing"
)

func within(got, want, rel float64) bool {
	return math.Abs(got-want) <= rel*math.Abs(want)
}

// TestReferenceRuns compares the solver with ngspice-39 runs of the same
// circuits (1N4007 model, ideal sine, winding resistance, ideal capacitor,
// resistive load), tabulated in shared/reference/methods.md §7 (netlists in
// shared/reference/spice). Those runs included the model's junction
// capacitance and transit time, which the solver leaves out.
func TestReferenceRuns(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name                string
		top                 Topology
		hz, vrms, rw, c, rl float64
		max, min, avg, icap float64
		idpk, conductionDeg float64
	}{
		{"ctA_50", CenterTap, 50, 12, 0.5, 2200e-6, 15, 14.8547, 12.1225, 13.5053, 1.4096, 3.9390, 64.6},
		{"ctA_60", CenterTap, 60, 12, 0.5, 2200e-6, 15, 14.7339, 12.4282, 13.5925, 1.4291, 3.9970, 63.7},
		{"ctB_50", CenterTap, 50, 12, 0.5, 4700e-6, 15, 14.3980, 13.0758, 13.7404, 1.4615, 4.0935, 62.5},
		{"ctC_60", CenterTap, 60, 18, 1.0, 1000e-6, 100, 23.6116, 22.1407, 22.8811, 0.4648, 1.4817, 43.6},
		{"brA_50", Bridge, 50, 12, 0.5, 2200e-6, 15, 13.9058, 11.3646, 12.6491, 1.3099, 3.6618, 66.6},
		{"hwA_50", HalfWave, 50, 12, 0.5, 2200e-6, 15, 14.7010, 9.1019, 11.7944, 1.6820, 5.5745, 79.4},
		{"ctX_50", CenterTap, 50, 70.711, 3.0, 954.93e-6, 100, 90.4379, 84.0789, 87.2723, 1.4440, 4.0901, 57.6},
		{"hwX_50", HalfWave, 50, 70.711, 3.0, 954.93e-6, 100, 87.2404, 73.6632, 80.3601, 1.8057, 6.1039, 71.5},
	}
	for _, tt := range tests {
		r := Rectifier{Topology: tt.top, VrmsV: tt.vrms, Hz: tt.hz, CapF: tt.c, SourceOhm: tt.rw, Load: Load{Ohms: tt.rl}}
		if tt.name == "ctX_50" || tt.name == "hwX_50" {
			// These two runs use the near-ideal diode DIDEAL (IS = 1e-14, N = 0.05, RS = 0).
			r.Diode = Diode{IS: 1e-14, N: 0.05}
		}
		res, err := r.Solve()
		if err != nil {
			t.Fatalf("%s: %v", tt.name, err)
		}
		for _, c := range []struct {
			what      string
			got, want float64
			rel       float64
		}{
			{"peak", res.PeakV, tt.max, 0.002}, {"trough", res.TroughV, tt.min, 0.002}, {"mean", res.MeanV, tt.avg, 0.002},
			{"cap rms", res.CapRippleARMS, tt.icap, 0.01}, {"diode peak", res.DiodePeakA, tt.idpk, 0.01},
			{"conduction", res.ConductionDeg, tt.conductionDeg, 0.02},
		} {
			if !within(c.got, c.want, c.rel) {
				t.Errorf("%s %s = %.5g, ngspice %.5g (tolerance %g %%)", tt.name, c.what, c.got, c.want, c.rel*100)
			}
		}
	}
}

// TestNgspiceCrossCheck runs ngspice on the netlist the solver exports and
// compares: peak, trough and mean within 1 %, capacitor ripple current within
// 5 % (issue #4). It skips when ngspice is missing unless
// WHICHREG_REQUIRE_NGSPICE=1.
func TestNgspiceCrossCheck(t *testing.T) {
	path, err := exec.LookPath("ngspice")
	if err != nil {
		if os.Getenv("WHICHREG_REQUIRE_NGSPICE") == "1" {
			t.Fatal("ngspice is required (WHICHREG_REQUIRE_NGSPICE=1) but not on PATH; apt-get install -y ngspice")
		}
		t.Skip("ngspice not installed; set WHICHREG_REQUIRE_NGSPICE=1 to make this a failure")
	}
	cases := []struct {
		name string
		r    Rectifier
	}{
		{"half-wave 50 Hz light resistive", Rectifier{Topology: HalfWave, VrmsV: 15, Hz: 50, CapF: 1000e-6, SourceOhm: 1.2, Load: Load{Ohms: 200}}},
		{"half-wave 60 Hz regulator load", Rectifier{Topology: HalfWave, VrmsV: 12, Hz: 60, CapF: 4700e-6, ESROhm: 0.05, SourceOhm: 0.8, Load: Load{Amps: 0.3}}},
		{"centre-tap 50 Hz heavy", Rectifier{Topology: CenterTap, VrmsV: 9, Hz: 50, CapF: 6800e-6, ESROhm: 0.02, SourceOhm: 0.25, Load: Load{Amps: 1.5}}},
		{"centre-tap 60 Hz light", Rectifier{Topology: CenterTap, VrmsV: 18, Hz: 60, CapF: 470e-6, SourceOhm: 2, Load: Load{Amps: 0.05}}},
		{"bridge 50 Hz heavy", Rectifier{Topology: Bridge, VrmsV: 12.6, Hz: 50, CapF: 3300e-6, ESROhm: 0.04, SourceOhm: 0.4, Load: Load{Amps: 1.2}}},
		{"bridge 60 Hz light resistive", Rectifier{Topology: Bridge, VrmsV: 24, Hz: 60, CapF: 220e-6, SourceOhm: 3, Load: Load{Ohms: 470}}},
	}
	re := regexp.MustCompile(`(?m)^\s*(peak|trough|mean|icap|idpk|vsec)\s*=\s*([-+0-9.eE]+)`)
	dir := t.TempDir()
	for _, tc := range cases {
		tc := tc
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			res, err := tc.r.Solve()
			if err != nil {
				t.Fatal(err)
			}
			net, err := tc.r.Netlist(tc.name, res.SettleCycles)
			if err != nil {
				t.Fatal(err)
			}
			f := filepath.Join(dir, regexp.MustCompile(`\W+`).ReplaceAllString(tc.name, "_")+".cir")
			if err := os.WriteFile(f, []byte(net), 0o644); err != nil {
				t.Fatal(err)
			}
			out, err := exec.Command(path, "-b", f).CombinedOutput()
			if err != nil {
				t.Fatalf("ngspice failed: %v\n%s", err, out)
			}
			got := map[string]float64{}
			for _, m := range re.FindAllStringSubmatch(string(out), -1) {
				v, err := strconv.ParseFloat(m[2], 64)
				if err == nil {
					got[m[1]] = v
				}
			}
			if len(got) != 6 {
				t.Fatalf("ngspice gave %v; output:\n%s", got, out)
			}
			for _, c := range []struct {
				what     string
				ours, sp float64
				rel      float64
			}{
				{"peak", res.PeakV, got["peak"], 0.01}, {"trough", res.TroughV, got["trough"], 0.01},
				{"mean", res.MeanV, got["mean"], 0.01}, {"cap ripple rms", res.CapRippleARMS, got["icap"], 0.05},
				{"diode peak", res.DiodePeakA, got["idpk"], 0.05},
				{"loaded secondary rms", res.SecondaryRMSV, got["vsec"], 0.005},
			} {
				if !within(c.ours, c.sp, c.rel) {
					t.Errorf("%s: ours %.5g, ngspice %.5g (tolerance %g %%)", c.what, c.ours, c.sp, c.rel*100)
				}
			}
		})
	}
}

// TestLargeCapacitorLimit checks the textbook estimate ΔV ≈ I/(2fC) full wave
// and I/(fC) half wave (Horowitz & Hill, The Art of Electronics, 3rd ed.,
// §1.6.3A): the estimate errs on the safe side, and the simulation approaches
// it as the capacitor grows and the conduction pulse narrows.
func TestLargeCapacitorLimit(t *testing.T) {
	t.Parallel()
	for _, top := range []Topology{HalfWave, CenterTap, Bridge} {
		k := 2.0
		if top == HalfWave {
			k = 1
		}
		prev := 0.0
		for _, c := range []float64{2200e-6, 22000e-6, 220000e-6} {
			// A near-ideal diode and almost no winding resistance, so that the
			// conduction pulse can narrow as the capacitor grows.
			r := Rectifier{Topology: top, VrmsV: 12, Hz: 50, CapF: c, SourceOhm: 0.001, Load: Load{Amps: 0.5},
				Diode: Diode{IS: 1e-14, N: 0.05}}
			res, err := r.Solve()
			if err != nil {
				t.Fatal(err)
			}
			est := r.Load.Amps / (k * r.Hz * c)
			ratio := res.RippleVpp / est
			if ratio > 1.0 {
				t.Errorf("%s C=%g: ripple %.4g V exceeds the conservative estimate %.4g V", top, c, res.RippleVpp, est)
			}
			if ratio < prev-1e-3 {
				t.Errorf("%s: ripple/estimate fell from %.3f to %.3f as C grew", top, prev, ratio)
			}
			prev = ratio
		}
		if prev < 0.85 {
			t.Errorf("%s: with a large capacitor the ripple is %.2f of I/(kfC); want it near 1", top, prev)
		}
	}
}

// TestIdealHalfWave checks the exact ideal-diode half-wave ripple r = Vpp/Vp,
// the root of cos(φ)·exp(−(2π − arccos(1−r) − φ)/(ωRC)) = 1 − r with
// φ = arctan(1/ωRC) (social.076.moe attachment 2377191, quoted in
// methods.md §1.2), against the solver with a near-ideal diode and a tiny
// source resistance.
func TestIdealHalfWave(t *testing.T) {
	t.Parallel()
	for _, wrc := range []float64{10, 30, 100} {
		f := func(r float64) float64 {
			phi := math.Atan(1 / wrc)
			return math.Cos(phi)*math.Exp(-(2*math.Pi-math.Acos(1-r)-phi)/wrc) - (1 - r)
		}
		lo, hi := 1e-6, 1.0
		for i := 0; i < 200; i++ {
			m := (lo + hi) / 2
			if f(lo)*f(m) <= 0 {
				hi = m
			} else {
				lo = m
			}
		}
		exact := (lo + hi) / 2
		rl := 100.0
		c := wrc / (2 * math.Pi * 50 * rl)
		r := Rectifier{Topology: HalfWave, VrmsV: 100 / math.Sqrt2, Hz: 50, CapF: c, SourceOhm: 1e-3,
			Load: Load{Ohms: rl}, Diode: Diode{IS: 1e-14, N: 0.05}, StepsPerCycle: 20000}
		res, err := r.Solve()
		if err != nil {
			t.Fatal(err)
		}
		got := res.RippleVpp / 100
		if !within(got, exact, 0.01) {
			t.Errorf("ωRC=%g: ripple/Vp = %.5f, exact %.5f", wrc, got, exact)
		}
	}
}

func TestCorners(t *testing.T) {
	t.Parallel()
	r := Rectifier{Topology: Bridge, VrmsV: 12, Hz: 50, CapF: 2200e-6, SourceOhm: 0.5, ESROhm: 0.05}
	cr, err := r.Corners(CornerSpec{MainsTol: 0.1, CapTol: 0.2, LoadMin: Load{Amps: 0.05}, LoadMax: Load{Amps: 1}})
	if err != nil {
		t.Fatal(err)
	}
	if len(cr.Corners) != 8 {
		t.Fatalf("%d corners, want 8", len(cr.Corners))
	}
	if cr.WorstTrough.Name != "low mains, full load, low C" {
		t.Errorf("worst trough at %q, want low mains, full load, low C", cr.WorstTrough.Name)
	}
	if cr.WorstPeak.Mains != 1.1 || cr.WorstPeak.Load.Amps != 0.05 {
		t.Errorf("worst peak at %q, want high mains and light load", cr.WorstPeak.Name)
	}
}

func TestFromRegulation(t *testing.T) {
	emf, rs, err := FromRegulation(Bridge, 12, 0.10, 1.0)
	if err != nil || !within(emf, 13.2, 1e-12) || !within(rs, 1.2/1.85, 1e-12) {
		t.Errorf("FromRegulation = %g V, %g Ω, %v", emf, rs, err)
	}
	if _, _, err := FromRegulation(Bridge, 12, 0.1, 0); err == nil {
		t.Error("regulation without a load current should be an error")
	}
}

func TestSolveErrors(t *testing.T) {
	bad := []Rectifier{
		{Topology: Bridge, VrmsV: 12, Hz: 50, CapF: 0, Load: Load{Amps: 1}},
		{Topology: Bridge, VrmsV: 12, Hz: 50, CapF: 1e-3, SourceOhm: -1},
		{Topology: "quarter-wave", VrmsV: 12, Hz: 50, CapF: 1e-3},
		{Topology: Bridge, VrmsV: math.NaN(), Hz: 50, CapF: 1e-3},
		{Topology: Bridge, VrmsV: 12, Hz: 50, CapF: 10e-6, SourceOhm: 0.1, Load: Load{Amps: 20}},
	}
	for i, r := range bad {
		if _, err := r.Solve(); err == nil {
			t.Errorf("case %d: Solve succeeded, want an error", i)
		}
	}
}

// FuzzSolve: for any finite input the solver returns an error or finite
// numbers, and never panics.
func FuzzSolve(f *testing.F) {
	f.Add(uint8(0), 12.0, 50.0, 2200e-6, 0.05, 0.5, 1.0, 0.0)
	f.Add(uint8(1), 240.0, 60.0, 1e-6, 0.0, 0.0, 0.0, 10.0)
	f.Add(uint8(2), 1.0, 400.0, 1.0, 10.0, 1000.0, 100.0, 0.0)
	f.Fuzz(func(t *testing.T, top uint8, v, hz, c, esr, rs, amps, ohms float64) {
		r := Rectifier{Topology: []Topology{HalfWave, CenterTap, Bridge}[int(top)%3], VrmsV: v, Hz: hz, CapF: c,
			ESROhm: esr, SourceOhm: rs, Load: Load{Amps: amps, Ohms: ohms}, StepsPerCycle: 400}
		res, err := r.Solve()
		if err != nil {
			return
		}
		for _, x := range []float64{res.PeakV, res.TroughV, res.MeanV, res.CapRippleARMS, res.DiodePeakA, res.ConductionDeg} {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Fatalf("non-finite result %+v for %+v", res, r)
			}
		}
	})
}

func BenchmarkSolve(b *testing.B) {
	r := Rectifier{Topology: Bridge, VrmsV: 12.6, Hz: 50, CapF: 3300e-6, ESROhm: 0.04, SourceOhm: 0.4, Load: Load{Amps: 1.2}}
	for b.Loop() {
		if _, err := r.Solve(); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkCorners(b *testing.B) {
	r := Rectifier{Topology: Bridge, VrmsV: 12.6, Hz: 50, CapF: 3300e-6, ESROhm: 0.04, SourceOhm: 0.4}
	spec := CornerSpec{MainsTol: 0.1, CapTol: 0.2, LoadMin: Load{Amps: 0.1}, LoadMax: Load{Amps: 1.2}}
	for b.Loop() {
		if _, err := r.Corners(spec); err != nil {
			b.Fatal(err)
		}
	}
}

func TestWaveform(t *testing.T) {
	r := Rectifier{Topology: Bridge, VrmsV: 12, Hz: 50, CapF: 2200e-6, SourceOhm: 0.5, Load: Load{Ohms: 15}}
	res, _ := r.Solve()
	ts, vs, err := r.Waveform(2)
	if err != nil {
		t.Fatal(err)
	}
	if len(ts) != 4001 || len(vs) != 4001 || math.Abs(ts[len(ts)-1]-0.04) > 1e-9 {
		t.Fatalf("%d points ending at %g s", len(ts), ts[len(ts)-1])
	}
	lo, hi := vs[0], vs[0]
	for _, v := range vs {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	if !within(lo, res.TroughV, 1e-3) || !within(hi, res.PeakV, 1e-3) {
		t.Errorf("waveform %g..%g V, steady state %g..%g V", lo, hi, res.TroughV, res.PeakV)
	}
}

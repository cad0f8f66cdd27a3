package circuit

import (
	"math"
	"testing"
)

// TestESeries checks the tables against IEC 60063 as quoted in
// shared/reference/methods.md §5: E24 and E12 written out (eight E24 members
// are not rounded geometric steps), E96 equal to round(10^(i/96), 2) for
// every member, E48 every second E96 value, E12 every second E24 value.
func TestESeries(t *testing.T) {
	if len(E12) != 12 || len(E24) != 24 || len(E48) != 48 || len(E96) != 96 {
		t.Fatalf("lengths %d %d %d %d", len(E12), len(E24), len(E48), len(E96))
	}
	for i, v := range E96 {
		if want := math.Round(math.Pow(10, float64(i)/96)*100) / 100; v != want {
			t.Errorf("E96[%d] = %g, want %g", i, v, want)
		}
	}
	for i, v := range E48 {
		if v != E96[2*i] {
			t.Errorf("E48[%d] = %g, want E96[%d] = %g", i, v, 2*i, E96[2*i])
		}
	}
	for i, v := range E12 {
		if v != E24[2*i] {
			t.Errorf("E12[%d] = %g, want E24[%d] = %g", i, v, 2*i, E24[2*i])
		}
	}
	// The E24 members that differ from round(10^(i/24), 1) (methods.md §5).
	off := map[float64]bool{2.7: true, 3.0: true, 3.3: true, 3.6: true, 3.9: true, 4.3: true, 4.7: true, 8.2: true}
	for i, v := range E24 {
		geo := math.Round(math.Pow(10, float64(i)/24)*10) / 10
		if (geo != v) != off[v] {
			t.Errorf("E24[%d] = %g, geometric %g: the off-formula set is wrong", i, v, geo)
		}
	}
	vals := Values(E24, 100, 1000)
	if vals[0] != 100 || vals[len(vals)-1] != 1000 || len(vals) != 25 {
		t.Errorf("Values(E24, 100, 1000) = %v", vals)
	}
}

// TestDivider checks the adjustable and lifted-ground formulas against
// worked examples.
func TestDivider(t *testing.T) {
	tests := []struct {
		name                string
		vref, i, r1, r2, vb float64
		want, tol           float64
		source              string
	}{
		{"317 12 V", 1.25, 0, 240, 2064, 0, 12.0, 1e-9, "electro-tech-online thread: R1 = 240 Ω, 12 V → R2 = 2064 Ω"},
		{"317 12 V with Iadj", 1.25, 50e-6, 240, 2064, 0, 12.1032, 1e-4, "same, with IADJ = 50 µA → 12.10 V (arith.)"},
		{"317 8.5 V with 1k3", 1.25, 0, 220, 1300, 0, 8.636, 1e-3, "circuit-innovations.co.uk LM317: R1 = 220 Ω, R2 = 1K3 → 8.636 V"},
		{"7805 lifted, IQ 2.5 mA", 5, 2.5e-3, 470, 150, 0, 6.97, 0.01, "Fairchild LM7805 formula with the forum's IQ 2.5 mA: R1 470, R2 150 → 6.97 V"},
		{"7805 lifted, IQ 5 mA", 5, 5e-3, 470, 150, 0, 7.35, 0.01, "same with the datasheet IQ 5 mA typ → 7.35 V (methods.md §4.2)"},
		{"317 to a negative rail", 1.25, 50e-6, 240, 2064, -5, 7.1032, 1e-4, "bottom resistor to −5 V: the output drops by 5 V (identity)"},
	}
	for _, tt := range tests {
		got, err := DividerVout(tt.vref, tt.i, tt.r1, tt.r2, tt.vb)
		if err != nil || math.Abs(got-tt.want) > tt.tol {
			t.Errorf("%s: %g V (%v), want %g (%s)", tt.name, got, err, tt.want, tt.source)
		}
	}
	if _, err := DividerVout(1.25, 0, 0, 100, 0); err == nil {
		t.Error("R1 = 0 should be an error")
	}
}

func TestChooseDivider(t *testing.T) {
	// A 317 (±4 %, National LM317) set to 12 V with a 10 mA minimum load:
	// the divider current stays within 10 to 25 mA, so 50 Ω ≤ R1 ≤ 125 Ω.
	// By hand: R1 120 Ω → 1.25/120 = 10.42 mA; R2 ideal (12 − 1.25)/(10.42 mA
	// + 50 µA) = 1027 Ω → E24 1 kΩ; Vout = 1.25·(1 + 1000/120) + 50 µA·1 kΩ
	// = 11.717 V (−2.4 %, inside ±4 %, no trimmer); R2 carries 10.42 +
	// 0.1 mA at most: 0.111 W → a 0.25 W part; R1 1.25²/120 = 13 mW.
	c, err := ChooseDivider(DividerSpec{TargetV: 12, VrefV: 1.25, ITypA: 50e-6, IMaxA: 100e-6, MinLoadA: 10e-3, Tolerance: 0.04})
	if err != nil {
		t.Fatal(err)
	}
	if c.R1Ohm != 120 || c.R2Ohm != 1000 || c.DividerA < 10e-3 || c.DividerA > 25e-3 || c.Trimmer ||
		math.Abs(c.VoutV-11.7167) > 1e-3 || math.Abs(c.R2W-0.1107) > 1e-3 || c.R2RatingW != 0.25 || math.Abs(c.R1W-0.01302) > 1e-4 {
		t.Errorf("ChooseDivider = %+v; want 120 Ω over 1 kΩ, 11.72 V, R2 0.111 W (0.25 W part)", c)
	}
	// Check by hand: the result reproduces itself through DividerVout.
	v, _ := DividerVout(1.25, 50e-6, c.R1Ohm, c.R2Ohm, 0)
	if math.Abs(v-c.VoutV) > 1e-12 {
		t.Errorf("VoutV %g does not match the formula %g", c.VoutV, v)
	}
	// The same in E96 (IEC 60063): R1 124 Ω, ideal R2 10.75/(10.08 mA +
	// 50 µA) = 1061 Ω → 1.07 kΩ gives 1.25·(1 + 1070/124) + 53.5 mV = 12.09 V.
	e96, _ := Series("E96")
	c96, err := ChooseDivider(DividerSpec{TargetV: 12, VrefV: 1.25, ITypA: 50e-6, IMaxA: 100e-6, MinLoadA: 10e-3, Tolerance: 0.04, Series: e96})
	if err != nil || c96.R1Ohm != 124 || c96.R2Ohm != 1070 {
		t.Errorf("E96 divider %+v, %v; want 124 Ω over 1.07 kΩ", c96, err)
	}
	// No minimum load given: the default 5 mA, so R1 from 100 to 250 Ω.
	cd, err := ChooseDivider(DividerSpec{TargetV: 12, VrefV: 1.25, ITypA: 50e-6, IMaxA: 100e-6})
	if err != nil || cd.DividerA < DefaultMinLoadA || cd.DividerA > DividerSpan*DefaultMinLoadA {
		t.Errorf("default minimum load: %+v, %v", cd, err)
	}
	// A tight tolerance the E6 series cannot meet asks for a trimmer.
	e6, _ := Series("E6")
	ct, err := ChooseDivider(DividerSpec{TargetV: 12, VrefV: 1.25, MinLoadA: 10e-3, Tolerance: 0.001, Series: e6})
	if err != nil || !ct.Trimmer {
		t.Errorf("E6 at 0.1 %%: %+v, %v; want a trimmer", ct, err)
	}
	// TI TL783 SLVS036 design considerations: R1 = 82 Ω gives the 15 mA
	// minimum load (1.25 V / 82 Ω = 15.2 mA).
	// With the minimum load at 15 mA no R1 above 83 Ω qualifies, and the
	// E24 pair 82 Ω / 820 Ω gives 13.82 V.
	c783, err := ChooseDivider(DividerSpec{TargetV: 13.82, VrefV: 1.25, ITypA: 83e-6, IMaxA: 110e-6, MinLoadA: 15e-3})
	if err != nil || c783.R1Ohm != 82 || c783.R2Ohm != 820 || c783.DividerA < 15e-3 {
		t.Errorf("TL783 divider %+v, %v; want R1 = 82 Ω drawing 15.2 mA", c783, err)
	}
	if _, err := ChooseDivider(DividerSpec{TargetV: 1.0, VrefV: 1.25}); err == nil {
		t.Error("a target below vref should be an error")
	}
}

// TestBypass checks the pass-resistor example of methods.md §4.4: 5 V out,
// R = 10 Ω, 12 V in → 0.70 A and 4.9 W; at 14 V in 0.90 A, so the load must
// never fall below about 0.9 A.
func TestBypass(t *testing.T) {
	r, err := Bypass{ROhm: 10, VinMinV: 12, VinMaxV: 14, VoutV: 5, LoadMinA: 0.5, LoadMaxA: 2}.Solve()
	if err != nil {
		t.Fatal(err)
	}
	if !within(r.ResistorMinA, 0.70, 1e-9) || !within(r.ResistorMaxA, 0.90, 1e-9) || !within(r.MinLoadA, 0.90, 1e-9) {
		t.Errorf("shares %+v", r)
	}
	if !within(r.ResistorMinA*r.ResistorMinA*10, 4.9, 1e-9) {
		t.Errorf("resistor power at 12 V in = %g W, want 4.9", r.ResistorMinA*r.ResistorMinA*10)
	}
	if r.RegulatesLight || !within(r.RegulatorMaxA, 1.3, 1e-9) {
		t.Errorf("0.5 A light load must lose regulation; regulator max %g", r.RegulatorMaxA)
	}
	if _, err := (Bypass{ROhm: -1}).Solve(); err == nil {
		t.Error("negative resistor should be an error")
	}
}

// TestThermal checks manufacturer examples.
func TestThermal(t *testing.T) {
	// TI TPS758xx SLVS330D: PD = (3.3 − 2.5) V × 3 A = 2.4 W; RθJA(max) = (125 − 55)/2.4 = 29 °C/W.
	p := RegulatorDissipation(3.3, 2.5, 3, 0)
	if !within(p, 2.4, 1e-9) {
		t.Errorf("dissipation %g", p)
	}
	if th, _ := RequiredThetaSA(p, 55, 125, 0, 0); math.Abs(th-29.17) > 0.01 {
		t.Errorf("θJA(max) = %g, want 29.17", th)
	}
	// Thermalloy example: TO-220, 5 W, θJC 3, compound θCS 1, Tj 150, Ta 50 → θSA < 16 °C/W;
	// the 6030 heat sink (66 °C rise at 5 W, 13.2 °C/W) is good enough.
	if th, _ := RequiredThetaSA(5, 50, 150, 3, 1); !within(th, 16, 1e-9) {
		t.Errorf("required θSA %g, want 16", th)
	}
	if tj := JunctionTemp(5, 50, 3, 1, 13.2); !within(tj, 136, 1e-9) || tj > 150 {
		t.Errorf("Tj with the 6030 = %g", tj)
	}
	// Free air: LM317K at 25 °C, 125 °C junction, θJA 39 → 2.56 W (allaboutcircuits, arith.).
	if tj := FreeAirTemp(100.0/39, 25, 39); !within(tj, 125, 1e-9) {
		t.Errorf("free-air Tj %g", tj)
	}
	if cs, _ := CaseToSink("none", SmallTab); cs != 1.0 {
		t.Errorf("TO-220 compound θCS %g, want 1.0 (TI SLVS330D)", cs)
	}
	if _, err := CaseToSink("glue", SmallTab); err == nil {
		t.Error("unknown insulator should be an error")
	}
}

func TestPlanTestLoad(t *testing.T) {
	// 5 V, at least 1 A: 10 Ω ∥ 10 Ω = 5 Ω draws exactly 1 A, 2.5 W each,
	// so each must be rated 5 W at 50 % derating (hand calculation).
	p, err := PlanTestLoad(5, 1, nil, nil, 0.5)
	if err != nil {
		t.Fatal(err)
	}
	if p.CurrentA < 1-1e-9 || p.Arrangement != "2 parallel" || p.Parts[0].Ohms != 10 || p.Parts[0].Watts != 5 {
		t.Errorf("plan %+v", p)
	}
	for _, tc := range []struct{ v, i float64 }{{12, 0.6}, {24, 2}, {5, 0.05}, {48, 1}, {3.3, 0.8}} {
		p, err := PlanTestLoad(tc.v, tc.i, nil, nil, 0.5)
		if err != nil {
			t.Errorf("%g V %g A: %v", tc.v, tc.i, err)
			continue
		}
		if p.CurrentA < tc.i*(1-1e-9) || p.CurrentA > tc.i*1.25 {
			t.Errorf("%g V %g A: draws %g A", tc.v, tc.i, p.CurrentA)
		}
		for _, part := range p.Parts {
			if part.DissipationW > 0.5*part.Watts+1e-12 {
				t.Errorf("%g V %g A: %g Ω runs at %g W of %g W", tc.v, tc.i, part.Ohms, part.DissipationW, part.Watts)
			}
		}
	}
	if _, err := PlanTestLoad(400, 20, nil, nil, 0.5); err == nil {
		t.Error("8 kW from stock resistors should be impossible")
	}
}

// FuzzModels: the divider chooser, the test-load planner and the bypass and
// thermal models return an error or finite numbers for any input, and never
// panic.
func FuzzModels(f *testing.F) {
	f.Add(12.0, 1.25, 50e-6, 10e-3, 5.0, 1.0, 10.0, 0.5)
	f.Add(-3.0, 0.0, -1.0, 1e9, 0.0, 0.0, -1.0, 2.0)
	f.Add(1e300, 1e-300, 1e3, 0.0, 1e6, 1e-6, 1e-9, 0.999)
	f.Fuzz(func(t *testing.T, target, vref, i, minLoad, volts, amps, r, derate float64) {
		if c, err := ChooseDivider(DividerSpec{TargetV: target, VrefV: vref, ITypA: i, IMaxA: i, MinLoadA: minLoad}); err == nil {
			if math.IsNaN(c.VoutV) || math.IsInf(c.VoutV, 0) {
				t.Fatalf("divider %+v", c)
			}
		}
		if volts < 1e4 && amps < 1e3 { // keep the planner's search bounded in time
			if p, err := PlanTestLoad(volts, amps, nil, nil, derate); err == nil && (p.CurrentA < amps*(1-1e-9) || math.IsNaN(p.PowerW)) {
				t.Fatalf("plan %+v", p)
			}
		}
		if b, err := (Bypass{ROhm: r, VinMinV: volts, VinMaxV: volts * 1.2, VoutV: target, LoadMinA: amps, LoadMaxA: amps * 2}).Solve(); err == nil {
			if math.IsNaN(b.MinLoadA) {
				t.Fatalf("bypass %+v", b)
			}
		}
		_, _ = RequiredThetaSA(volts, 25, 125, r, 1)
	})
}

// TestMatchSecondary: a transformer given as 12.6 V RMS loaded at 1 A with
// 10 % regulation. The simple model (EMF 13.86 V, R = V·reg/(F·I)) reads
// 2.8 % (bridge) and 4.7 % (half-wave) high at its own load, because the
// peaky rectifier current drops less RMS voltage than I_rms·R (the centre
// tap's form factor happens to fit this case); MatchSecondary sets R so the
// loaded secondary is 12.6 V again (the solver's secondary RMS agrees with
// ngspice within 0.5 %: TestNgspiceCrossCheck).
func TestMatchSecondary(t *testing.T) {
	for _, top := range []Topology{Bridge, CenterTap, HalfWave} {
		emf, rs, err := FromRegulation(top, 12.6, 0.10, 1)
		if err != nil {
			t.Fatal(err)
		}
		r := Rectifier{Topology: top, VrmsV: emf, Hz: 50, CapF: 4700e-6, ESROhm: 0.05, SourceOhm: rs, Load: Load{Amps: 1}}
		before, err := r.Solve()
		if err != nil {
			t.Fatal(err)
		}
		m, err := r.MatchSecondary(12.6)
		if err != nil {
			t.Fatal(err)
		}
		after, err := m.Solve()
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("%s: simple model %.3f V loaded (R %.3f Ω), matched %.4f V (R %.3f Ω); trough %.2f → %.2f V", top, before.SecondaryRMSV, rs, after.SecondaryRMSV, m.SourceOhm, before.TroughV, after.TroughV)
		if math.Abs(after.SecondaryRMSV-12.6) > 12.6e-4 {
			t.Errorf("%s: matched secondary %.4f V, want 12.6 V", top, after.SecondaryRMSV)
		}
		if top != CenterTap && (before.SecondaryRMSV <= 12.6*1.01 || after.TroughV >= before.TroughV) {
			t.Errorf("%s: the simple model's secondary %.3f V should read high and its trough %.2f V above the matched %.2f V", top, before.SecondaryRMSV, before.TroughV, after.TroughV)
		}
	}
	if _, err := (Rectifier{Topology: Bridge, VrmsV: 10, SourceOhm: 1}).MatchSecondary(11); err == nil {
		t.Error("a loaded secondary above the EMF should be an error")
	}
}

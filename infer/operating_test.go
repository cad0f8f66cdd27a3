package infer_test

import (
	"math"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/infer"
)

// TestOperatingPeakAgrees: identification (the peak corners only) and
// replacement (the whole sweep) see the same highest input, since both use
// the one input model.
func TestOperatingPeakAgrees(t *testing.T) {
	c := builtinCatalog(t)
	for _, name := range []string{"../testdata/demo/bench-supply-negative.toml", "../testdata/swap/adj-vin-max.toml", "../testdata/swap/lifted-ground-ldo.toml"} {
		ev := load(t, c, name)
		id, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepPeak})
		if err != nil {
			t.Fatal(err)
		}
		sw, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepAll, AssumedLoadA: 1})
		if err != nil {
			t.Fatal(err)
		}
		if id.Source != infer.InputRectifier || math.Abs(id.Peak.V-sw.Peak.V) > 1e-9 {
			t.Errorf("%s: identification peak %v, replacement peak %v", name, id.Peak, sw.Peak)
		}
		if sw.Trough.V >= sw.Nominal.TroughV || sw.MeanLow.V >= sw.MeanHigh.V {
			t.Errorf("%s: worst trough %v not below nominal %v, or mean range %v..%v reversed", name, sw.Trough, sw.Nominal, sw.MeanLow, sw.MeanHigh)
		}
	}
}

// TestOperatingFromReading checks the bounds from a bare 11.3 V reading at
// ±10 % mains against a hand calculation with the stated assumptions (20 %
// ripple, 1.5 V drop at full load, 1.0 V at light load, 10 % transformer
// rise, −20 % capacitor; common practice, no source):
//
//	ripple 2.26 V; crest 11.3 + 1.13 + 1.5 = 13.93 V
//	peak   13.93 × 1.1 × 1.1 − 1.0          = 15.8553 V
//	trough 13.93 × 0.9 − 1.5 − 2.26 / 0.8   = 8.212 V
func TestOperatingFromReading(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/demo/controller-to3-case.toml")
	ev.Input = nil
	op, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepAll, AssumedLoadA: 1.5})
	if err != nil {
		t.Fatal(err)
	}
	if op.Source != infer.InputUnknown || !op.LoadAssumed || op.LoadMaxA != 1.5 {
		t.Fatalf("before a reading: %+v", op)
	}
	r := op.FromReading(-11.3)
	if r.Source != infer.InputReading {
		t.Fatalf("source %s", r.Source)
	}
	if math.Abs(r.Peak.V-15.8553) > 1e-6 || math.Abs(r.Trough.V-8.212) > 1e-6 {
		t.Errorf("peak %.4f trough %.4f, want 15.8553 and 8.212", r.Peak.V, r.Trough.V)
	}
	if len(r.Assumptions) <= len(op.Assumptions) {
		t.Error("the bound's assumptions are not stated")
	}
}

// TestOperatingNoSteadyState: a rectifier that cannot carry its load is an
// error naming the file and the table and saying what is wrong.
func TestOperatingNoSteadyState(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/swap/adj-vin-max.toml")
	ev.Output.Amps.V = 500 // far beyond what 220 µF and 45 V RMS can feed
	_, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepAll})
	if err == nil {
		t.Fatal("no error")
	}
	if !strings.Contains(err.Error(), "adj-vin-max.toml: [input]: ") || !strings.Contains(err.Error(), "cannot carry this load") {
		t.Errorf("the error does not name the file, table and corner: %v", err)
	}
}

// TestOperatingReconcile: a reading of the IN lead that the described
// rectifier cannot produce sets the model aside for the bound from the
// reading and says why; a reading inside the model's envelope changes
// nothing. testdata/swap/why-input-conflict.toml gives a 9 V secondary
// (the model's highest input 12.6 V) and reads 21.0 V; the bound from 21.0 V
// is 28.77 V at its highest and 15.39 V at its lowest (the hand calculation
// in that file).
func TestOperatingReconcile(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/swap/why-input-conflict.toml")
	op, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepAll, AssumedLoadA: 1})
	if err != nil {
		t.Fatal(err)
	}
	if op.Source != infer.InputRectifier {
		t.Fatalf("source %s", op.Source)
	}
	if same, why := op.Reconcile(op.Nominal.MeanV); why != "" || same.Source != infer.InputRectifier {
		t.Errorf("a reading at the model's own mean is a conflict: %q", why)
	}
	r, why := op.Reconcile(21.0)
	if r.Source != infer.InputReading || !strings.Contains(why, "contradict") || r.Corners != nil {
		t.Fatalf("21.0 V against a %.1f V model: source %s, %q", op.Peak.V, r.Source, why)
	}
	if math.Abs(r.Peak.V-28.77) > 0.01 || math.Abs(r.Trough.V-15.39) > 0.01 {
		t.Errorf("bound from 21.0 V: peak %.3f trough %.3f, want 28.77 and 15.39", r.Peak.V, r.Trough.V)
	}
	for _, a := range r.Assumptions {
		if strings.Contains(a, "1N4007") {
			t.Errorf("the set-aside model's assumption kept: %q", a)
		}
	}
	if low, why := op.Reconcile(0.5 * op.MeanLow.V); low.Source != infer.InputReading || !strings.Contains(why, "below") {
		t.Errorf("a reading at half the lowest mean: %s, %q", low.Source, why)
	}
}

// TestOnlyBoundCrosses: a limit crossed by the bound from a bare reading
// but not by the reading itself is an assumption; crossed by the reading,
// it is hard evidence. The bound from −11.3 V (TestOperatingFromReading's
// hand figures): trough 8.212 V, peak 15.8553 V; no bound for a DC supply.
func TestOnlyBoundCrosses(t *testing.T) {
	c := builtinCatalog(t)
	ev := load(t, c, "../testdata/demo/controller-to3-case.toml")
	ev.Input = nil
	op, err := infer.OperatingPoint(ev, infer.OperatingOptions{Sweep: infer.SweepAll, AssumedLoadA: 1.5})
	if err != nil {
		t.Fatal(err)
	}
	r := op.FromReading(-11.3)
	for _, tc := range []struct {
		side  infer.BoundSide
		limit float64
		want  bool
	}{
		{infer.BoundLow, 9, true},      // 8.212 < 9 ≤ 11.3: the bound alone
		{infer.BoundLow, 12, false},    // the reading itself is below 12 V
		{infer.BoundLow, 8, false},     // the bound is inside too
		{infer.BoundHigh, 15, true},    // 15.86 > 15 ≥ 11.3: the bound alone
		{infer.BoundHigh, 11, false},   // the reading itself is over 11 V
		{infer.BoundHigh, 16.5, false}, // inside
	} {
		if got := r.OnlyBoundCrosses(tc.side, tc.limit); got != tc.want {
			t.Errorf("side %d limit %g: %v, want %v", tc.side, tc.limit, got, tc.want)
		}
	}
	if v, ok := r.Measured(infer.BoundLow); !ok || v != 11.3 {
		t.Errorf("measured %g %v, want 11.3", v, ok)
	}
	if !strings.Contains(r.BoundAdvice(infer.BoundHigh), "11.3 V reading") {
		t.Errorf("advice %q", r.BoundAdvice(infer.BoundHigh))
	}
	if op.OnlyBoundCrosses(infer.BoundLow, 9) {
		t.Error("no reading, no bound: nothing to call an assumption")
	}
}

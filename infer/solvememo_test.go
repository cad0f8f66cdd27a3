package infer

import (
	"sync"
	"testing"

	"github.com/google/go-cmp/cmp"

	"github.com/whichreg/whichreg/infer/circuit"
)

// TestSolveMemo: a remembered solve is the solve (identical figures), each
// circuit is solved once however often it is asked for, from several
// goroutines too, and a nil memo solves afresh.
func TestSolveMemo(t *testing.T) {
	r := circuit.Rectifier{Topology: circuit.Bridge, VrmsV: 13.9, Hz: 50, CapF: 2200e-6, ESROhm: 0.05, SourceOhm: 0.6, Load: circuit.Load{Amps: 0.5}}
	want, err := r.Solve()
	if err != nil {
		t.Fatal(err)
	}
	wantMatch, err := r.MatchSecondary(12.6)
	if err != nil {
		t.Fatal(err)
	}
	m := &solveMemo{}
	var wg sync.WaitGroup
	for range 4 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for _, mm := range []*solveMemo{m, nil} {
				got, err := mm.solve(r)
				if err != nil {
					t.Error(err)
				}
				if d := cmp.Diff(want, got); d != "" {
					t.Errorf("solve (-direct +memo):\n%s", d)
				}
				gotMatch, err := mm.match(r, 12.6)
				if err != nil {
					t.Error(err)
				}
				if gotMatch != wantMatch {
					t.Errorf("match = %+v, want %+v", gotMatch, wantMatch)
				}
			}
		}()
	}
	wg.Wait()
	if len(m.solved) != 1 || len(m.matched) != 1 {
		t.Errorf("memo holds %d solves and %d matches, want 1 and 1", len(m.solved), len(m.matched))
	}
	// Another circuit is another entry, never the first one's result.
	r2 := r.At(circuit.Corner{Mains: 0.9, CapFactor: 0.8, Load: r.Load})
	got2, _ := m.solve(r2)
	if want2, _ := r2.Solve(); got2 != want2 || got2 == want {
		t.Errorf("second circuit: memo %+v, direct %+v", got2, want2)
	}
}

package infer

import (
	"sync"

	"github.com/whichreg/whichreg/infer/circuit"
)

// solveMemo remembers the rectifier solves made for one evidence file, so
// that in one command identification's operating point and replacement's
// solve each rectifier and corner once: the match of the loaded secondary
// and the high-mains, light-load corners were solved by both. A solve is
// deterministic, so a remembered result is the result; the key is the whole
// circuit, so evidence changed afterwards cannot meet a stale one. Errors
// are not remembered. A nil memo solves afresh every time. It is safe for
// concurrent use.
type solveMemo struct {
	mu      sync.Mutex
	solved  map[circuit.Rectifier]circuit.Result
	matched map[matchKey]circuit.Rectifier
}

// matchKey is a rectifier before its winding resistance is fitted, and the
// loaded secondary it is fitted to.
type matchKey struct {
	r    circuit.Rectifier
	vrms float64
}

// solve is [circuit.Rectifier.Solve], remembered.
func (m *solveMemo) solve(r circuit.Rectifier) (circuit.Result, error) {
	if m == nil {
		return r.Solve()
	}
	m.mu.Lock()
	res, ok := m.solved[r]
	m.mu.Unlock()
	if ok {
		return res, nil
	}
	res, err := r.Solve()
	if err != nil {
		return res, err
	}
	m.mu.Lock()
	if m.solved == nil {
		m.solved = map[circuit.Rectifier]circuit.Result{}
	}
	m.solved[r] = res
	m.mu.Unlock()
	return res, nil
}

// match is [circuit.Rectifier.MatchSecondary], remembered.
func (m *solveMemo) match(r circuit.Rectifier, vrmsLoadedV float64) (circuit.Rectifier, error) {
	if m == nil {
		return r.MatchSecondary(vrmsLoadedV)
	}
	k := matchKey{r, vrmsLoadedV}
	m.mu.Lock()
	got, ok := m.matched[k]
	m.mu.Unlock()
	if ok {
		return got, nil
	}
	got, err := r.MatchSecondary(vrmsLoadedV)
	if err != nil {
		return got, err
	}
	m.mu.Lock()
	if m.matched == nil {
		m.matched = map[matchKey]circuit.Rectifier{}
	}
	m.matched[k] = got
	m.mu.Unlock()
	return got, nil
}

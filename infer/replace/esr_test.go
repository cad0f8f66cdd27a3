package replace

import (
	"math"
	"testing"

	"github.com/whichreg/whichreg/infer"
)

// TestESREstimate pins the aluminium-electrolytic ESR estimate between
// published figures (±40 %, esrSpread):
//   - the ESR chart quoted in shared/reference/methods.md §6 (general
//     purpose, probably 100 kHz): 10 µF 20 Ω at 10 V, 22 µF 9.0 Ω, 47 µF
//     4.2 Ω, 100 µF 1.6 Ω at 16 V, 220 µF 0.75 Ω at 16 V;
//   - the makers' dissipation factor: tan δ ≤ 0.16 at 120 Hz for 16 V
//     general-purpose parts (Lelon RGA series specification table), so ESR ≤
//     0.16 / (2π·120 Hz·C), which a 100 kHz figure stays below.
func TestESREstimate(t *testing.T) {
	for _, tc := range []struct {
		uf, chartOhm float64
	}{{10, 20}, {22, 9.0}, {47, 4.2}, {100, 1.6}, {220, 0.75}} {
		got := esrEstimate(infer.CapElectrolytic, tc.uf)
		if math.Abs(got/tc.chartOhm-1) > esrSpread {
			t.Errorf("%g µF: estimate %.3g Ω, chart %.3g Ω: more than ±%.0f %% apart", tc.uf, got, tc.chartOhm, esrSpread*100)
		}
		if tanD := 0.16 / (2 * math.Pi * 120 * tc.uf * 1e-6); got > tanD {
			t.Errorf("%g µF: estimate %.3g Ω above the tan δ bound %.3g Ω", tc.uf, got, tanD)
		}
	}
	// Ceramic: MLCC 0.01–0.1 Ω (methods.md §6).
	if e := esrEstimate(infer.CapCeramic, 10); e < 0.01 || e > 0.1 {
		t.Errorf("ceramic %.3g Ω", e)
	}
}

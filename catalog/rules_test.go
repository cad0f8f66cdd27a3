package catalog_test

import (
	"math"
	"testing"
)

// TestRules checks the shared family rules against datasheet figures.
func TestRules(t *testing.T) {
	c := builtinCatalog(t)
	near := func(what string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > 1e-9 {
			t.Errorf("%s = %g, want %g", what, got, want)
		}
	}
	// National LM1117 DS100919: dropout 1.40 V max at 800 mA; never softened
	// at lighter loads.
	near("1117 HeadroomNeeded", c.Family("1117").HeadroomNeeded(), 1.4)
	// National LM2940: ground current 15 mA max at light load, 60 mA max at
	// 1 A (shared/reference adjustable.md).
	f2940 := c.Family("2940")
	near("2940 ground current at 1 A", f2940.GroundCurrentA(1), 0.060)
	near("2940 ground current at no load", f2940.GroundCurrentA(0), 0.015)
	// LM7805 (fixed.md): 8 mA max, NPN drive flows into the load.
	near("78xx ground current at 1 A", c.Family("78xx").GroundCurrentA(1), 0.008)
	// National LM317: 40 V input-output rating. At 30 V out it runs with
	// up to 70 V in, but at start-up the whole input is across it.
	il := c.Family("317").InputLimit(30)
	near("317 start limit", il.StartV, 40)
	near("317 running limit", il.RunV, 70)
	// A fixed part's limit is its absolute maximum either way (LM7805 35 V).
	il = c.Family("78xx").InputLimit(5)
	near("78xx start limit", il.StartV, 35)
	near("78xx running limit", il.RunV, 35)
	// Negative rails keep their sign.
	near("79xx Signed", c.Family("79xx").Signed(12), -12)
	near("78xx Signed", c.Family("78xx").Signed(-5), 5)
	// National LM337: 1 µF solid tantalum or 10 µF aluminium.
	near("337 tantalum", c.Family("337").MinCoutUF("tantalum"), 1)
	near("337 aluminium", c.Family("337").MinCoutUF("electrolytic"), 10)
	// An LDO with an ESR window keeps its figure whatever the type.
	near("2940 aluminium", f2940.MinCoutUF("electrolytic"), 22)
}

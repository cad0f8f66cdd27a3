package infer

import (
	"math"
	"testing"

	"github.com/whichreg/whichreg/catalog"
)

// TestWiringRows: every lead function's wiring row is a distribution, and
// its likeliest word is where such a lead goes on a board (common
// practice, no source): SENSE to the load, FB to the output or a divider,
// PG to its pull-up network, BYP to a capacitor (traced as a network), SW
// to the coil, EN tied high to the input, INH tied low to ground.
func TestWiringRows(t *testing.T) {
	f := &catalog.Family{ID: "test"}
	for _, tc := range []struct {
		fn   string
		want Wiring
	}{
		{catalog.PinIn, WiredUnregulated}, {catalog.PinOut, WiredLoad}, {catalog.PinGnd, WiredGround},
		{catalog.PinAdj, WiredNetwork}, {catalog.PinNC, WiredOpen}, {catalog.PinSense, WiredLoad},
		{catalog.PinFB, WiredLoad}, {catalog.PinPG, WiredNetwork}, {catalog.PinBYP, WiredNetwork},
		{catalog.PinSW, WiredInductor}, {catalog.PinEn, WiredUnregulated}, {catalog.PinInh, WiredGround},
	} {
		row := wiringOf(f, tc.fn)
		sum, best := 0.0, 0
		for i, p := range row {
			sum += p
			if p > row[best] {
				best = i
			}
		}
		if math.Abs(sum-1) > 1e-9 {
			t.Errorf("%s: row sums to %g", tc.fn, sum)
		}
		if got := wirings.words[best]; got != tc.want {
			t.Errorf("%s: likeliest wiring %s, want %s", tc.fn, got, tc.want)
		}
	}
}

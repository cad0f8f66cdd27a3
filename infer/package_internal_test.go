package infer

import (
	"testing"

	"github.com/whichreg/whichreg/catalog/builtin"
)

// TestPackageConfusion: a named package that is not the variant's outline
// costs by how easily one is written for the other (judgement: common
// practice, no source): a name slip a few per cent, another outline of the
// same kind about one per cent, a difference seen at a glance (mounting,
// can, size) or in the lead count well under half a per cent.
func TestPackageConfusion(t *testing.T) {
	c := builtin.Catalog()
	for _, tc := range []struct {
		named, outline string
		want           float64
	}{
		{"SOT-23", "SOT-223", pNameSlip},
		{"SOT-223", "SOT-23", pNameSlip},
		{"DPAK", "D2PAK", pNameSlip},
		{"TO-220FP", "TO-220", pNameSlip},
		{"TO-220", "TO-220FP", pNameSlip},
		{"TO-220", "TO-126", pSameKind},
		{"DPAK", "SOT-223", pSameKind},
		{"SOT-23", "D2PAK", pGlance},    // a tiny body against a power package
		{"SOT-23", "DPAK", pGlance},     // likewise
		{"TO-92", "TO-220", pGlance},    // likewise, both through-hole
		{"TO-220", "D2PAK", pGlance},    // through-hole against surface-mount
		{"TO-39", "TO-92", pGlance},     // a can against plastic
		{"TO-220", "TO-3", pOtherLeads}, // three leads against two
	} {
		o := c.Outline(tc.outline)
		if o == nil {
			t.Fatalf("no outline %s", tc.outline)
		}
		if got, why := packageConfusion(tc.named, c.Outline(tc.named), o); got != tc.want {
			t.Errorf("%s named for %s: %g (%s), want %g", tc.named, tc.outline, got, why, tc.want)
		}
	}
	if pGlance > 0.005 || pNameSlip < 0.02 || pNameSlip > 0.05 {
		t.Errorf("the confusions left their stated ranges")
	}
}

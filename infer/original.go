package infer

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/catalog"
)

// ErrNotInCatalog is returned (wrapped) by [ChooseOriginal] when the evidence
// fits nothing in the catalog better than its leader.
var ErrNotInCatalog = errors.New("the evidence fits nothing in the catalog")

// ErrNonRegulator is returned (wrapped) when the original is a part that
// sits where a regulator might (a transistor, a shunt reference, a
// switching IC): no regulator replaces it.
var ErrNonRegulator = errors.New("the original is not a regulator")

// ErrUnknownVariant is what [ParseVariant]'s errors match (errors.Is) for
// a family, outline or voltage the catalog does not have.
var ErrUnknownVariant = errors.New("no such variant in the catalog")

// variantError is a ParseVariant error: its own words, matching
// ErrUnknownVariant.
type variantError struct{ msg string }

func (e *variantError) Error() string        { return e.msg }
func (e *variantError) Is(target error) bool { return target == ErrUnknownVariant }

func unknownVariant(format string, args ...any) error {
	return &variantError{fmt.Sprintf(format, args...)}
}

// Original is the part being replaced: a hypothesis and how it was chosen.
type Original struct {
	Hypothesis
	// Probability is identification's probability of the hypothesis when it
	// is the leader; 1 when the technician named it.
	Probability float64
	// Named says the technician named it (rather than taking the leader).
	Named bool
}

// ParseVariant resolves "ID[:OUTLINE[:VOUT]]" against the catalog: a family
// id, optionally one of its outlines (else its first package) and an output
// voltage (a magnitude; a sign and a trailing "V" are accepted). A fixed
// family with a single output voltage gets it without VOUT. Errors wrap
// [ErrUnknownVariant] and say what the catalog has instead.
func ParseVariant(c *catalog.Catalog, spec string) (Hypothesis, error) {
	parts := strings.SplitN(strings.TrimSpace(spec), ":", 3)
	f := c.Family(parts[0])
	if f == nil {
		return Hypothesis{}, unknownVariant("no family %q in the catalog", parts[0])
	}
	p := &f.Packages[0]
	if len(parts) > 1 && parts[1] != "" {
		p = f.Package(c, parts[1])
		if p == nil {
			var outs []string
			for _, q := range f.Packages {
				outs = append(outs, q.Outline)
			}
			return Hypothesis{}, unknownVariant("%s does not come in %q (it comes in %s)", f.ID, parts[1], strings.Join(outs, ", "))
		}
	}
	h := Hypothesis{Family: f, Package: p, Outline: c.Outline(p.Outline)}
	switch {
	case len(parts) > 2:
		v, err := strconv.ParseFloat(strings.TrimSuffix(strings.TrimSpace(parts[2]), "V"), 64)
		if err != nil || v == 0 || math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > 1000 {
			return h, unknownVariant("%q is not an output voltage", parts[2])
		}
		if v < 0 {
			v = -v
		}
		h.VoutV = v
	case !f.Adjustable() && len(f.OutputsV) == 1:
		h.VoutV = f.OutputsV[0]
	}
	return h, nil
}

// ChooseOriginal returns the original part: named (with its output voltage
// taken from identification's best candidate of the same family and package
// when the name leaves it open, and an adjustable part's setting always), or
// else identification's leader. It returns an error wrapping
// [ErrNotInCatalog] when "not in the catalog" is more probable than the
// leader, and one wrapping [ErrNonRegulator] when the original is a
// look-alike.
func ChooseOriginal(res *Result, named *Hypothesis) (Original, error) {
	if named != nil {
		h := *named
		if h.Family.Adjustable() || h.VoutV == 0 {
			for _, cd := range res.Candidates {
				if cd.Family == h.Family && cd.Package == h.Package {
					h.VoutV = cd.VoutV
					break
				}
			}
		}
		o := Original{Hypothesis: h, Probability: 1, Named: true}
		return o, nonRegulator(o)
	}
	if len(res.Candidates) == 0 {
		return Original{}, fmt.Errorf("%w: the catalog has no candidates", ErrNotInCatalog)
	}
	lead := res.Candidates[0]
	if res.NotInCatalog > lead.Probability {
		return Original{}, fmt.Errorf("%w (not in the catalog %.0f %%, leader %s %.0f %%)", ErrNotInCatalog, 100*res.NotInCatalog, lead.Label(), 100*lead.Probability)
	}
	if packageAtGlance(lead) {
		// A leader in an outline nobody would mistake for the one named
		// fits nothing the technician holds.
		return Original{}, fmt.Errorf("%w: the leader %s (%.0f %%) is not the package named, and no part in the named package fits the readings; check the readings (the meter's polarity, the lead numbering) or name the part with --original", ErrNotInCatalog, lead.Label(), 100*lead.Probability)
	}
	o := Original{Hypothesis: lead.Hypothesis, Probability: lead.Probability}
	return o, nonRegulator(o)
}

// NonRegulator returns an error wrapping [ErrNonRegulator], saying what the
// part is and what to do, when h is a look-alike (a transistor, a shunt
// reference, a switching IC), and nil for a regulator.
func NonRegulator(h Hypothesis) error {
	f := h.Family
	if f == nil || !f.NonRegulator() {
		return nil
	}
	return fmt.Errorf("%w: %s %s is a look-alike — %s — and no regulator replaces it; fit the same kind of part with at least its voltage and current ratings, or, if you know the part is a regulator, name it with --original ID[:OUTLINE[:VOUT]]",
		ErrNonRegulator, f.ID, h.Package.Outline, f.Title)
}

func nonRegulator(o Original) error { return NonRegulator(o.Hypothesis) }

// TerminalVolts maps the measured lead (and case) voltages onto h's terminal
// functions (IN, OUT, GND, ADJ), signed as measured; a lead wired to ground
// counts as 0 V.
func TerminalVolts(h Hypothesis, ev *Evidence) map[string]float64 { return terminalVolts(h, ev) }

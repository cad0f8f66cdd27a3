package replace

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/infer"
)

// Check is one row of a candidate's check table: its figures as numbers
// (in Unit, SI; nil when the check has no number), the same figures as
// text, the normalised margin, the status and one sentence of why.
type Check struct {
	Name      CheckName `json:"check"`      // which check (the contract's names)
	Value     *float64  `json:"value"`      // what the candidate meets here
	Limit     *float64  `json:"limit"`      // what it must meet
	Unit      string    `json:"unit"`       // V, A, W, °C, F or "" (null figures)
	Margin    float64   `json:"margin"`     // normalised: > 0 inside the limit, < 0 beyond it
	Status    Status    `json:"status"`     // pass, warn, work or fail
	ValueText string    `json:"value_text"` // the value in words and units
	LimitText string    `json:"limit_text"` // the limit in words and units
	Text      string    `json:"text"`       // one sentence of why
	// Action is what to do about it (install notes; "" when nothing).
	Action string `json:"action,omitempty"`
}

// MarginInUnit returns the margin in the check's unit, signed like Margin
// (> 0 inside the limit), for the checks whose limit is a bound the value
// must stay on one side of: current, vin_max, dropout, thermal, cout and
// min_load. For the others (a target with a tolerance, a fit, a word) the
// distance between value and limit is not a margin, and ok is false: the
// normalised Margin alone says it.
func (c Check) MarginInUnit() (m float64, ok bool) {
	switch c.Name {
	case CheckCurrent, CheckVinMax, CheckDropout, CheckThermal, CheckCout, CheckMinLoad:
	default:
		return 0, false
	}
	if c.Value == nil || c.Limit == nil || c.Unit == "" || math.IsNaN(c.Margin) {
		return 0, false
	}
	return math.Copysign(math.Abs(*c.Limit-*c.Value), c.Margin), true
}

// num returns a pointer to x, for the figures of a Check.
func num(x float64) *float64 { return &x }

// Replacement is one candidate with its checks.
type Replacement struct {
	infer.Hypothesis
	Verdict Verdict // drop-in, needs-work or unsuitable
	Checks  []Check // every check that applies, in the fixed order
	// Install are the install notes: the actions of every check that does
	// not fail, then what to measure after power-up. Empty for an
	// unsuitable candidate's failing checks.
	Install []string
	// Deciding is the check that sets the verdict: the failing one, else
	// the one needing the most work, else the smallest margin.
	Deciding CheckName
	// DecidingWhy says which of the three rules chose it: "fails", "needs
	// work" or "smallest margin".
	DecidingWhy string
	// MinMargin is the smallest margin over the checks.
	MinMargin float64
	// WorkCount is the number of checks that need work.
	WorkCount int
	// FailsLikeOriginal is true when the candidate is unsuitable only
	// through checks the original part fails in this circuit too.
	FailsLikeOriginal bool
}

// Shortfall is a check the original part itself fails in this circuit, and
// the best candidate that passes it.
type Shortfall struct {
	Check      Check  // the original's own row
	PassedBy   string // the best-ranked usable candidate that passes it; "" when none
	PassedWith string // its value against its limit
	// OnBound is true when the original misses the check only on the
	// assumed bound from a bare reading of the IN lead, not on the reading
	// itself: the check warns (see [infer.Operating.OnlyBoundCrosses]).
	OnBound bool
	cond    Conditions
	advice  string // how to settle a miss on the bound
}

// Sentence says it in words for the summary.
func (s Shortfall) Sentence(orig string) string {
	if s.OnBound {
		t := fmt.Sprintf("the original %s misses %s only on the assumed input bound (%s against %s), not on the reading itself: %s",
			orig, s.Check.Name, s.Check.ValueText, s.Check.LimitText, s.advice)
		if s.PassedBy != "" {
			t += fmt.Sprintf("; %s clears even the bound (%s)", s.PassedBy, s.PassedWith)
		}
		return t
	}
	t := fmt.Sprintf("the original %s fails %s in this circuit too (%s against %s): %s",
		orig, s.Check.Name, s.Check.ValueText, s.Check.LimitText, circuitWords(s.Check, s.cond))
	switch {
	case s.PassedBy != "":
		t += fmt.Sprintf("; %s passes it (%s)", s.PassedBy, s.PassedWith)
	case s.cond.Source == infer.InputReading && (s.Check.Name == CheckDropout || s.Check.Name == CheckVinMax):
		t += "; no usable part clears the assumed bound too: those that clear the reading itself are listed with a warning"
	case s.Check.Name == CheckDropout && s.cond.Source == infer.InputDC:
		t += "; no usable part passes it: the supply sags too low for this output"
	case s.Check.Name == CheckDropout:
		t += "; no usable part passes it: the circuit needs more filter capacitance, a higher secondary or less load"
	default:
		t += "; no usable part passes it"
	}
	return t
}

// Check returns the candidate's check named n, or nil.
func (r *Replacement) Check(n CheckName) *Check {
	for i := range r.Checks {
		if r.Checks[i].Name == n {
			return &r.Checks[i]
		}
	}
	return nil
}

// Summary is one line: the verdict, which check decides it and why.
func (r *Replacement) Summary() string {
	ch := r.Check(r.Deciding)
	if ch == nil {
		return string(r.Verdict)
	}
	return fmt.Sprintf("%s (%s %s: %s)", r.Verdict, r.Deciding, r.DecidingWhy, ch.Text)
}

// WorkList names the checks that need work, in order.
func (r *Replacement) WorkList() string {
	var ws []string
	for _, ch := range r.Checks {
		if ch.Status == Work {
			ws = append(ws, string(ch.Name))
		}
	}
	return strings.Join(ws, ", ")
}

// Result is the outcome of [Swap].
type Result struct {
	Original     infer.Original // the part being replaced
	Replacements []Replacement  // ranked: drop-in, needs-work, unsuitable
	Conditions   Conditions     // the circuit numbers the checks used
	Assumptions  []string       // defaults used where the evidence was silent
	// OriginalShortfalls are the checks the original part itself fails in
	// this circuit, and those it misses only on the assumed bound from a
	// bare reading ([Shortfall.OnBound]); nil when it passes them all.
	OriginalShortfalls []Shortfall
	// Hidden counts unsuitable candidates left out (without Options.All).
	Hidden int
}

// Options tune [Swap].
type Options struct {
	// All includes obsolete and scarce parts and other polarities, and
	// unsuitable candidates (otherwise shown only when nothing else fits).
	All bool
}

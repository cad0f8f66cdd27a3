package replace

import "fmt"

// Status is the outcome of one check.
type Status string

// Check statuses, from best to worst.
const (
	Pass Status = "pass" // meets the limit with margin
	Warn Status = "warn" // a caution (small margin, an assumption); no work needed
	Work Status = "work" // something must be done before it works
	Fail Status = "fail" // does not work in this circuit
)

var statuses = []Status{Pass, Warn, Work, Fail}

// rank orders statuses from 0 (pass) to 3 (fail).
func (s Status) rank() int {
	for i, w := range statuses {
		if w == s {
			return i
		}
	}
	return len(statuses)
}

// String returns the word.
func (s Status) String() string { return string(s) }

// MarshalText returns the word.
func (s Status) MarshalText() ([]byte, error) { return []byte(s), nil }

// UnmarshalText accepts pass, warn, work or fail.
func (s *Status) UnmarshalText(b []byte) error {
	for _, w := range statuses {
		if string(b) == string(w) {
			*s = w
			return nil
		}
	}
	return fmt.Errorf("status %q is not one of pass, warn, work, fail", b)
}

// Verdict is the outcome for a candidate.
type Verdict string

// Verdicts, from best to worst.
const (
	DropIn     Verdict = "drop-in"    // only pass and warn
	NeedsWork  Verdict = "needs-work" // some work, no fail
	Unsuitable Verdict = "unsuitable" // at least one fail
)

var verdicts = []Verdict{DropIn, NeedsWork, Unsuitable}

func (v Verdict) rank() int {
	for i, w := range verdicts {
		if w == v {
			return i
		}
	}
	return len(verdicts)
}

// String returns the word.
func (v Verdict) String() string { return string(v) }

// MarshalText returns the word.
func (v Verdict) MarshalText() ([]byte, error) { return []byte(v), nil }

// UnmarshalText accepts drop-in, needs-work or unsuitable.
func (v *Verdict) UnmarshalText(b []byte) error {
	for _, w := range verdicts {
		if string(b) == string(w) {
			*v = w
			return nil
		}
	}
	return fmt.Errorf("verdict %q is not one of drop-in, needs-work, unsuitable", b)
}

// CheckName names a check (the JSON contract's words).
type CheckName string

// The checks, in the order they run.
const (
	CheckOutline  CheckName = "outline"
	CheckPolarity CheckName = "polarity"
	CheckPinout   CheckName = "pinout"
	CheckTab      CheckName = "tab"
	CheckVout     CheckName = "vout"
	CheckCurrent  CheckName = "current"
	CheckVinMax   CheckName = "vin_max"
	CheckDropout  CheckName = "dropout"
	CheckThermal  CheckName = "thermal"
	CheckCout     CheckName = "cout"
	CheckMinLoad  CheckName = "min_load"
	CheckModule   CheckName = "module"
)

// CheckNames returns every check name in the order the checks run.
func CheckNames() []CheckName {
	names := make([]CheckName, len(checks))
	for i, c := range checks {
		names[i] = c.name
	}
	return names
}

// String returns the word.
func (n CheckName) String() string { return string(n) }

// MarshalText returns the word.
func (n CheckName) MarshalText() ([]byte, error) { return []byte(n), nil }

// UnmarshalText accepts one of the check names.
func (n *CheckName) UnmarshalText(b []byte) error {
	for _, c := range checks {
		if string(b) == string(c.name) {
			*n = c.name
			return nil
		}
	}
	return fmt.Errorf("check %q is not one of %v", b, CheckNames())
}

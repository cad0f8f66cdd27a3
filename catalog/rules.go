package catalog

import "math"

// This file holds the family rules that identification and replacement
// share. Each rule lives here once; both sides call it.

// HeadroomNeeded returns the input-output difference (magnitude, volts) the
// family needs to stay in regulation: the datasheet's worst-case dropout.
// The catalog holds the maximum at rated current, and makers give no
// guaranteed lower maximum at lighter loads, so the same figure holds at any
// current up to the rating: the dropout is never taken below the datasheet
// maximum (a 1117 at 100 mA needs its 1.2–1.4 V, not a scaled-down figure).
func (f *Family) HeadroomNeeded() float64 { return f.DropoutV }

// lightDropoutFloor is the least fraction of the rated-current dropout a
// PNP or P-MOS pass LDO needs at light load: National LM2940, 1.0 V max at
// 1 A and 0.2 V max at 100 mA over temperature (shared/reference
// adjustable.md).
const lightDropoutFloor = 0.2

// HeadroomAt returns the headroom the family in package p (whose rating
// may differ from the family's) needs at load current loadA (amperes; 0 or
// less when unknown, giving [Family.HeadroomNeeded]). An
// NPN pass element needs its figure at any load (makers guarantee nothing
// lower). A PNP or P-MOS pass LDO's dropout is the pass element's
// saturation voltage or on-resistance times the current, so it falls with
// the load: the rated figure scaled by loadA over the rating, never below
// lightDropoutFloor of it (the LM2940's own light-load maximum).
func (f *Family) HeadroomAt(p *Package, loadA float64) float64 {
	rated := f.Current(p)
	if loadA <= 0 || rated <= 0 || (f.Pass != PassPNP && f.Pass != PassPMOS) {
		return f.HeadroomNeeded()
	}
	return f.HeadroomNeeded() * math.Min(1, math.Max(lightDropoutFloor, loadA/rated))
}

// ScalesDropout reports whether the family's dropout falls with the load
// (PNP and P-MOS pass LDOs; see [Family.HeadroomAt]).
func (f *Family) ScalesDropout() bool { return f.Pass == PassPNP || f.Pass == PassPMOS }

// pnpDriveFraction is the part of the load current a PNP-pass LDO's drive
// adds to its ground current: National LM2940 (shared/reference
// adjustable.md: 15 mA max at 5 mA, 60 mA max at 1 A over temperature,
// VIN = VO + 5 V), a straight line between the two datasheet points.
const pnpDriveFraction = 0.045

// GroundCurrentA returns the worst-case ground-lead (quiescent) current at
// load current loadA, amperes: the datasheet maximum, plus for PNP-pass LDOs
// the base drive that rises with the load (see pnpDriveFraction). An NPN
// pass element's drive flows into the load (ST LD1117, LT1086 datasheets),
// so classic and quasi-LDO parts keep their figure; an adjustable part's
// ADJ current is its ground current.
func (f *Family) GroundCurrentA(loadA float64) float64 {
	i := f.IqMA * 1e-3
	if f.Adjustable() {
		i = f.IadjUA * 1e-6
	}
	if f.Pass == PassPNP {
		i += pnpDriveFraction * math.Max(0, loadA)
	}
	return i
}

// InputLimit is what a family's input maximum means in a circuit.
type InputLimit struct {
	// StartV is the input the part must stand with its output at zero: at
	// switch-on into the discharged output capacitor, or with the output
	// shorted. For a fixed part it is the absolute input maximum; for an
	// adjustable (floating) part the input-output rating, since the whole
	// input then appears across it.
	StartV float64
	// RunV is the input the part stands while regulating: a fixed part's
	// maximum, an adjustable part's differential rating plus its output.
	RunV float64
	// What names the rating in words.
	What string
}

// InputLimit returns the family's input limits at output voutV (magnitude),
// volts: [Family.VinMax] for fixed parts; for adjustable parts the
// input-output rating (RunV adds voutV), capped by an absolute input maximum
// where the family has one. Replacement judges a candidate by StartV;
// identification, which sees a part that has been running, by RunV.
func (f *Family) InputLimit(voutV float64) InputLimit {
	if !f.Adjustable() || f.Switching() {
		v := f.VinMax(voutV)
		return InputLimit{StartV: v, RunV: v, What: "input maximum"}
	}
	l := InputLimit{StartV: f.VdiffMaxV, RunV: f.VdiffMaxV + voutV, What: "input-output maximum"}
	if f.VinMaxV > 0 {
		l.StartV = math.Min(l.StartV, f.VinMaxV)
		if f.VinMaxV < l.RunV {
			l.RunV, l.What = f.VinMaxV, "input maximum"
		}
	}
	return l
}

// Signed returns the magnitude v with the polarity's sign: negative for a
// negative rail. Every figure inside the models is a magnitude; this is the
// one place a rail gets its sign back.
func (p Polarity) Signed(v float64) float64 {
	if p == Negative {
		return -math.Abs(v)
	}
	return math.Abs(v)
}

// Signed returns v with the family's sign ([Polarity.Signed]).
func (f *Family) Signed(v float64) float64 { return f.Polarity.Signed(v) }

// SignText returns "-" for a negative family and "" otherwise, to put in
// front of a magnitude written with a format verb.
func (f *Family) SignText() string {
	if f.Negative() {
		return "-"
	}
	return ""
}

// aluminiumFactor is how much more aluminium-electrolytic capacitance a
// family that states its output capacitor as solid tantalum needs: National
// LM337 and LM320 ("1 µF solid tantalum or 10 µF aluminium electrolytic");
// LM79xx asks 25 µF aluminium for its 1 µF tantalum (shared/reference
// fixed.md), so a 79xx gets the warning in between.
const aluminiumFactor = 10

// MinCoutUF returns the least output capacitance (µF) the family needs for
// stability with a capacitor of the given type ("tantalum", "electrolytic",
// "ceramic", or "" when unknown, which takes the tantalum figure): the
// datasheet's figure, which makers state for solid tantalum, multiplied by
// aluminiumFactor for aluminium electrolytics on families that set no ESR
// window (the negative regulators' rule). Families with an ESR window keep
// the figure; the window decides the type.
func (f *Family) MinCoutUF(capType string) float64 {
	c := f.Cout
	if capType == "electrolytic" && c.ESRMinOhm == 0 && c.ESRMaxOhm == 0 && f.Negative() {
		return c.MinUF * aluminiumFactor
	}
	return c.MinUF
}

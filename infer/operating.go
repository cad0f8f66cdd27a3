package infer

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/infer/circuit"
)

// InputSource says where an operating point's input figures come from.
type InputSource string

// Input sources, from the most to the least certain.
const (
	// InputRectifier: the [input] rectifier, transformer and filter solved
	// to their steady state at every corner.
	InputRectifier InputSource = "rectifier"
	// InputDC: a DC supply (rectifier = "dc") with its stated range.
	InputDC InputSource = "dc"
	// InputReading: bounded from a meter reading of the IN lead (and a scope
	// trough, when given) with stated ripple and drop assumptions.
	InputReading InputSource = "reading"
	// InputUnknown: nothing says what feeds the part.
	InputUnknown InputSource = "unknown"
)

// Level is one input figure (a magnitude, volts; negative rails too) and the
// condition it belongs to.
type Level struct {
	V  float64 `json:"v"`  // volts, magnitude
	At string  `json:"at"` // the corner or measurement it comes from
}

// Operating is the one input model that identification and replacement
// share: the input to the regulator at nominal mains and at its worst
// corners, and the load, each with where it comes from. Every figure is a
// magnitude; a negative rail's sign is the family's (see the polarity).
type Operating struct {
	// Source says where the input figures come from.
	Source InputSource `json:"source"`
	// LoadMaxA is the full load every check uses; LoadAssumed says it was
	// not given and names the assumption in Assumptions.
	LoadMaxA    float64 `json:"load_max_a"`
	LoadAssumed bool    `json:"load_assumed"`
	// LoadMinA is the lightest load (0 when not given).
	LoadMinA float64 `json:"load_min_a"`
	// MainsTol is the mains tolerance either way, fraction.
	MainsTol float64 `json:"mains_tolerance"`
	// Nominal is the input at nominal mains and full load (peak, trough, mean).
	Nominal Levels `json:"nominal"`
	// Trough is the lowest input: low mains, full load, low filter capacitance
	// (a DC supply's minimum). The dropout check uses it.
	Trough Level `json:"trough"`
	// Peak is the highest input: high mains, light load (a DC supply's
	// maximum). The input-maximum check uses it.
	Peak Level `json:"peak"`
	// MeanHigh and MeanLow are the mean input at full load at high and low
	// mains: the range over which the regulator dissipates.
	MeanHigh Level `json:"mean_high"`
	MeanLow  Level `json:"mean_low"`
	// TransientV is a surge the part must survive (0 = none stated).
	TransientV float64 `json:"transient_v"`
	// Corners is the rectifier sweep (InputRectifier with the whole sweep).
	Corners *circuit.CornerResult `json:"corners,omitempty"`
	// Rectifier is the nominal rectifier model (InputRectifier only).
	Rectifier *circuit.Rectifier `json:"-"`
	// Assumptions are what was taken where the evidence was silent, as
	// sentences.
	Assumptions []string `json:"assumptions"`

	// ReadingV is the meter reading of the IN lead the input is bounded
	// from (InputReading only; magnitude, volts; 0 otherwise).
	ReadingV float64 `json:"reading_v,omitempty"`

	troughMeasured float64 // a scope trough at nominal mains, magnitude; 0 = none
}

// Levels are peak, trough and mean input at one condition, volts (magnitudes).
type Levels struct {
	PeakV   float64 `json:"peak_v"`   // the crest of the ripple
	TroughV float64 `json:"trough_v"` // the lowest point of the ripple
	MeanV   float64 `json:"mean_v"`   // the average
}

// Sweep says how much of the rectifier model to solve.
type Sweep int

const (
	// SweepPeak solves only the high-mains, light-load corners: all that
	// identification needs (the highest input).
	SweepPeak Sweep = iota
	// SweepAll solves every corner (replacement checks).
	SweepAll
)

// OperatingOptions tune [OperatingPoint].
type OperatingOptions struct {
	// Sweep is how much of the rectifier model to solve.
	Sweep Sweep
	// AssumedLoadA is the full load taken when the evidence gives none
	// (replacement passes the original's rating); 0 means 0.1 A.
	AssumedLoadA float64
	// AssumedLoadWhy replaces the note that says where AssumedLoadA comes
	// from ("" = the original's rating).
	AssumedLoadWhy string
}

// Filter-capacitor and bare-reading assumptions, shared by every use of the
// input model.
const (
	// FilterCapTolerance is the low corner of an aluminium filter
	// capacitor, −20 % (the usual ±20 % tolerance of IEC 60062 code M).
	FilterCapTolerance = 0.20
	// DefaultMainsTolerance is ±10 % (IEC 60038 230 V ±10 %).
	DefaultMainsTolerance = 0.10
	// readingRipple is the full-load ripple, peak to peak, taken as a
	// fraction of a bare meter reading: designers aim at 10–20 % (common
	// practice, no source); the larger is the worst case.
	readingRipple = 0.20
	// readingDropV and readingLightDropV are the rectifier's forward drop at
	// full and light load: two silicon diodes of a bridge, about 0.75 V each
	// at amperes and 0.5 V near no load (1N4007 datasheet VF curve).
	readingDropV      = 1.5
	readingLightDropV = 1.0
	// readingRegulation is the transformer's no-load rise, fraction
	// (small mains transformers 10–20 %; common practice, no source).
	readingRegulation = 0.10
	// defaultLoadA is the transformer-model load when nothing else is known.
	defaultLoadA = 0.1
)

// OperatingPoint works out the input and load of the part's circuit from
// the evidence: from the [input] rectifier model, from a DC supply's range,
// or (see [Operating.FromReading]) bounded from a meter reading of the IN
// lead. A rectifier model that has no steady state returns an error
// wrapping [circuit.ErrNoSteadyState].
func OperatingPoint(ev *Evidence, opts OperatingOptions) (*Operating, error) {
	op := &Operating{Source: InputUnknown, MainsTol: DefaultMainsTolerance}
	out, in := ev.Output, ev.Input
	switch {
	case out != nil && out.Amps.Set && out.Amps.V > 0:
		op.LoadMaxA = out.Amps.V
	case opts.AssumedLoadA > 0 && opts.AssumedLoadWhy != "":
		op.LoadMaxA, op.LoadAssumed = opts.AssumedLoadA, true
		op.note("%s", opts.AssumedLoadWhy)
	case opts.AssumedLoadA > 0:
		op.LoadMaxA, op.LoadAssumed = opts.AssumedLoadA, true
		op.note("load not given: the original's rating %.3g A is taken as the full load in the input model and in every check", opts.AssumedLoadA)
	default:
		op.LoadMaxA, op.LoadAssumed = defaultLoadA, true
		op.note("load not given: %.3g A is taken as the full load of the input model", defaultLoadA)
	}
	if out != nil && out.MinAmps.Set {
		op.LoadMinA = out.MinAmps.V
	} else {
		op.note("lightest load not given: no load assumed")
	}
	if opts.AssumedLoadA == 0 && (in == nil || in.Rectifier == "" || in.Rectifier.DC()) {
		op.Assumptions = nil // the load is used by nothing but the rectifier model
	}
	if in == nil {
		return op, nil
	}
	if in.MainsTolerance.Set {
		op.MainsTol = in.MainsTolerance.V
	} else {
		op.note("mains tolerance ±10 %% (IEC 60038) assumed")
	}
	if in.TroughVolts.Set {
		op.troughMeasured = math.Abs(in.TroughVolts.V)
	}
	if in.TransientVolts.Set {
		op.TransientV = math.Abs(in.TransientVolts.V)
	}
	if in.Rectifier.DC() {
		// The nominal DC input, and its stated range (a missing end of the
		// range is the nominal; a missing nominal is the middle of the range).
		lo, hi := math.Abs(in.DCVoltsMin.V), math.Abs(in.DCVoltsMax.V)
		v := math.Abs(in.DCVolts.V)
		switch {
		case !in.DCVolts.Set && in.DCVoltsMin.Set && in.DCVoltsMax.Set:
			v = (lo + hi) / 2
		case !in.DCVolts.Set:
			v = lo + hi // only one end is given
		}
		if !in.DCVoltsMin.Set {
			lo = v
		}
		if !in.DCVoltsMax.Set {
			hi = v
		}
		op.Source = InputDC
		op.Nominal = Levels{PeakV: v, TroughV: v, MeanV: v}
		op.Trough, op.Peak = Level{lo, "the DC supply at its lowest"}, Level{hi, "the DC supply at its highest"}
		if lo == hi {
			op.Trough.At, op.Peak.At = "the DC supply", "the DC supply"
		}
		op.MeanHigh, op.MeanLow = op.Peak, op.Trough
		return op, nil
	}
	r, ok, err := op.rectifierModel(ev)
	if err != nil || !ok {
		return op, err
	}
	op.Source, op.Rectifier = InputRectifier, &r
	light := circuit.Load{Amps: op.LoadMinA}
	if opts.Sweep == SweepPeak {
		for _, c := range []circuit.Corner{
			{Name: "high mains, light load, nominal C", Mains: 1 + op.MainsTol, CapFactor: 1, Load: light},
			{Name: "high mains, light load, low C", Mains: 1 + op.MainsTol, CapFactor: 1 - FilterCapTolerance, Load: light},
		} {
			res, err := ev.memo.solve(r.At(c))
			if err != nil {
				return nil, fmt.Errorf("%s: [input]: %s: %w", ev.File, c.Name, err)
			}
			if res.PeakV > op.Peak.V {
				op.Peak = Level{res.PeakV, "the rectifier model at " + c.Name}
			}
		}
		return op, nil
	}
	cr, err := r.Corners(circuit.CornerSpec{MainsTol: op.MainsTol, CapTol: FilterCapTolerance, LoadMin: light, LoadMax: r.Load, Solve: ev.memo.solve})
	if err != nil {
		return nil, fmt.Errorf("%s: [input]: %w", ev.File, err)
	}
	nom, err := ev.memo.solve(r)
	if err != nil {
		return nil, fmt.Errorf("%s: [input]: nominal: %w", ev.File, err)
	}
	op.Corners = &cr
	op.Nominal = Levels{PeakV: nom.PeakV, TroughV: nom.TroughV, MeanV: nom.MeanV}
	op.Trough = Level{cr.WorstTrough.Result.TroughV, cr.WorstTrough.Name}
	op.Peak = Level{cr.WorstPeak.Result.PeakV, cr.WorstPeak.Name}
	for _, c := range cr.Corners {
		if c.CapFactor == 1 && c.Load == r.Load {
			if c.Mains > 1 {
				op.MeanHigh = Level{c.Result.MeanV, c.Name}
			} else {
				op.MeanLow = Level{c.Result.MeanV, c.Name}
			}
		}
	}
	if op.troughMeasured > 0 {
		ripple := nom.PeakV - nom.TroughV
		if t := op.scaledTrough(op.troughMeasured, readingDropV, ripple); t < op.Trough.V {
			op.Trough = Level{t, "the measured trough taken to low mains and low C"}
		}
	}
	return op, nil
}

// FromReading returns the operating point bounded from vin, a meter reading
// of the IN lead (the mean input at nominal mains and normal load), when the
// evidence describes no rectifier and no DC supply; otherwise it returns op
// unchanged. The ripple, rectifier drop and transformer rise it assumes are
// added to Assumptions as sentences.
func (op Operating) FromReading(vin float64) Operating {
	if op.Source != InputUnknown || vin == 0 {
		return op
	}
	vm := math.Abs(vin)
	t, ripple := op.MainsTol, op.readingRipple(vm)
	crest := vm + ripple/2 + readingDropV // the secondary's crest at full load
	op.Peak = op.PeakFor(vin)
	op.Source, op.ReadingV = InputReading, vm
	bounded := readingName(vm)
	op.Nominal = Levels{PeakV: vm + ripple/2, TroughV: vm - ripple/2, MeanV: vm}
	// Lowest: the crest at low mains less the drop, which does not shrink,
	// and the ripple grown by the low capacitor.
	op.Trough = Level{op.scaledTrough(vm-ripple/2, readingDropV, ripple), "low mains, full load and low C as bounded from the " + bounded}
	op.MeanHigh = Level{crest*(1+t) - readingDropV - ripple/2, "high mains and full load as bounded from the " + bounded}
	op.MeanLow = Level{crest*(1-t) - readingDropV - ripple/2, "low mains and full load as bounded from the " + bounded}
	if op.troughMeasured > 0 {
		op.Trough.At = "the measured trough taken to low mains and low C"
	}
	op.Assumptions = append(append([]string(nil), op.Assumptions...),
		fmt.Sprintf("no rectifier described: the input is bounded from the %.3g V reading, taking %.3g V ripple peak to peak at full load, a %.2g V rectifier drop (%.2g V at light load), a %.0f %% transformer rise at light load and ±%.0f %% mains",
			vm, ripple, readingDropV, readingLightDropV, readingRegulation*100, t*100),
		"describe the [input] rectifier, secondary and filter, or measure the trough with a scope, to replace these bounds with the model")
	return op
}

// readingConflict is how far a meter reading of the IN lead may sit outside
// the rectifier model's envelope (its lowest full-load mean to its highest
// peak) before the two are taken to contradict each other: 10 %, well
// beyond a meter's error and the model's agreement with ngspice (common
// practice, no source).
const readingConflict = 0.10

// Reconcile compares vin, a meter reading of the IN lead, with the
// rectifier model. When the reading lies outside everything the model can
// produce (above its highest peak or below its lowest full-load mean by
// more than 10 %), the description and the reading contradict each other
// (a slip in the notes, a wrong secondary or filter value); Reconcile then
// returns the operating point bounded from the reading (see
// [Operating.FromReading]) and a sentence saying so. Otherwise it returns
// op unchanged and "".
func (op Operating) Reconcile(vin float64) (Operating, string) {
	vm := math.Abs(vin)
	if op.Source != InputRectifier || vm == 0 {
		return op, ""
	}
	var what string
	switch {
	case vm > op.Peak.V*(1+readingConflict):
		what = fmt.Sprintf("the IN lead reads %.3g V, above the %.3g V the described rectifier can reach at %s", vm, op.Peak.V, op.Peak.At)
	case vm < op.MeanLow.V*(1-readingConflict):
		what = fmt.Sprintf("the IN lead reads %.3g V, below the %.3g V the described rectifier gives even at %s", vm, op.MeanLow.V, op.MeanLow.At)
	default:
		return op, ""
	}
	r := op
	r.Source, r.Corners, r.Rectifier = InputUnknown, nil, nil
	r.Nominal, r.Trough, r.Peak, r.MeanHigh, r.MeanLow = Levels{}, Level{}, Level{}, Level{}, Level{}
	r.Assumptions = nil
	for _, a := range op.Assumptions {
		if !strings.Contains(a, "ESR 0.05 Ω") && !strings.HasPrefix(a, "transformer regulation") && !strings.HasPrefix(a, "50 Hz") {
			r.Assumptions = append(r.Assumptions, a) // the model's own assumptions no longer apply
		}
	}
	r = r.FromReading(vin)
	return r, what + ": the [input] description and the reading contradict each other (a slip in the notes, a wrong secondary or filter value?); the checks use the bound from the reading instead; correct the [input] table to use the model"
}

// PeakFor returns the highest input given vin, a meter reading of the IN
// lead: the model's peak when the evidence describes the input, else the
// bound from the reading (the transformer's no-load rise and high mains on
// the secondary's crest, less the smaller light-load rectifier drop); a zero
// Level when neither is known.
func (op *Operating) PeakFor(vin float64) Level {
	if op.Source != InputUnknown || vin == 0 {
		return op.Peak
	}
	vm := math.Abs(vin)
	crest := vm + op.readingRipple(vm)/2 + readingDropV
	return Level{crest*(1+readingRegulation)*(1+op.MainsTol) - readingLightDropV, "high mains and light load as bounded from the " + readingName(vm)}
}

// readingName names a bare reading of vm volts in the corner texts.
func readingName(vm float64) string { return fmt.Sprintf("%.3g V reading", vm) }

// readingRipple is the full-load ripple taken with a bare reading vm: from
// the measured trough when there is one (the mean sits about half the ripple
// above the trough), else readingRipple of the reading.
func (op *Operating) readingRipple(vm float64) float64 {
	if op.troughMeasured > 0 {
		return math.Max(0, 2*(vm-op.troughMeasured))
	}
	return readingRipple * vm
}

// scaledTrough takes a trough measured (or bounded) at nominal mains and
// full load to low mains and low filter capacitance: the secondary's crest
// (trough + ripple + rectifier drop) scales with the mains, the drop does
// not, and the ripple grows as 1/C.
func (op *Operating) scaledTrough(trough, dropV, ripple float64) float64 {
	crest := trough + ripple + dropV
	return crest*(1-op.MainsTol) - dropV - ripple/(1-FilterCapTolerance)
}

// rectifierModel builds the [input] rectifier at nominal mains and full
// load; ok is false when the evidence does not describe one.
func (op *Operating) rectifierModel(ev *Evidence) (r circuit.Rectifier, ok bool, err error) {
	in := ev.Input
	if in.Rectifier == "" || !in.SecondaryVrms.Set || !in.FilterUF.Set {
		return r, false, nil
	}
	top, ok := in.Rectifier.Topology()
	if !ok {
		return r, false, nil
	}
	reg := in.SecondaryRegulation.Or(0.10)
	if !in.SecondaryRegulation.Set {
		op.note("transformer regulation 10 %% assumed")
	}
	hz := in.MainsHz.Or(50)
	if !in.MainsHz.Set {
		op.note("50 Hz mains assumed")
	}
	emf, rs, err := circuit.FromRegulation(top, in.SecondaryVrms.V, reg, op.LoadMaxA)
	if err != nil {
		return r, false, fmt.Errorf("%s: [input]: %w", ev.File, err)
	}
	op.note("filter capacitor ESR 0.05 Ω and 1N4007-class diodes assumed")
	r = circuit.Rectifier{Topology: top, VrmsV: emf, Hz: hz, CapF: in.FilterUF.V * 1e-6, ESROhm: 0.05, SourceOhm: rs, Load: circuit.Load{Amps: op.LoadMaxA}}
	// The model's own loaded secondary must read what was measured.
	if r, err = ev.memo.match(r, in.SecondaryVrms.V); err != nil {
		return r, false, fmt.Errorf("%s: [input]: %w", ev.File, err)
	}
	return r, true, nil
}

func (op *Operating) note(format string, args ...any) {
	op.Assumptions = append(op.Assumptions, fmt.Sprintf(format, args...))
}

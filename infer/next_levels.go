package infer

import (
	"fmt"
	"math"

	"github.com/whichreg/whichreg/catalog"
)

// pLiftedGround is the share of fixed parts whose common lead is lifted
// above ground (a divider, diodes or a zener), the same 80 / 20 as
// [termOutputOnly] (common practice, no source).
const pLiftedGround = 0.2

// levelStepV is the step a predicted reading is rounded to, so that two
// hypotheses predicting the same reading share an outcome: a quarter volt,
// about a fixed part's tolerance at 5 V (common practice, no source).
const levelStepV = 0.25

// levelKey is a predicted reading as an outcome: "about +1.25 V", or
// "about 0 V" for ground.
func levelKey(v float64) string {
	r := math.Round(v/levelStepV) * levelStepV
	if math.Abs(r) < 0.3 {
		return "about 0 V"
	}
	return fmt.Sprintf("about %+g V", r)
}

// leadDist predicts the reading of a lead of function fn under h, given the
// readings already made (tv, by function, see [terminalVolts]). The output
// and the common lead of a regulator are predicted as numbers: the common
// lead at the measured output less what the part holds (so a 5 V part
// lifted to 6 V reads about +1 V there, a 6 V part about 0 V), the output at
// the measured common lead plus it; with neither measured, a fixed part's
// common lead is at ground four times in five.
func leadDist(h Hypothesis, fn string, tv map[string]float64) outcomeDist {
	f := h.Family
	held, _ := regulated(h)
	s := f.Signed(1)
	if isRegulator(h) && held > 0 && f.Device != catalog.DeviceBuck && !groundReferenced(h) {
		out, haveOut := tv[catalog.PinOut]
		com, haveCom := common(tv)
		switch {
		case (fn == catalog.PinGnd || fn == catalog.PinAdj) && haveOut:
			return outcomeDist{levelKey(out - s*held): 1}
		case fn == catalog.PinOut && haveCom:
			return outcomeDist{levelKey(com + s*held): 1}
		case fn == catalog.PinGnd:
			return outcomeDist{"about 0 V": 1 - pLiftedGround, "a few volts off ground (a lifted ground)": pLiftedGround}
		case fn == catalog.PinOut && !f.Adjustable():
			return outcomeDist{levelKey(s * held): 1 - pLiftedGround, "above the part's own voltage (a lifted ground)": pLiftedGround}
		}
	}
	return outcomeDist{leadLevel(h, fn): 1}
}

// The levels a regulator's and a transistor's main leads share: the
// meter reads the rail, whatever the lead is called.
const (
	levelInput  = "the unregulated input (the largest voltage)"
	levelOutput = "the output"
)

// railDist predicts the reading of a lead (or can) of function fn under h
// whose wiring w is known: a rail whose wiring is known reads that rail's
// level whatever the hypothesis calls the lead (a reading adds only the
// level: which output voltage, how far a ground is lifted). Unknown or
// other wiring: [leadDist].
func railDist(h Hypothesis, w Wiring, fn string, tv map[string]float64) outcomeDist {
	switch w {
	case WiredGround:
		return outcomeDist{levelKey(0): 1}
	case WiredUnregulated:
		return outcomeDist{levelInput: 1}
	case WiredLoad:
		if isRegulator(h) {
			return leadDist(h, senseFn(h), tv)
		}
		return outcomeDist{levelOutput: 1}
	}
	return leadDist(h, fn, tv)
}

// leadLevel names the level a lead of function fn sits at under h, in
// words a technician reads off a meter.
func leadLevel(h Hypothesis, fn string) string {
	f := h.Family
	switch fn {
	case catalog.PinIn:
		return levelInput
	case catalog.PinOut, catalog.PinSense:
		if h.VoutV > 0 {
			return levelKey(f.Signed(h.VoutV))
		}
		return levelOutput
	case catalog.PinGnd:
		return "ground (or a lifted-ground level)"
	case catalog.PinAdj:
		if h.VoutV > 0 {
			return levelKey(f.Signed(h.VoutV - f.VrefV))
		}
		return "the output less the reference"
	case catalog.PinB, catalog.PinG:
		if len(f.ControlDropV) == 2 {
			return fmt.Sprintf("%.1f–%.1f V beyond the output lead (a transistor's control lead)", f.ControlDropV[0], f.ControlDropV[1])
		}
		return "a little beyond the output lead (a transistor's control lead)"
	case catalog.PinC, catalog.PinD:
		// The same words as a regulator's input and output: the meter
		// reads the rail, not what the lead is called.
		if f.Device.Polarity() == "negative" {
			return levelOutput
		}
		return levelInput
	case catalog.PinE, catalog.PinS:
		if f.Device.Polarity() == "negative" {
			return levelInput
		}
		return levelOutput
	case catalog.PinRef:
		return fmt.Sprintf("%s V above the anode (a shunt reference's REF)", trimFloat(f.VrefV))
	case catalog.PinA:
		return levelKey(0)
	case catalog.PinK:
		return "the rail it holds (a shunt reference's cathode)"
	case catalog.PinSW:
		return "about the output, switching (a switcher's switch node)"
	case catalog.PinFB:
		if h.VoutV > 0 {
			return levelKey(f.Signed(h.VoutV))
		}
		return levelKey(f.Signed(f.VrefV))
	case catalog.PinPG:
		return "the output or the input, pulled up (a power-good flag)"
	case catalog.PinBYP:
		return "a steady volt or so (a noise-bypass lead on its capacitor)"
	case catalog.PinEn:
		return "the input or a logic high (an enable lead, on when high)"
	case catalog.PinInh:
		return "about 0 V or a logic low (an inhibit lead, off when high)"
	}
	return "nothing (not connected)"
}

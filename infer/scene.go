package infer

import (
	"math"
	"strconv"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer/circuit"
)

// scene is what the evidence says about the circuit, worked out once and
// shared by every hypothesis: the input model, the marking's matches (cached
// per family and voltage), and whether reasons get their text.
type scene struct {
	c     *catalog.Catalog
	ev    *Evidence
	input *Operating // the input model (peak only), shared with replacement

	legible   bool
	marks     map[string]catalog.Hit // the marking decoded, by family id (the best hit)
	codeVolts []float64              // the output voltages the marking's voltage code reads as

	text bool // format reason texts

	leads    []int     // ev.Leads(), taken once for every hypothesis
	pinKeys  []string  // "pins.N" of each of leads
	measured []float64 // measuredLeads(ev), likewise
	// volts is terminalVolts by package (it depends on the package, its
	// outline and the evidence only), made on first use; read-only.
	volts map[*catalog.Package]map[string]float64
}

// terminalVolts is [terminalVolts] of h on the scene's evidence, made once
// per package: the hypotheses of one package's voltages share it.
func (sc *scene) terminalVolts(h Hypothesis) map[string]float64 {
	if v, ok := sc.volts[h.Package]; ok {
		return v
	}
	if sc.volts == nil {
		sc.volts = map[*catalog.Package]map[string]float64{}
	}
	v := terminalVolts(h, sc.ev)
	sc.volts[h.Package] = v
	return v
}

// setLeads sets the scene's lead list and the evidence key of each lead.
func (sc *scene) setLeads(leads []int) {
	sc.leads, sc.pinKeys = leads, make([]string, len(leads))
	for i, n := range leads {
		sc.pinKeys[i] = "pins." + strconv.Itoa(n)
	}
}

// newScene prepares the marking matches and the input model.
func newScene(c *catalog.Catalog, ev *Evidence) (*scene, error) {
	sc := &scene{c: c, ev: ev, legible: catalog.Legible(catalog.NormalizeMarking(ev.Marking)), measured: measuredLeads(ev)}
	sc.setLeads(ev.Leads())
	if sc.legible {
		sc.marks = map[string]catalog.Hit{}
		for _, h := range catalog.Find(c, ev.Marking) {
			if _, have := sc.marks[h.Family.ID]; !have {
				sc.marks[h.Family.ID] = h
			}
			if h.How == "wildcard" && len(h.VoutV) > 0 && sc.codeVolts == nil {
				sc.codeVolts = h.VoutV
			}
		}
	}
	in, err := OperatingPoint(ev, OperatingOptions{Sweep: SweepPeak})
	if err != nil {
		return nil, err
	}
	sc.input = in
	return sc, nil
}

// terminalVolts maps the measured voltages onto the hypothesis's terminal
// functions: a lead's reading, or 0 V for a common lead wired to ground,
// and the case's reading for the function the tab or can carries.
func terminalVolts(h Hypothesis, ev *Evidence) map[string]float64 {
	v := map[string]float64{}
	for i, fn := range h.Package.Pins {
		p, ok := ev.Lead(i + 1)
		if !ok {
			continue
		}
		if _, have := v[fn]; have {
			continue
		}
		if p.Volts.Set {
			v[fn] = p.Volts.V
		} else if p.WiredTo == WiredGround && (fn == catalog.PinGnd || fn == catalog.PinAdj || fn == catalog.PinA) {
			v[fn] = 0
		}
	}
	if ev.Case != nil && h.Package.Tab != catalog.TabNone && h.Package.Tab != "" {
		if _, have := v[h.Package.Tab]; !have {
			if ev.Case.Volts.Set {
				v[h.Package.Tab] = ev.Case.Volts.V
			} else if h.Outline != nil && h.Outline.CaseTerminal && ev.Case.WiredTo == WiredGround && h.Package.Tab == catalog.PinGnd {
				v[catalog.PinGnd] = 0
			}
		}
	}
	return v
}

// common returns the voltage of the hypothesis's common lead (GND, else ADJ).
func common(v map[string]float64) (float64, bool) {
	if x, ok := v[catalog.PinGnd]; ok {
		return x, true
	}
	x, ok := v[catalog.PinAdj]
	return x, ok
}

// senseFn is the function whose lead carries the regulated output: OUT, or
// a switching IC's feedback lead (tied to the output on fixed versions).
func senseFn(h Hypothesis) string {
	if h.Package.Lead(catalog.PinOut) == 0 && h.Package.Lead(catalog.PinFB) > 0 {
		return catalog.PinFB
	}
	return catalog.PinOut
}

// adjustableVout is the output an adjustable hypothesis is set to: the
// measured OUT lead, or what the divider gives.
func adjustableVout(h Hypothesis, ev *Evidence) float64 {
	v := terminalVolts(h, ev)
	if x, ok := v[catalog.PinOut]; ok {
		return math.Abs(x)
	}
	if nw := ev.Network; nw != nil && nw.RTopOhms.Set && nw.RBottomOhms.Set {
		f := h.Family
		vo, err := circuit.DividerVout(f.VrefV, f.IadjTypUA*1e-6, nw.RTopOhms.V, nw.RBottomOhms.V, math.Abs(nw.BottomToVolts.V))
		if err == nil {
			return vo
		}
	}
	return 0
}

// measuredLeads returns the readings of every lead (and the case) that has
// one, for the checks that look at the evidence as a whole.
func measuredLeads(ev *Evidence) []float64 {
	var vs []float64
	for _, n := range ev.Leads() {
		if p, _ := ev.Lead(n); p.Volts.Set {
			vs = append(vs, p.Volts.V)
		}
	}
	if ev.Case != nil && ev.Case.Volts.Set {
		vs = append(vs, ev.Case.Volts.V)
	}
	return vs
}

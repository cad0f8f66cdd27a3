package replace

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
)

// thermalPath returns the junction-to-ambient resistance a candidate gets
// here and the words for it: surface-mount parts by their datasheet θJA on
// the board copper (never the old heat sink); a tab or can on the old heat
// sink through θJC + θCS + θSA; anything else in free air by θJA.
func thermalPath(in Input, c cand) (float64, string) {
	o, p, cd := c.Outline, c.Package, &in.Cond
	switch {
	case c.Family.Switching():
		return p.ThetaJA, fmt.Sprintf("free air, θJA %g °C/W", p.ThetaJA)
	case o != nil && o.SMD:
		return p.ThetaJA, fmt.Sprintf("θJA %g °C/W, assuming the board gives it the copper area of the datasheet's test board (see its footprint note; the old heat sink is not used)", p.ThetaJA)
	case cd.HeatsinkCW > 0 && o != nil && o.Isolated:
		jc := p.ThetaJC
		if jc == 0 {
			jc = p.ThetaJA / 4 // isolated packages without a θJC: a quarter of θJA (from memory)
		}
		cs, _ := circuit.CaseToSink("none", circuit.SmallTab)
		return jc + cs + cd.HeatsinkCW, fmt.Sprintf("θJC %g (isolated body) + θCS %g + θSA %g °C/W", jc, cs, cd.HeatsinkCW)
	case cd.HeatsinkCW > 0 && o != nil && (o.Tab || o.MetalCan):
		ins := cd.Insulator
		if c.kit {
			ins = "mica kit to be fitted"
		}
		return p.ThetaJC + c.thetaCS + cd.HeatsinkCW, fmt.Sprintf("θJC %g + θCS %g (%s) + θSA %g °C/W", p.ThetaJC, c.thetaCS, ins, cd.HeatsinkCW)
	}
	return p.ThetaJA, fmt.Sprintf("free air, θJA %g °C/W", p.ThetaJA)
}

// practicalThetaSA is the best heat sink a bench repair can fit: a large
// finned extrusion of about 1 °C/W (common practice, no source). A part that
// needs no better than this needs work; one that needs better fails.
const practicalThetaSA = 1.0

func checkThermal(in Input, c cand) (Check, bool) {
	f, cd := c.Family, &in.Cond
	theta, path := thermalPath(in, c)
	tj := cd.AmbientC + c.powerW*theta
	m := (f.TjMaxC - tj) / math.Max(1, f.TjMaxC-cd.AmbientC)
	st := Pass
	switch {
	case tj > f.TjMaxC:
		st = Fail
	case tj > f.TjMaxC-15:
		st = Warn
	}
	ch := Check{Name: CheckThermal, Unit: "°C", Value: num(tj), Limit: num(f.TjMaxC), Margin: m, Status: st,
		ValueText: fmt.Sprintf("Tj %.0f °C", tj), LimitText: fmt.Sprintf("%g °C", f.TjMaxC)}
	at := "at high mains and full load"
	if cd.Source == infer.InputDC { // a DC supply has no mains
		at = "at the supply's highest and full load"
	}
	if cd.BypassOhm > 0 {
		at = fmt.Sprintf("at full load with %.2f V in, the worst point of the bypass resistor's share", c.atV)
	}
	ch.Text = fmt.Sprintf("%.2f W %s through %s, from %g °C ambient", c.powerW, at, path, cd.AmbientC)
	if st == Fail && thermalBoundOnly(in, c, theta, &ch) {
		return ch, true
	}
	smd := c.Outline != nil && c.Outline.SMD
	if st == Fail && c.powerW > 0 && !smd && !f.Switching() && c.Outline != nil && (c.Outline.Tab || c.Outline.MetalCan) {
		sa, err := circuit.RequiredThetaSA(c.powerW, cd.AmbientC, f.TjMaxC-15, c.Package.ThetaJC, c.thetaCS)
		switch {
		case err == nil && sa >= practicalThetaSA && in.Ev.Mount != nil:
			// A larger heat sink settles it: work, not a verdict.
			ch.Status = Work
			ch.Text += fmt.Sprintf("; a heat sink of %.2g °C/W or better keeps it 15 °C inside the limit", sa)
			ch.Action = fmt.Sprintf("heat sink: fit one of %.2g °C/W or better (the board's is %g °C/W)", sa, cd.HeatsinkCW)
		case err == nil && sa > 0:
			ch.Text += fmt.Sprintf("; it would need a heat sink of %.2g °C/W or better", sa)
		}
		if in.Ev.Mount == nil {
			// Nothing says how the running original is cooled: it cannot
			// have run in free air, so this is a question, not a verdict,
			// and the free-air junction temperature is no value to judge by
			// (its negative margin would contradict the caution).
			ch.Status, ch.Value, ch.Margin = Warn, nil, 0
			ch.ValueText = fmt.Sprintf("unknown (free air: Tj %.0f °C)", tj)
			ch.Text += "; the evidence does not describe the mounting, and the original cannot have run like this in free air: give [mount] heatsink_c_per_w"
		}
	}
	return ch, true
}

// thermalBoundOnly settles a failing thermal check when the input is only
// bounded from a bare meter reading: the reading itself is hard evidence,
// the high-mains bound an assumption (as [boundOnly] does for dropout and
// the input maximum). When the dissipation at the measured input keeps the
// junction inside its limit, the check becomes a warn that keeps the
// bound's margin, says so and how to settle it, and reports true. A
// failure at the measured input itself stays a fail (false).
func thermalBoundOnly(in Input, c cand, theta float64, ch *Check) bool {
	cd := &in.Cond
	m, ok := in.Op.Measured(infer.BoundMean)
	if cd.Source != infer.InputReading || !ok || c.Family.Switching() {
		return false
	}
	m = math.Abs(m)
	var w float64
	if cd.BypassOhm > 0 {
		b := circuit.Bypass{ROhm: cd.BypassOhm, VinMinV: m, VinMaxV: m, VoutV: cd.VoutV, LoadMaxA: in.RegLoadA}
		w, _ = b.RegulatorPowerMax(c.Family.GroundCurrentA(in.RegLoadA))
	} else {
		w = circuit.RegulatorDissipation(m, cd.VoutV, in.RegLoadA, c.Family.GroundCurrentA(in.RegLoadA))
	}
	tj := cd.AmbientC + w*theta
	if tj > c.Family.TjMaxC {
		ch.Text += fmt.Sprintf("; at the %.3g V measured it still dissipates %.2f W (Tj %.0f °C), whatever feeds the part", m, w, tj)
		return false
	}
	ch.Status = Warn
	ch.Text += fmt.Sprintf("; only the assumed bound misses it (at the %.3g V measured: %.2f W, Tj %.0f °C): %s", m, w, tj, in.Op.BoundAdvice(infer.BoundMean))
	ch.Action = "input: before relying on it, measure the input at full load and allow for high mains"
	if in.RegLoadA > 0 && theta > 0 {
		// The input at which the junction reaches its limit at full load
		// (ground current left out: it is small beside the load).
		ch.Action = fmt.Sprintf("input: before relying on it, measure the input at full load: with high mains allowed for it must stay under about %.3g V, where the junction reaches %g °C", cd.VoutV+(c.Family.TjMaxC-cd.AmbientC)/(theta*in.RegLoadA), c.Family.TjMaxC)
	}
	return true
}

// esrEstimate is the typical ESR of a capacitor by type and value, ohms,
// at the tens of kilohertz where an LDO's loop crosses over:
//   - general-purpose wet aluminium electrolytics about 150 Ω·µF / C. Check
//     values: the ESR chart quoted in shared/reference/methods.md §6 (10 µF
//     20 Ω at 10 V, 100 µF 1.6 Ω at 16 V and 1.4 Ω at 25 V: 140–200 Ω·µF),
//     and the makers' dissipation factor: tan δ at most 0.16 (16 V) and
//     0.14 (25 V) at 120 Hz, 20 °C (Lelon RGA general-purpose series
//     specification table) gives ESR ≤ tan δ / (2π·120 Hz·C) = 212 and
//     186 Ω·µF / C at 120 Hz, which the 100 kHz figure stays below. So an
//     estimate is good to about ±40 %; [esrSpread] says so in the sentence.
//   - solid tantalum about 3 Ω at 1 µF falling as 1/√C (from memory; the
//     reference notes a conflict, methods.md §6 and §9 item 5).
//   - ceramic 0.01 Ω (methods.md §6: MLCC 0.01–0.1 Ω).
func esrEstimate(kind infer.CapType, uf float64) float64 {
	switch kind {
	case infer.CapElectrolytic:
		return esrAlOhmUF / math.Max(uf, 0.1)
	case infer.CapTantalum:
		return 3 / math.Sqrt(math.Max(uf, 0.1))
	case infer.CapCeramic:
		return 0.01
	}
	return 0
}

const (
	// esrAlOhmUF is a general-purpose aluminium electrolytic's ESR times its
	// capacitance, Ω·µF (see [esrEstimate]).
	esrAlOhmUF = 150
	// esrSpread is how far a general-purpose aluminium part's ESR may sit
	// from the estimate either way at room temperature (the 140–212 Ω·µF
	// bracket above, and ageing: common practice, no source).
	esrSpread = 0.4
	// esrColdFactor is the rise of an aluminium electrolytic's impedance
	// from 20 °C to −25 °C: at most 3 for 16–50 V parts under 16 mm
	// diameter (Lelon RGA series, impedance ratio Z(−25 °C)/Z(+20 °C));
	// about 30× from 25 °C to −40 °C (TI LM3940 datasheet, SNVS114G).
	esrColdFactor = 3
)

func checkCout(in Input, c cand) (Check, bool) {
	f, cp := c.Family, in.Cap
	req := f.Cout
	needs := req.MinUF > 0 || req.ESRMinOhm > 0 || req.ESRMaxOhm > 0 || !req.CeramicOK
	ch := Check{Name: CheckCout, Unit: "F", LimitText: coutLimit(f), Action: coutAdvice(f)}
	if req.MinUF > 0 {
		ch.Limit = num(f.MinCoutUF(string(cp.Type)) * 1e-6)
	}
	kind := string(cp.Type)
	if kind == "" {
		kind = "of unknown type"
	}
	ch.ValueText = fmt.Sprintf("%g µF %s", cp.UF, kind)
	if cp.UFSet {
		ch.Value = num(cp.UF * 1e-6)
	} else {
		ch.ValueText = "value unknown, " + kind
	}
	switch {
	case cp.Silent && !needs:
		return Check{}, false
	case cp.Silent:
		ch.ValueText, ch.Margin, ch.Status = "unknown", 0, Warn
		ch.Text = "the board's output capacitor is not described: check it meets " + coutLimit(f)
	case cp.Type == infer.CapCeramic && !req.CeramicOK:
		ch.Margin, ch.Status = -1, Work
		ch.Text = "not stable with ceramic capacitors alone: its loop needs the ESR of a tantalum or aluminium part"
		if esr := esrEstimate(cp.Type, cp.UF); req.ESRMinOhm > 0 {
			// The ESR decides: the row's figures are in ohms.
			ch.Unit, ch.Value, ch.Limit = "Ω", num(esr), num(req.ESRMinOhm)
			ch.ValueText += fmt.Sprintf(", ESR about %s", ohmsG(esr))
			ch.Margin = esr/req.ESRMinOhm - 1
			ch.Text = fmt.Sprintf("not stable with ceramic capacitors alone: their ESR (about %s) is below the %s its loop needs", ohmsG(esr), ohmsG(req.ESRMinOhm))
		}
		if cp.UFSet && cp.UF < req.MinUF {
			ch.Text += fmt.Sprintf("; and %g µF is under its %g µF minimum", cp.UF, req.MinUF)
		}
		ch.Action = capAdvice(f, cp)
	case cp.UFSet && req.MinUF > 0 && cp.UF < req.MinUF:
		ch.Margin, ch.Status = cp.UF/req.MinUF-1, Work
		ch.Text = fmt.Sprintf("needs at least %g µF at the output for stability; the board has %g µF", req.MinUF, cp.UF)
		ch.Action = capAdvice(f, cp)
	case cp.UFSet && f.Cout.MaxUF > 0 && cp.UF > f.Cout.MaxUF:
		ch.Limit, ch.Margin, ch.Status, ch.Action = num(f.Cout.MaxUF*1e-6), f.Cout.MaxUF/cp.UF-1, Fail, ""
		ch.Text = fmt.Sprintf("more than the %g µF it can start into", f.Cout.MaxUF)
	case cp.UFSet && cp.Type != "" && cp.UF < f.MinCoutUF(string(cp.Type)):
		need := f.MinCoutUF(string(cp.Type))
		ch.Margin, ch.Status, ch.Action = cp.UF/need-1, Work, capAdvice(f, cp)
		ch.Text = fmt.Sprintf("the datasheet asks %g µF of solid tantalum or %g µF of aluminium electrolytic; the board has %g µF %s", req.MinUF, f.MinCoutUF(string(infer.CapElectrolytic)), cp.UF, cp.Type)
	case !needs:
		ch.LimitText, ch.Margin, ch.Status, ch.Action = "none needed", 1, Pass, ""
		ch.Text = "not needed for stability; the board's capacitor helps the transient response"
	case !cp.UFSet:
		ch.Margin, ch.Status = 0, Warn
		ch.Text = fmt.Sprintf("the capacitor's value is not given: read it off the part and make sure it meets %s", coutLimit(f))
	case cp.Type == "":
		ch.Margin, ch.Status = 0, Warn
		ch.Text = fmt.Sprintf("the capacitor's type is not given: this part needs %s; an aluminium part's ESR may be outside it", coutLimit(f))
	default:
		coutESR(f, cp, &ch)
	}
	if ch.Status == Pass {
		ch.Action = ""
	}
	return ch, true
}

// coutESR judges a capacitor of known type and value against the ESR
// window. When the ESR decides, the row's figures are the ESR in ohms
// against the window's end it misses (or comes nearest to).
func coutESR(f *catalog.Family, cp Cap, ch *Check) {
	req := f.Cout
	esr := esrEstimate(cp.Type, cp.UF)
	esrRow := func(limit float64) {
		ch.Unit, ch.Value, ch.Limit = "Ω", num(esr), num(limit)
		ch.ValueText += fmt.Sprintf(", ESR about %s", ohmsG(esr))
		ch.LimitText = "ESR " + esrWindow(req)
		if req.MinUF > 0 {
			ch.LimitText = fmt.Sprintf("≥ %g µF, ", f.MinCoutUF(string(cp.Type))) + ch.LimitText
		}
	}
	al := cp.Type == infer.CapElectrolytic
	switch {
	case req.ESRMaxOhm > 0 && esr > req.ESRMaxOhm:
		esrRow(req.ESRMaxOhm)
		ch.Margin, ch.Status = 1-esr/req.ESRMaxOhm, Work
		ch.Text = fmt.Sprintf("the capacitor's ESR (about %s for %g µF %s", ohmsG(esr), cp.UF, cp.Type)
		if al {
			ch.Text += fmt.Sprintf(", ±%.0f %% by make and age, %d× more at −25 °C", esrSpread*100, esrColdFactor)
		}
		ch.Text += fmt.Sprintf(") is above the %s the part tolerates: it may oscillate", ohmsG(req.ESRMaxOhm))
		if al && esr*(1-esrSpread) <= req.ESRMaxOhm {
			ch.Text += fmt.Sprintf("; only an ESR meter reading well under %s, cold, would let it stay", ohmsG(req.ESRMaxOhm))
		}
		ch.Action = esrAdvice(f, cp)
	case req.ESRMinOhm > 0 && esr > 0 && esr < req.ESRMinOhm:
		esrRow(req.ESRMinOhm)
		ch.Margin, ch.Status = esr/req.ESRMinOhm-1, Work
		ch.Text = fmt.Sprintf("the capacitor's ESR (about %s) is below the %s the loop needs: it may oscillate", ohmsG(esr), ohmsG(req.ESRMinOhm))
		ch.Action = esrAdvice(f, cp)
	case al && req.ESRMaxOhm > 0 && esr*esrColdFactor > req.ESRMaxOhm:
		esrRow(req.ESRMaxOhm)
		ch.Margin, ch.Status = 1-esr/req.ESRMaxOhm, Warn
		ch.Text = fmt.Sprintf("the capacitor's ESR (about %s, ±%.0f %% by make and age) is inside the %s the part tolerates at room temperature, but rises about %d× at −25 °C to about %s: if the equipment works in the cold, fit a low-ESR or tantalum part",
			ohmsG(esr), esrSpread*100, ohmsG(req.ESRMaxOhm), esrColdFactor, ohmsG(esr*esrColdFactor))
		ch.Action = strings.Replace(esrAdvice(f, cp), "capacitor: ", "capacitor, if the equipment works in the cold: ", 1)
	default:
		ch.Margin, ch.Status = 0.5, Pass
		ch.Text = "within the part's output-capacitor requirement"
	}
}

// esrAdvice says which capacitor brings the ESR inside the family's window:
// a tantalum or low-ESR aluminium of the value the datasheet asks when the
// ESR is too high; a resistor in series with the ceramic (TI's advice: in
// series with the capacitor, not in the output line; methods.md §6) or a
// tantalum when it is too low.
func esrAdvice(f *catalog.Family, cp Cap) string {
	req := f.Cout
	uf := math.Max(f.MinCoutUF(string(infer.CapTantalum)), math.Max(cp.UF, 1))
	window := esrWindow(req)
	if esrEstimate(cp.Type, cp.UF) < req.ESRMinOhm && cp.UF >= uf {
		r := math.Sqrt(math.Max(req.ESRMinOhm, 0.01) * req.ESRMaxOhm)
		if req.ESRMaxOhm <= 0 {
			r = 2 * req.ESRMinOhm
		}
		// The E12 value nearest the window's geometric middle (IEC 60063).
		if lo, hi, ok := circuit.Nearest(circuit.Values(circuit.E12, 0.01, 100), r); ok {
			if hi/r < r/lo {
				r = hi
			} else {
				r = lo
			}
		}
		return fmt.Sprintf("capacitor: put a %s resistor in series with the %g µF ceramic (in the capacitor's leg, not the output line), or fit %g µF of solid tantalum with an ESR of %s, right at the output lead", ohmsG(r), cp.UF, uf, window)
	}
	return fmt.Sprintf("capacitor: replace the %g µF %s with %g µF of solid tantalum or low-ESR aluminium with a datasheet ESR of %s, right at the output lead", cp.UF, cp.Type, uf, window)
}

// capAdvice says which capacitor to fit when the board's is too small or of
// a type the family forbids: inside the ESR window where the family has one,
// else the datasheet's tantalum (or larger aluminium) value added at the
// output lead.
func capAdvice(f *catalog.Family, cp Cap) string {
	req := f.Cout
	if req.ESRMinOhm > 0 || req.ESRMaxOhm > 0 {
		return esrAdvice(f, cp)
	}
	if cp.Type == infer.CapCeramic {
		return fmt.Sprintf("capacitor: replace the %g µF ceramic with at least %g µF of solid tantalum (or %g µF aluminium) right at the output lead", cp.UF, req.MinUF, f.MinCoutUF(string(infer.CapElectrolytic)))
	}
	return fmt.Sprintf("capacitor: add at least %g µF of solid tantalum (or %g µF aluminium) right at the output lead", req.MinUF, f.MinCoutUF(string(infer.CapElectrolytic)))
}

// esrWindow writes a family's ESR window: "0.1–10 Ω", or "up to 3 Ω"
// when it has no lower end.
func esrWindow(c catalog.COut) string {
	if c.ESRMinOhm <= 0 {
		return "up to " + trim(c.ESRMaxOhm) + " Ω"
	}
	if c.ESRMaxOhm <= 0 {
		return "from " + trim(c.ESRMinOhm) + " Ω"
	}
	return trim(c.ESRMinOhm) + "–" + trim(c.ESRMaxOhm) + " Ω"
}

// ohmsG writes a resistance with two significant figures ("15 Ω", "0.1 Ω").
func ohmsG(r float64) string { return fmt.Sprintf("%.2g Ω", r) }

func coutLimit(f *catalog.Family) string {
	c := f.Cout
	var parts []string
	if c.MinUF > 0 {
		s := fmt.Sprintf("≥ %g µF", c.MinUF)
		if al := f.MinCoutUF(string(infer.CapElectrolytic)); al != c.MinUF {
			s = fmt.Sprintf("≥ %g µF tantalum or %g µF aluminium", c.MinUF, al)
		}
		parts = append(parts, s)
	}
	if c.ESRMinOhm > 0 || c.ESRMaxOhm > 0 {
		parts = append(parts, "ESR "+esrWindow(c))
	}
	if !c.CeramicOK {
		parts = append(parts, "not ceramic alone")
	}
	if c.MaxUF > 0 {
		parts = append(parts, fmt.Sprintf("≤ %g µF", c.MaxUF))
	}
	if len(parts) == 0 {
		return "none needed"
	}
	return strings.Join(parts, ", ")
}

func coutAdvice(f *catalog.Family) string {
	c := f.Cout
	switch {
	case c.ESRMinOhm > 0 || c.ESRMaxOhm > 0:
		return fmt.Sprintf("capacitor: fit %g µF or more of solid tantalum (ESR %s) right at the output lead", math.Max(c.MinUF, 10), esrWindow(c))
	case c.MinUF > 0:
		return fmt.Sprintf("capacitor: fit at least %g µF of solid tantalum (or %g µF aluminium) right at the output lead", c.MinUF, f.MinCoutUF(string(infer.CapElectrolytic)))
	}
	return "capacitor: 0.1 µF ceramic at the input and output leads"
}

func checkMinLoad(in Input, c cand) (Check, bool) {
	f, cd := c.Family, &in.Cond
	if !f.Adjustable() && cd.BypassOhm <= 0 {
		return Check{}, false
	}
	div := 0.0
	switch {
	case c.divider != nil:
		div = c.divider.DividerA
	case f.Adjustable() && in.Network.Resistors():
		div = f.VrefV / in.Network.RTopOhm
	}
	needA := f.MinLoadMA * 1e-3
	avail := cd.LoadMinA + div
	text := fmt.Sprintf("divider %.1f mA plus the lightest load %.3g A against this part's %g mA minimum", div*1e3, cd.LoadMinA, f.MinLoadMA)
	if c.bypass != nil {
		needA = c.bypass.MinLoadA
		text = fmt.Sprintf("the bypass resistor passes %.3g A at %s; with the part's own %g mA the load must stay above %.3g A, and the lightest is %.3g A",
			c.bypass.ResistorMaxA, cd.PeakAt, f.MinLoadMA, needA, avail)
	}
	m := 1.0
	if needA > 0 {
		m = (avail - needA) / math.Max(needA, 1e-3)
	}
	ch := Check{Name: CheckMinLoad, Unit: "A", Value: num(avail), Limit: num(needA), Margin: m, Status: status(m, 0.2),
		ValueText: fmt.Sprintf("%.3g A", avail), LimitText: fmt.Sprintf("%.3g A", needA), Text: text}
	if ch.Status == Fail && c.bypass == nil && f.Adjustable() && in.Network.Resistors() {
		// The old divider draws too little: smaller resistors fix it.
		if d, err := chooseFor(f, cd.VoutV); err == nil {
			ch.Status = Work
			ch.Action = fmt.Sprintf("resistors: replace the divider with R1 %s and R2 %s so that it draws %.1f mA", ohms(d.R1Ohm), ohms(d.R2Ohm), d.DividerA*1e3)
		}
	}
	return ch, true
}

func checkModule(in Input, c cand) (Check, bool) {
	f, cd := c.Family, &in.Cond
	if !f.Switching() {
		return Check{}, false
	}
	var probs []string
	st := Warn
	if cd.BypassOhm > 0 {
		probs = append(probs, fmt.Sprintf("the %s bypass resistor would push current into an output the module cannot sink", ohms(cd.BypassOhm)))
		st = Fail
	}
	if in.Lifted {
		probs = append(probs, "it cannot work on a lifted ground")
		st = Fail
	}
	if in.Booster {
		probs = append(probs, "it cannot drive the external pass transistor: its input current is not the load's, so the sense resistor never turns the transistor on as designed")
		st = Fail
	}
	if in.Cap.UFSet && f.Cout.MaxUF > 0 && in.Cap.UF > f.Cout.MaxUF {
		probs = append(probs, fmt.Sprintf("the board's %g µF at the output is more than the %g µF it starts into", in.Cap.UF, f.Cout.MaxUF))
		st = Fail
	}
	probs = append(probs, "it cannot sink current (no output held up by another rail)", "fit an input capacitor (47 µF) at its leads if the filter is far away", "switching noise of tens of mV at hundreds of kHz: not for audio, RF or precision analogue without filtering")
	m := 0.0
	if st == Fail {
		m = -1
	}
	ch := Check{Name: CheckModule, ValueText: "switching step-down", LimitText: "linear regulator's circuit", Margin: m, Status: st, Text: strings.Join(probs, "; ")}
	if st != Fail {
		ch.Action = "module: fit 47 µF at its input if the filter capacitor is far away"
	}
	return ch, true
}

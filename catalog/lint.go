package catalog

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/internal/tomlpos"
)

func oneOf(v string, set []string) bool {
	for _, s := range set {
		if v == s {
			return true
		}
	}
	return false
}

// Lint checks the merged catalog c and returns every problem found in
// entries whose Origin is in only (all entries when only is empty). Each
// problem names the file, line, column and key, and says what to do.
func Lint(c *Catalog, only ...string) ErrorList {
	want := func(origin string) bool {
		if len(only) == 0 {
			return true
		}
		for _, o := range only {
			if o == origin {
				return true
			}
		}
		return false
	}
	var errs ErrorList
	for i := range c.Outlines {
		if o := &c.Outlines[i]; want(o.Origin) {
			lintOutline(o, &errs)
		}
	}
	for i := range c.Families {
		if f := &c.Families[i]; want(f.Origin) {
			lintFamily(c, f, &errs)
		}
	}
	errs.Sort()
	return errs
}

func (p position) add(errs *ErrorList, key, format string, args ...any) {
	if p.ix == nil { // an entry built in Go (the generated built-in catalog) has no positions
		p.ix = tomlpos.Index(nil)
	}
	k := p.path
	if key != "" {
		k += "." + key
	}
	errs.Add(p.file, p.ix, k, format, args...)
}

func bad(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) }

func lintOutline(o *Outline, errs *ErrorList) {
	p := o.pos
	if o.Name == "" {
		p.add(errs, "name", "outline has no name; add name = \"TO-220\" or the like")
	}
	if o.Leads < 1 || o.Leads > 16 {
		p.add(errs, "leads", "leads = %d is impossible; give the number of leads (1 to 16), not counting the tab or can", o.Leads)
	}
	if o.PitchMM <= 0 || o.PitchMM > 20 || bad(o.PitchMM) {
		p.add(errs, "pitch_mm", "pitch_mm = %g is impossible; give the lead spacing in millimetres (e.g. 2.54)", o.PitchMM)
	}
	if o.HoleSpacingMM < 0 || o.HoleSpacingMM > 100 || bad(o.HoleSpacingMM) {
		p.add(errs, "hole_spacing_mm", "hole_spacing_mm = %g is impossible; give millimetres, or leave it out", o.HoleSpacingMM)
	}
	if o.Commonness < 0 || o.Commonness > 5 {
		p.add(errs, "commonness", "commonness = %d is not 1 (rare) to 5 (everywhere), or 0 for the default", o.Commonness)
	}
	if o.RoundCan && !o.MetalCan {
		p.add(errs, "round_can", "round_can needs metal_can = true")
	}
	if o.MountingHole && o.SMD {
		p.add(errs, "mounting_hole", "a surface-mount outline has no mounting hole; leave mounting_hole out")
	}
	if o.CaseTerminal && !o.MetalCan {
		p.add(errs, "case_terminal", "case_terminal needs metal_can = true")
	}
	if o.View == "" {
		p.add(errs, "view", "outline %q has no view; say how leads are numbered (e.g. \"marked face toward you, leads down, 1 at the left\")", o.Name)
	}
}

func lintFamily(c *Catalog, f *Family, errs *ErrorList) {
	p := f.pos
	if f.ID == "" {
		p.add(errs, "id", "family has no id; add the generic designation, e.g. id = \"317\"")
	}
	if !isWord(f.Polarity, Polarities()) {
		p.add(errs, "polarity", "polarity %q is not one of %s", f.Polarity, quoteWords(Polarities()))
	}
	if !isWord(f.Kind, Kinds()) {
		p.add(errs, "kind", "kind %q is not one of %s", f.Kind, quoteWords(Kinds()))
	}
	if !isWord(f.Status, Statuses()) {
		p.add(errs, "status", "status %q is not one of %s", f.Status, quoteWords(Statuses()))
	}
	if f.Pass != "" && !isWord(f.Pass, Passes()) {
		p.add(errs, "pass", "pass %q is not one of %s (or leave it out for npn)", f.Pass, quoteWords(Passes()))
	}
	if f.Source == "" {
		p.add(errs, "source", "family %q names no source; give the datasheet title and revision (write \"from memory\" for unconfirmed values)", f.ID)
	}
	if f.CurrentA <= 0 || f.CurrentA > 100 || bad(f.CurrentA) {
		p.add(errs, "current_a", "current_a = %g is impossible; give the rated output current in amperes", f.CurrentA)
	}
	if f.NonRegulator() {
		lintNonRegulator(f, errs)
	} else {
		if f.DropoutV <= 0 || f.DropoutV > 10 || bad(f.DropoutV) {
			p.add(errs, "dropout_v", "dropout_v = %g is impossible; give the worst-case input-output difference at rated current (> 0 V)", f.DropoutV)
		}
		if f.Tolerance <= 0 || f.Tolerance >= 0.5 || bad(f.Tolerance) {
			p.add(errs, "tolerance", "tolerance = %g is not a fraction between 0 and 0.5 (write 0.04 for ±4 %%)", f.Tolerance)
		}
		if f.Device != "" {
			p.add(errs, "device", "device is for kind = \"non-regulator\" families; a %s regulator leaves it out", f.Kind)
		}
		if len(f.ControlDropV) > 0 {
			p.add(errs, "control_drop_v", "control_drop_v is for transistor look-alikes (kind = \"non-regulator\"); a regulator leaves it out")
		}
	}
	if f.TjMaxC < 50 || f.TjMaxC > 250 || bad(f.TjMaxC) {
		p.add(errs, "tj_max_c", "tj_max_c = %g °C is impossible; give the maximum junction temperature (e.g. 125)", f.TjMaxC)
	}
	if f.Commonness < 1 || f.Commonness > 5 {
		p.add(errs, "commonness", "commonness = %d is not 1 (rare) to 5 (everywhere)", f.Commonness)
	}
	if f.Since != 0 && (f.Since < 1950 || f.Since > 2100) {
		p.add(errs, "since", "since = %d is not a plausible year; give the year of introduction or leave it out", f.Since)
	}
	for _, v := range []struct {
		key string
		val float64
	}{{"iq_ma", f.IqMA}, {"iq_typ_ma", f.IqTypMA}, {"iadj_ua", f.IadjUA}, {"iadj_typ_ua", f.IadjTypUA}, {"min_load_ma", f.MinLoadMA},
		{"vin_max_v", f.VinMaxV}, {"vdiff_max_v", f.VdiffMaxV}, {"vout_max_v", f.VoutMaxV}, {"vin_max_high_v", f.VinMaxHighV},
		{"transient_max_v", f.TransientMaxV},
		{"cout.min_uf", f.Cout.MinUF}, {"cout.max_uf", f.Cout.MaxUF}, {"cout.esr_min_ohm", f.Cout.ESRMinOhm}, {"cout.esr_max_ohm", f.Cout.ESRMaxOhm}} {
		if v.val < 0 || bad(v.val) || v.val > 1e4 {
			p.add(errs, v.key, "%s = %g is impossible; values are positive magnitudes (polarity gives the sign)", v.key, v.val)
		}
	}
	if f.Efficiency < 0 || f.Efficiency > 1 || bad(f.Efficiency) {
		p.add(errs, "efficiency", "efficiency = %g is not a fraction between 0 and 1", f.Efficiency)
	}
	if f.Switching() && f.Efficiency == 0 {
		p.add(errs, "efficiency", "a switching module needs its efficiency (e.g. 0.85) for the thermal check")
	}
	if f.Cout.ESRMaxOhm > 0 && f.Cout.ESRMinOhm > f.Cout.ESRMaxOhm {
		p.add(errs, "cout.esr_min_ohm", "esr_min_ohm %g is above esr_max_ohm %g; swap them", f.Cout.ESRMinOhm, f.Cout.ESRMaxOhm)
	}
	if f.Tolerance25C < 0 || bad(f.Tolerance25C) || (f.Tolerance25C > 0 && f.Tolerance > 0 && f.Tolerance25C > f.Tolerance) {
		p.add(errs, "tolerance_25c", "tolerance_25c = %g must be a fraction no larger than the overall tolerance %g", f.Tolerance25C, f.Tolerance)
	}
	if f.IqTypMA > 0 && f.IqMA > 0 && f.IqTypMA > f.IqMA {
		p.add(errs, "iq_typ_ma", "iq_typ_ma %g is above the maximum iq_ma %g", f.IqTypMA, f.IqMA)
	}
	switch f.Kind {
	case "fixed":
		if len(f.OutputsV) == 0 {
			p.add(errs, "outputs_v", "a fixed family needs its standard output voltages, e.g. outputs_v = [5, 12, 15]")
		}
		maxOut := 0.0
		for i, v := range f.OutputsV {
			if v <= 0 || v > 1000 || bad(v) {
				p.add(errs, "outputs_v", "outputs_v[%d] = %g: give magnitudes above 0 V; polarity says whether the rail is negative", i, v)
			}
			maxOut = math.Max(maxOut, v)
		}
		if f.VinMaxV <= 0 && !f.Switching() {
			p.add(errs, "vin_max_v", "a fixed family needs vin_max_v, the absolute maximum input")
		} else if len(f.OutputsV) > 0 && f.VinMaxV > 0 {
			limit := f.VinMax(maxOut)
			if limit < maxOut+f.DropoutV {
				p.add(errs, "vin_max_v", "vin_max_v %g V is below the highest output %g V plus dropout %g V; check the datasheet (is vin_max_high_v missing?)", limit, maxOut, f.DropoutV)
			}
		}
		if f.TransientMaxV > 0 && f.TransientMaxV <= f.VinMax(maxOut) {
			p.add(errs, "transient_max_v", "transient_max_v %g V is not above the input maximum %g V; give the datasheet's surge rating, or leave it out", f.TransientMaxV, f.VinMax(maxOut))
		}
		if f.VrefV != 0 {
			p.add(errs, "vref_v", "vref_v is for adjustable families; a fixed family lists outputs_v")
		}
	case "adjustable":
		if f.VrefV < 0.5 || f.VrefV > 5 || bad(f.VrefV) {
			p.add(errs, "vref_v", "vref_v = %g V is outside 0.5–5 V; give OUT minus ADJ (1.25 for a 317)", f.VrefV)
		}
		if f.VdiffMaxV <= 0 {
			p.add(errs, "vdiff_max_v", "an adjustable family needs vdiff_max_v, the maximum input-output differential")
		}
		if f.TransientMaxV != 0 {
			p.add(errs, "transient_max_v", "transient_max_v is for fixed families; an adjustable part is limited by vdiff_max_v")
		}
		if len(f.OutputsV) > 0 {
			p.add(errs, "outputs_v", "outputs_v is for fixed families; an adjustable family gives vref_v (and vout_max_v)")
		}
	}
	for i, m := range f.Markings {
		if err := checkPattern(m, f.Kind == "fixed"); err != nil {
			p.add(errs, fmt.Sprintf("markings[%d]", i), "%v", err)
		}
	}
	if len(f.Packages) == 0 {
		p.add(errs, "", "family %q has no [[family.package]]; add at least one package variant", f.ID)
	}
	for i := range f.Packages {
		lintPackage(c, f, i, errs)
	}
	lintVariants(f, errs)
}

func lintPackage(c *Catalog, f *Family, i int, errs *ErrorList) {
	pk := &f.Packages[i]
	p := f.pos
	key := func(k string) string { return fmt.Sprintf("package[%d].%s", i, k) }
	o := c.Outline(pk.Outline)
	if o == nil {
		var names []string
		for _, ol := range c.Outlines {
			names = append(names, ol.Name)
		}
		p.add(errs, key("outline"), "unknown outline %q; use one of %s, or define it with [[outline]]", pk.Outline, strings.Join(names, ", "))
	} else if len(pk.Pins) != o.Leads {
		p.add(errs, key("pins"), "%d pins given but outline %s has %d leads; list one function per lead", len(pk.Pins), o.Name, o.Leads)
	}
	for j, fn := range pk.Pins {
		switch {
		case f.NonRegulator() && !isWord(Pin(fn), Pins()):
			p.add(errs, key("pins"), "pins[%d] = %q is not one of %s", j, fn, quoteWords(Pins()))
		case !f.NonRegulator() && isWord(Pin(fn), Pins()) && !isWord(Pin(fn), RegulatorPins()):
			p.add(errs, key("pins"), "pins[%d] = %q is a look-alike's lead; a regulator uses %s (a transistor or switching IC is kind = \"non-regulator\")", j, fn, quoteWords(RegulatorPins()))
		case !f.NonRegulator() && !isWord(Pin(fn), RegulatorPins()):
			p.add(errs, key("pins"), "pins[%d] = %q is not one of %s", j, fn, quoteWords(RegulatorPins()))
		}
	}
	if pk.Tab != TabNone && !isWord(Pin(pk.Tab), Pins()) {
		p.add(errs, key("tab"), "tab = %q is not a lead function or \"none\"", pk.Tab)
	}
	terms := pk.Terminals(o)
	has := func(fn string) bool { return oneOf(fn, terms) }
	switch f.Kind {
	case "fixed":
		common := PinGnd
		if !has(PinGnd) && has(PinAdj) {
			common = PinAdj // 1117-class fixed parts call it ADJ/GND
		}
		if !has(PinIn) || !has(PinOut) || !has(common) {
			p.add(errs, key("pins"), "a fixed part needs IN, OUT and GND terminals; this pinout has %s", strings.Join(terms, ", "))
		}
	case "adjustable":
		if !has(PinIn) || !has(PinOut) || !has(PinAdj) {
			p.add(errs, key("pins"), "an adjustable part needs IN, OUT and ADJ terminals; this pinout has %s", strings.Join(terms, ", "))
		}
	case KindNonRegulator:
		if msg := devicePinout(f.Device, terms); msg != "" {
			p.add(errs, key("pins"), "%s; this pinout has %s", msg, strings.Join(terms, ", "))
		}
	}
	if o != nil {
		switch {
		case o.CaseTerminal:
			if pk.Tab == TabNone || pk.Tab == "" {
				p.add(errs, key("tab"), "on %s the case is a terminal; give its function (IN, OUT or GND)", o.Name)
			}
		case o.Isolated || (!o.Tab && !o.MetalCan):
			if pk.Tab != TabNone {
				p.add(errs, key("tab"), "outline %s has no exposed tab; write tab = \"none\"", o.Name)
			}
		default:
			if pk.Tab != TabNone && !oneOf(pk.Tab, pk.Pins) {
				p.add(errs, key("tab"), "tab tied to %s but no lead of this pinout is %s; check the datasheet", pk.Tab, pk.Tab)
			}
		}
	}
	if pk.ThetaJC < 0 || pk.ThetaJA <= 0 || bad(pk.ThetaJC) || bad(pk.ThetaJA) || pk.ThetaJA > 1000 {
		p.add(errs, key("theta_ja"), "theta_jc %g / theta_ja %g °C/W: give positive thermal resistances from the datasheet", pk.ThetaJC, pk.ThetaJA)
	} else if pk.ThetaJC > pk.ThetaJA {
		p.add(errs, key("theta_jc"), "theta_jc %g is above theta_ja %g; junction-to-case cannot exceed junction-to-ambient", pk.ThetaJC, pk.ThetaJA)
	}
	if pk.CurrentA < 0 || bad(pk.CurrentA) {
		p.add(errs, key("current_a"), "current_a = %g is impossible", pk.CurrentA)
	}
	if pk.Variant != "" && pk.Source == "" {
		p.add(errs, key("source"), "variant %q names no source; give the datasheet (maker, title, revision) its pinout or rating comes from", pk.Variant)
	}
	for j, code := range pk.OrderCodes {
		if code == "" || len(code) > 40 || strings.ContainsAny(code, " \t\n") {
			p.add(errs, key("order_codes"), "order_codes[%d] = %q is not an order code; give the maker's code as printed in its ordering table, without spaces", j, code)
		}
	}
	if pk.Status != "" && !isWord(pk.Status, Statuses()) {
		p.add(errs, key("status"), "status %q is not one of %s", pk.Status, quoteWords(Statuses()))
	}
}

// lintNonRegulator checks the keys of a look-alike family.
func lintNonRegulator(f *Family, errs *ErrorList) {
	p := f.pos
	if !isWord(f.Device, Devices()) {
		p.add(errs, "device", "device %q is not one of %s; a non-regulator family says what it is", f.Device, quoteWords(Devices()))
		return
	}
	if f.Polarity != f.Device.Polarity() && isWord(f.Polarity, Polarities()) {
		p.add(errs, "polarity", "%s has polarity = %q (the collector, drain or cathode side is %s)", f.Device.A(), f.Device.Polarity(), f.Device.Polarity())
	}
	if f.VinMaxV <= 0 {
		p.add(errs, "vin_max_v", "%s needs vin_max_v, its maximum collector, drain, cathode or input voltage", f.Device.A())
	}
	if f.Device.Transistor() {
		if len(f.ControlDropV) != 2 {
			p.add(errs, "control_drop_v", "%s needs control_drop_v = [low, high], the conducting %s drop in volts from the datasheet", f.Device.A(), controlName(f.Device))
		} else if lo, hi := f.ControlDropV[0], f.ControlDropV[1]; lo <= 0 || hi < lo || hi > 10 || bad(lo) || bad(hi) {
			p.add(errs, "control_drop_v", "control_drop_v = [%g, %g] is impossible; give [low, high] magnitudes in volts, low first (e.g. [0.6, 1.5])", lo, hi)
		}
		if f.VrefV != 0 || len(f.OutputsV) > 0 {
			p.add(errs, "vref_v", "%s has no reference or output voltage; leave vref_v and outputs_v out", f.Device.A())
		}
		return
	}
	if len(f.ControlDropV) > 0 {
		p.add(errs, "control_drop_v", "control_drop_v is for transistors; %s leaves it out", f.Device.A())
	}
	if f.VrefV < 0.5 || f.VrefV > 5 || bad(f.VrefV) {
		p.add(errs, "vref_v", "vref_v = %g V is outside 0.5–5 V; give the reference voltage of %s", f.VrefV, f.Device.A())
	}
	if f.Tolerance <= 0 || f.Tolerance >= 0.5 || bad(f.Tolerance) {
		p.add(errs, "tolerance", "tolerance = %g is not a fraction between 0 and 0.5 (write 0.02 for ±2 %%)", f.Tolerance)
	}
	if f.Device == DeviceShuntRef && len(f.OutputsV) > 0 {
		p.add(errs, "outputs_v", "a shunt reference has no fixed outputs; leave outputs_v out")
	}
	for i, v := range f.OutputsV {
		if v <= 0 || v > 1000 || bad(v) {
			p.add(errs, "outputs_v", "outputs_v[%d] = %g: give magnitudes above 0 V", i, v)
		}
	}
}

func controlName(d Device) string {
	if d.MOS() {
		return "gate-to-source"
	}
	return "base-to-emitter"
}

// devicePinout says what is wrong with a look-alike's terminals, or "".
func devicePinout(d Device, terms []string) string {
	count := map[string]int{}
	for _, t := range terms {
		count[t]++
	}
	exactly := func(want ...string) bool {
		n := 0
		for _, w := range want {
			if count[w] != 1 {
				return false
			}
			n++
		}
		return n == len(terms)
	}
	switch {
	case d.Bipolar():
		if !exactly(PinB, PinC, PinE) {
			return fmt.Sprintf("%s has exactly one B, one C and one E terminal", d.A())
		}
	case d.MOS():
		if !exactly(PinG, PinD, PinS) {
			return fmt.Sprintf("%s has exactly one G, one D and one S terminal", d.A())
		}
	case d == DeviceShuntRef:
		if count[PinRef] != 1 || count[PinA] == 0 || count[PinK] == 0 || count[PinRef]+count[PinA]+count[PinK]+count[PinNC] != len(terms) {
			return "a shunt reference has one REF, and A and K terminals (NC for unused leads)"
		}
	case d == DeviceBuck:
		for _, fn := range terms {
			if !oneOf(fn, []string{PinIn, PinSW, PinGnd, PinFB, PinEn, PinInh, PinNC, PinPG}) {
				return fmt.Sprintf("a buck IC's leads are IN, SW, GND, FB, EN or INH, PG and NC, not %s", fn)
			}
		}
		if count[PinIn] == 0 || count[PinSW] == 0 || count[PinGnd] == 0 || count[PinFB] == 0 {
			return "a buck IC needs IN, SW, GND and FB terminals"
		}
	}
	return ""
}

// lintVariants requires a variant name on every package that shares its
// outline with another package of the same family, and names that differ.
func lintVariants(f *Family, errs *ErrorList) {
	seen := map[string]int{}
	for i, pk := range f.Packages {
		k := strings.ToLower(pk.Outline) + "\x00" + strings.ToLower(pk.Variant)
		if j, ok := seen[k]; ok {
			if pk.Variant == "" {
				f.pos.add(errs, fmt.Sprintf("package[%d].variant", i), "package[%d] and package[%d] are both %s; give each a variant name (e.g. variant = \"TL432 order\")", j, i, pk.Outline)
			} else {
				f.pos.add(errs, fmt.Sprintf("package[%d].variant", i), "variant %q on %s is given twice (also package[%d]); the names must differ", pk.Variant, pk.Outline, j)
			}
		}
		seen[k] = i
	}
}

package infer

import (
	"math"
	"sort"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/internal/tomlpos"
)

// Most leads a package may have, and most diodes in a common lead.
const (
	maxLeadsAny   = 16
	maxDiodeDrops = 10
)

// noPlace locates nothing: the errors of evidence built in Go carry the key
// but no line.
type noPlace struct{}

func (noPlace) Nearest(string) tomlpos.Entry { return tomlpos.Entry{} }

// checker collects the problems of one evidence.
type checker struct {
	file string
	loc  tomlpos.Locator
	errs tomlpos.ErrorList
}

func (k *checker) add(key, format string, args ...any) {
	k.errs.Add(k.file, k.loc, key, format, args...)
}

// Check checks the evidence against itself and the catalog's outlines:
// words that are not allowed, lead numbers the outline lacks, impossible or
// inconsistent values. It returns nil or a [tomlpos.ErrorList] whose errors
// name the key (and, for a loaded file, its line and column). Evidence
// built in Go should be checked before it is used.
func (e *Evidence) Check(c *catalog.Catalog) error {
	k := &checker{file: e.File, loc: e.loc}
	if k.loc == nil {
		k.loc = noPlace{}
	}
	maxLeads := e.checkOutline(k, c)
	e.checkLeads(k, maxLeads)
	e.checkInput(k)
	e.checkOutput(k)
	e.checkNetwork(k)
	if b := e.Bench; b != nil {
		k.nonNeg("bench.dropout_volts", b.DropoutVolts.Set, b.DropoutVolts.V, 50, "V")
		k.nonNeg("bench.holds_amps", b.HoldsAmps.Set, b.HoldsAmps.V, 1000, "A")
	}
	if m := e.Mount; m != nil {
		k.nonNeg("mount.heatsink_c_per_w", m.HeatsinkCPerW.Set, m.HeatsinkCPerW.V, 1000, "°C/W")
		if ins := insulators(); !ins.ok(m.Insulator) {
			k.add("mount.insulator", "insulator %q is not one of %s", m.Insulator, ins.list())
		}
		if m.AmbientC.Set && (m.AmbientC.V < -60 || m.AmbientC.V > 150) {
			k.add("mount.ambient_c", "ambient_c = %g °C is not a plausible ambient", m.AmbientC.V)
		}
	}
	if len(k.errs) == 0 {
		return nil
	}
	k.errs.Sort()
	return k.errs
}

// checkOutline checks the package name, the measured outline and the year,
// and returns how many leads the package has (0 = unknown).
func (e *Evidence) checkOutline(k *checker, c *catalog.Catalog) int {
	maxLeads := 0
	if e.Package != "" {
		o := c.Outline(e.Package)
		if o == nil {
			var names []string
			for _, ol := range c.Outlines {
				names = append(names, ol.Name)
			}
			k.add("package", "unknown package %q; use an outline name from the catalog (%s), or leave it out and give [outline]", e.Package, strings.Join(names, ", "))
		} else {
			maxLeads = o.Leads
		}
	}
	if e.Outline != nil && e.Outline.Leads != nil {
		n := *e.Outline.Leads
		if n < 1 || n > maxLeadsAny {
			k.add("outline.leads", "leads = %d is impossible; count the leads (1 to %d), not the tab", n, maxLeadsAny)
		} else {
			// A package name whose lead count differs is answered with the
			// outline measured; identification lists it as a conflict.
			maxLeads = n
		}
	}
	if e.Outline != nil {
		k.within("outline.pitch_mm", e.Outline.PitchMM.Set, e.Outline.PitchMM.V, 0.1, 50, "mm")
		k.within("outline.hole_spacing_mm", e.Outline.HoleSpacingMM.Set, e.Outline.HoleSpacingMM.V, 1, 100, "mm")
	}
	if e.Year != 0 && (e.Year < 1900 || e.Year > 2100) {
		k.add("year", "year = %d is not a plausible year of manufacture", e.Year)
	}
	return maxLeads
}

// checkLeads checks the [pins.N] tables and the case.
func (e *Evidence) checkLeads(k *checker, maxLeads int) {
	keys := make([]string, 0, len(e.Pins))
	for key := range e.Pins {
		keys = append(keys, key)
	}
	sort.Strings(keys)
	for _, key := range keys {
		p := e.Pins[key]
		n, err := strconv.Atoi(key)
		at := "pins." + key
		switch {
		case err != nil || n < 1 || strconv.Itoa(n) != key:
			k.add(at, "[pins.%s]: leads are numbered 1, 2, 3 … as the outline's convention numbers them", key)
			continue
		case maxLeads > 0 && n > maxLeads:
			k.add(at, "lead %d: the package has only %d leads (numbered by the convention 'whichreg catalog show' draws)", n, maxLeads)
			continue
		}
		if !wirings.ok(p.WiredTo) {
			k.add(at+".wired_to", "wired_to %q is not one of %s", p.WiredTo, wirings.list())
		}
		k.volts(at+".volts", p.Volts)
	}
	if cs := e.Case; cs != nil {
		if t := cs.TiedToPin; t != nil && (*t < 0 || (maxLeads > 0 && *t > maxLeads) || *t > maxLeadsAny) {
			k.add("case.tied_to_pin", "tied_to_pin = %d: give a lead number of the package, or 0 for none", *t)
		}
		if !wirings.ok(cs.WiredTo) {
			k.add("case.wired_to", "wired_to %q is not one of %s", cs.WiredTo, wirings.list())
		}
		k.volts("case.volts", cs.Volts)
	}
}

// checkInput checks the [input] table: the rectifier, or the DC supply and
// its range.
func (e *Evidence) checkInput(k *checker) {
	in := e.Input
	if in == nil {
		return
	}
	if !inputKinds.ok(in.Rectifier) {
		k.add("input.rectifier", "rectifier %q is not one of %s", in.Rectifier, inputKinds.list())
	}
	k.within("input.secondary_vrms", in.SecondaryVrms.Set, in.SecondaryVrms.V, 0.5, 2000, "V")
	k.fraction("input.secondary_regulation", in.SecondaryRegulation, 1)
	k.within("input.filter_uf", in.FilterUF.Set, in.FilterUF.V, 0.001, 1e7, "µF")
	k.within("input.mains_hz", in.MainsHz.Set, in.MainsHz.V, 10, 1000, "Hz")
	k.fraction("input.mains_tolerance", in.MainsTolerance, 0.5)
	k.volts("input.trough_volts", in.TroughVolts)
	k.volts("input.transient_volts", in.TransientVolts)
	dc := []struct {
		key string
		v   Volts
	}{{"input.dc_volts", in.DCVolts}, {"input.dc_volts_min", in.DCVoltsMin}, {"input.dc_volts_max", in.DCVoltsMax}}
	anyDC := false
	for _, d := range dc {
		k.volts(d.key, d.v)
		if d.v.Set {
			anyDC = true
			if !in.Rectifier.DC() {
				k.add(d.key, "%s describes a DC supply, but rectifier = %q; write rectifier = \"dc\" or leave the key out", strings.TrimPrefix(d.key, "input."), in.Rectifier)
			}
		}
	}
	if in.Rectifier.DC() && !anyDC {
		k.add("input.dc_volts", "rectifier = \"dc\" needs dc_volts (or dc_volts_min and dc_volts_max)")
	}
	// The range must run min ≤ nominal ≤ max, all of one sign.
	sign := 0.0
	for _, d := range dc {
		if d.v.Set && d.v.V != 0 {
			s := math.Copysign(1, d.v.V)
			if sign != 0 && s != sign {
				k.add(d.key, "%g V has the other sign from the rest of the DC range; give all of dc_volts, dc_volts_min and dc_volts_max with the supply's sign", d.v.V)
			}
			sign = s
		}
	}
	lo, nom, hi := math.Abs(in.DCVoltsMin.V), math.Abs(in.DCVolts.V), math.Abs(in.DCVoltsMax.V)
	switch {
	case in.DCVoltsMin.Set && in.DCVoltsMax.Set && lo > hi:
		k.add("input.dc_volts_min", "dc_volts_min %g V is beyond dc_volts_max %g V; min is the lowest input, max the highest", in.DCVoltsMin.V, in.DCVoltsMax.V)
	case in.DCVoltsMin.Set && in.DCVolts.Set && lo > nom:
		k.add("input.dc_volts_min", "dc_volts_min %g V is beyond the nominal dc_volts %g V", in.DCVoltsMin.V, in.DCVolts.V)
	case in.DCVoltsMax.Set && in.DCVolts.Set && hi < nom:
		k.add("input.dc_volts_max", "dc_volts_max %g V is below the nominal dc_volts %g V", in.DCVoltsMax.V, in.DCVolts.V)
	}
	if in.TransientVolts.Set {
		top := math.Max(nom, hi)
		switch {
		case in.TransientVolts.V == 0:
			k.add("input.transient_volts", "transient_volts = 0: give the surge's peak, or leave the key out")
		case math.Abs(in.TransientVolts.V) < top:
			k.add("input.transient_volts", "transient_volts %g V is below the highest DC input %g V; give the peak of the surge", in.TransientVolts.V, top)
		}
	}
}

// checkOutput checks the [output] and [bypass] tables.
func (e *Evidence) checkOutput(k *checker) {
	if out := e.Output; out != nil {
		k.nonNeg("output.amps", out.Amps.Set, out.Amps.V, 1000, "A")
		k.nonNeg("output.min_amps", out.MinAmps.Set, out.MinAmps.V, 1000, "A")
		k.nonNeg("output.cap_uf", out.CapUF.Set, out.CapUF.V, 1e7, "µF")
		if out.MinAmps.Set && out.Amps.Set && out.MinAmps.V > out.Amps.V {
			k.add("output.min_amps", "min_amps %g A is above amps %g A; amps is the normal (maximum) load", out.MinAmps.V, out.Amps.V)
		}
		if !capTypes.ok(out.CapType) {
			k.add("output.cap_type", "cap_type %q is not one of %s", out.CapType, capTypes.list())
		}
	}
	if b := e.Bypass; b != nil {
		k.nonNeg("bypass.ohms", b.Ohms.Set, b.Ohms.V, 1e9, "Ω")
	}
	if b := e.Booster; b != nil {
		if !transistors.ok(b.Transistor) {
			k.add("booster.transistor", "transistor %q is not one of %s", b.Transistor, transistors.list())
		}
		k.nonNeg("booster.r_sense_ohms", b.RSenseOhms.Set, b.RSenseOhms.V, 1000, "Ω")
		if b.RSenseOhms.Set && b.RSenseOhms.V == 0 {
			k.add("booster.r_sense_ohms", "r_sense_ohms = 0 would never turn the transistor on; leave it out if unknown")
		}
	}
}

// checkNetwork checks the [network] table.
func (e *Evidence) checkNetwork(k *checker) {
	nw := e.Network
	if nw == nil {
		return
	}
	k.nonNeg("network.r_top_ohms", nw.RTopOhms.Set, nw.RTopOhms.V, 1e9, "Ω")
	k.nonNeg("network.r_bottom_ohms", nw.RBottomOhms.Set, nw.RBottomOhms.V, 1e9, "Ω")
	if nw.RTopOhms.Set && nw.RTopOhms.V == 0 {
		k.add("network.r_top_ohms", "r_top_ohms = 0 would short the output to the common lead; leave it out if unknown")
	}
	k.volts("network.bottom_to_volts", nw.BottomToVolts)
	if d := nw.DiodeDrops; d != nil && (*d < 0 || *d > maxDiodeDrops) {
		k.add("network.diode_drops", "diode_drops = %d: count the silicon diodes in series in the common lead (0 to %d)", *d, maxDiodeDrops)
	}
	k.nonNeg("network.zener_volts", nw.ZenerVolts.Set, nw.ZenerVolts.V, 200, "V")
}

func (k *checker) volts(key string, v Volts) {
	if v.Set && (v.V < -10000 || v.V > 10000) {
		k.add(key, "%g V is outside ±10 kV; give volts to board ground", v.V)
	}
}

func (k *checker) within(key string, set bool, v, lo, hi float64, unit string) {
	if set && (v < lo || v > hi) {
		k.add(key, "%g %s is outside %g to %g %s", v, unit, lo, hi, unit)
	}
}

func (k *checker) nonNeg(key string, set bool, v, hi float64, unit string) {
	if set && (v < 0 || v > hi) {
		k.add(key, "%g %s is impossible (0 to %g %s)", v, unit, hi, unit)
	}
}

func (k *checker) fraction(key string, f Fraction, hi float64) {
	if f.Set && (f.V < 0 || f.V > hi) {
		k.add(key, "%g is not a fraction from 0 to %g (write 0.10 for 10 %%)", f.V, hi)
	}
}

package catalog

import (
	"fmt"
	"strings"
)

// standardVolts are the whole-volt outputs fixed regulators are commonly
// sold in; a voltage code that reads as one of them is ambiguous when the
// family means a fractional voltage (common practice, no source).
var standardVolts = map[string]bool{"05": true, "06": true, "08": true, "09": true, "10": true, "12": true, "15": true, "18": true, "20": true, "24": true}

// Notes returns remarks on the merged catalog c that are not errors but that
// a catalog's author should read, for entries whose Origin is in only (all
// when only is empty): a family that replaces a built-in or earlier one with
// the same id, and a fixed family whose voltage code also reads as a
// whole-volt output ("18" is 1.8 V or 18 V). Each note has its file, line and
// key like a lint problem.
func Notes(c *Catalog, only ...string) ErrorList {
	var notes ErrorList
	for i := range c.Families {
		f := &c.Families[i]
		if len(only) > 0 && !oneOf(f.Origin, only) {
			continue
		}
		if f.Replaces != "" {
			f.pos.add(&notes, "id", "family %q replaces the one from %s; every figure of that one is unused (rename the id to keep both)", f.ID, f.Replaces)
		}
		if f.Kind != KindFixed || !usesVoltageCode(f) {
			continue
		}
		for _, v := range f.OutputsV {
			code := VoltageCode(v)
			if v < 10 && v != float64(int(v)) && standardVolts[code] {
				f.pos.add(&notes, "outputs_v", "the voltage code %q of %g V also reads as %s V: a marking alone cannot tell them apart, so the measured output decides", code, v, strings.TrimLeft(code, "0"))
			}
		}
	}
	notes.Sort()
	return notes
}

func usesVoltageCode(f *Family) bool {
	for _, m := range f.Markings {
		if strings.Contains(m, VoltageToken) {
			return true
		}
	}
	return false
}

// PackageVariant returns the package on outline whose Variant is variant
// (case-insensitive; "" matches the first package on the outline), or nil.
func (f *Family) PackageVariant(c *Catalog, outline, variant string) *Package {
	o := c.Outline(outline)
	for i := range f.Packages {
		p := &f.Packages[i]
		same := strings.EqualFold(p.Outline, outline) || (o != nil && c.Outline(p.Outline) == o)
		if same && (variant == "" || strings.EqualFold(p.Variant, variant)) {
			return p
		}
	}
	return nil
}

// Label names a package for people: the outline, and the variant when there
// is one ("TO-92 (2N3904 order)").
func (p *Package) Label() string {
	if p.Variant == "" {
		return p.Outline
	}
	return fmt.Sprintf("%s (%s)", p.Outline, p.Variant)
}

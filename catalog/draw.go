package catalog

import (
	"fmt"
	"strings"
)

// Drawing returns a small text figure of package p on outline o: the leads
// in the outline's numbering with their functions, what the tab or can is
// tied to, and the viewing convention.
func Drawing(o *Outline, p *Package) string {
	var b strings.Builder
	name := p.Outline
	view := ""
	if o != nil {
		name, view = o.Name, o.View
	}
	fmt.Fprintf(&b, "%s — %s\n", name, view)
	if o != nil && o.Leads == 8 && len(p.Pins) == 8 {
		// Dual in-line: 1-4 down the left, 5-8 up the right.
		b.WriteString("        +-----------+\n")
		for i := 0; i < 4; i++ {
			fmt.Fprintf(&b, "  %-4s %d|%s|%d %s\n", p.Pins[i], i+1, strings.Repeat(" ", 11), 8-i, p.Pins[7-i])
		}
		b.WriteString("        +-----------+\n")
		return b.String()
	}
	w := 6
	if near, far, ok := twoSided(o, len(p.Pins)); ok {
		drawTwoSided(&b, p, near, far, w)
		return b.String()
	}
	n := len(p.Pins)
	width := n * w
	top := "+" + strings.Repeat("-", width-1) + "+"
	switch {
	case o != nil && o.CaseTerminal:
		fmt.Fprintf(&b, "  (o)%s(o)   mounting holes; the can is %s\n", strings.Repeat(" ", width-2), p.Tab)
	case o != nil && o.RoundCan:
		// A round can seen from below, its leads on a circle under it.
		edge := strings.Repeat("-", width-5)
		fmt.Fprintf(&b, "    .%s.\n   /%s\\   can tied to %s\n   \\%s/\n    '%s'\n",
			edge, center("", width-3), p.Tab, center("", width-3), edge)
	case o != nil && o.MetalCan:
		fmt.Fprintf(&b, "  %s\n  |%s|   can tied to %s\n  %s\n", top, center("", width-1), p.Tab, top)
	case o != nil && o.Tab && !o.Isolated && o.MountingHole:
		fmt.Fprintf(&b, "  %s\n  |%s|   tab: %s\n  |%s|\n  %s\n", top, center("(o)", width-1), p.Tab, center("", width-1), top)
	case o != nil && o.Tab && !o.Isolated:
		// A surface-mount pad: no hole.
		fmt.Fprintf(&b, "  %s\n  |%s|   pad: %s\n  %s\n", top, center("", width-1), p.Tab, top)
	case o != nil && o.MountingHole:
		fmt.Fprintf(&b, "  %s\n  |%s|   insulated body\n  %s\n", top, center("(o)", width-1), top)
	default:
		fmt.Fprintf(&b, "  %s\n  |%s|\n  %s\n", top, center("", width-1), top)
	}
	var leads, nums, fns strings.Builder
	for i, f := range p.Pins {
		leads.WriteString(center("|", w))
		nums.WriteString(center(fmt.Sprint(i+1), w))
		fns.WriteString(center(f, w))
	}
	fmt.Fprintf(&b, "  %s\n  %s\n  %s\n", strings.TrimRight(leads.String(), " "), strings.TrimRight(nums.String(), " "), strings.TrimRight(fns.String(), " "))
	return b.String()
}

// farLead is a lead on the far side of a small-outline package: its index
// in the pin list and the near-side column it stands above (x.5 = between
// two columns).
type farLead struct {
	pin int
	col float64
}

// twoSided returns, for the small-outline packages whose leads leave on
// both long sides, how many leads are on the near side (numbered from the
// left) and where the far-side leads stand, as the outlines' views say:
// SOT-23 has 1 and 2 near and 3 opposite, midway (NXP SOT23); SOT-23-5 has
// 1-2-3 near, 4 opposite 3 and 5 opposite 1 (TI DBV, Diodes AP2127 pin
// assignment). Other outlines are drawn with every lead in one row.
func twoSided(o *Outline, pins int) (near int, far []farLead, ok bool) {
	if o == nil {
		return 0, nil, false
	}
	switch {
	case o.Name == "SOT-23" && pins == 3:
		return 2, []farLead{{2, 0.5}}, true
	case o.Name == "SOT-23-5" && pins == 5:
		return 3, []farLead{{4, 0}, {3, 2}}, true
	}
	return 0, nil, false
}

// drawTwoSided draws a body with near leads below it and far leads above,
// each lead with its number and function.
func drawTwoSided(b *strings.Builder, p *Package, near int, far []farLead, w int) {
	width := near * w
	row := func(text func(f farLead) string) string {
		line := []byte(strings.Repeat(" ", width+w))
		for _, f := range far {
			s := text(f)
			at := max(0, min(int(f.col*float64(w))+(w-len(s))/2, len(line)-len(s)))
			copy(line[at:], s)
		}
		return strings.TrimRight(string(line), " ")
	}
	fmt.Fprintf(b, "  %s\n  %s\n  %s\n",
		row(func(f farLead) string { return p.Pins[f.pin] }),
		row(func(f farLead) string { return fmt.Sprint(f.pin + 1) }),
		row(func(farLead) string { return "|" }))
	top := "+" + strings.Repeat("-", width-1) + "+"
	fmt.Fprintf(b, "  %s\n  |%s|\n  %s\n", top, center("", width-1), top)
	var leads, nums, fns strings.Builder
	for i := 0; i < near; i++ {
		leads.WriteString(center("|", w))
		nums.WriteString(center(fmt.Sprint(i+1), w))
		fns.WriteString(center(p.Pins[i], w))
	}
	fmt.Fprintf(b, "  %s\n  %s\n  %s\n", strings.TrimRight(leads.String(), " "), strings.TrimRight(nums.String(), " "), strings.TrimRight(fns.String(), " "))
}

func center(s string, w int) string {
	if len(s) >= w {
		return s
	}
	left := (w - len(s)) / 2
	return strings.Repeat(" ", left) + s + strings.Repeat(" ", w-len(s)-left)
}

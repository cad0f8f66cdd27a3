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

func center(s string, w int) string {
	if len(s) >= w {
		return s
	}
	left := (w - len(s)) / 2
	return strings.Repeat(" ", left) + s + strings.Repeat(" ", w-len(s)-left)
}

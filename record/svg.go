package record

import (
	"fmt"
	"strings"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
)

// PinoutSVG draws the old part's terminals (top) and the new part's
// (bottom), each with its number and function in the outline's own
// numbering, and a line from every new terminal to the old pad it goes to.
func PinoutSVG(orig, chosen infer.Hypothesis) []byte {
	oldT := orig.Package.Terminals(orig.Outline)
	newT := chosen.Package.Terminals(chosen.Outline)
	links := replace.LeadMap(orig, chosen)
	n := max(len(oldT), len(newT))
	const step, left, top, h = 110.0, 60.0, 70.0, 150.0
	w := left*2 + step*float64(max(n-1, 1))
	x := func(i int) float64 { return left + step*float64(i) }
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%g" height="%g" viewBox="0 0 %g %g" font-family="sans-serif" font-size="12">`+"\n", w, top+h+60, w, top+h+60)
	fmt.Fprintf(&b, `<rect width="%g" height="%g" fill="white"/>`+"\n", w, top+h+60)
	fmt.Fprintf(&b, `<text x="10" y="20" font-size="14">Old %s %s (pads) → new %s %s (leads)</text>`+"\n",
		xml(orig.Family.ID), xml(orig.Package.Outline), xml(chosen.Family.ID), xml(chosen.Package.Outline))
	fmt.Fprintf(&b, `<text x="10" y="38" fill="#555">numbering as each outline's drawing (whichreg catalog show); check against the maker's datasheet</text>`+"\n")
	for _, l := range links {
		if l.Old > 0 {
			fmt.Fprintf(&b, `<line x1="%g" y1="%g" x2="%g" y2="%g" stroke="#c0392b" stroke-width="2"/>`+"\n", x(l.Old-1), top+22, x(l.New-1), top+h-22)
		}
	}
	pad := func(i int, y float64, num, fn, fill string) {
		fmt.Fprintf(&b, `<circle cx="%g" cy="%g" r="16" fill="%s" stroke="black"/><text x="%g" y="%g" text-anchor="middle">%s</text>`+"\n", x(i), y, fill, x(i), y+4, xml(num))
		fmt.Fprintf(&b, `<text x="%g" y="%g" text-anchor="middle" font-weight="bold">%s</text>`+"\n", x(i), labelY(y, top), xml(fn))
	}
	for i, fn := range oldT {
		pad(i, top, termName(i, oldT, orig), fn, "#f2f2f2")
	}
	for i, fn := range newT {
		pad(i, top+h, termName(i, newT, chosen), fn, "#dbe9ff")
	}
	b.WriteString("</svg>\n")
	return []byte(b.String())
}

// termName is a terminal's number, or "can" for a case terminal.
func termName(i int, t []string, h infer.Hypothesis) string {
	if i == len(t)-1 && h.Outline != nil && h.Outline.CaseTerminal && len(t) > len(h.Package.Pins) {
		return "can"
	}
	return fmt.Sprint(i + 1)
}

// labelY puts a function label above the old pads and below the new ones.
func labelY(y, top float64) float64 {
	if y == top {
		return y - 24
	}
	return y + 34
}

func xml(s string) string {
	return strings.NewReplacer("&", "&amp;", "<", "&lt;", ">", "&gt;", `"`, "&quot;").Replace(s)
}

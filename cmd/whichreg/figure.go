package main

import (
	"fmt"
	"math"
	"strings"

	"github.com/whichreg/whichreg/infer/replace"
)

// inputFigure draws the regulator's input over two mains cycles at the worst
// corner (low mains, full load, low capacitance), with the level the chosen
// part needs (output plus dropout) and the margin marked, as SVG.
func inputFigure(sres *replace.Result, chosen *replace.Replacement) ([]byte, error) {
	cd := sres.Conditions
	if cd.Rectifier == nil || cd.Corners == nil {
		return nil, fmt.Errorf("the figure needs the rectifier: give [input] rectifier, secondary_vrms and filter_uf")
	}
	wc := cd.Corners.WorstTrough
	ts, vs, err := cd.Rectifier.At(wc).Waveform(2)
	if err != nil {
		return nil, err
	}
	need := 0.0
	if ch := chosen.Check(replace.CheckDropout); ch != nil && ch.Limit != nil {
		need = *ch.Limit
	}
	thr := cd.VoutV + need
	lo, hi := thr, vs[0]
	for _, v := range vs {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	lo, hi = math.Floor(lo-1), math.Ceil(hi+0.5)
	const W, H, L, R, T, B = 720.0, 360.0, 60.0, 20.0, 40.0, 50.0
	x := func(t float64) float64 { return L + (W-L-R)*t/ts[len(ts)-1] }
	y := func(v float64) float64 { return T + (H-T-B)*(hi-v)/(hi-lo) }
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%g" height="%g" viewBox="0 0 %g %g" font-family="sans-serif" font-size="12">`+"\n", W, H, W, H)
	fmt.Fprintf(&b, `<rect width="%g" height="%g" fill="white"/>`+"\n", W, H)
	fmt.Fprintf(&b, `<text x="%g" y="20" font-size="14">Regulator input at %s: %s</text>`+"\n", L, xmlEscape(wc.Name), xmlEscape(chosen.Label()))
	for v := lo; v <= hi+1e-9; v++ {
		fmt.Fprintf(&b, `<line x1="%g" y1="%.1f" x2="%g" y2="%.1f" stroke="#ddd"/><text x="%g" y="%.1f" text-anchor="end">%g V</text>`+"\n", L, y(v), W-R, y(v), L-6, y(v)+4, v)
	}
	for i := 0; i <= 4; i++ {
		t := ts[len(ts)-1] * float64(i) / 4
		fmt.Fprintf(&b, `<text x="%.1f" y="%g" text-anchor="middle">%.0f ms</text>`+"\n", x(t), H-B+18, t*1e3)
	}
	var pts []string
	step := max(1, len(ts)/1000)
	for i := 0; i < len(ts); i += step {
		pts = append(pts, fmt.Sprintf("%.1f,%.1f", x(ts[i]), y(vs[i])))
	}
	fmt.Fprintf(&b, `<polyline fill="none" stroke="#1f5fbf" stroke-width="2" points="%s"/>`+"\n", strings.Join(pts, " "))
	fmt.Fprintf(&b, `<line x1="%g" y1="%.1f" x2="%g" y2="%.1f" stroke="#c0392b" stroke-dasharray="6 4" stroke-width="1.5"/>`+"\n", L, y(thr), W-R, y(thr))
	fmt.Fprintf(&b, `<text x="%g" y="%.1f" fill="#c0392b" text-anchor="end">needed: %.2f V out + %.2f V = %.2f V</text>`+"\n", W-R, y(thr)-6, cd.VoutV, need, thr)
	margin := cd.TroughV - thr
	fmt.Fprintf(&b, `<text x="%g" y="%g">trough %.2f V, margin %+.2f V</text>`+"\n", L, H-12, cd.TroughV, margin)
	b.WriteString("</svg>\n")
	return []byte(b.String()), nil
}

func xmlEscape(s string) string {
	return strings.NewReplacer("&", "&amp;", "<", "&lt;", ">", "&gt;", `"`, "&quot;").Replace(s)
}

package record

import (
	"encoding/json"
	"fmt"
	"io"
	"sort"
	"strings"

	"github.com/whichreg/whichreg/infer/replace"
)

// Images are the drawings a Markdown record links to, as paths relative to
// the record's own folder ("" = none).
type Images struct {
	Input  string // the input waveform at the worst corner
	Pinout string // old and new pinouts with the lead-to-pad mapping
}

// WriteJSON writes the record as indented JSON with the schema name.
func WriteJSON(w io.Writer, rec Record) error {
	doc := struct {
		Schema string `json:"schema"`
		Record
	}{"whichreg/record/v1", rec}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(doc)
}

// WriteMarkdown writes the record as Markdown.
func WriteMarkdown(w io.Writer, rec Record, img Images) error {
	m := &mdw{w: w}
	ref := rec.Ref
	if ref == "" {
		ref = "(no reference)"
	}
	m.f("# Regulator substitution record: %s\n\n", esc(ref))
	if rec.Override != "" {
		m.f("> **OVERRIDE — %s %s is unsuitable in this circuit** (%s). Recorded at the technician's request: %s\n\n",
			rec.Chosen.Family, rec.Chosen.Package, esc(rec.Chosen.Summary), esc(rec.Override))
	}
	for _, s := range rec.Warnings {
		m.f("> **Warning:** %s\n\n", esc(s))
	}
	m.f("| | |\n| --- | --- |\n")
	if rec.Equipment != "" {
		m.f("| Equipment | %s |\n", esc(rec.Equipment)) // no empty row: it would read as a bare heading
	}
	m.f("| Reference | %s |\n| Date | %s |\n| Evidence file | %s |\n| Tool | %s |\n| Catalog | sha256 %s |\n\n",
		esc(ref), rec.Date, esc(rec.EvidenceFile), rec.Tool, rec.CatalogSHA256)
	m.f("## Safety\n")
	for _, s := range rec.Safety {
		m.f("- %s\n", s)
	}
	if len(rec.BenchNotes) > 0 {
		m.f("\n## Bench notes\n")
		for _, s := range rec.BenchNotes {
			m.f("- %s\n", esc(s))
		}
	}
	m.f("\n## Evidence as measured\n")
	writeEvidence(m, rec)
	writeIdentification(m, rec)
	writeChosen(m, rec, img)
	m.f("\n## Runners-up and why not\n")
	if len(rec.RunnersUp) == 0 {
		m.f("- none\n")
	}
	for _, r := range rec.RunnersUp {
		m.f("- %s (%s): %s\n", r.Candidate, r.Verdict, esc(r.WhyNot))
	}
	writeConditions(m, rec)
	m.f("\n## Assumptions and defaults\n")
	if len(rec.Assumptions) == 0 {
		m.f("- none\n")
	}
	for _, a := range rec.Assumptions {
		m.f("- %s\n", esc(a))
	}
	m.f("\n## Sign-off\n")
	m.f("| | name | date |\n| --- | --- | --- |\n| Fitted by | | |\n| Verified by | | |\n")
	m.f("\nMeasured after fitting: output ______ V at full load; case ______ °C after 10 minutes; output ripple ______ mV p-p.\n")
	return m.err
}

func writeIdentification(m *mdw, rec Record) {
	m.f("\n## Identification\n")
	m.f("| rank | probability | candidate | score |\n| ---: | ---: | --- | ---: |\n")
	for i, cd := range rec.Identification {
		m.f("| %d | %s | %s %s %s | %+.2f |\n", i+1, pct(cd.Probability), cd.Family, cd.Package, voutText(cd.VoutV), cd.Score)
	}
	m.f("| – | %s | not in the catalog | |\n\n", pct(rec.NotInCatalog))
	for _, cd := range rec.Identification {
		m.f("Reasons for %s %s %s (score %+.2f):\n\n", cd.Family, cd.Package, voutText(cd.VoutV), cd.Score)
		for _, r := range cd.Reasons {
			m.f("- %+.2f %s: %s\n", r.Weight, r.Evidence, esc(r.Text))
		}
		m.f("\n")
	}
	for _, c := range rec.Conflicts {
		m.f("- conflict: %s\n", esc(c))
	}
	o := rec.Original
	m.f("\nOriginal taken as **%s %s %s**", o.Family, o.Package, voutText(o.VoutV))
	if o.Named {
		m.f(" (named by the technician).\n")
	} else {
		m.f(" (identification's leader, %s).\n", pct(o.Probability))
	}
}

func writeChosen(m *mdw, rec Record, img Images) {
	c := rec.Chosen
	m.f("\n## Chosen replacement: %s %s %s — %s\n\n", c.Family, c.Package, voutText(c.VoutV), c.Verdict)
	m.f("%s\n\n", esc(c.Summary))
	if len(c.OrderCodes) > 0 {
		m.f("Order codes (examples from the makers' tables; pick the voltage and package): %s. Confirm against the maker's current datasheet.\n\n", strings.Join(c.OrderCodes, ", "))
	}
	m.f("| check | value | limit | margin | status | why |\n| --- | --- | --- | ---: | --- | --- |\n")
	for _, ch := range c.Checks {
		m.f("| %s | %s | %s | %+.2f | %s | %s |\n", ch.Name, esc(ch.ValueText), esc(ch.LimitText), ch.Margin, ch.Status, esc(ch.Text))
	}
	m.f("\nInstall:\n")
	switch {
	case c.Verdict == replace.Unsuitable:
		m.f("- none: the part fails the checks marked fail above; no install notes are given for it\n")
	case len(c.Install) == 0:
		m.f("- none beyond the usual\n")
	}
	if c.Verdict != replace.Unsuitable {
		for _, in := range c.Install {
			m.f("- %s\n", esc(in))
		}
	}
	if c.Rewire {
		m.f("\nLead mapping (new lead → old pad):\n\n")
		for _, l := range c.LeadMap {
			if l.Old > 0 {
				m.f("- new %d (%s) → old pad %d\n", l.New, l.Fn, l.Old)
			} else {
				m.f("- new %d (%s) → no old pad\n", l.New, l.Fn)
			}
		}
		if img.Pinout != "" {
			m.f("\n![old and new pinouts with the lead mapping](%s)\n", img.Pinout)
		}
	}
	if img.Input != "" {
		m.f("\n![input at the worst corner](%s)\n", img.Input)
	}
}

func writeConditions(m *mdw, rec Record) {
	cd := rec.Conditions
	s := ""
	if rec.negative {
		s = "-"
	}
	m.f("\n## Worst-corner numbers\n")
	load := fmt.Sprintf("%.3g to %.3g A", cd.LoadMinA, cd.LoadMaxA)
	if cd.LoadAssumed {
		load += " (full load assumed)"
	}
	m.f("| | |\n| --- | --- |\n| Output | %s%.2f V, load %s |\n| Lowest input | %s%.2f V (%s) |\n| Highest input | %s%.1f V (%s) |\n| Mean input at full load | %s%.2f V (low mains) to %s%.2f V (high mains) |\n| Ambient | %g °C |\n",
		s, cd.VoutV, load, s, cd.TroughV, esc(cd.TroughAt), s, cd.PeakV, esc(cd.PeakAt), s, cd.ColdInV, s, cd.HotInV, cd.AmbientC)
	sink := "free air (no heat sink)"
	if cd.HeatsinkCW > 0 {
		sink = fmt.Sprintf("%g °C/W", cd.HeatsinkCW)
	}
	bond := "not bonded to chassis"
	if cd.Grounded {
		bond = "bonded to chassis"
	}
	m.f("| Heat sink | %s, insulator %s, %s |\n", sink, cd.Insulator, bond)
	if cd.OldTabV != nil {
		m.f("| Old tab or can | %+.2f V |\n", *cd.OldTabV)
	}
	if cd.BypassOhm > 0 {
		m.f("| Bypass resistor | %g Ω |\n", cd.BypassOhm)
	}
	if cd.TransientV > 0 {
		m.f("| Transient | %s%.1f V |\n", s, cd.TransientV)
	}
}

// writeEvidence lists every value the technician gave, signs kept.
func writeEvidence(m *mdw, rec Record) {
	b, _ := json.Marshal(rec.Evidence)
	var doc map[string]any
	_ = json.Unmarshal(b, &doc)
	var rows []string
	var walk func(prefix string, v any)
	walk = func(prefix string, v any) {
		switch x := v.(type) {
		case map[string]any:
			keys := make([]string, 0, len(x))
			for k := range x {
				keys = append(keys, k)
			}
			sort.Strings(keys)
			for _, k := range keys {
				p := k
				if prefix != "" {
					p = prefix + "." + k
				}
				walk(p, x[k])
			}
		case nil:
		default:
			val := fmt.Sprint(x)
			if prefix == "mount.heatsink_c_per_w" && val == "0" {
				val = "0 (free air)" // the evidence's own word for no heat sink
			}
			rows = append(rows, fmt.Sprintf("| %s | %s |", prefix, esc(val)))
		}
	}
	walk("", doc)
	m.f("| key | value |\n| --- | --- |\n")
	for _, r := range rows {
		m.f("%s\n", r)
	}
}

// mdw writes formatted text and keeps the first error.
type mdw struct {
	w   io.Writer
	err error
}

func (m *mdw) f(format string, args ...any) {
	if m.err == nil {
		_, m.err = fmt.Fprintf(m.w, format, args...)
	}
}

func esc(s string) string { return strings.ReplaceAll(s, "|", "\\|") }

func pct(p float64) string {
	if p >= 0.0005 {
		return fmt.Sprintf("%.1f %%", 100*p)
	}
	return "<0.1 %"
}

func voutText(v *float64) string {
	if v == nil {
		return ""
	}
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.2f", *v), "0"), ".") + " V"
}

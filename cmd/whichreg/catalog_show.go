package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"
	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/report"
)

type catalogShowOptions struct {
	app    *App
	Format string
	ID     string
}

func newCatalogShowCmd(app *App, runF func(*catalogShowOptions) error) *cobra.Command {
	opts := &catalogShowOptions{app: app}
	cmd := &cobra.Command{
		Use:   "show ID",
		Short: "Show every field of a family and draw each package's pinout",
		Example: `  whichreg catalog show 317
  whichreg catalog show 79xx --format json`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.ID = args[0]
			if runF != nil {
				return runF(opts)
			}
			return catalogShowRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// catalogShowDoc is the JSON document of `catalog show`: the family and
// the outlines it comes in.
type catalogShowDoc struct {
	Schema   string       `json:"schema"`
	Family   familyDoc    `json:"family"`
	Outlines []outlineDoc `json:"outlines"`
}

func catalogShowRun(opts *catalogShowOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	f, read, alts := catalog.Resolve(c, opts.ID)
	if f == nil && len(alts) > 0 {
		var ids []string
		for _, h := range alts {
			ids = append(ids, h.Family.ID)
		}
		return inputError(fmt.Errorf("%q reads equally well as %s", opts.ID, strings.Join(ids, ", ")),
			"give more of the marking, or one of those ids; 'whichreg catalog find MARKING' shows how each reads")
	}
	if f == nil {
		return inputError(fmt.Errorf("no family %q in the catalog", opts.ID), suggestIDs(c, opts.ID))
	}
	out := opts.app.IO.Out
	if opts.Format == "json" {
		d := catalogShowDoc{Schema: report.Schema("catalog-show"), Family: familyDocOf(f), Outlines: []outlineDoc{}}
		seen := map[string]bool{}
		for _, p := range f.Packages {
			if o := c.Outline(p.Outline); o != nil && !seen[o.Name] {
				seen[o.Name] = true
				d.Outlines = append(d.Outlines, outlineDocOf(o))
			}
		}
		return writeJSON(out, d)
	}
	if read.Family != nil {
		report.Fill(out, fmt.Sprintf("%s is a %s: %s", opts.ID, f.ID, read.Detail), opts.app.Width(), "", "  ")
		fmt.Fprintln(out)
	}
	writeFamily(out, opts.app.Width(), c, f)
	return nil
}

func suggestIDs(c *catalog.Catalog, id string) string {
	var near []string
	for _, f := range c.Sorted() {
		if strings.Contains(strings.ToLower(f.ID), strings.ToLower(strings.TrimRight(id, "xX"))) {
			near = append(near, f.ID)
		}
	}
	if len(near) > 0 {
		return "did you mean " + strings.Join(near, ", ") + "? 'whichreg catalog list' lists every id"
	}
	return "'whichreg catalog list' lists every id; 'whichreg catalog find MARKING' searches by marking"
}

// fieldWidth is the indent of a field's value in 'catalog show'.
const fieldWidth = 17

// field writes "  label:  value", the value wrapped under itself.
func field(w io.Writer, width int, label, value string) {
	report.Fill(w, value, width, report.Pad("  "+label+":", fieldWidth-1)+" ", strings.Repeat(" ", fieldWidth))
}

func writeFamily(w io.Writer, width int, c *catalog.Catalog, f *catalog.Family) {
	report.Fill(w, f.ID+" — "+f.Title, width, "", "  ")
	from := f.Origin
	if f.Replaces != "" {
		from += " (replaces the entry from " + f.Replaces + ")"
	}
	field(w, width, "from", from)
	tol := report.Percent(f.Tolerance)
	switch {
	case f.Kind == "non-regulator":
		field(w, width, "what it is", string(f.Device)+": a look-alike that sits where a regulator might; never a replacement")
		if len(f.ControlDropV) == 2 {
			field(w, width, "control drop", report.Num(f.ControlDropV[0], "V")+" to "+report.Num(f.ControlDropV[1], "V")+" conducting")
		}
		if f.VrefV > 0 {
			field(w, width, "reference", report.Num(f.VrefV, "V")+" ±"+tol)
		}
		if f.VinMaxV > 0 {
			field(w, width, "voltage", report.Num(f.VinMaxV, "V")+" max")
		}
	case f.Adjustable():
		pass := string(f.Pass)
		if pass == "" {
			pass = "npn"
		}
		field(w, width, "polarity", string(f.Polarity)+", "+string(f.Kind)+", pass element "+pass)
		ref := report.Num(f.VrefV, "V") + " ±" + tol + " (OUT to ADJ)"
		if f.VoutMaxV > 0 {
			ref += "; output up to " + report.Num(f.VoutMaxV, "V")
		}
		field(w, width, "reference", ref)
		field(w, width, "ADJ current", report.Num(f.IadjUA*1e-6, "A")+" max"+typ(f.IadjTypUA*1e-6, "A"))
		field(w, width, "differential", report.Num(f.VdiffMaxV, "V")+" max input-output")
		if f.VinMaxV > 0 {
			field(w, width, "input", report.Num(f.VinMaxV, "V")+" max")
		}
	default:
		pass := string(f.Pass)
		if pass == "" {
			pass = "npn"
		}
		field(w, width, "polarity", string(f.Polarity)+", "+string(f.Kind)+", pass element "+pass)
		field(w, width, "outputs", outputsText(f)+" ±"+tol)
		in := report.Num(f.VinMaxV, "V") + " max"
		if f.VinMaxHighV > 0 {
			in += " (" + report.Num(f.VinMaxHighV, "V") + " for " + report.Num(f.VinMaxHighFromV, "V") + " and up)"
		}
		if f.TransientMaxV > 0 {
			in += ", " + report.Num(f.TransientMaxV, "V") + " transient (load dump)"
		}
		field(w, width, "input", in)
		field(w, width, "ground current", report.Num(f.IqMA*1e-3, "A")+" max"+typ(f.IqTypMA*1e-3, "A"))
	}
	field(w, width, "current", report.Num(f.CurrentA, "A")+" rated")
	if f.Kind != "non-regulator" {
		field(w, width, "dropout", report.Num(f.DropoutV, "V")+" at rated current")
		field(w, width, "minimum load", report.Num(f.MinLoadMA*1e-3, "A"))
	}
	field(w, width, "junction", report.Num(f.TjMaxC, "°C")+" max")
	if f.Kind != "non-regulator" {
		field(w, width, "output cap", coutText(f.Cout))
	}
	if f.Efficiency > 0 {
		field(w, width, "efficiency", report.Percent(f.Efficiency))
	}
	since := "unknown"
	if f.Since > 0 {
		since = fmt.Sprint(f.Since)
	}
	field(w, width, "status", fmt.Sprintf("%s; since %s; commonness %d of 5", f.Status, since, f.Commonness))
	field(w, width, "markings", strings.Join(f.Markings, " "))
	field(w, width, "source", f.Source)
	for _, n := range f.Notes {
		field(w, width, "note", n)
	}
	for i := range f.Packages {
		p := &f.Packages[i]
		o := c.Outline(p.Outline)
		fmt.Fprintln(w)
		report.Fill(w, fmt.Sprintf("package %s: %s, θJC %s, θJA %s, %s", p.Label(), report.Num(f.Current(p), "A"),
			report.Num(p.ThetaJC, "°C/W"), report.Num(p.ThetaJA, "°C/W"), f.StatusOf(p)), width, "  ", "    ")
		if p.Note != "" {
			report.Fill(w, p.Note, width, "  note: ", "        ")
		}
		for k, line := range strings.Split(strings.TrimRight(catalog.Drawing(o, p), "\n"), "\n") {
			if k == 0 {
				// The caption is prose: it wraps; the drawing below does not.
				report.Fill(w, line, width, "    ", "      ")
				continue
			}
			fmt.Fprintf(w, "    %s\n", line)
		}
	}
}

// typ writes " (X typ)" for a typical figure, nothing when it is not given.
func typ(v float64, unit string) string {
	if v == 0 {
		return ""
	}
	return " (" + report.Num(v, unit) + " typ)"
}

func coutText(c catalog.COut) string {
	if c.MinUF == 0 && c.ESRMinOhm == 0 && c.ESRMaxOhm == 0 {
		s := "not needed for stability"
		if !c.CeramicOK {
			s += "; not for ceramic alone"
		}
		if c.MaxUF > 0 {
			s += "; at most " + report.Num(c.MaxUF*1e-6, "F")
		}
		return s
	}
	s := "at least " + report.Num(c.MinUF*1e-6, "F")
	switch {
	case c.ESRMinOhm > 0 && c.ESRMaxOhm > 0:
		s += ", ESR " + report.Num(c.ESRMinOhm, "Ω") + " to " + report.Num(c.ESRMaxOhm, "Ω")
	case c.ESRMinOhm > 0:
		s += ", ESR at least " + report.Num(c.ESRMinOhm, "Ω")
	case c.ESRMaxOhm > 0:
		s += ", ESR at most " + report.Num(c.ESRMaxOhm, "Ω")
	}
	if c.CeramicOK {
		s += "; ceramic OK"
	} else {
		s += "; not stable with ceramic alone"
	}
	return s
}

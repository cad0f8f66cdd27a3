package main

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

func newCatalogCmd(app *App) *cobra.Command {
	cmd := &cobra.Command{
		Use:   "catalog",
		Short: "Browse, search and check the regulator catalog",
		Long: `The catalog lists the regulator families whichreg knows, the packages each comes
in with its lead-by-lead pinout, and the datasheet figures behind every check.
The built-in catalog can be extended with --catalog FILE or with *.toml files in
the whichreg/catalog folder of your configuration directory.`,
	}
	cmd.AddCommand(newCatalogListCmd(app, nil), newCatalogShowCmd(app, nil), newCatalogFindCmd(app, nil),
		newCatalogCheckCmd(app, nil), newCatalogInitCmd(app, nil))
	return cmd
}

type catalogListOptions struct {
	app      *App
	Format   string
	Polarity string
	Kind     string
	Outline  string
	Status   string
}

func newCatalogListCmd(app *App, runF func(*catalogListOptions) error) *cobra.Command {
	opts := &catalogListOptions{app: app}
	cmd := &cobra.Command{
		Use:   "list",
		Short: "List the families, optionally filtered",
		Example: `  whichreg catalog list
  whichreg catalog list --polarity negative --outline TO-220
  whichreg catalog list --status active --format json`,
		Args: cobra.NoArgs,
		RunE: func(cmd *cobra.Command, args []string) error {
			if runF != nil {
				return runF(opts)
			}
			return catalogListRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	addEnumFlag(cmd, &opts.Polarity, "polarity", "only this polarity", "", "positive", "negative")
	addEnumFlag(cmd, &opts.Kind, "kind", "only this kind", "", "fixed", "adjustable")
	addEnumFlag(cmd, &opts.Status, "status", "only this production status", "", "active", "obsolete", "scarce")
	cmd.Flags().StringVar(&opts.Outline, "outline", "", "only families sold in this `OUTLINE` (name or alias)")
	return cmd
}

func catalogListRun(opts *catalogListOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	if opts.Outline != "" && c.Outline(opts.Outline) == nil {
		return inputError(fmt.Errorf("unknown outline %q", opts.Outline), "see 'whichreg catalog list' and the outline names in 'whichreg catalog show ID'")
	}
	var fams []*catalog.Family
	for _, f := range c.Sorted() {
		if (opts.Polarity != "" && string(f.Polarity) != opts.Polarity) || (opts.Kind != "" && string(f.Kind) != opts.Kind) ||
			(opts.Status != "" && string(f.Status) != opts.Status) || (opts.Outline != "" && f.Package(c, opts.Outline) == nil) {
			continue
		}
		fams = append(fams, f)
	}
	out := opts.app.IO.Out
	if opts.Format == "json" {
		if fams == nil {
			fams = []*catalog.Family{}
		}
		return writeJSON(out, fams)
	}
	var tw io.Writer = out
	var flush func() error
	if isTerminal(out) {
		t := tabwriter.NewWriter(out, 0, 4, 2, ' ', 0)
		fmt.Fprintln(t, "ID\tPOLARITY\tKIND\tCURRENT\tOUTPUT\tPACKAGES\tSTATUS\tTITLE")
		tw, flush = t, t.Flush
	}
	for _, f := range fams {
		fmt.Fprintf(tw, "%s\t%s\t%s\t%g A\t%s\t%s\t%s\t%s\n", f.ID, f.Polarity, f.Kind, f.CurrentA, outputsText(f), packagesText(f), f.Status, f.Title)
	}
	if flush == nil {
		return nil
	}
	return flush()
}

func outputsText(f *catalog.Family) string {
	sign := ""
	if f.Negative() {
		sign = "-"
	}
	if f.Adjustable() {
		return fmt.Sprintf("%s%g V ref", sign, f.VrefV)
	}
	var vs []string
	for _, v := range f.OutputsV {
		vs = append(vs, sign+fmt.Sprint(v))
	}
	return strings.Join(vs, "/") + " V"
}

func packagesText(f *catalog.Family) string {
	var ps []string
	for _, p := range f.Packages {
		ps = append(ps, p.Outline)
	}
	return strings.Join(ps, ",")
}

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

// showJSON is the JSON shape of `catalog show`: the family and its outlines.
type showJSON struct {
	*catalog.Family
	Outlines []*catalog.Outline `json:"outlines"`
}

func catalogShowRun(opts *catalogShowOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	f := c.Family(opts.ID)
	if f == nil {
		return inputError(fmt.Errorf("no family %q in the catalog", opts.ID), suggestIDs(c, opts.ID))
	}
	out := opts.app.IO.Out
	if opts.Format == "json" {
		sj := showJSON{Family: f}
		for _, p := range f.Packages {
			sj.Outlines = append(sj.Outlines, c.Outline(p.Outline))
		}
		return writeJSON(out, sj)
	}
	writeFamily(out, c, f)
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

func writeFamily(w io.Writer, c *catalog.Catalog, f *catalog.Family) {
	fmt.Fprintf(w, "%s — %s\n", f.ID, f.Title)
	fmt.Fprintf(w, "  from:          %s", f.Origin)
	if f.Replaces != "" {
		fmt.Fprintf(w, " (replaces the entry from %s)", f.Replaces)
	}
	fmt.Fprintln(w)
	pass := f.Pass
	if pass == "" {
		pass = "npn"
	}
	fmt.Fprintf(w, "  polarity:      %s, %s, pass element %s\n", f.Polarity, f.Kind, pass)
	if f.Adjustable() {
		fmt.Fprintf(w, "  reference:     %g V ±%g %% (OUT to ADJ); output up to %g V\n", f.VrefV, f.Tolerance*100, f.VoutMaxV)
		fmt.Fprintf(w, "  ADJ current:   %g µA max (%g typ)\n", f.IadjUA, f.IadjTypUA)
		fmt.Fprintf(w, "  differential:  %g V max input-output\n", f.VdiffMaxV)
		if f.VinMaxV > 0 {
			fmt.Fprintf(w, "  input:         %g V max\n", f.VinMaxV)
		}
	} else {
		fmt.Fprintf(w, "  outputs:       %s ±%g %%\n", outputsText(f), f.Tolerance*100)
		fmt.Fprintf(w, "  input:         %g V max", f.VinMaxV)
		if f.VinMaxHighV > 0 {
			fmt.Fprintf(w, " (%g V for %g V and up)", f.VinMaxHighV, f.VinMaxHighFromV)
		}
		fmt.Fprintln(w)
		fmt.Fprintf(w, "  ground current: %g mA max (%g typ)\n", f.IqMA, f.IqTypMA)
	}
	fmt.Fprintf(w, "  current:       %g A rated\n", f.CurrentA)
	fmt.Fprintf(w, "  dropout:       %g V at rated current\n", f.DropoutV)
	fmt.Fprintf(w, "  minimum load:  %g mA\n", f.MinLoadMA)
	fmt.Fprintf(w, "  junction:      %g °C max\n", f.TjMaxC)
	fmt.Fprintf(w, "  output cap:    %s\n", coutText(f.Cout))
	if f.Efficiency > 0 {
		fmt.Fprintf(w, "  efficiency:    %g %%\n", f.Efficiency*100)
	}
	fmt.Fprintf(w, "  status:        %s; since %d; commonness %d of 5\n", f.Status, f.Since, f.Commonness)
	fmt.Fprintf(w, "  markings:      %s\n", strings.Join(f.Markings, " "))
	fmt.Fprintf(w, "  source:        %s\n", f.Source)
	for _, n := range f.Notes {
		fmt.Fprintf(w, "  note:          %s\n", n)
	}
	for i := range f.Packages {
		p := &f.Packages[i]
		o := c.Outline(p.Outline)
		fmt.Fprintf(w, "\n  package %s: %g A, theta_jc %g, theta_ja %g °C/W, %s\n", p.Outline, f.Current(p), p.ThetaJC, p.ThetaJA, f.StatusOf(p))
		if p.Note != "" {
			fmt.Fprintf(w, "  note: %s\n", p.Note)
		}
		for _, line := range strings.Split(strings.TrimRight(catalog.Drawing(o, p), "\n"), "\n") {
			fmt.Fprintf(w, "    %s\n", line)
		}
	}
}

func coutText(c catalog.COut) string {
	if c.MinUF == 0 && c.ESRMinOhm == 0 && c.ESRMaxOhm == 0 {
		s := "not needed for stability"
		if !c.CeramicOK {
			s += "; not for ceramic alone"
		}
		if c.MaxUF > 0 {
			s += fmt.Sprintf("; at most %g µF", c.MaxUF)
		}
		return s
	}
	s := fmt.Sprintf("at least %g µF", c.MinUF)
	if c.ESRMinOhm > 0 || c.ESRMaxOhm > 0 {
		s += fmt.Sprintf(", ESR %g–%g Ω", c.ESRMinOhm, c.ESRMaxOhm)
	}
	if c.CeramicOK {
		s += "; ceramic OK"
	} else {
		s += "; not stable with ceramic alone"
	}
	return s
}

type catalogFindOptions struct {
	app     *App
	Format  string
	Pattern string
}

func newCatalogFindCmd(app *App, runF func(*catalogFindOptions) error) *cobra.Command {
	opts := &catalogFindOptions{app: app}
	cmd := &cobra.Command{
		Use:   "find MARKING",
		Short: "Find families by a partial marking (? = one unreadable character, * = any run)",
		Long: `find matches what is legible on a part against the catalog's marking patterns.
Write ? for each character you cannot read and * for a run of unknown length.
Wildcard matches come first, most specific pattern first; fuzzy matches of the
legible characters follow.`,
		Example: `  whichreg catalog find '?M3?7'
  whichreg catalog find 7912
  whichreg catalog find 'LM3*K' --format json`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.Pattern = args[0]
			if runF != nil {
				return runF(opts)
			}
			return catalogFindRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// findHitJSON is one hit of `catalog find --format json`.
type findHitJSON struct {
	ID      string    `json:"id"`
	Title   string    `json:"title"`
	How     string    `json:"how"`
	Pattern string    `json:"pattern"`
	VoutV   []float64 `json:"vout_v"`
	Score   int       `json:"score"`
	Detail  string    `json:"detail"`
}

func catalogFindRun(opts *catalogFindOptions) error {
	c, err := opts.app.loadCatalog()
	if err != nil {
		return err
	}
	hits := catalog.Find(c, opts.Pattern)
	out := opts.app.IO.Out
	if opts.Format == "json" {
		res := []findHitJSON{}
		for _, h := range hits {
			v := h.VoutV
			if v == nil {
				v = []float64{}
			}
			res = append(res, findHitJSON{h.Family.ID, h.Family.Title, h.How, h.Pattern, v, h.Score, h.Detail})
		}
		return writeJSON(out, map[string]any{"query": opts.Pattern, "hits": res})
	}
	if len(hits) == 0 {
		fmt.Fprintf(out, "no family matches %q\n", opts.Pattern)
		if !catalog.Legible(catalog.NormalizeMarking(opts.Pattern)) {
			fmt.Fprintln(out, "(nothing legible in it: give at least one letter or digit)")
		}
		return nil
	}
	for i, h := range hits {
		fmt.Fprintf(out, "%2d. %-10s %-8s %s\n    %s\n", i+1, h.Family.ID, h.How, h.Family.Title, h.Detail)
	}
	return nil
}

type catalogCheckOptions struct {
	app    *App
	Format string
	Files  []string
}

func newCatalogCheckCmd(app *App, runF func(*catalogCheckOptions) error) *cobra.Command {
	opts := &catalogCheckOptions{app: app}
	cmd := &cobra.Command{
		Use:   "check [FILE...]",
		Short: "Lint catalog files: every problem with file:line:column and what to do",
		Long: `check loads the built-in catalog with the given files (or, with no files, the
built-in catalog and every user catalog) and reports every problem it finds.
It exits 1 when there is any.`,
		Example: `  whichreg catalog check
  whichreg catalog check my-parts.toml`,
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.Files = args
			if runF != nil {
				return runF(opts)
			}
			return catalogCheckRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// problemJSON is one lint problem in `catalog check --format json`.
type problemJSON struct {
	File    string `json:"file"`
	Line    int    `json:"line"`
	Col     int    `json:"col"`
	Key     string `json:"key"`
	Message string `json:"message"`
}

func catalogCheckRun(opts *catalogCheckOptions) error {
	files, errs := builtin.Files()
	names := opts.Files
	if len(names) == 0 {
		names = opts.app.catalogSources()
	}
	for _, n := range names {
		data, err := readLimited(n, "catalog", maxCatalogBytes)
		if err != nil {
			return err
		}
		f, e := catalog.Load(n, data)
		errs = append(errs, e...)
		files = append(files, f)
	}
	c := catalog.Merge(files...)
	errs = append(errs, catalog.Lint(c)...)
	out := opts.app.IO.Out
	if opts.Format == "json" {
		ps := []problemJSON{}
		for _, e := range errs {
			ps = append(ps, problemJSON{e.File, e.Line, e.Col, e.Key, e.Err.Error()})
		}
		if err := writeJSON(out, map[string]any{"families": len(c.Families), "outlines": len(c.Outlines), "problems": ps}); err != nil {
			return ioError(err)
		}
	} else if len(errs) == 0 {
		fmt.Fprintf(out, "ok: %d families, %d outlines, no problems\n", len(c.Families), len(c.Outlines))
	} else {
		for _, e := range errs {
			fmt.Fprintln(out, e)
		}
		fmt.Fprintf(out, "%d problem(s)\n", len(errs))
	}
	if len(errs) > 0 {
		return &exitError{code: exitInput, err: errPrinted}
	}
	return nil
}

type catalogInitOptions struct {
	app  *App
	File string
}

func newCatalogInitCmd(app *App, runF func(*catalogInitOptions) error) *cobra.Command {
	opts := &catalogInitOptions{app: app}
	cmd := &cobra.Command{
		Use:   "init [FILE]",
		Short: "Write a commented starter catalog (to stdout, or to FILE; never overwrites)",
		Example: `  whichreg catalog init my-parts.toml
  whichreg catalog check my-parts.toml`,
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.File = args[0]
			}
			if runF != nil {
				return runF(opts)
			}
			return writeOut(opts.app, opts.File, []byte(catalog.StarterFile), false)
		},
	}
	return cmd
}

// writeOut writes data to file atomically, or to stdout when file is "".
func writeOut(app *App, file string, data []byte, force bool) error {
	if file == "" || file == "-" {
		if _, err := app.IO.Out.Write(data); err != nil {
			return ioError(err)
		}
		return nil
	}
	if err := writeFileAtomic(file, data, force); err != nil {
		return err
	}
	fmt.Fprintf(app.IO.ErrOut, "wrote %s\n", file)
	return nil
}

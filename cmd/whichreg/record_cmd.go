package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"os"
	"sort"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
)

// safetyCautions are written into every record (DESIGN.md "Safety").
var safetyCautions = []string{
	"Mains voltage is present inside the equipment whenever it is plugged in, including fuse holders, switches and the transformer primary. Unplug it before working on it; measure powered circuits with one hand, insulated probes and, where appropriate, an isolating transformer.",
	"Filter capacitors hold their charge after switch-off. Discharge them through a resistor and confirm with a meter before touching the board or desoldering.",
	"Regulator tabs and cans are often live (a 79xx tab is its input, a 317 tab its output) and can short a rail to a grounded heat sink or chassis. Check the insulation with an ohmmeter before power-up.",
	"Regulators, heat sinks and bypass or load resistors get hot enough to burn. Let them cool before touching.",
	"Confirm the chosen part against the maker's current datasheet. Follow local electrical codes and qualified practice; where the work requires a licensed person, use one.",
}

type recordOptions struct {
	app      *App
	Format   string
	Choose   string
	Original string
	Output   string
	Figure   string
	Force    bool
	File     string
}

func newRecordCmd(app *App, runF func(*recordOptions) error) *cobra.Command {
	opts := &recordOptions{app: app}
	cmd := &cobra.Command{
		Use:   "record EVIDENCE.toml --choose ID[:OUTLINE]",
		Short: "Write the substitution record of the repair, with its checks",
		Long: `record writes what a technician files with the repair: the equipment and
reference, the evidence as measured, the identification (top five with their
reasons), the chosen replacement with its full check table and install notes,
the runners-up and why not, the worst-corner numbers and assumptions, the
safety cautions, the tool version, a hash of the catalog used, the date, and
lines for "fitted by" and "verified by".

With -o it writes through a temporary file and renames it; it refuses to
replace an existing file without --force, and on any error writes nothing.
--figure FILE.svg adds the input waveform at the worst corner with the
regulation threshold marked.`,
		Example: `  whichreg record testdata/demo/vending-lifted-ground.toml --choose 78xx:TO-220 -o vr1-record.md
  whichreg record board.toml --choose 2940 --format json -o record.json --figure input.svg`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.File = args[0]
			if opts.Choose == "" {
				return flagErrorf("--choose ID[:OUTLINE] is required: run 'whichreg swap %s' to see the candidates", opts.File)
			}
			if opts.Figure == "-" && (opts.Output == "" || opts.Output == "-") {
				return flagErrorf("--figure - writes the figure to stdout: give the record a file with -o FILE")
			}
			if runF != nil {
				return runF(opts)
			}
			return recordRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "markdown", "json")
	cmd.Flags().StringVar(&opts.Choose, "choose", "", "the chosen replacement `ID[:OUTLINE]`")
	cmd.Flags().StringVar(&opts.Original, "original", "", "the original part as `ID[:OUTLINE[:VOUT]]` instead of infer's leader")
	cmd.Flags().StringVarP(&opts.Output, "output", "o", "", "write the record to `FILE` (default, or -: standard output)")
	cmd.Flags().StringVar(&opts.Figure, "figure", "", "also write the input waveform as `FILE.svg` (-: standard output, with -o FILE)")
	cmd.Flags().BoolVar(&opts.Force, "force", false, "replace existing files")
	return cmd
}

// recordJSON is the content of a record.
type recordJSON struct {
	Title          string            `json:"title"`
	Ref            string            `json:"ref"`
	Equipment      string            `json:"equipment"`
	Date           string            `json:"date"`
	Tool           string            `json:"tool"`
	CatalogSHA256  string            `json:"catalog_sha256"`
	EvidenceFile   string            `json:"evidence_file"`
	Evidence       *infer.Evidence   `json:"evidence"`
	Identification []candidateJSON   `json:"identification"`
	NotInCatalog   float64           `json:"not_in_catalog"`
	Conflicts      []string          `json:"conflicts"`
	Original       originalJSON      `json:"original"`
	Chosen         replacementJSON   `json:"chosen"`
	RunnersUp      []runnerUpJSON    `json:"runners_up"`
	Conditions     infer.Conditions  `json:"conditions"`
	Assumptions    []string          `json:"assumptions"`
	Safety         []string          `json:"safety"`
	SignOff        map[string]string `json:"sign_off"`
}

type runnerUpJSON struct {
	Candidate string `json:"candidate"`
	Verdict   string `json:"verdict"`
	WhyNot    string `json:"why_not"`
}

func recordRun(o *recordOptions) error {
	st, err := prepareSwap(o.app, o.File, o.Original, true)
	if err != nil {
		return err
	}
	c, ev, ires, sres := st.cat, st.ev, st.ires, st.sres
	chosen, err := findChoice(c, sres, o.Choose)
	if err != nil {
		return err
	}
	rec := buildRecord(o.app, c, ev, ires, sres, chosen)
	var body []byte
	if o.Format == "json" {
		var buf bytes.Buffer
		if err := writeJSON(&buf, rec); err != nil {
			return ioError(err)
		}
		body = buf.Bytes()
	} else {
		var buf bytes.Buffer
		writeRecordMarkdown(&buf, rec, sres, chosen, o.Figure)
		body = buf.Bytes()
	}
	var fig []byte
	if o.Figure != "" {
		fig, err = inputFigure(sres, chosen)
		if err != nil {
			return inputError(fmt.Errorf("--figure: %v", err))
		}
	}
	return writeRecordFiles(o, body, fig)
}

// writeRecordFiles writes the record and figure, or nothing: if the second
// file cannot be written the first is removed again.
func writeRecordFiles(o *recordOptions, body, fig []byte) error {
	if o.Figure == "-" {
		// The figure goes to stdout, the record to its file (checked in RunE).
		if err := writeFileAtomic(o.Output, body, o.Force); err != nil {
			return err
		}
		fmt.Fprintf(o.app.IO.ErrOut, "wrote %s\n", o.Output)
		_, err := o.app.IO.Out.Write(fig)
		return err
	}
	if o.Output == "" || o.Output == "-" {
		if fig != nil {
			if err := writeFileAtomic(o.Figure, fig, o.Force); err != nil {
				return err
			}
			fmt.Fprintf(o.app.IO.ErrOut, "wrote %s\n", o.Figure)
		}
		_, err := o.app.IO.Out.Write(body)
		return err
	}
	if fig != nil && !o.Force {
		if _, err := os.Lstat(o.Figure); err == nil {
			return inputError(fmt.Errorf("%s already exists; not overwritten", o.Figure), "use --force to replace it")
		}
	}
	if err := writeFileAtomic(o.Output, body, o.Force); err != nil {
		return err
	}
	if fig != nil {
		if err := writeFileAtomic(o.Figure, fig, o.Force); err != nil {
			os.Remove(o.Output)
			return err
		}
		fmt.Fprintf(o.app.IO.ErrOut, "wrote %s\n", o.Figure)
	}
	fmt.Fprintf(o.app.IO.ErrOut, "wrote %s\n", o.Output)
	return nil
}

func findChoice(c *catalog.Catalog, sres *infer.SwapResult, spec string) (*infer.Replacement, error) {
	parts := strings.SplitN(spec, ":", 2)
	f := c.Family(parts[0])
	if f == nil {
		return nil, inputError(fmt.Errorf("--choose: no family %q in the catalog", parts[0]), suggestIDs(c, parts[0]))
	}
	var outline *catalog.Outline
	if len(parts) == 2 {
		if outline = c.Outline(parts[1]); outline == nil || f.Package(c, parts[1]) == nil {
			return nil, inputError(fmt.Errorf("--choose: %s does not come in %q (it comes in %s)", f.ID, parts[1], packagesText(f)))
		}
	}
	for i := range sres.Replacements {
		r := &sres.Replacements[i]
		if r.Family == f && (outline == nil || r.Outline == outline) {
			return r, nil
		}
	}
	return nil, inputError(fmt.Errorf("--choose: %s is not a candidate here (its polarity differs from the original's)", spec))
}

func buildRecord(app *App, c *catalog.Catalog, ev *infer.Evidence, ires *infer.Result, sres *infer.SwapResult, chosen *infer.Replacement) recordJSON {
	sj := swapJSONOf(sres)
	rec := recordJSON{
		Title: "Regulator substitution record", Ref: ev.Ref, Equipment: ev.Equipment,
		Date: app.Now().Format("2006-01-02"), Tool: "whichreg " + version, CatalogSHA256: c.Hash(),
		EvidenceFile: ev.File, Evidence: ev, NotInCatalog: round(ires.NotInCatalog, 6), Conflicts: ires.Conflicts,
		Original: sj.Original, Conditions: sres.Conditions, Assumptions: sres.Assumptions, Safety: safetyCautions,
		SignOff: map[string]string{"fitted_by": "", "fitted_date": "", "verified_by": "", "verified_date": "", "measured_output_v": "", "case_temp_after_10_min_c": ""},
	}
	ij := recordIdentOf(ires, 5)
	rec.Identification = ij.Candidates
	for i, r := range sres.Replacements {
		if &sres.Replacements[i] == chosen {
			rec.Chosen = sj.Replacements[i]
			continue
		}
		if len(rec.RunnersUp) < 4 && r.Family.StatusOf(r.Package) == "active" {
			why := ""
			for _, ch := range r.Checks {
				if ch.Check == r.Deciding {
					why = ch.Check + ": " + ch.Text
				}
			}
			rec.RunnersUp = append(rec.RunnersUp, runnerUpJSON{r.Label(), r.Verdict, why})
		}
	}
	if rec.Conflicts == nil {
		rec.Conflicts = []string{}
	}
	if rec.Assumptions == nil {
		rec.Assumptions = []string{}
	}
	return rec
}

func writeRecordMarkdown(w io.Writer, rec recordJSON, sres *infer.SwapResult, chosen *infer.Replacement, figure string) {
	ref := rec.Ref
	if ref == "" {
		ref = "(no reference)"
	}
	fmt.Fprintf(w, "# Regulator substitution record: %s\n\n", ref)
	fmt.Fprintf(w, "| | |\n| --- | --- |\n| Equipment | %s |\n| Reference | %s |\n| Date | %s |\n| Evidence file | %s |\n| Tool | %s |\n| Catalog | sha256 %s |\n\n",
		mdEscape(rec.Equipment), mdEscape(ref), rec.Date, mdEscape(rec.EvidenceFile), rec.Tool, rec.CatalogSHA256)
	fmt.Fprintln(w, "## Safety")
	for _, s := range rec.Safety {
		fmt.Fprintf(w, "- %s\n", s)
	}
	fmt.Fprintln(w, "\n## Evidence as measured")
	writeEvidenceTable(w, rec.Evidence)
	fmt.Fprintln(w, "\n## Identification")
	fmt.Fprintln(w, "| rank | probability | candidate | score |\n| ---: | ---: | --- | ---: |")
	for i, cd := range rec.Identification {
		fmt.Fprintf(w, "| %d | %s | %s %s %s | %+.2f |\n", i+1, pct(cd.Probability), cd.Family, cd.Package, voutText(cd.Vout), cd.Score)
	}
	fmt.Fprintf(w, "| – | %s | not in the catalog | |\n\n", pct(rec.NotInCatalog))
	for _, cd := range rec.Identification {
		fmt.Fprintf(w, "Reasons for %s %s %s (score %+.2f):\n\n", cd.Family, cd.Package, voutText(cd.Vout), cd.Score)
		for _, r := range cd.Reasons {
			fmt.Fprintf(w, "- %+.2f %s: %s\n", r.Weight, r.Evidence, mdEscape(r.Text))
		}
		fmt.Fprintln(w)
	}
	for _, c := range rec.Conflicts {
		fmt.Fprintf(w, "- conflict: %s\n", mdEscape(c))
	}
	fmt.Fprintf(w, "\nOriginal taken as **%s %s %s**", rec.Original.Family, rec.Original.Package, voutText(rec.Original.Vout))
	if rec.Original.FromInfer {
		fmt.Fprintf(w, " (infer's leader, %s).\n", pct(rec.Original.Probability))
	} else {
		fmt.Fprintln(w, " (named by the technician).")
	}
	fmt.Fprintf(w, "\n## Chosen replacement: %s — %s\n\n", chosen.Label(), chosen.Verdict)
	writeCheckTable(w, *chosen)
	fmt.Fprintln(w, "\nInstall:")
	for _, in := range chosen.Install {
		fmt.Fprintf(w, "- %s\n", mdEscape(in))
	}
	if figure != "" {
		fmt.Fprintf(w, "\n![input at the worst corner](%s)\n", figure)
	}
	fmt.Fprintln(w, "\n## Runners-up and why not")
	for _, r := range rec.RunnersUp {
		fmt.Fprintf(w, "- %s (%s): %s\n", r.Candidate, r.Verdict, mdEscape(r.WhyNot))
	}
	cd := rec.Conditions
	fmt.Fprintln(w, "\n## Worst-corner numbers")
	fmt.Fprintf(w, "| | |\n| --- | --- |\n| Output | %.2f V, load %.3g to %.3g A |\n| Lowest input | %.2f V (%s) |\n| Highest input | %.1f V (%s) |\n| Input at high mains, full load | %.2f V |\n| Ambient | %g °C |\n| Heat sink | %g °C/W, insulator %s, %s |\n",
		cd.VoutV, cd.LoadMinA, cd.LoadMaxA, cd.TroughV, mdEscape(cd.TroughAt), cd.PeakV, mdEscape(cd.PeakAt), cd.HotInV, cd.AmbientC, cd.HeatsinkCW, cd.Insulator, groundWord(cd.Grounded))
	if cd.BypassOhm > 0 {
		fmt.Fprintf(w, "| Bypass resistor | %g Ω |\n", cd.BypassOhm)
	}
	fmt.Fprintln(w, "\n## Assumptions and defaults")
	if len(rec.Assumptions) == 0 {
		fmt.Fprintln(w, "- none")
	}
	for _, a := range rec.Assumptions {
		fmt.Fprintf(w, "- %s\n", mdEscape(a))
	}
	fmt.Fprintln(w, "\n## Sign-off")
	fmt.Fprintln(w, "| | name | date |\n| --- | --- | --- |\n| Fitted by | | |\n| Verified by | | |")
	fmt.Fprintln(w, "\nMeasured after fitting: output ______ V at full load; case ______ °C after 10 minutes; output ripple ______ mV p-p.")
}

func voutText(v float64) string {
	if v == 0 {
		return ""
	}
	return fmt.Sprintf("%s V", trimV(v))
}

func trimV(v float64) string {
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.2f", v), "0"), ".")
}

func groundWord(g bool) string {
	if g {
		return "bonded to chassis"
	}
	return "not bonded to chassis"
}

// writeEvidenceTable lists every value the technician gave.
func writeEvidenceTable(w io.Writer, ev *infer.Evidence) {
	b, _ := json.Marshal(ev)
	var m map[string]any
	_ = json.Unmarshal(b, &m)
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
			rows = append(rows, fmt.Sprintf("| %s | %s |", prefix, mdEscape(fmt.Sprint(x))))
		}
	}
	walk("", m)
	fmt.Fprintln(w, "| key | value |\n| --- | --- |")
	for _, r := range rows {
		fmt.Fprintln(w, r)
	}
}

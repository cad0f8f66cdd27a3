package main

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/circuit"
	"github.com/whichreg/whichreg/infer/replace"
)

type swapOptions struct {
	app      *App
	Format   string
	Original string
	All      bool
	File     string
	Details  int
}

func newSwapCmd(app *App, runF func(*swapOptions) error) *cobra.Command {
	opts := &swapOptions{app: app}
	cmd := &cobra.Command{
		Use:   "swap EVIDENCE.toml",
		Short: "Rank current-production replacements checked against the circuit",
		Long: `swap takes the original from infer's leader (or from --original) and checks
every current-production candidate in every package: outline and footprint,
lead-by-lead function, tab potential against the mounting, polarity, output
voltage, current, input maximum at high mains and light load, dropout at the
ripple trough at low mains and full load, junction temperature, output-capacitor
stability and minimum load. Drop-in parts come first, then parts that need
work; unsuitable ones are shown with --all or when nothing else fits.

--original takes ID, ID:OUTLINE or ID:OUTLINE:VOUT, e.g. 78xx:TO-3:5.`,
		Example: `  whichreg swap testdata/demo/vending-lifted-ground.toml
  whichreg swap board.toml --original 317:TO-220 --format json
  whichreg swap board.toml --all`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.File = args[0]
			if runF != nil {
				return runF(opts)
			}
			return swapRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json", "markdown")
	cmd.Flags().StringVar(&opts.Original, "original", "", "the original part as `ID[:OUTLINE[:VOUT]]` instead of infer's leader")
	cmd.Flags().BoolVar(&opts.All, "all", false, "include obsolete, scarce and unsuitable candidates")
	cmd.Flags().IntVar(&opts.Details, "details", 3, "show the full check table of this many candidates (text)")
	return cmd
}

// resolveOriginal returns identification's result and the original: named
// with spec (ID[:OUTLINE[:VOUT]]), or identification's leader.
func resolveOriginal(c *catalog.Catalog, ev *infer.Evidence, spec string) (infer.Original, *infer.Result, error) {
	res, err := infer.Identify(c, ev, infer.Options{})
	if err != nil {
		return infer.Original{}, nil, inputError(err)
	}
	var named *infer.Hypothesis
	if spec != "" {
		h, err := infer.ParseVariant(c, spec)
		if err != nil {
			if id, _, _ := strings.Cut(spec, ":"); c.Family(id) == nil {
				return infer.Original{}, res, inputError(fmt.Errorf("--original: %v", err), suggestIDs(c, id))
			}
			return infer.Original{}, res, inputError(fmt.Errorf("--original: %v", err))
		}
		named = &h
	}
	orig, err := infer.ChooseOriginal(res, named)
	switch {
	case errors.Is(err, infer.ErrNotInCatalog):
		return orig, res, inputError(err, "name the original with --original ID[:OUTLINE[:VOUT]]")
	case err != nil:
		return orig, res, inputError(err)
	}
	return orig, res, nil
}

// swapState is what swap and record share: the catalog, the evidence (and
// its source text), the identification, and the checked replacements.
type swapState struct {
	cat  *catalog.Catalog
	ev   *infer.Evidence
	src  []byte
	ires *infer.Result
	sres *replace.Result
}

func prepareSwap(app *App, file, original string, all bool) (*swapState, error) {
	c, err := app.loadCatalog()
	if err != nil {
		return nil, err
	}
	ev, src, err := loadEvidenceSource(app, c, file)
	if err != nil {
		return nil, err
	}
	orig, ires, err := resolveOriginal(c, ev, original)
	if err != nil {
		return nil, err
	}
	sres, err := replace.Swap(c, ev, orig, replace.Options{All: all})
	if err != nil {
		return nil, inputError(fmt.Errorf("%s: %w", file, err))
	}
	return &swapState{c, ev, src, ires, sres}, nil
}

func swapRun(o *swapOptions) error {
	st, err := prepareSwap(o.app, o.File, o.Original, o.All)
	if err != nil {
		return err
	}
	res := st.sres
	out := o.app.IO.Out
	switch o.Format {
	case "json":
		return writeJSON(out, swapJSONOf(res))
	case "markdown":
		writeSwapMarkdown(out, res, o.Details)
	default:
		writeSwapText(out, res, o.Details)
	}
	return nil
}

// swapJSON is the JSON contract of `whichreg swap` (issue #5).
type swapJSON struct {
	Original     originalJSON       `json:"original"`
	Replacements []replacementJSON  `json:"replacements"`
	Assumptions  []string           `json:"assumptions"`
	Conditions   replace.Conditions `json:"conditions"`
	Hidden       int                `json:"hidden"`
}

type originalJSON struct {
	Family      string  `json:"family"`
	Package     string  `json:"package"`
	Vout        float64 `json:"vout"`
	Probability float64 `json:"probability"`
	FromInfer   bool    `json:"from_infer"`
}

type replacementJSON struct {
	Family   string            `json:"family"`
	Package  string            `json:"package"`
	Vout     float64           `json:"vout"`
	Verdict  replace.Verdict   `json:"verdict"`  // drop-in, needs-work or unsuitable
	Deciding replace.CheckName `json:"deciding"` // the check that decides the verdict
	// DecidingWhy says which rule chose it: fails, needs work or smallest margin.
	DecidingWhy string          `json:"deciding_why"`
	Checks      []replace.Check `json:"checks"`
	Install     []string        `json:"install"`
}

// sig rounds x to 6 significant figures, so that JSON output does not carry
// the last bits of the solver.
func sig(x float64) float64 {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return x
	}
	p := math.Pow(10, 5-math.Floor(math.Log10(math.Abs(x))))
	return math.Round(x*p) / p
}

func roundResult(r circuit.Result) circuit.Result {
	r.PeakV, r.TroughV, r.MeanV, r.RippleVpp = sig(r.PeakV), sig(r.TroughV), sig(r.MeanV), sig(r.RippleVpp)
	r.CapRippleARMS, r.DiodePeakA, r.ConductionDeg, r.LoadA = sig(r.CapRippleARMS), sig(r.DiodePeakA), sig(r.ConductionDeg), sig(r.LoadA)
	return r
}

// roundConditions rounds the worst-corner numbers for output.
func roundConditions(c replace.Conditions) replace.Conditions {
	c.VoutV, c.TroughV, c.PeakV, c.HotInV = sig(c.VoutV), sig(c.TroughV), sig(c.PeakV), sig(c.HotInV)
	if c.Corners != nil {
		cr := *c.Corners
		cr.Corners = append([]circuit.Corner(nil), cr.Corners...)
		for i := range cr.Corners {
			cr.Corners[i].Result = roundResult(cr.Corners[i].Result)
		}
		cr.WorstTrough.Result = roundResult(cr.WorstTrough.Result)
		cr.WorstPeak.Result = roundResult(cr.WorstPeak.Result)
		c.Corners = &cr
	}
	return c
}

func swapJSONOf(res *replace.Result) swapJSON {
	j := swapJSON{
		Original:    originalJSON{res.Original.Family.ID, res.Original.Package.Outline, signedVout(res.Original.Hypothesis), round(res.Original.Probability, 6), !res.Original.Named},
		Assumptions: res.Assumptions, Conditions: roundConditions(res.Conditions), Hidden: res.Hidden, Replacements: []replacementJSON{},
	}
	if j.Assumptions == nil {
		j.Assumptions = []string{}
	}
	for _, r := range res.Replacements {
		cs := make([]replace.Check, len(r.Checks))
		for i, ch := range r.Checks {
			ch.Margin = round(ch.Margin, 4)
			for _, p := range []**float64{&ch.Value, &ch.Limit} {
				if *p != nil {
					v := sig(**p)
					*p = &v
				}
			}
			cs[i] = ch
		}
		j.Replacements = append(j.Replacements, replacementJSON{r.Family.ID, r.Package.Outline, signedVout(r.Hypothesis), r.Verdict, r.Deciding, r.DecidingWhy, cs, r.Install})
	}
	return j
}

func originalLine(res *replace.Result) string {
	o := res.Original
	if !o.Named {
		s := fmt.Sprintf("original: %s, infer's leader at %s", o.Label(), pct(o.Probability))
		if o.Probability < 0.6 {
			s += " — below 60 %: identification is uncertain; make the suggested measurements or name it with --original"
		}
		return s
	}
	return fmt.Sprintf("original: %s (named with --original)", o.Label())
}

func writeSwapText(w io.Writer, res *replace.Result, details int) {
	cd := res.Conditions
	sign := res.Original.Family.SignText()
	fmt.Fprintln(w, originalLine(res))
	fmt.Fprintf(w, "circuit: %s%.2f V out, %.3g–%.3g A; input %s%.2f V at its lowest (%s), %s%.1f V at its highest (%s)\n",
		sign, cd.VoutV, cd.LoadMinA, cd.LoadMaxA, sign, cd.TroughV, cd.TroughAt, sign, cd.PeakV, cd.PeakAt)
	fmt.Fprintln(w)
	for i, r := range res.Replacements {
		dec := ""
		if ch := r.Check(r.Deciding); ch != nil {
			dec = fmt.Sprintf("%s %s: %s", ch.Name, r.DecidingWhy, ch.Text)
		}
		fmt.Fprintf(w, "%2d. %-26s %-11s %s\n", i+1, r.Label(), r.Verdict, dec)
	}
	if len(res.Replacements) == 0 {
		fmt.Fprintln(w, "no candidate in the catalog")
	}
	if res.Hidden > 0 {
		fmt.Fprintf(w, "(%d unsuitable candidates not shown; --all shows them)\n", res.Hidden)
	}
	for i, r := range res.Replacements {
		if i >= details {
			break
		}
		fmt.Fprintf(w, "\n%s — %s\n", r.Label(), r.Verdict)
		for _, ch := range r.Checks {
			fmt.Fprintf(w, "  %-4s %-9s %-24s limit %-22s margin %+6.2f  %s\n", ch.Status, ch.Name, ch.ValueText, ch.LimitText, ch.Margin, ch.Text)
		}
		for _, in := range r.Install {
			fmt.Fprintf(w, "  - %s\n", in)
		}
	}
	writeList(w, 80, "Assumed:", res.Assumptions)
	fmt.Fprintln(w, "\nSafety: unplug and discharge the filter capacitors before desoldering; tabs and heat sinks may be live or hot. Confirm against the maker's datasheet.")
}

func writeSwapMarkdown(w io.Writer, res *replace.Result, details int) {
	fmt.Fprintf(w, "# Replacements\n\n%s\n\n| # | candidate | verdict | deciding check |\n| ---: | --- | --- | --- |\n", mdEscape(originalLine(res)))
	for i, r := range res.Replacements {
		fmt.Fprintf(w, "| %d | %s | %s | %s (%s) |\n", i+1, r.Label(), r.Verdict, r.Deciding, r.DecidingWhy)
	}
	for i, r := range res.Replacements {
		if i >= details {
			break
		}
		fmt.Fprintf(w, "\n## %s — %s\n\n", r.Label(), r.Verdict)
		writeCheckTable(w, r)
	}
}

func writeCheckTable(w io.Writer, r replace.Replacement) {
	fmt.Fprintln(w, "| check | value | limit | margin | status | why |\n| --- | --- | --- | ---: | --- | --- |")
	for _, ch := range r.Checks {
		fmt.Fprintf(w, "| %s | %s | %s | %+.2f | %s | %s |\n", ch.Name, mdEscape(ch.ValueText), mdEscape(ch.LimitText), ch.Margin, ch.Status, mdEscape(ch.Text))
	}
}

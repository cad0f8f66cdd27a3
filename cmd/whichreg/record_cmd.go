package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer/replace"
	"github.com/whichreg/whichreg/record"
	"github.com/whichreg/whichreg/report"
)

type recordOptions struct {
	app      *App
	Format   string
	Choose   string
	Original string
	Output   string
	Figure   string
	Override string
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
regulation threshold marked. When the new part's leads must be rewired, a
drawing of the old and new pinouts with the lead-to-pad mapping is written
beside the record (FILE-pinout.svg) and linked from it.

A part that swap judges unsuitable is refused (exit 1, nothing written)
unless --override "REASON" is given; the record then opens with a banner
saying so. A warning goes to standard error when the original is
identification's leader at less than 60 %.`,
		Example: `  whichreg record testdata/demo/vending-lifted-ground.toml --choose 78xx:TO-220 -o vr1-record.md
  whichreg record board.toml --choose 2940 --format json -o record.json --figure input.svg
  whichreg record board.toml --choose 78xx:TO-3 --override "only part on hand; load reduced to 0.5 A" -o u4.md`,
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
	cmd.Flags().StringVar(&opts.Override, "override", "", "record an unsuitable choice anyway, for this `REASON` (printed in a banner)")
	cmd.Flags().BoolVar(&opts.Force, "force", false, "replace existing files")
	return cmd
}

func recordRun(o *recordOptions) error {
	st, err := prepareSwap(o.app, o.File, o.Original, true)
	if err != nil {
		return err
	}
	chosen, err := findChoice(st.cat, st.sres, o.Choose)
	if err != nil {
		return err
	}
	if err := record.Guard(chosen, o.Override); err != nil {
		return inputError(err, fmt.Sprintf("choose a drop-in or needs-work part ('whichreg swap %s'), or give --override \"REASON\" to record it anyway", o.File))
	}
	rec := record.Build(record.Input{Catalog: st.cat, Evidence: st.ev, EvidenceSource: st.src, Identification: st.ires,
		Swap: st.sres, Chosen: chosen, Override: o.Override, Date: o.app.Now(), Tool: "whichreg " + version})
	for _, w := range rec.Warnings {
		fmt.Fprintf(o.app.IO.ErrOut, "warning: %s\n", w)
	}
	var files []outFile
	var img record.Images
	if o.Figure != "" {
		fig, err := inputFigure(st.sres, chosen)
		if err != nil {
			return inputError(fmt.Errorf("--figure: %v", err))
		}
		files = append(files, outFile{o.Figure, fig})
		img.Input = relativeTo(o.Output, o.Figure)
	}
	if rec.Chosen.Rewire && o.Output != "" && o.Output != "-" {
		name := strings.TrimSuffix(o.Output, filepath.Ext(o.Output)) + "-pinout.svg"
		files = append(files, outFile{name, record.PinoutSVG(st.sres.Original.Hypothesis, chosen.Hypothesis)})
		img.Pinout = relativeTo(o.Output, name)
	}
	var buf bytes.Buffer
	if o.Format == "json" {
		err = writeRecordJSON(&buf, rec)
	} else {
		err = record.WriteMarkdown(&buf, rec, img)
	}
	if err != nil {
		return ioError(err)
	}
	if o.Format != "json" {
		// A record file is 80 columns (or --width) wherever it was made.
		width := defaultWidth
		if o.Output == "" || o.Output == "-" || o.app.widthFlag > 0 {
			width = o.app.Width()
		}
		reflowed := report.ReflowMarkdown(buf.String(), width)
		buf.Reset()
		buf.WriteString(reflowed)
	}
	return writeRecordFiles(o, buf.Bytes(), files)
}

// outFile is a drawing written beside the record.
type outFile struct {
	name string
	data []byte
}

// relativeTo returns the path of file as seen from the folder of the
// record (the current folder when the record goes to standard output), so
// that the record's image links work where it is kept.
func relativeTo(recordFile, file string) string {
	dir := "."
	if recordFile != "" && recordFile != "-" {
		dir = filepath.Dir(recordFile)
	}
	abs, err1 := filepath.Abs(file)
	base, err2 := filepath.Abs(dir)
	if err1 != nil || err2 != nil {
		return filepath.ToSlash(file)
	}
	rel, err := filepath.Rel(base, abs)
	if err != nil {
		return filepath.ToSlash(file)
	}
	return filepath.ToSlash(rel)
}

// writeRecordFiles writes the record and its drawings, or nothing: if a
// later file cannot be written the earlier ones are removed again. A
// drawing named "-" goes to standard output (the record then has a file).
func writeRecordFiles(o *recordOptions, body []byte, files []outFile) error {
	toStdout := o.Output == "" || o.Output == "-"
	if !o.Force {
		for _, f := range files {
			if _, err := os.Lstat(f.name); err == nil && f.name != "-" {
				return inputError(fmt.Errorf("%s already exists; not overwritten", f.name), "use --force to replace it")
			}
		}
	}
	var written []string
	undo := func() {
		for _, n := range written {
			os.Remove(n)
		}
	}
	if !toStdout {
		if err := writeFileAtomic(o.Output, body, o.Force); err != nil {
			return err
		}
		written = append(written, o.Output)
	}
	var stdout []byte
	for _, f := range files {
		if f.name == "-" {
			stdout = f.data
			continue
		}
		if err := writeFileAtomic(f.name, f.data, o.Force); err != nil {
			undo()
			return err
		}
		written = append(written, f.name)
	}
	for _, n := range written {
		fmt.Fprintf(o.app.IO.ErrOut, "wrote %s\n", n)
	}
	if toStdout {
		stdout = body
	}
	if stdout != nil {
		if _, err := o.app.IO.Out.Write(stdout); err != nil {
			return ioError(err)
		}
	}
	return nil
}

func findChoice(c *catalog.Catalog, sres *replace.Result, spec string) (*replace.Replacement, error) {
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

package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"time"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/internal/tomlpos"
)

// Exit codes (DESIGN.md, contract).
const (
	exitOK    = 0
	exitInput = 1 // invalid input: the message names file:line and key
	exitUsage = 2 // usage error
	exitIO    = 3 // an I/O failure
)

// version is the tool version written into records.
const version = "0.1.0"

// IOStreams are the streams a command writes to.
type IOStreams struct {
	In     io.Reader
	Out    io.Writer
	ErrOut io.Writer
}

// App is what every command shares: streams, catalog sources and the clock.
type App struct {
	IO           *IOStreams
	CatalogFiles []string
	// ConfigDir returns the user configuration directory (os.UserConfigDir).
	ConfigDir func() (string, error)
	// Now returns the current time (records are dated with it).
	Now func() time.Time
}

// flagError is a usage problem; usage is printed for it.
type flagError struct{ err error }

func (e *flagError) Error() string { return e.err.Error() }
func (e *flagError) Unwrap() error { return e.err }

func flagErrorf(format string, args ...any) error {
	return &flagError{fmt.Errorf(format, args...)}
}

// exitError carries an exit code and optional hint lines.
type exitError struct {
	code  int
	err   error
	hints []string
}

func (e *exitError) Error() string { return e.err.Error() }
func (e *exitError) Unwrap() error { return e.err }

func inputError(err error, hints ...string) error { return &exitError{exitInput, err, hints} }
func ioError(err error, hints ...string) error    { return &exitError{exitIO, err, hints} }

// errPrinted reports that the command has already printed its diagnostics.
var errPrinted = errors.New("already printed")

// testOnlyNow, when set by the tests, replaces the clock (records are dated).
var testOnlyNow func() time.Time

// Main runs whichreg with os.Args and returns the exit code.
func Main() int {
	app := &App{
		IO:        &IOStreams{In: os.Stdin, Out: os.Stdout, ErrOut: os.Stderr},
		ConfigDir: os.UserConfigDir,
		Now:       time.Now,
	}
	if testOnlyNow != nil {
		app.Now = testOnlyNow
	}
	return run(app, os.Args[1:])
}

func run(app *App, args []string) (code int) {
	// A panic is a bug in whichreg, never the user's fault: say so in one
	// line rather than with a stack trace, and exit as for invalid input.
	defer func() {
		if r := recover(); r != nil {
			fmt.Fprintf(app.IO.ErrOut, "whichreg: internal error: %v\nhint: please report it with the file and command that caused it\n", r)
			code = exitInput
		}
	}()
	root := newRootCmd(app)
	root.SetArgs(args)
	err := root.Execute()
	if err == nil {
		return exitOK
	}
	var fe *flagError
	var ee *exitError
	switch {
	case errors.Is(err, errPrinted):
		if errors.As(err, &ee) {
			return ee.code
		}
		return exitInput
	case errors.As(err, &fe) || isCobraUsage(err):
		fmt.Fprintf(app.IO.ErrOut, "whichreg: %v\n", err)
		fmt.Fprintf(app.IO.ErrOut, "Run 'whichreg --help' (or the command with --help) for usage.\n")
		return exitUsage
	case errors.As(err, &ee):
		printError(app.IO.ErrOut, ee.err)
		for _, h := range ee.hints {
			fmt.Fprintf(app.IO.ErrOut, "hint: %s\n", h)
		}
		return ee.code
	default:
		printError(app.IO.ErrOut, err)
		return exitInput
	}
}

// isCobraUsage recognises cobra's own argument and command errors.
func isCobraUsage(err error) bool {
	msg := err.Error()
	for _, p := range []string{"unknown command", "unknown flag", "unknown shorthand flag", "accepts ", "requires at least", "requires at most", "invalid argument", "flag needs an argument", "required flag"} {
		if strings.Contains(msg, p) {
			return true
		}
	}
	return false
}

// printError prints an error; a list of positioned errors one per line.
func printError(w io.Writer, err error) {
	var list tomlpos.ErrorList
	if errors.As(err, &list) {
		for _, e := range list {
			fmt.Fprintf(w, "whichreg: %v\n", e)
		}
		return
	}
	fmt.Fprintf(w, "whichreg: %v\n", err)
}

func newRootCmd(app *App) *cobra.Command {
	root := &cobra.Command{
		Use:   "whichreg",
		Short: "Identify an unmarked linear regulator, choose a replacement, record the repair",
		Long: `whichreg helps a bench technician with a three-terminal linear regulator whose
marking is gone: it ranks what the part was from what you can measure (infer),
checks current-production replacements against the real circuit (swap), and
writes the decision down for the next person (record).

Start with 'whichreg evidence init board.toml', fill in what you measured,
then run 'whichreg infer board.toml'.

Exit codes:
  0  success (contradictory evidence still answers, with its conflicts listed)
  1  invalid input: the message names file:line and key
  2  usage error
  3  I/O failure

Safety: the equipment may carry mains voltage and its filter capacitors may hold
a charge long after it is switched off. See 'whichreg record' for the cautions
written into every record.`,
		SilenceErrors: true,
		SilenceUsage:  true,
		Version:       version,
	}
	root.SetOut(app.IO.Out)
	root.SetErr(app.IO.ErrOut)
	root.SetFlagErrorFunc(func(c *cobra.Command, err error) error { return &flagError{err} })
	root.PersistentFlags().StringArrayVar(&app.CatalogFiles, "catalog", nil, "add a user catalog `FILE` on top of the built-in one (repeatable)")
	root.AddCommand(
		newCatalogCmd(app),
		newEvidenceCmd(app),
		newInferCmd(app, nil),
		newSwapCmd(app, nil),
		newRecordCmd(app, nil),
		newCalcCmd(app),
	)
	return root
}

// maxCatalogBytes bounds a user catalog file (10 000 families take about 4 MB).
const maxCatalogBytes = 32 << 20

// catalogSources lists the user catalog files in the order they are merged:
// the config directory's files (sorted), then --catalog flags.
func (app *App) catalogSources() []string {
	var out []string
	if app.ConfigDir != nil {
		if dir, err := app.ConfigDir(); err == nil && dir != "" {
			m, _ := filepath.Glob(filepath.Join(dir, "whichreg", "catalog", "*.toml"))
			out = append(out, m...)
		}
	}
	return append(out, app.CatalogFiles...)
}

// loadCatalog loads the built-in catalog and every user file, and lints the
// result. It returns an input error listing every problem.
func (app *App) loadCatalog() (*catalog.Catalog, error) {
	files, errs := builtin.Files()
	for _, name := range app.catalogSources() {
		data, err := readLimited(name, "catalog", maxCatalogBytes)
		if err != nil {
			return nil, err
		}
		f, e := catalog.Load(name, data)
		errs = append(errs, e...)
		files = append(files, f)
	}
	if len(errs) > 0 {
		return nil, inputError(errs, "run 'whichreg catalog check FILE' for the full list")
	}
	c := catalog.Merge(files...)
	if lint := catalog.Lint(c); len(lint) > 0 {
		return nil, inputError(lint, "fix the catalog file, or leave it out with fewer --catalog flags")
	}
	return c, nil
}

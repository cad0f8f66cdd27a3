package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
	"time"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/internal/tomlpos"
)

// Exit codes (DESIGN.md, contract).
const (
	exitOK       = 0
	exitInput    = 1 // invalid input (the message names file:line and key), a refused record
	exitUsage    = 2 // usage error
	exitIO       = 3 // an I/O failure, write errors included
	exitInternal = 4 // an internal error: a bug in whichreg
)

// version is the tool version written into records.
const version = "0.1.0"

// flagError is a usage problem: a bad flag, a wrong number of arguments,
// an unknown command. Usage hints are printed for it and it exits 2.
type flagError struct {
	err   error
	hints []string
}

func (e *flagError) Error() string { return e.err.Error() }
func (e *flagError) Unwrap() error { return e.err }

func flagErrorf(format string, args ...any) error {
	return &flagError{err: fmt.Errorf(format, args...)}
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
		Getenv:    os.Getenv,
		Now:       time.Now,
	}
	if testOnlyNow != nil {
		app.Now = testOnlyNow
	}
	return run(app, os.Args[1:])
}

// run executes one command line and returns its exit code. It is the one
// place where errors become exit codes.
func run(app *App, args []string) (code int) {
	out := newOutWriter(app.IO.Out)
	app.IO.Out = out
	defer func() { app.IO.Out = out.dst }()
	// A panic is a bug in whichreg, never the user's fault: say so in one
	// line rather than with a stack trace, with its own exit code.
	defer func() {
		if r := recover(); r != nil {
			_ = out.Flush()
			fmt.Fprintf(app.IO.ErrOut, "whichreg: internal error: %v\nhint: this is a bug in whichreg; please report it with the file and command that caused it\n", r)
			code = exitInternal
		}
	}()
	root := newRootCmd(app)
	root.SetArgs(args)
	err := root.Execute()
	// A failed write to standard output is an I/O failure whichever command
	// was writing and however it passed the error on.
	if ferr := out.Flush(); ferr != nil && (err == nil || errors.Is(err, ferr)) {
		err = ioError(fmt.Errorf("writing the output: %v", ferr), "check the free space and the destination of the output")
	}
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
	case errors.As(err, &fe):
		fmt.Fprintf(app.IO.ErrOut, "whichreg: %v\n", err)
		for _, h := range fe.hints {
			fmt.Fprintf(app.IO.ErrOut, "hint: %s\n", h)
		}
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

// Command groups of the root help.
const (
	groupWork  = "work"
	groupTools = "tools"
)

func newRootCmd(app *App) *cobra.Command {
	// List commands in the order of the work, not alphabetically.
	cobra.EnableCommandSorting = false
	root := &cobra.Command{
		Use:   "whichreg",
		Short: "Identify an unmarked linear regulator, choose a replacement, record the repair",
		Long: `whichreg helps a bench technician with a three-terminal linear regulator whose
marking is gone: it ranks what the part was from what you can measure (infer),
checks current-production replacements against the real circuit (swap), and
writes the decision down for the next person (record).

Start with 'whichreg evidence init board.toml', fill in what you measured,
then run 'whichreg infer board.toml'. A file argument of - reads standard
input; an output file of - writes standard output.

Text is fitted to the terminal (COLUMNS, else the terminal's width) or to 80
columns when piped; --width N sets it.

Exit codes:
  0  success (contradictory evidence still answers, with its conflicts listed)
  1  invalid input: the message names file:line and key; a refused record
  2  usage error
  3  I/O failure (reading, or writing the output)
  4  internal error (a bug in whichreg: please report it)

Safety: the equipment may carry mains voltage and its filter capacitors may hold
a charge long after it is switched off. See 'whichreg record' for the cautions
written into every record.`,
		Example: `  whichreg evidence init u4.toml
  whichreg infer u4.toml
  whichreg swap u4.toml
  whichreg record u4.toml --choose 78xx:TO-220 -o u4-record.md
  whichreg catalog find '?M3?7'`,
		SilenceErrors: true,
		SilenceUsage:  true,
		Version:       version,
		Args:          cobra.ArbitraryArgs,
		RunE:          groupRunE,
	}
	root.SetOut(app.IO.Out)
	root.SetErr(app.IO.ErrOut)
	root.SetFlagErrorFunc(func(c *cobra.Command, err error) error { return &flagError{err: err} })
	pf := root.PersistentFlags()
	pf.StringArrayVar(&app.CatalogFiles, "catalog", nil, "add a user catalog `FILE` (repeatable; - is stdin)")
	pf.BoolVar(&app.NoUserCatalog, "no-user-catalog", false, "leave out the user catalogs ('catalog paths')")
	pf.IntVar(&app.widthFlag, "width", 0, "fit text to `N` columns (default: the terminal, or 80)")
	root.PersistentPreRunE = func(cmd *cobra.Command, args []string) error {
		if app.widthFlag != 0 && app.widthFlag < minWidth {
			return flagErrorf("--width %d is too narrow: give %d or more", app.widthFlag, minWidth)
		}
		return nil
	}
	root.AddGroup(&cobra.Group{ID: groupWork, Title: "At the bench (in this order):"},
		&cobra.Group{ID: groupTools, Title: "Catalog and calculations:"})
	for _, c := range []*cobra.Command{newEvidenceCmd(app), newGuideCmd(app, nil), newInferCmd(app, nil), newSwapCmd(app, nil), newRecordCmd(app, nil)} {
		c.GroupID = groupWork
		root.AddCommand(c)
	}
	for _, c := range []*cobra.Command{newCatalogCmd(app), newCalcCmd(app)} {
		c.GroupID = groupTools
		root.AddCommand(c)
	}
	root.SetHelpCommandGroupID(groupTools)
	root.SetCompletionCommandGroupID(groupTools)
	// The completion and help commands are usually added at Execute; adding
	// them here gives them typed usage errors too ('completion bogus').
	root.InitDefaultCompletionCmd()
	root.InitDefaultHelpCmd()
	typedUsageErrors(root)
	addCompletions(root, app)
	fitHelpFunc(root, app)
	return root
}

// groupRunE runs a command that only groups others: with no arguments it
// prints its help; with any it is an unknown subcommand, a usage error
// that suggests the nearest names.
func groupRunE(cmd *cobra.Command, args []string) error {
	if len(args) == 0 {
		return cmd.Help()
	}
	fe := &flagError{err: fmt.Errorf("unknown command %q for %q", args[0], cmd.CommandPath())}
	if cmd.SuggestionsMinimumDistance <= 0 {
		cmd.SuggestionsMinimumDistance = 2
	}
	if s := cmd.SuggestionsFor(args[0]); len(s) > 0 {
		fe.hints = append(fe.hints, "did you mean "+strings.Join(s, " or ")+"?")
	}
	var names []string
	for _, c := range cmd.Commands() {
		if c.IsAvailableCommand() {
			names = append(names, c.Name())
		}
	}
	fe.hints = append(fe.hints, fmt.Sprintf("'%s' has: %s", cmd.CommandPath(), strings.Join(names, ", ")))
	return fe
}

// typedUsageErrors makes every argument-count error of the tree a
// *flagError, so that run tells usage errors by their type, not by their text.
func typedUsageErrors(c *cobra.Command) {
	if c.HasSubCommands() && c.RunE == nil && c.Run == nil {
		c.Args = cobra.ArbitraryArgs
		c.RunE = groupRunE
	}
	if check := c.Args; check != nil {
		c.Args = func(cmd *cobra.Command, args []string) error {
			if err := check(cmd, args); err != nil {
				var fe *flagError
				if errors.As(err, &fe) {
					return err
				}
				return &flagError{err: err}
			}
			return nil
		}
	}
	for _, sub := range c.Commands() {
		typedUsageErrors(sub)
	}
}

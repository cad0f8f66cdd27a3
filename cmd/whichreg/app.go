package main

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"time"

	"golang.org/x/term"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

// IOStreams are the streams a command reads and writes.
type IOStreams struct {
	In     io.Reader // standard input (evidence given as -)
	Out    io.Writer // results
	ErrOut io.Writer // diagnostics, warnings and prompts
}

// App is what every command shares: streams, catalog sources, the output
// width and the clock.
type App struct {
	IO           *IOStreams // where every command reads and writes
	CatalogFiles []string   // user catalog files from --catalog, in order
	// NoUserCatalog leaves out the configuration directory's catalog files
	// (--no-user-catalog); --catalog files are still read.
	NoUserCatalog bool
	// ConfigDir returns the user configuration directory (os.UserConfigDir).
	ConfigDir func() (string, error)
	// Getenv reads an environment variable (os.Getenv; COLUMNS).
	Getenv func(string) string
	// Now returns the current time (records are dated with it).
	Now func() time.Time
	// widthFlag is --width (0: not given).
	widthFlag int
	// stdinUsed records that "-" has been read from standard input.
	stdinUsed bool
}

// defaultWidth is the width of text output when nothing else says.
const defaultWidth = 80

// minWidth is the narrowest --width accepted.
const minWidth = 40

// Width returns the width text output is fitted to: --width when given;
// on a terminal COLUMNS when set, else the terminal's own width; else 80.
// Piped output keeps 80 unless --width says otherwise, so that what a
// script sees does not depend on the window it ran in.
func (app *App) Width() int {
	if app.widthFlag > 0 {
		return app.widthFlag
	}
	fd, ok := terminalFD(app.IO.Out)
	if !ok {
		return defaultWidth
	}
	if app.Getenv != nil {
		if n, err := strconv.Atoi(app.Getenv("COLUMNS")); err == nil && n > 0 {
			return max(n, minWidth)
		}
	}
	if w, _, err := term.GetSize(fd); err == nil && w > 0 {
		return max(w, minWidth)
	}
	return defaultWidth
}

// terminalFD returns the descriptor of w when w is a terminal.
func terminalFD(w io.Writer) (int, bool) {
	if o, ok := w.(*outWriter); ok {
		w = o.dst
	}
	f, ok := w.(*os.File)
	if !ok {
		return 0, false
	}
	fd := int(f.Fd())
	return fd, term.IsTerminal(fd)
}

// isTerminal reports whether w is a terminal (tables get a header there).
func isTerminal(w io.Writer) bool {
	_, ok := terminalFD(w)
	return ok
}

// outWriter buffers standard output and keeps the first write error, so
// that a full disk or a closed pipe is reported once, with exit code 3,
// whichever command was writing.
type outWriter struct {
	dst io.Writer
	buf *bufio.Writer
	err error
}

func newOutWriter(dst io.Writer) *outWriter {
	return &outWriter{dst: dst, buf: bufio.NewWriterSize(dst, 32<<10)}
}

func (o *outWriter) Write(p []byte) (int, error) {
	if o.err != nil {
		return 0, o.err
	}
	n, err := o.buf.Write(p)
	if err != nil {
		o.err = err
	}
	return n, err
}

// Flush writes out what is buffered and returns the first error seen.
func (o *outWriter) Flush() error {
	if o.err == nil {
		o.err = o.buf.Flush()
	}
	return o.err
}

// maxCatalogBytes bounds a user catalog file (10 000 families take about 4 MB).
const maxCatalogBytes = 32 << 20

// userCatalogDir returns the folder whose *.toml files are user catalogs.
func (app *App) userCatalogDir() (string, error) {
	if app.ConfigDir == nil {
		return "", errors.New("no configuration directory")
	}
	dir, err := app.ConfigDir()
	if err != nil {
		return "", err
	}
	if dir == "" {
		return "", errors.New("no configuration directory")
	}
	return filepath.Join(dir, "whichreg", "catalog"), nil
}

// catalogSources lists the user catalog files in the order they are merged:
// the config directory's files (sorted), then --catalog flags.
func (app *App) catalogSources() []string {
	var out []string
	if !app.NoUserCatalog {
		if dir, err := app.userCatalogDir(); err == nil {
			m, _ := filepath.Glob(filepath.Join(dir, "*.toml"))
			out = append(out, m...)
		}
	}
	return append(out, app.CatalogFiles...)
}

// loadCatalog loads the built-in catalog and every user file, and lints the
// result. It returns an input error listing every problem.
func (app *App) loadCatalog() (*catalog.Catalog, error) {
	files, errs := builtin.Files()
	nBuiltin := len(files)
	for _, name := range app.catalogSources() {
		data, err := app.readLimited(name, "catalog", maxCatalogBytes)
		if err != nil {
			return nil, err
		}
		f, e := catalog.Load(displayName(name), data)
		errs = append(errs, e...)
		files = append(files, f)
	}
	if len(errs) > 0 {
		return nil, inputError(errs, "run 'whichreg catalog check FILE' for the full list")
	}
	c := catalog.Merge(files...)
	// The built-in entries are linted by the tests (TestBuiltinLintsClean);
	// at start-up only what the user files add is, so that start-up does not
	// grow with the built-in catalog.
	if lint := catalog.LintAdded(c, files[nBuiltin:]...); len(lint) > 0 {
		return nil, inputError(lint, "fix the catalog file, or leave it out with fewer --catalog flags")
	}
	return c, nil
}

// displayName is how a file argument is named in messages: "-" is stdin.
func displayName(file string) string {
	if file == "-" {
		return "stdin"
	}
	return file
}

// readLimited reads a file of at most limit bytes; "-" reads standard
// input (once). A larger file is invalid input (it is not the kind of file
// wanted); a failure to read is an I/O error.
func (app *App) readLimited(file, what string, limit int64) ([]byte, error) {
	if file == "-" {
		if app.stdinUsed {
			return nil, flagErrorf("standard input (-) can be read only once")
		}
		app.stdinUsed = true
		if app.IO.In == nil {
			return nil, ioError(fmt.Errorf("reading %s from stdin: no standard input", what))
		}
		data, err := io.ReadAll(io.LimitReader(app.IO.In, limit+1))
		if err != nil {
			return nil, ioError(fmt.Errorf("reading %s from stdin: %w", what, err))
		}
		if int64(len(data)) > limit {
			return nil, inputError(fmt.Errorf("stdin: more than %d MiB is far too large for %s file; is it the right input?", limit>>20, article(what)))
		}
		return data, nil
	}
	st, err := os.Stat(file)
	if err != nil {
		return nil, ioError(fmt.Errorf("reading %s: %w", what, err))
	}
	if st.IsDir() {
		return nil, inputError(fmt.Errorf("%s is a directory, not %s file", file, article(what)))
	}
	if st.Size() > limit {
		return nil, inputError(fmt.Errorf("%s: %d bytes is far too large for %s file (at most %d MiB); is it the right file?", file, st.Size(), article(what), limit>>20))
	}
	data, err := os.ReadFile(file)
	if err != nil {
		return nil, ioError(fmt.Errorf("reading %s: %w", what, err))
	}
	return data, nil
}

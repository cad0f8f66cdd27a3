package main

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"os/signal"
	"regexp"
	"strings"
	"sync"
	"syscall"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/guide"
	"github.com/whichreg/whichreg/report"
)

type guideOptions struct {
	app    *App
	Format string
	File   string // "" when the session names a new file after the board reference
}

func newGuideCmd(app *App, runF func(*guideOptions) error) *cobra.Command {
	opts := &guideOptions{app: app}
	cmd := &cobra.Command{
		Use:   "guide [EVIDENCE.toml]",
		Short: "Ask for the most informative measurement until the part is known",
		Long: `guide runs a measuring session at the bench. It shows the three leading
candidates, asks for the single most informative measurement (what to connect
where, power off or on, the unit expected), writes your answer into the
evidence file and ranks again, until the leader reaches 95 % or no measurement
left is worth making. Then it names the leader and the 'swap' command to run.

Answer each question with a value ("12.1", "-15.02 V", "4k7", "unregulated";
a choice may be shortened to its first letters) or with a word:
  skip   the measurement cannot be made: do not ask it again
  back   take back the last answer
  why    the leader's reasons
  list   the other measurements worth making; pick one by number
  help   what can be typed
  quit   end the session (so does Ctrl-D, or Ctrl-C)
A reading made without being asked may be given as KEY = VALUE at any
prompt, e.g. "output.amps = 0.45" (the keys are those of 'whichreg evidence
init').

Nothing is lost: after every answer the evidence file is rewritten whole
(a temporary file renamed over it), keeping your comments and layout. An
answer the evidence file would not accept is refused with the reason and
asked again; nothing is written for it. Without EVIDENCE.toml the session
asks for the board reference first and names the new file after it (U4.toml);
a file that does not exist yet is started.

--format json speaks JSON lines for another program: one object per step
({"schema": "whichreg/guide/v1", "ask": …} or {…, "done": …}; see
docs/schema/guide.v1.json), one answer per line on standard input.`,
		Example: `  whichreg guide                 # asks for the board reference, writes U4.toml
  whichreg guide u4.toml         # continues a file
  whichreg guide u4.toml --format json < answers.txt`,
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.File = args[0]
			}
			if opts.File == "-" {
				return flagErrorf("guide reads its answers from standard input: give the evidence file by name")
			}
			if runF != nil {
				return runF(opts)
			}
			return guideRun(opts)
		},
	}
	addFormatFlag(cmd, &opts.Format, "text", "json")
	return cmd
}

// maxEvidenceBytes bounds an evidence file.
const maxEvidenceBytes = 1 << 20

func guideRun(o *guideOptions) error {
	c, err := o.app.loadCatalog()
	if err != nil {
		return err
	}
	id := guide.Infer{Catalog: c}
	gopts := guide.Options{
		Save:    func(name string, doc []byte) error { return writeFileAtomic(name, doc, true) },
		NewFile: o.newFile,
	}
	name, doc := "", []byte(nil)
	if o.File != "" {
		doc, err = o.app.readLimited(o.File, "evidence", maxEvidenceBytes)
		switch {
		case errors.Is(err, fs.ErrNotExist):
			doc = nil // a new file under this name, after the board reference
		case err != nil:
			return err
		default:
			name = o.File
		}
	}
	s, err := guide.New(id, name, doc, gopts)
	if err != nil {
		return inputError(err, "mend the file (the message names the line), or start another with 'whichreg guide'")
	}
	// Piped answers are echoed after the prompt, so that the saved session log reads
	// as a session; a terminal echoes them itself.
	echo := true
	if f, ok := o.app.IO.In.(*os.File); ok {
		_, echo = terminalFD(f)
		echo = !echo
	}
	var r guideRenderer = &textGuide{w: o.app.IO.Out, width: o.app.Width(), color: o.color(), echo: echo}
	if o.Format == "json" {
		r = &jsonGuide{w: o.app.IO.Out}
	}
	lines, readErr, stop := readLines(o.app.IO.In)
	defer close(stop)
	// Ctrl-C, a closed terminal or a kill ends the session between steps:
	// never in the middle of writing the file.
	sig := make(chan os.Signal, 1)
	signal.Notify(sig, os.Interrupt, syscall.SIGHUP, syscall.SIGTERM)
	defer signal.Stop(sig)
	var last *guide.Reply
	for {
		st := s.Next()
		if st.Done != nil {
			r.done(st, last)
			return nil
		}
		r.step(st, last)
		if f, ok := o.app.IO.Out.(interface{ Flush() error }); ok {
			if err := f.Flush(); err != nil {
				return ioError(fmt.Errorf("writing the output: %v", err))
			}
		}
		var line string
		select {
		case <-sig:
			r.done(guide.Step{Done: s.Quit("interrupted"), Ranking: st.Ranking, Asked: s.Asked()}, nil)
			return nil
		case l, ok := <-lines:
			if !ok {
				if err := <-readErr; err != nil {
					return ioError(fmt.Errorf("reading the answers: %v", err), "the evidence file holds every answer accepted")
				}
				r.done(guide.Step{Done: s.Quit("the input ended"), Ranking: st.Ranking, Asked: s.Asked()}, nil)
				return nil
			}
			line = l
		}
		rep, err := s.Reply(line)
		if err != nil {
			return ioError(err, "the evidence file holds every answer accepted before this one")
		}
		last = &rep
		r.reply(line, rep)
	}
}

// readLines reads r line by line on its own goroutine, so that a signal
// can end the session while it waits for an answer. The lines channel is
// closed at the end of the input, and then readErr holds the read error
// (nil at a plain end); closing stop lets the goroutine go.
func readLines(r io.Reader) (lines <-chan string, readErr <-chan error, stop chan struct{}) {
	out, errc, stop := make(chan string), make(chan error, 1), make(chan struct{})
	go func() {
		defer close(out)
		sc := bufio.NewScanner(r)
		sc.Buffer(make([]byte, 4096), 64<<10)
		for sc.Scan() {
			select {
			case out <- sc.Text():
			case <-stop:
				return
			}
		}
		errc <- sc.Err()
	}()
	return out, errc, stop
}

// newFile names the evidence file after the board reference: the file
// given on the command line, or REF.toml in the current folder. An
// existing file is continued, never replaced.
func (o *guideOptions) newFile(ref string) (string, []byte, error) {
	name := o.File
	if name == "" {
		base := strings.Trim(unsafeName().ReplaceAllString(ref, "-"), "-.")
		if base == "" {
			return "", nil, fmt.Errorf("%q cannot name a file: give the reference in letters and digits (U4, IC3)", ref)
		}
		name = base + ".toml"
	}
	doc, err := o.app.readLimited(name, "evidence", maxEvidenceBytes)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return name, nil, nil
	case err != nil:
		return "", nil, err
	}
	return name, doc, nil
}

var unsafeName = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`[^A-Za-z0-9_.+-]+`) })

// color reports whether the probability bars may be coloured: a terminal,
// no NO_COLOR (https://no-color.org), and a TERM that is not "dumb".
func (o *guideOptions) color() bool {
	getenv := o.app.Getenv
	if getenv == nil {
		getenv = os.Getenv
	}
	return isTerminal(o.app.IO.Out) && getenv("NO_COLOR") == "" && getenv("TERM") != "dumb" && getenv("TERM") != ""
}

// guideRenderer writes the steps of a session as text or JSON lines.
type guideRenderer interface {
	step(st guide.Step, last *guide.Reply)
	reply(line string, r guide.Reply)
	done(st guide.Step, last *guide.Reply)
}

// textGuide writes a plain line-by-line session: no cursor movement, so
// that it works over a serial console and in a pipe.
type textGuide struct {
	w      io.Writer
	width  int
	color  bool
	echo   bool // write each answer after its prompt (input not a terminal)
	shown  bool
	warned bool // the full caution for powered measurements has been shown
}

func (t *textGuide) line(format string, args ...any) { fmt.Fprintf(t.w, format+"\n", args...) }

func (t *textGuide) fill(text, first, rest string) {
	for _, l := range report.Wrap(text, t.width, first, rest) {
		t.line("%s", l)
	}
}

func (t *textGuide) step(st guide.Step, _ *guide.Reply) {
	if !t.shown {
		t.shown = true
		t.fill("Answer each question with a value, or skip, back, why, list, help or quit. Every answer is saved at once.", "", "")
		if st.Ranking != nil {
			for _, c := range st.Ranking.Conflicts {
				t.fill(c, "CONFLICT in the file: ", "    ")
			}
		}
	}
	t.line("")
	t.ranking(st.Ranking)
	if st.Pick != nil {
		t.line("Other measurements worth making, the most information per effort first:")
		for i, q := range st.Pick {
			work := ""
			switch e := q.Effort(); {
			case e >= 4:
				work = "; a bench test"
			case e > 1:
				work = "; more work"
			}
			t.fill(fmt.Sprintf("%s (%.2f bit%s) [%s]", q.Measure, q.GainBits, work, q.Key), fmt.Sprintf("%3d. ", i+1), "     ")
		}
		fmt.Fprint(t.w, "Pick a number (Enter to go on): ")
		return
	}
	q := st.Ask
	head, number := q.Measure, fmt.Sprintf("Q%d. ", st.Asked+1)
	if head == "" {
		head = q.Key
	}
	if st.Ranking == nil { // the board reference, before any measurement
		number = ""
	}
	r := []rune(head)
	t.fill(strings.ToUpper(string(r[:1]))+string(r[1:]), number, "    ")
	t.fill(q.Prompt, "    ", "    ")
	switch {
	case q.Safety != "" && !t.warned:
		t.warned = true
		t.fill(q.Safety, "    CAUTION: ", "    ")
	case q.Safety != "" || q.Powered:
		t.line("    CAUTION: powered: mind the mains wiring and a live tab or can.")
	}
	hint := q.Key
	switch {
	case len(q.Choices) > 0:
		choices := strings.Join(q.Choices, " | ")
		if report.Width(hint+choices)+24 > t.width { // room for the answer
			t.fill(choices, "    one of: ", "            ")
			break
		}
		hint += ": " + choices
	case q.Unit != "":
		hint += ", in " + q.Unit
	}
	fmt.Fprintf(t.w, "[%s] > ", hint)
}

// ranking writes the top three, one line each, with a bar on a colour terminal.
func (t *textGuide) ranking(r *guide.Ranking) {
	if r == nil {
		return
	}
	for i, l := range r.Leaders {
		if i == 3 {
			break
		}
		bar := ""
		if t.color {
			n := int(l.Probability*20 + 0.5)
			colour := "\x1b[33m"
			if l.Probability >= 0.95 {
				colour = "\x1b[32m"
			}
			bar = colour + strings.Repeat("█", n) + "\x1b[2m" + strings.Repeat("░", 20-n) + "\x1b[0m "
		}
		t.line("  %5.1f %% %s%s", 100*l.Probability, bar, l.Label)
	}
	if r.NotInCatalog >= 0.05 {
		t.line("  %5.1f %% not in the catalog", 100*r.NotInCatalog)
	}
}

func (t *textGuide) reply(line string, r guide.Reply) {
	if t.echo {
		t.line("%s", line)
	}
	switch r.Kind {
	case guide.Accepted:
		t.line("  saved %s", r.Key)
		for _, c := range r.Conflicts {
			t.fill(c, "  CONFLICT: ", "    ")
		}
	case guide.Continued:
		t.fill(r.Message, "  ", "  ")
	case guide.Refused:
		t.fill(r.Message, "  refused: ", "    ")
	case guide.Skipped:
		t.line("  skipped %s: not asked again", r.Key)
	case guide.Undone:
		t.line("  took back %s", r.Key)
	case guide.Why, guide.Help:
		for _, l := range r.Lines {
			if report.Width(l)+2 <= t.width {
				t.line("  %s", l) // the columns of the reasons survive
				continue
			}
			t.fill(l, "  ", "      ")
		}
	case guide.Picked:
		if r.Key != "" {
			t.line("  next: %s", r.Key)
		}
	case guide.Listed, guide.Quit:
	}
}

func (t *textGuide) done(st guide.Step, _ *guide.Reply) {
	d := st.Done
	t.line("")
	t.ranking(st.Ranking)
	t.fill("Done: "+d.Reason+".", "", "  ")
	if d.Leader.Label != "" {
		t.line("  leader: %s at %.1f %%", d.Leader.Label, 100*d.Leader.Probability)
	}
	if d.File == "" {
		t.line("  nothing was written")
		return
	}
	t.line("  evidence: %s (%s this session)", d.File, plural(st.Asked, "answer"))
	if r := st.Ranking; r != nil && r.NotInCatalog > d.Leader.Probability {
		t.fill(fmt.Sprintf("\"Not in the catalog\" is more likely (%.1f %%): the readings fit no known part well; check them, and the lead numbering.", 100*r.NotInCatalog), "  ", "  ")
	}
	if d.Leader.Device != "" {
		t.fill(fmt.Sprintf("The leader is not a regulator but a look-alike (%s: %s). swap does not replace it: fit the same kind of part, lead for lead.", d.Leader.Device, d.Leader.Title), "  ", "  ")
		t.line("  next: %s", guideNext(d))
		return
	}
	if d.Leader.Probability < 0.6 {
		t.fill("The identification is uncertain: read the reasons with 'whichreg infer "+d.File+"' before trusting a replacement.", "  ", "  ")
	}
	t.line("  next: %s", guideNext(d))
}

// guideNext is the command to run after the session: swap for a
// regulator, the catalog's drawing for a look-alike.
func guideNext(d *guide.Done) string {
	if d.Leader.Device != "" {
		return "whichreg catalog show " + shellQuote(d.Leader.Family)
	}
	return "whichreg swap " + shellQuote(d.File)
}

// shellQuote quotes s for a POSIX shell when it needs it.
func shellQuote(s string) string {
	if shellSafe().MatchString(s) {
		return s
	}
	return "'" + strings.ReplaceAll(s, "'", `'\''`) + "'"
}

var shellSafe = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`^[A-Za-z0-9_./+:-]+$`) })

func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return fmt.Sprintf("%d %ss", n, word)
}

package guide

import (
	"errors"
	"fmt"
	"slices"
	"sort"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/internal/tomledit"
)

// Kind is how a question's answer is written.
type Kind string

// The answer kinds of the JSON contract.
const (
	KindChoice Kind = "choice" // one of Question.Choices
	KindNumber Kind = "number" // a number with an optional unit or SI prefix
	KindText   Kind = "text"   // free text
)

// Question is one measurement the session can ask for.
type Question struct {
	Key     string   // the evidence key the answer fills, e.g. "pins.2.volts"
	Measure string   // a few words: what is measured
	Prompt  string   // plain words: what to connect where, power off or on
	Kind    Kind     // how the answer is written
	Choices []string // the allowed words of a choice; nil otherwise
	Unit    string   // the unit of a number ("V", "A"); "" otherwise
	Powered bool     // made with the equipment running
	Safety  string   // the caution to show before a powered measurement; "" when none
	// GainBits is the expected information gain over the leaders, in bits.
	GainBits float64
}

// Leader is one ranked hypothesis.
type Leader struct {
	Family      string  // catalog family id, e.g. "78xx"
	Package     string  // outline name, e.g. "TO-220"
	VoutV       float64 // output voltage with its sign; 0 when unknown
	Probability float64 // posterior probability, 0 to 1
	Label       string  // "78xx TO-220 5 V"
	Title       string  // the family's title, e.g. "positive adjustable, 1.5 A"
	// Device says what a look-alike that is not a regulator is ("npn",
	// "shunt-ref", …; the catalog's device words); "" for a regulator.
	Device string
}

// Ranking is what the identification makes of one evidence document.
type Ranking struct {
	Leaders      []Leader   // most probable first; may be empty
	NotInCatalog float64    // probability that the part is none of them
	Conflicts    []string   // contradictions in the evidence
	Reasons      []string   // the leader's reasons, one line each
	Questions    []Question // open measurements, most informative first
}

// Identifier loads and ranks an evidence document.
type Identifier interface {
	// Rank loads doc (its file is called name) with the evidence loader and
	// ranks it. An error means the loader refused the document; its message
	// names the key and is shown to the technician as it is.
	Rank(name string, doc []byte) (*Ranking, error)
}

// Options tune a [Session].
type Options struct {
	// Stop is the leader probability that ends the session (0.95 if zero).
	Stop float64
	// MinGain is the least expected gain, in bits, worth a question (0.05
	// if zero).
	MinGain float64
	// Save writes the whole document; it is called after every accepted
	// answer and every undo, and must replace the file atomically. An error
	// from Save ends the session (Reply returns it).
	Save func(name string, doc []byte) error
	// NewFile names the evidence file of a session started without one,
	// from the board reference the technician gives. When that file exists
	// already it returns its contents, and the session continues it instead
	// of writing a new one; doc is nil for a new file. An error is shown
	// and the reference asked again.
	NewFile func(ref string) (name string, doc []byte, err error)
}

// Step is what the session wants next: exactly one of Ask, Pick and Done is set.
type Step struct {
	Ask     *Question  // a question to ask
	Pick    []Question // the candidate measurements to choose from, by number
	Done    *Done      // the end of the session
	Ranking *Ranking   // the current ranking; nil before the first document
	Asked   int        // accepted answers so far in this session
}

// Done is how a session ended.
type Done struct {
	Reason string // why it ended, in words
	Leader Leader // the leader at the end; zero when nothing is ranked
	File   string // the evidence file; "" when none was written
}

// ReplyKind says what the session made of a line.
type ReplyKind string

// What a line can do.
const (
	Accepted ReplyKind = "accepted" // a value was written under Reply.Key
	Refused  ReplyKind = "refused"  // not written: Reply.Message says why; asked again
	Skipped  ReplyKind = "skipped"  // not asked again
	Undone   ReplyKind = "undone"   // the answer for Reply.Key was taken back
	Why      ReplyKind = "why"      // Reply.Lines are the leader's reasons
	Listed   ReplyKind = "listed"   // the next step is a Pick
	Picked   ReplyKind = "picked"   // the picked question is asked next
	Quit     ReplyKind = "quit"     // the session is over
	Help     ReplyKind = "help"     // Reply.Lines say what can be typed
	// Continued: the board reference named an existing file, which the
	// session goes on with (Reply.Message says so).
	Continued ReplyKind = "continued"
)

// Reply is the session's answer to one line.
type Reply struct {
	Kind      ReplyKind // what the session did with the line
	Key       string    // the key answered, skipped, undone or picked
	Message   string    // Refused: why, with the loader's message
	Conflicts []string  // Accepted: conflicts the answer brought
	Lines     []string  // Why: the leader's reasons
}

// refKey is the question asked first when there is no file yet.
const refKey = "ref"

type entry struct {
	key string
	doc []byte
}

// Session is one guided measuring session. It is not safe for concurrent use.
type Session struct {
	id      Identifier
	opts    Options
	name    string
	doc     []byte
	rank    *Ranking
	history []entry
	skipped map[string]bool
	picked  *Question
	picking []Question
	done    *Done
}

// New starts a session on the document doc of the file name. With name ""
// the session first asks for the board reference and names a new file
// after it (Options.NewFile). It returns the loader's error when doc does
// not load.
func New(id Identifier, name string, doc []byte, opts Options) (*Session, error) {
	if opts.Stop == 0 {
		opts.Stop = 0.95
	}
	if opts.MinGain == 0 {
		opts.MinGain = 0.05
	}
	s := &Session{id: id, opts: opts, name: name, doc: doc, skipped: map[string]bool{}}
	if name != "" {
		r, err := id.Rank(name, doc)
		if err != nil {
			return nil, err
		}
		s.rank = r
	}
	return s, nil
}

// Document returns the current evidence document and its file name.
func (s *Session) Document() (name string, doc []byte) { return s.name, s.doc }

// Asked returns how many answers the session has accepted (less undone ones).
func (s *Session) Asked() int { return len(s.history) }

// Next returns the next step. Once it has returned a Done, the session is
// over and every later call returns the same Done.
func (s *Session) Next() Step {
	st := Step{Ranking: s.rank, Asked: len(s.history)}
	switch {
	case s.done != nil:
		st.Done = s.done
	case s.rank == nil:
		st.Ask = &Question{Key: refKey, Measure: "board reference",
			Prompt: "The board reference printed beside the part (U4, IC3, VR1); the evidence file is named after it.", Kind: KindText}
	case s.picking != nil:
		st.Pick = s.picking
	case s.picked != nil:
		st.Ask = s.picked
	default:
		lead := s.leader()
		qs := s.open()
		lv := leadVoltage(qs)
		switch {
		case lead.Probability >= s.opts.Stop:
			st.Done = s.finish(fmt.Sprintf("the leader reached %.0f %%", 100*s.opts.Stop))
		case worth(qs, s.opts.MinGain) >= 0:
			st.Ask = &qs[worth(qs, s.opts.MinGain)]
		case lv != nil:
			st.Ask = lv
		default:
			st.Done = s.finish(fmt.Sprintf("no remaining measurement is worth asking (expected gain under %g bit)", s.opts.MinGain))
		}
	}
	return st
}

// worth returns the index of the first question expected to gain at least
// least bits, or -1.
func worth(qs []Question, least float64) int {
	for i, q := range qs {
		if q.GainBits >= least {
			return i
		}
	}
	return -1
}

// leadVoltage returns the first open question for a lead's voltage.
//
// The expected gain of a lead voltage is estimated from coarse classes of
// outcome: a true ground and a lifted ground (a 5 V part raised to 6.1 V by
// a divider) are one class, so a reading that would settle the question can
// be estimated at almost nothing. Each lead's voltage is one touch of a
// probe and the first thing a technician measures, so the session asks every
// open lead voltage once before it gives up short of the stop probability.
func leadVoltage(qs []Question) *Question {
	for i := range qs {
		if strings.HasPrefix(qs[i].Key, "pins.") && strings.HasSuffix(qs[i].Key, ".volts") {
			return &qs[i]
		}
	}
	return nil
}

// Quit ends the session with the reason given (the front end's, for a
// closed input) and returns the end.
func (s *Session) Quit(reason string) *Done {
	if s.done == nil {
		s.finish(reason)
	}
	return s.done
}

func (s *Session) finish(reason string) *Done {
	s.done = &Done{Reason: reason, Leader: s.leader(), File: s.name}
	return s.done
}

func (s *Session) leader() Leader {
	if s.rank == nil || len(s.rank.Leaders) == 0 {
		return Leader{}
	}
	return s.rank.Leaders[0]
}

// open returns the ranked questions neither skipped nor answered in this
// session (an illegible marking stays open to the identification, but the
// technician has already looked), best first.
func (s *Session) open() []Question {
	answered := map[string]bool{}
	for _, e := range s.history {
		answered[e.key] = true
	}
	var out []Question
	for _, q := range s.rank.Questions {
		if !s.skipped[q.Key] && !answered[q.Key] {
			out = append(out, q)
		}
	}
	// The most information per effort first: a look or a probe before an
	// oscilloscope, both before a bench test.
	sort.SliceStable(out, func(i, j int) bool {
		return out[i].GainBits/out[i].Effort() > out[j].GainBits/out[j].Effort()
	})
	return out
}

// Effort is the relative work of the measurement, by its key: 1 for a look
// at the part, an ohmmeter reading or one touch of a probe; 2 for a current
// (the circuit broken or a shunt found) or an oscilloscope trace; 4 for a
// bench test with the part fed from a bench supply. Common practice, no
// source: the weights order questions of similar gain, they do not decide
// when to stop.
func (q Question) Effort() float64 {
	switch key := q.Key; {
	case key == "package" || key == "marking" || strings.HasPrefix(key, "pins.") || strings.HasPrefix(key, "case."):
		return 1
	case strings.HasPrefix(key, "bench."):
		return 4
	}
	return 2
}

// Reply takes one line typed by the technician. The error is not nil only
// when saving the document failed; the session is then over.
func (s *Session) Reply(line string) (Reply, error) {
	line = strings.TrimSpace(line)
	st := s.Next()
	switch {
	case st.Done != nil:
		return Reply{Kind: Quit}, nil
	case isQuit(line):
		s.finish("quit")
		return Reply{Kind: Quit}, nil
	case st.Pick != nil:
		return s.pick(line), nil
	}
	q := *st.Ask
	switch strings.ToLower(line) {
	case "skip":
		if q.Key == refKey {
			return Reply{Kind: Refused, Key: q.Key, Message: "the board reference names the file: give one (any short name will do)"}, nil
		}
		s.skipped[q.Key] = true
		s.picked = nil
		return Reply{Kind: Skipped, Key: q.Key}, nil
	case "back":
		return s.back()
	case "why":
		if s.rank == nil || len(s.rank.Leaders) == 0 {
			return Reply{Kind: Why, Lines: []string{"nothing is ranked yet"}}, nil
		}
		return Reply{Kind: Why, Lines: append([]string{s.rank.Leaders[0].Label + ":"}, s.rank.Reasons...)}, nil
	case "list":
		if s.rank == nil {
			return Reply{Kind: Refused, Key: q.Key, Message: "give the board reference first"}, nil
		}
		s.picking = s.open()
		if len(s.picking) == 0 {
			s.picking = nil
			return Reply{Kind: Refused, Key: q.Key, Message: "no other measurement is open"}, nil
		}
		return Reply{Kind: Listed}, nil
	case "":
		return Reply{Kind: Refused, Key: q.Key, Message: "type a value, or skip, back, why, list or quit"}, nil
	case "help":
		return Reply{Kind: Help, Lines: helpLines}, nil
	}
	if q.Key == refKey {
		return s.start(line)
	}
	if key, value, ok := keyed(line); ok {
		return s.answer(Question{Key: key, Kind: KindText}, value)
	}
	return s.answer(q, line)
}

// keyed splits a direct answer "pins.2.volts = 5.01", which fills any
// evidence key, not only the one asked.
func keyed(line string) (key, value string, ok bool) {
	key, value, ok = strings.Cut(line, "=")
	key, value = strings.TrimSpace(key), strings.TrimSpace(value)
	if !ok || key == "" || value == "" || strings.ContainsAny(key, " \t\"'") {
		return "", "", false
	}
	if t, err := fieldType(key); err != nil || !isLeaf(t) {
		return "", "", false
	}
	return key, strings.Trim(value, `"`), true
}

// helpLines say what can be typed at a prompt.
var helpLines = []string{
	"a value: 12.1, -15.02 V, 4k7, 450m, a word of the choices (or its first letters)",
	"KEY = VALUE: fill another evidence key, e.g. output.amps = 0.45",
	"skip: this cannot be measured; do not ask it again",
	"back: take back the last answer",
	"why: the leader's reasons",
	"list: the other measurements worth making, to pick one",
	"quit: end the session; every answer is already saved",
}

func isQuit(line string) bool {
	switch strings.ToLower(line) {
	case "quit", "q", "exit":
		return true
	}
	return false
}

// answer writes the value, loads the result and saves it when it loads.
func (s *Session) answer(q Question, line string) (Reply, error) {
	v, err := valueFor(q, line)
	if err != nil {
		return Reply{Kind: Refused, Key: q.Key, Message: err.Error()}, nil
	}
	doc, err := tomledit.Set(s.doc, q.Key, v)
	if err != nil {
		return Reply{Kind: Refused, Key: q.Key, Message: err.Error()}, nil
	}
	r, err := s.id.Rank(s.name, doc)
	if err != nil {
		return Reply{Kind: Refused, Key: q.Key, Message: "not written: " + err.Error()}, nil
	}
	if err := s.opts.Save(s.name, doc); err != nil {
		s.finish("the evidence file could not be written")
		return Reply{}, err
	}
	var fresh []string
	for _, c := range r.Conflicts {
		if !slices.Contains(s.rank.Conflicts, c) {
			fresh = append(fresh, c)
		}
	}
	s.history = append(s.history, entry{q.Key, s.doc})
	s.doc, s.rank, s.picked = doc, r, nil
	return Reply{Kind: Accepted, Key: q.Key, Conflicts: fresh}, nil
}

// start makes the new document of a session begun without a file.
func (s *Session) start(ref string) (Reply, error) {
	name, old, err := s.opts.NewFile(ref)
	if err != nil {
		return Reply{Kind: Refused, Key: refKey, Message: err.Error()}, nil
	}
	if old != nil {
		r, err := s.id.Rank(name, old)
		if err != nil {
			return Reply{Kind: Refused, Key: refKey, Message: fmt.Sprintf("%s exists and does not load (%v); mend it, or give another reference", name, err)}, nil
		}
		s.name, s.doc, s.rank = name, old, r
		return Reply{Kind: Continued, Key: refKey, Message: name + " exists: continuing it"}, nil
	}
	doc, err := tomledit.Set([]byte(newHeader), refKey, ref)
	if err != nil {
		return Reply{Kind: Refused, Key: refKey, Message: err.Error()}, nil
	}
	r, err := s.id.Rank(name, doc)
	if err != nil {
		return Reply{Kind: Refused, Key: refKey, Message: "not written: " + err.Error()}, nil
	}
	if err := s.opts.Save(name, doc); err != nil {
		s.finish("the evidence file could not be written")
		return Reply{}, err
	}
	s.name, s.doc, s.rank = name, doc, r
	return Reply{Kind: Accepted, Key: refKey, Conflicts: r.Conflicts}, nil
}

// newHeader opens an evidence file the guide starts.
const newHeader = `# Evidence about one unmarked three-terminal part, written by 'whichreg guide'.
# Every value is as it was measured; edit by hand or run the guide again.
`

// back undoes the last accepted answer and saves the document before it.
func (s *Session) back() (Reply, error) {
	if len(s.history) == 0 {
		return Reply{Kind: Refused, Message: "nothing to take back"}, nil
	}
	last := s.history[len(s.history)-1]
	r, err := s.id.Rank(s.name, last.doc)
	if err != nil {
		return Reply{}, errors.Join(errors.New("the document before the last answer no longer loads"), err)
	}
	if err := s.opts.Save(s.name, last.doc); err != nil {
		s.finish("the evidence file could not be written")
		return Reply{}, err
	}
	s.history = s.history[:len(s.history)-1]
	s.doc, s.rank, s.picked = last.doc, r, nil
	return Reply{Kind: Undone, Key: last.key}, nil
}

// pick takes the number (or key) of a listed measurement.
func (s *Session) pick(line string) Reply {
	list := s.picking
	if n, err := strconv.Atoi(line); err == nil && n >= 1 && n <= len(list) {
		s.picking, s.picked = nil, &list[n-1]
		return Reply{Kind: Picked, Key: list[n-1].Key}
	}
	for i := range list {
		if list[i].Key == line {
			s.picking, s.picked = nil, &list[i]
			return Reply{Kind: Picked, Key: line}
		}
	}
	if line == "" || line == "back" {
		s.picking = nil
		return Reply{Kind: Picked}
	}
	return Reply{Kind: Refused, Message: fmt.Sprintf("pick a number from 1 to %d, or press Enter to go on", len(list))}
}

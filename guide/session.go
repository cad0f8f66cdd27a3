package guide

import (
	"fmt"
	"sort"
	"strings"
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

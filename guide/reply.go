package guide

import (
	"errors"
	"fmt"
	"slices"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/internal/tomledit"
)

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

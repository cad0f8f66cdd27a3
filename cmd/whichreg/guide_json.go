package main

import (
	"encoding/json"
	"io"

	"github.com/whichreg/whichreg/guide"
	"github.com/whichreg/whichreg/report"
)

// jsonGuide speaks JSON lines (DESIGN.md's guide contract): one object per step.
type jsonGuide struct{ w io.Writer }

type guideAskJSON struct {
	Key      string   `json:"key"`
	Prompt   string   `json:"prompt"`
	Kind     string   `json:"kind"`
	Choices  []string `json:"choices"`
	Unit     string   `json:"unit"`
	Measure  string   `json:"measure"`
	Powered  bool     `json:"powered"`
	Safety   string   `json:"safety,omitempty"`
	GainBits float64  `json:"gain_bits"`
}

type guideLeaderJSON struct {
	Family      string   `json:"family"`
	Package     string   `json:"package"`
	Vout        *float64 `json:"vout"`
	Probability float64  `json:"probability"`
	Device      string   `json:"device,omitempty"`
}

type guideReplyJSON struct {
	Kind      string   `json:"kind"`
	Key       string   `json:"key,omitempty"`
	Message   string   `json:"message,omitempty"`
	Conflicts []string `json:"conflicts,omitempty"`
	Lines     []string `json:"lines,omitempty"`
}

type guideDoneJSON struct {
	Reason       string           `json:"reason"`
	Leader       *guideLeaderJSON `json:"leader"`
	EvidenceFile *string          `json:"evidence_file"`
	Asked        int              `json:"asked"`
	Next         string           `json:"next,omitempty"`
}

type guideJSON struct {
	Schema    string            `json:"schema"`
	Ask       *guideAskJSON     `json:"ask,omitempty"`
	Pick      []guideAskJSON    `json:"pick,omitempty"`
	Done      *guideDoneJSON    `json:"done,omitempty"`
	Ranking   []guideLeaderJSON `json:"ranking"`
	Conflicts []string          `json:"conflicts"`
	Reply     *guideReplyJSON   `json:"reply,omitempty"`
}

func askJSON(q guide.Question) guideAskJSON {
	ch := q.Choices
	if ch == nil {
		ch = []string{}
	}
	return guideAskJSON{Key: q.Key, Prompt: q.Prompt, Kind: string(q.Kind), Choices: ch, Unit: q.Unit,
		Measure: q.Measure, Powered: q.Powered, Safety: q.Safety, GainBits: round(q.GainBits, 4)}
}

func leaderJSON(l guide.Leader) guideLeaderJSON {
	return guideLeaderJSON{l.Family, l.Package, report.NonZero(l.VoutV), round(l.Probability, 6), l.Device}
}

func (j *jsonGuide) object(st guide.Step, last *guide.Reply) guideJSON {
	o := guideJSON{Schema: report.Schema("guide"), Ranking: []guideLeaderJSON{}, Conflicts: []string{}}
	if st.Ranking != nil {
		for _, l := range st.Ranking.Leaders {
			o.Ranking = append(o.Ranking, leaderJSON(l))
		}
		if st.Ranking.Conflicts != nil {
			o.Conflicts = st.Ranking.Conflicts
		}
	}
	if last != nil {
		o.Reply = &guideReplyJSON{string(last.Kind), last.Key, last.Message, last.Conflicts, last.Lines}
	}
	return o
}

func (j *jsonGuide) write(o guideJSON) {
	b, err := json.Marshal(o)
	if err != nil {
		panic(err) // plain structs of strings and numbers always marshal
	}
	j.w.Write(append(b, '\n'))
}

func (j *jsonGuide) step(st guide.Step, last *guide.Reply) {
	o := j.object(st, last)
	if st.Pick != nil {
		o.Pick = []guideAskJSON{}
		for _, q := range st.Pick {
			o.Pick = append(o.Pick, askJSON(q))
		}
	} else {
		a := askJSON(*st.Ask)
		o.Ask = &a
	}
	j.write(o)
}

func (j *jsonGuide) reply(string, guide.Reply) {}

func (j *jsonGuide) done(st guide.Step, last *guide.Reply) {
	o := j.object(st, last)
	d := &guideDoneJSON{Reason: st.Done.Reason, Asked: st.Asked}
	if st.Done.Leader.Family != "" {
		l := leaderJSON(st.Done.Leader)
		d.Leader = &l
	}
	if f := st.Done.File; f != "" {
		d.EvidenceFile = &f
		d.Next = guideNext(st.Done)
	}
	o.Done = d
	j.write(o)
}

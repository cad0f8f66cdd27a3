package main

import (
	"encoding/json"
	"io"

	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
	"github.com/whichreg/whichreg/record"
	"github.com/whichreg/whichreg/report"
)

// swapDoc is the JSON document of `whichreg swap` (schema
// whichreg/swap/v1, docs/schema/swap.v1.json).
type swapDoc struct {
	Schema       string           `json:"schema"`
	Original     originalDoc      `json:"original"`
	Replacements []replacementDoc `json:"replacements"`
	Conditions   conditionsDoc    `json:"conditions"`
	Assumptions  []string         `json:"assumptions"`
	// Hidden counts the unsuitable candidates left out (--all shows them).
	Hidden int `json:"hidden"`
}

// originalDoc is the part replaced.
type originalDoc struct {
	Family      string   `json:"family"`
	Outline     string   `json:"outline"`
	VoutV       *float64 `json:"vout_v"`
	Probability float64  `json:"probability"`
	// FromInfer is true when the original is identification's leader, false
	// when it was named with --original.
	FromInfer bool `json:"from_infer"`
	// Shortfalls are the checks the original itself fails in this circuit.
	Shortfalls []shortfallDoc `json:"shortfalls"`
}

// shortfallDoc is a check the original part fails in this circuit too.
type shortfallDoc struct {
	Check    checkDoc `json:"check"`
	Text     string   `json:"text"`      // the summary sentence
	PassedBy *string  `json:"passed_by"` // the best usable candidate that passes it; null when none
}

// replacementDoc is one candidate and its checks.
type replacementDoc struct {
	Family      string     `json:"family"`
	Outline     string     `json:"outline"`
	VoutV       *float64   `json:"vout_v"`
	Verdict     string     `json:"verdict"`
	Deciding    string     `json:"deciding"`
	DecidingWhy string     `json:"deciding_why"`
	Checks      []checkDoc `json:"checks"`
	Install     []string   `json:"install"`
}

// checkDoc is one check row (DESIGN.md: value, limit, unit, margin, status,
// one sentence), its figures as numbers in the SI unit named by unit.
type checkDoc struct {
	Check     string   `json:"check"`
	Value     *float64 `json:"value"`
	Limit     *float64 `json:"limit"`
	Unit      *string  `json:"unit"`
	Margin    float64  `json:"margin"`
	Status    string   `json:"status"`
	Text      string   `json:"text"`
	ValueText string   `json:"value_text"`
	LimitText string   `json:"limit_text"`
	Action    *string  `json:"action"`
}

// conditionsDoc is the circuit the checks used, at its worst corners.
type conditionsDoc struct {
	VoutV       float64     `json:"vout_v"`
	LoadMaxA    float64     `json:"load_max_a"`
	LoadAssumed bool        `json:"load_assumed"`
	LoadMinA    float64     `json:"load_min_a"`
	InputSource string      `json:"input_source"`
	TroughV     float64     `json:"trough_v"`
	TroughAt    string      `json:"trough_at"`
	PeakV       float64     `json:"peak_v"`
	PeakAt      string      `json:"peak_at"`
	HotInV      float64     `json:"hot_in_v"`
	ColdInV     float64     `json:"cold_in_v"`
	TransientV  *float64    `json:"transient_v"`
	AmbientC    float64     `json:"ambient_c"`
	HeatsinkCPW *float64    `json:"heatsink_c_per_w"`
	Insulator   string      `json:"insulator"`
	Grounded    bool        `json:"grounded"`
	BypassOhm   *float64    `json:"bypass_ohm"`
	OldTabV     *float64    `json:"old_tab_v"`
	Corners     *cornersDoc `json:"corners"`
	// InputConflict says why the [input] description was set aside for the
	// IN lead's reading; null when they agree.
	InputConflict *string `json:"input_conflict"`
}

// signedV returns a hypothesis's output voltage, signed, or nil when unknown.
func signedV(h infer.Hypothesis) *float64 {
	if h.VoutV == 0 {
		return nil
	}
	v := signedVout(h)
	return &v
}

func checkDocOf(ch replace.Check) checkDoc {
	return checkDoc{Check: string(ch.Name), Value: sigPtr(ch.Value), Limit: sigPtr(ch.Limit), Unit: orNull(ch.Unit),
		Margin: round(ch.Margin, 4), Status: string(ch.Status), Text: ch.Text, ValueText: ch.ValueText, LimitText: ch.LimitText,
		Action: orNull(ch.Action)}
}

func conditionsDocOf(c replace.Conditions) conditionsDoc {
	s := report.Sig
	return conditionsDoc{VoutV: s(c.VoutV), LoadMaxA: s(c.LoadMaxA), LoadAssumed: c.LoadAssumed, LoadMinA: s(c.LoadMinA),
		InputSource: string(c.Source), TroughV: s(c.TroughV), TroughAt: c.TroughAt, PeakV: s(c.PeakV), PeakAt: c.PeakAt,
		HotInV: s(c.HotInV), ColdInV: s(c.ColdInV), TransientV: positive(c.TransientV, 1), AmbientC: c.AmbientC,
		HeatsinkCPW: positive(c.HeatsinkCW, 1), Insulator: c.Insulator, Grounded: c.Grounded, BypassOhm: positive(c.BypassOhm, 1),
		OldTabV: sigPtr(c.OldTabV), Corners: cornersDocOf(c.Corners), InputConflict: orNull(c.InputConflict)}
}

func swapDocOf(res *replace.Result) swapDoc {
	o := res.Original
	d := swapDoc{Schema: report.Schema("swap"),
		Original:    originalDoc{o.Family.ID, o.Package.Outline, signedV(o.Hypothesis), round(o.Probability, 6), !o.Named, []shortfallDoc{}},
		Assumptions: nonNil(res.Assumptions), Conditions: conditionsDocOf(res.Conditions), Hidden: res.Hidden, Replacements: []replacementDoc{}}
	for _, sf := range res.OriginalShortfalls {
		sd := shortfallDoc{Check: checkDocOf(sf.Check), Text: sf.Sentence(o.Label())}
		if sf.PassedBy != "" {
			sd.PassedBy = &sf.PassedBy
		}
		d.Original.Shortfalls = append(d.Original.Shortfalls, sd)
	}
	for _, r := range res.Replacements {
		rd := replacementDoc{Family: r.Family.ID, Outline: r.Package.Outline, VoutV: signedV(r.Hypothesis), Verdict: string(r.Verdict),
			Deciding: string(r.Deciding), DecidingWhy: r.DecidingWhy, Checks: []checkDoc{}, Install: nonNil(r.Install)}
		for _, ch := range r.Checks {
			rd.Checks = append(rd.Checks, checkDocOf(ch))
		}
		d.Replacements = append(d.Replacements, rd)
	}
	return d
}

// writeRecordJSON writes the record as its JSON document (schema
// whichreg/record/v1, docs/schema/record.v1.json): the record package's
// fields, with the circuit conditions in the same shape as swap's (SI
// units in the keys, null for what is not there).
func writeRecordJSON(w io.Writer, rec record.Record) error {
	ch := rec.Chosen
	chosen := chosenDoc{Family: ch.Family, Outline: ch.Package, VoutV: ch.VoutV, Verdict: string(ch.Verdict), Deciding: ch.Deciding,
		Summary: ch.Summary, Checks: []checkDoc{}, Install: nonNil(ch.Install), OrderCodes: nonNil(ch.OrderCodes), LeadMap: []leadLinkDoc{},
		Rewire: ch.Rewire, DatasheetOf: ch.DatasheetOf}
	for _, c := range ch.Checks {
		chosen.Checks = append(chosen.Checks, checkDocOf(c))
	}
	for _, l := range ch.LeadMap {
		ld := leadLinkDoc{New: l.New, Function: l.Fn}
		if l.Old > 0 {
			old := l.Old
			ld.Old = &old
		}
		chosen.LeadMap = append(chosen.LeadMap, ld)
	}
	ident := []inferCandDoc{}
	for _, c := range rec.Identification {
		cd := inferCandDoc{Family: c.Family, Outline: c.Package, VoutV: c.VoutV, Probability: c.Probability, Score: finite(c.Score, 4),
			Reasons: []reasonDoc{}}
		for _, r := range c.Reasons {
			cd.Reasons = append(cd.Reasons, reasonDoc{r.Evidence, finite(r.Weight, 4), r.Text})
		}
		ident = append(ident, cd)
	}
	doc := struct {
		Schema string `json:"schema"`
		record.Record
		Identification []inferCandDoc `json:"identification"`
		Chosen         chosenDoc      `json:"chosen"`
		Conditions     conditionsDoc  `json:"conditions"`
	}{report.Schema("record"), rec, ident, chosen, conditionsDocOf(rec.Conditions)}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(doc)
}

// chosenDoc is the chosen replacement in the record's JSON.
type chosenDoc struct {
	Family      string        `json:"family"`
	Outline     string        `json:"outline"`
	VoutV       *float64      `json:"vout_v"`
	Verdict     string        `json:"verdict"`
	Deciding    string        `json:"deciding"`
	Summary     string        `json:"summary"`
	Checks      []checkDoc    `json:"checks"`
	Install     []string      `json:"install"`
	OrderCodes  []string      `json:"order_codes"`
	LeadMap     []leadLinkDoc `json:"lead_map"`
	Rewire      bool          `json:"rewire"`
	DatasheetOf string        `json:"datasheet_of"`
}

// leadLinkDoc maps a terminal of the new part to the old part's pad with
// the same function (old null: no counterpart). Terminals count from 1;
// on a can the case is the last.
type leadLinkDoc struct {
	New      int    `json:"new"`
	Old      *int   `json:"old"`
	Function string `json:"function"`
}

// Package record builds the substitution record a technician files with a
// repair — the evidence and bench notes, the identification, the chosen
// replacement's checks and install notes, the runners-up and why not, the
// circuit numbers and assumptions, the safety cautions and sign-off lines —
// and writes it as Markdown, JSON or an SVG drawing of the lead mapping.
//
// It owns the record's policies: a record of an unsuitable choice is
// refused unless overridden with a reason ([Guard]), the runners-up are the
// best four current parts with the truthful reason each ranks below the
// first, and the cautions every record carries ([SafetyCautions]).
package record

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strings"
	"sync"
	"time"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/infer"
	"github.com/whichreg/whichreg/infer/replace"
)

// SafetyCautions are written into every record (DESIGN.md "Safety").
func SafetyCautions() []string {
	return []string{
		"Mains voltage is present inside the equipment whenever it is plugged in, including fuse holders, switches and the transformer primary. Unplug it before working on it; measure powered circuits with one hand, insulated probes and, where appropriate, an isolating transformer.",
		"Filter capacitors hold their charge after switch-off. Discharge them through a resistor and confirm with a meter before touching the board or desoldering.",
		"Regulator tabs and cans are often live (a 79xx tab is its input, a 317 tab its output, a lifted ground sits above chassis) and can short a rail to a grounded heat sink or chassis. Check the insulation with an ohmmeter before power-up.",
		"Regulators, heat sinks and bypass or load resistors get hot enough to burn. Let them cool before touching.",
		"Confirm the chosen part against the maker's current datasheet. Follow local electrical codes and qualified practice; where the work requires a licensed person, use one.",
	}
}

// ErrUnsuitable is returned (wrapped) by [Guard] for a choice whose verdict
// is unsuitable and no override reason.
var ErrUnsuitable = errors.New("the chosen part is unsuitable")

// LowConfidence is the original's probability below which a record warns
// that the identification is uncertain.
const LowConfidence = 0.6

// Guard refuses a record of an unsuitable choice unless override gives a
// reason; the error names the failing checks.
func Guard(chosen *replace.Replacement, override string) error {
	if chosen.Verdict != replace.Unsuitable || strings.TrimSpace(override) != "" {
		return nil
	}
	var fails []string
	for _, ch := range chosen.Checks {
		if ch.Status == replace.Fail {
			fails = append(fails, fmt.Sprintf("%s: %s", ch.Name, ch.Text))
		}
	}
	return fmt.Errorf("%w: %s %s", ErrUnsuitable, chosen.Label(), strings.Join(fails, "; "))
}

// Candidate is one identification candidate in the record.
type Candidate struct {
	Family      string         `json:"family"`      // the catalog family id
	Package     string         `json:"outline"`     // the outline name (TO-220)
	VoutV       *float64       `json:"vout_v"`      // signed; null when unknown
	Probability float64        `json:"probability"` // posterior, 0…1
	Score       float64        `json:"score"`       // the sum of the reasons' weights (natural log)
	Reasons     []infer.Reason `json:"reasons"`     // why, one per piece of evidence
}

// Original is the part replaced.
type Original struct {
	Family      string   `json:"family"`      // the catalog family id
	Package     string   `json:"outline"`     // the outline name (TO-220)
	VoutV       *float64 `json:"vout_v"`      // signed
	Probability float64  `json:"probability"` // identification's posterior, 0…1
	Named       bool     `json:"named"`       // named by the technician rather than identification's leader
}

// Chosen is the chosen replacement with its checks.
type Chosen struct {
	Family      string          `json:"family"`       // the catalog family id
	Package     string          `json:"outline"`      // the outline name (TO-220)
	VoutV       *float64        `json:"vout_v"`       // signed
	Verdict     replace.Verdict `json:"verdict"`      // drop-in, needs work or unsuitable
	Deciding    string          `json:"deciding"`     // the check that set the verdict
	Summary     string          `json:"summary"`      // the verdict in one sentence
	Checks      []replace.Check `json:"checks"`       // every check that applies, in order
	Install     []string        `json:"install"`      // fitting instructions, as sentences
	OrderCodes  []string        `json:"order_codes"`  // examples of current order codes
	LeadMap     []replace.Link  `json:"lead_map"`     // new terminal → old pad
	Rewire      bool            `json:"rewire"`       // the leads do not go straight into the old holes
	DatasheetOf string          `json:"datasheet_of"` // the catalog's source for the family
}

// RunnerUp is a candidate that was not chosen, and why.
type RunnerUp struct {
	Candidate string          `json:"candidate"` // family, outline and output, as a label
	Verdict   replace.Verdict `json:"verdict"`   // its own verdict
	WhyNot    string          `json:"why_not"`   // why it was not the choice
}

// Record is everything a substitution record holds.
type Record struct {
	Title          string             `json:"title"`              // the record's heading
	Ref            string             `json:"ref"`                // board reference from the evidence
	Equipment      string             `json:"equipment"`          // the equipment from the evidence
	Date           string             `json:"date"`               // when the record was made, YYYY-MM-DD
	Tool           string             `json:"tool"`               // "whichreg VERSION"
	CatalogSHA256  string             `json:"catalog_sha256"`     // the catalog's content hash
	EvidenceFile   string             `json:"evidence_file"`      // the evidence file's name as given
	Override       string             `json:"override,omitempty"` // the reason an unsuitable choice was recorded anyway
	Warnings       []string           `json:"warnings"`           // low confidence and the like
	BenchNotes     []string           `json:"bench_notes"`        // the evidence file's comments
	Evidence       *infer.Evidence    `json:"evidence"`           // the measurements the decision rests on
	Identification []Candidate        `json:"identification"`     // the leading candidates
	NotInCatalog   float64            `json:"not_in_catalog"`     // probability that the part is none of the catalog's
	Conflicts      []string           `json:"conflicts"`          // evidence that contradicts itself
	Original       Original           `json:"original"`           // the part replaced
	Chosen         Chosen             `json:"chosen"`             // the replacement fitted
	RunnersUp      []RunnerUp         `json:"runners_up"`         // other candidates and why not
	Conditions     replace.Conditions `json:"conditions"`         // the circuit conditions checked against
	Assumptions    []string           `json:"assumptions"`        // what was taken where the evidence was silent
	Safety         []string           `json:"safety"`             // the usual cautions
	SignOff        map[string]string  `json:"sign_off"`           // blanks for the technician: who fitted and verified it, when, what was measured
	negative       bool               // the rail is negative (for the Markdown)
}

// Input is what [Build] needs.
type Input struct {
	Catalog        *catalog.Catalog     // the merged catalog (its hash goes in the record)
	Evidence       *infer.Evidence      // the loaded evidence
	EvidenceSource []byte               // the evidence file as written (for its comments); may be nil
	Identification *infer.Result        // from [infer.Identify]
	Swap           *replace.Result      // from [replace.Swap]
	Chosen         *replace.Replacement // one of Swap.Replacements
	Override       string               // reason for recording an unsuitable choice
	Date           time.Time            // the record's date
	Tool           string               // "whichreg VERSION"
}

// Build assembles the record.
func Build(in Input) Record {
	ev, ires, sres, ch := in.Evidence, in.Identification, in.Swap, in.Chosen
	rec := Record{
		Title: "Regulator substitution record", Ref: ev.Ref, Equipment: ev.Equipment,
		Date: in.Date.Format("2006-01-02"), Tool: in.Tool, CatalogSHA256: in.Catalog.Hash(),
		EvidenceFile: ev.File, Override: strings.TrimSpace(in.Override), Evidence: ev,
		BenchNotes: BenchNotes(in.EvidenceSource), NotInCatalog: round(ires.NotInCatalog, 6), Conflicts: ires.Conflicts,
		Conditions: sres.Conditions, Assumptions: sres.Assumptions, Safety: SafetyCautions(),
		SignOff:  map[string]string{"fitted_by": "", "fitted_date": "", "verified_by": "", "verified_date": "", "measured_output_v": "", "case_temp_after_10_min_c": ""},
		negative: sres.Original.Family.Negative(),
	}
	o := sres.Original
	rec.Original = Original{o.Family.ID, o.Package.Outline, signedVout(o.Hypothesis), round(o.Probability, 6), o.Named}
	if !o.Named && o.Probability < LowConfidence {
		rec.Warnings = append(rec.Warnings, fmt.Sprintf("the original %s is identification's leader at only %.0f %%: make the suggested measurements, or name it with --original", o.Label(), 100*o.Probability))
	}
	if c := sres.Conditions.InputConflict; c != "" {
		rec.Warnings = append(rec.Warnings, c)
	}
	for _, sf := range sres.OriginalShortfalls {
		rec.Warnings = append(rec.Warnings, sf.Sentence(o.Label()))
	}
	if ch.Verdict == replace.Unsuitable {
		rec.Warnings = append(rec.Warnings, fmt.Sprintf("%s is unsuitable here and was recorded on the technician's override: %s", ch.Label(), rec.Override))
	}
	for i := 0; i < len(ires.Candidates) && len(rec.Identification) < 5; i++ {
		cd := ires.Candidates[i]
		if math.IsInf(cd.Score, -1) {
			continue // ruled out (JSON has no −Inf)
		}
		rs := make([]infer.Reason, len(cd.Reasons))
		for k, r := range cd.Reasons {
			rs[k] = infer.Reason{Evidence: r.Evidence, Weight: round(r.Weight, 4), Text: r.Text}
		}
		rec.Identification = append(rec.Identification, Candidate{cd.Family.ID, cd.Package.Outline, signedVout(cd.Hypothesis), round(cd.Probability, 6), round(cd.Score, 4), rs})
	}
	rec.Chosen = chosen(in)
	rec.RunnersUp = RunnersUp(sres, ch, 4)
	for _, s := range []*[]string{&rec.Conflicts, &rec.Assumptions, &rec.Warnings, &rec.BenchNotes} {
		if *s == nil {
			*s = []string{}
		}
	}
	return rec
}

func chosen(in Input) Chosen {
	ch, o := in.Chosen, in.Swap.Original
	checks := make([]replace.Check, len(ch.Checks))
	for i, k := range ch.Checks {
		k.Margin = round(k.Margin, 4)
		for _, p := range []**float64{&k.Value, &k.Limit} {
			if *p != nil {
				v := round(**p, 6)
				*p = &v
			}
		}
		checks[i] = k
	}
	c := Chosen{Family: ch.Family.ID, Package: ch.Package.Outline, VoutV: signedVout(ch.Hypothesis), Verdict: ch.Verdict,
		Deciding: string(ch.Deciding), Summary: ch.Summary(), Checks: checks, Install: ch.Install,
		OrderCodes: ch.Package.OrderCodes, LeadMap: replace.LeadMap(o.Hypothesis, ch.Hypothesis), DatasheetOf: ch.Family.Source}
	if c.Install == nil {
		c.Install = []string{}
	}
	if c.OrderCodes == nil {
		c.OrderCodes = []string{}
	}
	for i, l := range c.LeadMap {
		if l.Old != i+1 {
			c.Rewire = true
		}
	}
	return c
}

// RunnersUp returns up to n current-production candidates other than the
// chosen one, best first, each with the truthful reason it ranks below the
// first candidate (or, for the first, why it was not the choice).
func RunnersUp(sres *replace.Result, chosen *replace.Replacement, n int) []RunnerUp {
	out := []RunnerUp{}
	if len(sres.Replacements) == 0 {
		return out
	}
	first := &sres.Replacements[0]
	for i := range sres.Replacements {
		r := &sres.Replacements[i]
		if r == chosen || r.Family.StatusOf(r.Package) != catalog.Active {
			continue
		}
		if len(out) >= n {
			break
		}
		why := replace.WhyNotFirst(r, first)
		if r == first {
			why = fmt.Sprintf("ranked first (%s); the technician chose %s", r.Summary(), chosen.Label())
		}
		out = append(out, RunnerUp{r.Label(), r.Verdict, why})
	}
	return out
}

// keyComment matches a commented-out evidence key or table header (the
// template's lines), which are not bench notes.
var keyComment = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`^\s*#\s*(\[[^\]]*\]|[A-Za-z0-9_."]+\s*=)`) })

// annotation matches the project's own machine annotations of its scenario
// files, "# want: 78xx TO-220 5", "# expect: LFxx:TO-220 needs-work
// cout=work", "# original: 337:TO-220", "# shortfall: dropout value=1.2",
// which are test expectations, not bench notes: the word and a colon at the
// start of the line, then a catalog id (with an optional :OUTLINE:VOUT)
// alone, or followed by an outline name, an output voltage, a verdict or a
// key=value. A note
// in words ("# expect: hum at low mains") does not match and is kept.
var annotation = sync.OnceValue(func() *regexp.Regexp {
	return regexp.MustCompile(`^#\s*(want|expect|original|shortfall):\s*[0-9A-Za-z]+(-[0-9A-Za-z]+)*(:\S+)?(\s*$|\s+([A-Z][A-Z0-9]*-?[0-9][A-Z0-9-]*|[0-9.]+|drop-in|needs-work|unsuitable|\S+=\S*)(\s|$))`)
})

// labelled matches a comment line that starts a note of its own with a
// label ("fuse: …", "expect: …") rather than going on with the one above.
var labelled = sync.OnceValue(func() *regexp.Regexp { return regexp.MustCompile(`^[A-Za-z][\w-]*:\s`) })

// BenchNotes returns the comments of an evidence file as the technician
// wrote them: whole-line comments, consecutive lines joined into one note
// (less commented-out keys and tables, and
// less the test annotations [annotation] matches) and the comments after
// values, prefixed with their key.
func BenchNotes(src []byte) []string {
	var notes []string
	table := ""
	para := false // the last note is a whole-line comment that may go on
	for _, line := range strings.Split(string(src), "\n") {
		t := strings.TrimSpace(line)
		if !strings.HasPrefix(t, "#") || keyComment().MatchString(t) || annotation().MatchString(t) {
			para = false
		}
		switch {
		case t == "" || keyComment().MatchString(t) || annotation().MatchString(t):
		case strings.HasPrefix(t, "#"):
			s := strings.TrimSpace(strings.TrimLeft(t, "#"))
			switch {
			case s == "":
				para = false
			case para && len(notes) > 0 && !labelled().MatchString(s):
				notes[len(notes)-1] += " " + s // a paragraph written over several lines
			default:
				notes = append(notes, s)
				para = true
			}
			continue
		case strings.HasPrefix(t, "["):
			table = strings.Trim(strings.SplitN(t, "#", 2)[0], " []")
		default:
			key, rest, ok := strings.Cut(t, "=")
			i := commentStart(rest)
			if !ok || i < 0 {
				continue
			}
			if c := strings.TrimSpace(rest[i+1:]); c != "" {
				k := strings.TrimSpace(key)
				if table != "" {
					k = table + "." + k
				}
				notes = append(notes, k+": "+c)
			}
		}
	}
	return notes
}

// commentStart returns the index of a '#' outside a quoted string, or -1.
func commentStart(s string) int {
	quote := rune(0)
	for i, r := range s {
		switch {
		case quote != 0 && r == quote:
			quote = 0
		case quote == 0 && (r == '"' || r == '\''):
			quote = r
		case quote == 0 && r == '#':
			return i
		}
	}
	return -1
}

// signedVout returns h's output with its rail's sign, or nil when unknown.
func signedVout(h infer.Hypothesis) *float64 {
	if h.VoutV == 0 {
		return nil
	}
	v := round(h.Family.Signed(h.VoutV), 4)
	return &v
}

func round(x float64, n int) float64 {
	p := math.Pow(10, float64(n))
	return math.Round(x*p) / p
}

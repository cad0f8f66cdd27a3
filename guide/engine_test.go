package guide

import (
	"errors"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"github.com/whichreg/whichreg/catalog/builtin"
)

// start is a file a technician began by hand, with comments to keep.
const start = `# U7 on the bench supply of our own test board.
ref = "U7"      # board reference
package = "TO-220"

[pins.1]  # left lead
wired_to = "unregulated"
`

// TestReplies runs short sessions line by line and checks what the session
// made of each line and the document saved at the end.
func TestReplies(t *testing.T) {
	t.Parallel()
	id := Infer{Catalog: builtin.Catalog()}
	tests := []struct {
		name  string
		lines []string
		kinds []ReplyKind
		want  string // the saved document; "" = never saved
	}{
		{
			name:  "direct answers keep comments and order",
			lines: []string{"pins.3.volts = 5.02", "pins.2.wired_to = ground", "output.amps = 450m"},
			kinds: []ReplyKind{Accepted, Accepted, Accepted},
			want:  start + "\n[pins.2]\nwired_to = \"ground\"\n\n[pins.3]\nvolts = 5.02\n\n[output]\namps = \"450m\"\n",
		},
		{
			name:  "a refused answer is not written; back takes back the last accepted one",
			lines: []string{"pins.3.volts = 5.02", "pins.2.volts = twelve", "pins.2.volts = 0", "back"},
			kinds: []ReplyKind{Accepted, Refused, Accepted, Undone},
			want:  start + "\n[pins.3]\nvolts = 5.02\n",
		},
		{
			name:  "a lead the package lacks is refused with the loader's message",
			lines: []string{"pins.4.volts = 3"},
			kinds: []ReplyKind{Refused},
		},
		{
			name:  "nothing to take back",
			lines: []string{"back", "why", "help", "quit", "5"},
			kinds: []ReplyKind{Refused, Why, Help, Quit, Quit},
		},
		{
			name:  "skip, then list and pick by number",
			lines: []string{"skip", "list", "1", "skip"},
			kinds: []ReplyKind{Skipped, Listed, Picked, Skipped},
		},
		{
			name:  "a choice may be shortened",
			lines: []string{"list", "pins.2.wired_to", "'gro'"},
			kinds: []ReplyKind{Listed, Picked, Accepted},
			want:  start + "\n[pins.2]\nwired_to = \"ground\"\n",
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			saved := ""
			s, err := New(id, "u7.toml", []byte(start), Options{Save: func(_ string, doc []byte) error {
				saved = string(doc)
				return nil
			}})
			if err != nil {
				t.Fatal(err)
			}
			var kinds []ReplyKind
			for _, l := range tt.lines {
				r, err := s.Reply(l)
				if err != nil {
					t.Fatal(err)
				}
				kinds = append(kinds, r.Kind)
			}
			if diff := cmp.Diff(tt.kinds, kinds); diff != "" {
				t.Errorf("replies mismatch (-want +got):\n%s", diff)
			}
			if tt.want != "" {
				if diff := cmp.Diff(tt.want, saved); diff != "" {
					t.Errorf("saved document mismatch (-want +got):\n%s", diff)
				}
			}
		})
	}
}

// TestSkipNotAskedAgain checks that a skipped key is never asked again and
// that the session ends.
func TestSkipNotAskedAgain(t *testing.T) {
	t.Parallel()
	s, err := New(Infer{Catalog: builtin.Catalog()}, "u7.toml", []byte(start), Options{Save: func(string, []byte) error { return nil }})
	if err != nil {
		t.Fatal(err)
	}
	seen := map[string]bool{}
	for range 60 {
		st := s.Next()
		if st.Done != nil {
			if !strings.Contains(st.Done.Reason, "worth asking") {
				t.Errorf("reason %q, want no measurement worth asking", st.Done.Reason)
			}
			return
		}
		if seen[st.Ask.Key] {
			t.Fatalf("%s asked again after skip", st.Ask.Key)
		}
		seen[st.Ask.Key] = true
		if r, _ := s.Reply("skip"); r.Kind != Skipped {
			t.Fatalf("skip: %s", r.Kind)
		}
	}
	t.Fatal("the session did not end")
}

// TestNewFile starts without a file: the board reference comes first and
// names the file; an existing file of that name is continued, not replaced.
func TestNewFile(t *testing.T) {
	t.Parallel()
	id := Infer{Catalog: builtin.Catalog()}
	saved := map[string]string{}
	opts := Options{
		Save: func(name string, doc []byte) error { saved[name] = string(doc); return nil },
		NewFile: func(ref string) (string, []byte, error) {
			switch ref {
			case "U7":
				return "U7.toml", []byte(start), nil
			case "bad":
				return "", nil, errors.New("no")
			}
			return ref + ".toml", nil, nil
		},
	}
	s, _ := New(id, "", nil, opts)
	if st := s.Next(); st.Ask == nil || st.Ask.Key != "ref" {
		t.Fatalf("first step %+v, want the board reference", st)
	}
	for _, c := range []struct {
		line string
		kind ReplyKind
	}{{"skip", Refused}, {"bad", Refused}, {"U9", Accepted}} {
		if r, _ := s.Reply(c.line); r.Kind != c.kind {
			t.Errorf("%q: %s, want %s", c.line, r.Kind, c.kind)
		}
	}
	if want := newHeader + "ref = \"U9\"\n"; saved["U9.toml"] != want {
		t.Errorf("U9.toml = %q, want %q", saved["U9.toml"], want)
	}
	s2, _ := New(id, "", nil, opts)
	if r, _ := s2.Reply("U7"); r.Kind != Continued {
		t.Errorf("existing file: %s, want continued", r.Kind)
	}
	if _, ok := saved["U7.toml"]; ok {
		t.Error("the existing U7.toml was written without an answer")
	}
	if name, doc := s2.Document(); name != "U7.toml" || string(doc) != start {
		t.Errorf("continued %s %q", name, doc)
	}
}

// TestRefusedFile: a file that does not load starts no session.
func TestRefusedFile(t *testing.T) {
	t.Parallel()
	_, err := New(Infer{Catalog: builtin.Catalog()}, "x.toml", []byte("volts = 5\n"), Options{})
	if err == nil || !strings.Contains(err.Error(), "volts") {
		t.Errorf("New on an unknown key: %v, want the loader's error naming it", err)
	}
}

// TestSaveFails: an I/O failure ends the session with the error.
func TestSaveFails(t *testing.T) {
	t.Parallel()
	s, _ := New(Infer{Catalog: builtin.Catalog()}, "u7.toml", []byte(start), Options{Save: func(string, []byte) error { return errors.New("disk full") }})
	if _, err := s.Reply("output.amps = 1"); err == nil {
		t.Fatal("no error from a failed save")
	}
	if st := s.Next(); st.Done == nil {
		t.Error("the session goes on after a failed save")
	}
}

// fixed is an Identifier that ranks every document the same.
type fixed struct{ r Ranking }

func (f fixed) Rank(string, []byte) (*Ranking, error) { r := f.r; return &r, nil }

// TestStopRules checks when a session ends: at the stop probability; below
// it when nothing is worth asking, but only after the open lead voltages.
func TestStopRules(t *testing.T) {
	t.Parallel()
	low := []Question{{Key: "output.amps", GainBits: 0.04}, {Key: "pins.2.volts", GainBits: 0.01}}
	tests := []struct {
		name    string
		p       float64
		qs      []Question
		wantAsk string // "" = done
	}{
		{"sure leader", 0.96, []Question{{Key: "pins.1.volts", GainBits: 2}}, ""},
		{"informative question", 0.5, []Question{{Key: "marking", GainBits: 0.3}}, "marking"},
		{"nothing worth asking but a lead voltage", 0.5, low, "pins.2.volts"},
		{"nothing worth asking", 0.5, low[:1], ""},
		{"no questions", 0.5, nil, ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			id := fixed{Ranking{Leaders: []Leader{{Family: "78xx", Probability: tt.p}}, Questions: tt.qs}}
			s, err := New(id, "x.toml", nil, Options{})
			if err != nil {
				t.Fatal(err)
			}
			st := s.Next()
			got := ""
			if st.Ask != nil {
				got = st.Ask.Key
			}
			if got != tt.wantAsk {
				t.Errorf("asks %q, want %q (done: %+v)", got, tt.wantAsk, st.Done)
			}
		})
	}
}

package guide

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/BurntSushi/toml"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

func builtinCatalog(t testing.TB) *catalog.Catalog {
	t.Helper()
	files, errs := builtin.Files()
	if len(errs) > 0 {
		t.Fatal(errs)
	}
	return catalog.Merge(files...)
}

// lookup returns the value of a dotted key in a decoded TOML document, as a
// technician would type it, and whether it is there.
func lookup(m map[string]any, key string) (string, bool) {
	parts := strings.Split(key, ".")
	var cur any = m
	for _, p := range parts {
		t, ok := cur.(map[string]any)
		if !ok {
			return "", false
		}
		if cur, ok = t[p]; !ok {
			return "", false
		}
	}
	switch v := cur.(type) {
	case map[string]any, []any:
		return "", false
	case float64:
		return fmt.Sprint(v), true
	default:
		return fmt.Sprint(v), true
	}
}

// drive answers a session from a complete evidence file and returns the
// end and the number of questions asked (skips included, the board
// reference not).
func drive(t *testing.T, id Identifier, complete map[string]any, dir string) (*Done, int, []string) {
	t.Helper()
	var saved []byte
	s, err := New(id, "", nil, Options{
		Save: func(name string, doc []byte) error { saved = doc; return os.WriteFile(name, doc, 0o644) },
		NewFile: func(ref string) (string, []byte, error) {
			return filepath.Join(dir, ref+".toml"), nil, nil
		},
	})
	if err != nil {
		t.Fatal(err)
	}
	asked := 0
	var log []string
	for range 40 {
		st := s.Next()
		if st.Done != nil {
			_ = saved
			return st.Done, asked, log
		}
		q := st.Ask
		if q.Key != refKey {
			asked++
		}
		answer, ok := lookup(complete, q.Key)
		if !ok {
			answer = "skip"
		}
		r, err := s.Reply(answer)
		if err != nil {
			t.Fatal(err)
		}
		lead := ""
		if st.Ranking != nil && len(st.Ranking.Leaders) > 0 {
			lead = fmt.Sprintf("%s %.3f", st.Ranking.Leaders[0].Label, st.Ranking.Leaders[0].Probability)
		}
		log = append(log, fmt.Sprintf("[%s] %s (%.2f bit) <- %q: %s %s", lead, q.Key, q.GainBits, answer, r.Kind, r.Message))
	}
	t.Fatalf("the session did not end in 40 steps:\n%s", strings.Join(log, "\n"))
	return nil, 0, nil
}

// TestDemoSessions answers a session started from nothing from each demo
// scenario's complete file: it must reach infer's leader on the complete
// file within 8 questions (issue 14).
func TestDemoSessions(t *testing.T) {
	c := builtinCatalog(t)
	id := Infer{Catalog: c}
	files, _ := filepath.Glob("../testdata/demo/*.toml")
	if len(files) == 0 {
		t.Fatal("no demo scenarios under testdata/demo")
	}
	for _, f := range files {
		t.Run(filepath.Base(f), func(t *testing.T) {
			data, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			var complete map[string]any
			if _, err := toml.Decode(string(data), &complete); err != nil {
				t.Fatal(err)
			}
			want, err := id.Rank(f, data)
			if err != nil {
				t.Fatal(err)
			}
			done, asked, log := drive(t, id, complete, t.TempDir())
			t.Logf("%s: %d questions, %s\n%s", filepath.Base(f), asked, done.Reason, strings.Join(log, "\n"))
			w := want.Leaders[0]
			g := done.Leader
			if g.Family != w.Family || g.Package != w.Package || math.Abs(g.VoutV-w.VoutV) > 0.05*math.Abs(w.VoutV)+0.01 {
				t.Errorf("leader %s, want %s (infer on the complete file)", g.Label, w.Label)
			}
			if asked > 8 {
				t.Errorf("%d questions, want at most 8", asked)
			}
		})
	}
}

package main

import (
	"bufio"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/BurntSushi/toml"

	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/guide"
)

// lookup returns the value of a dotted key in a decoded TOML document as a
// technician would type it, and whether the document has it.
func lookup(m map[string]any, key string) (string, bool) {
	var cur any = m
	for _, p := range strings.Split(key, ".") {
		t, ok := cur.(map[string]any)
		if !ok {
			return "", false
		}
		if cur, ok = t[p]; !ok {
			return "", false
		}
	}
	switch cur.(type) {
	case map[string]any, []any, []map[string]any:
		return "", false
	}
	return fmt.Sprint(cur), true
}

// guideDriver runs 'whichreg guide FILE --format json' in process and
// answers every question from the complete evidence, "skip" where it has
// no value. It returns the JSON objects the command wrote and the questions
// asked (the board reference not counted).
func guideDriver(t *testing.T, file string, complete map[string]any) ([]guideJSON, int) {
	t.Helper()
	app, _, errOut := testApp()
	inR, inW := io.Pipe()
	outR, outW := io.Pipe()
	app.IO.In, app.IO.Out = inR, outW
	code := make(chan int, 1)
	go func() {
		code <- run(app, []string{"guide", file, "--format", "json"})
		outW.Close()
	}()
	schema := guideSchema(t)
	var objs []guideJSON
	asked := 0
	sc := bufio.NewScanner(outR)
	sc.Buffer(nil, 1<<20)
	for sc.Scan() {
		var o guideJSON
		if err := json.Unmarshal(sc.Bytes(), &o); err != nil {
			t.Fatalf("not a JSON line: %v\n%s", err, sc.Text())
		}
		if err := validateLine(t, schema, sc.Bytes()); err != nil {
			t.Fatalf("docs/schema/guide.v1.json: %v\n%s", err, sc.Text())
		}
		objs = append(objs, o)
		if o.Done != nil {
			break
		}
		if o.Ask == nil {
			t.Fatalf("neither ask nor done: %s", sc.Text())
		}
		if o.Ask.Key != "ref" {
			asked++
		}
		answer, ok := lookup(complete, o.Ask.Key)
		if !ok {
			answer = "skip"
		}
		if asked > 30 {
			t.Fatal("more than 30 questions")
		}
		fmt.Fprintln(inW, answer)
	}
	inW.Close()
	if c := <-code; c != 0 {
		t.Fatalf("exit code %d: %s", c, errOut)
	}
	return objs, asked
}

// TestGuideDemoSessions answers a session started from nothing from each
// demo scenario's complete file over the JSON-lines protocol: it must reach
// the leader infer gives on the complete file within 8 questions, and the
// file it leaves must load and identify the same (issue 14).
func TestGuideDemoSessions(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/demo/*.toml")
	if len(files) == 0 {
		t.Fatal("no demo scenarios under testdata/demo")
	}
	id := guide.Infer{Catalog: builtin.Catalog()}
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
			out := filepath.Join(t.TempDir(), "session.toml")
			objs, asked := guideDriver(t, out, complete)
			var log []string
			for _, o := range objs {
				if o.Ask != nil {
					log = append(log, o.Ask.Key)
				}
			}
			done := objs[len(objs)-1].Done
			if done.Leader != nil {
				t.Logf("%d questions (%s), ended: %s; leader %s %s at %.3f", asked, strings.Join(log, ", "), done.Reason,
					done.Leader.Family, done.Leader.Package, done.Leader.Probability)
			}
			if asked > 8 {
				t.Errorf("%d questions, want at most 8", asked)
			}
			w := want.Leaders[0]
			if done.Leader == nil || !sameLeader(*done.Leader, w) {
				t.Errorf("session leader %+v, want %s (infer on the complete file)", done.Leader, w.Label)
			}
			if done.EvidenceFile == nil || *done.EvidenceFile != out {
				t.Fatalf("evidence_file %v, want %s", done.EvidenceFile, out)
			}
			saved, err := os.ReadFile(out)
			if err != nil {
				t.Fatal(err)
			}
			again, err := id.Rank(out, saved)
			if err != nil {
				t.Fatalf("the session's file does not load: %v", err)
			}
			if !sameLeader(*done.Leader, again.Leaders[0]) {
				t.Errorf("the session's file identifies as %s, the session ended with %+v", again.Leaders[0].Label, *done.Leader)
			}
		})
	}
}

// sameLeader compares a JSON leader with a ranked one: family, package and
// output voltage (within 1 %).
func sameLeader(j guideLeaderJSON, l guide.Leader) bool {
	v := 0.0
	if j.Vout != nil {
		v = *j.Vout
	}
	return j.Family == l.Family && j.Package == l.Package && math.Abs(v-l.VoutV) <= 0.01*math.Abs(l.VoutV)+0.005
}

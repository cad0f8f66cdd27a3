package main

import (
	"flag"
	"os"
	"path/filepath"
	"testing"
	"time"

	"github.com/google/go-cmp/cmp"
	"github.com/spf13/cobra/doc"
)

var updateMan = flag.Bool("update-man", false, "rewrite the man pages under docs/man (go generate ./cmd/whichreg)")

// manDate dates the man pages; it moves with the version.
var manDate = time.Date(2026, 12, 1, 0, 0, 0, 0, time.UTC)

// TestManPages generates the man pages from the command tree (cobra/doc)
// and checks that docs/man holds exactly them: a changed flag or help text
// fails here until 'go generate ./cmd/whichreg' rewrites the pages.
func TestManPages(t *testing.T) {
	app, _, _ := testApp()
	root := newRootCmd(app)
	dir := t.TempDir()
	hdr := &doc.GenManHeader{Title: "WHICHREG", Section: "1", Source: "whichreg " + version, Manual: "whichreg manual", Date: &manDate}
	root.DisableAutoGenTag = true
	if err := doc.GenManTree(root, hdr, dir); err != nil {
		t.Fatal(err)
	}
	want := "../../docs/man"
	got, _ := filepath.Glob(filepath.Join(dir, "*.1"))
	if len(got) < 20 {
		t.Fatalf("only %d man pages generated", len(got))
	}
	if *updateMan {
		old, _ := filepath.Glob(filepath.Join(want, "*.1"))
		for _, f := range old {
			os.Remove(f)
		}
		if err := os.MkdirAll(want, 0o755); err != nil {
			t.Fatal(err)
		}
	}
	seen := map[string]bool{}
	for _, f := range got {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		name := filepath.Base(f)
		seen[name] = true
		dst := filepath.Join(want, name)
		if *updateMan {
			if err := os.WriteFile(dst, data, 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		have, err := os.ReadFile(dst)
		if err != nil {
			t.Errorf("docs/man/%s is missing: run go generate ./cmd/whichreg", name)
			continue
		}
		if diff := cmp.Diff(string(have), string(data)); diff != "" {
			t.Errorf("docs/man/%s is stale (run go generate ./cmd/whichreg) (-have +generated):\n%s", name, diff)
		}
	}
	old, _ := filepath.Glob(filepath.Join(want, "*.1"))
	for _, f := range old {
		if !seen[filepath.Base(f)] {
			t.Errorf("docs/man/%s belongs to no command: run go generate ./cmd/whichreg", filepath.Base(f))
		}
	}
}

package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/whichreg/whichreg/internal/golden"
)

func testApp() (*App, *bytes.Buffer, *bytes.Buffer) {
	var out, errOut bytes.Buffer
	return &App{
		IO:        &IOStreams{Out: &out, ErrOut: &errOut},
		ConfigDir: func() (string, error) { return "", nil },
		Now:       func() time.Time { return time.Date(2026, 3, 14, 9, 30, 0, 0, time.UTC) },
	}, &out, &errOut
}

// TestRecordGolden pins the example record kept under testdata/demo (the
// Markdown and the JSON) and the swap JSON of the same scenario. Regenerate
// with go test ./cmd/whichreg -update after a deliberate change (a catalog
// change alters the catalog hash in the record).
func TestRecordGolden(t *testing.T) {
	demo := "../../testdata/demo/vending-lifted-ground.toml"
	cases := []struct {
		golden string
		args   []string
	}{
		{"vending-lifted-ground.record.md", []string{"record", demo, "--choose", "78xx:TO-220"}},
		{"vending-lifted-ground.record.json", []string{"record", demo, "--choose", "78xx:TO-220", "--format", "json"}},
		{"vending-lifted-ground.swap.json", []string{"swap", demo, "--format", "json"}},
		{"bench-supply-negative.infer.json", []string{"infer", "../../testdata/demo/bench-supply-negative.toml", "--format", "json", "--top", "3"}},
	}
	for _, tc := range cases {
		t.Run(tc.golden, func(t *testing.T) {
			app, out, errOut := testApp()
			if code := run(app, tc.args); code != 0 {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			// The evidence path is relative to this package; keep the golden repository-relative.
			got := strings.ReplaceAll(out.String(), "../../testdata/", "testdata/")
			golden.Check(t, filepath.Join("../../testdata/demo", tc.golden), got, golden.Update(*updateScripts))
		})
	}
}

// TestSwapJSONFields pins the contract's field names (issue #5), written
// out here rather than taken from the structs.
func TestSwapJSONFields(t *testing.T) {
	app, out, _ := testApp()
	if code := run(app, []string{"swap", "../../testdata/demo/bench-supply-negative.toml", "--format", "json"}); code != 0 {
		t.Fatalf("exit %d", code)
	}
	for _, field := range []string{`"schema": "whichreg/swap/v1"`, `"original"`, `"family"`, `"outline"`, `"vout_v"`, `"probability"`, `"replacements"`, `"verdict"`,
		`"checks"`, `"check"`, `"value"`, `"limit"`, `"unit"`, `"margin"`, `"status"`, `"text"`, `"install"`, `"assumptions"`} {
		if !strings.Contains(out.String(), field) {
			t.Errorf("swap JSON lacks %s", field)
		}
	}
}

// BenchmarkInferCommand: the whole infer command in-process, catalog loading included.
func BenchmarkInferCommand(b *testing.B) {
	for b.Loop() {
		app, _, _ := testApp()
		if code := run(app, []string{"infer", "../../testdata/demo/bench-supply-negative.toml"}); code != 0 {
			b.Fatal(code)
		}
	}
}

// BenchmarkRootCmd: building the command tree, which every run pays.
func BenchmarkRootCmd(b *testing.B) {
	for b.Loop() {
		app, _, _ := testApp()
		_ = newRootCmd(app)
	}
}

// BenchmarkVersion: the least a run does (the tree, flag parsing, one line).
func BenchmarkVersion(b *testing.B) {
	for b.Loop() {
		app, _, _ := testApp()
		if code := run(app, []string{"--version"}); code != 0 {
			b.Fatal(code)
		}
	}
}

// BenchmarkInferNoRectifier: infer on a demo without a rectifier model.
func BenchmarkInferNoRectifier(b *testing.B) {
	for b.Loop() {
		app, _, _ := testApp()
		if code := run(app, []string{"infer", "../../testdata/demo/controller-to3-case.toml"}); code != 0 {
			b.Fatal(code)
		}
	}
}

// TestRecordHashFollowsContent: the same user catalog copied into two
// folders (once through --catalog, once through the configuration
// directory) gives the same catalog_sha256 in the record, and one changed
// figure gives another (issue 9: the hash covered each entry's path).
func TestRecordHashFollowsContent(t *testing.T) {
	data, err := os.ReadFile("../../testdata/catalog/good/one-family.toml")
	if err != nil {
		t.Fatal(err)
	}
	demo := "../../testdata/demo/vending-lifted-ground.toml"
	hash := func(t *testing.T, data []byte, viaConfig bool) string {
		t.Helper()
		dir := t.TempDir()
		args := []string{"record", demo, "--choose", "78xx:TO-220", "--format", "json"}
		app, out, errOut := testApp()
		switch {
		case data == nil: // the built-in catalog alone
		case viaConfig:
			if err := os.MkdirAll(filepath.Join(dir, "whichreg", "catalog"), 0o755); err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(filepath.Join(dir, "whichreg", "catalog", "shop.toml"), data, 0o644); err != nil {
				t.Fatal(err)
			}
			app.ConfigDir = func() (string, error) { return dir, nil }
		default:
			name := filepath.Join(dir, "elsewhere", "copy.toml")
			if err := os.MkdirAll(filepath.Dir(name), 0o755); err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(name, data, 0o644); err != nil {
				t.Fatal(err)
			}
			args = append(args, "--catalog", name)
		}
		if code := run(app, args); code != 0 {
			t.Fatalf("exit %d: %s", code, errOut)
		}
		var doc struct {
			Hash string `json:"catalog_sha256"`
		}
		if err := json.Unmarshal(out.Bytes(), &doc); err != nil {
			t.Fatal(err)
		}
		if len(doc.Hash) != 64 {
			t.Fatalf("catalog_sha256 %q is not a hex SHA-256", doc.Hash)
		}
		return doc.Hash
	}
	a, b := hash(t, data, false), hash(t, data, true)
	if a != b {
		t.Errorf("the same catalog in two folders gives two hashes: %s, %s", a, b)
	}
	changed := bytes.Replace(data, []byte("theta_ja"), []byte("theta_ja = 99 # "), 1)
	if bytes.Equal(changed, data) {
		t.Fatal("the test catalog has no theta_ja to change")
	}
	if c := hash(t, changed, false); c == a {
		t.Error("a changed figure left the hash as it was")
	}
	if hash(t, nil, false) == a {
		t.Error("the user catalog did not reach the hash (was it read?)")
	}
}

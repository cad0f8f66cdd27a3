package main

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/whichreg/whichreg/internal/golden"
)

// TestBadInput runs every file of the bad-input corpus under testdata/bad
// (catalog-*.toml through 'catalog check', the rest through 'infer') and
// compares the exit code and messages with the file's golden. No message
// may carry a Go stack trace.
func TestBadInput(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/bad/*.toml")
	if len(files) < 40 {
		t.Fatalf("want at least 40 bad-input files, found %d", len(files))
	}
	for _, name := range files {
		base := filepath.Base(name)
		args := []string{"infer", name}
		if strings.HasPrefix(base, "catalog-") {
			args = []string{"catalog", "check", name}
		}
		t.Run(base, func(t *testing.T) { checkGolden(t, args, strings.TrimSuffix(name, ".toml")+".golden") })
	}
	// Cases that need no file of their own.
	big := filepath.Join(t.TempDir(), "big.toml")
	if err := os.WriteFile(big, []byte(strings.Repeat("# padding\n", 5<<20)), 0o644); err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		name string
		args []string
	}{
		{"evidence-50MB", []string{"infer", big}},
		{"catalog-50MB", []string{"catalog", "check", big}},
		{"record-choose-unknown", []string{"record", "../../testdata/demo/vending-lifted-ground.toml", "--choose", "LM9999"}},
		{"swap-original-unknown-package", []string{"swap", "../../testdata/demo/vending-lifted-ground.toml", "--original", "78xx:TO-999"}},
		{"usage-format", []string{"infer", "../../testdata/demo/vending-lifted-ground.toml", "--format", "yaml"}},
		{"evidence-directory", []string{"infer", "../../testdata"}},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			checkGolden(t, tc.args, filepath.Join("../../testdata/bad", tc.name+".golden"))
		})
	}
}

func checkGolden(t *testing.T, args []string, goldenPath string) {
	t.Helper()
	app, out, errOut := testApp()
	code := run(app, args)
	clean := func(s string) string {
		s = strings.ReplaceAll(s, "../../testdata/", "testdata/")
		if dir := filepath.Dir(args[len(args)-1]); strings.Contains(dir, os.TempDir()) {
			s = strings.ReplaceAll(s, args[len(args)-1], "BIG.toml")
		}
		return s
	}
	got := fmt.Sprintf("exit %d\n-- stdout --\n%s-- stderr --\n%s", code, clean(out.String()), clean(errOut.String()))
	if code == 0 && !strings.Contains(goldenPath, "evidence-empty") {
		t.Errorf("exit 0 for bad input")
	}
	for _, bad := range []string{"goroutine ", "panic:", ".go:"} {
		if strings.Contains(got, bad) {
			t.Errorf("output contains %q:\n%s", bad, got)
		}
	}
	golden.Check(t, goldenPath, got, golden.Update(*updateScripts))
}

// FuzzCalcFlags runs the calculators with arbitrary flag values: every run
// ends with exit 0, 1 or 2 and never panics.
func FuzzCalcFlags(f *testing.F) {
	f.Add("bridge", "12.6", "2200u", "0.8", "0.1", "50")
	f.Add("half-wave", "0", "-1", "NaN", "4k7", "1e9")
	f.Add("center-tap", "1e308", "1e-12", "1000", "0R22", "60")
	f.Fuzz(func(t *testing.T, rect, vrms, cap, load, reg, hz string) {
		for _, args := range [][]string{
			{"calc", "rectifier", "--rectifier", rect, "--vrms", vrms, "--cap", cap, "--load", load, "--regulation", reg, "--hz", hz, "--format", "json"},
			{"calc", "divider", "--target", vrms, "--vref", reg, "--iadj", load},
			{"calc", "boost", "--r", reg, "--vin-min", vrms, "--vin-max", cap, "--vout", load},
			{"calc", "heatsink", "--power", load, "--theta-jc", reg, "--theta-sa", hz},
		} {
			app, _, _ := testApp()
			if code := run(app, args); code < 0 || code > 2 {
				t.Fatalf("%v: exit %d", args, code)
			}
		}
	})
}

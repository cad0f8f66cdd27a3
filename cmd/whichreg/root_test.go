package main

import (
	"os"
	"strings"
	"testing"

	"github.com/spf13/cobra"
)

// TestPanicIsInternalError: a bug reaches the user as one line with exit
// code 4 (issue 9 item 7), never as a stack trace or as "invalid input".
func TestPanicIsInternalError(t *testing.T) {
	app, _, errOut := testApp()
	app.ConfigDir = func() (string, error) { panic("boom") }
	if code := run(app, []string{"catalog", "list"}); code != exitInternal {
		t.Errorf("exit %d, want %d", code, exitInternal)
	}
	if got := errOut.String(); !strings.HasPrefix(got, "whichreg: internal error: boom\n") || strings.Contains(got, "goroutine") {
		t.Errorf("stderr = %q", got)
	}
}

// TestUsageErrorsByType: every kind of usage error exits 2, told apart by
// its type (*flagError), whatever its wording.
func TestUsageErrorsByType(t *testing.T) {
	demo := "../../testdata/demo/vending-lifted-ground.toml"
	for _, args := range [][]string{
		{"frobnicate"},
		{"catalog", "bogus"},
		{"calc", "bogus"},
		{"evidence", "bogus"},
		{"infer"},
		{"infer", demo, demo},
		{"infer", demo, "--nope"},
		{"infer", demo, "--top", "x"},
		{"infer", demo, "--format", "yaml"},
		{"infer", "--top"},
		{"catalog", "list", "extra"},
		{"calc", "rectifier", "--vrms", "12"},
		{"record", demo},
		{"--width", "3", "catalog", "list"},
	} {
		app, _, errOut := testApp()
		if code := run(app, args); code != exitUsage {
			t.Errorf("%q: exit %d, want %d; stderr:\n%s", args, code, exitUsage, errOut)
		}
	}
}

// TestWidth: piped output (anything that is not a terminal) is 80 columns
// unless --width says otherwise; COLUMNS applies to terminals only.
func TestWidth(t *testing.T) {
	app, _, _ := testApp()
	app.Getenv = func(string) string { return "132" }
	if got := app.Width(); got != defaultWidth {
		t.Errorf("piped width = %d, want %d", got, defaultWidth)
	}
	app.widthFlag = 100
	if got := app.Width(); got != 100 {
		t.Errorf("--width 100: width = %d", got)
	}
}

// TestEveryCommandTeaches: every command of ours has a short help line and
// examples (cobra's own completion and help commands aside).
func TestEveryCommandTeaches(t *testing.T) {
	app, _, _ := testApp()
	var walk func(c *cobra.Command)
	walk = func(c *cobra.Command) {
		if c.Name() == "completion" || c.Name() == "help" {
			return
		}
		if c.Short == "" || c.Example == "" {
			t.Errorf("%q lacks a Short or an Example", c.CommandPath())
		}
		for _, sub := range c.Commands() {
			walk(sub)
		}
	}
	walk(newRootCmd(app))
}

// TestClosedPipe: writing into a pipe whose reader has gone, without a
// SIGPIPE to end the process (the pipe is not standard output here, as when
// SIGPIPE is ignored), is an I/O failure with a message: exit 3.
func TestClosedPipe(t *testing.T) {
	r, w, err := os.Pipe()
	if err != nil {
		t.Fatal(err)
	}
	r.Close()
	defer w.Close()
	app, _, errOut := testApp()
	app.IO.Out = w
	if code := run(app, []string{"catalog", "list"}); code != exitIO {
		t.Errorf("exit %d, want %d; stderr:\n%s", code, exitIO, errOut)
	}
	if !strings.Contains(errOut.String(), "writing the output") || !strings.Contains(errOut.String(), "broken pipe") {
		t.Errorf("stderr = %q", errOut)
	}
}

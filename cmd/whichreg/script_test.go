package main

import (
	"errors"
	"flag"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"
	"unicode/utf8"

	"github.com/rogpeppe/go-internal/testscript"
)

var updateScripts = flag.Bool("update", false, "update the want sections of the testscript files")

func TestMain(m *testing.M) {
	testscript.Main(m, map[string]func(){
		"whichreg": func() {
			testOnlyNow = func() time.Time { return time.Date(2026, 3, 14, 9, 30, 0, 0, time.UTC) }
			os.Exit(Main())
		},
	})
}

// TestScripts runs the end-to-end scripts in testdata/script. Each names its
// command and case (<command>_<case>.txtar).
func TestScripts(t *testing.T) {
	root, err := filepath.Abs("../..")
	if err != nil {
		t.Fatal(err)
	}
	testscript.Run(t, testscript.Params{
		Dir:                 "testdata/script",
		RequireExplicitExec: true,
		RequireUniqueNames:  true,
		UpdateScripts:       *updateScripts,
		Setup: func(env *testscript.Env) error {
			env.Setenv("ROOT", root)
			env.Setenv("HOME", filepath.Join(env.WorkDir, "home"))
			env.Setenv("XDG_CONFIG_HOME", filepath.Join(env.WorkDir, "home", ".config"))
			return nil
		},
		Cmds: map[string]func(ts *testscript.TestScript, neg bool, args []string){
			// full CODE PROGRAM ARGS... runs the program with its standard
			// output on /dev/full (every write fails: a full disk) and checks
			// its exit code; its stderr becomes the script's stderr.
			"full": func(ts *testscript.TestScript, neg bool, args []string) {
				if len(args) < 2 {
					ts.Fatalf("usage: full CODE PROGRAM [ARGS...]")
				}
				want, err := strconv.Atoi(args[0])
				ts.Check(err)
				devFull, err := os.OpenFile("/dev/full", os.O_WRONLY, 0)
				if err != nil {
					ts.Fatalf("no /dev/full here: %v", err)
				}
				defer devFull.Close()
				path, err := exec.LookPath(args[1])
				if err != nil {
					// LookPath uses the test process's PATH, which testscript.Main extended.
					ts.Fatalf("full: %v", err)
				}
				cmd := exec.Command(path, args[2:]...)
				cmd.Dir = ts.MkAbs(".")
				for _, k := range []string{"PATH", "HOME", "XDG_CONFIG_HOME", "ROOT"} {
					cmd.Env = append(cmd.Env, k+"="+ts.Getenv(k))
				}
				cmd.Stdout, cmd.Stderr = devFull, ts.Stderr()
				err = cmd.Run()
				got := 0
				var ee *exec.ExitError
				if errors.As(err, &ee) {
					got = ee.ExitCode()
				} else if err != nil {
					ts.Fatalf("full: %v", err)
				}
				if got != want {
					ts.Fatalf("exit code %d, want %d", got, want)
				}
			},
			// maxwidth N checks that no line of the last command's stdout is
			// wider than N columns (runes).
			"maxwidth": func(ts *testscript.TestScript, neg bool, args []string) {
				if len(args) != 1 {
					ts.Fatalf("usage: maxwidth N")
				}
				n, err := strconv.Atoi(args[0])
				ts.Check(err)
				for i, line := range strings.Split(ts.ReadFile("stdout"), "\n") {
					if w := utf8.RuneCountInString(line); w > n {
						ts.Fatalf("line %d is %d columns wide (more than %d):\n%s", i+1, w, n, line)
					}
				}
			},
			// exits CODE PROGRAM ARGS... runs the program and checks its exit code.
			"exits": func(ts *testscript.TestScript, neg bool, args []string) {
				if len(args) < 2 {
					ts.Fatalf("usage: exits CODE PROGRAM [ARGS...]")
				}
				want, err := strconv.Atoi(args[0])
				if err != nil {
					ts.Fatalf("exits: %v", err)
				}
				err = ts.Exec(args[1], args[2:]...)
				got := 0
				var ee *exec.ExitError
				if errors.As(err, &ee) {
					got = ee.ExitCode()
				} else if err != nil {
					ts.Fatalf("exits: %v", err)
				}
				if got != want {
					ts.Fatalf("exit code %d, want %d", got, want)
				}
			},
		},
	})
}

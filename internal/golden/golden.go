// Package golden compares test output with golden files and rewrites them
// when the tests run with -update. It is for tests only.
package golden

import (
	"os"
	"testing"

	"github.com/google/go-cmp/cmp"
)

// Update says whether [Check] rewrites the golden file with what the test
// got (go test -update) instead of comparing: call sites read
// golden.Check(t, path, got, golden.Update(*update)).
type Update bool

// Check compares got with the file at path. With update it writes got to
// the file instead. A missing file fails the test with the command that
// creates it.
func Check(t testing.TB, path, got string, update Update) {
	t.Helper()
	if update {
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("missing golden file %s (run go test with -update): %v", path, err)
	}
	if diff := cmp.Diff(string(want), got); diff != "" {
		t.Errorf("%s mismatch (-want +got):\n%s", path, diff)
	}
}

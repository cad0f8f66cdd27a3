package tomledit

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"testing"

	"github.com/BurntSushi/toml"
	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
)

// fuzzKeys are the keys the fuzzer sets: the guide's own and some odd ones.
var fuzzKeys = []string{
	"pins.2.volts", "pins.1.wired_to", "pins.10.volts", "case.tied_to_pin", "output.amps",
	"package", "marking", "input.rectifier", "a.b.c", `"quoted key".x`, "ref",
}

// FuzzSet checks that on any document TOML accepts, a successful Set or
// Remove changes exactly the one key (decoded before and after) and keeps
// every other line, and that nothing panics on any input.
func FuzzSet(f *testing.F) {
	files, _ := filepath.Glob("../../testdata/demo/*.toml")
	more, _ := filepath.Glob("../../testdata/infer/*.toml")
	files = append(files, more...)
	if len(files) == 0 {
		f.Fatal("no seed files under testdata/demo and testdata/infer")
	}
	for i, name := range files {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data, uint8(i), "x", 1.5, uint8(i))
	}
	f.Add([]byte(evidence), uint8(0), "", math.Copysign(0, -1), uint8(3))
	f.Add([]byte("a = [\n 1, # c\n]\n[b]\nc = '''\n[x]\n'''\n"), uint8(8), "y", 2.0, uint8(1))
	f.Fuzz(func(t *testing.T, doc []byte, keyIx uint8, s string, x float64, kind uint8) {
		if len(doc) > 4096 {
			return
		}
		key := fuzzKeys[int(keyIx)%len(fuzzKeys)]
		var v any
		switch kind % 4 {
		case 0:
			v = s
		case 1:
			v = x
		case 2:
			v = int(int32(math.Float64bits(x)))
		default:
			v = x > 0
		}
		if kind%8 == 7 {
			out, err := Remove(doc, key)
			checkRemoved(t, doc, out, err, key)
			return
		}
		out, err := Set(doc, key, v)
		if err != nil {
			return
		}
		if f, ok := v.(float64); ok && (math.IsNaN(f) || math.IsInf(f, 0)) {
			t.Fatalf("Set wrote a non-finite float: %s", out)
		}
		checkDecodes(t, string(doc), string(out), key, v)
	})
}

func checkRemoved(t *testing.T, doc, out []byte, err error, key string) {
	t.Helper()
	var before, after map[string]any
	if _, derr := toml.Decode(string(doc), &before); derr != nil || err != nil {
		if err != nil && !errors.Is(err, ErrNotFound) && derr == nil {
			return // refused (an inline table, …): allowed
		}
		return
	}
	if _, derr := toml.Decode(string(out), &after); derr != nil {
		t.Fatalf("the document after Remove does not decode: %v\n%s", derr, out)
	}
	path, _ := parseKey(key)
	m := before
	for _, p := range path[:len(path)-1] {
		m = m[p].(map[string]any)
	}
	delete(m, path[len(path)-1])
	if diff := cmp.Diff(before, after, cmpopts.EquateNaNs(), cmpopts.EquateEmpty()); diff != "" {
		t.Errorf("Remove(%q) mismatch (-want +got):\n%s", key, diff)
	}
}

package tomledit

import (
	"errors"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/BurntSushi/toml"
	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"
)

const evidence = `# want: 78xx TO-220 5
# A test board of our own.
ref       = "U4"                     # board reference
package   = "TO-220"

[pins.1]
wired_to = "unregulated"   # power off
volts = 12.1
[pins.3]
wired_to = "load"

[case]                              # the tab
tied_to_pin = 2

[mount]
ambient_c = 40
`

func TestSet(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name, doc, key string
		value          any
		want           string
		reason         string
	}{
		{
			name: "replace keeps the comment's column", doc: evidence, key: "pins.1.wired_to", value: "ground",
			want: strings.Replace(evidence, `wired_to = "unregulated"   # power off`, `wired_to = "ground"        # power off`, 1),
		},
		{
			name: "replace a longer value pushes the comment", doc: evidence, key: "ref", value: "U4-very-long-reference-name",
			want: strings.Replace(evidence, `ref       = "U4"                     # board`, `ref       = "U4-very-long-reference-name" # board`, 1),
		},
		{
			name: "add a key at the end of its table", doc: evidence, key: "pins.1.note", value: "x",
			want: strings.Replace(evidence, "volts = 12.1\n", "volts = 12.1\nnote = \"x\"\n", 1),
		},
		{
			name: "new lead table goes between its neighbours", doc: evidence, key: "pins.2.volts", value: 5.0,
			want:   strings.Replace(evidence, "[pins.3]", "[pins.2]\nvolts = 5.0\n[pins.3]", 1),
			reason: "lead 2 sorts between leads 1 and 3; no blank line, as the neighbours have none",
		},
		{
			name: "new lead table after the last lead", doc: evidence, key: "pins.10.volts", value: -15.02,
			want:   strings.Replace(evidence, "wired_to = \"load\"\n", "wired_to = \"load\"\n[pins.10]\nvolts = -15.02\n", 1),
			reason: "10 sorts after 3 as a number",
		},
		{
			name: "integer into an existing table", doc: evidence, key: "case.volts", value: 0,
			want: strings.Replace(evidence, "tied_to_pin = 2\n", "tied_to_pin = 2\nvolts = 0\n", 1),
		},
		{
			name: "new table at the end", doc: evidence, key: "output.amps", value: 0.45,
			want: evidence + "\n[output]\namps = 0.45\n",
		},
		{
			name: "top-level key after the last top-level key", doc: evidence, key: "marking", value: "L?78??",
			want: strings.Replace(evidence, "package   = \"TO-220\"\n", "package   = \"TO-220\"\nmarking = \"L?78??\"\n", 1),
		},
		{
			name: "top-level key into a document of tables only", doc: "# head\n\n# about pins\n[pins.1]\nvolts = 1\n", key: "package", value: "TO-3",
			want: "# head\n\npackage = \"TO-3\"\n\n# about pins\n[pins.1]\nvolts = 1\n",
		},
		{
			name: "empty document", doc: "", key: "pins.2.volts", value: 5.0,
			want: "[pins.2]\nvolts = 5.0\n",
		},
		{
			name: "no final newline", doc: "ref = \"U1\"", key: "marking", value: "?M3?7",
			want: "ref = \"U1\"\nmarking = \"?M3?7\"\n",
		},
		{
			name: "CRLF document stays CRLF", doc: "ref = \"U1\"\r\n[case]\r\ntied_to_pin = 1\r\n", key: "case.volts", value: 1.5,
			want: "ref = \"U1\"\r\n[case]\r\ntied_to_pin = 1\r\nvolts = 1.5\r\n",
		},
		{
			name: "dotted keys stay dotted", doc: "ref = \"U1\"\ncase.tied_to_pin = 2\n\n[mount]\nambient_c = 40\n", key: "case.volts", value: 1.0,
			want: "ref = \"U1\"\ncase.tied_to_pin = 2\ncase.volts = 1.0\n\n[mount]\nambient_c = 40\n",
		},
		{
			name: "dotted leads under [pins]", doc: "[pins]\n1.volts = 12  # in\n", key: "pins.1.wired_to", value: "unregulated",
			want: "[pins]\n1.volts = 12  # in\n1.wired_to = \"unregulated\"\n",
		},
		{
			name: "indented keys keep their indentation", doc: "[case]\n  tied_to_pin = 2\n", key: "case.volts", value: 3.0,
			want: "[case]\n  tied_to_pin = 2\n  volts = 3.0\n",
		},
		{
			name: "a multi-line value is replaced whole", doc: "note = \"\"\"\nline [x]\n\"\"\" # kept\nref = 'U1'\n", key: "note", value: "short",
			want: "note = \"short\" # kept\nref = 'U1'\n",
		},
		{
			name: "a sub-table goes after its parent's tables", doc: "[input]\nrectifier = \"bridge\"\n\n[mount]\nambient_c = 40\n", key: "input.extra.x", value: true,
			want: "[input]\nrectifier = \"bridge\"\n\n[input.extra]\nx = true\n\n[mount]\nambient_c = 40\n",
		},
		{
			name: "quoted key parts", doc: "[\"odd key\"]\na = 1\n", key: `"odd key".b`, value: "q\"uote",
			want: "[\"odd key\"]\na = 1\nb = \"q\\\"uote\"\n",
		},
		{
			name: "a table header with spaces and a comment", doc: "[ pins . 2 ] # lead two\nvolts = 1\n", key: "pins.2.volts", value: 2.5,
			want: "[ pins . 2 ] # lead two\nvolts = 2.5\n",
		},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			got, err := Set([]byte(tt.doc), tt.key, tt.value)
			if err != nil {
				t.Fatalf("Set(%q): %v", tt.key, err)
			}
			if diff := cmp.Diff(tt.want, string(got)); diff != "" {
				t.Errorf("Set(%q) mismatch (-want +got):\n%s", tt.key, diff)
			}
			checkDecodes(t, tt.doc, string(got), tt.key, tt.value)
		})
	}
}

func TestSetRefused(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name, doc, key string
		unsupported    bool
	}{
		{"inside an inline table", "case = { tied_to_pin = 2 }\n", "case.volts", true},
		{"below a value", "pins = 3\n", "pins.2.volts", true},
		{"a table, not a value", "[case]\nvolts = 1\n", "case", true},
		{"inside an array of tables", "[[family]]\nid = \"x\"\n", "family.id", true},
		{"not a key", "", "pins..volts", false},
		{"not TOML the editor follows", "ref = \"open\n", "ref", false},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			t.Parallel()
			_, err := Set([]byte(tt.doc), tt.key, "x")
			if err == nil {
				t.Fatalf("Set(%q) on %q succeeded, want an error", tt.key, tt.doc)
			}
			if got := errors.Is(err, ErrUnsupported); got != tt.unsupported {
				t.Errorf("Set(%q): %v; errors.Is(ErrUnsupported) = %v, want %v", tt.key, err, got, tt.unsupported)
			}
		})
	}
	if _, err := Set(nil, "volts", struct{}{}); err == nil {
		t.Error("Set with a struct value succeeded")
	}
}

func TestRemove(t *testing.T) {
	t.Parallel()
	got, err := Remove([]byte(evidence), "pins.1.volts")
	if err != nil {
		t.Fatal(err)
	}
	want := strings.Replace(evidence, "volts = 12.1\n", "", 1)
	if diff := cmp.Diff(want, string(got)); diff != "" {
		t.Errorf("Remove mismatch (-want +got):\n%s", diff)
	}
	if _, err := Remove([]byte(evidence), "pins.2.volts"); !errors.Is(err, ErrNotFound) {
		t.Errorf("Remove of a missing key: %v, want ErrNotFound", err)
	}
}

// TestEvidenceFiles sets a key in each evidence file of the repository and
// checks that only that key changed.
func TestEvidenceFiles(t *testing.T) {
	t.Parallel()
	files, _ := filepath.Glob("../../testdata/*/*.toml")
	if len(files) == 0 {
		t.Fatal("no evidence files found under testdata")
	}
	for _, f := range files {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		for _, key := range []string{"pins.2.volts", "case.tied_to_pin", "output.amps", "package", "marking"} {
			got, err := Set(data, key, 1.5)
			if err != nil {
				var m map[string]any
				if errors.Is(err, ErrUnsupported) || toml.Unmarshal(data, &m) != nil {
					continue
				}
				t.Errorf("%s: Set(%q): %v", f, key, err)
				continue
			}
			checkDecodes(t, string(data), string(got), key, 1.5)
		}
	}
}

// checkDecodes decodes before and after and checks that after is before
// with key set to v, and that every line of before survives in order except
// the lines of the value replaced.
func checkDecodes(t *testing.T, before, after, key string, v any) {
	t.Helper()
	path, err := parseKey(key)
	if err != nil {
		t.Fatal(err)
	}
	replaced := 0
	if sts, err := lex(before); err == nil {
		for _, st := range sts {
			if st.kind == stmtKeyVal && reflect.DeepEqual(st.path, path) {
				replaced = strings.Count(before[st.start:st.end], "\n") + 1
			}
		}
	}
	var want, got map[string]any
	if _, err := toml.Decode(before, &want); err != nil {
		return // the editor made no promise about invalid documents
	}
	if _, err := toml.Decode(after, &got); err != nil {
		t.Fatalf("the edited document does not decode: %v\n%s", err, after)
	}
	if !setIn(want, path, v) {
		t.Fatalf("expected value cannot be set at %v, yet the edit succeeded", path)
	}
	if diff := cmp.Diff(want, got, cmpopts.EquateNaNs()); diff != "" {
		t.Errorf("decoded mismatch (-want +got):\n%s", diff)
	}
	if missing := lostLines(before, after); missing > replaced {
		t.Errorf("%d lines of the original were changed or lost:\n%s", missing, after)
	}
}

// setIn sets m[path] = v as the TOML decoder would return it.
func setIn(m map[string]any, path []string, v any) bool {
	for _, p := range path[:len(path)-1] {
		next, ok := m[p]
		if !ok {
			next = map[string]any{}
			m[p] = next
		}
		sub, ok := next.(map[string]any)
		if !ok {
			return false
		}
		m = sub
	}
	if i, ok := v.(int); ok {
		v = int64(i)
	}
	m[path[len(path)-1]] = v
	return true
}

// lostLines counts the lines of before that are not kept, in order, in
// after: len(before) minus the longest common subsequence of lines. (An
// unterminated last line may gain its line ending.)
func lostLines(before, after string) int {
	a, b := strings.Split(before, "\n"), strings.Split(after, "\n")
	prev, cur := make([]int, len(b)+1), make([]int, len(b)+1)
	for i := range a {
		for j := range b {
			switch {
			case strings.TrimSuffix(a[i], "\r") == strings.TrimSuffix(b[j], "\r"):
				cur[j+1] = prev[j] + 1
			default:
				cur[j+1] = max(prev[j+1], cur[j])
			}
		}
		prev, cur = cur, prev
	}
	return len(a) - prev[len(b)]
}

package tomlpos

import (
	"testing"

	"github.com/google/go-cmp/cmp"
)

func TestScan(t *testing.T) {
	doc := `# comment
top = 1
[[family]]
id = "a"
cout = { min_uf = 1, esr_max_ohm = 2 }
markings = [
  "x", "y",
]
  [[family.package]]
  pins = ["IN", "GND", "OUT"]
[[family]]
id = "b"
  [[family.package]]
  outline = "TO-3"
  [[family.package]]
  outline = "TO-220"
[pins.2]
wired_to = "load"
text = """
id = "not a key"
"""
"quoted.key" = 3
`
	got := map[string][2]int{}
	for _, e := range Scan([]byte(doc)) {
		got[e.Path] = [2]int{e.Line, e.Col}
	}
	want := map[string][2]int{
		"top": {2, 1}, "family[0]": {3, 1}, "family[0].id": {4, 1}, "family[0].cout": {5, 1},
		"family[0].cout.min_uf": {5, 10}, "family[0].cout.esr_max_ohm": {5, 22}, "family[0].markings": {6, 1},
		"family[0].package[0]": {9, 3}, "family[0].package[0].pins": {10, 3}, "family[1]": {11, 1},
		"family[1].id": {12, 1}, "family[1].package[0]": {13, 3}, "family[1].package[0].outline": {14, 3},
		"family[1].package[1]": {15, 3}, "family[1].package[1].outline": {16, 3}, "pins.2": {17, 1},
		"pins.2.wired_to": {18, 1}, "pins.2.text": {19, 1}, "pins.2.quoted.key": {22, 1},
	}
	if diff := cmp.Diff(want, got); diff != "" {
		t.Errorf("Scan mismatch (-want +got):\n%s", diff)
	}
}

func TestStrip(t *testing.T) {
	if got := Strip("family[10].package[2].pins"); got != "family.package.pins" {
		t.Errorf("Strip = %q", got)
	}
}

func FuzzScan(f *testing.F) {
	f.Add([]byte("[[a]]\nb = { c = [1, {d = 2}] }\n"))
	f.Add([]byte("x = \"\"\"\nunterminated"))
	f.Add([]byte("[a.\"b\".c]\n'd' = 'e'\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		var v map[string]any
		Scan(data)
		_, errs, _ := Decode("f.toml", data, &v, "")
		for _, e := range errs {
			_ = e.Error()
		}
	})
}

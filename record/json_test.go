package record_test

import (
	"bytes"
	"encoding/json"
	"strings"
	"testing"
	"unicode"

	"github.com/whichreg/whichreg/record"
)

// TestJSONVocabulary: the record package's own JSON speaks the one
// vocabulary (docs/vocabulary.md): snake_case keys, no Go field names, and
// an outline is "outline" everywhere except inside the evidence, whose keys
// are the evidence file's (package = "TO-220" names an outline there).
func TestJSONVocabulary(t *testing.T) {
	rec, _, err := build(t, "../testdata/demo/vending-lifted-ground.toml", "78xx:TO-220", "78xx:TO-220", "")
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := record.WriteJSON(&buf, rec); err != nil {
		t.Fatal(err)
	}
	var doc map[string]any
	if err := json.Unmarshal(buf.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	if doc["schema"] != "whichreg/record/v1" {
		t.Errorf("schema = %v", doc["schema"])
	}
	var walk func(path string, v any)
	walk = func(path string, v any) {
		switch v := v.(type) {
		case map[string]any:
			for k, x := range v {
				p := path + "." + k
				if strings.IndexFunc(k, unicode.IsUpper) >= 0 && !strings.HasPrefix(path, ".evidence.pins") {
					t.Errorf("%s: a Go field name, not a JSON key", p)
				}
				if k == "package" && !strings.HasPrefix(path, ".evidence") {
					t.Errorf("%s: the outline is called outline", p)
				}
				walk(p, x)
			}
		case []any:
			for _, x := range v {
				walk(path+"[]", x)
			}
		}
	}
	walk("", doc)
	for _, key := range []string{"original", "chosen", "identification", "conditions"} {
		if doc[key] == nil {
			t.Errorf("no %s", key)
		}
	}
}

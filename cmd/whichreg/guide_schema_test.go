package main

import (
	"bytes"
	"strings"
	"testing"

	"github.com/santhosh-tekuri/jsonschema/v6"
)

// guideSchema compiles docs/schema/guide.v1.json, which every line of
// 'whichreg guide --format json' must satisfy (TestGuideDemoSessions
// validates each line).
func guideSchema(t *testing.T) *jsonschema.Schema {
	t.Helper()
	sch, err := jsonschema.NewCompiler().Compile(schemaPath(t, "guide"))
	if err != nil {
		t.Fatalf("compiling docs/schema/guide.v1.json: %v", err)
	}
	return sch
}

// validateLine checks one JSON line against the guide schema.
func validateLine(t *testing.T, sch *jsonschema.Schema, line []byte) error {
	t.Helper()
	doc, err := jsonschema.UnmarshalJSON(bytes.NewReader(line))
	if err != nil {
		t.Fatalf("not JSON: %v\n%s", err, line)
	}
	return sch.Validate(doc)
}

// TestGuideSchemaCatchesMistakes checks that the schema is not one that
// cannot fail: broken guide objects are refused.
func TestGuideSchemaCatchesMistakes(t *testing.T) {
	sch := guideSchema(t)
	good := `{"schema":"whichreg/guide/v1","ask":{"key":"pins.2.volts","prompt":"p","kind":"number","choices":[],"unit":"V","measure":"m","powered":true,"gain_bits":0.5},"ranking":[{"family":"78xx","package":"TO-220","vout":5,"probability":0.5}],"conflicts":[]}`
	if err := validateLine(t, sch, []byte(good)); err != nil {
		t.Fatalf("a good object is refused: %v", err)
	}
	bad := map[string]string{
		"two steps":   strings.Replace(good, `"ranking"`, `"done":{"reason":"quit","leader":null,"evidence_file":null,"asked":0},"ranking"`, 1),
		"bad kind":    strings.Replace(good, `"number"`, `"float"`, 1),
		"extra key":   strings.Replace(good, `"conflicts":[]`, `"conflicts":[],"extra":1`, 1),
		"probability": strings.Replace(good, `"probability":0.5`, `"probability":1.5`, 1),
		"schema name": strings.Replace(good, "guide/v1", "guide/v2", 1),
		"no step":     strings.Replace(good, `"ask":{"key":"pins.2.volts","prompt":"p","kind":"number","choices":[],"unit":"V","measure":"m","powered":true,"gain_bits":0.5},`, "", 1),
	}
	for name, doc := range bad {
		if validateLine(t, sch, []byte(doc)) == nil {
			t.Errorf("%s: accepted", name)
		}
	}
}

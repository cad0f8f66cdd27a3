package main

import (
	"encoding/json"
	"fmt"
	"os"
	"slices"
	"strings"
	"testing"
)

// jsonSchema is the part of JSON Schema (2020-12) that docs/schema/guide.v1.json
// uses: type, const, enum, required, properties, additionalProperties: false,
// items, $ref to #/$defs, oneOf, minimum and maximum.
type jsonSchema map[string]any

func loadSchema(t *testing.T, path string) jsonSchema {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var s jsonSchema
	if err := json.Unmarshal(data, &s); err != nil {
		t.Fatalf("%s: %v", path, err)
	}
	return s
}

// validate returns the first way v breaks the schema s (root holds $defs),
// or nil.
func (root jsonSchema) validate(s map[string]any, v any, at string) error {
	if ref, ok := s["$ref"].(string); ok {
		name, found := strings.CutPrefix(ref, "#/$defs/")
		def, ok := root["$defs"].(map[string]any)[name].(map[string]any)
		if !found || !ok {
			return fmt.Errorf("%s: unknown $ref %s", at, ref)
		}
		return root.validate(def, v, at)
	}
	if c, ok := s["const"]; ok && c != v {
		return fmt.Errorf("%s: %v, want %v", at, v, c)
	}
	if e, ok := s["enum"].([]any); ok && !slices.Contains(e, v) {
		return fmt.Errorf("%s: %v is not one of %v", at, v, e)
	}
	if ty, ok := s["type"]; ok && !typeOK(ty, v) {
		return fmt.Errorf("%s: %T is not of type %v", at, v, ty)
	}
	if n, ok := v.(float64); ok {
		if lo, ok := s["minimum"].(float64); ok && n < lo {
			return fmt.Errorf("%s: %v below %v", at, n, lo)
		}
		if hi, ok := s["maximum"].(float64); ok && n > hi {
			return fmt.Errorf("%s: %v above %v", at, n, hi)
		}
	}
	if one, ok := s["oneOf"].([]any); ok {
		n := 0
		for _, sub := range one {
			if root.validate(sub.(map[string]any), v, at) == nil {
				n++
			}
		}
		if n != 1 {
			return fmt.Errorf("%s: matches %d of the oneOf schemas, want 1", at, n)
		}
	}
	switch x := v.(type) {
	case map[string]any:
		for _, r := range asList(s["required"]) {
			if _, ok := x[r.(string)]; !ok {
				return fmt.Errorf("%s: %q is required", at, r)
			}
		}
		props, _ := s["properties"].(map[string]any)
		for k, sub := range x {
			ps, ok := props[k].(map[string]any)
			if !ok {
				if s["additionalProperties"] == false {
					return fmt.Errorf("%s: %q is not in the schema", at, k)
				}
				continue
			}
			if err := root.validate(ps, sub, at+"."+k); err != nil {
				return err
			}
		}
	case []any:
		if items, ok := s["items"].(map[string]any); ok {
			for i, it := range x {
				if err := root.validate(items, it, fmt.Sprintf("%s[%d]", at, i)); err != nil {
					return err
				}
			}
		}
	}
	return nil
}

func asList(v any) []any {
	l, _ := v.([]any)
	return l
}

func typeOK(ty, v any) bool {
	if l, ok := ty.([]any); ok {
		return slices.ContainsFunc(l, func(t any) bool { return typeOK(t, v) })
	}
	switch ty {
	case "object":
		_, ok := v.(map[string]any)
		return ok
	case "array":
		_, ok := v.([]any)
		return ok
	case "string":
		_, ok := v.(string)
		return ok
	case "number":
		_, ok := v.(float64)
		return ok
	case "integer":
		n, ok := v.(float64)
		return ok && n == float64(int64(n))
	case "boolean":
		_, ok := v.(bool)
		return ok
	case "null":
		return v == nil
	}
	return false
}

// TestGuideSchemaCatchesMistakes checks that the validator is not a test
// that cannot fail: broken guide objects are refused.
func TestGuideSchemaCatchesMistakes(t *testing.T) {
	root := loadSchema(t, "../../docs/schema/guide.v1.json")
	good := `{"schema":"whichreg/guide/v1","ask":{"key":"pins.2.volts","prompt":"p","kind":"number","choices":[],"unit":"V","measure":"m","powered":true,"gain_bits":0.5},"ranking":[{"family":"78xx","package":"TO-220","vout":5,"probability":0.5}],"conflicts":[]}`
	bad := map[string]string{
		"two steps":   strings.Replace(good, `"ranking"`, `"done":{"reason":"quit","leader":null,"evidence_file":null,"asked":0},"ranking"`, 1),
		"bad kind":    strings.Replace(good, `"number"`, `"float"`, 1),
		"extra key":   strings.Replace(good, `"conflicts":[]`, `"conflicts":[],"extra":1`, 1),
		"probability": strings.Replace(good, `"probability":0.5`, `"probability":1.5`, 1),
		"schema name": strings.Replace(good, "guide/v1", "guide/v2", 1),
	}
	var v any
	if err := json.Unmarshal([]byte(good), &v); err != nil {
		t.Fatal(err)
	}
	if err := root.validate(root, v, "$"); err != nil {
		t.Fatalf("a good object is refused: %v", err)
	}
	for name, doc := range bad {
		if err := json.Unmarshal([]byte(doc), &v); err != nil {
			t.Fatal(err)
		}
		if root.validate(root, v, "$") == nil {
			t.Errorf("%s: accepted", name)
		}
	}
}

package guide

import (
	"fmt"
	"reflect"
	"strconv"
	"strings"

	"github.com/whichreg/whichreg/infer"
)

// fieldType returns the Go type of an evidence key in [infer.Evidence],
// following its toml tags ("pins.2.volts" → infer.Volts). Map levels
// (the lead number of pins) take any name.
func fieldType(key string) (reflect.Type, error) {
	t := reflect.TypeOf(infer.Evidence{})
	parts := strings.Split(key, ".")
	for i := 0; i < len(parts); i++ {
		for t.Kind() == reflect.Pointer {
			t = t.Elem()
		}
		switch t.Kind() {
		case reflect.Map:
			t = t.Elem()
			continue
		case reflect.Struct:
		default:
			return nil, fmt.Errorf("%s: %s is a value, not a table", key, strings.Join(parts[:i], "."))
		}
		found := false
		for k := 0; k < t.NumField(); k++ {
			f := t.Field(k)
			if name, _, _ := strings.Cut(f.Tag.Get("toml"), ","); name == parts[i] && name != "-" {
				t, found = f.Type, true
				break
			}
		}
		if !found {
			return nil, fmt.Errorf("%s is not an evidence key", key)
		}
	}
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	return t, nil
}

// isLeaf reports whether an evidence field of type t holds one value (not a
// table of them).
func isLeaf(t reflect.Type) bool {
	switch t.Kind() {
	case reflect.Map, reflect.Slice:
		return false
	case reflect.Struct:
		return reflect.PointerTo(t).Implements(reflect.TypeOf((*quantity)(nil)).Elem())
	}
	return true
}

// quantity is implemented by the evidence's measured quantities ([infer.Q]).
type quantity interface{ UnmarshalTOML(any) error }

// valueFor turns an answer into the TOML value written under q's key: a
// number when the answer is a plain number, the answer as a string when it
// carries a unit or prefix ("12.1 V", "4k7": the evidence loader reads and
// checks it), a whole number for counts and lead numbers, true or false for
// yes/no keys, and for a choice the allowed word the answer abbreviates.
// Anything it cannot turn into the key's type is passed on as a string, so
// that the evidence loader refuses it with its own message.
func valueFor(q Question, answer string) (any, error) {
	t, err := fieldType(q.Key)
	if err != nil {
		return nil, err
	}
	answer = strings.TrimSpace(answer)
	if len(answer) >= 2 && (answer[0] == '"' || answer[0] == '\'') && answer[len(answer)-1] == answer[0] {
		answer = answer[1 : len(answer)-1] // "?M3?7" typed with its quotes
	}
	if q.Kind == KindChoice {
		answer = expandChoice(answer, q.Choices)
	}
	switch {
	case reflect.PointerTo(t).Implements(reflect.TypeOf((*quantity)(nil)).Elem()):
		if n, err := strconv.Atoi(answer); err == nil {
			return n, nil // "0" stays 0, as typed
		}
		if f, err := strconv.ParseFloat(answer, 64); err == nil {
			return f, nil
		}
	case t.Kind() == reflect.Int:
		if n, err := strconv.Atoi(answer); err == nil {
			return n, nil
		}
	case t.Kind() == reflect.Bool:
		switch strings.ToLower(answer) {
		case "yes", "y", "true":
			return true, nil
		case "no", "n", "false":
			return false, nil
		}
	}
	return answer, nil
}

// expandChoice returns the choice that answer names: itself, whatever the
// case, or the only choice it begins. Otherwise answer as typed.
func expandChoice(answer string, choices []string) string {
	var hits []string
	for _, c := range choices {
		if strings.EqualFold(c, answer) {
			return c
		}
		if answer != "" && len(answer) < len(c) && strings.EqualFold(c[:len(answer)], answer) {
			hits = append(hits, c)
		}
	}
	if len(hits) == 1 {
		return hits[0]
	}
	return answer
}

package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/santhosh-tekuri/jsonschema/v6"
)

// jsonCases are the JSON documents of every command, each with its schema
// under docs/schema and its top-level keys written out (not taken from the
// structs, so that a renamed key fails here).
var jsonCases = []struct {
	name   string
	args   []string
	schema string
	keys   string
}{
	{"infer", []string{"infer", demoFile("vending-lifted-ground"), "--format", "json"}, "infer",
		"assumptions candidates conflicts next not_in_catalog not_in_catalog_score others others_count prior_only schema"},
	{"infer-all", []string{"infer", demoFile("controller-to3-case"), "--format", "json", "--all"}, "infer", ""},
	{"infer-negative", []string{"infer", demoFile("bench-supply-negative"), "--format", "json"}, "infer", ""},
	{"swap", []string{"swap", demoFile("vending-lifted-ground"), "--format", "json"}, "swap",
		"assumptions conditions hidden original replacements schema"},
	{"swap-all", []string{"swap", demoFile("bench-supply-negative"), "--format", "json", "--all"}, "swap", ""},
	{"swap-named", []string{"swap", demoFile("preamp-adjustable"), "--original", "317:TO-220", "--format", "json"}, "swap", ""},
	{"record", []string{"record", demoFile("vending-lifted-ground"), "--choose", "78xx:TO-220", "--format", "json"}, "record",
		"assumptions bench_notes catalog_sha256 chosen conditions conflicts date equipment evidence evidence_file identification not_in_catalog original ref runners_up safety schema sign_off title tool warnings"},
	{"record-negative", []string{"record", demoFile("bench-supply-negative"), "--choose", "79xx", "--format", "json"}, "record", ""},
	{"catalog-list", []string{"catalog", "list", "--format", "json"}, "catalog-list", "families schema"},
	{"catalog-show", []string{"catalog", "show", "317", "--format", "json"}, "catalog-show", "family outlines schema"},
	{"catalog-show-negative", []string{"catalog", "show", "79xx", "--format", "json"}, "catalog-show", ""},
	{"catalog-find", []string{"catalog", "find", "?M3?7", "--format", "json"}, "catalog-find", "hits query schema"},
	{"catalog-find-suffix", []string{"catalog", "find", "L7805CV", "--format", "json"}, "catalog-find", ""},
	{"catalog-find-transistor", []string{"catalog", "find", "2N6338", "--format", "json"}, "catalog-find", ""},
	{"catalog-check", []string{"catalog", "check", "--format", "json"}, "catalog-check", "families outlines problems schema"},
	{"catalog-paths", []string{"catalog", "paths", "--format", "json"}, "catalog-paths", "files schema user_catalog_dir user_catalog_used"},
	{"calc-rectifier", []string{"calc", "rectifier", "--vrms", "12.6", "--cap", "2200u", "--load", "0.8", "--format", "json"}, "calc-rectifier",
		"cap_f cap_ripple_a_rms conduction_deg corners diode_peak_a emf_v_rms esr_ohm hz load_a mean_v peak_v rectifier ripple_vpp schema source_ohm trough_v"},
	{"calc-rectifier-rload", []string{"calc", "rectifier", "--rectifier", "center-tap", "--vrms", "9", "--cap", "4700u", "--rload", "10", "--rs", "0R3", "--format", "json"}, "calc-rectifier", ""},
	{"calc-boost", []string{"calc", "boost", "--r", "4R7", "--vin-min", "11", "--vin-max", "16", "--vout", "5", "--load-min", "1.5", "--load-max", "3", "--format", "json"}, "calc-boost",
		"min_load_a output_rise_to_v r_ohm regulates_light regulator_max_a regulator_min_a resistor_max_a resistor_max_w resistor_min_a schema"},
	{"calc-heatsink", []string{"calc", "heatsink", "--vin", "16", "--vout", "5", "--load", "0.8", "--theta-sa", "8", "--theta-ja", "50", "--format", "json"}, "calc-heatsink",
		"ambient_c free_air_junction_c junction_c power_w required_theta_sa_c_per_w schema theta_cs_c_per_w theta_ja_c_per_w theta_jc_c_per_w theta_sa_c_per_w tj_limit_c"},
	{"calc-heatsink-needed", []string{"calc", "heatsink", "--power", "6", "--format", "json"}, "calc-heatsink", ""},
	{"calc-divider", []string{"calc", "divider", "--target", "12", "--format", "json"}, "calc-divider",
		"divider_a error_v min_load_a r1_ohm r1_rating_w r1_w r2_ohm r2_rating_w r2_w schema series spread_high_v spread_low_v trimmer vout_v"},
	{"calc-divider-pair", []string{"calc", "divider", "--r1", "240", "--r2", "2k", "--format", "json"}, "calc-divider", ""},
	{"calc-testload", []string{"calc", "testload", "--volts", "5", "--amps", "1", "--format", "json"}, "calc-testload",
		"amps_a arrangement current_a need_ohm need_w parts power_w schema total_ohm volts_v"},
}

func demoFile(name string) string { return "../../testdata/demo/" + name + ".toml" }

// TestJSONSchemas validates every command's JSON output against its schema
// in docs/schema with a general-purpose JSON Schema (2020-12) validator, and
// checks that the document names that schema.
func TestJSONSchemas(t *testing.T) {
	c := jsonschema.NewCompiler()
	for _, tc := range jsonCases {
		t.Run(tc.name, func(t *testing.T) {
			sch, err := c.Compile(schemaPath(t, tc.schema))
			if err != nil {
				t.Fatalf("compiling docs/schema/%s.v1.json: %v", tc.schema, err)
			}
			doc := runJSON(t, tc.args)
			if err := sch.Validate(doc); err != nil {
				t.Errorf("%s does not validate against docs/schema/%s.v1.json:\n%v", strings.Join(tc.args, " "), tc.schema, err)
			}
			if got := doc.(map[string]any)["schema"]; got != "whichreg/"+tc.schema+"/v1" {
				t.Errorf("schema = %v, want whichreg/%s/v1", got, tc.schema)
			}
		})
	}
}

// TestJSONKeys pins each document's top-level keys (issue 9 item 8).
func TestJSONKeys(t *testing.T) {
	for _, tc := range jsonCases {
		if tc.keys == "" {
			continue
		}
		t.Run(tc.name, func(t *testing.T) {
			doc := runJSON(t, tc.args).(map[string]any)
			var got []string
			for k := range doc {
				got = append(got, k)
			}
			sort.Strings(got)
			if diff := cmp.Diff(strings.Fields(tc.keys), got); diff != "" {
				t.Errorf("%s keys mismatch (-want +got):\n%s", tc.name, diff)
			}
		})
	}
}

// TestSchemasAreUsed: every schema file but the guide's (tested in
// guide_schema_test.go) is exercised here, so none goes stale unseen.
func TestSchemasAreUsed(t *testing.T) {
	files, _ := filepath.Glob("../../docs/schema/*.v1.json")
	if len(files) == 0 {
		t.Fatal("no schema files under docs/schema")
	}
	used := map[string]bool{"guide": true}
	for _, tc := range jsonCases {
		used[tc.schema] = true
	}
	for _, f := range files {
		if name := strings.TrimSuffix(filepath.Base(f), ".v1.json"); !used[name] {
			t.Errorf("docs/schema/%s is validated by no test", filepath.Base(f))
		}
	}
}

func schemaPath(t *testing.T, name string) string {
	p, err := filepath.Abs(filepath.Join("../../docs/schema", name+".v1.json"))
	if err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(p); err != nil {
		t.Fatal(err)
	}
	return p
}

func runJSON(t *testing.T, args []string) any {
	t.Helper()
	app, out, errOut := testApp()
	if code := run(app, args); code != 0 {
		t.Fatalf("%v: exit %d: %s", args, code, errOut)
	}
	doc, err := jsonschema.UnmarshalJSON(bytes.NewReader(out.Bytes()))
	if err != nil {
		t.Fatalf("%v: not JSON: %v", args, err)
	}
	var m map[string]any
	if err := json.Unmarshal(out.Bytes(), &m); err != nil {
		t.Fatalf("%v: not a JSON object: %v", args, err)
	}
	return doc
}

package units

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestParse checks SI prefixes and the IEC 60062 RKM code. Expected values:
// IEC 60062 examples as quoted in methods.md §5 (R47 = 0.47 Ω, 4R7 = 4.7 Ω,
// 4K7 = 4.7 kΩ, 47K3 = 47.3 kΩ, 4M7 = 4.7 MΩ; 2n2 = 2.2 nF); the others are
// SI prefix arithmetic.
func TestParse(t *testing.T) {
	tests := []struct {
		in   string
		unit string
		want float64
	}{
		{"12.6", "V", 12.6},
		{"-12", "V", -12},
		{"1e3", "", 1000},
		{"4k7", "Ω", 4700},
		{"4K7", "Ω", 4700},
		{"47K3", "Ω", 47300},
		{"4M7", "Ω", 4.7e6},
		{"R47", "Ω", 0.47},
		{"4R7", "Ω", 4.7},
		{"0R22", "Ω", 0.22},
		{"470R", "Ω", 470},
		{"470 ohm", "Ω", 470},
		{"2u2", "F", 2.2e-6},
		{"2n2", "F", 2.2e-9},
		{"2200u", "F", 2200e-6},
		{"2200uF", "F", 2200e-6},
		{"330m", "V", 0.33},
		{"1.6A", "A", 1.6},
		{"600mA", "A", 0.6},
		{"50Hz", "Hz", 50},
		{"4.7k", "Ω", 4700},
		{" 5 V ", "V", 5},
		// What report.Num prints reads back (issue 13): a space between the
		// number and the prefixed unit, µ and Ω, the minus sign U+2212.
		{"2200 µF", "F", 2200e-6},
		{"2200 μF", "F", 2200e-6}, // Greek small mu
		{"4.7 kΩ", "Ω", 4700},
		{"4.7 k\u2126", "Ω", 4700}, // the ohm sign
		{"450 mA", "A", 0.45},
		{"\u221215.02 V", "V", -15.02},
		{"220 mΩ", "Ω", 0.22},
		{"10 k", "Ω", 1e4},
	}
	for _, tt := range tests {
		got, err := Parse(tt.in, tt.unit)
		if err != nil {
			t.Errorf("Parse(%q) error: %v", tt.in, err)
			continue
		}
		if math.Abs(got-tt.want) > 1e-12*math.Max(1, math.Abs(tt.want)) {
			t.Errorf("Parse(%q) = %g, want %g", tt.in, got, tt.want)
		}
	}
}

func TestParseErrors(t *testing.T) {
	for _, in := range []string{"", "NaN", "Inf", "-inf", "4k7k", "4.7k7", "x", "12 parsecs", "1e999", "5q", "k", "V", "1_000", "12 5", "4 k 7", "4 R"} {
		if v, err := Parse(in, "V"); err == nil {
			t.Errorf("Parse(%q) = %g, want an error", in, v)
		} else if !errors.Is(err, ErrSyntax) {
			t.Errorf("Parse(%q) error %v does not wrap ErrSyntax", in, err)
		}
	}
}

func TestParseIn(t *testing.T) {
	for _, tt := range []struct {
		in   string
		want float64
	}{{"2200", 2200}, {"2200u", 2200}, {"2m2", 2200}, {"10uF", 10}} {
		got, err := ParseIn(tt.in, "F", 1e-6)
		if err != nil || math.Abs(got-tt.want) > 1e-9 {
			t.Errorf("ParseIn(%q, µF) = %g, %v; want %g", tt.in, got, err, tt.want)
		}
	}
}

func TestFormat(t *testing.T) {
	for _, tt := range []struct {
		v    float64
		want string
	}{{4700, "4.7 kΩ"}, {0.22, "220 mΩ"}, {2.2e-6, "2.2 µΩ"}, {12, "12 Ω"}} {
		if got := Format(tt.v, "Ω"); got != tt.want {
			t.Errorf("Format(%g) = %q, want %q", tt.v, got, tt.want)
		}
	}
}

func FuzzParse(f *testing.F) {
	for _, s := range []string{"4k7", "0R22", "2u2", "1.6A", "330m", "1e308", "-5", "NaN", "µ", "2200uF"} {
		f.Add(s)
	}
	seeds, _ := filepath.Glob("../../testdata/fuzz/units/*")
	if len(seeds) == 0 {
		f.Fatal("no seeds under testdata/fuzz/units")
	}
	for _, name := range seeds {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		for _, line := range strings.Split(string(data), "\n") {
			f.Add(line)
		}
	}
	f.Fuzz(func(t *testing.T, s string) {
		v, err := Parse(s, "F")
		if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
			t.Fatalf("Parse(%q) = %g without error", s, v)
		}
		_, _ = ParseIn(s, "Ω", 1e3)
	})
}

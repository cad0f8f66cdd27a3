package report

import (
	"math"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"

	"github.com/whichreg/whichreg/internal/units"
)

func TestWrap(t *testing.T) {
	tests := []struct {
		name, text, first, rest string
		width                   int
		want                    []string
	}{
		{"fits", "short line", "", "", 20, []string{"short line"}},
		{"breaks at spaces", "one two three four", "", "", 9, []string{"one two", "three", "four"}},
		{"indents", "one two three four", "- ", "  ", 9, []string{"- one two", "  three", "  four"}},
		{"long word broken", "abcdefghij", "", "", 4, []string{"abcd", "efgh", "ij"}},
		{"newline kept", "a b\nc", "", "", 20, []string{"a b", "c"}},
		{"empty", "", "> ", "  ", 20, []string{">"}},
		{"runes not bytes", "µµµµ ΩΩΩΩ", "", "", 9, []string{"µµµµ ΩΩΩΩ"}},
		{"number and unit kept together", "it is 19 % of them", "", "", 9, []string{"it is", "19 % of", "them"}},
		{"prefixed unit kept", "R2 4.7 kΩ, C1 2200 µF", "", "", 10, []string{"R2 4.7 kΩ,", "C1 2200 µF"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := Wrap(tt.text, tt.width, tt.first, tt.rest)
			if diff := cmp.Diff(tt.want, got); diff != "" {
				t.Errorf("Wrap mismatch (-want +got):\n%s", diff)
			}
		})
	}
}

// TestWrapFits: no line is wider than the width whenever the prefixes leave room.
func TestWrapFits(t *testing.T) {
	text := strings.Repeat("the regulator's input peak 12.2 V (the rectifier model at high mains) ", 5)
	for w := 12; w < 100; w++ {
		for _, l := range Wrap(text, w, "  - ", "    ") {
			if Width(l) > w {
				t.Fatalf("width %d: line %q is %d wide", w, l, Width(l))
			}
		}
	}
}

func TestTable(t *testing.T) {
	tab := func() *Table {
		tb := &Table{Columns: []Column{{Header: "ID"}, {Header: "CURRENT", Align: Right}, {Header: "TITLE", Wrap: true, Under: true}}}
		tb.Row("78xx", "1 A", "positive fixed three-terminal regulator")
		tb.Row("317", "1.5 A", "positive adjustable")
		return tb
	}
	tests := []struct {
		width int
		want  string
	}{
		{80, "ID    CURRENT  TITLE\n78xx      1 A  positive fixed three-terminal regulator\n317     1.5 A  positive adjustable\n"},
		{30, "ID    CURRENT\n78xx      1 A\n    positive fixed\n    three-terminal regulator\n317     1.5 A\n    positive adjustable\n"},
		{20, "ID    CURRENT\n78xx      1 A\n    positive fixed\n    three-terminal\n    regulator\n317     1.5 A\n    positive\n    adjustable\n"},
		{10, "id: 78xx\ncurrent:\n  1 A\ntitle:\n  positive\n  fixed\n  three-te\n  rminal\n  regulato\n  r\n\nid: 317\ncurrent:\n  1.5 A\ntitle:\n  positive\n  adjustab\n  le\n"},
	}
	for _, tt := range tests {
		var b strings.Builder
		if err := tab().Write(&b, tt.width); err != nil {
			t.Fatal(err)
		}
		if diff := cmp.Diff(tt.want, b.String()); diff != "" {
			t.Errorf("width %d mismatch (-want +got):\n%s", tt.width, diff)
		}
		for _, l := range strings.Split(b.String(), "\n") {
			if tt.width >= 20 && Width(l) > tt.width {
				t.Errorf("width %d: line %q too wide", tt.width, l)
			}
		}
	}
}

func TestNum(t *testing.T) {
	tests := []struct {
		v    float64
		unit string
		want string
	}{
		{4700, "Ω", "4.7 kΩ"},
		{0.45, "A", "450 mA"},
		{2200e-6, "F", "2200 µF"},
		{10e-6, "F", "10 µF"},
		{-15.02, "V", "-15.02 V"},
		{12.15, "V", "12.15 V"},
		{5.0013, "V", "5 V"}, // 4000 counts: 5.00 V on the 40 V range,
		{48.774, "V", "48.8 V"}, {3.9994, "V", "3.999 V"}, {0.45, "F", "0.45 F"},
		{1.4000000000000001, "%", "1.4 %"},
		{0.22, "Ω", "220 mΩ"},
		{0, "V", "0 V"},
		{125, "°C", "125 °C"},
		{5.123, "°C/W", "5.12 °C/W"},
		{0.9999, "V", "1 V"}, {0.39994, "V", "399.9 mV"},
		{0.99999, "V", "1 V"},
		{math.NaN(), "V", "unknown"},
		{3.5, "", "3.5"},
	}
	for _, tt := range tests {
		if got := Num(tt.v, tt.unit); got != tt.want {
			t.Errorf("Num(%v, %q) = %q, want %q", tt.v, tt.unit, got, tt.want)
		}
	}
	if got := Signed(5, "V"); got != "+5 V" {
		t.Errorf("Signed(5) = %q", got)
	}
	if got := Signed(-5, "V"); got != "-5 V" {
		t.Errorf("Signed(-5) = %q", got)
	}
}

// TestNumTypedBack: every number Num prints parses back (internal/units) to
// itself within the printed resolution.
func TestNumTypedBack(t *testing.T) {
	for _, unit := range []string{"V", "A", "Ω", "F", "W", "Hz"} {
		for _, v := range []float64{4700, 0.45, 2200e-6, -15.02, 12.15, 1e-9, 3.3e6, 0.01, 47e-12} {
			s := Num(v, unit)
			got, err := units.Parse(s, unit)
			if err != nil {
				t.Errorf("Num(%g, %q) = %q does not parse back: %v", v, unit, s, err)
				continue
			}
			if math.Abs(got-v) > 1e-3*math.Abs(v) {
				t.Errorf("Num(%g, %q) = %q parses back as %g", v, unit, s, got)
			}
		}
	}
}

func TestSig(t *testing.T) {
	for _, tt := range []struct{ in, want float64 }{{12.3456789, 12.3457}, {0, 0}, {-0.000123456789, -0.000123457}, {12345678901, 12345700000}} {
		if got := Sig(tt.in); got != tt.want {
			t.Errorf("Sig(%g) = %g, want %g", tt.in, got, tt.want)
		}
	}
}

// TestReflowMarkdownNoBlockStart: a wrapped line never starts with what
// Markdown reads as a list item, heading, quote or setext underline (the
// CommonMark spec, sections 4.3, 4.2, 5.1 and 5.2).
func TestReflowMarkdownNoBlockStart(t *testing.T) {
	for _, in := range []string{
		"the load is 120 mA at idle and 40 mA more with the relay, + 5 mA for the lamp\n",
		"- a list item whose text runs long enough to wrap - and then 2. again # and > here\n",
		"a paragraph that ends on a dash at the wrap point ---- of the page\n",
	} {
		for width := 20; width <= 60; width++ {
			got := ReflowMarkdown(in, width)
			lines := strings.Split(strings.TrimSuffix(got, "\n"), "\n")
			for _, l := range lines[1:] {
				if blockStart().MatchString(strings.TrimSpace(l)) {
					t.Errorf("width %d: line %q starts a block in %q", width, l, got)
				}
			}
			if strings.Join(strings.Fields(got), " ") != strings.Join(strings.Fields(in), " ") {
				t.Errorf("width %d: words changed: %q", width, got)
			}
		}
	}
}

func TestReflowMarkdown(t *testing.T) {
	in := "# A heading that is long enough to pass the width but stays\n\n" +
		"A paragraph of several words that runs past the width\nand goes on.\n\n" +
		"- a list item whose text runs past the width of the page\n" +
		"- short\n\n" +
		"| check | value | why |\n| --- | --- | --- |\n| vout | 5 V \\| 6 V | the output is what the divider gives |\n\n" +
		"| a | b |\n| --- | --- |\n| 1 | 2 |\n"
	want := "# A heading that is long enough to pass the width but stays\n\n" +
		"A paragraph of several words\nthat runs past the width and\ngoes on.\n\n" +
		"- a list item whose text runs\n  past the width of the page\n" +
		"- short\n\n" +
		"- **vout**: value 5 V | 6 V;\n  the output is what the\n  divider gives\n\n" +
		"| a | b |\n| --- | --- |\n| 1 | 2 |\n"
	if diff := cmp.Diff(want, ReflowMarkdown(in, 30)); diff != "" {
		t.Errorf("ReflowMarkdown mismatch (-want +got):\n%s", diff)
	}
}

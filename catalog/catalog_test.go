package catalog_test

import (
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/google/go-cmp/cmp/cmpopts"

	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
	"github.com/whichreg/whichreg/internal/golden"
)

var update = flag.Bool("update", false, "update golden files")

func builtinCatalog(t testing.TB) *catalog.Catalog {
	t.Helper()
	files, errs := builtin.Files()
	if len(errs) > 0 {
		t.Fatalf("built-in catalog does not load: %v", errs)
	}
	return catalog.Merge(files...)
}

func TestBuiltinLintsClean(t *testing.T) {
	c := builtinCatalog(t)
	if errs := catalog.Lint(c); len(errs) > 0 {
		for _, e := range errs {
			t.Error(e)
		}
	}
	// Issue #2: every family id the catalog must carry.
	for _, id := range []string{"78xx", "78Mxx", "78Lxx", "78Sxx", "323", "309", "340", "79xx", "79Mxx", "79Lxx", "320",
		"317", "317L", "317M", "317HV", "337", "350", "338", "783", "2940", "2937", "4940", "1117", "1084", "1085",
		"1086", "2941", "2990", "sip3-buck",
		// Added with issue 11: five-lead LDOs with enable, the L200, the
		// negative 3 A parts, the early LDO and the 7.5 A quasi-LDO.
		"2985", "5205", "2112", "L200", "345", "333", "2930", "1083"} {
		f := c.Family(id)
		if f == nil {
			t.Errorf("family %q missing", id)
			continue
		}
		if f.Source == "" {
			t.Errorf("family %q has no source", id)
		}
	}
	for _, o := range []string{"TO-3", "TO-204AA", "TO-66", "TO-220", "TO-220FP", "TO-202", "TO-126", "TO-92", "TO-39",
		"DPAK", "D2PAK", "SOT-223", "SOT-89", "SO-8", "SIP-3", "SOT-23-5", "SOT-753"} {
		if c.Outline(o) == nil {
			t.Errorf("outline %q missing", o)
		}
	}
}

// TestGeneratedMatchesTOML: the generated built-in catalog (builtin_gen.go)
// equals what its TOML files decode to. After editing a TOML file run
// go generate ./catalog/builtin.
func TestGeneratedMatchesTOML(t *testing.T) {
	decoded, errs := builtin.Decode()
	if len(errs) > 0 {
		t.Fatalf("built-in TOML does not load: %v", errs)
	}
	if lint := catalog.Lint(catalog.Merge(decoded...)); len(lint) > 0 {
		t.Fatalf("built-in TOML does not lint clean: %v", lint)
	}
	gen, _ := builtin.Files()
	opts := cmpopts.IgnoreUnexported(catalog.Outline{}, catalog.Family{})
	if diff := cmp.Diff(decoded, gen, opts); diff != "" {
		t.Errorf("builtin_gen.go is out of date: run go generate ./catalog/builtin (-toml +generated):\n%s", diff)
	}
}

// TestPinouts checks pinouts against the makers' datasheets. Each row names
// the datasheet text the expectation comes from.
func TestPinouts(t *testing.T) {
	c := builtinCatalog(t)
	tests := []struct {
		family, outline string
		pins            []string
		tab             string
		source          string
	}{
		{"78xx", "TO-220", []string{"IN", "GND", "OUT"}, "GND", "onsemi MC7800/D: 'Pin 1. Input 2. Ground 3. Output; heatsink surface connected to Pin 2'"},
		{"78xx", "TO-3", []string{"IN", "OUT"}, "GND", "ST LM323 (1993) table 'TO-3: VI = 1, VO = 2, GND = Case', the same for 78xx TO-3 (lead positions from memory)"},
		{"79xx", "TO-220", []string{"GND", "IN", "OUT"}, "IN", "onsemi MC7900: '1 Ground, 2 Input, 3 Output; heatsink surface connected to Pin 2'"},
		{"79xx", "TO-3", []string{"GND", "OUT"}, "IN", "Motorola MC7900 case 1-03: leads Gnd and Output, case = input (bottom view)"},
		{"317", "TO-220", []string{"ADJ", "OUT", "IN"}, "OUT", "onsemi LM317: 'Pin 1. Adjust 2. Vout 3. Vin; heatsink surface connected to Pin 2'"},
		{"317", "TO-3", []string{"ADJ", "IN"}, "OUT", "TI LM138/LM338 SNVS771C: 'Pin 1 Adjustment, 2 Output, 3 Input; Tab/Case is Output'"},
		{"337", "TO-220", []string{"ADJ", "IN", "OUT"}, "IN", "onsemi LM337/D Rev 10: 'Pin 1 Adjust, 2 Vin, 3 Vout; heatsink surface connected to Pin 2'"},
		{"1117", "SOT-223", []string{"GND", "OUT", "IN"}, "OUT", "TI LM1117 SNOS412Q pin table: ADJ/GND pin 1, VOUT pin 2 and TAB, VIN pin 3"},
		{"1117", "TO-220", []string{"GND", "OUT", "IN"}, "OUT", "TI LM1117 SNOS412Q pin table (TO-220 as SOT-223)"},
		{"78Lxx", "TO-92", []string{"OUT", "GND", "IN"}, "none", "onsemi MC78L00A/D: TO-92 'Pin 1. Output 2. Ground 3. Input'"},
		{"78Lxx", "SO-8", []string{"OUT", "GND", "GND", "NC", "NC", "GND", "GND", "IN"}, "none", "onsemi MC78L00A/D SOIC-8 pin list"},
		{"2937", "TO-220", []string{"IN", "GND", "OUT"}, "GND", "TI LM2937 SNVS100F pin table: 1 INPUT, 2 GND, 3 OUTPUT, TAB GND"},
		{"sip3-buck", "SIP-3", []string{"IN", "GND", "OUT"}, "none", "module makers' text: '+Vin and GND terminals (pins 1 and 2)', 78xx order"},
	}
	for _, tt := range tests {
		t.Run(tt.family+"/"+tt.outline, func(t *testing.T) {
			f := c.Family(tt.family)
			if f == nil {
				t.Fatalf("no family %s", tt.family)
			}
			p := f.Package(c, tt.outline)
			if p == nil {
				t.Fatalf("%s has no %s package", tt.family, tt.outline)
			}
			got := struct {
				Pins []string
				Tab  string
			}{p.Pins, p.Tab}
			want := struct {
				Pins []string
				Tab  string
			}{tt.pins, tt.tab}
			if diff := cmp.Diff(want, got); diff != "" {
				t.Errorf("pinout mismatch with %s (-want +got):\n%s", tt.source, diff)
			}
		})
	}
}

// TestDatasheetFigures checks a few figures the identification leans on.
func TestDatasheetFigures(t *testing.T) {
	c := builtinCatalog(t)
	tests := []struct {
		family string
		got    func(*catalog.Family) float64
		want   float64
		source string
	}{
		{"317", func(f *catalog.Family) float64 { return f.VrefV }, 1.25, "National LM317: VREF 1.20/1.25/1.30 V"},
		{"317", func(f *catalog.Family) float64 { return f.IadjUA }, 100, "National LM317: IADJ 100 uA max"},
		{"317", func(f *catalog.Family) float64 { return f.MinLoadMA }, 10, "National LM317: minimum load 10 mA max"},
		{"78xx", func(f *catalog.Family) float64 { return f.IqMA }, 8, "Fairchild LM7805 Rev 1.3.1: IQ 8 mA max"},
		{"78xx", func(f *catalog.Family) float64 { return f.VinMax(5) }, 35, "onsemi MC7800: 35 V for 5-18 V"},
		{"78xx", func(f *catalog.Family) float64 { return f.VinMax(24) }, 40, "onsemi MC7800: 40 V for 24 V"},
		{"2940", func(f *catalog.Family) float64 { return f.Cout.MinUF }, 22, "National LM2940: COUT >= 22 uF"},
		{"1117", func(f *catalog.Family) float64 { return f.DropoutV }, 1.4, "National LM1117I: 1.40 V max at 800 mA"},
		{"79Mxx", func(f *catalog.Family) float64 { return f.CurrentA }, 0.5, "onsemi MC79M00: 500 mA"},
	}
	for _, tt := range tests {
		f := c.Family(tt.family)
		if f == nil {
			t.Fatalf("no family %s", tt.family)
		}
		if got := tt.got(f); got != tt.want {
			t.Errorf("%s: got %g, want %g (%s)", tt.family, got, tt.want, tt.source)
		}
	}
}

func TestFind(t *testing.T) {
	c := builtinCatalog(t)
	tests := []struct {
		name, query string
		first       string // "" = nothing found
		vout        float64
		reason      string
	}{
		{"worn 317", "?M3?7", "317", 0, "L and 1 unreadable; 317 is the commoner of 317 and 337"},
		{"worn gap 78xx", "L?7805", "78xx", 5, "a 5 V positive 1 A marking with a gap"},
		{"5 V positive", "MC7805CT", "78xx", 5, "a 5 V positive 1 A part"},
		{"negative 12 V", "LM7912CT", "79xx", 12, "a negative 12 V marking"},
		{"low-current", "78L05", "78Lxx", 5, "the L is legible"},
		{"1117 fragment", "*1117*", "1117", 0, ""},
		{"garbage", "QQZZX", "", 0, "nothing legible that fits any family"},
		{"only wildcards", "???", "", 0, "nothing legible"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			hits := catalog.Find(c, tt.query)
			if tt.first == "" {
				if len(hits) != 0 {
					t.Fatalf("Find(%q) = %d hits, first %s; want none", tt.query, len(hits), hits[0].Family.ID)
				}
				return
			}
			if len(hits) == 0 {
				t.Fatalf("Find(%q) found nothing, want %s", tt.query, tt.first)
			}
			if hits[0].Family.ID != tt.first || hits[0].How != "wildcard" {
				t.Errorf("Find(%q) first = %s (%s), want %s: %s", tt.query, hits[0].Family.ID, hits[0].How, tt.first, tt.reason)
			}
			if tt.vout > 0 && (len(hits[0].VoutV) != 1 || hits[0].VoutV[0] != tt.vout) {
				t.Errorf("Find(%q) voltages = %v, want [%g]", tt.query, hits[0].VoutV, tt.vout)
			}
		})
	}
}

// TestBadCatalogs lints each file under testdata/catalog/bad on top of the
// built-in catalog and compares the messages with its golden file.
func TestBadCatalogs(t *testing.T) {
	files, err := filepath.Glob("../testdata/catalog/bad/*.toml")
	if err != nil || len(files) < 10 {
		t.Fatalf("want at least 10 bad catalogs, found %d (%v)", len(files), err)
	}
	base, _ := builtin.Files()
	for _, name := range files {
		t.Run(filepath.Base(name), func(t *testing.T) {
			got := lintFile(t, base, name)
			if got == "" {
				t.Fatalf("%s lints clean; it should not", name)
			}
			golden.Check(t, strings.TrimSuffix(name, ".toml")+".golden", got, golden.Update(*update))
		})
	}
}

func lintFile(t *testing.T, base []*catalog.File, name string) string {
	data, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	rel := "testdata/catalog/bad/" + filepath.Base(name)
	f, errs := catalog.Load(rel, data)
	c := catalog.Merge(append(append([]*catalog.File(nil), base...), f)...)
	errs = append(errs, catalog.Lint(c, rel)...)
	var b strings.Builder
	for _, e := range errs {
		b.WriteString(e.Error())
		b.WriteString("\n")
	}
	return b.String()
}

func TestGoodCatalogs(t *testing.T) {
	files, _ := filepath.Glob("../testdata/catalog/good/*.toml")
	if len(files) == 0 {
		t.Fatal("no good catalogs found")
	}
	base, _ := builtin.Files()
	for _, name := range files {
		data, _ := os.ReadFile(name)
		f, errs := catalog.Load(name, data)
		c := catalog.Merge(append(append([]*catalog.File(nil), base...), f)...)
		errs = append(errs, catalog.Lint(c)...)
		if len(errs) > 0 {
			t.Errorf("%s: %v", name, errs)
		}
		if strings.Contains(name, "replace-78xx") {
			if got := c.Family("78xx"); got.CurrentA != 1.5 || got.Replaces != "builtin:fixed-positive.toml" {
				t.Errorf("78xx not replaced: current %g, replaces %q", got.CurrentA, got.Replaces)
			}
		}
	}
}

func TestStarterFile(t *testing.T) {
	base, _ := builtin.Files()
	f, errs := catalog.Load("starter.toml", []byte(catalog.StarterFile))
	c := catalog.Merge(append(base, f)...)
	errs = append(errs, catalog.Lint(c)...)
	if len(errs) > 0 {
		t.Fatalf("starter file does not lint clean: %v", errs)
	}
}

func TestVoltageCode(t *testing.T) {
	for v, want := range map[float64]string{5: "05", 12: "12", 8.5: "85", 3.3: "33", 2.85: "285", 5.2: "52", 24: "24"} {
		if got := catalog.VoltageCode(v); got != want {
			t.Errorf("VoltageCode(%g) = %q, want %q", v, got, want)
		}
	}
}

func FuzzLoadCatalog(f *testing.F) {
	seeds, _ := filepath.Glob("../testdata/catalog/*/*.toml")
	more, _ := filepath.Glob("../testdata/fuzz/catalog/*")
	bad, _ := filepath.Glob("../testdata/bad/catalog-*.toml")
	seeds = append(append(seeds, more...), bad...)
	if len(seeds) == 0 {
		f.Fatal("no seed files found")
	}
	for _, s := range seeds {
		data, err := os.ReadFile(s)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	base, _ := builtin.Files()
	f.Fuzz(func(t *testing.T, data []byte) {
		file, errs := catalog.Load("fuzz.toml", data)
		c := catalog.Merge(append(append([]*catalog.File(nil), base...), file)...)
		errs = append(errs, catalog.Lint(c, "fuzz.toml")...)
		for _, e := range errs {
			_ = e.Error()
		}
		if len(file.Families) > 0 {
			catalog.Find(c, file.Families[0].ID)
			for _, fam := range file.Families {
				for _, m := range fam.Markings {
					catalog.DecodeMarking(c, m)
				}
			}
		}
	})
}

func ExampleFind() {
	files, _ := builtin.Files()
	c := catalog.Merge(files...)
	for _, h := range catalog.Find(c, "LM79?5")[:1] { // 7905 or 7915
		fmt.Printf("%s %s %v\n", h.Family.ID, h.How, h.VoutV)
	}
	// Output: 79xx wildcard [5 15]
}

func ExampleLoad() {
	f, errs := catalog.Load("mine.toml", []byte(`
[[family]]
id = "x1"
dropout = 2
`))
	fmt.Println(len(f.Families), errs[0])
	// Output: 1 mine.toml:4:1: family[0].dropout: unknown key "dropout"; the known keys are listed in the starter file that `whichreg catalog init` writes
}

func ExampleLint() {
	files, _ := builtin.Files()
	mine, _ := catalog.Load("mine.toml", []byte(`
[[family]]
id = "my-7805"
title = "house 7805"
polarity = "positive"
kind = "fixed"
outputs_v = [5]
tolerance = 0.04
current_a = 1
vin_max_v = 35
dropout_v = 2
iq_ma = 8
tj_max_c = 125
status = "active"
commonness = 3
source = "maker's datasheet"
  [[family.package]]
  outline = "TO-220"
  pins = ["IN", "OUT"]
  tab = "GND"
  theta_jc = 5
  theta_ja = 65
`))
	c := catalog.Merge(append(files, mine)...)
	for _, e := range catalog.Lint(c, "mine.toml") {
		fmt.Println(e)
	}
	// Output:
	// mine.toml:19:3: family[0].package[0].pins: 2 pins given but outline TO-220 has 3 leads; list one function per lead
	// mine.toml:19:3: family[0].package[0].pins: a fixed part needs IN, OUT and GND terminals; this pinout has IN, OUT
	// mine.toml:20:3: family[0].package[0].tab: tab tied to GND but no lead of this pinout is GND; check the datasheet
}

// TestDrawings pins the pinout figure of every built-in package variant.
func TestDrawings(t *testing.T) {
	c := builtinCatalog(t)
	var b strings.Builder
	for _, f := range c.Sorted() {
		for i := range f.Packages {
			p := &f.Packages[i]
			fmt.Fprintf(&b, "== %s %s\n%s", f.ID, p.Label(), catalog.Drawing(c.Outline(p.Outline), p))
		}
	}
	golden.Check(t, "../testdata/catalog/drawings.golden", b.String(), golden.Update(*update))
}

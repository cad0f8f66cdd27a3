package catalog_test

import (
	"slices"
	"strings"
	"testing"

	"github.com/google/go-cmp/cmp"
	"github.com/whichreg/whichreg/catalog"
	"github.com/whichreg/whichreg/catalog/builtin"
)

// TestVariantPinouts checks the pinout of every family and variant added for
// issue 11 against the datasheet text named beside it ("from memory" where
// no datasheet was read: those rows pin the data, they do not confirm it).
func TestVariantPinouts(t *testing.T) {
	c := builtin.Catalog()
	tests := []struct {
		family, outline, variant string
		pins                     []string
		tab                      string
		source                   string
	}{
		{"npn-darlington", "TO-220", "", []string{"B", "C", "E"}, "C", "onsemi TIP120/D Rev 9: TO-220AB 'PIN 1. BASE 2. COLLECTOR 3. EMITTER 4. COLLECTOR'"},
		{"npn-power", "TO-220", "", []string{"B", "C", "E"}, "C", "the TO-220 transistor order of onsemi TIP120/D Rev 9 (TIP41C order from memory)"},
		{"npn-power", "TO-3", "", []string{"B", "E"}, "C", "onsemi 2N3055A/D Rev 6: TO-204AA pin 1 base, pin 2 emitter, case collector (lead positions from memory)"},
		{"npn-power", "TO-126", "", []string{"E", "C", "B"}, "C", "Central Semiconductor BD135/137/139 R3 (2009): 'LEAD CODE: 1) Emitter 2) Collector 3) Base; Mounting Pad is Common to Pin 2'"},
		{"pnp-power", "TO-126", "", []string{"E", "C", "B"}, "C", "the complements' lead code of Central BD135/137/139 R3 (SGS-Thomson BD136/138/140 in SOT-32)"},
		{"nmos-power", "TO-220", "", []string{"G", "D", "S"}, "D", "GE IRF540: 'TERM. 1 GATE, TERM. 2 DRAIN, TERM. 3 SOURCE, TAB DRAIN'"},
		{"npn-small", "TO-92", "BC547 order", []string{"C", "B", "E"}, "none", "Fairchild BC546/547/548: TO-92 1 collector, 2 base, 3 emitter (from memory)"},
		{"npn-small", "TO-92", "2N3904 order", []string{"E", "B", "C"}, "none", "onsemi 2N3904/D: TO-92 1 emitter, 2 base, 3 collector (from memory)"},
		{"shunt-ref", "SOT-23", "TL431 order", []string{"K", "REF", "A"}, "none", "TI ATL431/ATL432 SLVSCV5D pin table: ATL431 CATHODE 1, REF 2, ANODE 3"},
		{"shunt-ref", "SOT-23", "TL432 order", []string{"REF", "K", "A"}, "none", "TI ATL431/ATL432 SLVSCV5D pin table: ATL432 REF 1, CATHODE 2, ANODE 3"},
		{"buck-5lead", "TO-220-5", "", []string{"IN", "SW", "GND", "FB", "INH"}, "GND", "TI LM2596 SNVS124G pin functions: 1 VIN, 2 OUTPUT (switch), 3 GND, 4 FEEDBACK, 5 ON/OFF (low = on)"},
		{"78Txx", "TO-220", "", []string{"IN", "GND", "OUT"}, "GND", "onsemi/Motorola MC78T00: 'Pin 1. Input 2. Ground 3. Output; heatsink surface connected to Pin 2'"},
		{"1117-adj", "SOT-223", "", []string{"ADJ", "OUT", "IN"}, "OUT", "TI LM1117 SNOS412Q pin table: ADJ/GND 1, VOUT 2 and TAB, VIN 3"},
		{"1085-fixed", "TO-220", "", []string{"GND", "OUT", "IN"}, "OUT", "TI LM1086 SNVS039J pin table (pin 1 ADJ/GND, pin 2 and TAB VOUT, pin 3 VIN); National LM1085 'same pin-out as LM317'"},
		{"1086-fixed", "SOT-223", "", []string{"GND", "OUT", "IN"}, "OUT", "TI LM1086 SNVS039J pin table"},
		{"317", "DPAK", "0.5 A National MDT", []string{"ADJ", "OUT", "IN"}, "OUT", "National LM117/LM317 connection diagrams: TO-252 as TO-220, tab = OUT"},
		{"317", "DPAK", "1.5 A TI KVU", []string{"ADJ", "OUT", "IN"}, "OUT", "TI LM317 SLVS044 pin table (KVU as KCS, tab = OUTPUT)"},
		{"337L", "TO-92", "", []string{"OUT", "ADJ", "IN"}, "none", "TI LM337L SNVS780E figure text: 'Pin 1. Output 2. Adjustment 3. Input'"},
		{"2941", "TO-220-5", "", []string{"INH", "IN", "GND", "OUT", "ADJ"}, "GND", "TI LM2941 SNVS770G: ON/OFF on lead 1, off when high (pinout from memory)"},
		{"2950", "TO-92", "", []string{"OUT", "GND", "IN"}, "none", "National LP2950 TO-92: 1 OUTPUT, 2 GND, 3 INPUT (from memory)"},
		{"1700", "TO-92", "", []string{"GND", "IN", "OUT"}, "none", "Microchip MCP1700 TO-92: 1 GND, 2 VIN, 3 VOUT (from memory)"},
		{"6206", "SOT-23", "", []string{"GND", "OUT", "IN"}, "none", "Torex XC6206 SOT-23: 1 VSS, 2 VOUT, 3 VIN (from memory)"},
		{"2985", "SOT-23-5", "", []string{"IN", "GND", "EN", "BYP", "OUT"}, "none", "TI LP2992 JAJSS37K pin table, the LP2985's series: VIN 1, GND 2, ON/OFF 3, BYPASS 4, VOUT 5"},
		{"5205", "SOT-23-5", "", []string{"IN", "GND", "EN", "BYP", "OUT"}, "none", "Micrel MIC5205 M9999-020806: 'connect EN (pin 3) to IN (supply input, pin 1)'; typical application GND 2, BYP 4, OUT 5"},
		{"2112", "SOT-23-5", "", []string{"IN", "GND", "EN", "NC", "OUT"}, "none", "Diodes AP2127 DS36478 Rev. 7-2 SOT-23-5: VIN 1, GND 2, shutdown 3, NC/ADJ 4, VOUT 5 (the AP2112's own table from memory)"},
		{"L200", "TO-220-5", "", []string{"IN", "SENSE", "GND", "ADJ", "OUT"}, "GND", "ST L200 Pentawatt: 1 input, 2 current limiting, 3 ground, 4 reference, 5 output (from memory)"},
		{"345", "TO-3", "", []string{"GND", "OUT"}, "IN", "National LM145/LM345 TL/H/7785: TO-3 only; lead positions and the can as the LM320K (from memory)"},
		{"333", "TO-220", "", []string{"ADJ", "IN", "OUT"}, "IN", "National LM333T (DS009065 front view); the 337's order, from memory"},
		{"333", "TO-3", "", []string{"ADJ", "OUT"}, "IN", "National LM333K STEEL (DS009065 bottom view); the 337's leads, from memory"},
		{"2930", "TO-220", "", []string{"IN", "GND", "OUT"}, "GND", "National LM2930T (DS005539 front view); lead order from memory"},
		{"78Mxx", "TO-39", "", []string{"IN", "GND", "OUT"}, "GND", "TI LM341/LM78M05 SNVS090F: 'Pin 1 Input, 2 Ground, 3 Output; Tab/Case is Ground' (TO package = TO-39)"},
		{"1083", "TO-220", "", []string{"ADJ", "OUT", "IN"}, "OUT", "Linear Technology LT1083/84/85: 'pin compatible with older 3-terminal regulators'; case connected to the output"},
		{"320", "TO-39", "", []string{"GND", "OUT", "IN"}, "IN", "LM320H lead order as the 337's TO-39 (SGS-Thomson LM137 1993: 1 ADJ, 2 OUT, 3 IN), from memory"},
	}
	for _, tt := range tests {
		t.Run(tt.family+"/"+tt.outline+"/"+tt.variant, func(t *testing.T) {
			f := c.Family(tt.family)
			if f == nil {
				t.Fatalf("no family %s", tt.family)
			}
			p := f.PackageVariant(c, tt.outline, tt.variant)
			if p == nil {
				t.Fatalf("%s has no %s package %q", tt.family, tt.outline, tt.variant)
			}
			if tt.variant != "" && p.Source == "" {
				t.Errorf("variant %q names no source", tt.variant)
			}
			got := []string{p.Tab}
			got = append(got, p.Pins...)
			want := append([]string{tt.tab}, tt.pins...)
			if diff := cmp.Diff(want, got); diff != "" {
				t.Errorf("tab and pins differ from %s (-want +got):\n%s", tt.source, diff)
			}
		})
	}
}

// TestCorrectedFigures checks the figures corrected or added for issue 11
// against the datasheets named beside them.
func TestCorrectedFigures(t *testing.T) {
	c := builtin.Catalog()
	fam := func(id string) *catalog.Family {
		f := c.Family(id)
		if f == nil {
			t.Fatalf("no family %s", id)
		}
		return f
	}
	num := []struct {
		family string
		what   string
		got    func(*catalog.Family) float64
		want   float64
		source string
	}{
		{"78xx", "tolerance", func(f *catalog.Family) float64 { return f.Tolerance }, 0.05, "Fairchild LM7805 Rev 1.3.1: 4.75-5.25 V over 5 mA-1 A, 7-20 V"},
		{"78xx", "tolerance_25c", func(f *catalog.Family) float64 { return f.Tolerance25C }, 0.04, "Fairchild LM7805: 4.80-5.20 V at 25 C"},
		{"79xx", "tolerance", func(f *catalog.Family) float64 { return f.Tolerance }, 0.05, "onsemi MC7905: -4.75 to -5.25 V over 7-20 V, 5 mA-1 A"},
		{"78Mxx", "tolerance", func(f *catalog.Family) float64 { return f.Tolerance }, 0.05, "Fairchild MC78M05: 4.75-5.25 V"},
		{"79Mxx", "tolerance", func(f *catalog.Family) float64 { return f.Tolerance }, 0.05, "onsemi MC79M05: -4.75 to -5.25 V over 7-25 V, 5-350 mA"},
		{"78Sxx", "tolerance", func(f *catalog.Family) float64 { return f.Tolerance }, 0.05, "from memory: the L78S05 as the L7805"},
		{"78Txx", "dropout_v", func(f *catalog.Family) float64 { return f.DropoutV }, 2.5, "Motorola MC78T00: dropout 2.5 V max at 3.0 A, 25 C"},
		{"78Txx", "current_a", func(f *catalog.Family) float64 { return f.CurrentA }, 3, "onsemi MC78T00: 'in excess of 3.0 A'"},
		{"337L", "min_load_ma", func(f *catalog.Family) float64 { return f.MinLoadMA }, 5, "National LM337L: minimum load 3.5 typ / 5 max mA at 40 V"},
		{"337L", "iadj_ua", func(f *catalog.Family) float64 { return f.IadjUA }, 100, "National LM337L: ADJ current 50 typ / 100 max uA"},
		{"1117-adj", "dropout_v", func(f *catalog.Family) float64 { return f.DropoutV }, 1.4, "National LM1117I: 1.40 V max at 800 mA"},
		{"1117-adj", "iadj_ua", func(f *catalog.Family) float64 { return f.IadjUA }, 120, "National LM1117I: ADJ current 60 typ / 120 max uA"},
		{"3940", "cout.min_uf", func(f *catalog.Family) float64 { return f.Cout.MinUF }, 33, "TI LM3940 SNVS114G: Cout >= 33 uF"},
		{"shunt-ref", "vref_v", func(f *catalog.Family) float64 { return f.VrefV }, 2.495, "TI TL431 SLVS543: Vref 2495 mV typ"},
		{"shunt-ref", "vin_max_v", func(f *catalog.Family) float64 { return f.VinMaxV }, 36, "TI TL431 and NXP TL431 family: VKA up to 36 V"},
		{"npn-darlington", "control_drop_v high", func(f *catalog.Family) float64 { return f.ControlDropV[1] }, 2.5, "ST TIP120: VBE(on) 2.5 V max at IC 3 A"},
		{"npn-darlington", "vin_max_v", func(f *catalog.Family) float64 { return f.VinMaxV }, 60, "onsemi TIP120/D: VCEO 60 V"},
		{"nmos-power", "control_drop_v low", func(f *catalog.Family) float64 { return f.ControlDropV[0] }, 2.0, "IRF540N: VGS(th) 2.0-4.0 V"},
		{"5205", "cout.esr_max_ohm", func(f *catalog.Family) float64 { return f.Cout.ESRMaxOhm }, 5, "Micrel MIC5205: output capacitor ESR 'about 5 ohm or less'"},
		{"5205", "cout.min_uf", func(f *catalog.Family) float64 { return f.Cout.MinUF }, 2.2, "Micrel MIC5205: 2.2 uF minimum with the 470 pF bypass capacitor"},
		{"5205", "current_a", func(f *catalog.Family) float64 { return f.CurrentA }, 0.15, "Micrel MIC5205: guaranteed 150 mA output"},
		{"345", "vin_max_v", func(f *catalog.Family) float64 { return f.VinMaxV }, 20, "National LM145/LM345 TL/H/7785: input voltage 20 V absolute maximum"},
		{"345", "dropout_v", func(f *catalog.Family) float64 { return f.DropoutV }, 2.8, "National LM345: 'input-output differential of 2.8 V at full rated load over full temperature range'"},
		{"345", "iq_ma", func(f *catalog.Family) float64 { return f.IqMA }, 3.0, "National LM345: quiescent current 1.0 typ / 3.0 max mA"},
		{"333", "vdiff_max_v", func(f *catalog.Family) float64 { return f.VdiffMaxV }, 35, "National LM133/LM333 DS009065: input-output voltage differential 35 V"},
		{"2930", "dropout_v", func(f *catalog.Family) float64 { return f.DropoutV }, 0.6, "National LM2930 DS005539: dropout 0.6 V max at 150 mA"},
		{"2930", "vin_max_v", func(f *catalog.Family) float64 { return f.VinMaxV }, 26, "National LM2930 DS005539: input voltage operating range 26 V"},
		{"1083", "current_a", func(f *catalog.Family) float64 { return f.CurrentA }, 7.5, "Linear Technology LT1083: 7.5 A"},
		{"1083", "dropout_v", func(f *catalog.Family) float64 { return f.DropoutV }, 1.5, "Linear Technology LT1083: dropout 1.5 V max at maximum output current"},
		{"buck-5lead", "vref_v", func(f *catalog.Family) float64 { return f.VrefV }, 1.23, "TI LM2596: 1.23 V feedback reference"},
	}
	for _, tt := range num {
		if got := tt.got(fam(tt.family)); got != tt.want {
			t.Errorf("%s %s: got %g, want %g (%s)", tt.family, tt.what, got, tt.want, tt.source)
		}
	}
	for _, tt := range []struct {
		family string
		volts  []float64
		source string
	}{
		{"2937", []float64{2.5, 3.3}, "TI LM2937-2.5 / LM2937-3.3"},
		{"1117", []float64{1.2, 3.0}, "ST LD1117 Rev 16/19 voltage list"},
		{"1117", []float64{1.5}, "from memory: second sources' lists"},
	} {
		for _, v := range tt.volts {
			if !slices.Contains(fam(tt.family).OutputsV, v) {
				t.Errorf("%s lacks %g V (%s)", tt.family, v, tt.source)
			}
		}
	}
	// The 317's DPAK is sold at two ratings.
	f := fam("317")
	for variant, amps := range map[string]float64{"0.5 A National MDT": 0.5, "1.5 A TI KVU": 1.5} {
		p := f.PackageVariant(c, "DPAK", variant)
		if p == nil || f.Current(p) != amps {
			t.Errorf("317 DPAK %s: want %g A (National LM317 MDT current limit 0.5 A min; TI LM317 KVU 1.5 A)", variant, amps)
		}
	}
	// The 1117's SOT-223 is sold at 0.8 A by the original makers and 1 A by
	// second sources.
	f = fam("1117")
	for variant, amps := range map[string]float64{"0.8 A National, TI, ST": 0.8, "1 A second sources": 1.0} {
		p := f.PackageVariant(c, "SOT-223", variant)
		if p == nil || f.Current(p) != amps {
			t.Errorf("1117 SOT-223 %s: want %g A (National LM1117 800 mA; HTC LM1117 R1.22.3 1 A)", variant, amps)
		}
	}
	// The 783's markings must not take a 7805's (issue 11: L78?5CV).
	for _, h := range catalog.Find(c, "L78?5CV") {
		if h.Family.ID == "783" {
			t.Errorf("catalog find L78?5CV offers the 783 (%+v)", h)
		}
	}
}

// TestOrderCodeVoltages: an order code that names a fixed voltage
// (LM1085IT-3.3/NOPB) belongs to the fixed family, never to the adjustable
// one of the same number, and the voltage it names is one the family is sold
// at. The makers' ordering tables write the voltage as the suffix (-3.3, -5.0,
// 33) and "-ADJ" or nothing for the adjustable part (which then ties with
// the fixed family: LD1117STR).
func TestOrderCodeVoltages(t *testing.T) {
	c := builtin.Catalog()
	for _, f := range c.Sorted() {
		if f.NonRegulator() {
			continue
		}
		for _, p := range f.Packages {
			for _, oc := range p.OrderCodes {
				d := catalog.DecodeMarking(c, oc)
				h, ok := d.Hit(f.ID)
				if !ok {
					continue // TestMarkingOrderCodes reports it
				}
				switch {
				case f.Adjustable() && d.Hits[0].Family != f && d.Hits[0].Score > h.Score:
					t.Errorf("%s under adjustable %s %s reads first as %s (%s): a voltage suffix belongs to the fixed family", oc, f.ID, p.Outline, d.Hits[0].Family.ID, d.Hits[0].Detail)
				case !f.Adjustable() && len(h.VoutV) > 0 && !slices.ContainsFunc(h.VoutV, func(v float64) bool { return slices.Contains(f.OutputsV, v) }):
					t.Errorf("%s under %s %s names %v V, a voltage the family lacks (%v)", oc, f.ID, p.Outline, h.VoutV, f.OutputsV)
				}
			}
		}
	}
}

// TestTwoSidedDrawings: the SOT-23 outlines are drawn with their leads on
// both sides, as the makers' top views show them: SOT-23-5 lead 5 opposite
// lead 1 and 4 opposite 3 (TI LP2992 DBV pin table, Diodes AP2127 DS36478
// pin assignment); SOT-23 lead 3 opposite the gap between 1 and 2 (NXP SOT23
// outline).
func TestTwoSidedDrawings(t *testing.T) {
	c := builtin.Catalog()
	for _, tt := range []struct {
		family, outline string
		above           map[string]float64 // far lead number -> near column (0 = lead 1)
	}{
		{"2985", "SOT-23-5", map[string]float64{"5": 0, "4": 2}},
		{"6206", "SOT-23", map[string]float64{"3": 0.5}},
	} {
		f := c.Family(tt.family)
		p := f.Package(c, tt.outline)
		lines := strings.Split(catalog.Drawing(c.Outline(tt.outline), p), "\n")
		// lines[0] is the view; lines[2] the far numbers; the near numbers
		// follow the body.
		far, nearNums := lines[2], lines[len(lines)-3]
		col1 := strings.Index(nearNums, "1")
		col2 := strings.Index(nearNums, "2")
		for num, col := range tt.above {
			want := col1 + int(col*float64(col2-col1))
			if got := strings.Index(far, num); got != want {
				t.Errorf("%s %s: far lead %s drawn at column %d, want %d (above near column %g):\n%s", tt.family, tt.outline, num, got, want, col, strings.Join(lines, "\n"))
			}
		}
	}
}

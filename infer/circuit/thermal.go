package circuit

import (
	"fmt"
	"strings"
)

// insulatorRow is one interface of the case-to-sink table: θCS on a small
// tab and on a large can, °C/W.
type insulatorRow struct {
	word         string
	small, large float64
}

// insulatorTable is the case-to-sink table, in the order the words are
// listed to the user. "none" is bare metal with thermal compound, the same
// as "grease".
func insulatorTable() []insulatorRow {
	return []insulatorRow{
		{"none", 1.0, 0.4},
		{"grease", 1.0, 0.4},
		{"mica", 1.6, 1.0},
		{"silicone", 2.5, 1.5},
		{"unknown", 2.5, 1.5},
	}
}

// Insulators returns the interface words [CaseToSink] knows, in order: the
// one list the evidence file and the flags allow.
func Insulators() []string {
	rows := insulatorTable()
	out := make([]string, len(rows))
	for i, r := range rows {
		out[i] = r.word
	}
	return out
}

// CaseSize is the size of the metal face that meets the heat sink, which
// sets the interface's thermal resistance.
type CaseSize int

const (
	// SmallTab is a plastic package's tab (TO-220, TO-126, TO-202).
	SmallTab CaseSize = iota
	// LargeCan is a TO-3 or TO-66 metal can.
	LargeCan
)

// CaseToSink returns θCS, the case-to-heat-sink thermal resistance in °C/W,
// for an interface (one of [Insulators]: "none" = bare metal with thermal
// compound, "grease", "mica", "silicone", "unknown") on a large can (TO-3,
// TO-66, size [LargeCan]) or a small tab ([SmallTab]).
//
// Values: TO-220 with compound 1.0 °C/W (TI TPS758xx SLVS330D); TO-3 with
// grease 0.40, grease + mica 1.00 °C/W (blog.mbedded.ninja TO-3 page, as
// quoted in methods.md §3); TO-220 greased mica 1.6 °C/W (ON Semi AN1040,
// from memory); silicone pads 2.5 °C/W on a TO-220 and 1.5 on a TO-3 (from
// memory, the middle of the 1.5–3 range). "unknown" takes the silicone pad,
// the worst of the three.
func CaseToSink(insulator string, size CaseSize) (float64, error) {
	for _, r := range insulatorTable() {
		if strings.EqualFold(r.word, insulator) {
			if size == LargeCan {
				return r.large, nil
			}
			return r.small, nil
		}
	}
	return 0, fmt.Errorf("unknown insulator %q (use %s)", insulator, strings.Join(Insulators(), ", "))
}

// JunctionTemp returns the junction temperature, °C, of a part dissipating
// powerW at ambient ambientC through the series thermal path
//
//	Tj = Ta + P·(θJC + θCS + θSA)
//
// (the datasheet heat-sink procedure, e.g. National/TI LM317 "Heatsink
// Requirements"). With no heat sink use [FreeAirTemp].
func JunctionTemp(powerW, ambientC, thetaJC, thetaCS, thetaSA float64) float64 {
	return ambientC + powerW*(thetaJC+thetaCS+thetaSA)
}

// FreeAirTemp returns Tj = Ta + P·θJA, for a part with no heat sink.
func FreeAirTemp(powerW, ambientC, thetaJA float64) float64 {
	return ambientC + powerW*thetaJA
}

// RequiredThetaSA returns the largest heat-sink-to-air resistance, °C/W, that
// keeps the junction at or below tjC:
//
//	θSA = (Tj − Ta)/P − θJC − θCS
//
// A negative result means no heat sink is good enough. It returns an error
// for a non-positive power.
func RequiredThetaSA(powerW, ambientC, tjC, thetaJC, thetaCS float64) (float64, error) {
	if !(powerW > 0) {
		return 0, fmt.Errorf("dissipation %g W: nothing to sink", powerW)
	}
	return (tjC-ambientC)/powerW - thetaJC - thetaCS, nil
}

// RegulatorDissipation returns the power a linear regulator dissipates:
//
//	P = (Vin − Vout)·Iout + Vin·Ignd
//
// (National/TI LM317 "Heatsink Requirements": PD = (VIN − VOUT)·IL + VIN·IG).
func RegulatorDissipation(vinV, voutV, ioutA, ignA float64) float64 {
	p := (vinV-voutV)*ioutA + vinV*ignA
	if p < 0 {
		return 0
	}
	return p
}

package infer

import (
	"fmt"
	"strings"

	"github.com/whichreg/whichreg/infer/circuit"
)

// The words an evidence file allows, each list in one place. Every word type
// is a string underneath (so untyped string constants still compare) and
// implements [encoding.TextUnmarshaler]: the TOML decoder then reports a bad
// word with its file, line and column.

// vocab is the list of words one evidence key allows.
type vocab[T ~string] struct {
	key   string // the key's own name, for messages ("wired_to")
	words []T
}

// parse returns s as a word of the list, or an error naming the allowed words.
func (v vocab[T]) parse(s string) (T, error) {
	for _, w := range v.words {
		if string(w) == s {
			return w, nil
		}
	}
	return "", fmt.Errorf("%s %q is not one of %s", v.key, s, v.list())
}

// ok reports whether w is "" (not given) or one of the words.
func (v vocab[T]) ok(w T) bool {
	if w == "" {
		return true
	}
	_, err := v.parse(string(w))
	return err == nil
}

// list returns the words joined by ", ".
func (v vocab[T]) list() string {
	s := make([]string, len(v.words))
	for i, w := range v.words {
		s[i] = string(w)
	}
	return strings.Join(s, ", ")
}

// Wiring is where a lead (or the case) goes on the board, found with an
// ohmmeter, power off.
type Wiring string

// The wiring words.
const (
	WiredUnregulated Wiring = "unregulated" // the rectifier and filter capacitor
	WiredLoad        Wiring = "load"        // the regulated rail
	WiredGround      Wiring = "ground"      // board ground
	WiredNetwork     Wiring = "network"     // resistors, a zener, diodes or a trimmer
	WiredOpen        Wiring = "open"        // nothing
	WiredInductor    Wiring = "inductor"    // a coil: a switching regulator's switch node drives one
)

var wirings = vocab[Wiring]{"wired_to", []Wiring{WiredUnregulated, WiredLoad, WiredGround, WiredNetwork, WiredOpen, WiredInductor}}

// Wirings returns the wiring words in their usual order.
func Wirings() []Wiring { return append([]Wiring(nil), wirings.words...) }

// String returns the word.
func (w Wiring) String() string { return string(w) }

// MarshalText returns the word.
func (w Wiring) MarshalText() ([]byte, error) { return []byte(w), nil }

// UnmarshalText accepts one of the wiring words.
func (w *Wiring) UnmarshalText(b []byte) (err error) { *w, err = wirings.parse(string(b)); return }

// CapType is the kind of capacitor at the output.
type CapType string

// The capacitor words.
const (
	CapCeramic      CapType = "ceramic"
	CapTantalum     CapType = "tantalum"
	CapElectrolytic CapType = "electrolytic"
	CapNone         CapType = "none" // no capacitor at the output
)

var capTypes = vocab[CapType]{"cap_type", []CapType{CapCeramic, CapTantalum, CapElectrolytic, CapNone}}

// String returns the word.
func (t CapType) String() string { return string(t) }

// MarshalText returns the word.
func (t CapType) MarshalText() ([]byte, error) { return []byte(t), nil }

// UnmarshalText accepts one of the capacitor words.
func (t *CapType) UnmarshalText(b []byte) (err error) { *t, err = capTypes.parse(string(b)); return }

// Insulator is what sits between the case and the heat sink. The words are
// those of the case-to-sink table, [circuit.Insulators], so the evidence
// file, the flags and the thermal model agree.
type Insulator string

// InsulatorUnknown is the insulator word for "not known" (the thermal model
// takes the worst of the table).
const InsulatorUnknown Insulator = "unknown"

// insulators returns the vocabulary of insulators, from the thermal table.
func insulators() vocab[Insulator] {
	ws := circuit.Insulators()
	v := vocab[Insulator]{key: "insulator", words: make([]Insulator, len(ws))}
	for i, w := range ws {
		v.words[i] = Insulator(w)
	}
	return v
}

// String returns the word.
func (i Insulator) String() string { return string(i) }

// MarshalText returns the word.
func (i Insulator) MarshalText() ([]byte, error) { return []byte(i), nil }

// UnmarshalText accepts one of the insulator words.
func (i *Insulator) UnmarshalText(b []byte) (err error) {
	*i, err = insulators().parse(string(b))
	return
}

// InputKind is what feeds the part: a rectifier topology, or a DC supply.
type InputKind string

// The input words.
const (
	RectifierBridge    InputKind = "bridge"
	RectifierCenterTap InputKind = "center-tap"
	RectifierHalfWave  InputKind = "half-wave"
	RectifierDC        InputKind = "dc" // a battery or another regulated supply
)

var inputKinds = vocab[InputKind]{"rectifier", []InputKind{RectifierBridge, RectifierCenterTap, RectifierHalfWave, RectifierDC}}

// String returns the word.
func (k InputKind) String() string { return string(k) }

// MarshalText returns the word.
func (k InputKind) MarshalText() ([]byte, error) { return []byte(k), nil }

// UnmarshalText accepts one of the input words.
func (k *InputKind) UnmarshalText(b []byte) (err error) {
	*k, err = inputKinds.parse(string(b))
	return
}

// DC reports whether the part is fed from a DC supply rather than a
// rectifier. It is the one place that knows "dc" is not a topology.
func (k InputKind) DC() bool { return k == RectifierDC }

// Topology returns the rectifier topology, and false for a DC supply or an
// input that is not given.
func (k InputKind) Topology() (circuit.Topology, bool) {
	if k == "" || k.DC() {
		return "", false
	}
	t, err := circuit.ParseTopology(string(k))
	return t, err == nil
}

// Transistor is the kind of an external pass transistor.
type Transistor string

// The transistor words.
const (
	TransistorPNP Transistor = "pnp" // the usual booster of a positive regulator
	TransistorNPN Transistor = "npn"
)

var transistors = vocab[Transistor]{"transistor", []Transistor{TransistorPNP, TransistorNPN}}

// String returns the word.
func (t Transistor) String() string { return string(t) }

// MarshalText returns the word.
func (t Transistor) MarshalText() ([]byte, error) { return []byte(t), nil }

// UnmarshalText accepts one of the transistor words.
func (t *Transistor) UnmarshalText(b []byte) (err error) {
	*t, err = transistors.parse(string(b))
	return
}

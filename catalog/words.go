package catalog

import (
	"fmt"
	"strings"
)

// The catalog's vocabulary: every word a catalog file may use for polarity,
// kind, pass element, status, lead function and device is a string-based
// type whose allowed words are listed here and nowhere else. Decoding a file
// rejects any other word with its file, line and key.

// Polarity is the sign of the rail a family regulates ("positive" or "negative").
type Polarity string

// The polarities.
const (
	Positive Polarity = "positive"
	Negative Polarity = "negative"
)

// Kind is what sort of family it is.
type Kind string

// The kinds of family.
const (
	KindFixed        Kind = "fixed"         // fixed-output regulator
	KindAdjustable   Kind = "adjustable"    // adjustable regulator (OUT − ADJ = vref_v)
	KindNonRegulator Kind = "non-regulator" // a part that sits where a regulator might: never a replacement
)

// Pass is a regulator's pass element, which sets its headroom.
type Pass string

// The pass elements; "" means PassNPN.
const (
	PassNPN       Pass = "npn"       // classic Darlington NPN, about 2 V headroom
	PassNPNLDO    Pass = "npn-ldo"   // quasi-LDO, about 1.3 V
	PassPNP       Pass = "pnp"       // LDO with a PNP pass transistor (base drive adds to the ground current)
	PassPMOS      Pass = "pmos"      // CMOS LDO with a P-channel pass element (ground current independent of load)
	PassSwitching Pass = "switching" // drop-in switching module
)

// Status is a family's or package's production status.
type Status string

// The production states; a package's "" means the family's.
const (
	Active   Status = "active"
	Obsolete Status = "obsolete"
	Scarce   Status = "scarce"
)

// Pin is a lead function, as used in [Package.Pins] and [Package.Tab]. The
// PinIn … constants are untyped so that they compare with plain strings too.
type Pin string

// Lead functions of regulators.
const (
	PinIn    = "IN"    // unregulated input
	PinOut   = "OUT"   // regulated output
	PinGnd   = "GND"   // common (fixed parts)
	PinAdj   = "ADJ"   // adjust (adjustable parts; fixed LDOs of the 1117 class use it as GND)
	PinNC    = "NC"    // not connected
	PinEn    = "EN"    // on/off control, on when asserted (5-lead parts)
	PinSense = "SENSE" // remote output sense
	PinFB    = "FB"    // feedback input (switching regulators, some LDOs)
	PinPG    = "PG"    // power-good output
	PinBYP   = "BYP"   // reference bypass / noise-reduction capacitor
	PinInh   = "INH"   // inhibit: on/off control that switches the part OFF when asserted
	TabNone  = "none"  // the tab is insulated or there is none (Tab only)
)

// Lead functions of look-alikes.
const (
	PinSW  = "SW"  // switch node (switching regulators)
	PinB   = "B"   // bipolar transistor base
	PinC   = "C"   // bipolar transistor collector
	PinE   = "E"   // bipolar transistor emitter
	PinG   = "G"   // MOSFET gate
	PinD   = "D"   // MOSFET drain
	PinS   = "S"   // MOSFET source
	PinRef = "REF" // shunt reference input
	PinA   = "A"   // shunt reference anode
	PinK   = "K"   // shunt reference cathode
)

// Device is what a non-regulator family is ([Family.Device]).
type Device string

// The devices a non-regulator family can be.
const (
	DeviceNPN           Device = "npn"            // bipolar NPN transistor
	DevicePNP           Device = "pnp"            // bipolar PNP transistor
	DeviceNPNDarlington Device = "npn-darlington" // NPN Darlington pair in one package
	DevicePNPDarlington Device = "pnp-darlington" // PNP Darlington pair in one package
	DeviceNMOS          Device = "nmos"           // N-channel MOSFET
	DevicePMOS          Device = "pmos"           // P-channel MOSFET
	DeviceShuntRef      Device = "shunt-ref"      // adjustable shunt reference (TL431 type)
	DeviceBuck          Device = "buck"           // step-down switching regulator IC (needs its inductor and diode)
)

// Polarities lists the allowed polarities.
func Polarities() []Polarity { return []Polarity{Positive, Negative} }

// Kinds lists the allowed kinds.
func Kinds() []Kind { return []Kind{KindFixed, KindAdjustable, KindNonRegulator} }

// Passes lists the allowed pass elements.
func Passes() []Pass { return []Pass{PassNPN, PassNPNLDO, PassPNP, PassPMOS, PassSwitching} }

// Statuses lists the allowed production states.
func Statuses() []Status { return []Status{Active, Obsolete, Scarce} }

// RegulatorPins lists the lead functions a regulator family may use.
func RegulatorPins() []Pin {
	return []Pin{PinIn, PinOut, PinGnd, PinAdj, PinNC, PinEn, PinSense, PinFB, PinPG, PinBYP, PinInh}
}

// Pins lists every lead function, the regulators' first.
func Pins() []Pin {
	return append(RegulatorPins(), PinSW, PinB, PinC, PinE, PinG, PinD, PinS, PinRef, PinA, PinK)
}

// Devices lists every [Device] word.
func Devices() []Device {
	return []Device{DeviceNPN, DevicePNP, DeviceNPNDarlington, DevicePNPDarlington, DeviceNMOS, DevicePMOS, DeviceShuntRef, DeviceBuck}
}

// word is the set of catalog word types.
type word interface {
	~string
}

// parseWord sets *dst to text when it is one of allowed (or "" when empty is
// allowed), and otherwise says which words are.
func parseWord[T word](text []byte, dst *T, allowed []T, what string, empty bool) error {
	s := string(text)
	if s == "" && empty {
		*dst = ""
		return nil
	}
	for _, a := range allowed {
		if s == string(a) {
			*dst = a
			return nil
		}
	}
	return fmt.Errorf("%s %q is not one of %s", what, s, quoteWords(allowed))
}

func quoteWords[T word](set []T) string {
	q := make([]string, 0, len(set))
	for _, s := range set {
		if s != "" {
			q = append(q, fmt.Sprintf("%q", string(s)))
		}
	}
	return strings.Join(q, ", ")
}

func isWord[T word](v T, set []T) bool {
	for _, s := range set {
		if v == s {
			return true
		}
	}
	return false
}

// String returns the word.
func (p Polarity) String() string { return string(p) }

// MarshalText returns the word.
func (p Polarity) MarshalText() ([]byte, error) { return []byte(p), nil }

// UnmarshalText accepts one of [Polarities].
func (p *Polarity) UnmarshalText(b []byte) error {
	return parseWord(b, p, Polarities(), "polarity", false)
}

// String returns the word.
func (k Kind) String() string { return string(k) }

// MarshalText returns the word.
func (k Kind) MarshalText() ([]byte, error) { return []byte(k), nil }

// UnmarshalText accepts one of [Kinds].
func (k *Kind) UnmarshalText(b []byte) error { return parseWord(b, k, Kinds(), "kind", false) }

// String returns the word ("npn" for the empty default).
func (p Pass) String() string {
	if p == "" {
		return string(PassNPN)
	}
	return string(p)
}

// MarshalText returns the word as written ("" stays "").
func (p Pass) MarshalText() ([]byte, error) { return []byte(p), nil }

// UnmarshalText accepts one of [Passes] or "".
func (p *Pass) UnmarshalText(b []byte) error {
	return parseWord(b, p, Passes(), "pass", true)
}

// String returns the word.
func (s Status) String() string { return string(s) }

// MarshalText returns the word.
func (s Status) MarshalText() ([]byte, error) { return []byte(s), nil }

// UnmarshalText accepts one of [Statuses] or "" (a package's "the family's").
func (s *Status) UnmarshalText(b []byte) error {
	return parseWord(b, s, Statuses(), "status", true)
}

// String returns the word.
func (p Pin) String() string { return string(p) }

// MarshalText returns the word.
func (p Pin) MarshalText() ([]byte, error) { return []byte(p), nil }

// UnmarshalText accepts one of [Pins] or "none" (for a tab).
func (p *Pin) UnmarshalText(b []byte) error {
	return parseWord(b, p, append(Pins(), TabNone), "lead function", false)
}

// String returns the word.
func (d Device) String() string { return string(d) }

// MarshalText returns the word.
func (d Device) MarshalText() ([]byte, error) { return []byte(d), nil }

// UnmarshalText accepts one of [Devices] or "" (a regulator).
func (d *Device) UnmarshalText(b []byte) error {
	return parseWord(b, d, Devices(), "device", true)
}

// A returns the device word with its article, for messages: "an npn", "a buck".
func (d Device) A() string {
	if strings.HasPrefix(string(d), "n") { // said "en-…"
		return "an " + string(d)
	}
	return "a " + string(d)
}

// Bipolar reports whether d is a bipolar transistor (leads B, C, E).
func (d Device) Bipolar() bool {
	return d == DeviceNPN || d == DevicePNP || d == DeviceNPNDarlington || d == DevicePNPDarlington
}

// MOS reports whether d is a MOSFET (leads G, D, S).
func (d Device) MOS() bool { return d == DeviceNMOS || d == DevicePMOS }

// Transistor reports whether d is a bipolar transistor or a MOSFET.
func (d Device) Transistor() bool { return d.Bipolar() || d.MOS() }

// Polarity returns the polarity a family of this device declares: negative
// for PNP and P-channel parts (the collector or drain sits below the emitter
// or source when conducting), positive for the rest.
func (d Device) Polarity() Polarity {
	if d == DevicePNP || d == DevicePNPDarlington || d == DevicePMOS {
		return Negative
	}
	return Positive
}

package catalog

// Kinds of family ([Family.Kind]).
const (
	KindFixed        = "fixed"         // fixed-output regulator
	KindAdjustable   = "adjustable"    // adjustable regulator (OUT − ADJ = vref_v)
	KindNonRegulator = "non-regulator" // a part that sits where a regulator might: never a replacement
)

// Lead functions of look-alike parts, used in [Package.Pins] and [Package.Tab]
// beside the regulator functions (PinIn …).
const (
	PinSense = "SENSE" // remote output sense
	PinFB    = "FB"    // feedback input (switching regulators, some LDOs)
	PinSW    = "SW"    // switch node (switching regulators)
	PinPG    = "PG"    // power-good output
	PinBYP   = "BYP"   // reference bypass / noise-reduction capacitor
	PinInh   = "INH"   // inhibit: on/off control that switches the part OFF when asserted
	PinB     = "B"     // bipolar transistor base
	PinC     = "C"     // bipolar transistor collector
	PinE     = "E"     // bipolar transistor emitter
	PinG     = "G"     // MOSFET gate
	PinD     = "D"     // MOSFET drain
	PinS     = "S"     // MOSFET source
	PinRef   = "REF"   // shunt reference input
	PinA     = "A"     // shunt reference anode
	PinK     = "K"     // shunt reference cathode
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

// Devices lists every [Device] word, in the order the starter file gives them.
func Devices() []Device {
	return []Device{DeviceNPN, DevicePNP, DeviceNPNDarlington, DevicePNPDarlington, DeviceNMOS, DevicePMOS, DeviceShuntRef, DeviceBuck}
}

// Bipolar reports whether d is a bipolar transistor (leads B, C, E).
func (d Device) Bipolar() bool {
	return d == DeviceNPN || d == DevicePNP || d == DeviceNPNDarlington || d == DevicePNPDarlington
}

// MOS reports whether d is a MOSFET (leads G, D, S).
func (d Device) MOS() bool { return d == DeviceNMOS || d == DevicePMOS }

// Transistor reports whether d is a bipolar transistor or a MOSFET.
func (d Device) Transistor() bool { return d.Bipolar() || d.MOS() }

// Polarity returns the polarity a family of this device declares: "negative"
// for PNP and P-channel parts (the collector or drain sits below the emitter
// or source when conducting), "positive" for the rest.
func (d Device) Polarity() string {
	if d == DevicePNP || d == DevicePNPDarlington || d == DevicePMOS {
		return "negative"
	}
	return "positive"
}

// NonRegulator reports whether the family is a look-alike (a transistor, a
// shunt reference, a switching-regulator IC): it is never offered as a
// replacement.
func (f *Family) NonRegulator() bool { return f.Kind == KindNonRegulator }

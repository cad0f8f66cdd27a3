// Package circuit holds the electrical models behind whichreg's replacement
// checks and bench calculators. It is pure computation: no catalog, no I/O.
// Every quantity is a float64 in SI base units (volts, amperes, ohms, farads,
// hertz, watts, seconds, °C, °C/W) and every name says which.
//
// # Models
//
//   - [Rectifier]: a sinusoidal secondary with series resistance, half-wave,
//     centre-tapped full-wave or bridge rectifier (Shockley diodes with series
//     resistance), a filter capacitor with ESR and a constant-current or
//     resistive load, integrated with the trapezoidal rule and shot to its
//     periodic steady state; [Rectifier.Corners] sweeps mains, load and
//     capacitor tolerance; [Rectifier.Netlist] writes the same circuit for ngspice.
//   - Thermal path: [JunctionTemp], [RequiredThetaSA], [CaseToSink].
//   - Bypass-resistor booster: [Bypass].
//   - Dividers: [DividerVout] (adjustable regulators and lifted-ground fixed
//     regulators, bottom resistor to any rail) and [ChooseDivider] from an
//     IEC 60063 series ([Series]).
//   - Dummy loads: [PlanTestLoad].
package circuit

// Package replace checks current-production candidates against the circuit
// of an original regulator and ranks them.
//
// It owns the replacement checks: one function per check (outline,
// polarity, pinout, tab, vout, current, vin_max, dropout, thermal, cout,
// min_load, module), run in a fixed order over one prepared [Input] that
// holds the operating point ([infer.OperatingPoint]), the target output,
// the old divider or lifted-ground network, the output capacitor and the
// mounting. No check writes anything another reads. Each [Check] carries its
// figures as numbers (value, limit, unit, margin) beside its sentence.
//
// Statuses are pass, warn (a caution: small margin, an assumption), work
// (something must be done: rework, rewiring, an insulating kit, new
// resistors, a heat-sink change) and fail. A candidate is drop-in when only
// pass and warn, needs-work when any work and no fail, unsuitable when any
// fail. Family rules come from package catalog (rules.go) and electrical
// models from infer/circuit, so identification and replacement agree.
package replace

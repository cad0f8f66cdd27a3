// Package infer does whichreg's reasoning: it loads an evidence file (what a
// technician measured on an unmarked regulator and its circuit), ranks the
// catalog's hypotheses of what the part was, suggests the measurement that
// would best separate the leaders, and checks replacements against the
// circuit.
//
// # Evidence
//
// [LoadEvidence] decodes a file strictly (unknown keys, bad words and types
// are positioned errors) and checks it with [Evidence.Check], which an
// [Evidence] built in Go can call too. The evidence words ([Wiring],
// [CapType], [Insulator], [InputKind], [Transistor]) are string types that
// decode themselves; each list lives in one place. [Template] is the file
// `whichreg evidence init` writes: it measures nothing until a line is
// uncommented.
//
// # Identification
//
// A hypothesis is a (family, package variant, output voltage) triple; the
// catalog's look-alikes (transistors, shunt references, switching ICs) are
// hypotheses too. Its score is a sum of natural-log terms, each kept as a
// [Reason]: a prior (commonness, era, how many variants share the family's
// mass, prior.go) plus the likelihood terms, one function per kind of
// evidence in one list (terms*.go): outline, each lead's wiring, the case
// tie, the lead voltages mapped through the pinout (regulation, headroom,
// polarity, a transistor's control drop and lead order, a shunt
// reference's reference), the part's current, the input peak against its
// limit (the shared input model, [OperatingPoint]), the divider and lifted
// ground, the marking. Missing evidence adds nothing. Evidence a part
// cannot produce is a near-veto that outweighs all the support the rest
// gives it, so a contradicted family cannot lead. A "not in the catalog"
// hypothesis gets a flat likelihood for every piece of evidence, so
// evidence that fits nothing says so. Probabilities are the normalised
// exponentials of the scores; the score of a candidate is exactly the sum of
// its reasons' weights. Variants of a family that look the same on the
// board (one outline, pinout and tab; another rating or maker) share their
// outline's prior and rank as one candidate (variants.go). A named package
// costs by how easily it is written for the variant's outline (a name a
// character apart, the same kind); a variant that differs from the named
// package at a glance or in its lead count is a near-veto; with no
// [input] described, the input reading itself weighs against the part's
// limit, the bound taken from it only lightly. Cross-checks (checks.go)
// list conflicts without failing: a slip in the transformer figure, a
// misread marking, swapped meter leads, a package name that does not fit
// the leads counted or the leader.
//
// # Next measurement
//
// For each measurement still open (a lead's continuity or voltage, the case
// tie, where a two-lead can goes, the load current, the input's ripple trough, a bench dropout test,
// the package, a second look at the marking), every hypothesis predicts an
// outcome; the expected information gain is the mutual information, in bits,
// between the leading hypotheses and the outcome. Readings are predicted
// as numbers where the evidence allows (a common lead at the measured
// output less the part's voltage, so a lifted 5 V part and a 6 V part
// predict different readings; a lead of known wiring at its rail). Each [Measurement] names
// the evidence key its answer fills, how the answer is written and, for a
// powered one, the caution to show first. Measurements the outline or the
// circuit cannot give are never offered.
package infer

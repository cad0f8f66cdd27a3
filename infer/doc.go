// Package infer does whichreg's reasoning: it loads an evidence file (what a
// technician measured on an unmarked regulator and its circuit), ranks the
// catalog's hypotheses of what the part was, suggests the measurement that
// would best separate the leaders, and checks replacements against the
// circuit.
//
// # Identification
//
// A hypothesis is a (family, package variant, output voltage) triple. Its
// score is a sum of natural-log terms, each kept as a [Reason]: a prior
// (commonness, era, how many variants share the family's mass) plus one
// log-likelihood per piece of evidence (outline, each lead's wiring, the case
// tie, the lead voltages mapped through the pinout, the regulator current,
// the input peak against the input maximum, the marking, the divider).
// Missing evidence adds nothing. A "not in the catalog" hypothesis gets a flat
// likelihood for every piece of evidence, so evidence that fits nothing
// says so. Probabilities are the normalised exponentials of the scores; the
// score of a candidate is exactly the sum of its reasons' weights.
//
// # Next measurement
//
// For each measurement still open (a lead's continuity or voltage, a voltage
// between two leads, the case tie, the load current), every hypothesis
// predicts an outcome; the expected information gain is the entropy, in
// bits, of the predicted outcome over the posterior.
package infer

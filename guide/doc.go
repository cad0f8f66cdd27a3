// Package guide runs a measuring session: it asks for the next most
// informative measurement, takes the technician's answer, writes it into the
// evidence document and ranks again, until the part is known.
//
// # The loop
//
// A [Session] holds an evidence document and its [Ranking]. [Session.Next]
// returns the next [Step]: a [Question] to ask, a list to pick from, or the
// end ([Done]). [Session.Reply] takes one line typed by the technician:
//
//   - a value ("12.1", "12.1 V", "4k7", "unregulated", "TO-220"), written into
//     the document with [tomledit.Set] under the question's evidence key;
//   - skip: the measurement cannot be made; it is not asked again;
//   - back: undo the last accepted answer;
//   - why: the leader's reasons;
//   - list: the other candidate measurements, to pick one by number;
//   - quit: end the session;
//   - key = value ("pins.2.volts = 5.01"): fills that evidence key instead
//     of the one asked, for a reading made without being asked.
//
// # Nothing lost
//
// Every edited document is loaded with the evidence loader (through the
// [Identifier]) before it is saved; a document the loader refuses is never
// written, and the refusal is returned for the technician to read and answer
// again. Contradictions are accepted and returned as new conflicts. After
// each accepted answer (and each undo) the session calls [Options.Save] with
// the whole document, which the front end writes atomically.
//
// # Which question
//
// The identification ranks the open measurements by expected information
// gain; the session asks the one with the most gain per effort (a look or a
// probe before an oscilloscope, both before a bench test), among those
// expected to gain at least [Options.MinGain].
//
// # Stopping
//
// The session ends when the leader reaches [Options.Stop] (95 %), or when no
// remaining measurement is expected to gain [Options.MinGain] (0.05 bit).
// Before it gives up short of the stop probability it asks each lead's
// voltage that is still open: the gain estimate of a lead voltage is coarse
// (a lifted ground and a true ground are one class of outcome), and the
// reading costs one touch of a probe.
//
// The package prints nothing and reads no flags: cmd/whichreg's guide
// command renders the steps as lines of text or JSON.
package guide

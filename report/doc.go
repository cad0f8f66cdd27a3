// Package report renders results for people and for programs: text wrapped
// to a terminal width, tables that degrade gracefully when the width is too
// small, one formatter for the numbers written into sentences, and the
// helpers every JSON document shares.
//
// It owns no domain knowledge: front ends (the whichreg command, or another
// program) pass it strings and numbers. It prints nothing on its own; every
// writer takes an [io.Writer].
//
// # Width
//
// Widths count runes, which is the display width of everything whichreg
// prints (Latin text, µ, Ω, °, ±, box-drawing characters); wide East Asian
// characters would be miscounted.
//
// # Numbers
//
// [Num] writes a quantity the way a bench meter shows it, with an SI prefix
// and a unit, so that the printed text can be typed back into any flag or
// evidence file. [Signed] does the same with an explicit sign. The minus
// sign is always the ASCII hyphen-minus, the one a keyboard types.
//
// # JSON
//
// Every document is an object whose first key is "schema", naming the
// command and version ([Schema]); [WriteJSON] writes it indented.
package report

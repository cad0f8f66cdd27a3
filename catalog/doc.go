// Package catalog says which three-terminal linear regulators exist: their
// families, the package outlines they come in, the lead-by-lead pinout of each
// package variant, and the datasheet figures the identification and the
// replacement checks need.
//
// # Files
//
// A catalog file is TOML with two arrays of tables, [[outline]] and
// [[family]] (each family with its [[family.package]] variants). The keys are
// the fields of [Outline], [Family], [Package] and [COut]; their TOML names are
// the names in the struct tags, and the JSON output uses the same names.
// Unknown keys are errors, never ignored.
//
// The built-in catalog (package builtin) is loaded first; user files are
// merged on top by [Merge], and a user family or outline with the same id or
// name replaces the built-in one. Every entry remembers the file it came from
// ([Family.Origin]).
//
// # Errors
//
// Loading and [Lint] return a [ErrorList] of [*Error] values, each with the
// file, line and column (starting at 1) and the dotted key path, e.g.
// "family[3].package[0].pins".
//
// # Markings
//
// [Family.Markings] are wildcard patterns of what is printed on a part:
// "?" stands for one character and "*" for any run. In a fixed family the
// token "{VV}" stands for the voltage code of each output (05 for 5 V, 12 for
// 12 V, 85 for 8.5 V); a run of "?" in a fixed family's pattern
// ("*LF??C*") is read as a voltage code too.
//
// [DecodeMarking] reads a marking as it is printed: a maker's prefix or a
// logo read as letters (LM, MC, L, µA, KA, …), the number a pattern names,
// then grade, package and voltage suffixes from the makers' ordering tables
// (LM7805CT: TO-220, 5 V; LD1117V33: TO-220, 3.3 V; LM2940CT-5.0). A
// four-digit year-and-week group beside the number is left out, O/0, I/1,
// B/8, S/5, Z/2 and G/6 are tried at half a character, a "*" in the marking
// never stands for the first character of a number, and a transistor type
// prefix (BC, 2N, TIP, IRF, …) finds only the non-regulator families. [Find]
// adds fuzzy matches of the legible characters; [Resolve] turns a part
// number into the one family it reads as.
package catalog

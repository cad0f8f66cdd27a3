// Package hygiene holds the repository-wide checks of the rules every Go file
// keeps (RULES.md, "How we like the code"): a doc comment on every package and
// exported name, no hand-written file over 450 lines, and no exported
// function or method that takes a bare bool. It has no code of its own; the
// checks are its tests, which parse the module's source with go/ast.
package hygiene

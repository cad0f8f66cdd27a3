// Command whichreg identifies an unmarked three-terminal linear regulator from
// bench measurements, checks current-production replacements against the real
// circuit, and writes the decision down. Run "whichreg --help" for the commands.
package main

//go:generate go test -run ^TestManPages$ . -args -update-man

import "os"

func main() { os.Exit(Main()) }

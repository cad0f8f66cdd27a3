// Command whichreg identifies an unmarked three-terminal linear regulator from
// bench measurements, checks current-production replacements against the real
// circuit, and writes the decision down. Run "whichreg --help" for the commands.
package main

import "os"

func main() { os.Exit(Main()) }

package builtin_test

import (
	"fmt"

	"github.com/whichreg/whichreg/catalog/builtin"
)

// A front end that needs no user catalogs starts from the built-in one.
func ExampleCatalog() {
	c := builtin.Catalog()
	f := c.Family("317")
	p := f.Package(c, "TO-220")
	fmt.Println(f.Title, "—", p.Pins, "tab", p.Tab, "— Vref", f.VrefV, "V")
	// Output: positive adjustable, 1.5 A — [ADJ OUT IN] tab OUT — Vref 1.25 V
}

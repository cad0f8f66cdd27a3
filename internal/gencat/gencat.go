// Package gencat writes large invented catalogs for benchmarks: n fixed 5 V
// families in a TO-220, each with a marking of its own. The data is not real
// and is never shipped.
package gencat

import (
	"fmt"
	"strings"
)

// Generate returns the TOML text of a catalog of n invented families.
func Generate(n int) []byte {
	var b strings.Builder
	for i := 0; i < n; i++ {
		fmt.Fprintf(&b, `[[family]]
id = "gen%d"
title = "generated"
polarity = "positive"
kind = "fixed"
outputs_v = [5]
tolerance = 0.04
current_a = 1.0
vin_max_v = 35
dropout_v = 2.0
iq_ma = 8
tj_max_c = 125
status = "active"
commonness = 3
markings = ["*G%dX{VV}*"]
source = "generated for a benchmark"
  [[family.package]]
  outline = "TO-220"
  pins = ["IN", "GND", "OUT"]
  tab = "GND"
  theta_jc = 5
  theta_ja = 65
`, i, i)
	}
	return []byte(b.String())
}

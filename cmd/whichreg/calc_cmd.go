package main

import (
	"strings"

	"github.com/spf13/cobra"
)

func newCalcCmd(app *App) *cobra.Command {
	cmd := &cobra.Command{
		Use:   "calc",
		Short: "Bench calculations: rectifier, booster, heat sink, divider, load",
		Long: `The electrical models behind the replacement checks, on their own. Values take
SI prefixes and IEC 60062 RKM code: 4k7, 0R22, 2u2, 2200u, 330m, 1.6A.`,
		Example: `  whichreg calc rectifier --vrms 12.6 --cap 2200u --load 0.8
  whichreg calc heatsink --vin 16 --vout 5 --load 0.8 --theta-sa 8
  whichreg calc divider --target 12 --vref 1.25`,
	}
	cmd.AddCommand(newCalcRectifierCmd(app, nil), newCalcBoostCmd(app, nil), newCalcHeatsinkCmd(app, nil),
		newCalcDividerCmd(app, nil), newCalcTestloadCmd(app, nil))
	return cmd
}

// requireFlags returns a usage error naming every one of the flags that was not given.
func requireFlags(cmd *cobra.Command, names ...string) error {
	var missing []string
	for _, n := range names {
		if !cmd.Flags().Changed(n) {
			missing = append(missing, "--"+n)
		}
	}
	if len(missing) == 0 {
		return nil
	}
	if len(missing) == 1 {
		return flagErrorf("%s is required", missing[0])
	}
	return flagErrorf("%s and %s are required", strings.Join(missing[:len(missing)-1], ", "), missing[len(missing)-1])
}

package main

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"github.com/whichreg/whichreg/internal/units"
	"github.com/whichreg/whichreg/report"
)

// enumFlag is a string flag whose value must be one of a list.
type enumFlag struct {
	value   *string
	allowed []string
}

func (f *enumFlag) String() string { return *f.value }
func (f *enumFlag) Type() string   { return strings.Join(f.allowed, "|") }
func (f *enumFlag) Set(v string) error {
	for _, a := range f.allowed {
		if v == a {
			*f.value = v
			return nil
		}
	}
	return fmt.Errorf("must be one of %s", strings.Join(f.allowed, ", "))
}

// addFormatFlag adds --format with the given values; the first is the default.
func addFormatFlag(cmd *cobra.Command, dst *string, allowed ...string) {
	*dst = allowed[0]
	cmd.Flags().Var(&enumFlag{dst, allowed}, "format", "output format: "+strings.Join(allowed, ", "))
	_ = cmd.RegisterFlagCompletionFunc("format", func(*cobra.Command, []string, string) ([]string, cobra.ShellCompDirective) {
		return allowed, cobra.ShellCompDirectiveNoFileComp
	})
}

func addEnumFlag(cmd *cobra.Command, dst *string, name, usage string, allowed ...string) {
	cmd.Flags().Var(&enumFlag{dst, allowed}, name, usage+" ("+strings.Join(allowed, ", ")+")")
}

// quantityFlag is a number flag that accepts SI prefixes and RKM code.
type quantityFlag struct {
	value *float64
	unit  string
	set   *bool
}

func (f *quantityFlag) String() string {
	if f.value == nil {
		return ""
	}
	return fmt.Sprint(*f.value)
}
func (f *quantityFlag) Type() string { return "value" }
func (f *quantityFlag) Set(s string) error {
	v, err := units.Parse(s, f.unit)
	if err != nil {
		return err
	}
	*f.value = v
	if f.set != nil {
		*f.set = true
	}
	return nil
}

// addQuantity adds a number flag in SI base units (V, A, Ω, F, Hz, W).
func addQuantity(cmd *cobra.Command, dst *float64, name, unit string, def float64, usage string) {
	*dst = def
	cmd.Flags().Var(&quantityFlag{value: dst, unit: unit}, name, usage)
}

// capFlag is --cap: a capacitance in farads that takes a unit or prefix. A
// bare number of a farad or more is refused, since "--cap 2200" almost
// always means 2200 µF.
type capFlag struct{ quantityFlag }

func (f *capFlag) Set(s string) error {
	v, err := units.Parse(s, "F")
	if err != nil {
		return err
	}
	if _, bare := strconv.ParseFloat(strings.TrimSpace(s), 64); bare == nil && v >= 1 {
		return fmt.Errorf("%s would be %s, not a filter capacitor: give the unit or prefix, e.g. %su or %suF for %s µF", s, report.Num(v, "F"), s, s, s)
	}
	return f.quantityFlag.Set(s)
}

// microFlag is a quantity whose bare numbers are in millionths of the unit
// (--filter-uf 2200 is 2200 µF, as the evidence key filter_uf); a unit or
// prefix may still be given. value is set in the base unit.
type microFlag struct {
	value *float64
	unit  string
}

func (f *microFlag) String() string {
	if f.value == nil || *f.value == 0 {
		return ""
	}
	return fmt.Sprint(*f.value / 1e-6)
}
func (f *microFlag) Type() string { return "µ" + f.unit }
func (f *microFlag) Set(s string) error {
	v, err := units.ParseIn(s, f.unit, 1e-6)
	if err != nil {
		return err
	}
	*f.value = v * 1e-6
	return nil
}

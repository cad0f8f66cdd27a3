package main

import (
	"strings"

	"github.com/spf13/cobra"
)

// addCompletions teaches shell completion the catalog's words: family ids
// for 'catalog show ID', and ID, ID:OUTLINE for --choose and --original
// wherever a command has them. The catalog (the user's files included) is
// loaded only when the shell asks.
func addCompletions(root *cobra.Command, app *App) {
	var walk func(c *cobra.Command)
	walk = func(c *cobra.Command) {
		for _, name := range []string{"choose", "original"} {
			if c.Flags().Lookup(name) != nil {
				_ = c.RegisterFlagCompletionFunc(name, func(_ *cobra.Command, _ []string, prefix string) ([]string, cobra.ShellCompDirective) {
					return app.completeVariants(prefix), cobra.ShellCompDirectiveNoFileComp | cobra.ShellCompDirectiveNoSpace
				})
			}
		}
		if c.CommandPath() == "whichreg catalog show" {
			c.ValidArgsFunction = func(_ *cobra.Command, args []string, prefix string) ([]string, cobra.ShellCompDirective) {
				if len(args) > 0 {
					return nil, cobra.ShellCompDirectiveNoFileComp
				}
				return app.completeVariants(strings.Split(prefix, ":")[0]), cobra.ShellCompDirectiveNoFileComp
			}
		}
		if c.Flags().Lookup("outline") != nil {
			_ = c.RegisterFlagCompletionFunc("outline", func(*cobra.Command, []string, string) ([]string, cobra.ShellCompDirective) {
				return app.completeOutlines(), cobra.ShellCompDirectiveNoFileComp
			})
		}
		for _, sub := range c.Commands() {
			walk(sub)
		}
	}
	walk(root)
}

// completeVariants returns the family ids that start with prefix, each
// with its title; once the prefix names a family and a colon, that
// family's ID:OUTLINE forms.
func (app *App) completeVariants(prefix string) []string {
	c, err := app.loadCatalog()
	if err != nil {
		return nil
	}
	if id, _, ok := strings.Cut(prefix, ":"); ok {
		f := c.Family(id)
		if f == nil {
			return nil
		}
		var out []string
		seen := map[string]bool{}
		for _, p := range f.Packages {
			if !seen[p.Outline] {
				seen[p.Outline] = true
				out = append(out, f.ID+":"+p.Outline+"\t"+string(f.StatusOf(&p)))
			}
		}
		return out
	}
	var out []string
	for _, f := range c.Sorted() {
		if strings.HasPrefix(strings.ToLower(f.ID), strings.ToLower(prefix)) {
			out = append(out, f.ID+"\t"+f.Title)
		}
	}
	return out
}

// completeOutlines returns every outline name.
func (app *App) completeOutlines() []string {
	c, err := app.loadCatalog()
	if err != nil {
		return nil
	}
	var out []string
	for _, o := range c.Outlines {
		out = append(out, o.Name)
	}
	return out
}

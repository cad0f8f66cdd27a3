package catalog

// LintAdded lints what the files in added bring to the merged catalog c: their
// own entries, and every entry when one of them defines an outline (a
// replaced outline can break the built-in families that use it). The
// built-in catalog's own entries are linted by its tests, so a program need
// not lint them at every start.
func LintAdded(c *Catalog, added ...*File) ErrorList {
	var only []string
	for _, f := range added {
		if f == nil {
			continue
		}
		if len(f.Outlines) > 0 {
			return Lint(c)
		}
		only = append(only, f.Name)
	}
	if len(only) == 0 {
		return nil
	}
	return Lint(c, only...)
}

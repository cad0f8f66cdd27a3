package report

import (
	"io"
	"strings"
)

// Align is how a column's cells sit in it.
type Align int

// The alignments; the zero value is Left.
const (
	Left  Align = iota // text
	Right              // numbers
)

// Column describes one column of a [Table].
type Column struct {
	// Header is the column's heading; a table whose headers are all empty
	// has no header line.
	Header string
	// Align is Left (the zero value) or Right.
	Align Align
	// Wrap lets the column's cells wrap inside it when the table is too
	// wide; a column that does not wrap keeps its natural width.
	Wrap bool
	// Under lets the column leave the row and be written under it, wrapped
	// to the whole width and indented, when the table does not fit even
	// with every wrapping column at its narrowest. Meant for a trailing
	// prose column.
	Under bool
}

// Table is a text table that fits a width: columns two spaces apart, the
// last one not padded. When it is too wide, wrapping columns wrap inside
// themselves, then Under columns move beneath their rows, and as a last
// resort every row is written as "header: value" lines.
type Table struct {
	Columns []Column // the columns, left to right
	rows    [][]string
}

// gap is the space between columns.
const gap = 2

// minWrap is the narrowest a wrapping column is made.
const minWrap = 10

// Row adds a row; missing cells are empty and extra cells are dropped.
func (t *Table) Row(cells ...string) {
	row := make([]string, len(t.Columns))
	copy(row, cells)
	t.rows = append(t.rows, row)
}

// Len returns the number of rows.
func (t *Table) Len() int { return len(t.rows) }

func (t *Table) hasHeader() bool {
	for _, c := range t.Columns {
		if c.Header != "" {
			return true
		}
	}
	return false
}

// natural returns the widest cell (header included) of column i.
func (t *Table) natural(i int) int {
	n := Width(t.Columns[i].Header)
	for _, r := range t.rows {
		n = max(n, Width(r[i]))
	}
	return n
}

// minUnder is the narrowest an Under column is made before it moves under
// its row instead.
const minUnder = 24

// layout returns column widths that fit width using the columns in use,
// narrowing the columns shrink allows (each down to its floor), and
// whether it succeeded.
func (t *Table) layout(width int, use []bool, shrink func(Column) int) ([]int, bool) {
	ws := make([]int, len(t.Columns))
	total := -gap
	for i := range t.Columns {
		if !use[i] {
			continue
		}
		ws[i] = t.natural(i)
		total += ws[i] + gap
	}
	for total > width {
		// Narrow the widest column that can still give.
		best := -1
		for i, c := range t.Columns {
			if floor := shrink(c); use[i] && floor > 0 && ws[i] > floor && (best < 0 || ws[i] > ws[best]) {
				best = i
			}
		}
		if best < 0 {
			return ws, false
		}
		ws[best]--
		total--
	}
	return ws, true
}

// Write writes the table fitted to width columns: first by narrowing the
// Under columns (down to minUnder), then by moving them under their rows
// and narrowing the other wrapping columns, then as "header: value" lines.
func (t *Table) Write(w io.Writer, width int) error {
	use := make([]bool, len(t.Columns))
	for i := range use {
		use[i] = true
	}
	under := make([]bool, len(t.Columns))
	ws, ok := t.layout(width, use, func(c Column) int {
		if c.Wrap && c.Under {
			return minUnder
		}
		return 0
	})
	if !ok {
		for i, c := range t.Columns {
			if c.Under {
				use[i], under[i] = false, true
			}
		}
		ws, ok = t.layout(width, use, func(c Column) int {
			if c.Wrap {
				return minWrap
			}
			return 0
		})
	}
	if !ok {
		return t.writeStacked(w, width)
	}
	var b strings.Builder
	if t.hasHeader() {
		hdr := make([]string, len(t.Columns))
		for i, c := range t.Columns {
			hdr[i] = c.Header
		}
		t.writeRow(&b, hdr, ws, use)
	}
	for _, r := range t.rows {
		t.writeRow(&b, r, ws, use)
		for i := range t.Columns {
			if under[i] && r[i] != "" {
				for _, l := range Wrap(r[i], width, "    ", "    ") {
					b.WriteString(l + "\n")
				}
			}
		}
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// writeRow writes one row, wrapping cells inside their columns.
func (t *Table) writeRow(b *strings.Builder, r []string, ws []int, use []bool) {
	cells := make([][]string, len(t.Columns))
	height := 1
	last := -1
	for i := range t.Columns {
		if !use[i] {
			continue
		}
		last = i
		if Width(r[i]) <= ws[i] {
			cells[i] = []string{r[i]}
		} else {
			cells[i] = Wrap(r[i], ws[i], "", "")
		}
		height = max(height, len(cells[i]))
	}
	for k := 0; k < height; k++ {
		var line strings.Builder
		for i, c := range t.Columns {
			if !use[i] {
				continue
			}
			s := ""
			if k < len(cells[i]) {
				s = cells[i][k]
			}
			if i != firstUsed(use) {
				line.WriteString(strings.Repeat(" ", gap))
			}
			switch {
			case c.Align == Right:
				line.WriteString(PadLeft(s, ws[i]))
			case i == last:
				line.WriteString(s)
			default:
				line.WriteString(Pad(s, ws[i]))
			}
		}
		b.WriteString(strings.TrimRight(line.String(), " ") + "\n")
	}
}

func firstUsed(use []bool) int {
	for i, u := range use {
		if u {
			return i
		}
	}
	return 0
}

// writeStacked writes every row as "header: value" lines, a blank line
// between rows: the layout of last resort for a very narrow width.
func (t *Table) writeStacked(w io.Writer, width int) error {
	var b strings.Builder
	for k, r := range t.rows {
		if k > 0 {
			b.WriteString("\n")
		}
		for i, c := range t.Columns {
			if r[i] == "" {
				continue
			}
			h := c.Header
			if h == "" {
				h = "-"
			}
			h = strings.ToLower(h) + ":"
			if Width(h)+1+Width(r[i]) <= width {
				b.WriteString(h + " " + r[i] + "\n")
				continue
			}
			b.WriteString(h + "\n")
			for _, l := range Wrap(r[i], width, "  ", "  ") {
				b.WriteString(l + "\n")
			}
		}
	}
	_, err := io.WriteString(w, b.String())
	return err
}

package report

import (
	"io"
	"strings"
	"unicode/utf8"
)

// Width returns the display width of s in columns (its rune count; see the
// package doc).
func Width(s string) int { return utf8.RuneCountInString(s) }

// Wrap breaks text into lines of at most width columns at spaces. The
// first line starts with first and the others with rest (indents, bullets);
// both count toward the width. A word longer than the room left is broken
// where it must be. Runs of spaces collapse to one; newlines in text start
// a new line. A width too small for the prefixes is treated as room for one
// character. Wrap returns at least one line.
func Wrap(text string, width int, first, rest string) []string {
	return wrap(text, width, first, rest, glueUnits)
}

// wrap is [Wrap] with glue joining the words that must not be split
// across lines.
func wrap(text string, width int, first, rest string, glue func([]string) []string) []string {
	var lines []string
	prefix := first
	for i, para := range strings.Split(text, "\n") {
		if i > 0 {
			prefix = rest
		}
		words := glue(strings.Fields(para))
		if len(words) == 0 {
			lines = append(lines, strings.TrimRight(prefix, " "))
			prefix = rest
			continue
		}
		line := prefix
		empty := true
		for _, w := range words {
			room := max(width-Width(line), 1)
			need := Width(w)
			if !empty {
				need++
			}
			if need <= room {
				if !empty {
					line += " "
				}
				line += w
				empty = false
				continue
			}
			if !empty {
				lines = append(lines, line)
				line, empty = rest, true
			}
			// Break a word that is wider than a whole line.
			for Width(w) > max(width-Width(line), 1) {
				n := max(width-Width(line), 1)
				head, tail := splitRunes(w, n)
				lines = append(lines, line+head)
				line, w = rest, tail
			}
			line += w
			empty = false
		}
		lines = append(lines, line)
		prefix = rest
	}
	for i, l := range lines {
		lines[i] = strings.ReplaceAll(l, nbsp, " ")
	}
	return lines
}

// glueUnits joins a number and the unit after it ("19 %", "4.7 kΩ") with
// a no-break space, so that no line ends between the two; Wrap turns it
// back into a space.
func glueUnits(words []string) []string {
	out := words[:0:0]
	for _, w := range words {
		if n := len(out); n > 0 && endsInDigit(out[n-1]) && isUnit(w) {
			out[n-1] += nbsp + w
			continue
		}
		out = append(out, w)
	}
	return out
}

const nbsp = "\u00a0"

func endsInDigit(s string) bool {
	r, _ := utf8.DecodeLastRuneInString(s)
	return r >= '0' && r <= '9'
}

// isUnit reports whether w is a unit symbol, with an optional SI prefix and
// trailing punctuation: %, °C, °C/W, V, mA, kΩ, µF, Hz, W, s, ms.
func isUnit(w string) bool {
	w = strings.TrimRight(w, ".,;:)")
	switch w {
	case "%", "°C", "°C/W", "Hz", "bits", "V p-p", "rms":
		return true
	}
	r, n := utf8.DecodeRuneInString(w)
	if strings.ContainsRune("pnuµmkMG", r) && n < len(w) {
		w = w[n:]
	}
	switch w {
	case "V", "A", "Ω", "F", "W", "s", "Hz":
		return true
	}
	return false
}

// splitRunes splits s after n runes.
func splitRunes(s string, n int) (string, string) {
	i := 0
	for k := range s {
		if i == n {
			return s[:k], s[k:]
		}
		i++
	}
	return s, ""
}

// Fill writes text wrapped as by [Wrap], one line per line.
func Fill(w io.Writer, text string, width int, first, rest string) error {
	for _, l := range Wrap(text, width, first, rest) {
		if _, err := io.WriteString(w, l+"\n"); err != nil {
			return err
		}
	}
	return nil
}

// Pad returns s padded with spaces to width columns (never cut).
func Pad(s string, width int) string {
	if n := width - Width(s); n > 0 {
		return s + strings.Repeat(" ", n)
	}
	return s
}

// PadLeft returns s right-aligned in width columns (never cut).
func PadLeft(s string, width int) string {
	if n := width - Width(s); n > 0 {
		return strings.Repeat(" ", n) + s
	}
	return s
}

package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strings"
)

// table is a titled grid of text cells.
type table struct {
	title  string
	header []string
	rows   [][]string
}

// add appends a row; it panics when the row does not match the header.
func (t *table) add(cells ...string) {
	if len(cells) != len(t.header) {
		panic(fmt.Sprintf("benchtab: row of %d cells in a table of %d columns", len(cells), len(t.header)))
	}
	t.rows = append(t.rows, cells)
}

// markdown writes t as a GitHub-flavoured Markdown table, preceded by its
// title as a heading when it has one.
func (t *table) markdown(w io.Writer) error {
	var b strings.Builder
	if t.title != "" {
		fmt.Fprintf(&b, "### %s\n\n", t.title)
	}
	line := func(cells []string) {
		b.WriteString("|")
		for _, c := range cells {
			if c == "no" {
				c = "**no**" // a goal that does not hold stands out
			}
			b.WriteString(" " + strings.ReplaceAll(c, "|", `\|`) + " |")
		}
		b.WriteString("\n")
	}
	line(t.header)
	sep := make([]string, len(t.header))
	for i := range sep {
		sep[i] = "---"
	}
	line(sep)
	for _, r := range t.rows {
		line(r)
	}
	b.WriteString("\n")
	_, err := io.WriteString(w, b.String())
	return err
}

// csv writes t as CSV with its header as the first record.
func (t *table) csv(w io.Writer) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(t.header); err != nil {
		return err
	}
	if err := cw.WriteAll(t.rows); err != nil {
		return err
	}
	return cw.Error()
}

// Cell formatting.

// holds is the verdict cell of a goal.
func holds(ok bool) string {
	if ok {
		return "yes"
	}
	return "no"
}

// dur prints a duration in seconds with a unit that suits it.
func dur(ns float64) string {
	switch {
	case ns >= 1e9:
		return fmt.Sprintf("%.3g s", ns/1e9)
	case ns >= 1e6:
		return fmt.Sprintf("%.3g ms", ns/1e6)
	case ns >= 1e3:
		return fmt.Sprintf("%.3g µs", ns/1e3)
	}
	return fmt.Sprintf("%.3g ns", ns)
}

// sci prints an error figure.
func sci(v float64) string {
	if math.IsNaN(v) {
		return "—"
	}
	return fmt.Sprintf("%.2e", v)
}

// fix prints v with d decimals, or a dash for NaN.
func fix(v float64, d int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	return fmt.Sprintf("%.*f", d, v)
}

// count prints an integer with thousands separators.
func count[T int | int64](n T) string {
	s := fmt.Sprint(n)
	neg := strings.HasPrefix(s, "-")
	s = strings.TrimPrefix(s, "-")
	var b strings.Builder
	for i, c := range s {
		if i > 0 && (len(s)-i)%3 == 0 {
			b.WriteByte(',')
		}
		b.WriteRune(c)
	}
	if neg {
		return "-" + b.String()
	}
	return b.String()
}

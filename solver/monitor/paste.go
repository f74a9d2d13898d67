package monitor

import (
	"porelight/solver"

	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"time"
)

// Reasons ParseReadings refuses a field or a line. A *PasteError wraps one
// of these (or ErrNegative, ErrNotFinite, ErrNotSorted, ErrDuplicate), so
// callers may test with errors.Is.
var (
	ErrNotNumber  = errors.New("is not a number")
	ErrNotTime    = errors.New("is not a number of days or a date (YYYY-MM-DD, DD/MM/YYYY or DD.MM.YYYY)")
	ErrColumns    = errors.New("does not have two columns (time or date, value)")
	ErrNoReadings = errors.New("no readings found")
)

// MaxPasteErrors caps the errors ParseReadings reports for one text.
const MaxPasteErrors = 20

// PasteError is one thing wrong with pasted readings. Line and Column are
// 1-indexed positions in the pasted text (Column 0: the whole line; Line 0:
// the whole text); Text is the field as pasted.
type PasteError struct {
	Line, Column int
	Text         string
	Err          error
	Detail       string // optional, e.g. "day 3 follows day 7 on line 4"
}

// Error reads like `line 4, column 2: "abc" is not a number`.
func (e *PasteError) Error() string {
	var b strings.Builder
	switch {
	case e.Line > 0 && e.Column > 0:
		fmt.Fprintf(&b, "line %d, column %d: %q ", e.Line, e.Column, e.Text)
	case e.Line > 0:
		fmt.Fprintf(&b, "line %d: ", e.Line)
	}
	b.WriteString(e.Err.Error())
	if e.Detail != "" {
		b.WriteString(" (" + e.Detail + ")")
	}
	return b.String()
}

// Unwrap returns the reason.
func (e *PasteError) Unwrap() error { return e.Err }

// ParseReadings reads two columns pasted from a spreadsheet or a text
// file: the time of each reading, then its value.
//
// Columns are separated by tabs (what a spreadsheet copies), semicolons,
// commas or spaces; the separator is found from the text. Numbers take a
// decimal point, or a decimal comma when the columns are separated by
// tabs, semicolons or spaces (so "12,5;0,034" and "12.5\t0.034" read the
// same); thousands separators are not read. The first column is either
// elapsed days (a number ≥ 0) or a date: YYYY-MM-DD, DD/MM/YYYY or
// DD.MM.YYYY, returned as Reading.Date in YYYY-MM-DD form. Blank lines are
// skipped, and so is a first line in which no field is a number or a date
// (a header). Empty trailing columns are ignored. Times must increase
// strictly down the text (among readings of the same kind: days with days,
// dates with dates).
//
// All errors are returned together (up to MaxPasteErrors), joined with errors.Join;
// each is a *PasteError naming the line and the column, e.g.
// `line 4, column 2: "abc" is not a number`. A text with no reading
// returns ErrNoReadings.
func ParseReadings(text string) ([]solver.Reading, error) {
	lines := strings.Split(text, "\n")
	for i := range lines {
		lines[i] = strings.TrimRight(lines[i], "\r")
	}
	sep := detectSeparator(lines)
	decimalComma := sep != ","

	var (
		out      []solver.Reading
		errs     []error
		header   = true // the next non-blank line may be a header
		prevDays = math.NaN()
		prevDate time.Time
		prevLine [2]int // line of the previous days / date reading
	)
	add := func(e *PasteError) {
		if len(errs) < MaxPasteErrors {
			errs = append(errs, e)
		}
	}
	for i, line := range lines {
		n := i + 1
		if strings.TrimSpace(line) == "" {
			continue
		}
		fields := splitFields(line, sep)
		if header {
			header = false
			if isHeader(fields, decimalComma) {
				continue
			}
		}
		if len(fields) != 2 {
			add(&PasteError{Line: n, Err: ErrColumns, Detail: fmt.Sprintf("found %d", len(fields))})
			continue
		}
		var r solver.Reading
		ok := true
		days, date, kind := parseTime(fields[0], decimalComma)
		switch kind {
		case timeNone:
			add(&PasteError{Line: n, Column: 1, Text: fields[0], Err: ErrNotTime})
			ok = false
		case timeBad:
			add(&PasteError{Line: n, Column: 1, Text: fields[0], Err: solver.ErrNotFinite})
			ok = false
		case timeDays:
			if days < 0 {
				add(&PasteError{Line: n, Column: 1, Text: fields[0], Err: solver.ErrNegative, Detail: "days after day 0"})
				ok = false
				break
			}
			r.T = days
			if !math.IsNaN(prevDays) {
				if e := orderError(days < prevDays, days == prevDays); e != nil {
					e.Line, e.Column, e.Text = n, 1, fields[0]
					e.Detail = fmt.Sprintf("day %g %s day %g on line %d", days, e.Detail, prevDays, prevLine[0])
					add(e)
				}
			}
			prevDays, prevLine[0] = days, n
		case timeDate:
			r.Date = date.Format(solver.DateLayout)
			if prevLine[1] > 0 {
				if e := orderError(date.Before(prevDate), date.Equal(prevDate)); e != nil {
					e.Line, e.Column, e.Text = n, 1, fields[0]
					e.Detail = fmt.Sprintf("%s %s %s on line %d", r.Date, e.Detail, prevDate.Format(solver.DateLayout), prevLine[1])
					add(e)
				}
			}
			prevDate, prevLine[1] = date, n
		}
		v, err := parseNumber(fields[1], decimalComma)
		if err != nil {
			add(&PasteError{Line: n, Column: 2, Text: fields[1], Err: err})
			ok = false
		}
		r.Value = v
		if ok {
			out = append(out, r)
		}
	}
	if len(errs) > 0 {
		return nil, errors.Join(errs...)
	}
	if len(out) == 0 {
		return nil, &PasteError{Err: ErrNoReadings}
	}
	return out, nil
}

// orderError returns the error for a time that is earlier than (before) or
// equal to (same) the previous one, or nil. Detail holds the verb.
func orderError(before, same bool) *PasteError {
	switch {
	case before:
		return &PasteError{Err: solver.ErrNotSorted, Detail: "follows"}
	case same:
		return &PasteError{Err: solver.ErrDuplicate, Detail: "repeats"}
	}
	return nil
}

// detectSeparator picks the column separator of the pasted lines: a tab
// if any line has one, else a semicolon if any line has one, else a comma
// or runs of spaces, whichever splits more lines into exactly two fields
// (the comma on a tie). The result is "\t", ";", "," or " ".
func detectSeparator(lines []string) string {
	for _, s := range []string{"\t", ";"} {
		for _, l := range lines {
			if strings.Contains(l, s) {
				return s
			}
		}
	}
	comma, space := 0, 0
	for _, l := range lines {
		if strings.TrimSpace(l) == "" {
			continue
		}
		if len(splitFields(l, ",")) == 2 {
			comma++
		}
		if len(splitFields(l, " ")) == 2 {
			space++
		}
	}
	if space > comma {
		return " "
	}
	return ","
}

// splitFields splits one line at sep (" " means runs of white space),
// trims each field and drops empty fields at the end of the line.
func splitFields(line, sep string) []string {
	var fs []string
	if sep == " " {
		fs = strings.Fields(line)
	} else {
		fs = strings.Split(line, sep)
	}
	for i := range fs {
		fs[i] = strings.TrimSpace(fs[i])
	}
	for len(fs) > 0 && fs[len(fs)-1] == "" {
		fs = fs[:len(fs)-1]
	}
	return fs
}

// isHeader reports whether no field of a line reads as a time or a number.
func isHeader(fields []string, decimalComma bool) bool {
	for _, f := range fields {
		if _, _, k := parseTime(f, decimalComma); k != timeNone {
			return false
		}
	}
	return true
}

// Kinds of the first column.
const (
	timeNone = iota // neither a number nor a date
	timeBad         // a number that is not finite
	timeDays
	timeDate
)

// dateLayouts are the date forms ParseDate reads; the first is the file
// format's.
var dateLayouts = []string{solver.DateLayout, "2/1/2006", "2.1.2006"}

// ParseDate reads a calendar date in one of the forms ParseReadings
// takes: YYYY-MM-DD (the file format, solver.DateLayout), DD/MM/YYYY or
// DD.MM.YYYY, with one-digit days and months allowed in the last two. Write
// the result with solver.DateLayout for the file.
func ParseDate(s string) (time.Time, bool) {
	for _, l := range dateLayouts {
		if d, err := time.Parse(l, s); err == nil {
			return d, true
		}
	}
	return time.Time{}, false
}

// parseTime reads the first column: elapsed days or a date.
func parseTime(s string, decimalComma bool) (days float64, date time.Time, kind int) {
	v, err := parseNumber(s, decimalComma)
	switch {
	case err == nil:
		return v, time.Time{}, timeDays
	case errors.Is(err, solver.ErrNotFinite):
		return 0, time.Time{}, timeBad
	}
	if d, ok := ParseDate(s); ok {
		return 0, d, timeDate
	}
	return 0, time.Time{}, timeNone
}

// parseNumber reads a decimal number with a decimal point or, when
// decimalComma is set, a decimal comma; a leading "−" (U+2212) is a minus.
// It returns ErrNotNumber or ErrNotFinite.
func parseNumber(s string, decimalComma bool) (float64, error) {
	s = strings.Replace(s, "−", "-", 1)
	if decimalComma && strings.Count(s, ",") == 1 && !strings.Contains(s, ".") {
		s = strings.Replace(s, ",", ".", 1)
	}
	if s == "" {
		return 0, ErrNotNumber
	}
	lower := strings.ToLower(s)
	if strings.Contains(lower, "inf") || strings.Contains(lower, "nan") {
		if _, err := strconv.ParseFloat(s, 64); err == nil {
			return 0, solver.ErrNotFinite
		}
		return 0, ErrNotNumber
	}
	for _, c := range s {
		if !(c >= '0' && c <= '9' || c == '.' || c == '-' || c == '+' || c == 'e' || c == 'E') {
			return 0, ErrNotNumber
		}
	}
	v, err := strconv.ParseFloat(s, 64)
	switch {
	case math.IsInf(v, 0):
		return 0, solver.ErrNotFinite
	case err != nil && !errors.Is(err, strconv.ErrRange):
		return 0, ErrNotNumber
	}
	return v, nil
}

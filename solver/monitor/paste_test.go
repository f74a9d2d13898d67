package monitor

import (
	"porelight/solver"

	"errors"
	"reflect"
	"strings"
	"testing"
)

// ParseReadings reads the two-column layouts a spreadsheet or a text file
// gives: tab, semicolon, comma or space separated; decimal point or
// decimal comma; days or dates (ISO 8601 YYYY-MM-DD, and the DD/MM/YYYY and
// DD.MM.YYYY forms common in practice); an optional header.
func TestParseReadings(t *testing.T) {
	t.Parallel()
	days := []solver.Reading{{T: 0, Value: 0}, {T: 12.5, Value: 0.034}, {T: 30, Value: -0.002}}
	dates := []solver.Reading{{Date: "2024-03-05", Value: 0.01}, {Date: "2024-03-19", Value: 0.0125}}
	cases := []struct {
		name, text string
		want       []solver.Reading
	}{
		{"tab, decimal point", "0\t0\n12.5\t0.034\n30\t-0.002\n", days},
		{"tab, decimal comma", "0\t0\n12,5\t0,034\n30\t-0,002", days},
		{"semicolon, decimal comma", "0;0\n12,5;0,034\n30;-0,002", days},
		{"semicolon, decimal point", "0;0\n12.5;0.034\n30;-0.002", days},
		{"comma, decimal point", "0,0\n12.5,0.034\n30,-0.002", days},
		{"comma and spaces", "0, 0\n12.5, 0.034\n30, -0.002", days},
		{"spaces, decimal comma", "0   0\n12,5 0,034\n  30  -0,002  ", days},
		{"windows line ends and blank lines", "\r\n0\t0\r\n\r\n12.5\t0.034\r\n30\t-0.002\r\n\r\n", days},
		{"header", "Day\tSettlement (m)\n0\t0\n12.5\t0.034\n30\t-0.002", days},
		{"header after blank lines", "\n\nelapsed;s\n0;0\n12,5;0,034\n30;-0,002", days},
		{"trailing empty columns", "0\t0\t\t\n12.5\t0.034\t\n30\t-0.002", days},
		{"minus sign and plus", "0\t+0\n12.5\t0.034\n30\t−0.002", days},
		{"exponent", "0\t0\n1.25e1\t3.4e-2\n30\t-2E-3", days},
		{"ISO dates", "2024-03-05\t0.01\n2024-03-19\t0.0125", dates},
		{"day/month/year", "05/03/2024;0,01\n19/03/2024;0,0125", dates},
		{"day.month.year", "5.3.2024;0,01\n19.03.2024;0,0125", dates},
		{"dates with a header, comma", "date,settlement\n2024-03-05,0.01\n2024-03-19,0.0125", dates},
		{"one reading", "3\t0.5", []solver.Reading{{T: 3, Value: 0.5}}},
		{"days and dates mixed", "0\t0\n2024-03-19\t0.0125", []solver.Reading{{T: 0, Value: 0}, {Date: "2024-03-19", Value: 0.0125}}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			got, err := ParseReadings(c.text)
			if err != nil {
				t.Fatalf("%q: %v", c.text, err)
			}
			if !reflect.DeepEqual(got, c.want) {
				t.Errorf("%q:\n got %+v\nwant %+v", c.text, got, c.want)
			}
		})
	}
}

// Bad pastes name the line and the column of every fault.
func TestParseReadingsErrors(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name, text string
		want       []string // each error message, in order
		reasons    []error
	}{
		{"text in a value", "0\t0\n5\t0.01\n10\t0.02\n15\tabc\n",
			[]string{`line 4, column 2: "abc" is not a number`}, []error{ErrNotNumber}},
		{"text in a time", "0;0\nlater;0,01",
			[]string{`line 2, column 1: "later" is not a number of days or a date (YYYY-MM-DD, DD/MM/YYYY or DD.MM.YYYY)`}, []error{ErrNotTime}},
		{"unsorted days", "0\t0\n10\t0.01\n7\t0.02",
			[]string{`line 3, column 1: "7" must be in increasing order (day 7 follows day 10 on line 2)`}, []error{solver.ErrNotSorted}},
		{"repeated day", "0\t0\n10\t0.01\n10\t0.02",
			[]string{`line 3, column 1: "10" repeats the time of the reading before (day 10 repeats day 10 on line 2)`}, []error{solver.ErrDuplicate}},
		{"unsorted dates", "2024-03-19\t0.01\n05/03/2024\t0.02",
			[]string{`line 2, column 1: "05/03/2024" must be in increasing order (2024-03-05 follows 2024-03-19 on line 1)`}, []error{solver.ErrNotSorted}},
		{"three columns", "0\t0\t1\n5\t0.01",
			[]string{`line 1: does not have two columns (time or date, value) (found 3)`}, []error{ErrColumns}},
		{"decimal commas with comma columns", "0,0\n12,5,0,034",
			[]string{`line 2: does not have two columns (time or date, value) (found 4)`}, []error{ErrColumns}},
		{"one column", "0\t0\n12.5",
			[]string{`line 2: does not have two columns (time or date, value) (found 1)`}, []error{ErrColumns}},
		{"missing value", "0\t0\n\t0.5",
			[]string{`line 2, column 1: "" is not a number of days or a date (YYYY-MM-DD, DD/MM/YYYY or DD.MM.YYYY)`}, []error{ErrNotTime}},
		{"not finite", "0\t0\n1\tNaN\n2\tinf",
			[]string{`line 2, column 2: "NaN" must be a finite number`, `line 3, column 2: "inf" must be a finite number`}, []error{solver.ErrNotFinite, solver.ErrNotFinite}},
		{"negative days", "-1\t0",
			[]string{`line 1, column 1: "-1" must be ≥ 0 (days after day 0)`}, []error{solver.ErrNegative}},
		{"impossible date", "2024-02-30\t0",
			[]string{`line 1, column 1: "2024-02-30" is not a number of days or a date (YYYY-MM-DD, DD/MM/YYYY or DD.MM.YYYY)`}, []error{ErrNotTime}},
		{"thousands separator", "0;0\n1.000,5;2",
			[]string{`line 2, column 1: "1.000,5" is not a number of days or a date (YYYY-MM-DD, DD/MM/YYYY or DD.MM.YYYY)`}, []error{ErrNotTime}},
		{"every fault at once", "day\tvalue\n0\t0\n5\tx\n4\t0.2\n",
			[]string{`line 3, column 2: "x" is not a number`, `line 4, column 1: "4" must be in increasing order (day 4 follows day 5 on line 3)`},
			[]error{ErrNotNumber, solver.ErrNotSorted}},
		{"nothing", "\n \n", []string{"no readings found"}, []error{ErrNoReadings}},
		{"only a header", "day\tsettlement", []string{"no readings found"}, []error{ErrNoReadings}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			got, err := ParseReadings(c.text)
			if err == nil {
				t.Fatalf("%q: no error, got %+v", c.text, got)
			}
			if got != nil {
				t.Errorf("readings returned with an error: %+v", got)
			}
			if msg := err.Error(); msg != strings.Join(c.want, "\n") {
				t.Errorf("%q:\n got %s\nwant %s", c.text, msg, strings.Join(c.want, "\n"))
			}
			for _, r := range c.reasons {
				if !errors.Is(err, r) {
					t.Errorf("errors.Is(err, %v) is false", r)
				}
			}
			var pe *PasteError
			if !errors.As(err, &pe) {
				t.Errorf("no *PasteError in %v", err)
			}
		})
	}
}

// At most 20 errors are listed, however long the paste.
// ParseDate reads the three date forms of ParseReadings, and nothing else.
func TestParseDate(t *testing.T) {
	t.Parallel()
	cases := []struct {
		in, want string // want "" for a refusal
	}{
		{"2024-03-05", "2024-03-05"},
		{"05/03/2024", "2024-03-05"},
		{"5/3/2024", "2024-03-05"},
		{"05.03.2024", "2024-03-05"},
		{"5.3.2024", "2024-03-05"},
		{"2024-3-5", ""},
		{"03/05/24", ""},
		{"31/02/2024", ""},
		{"12.5", ""},
		{"", ""},
	}
	for _, tc := range cases {
		d, ok := ParseDate(tc.in)
		got := ""
		if ok {
			got = d.Format(solver.DateLayout)
		}
		if got != tc.want {
			t.Errorf("ParseDate(%q) = %q, %v; want %q", tc.in, got, ok, tc.want)
		}
	}
}

func TestParseReadingsErrorCap(t *testing.T) {
	t.Parallel()
	text := strings.Repeat("1\tx\n", 50)
	_, err := ParseReadings(text)
	if n := len(err.(interface{ Unwrap() []error }).Unwrap()); n != MaxPasteErrors {
		t.Errorf("%d errors, want %d", n, MaxPasteErrors)
	}
}

// FuzzParseReadings: never panics; every failure is a list of *PasteError
// with a line inside the text; every success has finite values and dates
// in the file format.
func FuzzParseReadings(f *testing.F) {
	for _, s := range []string{"0\t0\n1\t2", "a;b\n1;2,5", "05/03/2024,1", "1.2.2024 3", "\n", "1e400\t1", "0x10\t1"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, text string) {
		rs, err := ParseReadings(text)
		if err != nil {
			lines := strings.Count(text, "\n") + 1
			errs := []error{err}
			if u, ok := err.(interface{ Unwrap() []error }); ok {
				errs = u.Unwrap()
			}
			for _, e := range errs {
				pe, ok := e.(*PasteError)
				if !ok {
					t.Fatalf("not a *PasteError: %T %v", e, e)
				}
				if pe.Line < 0 || pe.Line > lines || pe.Column < 0 || pe.Column > 2 {
					t.Fatalf("position out of the text: %v", pe)
				}
			}
			return
		}
		for _, r := range rs {
			if !finiteNum(r.T) || !finiteNum(r.Value) || r.T < 0 {
				t.Fatalf("bad reading %+v", r)
			}
			if r.Date != "" {
				if _, ok := parseDate(r.Date); !ok {
					t.Fatalf("date %q not in the file format", r.Date)
				}
			}
		}
	})
}

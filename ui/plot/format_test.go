package plot

import (
	"math"
	"testing"
)

func TestFormatting(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		got  string
		want string
	}{
		{"coord trims .0", coord(40), "40"},
		{"coord one decimal", coord(12.345), "12.3"},
		{"coord negative zero", coord(-0.01), "0"},
		{"coord NaN", coord(math.NaN()), "0"},
		{"sig 3", sig(35.2149, 3), "35.2"},
		{"sig trims zeros", sig(2.5, 3), "2.5"},
		{"sig small", sig(0.004213, 3), "0.00421"},
		{"sig large", sig(123456, 3), "123456"},
		{"sig tiny uses power", sig(-2.5e-7, 2), "−2.5×10⁻⁷"},
		{"sig huge uses power", sig(3e9, 3), "3×10⁹"},
		{"sig zero", sig(0, 3), "0"},
		{"sig NaN", sig(math.NaN(), 3), "–"},
		{"sig minus", sig(-1.25, 3), "−1.25"},
		{"fixed negative zero", fixed(-0.0001, 2), "0.00"},
		{"time days", timeLabel(30), "30 d"},
		{"time fraction", timeLabel(0.5), "0.5 d"},
		{"time just under a year", timeLabel(365), "365 d"},
		{"time one year", timeLabel(365.25), "1 yr"},
		{"time years", timeLabel(1000), "2.74 yr"},
		{"csv plain", csvNum(0.1 + 0.2), "0.3"},
		{"csv exponent", csvNum(1e-9), "1e-09"},
		{"csv NaN empty", csvNum(math.NaN()), ""},
		{"csv Inf empty", csvNum(math.Inf(1)), ""},
	}
	for _, c := range cases {
		if c.got != c.want {
			t.Errorf("%s: got %q; want %q", c.name, c.got, c.want)
		}
	}
}

func TestWrapAndFit(t *testing.T) {
	t.Parallel()
	cases := []struct {
		s        string
		width    float64
		maxLines int
		want     []string
	}{
		{"Silty clay", 66, 3, []string{"Silty clay"}},
		{"Soft grey clay with organics", 66, 3, []string{"Soft grey", "clay with", "organics"}},
		{"Soft grey clay with organics", 66, 2, []string{"Soft grey", "clay with…"}},
		{"Soft grey clay with organics", 66, 1, []string{"Soft grey…"}},
		{"Name", 66, 0, nil},
		{"   ", 66, 2, nil},
	}
	for _, c := range cases {
		got := wrapWords(c.s, c.width, 10, c.maxLines)
		if len(got) != len(c.want) {
			t.Errorf("wrapWords(%q, %v, %d) = %q; want %q", c.s, c.width, c.maxLines, got, c.want)
			continue
		}
		for i := range got {
			if got[i] != c.want[i] {
				t.Errorf("wrapWords(%q, %v, %d) = %q; want %q", c.s, c.width, c.maxLines, got, c.want)
			}
			if textWidth(got[i], 10) > c.width {
				t.Errorf("line %q is wider than %v", got[i], c.width)
			}
		}
	}
}

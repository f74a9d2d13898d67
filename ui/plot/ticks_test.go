package plot

import (
	"math"
	"slices"
	"testing"
)

func TestNiceRange(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name           string
		lo, hi         float64
		target         int
		wlo, whi, step float64
	}{
		{"unit span", 0, 1, 5, 0, 1, 0.2},
		{"pressure", 0, 61.8, 7, 0, 70, 10},
		{"pressure, fewer ticks", 0, 61.8, 6, 0, 80, 20},
		{"uneven", 3.2, 97, 5, 0, 100, 20},
		{"negative heads", -2.545, -0.955, 4, -3, -0.5, 0.5},
		{"small settlement", 0, 0.0437, 5, 0, 0.05, 0.01},
		{"step of two", 0, 14, 7, 0, 14, 2},
		{"swapped", 10, 0, 5, 0, 10, 2},
		{"equal nonzero", 5, 5, 4, 4.5, 5.5, 0.5},
		{"equal zero", 0, 0, 4, -1, 1, 0.5},
		{"lo NaN", math.NaN(), 8, 4, 7, 9, 0.5},
		{"both bad", math.Inf(-1), math.NaN(), 5, 0, 1, 0.2},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			lo, hi, step := NiceRange(c.lo, c.hi, c.target)
			if !close(lo, c.wlo) || !close(hi, c.whi) || !close(step, c.step) {
				t.Errorf("NiceRange(%v, %v, %d) = %v, %v, %v; want %v, %v, %v",
					c.lo, c.hi, c.target, lo, hi, step, c.wlo, c.whi, c.step)
			}
		})
	}
}

// TestNiceStepIs125 checks over many spans that every step is 1, 2 or 5
// times a power of ten and gives between target/2.5 and target intervals.
func TestNiceStepIs125(t *testing.T) {
	t.Parallel()
	for _, target := range []int{2, 3, 5, 8} {
		for span := 1e-3; span < 1e5; span *= 1.37 {
			s := niceStep(span, target)
			m := s / math.Pow(10, math.Floor(math.Log10(s)+1e-9))
			if !close(m, 1) && !close(m, 2) && !close(m, 5) {
				t.Fatalf("niceStep(%g, %d) = %g: mantissa %g", span, target, s, m)
			}
			n := span / s
			if n > float64(target)*(1+1e-9) || n < float64(target)/2.5-1e-9 {
				t.Fatalf("niceStep(%g, %d) = %g gives %g intervals", span, target, s, n)
			}
		}
	}
}

func TestLinearTicks(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name         string
		lo, hi, step float64
		want         []string
	}{
		{"integers", 0, 70, 10, []string{"0", "10", "20", "30", "40", "50", "60", "70"}},
		{"halves with minus", -1.5, 0, 0.5, []string{"−1.5", "−1.0", "−0.5", "0.0"}},
		{"hundredths", 0, 0.05, 0.01, []string{"0.00", "0.01", "0.02", "0.03", "0.04", "0.05"}},
		{"offset start", 0.3, 1.1, 0.2, []string{"0.4", "0.6", "0.8", "1.0"}},
		{"bad step", 0, 1, 0, nil},
		{"reversed", 1, 0, 0.1, nil},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			var got []string
			for _, tk := range LinearTicks(c.lo, c.hi, c.step) {
				got = append(got, tk.Label)
			}
			if !slices.Equal(got, c.want) {
				t.Errorf("LinearTicks(%v, %v, %v) labels = %q; want %q", c.lo, c.hi, c.step, got, c.want)
			}
		})
	}
}

func TestLogRangeAndTicks(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name     string
		lo, hi   float64
		wlo, whi float64
		majors   []string // labels of the labelled ticks
		minors   int
	}{
		{"four decades", 0.3, 2000, 0.1, 1e4, []string{"0.1", "1", "10", "100", "1000", "10⁴"}, 10},
		{"inside one decade", 2, 7, 1, 10, []string{"1", "10"}, 2},
		{"exact decades", 1, 100, 1, 100, []string{"1", "10", "100"}, 4},
		{"small times", 1e-3, 0.05, 1e-3, 0.1, []string{"0.001", "0.01", "0.1"}, 4},
		{"nine decades, every other labelled", 1e-4, 2e4, 1e-4, 1e5, []string{"10⁻⁴", "0.01", "1", "100", "10⁴"}, 18},
		{"non-positive", 0, -1, 1, 10, []string{"1", "10"}, 2},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			lo, hi := LogRange(c.lo, c.hi)
			if !close(lo, c.wlo) || !close(hi, c.whi) {
				t.Fatalf("LogRange(%v, %v) = %v, %v; want %v, %v", c.lo, c.hi, lo, hi, c.wlo, c.whi)
			}
			var majors []string
			minors := 0
			for _, tk := range LogTicks(lo, hi) {
				if tk.Minor {
					minors++
					if tk.Label != "" {
						t.Errorf("minor tick %v is labelled %q", tk.Value, tk.Label)
					}
					m := tk.Value / math.Pow(10, math.Floor(math.Log10(tk.Value)+1e-9))
					if !close(m, 2) && !close(m, 5) {
						t.Errorf("minor tick %v is not 2 or 5 times a decade", tk.Value)
					}
				} else if tk.Label != "" {
					majors = append(majors, tk.Label)
				}
			}
			if !slices.Equal(majors, c.majors) || minors != c.minors {
				t.Errorf("LogTicks(%v, %v): labels %q, %d minors; want %q, %d", lo, hi, majors, minors, c.majors, c.minors)
			}
		})
	}
}

// close compares with a relative tolerance of 1e-9 (absolute near zero).
func close(a, b float64) bool {
	return math.Abs(a-b) <= 1e-9*math.Max(1, math.Max(math.Abs(a), math.Abs(b)))
}

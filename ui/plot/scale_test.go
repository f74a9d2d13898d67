package plot

import (
	"math"
	"testing"
)

func TestScaleMap(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		s    Scale
		v    float64
		want float64 // NaN when the value cannot be mapped
	}{
		{"linear start", Scale{Lo: 0, Hi: 10, A: 50, B: 550}, 0, 50},
		{"linear middle", Scale{Lo: 0, Hi: 10, A: 50, B: 550}, 5, 300},
		{"linear beyond", Scale{Lo: 0, Hi: 10, A: 50, B: 550}, 12, 650},
		{"upward axis", Scale{Lo: 0, Hi: 100, A: 400, B: 40}, 25, 310},
		{"depth down", Scale{Lo: 0, Hi: 8, A: 72, B: 586}, 4, 329},
		{"log decade", Scale{Lo: 1, Hi: 1000, A: 0, B: 300, Log: true}, 10, 100},
		{"log between", Scale{Lo: 0.1, Hi: 10, A: 0, B: 200, Log: true}, math.Sqrt(10), 150},
		{"log zero", Scale{Lo: 1, Hi: 10, A: 0, B: 100, Log: true}, 0, math.NaN()},
		{"log negative", Scale{Lo: 1, Hi: 10, A: 0, B: 100, Log: true}, -3, math.NaN()},
		{"NaN value", Scale{Lo: 0, Hi: 1, A: 0, B: 100}, math.NaN(), math.NaN()},
		{"empty domain", Scale{Lo: 3, Hi: 3, A: 0, B: 100}, 3, 50},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			got := c.s.Map(c.v)
			if math.IsNaN(c.want) != math.IsNaN(got) || (!math.IsNaN(got) && !close(got, c.want)) {
				t.Errorf("%+v.Map(%v) = %v; want %v", c.s, c.v, got, c.want)
			}
			if !math.IsNaN(got) && c.s.Lo != c.s.Hi {
				if back := c.s.Invert(got); !close(back, c.v) {
					t.Errorf("Invert(Map(%v)) = %v", c.v, back)
				}
			}
		})
	}
}

func TestScaleContains(t *testing.T) {
	t.Parallel()
	s := Scale{Lo: 0.01, Hi: 100, A: 0, B: 1, Log: true}
	for v, want := range map[float64]bool{0.01: true, 100: true, 5: true, 0.009: false, 101: false, 0: false} {
		if got := s.Contains(v); got != want {
			t.Errorf("Contains(%v) = %v; want %v", v, got, want)
		}
	}
}

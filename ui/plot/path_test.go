package plot

import (
	"math"
	"strings"
	"testing"
)

func TestPathD(t *testing.T) {
	t.Parallel()
	id := Scale{Lo: 0, Hi: 100, A: 0, B: 100}
	lg := Scale{Lo: 1, Hi: 100, A: 0, B: 200, Log: true}
	nan := math.NaN()
	cases := []struct {
		name   string
		xs, ys []float64
		sx     Scale
		want   string
	}{
		{"line", []float64{0, 10, 20.25}, []float64{5, 6.5, 7}, id, "M0 5 L10 6.5 L20.3 7"},
		{"a point on the line is dropped", []float64{0, 10, 20}, []float64{5, 6, 7}, id, "M0 5 L20 7"},
		{"gap at NaN", []float64{0, 1, nan, 3, 4}, []float64{0, 1, 2, 3, 4}, id, "M0 0 L1 1 M3 3 L4 4"},
		{"NaN in y", []float64{0, 1, 2}, []float64{0, nan, 2}, id, "M0 0 M2 2"},
		{"log drops zero time", []float64{0, 1, 10, 100}, []float64{1, 2, 3.5, 4}, lg, "M0 2 L100 3.5 L200 4"},
		{"same pixel skipped", []float64{0, 0.01, 5}, []float64{0, 0.01, 5}, id, "M0 0 L5 5"},
		{"shorter slice sets length", []float64{1, 2, 3}, []float64{1, 2}, id, "M1 1 L2 2"},
		{"empty", nil, nil, id, ""},
		{"negative coordinates", []float64{-1.5}, []float64{-0.04}, id, "M-1.5 0"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			if got := pathD(points(c.xs, c.ys, c.sx, id)); got != c.want {
				t.Errorf("pathD = %q; want %q", got, c.want)
			}
		})
	}
}

func TestNearest(t *testing.T) {
	t.Parallel()
	pts := []Pt{{X: 0, Y: 0}, {X: 10, Y: 0}, {X: 10, Y: 10}, {X: 30, Y: 5}}
	cases := []struct {
		x, y float64
		want int
	}{
		{1, 1, 0}, {9, 2, 1}, {12, 9, 2}, {25, 5, 3}, {100, 100, 3}, {-5, -5, 0},
	}
	for _, c := range cases {
		if got, _ := nearest(pts, c.x, c.y); got != c.want {
			t.Errorf("nearest(%v, %v) = %d; want %d", c.x, c.y, got, c.want)
		}
	}
	if got, _ := nearest(nil, 0, 0); got != -1 {
		t.Errorf("nearest(nil) = %d; want -1", got)
	}
}

// TestThin: a curve of 200,000 points (a fine mesh) is written with at
// most maxPathPoints points, every dropped point within a pixel of the
// drawn line, and gaps in the source stay gaps.
func TestThin(t *testing.T) {
	t.Parallel()
	var pts []Pt
	for i := range 200_000 {
		if i == 120_000 {
			continue // a dropped value breaks the curve
		}
		x := float64(i) / 200_000 * 600
		pts = append(pts, Pt{X: x, Y: 200 + 150*math.Sin(x/40), I: i})
	}
	out := thin(pts, maxPathPoints)
	if len(out) > maxPathPoints || len(out) < 20 {
		t.Fatalf("%d points kept, want 20 … %d", len(out), maxPathPoints)
	}
	d := pathD(pts)
	if n := strings.Count(d, "M"); n != 2 {
		t.Errorf("%d moves in the thinned path, want 2 (one gap)", n)
	}
	if len(d) > 16<<10 {
		t.Errorf("path data %d bytes, want < 16 KB", len(d))
	}
	// Every source point lies within 1 px of the polyline through the
	// kept points of its run (here: compare with the kept neighbours' chord).
	j := 0
	for _, p := range pts {
		for j+1 < len(out) && out[j+1].X <= p.X {
			j++
		}
		if j+1 >= len(out) || out[j+1].I != out[j].I+1 {
			continue
		}
		a, b := out[j], out[j+1]
		y := a.Y + (b.Y-a.Y)*(p.X-a.X)/(b.X-a.X)
		if math.Abs(y-p.Y) > 1 {
			t.Fatalf("point at x=%.2f is %.2f px from the drawn line", p.X, math.Abs(y-p.Y))
		}
	}
}

package plot

import (
	"math"
	"os"
	"testing"
	"unicode/utf8"

	"porelight/solver"
)

// labelBox is the box a tick label takes: 0.6 em a character (about the
// width of digits in the usual sans-serif faces, wider than textWidth's
// estimate), the font size as its height.
func labelBox(t TextEl) Box {
	w := float64(utf8.RuneCountInString(t.Text)) * t.Size * 0.6
	x := t.X
	switch t.Anchor {
	case "end":
		x -= w
	case "middle":
		x -= w / 2
	}
	return Box{x, t.Y - t.Size, w, t.Size}
}

// TestTickLabelsNeverCollide draws every figure of the synthetic case and
// of the demo project, from a phone's width to a desktop's, and requires
// that no two axis tick labels (11 px, unrotated) overlap.
func TestTickLabelsNeverCollide(t *testing.T) {
	t.Parallel()
	cases := map[string]struct {
		p *solver.Project
		r *solver.Result
	}{"synthetic": {synthProject(), synthResult()}}
	if p, r := demoCase(t); p != nil {
		cases["demo"] = struct {
			p *solver.Project
			r *solver.Result
		}{p, r}
	}
	for cname, c := range cases {
		for _, fg := range figures {
			for _, w := range []int{300, 360, 420, 520, 640, 760} {
				f := fg.build(c.p, c.r, w, 420)
				var ticks []TextEl
				for _, tx := range f.Texts {
					if tx.Size == 11 && tx.Rotate == 0 && !tx.Bold && !tx.Halo {
						ticks = append(ticks, tx)
					}
				}
				if f.Message == "" && len(ticks) < 4 {
					t.Errorf("%s %s at %d px: only %d tick labels left", cname, fg.name, w, len(ticks))
				}
				for i := range ticks {
					for j := range i {
						a, b := labelBox(ticks[i]), labelBox(ticks[j])
						if a.X < b.Right()+1 && b.X < a.Right()+1 && a.Y < b.Bottom() && b.Y < a.Bottom() {
							t.Errorf("%s %s at %d px: labels %q and %q collide", cname, fg.name, w, ticks[j].Text, ticks[i].Text)
						}
					}
				}
			}
		}
	}
}

// demoCase is the demo project and its solution, or nil when the demo
// cannot be read.
func demoCase(t *testing.T) (*solver.Project, *solver.Result) {
	data, err := os.ReadFile("../../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	p, err := solver.Decode(data)
	if err != nil {
		t.Fatal(err)
	}
	r, err := solver.Solve(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	return p, r
}

// TestTimeAxisFitsTheData: the log time axis of the degree plot spans the
// consolidation, not the whole run. On the synthetic column (one load at
// day 0, no secondary compression; its degrees follow Terzaghi's series)
// the axis holds every time from Us = 1 % to Us = 99 % and ends at the
// whole decade above three times the time Us reaches 99.5 % (the range's
// margin, widened to decades), where the run itself went on to 35,000
// days (an axis to 10⁵ before).
func TestTimeAxisFitsTheData(t *testing.T) {
	t.Parallel()
	p, r := synthProject(), synthResult()
	s := &r.Consolidation.Series
	f := DegreeFigure(p, r, 0, 0)
	x := f.Panels[0].X
	t995 := math.NaN()
	for i, u := range s.Us {
		if s.Time[i] > 0 && u >= 0.01 && u <= 0.99 && !x.Contains(s.Time[i]) {
			t.Errorf("Us = %.3f at t = %g d is off the axis %g–%g d", u, s.Time[i], x.Lo, x.Hi)
		}
		if math.IsNaN(t995) && u >= 0.995 {
			t995 = s.Time[i]
		}
	}
	want := math.Pow(10, math.Ceil(math.Log10(3*t995)))
	if _, end, _ := positiveTimeRange(s.Time); !(x.Hi <= want*1.0001) || !(x.Hi < end) {
		t.Errorf("the axis ends at %g d: Us reaches 99.5 %% at %g d, the run ends at %g d", x.Hi, t995, end)
	}
}

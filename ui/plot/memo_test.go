package plot

import (
	"testing"

	"porelight/solver"
)

// TestFigureMemo: a plot component builds its figure once per change of
// what it draws. The same props, or a copy of the project that differs
// only in its title and notes, give the same figure; a new result, a
// changed layer or another option give a new one, drawn from the new props.
func TestFigureMemo(t *testing.T) {
	t.Parallel()
	p, r := synthProject(), synthResult()
	c := &Settlement{Project: p, Result: r}
	f1 := c.Figure()
	if c.Figure() != f1 {
		t.Error("the same props built the figure again")
	}
	q := *p
	q.Title, q.Notes = "Another title", "notes"
	c.Project = &q
	if c.Figure() != f1 {
		t.Error("a new title built the figure again")
	}
	r2 := synthResult()
	c.Result = r2
	if c.Figure() == f1 {
		t.Error("a new result kept the old figure")
	}
	f2 := c.Figure()
	q2 := q
	q2.Layers = append([]solver.Layer(nil), q.Layers...)
	q2.Layers[0].Name = "Renamed"
	c.Project = &q2
	if c.Figure() == f2 {
		t.Error("a renamed layer kept the old figure")
	}
	f3 := c.Figure()
	c.Dates = true
	if c.Figure() == f3 {
		t.Error("another option kept the old figure")
	}
	ch := &Chart{Fig: f1}
	b1 := ch.body()
	if ch.body() != b1 || string(b1) != f1.Body() {
		t.Error("the chart's markup is not its figure's body")
	}
	ch.Fig = f3
	if string(ch.body()) != f3.Body() {
		t.Error("the chart kept the markup of its old figure")
	}
}

// TestResidualsMemo: the residuals figure is built once per change of
// its records, compared by value (they are made anew on every render),
// and new records out of view (KeepOutside) keep the last figure until a
// build in view. Not parallel: KeepOutside sets the package's hook.
func TestResidualsMemo(t *testing.T) {
	p := &solver.Project{Monitoring: &solver.Monitoring{Start: "2026-03-02"}}
	recs := func(d float64) []ResidualRecord {
		return []ResidualRecord{{Name: "plate P1", Times: []float64{10, 40}, Diffs: []float64{2, d}}}
	}
	c := &Residuals{Project: p, Records: recs(-7)}
	f1 := c.Figure()
	c.Records = recs(-7)
	if c.Figure() != f1 {
		t.Error("equal records built the figure again")
	}
	c.Records = recs(5)
	f2 := c.Figure()
	if f2 == f1 {
		t.Fatal("new records kept the old figure")
	}
	defer KeepOutside(nil)
	KeepOutside(func(id string) bool { return id == f2.ID })
	c.Records = recs(9)
	if c.Figure() != f2 {
		t.Error("new records out of view did not keep the last figure")
	}
	KeepOutside(nil)
	if f3 := c.Figure(); f3 == f2 || f3.Body() == f2.Body() {
		t.Error("the build after the one out of view did not draw the new records")
	}
}

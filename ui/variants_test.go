package ui

import (
	"reflect"
	"strings"
	"testing"
	"time"

	"github.com/vugu/vugu/staticrender"

	optcmp "porelight/solver/compare"
)

// The page's comparison, through the solve workers or in-process, gives
// each option the result of package compare's own solve of it.
func TestCompareOnPage(t *testing.T) {
	for _, workers := range []bool{true, false} {
		root := &Root{Version: "test"}
		if workers {
			root.Host, root.Env = &workerHost{}, staticrender.New(nil).EventEnv()
			root.Env.Lock()
		}
		root.Start(Sources{Demo: demoJSON(t)})
		root.form.AddVariant()
		root.form.Edit("variants[0].loads[1].q", "45")
		root.form.AddVariant()
		root.form.Edit("variants[1].name", "softer lower clay")
		root.form.Edit("variants[1].layers[3].mv", "0.0015")
		root.edited()
		root.runCompare()
		s := root.compareState()
		if workers {
			root.Env.UnlockOnly()
			waitIdle(t, root, "the comparison", 30*time.Second, func() bool { return s.busy })
		}
		want := optcmp.Solve(root.form.Model(), nil)
		if len(s.outcomes) != 3 || s.err != "" {
			t.Fatalf("workers %v: %d outcomes, error %q", workers, len(s.outcomes), s.err)
		}
		for i, o := range s.outcomes {
			if o.Name != want[i].Name || o.Problem != "" || !reflect.DeepEqual(o.Figures, want[i].Figures) {
				t.Errorf("workers %v, %s: %+v, want %+v (%s)", workers, o.Name, o.Figures, want[i].Figures, o.Problem)
			}
		}
		if !(s.outcomes[1].Figures.Final > s.outcomes[0].Figures.Final && s.outcomes[2].Figures.Final > s.outcomes[0].Figures.Final) {
			t.Errorf("workers %v: a higher load and a softer clay should settle more: %g, %g against %g", workers,
				s.outcomes[1].Figures.Final, s.outcomes[2].Figures.Final, s.outcomes[0].Figures.Final)
		}
	}
}

// Five sections from the project and two options: the page's profile is
// package compare's Profile of the same comparison, and the spans table
// flags the spans over the limit.
func TestAlignmentOnPage(t *testing.T) {
	root := &Root{Version: "test"}
	root.Start(Sources{Demo: demoJSON(t)})
	root.form.AddVariant()
	root.form.Edit("variants[0].name", "thick")
	root.form.Edit("variants[0].layers[1].thickness", "6")
	root.form.AddVariant()
	root.form.Edit("variants[1].name", "high")
	root.form.Edit("variants[1].loads[1].q", "50")
	for range 5 {
		root.form.AddSection()
	}
	root.form.SetSectionOption(1, "thick")
	root.form.SetSectionOption(2, "thick")
	root.form.SetSectionOption(3, "high")
	root.form.Edit("alignment.limit", "0.002")
	root.edited()
	if !root.form.Valid() {
		t.Fatalf("problems: %v", root.form.Other())
	}
	root.runCompare()
	v := &Variants{F: root.form, S: root.compareState(), Changed: func() {}}
	pts, spans := v.profile()
	wantPts, wantSpans := optcmp.Profile(root.form.Model(), optcmp.Solve(root.form.Model(), nil))
	if !reflect.DeepEqual(pts, wantPts) || !reflect.DeepEqual(spans, wantSpans) || len(spans) != 4 {
		t.Fatalf("page profile %+v %+v, package %+v %+v", pts, spans, wantPts, wantSpans)
	}
	rows := v.spanRows()
	for k, r := range rows {
		if r.Over != spans[k].Over || (r.Over && !strings.HasPrefix(r.Check, "over 1/500")) {
			t.Errorf("span %d: %+v against %+v", k, r, spans[k])
		}
	}
	if f := v.profileFig(); f.Message != "" {
		t.Errorf("profile figure: %s", f.Message)
	}
}

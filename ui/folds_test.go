package ui

import (
	"bytes"
	"fmt"
	"strings"
	"testing"
	"time"

	"github.com/vugu/vugu"
	"github.com/vugu/vugu/staticrender"
)

// rows counts the rows in the body of table id.
func (p *page) rows(id string) int {
	p.t.Helper()
	n := p.find(id)
	if n == nil {
		p.t.Fatalf("no table #%s", id)
	}
	count := 0
	for c := n.FirstChild; c != nil; c = c.NextSibling {
		if c.Data == "tbody" {
			for r := c.FirstChild; r != nil; r = r.NextSibling {
				if r.Data == "tr" {
					count++
				}
			}
		}
	}
	return count
}

// The tables by layer are folded at first: a line says what they hold,
// and nothing of them is built. The toggle builds them; the choice
// outlives the renders of an edit; the toggle folds them again.
func TestTablesFold(t *testing.T) {
	p := newPage(t, Sources{})
	res := p.root.Result()
	if p.find("tables") == nil || p.find("tables-toggle") == nil {
		t.Fatal("no tables section or toggle")
	}
	for _, id := range []string{"steady-table", "uplift-table", "settlement-table", "stats"} {
		if p.find(id) != nil {
			t.Errorf("#%s is built while the tables are folded", id)
		}
	}
	if got := p.attr("tables-toggle", "aria-expanded"); got != "false" {
		t.Errorf("aria-expanded %q while folded", got)
	}
	hint := p.text("tables-hint")
	for _, want := range []string{fmt.Sprintf("%d layers", len(res.Steady.Layers)), "steady seepage", "settlement"} {
		if !strings.Contains(hint, want) {
			t.Errorf("hint %q lacks %q", hint, want)
		}
	}
	if p.find("tables-foldnote") == nil {
		t.Error("no note for a printout of the folded tables")
	}

	p.fire("tables-toggle", "click", nil)
	if got := p.rows("steady-table"); got != len(res.Steady.Layers) {
		t.Errorf("the steady table has %d rows, want one per layer (%d)", got, len(res.Steady.Layers))
	}
	if got := p.rows("settlement-table"); got != len(res.Summary.Layers) {
		t.Errorf("the settlement table has %d rows, want %d", got, len(res.Summary.Layers))
	}
	if got := p.attr("tables-toggle", "aria-expanded"); got != "true" {
		t.Errorf("aria-expanded %q while open", got)
	}
	if p.find("tables-foldnote") != nil {
		t.Error("the folded-tables note shows while they are open")
	}
	// An edit solves again and renders: the tables stay open and show
	// the new results.
	p.typeInto("layers-1-k", "6e-9")
	if p.find("steady-table") == nil {
		t.Fatal("the tables folded after an edit")
	}
	if !strings.Contains(p.text("steady-table"), p.root.Result().Steady.Layers[1].Name) {
		t.Error("the steady table lacks the second layer")
	}

	p.fire("tables-toggle", "click", nil)
	if p.find("steady-table") != nil || p.find("settlement-table") != nil {
		t.Error("the tables are still built after folding them")
	}
}

// The records editor is folded at first behind a count of what it holds.
// A problem in a record opens it (and it stays open once the problem is
// fixed, so it does not close under the user's hands); adding a record
// opens it; text left in a paste box is kept, and said, while folded.
func TestRecordsFold(t *testing.T) {
	p := monPage(t, monColumn())
	if got, want := p.text("records-summary"), "1 settlement plate (1 reading), 1 piezometer (1 reading)."; got != want {
		t.Errorf("summary %q, want %q", got, want)
	}
	if p.find("records-body") != nil || p.find("monitoring-plates-0-name") != nil {
		t.Fatal("the records editor is built while folded")
	}
	if p.find("mon-add-plate") == nil {
		t.Error("no Add button while folded")
	}

	// Thinning the lower clay puts the piezometer (5 m) below the base of
	// the column: a problem of the records, made outside the editor.
	p.typeInto("layers-1-thickness", "1")
	if p.find("records-body") == nil {
		t.Fatal("a problem in the records left the editor folded")
	}
	if got := p.text("monitoring-piezometers-0-depth-err"); !strings.Contains(got, "below the base of the column") {
		t.Errorf("depth error %q", got)
	}
	if p.find("records-held") == nil {
		t.Error("the editor does not say why it stays open")
	}
	p.typeInto("layers-1-thickness", "4")
	if !p.root.form.Valid() {
		t.Fatalf("problems left: %v", p.root.form.Other())
	}
	if p.find("records-body") == nil {
		t.Error("the editor folded itself once the problem was fixed")
	}
	if p.find("records-held") != nil {
		t.Error("the editor still says a record needs attention")
	}

	// Text in a paste box outlives the fold, and the fold says so.
	p.fire("monitoring-plates-0-toggle", "click", nil)
	p.typeInto("monitoring-plates-0-paste", "0\t0\n7\t3")
	p.fire("records-toggle", "click", nil)
	if p.find("records-body") != nil {
		t.Fatal("the editor did not fold")
	}
	if got := p.text("records-summary"); !strings.Contains(got, "paste box holds text not yet used") {
		t.Errorf("summary %q does not mention the unused paste", got)
	}
	p.fire("records-toggle", "click", nil)
	if got := p.value("monitoring-plates-0-paste"); got != "0\t0\n7\t3" {
		t.Errorf("the paste box holds %q after folding", got)
	}
	p.fire("records-toggle", "click", nil)

	// Adding a record while folded opens the editor on it.
	p.fire("mon-add-piezometer", "click", nil)
	if p.find("records-body") == nil || p.find("monitoring-piezometers-1-depth") == nil {
		t.Error("adding a piezometer did not open the editor on it")
	}
	if got := p.text("records-summary"); !strings.HasPrefix(got, "1 settlement plate (1 reading), 2 piezometers (1 reading)") {
		t.Errorf("summary %q after adding a piezometer", got)
	}
}

// The Asaoka plots are folded behind one toggle; the forecasts stay in
// view. The reading-by-reading tables fold one by one.
func TestComparisonFolds(t *testing.T) {
	p := newPage(t, Sources{})
	if p.find("asaoka-0-final") == nil {
		t.Fatal("no Asaoka forecast for the demo's first plate")
	}
	if p.find("plot-asaoka-0") != nil {
		t.Error("the Asaoka plot is built while folded")
	}
	p.fire("asaoka-plots-toggle", "click", nil)
	if p.find("plot-asaoka-0") == nil || p.find("plot-asaoka-1") == nil {
		t.Error("the Asaoka plots are not built once opened")
	}
	p.fire("asaoka-plots-toggle", "click", nil)
	if p.find("plot-asaoka-0") != nil {
		t.Error("the Asaoka plots stay after folding them")
	}

	const id = "res-monitoring-plates-0"
	if p.find(id+"-table") != nil {
		t.Error("the reading-by-reading table is built while folded")
	}
	p.fire(id+"-toggle", "click", nil)
	want := len(p.root.resultFor.Monitoring.Plates[0].Readings)
	if got := p.rows(id + "-table"); got != want {
		t.Errorf("the reading-by-reading table has %d rows, want %d", got, want)
	}
	if p.find("res-monitoring-plates-1-table") != nil {
		t.Error("opening one record's table opened another")
	}
	p.fire(id+"-toggle", "click", nil)
	if p.find(id+"-table") != nil {
		t.Error("the reading-by-reading table stays after folding it")
	}
}

// renderHTML renders a build as HTML.
func renderHTML(t *testing.T, br *vugu.BuildResults) string {
	t.Helper()
	var buf bytes.Buffer
	if err := staticrender.New(&buf).Render(br); err != nil {
		t.Error(err)
	}
	return buf.String()
}

// foldedParts are the ids of what only an open fold builds, and the ids
// of the notes a printout shows where a section is folded.
var (
	foldedParts = []string{"steady-table", "settlement-table", "records-body", "monitoring-plates-0-name",
		"plot-asaoka-0", "plot-asaoka-1", "res-monitoring-plates-0-table", "res-monitoring-piezometers-0-table"}
	foldNotes = []string{"tables-foldnote", "records-foldnote", "monitoring-foldnote"}
)

// Print report opens every fold, renders, yields to the browser, prints,
// then puts the folds back as the user had them. The Host records the
// page as it is rendered when Print is called. Both ways are tested:
// without a render loop (Env nil) and with one, where printing runs in a
// goroutine that takes the render lock.
func TestPrintReportOpensEveryFold(t *testing.T) {
	for _, withEnv := range []bool{false, true} {
		t.Run(fmt.Sprintf("Env set %v", withEnv), func(t *testing.T) {
			p := newPage(t, Sources{})
			p.fire("tables-toggle", "click", nil) // the user's choice, kept after printing
			var printed string
			var yieldedFirst bool
			done := make(chan struct{})
			p.host.onPrint = func() {
				yieldedFirst = p.host.yields.Load() > 0
				if withEnv {
					p.ee.RLock()
					defer p.ee.RUnlock()
				}
				printed = renderHTML(t, p.env.RunBuild(p.root))
				close(done)
			}
			if withEnv {
				p.root.Env = p.ee
				p.ee.Lock() // a handler runs with the render lock held
				p.fire("print-report", "click", nil)
				p.ee.UnlockRender()
				select {
				case <-done:
				case <-time.After(30 * time.Second):
					t.Fatal("Print was never called")
				}
				for deadline := time.Now().Add(30 * time.Second); ; time.Sleep(time.Millisecond) {
					p.ee.RLock()
					printing := p.root.printing
					p.ee.RUnlock()
					if !printing {
						break
					}
					if time.Now().After(deadline) {
						t.Fatal("the folds were never restored after printing")
					}
				}
				p.build()
			} else {
				p.fire("print-report", "click", nil)
				select {
				case <-done:
				default:
					t.Fatal("Print was not called")
				}
			}
			if !yieldedFirst {
				t.Error("Print was called before yielding to the browser")
			}
			for _, id := range foldedParts {
				if !strings.Contains(printed, fmt.Sprintf("id=%q", id)) {
					t.Errorf("the printed page lacks #%s", id)
				}
			}
			for _, id := range foldNotes {
				if strings.Contains(printed, fmt.Sprintf("id=%q", id)) {
					t.Errorf("the printed page carries the fold note #%s", id)
				}
			}
			for _, want := range []string{`id="caution"`, `id="mon-caution"`} {
				if !strings.Contains(printed, want) {
					t.Errorf("the printed page lacks the caution %s", want)
				}
			}
			// After printing: the tables the user opened stay open,
			// everything else is folded again.
			if p.find("steady-table") == nil {
				t.Error("printing folded the tables the user had opened")
			}
			for _, id := range foldedParts[2:] {
				if p.find(id) != nil {
					t.Errorf("#%s is still built after printing", id)
				}
			}
			if p.find("records-foldnote") == nil {
				t.Error("the records' fold note is gone after printing")
			}
		})
	}
}

package ui

import (
	"bytes"
	"encoding/json"
	"errors"
	"html"
	"os"
	"strings"
	"sync/atomic"
	"testing"

	"github.com/vugu/vugu"
	"github.com/vugu/vugu/staticrender"

	"porelight/solver"
)

// page renders a Root natively with staticrender and fires its DOM
// handlers directly, as the browser would.
type page struct {
	t    testing.TB
	root *Root
	host *fakeHost
	env  *vugu.BuildEnv
	ee   vugu.EventEnv
	br   *vugu.BuildResults
}

func demoJSON(t testing.TB) []byte {
	t.Helper()
	data, err := os.ReadFile("../testdata/demo.json")
	if err != nil {
		t.Fatal(err)
	}
	return data
}

func newPage(t testing.TB, src Sources) *page {
	t.Helper()
	return openPage(t, &fakeHost{store: map[string]string{}}, src)
}

// openPage opens the page from src in the browser of h.
func openPage(t testing.TB, h *fakeHost, src Sources) *page {
	t.Helper()
	r := staticrender.New(nil)
	ee := r.EventEnv()
	env, err := vugu.NewBuildEnv(ee)
	if err != nil {
		t.Fatal(err)
	}
	p := &page{t: t, root: &Root{Host: h, Version: "test"}, host: h, env: env, ee: ee}
	if src.Demo == nil {
		src.Demo = demoJSON(t)
	}
	p.root.Start(src)
	p.build()
	return p
}

func (p *page) build() { p.br = p.env.RunBuild(p.root) }

// html renders the page as it stands.
func (p *page) html() string {
	p.t.Helper()
	var buf bytes.Buffer
	r := staticrender.New(&buf)
	if err := r.Render(p.br); err != nil {
		p.t.Fatal(err)
	}
	return buf.String()
}

// find returns the element with the given id, searching into components.
func (p *page) find(id string) *vugu.VGNode {
	var walk func(n *vugu.VGNode) *vugu.VGNode
	walk = func(n *vugu.VGNode) *vugu.VGNode {
		for ; n != nil; n = n.NextSibling {
			if n.Component != nil {
				if bo := p.br.ResultFor(n.Component); bo != nil {
					for _, o := range bo.Out {
						if f := walk(o); f != nil {
							return f
						}
					}
				}
			}
			for _, a := range n.Attr {
				if a.Key == "id" && a.Val == id {
					return n
				}
			}
			if f := walk(n.FirstChild); f != nil {
				return f
			}
		}
		return nil
	}
	for _, o := range p.br.Out.Out {
		if f := walk(o); f != nil {
			return f
		}
	}
	return nil
}

// fire calls the handler of event typ on element id with target props,
// then rebuilds.
func (p *page) fire(id, typ string, target map[string]any) {
	p.t.Helper()
	n := p.find(id)
	if n == nil {
		p.t.Fatalf("no element #%s", id)
	}
	for _, h := range n.DOMEventHandlerSpecList {
		if h.EventType == typ {
			h.Func(vugu.NewDOMEvent(p.ee, map[string]any{"target": target}))
			p.build()
			return
		}
	}
	p.t.Fatalf("#%s has no %s handler", id, typ)
}

func (p *page) typeInto(id, text string) { p.fire(id, "input", map[string]any{"value": text}) }

// text is the text content of element id.
func (p *page) text(id string) string {
	p.t.Helper()
	n := p.find(id)
	if n == nil {
		p.t.Fatalf("no element #%s", id)
	}
	var b strings.Builder
	var walk func(n *vugu.VGNode)
	walk = func(n *vugu.VGNode) {
		if n.InnerHTML != nil {
			b.WriteString(html.UnescapeString(*n.InnerHTML))
		}
		if n.Type == vugu.TextNode {
			b.WriteString(n.Data)
		}
		for c := n.FirstChild; c != nil; c = c.NextSibling {
			walk(c)
		}
	}
	walk(n)
	return b.String()
}

func (p *page) attr(id, key string) string {
	p.t.Helper()
	n := p.find(id)
	if n == nil {
		p.t.Fatalf("no element #%s", id)
	}
	for _, a := range n.Attr {
		if a.Key == key {
			return a.Val
		}
	}
	return ""
}

// value is the .value property bound to element id.
func (p *page) value(id string) string {
	p.t.Helper()
	n := p.find(id)
	if n == nil {
		p.t.Fatalf("no element #%s", id)
	}
	for _, pr := range n.Prop {
		if pr.Key == "value" {
			var s string
			if err := jsonUnmarshal(pr.JSONVal, &s); err != nil {
				p.t.Fatal(err)
			}
			return s
		}
	}
	return ""
}

// fakeHost records what the page asks of the browser.
type fakeHost struct {
	store     map[string]string
	downloads []download
	fragment  string
	file      []byte
	fileName  string
	fileErr   error
	yields    atomic.Int64 // calls of Yield
	onPrint   func()       // called by Print, if set
}

type download struct {
	name, mime string
	data       []byte
}

func (h *fakeHost) Yield() { h.yields.Add(1) }
func (h *fakeHost) Download(name, mime string, data []byte) error {
	h.downloads = append(h.downloads, download{name, mime, data})
	return nil
}
func (h *fakeHost) Store(k, v string) error { h.store[k] = v; return nil }
func (h *fakeHost) Recall(k string) (string, bool, error) {
	v, ok := h.store[k]
	return v, ok, nil
}
func (h *fakeHost) PageURL() string       { return "file:///tmp/porelight.html" }
func (h *fakeHost) SetFragment(f string)  { h.fragment = f }
func (h *fakeHost) CopyText(string) error { return errors.New("no clipboard") }
func (h *fakeHost) Print() {
	if h.onPrint != nil {
		h.onPrint()
	}
}
func (h *fakeHost) ReadFile(_ string, done func(string, []byte, error)) {
	done(h.fileName, h.file, h.fileErr)
}

func TestPageShowsDemoAndSummary(t *testing.T) {
	p := newPage(t, Sources{})
	if p.root.Result() == nil {
		t.Fatal("no result after Start")
	}
	html := p.html()
	for _, want := range []string{`id="layers-1-k"`, `id="sum-flux"`, `id="caution"`, `Upper soft clay`, `id="about"`,
		// The assumptions and sources are markup, not text shown with its tags.
		`<h2>Assumptions, sources and cautions</h2>`, `<li>Darcy, H. (1856). <i>Les fontaines`} {
		if !strings.Contains(html, want) {
			t.Errorf("page lacks %s", want)
		}
	}
	res, err := solver.Solve(mustRead(t, demoJSON(t)), nil)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := p.attr("sum-flux", "data-value"), exact(res.Summary.Flux); got != want {
		t.Errorf("sum-flux data-value = %s, want %s (native solve)", got, want)
	}
	if got := p.host.store[AutosaveKey]; !strings.Contains(got, `"Upper soft clay"`) {
		t.Errorf("autosave holds %.60q…, want the demo project", got)
	}
}

func mustRead(t testing.TB, data []byte) *solver.Project {
	t.Helper()
	p, ps := ReadProject(data)
	if ps != nil {
		t.Fatal(ps)
	}
	return p
}

func TestPageEditsAndProblems(t *testing.T) {
	p := newPage(t, Sources{})
	flux0 := p.attr("sum-flux", "data-value")
	k0, th0, cr0 := p.value("layers-1-k"), p.value("layers-1-thickness"), p.value("layers-1-ecurve-cr")

	// A valid edit re-solves at once (no Env): the flux changes.
	p.typeInto("layers-1-k", "3e-9")
	if got := p.attr("sum-flux", "data-value"); got == flux0 {
		t.Errorf("flux stayed %s after changing k", got)
	}
	flux1 := p.attr("sum-flux", "data-value")

	// Text that is not a number: kept as typed, the error shows beside
	// the field, the results stay those of the last valid inputs.
	p.typeInto("layers-1-k", "3e-9x")
	if got := p.value("layers-1-k"); got != "3e-9x" {
		t.Errorf("input shows %q, want the text as typed", got)
	}
	if got := p.text("layers-1-k-err"); got != "not a number" {
		t.Errorf("field error %q, want %q", got, "not a number")
	}
	if got := p.attr("sum-flux", "data-value"); got != flux1 {
		t.Errorf("flux changed to %s while the input is wrong, want %s", got, flux1)
	}
	if !strings.Contains(p.text("status"), "1 input needs attention") {
		t.Errorf("status %q does not count the problem", p.text("status"))
	}

	// A number the solver refuses: the solver's message, at the field.
	p.typeInto("layers-1-k", "-1")
	if got := p.text("layers-1-k-err"); !strings.Contains(got, "must be > 0") {
		t.Errorf("field error %q, want the solver's reason", got)
	}
	// An emptied required field says so.
	p.typeInto("layers-1-thickness", "")
	if got := p.text("layers-1-thickness-err"); got != "required" {
		t.Errorf("empty thickness error %q, want %q", got, "required")
	}
	// A cross-field problem lands on the field its path names.
	p.typeInto("layers-1-k", k0)
	p.typeInto("layers-1-thickness", th0)
	p.typeInto("layers-1-ecurve-cr", "2")
	if got := p.text("layers-1-ecurve-cr-err"); !strings.Contains(got, "must not exceed cc") {
		t.Errorf("cr error %q", got)
	}
	p.typeInto("layers-1-ecurve-cr", cr0)
	if !p.root.form.Valid() {
		t.Errorf("form still has problems: %v %v", p.root.form.ProblemsUnder(""), p.root.form.Other())
	}
	if got := p.attr("sum-flux", "data-value"); got != flux0 {
		t.Errorf("flux %s after restoring the inputs, want the first %s", got, flux0)
	}
}

func TestPageLayerRows(t *testing.T) {
	p := newPage(t, Sources{})
	n := len(p.root.form.Draft().Layers)
	p.typeInto("layers-0-k", "oops")
	p.fire("layers-0-down", "click", nil)
	// The typed text moved with its row.
	if got := p.value("layers-1-k"); got != "oops" {
		t.Errorf("after moving row 1 down, row 2's k shows %q, want %q", got, "oops")
	}
	if got := p.root.form.Draft().Layers[1].Name; got != "Crust" {
		t.Errorf("row 2 is %q, want Crust", got)
	}
	p.fire("layers-1-remove", "click", nil)
	if got := len(p.root.form.Draft().Layers); got != n-1 {
		t.Errorf("%d layers after removing one of %d", got, n)
	}
	if p.find("layers-1-k-err") != nil && p.text("layers-1-k-err") == "not a number" {
		t.Error("the removed row's problem stayed on the row that took its place")
	}
	p.fire("layer-add", "click", nil)
	if got := len(p.root.form.Draft().Layers); got != n {
		t.Errorf("%d layers after adding one, want %d", got, n)
	}
	if !p.root.form.Valid() {
		t.Errorf("problems after row edits: %v %v", p.root.form.ProblemsUnder(""), p.root.form.Other())
	}
}

func TestPageDrainageSwitch(t *testing.T) {
	p := newPage(t, Sources{})
	p.fire("bottom-drained", "change", map[string]any{"value": "undrained"})
	d := p.root.form.Draft()
	if d.Bottom.Drained || d.Bottom.Head != nil {
		t.Errorf("bottom after switching to undrained: %+v", d.Bottom)
	}
	if p.find("bottom-inflow") == nil {
		t.Error("no inflow input at an undrained end")
	}
	if p.find("bottom-head") != nil {
		t.Error("a head input at an undrained end")
	}
}

func TestPageOpenFile(t *testing.T) {
	tests := []struct {
		name, file string
		ok         bool
		want       string // in the notice
	}{
		{"not JSON", `{"format": "porelight/1", "layers": [`, false, "line 1, column 37: the file ends in the middle of the project"},
		{"results file", `{"steady": {}, "summary": {}, "warnings": [], "stats": {}}`, false, "this is a results file, not a project"},
		{"wrong format", `{"format": "other/9", "layers": []}`, false, "format"},
		{"bad value", strings.Replace(string(demoJSONNoT()), `"thickness": 4.0`, `"thickness": -4.0`, 1), false, "layer 2, thickness"},
		{"unknown field", `{"format": "porelight/1", "layer": []}`, false, "layer: is not a known field"},
		{"good", `{"format": "porelight/1", "title": "Two layers", "layers": [{"thickness": 2, "gammaSat": 19, "k": 1e-6, "mv": 1e-4}], "top": {"drained": true}, "bottom": {"drained": false}}`, true, "Opened"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			p := newPage(t, Sources{})
			before := p.root.form.Model()
			p.host.file, p.host.fileName = []byte(tt.file), "site.json"
			p.fire("open-file", "change", nil)
			last := p.root.notices[len(p.root.notices)-1]
			if !strings.Contains(last.Text, tt.want) {
				t.Errorf("notice %q lacks %q", last.Text, tt.want)
			}
			if got := last.Kind == "info"; got != tt.ok {
				t.Errorf("notice kind %q for ok=%v", last.Kind, tt.ok)
			}
			after := p.root.form.Model()
			if same := after.Title == before.Title && len(after.Layers) == len(before.Layers); same == tt.ok {
				t.Errorf("project replaced = %v, want %v", !same, tt.ok)
			}
		})
	}
}

func demoJSONNoT() []byte {
	data, _ := os.ReadFile("../testdata/demo.json")
	return data
}

func TestStartSources(t *testing.T) {
	demo := demoJSON(t)
	other := `{"format": "porelight/1", "title": "Autosaved", "layers": [{"thickness": 2, "gammaSat": 19, "k": 1e-6, "mv": 1e-4}], "top": {"drained": true}, "bottom": {"drained": false}}`
	frag, err := EncodeFragment(mustRead(t, []byte(strings.Replace(other, "Autosaved", "Linked", 1))))
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name      string
		src       Sources
		title     string
		wantError bool
	}{
		{"demo", Sources{}, "Demo: staged preload over layered soft clay", false},
		{"autosave", Sources{Autosave: other}, "Autosaved", false},
		{"corrupt autosave", Sources{Autosave: `{"format": "porelight/1", "layers": [{"thickness": "x"}]`}, "Demo: staged preload over layered soft clay", true},
		{"link beats autosave", Sources{Fragment: "#" + frag, Autosave: other}, "Linked", false},
		{"damaged link", Sources{Fragment: "#" + frag[:len(frag)/2], Autosave: other}, "Autosaved", true},
		{"fragment for something else", Sources{Fragment: "#sec-layers"}, "Demo: staged preload over layered soft clay", false},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			tt.src.Demo = demo
			p := newPage(t, tt.src)
			if got := p.root.form.Draft().Title; got != tt.title {
				t.Errorf("opened %q, want %q", got, tt.title)
			}
			hasError := false
			for _, n := range p.root.notices {
				hasError = hasError || n.Kind == "error"
			}
			if hasError != tt.wantError {
				t.Errorf("error notice = %v, want %v (%v)", hasError, tt.wantError, p.root.notices)
			}
		})
	}
}

func TestPageSaveAndShare(t *testing.T) {
	p := newPage(t, Sources{})
	p.fire("save-project", "click", nil)
	if len(p.host.downloads) != 1 {
		t.Fatalf("%d downloads after Save", len(p.host.downloads))
	}
	d := p.host.downloads[0]
	if d.name != "demo-staged-preload-over-layered-soft-clay.json" || d.mime != "application/json" {
		t.Errorf("download %q (%s)", d.name, d.mime)
	}
	if q := mustRead(t, d.data); q.Title != p.root.form.Draft().Title {
		t.Errorf("saved title %q", q.Title)
	}

	p.fire("share-link", "click", nil)
	link := p.value("share-url")
	base, frag, ok := strings.Cut(link, "#")
	if !ok || base != "file:///tmp/porelight.html" {
		t.Fatalf("share link %q", link)
	}
	data, err := DecodeFragment(frag)
	if err != nil {
		t.Fatal(err)
	}
	if q := mustRead(t, data); len(q.Layers) != len(p.root.form.Draft().Layers) {
		t.Errorf("the link carries %d layers", len(q.Layers))
	}

	// With a wrong input, Save writes a draft that says so (keep_test.go
	// reopens one); the link is refused, as it carries only projects.
	p.typeInto("waterTable", "deep")
	p.fire("save-project", "click", nil)
	if len(p.host.downloads) != 2 {
		t.Fatalf("%d downloads after saving a draft", len(p.host.downloads))
	}
	if d := p.host.downloads[1]; !strings.HasSuffix(d.name, "-draft.json") || !strings.Contains(string(d.data), `"porelight-draft/1"`) {
		t.Errorf("draft saved as %q: %.80q", d.name, d.data)
	}
}

func TestPageExports(t *testing.T) {
	p := newPage(t, Sources{})
	tests := []struct {
		button, file, mime string
		rows               int // data rows, -1 to skip the count
		head               string
	}{
		{"export-layers-csv", "-layers.csv", "text/csv", len(p.root.form.Draft().Layers), "layer,top (m),base (m)"},
		{"export-series", "-series.csv", "text/csv", len(p.root.Result().Consolidation.Series.Time), "time (day),load (kPa)"},
		{"export-results", "-results.json", "application/json", -1, "{"},
		{"export-isochrones-svg", "-isochrones.svg", "image/svg+xml", -1, "<?xml"},
		{"export-steady-csv", "-steady.csv", "text/csv", len(p.root.Result().Steady.Depth), "depth (m)"},
	}
	for i, tt := range tests {
		p.fire(tt.button, "click", nil)
		if len(p.host.downloads) != i+1 {
			t.Fatalf("%s: %d downloads in all", tt.button, len(p.host.downloads))
		}
		d := p.host.downloads[i]
		if !strings.HasSuffix(d.name, tt.file) || d.mime != tt.mime {
			t.Errorf("%s: file %q (%s), want …%s (%s)", tt.button, d.name, d.mime, tt.file, tt.mime)
		}
		text := strings.TrimSpace(string(d.data))
		if !strings.HasPrefix(text, tt.head) {
			t.Errorf("%s: starts %.40q, want %q", tt.button, text, tt.head)
		}
		if lines := strings.Split(text, "\n"); tt.rows >= 0 && len(lines)-1 != tt.rows {
			t.Errorf("%s: %d data rows, want %d", tt.button, len(lines)-1, tt.rows)
		}
	}
}

func jsonUnmarshal(raw []byte, v any) error { return json.Unmarshal(raw, v) }

// TestPageWithoutResults renders the page when the solve fails: the
// failure is said, and nothing that needs results is drawn.
func TestPageWithoutResults(t *testing.T) {
	r := staticrender.New(nil)
	env, err := vugu.NewBuildEnv(r.EventEnv())
	if err != nil {
		t.Fatal(err)
	}
	root := &Root{Solve: func(*solver.Project, *solver.Options) (*solver.Result, error) {
		return nil, errors.New("no convergence")
	}}
	root.Start(Sources{Demo: demoJSON(t)})
	p := &page{t: t, root: root, env: env, ee: r.EventEnv()}
	p.build()
	if got := p.text("status"); !strings.Contains(got, "no convergence") {
		t.Errorf("status %q does not give the failure", got)
	}
	if p.find("tables") != nil || p.find("sum-flux") != nil {
		t.Error("result tables or figures drawn without results")
	}
}

// TestPageModelChoice: the model select switches the project to the
// non-linear model, the summary then names it and shows its settlement
// (the same figure a native solve of that project gives), and the new
// soil fields take typed values by path.
func TestPageModelChoice(t *testing.T) {
	p := newPage(t, Sources{})
	p.fire("model", "change", map[string]any{"value": "nonlinear"})
	if m := p.root.form.Draft().Model; m != solver.ModelNonlinear {
		t.Fatalf("model after the switch: %q", m)
	}
	p.typeInto("layers-1-ecurve-ck", "0.8")
	p.typeInto("layers-0-ecurve-pop", "25")
	p.typeInto("layers-0-ecurve-ocr", "")
	d := p.root.form.Draft()
	if c := d.Layers[1].ECurve; c == nil || c.Ck != 0.8 {
		t.Fatalf("layer 2 curve after typing Ck: %+v", c)
	}
	if c := d.Layers[0].ECurve; c == nil || c.POP != 25 || c.OCR != 0 {
		t.Fatalf("layer 1 curve after typing POP: %+v", c)
	}
	res, err := solver.Solve(p.root.form.Model(), nil)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := p.attr("sum-settlement-elog", "data-value"), exact(*res.Summary.Settlement); got != want {
		t.Errorf("sum-settlement-elog data-value = %s, want %s (native solve of the non-linear model)", got, want)
	}
	if !strings.Contains(p.html(), "Final settlement, non-linear model") {
		t.Error("the summary does not name the non-linear model")
	}
	p.typeInto("layers-1-ecurve-ck", "-1")
	if msg := p.root.form.Problem("layers[1].ecurve.ck"); msg == "" {
		t.Error("no problem shown for Ck = −1")
	}
	p.fire("model", "change", map[string]any{"value": "linear"})
	if m := p.root.form.Draft().Model; m != "" {
		t.Errorf("model after switching back: %q, want empty (linear)", m)
	}
}

// TestPageSigmaPTable: a σ′p table is built point by point, its values
// typed by path, a bad value shown at its input, and a point removed; the
// solve then uses the table (its σ′p reaches the steady profiles).
func TestPageSigmaPTable(t *testing.T) {
	p := newPage(t, Sources{})
	p.typeInto("layers-0-ecurve-ocr", "")
	p.fire("layers-0-sigmap-add", "click", nil)
	p.fire("layers-0-sigmap-add", "click", nil)
	p.typeInto("layers-0-ecurve-sigmaPProfile-0-z", "0")
	p.typeInto("layers-0-ecurve-sigmaPProfile-0-value", "30")
	p.typeInto("layers-0-ecurve-sigmaPProfile-1-value", "-5")
	if msg := p.root.form.Problem("layers[0].ecurve.sigmaPProfile[1].value"); msg == "" {
		t.Error("no problem shown for σ′p = −5")
	}
	p.fire("layers-0-sigmap-1-remove", "click", nil)
	c := p.root.form.Draft().Layers[0].ECurve
	if c == nil || len(c.SigmaPProfile) != 1 || c.SigmaPProfile[0] != (solver.DepthValue{Z: 0, Value: 30}) {
		t.Fatalf("σ′p table after the edits: %+v", c)
	}
	if !p.root.form.Valid() {
		t.Fatalf("the form is not valid: %v", p.root.form.Other())
	}
	r := p.root.Result()
	if r == nil {
		t.Fatal("no result")
	}
	want, err := solver.Solve(p.root.form.Model(), nil)
	if err != nil {
		t.Fatal(err)
	}
	if got := *r.Summary.Layers[0].SettlementElog; got != *want.Summary.Layers[0].SettlementElog {
		t.Errorf("crust e–log settlement on the page %g m, native solve %g m", got, *want.Summary.Layers[0].SettlementElog)
	}
}

// The warnings under the summary name the input they concern as the
// tables number it, not by its 0-based path (common practice for the
// page: the problem list does the same).
func TestPageWarningsNameInputs(t *testing.T) {
	tests := []struct {
		w    solver.Warning
		want string
	}{
		{solver.Warning{Path: "layers[0].ecurve.ocr", Message: "OCR 3 gives σ'p = 2.6 kPa"}, "Layer 1, OCR: OCR 3 gives σ'p = 2.6 kPa"},
		{solver.Warning{Path: "layers[1].calphaReduced", Message: "give it"}, "Layer 2, Cα after unloading: give it"},
		{solver.Warning{Path: "loads[1].fill.thickness", Message: "m"}, "Stage 2, fill thickness: m"},
		{solver.Warning{Message: "no path"}, "no path"},
	}
	for _, tt := range tests {
		if got := warningText(tt.w); got != tt.want {
			t.Errorf("warningText(%q) = %q, want %q", tt.w.Path, got, tt.want)
		}
	}
	p := newPage(t, Sources{})
	if len(p.root.Result().Warnings) == 0 {
		t.Fatal("the demo has no warnings to show")
	}
	if got := p.text("warnings"); strings.Contains(got, "layers[") {
		t.Errorf("warnings show a 0-based path: %q", got)
	}
}

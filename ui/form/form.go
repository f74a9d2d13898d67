package form

import (
	"fmt"
	"reflect"
	"strings"
	"sync"

	"porelight/solver"
	"porelight/ui/units"
)

// Form is the editable state of one project: the draft the inputs show,
// the text typed into each input, and every problem with the draft.
//
// The rule for every input: what was typed is kept as typed; the draft
// takes the value when the text reads as a number (or list of numbers);
// solver.Validate then checks the whole draft. Only a draft without any
// problem becomes the model (Valid), and only the model is solved, saved
// and shared, so the last good results stay on screen while an input is
// wrong.
type Form struct {
	draft solver.Project
	raw   map[string]string   // path → text as typed, while it differs from the model's formatting
	bad   map[string]string   // path → why the typed text is not a value
	probs map[string][]string // path of the input → problems from Validate
	other []solver.Problem    // problems that no input shows

	good *solver.Project // the last draft without problems (echo.go)
	echo map[string]bool // inputs whose problem is an echo of another's

	sys units.System // the units the inputs show (units.go)

	typed   string // the input Edit last took (TakeTyped)
	changes int    // checks since TakeTyped: every change ends in one
}

// New starts a form on a copy of p.
func New(p *solver.Project) *Form {
	f := &Form{}
	f.Reset(p)
	return f
}

// Reset replaces the draft with a copy of p and forgets all typed text.
func (f *Form) Reset(p *solver.Project) {
	f.draft = *cloneProject(p)
	f.good = nil
	f.raw = map[string]string{}
	f.bad = map[string]string{}
	f.check()
	f.typed, f.changes = "", 0
}

// Draft is the project as the inputs show it (it may have problems).
func (f *Form) Draft() *solver.Project { return &f.draft }

// Valid reports whether the draft has no problem at all.
func (f *Form) Valid() bool {
	return len(f.bad) == 0 && len(f.probs) == 0 && len(f.other) == 0
}

// Model returns a copy of the draft, for solving, saving and sharing; call
// it only when Valid.
func (f *Form) Model() *solver.Project { return cloneProject(&f.draft) }

// Count is the number of problems to fix: the inputs with a problem that
// is not an echo of another's (echo.go), plus problems no input shows.
// It is the length of Problems.
func (f *Form) Count() int { return len(f.Problems()) }

// Other lists the problems that no input on the page shows.
func (f *Form) Other() []solver.Problem { return f.other }

// Problem is the message to show beside the input at path, or "".
func (f *Form) Problem(path string) string {
	if m, ok := f.bad[path]; ok {
		return m
	}
	return strings.Join(f.probs[path], "; ")
}

// Text is what the input at path shows: the text typed, or else the
// draft's value formatted.
func (f *Form) Text(path string) string {
	if s, ok := f.raw[path]; ok {
		return s
	}
	if r, ok := readingAt(&f.draft, path); ok && strings.HasSuffix(path, ".t") {
		return readingTimeText(*r)
	}
	if i := cvLayer(path); i >= 0 {
		return f.cvText(i)
	}
	if leafKind(path) == reflect.String {
		return getString(&f.draft, path)
	}
	if isList(path) {
		return formatList(listOf(&f.draft, path))
	}
	v, ok := getNumber(&f.draft, path)
	if !ok || (v == 0 && zeroIsDefault(path)) {
		return ""
	}
	return f.shownText(path, v)
}

// Edit takes the text typed into the input at path. It reports whether
// the draft changed.
func (f *Form) Edit(path, text string) bool {
	if i, ok := layerK(path); ok {
		delete(f.raw, CvPath(i)) // a k typed stands on its own
		delete(f.bad, CvPath(i))
	}
	f.raw[path] = text
	delete(f.bad, path)
	changed, msg := f.apply(path, text)
	if msg != "" {
		f.bad[path] = msg
	}
	f.check()
	f.typed = path
	return changed
}

// SetBool sets a true/false value (only boundary drainage is one). Making
// an end undrained drops its fixed head and pressure history, making it
// drained drops its inflow, as the two cannot go together.
func (f *Form) SetBool(path string, on bool) {
	end, _, _ := strings.Cut(path, ".")
	b := Boundary(&f.draft, end)
	if b.Drained == on {
		return
	}
	b.Drained = on
	if on {
		b.Inflow = 0
		delete(f.raw, end+".inflow")
		delete(f.bad, end+".inflow")
	} else {
		b.Head = nil
		b.Excess = nil
		f.dropRaw(end + ".head")
		f.dropRaw(end + ".excess")
	}
	f.check()
}

// apply parses text for path and stores it in the draft.
func (f *Form) apply(path, text string) (changed bool, problem string) {
	before := getAny(&f.draft, path)
	s := strings.TrimSpace(text)
	if msg, handled := f.applyRecord(path, s); handled {
		return msg == "" && getAny(&f.draft, path) != before, msg
	}
	if i := cvLayer(path); i >= 0 {
		msg := f.applyCv(i, s)
		return msg == "" && getAny(&f.draft, path) != before, msg
	}
	switch {
	case leafKind(path) == reflect.String:
		if err := setString(&f.draft, path, text); err != nil {
			return false, err.Error()
		}
	case isList(path):
		xs, msg := parseList(s)
		if msg != "" {
			return false, msg
		}
		setList(&f.draft, path, xs)
	case s == "":
		if err := clearNumber(&f.draft, path); err != nil {
			return false, err.Error()
		}
	default:
		x, msg := ParseNumber(s, leafKind(path) == reflect.Int)
		if msg != "" {
			return false, msg
		}
		if err := setNumber(&f.draft, path, f.fromShown(path, x)); err != nil {
			return false, err.Error()
		}
	}
	return getAny(&f.draft, path) != before, ""
}

func getAny(p *solver.Project, path string) string {
	if r, ok := readingAt(p, path); ok && strings.HasSuffix(path, ".t") {
		return fmt.Sprint(r.T, r.Date)
	}
	if isList(path) {
		return fmt.Sprint(listOf(p, path))
	}
	if leafKind(path) == reflect.String {
		return getString(p, path)
	}
	v, ok := getNumber(p, path)
	return fmt.Sprint(v, ok)
}

// check runs solver.Validate on the draft and files each problem under
// the input that shows its path.
func (f *Form) check() {
	f.changes++
	f.followCv()
	f.probs = map[string][]string{}
	f.other = nil
	for _, pr := range solver.AsProblems(solver.Validate(&f.draft)) {
		at, prefix := inputFor(pr.Path)
		if at == "" || !onPage(at) {
			f.other = append(f.other, pr)
			continue
		}
		if _, typed := f.bad[at]; typed {
			continue // the text itself is wrong; say that, not what the old value did
		}
		msg := pr.Message
		if s, ok := f.raw[at]; ok && strings.TrimSpace(s) == "" {
			msg = "required"
		}
		f.probs[at] = append(f.probs[at], prefix+msg)
	}
	if f.Valid() {
		f.good = cloneProject(&f.draft)
	}
	f.findEchoes()
}

// inputFor maps a problem path to the input showing it: list items of
// times and piezometers share one input, and name the item in the message.
func inputFor(path string) (input, prefix string) {
	if strings.HasPrefix(path, "monitoring.") && strings.HasSuffix(path, ".date") {
		return strings.TrimSuffix(path, ".date") + ".t", "" // one input shows t or date
	}
	if steps, err := solver.ParsePath(path); err == nil && len(steps) == 1 && steps[0].Index >= 0 && isList(steps[0].Name) {
		return steps[0].Name, fmt.Sprintf("value %d: ", steps[0].Index+1)
	}
	return path, ""
}

// pageFields are the paths an input on the page edits, with every list
// index written as "#" (see indexless).
var pageFields = func() map[string]bool {
	m := map[string]bool{}
	add := func(prefix string, names ...string) {
		for _, n := range names {
			m[prefix+n] = true
		}
	}
	add("", "title", "notes", "gammaW", "waterTable", "times", "piezometers", "targetDegree", "designLife", "model")
	add("layers[#].", "cv", "name", "thickness", "gammaSat", "gamma", "k", "mv", "mvUnload", "calpha", "calphaCc", "calphaReduced",
		"ecurve.e0", "ecurve.cc", "ecurve.cr", "ecurve.sigmaP", "ecurve.ocr", "ecurve.pop", "ecurve.ck",
		"ecurve.sigmaPProfile[#].z", "ecurve.sigmaPProfile[#].value")
	for _, end := range []string{"top.", "bottom."} {
		add(end, "head", "inflow", "resistance", "excess[#].t", "excess[#].value")
	}
	add("loads[#].", "start", "ramp", "q", "fill.thickness", "fill.gamma", "fill.gammaSat",
		"area.width", "area.length", "area.radius", "area.slope", "area.x", "area.y",
		"profile[#].z", "profile[#].value", "dig.depth", "dig.waterLevel", "lower.waterTable")
	add("layers[#].", "outlet.head")
	add("initialExcess[#].", "z", "value")
	add("mesh.", "order", "maxSize", "minPerLayer")
	add("stepping.", "theta", "dampedSteps", "firstStep", "growth", "endTime")
	add("layers[#].", "ch", "khKv")
	add("drains.", "pattern", "spacing", "diameter", "width", "thickness", "equivalent", "smearRatio", "smearK",
		"qw", "discharge", "top", "depth", "design.degree", "design.time")
	add("variants[#].", "name", "drainSpacing", "loads[#].start", "loads[#].ramp", "loads[#].q", "loads[#].fillThickness",
		"layers[#].k", "layers[#].mv", "layers[#].ch", "layers[#].thickness")
	add("alignment.", "date", "limit", "sections[#].name", "sections[#].chainage")
	add("uncertainty.", "runs", "seed", "date", "layers[#].k", "layers[#].mv", "layers[#].ch", "layers[#].kMv")
	add("monitoring.", "start")
	add("decisions.", "handover", "surcharge.removeBy", "strength.fs")
	add("decisions.strength.laws[#].", "s", "m", "ratio", "gain")
	add("monitoring.plates[#].", "name", "readings[#].t", "readings[#].value")
	add("monitoring.piezometers[#].", "name", "depth", "readings[#].t", "readings[#].value")
	return m
}()

// indexless writes every list index of a field path as "#":
// "layers[2].k" becomes "layers[#].k". A text that is not a field path
// (solver.ParsePath) is returned as it is, so no input matches it.
func indexless(path string) string {
	if s, ok := indexlessOf.Load(path); ok {
		return s.(string)
	}
	s := indexlessOnce(path)
	indexlessOf.Store(path, s)
	return s
}

// indexlessOf remembers indexless by path, as leafKinds and ids do: an
// input asks for it several times in every render (its unit, its
// placeholder, its value), for the same few hundred paths.
var indexlessOf sync.Map // path → indexless path

// indexlessOnce works indexless out.
func indexlessOnce(path string) string {
	steps, err := solver.ParsePath(path)
	if err != nil {
		return path
	}
	out := ""
	for _, st := range steps {
		out = solver.JoinPath(out, st.Name)
		if st.Index >= 0 {
			out += "[#]"
		}
	}
	return out
}

// onPage reports whether an input on the page shows the value at path.
func onPage(path string) bool { return pageFields[indexless(path)] }

func isList(path string) bool { return path == "times" || path == "piezometers" }

func listOf(p *solver.Project, path string) []float64 {
	if path == "times" {
		return p.Times
	}
	return p.Piezometers
}

func setList(p *solver.Project, path string, xs []float64) {
	if path == "times" {
		p.Times = xs
	} else {
		p.Piezometers = xs
	}
}

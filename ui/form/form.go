package ui

import (
	"fmt"
	"math"
	"reflect"
	"slices"
	"strconv"
	"strings"

	"porelight/solver"
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
}

// NewForm starts a form on a copy of p.
func NewForm(p *solver.Project) *Form {
	f := &Form{}
	f.Reset(p)
	return f
}

// Reset replaces the draft with a copy of p and forgets all typed text.
func (f *Form) Reset(p *solver.Project) {
	f.draft = *cloneProject(p)
	f.raw = map[string]string{}
	f.bad = map[string]string{}
	f.check()
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

// Count is the number of inputs with a problem plus problems no input shows.
func (f *Form) Count() int {
	n := len(f.other)
	seen := map[string]bool{}
	for p := range f.bad {
		seen[p] = true
	}
	for p := range f.probs {
		seen[p] = true
	}
	return n + len(seen)
}

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
	if kind := leafKind(path); kind == reflect.String {
		return getString(&f.draft, path)
	}
	if isList(path) {
		return formatList(listOf(&f.draft, path))
	}
	v, ok := getNumber(&f.draft, path)
	if !ok || (v == 0 && zeroIsDefault(path)) {
		return ""
	}
	return formatNumber(v * scaleOf(path))
}

// Edit takes the text typed into the input at path. It reports whether
// the draft changed.
func (f *Form) Edit(path, text string) bool {
	f.raw[path] = text
	delete(f.bad, path)
	changed, msg := f.apply(path, text)
	if msg != "" {
		f.bad[path] = msg
	}
	f.check()
	return changed
}

// SetBool sets a true/false value (only boundary drainage is one). Making
// an end undrained drops its fixed head and pressure history, making it
// drained drops its inflow, as the two cannot go together.
func (f *Form) SetBool(path string, on bool) {
	end, _, _ := strings.Cut(path, ".")
	b := boundary(&f.draft, end)
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
		x, msg := parseNumber(s, leafKind(path) == reflect.Int)
		if msg != "" {
			return false, msg
		}
		if err := setNumber(&f.draft, path, x/scaleOf(path)); err != nil {
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
}

// inputFor maps a problem path to the input showing it: list items of
// times and piezometers share one input, and name the item in the message.
func inputFor(path string) (input, prefix string) {
	if strings.HasPrefix(path, "monitoring.") && strings.HasSuffix(path, ".date") {
		return strings.TrimSuffix(path, ".date") + ".t", "" // one input shows t or date
	}
	for _, list := range []string{"times", "piezometers"} {
		if strings.HasPrefix(path, list+"[") {
			var i int
			if _, err := fmt.Sscanf(path[len(list):], "[%d]", &i); err == nil {
				return list, fmt.Sprintf("value %d: ", i+1)
			}
		}
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
	add("", "title", "notes", "gammaW", "waterTable", "times", "piezometers", "targetDegree", "designLife")
	add("layers[#].", "name", "thickness", "gammaSat", "gamma", "k", "mv", "calpha",
		"ecurve.e0", "ecurve.cc", "ecurve.cr", "ecurve.sigmaP", "ecurve.ocr")
	for _, end := range []string{"top.", "bottom."} {
		add(end, "head", "inflow", "excess[#].t", "excess[#].value")
	}
	add("loads[#].", "start", "ramp", "q")
	add("mesh.", "order", "maxSize", "minPerLayer")
	add("stepping.", "theta", "dampedSteps", "firstStep", "growth", "endTime")
	add("monitoring.", "start")
	add("monitoring.plates[#].", "name", "readings[#].t", "readings[#].value")
	add("monitoring.piezometers[#].", "name", "depth", "readings[#].t", "readings[#].value")
	return m
}()

// indexless writes every list index of a field path as "#":
// "layers[2].k" becomes "layers[#].k". A bracket holding anything but
// digits is kept as it is.
func indexless(path string) string {
	var b strings.Builder
	for {
		i := strings.IndexByte(path, '[')
		if i < 0 {
			b.WriteString(path)
			return b.String()
		}
		j := strings.IndexByte(path[i:], ']')
		if j < 0 {
			b.WriteString(path)
			return b.String()
		}
		b.WriteString(path[:i])
		if digits(path[i+1 : i+j]) {
			b.WriteString("[#]")
		} else {
			b.WriteString(path[i : i+j+1])
		}
		path = path[i+j+1:]
	}
}

func digits(s string) bool {
	if s == "" {
		return false
	}
	for _, r := range s {
		if r < '0' || r > '9' {
			return false
		}
	}
	return true
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

// zeroIsDefault reports whether a zero at path means "use the default",
// so the input shows empty (with the default as its placeholder).
func zeroIsDefault(path string) bool {
	_, ok := defaultHint(path)
	return ok
}

// defaultHint is the placeholder of an input whose empty value means a
// default, and whether there is one.
func defaultHint(path string) (string, bool) {
	i := strings.LastIndexByte(path, '.')
	leaf := path[i+1:]
	switch {
	case path == "gammaW":
		return "9.81", true
	case path == "targetDegree":
		return "95", true
	case path == "designLife":
		return "50", true
	case path == "mesh.order":
		return "1", true
	case path == "mesh.maxSize":
		return "H/200", true
	case path == "mesh.minPerLayer":
		return "4", true
	case path == "stepping.theta":
		return "0.5", true
	case path == "stepping.dampedSteps":
		return "4", true
	case path == "stepping.firstStep":
		return "1 min", true
	case path == "stepping.growth":
		return "1.2", true
	case path == "stepping.endTime":
		return "auto", true
	case strings.HasPrefix(path, "layers["):
		switch leaf {
		case "gamma":
			return "= γsat", true
		case "mv":
			return "from e–log", true
		case "calpha":
			return "none", true
		case "sigmaP", "ocr":
			return "–", true
		}
	case leaf == "inflow":
		return "0 (sealed)", true
	}
	return "", false
}

// scaleOf is the factor from the file's unit to the unit an input shows.
func scaleOf(path string) float64 {
	switch path {
	case "targetDegree":
		return 100 // fraction → %
	case "designLife":
		return 1 / 365.25 // day → year
	}
	if strings.HasPrefix(path, "monitoring.plates[") && strings.HasSuffix(path, ".value") {
		return 1000 // settlement readings: m → mm
	}
	return 1
}

// parseNumber reads one number as typed: a decimal comma is accepted, as
// is an exponent ("1.5e-9").
func parseNumber(s string, whole bool) (float64, string) {
	s = strings.ReplaceAll(strings.TrimSpace(s), ",", ".")
	s = strings.ReplaceAll(s, "−", "-") // a typographic minus
	x, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
		return 0, "not a number"
	}
	if whole && x != math.Trunc(x) {
		return 0, "must be a whole number"
	}
	return x, ""
}

// parseList reads numbers separated by commas, semicolons or spaces. With
// a comma as separator, decimals take a point.
func parseList(s string) ([]float64, string) {
	fields := strings.FieldsFunc(s, func(r rune) bool { return r == ',' || r == ';' || r == ' ' || r == '\t' || r == '\n' })
	xs := make([]float64, 0, len(fields))
	for i, w := range fields {
		w = strings.ReplaceAll(w, "−", "-")
		x, err := strconv.ParseFloat(w, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return nil, fmt.Sprintf("value %d (%q) is not a number", i+1, w)
		}
		xs = append(xs, x)
	}
	if len(xs) == 0 {
		return nil, ""
	}
	return xs, ""
}

// formatNumber writes x briefly and exactly enough to read back the same:
// 1.5e-09 → "1.5e-9", 0.30000000000000004 → "0.3".
func formatNumber(x float64) string {
	s := strconv.FormatFloat(x, 'g', 12, 64)
	if mant, exp, ok := strings.Cut(s, "e"); ok {
		sign := ""
		if exp[0] == '-' || exp[0] == '+' {
			if exp[0] == '-' {
				sign = "-"
			}
			exp = exp[1:]
		}
		exp = strings.TrimLeft(exp, "0")
		return mant + "e" + sign + exp
	}
	return s
}

func formatList(xs []float64) string {
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = formatNumber(x)
	}
	return strings.Join(parts, ", ")
}

// dropRaw forgets typed text at path and below it.
func (f *Form) dropRaw(prefix string) {
	for _, m := range []map[string]string{f.raw, f.bad} {
		for k := range m {
			if k == prefix || strings.HasPrefix(k, prefix+".") || strings.HasPrefix(k, prefix+"[") {
				delete(m, k)
			}
		}
	}
}

// remap renumbers the typed text of the items of list (e.g. "layers")
// after a structural edit: to(old) gives an item's new index, or -1 when
// it was removed.
func (f *Form) remap(list string, to func(old int) int) {
	for _, m := range []map[string]string{f.raw, f.bad} {
		moved := map[string]string{}
		for k, v := range m {
			old, rest, ok := listItem(k, list)
			if !ok {
				continue
			}
			delete(m, k)
			if n := to(old); n >= 0 {
				moved[fmt.Sprintf("%s[%d]%s", list, n, rest)] = v
			}
		}
		for k, v := range moved {
			m[k] = v
		}
	}
}

// listItem splits a path "list[i]rest" into i and rest.
func listItem(path, list string) (i int, rest string, ok bool) {
	if !strings.HasPrefix(path, list+"[") {
		return 0, "", false
	}
	tail := path[len(list)+1:]
	j := strings.IndexByte(tail, ']')
	if j < 0 || !digits(tail[:j]) {
		return 0, "", false
	}
	i, err := strconv.Atoi(tail[:j])
	return i, tail[j+1:], err == nil
}

// cloneProject makes a deep copy, so nothing is shared between the draft,
// the model and a solve in progress.
func cloneProject(p *solver.Project) *solver.Project {
	q := *p
	if p.Units != nil {
		u := *p.Units
		q.Units = &u
	}
	q.Layers = slices.Clone(p.Layers)
	for i, l := range q.Layers {
		if l.ECurve != nil {
			c := *l.ECurve
			q.Layers[i].ECurve = &c
		}
	}
	q.Top = cloneBoundary(p.Top)
	q.Bottom = cloneBoundary(p.Bottom)
	q.Loads = slices.Clone(p.Loads)
	for i := range q.Loads {
		q.Loads[i].Profile = slices.Clone(q.Loads[i].Profile)
	}
	q.InitialExcess = slices.Clone(p.InitialExcess)
	q.Times = slices.Clone(p.Times)
	q.Piezometers = slices.Clone(p.Piezometers)
	q.Monitoring = cloneMonitoring(p.Monitoring)
	return &q
}

func cloneBoundary(b solver.Boundary) solver.Boundary {
	if b.Head != nil {
		h := *b.Head
		b.Head = &h
	}
	b.Excess = slices.Clone(b.Excess)
	return b
}

package form

import (
	"fmt"
	"reflect"
	"strings"
	"sync"

	"porelight/solver"
)

// Values of the draft by field path (solver.ParsePath), found through
// the JSON names of the solver's types, so that a field added to
// solver.Project can be edited without a change here.

// fieldByJSON returns the field of struct type t whose JSON name is name.
// The page asks for every input's field on every render, so the answers
// are kept (jsonFields): reading the tags took a sixth of a keystroke's
// build with the demo loaded.
func fieldByJSON(t reflect.Type, name string) (reflect.StructField, bool) {
	k := jsonField{t, name}
	if f, ok := jsonFields.Load(k); ok {
		return f.(reflect.StructField), true
	}
	for i := range t.NumField() {
		f := t.Field(i)
		tag, _, _ := strings.Cut(f.Tag.Get("json"), ",")
		if tag == name {
			jsonFields.Store(k, f)
			return f, true
		}
	}
	return reflect.StructField{}, false
}

type jsonField struct {
	t    reflect.Type
	name string
}

var jsonFields sync.Map // jsonField → reflect.StructField

// locate walks p along path. With alloc it allocates nil pointers on the
// way (to set a value); without, a nil pointer or a missing list item ends
// the walk with ok == false and present == true only when the value exists.
func locate(p *solver.Project, path string, alloc bool) (v reflect.Value, present bool, err error) {
	if r, ok := routeOf(path); ok {
		v = reflect.ValueOf(p).Elem()
		for _, h := range r {
			if v, present = deref(v, alloc); !present {
				return reflect.Value{}, false, nil
			}
			v = v.FieldByIndex(h.field)
			if h.index >= 0 {
				if h.index >= v.Len() {
					return reflect.Value{}, false, fmt.Errorf("path %q: no item %d", path, h.index)
				}
				v = v.Index(h.index)
			}
		}
		if v, present = deref(v, alloc); !present {
			return reflect.Value{}, false, nil
		}
		return v, true, nil
	}
	steps, err := solver.ParsePath(path)
	if err != nil {
		return reflect.Value{}, false, err
	}
	v = reflect.ValueOf(p).Elem()
	for _, st := range steps {
		if v, present = deref(v, alloc); !present {
			return reflect.Value{}, false, nil
		}
		if v.Kind() != reflect.Struct {
			return reflect.Value{}, false, fmt.Errorf("path %q: %s is not an object", path, st.Name)
		}
		f, ok := fieldByJSON(v.Type(), st.Name)
		if !ok {
			return reflect.Value{}, false, fmt.Errorf("path %q: no field %s", path, st.Name)
		}
		v = v.FieldByIndex(f.Index)
		if st.Index >= 0 {
			if v.Kind() != reflect.Slice {
				return reflect.Value{}, false, fmt.Errorf("path %q: %s is not a list", path, st.Name)
			}
			if st.Index >= v.Len() {
				return reflect.Value{}, false, fmt.Errorf("path %q: no item %d", path, st.Index)
			}
			v = v.Index(st.Index)
		}
	}
	if v, present = deref(v, alloc); !present {
		return reflect.Value{}, false, nil
	}
	return v, true, nil
}

// hop is one step of a path through the types: the field, and the list
// item or -1.
type hop struct {
	field []int
	index int
}

// routeOf is the path's hops through the types, worked out once per path
// (every input's text goes through locate on every render); false for a
// path the types do not have, which locate walks step by step to say why.
func routeOf(path string) ([]hop, bool) {
	if r, ok := routes.Load(path); ok {
		return r.([]hop), true
	}
	steps, err := solver.ParsePath(path)
	if err != nil {
		return nil, false
	}
	t := reflect.TypeFor[solver.Project]()
	r := make([]hop, 0, len(steps))
	for _, st := range steps {
		for t.Kind() == reflect.Pointer {
			t = t.Elem()
		}
		if t.Kind() != reflect.Struct {
			return nil, false
		}
		f, ok := fieldByJSON(t, st.Name)
		if !ok {
			return nil, false
		}
		t = f.Type
		if st.Index >= 0 {
			if t.Kind() != reflect.Slice {
				return nil, false
			}
			t = t.Elem()
		}
		r = append(r, hop{f.Index, st.Index})
	}
	routes.Store(path, r)
	return r, true
}

var routes sync.Map // path → []hop

// deref follows the pointers from v, allocating the nil ones on the way
// when alloc is set; without, a nil pointer gives ok == false.
func deref(v reflect.Value, alloc bool) (_ reflect.Value, ok bool) {
	for v.Kind() == reflect.Pointer {
		if v.IsNil() {
			if !alloc {
				return reflect.Value{}, false
			}
			v.Set(reflect.New(v.Type().Elem()))
		}
		v = v.Elem()
	}
	return v, true
}

// leafKind is the reflect kind of the value at path (String, Float64, Int
// or Bool), found from the types alone so that absent values have one too.
// Every input asks for it on every render, so each path's answer is kept
// (the types never change).
func leafKind(path string) reflect.Kind {
	if k, ok := leafKinds.Load(path); ok {
		return k.(reflect.Kind)
	}
	k := findLeafKind(path)
	leafKinds.Store(path, k)
	return k
}

var leafKinds, ids sync.Map // path → reflect.Kind; path → element id

func findLeafKind(path string) reflect.Kind {
	steps, err := solver.ParsePath(path)
	if err != nil {
		return reflect.Invalid
	}
	t := reflect.TypeFor[solver.Project]()
	for _, st := range steps {
		for t.Kind() == reflect.Pointer {
			t = t.Elem()
		}
		if t.Kind() != reflect.Struct {
			return reflect.Invalid
		}
		f, ok := fieldByJSON(t, st.Name)
		if !ok {
			return reflect.Invalid
		}
		t = f.Type
		if st.Index >= 0 {
			if t.Kind() != reflect.Slice {
				return reflect.Invalid
			}
			t = t.Elem()
		}
	}
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	return t.Kind()
}

// IsText reports whether the value at path is text (a name, the title,
// the notes) rather than a number.
func IsText(path string) bool { return leafKind(path) == reflect.String }

// isPointerLeaf reports whether the value at path is held by a pointer, so
// that an empty entry means "absent" (nil) rather than zero.
func isPointerLeaf(path string) bool {
	// Only boundary heads are optional numbers held by pointer.
	return path == "top.head" || path == "bottom.head"
}

// getNumber returns the number at path and whether it is present.
func getNumber(p *solver.Project, path string) (float64, bool) {
	v, ok, err := locate(p, path, false)
	if err != nil || !ok {
		return 0, false
	}
	switch v.Kind() {
	case reflect.Float64:
		return v.Float(), true
	case reflect.Int:
		return float64(v.Int()), true
	}
	return 0, false
}

// getString returns the text at path ("" when absent).
func getString(p *solver.Project, path string) string {
	v, ok, err := locate(p, path, false)
	if err != nil || !ok || v.Kind() != reflect.String {
		return ""
	}
	return v.String()
}

// setNumber stores x at path, allocating on the way. Setting an e–log
// parameter creates the layer's ecurve; clearing its last one removes it.
func setNumber(p *solver.Project, path string, x float64) error {
	v, _, err := locate(p, path, true)
	if err != nil {
		return err
	}
	switch v.Kind() {
	case reflect.Float64:
		v.SetFloat(x)
	case reflect.Int:
		v.SetInt(int64(x))
	default:
		return fmt.Errorf("path %q is not a number", path)
	}
	tidyECurve(p, path)
	return nil
}

// clearNumber makes the value at path absent: nil for a pointer, zero
// otherwise.
func clearNumber(p *solver.Project, path string) error {
	if strings.HasPrefix(path, "variants[") {
		return clearVariantLeaf(p, path)
	}
	if isPointerLeaf(path) {
		end, _, _ := strings.Cut(path, ".")
		Boundary(p, end).Head = nil
		return nil
	}
	v, ok, err := locate(p, path, false)
	if err != nil {
		return err
	}
	if !ok {
		return nil
	}
	v.Set(reflect.Zero(v.Type()))
	tidyECurve(p, path)
	return nil
}

func setString(p *solver.Project, path, s string) error {
	v, _, err := locate(p, path, true)
	if err != nil {
		return err
	}
	if v.Kind() != reflect.String {
		return fmt.Errorf("path %q is not text", path)
	}
	v.SetString(s)
	return nil
}

// tidyECurve drops a layer's e–log curve when the edit at path left all of
// its parameters zero: an empty row of e–log columns means "no curve".
func tidyECurve(p *solver.Project, path string) {
	steps, err := solver.ParsePath(path)
	if err != nil || len(steps) < 2 || steps[0].Name != "layers" || steps[1].Name != "ecurve" {
		return
	}
	i := steps[0].Index
	if i < 0 || i >= len(p.Layers) {
		return
	}
	if c := p.Layers[i].ECurve; c != nil && reflect.ValueOf(*c).IsZero() {
		p.Layers[i].ECurve = nil
	}
}

// Boundary is the end of p that end names: "bottom" for the base, else
// the top.
func Boundary(p *solver.Project, end string) *solver.Boundary {
	if end == "bottom" {
		return &p.Bottom
	}
	return &p.Top
}

// IDOf turns a field path into the element id of its input:
// "layers[2].ecurve.cc" → "layers-2-ecurve-cc". Ids are stable, so browser
// tests and labels can refer to them.
func IDOf(path string) string {
	if id, ok := ids.Load(path); ok {
		return id.(string)
	}
	id := idReplacer.Replace(path)
	ids.Store(path, id)
	return id
}

var idReplacer = strings.NewReplacer("[", "-", "]", "", ".", "-")

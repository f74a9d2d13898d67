package solver

import (
	"bytes"
	"encoding/json"
	"fmt"
	"maps"
	"reflect"
	"slices"
	"strconv"
	"strings"
)

// MaxFileBytes is the largest project file Decode reads.
const MaxFileBytes = 4 << 20

// Decode reads one project from JSON. It refuses, all at once and each
// with its field path, every unknown field, every value of the wrong JSON
// type and a missing or different "format". It does not check values:
// call Validate (Solve does) for that. Decode never panics.
func Decode(data []byte) (*Project, error) {
	var ps Problems
	if len(data) > MaxFileBytes {
		ps.Add("", ErrTooLarge, fmt.Sprintf("the file has %d bytes, the limit is %d", len(data), MaxFileBytes))
		return nil, ps
	}
	var raw any
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	if err := dec.Decode(&raw); err != nil {
		ps.Add("", ErrSyntax, err.Error())
		return nil, ps
	}
	if dec.More() {
		ps.Add("", ErrSyntax, "text after the end of the project")
		return nil, ps
	}
	obj, ok := raw.(map[string]any)
	if !ok {
		ps.Add("", ErrSyntax, "a project is a JSON object {…}")
		return nil, ps
	}
	switch f := obj["format"].(type) {
	case nil:
		ps.Add("format", ErrRequired, fmt.Sprintf("expected %q", Format))
	case string:
		if f != Format {
			ps.Add("format", ErrFormat, fmt.Sprintf("got %q, this version reads %q", f, Format))
		}
	}
	checkShape(&ps, "", raw, reflect.TypeFor[Project]())
	if len(ps) > 0 {
		return nil, ps
	}
	var p Project
	if err := json.Unmarshal(data, &p); err != nil {
		// The shape check above should have caught everything; report
		// what is left rather than guess.
		ps.Add("", ErrSyntax, err.Error())
		return nil, ps
	}
	return &p, nil
}

// checkShape compares a decoded JSON value with the Go type it will be
// stored in and records unknown fields and wrong JSON types with their
// paths. It follows encoding/json's rules for field names.
func checkShape(ps *Problems, path string, v any, t reflect.Type) {
	for t.Kind() == reflect.Pointer {
		t = t.Elem()
	}
	if v == nil {
		return // null leaves the zero value, as encoding/json does
	}
	want := func(kind string) {
		ps.Add(path, ErrSyntax, fmt.Sprintf("expected %s, got %s", kind, jsonKind(v)))
	}
	switch t.Kind() {
	case reflect.Struct:
		obj, ok := v.(map[string]any)
		if !ok {
			want("an object")
			return
		}
		fields := jsonFields(t)
		// Sorted keys keep the order of the problems the same from run
		// to run (map order is random).
		for _, key := range slices.Sorted(maps.Keys(obj)) {
			val := obj[key]
			f, ok := fields[key]
			if !ok {
				ps.Add(join(path, keyName(key)), ErrUnknown, "check the spelling; names are case-sensitive")
				continue
			}
			checkShape(ps, join(path, key), val, f.Type)
		}
	case reflect.Slice:
		arr, ok := v.([]any)
		if !ok {
			want("a list")
			return
		}
		for i, el := range arr {
			checkShape(ps, IndexPath(path, i), el, t.Elem())
		}
	case reflect.String:
		if _, ok := v.(string); !ok {
			want("text")
		}
	case reflect.Bool:
		if _, ok := v.(bool); !ok {
			want("true or false")
		}
	case reflect.Float64:
		n, ok := v.(json.Number)
		if !ok {
			want("a number")
			return
		}
		if _, err := n.Float64(); err != nil {
			ps.Add(path, ErrNotFinite, "got "+n.String())
		}
	case reflect.Int:
		n, ok := v.(json.Number)
		if !ok {
			want("a whole number")
			return
		}
		if _, err := n.Int64(); err != nil {
			want("a whole number")
		}
	}
}

// keyName is the name an unknown key of a JSON object takes in a field
// path: the key itself, or the key quoted as a Go string when it is empty
// or holds a character of the path grammar (".", "[", "]") or a quote, so
// that every unknown field has a path of its own and never reads as
// another one.
func keyName(key string) string {
	if key == "" || strings.ContainsAny(key, ".[]\"") {
		return strconv.Quote(key)
	}
	return key
}

func join(path, key string) string {
	return JoinPath(path, key)
}

func jsonKind(v any) string {
	switch v.(type) {
	case map[string]any:
		return "an object"
	case []any:
		return "a list"
	case string:
		return "text"
	case bool:
		return "true/false"
	case json.Number:
		return "a number"
	}
	return "null"
}

// jsonFields maps the JSON names of t's exported fields to the fields.
func jsonFields(t reflect.Type) map[string]reflect.StructField {
	m := make(map[string]reflect.StructField, t.NumField())
	for i := range t.NumField() {
		f := t.Field(i)
		if !f.IsExported() {
			continue
		}
		name, _, _ := strings.Cut(f.Tag.Get("json"), ",")
		if name == "-" {
			continue
		}
		if name == "" {
			name = f.Name
		}
		m[name] = f
	}
	return m
}

// Encode writes a project as indented JSON in the file format.
func Encode(p *Project) ([]byte, error) {
	return json.MarshalIndent(p, "", "  ")
}

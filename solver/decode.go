package solver

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"maps"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"
)

// MaxFileBytes is the largest project file Decode reads.
const MaxFileBytes = 4 << 20

var utf8BOM = []byte("\xef\xbb\xbf")

// Decode reads one project from JSON. It refuses, all at once and each
// with its field path, every unknown field, every value of the wrong JSON
// type and a missing or different "format". It does not check values:
// call Validate (Solve does) for that. Decode never panics.
//
// Text that is not JSON is refused with one ErrSyntax problem saying
// where, "line 3, column 12: invalid character …" (1-based, columns in
// characters). A file of another kind gets one ErrNotProject problem
// naming it: Porelight's results (the JSON Solve's Result encodes to) or
// its answer refusing a project, a table (CSV), HTML or other text.
func Decode(data []byte) (*Project, error) {
	var ps Problems
	if len(data) > MaxFileBytes {
		ps.Add("", ErrTooLarge, fmt.Sprintf("the file has %d bytes, the limit is %d", len(data), MaxFileBytes))
		return nil, ps
	}
	// Some editors start a UTF-8 file with a byte order mark; JSON has
	// none, so it is dropped rather than refused.
	data = bytes.TrimPrefix(data, utf8BOM)
	var raw any
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	if err := dec.Decode(&raw); err != nil {
		if kind := notJSON(data); kind != "" {
			return nil, Problems{notProject(kind)}
		}
		ps = append(ps, syntaxProblem(data, err))
		return nil, ps
	}
	if dec.More() {
		if kind := notJSON(data); kind != "" {
			return nil, Problems{notProject(kind)}
		}
		// The text that follows starts after the white space at the
		// decoder's offset.
		rest := data[dec.InputOffset():]
		at := int64(len(data) - len(bytes.TrimLeft(rest, " \t\r\n")) + 1)
		ps = append(ps, Problem{Path: "", Err: ErrSyntax,
			Message: position(data, at) + ": text after the end of the project (a file holds one project, one JSON object {…})"})
		return nil, ps
	}
	obj, ok := raw.(map[string]any)
	if !ok {
		ps.Add("", ErrSyntax, "a project is a JSON object {…}")
		return nil, ps
	}
	if what := otherFile(obj); what != "" {
		ps = append(ps, Problem{Path: "", Err: ErrNotProject, Message: what})
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
		ps = append(ps, syntaxProblem(data, err))
		return nil, ps
	}
	return &p, nil
}

// syntaxProblem turns an error of encoding/json into a Problem that says
// where in data it happened, as "line 3, column 14: …" (both 1-based,
// columns counted in characters). A type error takes the path of its
// field.
func syntaxProblem(data []byte, err error) Problem {
	var se *json.SyntaxError
	var te *json.UnmarshalTypeError
	switch {
	case errors.As(err, &se):
		return Problem{Path: "", Err: ErrSyntax, Message: position(data, se.Offset) + ": " + se.Error() + " (the file is not valid JSON)"}
	case errors.As(err, &te):
		return Problem{Path: te.Field, Err: ErrSyntax,
			Message: position(data, te.Offset) + ": " + fmt.Sprintf("expected %s, got a JSON %s", te.Type, te.Value)}
	case errors.Is(err, io.EOF) && len(bytes.TrimSpace(data)) == 0:
		return Problem{Path: "", Err: ErrSyntax, Message: "the file is empty"}
	case errors.Is(err, io.ErrUnexpectedEOF), errors.Is(err, io.EOF):
		return Problem{Path: "", Err: ErrSyntax,
			Message: position(data, int64(len(data))) + ": the file ends in the middle of the project, so it is not valid JSON (was it cut short?)"}
	}
	return Problem{Path: "", Err: ErrSyntax, Message: err.Error()}
}

// position is "line L, column C" of the byte before offset off of data:
// encoding/json's offsets count the bytes read, the offending one
// included.
func position(data []byte, off int64) string {
	off = min(max(off, 1), int64(len(data)))
	before := data[:off]
	line := 1 + bytes.Count(before, []byte{'\n'})
	start := bytes.LastIndexByte(before, '\n') + 1
	col := max(utf8.RuneCount(before[start:]), 1)
	return fmt.Sprintf("line %d, column %d", line, col)
}

// notJSON says what data looks like when it is plainly not JSON ("CSV",
// "text", …), or "" when it is JSON or might be JSON with a mistake in
// it (it starts with { or [).
func notJSON(data []byte) string {
	t := bytes.TrimSpace(data)
	switch {
	case len(t) == 0 || t[0] == '{' || t[0] == '[' || json.Valid(t):
		return ""
	case !utf8.Valid(t) || bytes.IndexByte(t, 0) >= 0:
		return "a binary file, not text"
	case t[0] == '<':
		return "HTML or XML"
	}
	first, _, _ := bytes.Cut(t, []byte{'\n'})
	if bytes.ContainsAny(first, ",;\t") {
		return "CSV, a table of values"
	}
	return "text"
}

// notProject is the problem of a file that looks like kind.
func notProject(kind string) Problem {
	return Problem{Path: "", Err: ErrNotProject,
		Message: "this is not a project file (it looks like " + kind + "); open a Porelight project, a .json file saved from the page"}
}

// otherFile recognises a JSON object that is one of Porelight's other
// files rather than a project and says so; "" when it is not.
func otherFile(obj map[string]any) string {
	if f, ok := obj["format"]; ok {
		// The page's Save writes a draft with its problems in this
		// format (ui/form.DraftFormat); the page reads it back.
		if f == "porelight-draft/1" {
			return "this is a draft saved with problems, not a project the solver accepts — open it in the page to fix them"
		}
		return ""
	}
	_, steady := obj["steady"]
	_, summary := obj["summary"]
	if steady && summary {
		return "this is a results file, not a project — open a project file (saved with “Save”, not exported results)"
	}
	if e, ok := obj["error"].(map[string]any); ok && len(obj) == 1 {
		if _, ok := e["problems"]; ok {
			return "this is the solver's answer to a project it refused (a list of problems), not a project — open a project file"
		}
	}
	return ""
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
	// The JSON is valid, only of the wrong type: the reason stays
	// ErrSyntax (the file does not fit the format), the message says so.
	want := func(kind string) {
		*ps = append(*ps, Problem{Path: path, Err: ErrSyntax, Message: fmt.Sprintf("must be %s in JSON, not %s", kind, jsonKind(v))})
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
			*ps = append(*ps, Problem{Path: path, Err: ErrSyntax, Message: "must be a whole number (got " + n.String() + ")"})
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

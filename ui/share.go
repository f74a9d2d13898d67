package ui

import (
	"bytes"
	"compress/flate"
	"encoding/base64"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"strings"

	"porelight/solver"
	"porelight/ui/form"
)

// FragmentKey starts the URL fragment that carries a shared project:
// "#" + FragmentKey + base64url(raw deflate(project JSON)).
const FragmentKey = "p="

// EncodeFragment packs p for the URL fragment (without the leading "#").
func EncodeFragment(p *solver.Project) (string, error) {
	data, err := json.Marshal(p)
	if err != nil {
		return "", err
	}
	var buf bytes.Buffer
	w, err := flate.NewWriter(&buf, flate.BestCompression)
	if err != nil {
		return "", err
	}
	if _, err := w.Write(data); err != nil {
		return "", err
	}
	if err := w.Close(); err != nil {
		return "", err
	}
	return FragmentKey + base64.RawURLEncoding.EncodeToString(buf.Bytes()), nil
}

// ErrNoProject says a URL fragment carries no project (it may be empty or
// serve another purpose); it is not an error to report.
var ErrNoProject = errors.New("no project in the link")

// DecodeFragment unpacks the JSON of a project from a URL fragment (with
// or without the leading "#"). The JSON is not checked: pass it to
// ReadProject.
func DecodeFragment(frag string) ([]byte, error) {
	frag = strings.TrimPrefix(frag, "#")
	b64, ok := strings.CutPrefix(frag, FragmentKey)
	if !ok {
		return nil, ErrNoProject
	}
	// Padding and the standard alphabet may come back from a mail client
	// or a chat that "helped"; accept them.
	b64 = strings.TrimRight(b64, "=")
	b64 = strings.NewReplacer("+", "-", "/", "_").Replace(b64)
	z, err := base64.RawURLEncoding.DecodeString(b64)
	if err != nil {
		return nil, fmt.Errorf("the link is damaged (%v); was it cut short?", err)
	}
	r := flate.NewReader(bytes.NewReader(z))
	defer r.Close()
	data, err := io.ReadAll(io.LimitReader(r, solver.MaxFileBytes+1))
	if err != nil {
		return nil, fmt.Errorf("the link is damaged (%v); was it cut short?", err)
	}
	if len(data) > solver.MaxFileBytes {
		return nil, fmt.Errorf("the project in the link is larger than %d bytes", solver.MaxFileBytes)
	}
	return data, nil
}

// ReadProject decodes and validates a project file. On failure it returns
// every problem, each with its field path.
func ReadProject(data []byte) (*solver.Project, solver.Problems) {
	p, err := solver.Decode(data)
	if err != nil {
		return nil, solver.AsProblems(err)
	}
	if err := solver.Validate(p); err != nil {
		return nil, solver.AsProblems(err)
	}
	return p, nil
}

// describeProblems writes problems as one short paragraph for a message,
// each as "path: message" (the message alone for the whole project).
func describeProblems(ps solver.Problems, limit int) string {
	return describeProblemsAt(ps, limit, nil)
}

// describeProblemsAt is describeProblems for a panel that shows the
// fields here accepts (nil: none): their problems read as the message
// alone, beside them.
func describeProblemsAt(ps solver.Problems, limit int, here func(path string) bool) string {
	var b strings.Builder
	for i, p := range ps {
		if i == limit {
			fmt.Fprintf(&b, " … and %d more.", len(ps)-limit)
			break
		}
		if i > 0 {
			b.WriteString("; ")
		}
		if p.Path != "" && (here == nil || !here(p.Path)) {
			// Rows numbered from 1, as the tables show them.
			b.WriteString(form.Label(p.Path) + ": ")
		}
		b.WriteString(p.Message)
	}
	return b.String()
}

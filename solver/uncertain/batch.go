package uncertain

import (
	"encoding/json"
	"errors"

	"porelight/solver"
)

// Batch is one piece of work for a worker: the realisations From ≤ i <
// To of Project under Plan, or, with Sensitivity set, the one-at-a-time
// sensitivity. It travels as JSON (the page's solve workers, op
// "vary-batch"; see wasm/worker.go).
type Batch struct {
	Project     *solver.Project `json:"project"`
	Plan        Plan            `json:"plan"`
	From        int             `json:"from"`
	To          int             `json:"to"`
	Sensitivity bool            `json:"sensitivity,omitempty"`
	// Binary asks for the samples in the binary form (EncodeSamples)
	// instead of the JSON of an Answer.
	Binary bool `json:"binary,omitempty"`
}

// Answer is what a Batch gives.
type Answer struct {
	Samples []Sample `json:"samples,omitempty"`
	Base    *Sample  `json:"base,omitempty"`
	Swings  []Swing  `json:"swings,omitempty"`
}

// errBatch is the reason of a Batch that cannot run.
var errBatch = errors.New("is not a batch of realisations")

// RunBatch decodes a Batch from data, runs it and encodes its Answer.
// progress, when not nil, receives the fraction done; returning false
// stops the batch, which answers what it has. A batch that cannot be
// read or whose project is invalid returns the problems (solver.Problems).
func RunBatch(data []byte, progress func(float64) bool) ([]byte, error) {
	var b Batch
	if err := json.Unmarshal(data, &b); err != nil || b.Project == nil {
		return nil, solver.Problems{{Path: "", Message: "the batch could not be read", Err: errBatch}}
	}
	if err := solver.Validate(b.Project); err != nil {
		return nil, err
	}
	var a Answer
	if b.Sensitivity {
		base, sw := Sensitivity(b.Project, b.Plan, func(done, total int) bool {
			return progress == nil || progress(float64(done)/float64(total))
		})
		a.Base, a.Swings = &base, sw
	} else {
		n := max(1, b.To-b.From)
		a.Samples = Range(b.Project, b.Plan, b.From, b.To, func(done int) bool {
			return progress == nil || progress(float64(done)/float64(n))
		})
		if b.Binary {
			return EncodeSamples(a.Samples), nil
		}
	}
	return json.Marshal(a)
}

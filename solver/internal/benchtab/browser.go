package main

import (
	"encoding/json"
	"fmt"
	"os"
)

// browserFigures are the page's own measurements, written by its browser
// benchmark as JSON. The first five keys are required; the others are
// shown when present, and keys this program does not know are ignored
// (the page's benchmark owns the format).
type browserFigures struct {
	FirstPlotMs     *float64 `json:"firstPlotMs"`     // opening the page to the first plot
	EditToPlotMs    *float64 `json:"editToPlotMs"`    // an input event to the updated plot
	HeapBeforeBytes *float64 `json:"heapBeforeBytes"` // wasm memory before the solves
	HeapAfterBytes  *float64 `json:"heapAfterBytes"`  // and after them
	Solves          *int     `json:"solves"`

	EditToPlotNoDebounceMs          *float64 `json:"editToPlotNoDebounceMs"`          // the same from the end of the page's pause before a solve
	EditToPlotNonlinearNoDebounceMs *float64 `json:"editToPlotNonlinearNoDebounceMs"` // the same on the non-linear model
	EditToRestMs                    *float64 `json:"editToRestMs"`                    // the same to a figure out of view drawn, after the paint
	EditToRestNonlinearMs           *float64 `json:"editToRestNonlinearMs"`           // and on the non-linear model
	JSHeapBeforeBytes               *float64 `json:"jsHeapBeforeBytes"`               // JavaScript heap; 0 when unavailable
	JSHeapAfterBytes                *float64 `json:"jsHeapAfterBytes"`
	KeystrokeMs                     *float64 `json:"keystrokeMs"`    // a keystroke's input event to the next frame painted, median
	KeystrokeMaxMs                  *float64 `json:"keystrokeMaxMs"` // and the slowest
	Paste500Ms                      *float64 `json:"paste500Ms"`     // 500 readings pasted (one input event) and used, to the frames painted
	Insert500Ms                     *float64 `json:"insert500Ms"`    // the same text inserted as one input event per line and line break
	// The Monte Carlo of the demo in the page (static/browserbench_test.go).
	RangeRuns        int       `json:"rangeRuns"`
	RangeWorkers     int       `json:"rangeWorkers"`
	RangeMs          float64   `json:"rangeMs"`
	RangeOneWorkerMs float64   `json:"rangeOneWorkerMs"`
	RangeMaxGapMs    float64   `json:"rangeMaxGapMs"`
	RangeMemoryBytes []float64 `json:"rangeMemoryBytes"`
	Machine          string    `json:"machine"`
}

// Goals of section 5.
const (
	firstPlotGoalMs  = 1500
	editToPlotGoalMs = 50
	keystrokeGoalMs  = 30
	pasteGoalMs      = 1000
	heapGrowthGoal   = 5_000_000 // bytes (10⁶ to the MB), over heapSolves solves
	heapSolves       = 1000
	rangeGoalMs      = 10000 // 1,000 realisations of the demo in the page
	rangeSpeedupGoal = 1.7   // one worker per core (two here) against one
)

// readBrowser decodes the browser benchmark's file and requires its five
// keys.
func readBrowser(name string) (*browserFigures, error) {
	data, err := os.ReadFile(name)
	if err != nil {
		return nil, err
	}
	var b browserFigures
	if err := json.Unmarshal(data, &b); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	for _, k := range []struct {
		key string
		ok  bool
	}{
		{"firstPlotMs", b.FirstPlotMs != nil}, {"editToPlotMs", b.EditToPlotMs != nil},
		{"heapBeforeBytes", b.HeapBeforeBytes != nil}, {"heapAfterBytes", b.HeapAfterBytes != nil},
		{"solves", b.Solves != nil},
	} {
		if !k.ok {
			return nil, fmt.Errorf("%s: missing %q", name, k.key)
		}
	}
	return &b, nil
}

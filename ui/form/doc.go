// Package form is the editing model behind the page's inputs: one
// solver.Project being edited, the text typed into each input, and every
// problem with it. It is plain Go (no vugu, no DOM), so it is tested
// natively; the components in package ui show it and call its methods.
//
// # Overview
//
//	f := form.New(p)                     // a deep copy of p: p is not changed
//	f.Edit("layers[1].k", "2,5e-9")      // the text as typed, decimal comma and all
//	f.Text("layers[1].k")                // "2,5e-9": what the input shows, as typed
//	f.Problem("layers[1].k")             // "" or the message beside the input
//	if f.Valid() { solve(f.Model()) }    // a deep copy, safe to hand to a solve
//
// # Field paths
//
// Every input is named by the field path of the value it edits, in the
// grammar of solver.JoinPath, solver.IndexPath and solver.ParsePath, which
// is also the grammar of solver.Problem.Path: "layers[2].ecurve.cc",
// "monitoring.plates[0].readings[3].t". IDOf turns a path into the
// input's element id. Values are found by the JSON names of the solver's
// types, so a field added there can be edited without a change here.
//
// # Typed text is kept per path
//
// What was typed stays as typed: Text returns it until the form is Reset
// or the edit of another input replaces the value as a whole (a paste of
// readings, switching an end between drained and undrained).
// The draft (Draft) takes the value as soon as the text reads as one
// (ParseNumber; a list of numbers for "times" and "piezometers"; days or
// a date for a reading's time). Text that does not read is a problem of
// its input, and the draft keeps its previous value. Some inputs show
// another unit than the file: targetDegree in %, designLife in years,
// settlement readings in mm. An empty input whose zero means the
// solver's default shows that default as its Placeholder, taken from
// package solver's Default constants.
//
// # Problems are mapped to fields
//
// After every edit, solver.Validate checks the whole draft, and each
// problem is filed under the input showing its path: Problem(path) for
// one input, ProblemsUnder(prefix) for a section, Other for the problems
// no input shows. Valid reports whether there are none of any kind;
// only then is Model worth solving, saving or sharing, so the last good
// results stay on screen while an input is wrong. The form never parses
// a message: it goes by paths.
//
// # Structural edits renumber typed text
//
// Adding, removing and moving rows (AddLayer, RemoveLayer, MoveLayer,
// RemoveLoad, RemoveExcess, RemovePoint, RemoveRecord, RemoveReading) move the typed
// text and its problems with their rows: text typed into layers[3].k
// becomes layers[2].k's when a row above is removed. RemapKeys does the
// same for the per-row state a component keeps in its own maps.
//
// # Load stages
//
// SetFill turns a stage into a fill of the same pressure or back;
// SetArea gives it a loaded area (a strip, rectangle, circle or
// embankment, with sizes to start from), a typed profile of Δσ/q against
// depth (AreaProfile), or the whole top (AreaWhole); AreaKind tells which.
// AddPoint and RemovePoint edit a depth profile by its path (a stage's
// "loads[i].profile", or "initialExcess").
//
// # Deep copies
//
// New, Reset and Model copy the project deeply (every slice, every
// pointer), so nothing is shared between the caller's project, the
// draft, the model and a solve in progress. Draft is the form's own
// project: read it, and change it only through the form's methods.
package form

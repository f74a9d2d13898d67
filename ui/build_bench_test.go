package ui

import (
	"testing"

	"github.com/vugu/vugu"
)

// The Go side of a keystroke and of a redraw with the demo loaded,
// natively. A keystroke is the whole tree's build (vugu rebuilds every
// component on every render) and the edit's own work (the form's check,
// the autosave's encoding); a redraw after a solve is the build with
// every figure made again. The browser figures are TestBrowserBench's
// keystroke and edit-to-plot rows; these say where their Go part goes
// (go test -bench 'Keystroke|Redraw' -gcflags=all=-l -cpuprofile).

// demoRoot is the demo page, solved and built once (newPage).
func demoRoot(tb testing.TB) (*Root, *vugu.BuildEnv) {
	tb.Helper()
	p := newPage(tb, Sources{})
	if p.root.Result() == nil {
		tb.Fatal("the demo did not solve")
	}
	return p.root, p.env
}

func BenchmarkKeystrokeBuild(b *testing.B) {
	root, env := demoRoot(b)
	for b.Loop() {
		env.RunBuild(root)
	}
}

func BenchmarkKeystrokeEdit(b *testing.B) {
	root, _ := demoRoot(b)
	texts := []string{"2.1e-9", "2.2e-9"}
	i := 0
	for b.Loop() {
		// An invalid run of text would skip the solve; a valid one is
		// what a keystroke mostly is, and solves natively at once
		// without an Env: edit the form and track it, as edited does
		// before it asks for a solve.
		root.form.Edit("layers[1].k", texts[i%2])
		root.track()
		i++
	}
}

// BenchmarkRedrawBuild is the build after a solve: a new result (a copy,
// so that no figure is remembered) with the demo's project.
func BenchmarkRedrawBuild(b *testing.B) {
	root, env := demoRoot(b)
	r := root.result
	for b.Loop() {
		cp := *r
		root.result = &cp
		env.RunBuild(root)
	}
}

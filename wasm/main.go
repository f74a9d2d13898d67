//go:build js && wasm

// Command wasm is the WebAssembly program of the Porelight page: it
// exposes the JavaScript API (globalThis.porelight) and, where there is a
// document, mounts the page's components on #app and runs their render
// loop. The page shell (static/) loads it.
package main

import (
	"syscall/js"

	"github.com/vugu/vugu"
	"github.com/vugu/vugu/domrender"

	"porelight/ui"
)

// version is the program's version, porelight.version.
const version = "0.1.0"

func main() {
	a := &api{demo: demoProject()}
	a.register(js.Global())
	doc := js.Global().Get("document")
	if doc.IsUndefined() {
		serveWorker(a) // a worker or node: the API and goCall only
		select {}
	}
	run(a.demo)
}

// demoProject reads the demo project that the page carries inline in
// <script id="demo-project" type="application/json">.
func demoProject() []byte {
	var s string
	_ = catch(func() {
		el := js.Global().Get("document").Call("getElementById", "demo-project")
		if el.Truthy() {
			s = el.Get("textContent").String()
		}
	})
	return []byte(s)
}

func run(demo []byte) {
	renderer, err := domrender.New("#app")
	if err != nil {
		fail(err)
	}
	defer renderer.Release()
	ee := renderer.EventEnv()
	env, err := vugu.NewBuildEnv(ee)
	if err != nil {
		fail(err)
	}
	h := host{}
	src := ui.Sources{Fragment: fragment(), Demo: demo}
	src.View = ui.IsView(js.Global().Get("location").Get("search").String(), src.Fragment)
	if s, ok, err := h.Recall(ui.AutosaveKey); err != nil {
		src.AutosaveErr = err
	} else if ok {
		src.Autosave = s
		if hist, ok, _ := h.Recall(ui.HistoryKey); ok {
			src.History = hist
		}
	}
	root := &ui.Root{Host: h, Env: ee, Version: version}
	root.Start(src)
	first := true
	var co coalescer // coalesce.go
	drain := drainer(renderer)
	same := samer(renderer) // same.go
	for ok := true; ok; ok = renderer.EventWait() {
		if !first {
			co.wait()
			if drain != nil && !drain() {
				break
			}
		}
		ee.RLock()
		br := env.RunBuild(root)
		ee.RUnlock()
		if same != nil {
			same(br)
		}
		if err := renderer.Render(br); err != nil {
			fail(err)
		}
		co.rendered()
		if first {
			first = false
			// Tell the page shell (and tests) that the page is up.
			_ = catch(func() {
				ev := js.Global().Get("CustomEvent").New("porelight:ready")
				js.Global().Get("document").Call("dispatchEvent", ev)
			})
		}
	}
}

// fail shows a start-up failure in the page and stops.
func fail(err error) {
	_ = catch(func() {
		el := js.Global().Get("document").Call("getElementById", "app")
		if el.Truthy() {
			el.Set("textContent", "The page could not start: "+err.Error())
		}
	})
	panic(err)
}

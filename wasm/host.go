//go:build js && wasm

package main

import (
	"context"
	"errors"
	"fmt"
	"strings"
	"syscall/js"

	"porelight/solver"
	"porelight/ui"
)

// host gives the UI the browser: storage, downloads, files, yielding.
// Every JavaScript call that may throw goes through js.Value.Call inside
// catch (a throwing property read would end the Go program instead).
type host struct{}

// Yield waits for a setTimeout(0) callback, so that the browser can paint
// and run event handlers; Go's scheduler returns to the browser only while
// every goroutine is blocked.
func (host) Yield() {
	done := make(chan struct{})
	f := js.FuncOf(func(js.Value, []js.Value) any { close(done); return nil })
	defer f.Release()
	js.Global().Call("setTimeout", f, 0)
	<-done
}

// Download offers data as a file through a Blob and a temporary anchor.
func (host) Download(name, mime string, data []byte) error {
	return catch(func() {
		g := js.Global()
		arr := g.Get("Uint8Array").New(len(data))
		js.CopyBytesToJS(arr, data)
		opts := g.Get("Object").New()
		opts.Set("type", mime)
		blob := g.Get("Blob").New(g.Get("Array").Call("of", arr), opts)
		urlAPI := g.Get("URL")
		url := urlAPI.Call("createObjectURL", blob)
		doc := g.Get("document")
		a := doc.Call("createElement", "a")
		a.Set("href", url)
		a.Set("download", name)
		a.Set("rel", "noopener")
		a.Get("style").Set("display", "none")
		doc.Get("body").Call("appendChild", a)
		a.Call("click")
		a.Call("remove")
		// Give the browser time to start the download before letting go.
		g.Call("setTimeout", urlAPI.Get("revokeObjectURL").Call("bind", urlAPI), 60000, url)
	})
}

// storage returns window.localStorage, or an error where it is refused
// (reading the property throws in a sandboxed frame).
func storage() (js.Value, error) {
	var s js.Value
	err := catch(func() { s = js.Global().Get("Reflect").Call("get", js.Global(), "localStorage") })
	if err == nil && (s.IsUndefined() || s.IsNull()) {
		err = errors.New("no localStorage")
	}
	return s, err
}

func (host) Store(key, value string) error {
	s, err := storage()
	if err != nil {
		return err
	}
	return catch(func() { s.Call("setItem", key, value) })
}

func (host) Recall(key string) (value string, ok bool, err error) {
	s, err := storage()
	if err != nil {
		return "", false, err
	}
	err = catch(func() {
		v := s.Call("getItem", key)
		if v.Type() == js.TypeString {
			value, ok = v.String(), true
		}
	})
	return value, ok, err
}

func (host) PageURL() string {
	href := js.Global().Get("location").Get("href").String()
	base, _, _ := strings.Cut(href, "#")
	return base
}

func fragment() string {
	return js.Global().Get("location").Get("hash").String()
}

// SetFragment replaces the fragment in the address bar without a reload
// or a history entry. Where the browser refuses (an opaque origin), the
// address stays as it is.
func (h host) SetFragment(frag string) {
	url := h.PageURL()
	if frag != "" {
		url += "#" + strings.TrimPrefix(frag, "#")
	}
	_ = catch(func() { js.Global().Get("history").Call("replaceState", js.Null(), "", url) })
}

// ReadFile reads the file chosen in a file input. Nothing happens when no
// file was chosen (the dialogue was cancelled).
func (host) ReadFile(inputID string, done func(name string, data []byte, err error)) {
	var file js.Value
	var input js.Value
	err := catch(func() {
		input = js.Global().Get("document").Call("getElementById", inputID)
		if input.IsNull() {
			panic(fmt.Errorf("no file input #%s", inputID))
		}
		files := input.Get("files")
		if files.IsNull() || files.Get("length").Int() == 0 {
			return
		}
		file = files.Call("item", 0)
	})
	if err != nil {
		done("", nil, err)
		return
	}
	if file.IsUndefined() {
		return
	}
	name := file.Get("name").String()
	if size := file.Get("size").Float(); size > solver.MaxFileBytes {
		input.Set("value", "")
		done(name, nil, fmt.Errorf("the file has %.0f bytes; a project file has at most %d", size, solver.MaxFileBytes))
		return
	}
	var ok, fail js.Func
	release := func() { ok.Release(); fail.Release(); input.Set("value", "") }
	ok = js.FuncOf(func(_ js.Value, args []js.Value) any {
		arr := js.Global().Get("Uint8Array").New(args[0])
		data := make([]byte, arr.Get("length").Int())
		js.CopyBytesToGo(data, arr)
		release()
		done(name, data, nil)
		return nil
	})
	fail = js.FuncOf(func(_ js.Value, args []js.Value) any {
		msg := "the browser could not read it"
		if len(args) > 0 {
			msg = args[0].Call("toString").String()
		}
		release()
		done(name, nil, errors.New(msg))
		return nil
	})
	if err := catch(func() { file.Call("arrayBuffer").Call("then", ok, fail) }); err != nil {
		release()
		done(name, nil, err)
	}
}

var ignore = js.FuncOf(func(js.Value, []js.Value) any { return nil })

// CopyText selects the input's text and asks for the clipboard; browsers
// that refuse leave the selection for the user to copy.
func (host) CopyText(inputID string) error {
	return catch(func() {
		el := js.Global().Get("document").Call("getElementById", inputID)
		el.Call("focus")
		el.Call("select")
		// The old command first: it works in a sandboxed frame, where the
		// clipboard API is refused unless the frame allows clipboard-write.
		copied := false
		if err := catch(func() { copied = js.Global().Get("document").Call("execCommand", "copy").Truthy() }); err == nil && copied {
			return
		}
		clip := js.Global().Get("navigator").Get("clipboard")
		if clip.IsUndefined() || clip.IsNull() {
			panic(errors.New("no clipboard"))
		}
		clip.Call("writeText", el.Get("value")).Call("catch", ignore)
	})
}

// Frame reports whether the page is in a frame, and whether the frame is
// sandboxed with an opaque origin: the origin is then "null" although the
// page was not opened from a file (file:// pages have a "null" origin too,
// so the address tells them apart). A frame sandboxed with
// allow-same-origin but without allow-downloads cannot be told from a
// plain frame; Root treats both as frames where a download may fail.
func (host) Frame() (framed, sandboxed bool) {
	_ = catch(func() {
		g := js.Global()
		framed = !g.Get("self").Equal(g.Get("top"))
		if framed {
			origin := g.Get("origin")
			proto := g.Get("location").Get("protocol").String()
			sandboxed = origin.Type() == js.TypeString && origin.String() == "null" && proto != "file:"
		}
	})
	return framed, sandboxed
}

// Fill sets the value of the text box with this id after the next render
// (which makes the box).
func (host) Fill(id, text string) {
	var f js.Func
	f = js.FuncOf(func(js.Value, []js.Value) any {
		f.Release()
		_ = catch(func() {
			if el := js.Global().Get("document").Call("getElementById", id); el.Truthy() {
				el.Set("value", text)
			}
		})
		return nil
	})
	js.Global().Call("setTimeout", f, 30)
}

// Focus focuses the element with this id after the next render (the
// element may be in a section that opens with it), and scrolls it into
// view.
func (host) Focus(id string) {
	var f js.Func
	f = js.FuncOf(func(js.Value, []js.Value) any {
		f.Release()
		_ = catch(func() {
			el := js.Global().Get("document").Call("getElementById", id)
			if el.Truthy() {
				el.Call("focus")
				el.Call("scrollIntoView", map[string]any{"block": "center"})
			}
		})
		return nil
	})
	js.Global().Call("setTimeout", f, 30)
}

func (host) Print() { _ = catch(func() { js.Global().Call("print") }) }

// InView asks the page shell (porelightInView in static/shell/boot.js)
// whether the element with this id is in view; ui.Screen.
func (host) InView(id string) bool {
	in := true // when in doubt, draw it
	_ = catch(func() {
		if f := js.Global().Get("porelightInView"); f.Type() == js.TypeFunction {
			in = f.Invoke(id).Truthy()
		}
	})
	return in
}

// AfterPaint calls f from a zero-delay timeout set by an animation frame
// callback: the frame is painted between the two; ui.Screen.
func (host) AfterPaint(f func()) {
	var frame, after js.Func
	after = js.FuncOf(func(js.Value, []js.Value) any {
		after.Release()
		f()
		return nil
	})
	frame = js.FuncOf(func(js.Value, []js.Value) any {
		frame.Release()
		js.Global().Call("setTimeout", after, 0)
		return nil
	})
	js.Global().Call("requestAnimationFrame", frame)
}

// Solve runs the solve in the page's worker pool (globalThis.porelightWorkers,
// kept by the boot script; see ui.Solver). Answers come through JavaScript
// callbacks, which only hand them to channels: the solve goroutine waits
// here, the browser's event loop never does.
func (h host) Solve(ctx context.Context, project []byte, progress func(float64)) ([]byte, error) {
	return h.call(ctx, "solve-binary", project, progress)
}

// Batch runs a batch of Monte Carlo realisations (the JSON of an
// uncertain.Batch) in the pool, which spreads batches over one worker
// per core (see ui.Batcher).
func (h host) Batch(ctx context.Context, batch []byte, progress func(float64)) ([]byte, error) {
	return h.call(ctx, "vary-batch", batch, progress)
}

// SolveWide is Solve for the comparison of options: the pool spreads
// these over one worker per core, like the Monte Carlo's batches (see
// ui.WideSolver).
func (h host) SolveWide(ctx context.Context, project []byte, progress func(float64)) ([]byte, error) {
	return h.call(ctx, "vary-solve", project, progress)
}

// call runs op on payload in the pool and waits for the answer.
func (host) call(ctx context.Context, op string, payload []byte, progress func(float64)) ([]byte, error) {
	pool := js.Global().Get("porelightWorkers")
	if pool.Type() != js.TypeObject {
		return nil, ui.ErrNoWorker
	}
	type answer struct {
		data     []byte
		noWorker string
	}
	done := make(chan answer, 1)
	fractions := make(chan float64, 1)
	onProgress := js.FuncOf(func(_ js.Value, args []js.Value) any {
		if len(args) == 0 || args[0].Type() != js.TypeNumber {
			return nil
		}
		f := args[0].Float()
		select { // keep only the newest
		case <-fractions:
		default:
		}
		select {
		case fractions <- f:
		default:
		}
		return nil
	})
	onDone := js.FuncOf(func(_ js.Value, args []js.Value) any {
		var a answer
		switch {
		case len(args) > 1 && args[1].Truthy():
			a.noWorker = args[1].String()
		case len(args) > 0 && args[0].InstanceOf(js.Global().Get("Uint8Array")):
			a.data = make([]byte, args[0].Get("length").Int())
			js.CopyBytesToGo(a.data, args[0])
		default:
			a.noWorker = "the worker pool gave no answer"
		}
		select {
		case done <- a:
		default:
		}
		return nil
	})
	// The pool calls neither function after it has answered or the
	// solve was cancelled, so releasing them on return is safe.
	defer onProgress.Release()
	defer onDone.Release()
	var cancel js.Value
	if err := catch(func() { cancel = pool.Call("call", op, toJS(payload), onProgress, onDone) }); err != nil {
		return nil, fmt.Errorf("%w: %v", ui.ErrNoWorker, err)
	}
	for {
		select {
		case f := <-fractions:
			if progress != nil {
				progress(f)
			}
		case a := <-done:
			if a.noWorker != "" {
				return nil, fmt.Errorf("%w: %s", ui.ErrNoWorker, a.noWorker)
			}
			return a.data, nil
		case <-ctx.Done():
			if cancel.Type() == js.TypeFunction {
				_ = catch(func() { cancel.Invoke() })
			}
			return nil, ctx.Err()
		}
	}
}

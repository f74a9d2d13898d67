//go:build js && wasm

package main

import (
	"reflect"
	"syscall/js"
	"unsafe"

	"github.com/vugu/vugu/domrender"
)

// Renders are coalesced. vugu renders once per DOM event, inside the
// event: a paste that the browser delivers as many input events (one per
// line and line break when text is inserted programmatically: 1,000 for
// 500 readings), or keys typed during a render, each cost a whole render.
// The render loop instead lets the browser finish what is queued
// (settle), forgets the render requests that piled up meanwhile
// (drain), and renders once for all of them.

// settle returns once the browser has run the tasks queued now: a
// zero-delay timeout fires after them. While it waits every goroutine
// is blocked, so the event that woke the render loop returns to the
// browser at once.
func settle() {
	done := make(chan struct{})
	var f js.Func
	f = js.FuncOf(func(js.Value, []js.Value) any {
		f.Release()
		close(done)
		return nil
	})
	js.Global().Call("setTimeout", f, 0)
	<-done
}

// drainer returns a function that empties the renderer's queue of render
// requests without blocking, and reports whether the loop should go on
// (false once the renderer asked it to stop). vugu v0.4.0 keeps the queue
// in an unexported channel; when a vugu upgrade moves it, drainer returns
// nil and every request renders, as before.
func drainer(r *domrender.JSRenderer) func() bool {
	v := reflect.ValueOf(r).Elem()
	f := v.FieldByName("eventWaitCh")
	if !f.IsValid() || f.Type() != reflect.TypeFor[chan bool]() {
		return nil
	}
	ch := *(*chan bool)(unsafe.Pointer(f.UnsafeAddr()))
	return func() bool {
		for {
			select {
			case ok := <-ch:
				if !ok {
					return false
				}
			default:
				return true
			}
		}
	}
}

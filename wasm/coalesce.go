//go:build js && wasm

package main

import (
	"reflect"
	"syscall/js"
	"time"
	"unsafe"

	"github.com/vugu/vugu/domrender"
)

// Renders are coalesced. vugu renders once per DOM event, inside the
// event: a paste that the browser delivers as many input events (one per
// line and line break when text is inserted programmatically: 1,000 for
// 500 readings), or keys typed during a render, each cost a whole render.
// A request that comes soon after a render may be one of such a burst:
// the render loop then lets the browser finish what is queued (settle),
// forgets the render requests that piled up meanwhile (drain), and
// renders once for all of them. A request that finds the page idle (a
// keystroke as people type, a solve's answer) is rendered at once, in
// the task that asked: settling would hand the browser a frame to paint
// without the render (after a key the browser paints the field's new
// text first), and the render's own frame would be the next one.

// burstGap is how soon after a render a request counts as part of a
// burst: one frame at 60 Hz.
const burstGap = 16 * time.Millisecond

// coalescer remembers when the last render ended.
type coalescer struct{ last time.Time }

// wait settles before a render that may be part of a burst.
func (c *coalescer) wait() {
	if time.Since(c.last) < burstGap {
		settle()
	}
}

// rendered notes the end of a render.
func (c *coalescer) rendered() { c.last = time.Now() }

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

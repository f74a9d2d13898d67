package ui

import (
	"fmt"
	"runtime/debug"

	"porelight/solver"
)

// fixInputsFirst is what a helper says when asked to run on inputs with
// problems.
const fixInputsFirst = "Some inputs need attention: fix them first."

// inBackground runs work like a solve: in a goroutine (at once, inside
// the handler, when there is no Env), with options whose Progress yields
// to the browser about every 40 ms, reports the fraction done through
// setProgress (under the render lock) and stops the work once current
// says a newer run or a Cancel took over. done gets work's error with the
// render lock held. A panic in work becomes an error naming what was
// running: one escaping would stop the whole page.
func (c *Root) inBackground(what string, current func() bool, setProgress func(float64), work func(*solver.Options) error, done func(error)) {
	run := func() (err error) {
		defer func() {
			if r := recover(); r != nil {
				err = fmt.Errorf("internal error in %s: %v\n%s", what, r, debug.Stack())
			}
		}()
		return work(c.reporting(setProgress, current))
	}
	if c.Env == nil {
		done(run())
		return
	}
	go func() {
		err := run()
		c.Env.Lock()
		done(err)
		c.Env.UnlockRender()
	}()
}

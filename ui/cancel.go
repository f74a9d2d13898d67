package ui

// A long solve can be stopped from the summary: the results shown stay
// those of the last finished solve, and the next edit solves again.

// cancelable is the summary's Cancel action while a solve is far enough
// along to report progress (so quick solves never flash a button), else
// nil.
func (c *Root) cancelable() func() {
	if c.busy && c.progress > 0 {
		return c.cancel
	}
	return nil
}

// cancel stops the solve under way. Its Progress callback sees the newer
// generation and stops the solver, and finish then drops it.
func (c *Root) cancel() {
	if !c.busy {
		return
	}
	c.gen.Add(1)
	c.busy, c.progress, c.canceled = false, 0, true
}

// canceledStatus is the status line after a cancel.
func (c *Root) canceledStatus() Status {
	if c.result == nil {
		return Status{"stale", "The solve was cancelled, so there are no results; change a value to solve again."}
	}
	return Status{"stale", "The solve was cancelled; the results shown are for earlier inputs. Change a value to solve again."}
}

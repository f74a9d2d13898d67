package ui

import (
	"encoding/json"
	"strings"
	"time"
)

// The undo history. Every edit of the project (typing, adding, removing
// and moving rows, opening a file, the demo, a new project) is a step; a
// run of keystrokes in one input is one step, ended by a pause, by another
// input or by any other edit. The states are kept as the JSON the
// autosave writes (form.Form.EncodeState), so a step costs one encoding,
// made anyway for the autosave, and the history is stored beside it.

// HistoryKey is the browser storage key of the undo history kept with
// the autosave.
const HistoryKey = "porelight.history"

// HistorySteps is the number of steps that can be undone.
const HistorySteps = 100

// historyBytes bounds the stored history; the oldest steps are dropped
// from storage (not from the page) beyond it, as browsers give a page
// about 5 MB of storage (counted in UTF-16 by some), and the draft
// must always fit beside it.
const historyBytes = 1 << 20

// typingPause ends a run of keystrokes in one input: typing again after
// it starts a new step.
const typingPause = 2 * time.Second

// history holds the states before the current one (undo, oldest first)
// and those undone after it (redo, the next one last).
type history struct {
	undo, redo []string
	cur        string    // the state shown
	typing     string    // the input of the run of keystrokes that made cur, or ""
	at         time.Time // the last keystroke of that run
}

// reset makes s the current state, keeping the steps before it.
func (h *history) reset(s string) { h.cur, h.typing = s, "" }

// record takes the state s after an edit. typed is the one input typed
// into by the edit ("" for any other edit). It reports whether a step
// was added (false: nothing changed, or a keystroke joined its run).
func (h *history) record(s, typed string, now time.Time) bool {
	if s == h.cur {
		return false
	}
	if typed != "" && typed == h.typing && now.Sub(h.at) < typingPause {
		h.cur, h.at = s, now
		return false
	}
	if h.cur != "" {
		h.undo = append(h.undo, h.cur)
		if n := len(h.undo) - HistorySteps; n > 0 {
			h.undo = append(h.undo[:0:0], h.undo[n:]...)
		}
	}
	h.redo = nil
	h.cur, h.typing, h.at = s, typed, now
	return true
}

func (h *history) canUndo() bool { return len(h.undo) > 0 }
func (h *history) canRedo() bool { return len(h.redo) > 0 }

// back steps to the state before the current one and returns it (ok
// false when there is none).
func (h *history) back() (string, bool) {
	if len(h.undo) == 0 {
		return "", false
	}
	h.redo = append(h.redo, h.cur)
	h.cur = h.undo[len(h.undo)-1]
	h.undo = h.undo[:len(h.undo)-1]
	h.typing = ""
	return h.cur, true
}

// forward steps to the state last undone and returns it.
func (h *history) forward() (string, bool) {
	if len(h.redo) == 0 {
		return "", false
	}
	h.undo = append(h.undo, h.cur)
	h.cur = h.redo[len(h.redo)-1]
	h.redo = h.redo[:len(h.redo)-1]
	h.typing = ""
	return h.cur, true
}

// storedHistory is the layout of the stored history: the states as JSON
// values (each a draft as the autosave writes it), and the current one,
// so that a history left from another autosave is not joined to this one.
type storedHistory struct {
	Undo []json.RawMessage `json:"undo"`
	Redo []json.RawMessage `json:"redo"`
	Cur  json.RawMessage   `json:"cur"`
}

// encode writes the history for storage, without its oldest steps when
// it would pass historyBytes. The states are already JSON: they are
// joined, not encoded again.
func (h *history) encode() string {
	undo := h.undo
	size := func() int {
		n := len(h.cur)
		for _, s := range undo {
			n += len(s) + 1
		}
		for _, s := range h.redo {
			n += len(s) + 1
		}
		return n
	}
	for len(undo) > 0 && size() > historyBytes {
		undo = undo[1:]
	}
	var b strings.Builder
	b.WriteString(`{"undo":[`)
	b.WriteString(strings.Join(undo, ","))
	b.WriteString(`],"redo":[`)
	if size() <= historyBytes {
		b.WriteString(strings.Join(h.redo, ","))
	}
	b.WriteString(`],"cur":`)
	b.WriteString(h.cur)
	b.WriteString("}")
	return b.String()
}

// decode reads a stored history kept with the autosave cur and takes its
// steps. A history stored at the start of a run of keystrokes holds the
// state before the run as its current one: that state becomes the last
// step to undo (and the steps to redo, which followed it, are dropped).
// It reports whether there was a history to read.
func (h *history) decode(data, cur string) bool {
	var st storedHistory
	if data == "" || cur == "" || json.Unmarshal([]byte(data), &st) != nil {
		return false
	}
	h.undo, h.redo = nil, nil
	for _, s := range st.Undo {
		h.undo = append(h.undo, string(s))
	}
	if len(st.Cur) > 0 && !sameJSON(st.Cur, cur) {
		h.undo = append(h.undo, string(st.Cur))
	} else {
		for _, s := range st.Redo {
			h.redo = append(h.redo, string(s))
		}
	}
	if n := len(h.undo) - HistorySteps; n > 0 {
		h.undo = h.undo[n:]
	}
	h.cur, h.typing = cur, ""
	return true
}

// sameJSON compares two JSON texts as values (decoding tidies the white
// space a browser's storage might not keep).
func sameJSON(a json.RawMessage, b string) bool {
	if string(a) == b {
		return true
	}
	var x, y any
	if json.Unmarshal(a, &x) != nil || json.Unmarshal([]byte(b), &y) != nil {
		return false
	}
	xa, _ := json.Marshal(x)
	ya, _ := json.Marshal(y)
	return string(xa) == string(ya)
}

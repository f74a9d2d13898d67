package ui

import "errors"

// Host is what the page around the components provides: the browser's
// storage, downloads, files and the time slices of a long solve. wasm/
// implements it with syscall/js; tests pass a fake. The UI never calls a
// Host method while holding up the browser for a reply: methods return
// at once, and ReadFile answers later through its callback.
type Host interface {
	// Yield lets the browser paint and handle input for a moment. It is
	// called from the solve goroutine, never from an event handler.
	Yield()
	// Download offers data to the user as a file.
	Download(name, mime string, data []byte) error
	// Store keeps text under key in the browser's storage; Recall reads
	// it back (ok false when there is none). Both fail where storage is
	// not allowed, e.g. in a sandboxed frame.
	Store(key, value string) error
	Recall(key string) (value string, ok bool, err error)
	// PageURL is the address of the page without its fragment.
	PageURL() string
	// SetFragment replaces the URL fragment without reloading ("" clears it).
	SetFragment(frag string)
	// ReadFile reads the file chosen in the file input with this id and
	// then calls done, from a browser callback: done must not block.
	ReadFile(inputID string, done func(name string, data []byte, err error))
	// CopyText selects the text of the input with this id and copies it
	// to the clipboard where the browser allows.
	CopyText(inputID string) error
	// Print opens the browser's print dialogue.
	Print()
}

// nopHost stands in when no Host is set (native tests, static renders).
type nopHost struct{}

func (nopHost) Yield()                                {}
func (nopHost) Download(string, string, []byte) error { return errNoHost }
func (nopHost) Store(string, string) error            { return errNoHost }
func (nopHost) Recall(string) (string, bool, error)   { return "", false, nil }
func (nopHost) PageURL() string                       { return "porelight.html" }
func (nopHost) SetFragment(string)                    {}
func (nopHost) CopyText(string) error                 { return errNoHost }
func (nopHost) Print()                                {}
func (nopHost) ReadFile(_ string, done func(string, []byte, error)) {
	done("", nil, errNoHost)
}

var errNoHost = errors.New("not available outside the browser")

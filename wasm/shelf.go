//go:build js && wasm

package main

import (
	"syscall/js"

	"porelight/ui"
)

// The shelf of recent projects (ui.Shelf) in IndexedDB: database
// "porelight", object store "shelf" keyed by "key". Where the browser
// refuses IndexedDB (a sandboxed frame, private modes of some browsers)
// nothing is kept and the list stays empty.

const (
	shelfDB    = "porelight"
	shelfStore = "shelf"
)

// withShelf opens the database and hands use the store in a transaction
// of mode ("readonly", "readwrite"); use is not called when the database
// cannot be opened.
func withShelf(mode string, use func(store js.Value)) {
	var req js.Value
	err := catch(func() {
		idb := js.Global().Get("Reflect").Call("get", js.Global(), "indexedDB")
		if idb.IsUndefined() || idb.IsNull() {
			panic("no IndexedDB")
		}
		req = idb.Call("open", shelfDB, 1)
	})
	if err != nil {
		return
	}
	var up, ok, fail js.Func
	release := func() { up.Release(); ok.Release(); fail.Release() }
	up = js.FuncOf(func(js.Value, []js.Value) any {
		_ = catch(func() {
			req.Get("result").Call("createObjectStore", shelfStore, map[string]any{"keyPath": "key"})
		})
		return nil
	})
	ok = js.FuncOf(func(js.Value, []js.Value) any {
		release()
		_ = catch(func() {
			db := req.Get("result")
			use(db.Call("transaction", shelfStore, mode).Call("objectStore", shelfStore))
			db.Call("close") // closes once the transaction is done
		})
		return nil
	})
	fail = js.FuncOf(func(js.Value, []js.Value) any { release(); return nil })
	_ = catch(func() {
		req.Set("onupgradeneeded", up)
		req.Set("onsuccess", ok)
		req.Set("onerror", fail)
	})
}

func (host) ShelfPut(e ui.ShelfEntry) {
	withShelf("readwrite", func(st js.Value) {
		st.Call("put", map[string]any{"key": e.Key, "title": e.Title, "saved": e.Saved, "state": e.State})
	})
}

func (host) ShelfDelete(key string) {
	withShelf("readwrite", func(st js.Value) { st.Call("delete", key) })
}

func (host) ShelfList(done func([]ui.ShelfEntry)) {
	withShelf("readonly", func(st js.Value) {
		r := st.Call("getAll")
		var f js.Func
		f = js.FuncOf(func(js.Value, []js.Value) any {
			f.Release()
			var es []ui.ShelfEntry
			_ = catch(func() {
				all := r.Get("result")
				for i := range all.Length() {
					v := all.Index(i)
					str := func(k string) string {
						if x := v.Get(k); x.Type() == js.TypeString {
							return x.String()
						}
						return ""
					}
					es = append(es, ui.ShelfEntry{Key: str("key"), Title: str("title"), Saved: str("saved"), State: str("state")})
				}
			})
			done(es)
			return nil
		})
		r.Set("onsuccess", f)
	})
}

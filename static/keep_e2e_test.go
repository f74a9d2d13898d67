//go:build !(js && wasm)

package static_test

// Browser tests of "nothing lost": undo of each destructive action (the
// buttons and the keys), the draft kept across a reload with its invalid
// text, Save with problems, the problem list's links, the read-only view,
// and Save in a sandboxed frame that blocks downloads.

import (
	"context"
	"encoding/json"
	"fmt"
	"net/http"
	"net/http/httptest"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	cdpbrowser "github.com/chromedp/cdproto/browser"
	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

// draftJS reads the autosaved draft's project.
const draftJS = `JSON.parse(localStorage.getItem("porelight.autosave")).project`

// click clicks the element id as a user would see it: it waits until the
// element is enabled and on top at its centre (the page draws a change in
// a task of its own), then sends the click to the element itself. A
// mouse event at coordinates (chromedp.Click) can miss when a solve
// finishing meanwhile re-lays the page out.
func click(t *testing.T, ctx context.Context, id string) {
	t.Helper()
	poll[bool](t, ctx, fmt.Sprintf(`(() => {
		const el = document.getElementById(%q);
		if (!el || el.disabled) return false;
		el.scrollIntoView({block: "center", inline: "nearest"});
		const r = el.getBoundingClientRect();
		if (r.width === 0 || r.height === 0) return false;
		const top = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
		if (!top || !(top === el || el.contains(top))) return false;
		el.focus();
		el.click();
		return true;
	})()`, id), 20*time.Second)
}

// key presses a key with Ctrl (and Shift) on the page, outside any input.
func key(t *testing.T, ctx context.Context, k string, shift bool) {
	t.Helper()
	mods := []chromedp.Modifier{chromedp.ModifierCtrl}
	if shift {
		mods = append(mods, chromedp.ModifierShift)
	}
	eval[chromedp.Void](t, ctx, `document.activeElement && document.activeElement.blur()`)
	within(t, ctx, 10*time.Second, chromedp.KeyEvent(k, chromedp.KeyModifiers(mods...)))
}

// allowDownloads makes the browser save downloads into a new directory,
// which it returns.
func allowDownloads(t *testing.T, ctx context.Context) string {
	t.Helper()
	dir := t.TempDir()
	within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, cdpbrowser.SetDownloadBehavior, cdpbrowser.SetDownloadBehaviorParams{
			Behavior: cdpbrowser.SetDownloadBehaviorBehaviorAllow, DownloadPath: dir})
		return err
	}))
	return dir
}

// downloaded waits for a complete JSON file matching pattern in dir and
// returns it.
func downloaded(t *testing.T, dir, pattern string) []byte {
	t.Helper()
	for deadline := time.Now().Add(15 * time.Second); ; time.Sleep(200 * time.Millisecond) {
		matches, _ := filepath.Glob(filepath.Join(dir, pattern))
		if len(matches) > 0 {
			if data, err := os.ReadFile(matches[0]); err == nil && json.Valid(data) {
				return data
			}
		}
		if time.Now().After(deadline) {
			t.Fatalf("no %s file was downloaded", pattern)
		}
	}
}

func TestE2EKeep(t *testing.T) {
	pageURL, _ := builtPage(t)
	rec := &recorder{}
	ctx := browser(t, rec)
	shots := t.TempDir()
	if d := os.Getenv("SHOTS"); d != "" {
		shots = d
	}
	downloads := allowDownloads(t, ctx)
	open(t, ctx, pageURL)

	t.Run("undo each destructive action", func(t *testing.T) {
		typeInto(t, ctx, "layers-0-name", " (edited)")
		poll[bool](t, ctx, draftJS+`.layers[0].name.endsWith("(edited)")`, 10*time.Second)
		count := func(js string) int { return eval[int](t, ctx, js) }
		tests := []struct {
			name, measure string
			do            func()
			undoKey       bool
		}{
			{"remove layer 2", draftJS + `.layers.length`, func() { click(t, ctx, "layers-1-remove") }, false},
			{"remove stage 1", draftJS + `.loads.length`, func() { click(t, ctx, "loads-0-remove") }, true},
			{"remove plate 1 and its readings", draftJS + `.monitoring.plates.reduce((n, p) => n + p.readings.length, 0)`, func() {
				if eval[bool](t, ctx, `!document.getElementById("monitoring-plates-0-remove")`) {
					click(t, ctx, "records-toggle")
					poll[bool](t, ctx, `!!document.getElementById("monitoring-plates-0-remove")`, 10*time.Second)
				}
				click(t, ctx, "monitoring-plates-0-remove")
			}, false},
			{"Demo over edits", draftJS + `.layers[0].name.length`, func() {
				click(t, ctx, "open-demo")
				poll[bool](t, ctx, `!!document.getElementById("confirm-replace")`, 10*time.Second)
				click(t, ctx, "confirm-replace")
			}, true},
			{"New project over edits", draftJS + `.layers.length`, func() {
				click(t, ctx, "new-project")
				poll[bool](t, ctx, `!!document.getElementById("confirm-replace")`, 10*time.Second)
				click(t, ctx, "confirm-replace")
			}, false},
		}
		for _, tt := range tests {
			before := count(tt.measure)
			tt.do()
			poll[bool](t, ctx, fmt.Sprintf(`%s !== %d`, tt.measure, before), 10*time.Second)
			if tt.undoKey {
				key(t, ctx, "z", false)
			} else {
				click(t, ctx, "undo")
			}
			poll[bool](t, ctx, fmt.Sprintf(`%s === %d`, tt.measure, before), 10*time.Second)
			if !eval[bool](t, ctx, draftJS+`.layers[0].name.endsWith("(edited)")`) {
				t.Errorf("%s: after Undo the edit before it is gone", tt.name)
			}
			// Redo does it again, and Undo once more brings it back.
			key(t, ctx, "z", true)
			poll[bool](t, ctx, fmt.Sprintf(`%s !== %d`, tt.measure, before), 10*time.Second)
			click(t, ctx, "undo")
			poll[bool](t, ctx, fmt.Sprintf(`%s === %d`, tt.measure, before), 10*time.Second)
		}
		if got := eval[string](t, ctx, `document.getElementById("undo").textContent + "/" + document.getElementById("redo").textContent`); got != "Undo/Redo" {
			t.Errorf("buttons named %q", got)
		}
		screenshot(t, ctx, shots, "keep-1-undo.png")
	})

	t.Run("undo and redo keys back to back", func(t *testing.T) {
		// Ctrl+Z then at once Ctrl+Shift+Z, both before the page draws
		// the undo: Redo is still disabled when the second key comes, and
		// the key must not be dropped for it.
		layers := draftJS + `.layers.length`
		before := eval[int](t, ctx, layers)
		click(t, ctx, "layers-1-remove")
		poll[bool](t, ctx, fmt.Sprintf(`%s === %d`, layers, before-1), 10*time.Second)
		// Both keys in one task, as a quick hand can do between two
		// renders (the browser's own key events each wait their turn).
		eval[chromedp.Void](t, ctx, `(() => {
			document.activeElement && document.activeElement.blur();
			const press = shiftKey => document.dispatchEvent(new KeyboardEvent("keydown", {key: "z", ctrlKey: true, shiftKey, bubbles: true, cancelable: true}));
			press(false);
			press(true);
		})()`)
		// The undo ran within the script; the redo must follow.
		got := eval[int](t, ctx, layers)
		for end := time.Now().Add(5 * time.Second); got != before-1 && time.Now().Before(end); got = eval[int](t, ctx, layers) {
			time.Sleep(20 * time.Millisecond)
		}
		if got != before-1 {
			t.Errorf("after Ctrl+Z and Ctrl+Shift+Z: %d layers, want %d (the redo was dropped)", got, before-1)
		}
		click(t, ctx, "undo")
		poll[bool](t, ctx, fmt.Sprintf(`%s === %d`, layers, before), 10*time.Second)
	})

	t.Run("draft kept across reload", func(t *testing.T) {
		typeInto(t, ctx, "layers-2-mv", "5e-5x")
		poll[bool](t, ctx, `localStorage.getItem("porelight.autosave").includes('"layers[2].mv":"5e-5x"')`, 10*time.Second)
		open(t, ctx, pageURL)
		if got := value(t, ctx, "layers-2-mv"); got != "5e-5x" {
			t.Fatalf("after reload layer 3 mv shows %q, want the text typed", got)
		}
		if got := eval[string](t, ctx, `document.getElementById("layers-2-mv-err")?.textContent ?? ""`); got != "not a number" {
			t.Errorf("after reload the problem reads %q", got)
		}
		// The history came back with the draft.
		click(t, ctx, "undo")
		poll[bool](t, ctx, `document.getElementById("layers-2-mv").value !== "5e-5x"`, 10*time.Second)
		click(t, ctx, "redo")
		poll[bool](t, ctx, `document.getElementById("layers-2-mv").value === "5e-5x"`, 10*time.Second)
	})

	t.Run("problem list and save with problems", func(t *testing.T) {
		// Layer 3 mv is still "5e-5x"; a negative thickness of layer 4
		// also puts a piezometer below the base: an echo, not counted.
		typeInto(t, ctx, "layers-3-thickness", "-2")
		poll[bool](t, ctx, `document.getElementById("problem-head")?.textContent.startsWith("2 inputs")`, 10*time.Second)
		items := eval[[]string](t, ctx, `[...document.querySelectorAll("#problem-list li")].map(e => e.textContent)`)
		if len(items) != 2 || !strings.HasPrefix(items[0], "Layer 3, mv:") || !strings.HasPrefix(items[1], "Layer 4, thickness:") {
			t.Errorf("problem list %q", items)
		}
		if s := eval[string](t, ctx, `document.getElementById("status-text").textContent`); !strings.Contains(s, "2 inputs need attention") {
			t.Errorf("status %q", s)
		}
		within(t, ctx, 10*time.Second, chromedp.Click(chromedp.CSS(`#problem-list button[data-path="layers[3].thickness"]`)))
		poll[bool](t, ctx, `document.activeElement && document.activeElement.id === "layers-3-thickness"`, 5*time.Second)

		click(t, ctx, "save-project")
		data := downloaded(t, downloads, "*-draft.json")
		var d struct {
			Format, Note string
			Problems     []struct{ Path, Message string }
		}
		if err := json.Unmarshal(data, &d); err != nil {
			t.Fatal(err)
		}
		if d.Format != "porelight-draft/1" || !strings.Contains(d.Note, "2 problems") || len(d.Problems) != 2 {
			t.Errorf("draft file: format %q, note %q, %d problems", d.Format, d.Note, len(d.Problems))
		}
		// Reopened (after New project), it shows the problems again.
		click(t, ctx, "new-project")
		if eval[bool](t, ctx, `!!document.getElementById("confirm-replace")`) {
			click(t, ctx, "confirm-replace")
		}
		poll[bool](t, ctx, `!document.getElementById("problem-list")`, 10*time.Second)
		path := filepath.Join(downloads, "reopen.json")
		if err := os.WriteFile(path, data, 0o644); err != nil {
			t.Fatal(err)
		}
		within(t, ctx, 20*time.Second, chromedp.SetUploadFiles(chromedp.ID("open-file"), []string{path}))
		poll[bool](t, ctx, `document.getElementById("layers-2-mv")?.value === "5e-5x" && document.getElementById("problem-head")?.textContent.startsWith("2 inputs")`, 10*time.Second)
		screenshot(t, ctx, shots, "keep-2-problems.png")
		// The panel keeps within the page at a laptop's and a phone's width.
		for _, w := range []int64{1024, 400} {
			within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
				_, err := cdp.Call(ctx, tg, emulation.SetDeviceMetricsOverride, emulation.SetDeviceMetricsOverrideParams{Width: w, Height: 800, DeviceScaleFactor: 1})
				return err
			}))
			time.Sleep(300 * time.Millisecond)
			js := `(() => { const s = document.getElementById("keep").getBoundingClientRect();
				let m = 0; for (const e of document.querySelectorAll("#keep *, .pl-undo *")) { m = Math.max(m, e.getBoundingClientRect().right - Math.min(s.right, innerWidth)); }
				return Math.round(m); })()`
			if over := eval[int](t, ctx, js); over > 1 {
				t.Errorf("at %d px an element of the problem panel or the undo buttons sticks out %d px", w, over)
			}
			screenshot(t, ctx, shots, fmt.Sprintf("keep-2-problems-%d.png", w))
		}
		within(t, ctx, 10*time.Second, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := cdp.Call(ctx, tg, emulation.ClearDeviceMetricsOverride, cdp.Empty{})
			return err
		}))
		// Tidy up for what follows: undo back to a valid project.
		for range 10 {
			if eval[bool](t, ctx, `!document.getElementById("problem-list")`) {
				break
			}
			click(t, ctx, "undo")
			time.Sleep(100 * time.Millisecond)
		}
	})

	t.Run("sandboxed frame save", func(t *testing.T) {
		page, err := os.ReadFile(pagePath)
		if err != nil {
			t.Fatal(err)
		}
		// The frame is cross-origin (and in a process of its own): a
		// script served with the page answers the parent's questions
		// about it. It only reads and clicks elements.
		probe := `<script>if (self !== top) addEventListener("message", function (e) {
			var m = e.data || {}; if (!m.porelightTest) return;
			var el = document.getElementById(m.id), v = null;
			if (m.op === "click" && el) { el.click(); v = true; }
			if (m.op === "text" && el) { v = el.value !== undefined && el.tagName !== "BUTTON" ? el.value : el.textContent; }
			parent.postMessage({porelightAnswer: m.seq, value: v}, "*");
		});</script>`
		at := strings.Index(string(page), "<head>")
		if at < 0 {
			t.Fatal("the page has no <head>")
		}
		page = []byte(string(page[:at+len("<head>")]) + probe + string(page[at+len("<head>"):]))
		// Served over http, so that the sandboxed frame's "null" origin
		// is not that of a file.
		srv := httptest.NewServer(http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
			w.Header().Set("Content-Type", "text/html; charset=utf-8")
			if r.URL.Path == "/porelight.html" {
				_, _ = w.Write(page)
				return
			}
			fmt.Fprint(w, `<!doctype html><meta charset="utf-8"><title>wiki</title><body style="margin:0">`+
				`<iframe id="f" sandbox="allow-scripts" style="width:1200px;height:900px;border:0" src="/porelight.html"></iframe>`)
		}))
		defer srv.Close()
		ask := func(op, id string) string {
			t.Helper()
			return evalAwait[string](t, ctx, fmt.Sprintf(`new Promise(function (res) {
				var seq = Math.random();
				addEventListener("message", function h(e) { if (e.data && e.data.porelightAnswer === seq) { removeEventListener("message", h); res(String(e.data.value)); } });
				document.getElementById("f").contentWindow.postMessage({porelightTest: true, seq: seq, op: %q, id: %q}, "*");
				setTimeout(function () { res("(no answer)"); }, 3000);
			})`, op, id))
		}
		within(t, ctx, 60*time.Second, chromedp.Navigate(srv.URL+"/wiki.html"))
		deadline := time.Now().Add(45 * time.Second)
		for !strings.HasPrefix(ask("text", "status-text"), "Results are up to date") {
			if time.Now().After(deadline) {
				t.Fatalf("the framed page did not solve: status %q", ask("text", "status-text"))
			}
			time.Sleep(300 * time.Millisecond)
		}
		ask("click", "save-project")
		time.Sleep(500 * time.Millisecond)
		why := ask("text", "save-why")
		if !strings.Contains(why, "sandboxed frame") || !strings.Contains(why, "blocks downloads") {
			t.Errorf("Save in a sandboxed frame says %q", why)
		}
		if js := ask("text", "save-json"); !strings.Contains(js, `"format": "porelight/1"`) {
			t.Errorf("the box to copy holds %.80q", js)
		}
		if got := ask("click", "save-copy"); got != "true" {
			t.Errorf("no copy button in the box (%s)", got)
		}
		screenshot(t, ctx, shots, "keep-3-frame.png")
	})

	t.Run("shelf of recent projects", func(t *testing.T) {
		open(t, ctx, pageURL)
		typeInto(t, ctx, "title", "Shelf test, section A")
		typeInto(t, ctx, "layers-0-thickness", "2.25")
		poll[bool](t, ctx, draftJS+`.title === "Shelf test, section A"`, 10*time.Second)
		click(t, ctx, "new-project")
		poll[bool](t, ctx, `!!document.getElementById("confirm-replace")`, 10*time.Second)
		click(t, ctx, "confirm-replace")
		poll[bool](t, ctx, draftJS+`.layers.length === 1`, 10*time.Second)
		// The page writes the shelf without waiting; a reload before the
		// write is done (a loaded machine) would lose the race, not the
		// project: wait until IndexedDB holds it.
		poll[bool](t, ctx, `(() => {
			const r = indexedDB.open("porelight");
			r.onsuccess = () => { const db = r.result; try { const g = db.transaction("shelf").objectStore("shelf").get("shelf-test-section-a"); g.onsuccess = () => { window.__shelved = !!g.result; db.close(); }; } catch (e) { db.close(); } };
			return window.__shelved === true;
		})()`, 10*time.Second)
		// Listed after a reload, from IndexedDB; opening it brings it back.
		open(t, ctx, pageURL)
		poll[bool](t, ctx, `!!document.getElementById("shelf-toggle")`, 10*time.Second)
		click(t, ctx, "shelf-toggle")
		poll[bool](t, ctx, `!!document.querySelector('#shelf-list button[data-key="shelf-test-section-a"]')`, 20*time.Second)
		eval[chromedp.Void](t, ctx, `document.querySelector('#shelf-list button[data-key="shelf-test-section-a"]').click()`)
		poll[bool](t, ctx, `document.getElementById("layers-0-thickness").value === "2.25"`, 10*time.Second)
		screenshot(t, ctx, shots, "keep-5-shelf.png")
		click(t, ctx, "undo")
		poll[bool](t, ctx, draftJS+`.layers.length === 1`, 10*time.Second)
	})

	t.Run("view mode", func(t *testing.T) {
		open(t, ctx, pageURL+"?view")
		// Nothing in the link: the full page.
		if eval[bool](t, ctx, `!!document.getElementById("view-bar")`) {
			t.Error("?view without a project in the link shows the view")
		}
		click(t, ctx, "share-link")
		link := poll[string](t, ctx, `document.getElementById("share-url")?.value`, 10*time.Second)
		base, frag, _ := strings.Cut(link, "#")
		open(t, ctx, strings.TrimSuffix(base, "?view")+"#view&"+frag)
		if !eval[bool](t, ctx, `!!document.getElementById("view-bar") && !document.getElementById("layers-0-k") && !!document.getElementById("summary") && !document.getElementById("undo")`) {
			t.Fatal("the view shows editors, or lacks the bar or the summary")
		}
		screenshot(t, ctx, shots, "keep-4-view.png")
		click(t, ctx, "view-edit")
		poll[bool](t, ctx, `!!document.getElementById("layers-0-k") && !document.getElementById("view-bar")`, 10*time.Second)
	})
}

//go:build !(js && wasm)

package static_test

import (
	"encoding/hex"
	"encoding/json"
	"fmt"
	"hash/fnv"
	"math/rand"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"porelight/static"
)

// TestE2ECode122 checks the page's 7-bit text code in Chromium. "raw
// text" writes every character up to U+07FF into a <script> element's
// raw text and reads textContent back: the HTML standard's tokenizer
// (script data state) and input-stream preprocessing say that only NUL
// (to U+FFFD) and CR (to LF) change, and '<' is left out of the code
// because it can end the element; Unsafe7 must cover them. "decoder" runs
// from122, cut out of shell/boot.js as it stands, on texts that
// static.Encode122 wrote, and compares the bytes with the encoder's
// input; it logs the decoding time for 2 MB (a figure, not a goal).
func TestE2ECode122(t *testing.T) {
	if testing.Short() {
		t.Skip("browser tests are skipped in -short mode")
	}
	boot, err := os.ReadFile("shell/boot.js")
	if err != nil {
		t.Fatal(err)
	}
	src := string(boot)
	i := strings.Index(src, "function from122(")
	j := strings.Index(src, "\n\t} // from122")
	if i < 0 || j < i {
		t.Fatal(`shell/boot.js: no "function from122(" … "} // from122"`)
	}
	decoder := src[i:j] + "\n}"

	var raw strings.Builder
	for r := rune(0); r < 0x800; r++ {
		if r != '<' {
			raw.WriteRune(r)
		}
	}

	// The texts to decode: every byte value, runs of unsafe chunks (the
	// last one alone), random data (fixed seed) and 2 MB for the timing.
	type input struct {
		name string
		b    []byte
	}
	every := make([]byte, 256*3)
	for k := range every {
		every[k] = byte(k)
	}
	inputs := []input{{"empty", nil}, {"every byte value", every}}
	// 0x00 0x08 0x10 …: the 7-bit chunks are all 0 (NUL) or 10 (LF).
	inputs = append(inputs, input{"zeros", make([]byte, 13)}, input{"LF chunks", []byte{0x14, 0x28, 0x50, 0xa1, 0x42, 0x85, 0x0a}})
	rng := rand.New(rand.NewSource(7))
	for _, n := range []int{1, 2, 3, 6, 7, 8, 1000, 65537} {
		b := make([]byte, n)
		rng.Read(b)
		inputs = append(inputs, input{fmt.Sprintf("random %d bytes", n), b})
	}
	big := make([]byte, 2_000_000)
	rng.Read(big)
	inputs = append(inputs, input{"random 2 MB", big})

	var page strings.Builder
	page.WriteString(`<!doctype html><html><head><meta charset="utf-8"><title>code</title></head><body>` + "\n")
	page.WriteString(`<script id="raw" type="application/octet-stream">` + raw.String() + "</script>\n")
	for k, in := range inputs {
		fmt.Fprintf(&page, "<script id=\"d%d\" type=\"application/octet-stream\" data-bytes=\"%d\">\n%s\n</script>\n", k, len(in.b), static.Encode122(in.b))
	}
	page.WriteString("<script>\n" + decoder + `
function fnv(b) {
	var h = 0x811c9dc5;
	for (var i = 0; i < b.length; i++) {
		h = Math.imul(h ^ b[i], 16777619) >>> 0;
	}
	return h;
}
</script></body></html>`)
	file := filepath.Join(t.TempDir(), "code122.html")
	if err := os.WriteFile(file, []byte(page.String()), 0o644); err != nil {
		t.Fatal(err)
	}

	rec := &recorder{}
	ctx := browser(t, rec)
	within(t, ctx, 60*time.Second, chromedp.Navigate("file://"+file))

	t.Run("raw text", func(t *testing.T) {
		var got []int
		js := `JSON.stringify(Array.from(document.getElementById("raw").textContent, c => c.charCodeAt(0)))`
		if err := json.Unmarshal([]byte(eval[string](t, ctx, js)), &got); err != nil {
			t.Fatal(err)
		}
		want := []rune(raw.String())
		if len(got) != len(want) {
			t.Fatalf("textContent has %d characters, want %d", len(got), len(want))
		}
		var changed []string
		for k, r := range want {
			if rune(got[k]) != r {
				changed = append(changed, fmt.Sprintf("%U→%U", r, got[k]))
				if !strings.ContainsRune(static.Unsafe7, r) {
					t.Errorf("%U changed to %U but is not in Unsafe7", r, got[k])
				}
			}
		}
		// The HTML standard: NUL becomes U+FFFD, CR becomes LF.
		if strings.Join(changed, " ") != "U+0000→U+FFFD U+000D→U+000A" {
			t.Errorf("changed: %v, want NUL→U+FFFD and CR→LF only", changed)
		}
		if !strings.ContainsRune(static.Unsafe7, '<') {
			t.Error("Unsafe7 lacks '<'")
		}
	})

	t.Run("decoder", func(t *testing.T) {
		for k, in := range inputs {
			el := fmt.Sprintf(`document.getElementById("d%d")`, k)
			call := fmt.Sprintf(`from122(%s.textContent, Number(%s.getAttribute("data-bytes")))`, el, el)
			if len(in.b) <= 65537 {
				got := eval[string](t, ctx, `Array.from(`+call+`, b => b.toString(16).padStart(2, "0")).join("")`)
				if want := hex.EncodeToString(in.b); got != want {
					t.Errorf("%s: the page decodes %.40s…, want %.40s…", in.name, got, want)
				}
				continue
			}
			h := fnv.New32a()
			h.Write(in.b)
			got := eval[float64](t, ctx, `(() => { const b = `+call+`; return b.length === `+fmt.Sprint(len(in.b))+` ? fnv(b) : -1; })()`)
			if uint32(got) != h.Sum32() || got < 0 {
				t.Errorf("%s: FNV-1a of the decoded bytes %v, want %d", in.name, got, h.Sum32())
			}
			timing := eval[string](t, ctx, `(() => {
				const el = `+el+`, n = Number(el.getAttribute("data-bytes"));
				let t0 = performance.now();
				const text = el.textContent;
				const read = performance.now() - t0;
				const runs = [];
				for (let i = 0; i < 7; i++) {
					t0 = performance.now();
					from122(text, n);
					runs.push(performance.now() - t0);
				}
				runs.sort((a, b) => a - b);
				return "textContent " + read.toFixed(1) + " ms; decode first " + runs[runs.length-1].toFixed(1) +
					" ms at most, median " + runs[3].toFixed(1) + " ms (" + text.length + " characters)";
			})()`)
			t.Logf("%s: %s", in.name, timing)
		}
		// Damage is refused with a message.
		for _, tt := range []struct{ text, want string }{
			{`from122("A<A", 1)`, "damaged (character 1)"},
			{`from122("AA", 2)`, "truncated (1 of 2 bytes)"},
			{`from122("AAA", 1)`, "more than its 1 bytes"},
			{`from122("A", 0)`, "damaged (its end)"},
			{`from122("\u0300A", 1)`, "text after its end"},
			{`from122("A\u0800", 1)`, "damaged (character 1)"},
			{`from122("", NaN)`, "byte count"},
		} {
			got := eval[string](t, ctx, `(() => { try { `+tt.text+`; return "no error"; } catch (e) { return e.message; } })()`)
			if !strings.Contains(got, tt.want) {
				t.Errorf("%s: %q, want a message with %q", tt.text, got, tt.want)
			}
		}
	})
	_, problems := rec.snapshot()
	for _, p := range problems {
		t.Errorf("%s", p)
	}
}

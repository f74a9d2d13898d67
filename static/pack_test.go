package static

import (
	"bytes"
	"compress/gzip"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math/rand"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"
)

// module is a WebAssembly module of a custom section holding payload and
// the memory section mem (omitted when nil), as Go's linker lays out
// its memory: one memory, its section size padded to five bytes.
func module(payload []byte, mem []byte) []byte {
	b := []byte("\x00asm\x01\x00\x00\x00")
	b = append(b, 0)
	b = appendULEB(b, uint32(1+4+len(payload)))
	b = append(b, 4)
	b = append(b, "test"...)
	b = append(b, payload...)
	if mem != nil {
		n := uint32(len(mem))
		b = append(b, 5, byte(n)|0x80, 0x80, 0x80, 0x80, 0)
		b = append(b, mem...)
	}
	return b
}

func testInputs() Inputs {
	return Inputs{
		Wasm:       append(module(bytes.Repeat([]byte("program"), 100), []byte{1, 0, 0x43}), dataSection(seg(64, "data"), seg(80, "more"))...),
		WasmExec:   []byte("globalThis.Go = class {};"),
		VuguHelper: HelperMark + "window.vuguRender=function(){};})()",
		Demo:       []byte(`{"format": "porelight/1", "title": "A & B <i>"}`),
	}
}

func TestPack(t *testing.T) {
	in := testInputs()
	page, err := Pack(in)
	if err != nil {
		t.Fatal(err)
	}
	s := string(page)
	for _, want := range []string{
		`<meta http-equiv="Content-Security-Policy" content="` + CSP + `">`,
		`<div id="app">`,
		`<script id="demo-project" type="application/json">` + "\n" + string(in.Demo) + "\n</script>",
		`<script id="vugu-helper">` + "\n" + in.VuguHelper,
		string(in.WasmExec),
	} {
		if !strings.Contains(s, want) {
			t.Errorf("page lacks %q", want)
		}
	}
	if strings.Contains(CSP, "'unsafe-eval'") || !strings.Contains(CSP, "default-src 'none'") || !strings.Contains(CSP, "connect-src 'none'") {
		t.Errorf("CSP %q allows more than it should", CSP)
	}
	// No reference to anything outside the page.
	if m := regexp.MustCompile(`(?i)(src|href)\s*=\s*"(https?:|//)`).FindString(s); m != "" {
		t.Errorf("page refers outside: %s", m)
	}
	// The embedded program unpacks to the original bytes.
	m := regexp.MustCompile(`(?s)<script id="wasm-gz" type="application/octet-stream" data-bytes="(\d+)">(.*?)</script>`).FindStringSubmatch(s)
	if m == nil {
		t.Fatal("no wasm-gz script")
	}
	n, _ := strconv.Atoi(m[1])
	gz, err := Decode122(m[2], n)
	if err != nil {
		t.Fatal(err)
	}
	zr, err := gzip.NewReader(bytes.NewReader(gz))
	if err != nil {
		t.Fatal(err)
	}
	got, err := io.ReadAll(zr)
	if err != nil {
		t.Fatal(err)
	}
	want, err := CapMemory(in.Wasm, MaxMemoryPages)
	if err != nil {
		t.Fatal(err)
	}
	if want, err = JoinData(want, DataGap); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Error("the embedded program differs from the input with its memory capped and its data joined")
	}
}

func TestPackRefuses(t *testing.T) {
	tests := []struct {
		name   string
		change func(*Inputs)
		want   string
	}{
		{"not wasm", func(in *Inputs) { in.Wasm = []byte("MZ not a wasm file") }, "not WebAssembly"},
		{"changed helper", func(in *Inputs) { in.VuguHelper = "(function(){window.x=1})()" }, "helper script"},
		{"script end in demo", func(in *Inputs) { in.Demo = []byte(`{"notes": "</SCRIPT><b>"}`) }, "demo project"},
		{"comment in wasm_exec", func(in *Inputs) { in.WasmExec = []byte("x = 1 <!-- y") }, "wasm_exec.js"},
		// An outside compressor must give gzip that gunzips to the
		// program, or the page would fail in the browser.
		{"compressor fails", func(in *Inputs) {
			in.Gzip = func([]byte) ([]byte, error) { return nil, errors.New("no zopfli today") }
		}, "no zopfli today"},
		{"compressor gives no gzip", func(in *Inputs) { in.Gzip = func(b []byte) ([]byte, error) { return b, nil } }, "not gzip"},
		{"compressor loses bytes", func(in *Inputs) {
			in.Gzip = func(b []byte) ([]byte, error) { return gzipBest(b[:len(b)-1]) }
		}, "does not gunzip to the program"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			in := testInputs()
			tt.change(&in)
			_, err := Pack(in)
			if err == nil || !strings.Contains(err.Error(), tt.want) {
				t.Errorf("error %v, want one about %q", err, tt.want)
			}
		})
	}
}

// TestHelperScript reads the helper from the vugu module in use: it must
// start as the boot script expects, or the page would need 'unsafe-eval'.
func TestHelperScript(t *testing.T) {
	out, err := exec.Command("go", "list", "-m", "-f", "{{.Dir}}", "github.com/vugu/vugu").Output()
	if err != nil {
		t.Skipf("go list: %v", err)
	}
	s, err := HelperScript(strings.TrimSpace(string(out)))
	if err != nil {
		t.Fatal(err)
	}
	if !strings.HasPrefix(s, HelperMark) || !strings.Contains(s, "window.vuguRender=function") {
		t.Errorf("helper starts %.60q", s)
	}
	if !strings.Contains(bootJS, `"`+HelperMark+`"`) {
		t.Error("the boot script does not recognise the helper by HelperMark")
	}
	if _, err := HelperScript(t.TempDir()); err == nil {
		t.Error("no error for a folder without the renderer")
	}
}

// TestCode122 round-trips the 7-bit text code of Encode122 on every byte
// value, on runs of each unsafe chunk (at the end too, where it is
// written alone), on random data of every length up to 70 and some
// longer ones (fixed seeds), and checks the text: valid UTF-8, none of
// Unsafe7, at most one byte more than ⌈8n/7⌉. The expected lengths follow
// from the definition of the code; no outside source.
func TestCode122(t *testing.T) {
	// Bytes whose every 7-bit chunk is Unsafe7[i]: chunk c repeated is
	// the bit pattern of c, 7 bits at a time.
	repeated := func(c byte, n int) []byte {
		b := make([]byte, n)
		for k := 0; k < n*8; k++ {
			if c>>(6-k%7)&1 == 1 {
				b[k/8] |= 0x80 >> (k % 8)
			}
		}
		return b
	}
	inputs := map[string][]byte{"empty": {}}
	every := make([]byte, 256*3)
	for i := range every {
		every[i] = byte(i) // every value, at every offset within a chunk
	}
	inputs["every byte value"] = every
	for i := 0; i < len(Unsafe7); i++ {
		for _, n := range []int{1, 2, 6, 7, 8, 13, 14} {
			inputs[fmt.Sprintf("chunks all %#x, %d bytes", Unsafe7[i], n)] = repeated(Unsafe7[i], n)
		}
	}
	for seed := int64(1); seed <= 3; seed++ {
		rng := rand.New(rand.NewSource(seed))
		for _, n := range append([]int{255, 256, 4095, 4096, 4097, 100000}, seq(0, 70)...) {
			b := make([]byte, n)
			rng.Read(b)
			inputs[fmt.Sprintf("random seed %d, %d bytes", seed, n)] = b
		}
	}
	lone := 0
	for name, b := range inputs {
		enc := Encode122(b)
		if !utf8.ValidString(enc) {
			t.Errorf("%s: the text is not valid UTF-8", name)
		}
		if strings.ContainsAny(enc, Unsafe7) {
			t.Errorf("%s: the text holds one of %q", name, Unsafe7)
		}
		for _, r := range enc {
			if r >= 0x800 {
				t.Errorf("%s: %U is not below U+0800", name, r)
				break
			}
		}
		chunks := (8*len(b) + 6) / 7
		if len(enc) != chunks && len(enc) != chunks+1 {
			t.Errorf("%s: %d bytes of text, want %d or %d", name, len(enc), chunks, chunks+1)
		}
		if len(enc) == chunks+1 {
			lone++
		}
		for _, text := range []string{enc, wrap(enc, 7), "\n" + enc + "\n"} {
			got, err := Decode122(text, len(b))
			if err != nil || !bytes.Equal(got, b) {
				t.Errorf("%s: round trip failed (%v)", name, err)
				break
			}
		}
	}
	if lone == 0 {
		t.Error("no input ends in an unsafe chunk written alone")
	}
	// What the decoder refuses.
	ab := Encode122([]byte("ab")) // 16 bits in 3 chunks, 5 padding bits
	for _, tt := range []struct {
		text string
		n    int
		want string
	}{
		{ab, 3, "not 3"},
		{ab + "A", 2, "more than 2"},
		{"A", 0, "bits past"}, // a whole chunk of padding
		{Encode122([]byte("abc")), 2, "more than 2"},
		{ab[:2] + string(rune(ab[2]|1)), 2, "bits past"}, // a padding bit set
		{"A<A", 1, "not a character"},
		{"A\rA", 1, "not a character"},
		{"A\u0800", 1, "not a character"},
		{"A\ufffd", 1, "not a character"},
		{"\u0300A", 1, "goes on after"},
		{"", -1, "asked for"},
	} {
		if _, err := Decode122(tt.text, tt.n); err == nil || !strings.Contains(err.Error(), tt.want) {
			t.Errorf("Decode122(%q, %d): error %v, want one saying %q", tt.text, tt.n, err, tt.want)
		}
	}
}

func seq(lo, hi int) []int {
	var s []int
	for i := lo; i <= hi; i++ {
		s = append(s, i)
	}
	return s
}

// TestWrap: lines of about n bytes that never split a UTF-8 sequence,
// and the text is unchanged but for the line breaks.
func TestWrap(t *testing.T) {
	s := strings.Repeat("aé\u07ffb", 50)
	for _, n := range []int{1, 2, 3, 7, 1000} {
		w := wrap(s, n)
		if !utf8.ValidString(w) {
			t.Errorf("n=%d: a line break splits a character", n)
		}
		if strings.ReplaceAll(w, "\n", "") != s {
			t.Errorf("n=%d: the text changed", n)
		}
		for _, line := range strings.Split(w, "\n") {
			if len(line) > n+1 {
				t.Errorf("n=%d: a line of %d bytes", n, len(line))
				break
			}
		}
	}
}

// TestCapMemory rewrites the memory limits of small modules; the byte
// strings follow the binary format of WebAssembly 2.0 (§5.3.5 limits,
// §5.5.8 memory section, §5.1 LEB128).
func TestCapMemory(t *testing.T) {
	payload := []byte("code and data stay as they were")
	tests := []struct {
		name    string
		mem     []byte // the memory section's body before
		max     uint32
		want    []byte // after; nil when CapMemory must fail
		wantErr string
	}{
		{"Go's layout: no maximum", []byte{1, 0, 0x43}, 16384, []byte{1, 1, 0x43, 0x80, 0x80, 0x01}, ""},
		{"a two-byte minimum", []byte{1, 0, 0x80, 0x01}, 16384, []byte{1, 1, 0x80, 0x01, 0x80, 0x80, 0x01}, ""},
		{"a larger maximum is lowered", []byte{1, 1, 2, 0x80, 0x80, 0x04}, 16384, []byte{1, 1, 2, 0x80, 0x80, 0x01}, ""},
		{"a smaller maximum is kept", []byte{1, 1, 2, 10}, 16384, []byte{1, 1, 2, 10}, ""},
		{"minimum above the cap", []byte{1, 0, 0x80, 0x02}, 200, nil, "more than the cap"},
		{"two memories", []byte{2, 0, 1, 0, 1}, 16384, nil, "2 memories"},
		{"shared memory", []byte{1, 3, 1, 2}, 16384, nil, "not supported"},
		{"truncated limits", []byte{1, 0}, 16384, nil, "truncated"},
		{"trailing bytes", []byte{1, 0, 1, 9}, 16384, nil, "unexpected bytes"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := CapMemory(module(payload, tt.mem), tt.max)
			if tt.want == nil {
				if err == nil || !strings.Contains(err.Error(), tt.wantErr) {
					t.Fatalf("error %v, want one saying %q", err, tt.wantErr)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			want := module(payload, nil)
			want = append(want, 5)
			want = appendULEB(want, uint32(len(tt.want)))
			want = append(want, tt.want...)
			if !bytes.Equal(got, want) {
				t.Errorf("got  % x\nwant % x", got, want)
			}
		})
	}
	for _, bad := range [][]byte{
		[]byte("MZ not a module"),
		module(payload, nil),                                    // no memory
		append(module(payload, []byte{1, 0, 1}), 5, 3, 1, 0, 1), // two memory sections
		append(module(payload, []byte{1, 0, 1}), 0, 9, 1),       // a section past the end
	} {
		if _, err := CapMemory(bad, 16384); err == nil {
			t.Errorf("no error for % x", bad)
		}
	}
}

// TestCapMemoryValid has node compile the capped module and grow its
// memory: up to the cap it grows, one page more fails. Skipped without
// node.
func TestCapMemoryValid(t *testing.T) {
	node, err := exec.LookPath("node")
	if err != nil {
		t.Skip("node not found")
	}
	// An export section (id 7) exports memory 0 as "mem".
	m := module(nil, []byte{1, 0, 1})
	m = append(m, 7, 7, 1, 3, 'm', 'e', 'm', 2, 0)
	capped, err := CapMemory(m, 4)
	if err != nil {
		t.Fatal(err)
	}
	var hex strings.Builder
	for _, c := range capped {
		fmt.Fprintf(&hex, "%02x", c)
	}
	js := `const b = Buffer.from("` + hex.String() + `", "hex");
const mem = new WebAssembly.Instance(new WebAssembly.Module(b)).exports.mem;
mem.grow(3);
let over = "grew";
try { mem.grow(1); } catch (e) { over = e.constructor.name; }
console.log(mem.buffer.byteLength / 65536, over);`
	out, err := exec.Command(node, "-e", js).CombinedOutput()
	if err != nil {
		t.Fatalf("node: %v\n%s", err, out)
	}
	if got := strings.TrimSpace(string(out)); got != "4 RangeError" {
		t.Errorf("node says %q, want 4 pages and a RangeError past the cap", got)
	}
}

// TestPatchHelper: every patch finds its place in the helper of the vugu
// in use once (twice for text and comments), and a helper without one is
// refused rather than shipped unpatched.
func TestPatchHelper(t *testing.T) {
	out, err := exec.Command("go", "list", "-m", "-f", "{{.Dir}}", "github.com/vugu/vugu").Output()
	if err != nil {
		t.Skipf("go list: %v", err)
	}
	raw, err := helperSource(strings.TrimSpace(string(out)))
	if err != nil {
		t.Fatal(err)
	}
	s, err := patchHelper(raw)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range helperPatches {
		if got := strings.Count(s, p.new); got != p.n {
			t.Errorf("%s: the patched helper has the new code %d times, want %d", p.what, got, p.n)
		}
		if _, err := patchHelper(strings.Replace(raw, p.old, "", 1)); err == nil {
			t.Errorf("%s: a helper without the place to patch is accepted", p.what)
		}
	}
}

// TestTargetProps: every property of an event's target that the page's
// Go code reads is among those the patched helper sends.
func TestTargetProps(t *testing.T) {
	re := regexp.MustCompile(`Prop[A-Za-z0-9]*\("target",\s*"([^"]+)"`)
	n := 0
	for _, dir := range []string{"../ui", "../wasm"} {
		err := filepath.WalkDir(dir, func(path string, d fs.DirEntry, err error) error {
			if err != nil || d.IsDir() || !strings.HasSuffix(path, ".go") {
				return err
			}
			src, err := os.ReadFile(path)
			if err != nil {
				return err
			}
			for _, m := range re.FindAllStringSubmatch(string(src), -1) {
				n++
				if !slices.Contains(TargetProps, m[1]) {
					t.Errorf("%s reads the event target's %q, which the helper does not send (TargetProps)", path, m[1])
				}
			}
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
	}
	if n == 0 {
		t.Error("found no reads of an event target's properties: the pattern is out of date")
	}
}

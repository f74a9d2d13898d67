package static

import (
	"bytes"
	"compress/gzip"
	"errors"
	"fmt"
	"io"
	"os/exec"
	"regexp"
	"strconv"
	"strings"
	"testing"
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
		Wasm:       module(bytes.Repeat([]byte("program"), 100), []byte{1, 0, 0x43}),
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
	gz, err := Decode85(m[2], n)
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
	if !bytes.Equal(got, want) {
		t.Error("the embedded program differs from the input with its memory capped")
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

// TestBase85 round-trips every length modulo 4 and every byte value, and
// checks that the alphabet holds no character HTML or JavaScript treats
// specially, so no encoded text can close its script element.
func TestBase85(t *testing.T) {
	if len(Alphabet85) != 85 {
		t.Fatalf("alphabet has %d characters", len(Alphabet85))
	}
	if strings.ContainsAny(Alphabet85, "\"&'<>\\` \t\n") {
		t.Fatalf("alphabet holds a special character: %q", Alphabet85)
	}
	all := make([]byte, 1027)
	for i := range all {
		all[i] = byte(i * 7)
	}
	all[0], all[1], all[2], all[3] = 255, 255, 255, 255 // the largest group
	for _, n := range []int{0, 1, 2, 3, 4, 5, 1023, 1024, 1025, 1026, 1027} {
		enc := Encode85(all[:n])
		if len(enc) != (n+3)/4*5 {
			t.Errorf("%d bytes: %d characters, want %d", n, len(enc), (n+3)/4*5)
		}
		got, err := Decode85(wrap(enc, 120), n)
		if err != nil || !bytes.Equal(got, all[:n]) {
			t.Errorf("%d bytes: round trip failed (%v)", n, err)
		}
	}
	if _, err := Decode85("!!!!", 0); err == nil {
		t.Error("a truncated group was accepted")
	}
	if _, err := Decode85("!!!!<", 4); err == nil {
		t.Error("a character outside the alphabet was accepted")
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

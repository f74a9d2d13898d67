package static

import (
	"bytes"
	"compress/gzip"
	"io"
	"os/exec"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

func testInputs() Inputs {
	return Inputs{
		Wasm:       append([]byte("\x00asm\x01\x00\x00\x00"), bytes.Repeat([]byte("program"), 100)...),
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
	if !bytes.Equal(got, in.Wasm) {
		t.Error("the embedded program differs from the input")
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

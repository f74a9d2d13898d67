// Package static builds the single self-contained Porelight page and
// holds its browser end-to-end tests.
//
// Pack writes one HTML file that carries everything inline: the CSS, the
// demo project, the renderer's helper script, Go's wasm_exec.js, the
// solve workers' script (inert text until the boot script makes workers
// of it), the gzipped WebAssembly program in a 7-bit text code (see Encode122), its
// memory capped at MaxMemoryPages and its data joined into a few segments
// (see JoinData), and the boot script. A
// Content-Security-Policy meta tag forbids every network request, so the
// page works the same from disk, from a static server and in a sandboxed
// frame. The command in ./pack runs it for `make page`.
package static

import (
	"bytes"
	"compress/gzip"
	_ "embed"
	"errors"
	"fmt"
	"go/ast"
	"go/parser"
	"go/token"
	"io"
	"path/filepath"
	"strconv"
	"strings"
	"text/template"
	"unicode/utf8"
)

// CSP is the page's Content-Security-Policy: inline scripts and styles,
// WebAssembly compilation, data: images and blob: workers; nothing else,
// and in particular no connection of any kind. 'unsafe-eval' is not
// needed: see HelperMark.
const CSP = "default-src 'none'; script-src 'unsafe-inline' 'wasm-unsafe-eval'; style-src 'unsafe-inline'; " +
	"img-src data: blob:; worker-src blob:; connect-src 'none'; form-action 'none'; base-uri 'none'"

// HelperMark is how the vugu renderer's helper script starts. The page
// runs the script inline, and the boot script answers the renderer's own
// eval of it, so the page does without 'unsafe-eval'. Pack refuses a
// helper that does not start so (a vugu upgrade that changed it).
const HelperMark = "(function(){if(window.vuguRender)return;"

var (
	//go:embed shell/page.html
	pageHTML string
	//go:embed shell/page.css
	pageCSS string
	//go:embed shell/boot.js
	bootJS string
	//go:embed shell/worker.js
	workerJS string
)

// Inputs are the parts of the page.
type Inputs struct {
	Wasm       []byte // the js/wasm program, uncompressed
	WasmExec   []byte // $(go env GOROOT)/lib/wasm/wasm_exec.js of the toolchain that built Wasm
	VuguHelper string // the renderer's helper script (see HelperScript)
	Demo       []byte // the demo project JSON
	// Gzip, when not nil, compresses the program into the gzip format
	// (e.g. by an external zopfli, some 5 % smaller than compress/gzip
	// at its best); nil uses compress/gzip at BestCompression.
	Gzip func([]byte) ([]byte, error)
}

// Pack returns the page. It fails when a part would end its inline
// <script> or <style> early.
func Pack(in Inputs) ([]byte, error) {
	if len(in.Wasm) < 8 || !bytes.Equal(in.Wasm[:4], []byte("\x00asm")) {
		return nil, errors.New("pack: the program is not WebAssembly")
	}
	if !strings.HasPrefix(in.VuguHelper, HelperMark) {
		return nil, errors.New("pack: the renderer's helper script does not start as expected; check the vugu version")
	}
	wasm, err := CapMemory(in.Wasm, MaxMemoryPages)
	if err != nil {
		return nil, err
	}
	if wasm, err = JoinData(wasm, DataGap); err != nil {
		return nil, err
	}
	compress := in.Gzip
	if compress == nil {
		compress = gzipBest
	}
	gzipped, err := compress(wasm)
	if err != nil {
		return nil, fmt.Errorf("pack: compressing the program: %w", err)
	}
	// Whatever compressed it, the page can only use what gunzips to the
	// program.
	if zr, err := gzip.NewReader(bytes.NewReader(gzipped)); err != nil {
		return nil, fmt.Errorf("pack: the compressed program is not gzip: %w", err)
	} else if back, err := io.ReadAll(zr); err != nil || !bytes.Equal(back, wasm) {
		return nil, errors.New("pack: the compressed program does not gunzip to the program")
	}
	gz := bytes.NewBuffer(gzipped)
	// The scripts and the stylesheet go in without their comments and
	// indentation (about 12 kB); the helper comes so already.
	wasmExec, _ := SqueezeJS(string(in.WasmExec))
	boot, _ := SqueezeJS(bootJS)
	worker, _ := SqueezeJS(workerJS)
	css, _ := SqueezeCSS(pageCSS)
	parts := map[string]string{
		"demo project":  string(in.Demo),
		"helper script": in.VuguHelper,
		"wasm_exec.js":  wasmExec,
		"boot script":   boot,
		"worker script": worker,
		"stylesheet":    css,
	}
	for name, s := range parts {
		if err := inlineSafe(s); err != nil {
			return nil, fmt.Errorf("pack: %s: %w", name, err)
		}
	}
	t, err := template.New("page").Parse(pageHTML)
	if err != nil {
		return nil, err
	}
	var out bytes.Buffer
	err = t.Execute(&out, map[string]string{
		"CSP":        CSP,
		"CSS":        css,
		"Demo":       strings.TrimSpace(string(in.Demo)),
		"VuguHelper": in.VuguHelper,
		"WasmExec":   wasmExec,
		"WasmGz":     wrap(Encode122(gz.Bytes()), 4096),
		"WasmLen":    strconv.Itoa(gz.Len()),
		"Boot":       boot,
		"WorkerShim": worker,
	})
	if err != nil {
		return nil, err
	}
	return out.Bytes(), nil
}

// gzipBest compresses b with compress/gzip at BestCompression.
func gzipBest(b []byte) ([]byte, error) {
	var gz bytes.Buffer
	zw, err := gzip.NewWriterLevel(&gz, gzip.BestCompression)
	if err != nil {
		return nil, err
	}
	if _, err := zw.Write(b); err != nil {
		return nil, err
	}
	if err := zw.Close(); err != nil {
		return nil, err
	}
	return gz.Bytes(), nil
}

// inlineSafe refuses text that would close its <script> or <style> early
// or open an HTML comment inside a script.
func inlineSafe(s string) error {
	low := strings.ToLower(s)
	for _, bad := range []string{"</script", "</style", "<!--"} {
		if i := strings.Index(low, bad); i >= 0 {
			return fmt.Errorf("contains %q at byte %d", bad, i)
		}
	}
	return nil
}

// wrap breaks s into lines of about n bytes, never inside a UTF-8
// sequence.
func wrap(s string, n int) string {
	var b strings.Builder
	b.Grow(len(s) + len(s)/n + 1)
	for len(s) > n {
		cut := n
		for cut < len(s) && !utf8.RuneStart(s[cut]) {
			cut++
		}
		if cut == len(s) {
			break
		}
		b.WriteString(s[:cut])
		b.WriteByte('\n')
		s = s[cut:]
	}
	b.WriteString(s)
	return b.String()
}

// HelperScript reads the renderer's helper script, the string constant
// jsHelperScript in domrender/renderer-js-script.go of the vugu module at
// vuguDir, and patches it to write only what changed (helper.go).
func HelperScript(vuguDir string) (string, error) {
	s, err := helperSource(vuguDir)
	if err != nil {
		return "", err
	}
	return patchHelper(s)
}

// helperSource is the helper script as vugu has it.
func helperSource(vuguDir string) (string, error) {
	file := filepath.Join(vuguDir, "domrender", "renderer-js-script.go")
	f, err := parser.ParseFile(token.NewFileSet(), file, nil, 0)
	if err != nil {
		return "", err
	}
	for _, d := range f.Decls {
		g, ok := d.(*ast.GenDecl)
		if !ok || g.Tok != token.CONST {
			continue
		}
		for _, spec := range g.Specs {
			vs := spec.(*ast.ValueSpec)
			for i, name := range vs.Names {
				if name.Name != "jsHelperScript" || i >= len(vs.Values) {
					continue
				}
				lit, ok := vs.Values[i].(*ast.BasicLit)
				if !ok || lit.Kind != token.STRING {
					return "", fmt.Errorf("%s: jsHelperScript is not a string literal", file)
				}
				return strconv.Unquote(lit.Value)
			}
		}
	}
	return "", fmt.Errorf("%s: no constant jsHelperScript", file)
}

// Unsafe7 are the seven-bit values that Encode122 never writes as
// themselves. The program sits in the raw text of a <script> element,
// which the HTML parser hands over untouched except for:
//
//   - NUL, which the tokenizer replaces with U+FFFD (script data state);
//   - CR, which input-stream preprocessing turns into LF (CR LF into LF);
//   - '<', which can begin "</script" (ending the element) or "<!--"
//     (entering the escaped states, where a later "</script>" may not end
//     it).
//
// The page's UTF-8 decoding turns only invalid sequences into U+FFFD, and
// Encode122 writes valid UTF-8. Two more are left out by choice: LF, so
// that line breaks around and within the text are not data, and '&', so
// that the text would survive even in an element that decodes character
// references. Leaving a value out costs no space (see Encode122). The
// browser test TestE2ERawText checks in Chromium that every other
// character up to U+07FF reaches textContent unchanged.
const Unsafe7 = "\x00\n\r&<"

// Encode122 writes b as UTF-8 text carrying 7 bits per byte, after the
// base-122 idea: b is read as a stream of bits, most significant first,
// cut into 7-bit chunks (the last padded with zero bits), n = ⌈8·len(b)/7⌉
// chunks in all. A chunk c that is not in Unsafe7 is written as the ASCII
// character c. A chunk equal to Unsafe7[i] is written together with the
// chunk d after it as the one two-byte UTF-8 character U+0080 + 128·i + d
// (U+0080…U+02FF); 14 bits in 2 bytes, the same rate. When the unsafe
// chunk is the last one, it is written alone as U+0300 + i. So the text
// has ⌈8·len(b)/7⌉ bytes, or one more: 14.3 % more than b, against 25 %
// for base 85 and 33 % for base 64, and it holds none of Unsafe7 (in
// particular no '<'). Read in JavaScript, every character is one UTF-16
// code unit below U+0800. The decoder needs len(b) to tell the padding
// from data; see Decode122 and from122 in shell/boot.js.
func Encode122(b []byte) string {
	var unsafe [128]int8
	for i := range unsafe {
		unsafe[i] = -1
	}
	for i := 0; i < len(Unsafe7); i++ {
		unsafe[Unsafe7[i]] = int8(i)
	}
	n := (len(b)*8 + 6) / 7
	// chunk returns bits 7k … 7k+6 of b, zero past its end.
	chunk := func(k int) byte {
		i, off := 7*k/8, 7*k%8
		v := uint16(b[i]) << 8
		if i+1 < len(b) {
			v |= uint16(b[i+1])
		}
		return byte(v>>(9-off)) & 127
	}
	var out strings.Builder
	out.Grow(n + n/32 + 2)
	for k := 0; k < n; k++ {
		c := chunk(k)
		i := unsafe[c]
		switch {
		case i < 0:
			out.WriteByte(c)
		case k+1 < n:
			k++
			out.WriteRune(rune(0x80 + 128*int(i) + int(chunk(k))))
		default:
			out.WriteRune(rune(0x300 + int(i)))
		}
	}
	return out.String()
}

// Decode122 reverses Encode122 for n bytes, skipping line breaks; it is
// the Go twin of the page's decoder (from122 in shell/boot.js), used by
// the tests, and refuses what the page's decoder refuses: a character
// outside the code, text after a lone last chunk, too few or too many
// chunks for n bytes, and padding bits that are not zero.
func Decode122(s string, n int) ([]byte, error) {
	if n < 0 {
		return nil, fmt.Errorf("pack: %d bytes asked for", n)
	}
	out := make([]byte, 0, n)
	var acc uint32
	bits := 0
	ended := false
	for j, r := range s {
		if r == '\n' {
			continue
		}
		if ended {
			return nil, fmt.Errorf("pack: text goes on after the last chunk (byte %d)", j)
		}
		switch {
		case r < 0x80 && strings.IndexByte(Unsafe7, byte(r)) < 0:
			acc, bits = acc<<7|uint32(r), bits+7
		case r >= 0x80 && r < 0x80+128*rune(len(Unsafe7)):
			v := uint32(r - 0x80)
			acc, bits = acc<<14|uint32(Unsafe7[v>>7])<<7|v&127, bits+14
		case r >= 0x300 && r < 0x300+rune(len(Unsafe7)):
			acc, bits = acc<<7|uint32(Unsafe7[r-0x300]), bits+7
			ended = true
		default:
			return nil, fmt.Errorf("pack: %q (byte %d) is not a character of the 7-bit code", r, j)
		}
		for bits >= 8 {
			bits -= 8
			if len(out) == n {
				return nil, fmt.Errorf("pack: the text holds more than %d bytes", n)
			}
			out = append(out, byte(acc>>bits))
			acc &= 1<<bits - 1
		}
	}
	if len(out) < n {
		return nil, fmt.Errorf("pack: the text holds %d bytes, not %d", len(out), n)
	}
	if bits >= 7 || acc != 0 {
		return nil, fmt.Errorf("pack: the text has %d bits past its %d bytes (want fewer than 7, all zero)", bits, n)
	}
	return out, nil
}

// Package static builds the single self-contained Porelight page and
// holds its browser end-to-end tests.
//
// Pack writes one HTML file that carries everything inline: the CSS, the
// demo project, the renderer's helper script, Go's wasm_exec.js, the
// solve workers' script (inert text until the boot script makes workers
// of it), the gzipped WebAssembly program in base 85 (see Encode85), its
// memory capped at MaxMemoryPages, and the boot script. A
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
	// (e.g. by an external zopfli, some 4 % smaller than compress/gzip
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
	parts := map[string]string{
		"demo project":  string(in.Demo),
		"helper script": in.VuguHelper,
		"wasm_exec.js":  string(in.WasmExec),
		"boot script":   bootJS,
		"worker script": workerJS,
		"stylesheet":    pageCSS,
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
		"CSS":        pageCSS,
		"Demo":       strings.TrimSpace(string(in.Demo)),
		"VuguHelper": in.VuguHelper,
		"WasmExec":   string(in.WasmExec),
		"WasmGz":     wrap(Encode85(gz.Bytes()), 120),
		"WasmLen":    strconv.Itoa(gz.Len()),
		"Boot":       bootJS,
		"WorkerShim": workerJS,
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

func wrap(s string, n int) string {
	var b strings.Builder
	for len(s) > n {
		b.WriteString(s[:n])
		b.WriteByte('\n')
		s = s[n:]
	}
	b.WriteString(s)
	return b.String()
}

// HelperScript reads the renderer's helper script, the string constant
// jsHelperScript in domrender/renderer-js-script.go of the vugu module at
// vuguDir.
func HelperScript(vuguDir string) (string, error) {
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

// Alphabet85 is the alphabet of Encode85: the printable ASCII characters
// from '!' on, less the seven that HTML or JavaScript treat specially
// and the braces
// (" & ' < > \ and the backquote), in code order. Without '<' no run of
// them can close the script element that holds them or open a comment.
const Alphabet85 = "!#$%()*+,-./0123456789:;=?@ABCDEFGHIJKLMNOPQRSTUVWXYZ[]^_abcdefghijklmnopqrstuvwxyz|~"

// Encode85 writes b in base 85: every 4 bytes (big-endian, the last group
// padded with zero bytes) become 5 digits of Alphabet85, most significant
// first. The text is 25 % longer than b, against 33 % for base 64; the
// decoder needs the length of b to drop the padding.
func Encode85(b []byte) string {
	var out strings.Builder
	out.Grow((len(b) + 3) / 4 * 5)
	var group [4]byte
	var digits [5]byte
	for i := 0; i < len(b); i += 4 {
		group = [4]byte{}
		copy(group[:], b[i:])
		v := uint32(group[0])<<24 | uint32(group[1])<<16 | uint32(group[2])<<8 | uint32(group[3])
		for j := 4; j >= 0; j-- {
			digits[j] = Alphabet85[v%85]
			v /= 85
		}
		out.Write(digits[:])
	}
	return out.String()
}

// Decode85 reverses Encode85 for n bytes, skipping white space; it is the
// Go twin of the page's decoder, used by the tests.
func Decode85(s string, n int) ([]byte, error) {
	var idx [256]int16
	for i := range idx {
		idx[i] = -1
	}
	for i := 0; i < len(Alphabet85); i++ {
		idx[Alphabet85[i]] = int16(i)
	}
	out := make([]byte, 0, (len(s)/5+1)*4)
	var v uint32
	k := 0
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c == ' ' || c == '\n' || c == '\r' || c == '\t' {
			continue
		}
		d := idx[c]
		if d < 0 {
			return nil, fmt.Errorf("pack: %q is not a base-85 digit", c)
		}
		v = v*85 + uint32(d)
		if k++; k == 5 {
			out = append(out, byte(v>>24), byte(v>>16), byte(v>>8), byte(v))
			v, k = 0, 0
		}
	}
	if k != 0 || n > len(out) || len(out)-n > 3 {
		return nil, fmt.Errorf("pack: base-85 text of %d bytes does not hold %d bytes", len(out), n)
	}
	return out[:n], nil
}

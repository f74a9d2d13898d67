package static

import (
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"testing"
)

func TestSqueezeJS(t *testing.T) {
	tests := []struct {
		name, in, want string
		ok             bool
	}{
		{"indentation, blanks and comment lines", "// head\nfunction f() {\n\t// why\n\treturn 1; // kept\n\n}\n", "function f() {\nreturn 1; // kept\n}", true},
		// The line break after return stays: f still returns undefined.
		{"line breaks stay", "function f() {\n\treturn\n\t\t// nothing\n\t\t1;\n}", "function f() {\nreturn\n1;\n}", true},
		// A // line inside a block comment is comment text either way.
		{"block comments", "/* a\n   // b\n*/ x = 1;", "/* a\n*/ x = 1;", true},
		{"a template literal on one line", "\tx = `a ${b}`;\n", "x = `a ${b}`;", true},
		{"a template literal over lines", "x = `a\n\t// b\n`;", "", false},
		{"a string continued", "x = 'a\\\n\t// b';", "", false},
		{"a // line ending a block comment", "/* a\n// b */ x = 1;", "", false},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, ok := SqueezeJS(tt.in)
			want := tt.want
			if !tt.ok {
				want = tt.in
			}
			if ok != tt.ok || got != want {
				t.Errorf("SqueezeJS(%q) = %q, %v; want %q, %v", tt.in, got, ok, want, tt.ok)
			}
		})
	}
}

func TestSqueezeCSS(t *testing.T) {
	tests := []struct {
		name, in, want string
		ok             bool
	}{
		{"comments, indentation, blanks", "/* head\n   more */\n:root {\n\t--a: #fff; /* why */\n}\n\n@media print {\n\tp { x: 1 }\n}\n", ":root {\n--a: #fff;\n}\n@media print {\np { x: 1 }\n}", true},
		{"a comment between two tokens stays", "a/**/b { x: 1 }", "a/**/b { x: 1 }", true},
		{"strings are kept", `p::before { content: "/* not a comment */"; } q::after { content: '\'/*' }`, `p::before { content: "/* not a comment */"; } q::after { content: '\'/*' }`, true},
		{"an unquoted url is kept", "p { background: url(data:x/*y*/z) } /* c */", "p { background: url(data:x/*y*/z) }", true},
		{"a quoted url", `p { background: url("a/*b") }`, `p { background: url("a/*b") }`, true},
		{"an unclosed comment", "p { x: 1 } /* open", "", false},
		{"an unclosed string", "p::before { content: \"open\n}", "", false},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, ok := SqueezeCSS(tt.in)
			want := tt.want
			if !tt.ok {
				want = tt.in
			}
			if ok != tt.ok || got != want {
				t.Errorf("SqueezeCSS(%q) = %q, %v; want %q, %v", tt.in, got, ok, want, tt.ok)
			}
		})
	}
}

// TestSqueezeShell: the page's own scripts, the toolchain's wasm_exec.js
// and the stylesheet squeeze (Pack would carry them whole otherwise), and
// node parses the squeezed scripts. The browser tests run them.
func TestSqueezeShell(t *testing.T) {
	wasmExec, err := os.ReadFile(filepath.Join(runtime.GOROOT(), "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		t.Fatal(err)
	}
	node, _ := exec.LookPath("node")
	dir := t.TempDir()
	for name, src := range map[string]string{"boot.js": bootJS, "worker.js": workerJS, "wasm_exec.js": string(wasmExec)} {
		got, ok := SqueezeJS(src)
		if !ok || len(got) > len(src)*9/10 {
			t.Errorf("%s: squeezed %v, %d of %d bytes; want at least 10 %% less", name, ok, len(got), len(src))
		}
		if node == "" {
			continue
		}
		f := filepath.Join(dir, name)
		if err := os.WriteFile(f, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		if out, err := exec.Command(node, "--check", f).CombinedOutput(); err != nil {
			t.Errorf("%s squeezed does not parse: %v\n%s", name, err, out)
		}
	}
	if got, ok := SqueezeCSS(pageCSS); !ok || len(got) > len(pageCSS)*95/100 {
		t.Errorf("page.css: squeezed %v, %d of %d bytes; want at least 5 %% less", ok, len(got), len(pageCSS))
	}
}

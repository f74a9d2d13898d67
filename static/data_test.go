package static

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
)

// dataModule is a WebAssembly module of a custom section and the data
// section body data, after the binary format of WebAssembly 2.0 (§5.5.12
// data section: vec(data), an active segment of memory 0 being 0x00,
// the offset expression, vec(byte); §5.4.9 i32.const is 0x41 and a
// signed LEB128; §5.5.13 the data count section, id 12).
func dataModule(count int, data []byte) []byte {
	b := module([]byte("kept"), nil)
	if count >= 0 {
		b = append(b, 12)
		c := appendULEB(nil, uint32(count))
		b = appendULEB(b, uint32(len(c)))
		b = append(b, c...)
	}
	b = append(b, 11)
	b = appendULEB(b, uint32(len(data)))
	return append(b, data...)
}

// seg writes one active segment of memory 0 at offset off.
func seg(off int32, bytes string) []byte {
	b := []byte{0, 0x41}
	b = appendSLEB32(b, off)
	b = append(b, 0x0b)
	b = appendULEB(b, uint32(len(bytes)))
	return append(b, bytes...)
}

// dataSection is a data section of the segments.
func dataSection(segs ...[]byte) []byte {
	body := vec(len(segs), segs...)
	return append(appendULEB([]byte{11}, uint32(len(body))), body...)
}

func vec(n int, entries ...[]byte) []byte {
	b := appendULEB(nil, uint32(n))
	for _, e := range entries {
		b = append(b, e...)
	}
	return b
}

// TestJoinData joins the segments of small modules written by hand.
func TestJoinData(t *testing.T) {
	tests := []struct {
		name  string
		count int // the data count section's value; -1: none
		data  []byte
		gap   int
		want  []byte // the data section's body after; nil when JoinData must fail
		err   string
	}{
		{"gap within the limit", -1, vec(2, seg(8, "ab"), seg(13, "cd")), 3,
			vec(1, seg(8, "ab\x00\x00\x00cd")), ""},
		{"gap past the limit", -1, vec(2, seg(8, "ab"), seg(14, "cd")), 3,
			vec(2, seg(8, "ab"), seg(14, "cd")), ""},
		{"touching segments", -1, vec(2, seg(8, "ab"), seg(10, "cd")), 0,
			vec(1, seg(8, "abcd")), ""},
		// Go's linker writes its sections' segments out of address
		// order; the offsets, not the order, place the bytes.
		{"out of order", -1, vec(3, seg(200, "z"), seg(0x10000, "far"), seg(190, "y")), 16,
			vec(2, seg(190, "y"+strings.Repeat("\x00", 9)+"z"), seg(0x10000, "far")), ""},
		{"an offset of four LEB bytes", -1, vec(2, seg(0x7fff_fff0, "a"), seg(0x7fff_fff2, "b")), 1,
			vec(1, seg(0x7fff_fff0, "a\x00b")), ""},
		{"the data count follows", 3, vec(3, seg(0, "a"), seg(2, "b"), seg(4, "c")), 1,
			vec(1, seg(0, "a\x00b\x00c")), ""},
		{"no segments", -1, vec(0), 8, vec(0), ""},
		{"overlap", -1, vec(2, seg(8, "abc"), seg(10, "cd")), 8, nil, "overlap"},
		{"passive segment", -1, vec(1, []byte{1, 2, 'a', 'b'}), 8, nil, "passive"},
		{"offset from a global", -1, vec(1, []byte{0, 0x23, 0, 0x0b, 1, 'a'}), 8, nil, "not an i32.const"},
		{"offset expression of two instructions", -1, vec(1, []byte{0, 0x41, 1, 0x41, 2, 0x6a, 0x0b, 1, 'a'}), 8, nil, "not a lone i32.const"},
		{"segment past the section", -1, vec(1, []byte{0, 0x41, 1, 0x0b, 5, 'a'}), 8, nil, "past the end of the section"},
		{"more segments than written", -1, vec(2, seg(1, "a")), 8, nil, "truncated"},
		{"trailing bytes", -1, append(vec(1, seg(1, "a")), 7), 8, nil, "unexpected bytes"},
		{"past 4 GiB", -1, vec(1, seg(-2, "abc")), 8, nil, "past 4 GiB"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := JoinData(dataModule(tt.count, tt.data), tt.gap)
			if tt.want == nil {
				if err == nil || !strings.Contains(err.Error(), tt.err) {
					t.Fatalf("error %v, want one saying %q", err, tt.err)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			segs, err := readData(tt.want)
			if err != nil {
				t.Fatal(err)
			}
			count := -1
			if tt.count >= 0 {
				count = len(segs)
			}
			if want := dataModule(count, tt.want); !bytes.Equal(got, want) {
				t.Errorf("got  % x\nwant % x", got, want)
			}
		})
	}
	// Without a data section the module is the same.
	m := module([]byte("no data"), []byte{1, 0, 1})
	if got, err := JoinData(m, 8); err != nil || !bytes.Equal(got, m) {
		t.Errorf("a module without data: % x, %v", got, err)
	}
	for _, bad := range [][]byte{
		[]byte("MZ not a module"),
		append(dataModule(-1, vec(0)), 11, 1, 0), // two data sections
		append(dataModule(-1, vec(0)), 0, 9, 1),  // a section past the end
	} {
		if _, err := JoinData(bad, 8); err == nil {
			t.Errorf("no error for % x", bad)
		}
	}
}

// TestJoinDataGo joins the data of a program built by Go's js/wasm
// linker, then has node (V8's WebAssembly) check that the joined module
// starts with the same memory, byte for byte, as the linker's, and that
// it runs and prints what the program prints natively. Skipped without
// node.
func TestJoinDataGo(t *testing.T) {
	node, err := exec.LookPath("node")
	if err != nil {
		t.Skip("node not found")
	}
	dir := t.TempDir()
	src := `package main

import (
	"fmt"
	"strconv"
	"strings"
	"unicode"
)

type point struct {
	Name string
	X, Y float64
}

func main() {
	fmt.Printf("%s %v %s %+v\n", strings.ToUpper("données"), unicode.IsUpper('É'), strconv.Quote("a\tb"), point{"p", 1.5, -2})
}
`
	const want = "DONNÉES true \"a\\tb\" {Name:p X:1.5 Y:-2}\n"
	if err := os.WriteFile(filepath.Join(dir, "main.go"), []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "go.mod"), []byte("module joindata\n\ngo 1.26\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	linked := filepath.Join(dir, "linked.wasm")
	build := exec.Command(filepath.Join(runtime.GOROOT(), "bin", "go"), "build", "-o", linked, ".")
	build.Dir = dir
	build.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm", "GOFLAGS=")
	if out, err := build.CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	b, err := os.ReadFile(linked)
	if err != nil {
		t.Fatal(err)
	}
	joined, err := JoinData(b, DataGap)
	if err != nil {
		t.Fatal(err)
	}
	before, err := readData(dataBody(t, b))
	if err != nil {
		t.Fatal(err)
	}
	after, err := readData(dataBody(t, joined))
	if err != nil {
		t.Fatal(err)
	}
	// The linker cuts at every 8 zero bytes: even this program has
	// hundreds of segments.
	if len(before) < 100 || len(after) > 10 {
		t.Errorf("%d segments joined into %d; want 100 or more into 10 or fewer", len(before), len(after))
	}
	joinedPath := filepath.Join(dir, "joined.wasm")
	if err := os.WriteFile(joinedPath, joined, 0o644); err != nil {
		t.Fatal(err)
	}
	// Instantiating runs no Go code (the module has no start function):
	// the memory is what the data segments put there.
	js := `const fs = require("fs");
const imports = new Proxy({}, { get: () => new Proxy({}, { get: () => () => {} }) });
const mem = (f) => new Uint8Array(new WebAssembly.Instance(new WebAssembly.Module(fs.readFileSync(f)), imports).exports.mem.buffer);
const a = mem(process.argv[1]), b = mem(process.argv[2]);
let diff = a.length === b.length ? -1 : Math.min(a.length, b.length);
for (let i = 0; diff < 0 && i < a.length; i++) if (a[i] !== b[i]) diff = i;
let used = 0;
for (let i = 0; i < a.length; i++) if (a[i] !== 0) used = i;
console.log(diff < 0 ? "same" : "differ at " + diff, used > 0 ? "data" : "empty");`
	out, err := exec.Command(node, "-e", js, linked, joinedPath).CombinedOutput()
	if err != nil {
		t.Fatalf("node: %v\n%s", err, out)
	}
	if got := strings.TrimSpace(string(out)); got != "same data" {
		t.Errorf("node says %q, want the same memory, holding data", got)
	}
	// And the joined program runs (GOROOT's node runner, as make test-wasm).
	run := exec.Command(filepath.Join(runtime.GOROOT(), "lib", "wasm", "go_js_wasm_exec"), joinedPath)
	out, err = run.CombinedOutput()
	if err != nil {
		t.Fatalf("running the joined program: %v\n%s", err, out)
	}
	if string(out) != want {
		t.Errorf("the joined program printed %q, want %q", out, want)
	}
}

// dataBody is the body of the data section of module b.
func dataBody(t *testing.T, b []byte) []byte {
	t.Helper()
	for i := 8; i < len(b); {
		size, n, err := uleb(b, i+1)
		if err != nil {
			t.Fatal(err)
		}
		start, end := i+1+n, i+1+n+int(size)
		if b[i] == 11 {
			return b[start:end]
		}
		i = end
	}
	t.Fatal("no data section")
	return nil
}

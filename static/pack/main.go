// Command pack writes the single-file Porelight page (see package static).
//
//	go run ./static/pack -wasm static/build/porelight.wasm \
//		-wasmexec "$(go env GOROOT)/lib/wasm/wasm_exec.js" \
//		-vugu "$(go list -m -f '{{.Dir}}' github.com/vugu/vugu)" \
//		-demo testdata/demo.json -o static/build/porelight.html
package main

import (
	"bytes"
	"flag"
	"fmt"
	"os"
	"os/exec"

	"porelight/static"
)

func main() {
	wasm := flag.String("wasm", "", "the js/wasm program")
	wasmExec := flag.String("wasmexec", "", "wasm_exec.js of the same Go toolchain")
	vugu := flag.String("vugu", "", "directory of the vugu module (go list -m -f '{{.Dir}}' github.com/vugu/vugu)")
	demo := flag.String("demo", "testdata/demo.json", "the demo project")
	out := flag.String("o", "", "the page to write")
	zopfli := flag.String("zopfli", "zopfli", "the zopfli program, used to gzip the program when found (about 5 % smaller than Go's gzip); empty or not found: Go's compress/gzip")
	flag.Parse()
	if *wasm == "" || *wasmExec == "" || *vugu == "" || *out == "" {
		flag.Usage()
		os.Exit(2)
	}
	if err := run(*wasm, *wasmExec, *vugu, *demo, *out, *zopfli); err != nil {
		fmt.Fprintln(os.Stderr, "pack:", err)
		os.Exit(1)
	}
}

func run(wasm, wasmExec, vugu, demo, out, zopfli string) error {
	var in static.Inputs
	var err error
	if zopfli != "" {
		if path, err := exec.LookPath(zopfli); err == nil {
			in.Gzip = func(b []byte) ([]byte, error) { return runZopfli(path, b) }
		}
	}
	if in.Wasm, err = os.ReadFile(wasm); err != nil {
		return err
	}
	if in.WasmExec, err = os.ReadFile(wasmExec); err != nil {
		return err
	}
	if in.Demo, err = os.ReadFile(demo); err != nil {
		return err
	}
	if in.VuguHelper, err = static.HelperScript(vugu); err != nil {
		return err
	}
	page, err := static.Pack(in)
	if err != nil {
		return err
	}
	if err := os.WriteFile(out, page, 0o644); err != nil {
		return err
	}
	how := "gzip by compress/gzip"
	if in.Gzip != nil {
		how = "gzip by zopfli"
	}
	fmt.Printf("wrote %s (%.2f MB, %s)\n", out, float64(len(page))/1e6, how)
	return nil
}

// runZopfli gzips b with the zopfli program at path, three iterations:
// 0.26 % (5 kB) smaller than one for about 3 s more on 2 cores; the first
// takes most of the time, and five gain only 1 kB more.
func runZopfli(path string, b []byte) ([]byte, error) {
	f, err := os.CreateTemp("", "porelight-*.wasm")
	if err != nil {
		return nil, err
	}
	defer os.Remove(f.Name())
	if _, err := f.Write(b); err != nil {
		f.Close()
		return nil, err
	}
	if err := f.Close(); err != nil {
		return nil, err
	}
	var stderr bytes.Buffer
	cmd := exec.Command(path, "--i3", "--gzip", "-c", f.Name())
	cmd.Stderr = &stderr
	out, err := cmd.Output()
	if err != nil {
		return nil, fmt.Errorf("%s: %v %s", path, err, stderr.String())
	}
	return out, nil
}

// Command pack writes the single-file Porelight page (see package static).
//
//	go run ./static/pack -wasm static/build/porelight.wasm \
//		-wasmexec "$(go env GOROOT)/lib/wasm/wasm_exec.js" \
//		-vugu "$(go list -m -f '{{.Dir}}' github.com/vugu/vugu)" \
//		-demo testdata/demo.json -o static/build/porelight.html
package main

import (
	"flag"
	"fmt"
	"os"

	"porelight/static"
)

func main() {
	wasm := flag.String("wasm", "", "the js/wasm program")
	wasmExec := flag.String("wasmexec", "", "wasm_exec.js of the same Go toolchain")
	vugu := flag.String("vugu", "", "directory of the vugu module (go list -m -f '{{.Dir}}' github.com/vugu/vugu)")
	demo := flag.String("demo", "testdata/demo.json", "the demo project")
	out := flag.String("o", "", "the page to write")
	flag.Parse()
	if *wasm == "" || *wasmExec == "" || *vugu == "" || *out == "" {
		flag.Usage()
		os.Exit(2)
	}
	if err := run(*wasm, *wasmExec, *vugu, *demo, *out); err != nil {
		fmt.Fprintln(os.Stderr, "pack:", err)
		os.Exit(1)
	}
}

func run(wasm, wasmExec, vugu, demo, out string) error {
	var in static.Inputs
	var err error
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
	fmt.Printf("wrote %s (%.2f MB)\n", out, float64(len(page))/1e6)
	return nil
}

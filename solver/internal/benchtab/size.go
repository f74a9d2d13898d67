package main

import (
	"bytes"
	"compress/gzip"
	"os"
	"path/filepath"
	"time"
)

// sizes holds section 4: the built page, when it exists.
type sizes struct {
	built                time.Time // when the page was written; zero when not built
	wasm, wasmGzip, page int64
}

// pageLimit is the goal for the page: 2.5 MB (10⁶ bytes to the MB).
const pageLimit = 2_500_000

// measureSizes reads static/build/porelight.wasm and porelight.html under
// root; gzip -9 is compress/gzip at BestCompression.
func measureSizes(root string) (sizes, error) {
	var s sizes
	wasm, err := os.ReadFile(filepath.Join(root, "static", "build", "porelight.wasm"))
	if os.IsNotExist(err) {
		return s, nil
	} else if err != nil {
		return s, err
	}
	page, err := os.Stat(filepath.Join(root, "static", "build", "porelight.html"))
	if os.IsNotExist(err) {
		return s, nil
	} else if err != nil {
		return s, err
	}
	var buf bytes.Buffer
	zw, err := gzip.NewWriterLevel(&buf, gzip.BestCompression)
	if err != nil {
		return s, err
	}
	if _, err := zw.Write(wasm); err != nil {
		return s, err
	}
	if err := zw.Close(); err != nil {
		return s, err
	}
	return sizes{built: page.ModTime(), wasm: int64(len(wasm)), wasmGzip: int64(buf.Len()), page: page.Size()}, nil
}

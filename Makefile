# Porelight build. `make run` builds the page and opens it on the demo
# project; `make test` is the one test command (README, .ci/run).

GO      ?= go
GOROOT  := $(shell $(GO) env GOROOT)
BUILD   := static/build
WASM    := $(BUILD)/porelight.wasm
PAGE    := $(BUILD)/porelight.html
WASMEXEC := $(GOROOT)/lib/wasm/go_js_wasm_exec

.PHONY: all build page wasm run test test-native test-wasm vet gen gen-check e2e bench clean

all: build

test: vet test-native test-wasm gen-check page e2e

vet:
	@bad=$$(gofmt -l $$(git ls-files '*.go' 2>/dev/null || find . -name '*.go')); \
	if [ -n "$$bad" ]; then echo "gofmt needed:"; echo "$$bad"; exit 1; fi
	$(GO) vet ./...
	GOOS=js GOARCH=wasm $(GO) vet ./...

# -short skips the browser tests here; `e2e` runs them on the built page.
test-native:
	$(GO) test -short -count=1 ./...

# Package tests of the js/wasm build under node. Without node they are
# skipped, except under CI (CI set), where a skip would pass unseen.
test-wasm:
	@if command -v node >/dev/null; then \
		echo 'GOOS=js GOARCH=wasm $(GO) test -exec=$(WASMEXEC) ./wasm/... ./ui/...'; \
		GOOS=js GOARCH=wasm $(GO) test -count=1 -exec="$(WASMEXEC)" ./wasm/... ./ui/...; \
	elif [ -n "$$CI" ]; then echo "node not found, and CI is set: the js/wasm package tests cannot run"; exit 1; \
	else echo "node not found: skipping the js/wasm package tests"; fi

# Regenerate the vugu components' Go code (committed; see DEVELOPERS.md).
gen:
	rm -f ui/*_gen.go ui/plot/*_gen.go
	$(GO) generate ./ui/...

# Fails when the committed generated code differs from a fresh generation.
gen-check: gen
	@git diff --exit-code -- ui || { echo "generated code is stale: run 'make gen' and commit"; exit 1; }
	@untracked=$$(git ls-files --others --exclude-standard -- 'ui/*_gen.go'); \
	if [ -n "$$untracked" ]; then echo "generated files not committed: $$untracked"; exit 1; fi

# Inlining is switched off (-l) for every package but the numerics
# (porelight/solver and its subpackages, gonum), vugu's renderer, the Go
# runtime and syscall/js, whose speed the page rests on: the empty
# per-package -gcflags restore the default there. It saves about 0.38 MB
# of the gzipped program (the page must stay under 2.5 MB); the UI's own
# code does not need inlining to keep up with typing.
WASMFLAGS := -trimpath -ldflags="-s -w" -gcflags=all=-l \
	-gcflags=porelight/solver/...= -gcflags=gonum.org/v1/gonum/...= \
	-gcflags=github.com/vugu/...= -gcflags=runtime= -gcflags=syscall/js=

wasm:
	@mkdir -p $(BUILD)
	GOOS=js GOARCH=wasm $(GO) build $(WASMFLAGS) -o $(WASM) ./wasm

page build: wasm
	$(GO) run ./static/pack -wasm $(WASM) -wasmexec "$(GOROOT)/lib/wasm/wasm_exec.js" \
		-vugu "$$($(GO) list -m -f '{{.Dir}}' github.com/vugu/vugu)" \
		-demo testdata/demo.json -o $(PAGE)

run: build
	@echo "page: file://$(CURDIR)/$(PAGE)"
	@if [ -n "$${DISPLAY}$${WAYLAND_DISPLAY}" ] && command -v xdg-open >/dev/null; then \
		xdg-open "$(PAGE)" >/dev/null 2>&1 || echo "could not open a browser: open the file above"; \
	else echo "no desktop session: open the file above in a browser"; fi

# Browser tests of the built page in headless Chromium. They skip when no
# browser is found, and fail instead when CI or E2E is set.
e2e:
	$(GO) test -count=1 -run 'E2E' -v ./static

# The benchmark table (README links the latest): solver scaling, baselines
# at equal accuracy, accuracy per cost, page sizes, and the browser figures
# when Chromium is installed. Copies it to solver/internal/benchtab/latest.md and .csv.
BROWSER_JSON := $(BUILD)/browser.json
bench: page
	@rm -f $(BROWSER_JSON)
	@if [ -n "$$CHROME_PATH" ] || command -v chromium >/dev/null || command -v chromium-browser >/dev/null; then \
		PORELIGHT_BENCH_OUT=$(CURDIR)/$(BROWSER_JSON) $(GO) test -count=1 -run '^TestBrowserBench$$' ./static; \
	else echo "no Chromium: the browser rows will say 'not measured'"; fi
	$(GO) run ./solver/internal/benchtab $$( [ -f $(BROWSER_JSON) ] && echo -browser $(BROWSER_JSON) ) -out $(BUILD)/bench
	@cp $(BUILD)/bench/bench.md solver/internal/benchtab/latest.md && cp $(BUILD)/bench/bench.csv solver/internal/benchtab/latest.csv
	@echo "table: solver/internal/benchtab/latest.md"

clean:
	rm -rf $(BUILD)

# Porelight build. `make run` builds the page and opens it on the demo
# project; `make test` is the one test command (README, .ci/run).

GO      ?= go
GOROOT  := $(shell $(GO) env GOROOT)
BUILD   := static/build
WASM    := $(BUILD)/porelight.wasm
PAGE    := $(BUILD)/porelight.html

.PHONY: all build run test test-native test-wasm vet gen gen-check bench clean

all: build

test: vet test-native test-wasm

vet:
	@bad=$$(gofmt -l $$(git ls-files '*.go' 2>/dev/null || find . -name '*.go')); \
	if [ -n "$$bad" ]; then echo "gofmt needed:"; echo "$$bad"; exit 1; fi
	$(GO) vet ./...
	GOOS=js GOARCH=wasm $(GO) vet ./...

test-native:
	$(GO) test -count=1 ./...

test-wasm:
	GOOS=js GOARCH=wasm $(GO) build -o /dev/null ./...

bench:
	$(GO) test -run '^$$' -bench . -benchmem ./solver

clean:
	rm -rf $(BUILD)

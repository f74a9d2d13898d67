package static

import (
	"errors"
	"fmt"
)

// MaxMemoryPages is the most linear memory the page's program may use, in
// 64 KiB WebAssembly pages: 16384 pages are 1 GiB. Go's js/wasm linker
// declares its memory without a maximum, so a runaway solve would grow it
// to the 4 GiB of wasm32 (many seconds, and as much of the machine's RAM)
// before failing; with the cap it runs out of memory in about a second and
// the page replaces the worker (see notes on the worker in DEVELOPERS.md).
const MaxMemoryPages = 16384

// CapMemory returns a copy of the WebAssembly module wasm whose one
// defined memory has at most maxPages pages: the limits of the memory
// section (id 5) become flags 1, the same minimum and maxPages. A maximum
// already below maxPages is kept. It fails on a module that is not
// WebAssembly, has no memory section or more than one memory, or whose
// minimum exceeds maxPages. Other sections are copied byte for byte.
func CapMemory(wasm []byte, maxPages uint32) ([]byte, error) {
	secs, err := sections(wasm)
	if err != nil {
		return nil, err
	}
	out := append([]byte(nil), wasm[:8]...)
	found := false
	for _, sec := range secs {
		if sec.id != 5 {
			out = append(out, wasm[sec.at:sec.end]...)
			continue
		}
		if found {
			return nil, errors.New("pack: the module has two memory sections")
		}
		found = true
		body, err := capLimits(wasm[sec.start:sec.end], maxPages)
		if err != nil {
			return nil, err
		}
		out = appendSection(out, 5, body)
	}
	if !found {
		return nil, errors.New("pack: the module defines no memory")
	}
	return out, nil
}

// section is one section of a WebAssembly module: its id, its first
// byte, and its body.
type section struct {
	id             byte
	at, start, end int
}

// sections checks that wasm is a WebAssembly module and lists its
// sections in order.
func sections(wasm []byte) ([]section, error) {
	if len(wasm) < 8 || string(wasm[:4]) != "\x00asm" {
		return nil, errors.New("pack: the program is not WebAssembly")
	}
	var secs []section
	for i := 8; i < len(wasm); {
		id := wasm[i]
		size, n, err := uleb(wasm, i+1)
		if err != nil {
			return nil, fmt.Errorf("pack: section at byte %d: %w", i, err)
		}
		start := i + 1 + n
		end := start + int(size)
		if end > len(wasm) || end < start {
			return nil, fmt.Errorf("pack: section %d at byte %d runs past the end of the module", id, i)
		}
		secs = append(secs, section{id, i, start, end})
		i = end
	}
	return secs, nil
}

// appendSection appends a section with id and body to out.
func appendSection(out []byte, id byte, body []byte) []byte {
	out = append(out, id)
	out = appendULEB(out, uint32(len(body)))
	return append(out, body...)
}

// capLimits rewrites the body of a memory section: vec(limits).
func capLimits(b []byte, maxPages uint32) ([]byte, error) {
	count, n, err := uleb(b, 0)
	if err != nil {
		return nil, fmt.Errorf("pack: memory section: %w", err)
	}
	if count != 1 {
		return nil, fmt.Errorf("pack: the module has %d memories, want 1", count)
	}
	i := n
	if i >= len(b) {
		return nil, errors.New("pack: memory section: truncated")
	}
	flags := b[i]
	i++
	if flags != 0 && flags != 1 {
		return nil, fmt.Errorf("pack: memory limits flags %#x (shared or 64-bit memory) not supported", flags)
	}
	lo, n, err := uleb(b, i)
	if err != nil {
		return nil, fmt.Errorf("pack: memory minimum: %w", err)
	}
	i += n
	hi := maxPages
	if flags == 1 {
		m, n, err := uleb(b, i)
		if err != nil {
			return nil, fmt.Errorf("pack: memory maximum: %w", err)
		}
		i += n
		hi = min(m, maxPages)
	}
	if i != len(b) {
		return nil, errors.New("pack: memory section: unexpected bytes after the limits")
	}
	if lo > hi {
		return nil, fmt.Errorf("pack: the program starts with %d pages of memory, more than the cap of %d", lo, hi)
	}
	out := []byte{1, 1} // one memory; flags 1: a minimum and a maximum
	out = appendULEB(out, lo)
	return appendULEB(out, hi), nil
}

// uleb reads an unsigned LEB128 number of at most 32 bits at b[i:].
func uleb(b []byte, i int) (v uint32, n int, err error) {
	var shift uint
	for n = 0; n < 5; n++ {
		if i+n >= len(b) {
			return 0, 0, errors.New("truncated number")
		}
		c := b[i+n]
		if n == 4 && c > 0x0f {
			return 0, 0, errors.New("number exceeds 32 bits")
		}
		v |= uint32(c&0x7f) << shift
		if c&0x80 == 0 {
			return v, n + 1, nil
		}
		shift += 7
	}
	return 0, 0, errors.New("number exceeds 32 bits")
}

func appendULEB(b []byte, v uint32) []byte {
	for {
		c := byte(v & 0x7f)
		v >>= 7
		if v == 0 {
			return append(b, c)
		}
		b = append(b, c|0x80)
	}
}

package static

import (
	"cmp"
	"errors"
	"fmt"
	"slices"
)

// DataGap is the longest run of zero bytes that JoinData writes out to
// join two data segments. Go's js/wasm linker cuts its data into a new
// segment at every run of 8 or more zero bytes, to keep the raw module
// small: about 99 000 segments for the page's program, at the linker's
// limit of 100 000. Under gzip that is the wrong trade: each segment's
// header (its offset and length, about 7 bytes that never repeat) costs
// more than the zeros it saves, which gzip packs into a few bytes per
// 258. Joined across gaps up to DataGap the program has 3 segments; the
// module grows from 9.50 to 10.47 MB but gzips 168 kB (7 %) smaller,
// measured on the page's program with zopfli.
const DataGap = 4096

// JoinData returns a copy of the WebAssembly module wasm whose active
// data segments (all at constant offsets in memory 0, as Go's linker
// writes them) are sorted by offset and joined where the gap between
// two is at most gap bytes, the gap written as zeros. Linear memory
// starts zeroed and the segments do not overlap, so the memory the
// module starts with is the same byte for byte. A data count section
// (id 12), if any, is updated. A module without a data section is
// returned as it is. JoinData fails on segments it does not know to
// join: passive ones, another memory, an offset that is not an
// i32.const, segments that overlap or that end past 4 GiB. Other
// sections are copied byte for byte.
func JoinData(wasm []byte, gap int) ([]byte, error) {
	secs, err := sections(wasm)
	if err != nil {
		return nil, err
	}
	data, count := -1, -1
	for k, sec := range secs {
		switch {
		case sec.id == 11 && data >= 0, sec.id == 12 && count >= 0:
			return nil, fmt.Errorf("pack: the module has two sections %d", sec.id)
		case sec.id == 11:
			data = k
		case sec.id == 12:
			count = k
		}
	}
	if data < 0 {
		return wasm, nil
	}
	segs, err := readData(wasm[secs[data].start:secs[data].end])
	if err != nil {
		return nil, err
	}
	slices.SortStableFunc(segs, func(a, b dataSegment) int { return cmp.Compare(a.offset, b.offset) })
	// Each joined segment's bytes are a new slice, grown by append.
	var joined []dataSegment
	for _, s := range segs {
		if len(joined) > 0 {
			last := &joined[len(joined)-1]
			end := last.offset + uint64(len(last.bytes))
			if s.offset < end {
				return nil, fmt.Errorf("pack: data segments overlap at memory offset %d", s.offset)
			}
			if s.offset-end <= uint64(gap) {
				last.bytes = append(append(last.bytes, make([]byte, s.offset-end)...), s.bytes...)
				continue
			}
		}
		joined = append(joined, dataSegment{s.offset, append([]byte(nil), s.bytes...)})
	}
	out := append([]byte(nil), wasm[:8]...)
	for k, s := range secs {
		var body []byte
		switch k {
		case data:
			body = appendULEB(nil, uint32(len(joined)))
			for _, s := range joined {
				body = append(body, 0, 0x41) // memory 0, i32.const
				body = appendSLEB32(body, int32(uint32(s.offset)))
				body = append(body, 0x0b) // end
				body = appendULEB(body, uint32(len(s.bytes)))
				body = append(body, s.bytes...)
			}
		case count:
			body = appendULEB(nil, uint32(len(joined)))
		default:
			out = append(out, wasm[s.at:s.end]...)
			continue
		}
		out = appendSection(out, s.id, body)
	}
	return out, nil
}

// dataSegment is an active segment of memory 0: bytes at offset.
type dataSegment struct {
	offset uint64
	bytes  []byte
}

// readData reads the body of a data section: vec(data), every entry of
// the form 0x00 (active, memory 0), i32.const offset, end, vec(byte).
func readData(b []byte) ([]dataSegment, error) {
	count, i, err := uleb(b, 0)
	if err != nil {
		return nil, fmt.Errorf("pack: data section: %w", err)
	}
	segs := make([]dataSegment, 0, min(int(count), len(b)))
	for k := range int(count) {
		if i+2 > len(b) {
			return nil, fmt.Errorf("pack: data segment %d: truncated", k)
		}
		if b[i] != 0 {
			return nil, fmt.Errorf("pack: data segment %d has flags %#x (passive, or another memory): not supported", k, b[i])
		}
		if b[i+1] != 0x41 {
			return nil, fmt.Errorf("pack: data segment %d: its offset is not an i32.const", k)
		}
		off, n, err := sleb32(b, i+2)
		if err != nil {
			return nil, fmt.Errorf("pack: data segment %d: offset: %w", k, err)
		}
		i += 2 + n
		if i >= len(b) || b[i] != 0x0b {
			return nil, fmt.Errorf("pack: data segment %d: its offset is not a lone i32.const", k)
		}
		i++
		size, n, err := uleb(b, i)
		if err != nil {
			return nil, fmt.Errorf("pack: data segment %d: length: %w", k, err)
		}
		i += n
		if int(size) > len(b)-i {
			return nil, fmt.Errorf("pack: data segment %d runs past the end of the section", k)
		}
		// The offset is an unsigned address in memory.
		s := dataSegment{offset: uint64(uint32(off)), bytes: b[i : i+int(size)]}
		if s.offset+uint64(size) > 1<<32 {
			return nil, fmt.Errorf("pack: data segment %d ends past 4 GiB", k)
		}
		segs = append(segs, s)
		i += int(size)
	}
	if i != len(b) {
		return nil, errors.New("pack: data section: unexpected bytes after the segments")
	}
	return segs, nil
}

// sleb32 reads a signed LEB128 number of at most 32 bits at b[i:].
func sleb32(b []byte, i int) (v int32, n int, err error) {
	var shift uint
	for n = 0; n < 5; n++ {
		if i+n >= len(b) {
			return 0, 0, errors.New("truncated number")
		}
		c := b[i+n]
		v |= int32(c&0x7f) << shift
		shift += 7
		if c&0x80 == 0 {
			if shift < 32 && c&0x40 != 0 {
				v |= -1 << shift
			}
			return v, n + 1, nil
		}
	}
	return 0, 0, errors.New("number exceeds 32 bits")
}

func appendSLEB32(b []byte, v int32) []byte {
	for {
		c := byte(v & 0x7f)
		v >>= 7
		if (v == 0 && c&0x40 == 0) || (v == -1 && c&0x40 != 0) {
			return append(b, c)
		}
		b = append(b, c|0x80)
	}
}

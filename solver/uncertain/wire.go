package uncertain

import (
	"bytes"
	"encoding/binary"
	"errors"
	"math"
)

// samplesMagic starts the binary form of a list of samples: what a
// worker sends back for a batch of realisations. JSON would do, but in
// js/wasm decoding some 130 kB of floats per batch costs the page's own
// thread about as much as a solve, and that thread shares the cores with
// the workers. Not a file format: both ends are the same build.
const samplesMagic = "porelight-samples-1\n"

var errSamples = errors.New("uncertain: not a binary list of samples")

// IsBinarySamples reports whether data starts as EncodeSamples' output.
func IsBinarySamples(data []byte) bool { return bytes.HasPrefix(data, []byte(samplesMagic)) }

// EncodeSamples writes samples in the binary form: the magic, the count,
// then per sample its run, T90 (NaN for nil), Final, Remaining, the
// settlement and degree series (uvarint length, float64 little-endian
// bits each) and Problem (uvarint length, bytes).
func EncodeSamples(samples []Sample) []byte {
	n := len(samplesMagic) + 10
	for _, s := range samples {
		n += 40 + 8*(len(s.Settlement)+len(s.Degree)) + len(s.Problem)
	}
	b := make([]byte, 0, n)
	b = append(b, samplesMagic...)
	b = binary.AppendUvarint(b, uint64(len(samples)))
	f := func(v float64) { b = binary.LittleEndian.AppendUint64(b, math.Float64bits(v)) }
	for _, s := range samples {
		b = binary.AppendUvarint(b, uint64(s.Run))
		t := math.NaN()
		if s.T90 != nil {
			t = *s.T90
		}
		f(t)
		f(s.Final)
		f(s.Remaining)
		for _, vs := range [][]float64{s.Settlement, s.Degree} {
			b = binary.AppendUvarint(b, uint64(len(vs)))
			for _, v := range vs {
				f(v)
			}
		}
		b = binary.AppendUvarint(b, uint64(len(s.Problem)))
		b = append(b, s.Problem...)
	}
	return b
}

// DecodeSamples reads what EncodeSamples wrote.
func DecodeSamples(data []byte) ([]Sample, error) {
	if !IsBinarySamples(data) {
		return nil, errSamples
	}
	d := data[len(samplesMagic):]
	bad := false
	u := func() int {
		v, k := binary.Uvarint(d)
		if k <= 0 || v > math.MaxInt32 {
			bad = true
			return 0
		}
		d = d[k:]
		return int(v)
	}
	f := func() float64 {
		if len(d) < 8 {
			bad = true
			return 0
		}
		v := math.Float64frombits(binary.LittleEndian.Uint64(d))
		d = d[8:]
		return v
	}
	n := u()
	out := make([]Sample, 0, min(n, len(d)/24)) // a sample takes at least 24 bytes
	for range n {
		if bad {
			break
		}
		var s Sample
		s.Run = u()
		if t := f(); !math.IsNaN(t) {
			s.T90 = &t
		}
		s.Final, s.Remaining = f(), f()
		for _, dst := range []*[]float64{&s.Settlement, &s.Degree} {
			m := u()
			if m > len(d)/8 {
				bad = true
				break
			}
			if m > 0 {
				*dst = make([]float64, m)
				for i := range *dst {
					(*dst)[i] = f()
				}
			}
		}
		m := u()
		if m > len(d) {
			bad = true
			break
		}
		s.Problem, d = string(d[:m]), d[m:]
		out = append(out, s)
	}
	if bad || len(d) != 0 {
		return nil, errSamples
	}
	return out, nil
}

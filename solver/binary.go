package solver

import (
	"bytes"
	"encoding/binary"
	"errors"
	"fmt"
	"math"
	"reflect"
	"sync"
)

// The binary forms of a Result and of a Project carry a solve from one
// copy of this program to another (the page to its solve worker and
// back) faster than JSON: no float formatting or parsing, no field-name
// matching, about half the bytes. They are not file formats: both ends
// must be the same build, and the magic strings below change whenever
// the types change in a way that old readers would misread.
//
// Layout: the magic, then the value's fields in declaration order, each
// as
//
//	bool      one byte, 0 or 1
//	int       zig-zag varint
//	float64   8 bytes, IEEE 754 bits, little-endian
//	string    uvarint length, then the bytes
//	pointer   one byte, 0 for nil, 1 followed by the value
//	slice     uvarint length + 1 (0 for nil), then the elements
//	struct    its exported fields in order
//
// so nil and empty slices, and nil and zero pointers, survive the round
// trip, and a decoded value is reflect.DeepEqual to the encoded one.
const (
	resultMagic  = "porelight-result-2\n"  // 2: stage stresses, submerged fill, the soil model's series
	projectMagic = "porelight-project-2\n" // 2: fills and loaded areas, drains, the soil model, Asaoka settings
)

// errBinary is the reason of every error of UnmarshalBinary.
var errBinary = errors.New("not a binary form of this build")

// MarshalBinary encodes r in the binary form (see UnmarshalBinary). It
// implements encoding.BinaryMarshaler.
func (r *Result) MarshalBinary() ([]byte, error) { return marshalBinary(resultMagic, r) }

// UnmarshalBinary replaces r by the Result encoded in data by
// MarshalBinary of the same build. It implements
// encoding.BinaryUnmarshaler.
func (r *Result) UnmarshalBinary(data []byte) error { return unmarshalBinary(resultMagic, data, r) }

// IsBinaryResult reports whether data starts as Result.MarshalBinary's
// output.
func IsBinaryResult(data []byte) bool { return bytes.HasPrefix(data, []byte(resultMagic)) }

// MarshalBinary encodes p in the binary form: what the page sends its
// solve worker instead of the project's JSON. The form holds exactly
// what Decode would have given the worker; Solve still validates it.
func (p *Project) MarshalBinary() ([]byte, error) { return marshalBinary(projectMagic, p) }

// UnmarshalBinary replaces p by the Project encoded in data by
// MarshalBinary of the same build.
func (p *Project) UnmarshalBinary(data []byte) error { return unmarshalBinary(projectMagic, data, p) }

// IsBinaryProject reports whether data starts as Project.MarshalBinary's
// output.
func IsBinaryProject(data []byte) bool { return bytes.HasPrefix(data, []byte(projectMagic)) }

// binBuffers holds the buffers marshalBinary encodes into, grown to the
// size of what they carried: a result (the demo's is some 130 KB) grew
// from a small buffer by doubling, and its copies and their collection
// took most of the time of an encode.
var binBuffers = sync.Pool{New: func() any { return new([]byte) }}

// marshalBinary encodes *ptr after magic, into a pooled buffer, and
// returns a copy of exactly its length.
func marshalBinary[T any](magic string, ptr *T) ([]byte, error) {
	bp := binBuffers.Get().(*[]byte)
	defer binBuffers.Put(bp)
	e := binEncoder{buf: append((*bp)[:0], magic...)}
	err := e.value(reflect.ValueOf(ptr).Elem())
	*bp = e.buf[:0]
	if err != nil {
		return nil, err
	}
	return bytes.Clone(e.buf), nil
}

// unmarshalBinary decodes data into *ptr, leaving it alone on error.
func unmarshalBinary[T any](magic string, data []byte, ptr *T) error {
	if !bytes.HasPrefix(data, []byte(magic)) {
		return fmt.Errorf("%w: the header is missing", errBinary)
	}
	d := binDecoder{buf: data[len(magic):]}
	var out T
	if err := d.value(reflect.ValueOf(&out).Elem()); err != nil {
		return err
	}
	if len(d.buf) != 0 {
		return fmt.Errorf("%w: %d bytes left over", errBinary, len(d.buf))
	}
	*ptr = out
	return nil
}

type binEncoder struct{ buf []byte }

func (e *binEncoder) value(v reflect.Value) error {
	switch v.Kind() {
	case reflect.Bool:
		b := byte(0)
		if v.Bool() {
			b = 1
		}
		e.buf = append(e.buf, b)
	case reflect.Int:
		e.buf = binary.AppendVarint(e.buf, v.Int())
	case reflect.Float64:
		e.buf = binary.LittleEndian.AppendUint64(e.buf, math.Float64bits(v.Float()))
	case reflect.String:
		e.buf = binary.AppendUvarint(e.buf, uint64(v.Len()))
		e.buf = append(e.buf, v.String()...)
	case reflect.Pointer:
		if v.IsNil() {
			e.buf = append(e.buf, 0)
			return nil
		}
		e.buf = append(e.buf, 1)
		return e.value(v.Elem())
	case reflect.Slice:
		if v.IsNil() {
			e.buf = append(e.buf, 0)
			return nil
		}
		e.buf = binary.AppendUvarint(e.buf, uint64(v.Len())+1)
		if fs, ok := v.Interface().([]float64); ok {
			for _, f := range fs {
				e.buf = binary.LittleEndian.AppendUint64(e.buf, math.Float64bits(f))
			}
			return nil
		}
		for i := range v.Len() {
			if err := e.value(v.Index(i)); err != nil {
				return err
			}
		}
	case reflect.Struct:
		t := v.Type()
		for i := range t.NumField() {
			if !t.Field(i).IsExported() {
				return fmt.Errorf("solver: the binary form cannot carry the unexported field %s.%s", t, t.Field(i).Name)
			}
			if err := e.value(v.Field(i)); err != nil {
				return err
			}
		}
	default:
		return fmt.Errorf("solver: the binary result form has no encoding for %s", v.Type())
	}
	return nil
}

type binDecoder struct{ buf []byte }

func (d *binDecoder) short(what string) error {
	return fmt.Errorf("%w: it ends inside a %s", errBinary, what)
}

func (d *binDecoder) uvarint() (uint64, error) {
	n, k := binary.Uvarint(d.buf)
	if k <= 0 {
		return 0, d.short("length")
	}
	d.buf = d.buf[k:]
	return n, nil
}

func (d *binDecoder) float() (float64, error) {
	if len(d.buf) < 8 {
		return 0, d.short("number")
	}
	f := math.Float64frombits(binary.LittleEndian.Uint64(d.buf))
	d.buf = d.buf[8:]
	return f, nil
}

func (d *binDecoder) flag() (bool, error) {
	if len(d.buf) < 1 {
		return false, d.short("flag")
	}
	b := d.buf[0]
	d.buf = d.buf[1:]
	if b > 1 {
		return false, fmt.Errorf("%w: a flag byte is %d", errBinary, b)
	}
	return b == 1, nil
}

func (d *binDecoder) value(v reflect.Value) error {
	switch v.Kind() {
	case reflect.Bool:
		b, err := d.flag()
		v.SetBool(b)
		return err
	case reflect.Int:
		n, k := binary.Varint(d.buf)
		if k <= 0 {
			return d.short("whole number")
		}
		d.buf = d.buf[k:]
		v.SetInt(n)
	case reflect.Float64:
		f, err := d.float()
		v.SetFloat(f)
		return err
	case reflect.String:
		n, err := d.uvarint()
		if err != nil {
			return err
		}
		if n > uint64(len(d.buf)) {
			return d.short("text")
		}
		v.SetString(string(d.buf[:n]))
		d.buf = d.buf[n:]
	case reflect.Pointer:
		set, err := d.flag()
		if err != nil || !set {
			return err
		}
		p := reflect.New(v.Type().Elem())
		if err := d.value(p.Elem()); err != nil {
			return err
		}
		v.Set(p)
	case reflect.Slice:
		n, err := d.uvarint()
		if err != nil || n == 0 {
			return err
		}
		n--
		// Every element takes at least one byte, a float64 eight: a
		// length beyond what is left is damage, not a reason to allocate.
		least := uint64(1)
		if v.Type().Elem().Kind() == reflect.Float64 {
			least = 8
		}
		if n > uint64(len(d.buf))/least {
			return d.short("list")
		}
		s := reflect.MakeSlice(v.Type(), int(n), int(n))
		if fs, ok := s.Interface().([]float64); ok {
			for i := range fs {
				fs[i] = math.Float64frombits(binary.LittleEndian.Uint64(d.buf[8*i:]))
			}
			d.buf = d.buf[8*n:]
		} else {
			for i := range int(n) {
				if err := d.value(s.Index(i)); err != nil {
					return err
				}
			}
		}
		v.Set(s)
	case reflect.Struct:
		t := v.Type()
		for i := range t.NumField() {
			if !t.Field(i).IsExported() {
				continue
			}
			if err := d.value(v.Field(i)); err != nil {
				return err
			}
		}
	default:
		return fmt.Errorf("solver: the binary result form has no encoding for %s", v.Type())
	}
	return nil
}

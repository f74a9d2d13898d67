package solver

import (
	"encoding/json"
	"errors"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"reflect"
	"testing"
)

// fill sets v (and everything below it) to random values: pointers are
// nil or set, slices nil, empty or up to three long, so that every field
// of Result, those added later included, takes part in the round trip.
func fill(r *rand.Rand, v reflect.Value) {
	switch v.Kind() {
	case reflect.Bool:
		v.SetBool(r.IntN(2) == 1)
	case reflect.Int:
		v.SetInt(r.Int64N(1<<40) - 1<<39)
	case reflect.Float64:
		specials := []float64{0, math.Copysign(0, -1), math.SmallestNonzeroFloat64, math.MaxFloat64, -1e-300}
		if r.IntN(4) == 0 {
			v.SetFloat(specials[r.IntN(len(specials))])
		} else {
			v.SetFloat(r.NormFloat64() * math.Pow(10, float64(r.IntN(40)-20)))
		}
	case reflect.String:
		v.SetString([]string{"", "clay", "σ′ ≥ 0 — ünïcode", "layers[2].k"}[r.IntN(4)])
	case reflect.Pointer:
		if r.IntN(3) > 0 {
			p := reflect.New(v.Type().Elem())
			fill(r, p.Elem())
			v.Set(p)
		}
	case reflect.Slice:
		switch n := r.IntN(5) - 1; {
		case n < 0: // nil
		default:
			s := reflect.MakeSlice(v.Type(), n, n)
			for i := range n {
				fill(r, s.Index(i))
			}
			v.Set(s)
		}
	case reflect.Struct:
		for i := range v.NumField() {
			if v.Type().Field(i).IsExported() {
				fill(r, v.Field(i))
			}
		}
	default:
		panic("fill: no case for " + v.Type().String())
	}
}

// binaryForm is one of the types with a binary form.
type binaryForm interface {
	MarshalBinary() ([]byte, error)
	UnmarshalBinary([]byte) error
}

func TestBinaryRoundTrip(t *testing.T) {
	// Every kind of field and value, on 200 random values of each type
	// (fixed seeds): the decoded value must equal the encoded one exactly
	// (reflect.DeepEqual: same bits, same nil-ness), the header tells
	// the two forms apart, and a form is the caller's: encoding the next
	// value (into the pooled buffer) leaves the last one's intact.
	cases := []struct {
		name  string
		new   func() binaryForm
		is    func([]byte) bool
		other func([]byte) bool
	}{
		{"Result", func() binaryForm { return new(Result) }, IsBinaryResult, IsBinaryProject},
		{"Project", func() binaryForm { return new(Project) }, IsBinaryProject, IsBinaryResult},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var last []byte
			var lastWant binaryForm
			for seed := range uint64(200) {
				r := rand.New(rand.NewPCG(seed, 7))
				want := c.new()
				fill(r, reflect.ValueOf(want).Elem())
				data, err := want.MarshalBinary()
				if err != nil {
					t.Fatalf("seed %d: %v", seed, err)
				}
				if !c.is(data) || c.other(data) {
					t.Fatalf("seed %d: the header does not say what the data is", seed)
				}
				got := c.new()
				if err := got.UnmarshalBinary(data); err != nil {
					t.Fatalf("seed %d: %v", seed, err)
				}
				if !reflect.DeepEqual(got, want) {
					t.Fatalf("seed %d: the round trip changed the value", seed)
				}
				if err := c.new().UnmarshalBinary(append([]byte(nil), data...)[:len(data)-1]); err == nil && len(data) > 0 {
					t.Fatalf("seed %d: a truncated form was accepted", seed)
				}
				if last != nil {
					prev := c.new()
					if err := prev.UnmarshalBinary(last); err != nil || !reflect.DeepEqual(prev, lastWant) {
						t.Fatalf("seed %d: encoding this value changed the last one's form (%v)", seed, err)
					}
				}
				last, lastWant = data, want
			}
		})
	}
	// The other type's form is refused by its header.
	var p Project
	data, _ := (&Result{}).MarshalBinary()
	if err := p.UnmarshalBinary(data); !errors.Is(err, errBinary) {
		t.Errorf("a Result's form read as a Project: %v", err)
	}
}

func TestProjectBinaryFiles(t *testing.T) {
	// Every project file in testdata/: Decode(file) and the binary round
	// trip of it are the same project.
	files, err := filepath.Glob("../testdata/*/*.json")
	if err != nil {
		t.Fatal(err)
	}
	files = append(files, "../testdata/demo.json")
	n := 0
	for _, f := range files {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		var c struct { // a reference case holds its project under "project"
			Project json.RawMessage `json:"project"`
		}
		if json.Unmarshal(data, &c) == nil && len(c.Project) > 0 {
			data = c.Project
		}
		p, err := Decode(data)
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		n++
		bin, err := p.MarshalBinary()
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		var q Project
		if err := q.UnmarshalBinary(bin); err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		if !reflect.DeepEqual(&q, p) {
			t.Errorf("%s: the binary round trip changed the project", f)
		}
	}
	if n < 9 {
		t.Fatalf("only %d project files decoded", n)
	}
}

func TestResultBinaryDemo(t *testing.T) {
	// The demo's result: the binary form gives back what JSON gives back
	// (JSON round-trips float64 exactly), in fewer bytes.
	res, err := Solve(demoProject(t), nil)
	if err != nil {
		t.Fatal(err)
	}
	js, err := json.Marshal(res)
	if err != nil {
		t.Fatal(err)
	}
	var viaJSON Result
	if err := json.Unmarshal(js, &viaJSON); err != nil {
		t.Fatal(err)
	}
	bin, err := res.MarshalBinary()
	if err != nil {
		t.Fatal(err)
	}
	var viaBinary Result
	if err := viaBinary.UnmarshalBinary(bin); err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(viaBinary, *res) {
		t.Error("the binary round trip changed the demo's result")
	}
	a, _ := json.Marshal(viaJSON)
	b, _ := json.Marshal(viaBinary)
	if string(a) != string(b) {
		t.Error("the binary and JSON round trips differ")
	}
	if len(bin) >= len(js) {
		t.Errorf("binary %d B, JSON %d B: the binary form should be smaller", len(bin), len(js))
	}
	t.Logf("demo result: JSON %d B, binary %d B", len(js), len(bin))
}

func TestResultBinaryDamaged(t *testing.T) {
	// Every truncation of a valid encoding, a wrong header, trailing
	// bytes and a flag byte out of range are refused with errBinary;
	// none panics or allocates a huge list.
	var res Result
	fill(rand.New(rand.NewPCG(1, 2)), reflect.ValueOf(&res).Elem())
	data, err := res.MarshalBinary()
	if err != nil {
		t.Fatal(err)
	}
	for n := range len(data) {
		var r Result
		if err := r.UnmarshalBinary(data[:n]); !errors.Is(err, errBinary) {
			t.Fatalf("truncated to %d of %d bytes: error %v, want errBinary", n, len(data), err)
		}
	}
	var r Result
	if err := r.UnmarshalBinary(append(append([]byte{}, data...), 0)); !errors.Is(err, errBinary) {
		t.Errorf("a trailing byte: %v", err)
	}
	if err := r.UnmarshalBinary([]byte(`{"steady":{}}`)); !errors.Is(err, errBinary) || IsBinaryResult([]byte(`{"steady":{}}`)) {
		t.Errorf("JSON taken for the binary form: %v", err)
	}
	// A huge list length right after the header.
	huge := append([]byte(resultMagic), 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0x7f)
	if err := r.UnmarshalBinary(huge); !errors.Is(err, errBinary) {
		t.Errorf("a huge length: %v", err)
	}
}

func BenchmarkResultCodec(b *testing.B) {
	res, err := Solve(demoProject(b), nil)
	if err != nil {
		b.Fatal(err)
	}
	js, _ := json.Marshal(res)
	bin, _ := res.MarshalBinary()
	b.Run("json", func(b *testing.B) {
		for b.Loop() {
			out, _ := json.Marshal(res)
			var r Result
			if err := json.Unmarshal(out, &r); err != nil {
				b.Fatal(err)
			}
		}
		b.ReportMetric(float64(len(js)), "bytes")
	})
	b.Run("binary", func(b *testing.B) {
		for b.Loop() {
			out, _ := res.MarshalBinary()
			var r Result
			if err := r.UnmarshalBinary(out); err != nil {
				b.Fatal(err)
			}
		}
		b.ReportMetric(float64(len(bin)), "bytes")
	})
}

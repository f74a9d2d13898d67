package ui

import (
	"bytes"
	"testing"

	"github.com/vugu/vugu"
	"github.com/vugu/vugu/staticrender"
)

// fieldHTML renders one Field of the demo's form as the page would, and
// returns the input's value property beside (staticrender leaves
// properties out).
func fieldHTML(t *testing.T, f *Field) (html, value string) {
	t.Helper()
	var buf bytes.Buffer
	r := staticrender.New(&buf)
	env, err := vugu.NewBuildEnv(r.EventEnv())
	if err != nil {
		t.Fatal(err)
	}
	br := env.RunBuild(f)
	if err := r.Render(br); err != nil {
		t.Fatal(err)
	}
	for _, p := range br.Out.Out[0].FirstChild.Prop {
		if p.Key == "value" {
			value = string(p.JSONVal)
		}
	}
	html = buf.String()
	// staticrender wraps the output in a document.
	if i, j := bytes.Index(buf.Bytes(), []byte("<span")), bytes.LastIndex(buf.Bytes(), []byte("</span>")); i >= 0 && j > i {
		html = html[i : j+len("</span>")]
	}
	return html, value
}

// The markup of an input, which Field.Build writes out by hand. The
// wants are what the template it replaced (ui/field.vugu, until
// 0bd24b8) rendered for the same fields: every attribute, in its order,
// and only those.
func TestFieldMarkup(t *testing.T) {
	root, _ := demoRoot(t)
	f := root.Form()
	f.Edit("layers[2].mv", "5e-5x")
	f.Edit("mesh.maxSize", "")
	tests := []struct {
		name        string
		field       Field
		want, value string
	}{
		{"a number with its unit and a placeholder",
			Field{F: f, Path: "layers[1].gammaSat", Label: "γsat", Unit: "kN/m³"},
			`<span class="pl-field"><input type="text" autocomplete="off" spellcheck="false" aria-label="γsat (kN/m³)" id="layers-1-gammaSat" inputmode="decimal" title=""/><span class="pl-unit">kN/m³</span></span>`,
			`"16"`},
		{"a problem beside the input, named for screen readers",
			Field{F: f, Path: "layers[2].mv", Label: "mv", Unit: "m²/kN", Bare: true, Hint: "coefficient of volume compressibility"},
			`<span class="pl-field pl-bad"><input type="text" autocomplete="off" spellcheck="false" aria-describedby="layers-2-mv-err" aria-invalid="true" aria-label="mv (m²/kN)" id="layers-2-mv" inputmode="decimal" placeholder="from e–log" title="coefficient of volume compressibility"/><span class="pl-err" id="layers-2-mv-err">not a number</span></span>`,
			`"5e-5x"`},
		{"a text field, wide",
			Field{F: f, Path: "title", Label: "Project title", Wide: true},
			`<span class="pl-field pl-wide pl-textfield"><input type="text" autocomplete="off" spellcheck="false" aria-label="Project title" id="title" inputmode="text" title=""/></span>`,
			`"Demo: staged preload over layered soft clay"`},
		{"an empty input that stands for a default",
			Field{F: f, Path: "mesh.maxSize", Label: "largest element", Unit: "m"},
			`<span class="pl-field" data-used="0.065"><input type="text" autocomplete="off" spellcheck="false" aria-label="largest element (m)" id="mesh-maxSize" inputmode="decimal" placeholder="H/200" title=""/><span class="pl-unit">m</span></span>`,
			`""`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, value := fieldHTML(t, &tt.field)
			if got != tt.want {
				t.Errorf("got  %s\nwant %s", got, tt.want)
			}
			if value != tt.value {
				t.Errorf("value %s, want %s", value, tt.value)
			}
		})
	}
}

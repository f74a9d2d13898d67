package ui

import (
	"github.com/vugu/vjson"
	"github.com/vugu/vugu"

	"porelight/ui/form"
)

// Field is one input of the project: it shows the text typed (or the
// value), its unit, and the problem with it, if any. Its element id is
// form.IDOf(Path); the problem's is that plus "-err".
type Field struct {
	F    *form.Form // the form the value lives in
	Path string     // field path, e.g. "layers[2].k"
	// Label names the value for screen readers and tooltips; Unit is
	// shown beside the input unless Bare (a table states it in the
	// column head instead). Hint is an optional tooltip.
	Label string
	Unit  string
	Hint  string
	Bare  bool
	Wide  bool
	// Changed is called after every edit, valid or not.
	Changed func()
}

// Build draws the field:
//
//	<span class="pl-field …" data-used="…">
//	  <input type="text" id="…" aria-label="…" … .value="…" @input>
//	  <span class="pl-unit">kPa</span>
//	  <span class="pl-err" id="…-err">the problem</span>
//	</span>
//
// It is written out rather than generated from a template: the demo page
// has some 150 fields, each built on every render, and a template asks
// the form for the problem, the unit and the id several times over and
// grows each element's attributes one at a time.
func (c *Field) Build(*vugu.BuildIn) *vugu.BuildOut {
	id := form.IDOf(c.Path)
	problem := c.F.Problem(c.Path)
	unit := c.F.UnitOf(c.Path, c.Unit)
	textField := form.IsText(c.Path)
	shown := c.F.Text(c.Path)
	errID := ""
	if problem != "" {
		errID = id + "-err"
	}

	class := "pl-field"
	if c.Wide {
		class += " pl-wide"
	}
	if textField {
		class += " pl-textfield"
	}
	if problem != "" {
		class += " pl-bad"
	}
	root := &vugu.VGNode{Type: vugu.ElementNode, Data: "span", Attr: make([]vugu.VGAttribute, 1, 2)}
	root.Attr[0] = vugu.VGAttribute{Key: "class", Val: class}
	// What an empty input stands for, printed in its place by the
	// print style sheet (Form.Used is "" for an input that shows text,
	// and costs a second Text).
	used := ""
	if shown == "" {
		used = c.F.Used(c.Path)
	}
	if used != "" {
		root.Attr = append(root.Attr, vugu.VGAttribute{Key: "data-used", Val: used})
	}

	in := &vugu.VGNode{Type: vugu.ElementNode, Data: "input", Attr: make([]vugu.VGAttribute, 0, 11)}
	in.Attr = append(in.Attr,
		vugu.VGAttribute{Key: "type", Val: "text"},
		vugu.VGAttribute{Key: "autocomplete", Val: "off"},
		vugu.VGAttribute{Key: "spellcheck", Val: "false"})
	if problem != "" {
		in.Attr = append(in.Attr,
			vugu.VGAttribute{Key: "aria-describedby", Val: errID},
			vugu.VGAttribute{Key: "aria-invalid", Val: "true"})
	}
	label := c.Label
	if unit != "" && unit != "–" {
		label += " (" + unit + ")"
	}
	mode := "decimal"
	if textField {
		mode = "text"
	}
	in.Attr = append(in.Attr,
		vugu.VGAttribute{Key: "aria-label", Val: label},
		vugu.VGAttribute{Key: "id", Val: id},
		vugu.VGAttribute{Key: "inputmode", Val: mode})
	if h, ok := c.F.Placeholder(c.Path); ok {
		in.Attr = append(in.Attr, vugu.VGAttribute{Key: "placeholder", Val: h})
	}
	in.Attr = append(in.Attr, vugu.VGAttribute{Key: "title", Val: c.Hint})
	value, err := vjson.Marshal(shown)
	if err != nil {
		panic(err) // a string always encodes
	}
	in.Prop = []vugu.VGProperty{{Key: "value", JSONVal: value}}
	in.DOMEventHandlerSpecList = []vugu.DOMEventHandlerSpec{{EventType: "input", Func: c.onInput}}
	root.AppendChild(in)

	if c.Unit != "" && !c.Bare {
		u := &vugu.VGNode{Type: vugu.ElementNode, Data: "span", Attr: []vugu.VGAttribute{{Key: "class", Val: "pl-unit"}}}
		u.SetInnerHTML(unit)
		root.AppendChild(u)
	}
	if problem != "" {
		e := &vugu.VGNode{Type: vugu.ElementNode, Data: "span", Attr: []vugu.VGAttribute{{Key: "class", Val: "pl-err"}, {Key: "id", Val: errID}}}
		e.SetInnerHTML(problem)
		root.AppendChild(e)
	}
	return &vugu.BuildOut{Out: []*vugu.VGNode{root}}
}

func (c *Field) onInput(e vugu.DOMEvent) {
	c.F.Edit(c.Path, e.PropString("target", "value"))
	if c.Changed != nil {
		c.Changed()
	}
}

package static

import (
	"fmt"
	"strings"
)

// The page's edits re-render everything: vugu v0.4.0 rebuilds every
// component and its renderer sends every attribute, property, text and
// innerHTML again, which its helper script then writes into the DOM even
// when the value is the one already there. Each such write marks the
// element for style and layout again (a path's d is parsed again, an
// innerHTML is parsed again and its nodes replaced), and with the demo
// loaded that was most of a keystroke's cost. The packer therefore
// patches the helper so that it writes only what changed; what the DOM
// ends up holding is the same.

// helperPatch is one change to the minified helper of vugu v0.4.0.
type helperPatch struct {
	what     string
	old, new string
	n        int // times old occurs
}

var helperPatches = []helperPatch{
	// Every name and value arrives through readString, a few thousand
	// each render, most of them short ASCII (attribute names, ids,
	// classes, numbers): a TextDecoder call costs more than building
	// such a string by hand. Longer or non-ASCII strings still go
	// through the decoder.
	{"string reader", `readString(){var e=this.dataView.getUint32(this.offset),t=x.decode(new DataView(this.dataView.buffer,this.dataView.byteOffset+this.offset+4,e));return this.offset+=e+4,t}`,
		`readString(){var e=this.dataView.getUint32(this.offset),o=this.offset+4,t=null;if(e<=48){let s="";for(let i=0;i<e;i++){let c=this.dataView.getUint8(o+i);if(c>127){s=null;break}s+=String.fromCharCode(c)}t=s}if(t===null)t=x.decode(new DataView(this.dataView.buffer,this.dataView.byteOffset+o,e));return this.offset+=e+4,t}`, 1},
	{"attribute", `e.setAttribute(t,n),x.elAttrNames[t]=!0`,
		`e.getAttribute(t)!==n&&e.setAttribute(t,n),x.elAttrNames[t]=!0`, 1},
	{"attribute in a namespace", `t.setAttributeNS(e,n,s),x.elAttrNames[n]=!0`,
		`t.getAttributeNS(e,n)!==s&&t.setAttributeNS(e,n,s),x.elAttrNames[n]=!0`, 1},
	{"property", `e[t]=JSON.parse(n);break`,
		`{let v=JSON.parse(n);e[t]!==v&&(e[t]=v)}break`, 1},
	// vg-content and vg-html both arrive as innerHTML: the element keeps
	// the markup it was given, and moving into its children (vugu
	// building them itself) forgets it.
	{"innerHTML", `x.el.innerHTML=(x.bufferedInnerHTML||"")+e,x.bufferedInnerHTML=null;`,
		`{let h=(x.bufferedInnerHTML||"")+e;x.el.porelightHTML!==h&&(x.el.innerHTML=h,x.el.porelightHTML=h)}x.bufferedInnerHTML=null;`, 1},
	{"children", `throw"must have current selection to use opcodeMoveToFirstChild";x.nextElMove="first_child"`,
		`throw"must have current selection to use opcodeMoveToFirstChild";x.el.porelightHTML=null,x.nextElMove="first_child"`, 1},
	// An event reaches Go with every string, number and boolean of the
	// event and of its target, as JSON that Go parses: for an element some
	// 150 properties, among them innerHTML, outerHTML, textContent and
	// innerText, which serialise it (and innerText lays the page out).
	// That was a millisecond per input event, and a paste of 500 lines
	// inserted as 1,000 input events spent two seconds on it. The target
	// now brings only TargetProps.
	{"event target", `for(let t in e)try{let n=typeof e[t];`,
		`for(let t of ` + targetPropsJS + `)try{let n=typeof e[t];`, 1},
	{"text and comment", `else x.el.textContent=e;break}`,
		`else x.el.nodeValue!==e&&(x.el.nodeValue=e);break}`, 2},
	// An element whose only attribute is SameMark is as the last render
	// left it (wasm/same.go): its attributes, listeners and children
	// stay. The mark lasts until the next element is chosen.
	{"same: new element", `x.elAttrNames={},x.elEventKeys={}`, `x.elAttrNames={},x.elEventKeys={},x.same=!1`, 3},
	{"same: mark", `if(!e)throw"opcodeSetAttrStr: no current reference";let t=C.readString(),n=C.readString();`,
		`if(!e)throw"opcodeSetAttrStr: no current reference";let t=C.readString(),n=C.readString();if(t==="` + SameMark + `"){x.same=!0;break}`, 1},
	{"same: mark in a namespace", `e==""&&(e=null);let n=C.readString(),s=C.readString();`,
		`e==""&&(e=null);let n=C.readString(),s=C.readString();if(n==="` + SameMark + `"){x.same=!0;break}`, 1},
	{"same: attributes", `throw"cannot call opcodeRemoveOtherAttrs when nextElMove is set";`,
		`throw"cannot call opcodeRemoveOtherAttrs when nextElMove is set";if(x.same)break;`, 1},
	{"same: listeners", `case u:{let t=C.readString(),e=x.eventHandlerMap[t]||{},n=[];`,
		`case u:{let t=C.readString();if(x.same)break;let e=x.eventHandlerMap[t]||{},n=[];`, 1},
}

// SameMark is the attribute of an element the page leaves as it is
// (wasm.SameMark, see wasm/same.go).
const SameMark = "data-pl-same"

// TargetProps are the properties of an event's target that reach Go
// (vugu.DOMEvent.PropString("target", name) and its kin); add a name here
// before reading another. TestTargetProps checks the ui and wasm sources.
var TargetProps = []string{"value", "checked", "open", "clientWidth", "clientHeight",
	"id", "name", "type", "tagName", "selectionStart", "selectionEnd", "scrollTop", "scrollLeft"}

var targetPropsJS = func() string {
	q := make([]string, len(TargetProps))
	for i, p := range TargetProps {
		q[i] = `"` + p + `"`
	}
	return "[" + strings.Join(q, ",") + "]"
}()

// patchHelper applies helperPatches to the helper script s, or says which
// one no longer fits (a vugu upgrade changed the script).
func patchHelper(s string) (string, error) {
	for _, p := range helperPatches {
		if got := strings.Count(s, p.old); got != p.n {
			return "", fmt.Errorf("the renderer's helper script has %d places to patch for the %s, not %d: check the vugu version (static/helper.go)", got, p.what, p.n)
		}
		s = strings.ReplaceAll(s, p.old, p.new)
	}
	return s, nil
}

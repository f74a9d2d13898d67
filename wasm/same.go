//go:build js && wasm

package main

import (
	"reflect"
	"slices"
	"strconv"
	"unsafe"

	"github.com/vugu/vugu"
	"github.com/vugu/vugu/domrender"
)

// Unchanged parts of the page are not sent again. vugu v0.4.0 sends the
// whole tree on every render: each element with every attribute, event
// listener and property, which the helper script then compares with the
// DOM one by one. With the demo loaded that is some 2,000 nodes a
// keystroke, most of the render's time in the browser, for the few
// nodes that changed. Before each render, same replaces every element
// whose subtree hashes as at the same position in the last render by a
// stub: the element with only the attribute SameMark and no children.
// The packer patches the helper (static/helper.go) to leave such an
// element, its attributes, listeners and children as they are; the Go
// side's event handlers of the subtree are refreshed here, as the
// renderer would.

// SameMark is the attribute of a stub (static.SameMark).
const SameMark = "data-pl-same"

// shape is what a render drew at one position: the hash of the subtree,
// and where the shapes of its children are (all shapes of a render are
// in one slice, the children of a node side by side).
type shape struct {
	h          uint64
	kids, nkid int32
	stub       bool // an element that may be left as it is when its hash is the same
	dirty      bool // the subtree has a vg-js-create or vg-js-populate callback
}

// longHTML is the length from which an innerHTML is hashed by address
// and length rather than by content: a figure's markup (plot.Chart keeps
// it while the figure stays), some 50 kB each. The strings so hashed are
// kept until the next render, so that no other string can take their
// address meanwhile.
const longHTML = 1024

type sameState struct {
	cur, last      []shape
	html, lastHTML []string                              // the long innerHTML of cur and last
	handlers       map[string][]vugu.DOMEventHandlerSpec // the renderer's, by position
	pos            []byte
}

// samer returns the function that stubs the unchanged elements of a
// build before it is rendered, or nil when the renderer's handler map
// cannot be found (a vugu upgrade): then every render sends everything.
func samer(r *domrender.JSRenderer) func(*vugu.BuildResults) {
	s := &sameState{}
	st := reflect.ValueOf(r).Elem().FieldByName("jsRenderState")
	if !st.IsValid() || st.Kind() != reflect.Pointer || st.Type().Elem().Kind() != reflect.Struct {
		return nil
	}
	f, ok := st.Type().Elem().FieldByName("domHandlerMap")
	if !ok || f.Type != reflect.TypeFor[map[string][]vugu.DOMEventHandlerSpec]() {
		return nil
	}
	return func(br *vugu.BuildResults) {
		if st.IsNil() {
			return // before the first render
		}
		m := st.Elem().FieldByIndex(f.Index)
		s.handlers = *(*map[string][]vugu.DOMEventHandlerSpec)(unsafe.Pointer(m.UnsafeAddr()))
		s.stub(br)
	}
}

// stub hashes the build, stubs what is as last time and keeps the hashes.
func (s *sameState) stub(br *vugu.BuildResults) {
	s.cur, s.html = append(s.cur[:0], shape{}), s.html[:0]
	ok := br.Out != nil && len(br.Out.Out) == 1 && s.hash(br, br.Out.Out[0], 0)
	if ok && len(s.last) > 0 {
		s.pos = append(s.pos[:0], '0')
		s.prune(br, br.Out.Out[0], 0, 0, true)
	}
	if !ok {
		s.cur = s.cur[:0] // nothing to compare with next time
	}
	clear(s.lastHTML)
	s.cur, s.last = s.last, s.cur
	s.html, s.lastHTML = s.lastHTML, s.html
}

// resolve is the node a component's node stands for (its root).
func resolve(br *vugu.BuildResults, n *vugu.VGNode) (*vugu.VGNode, bool) {
	for n.Component != nil {
		out := br.ResultFor(n.Component)
		if out == nil || len(out.Out) != 1 {
			return nil, false
		}
		n = out.Out[0]
	}
	return n, true
}

// hash puts the shape of the subtree of n into s.cur[i]; false when the
// build has a component whose output the renderer would refuse.
func (s *sameState) hash(br *vugu.BuildResults, n *vugu.VGNode, i int) bool {
	if n.Component != nil {
		var ok bool
		if n, ok = resolve(br, n); !ok {
			return false
		}
	}
	h := uint64(fnvBasis)
	h = mix(h, byte(n.Type), n.Data)
	h = mix(h, 0, n.Namespace)
	for _, a := range n.Attr {
		h = mix(h, 1, a.Namespace)
		h = mix(h, 2, a.Key)
		h = mix(h, 3, a.Val)
	}
	for _, p := range n.Prop {
		h = mix(h, 4, p.Key)
		h = mix(h, 5, unsafe.String(unsafe.SliceData(p.JSONVal), len(p.JSONVal)))
	}
	for _, e := range n.DOMEventHandlerSpecList {
		h = mix(h, 6+b2(e.Capture)+2*b2(e.Passive), e.EventType)
	}
	sh := shape{dirty: n.JSCreateHandler != nil || n.JSPopulateHandler != nil}
	if n.InnerHTML != nil {
		if x := *n.InnerHTML; len(x) >= longHTML {
			s.html = append(s.html, x)
			h = mixWord(mixWord(h, 10), uint64(uintptr(unsafe.Pointer(unsafe.StringData(x)))))
			h = mixWord(h, uint64(len(x)))
		} else {
			h = mix(h, 11, x)
		}
	} else {
		k := 0
		for c := n.FirstChild; c != nil; c = c.NextSibling {
			k++
		}
		first := len(s.cur)
		s.cur = slices.Grow(s.cur, k)[:first+k]
		sh.kids, sh.nkid = int32(first), int32(k)
		j := first
		for c := n.FirstChild; c != nil; c = c.NextSibling {
			if !s.hash(br, c, j) {
				return false
			}
			h = mixWord(mixWord(h, 12), s.cur[j].h)
			sh.dirty = sh.dirty || s.cur[j].dirty
			j++
		}
	}
	sh.h = h
	sh.stub = n.Type == vugu.ElementNode && !n.IsTemplate() && !sh.dirty
	s.cur[i] = sh
	return true
}

// prune stubs n (at position s.pos, shape s.cur[i]) when it is as last
// time (s.last[li], li < 0 for none), else looks into its children.
func (s *sameState) prune(br *vugu.BuildResults, n *vugu.VGNode, i, li int, root bool) {
	if n.Component != nil {
		n, _ = resolve(br, n)
	}
	now := s.cur[i]
	if !root && li >= 0 && now.stub && s.last[li].stub && now.h == s.last[li].h {
		if len(n.DOMEventHandlerSpecList) > 0 {
			s.handlers[string(s.pos)] = n.DOMEventHandlerSpecList
		}
		s.note(br, n, "_")
		*n = vugu.VGNode{Type: n.Type, Data: n.Data, Namespace: n.Namespace, Attr: []vugu.VGAttribute{{Key: SameMark}},
			Parent: n.Parent, PrevSibling: n.PrevSibling, NextSibling: n.NextSibling}
		return
	}
	if n.InnerHTML != nil {
		return
	}
	s.children(br, n, now, li, "_")
}

// children prunes the children of n (shape now, last shape s.last[li]);
// sep is what the renderer puts between a position and a child's number.
func (s *sameState) children(br *vugu.BuildResults, n *vugu.VGNode, now shape, li int, sep string) {
	base := len(s.pos)
	j := 0
	for c := n.FirstChild; c != nil; c = c.NextSibling {
		was := -1
		if li >= 0 && j < int(s.last[li].nkid) {
			was = int(s.last[li].kids) + j
		}
		s.pos = strconv.AppendInt(append(s.pos[:base], sep...), int64(j+1), 10)
		r := c
		if r.Component != nil {
			r, _ = resolve(br, r)
		}
		if r.IsTemplate() {
			s.children(br, r, s.cur[int(now.kids)+j], was, "_t_")
		} else {
			s.prune(br, r, int(now.kids)+j, was, false)
		}
		j++
	}
	s.pos = s.pos[:base]
}

// note gives the renderer the event handlers of the children of n (at
// s.pos), as its sync would have: they may capture values of this build.
// sep is as for children.
func (s *sameState) note(br *vugu.BuildResults, n *vugu.VGNode, sep string) {
	if n.InnerHTML != nil {
		return
	}
	base := len(s.pos)
	i := 0
	for c := n.FirstChild; c != nil; c = c.NextSibling {
		i++
		s.pos = strconv.AppendInt(append(s.pos[:base], sep...), int64(i), 10)
		r := c
		if r.Component != nil {
			r, _ = resolve(br, r)
		}
		if r.IsTemplate() {
			s.note(br, r, "_t_")
			continue
		}
		if len(r.DOMEventHandlerSpecList) > 0 {
			s.handlers[string(s.pos)] = r.DOMEventHandlerSpecList
		}
		s.note(br, r, "_")
	}
	s.pos = s.pos[:base]
}

// FNV-1a, written out: in the page's build (no inlining outside the
// solver and vugu) a hash.Hash method call per string cost more than the
// render it saved.
const (
	fnvBasis = 14695981039346656037
	fnvPrime = 1099511628211
)

// mix adds a tag byte, the length of x and x to the hash h.
func mix(h uint64, tag byte, x string) uint64 {
	h = (h ^ uint64(tag)) * fnvPrime
	h = (h ^ uint64(len(x))) * fnvPrime
	for i := 0; i < len(x); i++ {
		h = (h ^ uint64(x[i])) * fnvPrime
	}
	return h
}

// mixWord adds the 8 bytes of w to the hash h.
func mixWord(h, w uint64) uint64 {
	for range 8 {
		h = (h ^ w&0xff) * fnvPrime
		w >>= 8
	}
	return h
}

func b2(b bool) byte {
	if b {
		return 1
	}
	return 0
}

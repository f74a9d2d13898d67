package plot

import (
	"math"
	"slices"
	"strings"
	"unicode/utf8"
)

// Default and smallest figure sizes, pixels.
const (
	defaultW = 640
	defaultH = 420
	minW     = 320
	minH     = 240
)

// Box is an axis-aligned rectangle in pixels.
type Box struct{ X, Y, W, H float64 }

// Right and Bottom are the far edges of the box.
func (b Box) Right() float64  { return b.X + b.W }
func (b Box) Bottom() float64 { return b.Y + b.H }

// Inside reports whether (x, y) lies in the box, edges included.
func (b Box) Inside(x, y float64) bool {
	return x >= b.X && x <= b.Right() && y >= b.Y && y <= b.Bottom()
}

// RectEl is a drawn rectangle. Empty Fill or Stroke means none.
type RectEl struct {
	Box
	Fill, Stroke string
	StrokeWidth  float64
}

// PathEl is a drawn path. Clip, when not empty, is the id of the clip path
// (a Figure.Clips entry) applied to it.
type PathEl struct {
	D      string
	Stroke string
	Dash   string // "none" for solid
	Width  float64
	Fill   string // "none" unless filled
	Clip   string
}

// TextEl is a drawn text. Anchor is "start", "middle" or "end"; Rotate, in
// degrees, turns the text about its anchor point; Halo draws a white outline
// under the glyphs so that labels stay readable over curves.
type TextEl struct {
	X, Y   float64
	Text   string
	Anchor string
	Size   float64
	Bold   bool
	Fill   string
	Rotate float64
	Halo   bool
}

// ClipEl is a named clip rectangle.
type ClipEl struct {
	ID string
	Box
}

// Series is one drawn curve of a panel: its legend name, style, the points
// (data and pixels), the path data and how a point reads out on hover.
type Series struct {
	Name  string
	Style Style
	Pts   []Pt
	D     string
	// Read formats the hover read-out of one point.
	Read func(p Pt) string
}

// Panel is one plot area with its scales. A depth figure may hold several
// panels side by side sharing the depth scale.
type Panel struct {
	Box    Box
	X, Y   Scale
	Series []*Series
	// XTicks are the ticks of the time axis where a time figure made
	// them, for a companion panel on the same axis.
	XTicks []Tick
}

// Figure is a complete plot reduced to drawing primitives, in drawing
// order: rectangles, then paths, then texts. The vugu component Chart and
// the standalone SVG writer both draw exactly these.
type Figure struct {
	// ID is the id of the root svg; clip ids derive from it.
	ID string
	// Title is the accessible title (and the heading drawn at the top).
	Title string
	// W and H are the size in pixels (the viewBox is 0 0 W H).
	W, H float64
	// Message, when not empty, explains why there is nothing to plot; the
	// figure then holds only the frame and this text.
	Message string

	Clips  []ClipEl
	Rects  []RectEl
	Paths  []PathEl
	Texts  []TextEl
	Panels []*Panel

	ticked []Box // the tick labels drawn on horizontal axes, kept apart (axis)
}

// size returns the figure size from requested pixels: zero means the
// default, small values are raised to the minimum.
func size(w, h int) (float64, float64) {
	fw, fh := float64(w), float64(h)
	if w <= 0 {
		fw = defaultW
	}
	if h <= 0 {
		fh = defaultH
	}
	return math.Max(fw, minW), math.Max(fh, minH)
}

// newFigure starts a figure with a white background and its heading.
func newFigure(id, title string, w, h int) *Figure {
	fw, fh := size(w, h)
	f := &Figure{ID: id, Title: title, W: fw, H: fh}
	f.Rects = append(f.Rects, RectEl{Box: Box{0, 0, fw, fh}, Fill: inkBack})
	f.text(12, 18, title, "start", 13, inkText).Bold = true
	return f
}

// message turns f into an explanation in place of a plot.
func (f *Figure) message(msg string) *Figure {
	f.Message = msg
	b := Box{12, 30, f.W - 24, f.H - 42}
	f.Rects = append(f.Rects, RectEl{Box: b, Fill: "#f6f7f9", Stroke: inkGrid, StrokeWidth: 1})
	f.text(b.X+b.W/2, b.Y+b.H/2+4, msg, "middle", 13, inkMuted)
	return f
}

func (f *Figure) text(x, y float64, s, anchor string, size float64, fill string) *TextEl {
	f.Texts = append(f.Texts, TextEl{X: x, Y: y, Text: s, Anchor: anchor, Size: size, Fill: fill})
	return &f.Texts[len(f.Texts)-1]
}

func (f *Figure) path(d, stroke, dash string, width float64) *PathEl {
	if dash == "" {
		dash = "none"
	}
	f.Paths = append(f.Paths, PathEl{D: d, Stroke: stroke, Dash: dash, Width: width, Fill: "none"})
	return &f.Paths[len(f.Paths)-1]
}

// clip adds a clip rectangle and returns its id.
func (f *Figure) clip(b Box) string {
	id := f.ID + "-clip-" + itoa(len(f.Clips))
	f.Clips = append(f.Clips, ClipEl{ID: id, Box: b})
	return id
}

// textWidth estimates the width of s at the given font size: a
// proportional sans-serif averages a little over half an em per glyph.
func textWidth(s string, size float64) float64 {
	return float64(utf8.RuneCountInString(s)) * size * 0.56
}

// fit shortens s with an ellipsis so that it fits in width pixels.
func fit(s string, width, size float64) string {
	if textWidth(s, size) <= width {
		return s
	}
	r := []rune(s)
	n := int(width/(size*0.56)) - 1
	if n < 1 {
		return ""
	}
	return strings.TrimSpace(string(r[:min(n, len(r))])) + "…"
}

func itoa(i int) string { return fixed(float64(i), 0) }

// axisSide says where an axis's ticks and labels go.
type axisSide int

const (
	sideBottom axisSide = iota
	sideTop
	sideLeft
	sideNone // grid only
)

// grid draws the grid of a panel for the given ticks: major lines darker,
// minor ones lighter. vertical is true for ticks along the x axis.
func (f *Figure) grid(p *Panel, ticks []Tick, vertical bool) {
	var major, minor strings.Builder
	for _, t := range ticks {
		b := &major
		if t.Minor {
			b = &minor
		}
		if vertical {
			x := p.X.Map(t.Value)
			if !isFinite(x) {
				continue
			}
			b.WriteString("M" + coord(x) + " " + coord(p.Box.Y) + " V" + coord(p.Box.Bottom()) + " ")
		} else {
			y := p.Y.Map(t.Value)
			if !isFinite(y) {
				continue
			}
			b.WriteString("M" + coord(p.Box.X) + " " + coord(y) + " H" + coord(p.Box.Right()) + " ")
		}
	}
	if minor.Len() > 0 {
		f.path(strings.TrimSpace(minor.String()), inkGridMin, "none", 1)
	}
	if major.Len() > 0 {
		f.path(strings.TrimSpace(major.String()), inkGrid, "none", 1)
	}
}

// axis draws tick marks and labels of one axis on the given side of box,
// mapping tick values with s, and the axis title.
func (f *Figure) axis(box Box, s Scale, ticks []Tick, side axisSide, title string) {
	var d strings.Builder
	if side != sideLeft {
		ticks = f.spaced(s, ticks, box)
	}
	for _, t := range ticks {
		v := s.Map(t.Value)
		if !isFinite(v) {
			continue
		}
		n := 5.0
		if t.Minor {
			n = 3
		}
		switch side {
		case sideBottom:
			d.WriteString("M" + coord(v) + " " + coord(box.Bottom()) + " v" + coord(n) + " ")
			if t.Label != "" {
				f.text(v, box.Bottom()+17, t.Label, "middle", 11, inkText)
			}
		case sideTop:
			d.WriteString("M" + coord(v) + " " + coord(box.Y) + " v" + coord(-n) + " ")
			if t.Label != "" {
				f.text(v, box.Y-8, t.Label, "middle", 11, inkText)
			}
		case sideLeft:
			d.WriteString("M" + coord(box.X) + " " + coord(v) + " h" + coord(-n) + " ")
			if t.Label != "" {
				f.text(box.X-7, v+4, t.Label, "end", 11, inkText)
			}
		}
	}
	if d.Len() > 0 {
		f.path(strings.TrimSpace(d.String()), inkAxis, "none", 1)
	}
	switch side {
	case sideBottom:
		f.text(box.X+box.W/2, box.Bottom()+36, title, "middle", 12, inkText)
	case sideTop:
		f.text(box.X+box.W/2, box.Y-26, title, "middle", 12, inkText)
	case sideLeft:
		t := f.text(box.X-44, box.Y+box.H/2, title, "middle", 12, inkText)
		t.Rotate = -90
	}
}

// tickGap is the least space between two tick labels, pixels.
const tickGap = 4

// tickBox is the box a horizontal axis's tick label takes when centred on
// x with its baseline at y, with a generous width (digits and the minus
// sign run to about 0.6 em in the usual sans-serif faces), so that labels
// kept apart here stay apart in the browser.
func tickBox(x, y float64, label string) Box {
	w := float64(utf8.RuneCountInString(label)) * 11 * 0.62
	return Box{x - w/2, y - 11, w, 11}
}

// spaced drops tick labels (never the ticks) of a horizontal axis so that
// no two collide: it keeps every k-th label for the least k at which the
// labels clear each other, then drops any that would touch a label another
// panel already drew beside this one. The labels kept are noted in
// f.ticked.
func (f *Figure) spaced(s Scale, ticks []Tick, box Box) []Tick {
	var idx []int
	for i, t := range ticks {
		if t.Label != "" && isFinite(s.Map(t.Value)) {
			idx = append(idx, i)
		}
	}
	clear := func(a, b Box) bool { return a.Right()+tickGap <= b.X || b.Right()+tickGap <= a.X }
	at := func(i int) Box { return tickBox(s.Map(ticks[i].Value), box.Y, ticks[i].Label) }
	k := 1
	for ; k < len(idx); k++ {
		ok := true
		for j := k; j < len(idx) && ok; j += k {
			ok = clear(at(idx[j-k]), at(idx[j]))
		}
		if ok {
			break
		}
	}
	out := slices.Clone(ticks)
	for n, i := range idx {
		b := at(i)
		keep := n%k == 0
		for _, o := range f.ticked {
			if keep && math.Abs(o.Y-b.Y) < 1 && !clear(o, b) {
				keep = false
			}
		}
		if keep {
			f.ticked = append(f.ticked, b)
		} else {
			out[i].Label = ""
		}
	}
	return out
}

// frame outlines a panel.
// It is a path, not a rectangle, so that it is drawn over the grid.
func (f *Figure) frame(b Box) {
	f.path("M"+coord(b.X)+" "+coord(b.Y)+" H"+coord(b.Right())+" V"+coord(b.Bottom())+" H"+coord(b.X)+" Z",
		inkAxis, "none", 1)
}

// addSeries maps xs, ys through the panel's scales, stores the series in
// the panel and draws it clipped to the panel. It returns nil, and draws
// nothing, when no point is finite.
func (f *Figure) addSeries(p *Panel, clip, name string, st Style, xs, ys []float64, read func(Pt) string) *Series {
	pts := points(xs, ys, p.X, p.Y)
	if len(pts) == 0 {
		return nil
	}
	// The path runs through every point (the clip trims it at the frame);
	// only points inside the panel can be read out.
	s := &Series{Name: name, Style: st, D: pathD(pts), Read: read}
	for _, q := range pts {
		if p.Box.Inside(q.X, q.Y) {
			s.Pts = append(s.Pts, q)
		}
	}
	p.Series = append(p.Series, s)
	f.path(s.D, st.Stroke, st.Dash, st.Width).Clip = clip
	if st.Marker {
		for _, q := range s.Pts {
			f.dot(q.X, q.Y, st.Stroke, clip)
		}
	}
	return s
}

// dot draws a small filled circle as a path (two arcs).
func (f *Figure) dot(x, y float64, fill, clip string) {
	r := 2.5
	d := "M" + coord(x-r) + " " + coord(y) + " a" + coord(r) + " " + coord(r) + " 0 1 0 " + coord(2*r) + " 0 a" +
		coord(r) + " " + coord(r) + " 0 1 0 " + coord(-2*r) + " 0 Z"
	p := f.path(d, "none", "none", 0)
	p.Fill, p.Clip = fill, clip
}

// legend lists the series of all panels in a column starting at (x, y),
// at most maxRows rows; extra entries are summarised on the last row. A
// name too long for one row breaks after a comma or space onto a second.
func (f *Figure) legend(x, y, width float64, maxRows int, series []*Series) {
	if len(series) == 0 || maxRows < 1 {
		return
	}
	const row = 16
	lines := make([][]string, len(series))
	total := 0
	for i, s := range series {
		lines[i] = legendLines(s.Name, width-32, 11)
		total += len(lines[i])
	}
	used := 0
	for i, s := range series {
		n := len(lines[i])
		// Keep the last row for the summary unless everything fits.
		if used+n > maxRows || (total > maxRows && used+n > maxRows-1) {
			yy := y + float64(used)*row
			f.text(x+32, yy+4, "+"+itoa(len(series)-i)+" more", "start", 11, inkMuted)
			return
		}
		yy := y + float64(used)*row
		switch {
		case s.Style.Shape != "":
			f.marks([]Pt{{X: x + 13, Y: yy}}, s.Style, "")
		default:
			f.path("M"+coord(x)+" "+coord(yy)+" h26", s.Style.Stroke, s.Style.Dash, s.Style.Width)
			if s.Style.Marker {
				f.dot(x+13, yy, s.Style.Stroke, "")
			}
		}
		for k, l := range lines[i] {
			f.text(x+32, yy+4+float64(k)*row*0.8, l, "start", 11, inkText)
		}
		used += n
	}
}

// legendLines breaks a legend name into one or two lines of the width
// given, at the last comma or space that fits; the second line is
// shortened if need be.
func legendLines(name string, width, size float64) []string {
	if textWidth(name, size) <= width {
		return []string{name}
	}
	r := []rune(name)
	n := min(len(r), int(width/(size*0.56)))
	split := func(k int) []string {
		return []string{strings.TrimSpace(string(r[:k])), fit(strings.TrimSpace(string(r[k:])), width, size)}
	}
	// After a comma when the rest then fits, else at the last space.
	for k := n - 1; k > 1; k-- {
		if r[k] == ' ' && r[k-1] == ',' && textWidth(strings.TrimSpace(string(r[k:])), size) <= width {
			return split(k)
		}
	}
	for k := n - 1; k > 0; k-- {
		if r[k] == ' ' {
			return split(k)
		}
	}
	return []string{fit(name, width, size)}
}

// allSeries lists the series of every panel in order.
func (f *Figure) allSeries() []*Series {
	var ss []*Series
	for _, p := range f.Panels {
		ss = append(ss, p.Series...)
	}
	return ss
}

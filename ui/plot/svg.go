package plot

import (
	"strings"
	"unicode/utf8"

	"porelight/solver"
)

// Attribute helpers shared by the standalone writer and the vugu
// templates, so that both draw the same thing.

// ViewBox is the svg viewBox attribute, "0 0 W H".
func (f *Figure) ViewBox() string { return "0 0 " + coord(f.W) + " " + coord(f.H) }

// TitleID is the id of the svg's <title>, referenced by aria-labelledby.
func (f *Figure) TitleID() string { return f.ID + "-title" }

// ClipRef is the clip-path attribute of a path: "url(#id)" or "none".
func (p PathEl) ClipRef() string {
	if p.Clip == "" {
		return "none"
	}
	return "url(#" + p.Clip + ")"
}

// FillAttr and StrokeAttr give "none" for an empty colour.
func (r RectEl) FillAttr() string   { return orNone(r.Fill) }
func (r RectEl) StrokeAttr() string { return orNone(r.Stroke) }

// Weight is the font-weight attribute.
func (t TextEl) Weight() string {
	if t.Bold {
		return "bold"
	}
	return "normal"
}

// Transform is the transform attribute: a rotation about the anchor point,
// or "" when the text is not rotated.
func (t TextEl) Transform() string {
	if t.Rotate == 0 {
		return ""
	}
	return "rotate(" + coord(t.Rotate) + " " + coord(t.X) + " " + coord(t.Y) + ")"
}

// HaloStroke is the stroke of the text: white when it has a halo.
func (t TextEl) HaloStroke() string {
	if t.Halo {
		return inkBack
	}
	return "none"
}

func orNone(s string) string {
	if s == "" {
		return "none"
	}
	return s
}

// SVG returns f as a standalone SVG document: the xmlns, size, a <title>,
// and every colour and font inline, so a saved file renders on its own.
func (f *Figure) SVG() string {
	var b strings.Builder
	b.Grow(4096 + 64*len(f.Texts) + 16*len(f.Paths))
	b.WriteString(`<?xml version="1.0" encoding="UTF-8"?>` + "\n")
	b.WriteString(`<svg xmlns="http://www.w3.org/2000/svg"`)
	attr(&b, "id", f.ID)
	attr(&b, "width", coord(f.W))
	attr(&b, "height", coord(f.H))
	attr(&b, "viewBox", f.ViewBox())
	attr(&b, "role", "img")
	attr(&b, "aria-labelledby", f.TitleID())
	attr(&b, "font-family", fontFamily)
	b.WriteString(">\n<title")
	attr(&b, "id", f.TitleID())
	b.WriteString(">")
	esc(&b, f.Title)
	b.WriteString("</title>\n")
	f.writeBody(&b)
	b.WriteString("</svg>\n")
	return b.String()
}

// Body is the markup inside the svg element but for the title: the clip
// paths, rectangles, paths and texts, as SVG writes them. Chart puts it
// into the page as one piece.
func (f *Figure) Body() string {
	var b strings.Builder
	b.Grow(4096 + 64*len(f.Texts) + 16*len(f.Paths))
	f.writeBody(&b)
	return b.String()
}

func (f *Figure) writeBody(b *strings.Builder) {
	if len(f.Clips) > 0 {
		b.WriteString("<defs>")
		for _, c := range f.Clips {
			b.WriteString("<clipPath")
			attr(b, "id", c.ID)
			b.WriteString("><rect")
			boxAttrs(b, c.Box)
			b.WriteString("/></clipPath>")
		}
		b.WriteString("</defs>\n")
	}
	for _, r := range f.Rects {
		b.WriteString("<rect")
		boxAttrs(b, r.Box)
		attr(b, "fill", r.FillAttr())
		attr(b, "stroke", r.StrokeAttr())
		attr(b, "stroke-width", coord(r.StrokeWidth))
		b.WriteString("/>\n")
	}
	for _, p := range f.Paths {
		b.WriteString("<path")
		attr(b, "d", p.D)
		attr(b, "fill", orNone(p.Fill))
		attr(b, "stroke", orNone(p.Stroke))
		attr(b, "stroke-width", coord(p.Width))
		attr(b, "stroke-dasharray", orNone(p.Dash))
		attr(b, "stroke-linejoin", "round")
		if p.Clip != "" {
			attr(b, "clip-path", p.ClipRef())
		}
		b.WriteString("/>\n")
	}
	for _, t := range f.Texts {
		writeText(b, t)
	}
}

func writeText(b *strings.Builder, t TextEl) {
	b.WriteString("<text")
	attr(b, "x", coord(t.X))
	attr(b, "y", coord(t.Y))
	attr(b, "text-anchor", t.Anchor)
	attr(b, "font-size", coord(t.Size))
	attr(b, "font-weight", t.Weight())
	attr(b, "fill", t.Fill)
	if tr := t.Transform(); tr != "" {
		attr(b, "transform", tr)
	}
	if t.Halo {
		attr(b, "stroke", t.HaloStroke())
		attr(b, "stroke-width", "3")
		attr(b, "stroke-linejoin", "round")
		attr(b, "paint-order", "stroke")
	}
	b.WriteString(">")
	esc(b, t.Text)
	b.WriteString("</text>\n")
}

func boxAttrs(b *strings.Builder, r Box) {
	attr(b, "x", coord(r.X))
	attr(b, "y", coord(r.Y))
	attr(b, "width", coord(r.W))
	attr(b, "height", coord(r.H))
}

func attr(b *strings.Builder, name, value string) {
	b.WriteString(" " + name + `="`)
	esc(b, value)
	b.WriteString(`"`)
}

// esc writes s escaped for XML content and attribute values. Characters
// XML 1.0 cannot hold (other control characters, invalid UTF-8) become
// U+FFFD, as encoding/xml's EscapeText does.
func esc(b *strings.Builder, s string) {
	plain := true // most values are numbers, names and ordinary text
	for i := 0; i < len(s) && plain; i++ {
		c := s[i]
		plain = c >= 0x20 && c < 0x7f && c != '&' && c != '<' && c != '>' && c != '"' && c != '\''
	}
	if plain {
		b.WriteString(s)
		return
	}
	for _, r := range s {
		switch {
		case r == '&':
			b.WriteString("&amp;")
		case r == '<':
			b.WriteString("&lt;")
		case r == '>':
			b.WriteString("&gt;")
		case r == '"':
			b.WriteString("&#34;")
		case r == '\'':
			b.WriteString("&#39;")
		case r == '\t':
			b.WriteString("&#x9;")
		case r == '\n':
			b.WriteString("&#xA;")
		case r == '\r':
			b.WriteString("&#xD;")
		case r < 0x20 || r == utf8.RuneError || (r >= 0xFFFE && r <= 0xFFFF):
			b.WriteRune('\uFFFD')
		default:
			b.WriteRune(r)
		}
	}
}

// IsochronesSVG returns the isochrone plot as a standalone SVG file; see
// IsochronesFigure. w and h are pixels, zero for the default size.
func IsochronesSVG(p *solver.Project, r *solver.Result, w, h int) string {
	return IsochronesFigure(p, r, w, h).SVG()
}

// DegreeSVG returns the degree of consolidation plot as a standalone SVG.
func DegreeSVG(p *solver.Project, r *solver.Result, w, h int) string {
	return DegreeFigure(p, r, w, h).SVG()
}

// SettlementSVG returns the settlement plot as a standalone SVG.
func SettlementSVG(p *solver.Project, r *solver.Result, w, h int) string {
	return SettlementFigure(p, r, w, h).SVG()
}

// PiezometersSVG returns the piezometer plot as a standalone SVG.
func PiezometersSVG(p *solver.Project, r *solver.Result, w, h int) string {
	return PiezometersFigure(p, r, w, h).SVG()
}

// SteadySVG returns the steady state profiles as a standalone SVG.
func SteadySVG(p *solver.Project, r *solver.Result, w, h int) string {
	return SteadyFigure(p, r, w, h).SVG()
}

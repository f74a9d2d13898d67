package plot

// Style is how one curve is stroked. Stroke is an sRGB colour, Dash an SVG
// stroke-dasharray ("none" for solid), Width the stroke width in pixels.
type Style struct {
	Stroke string
	Dash   string
	Width  float64
	// Marker is true for styles whose data points are also marked with a
	// small dot (used when a curve has few points).
	Marker bool
	// Shape, when set, draws the series as marks only, with no line:
	// "circle", "square", "triangle", "diamond", "down" (a triangle
	// pointing down) or "cross". Open marks are white inside.
	Shape string
	Open  bool
}

// palette is Porelight's curve scheme. Neighbours differ in lightness as
// well as hue (dark ink, mid rust, pale slate, …) and every entry has its
// own dash pattern, so that curves remain distinct in a greyscale print.
// Relative luminance of the strokes: 0.02, 0.18, 0.31, 0.04, 0.22, 0.07,
// 0.38, 0.04 (TestPaletteGreyscale keeps neighbours apart).
var palette = []Style{
	{Stroke: "#16233a", Dash: "none", Width: 2},          // ink
	{Stroke: "#c0571f", Dash: "8 3", Width: 2},           // rust
	{Stroke: "#7f9bb4", Dash: "none", Width: 3},          // slate, broad
	{Stroke: "#4a2c5e", Dash: "2 2.5", Width: 2},         // plum, dotted
	{Stroke: "#5f8f3e", Dash: "10 3 2 3", Width: 2},      // moss, dash-dot
	{Stroke: "#7a3b1d", Dash: "4 2", Width: 1.5},         // umber, short dash
	{Stroke: "#a7a59a", Dash: "12 4", Width: 2.5},        // stone, long dash
	{Stroke: "#0f3f4a", Dash: "6 2 2 2 2 2", Width: 1.5}, // deep teal, dash-dot-dot
}

// markStyles mark measured points. Shape and fill (open or solid) vary
// with the colour, so that records stay apart in a greyscale print and
// never look like a predicted curve.
var markStyles = []Style{
	{Stroke: "#16233a", Width: 1.3, Shape: "circle", Open: true},
	{Stroke: "#c0571f", Width: 1.3, Shape: "square"},
	{Stroke: "#4a2c5e", Width: 1.3, Shape: "triangle", Open: true},
	{Stroke: "#5f8f3e", Width: 1.3, Shape: "diamond"},
	{Stroke: "#0f3f4a", Width: 1.6, Shape: "cross"},
	{Stroke: "#7a3b1d", Width: 1.3, Shape: "down", Open: true},
}

// markAt returns the i-th style of measured points, cycling.
func markAt(i int) Style {
	if i < 0 {
		i = -i
	}
	return markStyles[i%len(markStyles)]
}

// styleAt returns the i-th style of the scheme, cycling; past one cycle the
// width changes so that repeats stay distinguishable.
func styleAt(i int) Style {
	if i < 0 {
		i = -i
	}
	s := palette[i%len(palette)]
	if (i/len(palette))%2 == 1 {
		s.Width = s.Width*0.6 + 0.3
	}
	return s
}

// withDash returns s with another dash pattern (used to tell a companion
// curve, such as an excess pore pressure, from its main curve).
func withDash(s Style, dash string) Style {
	s.Dash = dash
	return s
}

// Layer strip fills: earthy tints alternating light and darker so that
// neighbouring layers separate in grey as well.
var layerFills = []string{"#e9dfc9", "#c9b99a", "#dfe3d6", "#b7b3a6", "#efe6d8", "#cfc2ad"}

// Fixed drawing colours.
const (
	inkAxis    = "#33373d"
	inkText    = "#22262b"
	inkMuted   = "#5d636b"
	inkGrid    = "#d9dde2"
	inkGridMin = "#eef0f3"
	inkRule    = "#9aa1a9"
	inkBack    = "#ffffff"
	fontFamily = "system-ui, -apple-system, 'Segoe UI', Roboto, 'DejaVu Sans', Arial, sans-serif"
)

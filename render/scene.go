package render

import (
	"image"

	"plumb/layout"
)

// A Scene is a flat, ordered display list: everything a backend needs to draw
// a figure and nothing it would have to decide. Builders measure and place;
// backends only serialise. The zero Scene is an empty 0x0 figure.
type Scene struct {
	Width, Height float64 // canvas size in pixels (SVG user units)
	Title         string  // accessible name, written as <title>
	Desc          string  // plain-language description, written as <desc>
	Notes         []Note
	Font          Font
	Marks         []Mark
}

// Font names the typeface the scene was measured with. When Data is set the
// SVG backend embeds it, so that any viewer draws what layout measured.
// Faces are the parsed faces themselves: a raster backend draws Text marks
// with Faces.Face(mark.Bold) and so sets exactly the widths the builder
// measured.
type Font struct {
	Family string       // CSS font-family list, e.g. "Go, sans-serif"
	Data   []byte       // TTF/OTF bytes to embed, or nil
	Format string       // "truetype" or "opentype" when Data is set
	Faces  layout.Fonts // the regular and bold faces every text was measured with
}

// Kind says which primitive a Mark is.
type Kind uint8

// The primitives. GroupStart and GroupEnd bracket a panel or any other group;
// groups are placed by a translate transform only (DX, DY of the GroupStart).
const (
	Rect Kind = iota
	Circle
	Path
	Text
	GroupStart
	GroupEnd
	// Image is a raster drawn into X, Y, W, H, each pixel a crisp square
	// (no smoothing): the cells of a heat map too large for one rect each.
	Image
)

// Anchor is the horizontal alignment of a Text mark at its X.
type Anchor uint8

// Text anchors.
const (
	Start Anchor = iota
	Middle
	End
)

// Attr is one data-* attribute. A slice keeps output order deterministic.
type Attr struct{ Name, Value string }

// Point is a vertex of a Path.
type Point struct{ X, Y float64 }

// A Mark is one primitive of a Scene. Which fields matter depends on Kind:
//
//	Rect:       X, Y, W, H, Fill
//	Circle:     X, Y (centre), R, Fill, Stroke
//	Path:       Lines (each inner slice one polyline, drawn with M then L),
//	            Closed to close every polyline (areas), Fill, Stroke,
//	            StrokeWidth, Join, Cap, Dash
//	Text:       X, Y (baseline), Text, Size, Bold, Anchor, Fill
//	GroupStart: DX, DY (translate), Class
//	Image:      X, Y, W, H, Img (scaled to the box, pixels kept square-edged)
//
// Every kind may carry a Class (always prefixed "plumb-"), data-* Attrs and a
// Tooltip, written as a nested <title> so that shortened text stays readable.
type Mark struct {
	Kind        Kind
	Class       string
	X, Y, W, H  float64
	R           float64
	DX, DY      float64
	Lines       [][]Point
	Closed      bool
	Text        string
	Size        float64
	Bold        bool
	Anchor      Anchor
	Fill        Colour // the zero Colour means none
	Stroke      Colour // the zero Colour means none
	StrokeWidth float64
	Join        LineJoin     // corners of the stroke; the zero value is a mitre
	Cap         LineCap      // ends of the stroke; the zero value is butt
	Opacity     float64      // 0 means fully opaque
	Dash        []float64    // dash and gap lengths in px, repeated; nil is solid
	Img         *image.NRGBA // the pixels of an Image mark
	Attrs       []Attr
	Tooltip     string
}

// Add appends marks to the scene.
func (s *Scene) Add(m ...Mark) { s.Marks = append(s.Marks, m...) }

// A Note records one decision plumb made for the user. Notes are values so
// that a caller can act on them (for example warn "your data was changed")
// without matching their text.
type Note struct {
	Code    string // stable name of the kind of decision, such as "other" or "aspect"
	Text    string // the decision in plain words, with the numbers involved
	Changed bool   // what is drawn differs from the data given: rows left out, values combined or transformed
}

// String returns the note's text.
func (n Note) String() string { return n.Text }

// Note records a decision plumb made for the user. A note already recorded
// (the same code and text, as from several panels of one figure) is kept
// once.
func (s *Scene) Note(code string, changed bool, text string) {
	for _, n := range s.Notes {
		if n.Code == code && n.Text == text {
			return
		}
	}
	s.Notes = append(s.Notes, Note{Code: code, Text: text, Changed: changed})
}

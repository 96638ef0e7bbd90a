package render

import (
	"bufio"
	"bytes"
	"encoding/base64"
	"encoding/xml"
	"errors"
	"fmt"
	"hash/fnv"
	"image/png"
	"io"
	"math"
	"strconv"
	"strings"

	svg "github.com/ajstarks/svgo/float"
)

// notesNamespace qualifies the notes inside <metadata>, so that they never
// clash with another vocabulary a page may carry.
const notesNamespace = "urn:x-plumb:notes"

// WriteSVG serialises the scene as a standalone SVG document. It decides
// nothing: every position, size and colour comes from the scene. Output is a
// pure function of the scene, so identical scenes give identical bytes. A
// SceneWriter is given the scene itself (its WriteScene), to draw as it
// chooses.
func WriteSVG(w io.Writer, s *Scene) error {
	if sw, ok := w.(SceneWriter); ok {
		if s == nil {
			return ErrNoScene
		}
		return sw.WriteScene(s)
	}
	return SVGEncoder{}.Encode(w, s)
}

// An SVGEncoder writes scenes as SVG. Its zero value writes standalone
// documents, as WriteSVG does; the fields serve pages that inline several
// charts.
type SVGEncoder struct {
	// Fragment leaves out the XML prolog and the generator comment, so that
	// the <svg> element can be pasted into an HTML page.
	Fragment bool
	// IDPrefix starts every element id (default "plumb"). Ids also carry a
	// hash of the whole scene, so two different charts never share one.
	IDPrefix string
	// FontDeclared says the page already holds the embedded font's
	// @font-face rule (FontFaceCSS), so the chart refers to the family
	// without embedding the font bytes again.
	FontDeclared bool
}

// ErrNoScene is returned when there is no scene to write.
var ErrNoScene = errors.New("no scene to write")

// Encode writes the scene to w.
func (e SVGEncoder) Encode(w io.Writer, s *Scene) error {
	if s == nil {
		return ErrNoScene
	}
	// The marks are written first into a buffer so that the element ids can
	// be derived from every byte of the drawing, not from a summary of it.
	var body bytes.Buffer
	bbw := bufio.NewWriter(&body)
	bdoc := svg.New(bbw)
	bdoc.Decimals = 2
	for i := range s.Marks {
		writeMark(bdoc, bbw, &s.Marks[i])
	}
	bbw.Flush()

	bw := bufio.NewWriter(w)
	var head bytes.Buffer
	doc := svg.New(&head)
	doc.Decimals = 2
	id := e.sceneID(s, body.Bytes())
	root := []string{
		fmt.Sprintf(`viewBox="0 0 %s %s"`, num(s.Width), num(s.Height)),
		`role="img"`,
		fmt.Sprintf(`aria-labelledby="%s-title %s-desc"`, id, id),
	}
	if family := fontFamily(s.Font); family != "" {
		root = append(root, attr("font-family", family))
	}
	doc.Start(round2(s.Width), round2(s.Height), root...)
	h := head.Bytes()
	if e.Fragment {
		h = h[bytes.Index(h, []byte("<svg")):]
	}
	bw.Write(h)
	fmt.Fprintf(bw, "<title id=\"%s-title\">%s</title>\n", id, escape(s.Title))
	fmt.Fprintf(bw, "<desc id=\"%s-desc\">%s</desc>\n", id, escape(s.Desc))
	bw.WriteString("<metadata>\n<plumb:notes xmlns:plumb=\"" + notesNamespace + "\">\n")
	for _, n := range s.Notes {
		// The code and whether the data was changed let a CI job match
		// the decisions without parsing their text (see NoteCodes).
		attrs := ` code="` + escape(n.Code) + `"`
		if n.Changed {
			attrs += ` changed="true"`
		}
		bw.WriteString("<plumb:note" + attrs + ">" + escape(n.Text) + "</plumb:note>\n")
	}
	bw.WriteString("</plumb:notes>\n</metadata>\n")
	if s.Font.Data != nil && !e.FontDeclared {
		bw.WriteString("<defs>\n<style>" + FontFaceCSS(s.Font) + "</style>\n</defs>\n")
	}
	bw.Write(body.Bytes())
	bw.WriteString("</svg>\n")
	return bw.Flush()
}

// fontFamily is the CSS font-family list of the scene's font: the embedded
// face first when there is one, then the family the scene names.
func fontFamily(f Font) string {
	family := f.Family
	if f.Data != nil {
		family = strings.TrimSuffix(FontFamilyName(f)+", "+family, ", ")
	}
	return family
}

// FontFamilyName is the CSS family under which an embedded font is declared:
// derived from a hash of the font's bytes, so that charts embedding
// different fonts on one page never draw in each other's face, and charts
// embedding the same font can share one declaration.
func FontFamilyName(f Font) string {
	h := fnv.New64a()
	h.Write(f.Data)
	return fmt.Sprintf("plumb-font-%016x", h.Sum64())
}

// FontFaceCSS returns the @font-face rule that declares an embedded font, for
// a page that declares it once and writes its charts with FontDeclared. It
// returns "" for a font with no data.
func FontFaceCSS(f Font) string {
	if f.Data == nil {
		return ""
	}
	format := f.Format
	if format == "" {
		format = "truetype"
	}
	return fmt.Sprintf("@font-face{font-family:\"%s\";src:url(data:font/%s;base64,%s) format(\"%s\");}",
		FontFamilyName(f), fontMime(format), base64.StdEncoding.EncodeToString(f.Data), format)
}

func fontMime(format string) string {
	if format == "opentype" {
		return "otf"
	}
	return "ttf"
}

func writeMark(doc *svg.SVG, bw *bufio.Writer, m *Mark) {
	if m.Tooltip != "" && m.Kind != GroupStart && m.Kind != GroupEnd {
		doc.Group(`class="plumb-tip"`)
		fmt.Fprintf(bw, "<title>%s</title>\n", escape(m.Tooltip))
		defer doc.Gend()
	}
	a := markAttrs(m)
	switch m.Kind {
	case Rect:
		doc.Rect(round2(m.X), round2(m.Y), round2(m.W), round2(m.H), a...)
	case Circle:
		doc.Circle(round2(m.X), round2(m.Y), round2(m.R), a...)
	case Path:
		doc.Path(pathData(m.Lines, m.Closed), a...)
	case Text:
		switch m.Anchor {
		case Middle:
			a = append(a, `text-anchor="middle"`)
		case End:
			a = append(a, `text-anchor="end"`)
		}
		a = append(a, fmt.Sprintf(`font-size="%s"`, num(m.Size)))
		if m.Bold {
			a = append(a, `font-weight="bold"`)
		}
		doc.Text(round2(m.X), round2(m.Y), m.Text, a...)
	case GroupStart:
		if m.DX != 0 || m.DY != 0 {
			a = append(a, fmt.Sprintf(`transform="translate(%s,%s)"`, num(m.DX), num(m.DY)))
		}
		if len(a) == 0 {
			bw.WriteString("<g>\n")
		} else {
			doc.Group(a...)
		}
	case GroupEnd:
		doc.Gend()
	case Image:
		if m.Img == nil {
			return
		}
		var buf bytes.Buffer
		// png.Encode of an in-memory image fails only on a writer error,
		// and a bytes.Buffer does not fail; its output is deterministic.
		_ = png.Encode(&buf, m.Img)
		a = append(a, `preserveAspectRatio="none"`, `style="image-rendering:pixelated;image-rendering:crisp-edges"`)
		fmt.Fprintf(bw, `<image x="%s" y="%s" width="%s" height="%s" href="data:image/png;base64,%s" %s/>`+"\n",
			num(m.X), num(m.Y), num(m.W), num(m.H), base64.StdEncoding.EncodeToString(buf.Bytes()), strings.Join(a, " "))
	}
}

// markAttrs lists a mark's attributes in a fixed order: class, paint, data.
func markAttrs(m *Mark) []string {
	var a []string
	if m.Class != "" {
		a = append(a, attr("class", m.Class))
	}
	if m.Kind != GroupStart && m.Kind != GroupEnd && m.Kind != Image {
		a = append(a, attr("fill", m.Fill.Hex()))
		if m.Fill.A != 0 && m.Fill.A != 255 {
			a = append(a, fmt.Sprintf(`fill-opacity="%s"`, alpha(m.Fill.A)))
		}
		if !m.Stroke.IsNone() {
			a = append(a, attr("stroke", m.Stroke.Hex()))
			if m.Stroke.A != 255 {
				a = append(a, fmt.Sprintf(`stroke-opacity="%s"`, alpha(m.Stroke.A)))
			}
			if m.StrokeWidth > 0 {
				a = append(a, fmt.Sprintf(`stroke-width="%s"`, num(m.StrokeWidth)))
			}
			if j := joinName(m.Join); j != "" {
				a = append(a, `stroke-linejoin="`+j+`"`)
			}
			if c := capName(m.Cap); c != "" {
				a = append(a, `stroke-linecap="`+c+`"`)
			}
			if len(m.Dash) > 0 {
				a = append(a, attr("stroke-dasharray", dashArray(m.Dash)))
			}
		}
		if m.Opacity > 0 && m.Opacity < 1 {
			a = append(a, fmt.Sprintf(`opacity="%s"`, num(m.Opacity)))
		}
	}
	for _, d := range m.Attrs {
		a = append(a, attr("data-"+d.Name, d.Value))
	}
	return a
}

// joinName and capName spell the joins and caps that differ from SVG's
// defaults; the defaults (and unknown values) are left unwritten.
func joinName(j LineJoin) string {
	switch j {
	case JoinRound:
		return "round"
	case JoinBevel:
		return "bevel"
	}
	return ""
}

func capName(c LineCap) string {
	switch c {
	case CapRound:
		return "round"
	case CapSquare:
		return "square"
	}
	return ""
}

// alpha writes an 8-bit alpha as an opacity with at most three decimals.
func alpha(a uint8) string {
	return strconv.FormatFloat(math.Round(float64(a)/255*1000)/1000, 'f', -1, 64)
}

// dashArray writes dash lengths separated by spaces.
func dashArray(d []float64) string {
	parts := make([]string, len(d))
	for i, v := range d {
		parts[i] = num(v)
	}
	return strings.Join(parts, " ")
}

// pathData writes polylines with absolute M and L commands only, so that
// tests and audits can read vertices back without a path parser.
func pathData(lines [][]Point, closed bool) string {
	var b strings.Builder
	for _, line := range lines {
		for i, p := range line {
			if i == 0 {
				b.WriteByte('M')
			} else {
				b.WriteByte('L')
			}
			b.WriteString(num(p.X))
			b.WriteByte(',')
			b.WriteString(num(p.Y))
		}
		if closed && len(line) > 0 {
			b.WriteByte('Z')
		}
	}
	return b.String()
}

// round2 rounds to two decimals, the precision of every SVG coordinate.
func round2(v float64) float64 {
	r := math.Round(v*100) / 100
	if r == 0 {
		return 0 // no "-0"
	}
	return r
}

// num formats v with at most two decimals and no trailing zeros.
func num(v float64) string {
	return strconv.FormatFloat(round2(v), 'f', -1, 64)
}

// attr renders name="value" with the value escaped for an XML attribute.
func attr(name, value string) string {
	return name + `="` + escape(value) + `"`
}

// escape makes user text safe inside XML text and attribute values.
func escape(s string) string {
	var b strings.Builder
	xml.EscapeText(&b, []byte(s)) // never fails on a strings.Builder
	return b.String()
}

// sceneID derives element ids from the whole scene (its size, words,
// notes, font and every byte of its drawing), so that two figures on one page
// do not share ids unless they are the same figure, and identical input still
// gives identical bytes.
func (e SVGEncoder) sceneID(s *Scene, body []byte) string {
	h := fnv.New64a()
	fmt.Fprintf(h, "%g %g\x00%s\x00%s\x00%s\x00", s.Width, s.Height, s.Title, s.Desc, s.Font.Family)
	for _, n := range s.Notes {
		fmt.Fprintf(h, "%s\x00%s\x00", n.Code, n.Text)
	}
	h.Write(s.Font.Data)
	h.Write(body)
	prefix := e.IDPrefix
	if prefix == "" {
		prefix = "plumb"
	}
	return fmt.Sprintf("%s-%016x", prefix, h.Sum64())
}

package render

import (
	"bufio"
	"encoding/base64"
	"encoding/xml"
	"fmt"
	"hash/fnv"
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
// pure function of the scene, so identical scenes give identical bytes.
func WriteSVG(w io.Writer, s *Scene) error {
	bw := bufio.NewWriter(w)
	doc := svg.New(bw)
	doc.Decimals = 2
	id := sceneID(s)
	family := s.Font.Family
	if family == "" {
		family = "Go, sans-serif"
	}
	if s.Font.Data != nil {
		family = "plumb-embedded, " + family
	}
	doc.Start(round2(s.Width), round2(s.Height),
		fmt.Sprintf(`viewBox="0 0 %s %s"`, num(s.Width), num(s.Height)),
		`role="img"`,
		fmt.Sprintf(`aria-labelledby="%s-title %s-desc"`, id, id),
		attr("font-family", family),
	)
	fmt.Fprintf(bw, "<title id=\"%s-title\">%s</title>\n", id, escape(s.Title))
	fmt.Fprintf(bw, "<desc id=\"%s-desc\">%s</desc>\n", id, escape(s.Desc))
	bw.WriteString("<metadata>\n<plumb:notes xmlns:plumb=\"" + notesNamespace + "\">\n")
	for _, n := range s.Notes {
		bw.WriteString("<plumb:note>" + escape(n.Text) + "</plumb:note>\n")
	}
	bw.WriteString("</plumb:notes>\n</metadata>\n")
	if s.Font.Data != nil {
		format := s.Font.Format
		if format == "" {
			format = "truetype"
		}
		doc.Def()
		fmt.Fprintf(bw, "<style>@font-face{font-family:\"plumb-embedded\";src:url(data:font/%s;base64,%s) format(\"%s\");}</style>\n",
			fontMime(format), base64.StdEncoding.EncodeToString(s.Font.Data), format)
		doc.DefEnd()
	}
	for i := range s.Marks {
		writeMark(doc, bw, &s.Marks[i])
	}
	doc.End()
	return bw.Flush()
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
	}
}

// markAttrs lists a mark's attributes in a fixed order: class, paint, data.
func markAttrs(m *Mark) []string {
	var a []string
	if m.Class != "" {
		a = append(a, attr("class", m.Class))
	}
	if m.Kind != GroupStart && m.Kind != GroupEnd {
		fill := m.Fill
		if fill == "" {
			fill = "none"
		}
		a = append(a, attr("fill", fill))
		if m.Stroke != "" {
			a = append(a, attr("stroke", m.Stroke))
			if m.StrokeWidth > 0 {
				a = append(a, fmt.Sprintf(`stroke-width="%s"`, num(m.StrokeWidth)))
			}
			if m.Kind == Path {
				a = append(a, `stroke-linejoin="round"`, `stroke-linecap="round"`)
			}
			if m.Dash != "" {
				a = append(a, attr("stroke-dasharray", m.Dash))
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

// sceneID derives element ids from the content, so that two figures on
// one page do not share ids and identical input still gives identical bytes.
func sceneID(s *Scene) string {
	h := fnv.New32a()
	io.WriteString(h, s.Title)
	io.WriteString(h, s.Desc)
	fmt.Fprintf(h, "%d", len(s.Marks))
	return fmt.Sprintf("plumb-%08x", h.Sum32())
}

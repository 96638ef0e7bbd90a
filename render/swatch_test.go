package render

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"plumb/layout"
	"plumb/palette"
)

func TestPaletteSheet(t *testing.T) {
	red, _ := palette.ParseHex("#cc3333")
	green, _ := palette.ParseHex("#339933")
	blue, _ := palette.ParseHex("#3366cc")
	colors := []palette.SRGB{red, green, blue}
	s := PaletteSheet("Check", colors)
	if s.Title != "Check" || !strings.Contains(s.Desc, "deutan") || !strings.Contains(s.Desc, "#cc3333") {
		t.Errorf("title %q desc %q", s.Title, s.Desc)
	}
	var rects, distances int
	for _, m := range s.Marks {
		if m.Class != "" && !strings.HasPrefix(m.Class, "plumb-") {
			t.Errorf("class %q not prefixed", m.Class)
		}
		switch {
		case m.Kind == Rect:
			rects++
			if len(m.Attrs) < 2 || m.Attrs[0].Name != "label" || m.Attrs[1].Name != "value" || m.Attrs[1].Value != m.Fill.Hex() {
				t.Errorf("swatch attrs %v fill %s", m.Attrs, m.Fill)
			}
		case strings.Contains(m.Class, "plumb-distance"):
			distances++
		}
	}
	if rects != 4*len(colors) || distances != 4 {
		t.Errorf("%d swatches, %d distances", rects, distances)
	}
	// The deutan swatch of red and of green look alike: that is the point.
	found := false
	for _, m := range s.Marks {
		if m.Kind == Rect && len(m.Attrs) > 2 && m.Attrs[2].Value == "deutan" && m.Attrs[0].Value == "#cc3333" {
			found = true
			if m.Fill.Hex() == "#cc3333" {
				t.Error("deutan swatch not simulated")
			}
		}
	}
	if !found {
		t.Error("no deutan swatch for #cc3333")
	}
}

func TestWritePaletteSheetIsValidSVG(t *testing.T) {
	p, _ := palette.Categorical(8)
	var a, b bytes.Buffer
	if err := WritePaletteSheet(&a, "Categorical", p); err != nil {
		t.Fatal(err)
	}
	if err := WritePaletteSheet(&b, "Categorical", p); err != nil || !bytes.Equal(a.Bytes(), b.Bytes()) {
		t.Fatal("output not deterministic")
	}
	dec := xml.NewDecoder(bytes.NewReader(a.Bytes()))
	for {
		if _, err := dec.Token(); err == io.EOF {
			break
		} else if err != nil {
			t.Fatalf("not XML: %v", err)
		}
	}
	if n := strings.Count(a.String(), "<rect"); n != 32 {
		t.Errorf("%d rects", n)
	}
	// Render with a real SVG renderer when it is installed (DESIGN.md §5).
	rsvg, err := exec.LookPath("rsvg-convert")
	if err != nil {
		t.Skip("rsvg-convert not installed")
	}
	dir := t.TempDir()
	in := filepath.Join(dir, "sheet.svg")
	if err := os.WriteFile(in, a.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	if out, err := exec.Command(rsvg, "-o", filepath.Join(dir, "sheet.png"), in).CombinedOutput(); err != nil {
		t.Errorf("rsvg-convert: %v %s", err, out)
	}
}

func TestPaletteSheetEdgeCases(t *testing.T) {
	for _, cs := range [][]palette.SRGB{nil, {{R: 0.5, G: 0.5, B: 0.5}}} {
		var b bytes.Buffer
		if err := WritePaletteSheet(&b, "", cs); err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(b.String(), "closest: none") {
			t.Error("no pair should print none")
		}
	}
}

// sheetTexts parses an SVG and measures every <text> as layout would, each
// box widened about its anchor by slack (a viewer's fallback font may set
// the text wider than the Go fonts). It also returns the canvas.
func sheetTexts(t *testing.T, data []byte, slack float64) (boxes []layout.Box, texts []string, canvas layout.Box) {
	t.Helper()
	num := func(attrs map[string]string, name string) float64 {
		v, err := strconv.ParseFloat(attrs[name], 64)
		if err != nil {
			t.Fatalf("attribute %s=%q: %v", name, attrs[name], err)
		}
		return v
	}
	type frame struct{ dx, dy float64 }
	stack := []frame{{}}
	var cur map[string]string
	var text strings.Builder
	dec := xml.NewDecoder(bytes.NewReader(data))
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("not XML: %v", err)
		}
		switch tok := tok.(type) {
		case xml.StartElement:
			attrs := map[string]string{}
			for _, a := range tok.Attr {
				attrs[a.Name.Local] = a.Value
			}
			f := stack[len(stack)-1]
			if tr := attrs["transform"]; tr != "" {
				var dx, dy float64
				if _, err := fmt.Sscanf(tr, "translate(%g,%g)", &dx, &dy); err != nil {
					t.Fatalf("transform %q is not a plain translate", tr)
				}
				f.dx, f.dy = f.dx+dx, f.dy+dy
			}
			stack = append(stack, f)
			switch tok.Name.Local {
			case "svg":
				canvas = layout.Box{W: num(attrs, "width"), H: num(attrs, "height")}
			case "text":
				cur = attrs
				text.Reset()
			}
		case xml.CharData:
			if cur != nil {
				text.Write(tok)
			}
		case xml.EndElement:
			f := stack[len(stack)-1]
			stack = stack[:len(stack)-1]
			if tok.Name.Local != "text" || cur == nil {
				continue
			}
			anchor := layout.AnchorStart
			switch cur["text-anchor"] {
			case "middle":
				anchor = layout.AnchorMiddle
			case "end":
				anchor = layout.AnchorEnd
			}
			face := layout.Fonts{}.Face(cur["font-weight"] == "bold")
			b := layout.TextBox(face, text.String(), num(cur, "font-size"), num(cur, "x")+f.dx, num(cur, "y")+f.dy, anchor)
			grow := b.W * (slack - 1)
			switch anchor {
			case layout.AnchorMiddle:
				b.X -= grow / 2
			case layout.AnchorEnd:
				b.X -= grow
			}
			b.W += grow
			boxes = append(boxes, b)
			texts = append(texts, text.String())
			cur = nil
		}
	}
	return boxes, texts, canvas
}

// TestPaletteSheetTextFits checks every sheet the CLI can draw: no two
// texts overlap and none leaves the canvas, even set 15% wider than the Go
// fonts measure.
func TestPaletteSheetTextFits(t *testing.T) {
	type sheet struct {
		name   string
		colors palette.Palette
	}
	var sheets []sheet
	for n := 1; n <= palette.MaxCategorical; n++ {
		p, _ := palette.Categorical(n)
		sheets = append(sheets, sheet{fmt.Sprintf("Categorical palette, %d colours", n), p})
	}
	for _, hue := range palette.SequentialHues() {
		for _, n := range []int{palette.MinRamp, 7, palette.MaxRamp} {
			p, _ := palette.Sequential(hue, n)
			sheets = append(sheets, sheet{fmt.Sprintf("Sequential palette, %s, %d colours", hue, n), p})
		}
	}
	for _, pair := range palette.DivergingHues() {
		for _, n := range []int{palette.MinRamp, 9, palette.MaxRamp} {
			p, _ := palette.DivergingPair(pair, n)
			sheets = append(sheets, sheet{fmt.Sprintf("Diverging palette, %s, %d colours", pair, n), p})
		}
	}
	sheets = append(sheets, sheet{"", nil})
	for _, sh := range sheets {
		var b bytes.Buffer
		if err := WritePaletteSheet(&b, sh.name, sh.colors); err != nil {
			t.Fatal(err)
		}
		boxes, texts, canvas := sheetTexts(t, b.Bytes(), 1.15)
		if len(boxes) < 2 {
			t.Fatalf("%s: only %d texts", sh.name, len(boxes))
		}
		for i, bi := range boxes {
			if !bi.Inside(canvas) {
				t.Errorf("%s: %q %+v leaves the canvas %+v", sh.name, texts[i], bi, canvas)
			}
			for j := i + 1; j < len(boxes); j++ {
				if bi.Overlaps(boxes[j]) {
					t.Errorf("%s: %q %+v overlaps %q %+v", sh.name, texts[i], bi, texts[j], boxes[j])
				}
			}
		}
	}
}

// TestSheetTextsCatchesOverlap makes sure the overlap check can fail: two
// labels 10 px apart overlap.
func TestSheetTextsCatchesOverlap(t *testing.T) {
	svg := `<svg width="100" height="50"><g transform="translate(5,0)"><text x="0" y="20" font-size="12">#4494c8 / #cf6f19</text><text x="10" y="20" font-size="12">x</text></g></svg>`
	boxes, _, canvas := sheetTexts(t, []byte(svg), 1)
	if len(boxes) != 2 || !boxes[0].Overlaps(boxes[1]) || boxes[0].X != 5 {
		t.Errorf("boxes %+v", boxes)
	}
	if canvas != (layout.Box{W: 100, H: 50}) {
		t.Errorf("canvas %+v", canvas)
	}
}

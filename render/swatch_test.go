package render

import (
	"bytes"
	"encoding/xml"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

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
			if len(m.Attrs) < 2 || m.Attrs[0].Name != "label" || m.Attrs[1].Name != "value" || m.Attrs[1].Value != m.Fill {
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
	for _, m := range s.Marks {
		if m.Kind == Rect && m.Attrs[2].Value == "deutan" && m.Attrs[0].Value == "#cc3333" {
			if m.Fill == "#cc3333" {
				t.Error("deutan swatch not simulated")
			}
		}
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

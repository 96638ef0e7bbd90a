package render

import (
	"bytes"
	"encoding/base64"
	"encoding/xml"
	"errors"
	"image"
	"image/color"
	"image/png"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func encode(t *testing.T, e SVGEncoder, s *Scene) string {
	t.Helper()
	var b bytes.Buffer
	require.NoError(t, e.Encode(&b, s))
	return b.String()
}

var idRe = regexp.MustCompile(`<title id="([^"]+)-title">`)

func sceneIDOf(t *testing.T, svg string) string {
	t.Helper()
	m := idRe.FindStringSubmatch(svg)
	require.NotNil(t, m, "no title id in output")
	return m[1]
}

func TestWriteSVGNilScene(t *testing.T) {
	var b bytes.Buffer
	err := WriteSVG(&b, nil)
	assert.True(t, errors.Is(err, ErrNoScene))
	assert.Zero(t, b.Len(), "nothing is written for a nil scene")
}

func TestSVGFragment(t *testing.T) {
	s, err := BarsScene([]string{"a", "b"}, []float64{1, 2}, BarsOptions{})
	require.NoError(t, err)
	doc := encode(t, SVGEncoder{}, s)
	frag := encode(t, SVGEncoder{Fragment: true}, s)
	assert.True(t, strings.HasPrefix(doc, "<?xml"), "a document starts with the XML prolog")
	assert.True(t, strings.HasPrefix(frag, "<svg "), "a fragment starts with the svg element")
	assert.NotContains(t, frag, "<!--")
	assert.True(t, strings.HasSuffix(doc, frag), "the fragment is the document without its prolog")
	var v struct{ XMLName xml.Name }
	require.NoError(t, xml.Unmarshal([]byte(frag), &v), "a fragment parses on its own")
	assert.Equal(t, "svg", v.XMLName.Local)
}

// Two charts that differ only in one middle value must not share element
// ids when they sit on one page; the same chart twice gives the same id.
func TestSceneIDsDifferWhenAnyMarkDiffers(t *testing.T) {
	labels := []string{"a", "b", "c"}
	s1, err := BarsScene(labels, []float64{3, 2, 1}, BarsOptions{RowOptions: RowOptions{Order: ByData}})
	require.NoError(t, err)
	s2, err := BarsScene(labels, []float64{3, 2.5, 1}, BarsOptions{RowOptions: RowOptions{Order: ByData}})
	require.NoError(t, err)
	s3, err := BarsScene(labels, []float64{3, 2, 1}, BarsOptions{RowOptions: RowOptions{Order: ByData}})
	require.NoError(t, err)
	id1 := sceneIDOf(t, encode(t, SVGEncoder{}, s1))
	id2 := sceneIDOf(t, encode(t, SVGEncoder{}, s2))
	id3 := sceneIDOf(t, encode(t, SVGEncoder{}, s3))
	assert.NotEqual(t, id1, id2)
	assert.Equal(t, id1, id3)

	// The same chart for two media differs too.
	p, err := BarsScene(labels, []float64{3, 2, 1}, BarsOptions{RowOptions: RowOptions{Order: ByData}, Common: Common{Medium: Print}})
	require.NoError(t, err)
	assert.NotEqual(t, id1, sceneIDOf(t, encode(t, SVGEncoder{}, p)))

	// A caller's prefix leads the id.
	assert.True(t, strings.HasPrefix(sceneIDOf(t, encode(t, SVGEncoder{IDPrefix: "report-fig3"}, s1)), "report-fig3-"))
}

// A page declares an embedded font once and has each chart refer to it.
func TestSVGSharedFontDeclaration(t *testing.T) {
	s, err := BarsScene([]string{"a"}, []float64{1}, BarsOptions{Common: Common{EmbedFont: true}})
	require.NoError(t, err)
	out := encode(t, SVGEncoder{Fragment: true, FontDeclared: true}, s)
	assert.NotContains(t, out, "@font-face")
	assert.Contains(t, out, FontFamilyName(s.Font))
	css := FontFaceCSS(s.Font)
	assert.Contains(t, css, `font-family:"`+FontFamilyName(s.Font)+`"`)
	assert.Empty(t, FontFaceCSS(Font{}))
	other := Font{Data: append([]byte{1}, s.Font.Data...)}
	assert.NotEqual(t, FontFamilyName(s.Font), FontFamilyName(other), "different font bytes, different family")
}

func TestWriteSVGImageMark(t *testing.T) {
	img := image.NewNRGBA(image.Rect(0, 0, 2, 1))
	img.SetNRGBA(0, 0, color.NRGBA{R: 255, A: 255})
	img.SetNRGBA(1, 0, color.NRGBA{B: 255, A: 255})
	s := &Scene{Width: 20, Height: 10, Title: "t"}
	s.Add(Mark{Kind: Image, Class: "plumb-cells", X: 1, Y: 2, W: 10, H: 5, Img: img, Attrs: []Attr{{"rows", "1"}}})
	var b strings.Builder
	if err := WriteSVG(&b, s); err != nil {
		t.Fatal(err)
	}
	out := b.String()
	i := strings.Index(out, `<image x="1" y="2" width="10" height="5" href="data:image/png;base64,`)
	if i < 0 {
		t.Fatalf("no image element in\n%s", out)
	}
	start := i + len(`<image x="1" y="2" width="10" height="5" href="data:image/png;base64,`)
	end := strings.IndexByte(out[start:], '"')
	raw, err := base64.StdEncoding.DecodeString(out[start : start+end])
	if err != nil {
		t.Fatal(err)
	}
	back, err := png.Decode(bytes.NewReader(raw))
	if err != nil {
		t.Fatal(err)
	}
	if r, _, _, _ := back.At(0, 0).RGBA(); r != 0xffff {
		t.Errorf("pixel (0,0) red = %#x, want 0xffff", r)
	}
	if !strings.Contains(out, `class="plumb-cells"`) || !strings.Contains(out, `data-rows="1"`) || strings.Contains(out[i:], `fill=`) && strings.Index(out[i:], `fill=`) < strings.Index(out[i:], "/>") {
		t.Errorf("image attributes wrong:\n%s", out[i:i+200])
	}
}

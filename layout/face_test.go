package layout

import (
	"math"
	"strings"
	"sync"
	"testing"
)

// widthStrings exercise the Latin-1 fast path, the cmap path (Greek,
// Cyrillic, typographic punctuation), runes the Go fonts lack (CJK, emoji
// outside the BMP) and the ellipsis Wrap appends.
var widthStrings = []string{
	"",
	"A",
	"AV",
	"To",
	"Wa",
	"Harbour Loop",
	"Passengers per route, 2024",
	"Ærøskøbing – Ålesund",
	"Ωμέγα Ферма “quoted” …",
	"港口渡轮",
	"ferry 🚢 ⛴",
	"0123456789.,-+%",
}

func TestWidthMatchesFontTables(t *testing.T) {
	for _, tc := range []struct {
		name string
		face *Face
	}{
		{"GoRegular", GoRegular()},
		{"GoBold", GoBold()},
	} {
		ref := readRef(t, tc.face.Data())
		// Both Go fonts are unkerned: no kern table and no GPOS, so their
		// widths are sums of hmtx advances.
		if ref.hasKern || ref.hasGPOS {
			t.Fatalf("%s: font gained a kern or GPOS table; extend the reference", tc.name)
		}
		for _, s := range widthStrings {
			for _, size := range []float64{1, 11, 13.5, 48} {
				got, want := tc.face.Width(s, size), ref.width(s, size)
				if math.Abs(got-want) > 1e-6 {
					t.Errorf("%s Width(%q, %g) = %.9f, hmtx gives %.9f", tc.name, s, size, got, want)
				}
			}
		}
	}
}

// kernedGoRegular is Go Regular with a kern table added. The Go fonts kern
// nothing, so this is how the kerning code meets real font bytes; the pair
// values are made up for the test.
func kernedGoRegular(t testing.TB) (*Face, refFont) {
	t.Helper()
	data := GoRegular().Data()
	plain := readRef(t, data)
	g := plain.glyph
	ft := readTables(t, data)
	ft.tables["kern"] = kernTable([]kernPair{
		{g('A'), g('V'), -152},
		{g('V'), g('A'), -152},
		{g('T'), g('o'), -180},
		{g('W'), g('a'), -90},
		{g('f'), g('f'), 12},
		{g('Τ'), g('ο'), -160}, // Greek Tau omicron: outside the ASCII cache
		{g('o'), g('Τ'), -20},  // ASCII then Greek
	})
	kerned := ft.bytes()
	f, err := ParseFace(kerned)
	if err != nil {
		t.Fatalf("ParseFace(Go Regular + kern): %v", err)
	}
	return f, readRef(t, kerned)
}

func TestWidthKerning(t *testing.T) {
	f, ref := kernedGoRegular(t)
	if !ref.hasKern || len(ref.kern) != 7 {
		t.Fatalf("reference read %d kern pairs, want 7", len(ref.kern))
	}
	plain := GoRegular()
	for _, s := range append(widthStrings, "AVA", "Today", "Water", "off", "Τοπος", "oΤ", "xAVx") {
		for _, size := range []float64{10, 12, 100} {
			got, want := f.Width(s, size), ref.width(s, size)
			if math.Abs(got-want) > 1e-6 {
				t.Errorf("kerned Width(%q, %g) = %.9f, hmtx+kern give %.9f", s, size, got, want)
			}
		}
	}
	// The pairs really are kerned: tighter or looser than the plain font
	// by exactly the table's value.
	for _, tc := range []struct {
		text  string
		units float64
	}{
		{"AV", -152}, {"To", -180}, {"Wa", -90}, {"ff", 12}, {"Το", -160}, {"oΤ", -20}, {"AVA", -304},
	} {
		diff := f.Width(tc.text, 2048) - plain.Width(tc.text, 2048) // 2048 units per em: 1 px per unit
		if math.Abs(diff-tc.units) > 1e-9 {
			t.Errorf("kerning of %q = %g units, want %g", tc.text, diff, tc.units)
		}
	}
}

func TestAscentDescentMatchHhea(t *testing.T) {
	for _, f := range []*Face{GoRegular(), GoBold()} {
		ref := readRef(t, f.Data())
		for _, size := range []float64{1, 12, 40} {
			wantA := float64(ref.ascender) * size / ref.unitsPerEm
			wantD := -float64(ref.descender) * size / ref.unitsPerEm
			if got := f.Ascent(size); math.Abs(got-wantA) > 1e-9 {
				t.Errorf("Ascent(%g) = %g, hhea ascender gives %g", size, got, wantA)
			}
			if got := f.Descent(size); math.Abs(got-wantD) > 1e-9 {
				t.Errorf("Descent(%g) = %g, hhea descender gives %g", size, got, wantD)
			}
		}
	}
}

func TestAscentFallsBackToOS2(t *testing.T) {
	ft := readTables(t, GoRegular().Data())
	hhea := ft.tables["hhea"]
	clear(hhea[4:8]) // no hhea ascender or descender
	f, err := ParseFace(ft.bytes())
	if err != nil {
		t.Fatal(err)
	}
	ref := readRef(t, GoRegular().Data())
	if got, want := f.Ascent(20), float64(ref.typoAscender)*20/ref.unitsPerEm; math.Abs(got-want) > 1e-9 {
		t.Errorf("Ascent = %g, OS/2 sTypoAscender gives %g", got, want)
	}
	if got, want := f.Descent(20), -float64(ref.typoDescender)*20/ref.unitsPerEm; math.Abs(got-want) > 1e-9 {
		t.Errorf("Descent = %g, OS/2 sTypoDescender gives %g", got, want)
	}
}

func TestFaceNames(t *testing.T) {
	for _, tc := range []struct {
		face           *Face
		family, format string
	}{
		{GoRegular(), "Go", "truetype"},
		{GoBold(), "Go", "truetype"},
		{nil, "Go", "truetype"},     // nil measures with Go Regular
		{&Face{}, "Go", "truetype"}, // so does the zero Face
	} {
		if got := tc.face.Family(); got != tc.family {
			t.Errorf("Family() = %q, want %q", got, tc.family)
		}
		if got := tc.face.Format(); got != tc.format {
			t.Errorf("Format() = %q, want %q", got, tc.format)
		}
		if len(tc.face.Data()) == 0 {
			t.Error("Data() is empty")
		}
	}
	if GoRegular().Width("Harbour", 12) >= GoBold().Width("Harbour", 12) {
		t.Error("Go Bold should set wider than Go Regular")
	}
}

func TestFamilyFallback(t *testing.T) {
	ft := readTables(t, GoRegular().Data())
	delete(ft.tables, "name")
	f, err := ParseFace(ft.bytes())
	if err != nil {
		t.Fatal(err)
	}
	if got := f.Family(); got != "sans-serif" {
		t.Errorf("Family() without a name table = %q, want sans-serif", got)
	}
}

func TestSfntFormat(t *testing.T) {
	for _, tc := range []struct {
		tag, want string
	}{
		{"\x00\x01\x00\x00", "truetype"},
		{"true", "truetype"},
		{"OTTO", "opentype"},
		{"ttcf", ""},
		{"wOFF", ""},
		{"GIF8", ""},
	} {
		got, err := sfntFormat([]byte(tc.tag + "\x00\x00\x00\x00\x00\x00\x00\x00"))
		if got != tc.want || (err != nil) != (tc.want == "") {
			t.Errorf("sfntFormat(%q) = %q, %v; want %q", tc.tag, got, err, tc.want)
		}
	}
}

func TestParseFaceErrors(t *testing.T) {
	good := GoRegular().Data()
	hugeEm := readTables(t, good)
	hugeEm.tables["head"][18], hugeEm.tables["head"][19] = 0x80, 0 // 32768 units per em
	noHmtx := readTables(t, good)
	delete(noHmtx.tables, "hmtx")
	for _, tc := range []struct {
		name, want string
		data       []byte
	}{
		{"nil", "empty", nil},
		{"short", "shorter than an sfnt header", []byte("OTTO")},
		{"text", "not a TrueType or OpenType signature", []byte("this is not a font at all")},
		{"collection", "collection", append([]byte("ttcf"), good[4:]...)},
		{"woff", "WOFF", append([]byte("wOFF"), good[4:]...)},
		{"truncated", "parse font", good[:2000]},
		{"units per em", "units per em", hugeEm.bytes()},
		{"missing hmtx", "parse font", noHmtx.bytes()},
	} {
		f, err := ParseFace(tc.data)
		if err == nil || f != nil {
			t.Errorf("%s: ParseFace = %v, %v; want an error", tc.name, f, err)
			continue
		}
		if !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %q does not mention %q", tc.name, err, tc.want)
		}
	}
}

func TestParseFaceCopiesData(t *testing.T) {
	data := append([]byte(nil), GoRegular().Data()...)
	f, err := ParseFace(data)
	if err != nil {
		t.Fatal(err)
	}
	want := f.Width("Harbour Loop", 12)
	clear(data)
	if got := f.Width("Harbour Loop", 12); got != want {
		t.Errorf("Width changed from %g to %g after the caller reused its buffer", want, got)
	}
}

func TestWidthEdgeCases(t *testing.T) {
	f := GoRegular()
	for _, size := range []float64{0, -3, math.NaN()} {
		if got := f.Width("Harbour", size); got != 0 {
			t.Errorf("Width at size %g = %g, want 0", size, got)
		}
		if got := f.Ascent(size) + f.Descent(size); got != 0 {
			t.Errorf("Ascent+Descent at size %g = %g, want 0", size, got)
		}
	}
	// Invalid UTF-8 is measured rune by rune like any other text.
	if got := f.Width("a\xffb", 12); !(got > f.Width("ab", 12)) {
		t.Errorf("Width with an invalid byte = %g, want more than %q alone", got, "ab")
	}
	// Widths of an unkerned font add up.
	a, b := "Outer Gull ", "Skerry"
	if d := f.Width(a+b, 13) - f.Width(a, 13) - f.Width(b, 13); math.Abs(d) > 1e-9 {
		t.Errorf("Width is not additive for an unkerned font: off by %g", d)
	}
}

func TestFontsFace(t *testing.T) {
	custom, _ := kernedGoRegular(t)
	for _, tc := range []struct {
		name  string
		fonts Fonts
		bold  bool
		want  *Face
	}{
		{"zero regular", Fonts{}, false, GoRegular()},
		{"zero bold", Fonts{}, true, GoBold()},
		{"custom regular", Fonts{Regular: custom}, false, custom},
		{"custom regular, bold missing", Fonts{Regular: custom}, true, custom},
		{"custom bold", Fonts{Regular: custom, Bold: GoBold()}, true, GoBold()},
		{"bold only, regular asked", Fonts{Bold: custom}, false, GoRegular()},
	} {
		if got := tc.fonts.Face(tc.bold); got != tc.want {
			t.Errorf("%s: Face(%v) = %p, want %p", tc.name, tc.bold, got, tc.want)
		}
	}
}

func TestFaceConcurrentUse(t *testing.T) {
	f, ref := kernedGoRegular(t)
	var wg sync.WaitGroup
	errs := make(chan string, 8)
	for range 8 {
		wg.Go(func() {
			for range 200 {
				for _, s := range widthStrings {
					if got, want := f.Width(s, 12), ref.width(s, 12); math.Abs(got-want) > 1e-6 {
						errs <- s
						return
					}
				}
			}
		})
	}
	wg.Wait()
	close(errs)
	for s := range errs {
		t.Errorf("concurrent Width(%q) disagreed with the tables", s)
	}
}

func BenchmarkWidth(b *testing.B) {
	f := GoRegular()
	const label = "Outer Gull Skerry 12" // 20 characters
	b.ReportAllocs()
	for b.Loop() {
		f.Width(label, 12)
	}
}

func BenchmarkWidthKerned(b *testing.B) {
	f, _ := kernedGoRegular(b)
	const label = "Outer Gull Skerry 12"
	b.ReportAllocs()
	for b.Loop() {
		f.Width(label, 12)
	}
}

func BenchmarkWidthNonLatin(b *testing.B) {
	f := GoRegular()
	const label = "Ωμέγα Ферма – Τοπος" // cmap lookups outside Latin-1
	b.ReportAllocs()
	for b.Loop() {
		f.Width(label, 12)
	}
}

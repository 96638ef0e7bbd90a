package layout

import (
	"encoding/binary"
	"errors"
	"fmt"
	"strings"
	"sync"

	"golang.org/x/image/font"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"
)

// Face measures text set in one font.
//
// A Face is safe for concurrent use by multiple goroutines: everything it
// reads while measuring is computed once by ParseFace, and the scratch
// buffers the font parser needs come from a pool. The zero Face, and a nil
// *Face, measure with the Go Regular font.
type Face struct {
	font   *sfnt.Font
	data   []byte
	family string
	format string

	upem            float64 // font units per em
	ascent, descent int32   // font units, both positive for ordinary fonts

	// advance is the advance width of every glyph in font units, read once
	// from hmtx so that measuring never goes back to the font tables. With
	// latin below, this makes BenchmarkWidth about 8 times faster than
	// asking the parser for each rune's glyph and advance (82 against
	// 690 ns for a 20-character label).
	advance []uint16
	// latin maps runes below 256 to glyphs, skipping the cmap lookup for
	// the characters most labels are made of.
	latin [256]sfnt.GlyphIndex
	// kerned reports whether the font has any pair kerning at all; the Go
	// fonts have none, and then measuring is a sum of table lookups.
	kerned bool
	// asciiKern holds the kerning, in font units, of every pair of printable
	// ASCII characters (space to tilde), so common labels avoid the kern
	// table's binary search. Nil when the font is not kerned.
	asciiKern []int16

	buffers sync.Pool // of *sfnt.Buffer
}

// Printable ASCII, the range the kerning cache covers.
const (
	asciiFirst = ' '
	asciiLast  = '~'
	asciiCount = asciiLast - asciiFirst + 1
)

var (
	goRegular = sync.OnceValue(func() *Face { return mustParse(goregular.TTF) })
	goBold    = sync.OnceValue(func() *Face { return mustParse(gobold.TTF) })
)

// mustParse parses a font compiled into the binary. It fails only if the
// golang.org/x/image module itself is damaged, which the tests would show.
func mustParse(data []byte) *Face {
	f, err := ParseFace(data)
	if err != nil {
		panic("layout: built-in Go font does not parse: " + err.Error())
	}
	return f
}

// GoRegular returns the Go Regular face (family "Go"). The face is parsed
// once and shared.
func GoRegular() *Face { return goRegular() }

// GoBold returns the Go Bold face (family "Go"). The face is parsed once and
// shared.
func GoBold() *Face { return goBold() }

// ParseFace parses a TrueType (glyf outlines) or OpenType (CFF outlines)
// font. It keeps its own copy of data. The error names what is wrong with
// the font; garbage input yields an error, never a panic.
func ParseFace(data []byte) (face *Face, err error) {
	if len(data) == 0 {
		return nil, errors.New("layout: font data is empty")
	}
	format, err := sfntFormat(data)
	if err != nil {
		return nil, err
	}
	// The font parser is third-party code fed untrusted bytes; a panic in
	// it must reach the caller as an error like any other bad font.
	defer func() {
		if r := recover(); r != nil {
			face, err = nil, fmt.Errorf("layout: malformed font: %v", r)
		}
	}()
	data = append([]byte(nil), data...) // sfnt keeps reading the slice
	sf, err := sfnt.Parse(data)
	if err != nil {
		return nil, fmt.Errorf("layout: parse font: %w", err)
	}
	f := &Face{font: sf, data: data, format: format}
	if err := f.load(); err != nil {
		return nil, err
	}
	return f, nil
}

// load reads everything measuring needs from the parsed font.
func (f *Face) load() error {
	var b sfnt.Buffer
	upem := int(f.font.UnitsPerEm())
	// The OpenType head table allows 16 to 16384 units per em; beyond that
	// the parser's 26.6 fixed-point arithmetic, used here at one pixel per
	// font unit so that it returns exact font units, would overflow.
	if upem < 16 || upem > 16384 {
		return fmt.Errorf("layout: font has %d units per em, outside the 16 to 16384 the head table allows", upem)
	}
	f.upem = float64(upem)
	unit := fixed.Int26_6(upem) // ppem at which one font unit is one 26.6 step

	n := f.font.NumGlyphs()
	if n <= 0 {
		return errors.New("layout: font has no glyphs")
	}
	f.advance = make([]uint16, n)
	for g := range f.advance {
		a, err := f.font.GlyphAdvance(&b, sfnt.GlyphIndex(g), unit, font.HintingNone)
		if err != nil {
			return fmt.Errorf("layout: advance width of glyph %d: %w", g, err)
		}
		f.advance[g] = uint16(a)
	}
	for r := range f.latin {
		g, err := f.font.GlyphIndex(&b, rune(r))
		if err != nil {
			return fmt.Errorf("layout: cmap lookup of %U: %w", r, err)
		}
		f.latin[r] = f.checkGlyph(g)
	}

	m, err := f.font.Metrics(&b, unit, font.HintingNone)
	if err != nil {
		return fmt.Errorf("layout: font metrics: %w", err)
	}
	f.ascent, f.descent = int32(m.Ascent), int32(m.Descent)
	if f.ascent == 0 && f.descent == 0 {
		// Some fonts leave hhea empty and rely on OS/2 instead.
		f.ascent, f.descent = os2Extent(f.data)
	}

	f.family = "sans-serif"
	for _, id := range []sfnt.NameID{sfnt.NameIDTypographicFamily, sfnt.NameIDFamily} {
		if name, err := f.font.Name(&b, id); err == nil && strings.TrimSpace(name) != "" {
			f.family = strings.TrimSpace(name)
			break
		}
	}

	f.kerned = hasTable(f.data, "kern") || hasTable(f.data, "GPOS")
	if f.kerned {
		f.asciiKern = make([]int16, asciiCount*asciiCount)
		for i := range asciiCount {
			for j := range asciiCount {
				k := f.kernGlyphs(&b, f.latin[asciiFirst+i], f.latin[asciiFirst+j])
				f.asciiKern[i*asciiCount+j] = int16(k)
			}
		}
	}
	return nil
}

// checkGlyph maps glyph indices a malformed cmap may point past the end of
// the font to the missing glyph.
func (f *Face) checkGlyph(g sfnt.GlyphIndex) sfnt.GlyphIndex {
	if int(g) >= len(f.advance) {
		return 0
	}
	return g
}

// kernGlyphs returns the kerning of a glyph pair in font units.
func (f *Face) kernGlyphs(b *sfnt.Buffer, g0, g1 sfnt.GlyphIndex) int32 {
	k, err := f.font.Kern(b, g0, g1, fixed.Int26_6(f.upem), font.HintingNone)
	if err != nil { // ErrNotFound: the pair is not kerned
		return 0
	}
	return int32(k)
}

// usable returns f, or Go Regular for a nil or zero Face.
func (f *Face) usable() *Face {
	if f == nil || f.font == nil {
		return GoRegular()
	}
	return f
}

// Family returns the font's family name from its name table (the
// typographic family if present, else the family), or "sans-serif" when the
// font names none.
func (f *Face) Family() string { return f.usable().family }

// Data returns the raw font file, for embedding. The caller must not modify
// it.
func (f *Face) Data() []byte { return f.usable().data }

// Format returns "truetype" for fonts with glyf outlines and "opentype" for
// fonts with CFF outlines, the names CSS uses in @font-face format().
func (f *Face) Format() string { return f.usable().format }

// Width returns the advance width in pixels of text set on one line at a
// font size of size pixels (one em), pair kerning included. Runes the font
// lacks are measured as its missing glyph. A size that is not positive
// gives 0.
func (f *Face) Width(text string, size float64) float64 {
	f = f.usable()
	if !(size > 0) || text == "" {
		return 0
	}
	return float64(f.units(text)) * size / f.upem
}

// units returns the advance width of text in font units. Summing integer
// units and scaling once keeps the result exact and independent of how the
// text was split.
func (f *Face) units(text string) int64 {
	var (
		buf   *sfnt.Buffer // borrowed from the pool only when needed
		total int64
		prevR rune
		prevG sfnt.GlyphIndex
	)
	for i, r := range text {
		var g sfnt.GlyphIndex
		if r >= 0 && r < rune(len(f.latin)) {
			g = f.latin[r]
		} else {
			if buf == nil {
				buf = f.buffer()
			}
			if gi, err := f.font.GlyphIndex(buf, r); err == nil {
				g = f.checkGlyph(gi)
			}
		}
		total += int64(f.advance[g])
		if f.kerned && i > 0 {
			if isASCII(prevR) && isASCII(r) {
				total += int64(f.asciiKern[(prevR-asciiFirst)*asciiCount+(r-asciiFirst)])
			} else {
				if buf == nil {
					buf = f.buffer()
				}
				total += int64(f.kernGlyphs(buf, prevG, g))
			}
		}
		prevR, prevG = r, g
	}
	if buf != nil {
		f.buffers.Put(buf)
	}
	return total
}

func isASCII(r rune) bool { return r >= asciiFirst && r <= asciiLast }

// buffer borrows a scratch buffer for the font parser; return it with
// f.buffers.Put.
func (f *Face) buffer() *sfnt.Buffer {
	if b, ok := f.buffers.Get().(*sfnt.Buffer); ok {
		return b
	}
	return new(sfnt.Buffer)
}

// Ascent returns the distance in pixels from the baseline up to the top of
// the font's line box (the hhea ascender) at a font size of size pixels.
func (f *Face) Ascent(size float64) float64 {
	f = f.usable()
	if !(size > 0) {
		return 0
	}
	return float64(f.ascent) * size / f.upem
}

// Descent returns the distance in pixels from the baseline down to the bottom
// of the font's line box (the hhea descender, as a positive number) at a
// font size of size pixels.
func (f *Face) Descent(size float64) float64 {
	f = f.usable()
	if !(size > 0) {
		return 0
	}
	return float64(f.descent) * size / f.upem
}

// Fonts pairs the regular and bold faces a chart uses. The zero value uses
// the Go fonts.
type Fonts struct {
	Regular, Bold *Face
}

// Face returns the bold or the regular face. A missing regular face is Go
// Regular. A missing bold face is Go Bold when the regular face is missing
// too, and otherwise the regular face itself: one family set in its regular
// weight reads better than two families mixed.
func (fs Fonts) Face(bold bool) *Face {
	switch {
	case bold && fs.Bold != nil:
		return fs.Bold
	case bold && fs.Regular == nil:
		return GoBold()
	case fs.Regular != nil:
		return fs.Regular
	}
	return GoRegular()
}

// sfntFormat reads the sfnt version tag at the start of a font file.
func sfntFormat(data []byte) (string, error) {
	if len(data) < 12 {
		return "", fmt.Errorf("layout: font data is %d bytes, shorter than an sfnt header", len(data))
	}
	switch tag := string(data[:4]); tag {
	case "\x00\x01\x00\x00", "true":
		return "truetype", nil
	case "OTTO":
		return "opentype", nil
	case "ttcf":
		return "", errors.New("layout: font data is a font collection (ttcf); give a single font")
	case "wOFF", "wOF2":
		return "", errors.New("layout: font data is a compressed web font (WOFF); give the TTF or OTF file")
	default:
		return "", fmt.Errorf("layout: font data starts with %q, not a TrueType or OpenType signature", tag)
	}
}

// table returns the bytes of the table with the given tag, or nil.
func table(data []byte, tag string) []byte {
	if len(data) < 12 {
		return nil
	}
	n := int(binary.BigEndian.Uint16(data[4:]))
	for i := range n {
		rec := 12 + 16*i
		if rec+16 > len(data) {
			return nil
		}
		if string(data[rec:rec+4]) != tag {
			continue
		}
		off := uint64(binary.BigEndian.Uint32(data[rec+8:]))
		length := uint64(binary.BigEndian.Uint32(data[rec+12:]))
		if off+length > uint64(len(data)) {
			return nil
		}
		return data[off : off+length]
	}
	return nil
}

func hasTable(data []byte, tag string) bool { return table(data, tag) != nil }

// os2Extent returns the OS/2 typographic ascender and descender in font
// units, falling back to the Windows ascent and descent when those are zero.
func os2Extent(data []byte) (ascent, descent int32) {
	t := table(data, "OS/2")
	if len(t) < 78 {
		return 0, 0
	}
	i16 := func(o int) int32 { return int32(int16(binary.BigEndian.Uint16(t[o:]))) }
	ascent, descent = i16(68), -i16(70) // sTypoAscender, sTypoDescender
	if ascent == 0 && descent == 0 {
		ascent = int32(binary.BigEndian.Uint16(t[74:]))  // usWinAscent
		descent = int32(binary.BigEndian.Uint16(t[76:])) // usWinDescent
	}
	return ascent, descent
}

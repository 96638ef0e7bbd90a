package layout

// An independent reader and writer for the few sfnt tables the tests check
// against, written from the OpenType specification's table layouts (head,
// hhea, hmtx, cmap format 4, kern format 0, OS/2) with encoding/binary only,
// so that Face is compared with the font's bytes rather than with the parser
// it is built on.

import (
	"encoding/binary"
	"fmt"
	"slices"
	"testing"
)

var be = binary.BigEndian

// fontTables is a parsed table directory.
type fontTables struct {
	version []byte
	tables  map[string][]byte
}

func readTables(t testing.TB, data []byte) fontTables {
	t.Helper()
	ft := fontTables{version: slices.Clone(data[:4]), tables: map[string][]byte{}}
	n := int(be.Uint16(data[4:]))
	for i := range n {
		rec := data[12+16*i:]
		off, length := be.Uint32(rec[8:]), be.Uint32(rec[12:])
		ft.tables[string(rec[:4])] = slices.Clone(data[off : off+length])
	}
	return ft
}

// bytes writes the tables as an sfnt file, tags in sorted order, each table
// padded to four bytes, with the directory's search fields and checksums.
func (ft fontTables) bytes() []byte {
	tags := make([]string, 0, len(ft.tables))
	for tag := range ft.tables {
		tags = append(tags, tag)
	}
	slices.Sort(tags)
	n := len(tags)
	entrySelector := 0
	for 1<<(entrySelector+1) <= n {
		entrySelector++
	}
	searchRange := 16 << entrySelector
	out := make([]byte, 12+16*n)
	copy(out, ft.version)
	be.PutUint16(out[4:], uint16(n))
	be.PutUint16(out[6:], uint16(searchRange))
	be.PutUint16(out[8:], uint16(entrySelector))
	be.PutUint16(out[10:], uint16(16*n-searchRange))
	for i, tag := range tags {
		tab := ft.tables[tag]
		rec := out[12+16*i:]
		copy(rec, tag)
		padded := append(slices.Clone(tab), make([]byte, (4-len(tab)%4)%4)...)
		var sum uint32
		for j := 0; j < len(padded); j += 4 {
			sum += be.Uint32(padded[j:])
		}
		be.PutUint32(rec[4:], sum)
		be.PutUint32(rec[8:], uint32(len(out)))
		be.PutUint32(rec[12:], uint32(len(tab)))
		out = append(out, padded...)
	}
	return out
}

// kernPair is one entry of a kern format 0 subtable, by glyph index.
type kernPair struct {
	left, right uint16
	value       int16
}

// kernTable builds a version 0 kern table with one horizontal format 0
// subtable.
func kernTable(pairs []kernPair) []byte {
	slices.SortFunc(pairs, func(a, b kernPair) int {
		return int(uint32(a.left)<<16|uint32(a.right)) - int(uint32(b.left)<<16|uint32(b.right))
	})
	n := len(pairs)
	sub := make([]byte, 14+6*n)
	be.PutUint16(sub[0:], 0)                // subtable version
	be.PutUint16(sub[2:], uint16(len(sub))) // length
	be.PutUint16(sub[4:], 0x0001)           // format 0, horizontal
	be.PutUint16(sub[6:], uint16(n))
	sr := 1
	es := 0
	for sr*2 <= n {
		sr *= 2
		es++
	}
	be.PutUint16(sub[8:], uint16(6*sr))
	be.PutUint16(sub[10:], uint16(es))
	be.PutUint16(sub[12:], uint16(6*n-6*sr))
	for i, p := range pairs {
		e := sub[14+6*i:]
		be.PutUint16(e, p.left)
		be.PutUint16(e[2:], p.right)
		be.PutUint16(e[4:], uint16(p.value))
	}
	return append([]byte{0, 0, 0, 1}, sub...) // table version 0, one subtable
}

// refFont holds the values the tests read straight from the tables.
type refFont struct {
	unitsPerEm       float64
	ascender         int16 // hhea
	descender        int16 // hhea, negative below the baseline
	typoAscender     int16 // OS/2
	typoDescender    int16 // OS/2
	advances         []uint16
	cmap             []byte // the format 4 subtable
	kern             map[[2]uint16]int16
	hasKern, hasGPOS bool
}

func readRef(t testing.TB, data []byte) refFont {
	t.Helper()
	ft := readTables(t, data)
	head, hhea, hmtx, os2 := ft.tables["head"], ft.tables["hhea"], ft.tables["hmtx"], ft.tables["OS/2"]
	r := refFont{
		unitsPerEm:    float64(be.Uint16(head[18:])),
		ascender:      int16(be.Uint16(hhea[4:])),
		descender:     int16(be.Uint16(hhea[6:])),
		typoAscender:  int16(be.Uint16(os2[68:])),
		typoDescender: int16(be.Uint16(os2[70:])),
		kern:          map[[2]uint16]int16{},
	}
	numHMetrics := int(be.Uint16(hhea[34:]))
	numGlyphs := int(be.Uint16(ft.tables["maxp"][4:]))
	for g := range numGlyphs {
		r.advances = append(r.advances, be.Uint16(hmtx[4*min(g, numHMetrics-1):]))
	}
	cmap := ft.tables["cmap"]
	for i := range int(be.Uint16(cmap[2:])) {
		rec := cmap[4+8*i:]
		platform, encoding := be.Uint16(rec), be.Uint16(rec[2:])
		sub := cmap[be.Uint32(rec[4:]):]
		if be.Uint16(sub) == 4 && (platform == 3 && encoding == 1 || platform == 0) {
			r.cmap = sub[:be.Uint16(sub[2:])]
			break
		}
	}
	if r.cmap == nil {
		t.Fatal("font has no Unicode cmap subtable of format 4")
	}
	_, r.hasGPOS = ft.tables["GPOS"]
	if kern, ok := ft.tables["kern"]; ok {
		r.hasKern = true
		sub := kern[4:] // first subtable only, as most readers do
		for i := range int(be.Uint16(sub[6:])) {
			e := sub[14+6*i:]
			r.kern[[2]uint16{be.Uint16(e), be.Uint16(e[2:])}] = int16(be.Uint16(e[4:]))
		}
	}
	return r
}

// glyph maps a rune through the format 4 cmap subtable.
func (r refFont) glyph(c rune) uint16 {
	if c > 0xFFFF {
		return 0
	}
	t := r.cmap
	segX2 := int(be.Uint16(t[6:]))
	ends, starts := 14, 16+segX2
	deltas, ranges := starts+segX2, starts+2*segX2
	for s := 0; s < segX2; s += 2 {
		end, start := rune(be.Uint16(t[ends+s:])), rune(be.Uint16(t[starts+s:]))
		if c > end {
			continue
		}
		if c < start {
			return 0
		}
		delta := be.Uint16(t[deltas+s:])
		ro := int(be.Uint16(t[ranges+s:]))
		if ro == 0 {
			return uint16(c) + delta
		}
		g := be.Uint16(t[ranges+s+ro+2*int(c-start):])
		if g == 0 {
			return 0
		}
		return g + delta
	}
	return 0
}

// width is the reference advance width of text in pixels.
func (r refFont) width(text string, size float64) float64 {
	var units int64
	var prev uint16
	for i, c := range text {
		g := r.glyph(c)
		if int(g) >= len(r.advances) {
			g = 0
		}
		units += int64(r.advances[g])
		if i > 0 {
			units += int64(r.kern[[2]uint16{prev, g}])
		}
		prev = g
	}
	return float64(units) * size / r.unitsPerEm
}

// postName returns the name the post table (format 2) gives glyph g: a
// custom name, or "#n" for entry n of the standard Macintosh glyph order.
func postName(t testing.TB, data []byte, g uint16) string {
	t.Helper()
	post := readTables(t, data).tables["post"]
	if be.Uint32(post) != 0x00020000 {
		t.Skip("post table is not format 2; no glyph names to check against")
	}
	n := int(be.Uint16(post[32:]))
	idx := int(be.Uint16(post[34+2*int(g):]))
	if idx < 258 {
		return fmt.Sprintf("#%d", idx)
	}
	p := 34 + 2*n
	for range idx - 258 {
		p += 1 + int(post[p])
	}
	return string(post[p+1 : p+1+int(post[p])])
}

func TestReferenceCmapMatchesGlyphNames(t *testing.T) {
	// The reference cmap reader must find the glyphs the font itself names
	// after these characters, or the Width comparisons prove nothing.
	data := GoRegular().Data()
	r := readRef(t, data)
	for _, tc := range []struct {
		r    rune
		name string
	}{
		// Indices in the standard Macintosh glyph order of the TrueType
		// 'post' table, all from memory.
		{' ', "#3"},  // space (from memory)
		{'A', "#36"}, // A (from memory)
		{'V', "#57"}, // V (from memory)
		{'a', "#68"}, // a (from memory)
		{'o', "#82"}, // o (from memory)
		{'Å', "#99"}, // Aring, after asciitilde (97) and Adieresis (98) (from memory)
	} {
		if got := postName(t, data, r.glyph(tc.r)); got != tc.name {
			t.Errorf("glyph for %q is named %q, want %q", tc.r, got, tc.name)
		}
	}
}

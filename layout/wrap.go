package layout

import (
	"strings"
	"unicode"
	"unicode/utf8"
)

// Ellipsis marks text that was shortened to fit.
const Ellipsis = "…" // U+2026 HORIZONTAL ELLIPSIS

// Wrap breaks text into lines no wider than maxWidth pixels when set in f at
// a font size of size pixels, and into at most maxLines lines (maxLines <= 0
// means no limit). It fills each line with as many words as fit before
// starting the next.
//
// Lines break at white space, which is dropped (runs of white space, line
// breaks included, count as one space); after a hyphen or slash inside a
// word, which stays at the end of the line; and beside CJK ideographs and
// kana, which are written without spaces. When the text does not fit in
// maxLines lines, the last line is shortened with "…" (U+2026) so that it
// fits; a single word wider than maxWidth is shortened the same way. Text is
// cut between characters, never inside a UTF-8 sequence or before a
// combining mark.
//
// Wrap returns the lines and whether anything was cut. No line is wider than
// maxWidth, except that when even "…" alone does not fit, the result is
// that single "…". Empty or all-blank text gives no lines.
func Wrap(f *Face, text string, size, maxWidth float64, maxLines int) (lines []string, cut bool) {
	pieces := splitPieces(text)
	if len(pieces) == 0 {
		return nil, false
	}
	fits := func(s string) bool { return f.Width(s, size) <= maxWidth }
	if !fits(Ellipsis) { // also catches a NaN width
		return []string{Ellipsis}, true
	}
	for i := 0; i < len(pieces); {
		last := maxLines > 0 && len(lines) == maxLines-1
		line, j := pieces[i].text, i+1
		if fits(line) {
			for ; j < len(pieces); j++ {
				next := line + pieces[j].joiner() + pieces[j].text
				if !fits(next) {
					break
				}
				line = next
			}
		}
		if !fits(line) || (last && j < len(pieces)) {
			// A word too wide for any line, or text left over for the
			// last line: cut it down to what fits.
			rest := line
			if last {
				rest = joinPieces(line, pieces[j:])
				j = len(pieces)
			}
			line, cut = shorten(f, rest, size, maxWidth), true
		}
		lines = append(lines, line)
		i = j
	}
	return lines, cut
}

// piece is a run of text that cannot be broken, with how it joins the piece
// before it on the same line.
type piece struct {
	text  string
	space bool // preceded by a space (else it continues the word)
}

func (p piece) joiner() string {
	if p.space {
		return " "
	}
	return ""
}

func joinPieces(line string, rest []piece) string {
	var b strings.Builder
	b.WriteString(line)
	for _, p := range rest {
		b.WriteString(p.joiner())
		b.WriteString(p.text)
	}
	return b.String()
}

// splitPieces splits text at its break opportunities.
func splitPieces(text string) []piece {
	var pieces []piece
	for _, word := range strings.Fields(text) {
		start, prevAt := 0, 0
		var prev rune
		for i, r := range word {
			if i > 0 && breakBetween(prev, r, word[:prevAt]) {
				pieces = append(pieces, piece{text: word[start:i], space: start == 0})
				start = i
			}
			prev, prevAt = r, i
		}
		pieces = append(pieces, piece{text: word[start:], space: start == 0})
	}
	if len(pieces) > 0 {
		pieces[0].space = false
	}
	return pieces
}

// breakBetween reports whether a line may break between the runes r0 and r1
// inside a word; before is the part of the word ahead of r0. It follows the
// spirit of the Unicode line breaking algorithm (UAX #14) for the cases
// chart labels meet: a break after a hyphen or slash that follows a letter
// or digit (so a leading minus sign stays with its number), and a break
// beside an ideograph except before closing or after opening punctuation.
func breakBetween(r0, r1 rune, before string) bool {
	if r0 == '-' || r0 == '/' || r0 == '\u2010' || r0 == '\u2013' { // hyphen, en dash
		p, _ := utf8.DecodeLastRuneInString(before)
		return before != "" && (unicode.IsLetter(p) || unicode.IsDigit(p)) &&
			(unicode.IsLetter(r1) || unicode.IsDigit(r1))
	}
	if ideographic(r0) || ideographic(r1) {
		return !unicode.In(r1, unicode.Pe, unicode.Po, unicode.Pf) &&
			!unicode.In(r0, unicode.Ps, unicode.Pi) && !extends(r1)
	}
	return false
}

// ideographic reports whether r belongs to a script written without spaces
// between words.
func ideographic(r rune) bool {
	return unicode.In(r, unicode.Han, unicode.Hiragana, unicode.Katakana)
}

// extends reports whether r attaches to the character before it, so that
// text must not be cut just before r.
func extends(r rune) bool {
	switch {
	case r == '\u200D': // zero width joiner
		return true
	case r >= '\uFE00' && r <= '\uFE0F', r >= 0xE0100 && r <= 0xE01EF: // variation selectors
		return true
	case r >= 0x1F3FB && r <= 0x1F3FF: // emoji skin tone modifiers
		return true
	case r >= 0xE0020 && r <= 0xE007F: // tag characters
		return true
	}
	return unicode.In(r, unicode.Mn, unicode.Me, unicode.Mc)
}

// shorten returns the longest start of s that, with trailing spaces removed
// and "…" appended, fits in maxWidth; or "…" alone.
func shorten(f *Face, s string, size, maxWidth float64) string {
	// Byte offsets at which s may be cut: rune boundaries not followed by a
	// combining character and not preceded by a joiner.
	cuts := make([]int, 0, len(s))
	var prev rune
	for i, r := range s {
		if i > 0 && !extends(r) && prev != '\u200D' {
			cuts = append(cuts, i)
		}
		prev = r
	}
	candidate := func(k int) string {
		return strings.TrimRight(s[:cuts[k]], " ") + Ellipsis
	}
	fits := func(k int) bool { return f.Width(candidate(k), size) <= maxWidth }
	// Width grows with the length of the text (kerning aside), so search
	// for the longest fitting cut, then step back past any kerning quirk.
	lo, hi := 0, len(cuts) // cuts[:lo] all fit as far as we know; cuts[hi:] do not
	for lo < hi {
		mid := (lo + hi) / 2
		if fits(mid) {
			lo = mid + 1
		} else {
			hi = mid
		}
	}
	for k := lo - 1; k >= 0; k-- {
		if fits(k) {
			return candidate(k)
		}
	}
	return Ellipsis
}

package main

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// terminalSafe escapes everything in s that a terminal would act on rather
// than print: C0 controls (ESC among them, and newlines, which would forge
// a line), DEL, C1 controls (0x9b is CSI on many terminals), the bidi
// overrides that reorder what is shown, and bytes that are not UTF-8. The
// escapes are those of Go's strconv.Quote (\n, \t, \x1b, \u202e), so a
// message reads as the quoted text a user would type. Every error and note
// printer passes its whole line through here, whatever path, flag name,
// cell or column name it carries.
func terminalSafe(s string) string {
	if !needsEscape(s) {
		return s
	}
	var b strings.Builder
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && size == 1:
			fmt.Fprintf(&b, `\x%02x`, s[i])
		case r == '\n':
			b.WriteString(`\n`)
		case r == '\r':
			b.WriteString(`\r`)
		case r == '\t':
			b.WriteString(`\t`)
		case r < 0x20 || r == 0x7f:
			fmt.Fprintf(&b, `\x%02x`, r)
		case unsafeRune(r):
			fmt.Fprintf(&b, `\u%04x`, r)
		default:
			b.WriteString(s[i : i+size])
		}
		i += size
	}
	return b.String()
}

func needsEscape(s string) bool {
	for i := 0; i < len(s); {
		if c := s[i]; c >= 0x20 && c < 0x7f {
			i++
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if (r == utf8.RuneError && size == 1) || r < 0x20 || r == 0x7f || unsafeRune(r) {
			return true
		}
		i += size
	}
	return false
}

// unsafeRune reports C1 controls and the Unicode bidirectional embedding,
// override and isolate controls (Unicode Standard Annex #9, section 2).
func unsafeRune(r rune) bool {
	return (r >= 0x80 && r <= 0x9f) || (r >= 0x202a && r <= 0x202e) || (r >= 0x2066 && r <= 0x2069) || r == 0x200e || r == 0x200f || r == 0x061c
}

package render

import (
	"fmt"
	"strconv"
	"strings"

	"plumb/internal/suggest"
)

// Words and numbers every chart writes alike: data- attribute numbers,
// plurals, unit names, the closest name for a "did you mean".

// dataNumber formats a value for a data-* attribute: the shortest text that
// reads back as the same float64, so audits measure against exact data.
func dataNumber(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// plural picks the singular or plural phrase for a count.
func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// namesUnit reports whether a value name already says its unit, as
// "Weight (g)" or a column called "rainfall_mm" does, so the axis title
// does not say it twice.
func namesUnit(name, unit string) bool {
	n, u := strings.ToLower(name), strings.ToLower(unit)
	for _, form := range []string{"(" + u + ")", "_" + u, " " + u, "[" + u + "]"} {
		if strings.Contains(n, form+" ") || strings.HasSuffix(n, form) {
			return true
		}
	}
	return false
}

// closest suggests the nearest of the candidates, as "; did you mean ...?".
func closest(s string, cands []string) string {
	if best, ok := suggest.Closest(s, cands); ok {
		return fmt.Sprintf("; did you mean %q?", best)
	}
	return ""
}

// tooltip is the whole label when the lines drawn shorten it, and nothing
// when they show it all.
func tooltip(label string, lines []string) string {
	if strings.Join(lines, " ") != label {
		return label
	}
	return ""
}

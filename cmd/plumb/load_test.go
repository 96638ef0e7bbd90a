package main

import (
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestLoadFormats runs the CLI on a fixture of each table form people
// export and checks the exit code and what stderr says.
func TestLoadFormats(t *testing.T) {
	fx := func(name string) string { return filepath.Join("../../testdata/data", name) }
	tests := []struct {
		name   string
		args   []string
		code   int
		stderr []string
		not    []string
	}{
		{"semicolons and decimal commas", []string{"bars", fx("semicolon_decimal_comma.csv"), "--value", "Anteil"}, exitOK,
			[]string{"separated by semicolons", "decimal comma", `1 "–"`}, []string{"quote any cell"}},
		{"grouped decimal commas", []string{"bars", fx("semicolon_decimal_comma.csv")}, exitOK,
			[]string{"grouped in threes", "skipped 1 row"}, nil},
		{"the decimal mark stated", []string{"bars", fx("semicolon_decimal_comma.csv"), "--value", "Anteil", "--decimal", "."}, exitData,
			[]string{`line 2, column "Anteil"`, `"12,5"`}, nil},
		{"tabs in a .csv", []string{"bars", fx("tabs_in.csv")}, exitOK, []string{"separated by tabs"}, nil},
		{"pipes", []string{"bars", fx("pipe.csv")}, exitOK, []string{"separated by pipes"}, nil},
		{"--format overrides the sniffing", []string{"bars", fx("pipe.csv"), "--format", "csv"}, exitData,
			[]string{"1 column"}, nil},
		{"currency and percent", []string{"bars", fx("currency_percent.csv")}, exitOK,
			[]string{"amounts in $", "parentheses"}, nil},
		{"percent cells", []string{"bars", fx("currency_percent.csv"), "--value", "margin"}, exitOK,
			[]string{"percentages", `1 "N/A"`}, nil},
		{"day first, proven", []string{"lines", fx("dates_dmy.csv")}, exitOK,
			[]string{`DD/MM/YYYY, as "17/01/2023" on line 3 shows`}, nil},
		{"ambiguous day and month", []string{"lines", fx("dates_ambiguous.csv")}, exitData,
			[]string{"line 2", "--x-format DD/MM/YYYY", "--x-format MM/DD/YYYY"}, []string{"decimal"}},
		{"ambiguous dates, order stated", []string{"lines", fx("dates_ambiguous.csv"), "--x-format", "MM/DD/YYYY"}, exitOK, nil, nil},
		{"month names", []string{"lines", fx("dates_month_names.csv")}, exitOK, []string{"MMM YYYY"}, nil},
		{"quarters", []string{"lines", fx("dates_quarters.csv")}, exitOK, []string{"YYYY-Q"}, nil},
		{"bare CR line ends", []string{"lines", fx("bare_cr.csv")}, exitOK, []string{"Q YYYY"}, nil},
		{"mixed date forms", []string{"lines", fx("dates_mixed.csv")}, exitData,
			[]string{`line 3, column "day": cannot read "01/03/2024" as a date`}, []string{"decimal"}},
		{"a bad pattern", []string{"lines", fx("dates_dmy.csv"), "--x-format", "DD/MM"}, exitUsage, []string{"--x-format"}, nil},
		{"count rows with no value column", []string{"bars", fx("species.csv"), "--label", "species", "--agg", "count"}, exitOK,
			[]string{`counting the rows of each "species"`}, []string{"skipped"}},
		{"repeated labels named", []string{"bars", fx("repeated_labels.csv")}, exitOK,
			[]string{`combined 4 rows into 2 labels by adding them up (--agg sum): "Springfield" (2 rows), "Riverside" (2 rows)`}, nil},
		{"input over --max-input", []string{"bars", fx("../../go.sum"), "--format", "json", "--max-input", "10"}, exitData,
			[]string{"larger than the limit", "--max-input"}, nil},
		{"a bad size", []string{"bars", fx("pipe.csv"), "--max-input", "lots"}, exitUsage, []string{"--max-input"}, nil},
		{"a bad decimal mark", []string{"bars", fx("pipe.csv"), "--decimal", ";"}, exitUsage, []string{"--decimal"}, nil},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			code, _, stderr := plumb(t, "", append(tc.args, "--explain", "-o", filepath.Join(t.TempDir(), "o.svg"))...)
			assert.Equal(t, tc.code, code, stderr)
			for _, w := range tc.stderr {
				assert.Contains(t, stderr, w)
			}
			for _, w := range tc.not {
				assert.NotContains(t, stderr, w)
			}
		})
	}
}

// TestCountAxis checks that a count says what was counted.
func TestCountAxis(t *testing.T) {
	code, out, stderr := plumb(t, "", "bars", "../../testdata/data/species.csv", "--label", "species", "--agg", "count")
	assert.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "count of rows")
	assert.Contains(t, out, `data-value="3"`) // heron: three rows, one with no mass
}

// TestCombinedNoteLimits checks that the combined note names the first few
// repeated labels and counts the rest.
func TestCombinedNoteLimits(t *testing.T) {
	var rep []labelCount
	for i := range 8 {
		rep = append(rep, labelCount{string(rune('A' + i)), 2})
	}
	n := combinedNote(rep, "sum", 8)
	assert.True(t, n.Changed)
	assert.Contains(t, n.Text, `combined 16 rows into 8 labels`)
	assert.Contains(t, n.Text, `"E" (2 rows) and 3 more`)
	assert.False(t, strings.Contains(n.Text, `"F"`))
}

// TestLongLabels checks that a runaway label is shortened with a note, so
// that the figure stays small.
func TestLongLabels(t *testing.T) {
	long := strings.Repeat("x", 100_000)
	code, out, stderr := plumb(t, "k,v\n"+long+",1\nshort,2\n", "bars", "-", "--format", "csv")
	assert.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "shortened 1 label longer than 200 characters")
	assert.Less(t, len(out), 20_000)
	code, _, stderr = plumb(t, "x,s,v\n1,"+long+",1\n2,"+long+",2\n1,b,3\n2,b,4\n", "lines", "-", "--series", "s", "--y", "v", "--x", "x")
	assert.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "shortened 2 series names")
}

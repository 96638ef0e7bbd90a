package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestVersion(t *testing.T) {
	for _, arg := range []string{"--version", "-version", "version"} {
		code, out, stderr := plumb(t, "", arg)
		require.Equal(t, exitOK, code, stderr)
		// A test binary is built from the source tree: "(devel)" or a
		// module version, then the Go release.
		assert.Regexp(t, `^plumb (\(devel\)|v\S+)( \([0-9a-f]+(, modified)?\))? go\S+\n$`, out)
	}
}

func TestUnknownChartSuggests(t *testing.T) {
	for _, tc := range []struct{ arg, want string }{
		{"bar", `unknown chart "bar": did you mean "bars"?`},
		{"line", `did you mean "lines"?`},
		{"dot", `did you mean "dots"?`},
		{"palete", `did you mean "palette"?`},
		{"pie", "use plumb bars --percent, because lengths on a common scale"},
		{"donut", "use plumb bars --percent"},
		{"area", "use plumb lines"},
		{"radar", "use plumb dots or lines"},
		{"3d", "use plumb bars"},
		{"gauge", "use plumb bars"},
		{"bubble", "use plumb bars (or dots)"},
		{"zzzzzz", `unknown chart "zzzzzz"`},
	} {
		t.Run(tc.arg, func(t *testing.T) {
			code, _, stderr := plumb(t, "", tc.arg, "x.csv")
			assert.Equal(t, exitUsage, code)
			assert.Contains(t, stderr, tc.want)
		})
	}
	_, _, stderr := plumb(t, "", "zzzzzz")
	assert.NotContains(t, stderr, "did you mean")
}

func TestUnknownFlagPrintedOnce(t *testing.T) {
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "--lable", "region")
	assert.Equal(t, exitUsage, code)
	assert.Equal(t, "plumb: unknown flag --lable: did you mean --label?\n", stderr)
	code, _, stderr = plumb(t, eightRegions, "bars", "-", "--qqqqqq")
	assert.Equal(t, exitUsage, code)
	assert.Equal(t, 1, strings.Count(stderr, "qqqqqq"), stderr)
	// Bad values are reported once, in plumb's words, naming the fix.
	for _, tc := range []struct {
		args []string
		want string
	}{
		{[]string{"bars", "-", "--label"}, "plumb: --label needs a value (see plumb bars -h)\n"},
		{[]string{"bars", "-", "--top", "abc"}, "plumb: --top \"abc\": give a whole number\n"},
		{[]string{"bars", "-", "--from", "x"}, "plumb: --from \"x\": give a number\n"},
		{[]string{"lines", "-", "--together=maybe"}, "plumb: --together=\"maybe\": give true or false (or --together alone for true)\n"},
	} {
		code, _, stderr = plumb(t, eightRegions, tc.args...)
		assert.Equal(t, exitUsage, code)
		assert.Equal(t, tc.want, stderr)
	}
}

func TestControlCharactersEscaped(t *testing.T) {
	dir := t.TempDir()
	esc := "\x1b[2J\x1b]0;owned\x07"
	for _, args := range [][]string{
		{"bars", filepath.Join(dir, "no"+esc+".csv")},
		{"bars", "-", "--" + esc},
		{"bars", "-", "--font", filepath.Join(dir, esc+".ttf")},
		{"bars", "-", "-o", filepath.Join(dir, "no"+esc, "f.svg")},
		{"bars", "-", "--value", "rev\x9benue"},
		{"bars", "-", "--size", esc},
		{esc},
		{"palette", esc},
	} {
		_, _, stderr := plumb(t, eightRegions, args...)
		require.NotEmpty(t, stderr, args)
		for _, r := range stderr {
			if r == '\n' {
				continue
			}
			assert.False(t, r < 0x20 || r == 0x7f || (r >= 0x80 && r <= 0x9f), "raw control %U in %q", r, stderr)
		}
		assert.Regexp(t, `\\x(1b|9b)`, stderr, args)
	}
	// A cell that holds controls is named escaped.
	_, _, stderr := plumb(t, "k,v\nnorth,5\nsouth,1\x1b[31m\n", "bars", "-")
	assert.NotContains(t, stderr, "\x1b")
	assert.Contains(t, stderr, `\x1b`)
}

func TestTerminalSafe(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{"plain text, “quotes” and café", "plain text, “quotes” and café"},
		{"a\x1b[31mb", `a\x1b[31mb`},
		{"line\nforged", `line\nforged`},
		{"tab\there", `tab\there`},
		{"del\x7f", `del\x7f`},
		{"c1 \u009b csi", `c1 \u009b csi`},
		{"bidi \u202eevil", `bidi \u202eevil`},
		{"bad \xff byte", `bad \xff byte`},
	} {
		assert.Equal(t, tc.want, terminalSafe(tc.in), "%q", tc.in)
	}
}

func TestSizeMustBeFinitePositive(t *testing.T) {
	for _, size := range []string{"NaNx0", "nanxnan", "Infx500", "800xInf", "-800x500", "800x-1", "0x0", "0x500", "0x1p3x5", "1e3x500", "800", "x500", "800x500x2", "20001x500"} {
		code, _, stderr := plumb(t, eightRegions, "bars", "-", "--size", size)
		assert.Equal(t, exitUsage, code, "--size %s: %s", size, stderr)
	}
	for _, size := range []string{"800x500", "800x0", "640.5X400"} {
		code, _, stderr := plumb(t, eightRegions, "bars", "-", "--size", size)
		assert.Equal(t, exitOK, code, "--size %s: %s", size, stderr)
	}
}

func TestNotesNameTheirFigureAndFilter(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "orders.csv", "product,amount\nTea,12\nCoffee,30\nTea,8\n")
	out := filepath.Join(dir, "orders.svg")

	// Default: only what changed the data (combined labels), named by -o.
	code, _, stderr := plumb(t, "", "bars", data, "-o", out)
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, "plumb: "+out+": note: combined 2 rows into 1 label by adding them up (--agg sum): \"Tea\" (2 rows); 2 categories remain\n", stderr)

	// --explain adds the routine ones (the columns guessed).
	_, _, stderr = plumb(t, "", "bars", data, "-o", out, "--explain")
	assert.Contains(t, stderr, "plumb: "+out+`: note: using column "product" for labels`)
	assert.Contains(t, stderr, "combined 2 rows into 1 label")

	// The SVG's metadata has the decisions whatever stderr shows.
	svg, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.Contains(t, string(svg), `<plumb:note code="columns">`)

	// To standard output, notes name the data file, or <stdin>.
	_, _, stderr = plumb(t, "", "bars", data)
	assert.True(t, strings.HasPrefix(stderr, "plumb: "+data+": note: "), stderr)
	_, _, stderr = plumb(t, "product,amount\nTea,1\nTea,2\n", "bars", "-")
	assert.True(t, strings.HasPrefix(stderr, "plumb: <stdin>: note: "), stderr)

	// --quiet silences all, and wins over --explain.
	_, _, stderr = plumb(t, "", "bars", data, "-o", out, "--quiet", "--explain")
	assert.Empty(t, stderr)
}

func TestHelpListsValuesAndRepeatableFlags(t *testing.T) {
	code, _, stderr := plumb(t, "", "lines", "-h")
	assert.Equal(t, exitOK, code)
	assert.Contains(t, stderr, "may repeat: --y a --y b")
	assert.Contains(t, stderr, "-explain")
	code, _, stderr = plumb(t, "", "bars", "-h")
	assert.Equal(t, exitOK, code)
	assert.Contains(t, stderr, "may repeat: --highlight a --highlight b")
	assert.Contains(t, stderr, "print, screen or slide")
	_, _, stderr = plumb(t, "", "palette", "sequential", "-h")
	assert.Contains(t, stderr, "3-11")
	assert.Contains(t, stderr, "blue")
}

func TestListFlagsRepeat(t *testing.T) {
	csv := "month,a,b,c\n1,1,2,3\n2,2,3,4\n3,3,4,5\n"
	_, commas, stderr := plumb(t, csv, "lines", "-", "--y", "a,b")
	require.NotEmpty(t, commas, stderr)
	_, repeated, _ := plumb(t, csv, "lines", "-", "--y", "a", "--y", "b")
	assert.Equal(t, commas, repeated)
}

func TestPaletteQuietAndGrammar(t *testing.T) {
	code, out, stderr := plumb(t, "", "palette", "categorical", "--n", "1", "--quiet")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "Categorical palette, 1 colour<")
	assert.NotContains(t, out, "1 colours")

	code, out, _ = plumb(t, "", "palette", "check", "--quiet", "#1f77b4", "#d62728", "#2ca02c")
	assert.Equal(t, exitData, code, "the exit status still answers")
	assert.Empty(t, out)
	code, out, _ = plumb(t, "", "palette", "check", "#1f77b4", "#d62728", "#2ca02c")
	assert.Equal(t, exitData, code)
	assert.Contains(t, out, "safe: no")

	code, _, stderr = plumb(t, "", "palette", "sequental")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, `did you mean "sequential"?`)

	code, _, stderr = plumb(t, "", "palette", "categorical", "-o", "sheet.pdf")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, `plumb cannot write ".pdf" files`)
}

func TestFontReadIsBounded(t *testing.T) {
	// A sparse file just over the limit stands in for /dev/zero, which
	// would otherwise be read until memory ran out.
	big := filepath.Join(t.TempDir(), "huge.ttf")
	f, err := os.Create(big)
	require.NoError(t, err)
	require.NoError(t, f.Truncate(maxFontBytes+1))
	require.NoError(t, f.Close())
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "--font", big)
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "huge.ttf: more than 64 MB")
}

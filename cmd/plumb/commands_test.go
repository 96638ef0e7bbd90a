package main

import (
	"os"
	"reflect"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/render"
)

// optionsOf is the options struct a chart run hands its builder.
func optionsOf(t *testing.T, ch chart) any {
	switch r := ch.(type) {
	case *rowsRun:
		if r.dots {
			return r.dot
		}
		return r.bars
	case *linesRun:
		return r.opt
	case *diffRun:
		return r.opt
	case *spanRun:
		return r.opt
	case *boxRun:
		return r.opt
	case *histRun:
		return r.opt
	case *heatRun:
		return r.opt
	case *scatterRun:
		return r.opt
	case *matrixRun:
		return r.opt
	case *mapRun:
		return r.opt
	}
	t.Fatalf("no options for %T", ch)
	return nil
}

// Every option a flag claims to set is a field of the chart's options, so
// that the names in render's messages map to real flags.
func TestCommandTableFlagsSetRealOptions(t *testing.T) {
	for _, cmd := range commandTable() {
		if cmd.chart == nil {
			continue
		}
		ch := cmd.chart()
		typ := reflect.TypeOf(optionsOf(t, ch))
		seen := map[string]bool{}
		for _, d := range ch.flags() {
			assert.False(t, seen[d.name], "%s: --%s twice", cmd.name, d.name)
			seen[d.name] = true
			assert.NotNil(t, d.value, "%s --%s", cmd.name, d.name)
			assert.NotEmpty(t, d.usage, "%s --%s", cmd.name, d.name)
			for _, o := range d.sets {
				_, ok := typ.FieldByName(o)
				assert.True(t, ok, "%s --%s sets %s, which %s lacks", cmd.name, d.name, o, typ)
			}
		}
	}
}

// Flags write straight into the options the builder receives.
func TestFlagsBindToOptions(t *testing.T) {
	r := newRows(false)
	fs := newTableFlagSet("bars", dataSynopsis, r.flags(), nil)
	_, err := parse(fs, []string{"--top", "5", "--other", "mean", "--highlight", "a,b", "--highlight", "c", "--from", "-2",
		"--vertical", "--order", "label", "--title", "T", "--for", "print", "--size", "800x0", "--unit", "kg", "data.csv"})
	require.NoError(t, err)
	from := -2.0
	assert.Equal(t, render.BarsOptions{
		Common:     render.Common{Title: "T", Medium: render.Print, Width: 800},
		RowOptions: render.RowOptions{Order: render.ByLabel, Top: 5, Other: render.OtherMean, Highlight: []string{"a", "b", "c"}, From: &from, Unit: "kg"},
		Vertical:   true,
	}, r.bars)

	l := newLines()
	fs = newTableFlagSet("lines", dataSynopsis, l.flags(), nil)
	_, err = parse(fs, []string{"--index=2020", "--together", "--aspect", "3:1", "--y-name", "riders", "data.csv"})
	require.NoError(t, err)
	assert.True(t, l.opt.Index)
	assert.Equal(t, "2020", l.indexAt)
	assert.True(t, l.opt.Together)
	assert.Equal(t, "3:1", l.opt.Aspect)
	assert.Equal(t, "riders", l.opt.YName)
}

// The CLI names options by their flags: in errors, which exit 2 unless
// the chart refused, and in notes, on stderr and in the figure.
func TestOptionErrorsNameFlags(t *testing.T) {
	for _, tc := range []struct {
		args []string
		want string
		code int
	}{
		{[]string{"bars", "-", "--top", "1"}, "plumb: bars: --top 1: show at least 2 categories", exitUsage},
		{[]string{"bars", "-", "--to", "50"}, "plumb: bars: --to 50: would cut bars that reach 340; give --to at or beyond the largest value, or leave it out", exitData},
		{[]string{"lines", "-", "--aspect", "wide"}, `plumb: lines: --aspect "wide": use orientation, or width:height such as 16:9`, exitUsage},
		{[]string{"dots", "-", "--other", "sum"}, "never summed; use --other mean or none", exitUsage},
	} {
		code, _, stderr := plumb(t, "x,revenue\n1,120\n2,340\n3,95\n", append(tc.args, "--format", "csv")...)
		assert.Contains(t, stderr, tc.want, tc.args)
		assert.Equal(t, tc.code, code, tc.args)
		assert.NotContains(t, stderr, "Top", "a flag name, not the option's")
	}

	var b strings.Builder
	b.WriteString("x,a,b,c,d,e\n")
	for i := range 6 {
		b.WriteString(strings.Repeat(string(rune('1'+i))+",", 5) + "9\n")
	}
	code, out, stderr := plumb(t, b.String(), "lines", "-", "--format", "csv", "--explain")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "(--together keeps one panel)")
	assert.Contains(t, out, "(--together keeps one panel)", "the figure's metadata names the flag too")
}

// -h and the usage text come from the command table.
func TestHelpComesFromTheTable(t *testing.T) {
	code, out, _ := plumb(t, "", "help")
	require.Equal(t, exitOK, code)
	for _, cmd := range commandTable() {
		assert.Contains(t, out, "  "+cmd.name+" ")
		if cmd.chart == nil {
			continue
		}
		code, _, stderr := plumb(t, "", cmd.name, "-h")
		require.Equal(t, exitOK, code)
		for _, d := range cmd.chart().flags() {
			assert.Contains(t, stderr, "-"+d.name, cmd.name)
			if len(d.values) > 0 {
				assert.Contains(t, stderr, "-"+d.name+" "+strings.Join(d.values, "|"))
			}
		}
	}
}

// The README's table of charts lists exactly the flags each chart's entry
// in the command table has, besides the shared ones.
func TestReadmeListsEachChartsFlags(t *testing.T) {
	b, err := os.ReadFile("../../README.md")
	require.NoError(t, err)
	rows := map[string]string{}
	for _, line := range strings.Split(string(b), "\n") {
		if name, ok := strings.CutPrefix(line, "| `"); ok {
			name, rest, _ := strings.Cut(name, "`")
			rows[name] = rest
		}
	}
	flagName := regexp.MustCompile(`--([a-z][a-z-]*)`)
	shared := map[string]bool{}
	sh := newShared(&render.Common{})
	for _, d := range sh.flags() {
		shared[d.name] = true
	}
	for _, cmd := range commandTable() {
		if cmd.chart == nil {
			continue
		}
		row, ok := rows[cmd.name]
		require.True(t, ok, "README lists %s", cmd.name)
		var inReadme, inTable []string
		for _, m := range flagName.FindAllStringSubmatch(row, -1) {
			inReadme = append(inReadme, m[1])
		}
		for _, d := range cmd.chart().flags() {
			if !shared[d.name] {
				inTable = append(inTable, d.name)
			}
		}
		assert.ElementsMatch(t, inTable, inReadme, cmd.name)
	}
}

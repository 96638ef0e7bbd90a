package main

import (
	"errors"
	"fmt"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"plumb/render"
)

// The annotation flags add one annotation per use to the chart's Common,
// reading numbers, statistics and dates as the data's x column would.
func TestAnnotationFlagsBind(t *testing.T) {
	r := newRows(false)
	fs := newTableFlagSet("bars", dataSynopsis, r.flags(), nil)
	_, err := parse(fs, []string{"data.csv",
		"--ref", "100=Target = plan", "--ref", "mean", "--ref", "-2.5",
		"--event", "2024-07=New engine", "--event", "2020=Strike", "--event", "Mar 2021=Refit", "--event", "3.5",
		"--period", "2021-03..2021-06-15=Harbour works", "--period", "1..4=First weeks", "--period", "2019..2020=Years",
		"--callout", "Great Osk=new pier"})
	require.NoError(t, err)
	day := func(y int, m time.Month, d int) time.Time { return time.Date(y, m, d, 0, 0, 0, 0, time.UTC) }
	assert.Equal(t, render.Annotations{
		Refs: []render.Ref{{Value: 100, Text: "Target = plan"}, {Stat: "mean"}, {Value: -2.5}},
		Events: []render.Event{
			{At: day(2024, 7, 1), Text: "New engine"},
			{X: 2020, At: day(2020, 1, 1), Text: "Strike"}, // a bare year fits either axis
			{At: day(2021, 3, 1), Text: "Refit"},
			{X: 3.5},
		},
		Periods: []render.Period{
			{FromAt: day(2021, 3, 1), ToAt: day(2021, 6, 15), Text: "Harbour works"},
			{From: 1, To: 4, Text: "First weeks"},
			{From: 2019, To: 2020, FromAt: day(2019, 1, 1), ToAt: day(2020, 1, 1), Text: "Years"},
		},
		Callouts: []render.Callout{{Label: "Great Osk", Text: "new pier"}},
	}, r.bars.Annotations)
}

// A bad annotation is a usage error naming the flag and the value, with
// what would work.
func TestAnnotationFlagErrors(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "d.csv", "route,passengers\nGreat Osk,10\nLittle Osk,20\n")
	cases := []struct {
		args []string
		want string
	}{
		{[]string{"--ref", "abc"}, "--ref \"abc\": give the line's value as a number, mean or median"},
		{[]string{"--ref", "NaN=x"}, "--ref \"NaN=x\": give the line's value as a number"},
		{[]string{"--ref", "Inf"}, "--ref \"Inf\": give the line's value"},
		{[]string{"--event", "soon=Refit"}, "--event \"soon=Refit\": give x as a number or a date"},
		{[]string{"--event", "03/04/2024=Refit"}, "give x as a number or a date such as 2024-03-17"}, // day or month first? not a date
		{[]string{"--period", "5..3=Works"}, "--period \"5..3=Works\": the span's start is not before its end"},
		{[]string{"--period", "2021-06..2021-03"}, "the span's start is not before its end"},
		{[]string{"--period", "2021-06=Works"}, "give the span as FROM..TO=TEXT"},
		{[]string{"--period", "2021-03..7=Works"}, "give both ends as numbers, or both as dates"},
		{[]string{"--callout", "Great Osk"}, "--callout \"Great Osk\": give the category's label and the note as LABEL=TEXT"},
		{[]string{"--callout", "=note"}, "LABEL=TEXT"},
	}
	for _, tc := range cases {
		t.Run(fmt.Sprint(tc.args), func(t *testing.T) {
			code, _, stderr := plumb(t, "", append([]string{"bars", data}, tc.args...)...)
			assert.Equal(t, exitUsage, code)
			assert.Contains(t, stderr, tc.want)
		})
	}
}

// render's option errors about annotations are reworded with the flag
// that sets the option, so that the message names what the user typed.
func TestAnnotationOptionErrorsNameFlags(t *testing.T) {
	names := optionNames(newRows(false).flags())
	for option, flag := range map[string]string{"Refs": "--ref", "Events": "--event", "Periods": "--period", "Callouts": "--callout"} {
		err := flagWords(fmt.Errorf("bars: %w", &render.OptionError{Option: option, Value: `"Great Osc"`, Err: errors.New("no category has this label")}), names)
		assert.EqualError(t, err, "bars: "+flag+` "Great Osc": no category has this label`)
		var ue *usageError
		assert.ErrorAs(t, err, &ue)
	}
}

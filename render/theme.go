package render

import "plumb/palette"

// theme holds the colours a chart uses. Charts take every colour from here,
// and every colour but the inside-label white comes from package palette,
// where it is derived by a documented rule (palette/THEME.md), reproduced by
// `go generate ./palette` and pinned by tests.
type theme struct {
	neutral  Colour // the one colour of ordinary marks
	accent   Colour // highlighted marks
	context  Colour // faint context: guide lines, others' series
	grid     Colour // grid lines along the value axis
	baseline Colour // the zero line, stronger than the grid
	text     Colour // titles, labels, values: at least 4.5:1 on white
	muted    Colour // subtitles, ticks, notes: still at least 4.5:1 on white
	inside   Colour // value labels drawn inside a bar
}

func defaultTheme() theme {
	return theme{
		neutral: RGB(palette.Neutral()),
		accent:  RGB(palette.Accent()),
		context: RGB(palette.Context()),
		// Grid lines carry no data: a tint of the neutral's family below
		// 1.5:1 on white, so they recede behind the marks.
		grid: RGB(palette.Grid()),
		// The zero line is the reference every bar is read from: drawn in
		// the text colour, as strong as the labels that name it.
		baseline: RGB(palette.Text()),
		text:     RGB(palette.Text()),
		muted:    RGB(palette.Muted()),
		inside:   RGB(palette.SRGB{R: 1, G: 1, B: 1}),
	}
}

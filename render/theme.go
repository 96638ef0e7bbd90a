package render

import "plumb/palette"

// theme holds the colours a chart uses. Charts take every colour from here,
// and every colour but the inside-label white comes from package palette,
// where it is derived by a documented rule (palette/THEME.md), reproduced by
// `go generate ./palette` and pinned by tests.
type theme struct {
	neutral  string // the one colour of ordinary marks
	accent   string // highlighted marks
	context  string // faint context: guide lines, others' series
	grid     string // grid lines along the value axis
	baseline string // the zero line, stronger than the grid
	text     string // titles, labels, values: at least 4.5:1 on white
	muted    string // subtitles, ticks, notes: still at least 4.5:1 on white
	inside   string // value labels drawn inside a bar
}

func defaultTheme() theme {
	return theme{
		neutral: palette.Neutral().Hex(),
		accent:  palette.Accent().Hex(),
		context: palette.Context().Hex(),
		// Grid lines carry no data: a tint of the neutral's family below
		// 1.5:1 on white, so they recede behind the marks.
		grid: palette.Grid().Hex(),
		// The zero line is the reference every bar is read from: drawn in
		// the text colour, as strong as the labels that name it.
		baseline: palette.Text().Hex(),
		text:     palette.Text().Hex(),
		muted:    palette.Muted().Hex(),
		inside:   "#ffffff",
	}
}

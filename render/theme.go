package render

import "plumb/palette"

// theme holds the colours a chart uses. Charts take every colour from here,
// and the data colours come from package palette, where they are chosen by
// measurement and pinned by tests.
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
		// Grid lines carry no data: faint enough to recede behind the
		// marks (1.2:1 on white), the zero line dark enough to read as
		// the reference it is (11:1). Common practice.
		grid:     "#e4e6e8",
		baseline: "#3a3a3a",
		text:     palette.Text().Hex(),
		muted:    palette.Muted().Hex(),
		inside:   "#ffffff",
	}
}

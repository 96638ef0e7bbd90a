package render

// RowOptions are the options bar charts and dot plots share: everything a
// chart with one row per category needs, so that a caller falling back from
// bars to dots (when the values sit far from zero, which bars refuse) passes
// them on whole: DotsOptions{RowOptions: bars.RowOptions}.
type RowOptions struct {
	Common
	Order     Order     // ByValue (default), ByLabel or ByData
	Top       int       // most rows to draw; 0 chooses (see Other), negative draws all
	Other     OtherMode // what becomes of the categories beyond Top; OtherAuto by default
	Highlight []string  // labels drawn in the accent colour
	From, To  *float64  // widen the value domain; bars always include zero, and neither may hide a value
	Unit      string    // "%", "kg": said once, in the axis title and on the first value label; a currency sign leads every value ("$5")
	ValueName string    // what the values measure, for the axis and the description
	LabelName string    // what the categories are, for the description
	Averages  bool      // values are means, medians or extremes: never added up, and an automatic Other averages them
}

package main

import (
	"flag"
	"fmt"
	"io"

	"plumb/render"
)

// rowFlags are the flags bars and dots share.
type rowFlags struct {
	shared
	label, value, order, agg, unit, valueName, other string
	top                                              int
	vertical, percent                                bool
	highlight                                        listFlag
	from, to                                         floatFlag
}

func (r *rowFlags) register(fs *flag.FlagSet, dots bool) {
	r.shared.register(fs)
	fs.StringVar(&r.label, "label", "", "column with the category labels (default: the first column)")
	fs.StringVar(&r.value, "value", "", "column with the values (default: the first numeric column after the labels)")
	fs.StringVar(&r.order, "order", "value", "order of categories: value (largest first), label, or data (as in the file)")
	if dots {
		fs.IntVar(&r.top, "top", 0, fmt.Sprintf("show at most `N` categories, the largest; the rest are left out with a note (default %d; -1 shows all)", render.DefaultDotsTop))
		fs.StringVar(&r.other, "other", "", "what becomes of categories beyond --top: none (left out, the default) or mean (one Other dot)")
	} else {
		fs.IntVar(&r.top, "top", 0, fmt.Sprintf("show at most `N` categories (default: all, or %d with the rest summed into Other when the values are parts of a whole; -1 shows all)", render.DefaultTop))
		fs.StringVar(&r.other, "other", "", "combine categories beyond --top into Other by sum or mean, or none (leave them out with a note); default: sum for parts of a whole, else none")
	}
	fs.Var(&r.highlight, "highlight", "draw these `LABELS` (comma-separated) in the accent colour")
	fs.Var(&r.from, "from", "start of the value axis (may widen it, never hide data)")
	fs.Var(&r.to, "to", "end of the value axis (may widen it, never hide data)")
	fs.StringVar(&r.unit, "unit", "", "unit appended to values, such as % or kg")
	fs.StringVar(&r.valueName, "value-name", "", "what the values measure, for the axis (default: the value column's name)")
	if dots {
		fs.StringVar(&r.agg, "agg", "mean", "combine repeated labels: sum, mean, median, count, min or max")
		return
	}
	fs.StringVar(&r.agg, "agg", "sum", "combine repeated labels: sum, mean, median, count, min or max")
	fs.BoolVar(&r.vertical, "vertical", false, "stand the bars up (horizontal bars read better with long labels)")
	fs.BoolVar(&r.percent, "percent", false, "show each value as a percentage of the total")
}

// runRows is plumb bars and plumb dots.
func runRows(chart string, args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	dots := chart == "dots"
	fs := newFlagSet(chart, dataSynopsis, stderr)
	var f rowFlags
	f.register(fs, dots)
	path, c, err := parseChart(fs, &f.shared, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	switch f.order {
	case "value", "label", "data":
	default:
		return exitCode(usagef("--order %q: use value, label or data", f.order), stderr)
	}
	switch f.other {
	case "", "sum", "mean", "none":
	default:
		return exitCode(usagef("--other %q: use sum, mean or none", f.other), stderr)
	}
	if dots && f.other == "sum" {
		return exitCode(usagef("--other sum: a dot marks a position, not an amount, so dots are never summed; use --other mean or none, or draw bars"), stderr)
	}
	aggGiven := false
	fs.Visit(func(fl *flag.Flag) { aggGiven = aggGiven || fl.Name == "agg" })
	d, err := loadLabelled(path, f.readOptions(), f.label, f.value, f.agg, stdin)
	if err != nil {
		return exitCode(err, stderr)
	}
	if f.unit == "" {
		f.unit = d.unit // the sign the cells carry, such as % or $
	}
	notes := d.notes
	name := f.valueName
	if name == "" {
		name = d.valueCol
	}
	averages := f.agg != "sum" && f.agg != "count"
	c.Notes = notes
	// Values are parts of a whole when they are shares, when the user said
	// they sum or count, or when repeated labels really were summed; a
	// single value per label may be a median or a rate, which never adds.
	additive := f.percent || (aggGiven && !averages) || (f.agg == "sum" && len(d.repeated) > 0)
	return emit(chart, &f.shared, stdout, stderr, notes, func(w io.Writer) ([]render.Note, error) {
		row := render.RowOptions{
			Common: c, Order: render.Order(f.order), Top: f.top, Other: render.OtherMode(f.other), Highlight: f.highlight,
			From: f.from.v, To: f.to.v, Unit: f.unit, ValueName: name, LabelName: d.labelCol, Averages: averages,
		}
		if dots {
			return render.Dots(w, d.labels, d.values, render.DotsOptions{RowOptions: row})
		}
		return render.Bars(w, d.labels, d.values, render.BarsOptions{RowOptions: row, Additive: additive, Vertical: f.vertical, Percent: f.percent})
	})
}

package main

import (
	"flag"
	"io"

	"plumb/render"
)

// rowFlags are the flags bars and dots share.
type rowFlags struct {
	shared
	label, value, order, agg, unit, valueName string
	top                                       int
	vertical, percent                         bool
	highlight                                 listFlag
	from, to                                  floatFlag
}

func (r *rowFlags) register(fs *flag.FlagSet, dots bool) {
	r.shared.register(fs)
	fs.StringVar(&r.label, "label", "", "column with the category labels (default: the first column)")
	fs.StringVar(&r.value, "value", "", "column with the values (default: the first numeric column after the labels)")
	fs.StringVar(&r.order, "order", "value", "order of categories: value (largest first), label, or data (as in the file)")
	top := render.DefaultTop
	if dots {
		top = render.DefaultDotsTop
	}
	fs.IntVar(&r.top, "top", top, "show at most `N` categories: the top N-1 and one combined Other")
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
	return emit(chart, &f.shared, stdout, stderr, notes, func(w io.Writer) ([]render.Note, error) {
		if dots {
			return render.Dots(w, d.labels, d.values, render.DotsOptions{
				Common: c, Order: render.Order(f.order), Top: f.top, Highlight: f.highlight,
				From: f.from.v, To: f.to.v, Unit: f.unit, ValueName: name, LabelName: d.labelCol, Averages: averages,
			})
		}
		return render.Bars(w, d.labels, d.values, render.BarsOptions{
			Common: c, Order: render.Order(f.order), Top: f.top, Vertical: f.vertical, Percent: f.percent,
			Highlight: f.highlight, From: f.from.v, To: f.to.v, Unit: f.unit, ValueName: name,
			LabelName: d.labelCol, Averages: averages,
		})
	})
}

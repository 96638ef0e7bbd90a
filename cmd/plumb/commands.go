package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/render"
)

// A command is one entry of plumb's command table. The table is the single
// place that knows the commands: the dispatcher, the usage text, each
// chart's -h and the names that messages give the options all come from it.
// Adding a chart is one builder in render and one entry here.
type command struct {
	name     string
	summary  string // its line in plumb's usage text
	synopsis string // what follows "plumb NAME" in its -h

	// chart makes one run of a chart command: its options, with every flag
	// bound to the field it sets. Nil for commands that are not charts.
	chart func() chart

	// run is a command that is not a chart; it parses its own arguments.
	run func(args []string, stdin io.Reader, stdout, stderr io.Writer) int
}

// commandTable is plumb's command table, in the order the usage text lists it.
func commandTable() []command {
	return []command{
		{name: "bars", summary: "compare amounts (horizontal, sorted, from zero)", synopsis: dataSynopsis, chart: func() chart { return newRows(false) }},
		{name: "dots", summary: "compare values far from zero", synopsis: dataSynopsis, chart: func() chart { return newRows(true) }},
		{name: "lines", summary: "change over time or order, banked to 45°", synopsis: dataSynopsis, chart: func() chart { return newLines() }},
		{name: "diff", summary: "the difference of two series, a − b against zero", synopsis: dataSynopsis, chart: func() chart { return newDiff() }},
		{name: "span", summary: "ranges per category, low to high with the middle marked", synopsis: dataSynopsis, chart: func() chart { return newSpan() }},
		{name: "box", summary: "distributions per group as Tukey box plots", synopsis: dataSynopsis, chart: func() chart { return newBox() }},
		{name: "hist", summary: "the distribution of one column, in bins on nice edges", synopsis: dataSynopsis, chart: func() chart { return newHist() }},
		{name: "scatter", summary: "how two variables relate: points, binned when many", synopsis: dataSynopsis, chart: func() chart { return newScatter() }},
		{name: "matrix", summary: "how several variables relate, pair by pair", synopsis: dataSynopsis, chart: func() chart { return newMatrix() }},
		{name: "heat", summary: "a matrix of values as colours, rows and columns ordered (clustered)", synopsis: dataSynopsis, chart: func() chart { return newHeat() }},
		{name: "map", summary: "values by place, on an equal-area projection", synopsis: dataSynopsis, chart: func() chart { return newMap() }},
		{name: "figure", summary: "several charts in one grid, from figure files (.json)", synopsis: figureSynopsis, run: runFigure},
		{name: "audit", summary: "review figure files for misleading or unreadable choices", synopsis: auditSynopsis, run: runAudit},
		{name: "palette", summary: "show, make or check colour palettes", synopsis: "categorical|sequential|diverging|check [flags]", run: runPalette},
		{name: "demo", summary: "render the built-in gallery (-o DIR)", synopsis: demoSynopsis, run: func(args []string, _ io.Reader, stdout, stderr io.Writer) int {
			return runDemo(args, stdout, stderr)
		}},
	}
}

// lookup finds a command by name.
func lookup(name string) (command, bool) {
	for _, c := range commandTable() {
		if c.name == name {
			return c, true
		}
	}
	return command{}, false
}

// chart is one run of a chart command: options bound to flags, then loaded
// data and a drawing.
type chart interface {
	// flags are the chart's own flags and the shared ones, each bound to
	// the option field (or the CLI's own setting) it sets.
	flags() []flagDef
	// base is the run's shared settings and the chart's render.Common.
	base() *shared
	// load reads the data file and finishes the options from it (columns
	// chosen, unit found in the cells); given reports whether a flag was on
	// the command line. It returns the notes of loading and the drawing.
	load(path string, stdin io.Reader, given func(flag string) bool) ([]render.Note, func(io.Writer) ([]render.Note, error), error)
}

// A panelChart is a chart that can also be drawn as panels of a figure:
// the small multiples of --by and the panels of figure files. It stands
// apart from chart so that a chart without it still builds; --by and
// figure files refuse such a chart by name.
type panelChart interface {
	chart
	// readTable reads the data file once for every panel, keeping the
	// columns in keep (the --by column) besides the chart's own.
	readTable(path string, stdin io.Reader, keep []string) (*Table, []render.Note, error)
	// panel finishes a copy of the options from the data and plans one
	// panel of the given rows of t (nil: every row); c gives the panel its
	// heading and annotations. given is as for load. The run's own options
	// are left as they were, so that every panel starts from the flags.
	panel(t *Table, rows []int, c render.Common, given func(flag string) bool) (panelPart, error)
	// shares says which axes of small multiples carry the values, which
	// --by shares across panels: x, y or both.
	shares() (x, y bool)
}

// panelPart is one planned panel with what --by needs to know of it.
type panelPart struct {
	panel render.Panel
	notes []render.Note
	// size is the panel's total (for amounts that add up) or mean, which
	// --by-order value sorts by, largest first; total says which.
	size  float64
	total bool
}

// A flagDef is one flag of a command: its name, what it sets, and what -h
// says about it.
type flagDef struct {
	name   string     // without dashes
	sets   []string   // the render option fields it sets; none for the CLI's own flags (columns, output, reading)
	arg    string     // the value's placeholder in -h, such as N or COLUMN; "" for a switch
	values []string   // the values it accepts, when it takes one of a list
	def    string     // the default -h shows, "" for none
	repeat bool       // may be given more than once, each adding to a list
	usage  string     // what it does
	value  flag.Value // bound to the field it sets
}

// optionNames maps every option a command's flags set to the flag that sets
// it ("Top" to "--top"), for render's messages and for OptionErrors.
func optionNames(defs []flagDef) render.OptionNames {
	names := render.OptionNames{}
	for _, d := range defs {
		for _, o := range d.sets {
			if _, ok := names[o]; !ok {
				names[o] = "--" + d.name
			}
		}
	}
	return names
}

// runChart is every chart command: parse the flags into the options, load
// the data, draw, write and report.
func runChart(cmd command, args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	ch := cmd.chart()
	defs := ch.flags()
	sh := ch.base()
	names := optionNames(defs)
	fs := newTableFlagSet(cmd.name, cmd.synopsis, defs, stderr)
	pos, err := parse(fs, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	if len(pos) != 1 {
		return exitCode(usagef("give one data file (.csv, .tsv, .json), or - for standard input"), stderr)
	}
	if err := checkFigurePath(sh.out); err != nil {
		return exitCode(err, stderr)
	}
	sh.data = pos[0]
	if err := sh.finish(); err != nil {
		return exitCode(err, stderr)
	}
	sh.c.Names = names
	given := map[string]bool{}
	fs.Visit(func(f *flag.Flag) { given[f.Name] = true })
	if sh.by != "" || given["by-order"] || given["own-scales"] {
		return runBy(cmd, ch, pos[0], stdin, stdout, stderr, func(name string) bool { return given[name] })
	}
	notes, draw, err := ch.load(pos[0], stdin, func(name string) bool { return given[name] })
	if err != nil {
		return exitCode(flagWords(err, names), stderr)
	}
	sh.c.Notes = notes
	return emit(cmd.name, sh, stdout, stderr, notes, func(w io.Writer) ([]render.Note, error) {
		drawn, err := draw(w)
		return drawn, flagWords(err, names)
	})
}

// flagWords rewrites a render.OptionError in the command line's words: the
// option's flag for its name ("--top 1: ..." for "Top 1: ..."). An option
// value the chart cannot use is a usage error (exit 2), unless the chart
// refused it as misleading (exit 1, like every refusal).
func flagWords(err error, names render.OptionNames) error {
	var oe *render.OptionError
	if !errors.As(err, &oe) {
		return err
	}
	name, ok := names[oe.Option]
	if !ok {
		return err
	}
	msg := strings.Replace(err.Error(), oe.Error(), (&render.OptionError{Option: name, Value: oe.Value, Err: oe.Err}).Error(), 1)
	if errors.Is(err, render.ErrRefused) {
		return &reworded{msg: msg, err: err}
	}
	return &usageError{msg}
}

// reworded is an error whose message the CLI rewrote, still unwrapping to
// the original.
type reworded struct {
	msg string
	err error
}

func (e *reworded) Error() string { return e.msg }
func (e *reworded) Unwrap() error { return e.err }

// printHelp writes a command's -h: its synopsis and its flags, each with
// the values it accepts, its default and whether it repeats.
func printHelp(w io.Writer, name, synopsis string, defs []flagDef) {
	fmt.Fprintf(w, "usage: plumb %s %s\n\nflags:\n", name, synopsis)
	for _, d := range defs {
		head := "  --" + d.name
		if d.name == "o" {
			head = "  -o" // as people type it
		}
		switch {
		case len(d.values) > 0:
			head += " " + strings.Join(d.values, "|")
		case strings.HasPrefix(d.arg, "["):
			head += d.arg // an optional value: --index[=AT]
		case d.arg != "":
			head += " " + d.arg
		}
		text := d.usage
		if d.def != "" {
			text += " (default: " + d.def + ")"
		}
		if d.repeat {
			text += fmt.Sprintf("; may repeat: --%s a --%s b (survives Makefile functions, where a,b does not) or --%s a,b", d.name, d.name, d.name)
		}
		fmt.Fprintf(w, "%s\n    \t%s\n", head, text)
	}
}

// chartList is the charts part of plumb's usage text, from the table.
func chartList() string {
	var b strings.Builder
	other := false
	for _, c := range commandTable() {
		if c.chart == nil && !other {
			// The table lists the charts first, then the commands that
			// compose, review or show them.
			b.WriteString("\nother commands:\n")
			other = true
		}
		fmt.Fprintf(&b, "  %-9s %s\n", c.name, c.summary)
	}
	return strings.TrimSuffix(b.String(), "\n")
}

// The values flags bind to the option fields. Each reports a bad value in
// words that flagError turns into "--NAME VALUE: what would work".

// stringValue sets a string field.
type stringValue struct{ p *string }

func (v stringValue) String() string {
	if v.p == nil {
		return ""
	}
	return *v.p
}

func (v stringValue) Set(s string) error { *v.p = s; return nil }

// choiceValue sets a string-typed field (render.Order, render.Medium) to
// one of a list of values; refused values get their own reason.
type choiceValue[T ~string] struct {
	p       *T
	values  []string
	refused map[string]string // value: why it is not accepted
}

func (v choiceValue[T]) String() string {
	if v.p == nil {
		return ""
	}
	return string(*v.p)
}

func (v choiceValue[T]) Set(s string) error {
	if why, ok := v.refused[s]; ok {
		return errors.New(why)
	}
	if !slices.Contains(v.values, s) {
		return errors.New("use " + orList(v.values))
	}
	*v.p = T(s)
	return nil
}

// orList is "a, b or c".
func orList(vs []string) string {
	if len(vs) < 2 {
		return strings.Join(vs, "")
	}
	return strings.Join(vs[:len(vs)-1], ", ") + " or " + vs[len(vs)-1]
}

// intValue sets an int field.
type intValue struct{ p *int }

func (v intValue) String() string {
	if v.p == nil {
		return ""
	}
	return strconv.Itoa(*v.p)
}

func (v intValue) Set(s string) error {
	n, err := strconv.Atoi(strings.TrimSpace(s))
	if err != nil {
		return errors.New("give a whole number")
	}
	*v.p = n
	return nil
}

// boolValue sets a bool field; a bare --flag means true.
type boolValue struct{ p *bool }

func (v boolValue) String() string   { return strconv.FormatBool(v.p != nil && *v.p) }
func (v boolValue) IsBoolFlag() bool { return true }

func (v boolValue) Set(s string) error {
	b, err := strconv.ParseBool(s)
	if err != nil {
		return errors.New("give true or false")
	}
	*v.p = b
	return nil
}

// numberValue sets an optional number (*float64 field): nil unless given.
type numberValue struct{ p **float64 }

func (v numberValue) String() string {
	if v.p == nil || *v.p == nil {
		return ""
	}
	return strconv.FormatFloat(**v.p, 'g', -1, 64)
}

func (v numberValue) Set(s string) error {
	f, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || math.IsNaN(f) || math.IsInf(f, 0) {
		return errors.New("give a number")
	}
	*v.p = &f
	return nil
}

// listValue sets a list that may be given as commas (--y a,b), by
// repeating the flag (--y a --y b), or both.
type listValue struct{ p *[]string }

func (v listValue) String() string {
	if v.p == nil {
		return ""
	}
	return strings.Join(*v.p, ",")
}

func (v listValue) Set(s string) error {
	for _, p := range strings.Split(s, ",") {
		if p = strings.TrimSpace(p); p != "" {
			*v.p = append(*v.p, p)
		}
	}
	return nil
}

// sizeValue is --size WxH: it sets Common.Width and Common.Height.
type sizeValue struct{ w, h *float64 }

func (v sizeValue) String() string {
	if v.w == nil || *v.w == 0 {
		return ""
	}
	return strconv.FormatFloat(*v.w, 'g', -1, 64) + "x" + strconv.FormatFloat(*v.h, 'g', -1, 64)
}

func (v sizeValue) Set(s string) error {
	w, h, ok := parseSize(s)
	if !ok {
		return errors.New("give width x height in pixels, such as 800x500 (width 1 to 20000; height 0 lets the chart choose)")
	}
	*v.w, *v.h = w, h
	return nil
}

package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"slices"
	"strconv"
	"strings"

	"plumb/internal/suggest"
	"plumb/layout"
	"plumb/render"
)

// usageError is a mistake in the command line itself (exit 2), as opposed to
// bad data or a refused chart (exit 1).
type usageError struct{ msg string }

func (e *usageError) Error() string { return e.msg }

func usagef(format string, a ...any) error { return &usageError{fmt.Sprintf(format, a...)} }

// shared holds the settings every chart takes: the CLI's own (output,
// reading, notes) and, through c, the chart's render.Common.
type shared struct {
	c                                    *render.Common // the options' Common, which the shared flags set
	scale                                float64        // --scale: PNG pixels per SVG unit; 0 means 1
	out, font, format, decimal, maxInput string
	quiet, explain                       bool
	alt                                  bool   // --alt: print the figure's description on standard output
	data                                 string // the data path, set by runChart; names the figure in notes

	by        string // --by: one panel per value of this column
	byOrder   string // --by-order: value, label or data
	ownScales bool   // --own-scales: each panel its own value scale
}

// newShared binds the shared settings to a chart's Common, with the
// defaults the flags show.
func newShared(c *render.Common) shared {
	c.Medium = render.Screen
	return shared{c: c, maxInput: "1GB", byOrder: string(render.ByValue)}
}

// flags are the shared flags, bound to Common's fields and the CLI's own.
func (s *shared) flags() []flagDef {
	c := s.c
	return append([]flagDef{
		{name: "o", arg: "FILE", usage: "write the figure to FILE (.svg, .png, or no extension for SVG; - or none: SVG on standard output)", value: stringValue{&s.out}},
		{name: "title", sets: []string{"Title"}, arg: "TEXT", usage: "title above the chart", value: stringValue{&c.Title}},
		{name: "subtitle", sets: []string{"Subtitle"}, arg: "TEXT", usage: "subtitle: what is measured, in what unit", value: stringValue{&c.Subtitle}},
		{name: "source", sets: []string{"Source"}, arg: "TEXT", usage: "where the numbers come from, printed under the chart", value: stringValue{&c.Source}},
		{name: "note", sets: []string{"Note"}, arg: "TEXT", usage: "a note printed under the chart", value: stringValue{&c.Note}},
		{name: "for", sets: []string{"Medium"}, values: media, def: string(render.Screen), usage: "the medium: print, screen or slide (sets size and text sizes)",
			value: choiceValue[render.Medium]{p: &c.Medium, values: media}},
		{name: "size", sets: []string{"Width", "Height"}, arg: "WxH", usage: "canvas size WxH in pixels (H may be 0 to let the chart choose)", value: sizeValue{&c.Width, &c.Height}},
		{name: "by", arg: "COLUMN", usage: "small multiples: one panel per value of COLUMN, titled with the value, all on one value scale", value: stringValue{&s.by}},
		{name: "by-order", values: orders, def: string(render.ByValue), usage: "order of the --by panels: value (largest total first, or largest mean for values that do not add up), label, or data (as in the file)",
			value: choiceValue[string]{p: &s.byOrder, values: orders}},
		{name: "own-scales", usage: "give each --by panel its own value scale (flagged in a note: equal lengths then differ in amount)", value: boolValue{&s.ownScales}},
		{name: "font", sets: []string{"Fonts"}, arg: "FILE", usage: "measure text with this TTF/OTF FILE and name it in the figure", value: stringValue{&s.font}},
		{name: "embed-font", sets: []string{"EmbedFont"}, usage: "embed the font in the SVG so every viewer draws what was measured", value: boolValue{&c.EmbedFont}},
		{name: "scale", arg: "K", def: "1", usage: "pixels per SVG unit in a PNG, such as 2 for high-density screens", value: scaleValue{&s.scale}},
		{name: "format", arg: "FORMAT", usage: "data format when the file name does not say: csv, tsv, json, semicolon or pipe", value: stringValue{&s.format}},
		{name: "decimal", arg: "MARK", usage: "decimal mark of the numbers: . or , (default: decided per column from the cells)", value: stringValue{&s.decimal}},
		{name: "max-input", arg: "SIZE", def: "1GB", usage: "read at most SIZE of data, such as 1GB or 200MB", value: stringValue{&s.maxInput}},
		{name: "colors", sets: []string{"Colors"}, arg: "HEX,...", usage: "your own data colours in order, such as #1f5fa8,#c8553d: the first for single-series marks, the second for highlights, all for series and groups (checked for colour vision deficiency and contrast; problems are notes)",
			value: colorsValue{&c.Colors}},
		{name: "alt", usage: "print the figure's plain-language description (its <desc>, for alt text) on standard output; with -o the figure still goes to the file, without -o only the text is printed", value: boolValue{&s.alt}},
		{name: "quiet", usage: "print no notes on standard error (errors still print)", value: boolValue{&s.quiet}},
		{name: "explain", usage: "also print routine decisions (columns chosen, types guessed, banking) on standard error; the SVG's metadata always has them", value: boolValue{&s.explain}},
	}, annotationFlags(c)...)
}

// media are the values of --for.
var media = []string{string(render.Print), string(render.Screen), string(render.Slide)}

// finish completes Common from the settings that need work once the flags
// are parsed: the font file is read and parsed.
func (s *shared) finish() error {
	if err := checkScale(s.scale, s.out); err != nil {
		return err
	}
	if s.font == "" {
		return nil
	}
	data, err := readFont(s.font)
	if err != nil {
		return fmt.Errorf("--font %s: %w", s.font, err)
	}
	face, err := layout.ParseFace(data)
	if err != nil {
		return fmt.Errorf("--font %s: %w", s.font, err)
	}
	s.c.Fonts = layout.Fonts{Regular: face, Bold: face}
	return nil
}

// maxFontBytes bounds --font: the largest common faces (full CJK sets)
// are about 20 MB, and reading /dev/zero must stop rather than fill memory.
const maxFontBytes = 64 << 20

// readFont reads a font file of at most maxFontBytes.
func readFont(path string) ([]byte, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, bareCause(err)
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, maxFontBytes+1))
	if err != nil {
		return nil, bareCause(err)
	}
	if len(data) > maxFontBytes {
		return nil, fmt.Errorf("more than %d MB; is it a font file?", maxFontBytes>>20)
	}
	return data, nil
}

// parseSize reads --size WxH: plain decimal numbers (no NaN, Inf, signs or
// hexadecimal), width above 0, height 0 (the chart chooses) or more, both
// at most 20000 px.
func parseSize(s string) (w, h float64, ok bool) {
	ws, hs, ok := strings.Cut(strings.ToLower(strings.TrimSpace(s)), "x")
	if !ok || !plainDecimal(ws) || !plainDecimal(hs) {
		return 0, 0, false
	}
	w, err1 := strconv.ParseFloat(ws, 64)
	h, err2 := strconv.ParseFloat(hs, 64)
	if err1 != nil || err2 != nil || !(w > 0 && w <= 20000) || !(h >= 0 && h <= 20000) {
		return 0, 0, false
	}
	return w, h, true
}

// plainDecimal reports digits with at most one decimal point.
func plainDecimal(s string) bool {
	digits, dots := 0, 0
	for _, r := range s {
		switch {
		case r >= '0' && r <= '9':
			digits++
		case r == '.':
			dots++
		default:
			return false
		}
	}
	return digits > 0 && dots <= 1
}

// parse reads flags and positional arguments in any order, as people type
// them: "plumb bars data.csv --label x" and "plumb bars --label x data.csv".
// The flag package prints nothing (its output is discarded, so an unknown
// flag is reported once, by exitCode); -h prints the help.
func parse(fs *flag.FlagSet, args []string) ([]string, error) {
	help := fs.Usage
	fs.Usage = func() {}
	defer func() { fs.Usage = help }()
	var pos []string
	for {
		if err := fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				help()
				return nil, err
			}
			return nil, flagError(fs, err)
		}
		rest := fs.Args()
		if len(rest) == 0 {
			return pos, nil
		}
		pos = append(pos, rest[0])
		args = rest[1:]
	}
}

// flagError rewords the flag package's errors in plumb's manner ("--top
// "x": give a whole number") and suggests the nearest flag for a misspelt
// one. The flag package's own wording is kept for anything else.
func flagError(fs *flag.FlagSet, err error) error {
	msg := err.Error()
	if name, ok := strings.CutPrefix(msg, "flag provided but not defined: -"); ok {
		var names []string
		fs.VisitAll(func(f *flag.Flag) { names = append(names, f.Name) })
		if best, ok := suggest.Closest(name, names); ok {
			return usagef("unknown flag --%s: did you mean --%s?", name, best)
		}
		return usagef("unknown flag --%s (see %s -h)", name, fs.Name())
	}
	if name, ok := strings.CutPrefix(msg, "flag needs an argument: -"); ok {
		return usagef("--%s needs a value (see %s -h)", name, fs.Name())
	}
	// invalid boolean value "VALUE" for -NAME: CAUSE
	if rest, ok := strings.CutPrefix(msg, "invalid boolean value "); ok {
		if i := strings.LastIndex(rest, " for -"); i > 0 {
			name, _, _ := strings.Cut(rest[i+len(" for -"):], ": ")
			return usagef("--%s=%s: give true or false (or --%s alone for true)", name, rest[:i], name)
		}
	}
	// invalid value "VALUE" for flag -NAME: CAUSE
	if rest, ok := strings.CutPrefix(msg, "invalid value "); ok {
		if i := strings.LastIndex(rest, " for flag -"); i > 0 {
			value := rest[:i]
			// Every flag's Value says what would work (commands.go).
			name, cause, _ := strings.Cut(rest[i+len(" for flag -"):], ": ")
			return usagef("--%s %s: %s", name, value, cause)
		}
	}
	return usagef("%s (see %s -h)", msg, fs.Name())
}

// dataSynopsis is the usage line of a chart that reads a data file.
const dataSynopsis = "DATA [flags]\n\nDATA is a .csv, .tsv or .json file, or - for standard input."

// newTableFlagSet makes a flag set from a command's flag table, each flag
// bound to the field it sets. It never exits and never prints on its own;
// -h prints the synopsis and the table (printHelp) on stderr.
func newTableFlagSet(name, synopsis string, defs []flagDef, stderr io.Writer) *flag.FlagSet {
	fs := flag.NewFlagSet("plumb "+name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	for _, d := range defs {
		fs.Var(d.value, d.name, d.usage)
	}
	fs.Usage = func() { printHelp(stderr, name, synopsis, defs) }
	return fs
}

// printError writes one error line on stderr, user text made safe.
func printError(stderr io.Writer, err error) {
	fmt.Fprintln(stderr, "plumb: "+terminalSafe(err.Error()))
}

// exitCode maps an error to the documented exit status, printing it.
func exitCode(err error, stderr io.Writer) int {
	if err == nil {
		return exitOK
	}
	if errors.Is(err, flag.ErrHelp) {
		return exitOK
	}
	printError(stderr, err)
	var ue *usageError
	if errors.As(err, &ue) {
		return exitUsage
	}
	return exitData
}

// Which notes reach stderr.
type noteLevel int

const (
	notesChanged noteLevel = iota // default: what changed or left out data
	notesAll                      // --explain: routine decisions too
	notesNone                     // --quiet
)

// level is the note level the shared flags ask for; --quiet wins over
// --explain, so that a Makefile's global --quiet is obeyed.
func (s *shared) level() noteLevel {
	switch {
	case s.quiet:
		return notesNone
	case s.explain:
		return notesAll
	}
	return notesChanged
}

// printNotes writes the decisions plumb made on stderr, one per line, each
// naming the figure it belongs to ("plumb: out.svg: note: ..."), so that
// the notes of parallel runs (make -j) can be told apart.
func printNotes(stderr io.Writer, figure string, notes []render.Note, level noteLevel) {
	if level == notesNone {
		return
	}
	for _, n := range notes {
		if n.Changed || level == notesAll {
			fmt.Fprintln(stderr, "plumb: "+terminalSafe(figure)+": note: "+terminalSafe(n.Text))
		}
	}
}

// emit writes the figure that draw produces to -o (or stdout), prints the
// notes of loading and drawing, and returns the exit code.
func emit(chart string, sh *shared, stdout, stderr io.Writer, notes []render.Note, draw func(io.Writer) ([]render.Note, error)) int {
	before := len(notes)
	alt := &altCapture{}
	write := func(w io.Writer) error {
		if sh.alt {
			alt.w = w
			w = alt
		}
		drawn, err := draw(w)
		for _, n := range drawn {
			// The loading notes come back from the drawing when the chart
			// passed them on (render.Common.Notes) for the metadata.
			if !slices.Contains(notes[:before], n) {
				notes = append(notes, n)
			}
		}
		return err
	}
	var err error
	if sh.alt && (sh.out == "" || sh.out == "-") {
		// --alt without -o: the description is the output, and the figure
		// is drawn but not written.
		err = write(io.Discard)
	} else {
		err = writeFigure(sh.out, sh.scale, stdout, write)
	}
	printNotes(stderr, describeOutput(sh.out, sh.data), notes, sh.level())
	if err != nil {
		return exitCode(fmt.Errorf("%s: %w", chart, err), stderr)
	}
	if sh.alt {
		if !alt.seen {
			return exitCode(fmt.Errorf("%s: the figure has no description to print", chart), stderr)
		}
		fmt.Fprintln(stdout, alt.desc)
	}
	return exitOK
}

// altCapture is the writer a figure is drawn through under --alt: it takes
// the scene (render.SceneWriter), keeps its description and passes the
// scene on to the writer beneath, serialised as SVG unless that writer
// takes scenes itself (PNG output). The text printed is therefore the
// very <desc> the figure carries.
type altCapture struct {
	w    io.Writer
	desc string
	seen bool
}

func (a *altCapture) Write(p []byte) (int, error) { return a.w.Write(p) }

// WriteScene keeps the scene's description and writes the scene on.
func (a *altCapture) WriteScene(s *render.Scene) error {
	a.desc, a.seen = s.Desc, true
	if a.w == io.Discard {
		return nil
	}
	return render.WriteSVG(a.w, s)
}

// colorsValue is --colors HEX,...: a comma-separated list of #rgb or
// #rrggbb colours, each read by render.ParseColour. A value that is not a
// colour is named, with its place in the list.
type colorsValue struct{ p *[]render.Colour }

func (v colorsValue) String() string {
	if v.p == nil {
		return ""
	}
	hex := make([]string, len(*v.p))
	for i, c := range *v.p {
		hex[i] = c.Hex()
	}
	return strings.Join(hex, ",")
}

func (v colorsValue) Set(s string) error {
	if strings.TrimSpace(s) == "" {
		*v.p = nil // no colours given: plumb's own
		return nil
	}
	var out []render.Colour
	for i, part := range strings.Split(s, ",") {
		part = strings.TrimSpace(part)
		c, err := render.ParseColour(part)
		if err != nil {
			return fmt.Errorf("colour %d, %q, is not a hex colour: give #rgb or #rrggbb, such as #1f5fa8", i+1, part)
		}
		out = append(out, c)
	}
	*v.p = out
	return nil
}

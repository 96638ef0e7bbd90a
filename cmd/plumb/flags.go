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

// shared holds the flags every chart takes.
type shared struct {
	out, title, subtitle, source, note string
	medium, size, font, format         string
	decimal, maxInput                  string
	embedFont, quiet, explain          bool
	data                               string // the data path, set by parseChart; names the figure in notes
}

func (s *shared) register(fs *flag.FlagSet) {
	fs.StringVar(&s.out, "o", "", "write the figure to `FILE` (.svg or no extension; - or none: standard output)")
	fs.StringVar(&s.title, "title", "", "title above the chart")
	fs.StringVar(&s.subtitle, "subtitle", "", "subtitle: what is measured, in what unit")
	fs.StringVar(&s.source, "source", "", "where the numbers come from, printed under the chart")
	fs.StringVar(&s.note, "note", "", "a note printed under the chart")
	fs.StringVar(&s.medium, "for", "screen", "the medium: print, screen or slide (sets size and text sizes)")
	fs.StringVar(&s.size, "size", "", "canvas size `WxH` in pixels (H may be 0 to let the chart choose)")
	fs.StringVar(&s.font, "font", "", "measure text with this TTF/OTF `FILE` and name it in the figure")
	fs.BoolVar(&s.embedFont, "embed-font", false, "embed the font in the SVG so every viewer draws what was measured")
	fs.StringVar(&s.format, "format", "", "data format when the file name does not say: csv, tsv, json, semicolon or pipe")
	fs.BoolVar(&s.quiet, "quiet", false, "print no notes on standard error (errors still print)")
	fs.BoolVar(&s.explain, "explain", false, "also print routine decisions (columns chosen, types guessed, banking) on standard error; the SVG's metadata always has them")
	fs.StringVar(&s.decimal, "decimal", "", "decimal mark of the numbers: . or , (default: decided per column from the cells)")
	fs.StringVar(&s.maxInput, "max-input", "1GB", "read at most `SIZE` of data, such as 1GB or 200MB")
}

// common turns the shared flags into the render options they mean.
func (s *shared) common() (render.Common, error) {
	c := render.Common{Title: s.title, Subtitle: s.subtitle, Source: s.source, Note: s.note, Medium: render.Medium(s.medium), EmbedFont: s.embedFont, Names: flagNames}
	switch c.Medium {
	case render.Print, render.Screen, render.Slide:
	default:
		return c, usagef("--for %q: use print, screen or slide", s.medium)
	}
	if s.size != "" {
		wv, hv, ok := parseSize(s.size)
		if !ok {
			return c, usagef("--size %q: give width x height in pixels, such as 800x500 (width 1 to 20000; height 0 lets the chart choose)", s.size)
		}
		c.Width, c.Height = wv, hv
	}
	if s.font != "" {
		data, err := readFont(s.font)
		if err != nil {
			return c, fmt.Errorf("--font %s: %w", s.font, err)
		}
		face, err := layout.ParseFace(data)
		if err != nil {
			return c, fmt.Errorf("--font %s: %w", s.font, err)
		}
		c.Fonts = layout.Fonts{Regular: face, Bold: face}
	}
	return c, nil
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
			name, cause, _ := strings.Cut(rest[i+len(" for flag -"):], ": ")
			if f := fs.Lookup(name); f != nil {
				if g, ok := f.Value.(flag.Getter); ok {
					switch g.Get().(type) {
					case int, int64, uint, uint64:
						cause = "give a whole number"
					case float64:
						cause = "give a number"
					case bool:
						cause = "give true or false"
					}
				}
			}
			return usagef("--%s %s: %s", name, value, cause)
		}
	}
	return usagef("%s (see %s -h)", msg, fs.Name())
}

// dataSynopsis is the usage line of a chart that reads a data file.
const dataSynopsis = "DATA [flags]\n\nDATA is a .csv, .tsv or .json file, or - for standard input."

// newFlagSet makes a flag set that never exits and never prints on its own;
// -h prints "usage: plumb NAME SYNOPSIS" and the flags on stderr, marking
// the flags that may be repeated.
func newFlagSet(name, synopsis string, stderr io.Writer) *flag.FlagSet {
	fs := flag.NewFlagSet("plumb "+name, flag.ContinueOnError)
	fs.SetOutput(io.Discard)
	fs.Usage = func() {
		fmt.Fprintf(stderr, "usage: plumb %s %s\n\nflags:\n", name, synopsis)
		fs.VisitAll(func(f *flag.Flag) {
			if _, ok := f.Value.(*listFlag); ok && !strings.Contains(f.Usage, "repeat") {
				f.Usage += fmt.Sprintf("; may repeat: --%s a --%s b (survives Makefile functions, where a,b does not) or --%s a,b", f.Name, f.Name, f.Name)
			}
		})
		fs.SetOutput(stderr)
		fs.PrintDefaults()
		fs.SetOutput(io.Discard)
	}
	return fs
}

// floatFlag is an optional number: unset unless given.
type floatFlag struct{ v *float64 }

func (f *floatFlag) String() string {
	if f.v == nil {
		return ""
	}
	return strconv.FormatFloat(*f.v, 'g', -1, 64)
}

func (f *floatFlag) Set(s string) error {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil {
		return errors.New("give a number")
	}
	f.v = &v
	return nil
}

// listFlag is a list that may be given as commas (--y a,b), by repeating
// the flag (--y a --y b), or both.
type listFlag []string

func (l *listFlag) String() string { return strings.Join(*l, ",") }

func (l *listFlag) Set(s string) error {
	for _, p := range strings.Split(s, ",") {
		if p = strings.TrimSpace(p); p != "" {
			*l = append(*l, p)
		}
	}
	return nil
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

// parseChart reads a chart's command line: flags in any order and exactly
// one data file. It returns the data path and the shared render options.
func parseChart(fs *flag.FlagSet, sh *shared, args []string) (string, render.Common, error) {
	pos, err := parse(fs, args)
	if err != nil {
		return "", render.Common{}, err
	}
	if len(pos) != 1 {
		return "", render.Common{}, usagef("give one data file (.csv, .tsv, .json), or - for standard input")
	}
	if err := checkFigurePath(sh.out); err != nil {
		return "", render.Common{}, err
	}
	sh.data = pos[0]
	c, err := sh.common()
	return pos[0], c, err
}

// emit writes the figure that draw produces to -o (or stdout), prints the
// notes of loading and drawing, and returns the exit code.
func emit(chart string, sh *shared, stdout, stderr io.Writer, notes []render.Note, draw func(io.Writer) ([]render.Note, error)) int {
	before := len(notes)
	err := writeOutput(sh.out, stdout, func(w io.Writer) error {
		drawn, err := draw(w)
		for _, n := range drawn {
			// The loading notes come back from the drawing when the chart
			// passed them on (render.Common.Notes) for the metadata.
			if !slices.Contains(notes[:before], n) {
				notes = append(notes, n)
			}
		}
		return err
	})
	printNotes(stderr, describeOutput(sh.out, sh.data), notes, sh.level())
	if err != nil {
		return exitCode(fmt.Errorf("%s: %w", chart, err), stderr)
	}
	return exitOK
}

// flagNames maps render's option names to the flags that set them.
var flagNames = render.OptionNames{"Top": "--top", "Other": "--other", "Percent": "--percent", "Vertical": "--vertical",
	"From": "--from", "To": "--to", "Width": "--size", "Height": "--size", "Together": "--together", "Index": "--index", "IndexAt": "--index-at", "Aspect": "--aspect"}

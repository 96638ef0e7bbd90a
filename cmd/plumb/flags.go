package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"strconv"
	"strings"

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
	embedFont, quiet                   bool
}

func (s *shared) register(fs *flag.FlagSet) {
	fs.StringVar(&s.out, "o", "", "write the figure to `FILE` (.svg); default: standard output")
	fs.StringVar(&s.title, "title", "", "title above the chart")
	fs.StringVar(&s.subtitle, "subtitle", "", "subtitle: what is measured, in what unit")
	fs.StringVar(&s.source, "source", "", "where the numbers come from, printed under the chart")
	fs.StringVar(&s.note, "note", "", "a note printed under the chart")
	fs.StringVar(&s.medium, "for", "screen", "the medium: print, screen or slide (sets size and text sizes)")
	fs.StringVar(&s.size, "size", "", "canvas size `WxH` in pixels (H may be 0 to let the chart choose)")
	fs.StringVar(&s.font, "font", "", "measure text with this TTF/OTF `FILE` and name it in the figure")
	fs.BoolVar(&s.embedFont, "embed-font", false, "embed the font in the SVG so every viewer draws what was measured")
	fs.StringVar(&s.format, "format", "", "data format when the file name does not say: csv, tsv or json")
	fs.BoolVar(&s.quiet, "quiet", false, "do not print notes on standard error")
	fs.StringVar(&s.decimal, "decimal", "", "decimal mark of the numbers: . or , (default: decided per column from the cells)")
	fs.StringVar(&s.maxInput, "max-input", "1GB", "read at most `SIZE` of data, such as 1GB or 200MB")
}

// common turns the shared flags into the render options they mean.
func (s *shared) common() (render.Common, error) {
	c := render.Common{Title: s.title, Subtitle: s.subtitle, Source: s.source, Note: s.note, Medium: render.Medium(s.medium), EmbedFont: s.embedFont}
	switch c.Medium {
	case render.Print, render.Screen, render.Slide:
	default:
		return c, usagef("--for %q: use print, screen or slide", s.medium)
	}
	if s.size != "" {
		w, h, ok := strings.Cut(strings.ToLower(s.size), "x")
		wv, err1 := strconv.ParseFloat(w, 64)
		hv, err2 := strconv.ParseFloat(h, 64)
		if !ok || err1 != nil || err2 != nil || wv <= 0 || hv < 0 || wv > 20000 || hv > 20000 {
			return c, usagef("--size %q: give width x height in pixels, such as 800x500 (height 0 lets the chart choose)", s.size)
		}
		c.Width, c.Height = wv, hv
	}
	if s.font != "" {
		data, err := readFileLimited(s.font, maxFontSize)
		if err != nil {
			return c, fmt.Errorf("--font: %w", err)
		}
		face, err := layout.ParseFace(data)
		if err != nil {
			return c, fmt.Errorf("--font %s: %w", s.font, err)
		}
		c.Fonts = layout.Fonts{Regular: face, Bold: face}
	}
	return c, nil
}

// parse reads flags and positional arguments in any order, as people type
// them: "plumb bars data.csv --label x" and "plumb bars --label x data.csv".
func parse(fs *flag.FlagSet, args []string) ([]string, error) {
	var pos []string
	for {
		if err := fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				return nil, err
			}
			return nil, &usageError{err.Error()}
		}
		rest := fs.Args()
		if len(rest) == 0 {
			return pos, nil
		}
		pos = append(pos, rest[0])
		args = rest[1:]
	}
}

// dataSynopsis is the usage line of a chart that reads a data file.
const dataSynopsis = "DATA [flags]\n\nDATA is a .csv, .tsv or .json file, or - for standard input."

// newFlagSet makes a flag set that reports to stderr and never exits; -h
// prints "usage: plumb NAME SYNOPSIS" and the flags.
func newFlagSet(name, synopsis string, stderr io.Writer) *flag.FlagSet {
	fs := flag.NewFlagSet("plumb "+name, flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {
		fmt.Fprintf(stderr, "usage: plumb %s %s\n\nflags:\n", name, synopsis)
		fs.PrintDefaults()
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
		return fmt.Errorf("%q is not a number", s)
	}
	f.v = &v
	return nil
}

// listFlag is a comma-separated list, repeatable.
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

// exitCode maps an error to the documented exit status, printing it.
func exitCode(err error, stderr io.Writer) int {
	if err == nil {
		return exitOK
	}
	if errors.Is(err, flag.ErrHelp) {
		return exitOK
	}
	fmt.Fprintln(stderr, "plumb:", err)
	var ue *usageError
	if errors.As(err, &ue) {
		return exitUsage
	}
	return exitData
}

// printNotes writes the decisions plumb made on stderr, one per line.
func printNotes(stderr io.Writer, notes []render.Note, quiet bool) {
	if quiet {
		return
	}
	for _, n := range notes {
		fmt.Fprintln(stderr, "plumb: note:", n.Text)
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
	c, err := sh.common()
	return pos[0], c, err
}

// emit writes the figure that draw produces to -o (or stdout), prints the
// notes of loading and drawing, and returns the exit code.
func emit(chart string, sh *shared, stdout, stderr io.Writer, notes []render.Note, draw func(io.Writer) ([]render.Note, error)) int {
	err := writeOutput(sh.out, stdout, func(w io.Writer) error {
		n, err := draw(w)
		notes = append(notes, n...)
		return err
	})
	printNotes(stderr, notes, sh.quiet)
	if err != nil {
		return exitCode(fmt.Errorf("%s: %w", chart, err), stderr)
	}
	return exitOK
}

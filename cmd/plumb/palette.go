package main

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/internal/suggest"
	"plumb/palette"
	"plumb/render"
)

const paletteUsage = `usage:
  plumb palette categorical|sequential|diverging [--n N] [--hue NAME] [--json] [--quiet] [-o FILE]
  plumb palette check [--background HEX] [--json] [--quiet] [-o FILE] COLOUR...

Without --json a palette is written as an SVG swatch sheet showing the colours
as seen with normal, protan, deutan and tritan vision. check reviews any
colours (#rgb or #rrggbb; quote them, or leave out the '#', since the shell
reads '#' as a comment) and exits 0 when they are safe, 1 when not; with
--quiet it prints nothing and the exit status alone answers.`

// runPalette is "plumb palette": show plumb's palettes, or check colours.
func runPalette(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		fmt.Fprintln(stderr, paletteUsage)
		return exitUsage
	}
	switch args[0] {
	case "categorical", "sequential", "diverging":
		return runPaletteShow(args[0], args[1:], stdout, stderr)
	case "check":
		return runPaletteCheck(args[1:], stdout, stderr)
	case "help", "-h", "--help":
		fmt.Fprintln(stdout, paletteUsage)
		return exitOK
	}
	kinds := []string{"categorical", "sequential", "diverging", "check", "help"}
	if best, ok := suggest.Closest(args[0], kinds); ok {
		printError(stderr, usagef("palette: unknown kind %q: did you mean %q?", args[0], best))
	} else {
		printError(stderr, usagef("palette: unknown kind %q", args[0]))
	}
	fmt.Fprintln(stderr, paletteUsage)
	return exitUsage
}

func runPaletteShow(kind string, args []string, stdout, stderr io.Writer) int {
	var (
		n            = new(int)
		hue, out     = new(string), new(string)
		asJSON, hush = new(bool), new(bool)
	)
	fs := newTableFlagSet("palette "+kind, "[--n N] [--hue NAME] [--json] [--quiet] [-o FILE]", []flagDef{
		{name: "n", arg: "N", usage: fmt.Sprintf("number of colours (categorical 1-%d, default %d; sequential and diverging %d-%d, default 7 and 9)",
			palette.MaxCategorical, palette.MaxCategorical, palette.MinRamp, palette.MaxRamp), value: intValue{n}},
		{name: "hue", arg: "NAME", usage: "sequential: " + strings.Join(palette.SequentialHues(), ", ") +
			"; diverging: " + strings.Join(palette.DivergingHues(), ", "), value: stringValue{hue}},
		{name: "json", usage: `print {"kind", "colors", "worst_case_de2000", "min_contrast_on_white"} instead of a swatch sheet`, value: boolValue{asJSON}},
		{name: "o", arg: "FILE", usage: "output FILE (.svg or .png, or any name with --json); default standard output", value: stringValue{out}},
		{name: "quiet", usage: "accepted for symmetry with the charts: palettes print no notes", value: boolValue{hush}},
	}, stderr)
	pos, err := parse(fs, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	if len(pos) > 0 {
		return exitCode(usagef("palette %s: unexpected argument %q", kind, pos[0]), stderr)
	}
	if !*asJSON {
		if err := checkFigurePath(*out); err != nil {
			return exitCode(err, stderr)
		}
	}
	var (
		p     palette.Palette
		title string
	)
	switch kind {
	case "categorical":
		if *hue != "" {
			return exitCode(usagef("palette categorical: --hue does not apply"), stderr)
		}
		if *n == 0 {
			*n = palette.MaxCategorical
		}
		p, err = palette.Categorical(*n)
		title = fmt.Sprintf("Categorical palette, %s", colourCount(*n))
	case "sequential":
		if *hue == "" {
			*hue = palette.SequentialHues()[0]
		}
		if *n == 0 {
			*n = 7
		}
		p, err = palette.Sequential(*hue, *n)
		title = fmt.Sprintf("Sequential palette, %s, %s", *hue, colourCount(*n))
	case "diverging":
		if *hue == "" {
			*hue = palette.DivergingHues()[0]
		}
		if *n == 0 {
			*n = 9
		}
		p, err = palette.DivergingPair(*hue, *n)
		title = fmt.Sprintf("Diverging palette, %s, %s", *hue, colourCount(*n))
	}
	if err != nil {
		return exitCode(usagef("%v", err), stderr)
	}
	write := func(w io.Writer) error { return render.WritePaletteSheet(w, title, p) }
	if *asJSON {
		write = func(w io.Writer) error {
			// The two numbers a reader checks a palette by: the smallest
			// CIEDE2000 distance between any two colours under normal,
			// protan, deutan and tritan vision, and the lowest contrast
			// against white.
			return writeJSON(w, struct {
				Kind        string   `json:"kind"`
				Colors      []string `json:"colors"`
				WorstCase   float64  `json:"worst_case_de2000"`
				MinContrast float64  `json:"min_contrast_on_white"`
			}{kind, p.Hex(), math.Round(p.WorstCase()*100) / 100, math.Round(p.MinContrast(palette.SRGB{R: 1, G: 1, B: 1})*100) / 100})
		}
	}
	output := writeOutput
	if !*asJSON {
		output = func(path string, stdout io.Writer, write func(io.Writer) error) error {
			return writeFigure(path, 1, stdout, write)
		}
	}
	if err := output(*out, stdout, write); err != nil {
		return exitCode(err, stderr)
	}
	return exitOK
}

// checkJSON is the exact shape "palette check --json" prints.
type checkJSON struct {
	Colors     []string       `json:"colors"`
	Background string         `json:"background"`
	Pairs      []pairJSON     `json:"pairs"`
	Contrast   []contrastJSON `json:"contrast"`
	Safe       bool           `json:"safe"`
	Problems   []string       `json:"problems"`
}

type pairJSON struct {
	A      string  `json:"a"`
	B      string  `json:"b"`
	Normal float64 `json:"normal"`
	Protan float64 `json:"protan"`
	Deutan float64 `json:"deutan"`
	Tritan float64 `json:"tritan"`
}

type contrastJSON struct {
	Color string  `json:"color"`
	Ratio float64 `json:"ratio"`
}

func runPaletteCheck(args []string, stdout, stderr io.Writer) int {
	var (
		bgFlag, out   = new(string), new(string)
		asJSON, quiet = new(bool), new(bool)
	)
	*bgFlag = "#ffffff"
	fs := newTableFlagSet("palette check", "[--background HEX] [--json] [--quiet] [-o FILE] COLOUR...", []flagDef{
		{name: "background", arg: "COLOUR", def: "#ffffff", usage: "background COLOUR the marks sit on (#rgb or #rrggbb)", value: stringValue{bgFlag}},
		{name: "json", usage: "print the measurements as JSON", value: boolValue{asJSON}},
		{name: "quiet", usage: "print no report; the exit status says safe (0) or not (1)", value: boolValue{quiet}},
		{name: "o", arg: "FILE", usage: "FILE for the JSON (with --json) or the SVG swatch sheet (.svg)", value: stringValue{out}},
	}, stderr)
	pos, err := parse(fs, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	if !*asJSON {
		if err := checkFigurePath(*out); err != nil {
			return exitCode(err, stderr)
		}
	}
	if len(pos) == 0 {
		return exitCode(usagef("palette check: no colours given (want #rgb or #rrggbb)"), stderr)
	}
	bg, err := palette.ParseHex(*bgFlag)
	if err != nil {
		return exitCode(usagef("palette check: --background %q is not a colour (want #rgb or #rrggbb)", *bgFlag), stderr)
	}
	colors := make([]palette.SRGB, len(pos))
	for i, s := range pos {
		c, err := palette.ParseHex(s)
		if err != nil {
			return exitCode(usagef("palette check: argument %q is not a colour (want #rgb or #rrggbb)", s), stderr)
		}
		colors[i] = c
	}
	r := palette.Check(colors, bg)
	switch {
	case *asJSON && !(*quiet && *out == ""):
		err = writeOutput(*out, stdout, func(w io.Writer) error { return writeJSON(w, reportJSON(r)) })
	case *asJSON:
	default:
		if !*quiet {
			writeCheckText(stdout, r)
		}
		if *out != "" {
			err = writeOutput(*out, stdout, func(w io.Writer) error {
				return render.WritePaletteSheet(w, "Colour check", colors)
			})
		}
	}
	if err != nil {
		return exitCode(err, stderr)
	}
	if !r.Safe {
		return exitData
	}
	return exitOK
}

func reportJSON(r palette.Report) checkJSON {
	j := checkJSON{
		Colors:     palette.Palette(r.Colors).Hex(),
		Background: r.Background.Hex(),
		Pairs:      make([]pairJSON, len(r.Pairs)),
		Contrast:   make([]contrastJSON, len(r.Contrast)),
		Safe:       r.Safe,
		Problems:   r.Problems,
	}
	for i, p := range r.Pairs {
		j.Pairs[i] = pairJSON{A: p.A.Hex(), B: p.B.Hex(),
			Normal: p.Distance[palette.Normal], Protan: p.Distance[palette.Protan],
			Deutan: p.Distance[palette.Deutan], Tritan: p.Distance[palette.Tritan]}
	}
	for i, c := range r.Contrast {
		j.Contrast[i] = contrastJSON{Color: c.Color.Hex(), Ratio: c.Ratio}
	}
	if j.Problems == nil {
		j.Problems = []string{}
	}
	return j
}

func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// writeCheckText is the short readable report of palette check.
func writeCheckText(w io.Writer, r palette.Report) {
	fmt.Fprintf(w, "colours: %s on %s\n", strings.Join(palette.Palette(r.Colors).Hex(), " "), r.Background.Hex())
	if len(r.Pairs) > 0 {
		fmt.Fprintf(w, "closest pair for each vision (CIEDE2000, at least %g needed):\n", palette.MinPairDistance)
		for _, v := range palette.Visions {
			best := r.Pairs[0]
			for _, p := range r.Pairs[1:] {
				if p.Distance[v] < best.Distance[v] {
					best = p
				}
			}
			fmt.Fprintf(w, "  %-7s %6.1f  %s / %s\n", v, best.Distance[v], best.A.Hex(), best.B.Hex())
		}
	}
	fmt.Fprintf(w, "contrast on %s (at least %g:1 needed):\n", r.Background.Hex(), palette.MinMarkContrast)
	for _, c := range r.Contrast {
		// Truncated, not rounded: WCAG counts 2.999:1 as failing 3:1.
		fmt.Fprintf(w, "  %s  %.2f:1\n", c.Color.Hex(), math.Floor(c.Ratio*100)/100)
	}
	if r.Safe {
		fmt.Fprintln(w, "safe: yes")
		return
	}
	fmt.Fprintln(w, "safe: no")
	for _, p := range r.Problems {
		fmt.Fprintf(w, "  - %s\n", p)
	}
}

// colourCount is "1 colour" or "N colours".
func colourCount(n int) string {
	if n == 1 {
		return "1 colour"
	}
	return fmt.Sprintf("%d colours", n)
}

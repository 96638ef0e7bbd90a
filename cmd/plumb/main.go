// Command plumb turns a table of numbers into a clear, honest chart.
//
// Usage:
//
//	plumb CHART [DATA] [flags]
//
// See the README for the charts and their flags.
package main

import (
	"fmt"
	"io"
	"os"
)

// Exit codes: 0 success, 1 bad input or a refused chart, 2 usage error.
const (
	exitOK    = 0
	exitData  = 1
	exitUsage = 2
)

func main() {
	os.Exit(run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}

// run is the whole program behind main, with its streams passed in so that
// tests drive it exactly as a shell would.
func run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		fmt.Fprintln(stderr, usage)
		return exitUsage
	}
	switch args[0] {
	case "help", "-h", "--help":
		fmt.Fprintln(stdout, usage)
		return exitOK
	case "bars", "dots":
		return runRows(args[0], args[1:], stdin, stdout, stderr)
	case "lines":
		return runLines(args[1:], stdin, stdout, stderr)
	case "diff":
		return runDiff(args[1:], stdin, stdout, stderr)
	case "palette":
		return runPalette(args[1:], stdin, stdout, stderr)
	case "demo":
		return runDemo(args[1:], stdout, stderr)
	}
	fmt.Fprintf(stderr, "plumb: unknown chart %q\n%s\n", args[0], usage)
	return exitUsage
}

const usage = `usage: plumb CHART [DATA] [flags]

charts:
  bars      compare amounts (horizontal, sorted, from zero)
  dots      compare values far from zero
  lines     change over time or order, banked to 45°
  diff      the difference of two series, a − b against zero
  palette   show, make or check colour palettes
  demo      render the built-in gallery (-o DIR)

Run 'plumb CHART -h' for the flags of one chart.`

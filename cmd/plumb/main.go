// Command plumb turns a table of numbers into a clear, honest chart.
//
// Usage:
//
//	plumb CHART [DATA] [flags]
//
// See the README for the charts and their flags.
package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"runtime/debug"
	"strings"
	"sync"
	"time"

	"plumb/internal/suggest"
)

// Exit codes: 0 success, 1 bad input or a refused chart, 2 usage error. A
// run interrupted by a signal dies by that signal (a shell shows 128+N).
const (
	exitOK    = 0
	exitData  = 1
	exitUsage = 2
)

func main() {
	s := newSession(os.Stdout)
	sigs := make(chan os.Signal, 1)
	signal.Notify(sigs, interruptSignals()...)
	go func() {
		sig := <-sigs
		s.abort()
		dieBy(sig)
	}()
	os.Exit(run(os.Args[1:], os.Stdin, s, os.Stderr))
}

// session is one run of plumb: its standard output and the temporary files
// it is writing. It reaches every command as the stdout io.Writer, so that
// the commands keep the shape (args, stdin, stdout, stderr) and the output
// code finds the run's registry without any global state. main removes the
// registered files when a signal interrupts the run.
type session struct {
	io.Writer // standard output

	mu      sync.Mutex
	temps   map[string]bool // temporary files not yet renamed or removed
	aborted bool            // a signal arrived: no new file, no rename
	start   time.Time       // leftovers older than this are of earlier runs
}

func newSession(stdout io.Writer) *session {
	return &session{Writer: stdout, temps: map[string]bool{}, start: time.Now()}
}

// create makes a new file for writing (O_EXCL) and registers it, under
// the lock that abort takes, so that a file is either registered or never
// created; it fails once the run is being aborted.
func (s *session) create(name string, perm os.FileMode) (*os.File, error) {
	open := func() (*os.File, error) { return os.OpenFile(name, os.O_RDWR|os.O_CREATE|os.O_EXCL, perm) }
	if s == nil {
		return open()
	}
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.aborted {
		return nil, errors.New("interrupted")
	}
	f, err := open()
	if err == nil {
		s.temps[name] = true
	}
	return f, err
}

// forget drops a name from the registry.
func (s *session) forget(name string) {
	if s == nil {
		return
	}
	s.mu.Lock()
	delete(s.temps, name)
	s.mu.Unlock()
}

// remove deletes a temporary file and drops it from the registry.
func (s *session) remove(name string) {
	os.Remove(name)
	s.forget(name)
}

// rename moves a finished temporary file into place, unless a signal came
// first; the lock makes the two exclusive, so an interrupted run leaves
// either the old file or the complete new one, never a temporary file.
func (s *session) rename(name, target string) error {
	if s == nil {
		return os.Rename(name, target)
	}
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.aborted {
		return errors.New("interrupted")
	}
	err := os.Rename(name, target)
	delete(s.temps, name)
	return err
}

// abort removes every registered temporary file and blocks further renames
// for the rest of the process's short life. It keeps the lock on purpose.
func (s *session) abort() {
	s.mu.Lock()
	s.aborted = true
	for name := range s.temps {
		os.Remove(name)
	}
	clear(s.temps)
	// The lock stays held: the process is about to end, and no rename
	// may slip in after the files are gone.
}

// run is the whole program behind main, with its streams passed in so that
// tests drive it exactly as a shell would.
func run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	if _, ok := stdout.(*session); !ok {
		stdout = newSession(stdout)
	}
	if len(args) == 0 {
		fmt.Fprintln(stderr, usage())
		return exitUsage
	}
	switch args[0] {
	case "help", "-h", "-help", "--help":
		fmt.Fprintln(stdout, usage())
		return exitOK
	case "version", "-version", "--version":
		fmt.Fprintln(stdout, version())
		return exitOK
	}
	if cmd, ok := lookup(args[0]); ok {
		if cmd.chart != nil {
			return runChart(cmd, args[1:], stdin, stdout, stderr)
		}
		return cmd.run(args[1:], stdin, stdout, stderr)
	}
	printError(stderr, unknownChart(args[0]))
	fmt.Fprintln(stderr, "Run 'plumb help' for the list of charts.")
	return exitUsage
}

// commands are the names run accepts, for suggestions.
func commands() []string {
	var names []string
	for _, c := range commandTable() {
		names = append(names, c.name)
	}
	return append(names, "help", "version")
}

// notDrawn maps charts plumb deliberately does not draw to the command that
// shows the same data more faithfully, and why.
func notDrawn(name string) (instead, why string, ok bool) {
	// Cleveland & McGill (1984): position on a common scale and length are
	// judged more accurately than angle, area, volume or colour.
	switch strings.ToLower(strings.TrimLeft(name, "-")) {
	case "pie", "donut", "doughnut", "ring":
		return "bars --percent", "lengths on a common scale are compared more accurately than angles or areas (Cleveland & McGill 1984)", true
	case "treemap", "waffle", "bubble", "bubbles":
		return "bars (or dots)", "lengths and positions on a common scale are compared more accurately than areas (Cleveland & McGill 1984)", true
	case "area", "stacked", "stackedarea", "stream", "streamgraph":
		return "lines (or diff for two series)", "only the bottom layer of a stack sits on a common baseline; lines put every series on one", true
	case "radar", "spider", "polar":
		return "dots or lines", "radial axes have no common scale, so values are hard to compare (Cleveland & McGill 1984)", true
	case "3d", "bar3d", "pie3d":
		return "bars", "perspective changes the lengths it draws, so a 3-D bar or slice misstates its value", true
	case "gauge", "dial", "speedometer":
		return "bars (or dots with --from and --to)", "an angle on a dial is read less accurately than a position on a scale (Cleveland & McGill 1984)", true
	case "column", "columns":
		return "bars --vertical", "plumb calls upright bars bars --vertical; horizontal bars read long labels better", true
	}
	return "", "", false
}

// unknownChart is the usage error for a command plumb does not know: the
// nearest name when it is a slip of the keyboard, the closest honest chart
// when it names one plumb does not draw.
func unknownChart(name string) error {
	if instead, why, ok := notDrawn(name); ok {
		return usagef("%q is not a plumb chart: use plumb %s, because %s", name, instead, why)
	}
	if best, ok := suggest.Closest(name, commands()); ok {
		return usagef("unknown chart %q: did you mean %q?", name, best)
	}
	return usagef("unknown chart %q", name)
}

// version reports the module version from the build information ("(devel)"
// for a build from a source tree) and the VCS revision when Go recorded it.
func version() string {
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return "plumb (unknown version)"
	}
	v := bi.Main.Version
	if v == "" {
		v = "(devel)"
	}
	var rev, modified string
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			if s.Value == "true" {
				modified = ", modified"
			}
		}
	}
	out := "plumb " + v
	if rev != "" {
		out += " (" + rev + modified + ")"
	}
	return out + " " + bi.GoVersion
}

// usage is plumb's usage text; its list of charts comes from the command
// table.
func usage() string {
	return "usage: plumb CHART [DATA] [flags]\n\ncharts:\n" + chartList() + usageNotes
}

const usageNotes = `

Notes on standard error say what plumb changed or left out, each naming its
figure; --explain adds routine decisions, --quiet prints none.

plumb --version prints the version.
Run 'plumb CHART -h' for the flags of one chart.`

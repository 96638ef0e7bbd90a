package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"sync"

	"plumb/render"
)

// Running plumb figure: each file paired with its output, several files
// rendered at once, a progress line on a terminal, and the notes and
// errors printed in the order the files were given.

// figureJob is one figure file to render and what came of it.
type figureJob struct {
	in, out string
	alt     bool   // --alt: keep the description; without -o, write no figure
	desc    string // the figure's <desc>, kept under --alt
	notes   []render.Note
	err     error
}

// runFigure is plumb figure: read each figure file, plan its panels and
// render it, in parallel for several files.
func runFigure(args []string, _ io.Reader, stdout, stderr io.Writer) int {
	var out string
	var quiet, explain, alt bool
	defs := []flagDef{
		{name: "o", arg: "FILE|DIR", usage: "write the figure to FILE (.svg), or each NAME.json to DIR/NAME.svg (needed for several files; a folder is made); none: standard output", value: stringValue{&out}},
		{name: "quiet", usage: "print no notes on standard error (errors still print)", value: boolValue{&quiet}},
		{name: "explain", usage: "also print routine decisions on standard error; the SVG's metadata always has them", value: boolValue{&explain}},
		{name: "alt", usage: "print each figure's plain-language description (its <desc>) on standard output, after the figure's name when there are several; without -o only the text is printed", value: boolValue{&alt}},
	}
	fs := newTableFlagSet("figure", figureSynopsis, defs, stderr)
	files, err := parse(fs, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	jobs, err := figureJobs(files, out)
	if err != nil {
		return exitCode(err, stderr)
	}
	level := (&shared{quiet: quiet, explain: explain}).level()
	for _, j := range jobs {
		j.alt = alt
	}
	renderFigures(jobs, stdout, progress(stderr, len(jobs)), runtime.GOMAXPROCS(0))
	code := exitOK
	for _, j := range jobs {
		if alt && j.err == nil {
			if len(jobs) > 1 {
				fmt.Fprintln(stdout, terminalSafe(j.out)+": "+j.desc)
			} else {
				fmt.Fprintln(stdout, j.desc)
			}
		}
		printNotes(stderr, describeOutput(j.out, j.in), j.notes, level)
		if j.err != nil {
			printError(stderr, j.err)
			code = max(code, exitData)
			var ue *usageError
			if errors.As(j.err, &ue) {
				code = exitUsage
			}
		}
	}
	return code
}

// figureJobs pairs each figure file with its output: standard output or
// -o FILE for one file, DIR/NAME.svg under -o DIR.
func figureJobs(files []string, out string) ([]*figureJob, error) {
	if len(files) == 0 {
		return nil, usagef("give one or more figure files (FILE.json); see plumb figure -h")
	}
	st, statErr := os.Stat(out)
	toDir := len(files) > 1 || strings.HasSuffix(out, "/") || strings.HasSuffix(out, string(filepath.Separator)) || (out != "" && statErr == nil && st.IsDir())
	if toDir && (out == "" || out == "-") {
		return nil, usagef("%d figure files need -o DIR: each NAME.json is written to DIR/NAME.svg", len(files))
	}
	jobs := make([]*figureJob, len(files))
	seen := map[string]string{}
	for i, f := range files {
		if f == "-" {
			return nil, usagef("give figure files by name: their data paths are relative to them, so standard input cannot be one")
		}
		j := &figureJob{in: f, out: out}
		if toDir {
			name := strings.TrimSuffix(filepath.Base(f), filepath.Ext(f))
			if prev, ok := seen[name]; ok {
				return nil, usagef("%s and %s would both be written to %s.svg; rename one", prev, f, name)
			}
			seen[name] = f
			j.out = filepath.Join(out, name+".svg")
		} else if err := checkFigurePath(out); err != nil {
			return nil, err
		}
		jobs[i] = j
	}
	if toDir {
		if err := os.MkdirAll(out, 0o755); err != nil {
			return nil, &outputError{out, bareCause(err)}
		}
	}
	return jobs, nil
}

// renderFigures renders every job with at most workers at once; each job
// is alone in its files, so the bytes do not depend on the order of work.
// done is called once per finished job.
func renderFigures(jobs []*figureJob, stdout io.Writer, done func(), workers int) {
	workers = max(1, min(workers, len(jobs)))
	next := make(chan *figureJob)
	var wg sync.WaitGroup
	for range workers {
		wg.Go(func() {
			for j := range next {
				j.notes, j.err = renderFigure(j, stdout)
				done()
			}
		})
	}
	for _, j := range jobs {
		next <- j
	}
	close(next)
	wg.Wait()
}

// renderFigure reads, plans and writes one figure file.
func renderFigure(j *figureJob, stdout io.Writer) ([]render.Note, error) {
	spec, err := readFigure(j.in)
	if err != nil {
		return nil, err
	}
	s, err := render.FigureScene(spec.opt, spec.panels...)
	if err != nil {
		return spec.notes, &figureError{fmt.Sprintf("%s: %s", j.in, figureWords(err, spec))}
	}
	j.desc = s.Desc
	if j.alt && (j.out == "" || j.out == "-") {
		return s.Notes, nil // --alt without -o: the description is the output
	}
	// writeFigure draws PNG for a .png name and SVG otherwise.
	err = writeFigure(j.out, 1, stdout, func(w io.Writer) error { return render.WriteSVG(w, s) })
	if err != nil {
		return s.Notes, fmt.Errorf("figure %s: %w", j.in, err)
	}
	return s.Notes, nil
}

// figureWords says a figure's drawing error in the file's words: the
// panel by its JSON path (render names it by its title) and the option
// names as the figure file's keys.
func figureWords(err error, spec *figureSpec) string {
	msg := err.Error()
	var oe *render.OptionError
	if errors.As(err, &oe) {
		if name, ok := spec.opt.Names[oe.Option]; ok {
			msg = strings.Replace(msg, oe.Error(), (&render.OptionError{Option: name, Value: oe.Value, Err: oe.Err}).Error(), 1)
		}
	}
	for i, p := range spec.panels {
		if head := fmt.Sprintf("panel %q: ", p.Title); p.Title != "" && strings.HasPrefix(msg, head) {
			return fmt.Sprintf("panels[%d] (%q): %s", i, p.Title, strings.TrimPrefix(msg, head))
		}
	}
	return msg
}

// progress returns what renderFigures calls as each figure is done: on a
// terminal one line, rewritten in place ("plumb: figure 3 of 10"), and
// wiped at the end; when stderr is not a terminal, nothing, so that logs
// and pipes hold only the notes and errors.
func progress(stderr io.Writer, n int) func() {
	if n < 2 || !isTerminal(stderr) {
		return func() {}
	}
	var mu sync.Mutex
	k := 0
	return func() {
		mu.Lock()
		defer mu.Unlock()
		k++
		if k == n {
			fmt.Fprint(stderr, "\r\x1b[K")
			return
		}
		fmt.Fprintf(stderr, "\rplumb: figure %d of %d", k, n)
	}
}

// isTerminal reports whether w is a terminal: a character device, which
// pipes, files and test buffers are not.
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0 && st.Mode()&os.ModeDevice != 0
}

package main

import (
	"errors"
	"io"
	"io/fs"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"time"
)

// Output files.
//
// A figure goes to standard output ("" or "-"), straight into a file that is
// not a regular file (a FIFO, a terminal, /dev/null, or /dev/stdout when it
// leads to a pipe), or, for a regular file, into a temporary file beside it
// that is renamed over it only once everything was written. A symbolic link
// is followed: its target is replaced and the link kept.
//
// Temporary files are named ".NAME.plumb-PID-RANDOM.tmp" (NAME shortened to
// 100 bytes), so that a later run can recognise leftovers of its own kind.
// They are registered with the run's session, which removes them when the
// run fails or is interrupted by a signal. A run killed outright (kill -9,
// the out-of-memory killer) cannot clean up; the next run writing the same
// file removes every such leftover that is older than itself and whose PID
// names no live process on this machine (see removeStale). Files of any
// other name are never touched.

// checkFigurePath says whether path names a figure plumb can write: "" and
// "-" (standard output, SVG), a name ending in .svg or .png, or a name with
// no extension (SVG). Any other extension is refused, so that a figure
// never lands in a file that names another format.
func checkFigurePath(path string) error {
	if path == "" || path == "-" {
		return nil
	}
	switch ext := strings.ToLower(filepath.Ext(path)); ext {
	case ".svg", ".png", "":
		return nil
	default:
		return usagef("-o %s: plumb cannot write %q files; name the figure .svg or .png (no extension: SVG)", path, ext)
	}
}

// outputError is a failure to write the user's output file. It names the
// path the user gave, never a temporary file, and wraps the bare cause
// (such as syscall.ENOSPC) for errors.Is.
type outputError struct {
	path string
	err  error
}

func (e *outputError) Error() string { return "cannot write " + e.path + ": " + e.err.Error() }
func (e *outputError) Unwrap() error { return e.err }

// bareCause strips the operation and file name from an error of the os
// package, which would otherwise name the temporary file.
func bareCause(err error) error {
	var pe *fs.PathError
	var le *os.LinkError
	var se *os.SyscallError
	switch {
	case errors.As(err, &pe):
		return pe.Err
	case errors.As(err, &le):
		return le.Err
	case errors.As(err, &se):
		return se.Err
	}
	return err
}

// fileWriter writes to an open output file and reports failures under the
// user's path.
type fileWriter struct {
	f    *os.File
	path string
}

func (w *fileWriter) Write(p []byte) (int, error) {
	n, err := w.f.Write(p)
	if err != nil {
		err = &outputError{w.path, bareCause(err)}
	}
	return n, err
}

// writeOutput sends a figure to path, or to stdout when path is "" or "-".
// stdout is the run's session when the call comes from run, which is how
// the temporary file is found and removed if a signal interrupts the run.
func writeOutput(path string, stdout io.Writer, write func(io.Writer) error) error {
	if path == "" || path == "-" {
		return write(stdout)
	}
	if isPNG(path) {
		inner := write
		write = func(w io.Writer) error { return inner(&pngGuard{w: w}) }
	}
	s, _ := stdout.(*session)
	st, err := os.Stat(path)
	switch {
	case err == nil && st.IsDir():
		return &outputError{path, errors.New("it is a folder; give a file name")}
	case err == nil && !st.Mode().IsRegular():
		return writeDirect(path, 0, write)
	case err != nil && !errors.Is(err, fs.ErrNotExist):
		return &outputError{path, bareCause(err)}
	}
	target, viaProc, err := resolveLinks(path)
	if err != nil {
		return &outputError{path, err}
	}
	if viaProc && st != nil {
		// /dev/stdout or /proc/self/fd/N leading to a regular file: that
		// file is open in the shell (plumb -o /dev/stdout >> log), so
		// appending is the only write that keeps its meaning.
		return writeDirect(path, os.O_APPEND, write)
	}
	return writeReplacing(s, path, target, write)
}

// writeDirect writes into an existing file that must not be replaced: a
// FIFO, a device or a file reached through /proc. No temporary file.
func writeDirect(path string, flag int, write func(io.Writer) error) error {
	f, err := os.OpenFile(path, os.O_WRONLY|flag, 0)
	if err != nil {
		return &outputError{path, bareCause(err)}
	}
	if err := write(&fileWriter{f, path}); err != nil {
		f.Close()
		return err
	}
	if err := f.Close(); err != nil {
		return &outputError{path, bareCause(err)}
	}
	return nil
}

// writeReplacing writes target (the file path names, after symbolic links)
// through a temporary file in target's folder and renames it into place.
// A replaced file keeps its permission bits (and, where allowed, its owner);
// a new file is created with 0666 and the kernel applies the umask and any
// default ACL of the folder, exactly as for a file the shell creates.
func writeReplacing(s *session, path, target string, write func(io.Writer) error) error {
	old, err := os.Stat(target)
	if err != nil && !errors.Is(err, fs.ErrNotExist) {
		return &outputError{path, bareCause(err)}
	}
	if err == nil && !old.Mode().IsRegular() {
		return writeDirect(path, 0, write)
	}
	if err != nil {
		old = nil
	}
	s.removeStale(target)
	perm := fs.FileMode(0o666)
	if old != nil {
		perm = 0o600 // private until the old mode is copied, after the data
	}
	tmp, name, err := createTemp(s, target, perm)
	if err != nil {
		return &outputError{path, bareCause(err)}
	}
	done := false
	defer func() {
		// Every way out but success removes the temporary file, a panic
		// in a chart builder included.
		if !done {
			tmp.Close()
			s.remove(name)
		}
	}()
	if err := write(&fileWriter{tmp, path}); err != nil {
		return err
	}
	if old != nil {
		keepOwner(tmp, old)
		// The permission bits only: set-user-ID and set-group-ID bits are
		// not carried over to content plumb wrote.
		if err := tmp.Chmod(old.Mode().Perm()); err != nil {
			return &outputError{path, bareCause(err)}
		}
	}
	if err := tmp.Sync(); err != nil {
		return &outputError{path, bareCause(err)}
	}
	if err := tmp.Close(); err != nil {
		return &outputError{path, bareCause(err)}
	}
	if err := s.rename(name, target); err != nil {
		return &outputError{path, bareCause(err)}
	}
	done = true
	syncDir(filepath.Dir(target))
	return nil
}

// tempMark sits between the target's name and the PID in a temporary
// file's name.
const tempMark = ".plumb-"

// tempPrefix is the start of every temporary file name for target:
// ".NAME.plumb-", NAME cut to 100 bytes so that the whole name stays within
// the 255 bytes most file systems allow.
func tempPrefix(target string) string {
	base := filepath.Base(target)
	if len(base) > 100 {
		base = base[:100]
	}
	return "." + base + tempMark
}

// createTemp creates a new temporary file beside target, registered with
// the session in the same step, so that a signal never finds a file it does
// not know of.
func createTemp(s *session, target string, perm fs.FileMode) (*os.File, string, error) {
	prefix := filepath.Join(filepath.Dir(target), tempPrefix(target)) + strconv.Itoa(os.Getpid()) + "-"
	for range 100 {
		name := prefix + strconv.FormatUint(uint64(rand.Uint32()), 10) + ".tmp"
		f, err := s.create(name, perm)
		if err == nil {
			return f, name, nil
		}
		if !errors.Is(err, fs.ErrExist) {
			return nil, "", err
		}
	}
	return nil, "", errors.New("no free temporary name in the folder")
}

// resolveLinks follows symbolic links from path to the file that is to be
// written, which may not exist yet (a dangling link names the file to
// create). viaProc reports a link into /proc, such as /dev/stdout.
func resolveLinks(path string) (target string, viaProc bool, err error) {
	p := path
	for range 64 {
		if abs, err := filepath.Abs(p); err == nil && strings.HasPrefix(abs, "/proc/") {
			viaProc = true
		}
		fi, err := os.Lstat(p)
		if errors.Is(err, fs.ErrNotExist) || (err == nil && fi.Mode()&fs.ModeSymlink == 0) {
			if err == nil {
				// filepath.EvalSymlinks also resolves links among the
				// folders, so that the temporary file and the target
				// share one folder as seen by rename.
				if real, err := filepath.EvalSymlinks(p); err == nil {
					p = real
				}
			}
			return p, viaProc, nil
		}
		if err != nil {
			return "", false, bareCause(err)
		}
		link, err := os.Readlink(p)
		if err != nil {
			return "", false, bareCause(err)
		}
		if !filepath.IsAbs(link) {
			link = filepath.Join(filepath.Dir(p), link)
		}
		p = link
	}
	return "", false, errors.New("too many levels of symbolic links")
}

// removeStale deletes leftovers of earlier runs for target: temporary files
// of plumb's own pattern whose PID is not a live process on this machine
// and which were last modified before this run started. A run still writing
// (ours or another live one) is never disturbed. Failures are ignored: a
// leftover is untidy, not wrong.
func (s *session) removeStale(target string) {
	dir := filepath.Dir(target)
	prefix := tempPrefix(target)
	d, err := os.Open(dir)
	if err != nil {
		return
	}
	names, _ := d.Readdirnames(-1)
	d.Close()
	start := time.Now()
	if s != nil {
		start = s.start
	}
	for _, n := range names {
		rest, ok := strings.CutPrefix(n, prefix)
		if !ok || !strings.HasSuffix(rest, ".tmp") {
			continue
		}
		pidText, _, ok := strings.Cut(rest, "-")
		pid, err := strconv.Atoi(pidText)
		if !ok || err != nil || pid <= 0 || pid == os.Getpid() {
			continue
		}
		p := filepath.Join(dir, n)
		fi, err := os.Lstat(p)
		if err != nil || !fi.Mode().IsRegular() || !fi.ModTime().Before(start) || processAlive(pid, fi.ModTime()) {
			continue
		}
		os.Remove(p)
	}
}

// syncDir makes a rename durable where the system allows it; it is best
// effort, as the figure is already complete under its name.
func syncDir(dir string) {
	if d, err := os.Open(dir); err == nil {
		d.Sync()
		d.Close()
	}
}

// describeOutput is how notes name the figure they belong to: the -o path,
// or, for standard output, the data file ("<stdin>" for standard input).
func describeOutput(out, data string) string {
	switch {
	case out != "" && out != "-":
		return out
	case data == "" || data == "-":
		return "<stdin>"
	}
	return data
}

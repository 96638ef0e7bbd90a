//go:build unix

package main

import (
	"bytes"
	"errors"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"syscall"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// entries lists a folder's names, temporary files included.
func entries(t *testing.T, dir string) []string {
	t.Helper()
	es, err := os.ReadDir(dir)
	require.NoError(t, err)
	var names []string
	for _, e := range es {
		names = append(names, e.Name())
	}
	return names
}

func TestOutputThroughSymlinkKeepsLink(t *testing.T) {
	dir := t.TempDir()
	real := filepath.Join(dir, "figures", "revenue.svg")
	require.NoError(t, os.MkdirAll(filepath.Dir(real), 0o755))
	require.NoError(t, os.WriteFile(real, []byte("old"), 0o640))
	link := filepath.Join(dir, "latest.svg")
	require.NoError(t, os.Symlink("figures/revenue.svg", link))

	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", link)
	require.Equal(t, exitOK, code, stderr)

	fi, err := os.Lstat(link)
	require.NoError(t, err)
	assert.Equal(t, os.ModeSymlink, fi.Mode()&os.ModeSymlink, "the link is still a link")
	got, err := os.ReadFile(real)
	require.NoError(t, err)
	assert.True(t, strings.HasPrefix(string(got), "<?xml"), "the target holds the figure")
	st, err := os.Stat(real)
	require.NoError(t, err)
	assert.Equal(t, os.FileMode(0o640), st.Mode().Perm(), "the replaced target keeps its mode")
	assert.ElementsMatch(t, []string{"revenue.svg"}, entries(t, filepath.Dir(real)), "no temporary file left beside the target")
	assert.ElementsMatch(t, []string{"figures", "latest.svg"}, entries(t, dir), "no temporary file beside the link")
}

func TestOutputThroughDanglingSymlinkCreatesTarget(t *testing.T) {
	dir := t.TempDir()
	link := filepath.Join(dir, "latest.svg")
	require.NoError(t, os.Symlink("new.svg", link))
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", link)
	require.Equal(t, exitOK, code, stderr)
	fi, err := os.Lstat(link)
	require.NoError(t, err)
	assert.NotZero(t, fi.Mode()&os.ModeSymlink)
	got, err := os.ReadFile(filepath.Join(dir, "new.svg"))
	require.NoError(t, err)
	assert.Contains(t, string(got), "<svg")
}

func TestOutputToFIFOWritesDirectly(t *testing.T) {
	dir := t.TempDir()
	fifo := filepath.Join(dir, "pipe.svg")
	require.NoError(t, syscall.Mkfifo(fifo, 0o600))
	read := make(chan []byte, 1)
	go func() {
		f, err := os.Open(fifo) // blocks until plumb opens the other end
		if err != nil {
			read <- nil
			return
		}
		b, _ := io.ReadAll(f)
		f.Close()
		read <- b
	}()
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", fifo)
	require.Equal(t, exitOK, code, stderr)
	select {
	case b := <-read:
		assert.True(t, strings.HasPrefix(string(b), "<?xml"), "the reader got the figure")
	case <-time.After(10 * time.Second):
		t.Fatal("nothing arrived through the FIFO")
	}
	fi, err := os.Lstat(fifo)
	require.NoError(t, err)
	assert.NotZero(t, fi.Mode()&os.ModeNamedPipe, "the FIFO is still a FIFO, not replaced by a file")
	assert.ElementsMatch(t, []string{"pipe.svg"}, entries(t, dir))
}

func TestOutputModes(t *testing.T) {
	dir := t.TempDir()
	private := writeFile(t, dir, "private.svg", "old")
	require.NoError(t, os.Chmod(private, 0o600))
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", private)
	require.Equal(t, exitOK, code, stderr)
	st, err := os.Stat(private)
	require.NoError(t, err)
	assert.Equal(t, os.FileMode(0o600), st.Mode().Perm(), "a private file stays private")

	// A new file follows the umask, as a file the shell creates would.
	mask := syscall.Umask(0o027)
	defer syscall.Umask(mask)
	fresh := filepath.Join(dir, "fresh.svg")
	code, _, stderr = plumb(t, eightRegions, "bars", "-", "-o", fresh)
	require.Equal(t, exitOK, code, stderr)
	st, err = os.Stat(fresh)
	require.NoError(t, err)
	assert.Equal(t, os.FileMode(0o640), st.Mode().Perm())
}

func TestOutputFailureNamesUserPathOnly(t *testing.T) {
	dir := t.TempDir()
	ro := filepath.Join(dir, "ro")
	require.NoError(t, os.Mkdir(ro, 0o755))
	target := filepath.Join(ro, "fig.svg")
	// A folder that does not exist: the temporary file cannot be created
	// (this fails as root too, unlike a read-only folder).
	require.NoError(t, os.Mkdir(filepath.Join(ro, "sub"), 0o755))
	err := writeOutput(filepath.Join(ro, "sub", "x", "fig.svg"), newSession(io.Discard), func(w io.Writer) error {
		_, err := io.WriteString(w, "data")
		return err
	})
	require.Error(t, err)
	assert.NotContains(t, err.Error(), ".tmp")
	assert.Contains(t, err.Error(), filepath.Join("sub", "x", "fig.svg"))

	// A failing draw leaves no temporary file and names nothing else.
	boom := errors.New("boom")
	err = writeOutput(target, newSession(io.Discard), func(w io.Writer) error {
		io.WriteString(w, "partial")
		return boom
	})
	assert.ErrorIs(t, err, boom)
	assert.ElementsMatch(t, []string{"sub"}, entries(t, ro))

	// Nor does a panic in the drawing.
	func() {
		defer func() { assert.NotNil(t, recover()) }()
		writeOutput(target, newSession(io.Discard), func(w io.Writer) error {
			io.WriteString(w, "partial")
			panic("a bug in a chart builder")
		})
	}()
	assert.ElementsMatch(t, []string{"sub"}, entries(t, ro))

	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", ro)
	assert.Equal(t, exitData, code)
	assert.Contains(t, stderr, "cannot write "+ro+": it is a folder")
}

func TestOutputRemovesStaleLeftovers(t *testing.T) {
	dir := t.TempDir()
	out := filepath.Join(dir, "fig.svg")
	// A PID that was alive and is now gone: a finished child process.
	cmd := exec.Command("true")
	require.NoError(t, cmd.Run())
	dead := cmd.Process.Pid
	old := time.Now().Add(-time.Hour)
	stale := writeFile(t, dir, ".fig.svg.plumb-"+strconv.Itoa(dead)+"-123.tmp", "killed run")
	require.NoError(t, os.Chtimes(stale, old, old))
	live := writeFile(t, dir, ".fig.svg.plumb-"+strconv.Itoa(os.Getppid())+"-456.tmp", "a run still writing")
	require.NoError(t, os.Chtimes(live, old, old))
	other := writeFile(t, dir, ".other.svg.plumb-"+strconv.Itoa(dead)+"-789.tmp", "another figure's")
	require.NoError(t, os.Chtimes(other, old, old))
	mine := writeFile(t, dir, "notes.tmp", "the user's own file")
	require.NoError(t, os.Chtimes(mine, old, old))

	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	assert.NoFileExists(t, stale, "a dead run's leftover for this figure is removed")
	assert.FileExists(t, live, "a live process's file is kept")
	assert.FileExists(t, other, "only leftovers for this figure are touched")
	assert.FileExists(t, mine)
}

func TestFigureExtensionChoosesFormat(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct {
		name, want string
		code       int
	}{
		{"fig.svg", "", exitOK},
		{"fig.SVG", "", exitOK},
		{"fig", "", exitOK},
		{"fig.png", "", exitOK},
		{"fig.PNG", "", exitOK},
		{"fig.pdf", `plumb cannot write ".pdf" files`, exitUsage},
	} {
		t.Run(tc.name, func(t *testing.T) {
			out := filepath.Join(dir, tc.name)
			code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", out)
			require.Equal(t, tc.code, code, stderr)
			if tc.code == exitOK {
				b, err := os.ReadFile(out)
				require.NoError(t, err)
				png := strings.EqualFold(filepath.Ext(out), ".png")
				assert.Equal(t, png, bytes.HasPrefix(b, []byte("\x89PNG\r\n\x1a\n")), "the bytes are the format the name says")
				assert.Equal(t, !png, bytes.Contains(b, []byte("<svg")))
			}
			if tc.code != exitOK {
				assert.Contains(t, stderr, tc.want)
				assert.NoFileExists(t, out, "no SVG bytes in a file of another format")
			}
		})
	}
}

// TestSignalRemovesTemporaryFile builds plumb, lets it draw a large line
// chart into a file, sends SIGTERM while the temporary file exists, and
// checks that the run died and left nothing behind.
func TestSignalRemovesTemporaryFile(t *testing.T) {
	if testing.Short() {
		t.Skip("builds the binary")
	}
	dir := t.TempDir()
	bin := filepath.Join(dir, "plumb")
	build := exec.Command("go", "build", "-o", bin, ".")
	build.Stderr = os.Stderr
	require.NoError(t, build.Run())

	data := linesCSV(linesBenchRows)
	for attempt := range 4 {
		out := filepath.Join(dir, "fig.svg")
		cmd := exec.Command(bin, "lines", "-", "--format", "csv", "-o", out)
		stdin, err := cmd.StdinPipe()
		require.NoError(t, err)
		require.NoError(t, cmd.Start())
		go func() {
			for range 1 << attempt {
				stdin.Write(data)
			}
			stdin.Close()
		}()
		done := make(chan error, 1)
		go func() { done <- cmd.Wait() }()
		signalled := false
	poll:
		for {
			select {
			case err = <-done:
				break poll
			default:
			}
			if !signalled {
				if names, _ := filepath.Glob(filepath.Join(dir, ".fig.svg.plumb-*.tmp")); len(names) > 0 {
					require.NoError(t, cmd.Process.Signal(syscall.SIGTERM))
					signalled = true
				}
			}
			time.Sleep(200 * time.Microsecond)
		}
		if !signalled {
			// The run finished before the temporary file was seen: try
			// again with more data, so the write takes longer.
			os.Remove(out)
			continue
		}
		require.Error(t, err, "a terminated run does not exit 0")
		var ee *exec.ExitError
		require.ErrorAs(t, err, &ee)
		if ws, ok := ee.Sys().(syscall.WaitStatus); ok {
			assert.True(t, ws.Signaled() && ws.Signal() == syscall.SIGTERM, "killed by SIGTERM: %v", ws)
		}
		leftovers, _ := filepath.Glob(filepath.Join(dir, "*.tmp")) // Glob's * matches a leading dot
		assert.Empty(t, leftovers)
		return
	}
	t.Skip("the run always finished before its temporary file could be seen")
}

// TestOutputToDeviceWritesDirectly makes its own character device, a copy
// of the null device, inside the test's folder (root only), and checks that
// -o writes into it rather than replacing it with a plain file. The
// system's /dev/null is never touched.
func TestOutputToDeviceWritesDirectly(t *testing.T) {
	dir := t.TempDir()
	dev := filepath.Join(dir, "null")
	// Linux's null device is character device 1:3 (devices.txt in the
	// kernel documentation); makedev packs major 1, minor 3 as 0x103.
	if err := syscall.Mknod(dev, syscall.S_IFCHR|0o666, 0x103); err != nil {
		t.Skipf("cannot make a device node here: %v", err)
	}
	code, _, stderr := plumb(t, eightRegions, "bars", "-", "-o", dev)
	require.Equal(t, exitOK, code, stderr)
	fi, err := os.Lstat(dev)
	require.NoError(t, err)
	assert.NotZero(t, fi.Mode()&os.ModeCharDevice, "still a device, not a plain file")
	assert.ElementsMatch(t, []string{"null"}, entries(t, dir), "no temporary file")
}

package main

import (
	"bytes"
	"flag"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden files in golden/ from the current output")

const goldenDir = "../../golden"

// TestGolden renders the demo gallery and compares every figure byte for
// byte with golden/. Review a changed golden file as a picture before
// accepting it with -update (see DEVELOPERS.md).
func TestGolden(t *testing.T) {
	dir := t.TempDir()
	var stderr bytes.Buffer
	if code := run([]string{"demo", "-o", dir}, nil, &bytes.Buffer{}, &stderr); code != exitOK {
		t.Fatalf("demo exited %d: %s", code, stderr.String())
	}
	files, _ := filepath.Glob(filepath.Join(dir, "*.svg"))
	if len(files) < len(gallery) {
		t.Fatalf("demo wrote %d figures, want at least %d", len(files), len(gallery))
	}
	for _, path := range files {
		name := filepath.Base(path)
		t.Run(strings.TrimSuffix(name, ".svg"), func(t *testing.T) {
			got, err := os.ReadFile(path)
			if err != nil {
				t.Fatal(err)
			}
			root := checkFigure(t, got)
			if strings.HasPrefix(name, "bars-") {
				checkBars(t, root)
			}
			renderable(t, path)
			matchGolden(t, filepath.Join(goldenDir, name), got)
		})
	}
}

// renderable asserts that a real SVG renderer draws the file.
func renderable(t *testing.T, path string) {
	t.Helper()
	bin, err := exec.LookPath("rsvg-convert")
	if err != nil {
		t.Skip("rsvg-convert not installed (Debian: librsvg2-bin); .ci/run installs it")
	}
	out := filepath.Join(t.TempDir(), "out.png")
	cmd := exec.Command(bin, "-o", out, path)
	if msg, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("rsvg-convert cannot render %s: %v\n%s", filepath.Base(path), err, msg)
	}
	if st, err := os.Stat(out); err != nil || st.Size() == 0 {
		t.Fatalf("rsvg-convert wrote no image for %s", filepath.Base(path))
	}
}

// matchGolden compares a figure with its golden file, or rewrites the file
// under -update.
func matchGolden(t *testing.T, golden string, got []byte) {
	t.Helper()
	if *update {
		if err := os.WriteFile(golden, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(golden)
	if err != nil {
		t.Fatalf("no golden file (run go test ./cmd/plumb -update and review it): %v", err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("%s differs from the golden file; view both as pictures, then accept with -update if the change is intended", filepath.Base(golden))
	}
}

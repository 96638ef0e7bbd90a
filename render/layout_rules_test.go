package render

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestFilesStaySmall keeps every file of the package readable in one
// sitting: a builder that outgrows about 600 lines is split by job (the
// panel layer, its figures; a chart's plan, its marks).
func TestFilesStaySmall(t *testing.T) {
	files, err := filepath.Glob("*.go")
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range files {
		if strings.HasSuffix(f, "_test.go") {
			continue
		}
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		if n := bytes.Count(b, []byte("\n")); n > 600 {
			t.Errorf("%s has %d lines: split it by job", f, n)
		}
	}
}

package main

import (
	"io"
	"os"
	"path/filepath"
	"testing"
)

// BenchmarkBarsCLI is the whole of "plumb bars data.csv --label route
// --value value" on the million-row input of BenchmarkParseOnly: read, aggregate
// 1,000 labels, fold all but the top 11 into Other, lay out and write the
// SVG. Compare its ns/op with BenchmarkParseOnly; the target is at most 2x.
func BenchmarkBarsCLI(b *testing.B) {
	data := benchCSV()
	path := filepath.Join(b.TempDir(), "routes.csv")
	if err := os.WriteFile(path, data, 0o644); err != nil {
		b.Fatal(err)
	}
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	args := []string{"bars", path, "--label", "route", "--value", "value", "--quiet"}
	for b.Loop() {
		if code := run(args, nil, io.Discard, io.Discard); code != exitOK {
			b.Fatalf("exit %d", code)
		}
	}
}

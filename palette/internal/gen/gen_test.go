package main

import (
	"bytes"
	"os"
	"regexp"
	"strconv"
	"testing"
)

// TestTablesUpToDate regenerates the tables and compares them byte for byte
// with the committed palette/tables.go, so that a change to the design code
// without `go generate` (or a hand edit of a table) fails.
//
// The categorical search anneals annealDesign.runs times (about half a
// minute); the test re-runs only the run that the table says won, which
// reproduces the palette, its order and every other table exactly. Whether
// that run is still the best of all is checked by `go generate ./palette`
// itself, which runs them all and would write a different table.
func TestTablesUpToDate(t *testing.T) {
	want, err := os.ReadFile("../../tables.go")
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`found by annealing run (\d+) of (\d+)`).FindSubmatch(want)
	if m == nil {
		t.Fatal("palette/tables.go does not name its annealing run: run go generate ./palette")
	}
	run, _ := strconv.Atoi(string(m[1]))
	if total, _ := strconv.Atoi(string(m[2])); total != annealDesign.runs || run >= total {
		t.Fatalf("palette/tables.go names run %d of %d, the design has %d runs: run go generate ./palette", run, total, annealDesign.runs)
	}
	got, err := generate([]int{run})
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Error("palette/tables.go is stale: run go generate ./palette")
	}
}

package main

import (
	"bytes"
	"os"
	"testing"
)

// TestTablesUpToDate regenerates the tables and compares them byte for byte
// with the committed palette/tables.go, so that a change to the design code
// without `go generate` (or a hand edit of the table) fails.
func TestTablesUpToDate(t *testing.T) {
	if testing.Short() {
		t.Skip("regenerating takes several seconds")
	}
	want, err := os.ReadFile("../../tables.go")
	if err != nil {
		t.Fatal(err)
	}
	got, err := generate()
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Error("palette/tables.go is stale: run go generate ./palette")
	}
}

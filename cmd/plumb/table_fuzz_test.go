package main

import (
	"bytes"
	"errors"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// FuzzReadTable feeds arbitrary bytes as CSV, TSV and JSON. Whatever the
// input, ReadTable and Numbers must not panic, every error must be a
// *DataError with a one-line message, and a table must be self-consistent.
func FuzzReadTable(f *testing.F) {
	fixtures, _ := filepath.Glob("../../testdata/data/*")
	for _, name := range fixtures {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data, uint8(strings.Index("csvtsvjson", strings.TrimPrefix(filepath.Ext(name), "."))/3))
	}
	f.Add([]byte("a,b\n1,\"x\ny\"\n"), uint8(0))
	f.Add([]byte("a\tb\n1\t2\n"), uint8(1))
	f.Add([]byte(`[{"a": 1, "b": [1, {"c": null}]}, {"a": "NA"}]`), uint8(2))
	formats := []string{"csv", "tsv", "json"}
	f.Fuzz(func(t *testing.T, data []byte, format uint8) {
		name := "fuzz." + formats[int(format)%len(formats)]
		tab, err := ReadTable(bytes.NewReader(data), name, "", nil)
		if err != nil {
			checkDataError(t, err)
			return
		}
		if tab.Len() == 0 {
			t.Fatal("a table without rows should be ErrEmpty")
		}
		prev := 0
		for i := range tab.Len() {
			line := tab.Line(i)
			if line <= prev {
				t.Fatalf("row %d on line %d after line %d", i, line, prev)
			}
			prev = line
		}
		for _, col := range tab.Header {
			cells := tab.Strings(col)
			if col != "" && len(cells) != tab.Len() {
				t.Fatalf("column %q has %d cells for %d rows", col, len(cells), tab.Len())
			}
			vals, missing, err := tab.Numbers(col)
			if err != nil {
				checkDataError(t, err)
				continue
			}
			if len(vals) != tab.Len() || len(missing) > len(vals) {
				t.Fatalf("Numbers(%q): %d values, %d missing, %d rows", col, len(vals), len(missing), tab.Len())
			}
		}
	})
}

func checkDataError(t *testing.T, err error) {
	t.Helper()
	var de *DataError
	if !errors.As(err, &de) {
		t.Fatalf("error %T %v is not a *DataError", err, err)
	}
	if msg := err.Error(); strings.ContainsAny(msg, "\r\n") {
		t.Fatalf("message is not one line: %q", msg)
	}
}

// FuzzFastDecimal checks the fast path against strconv.ParseFloat, the
// independent reference: whenever fastDecimal accepts a cell, ParseFloat
// must accept it too and give the very same float64.
func FuzzFastDecimal(f *testing.F) {
	for _, s := range []string{"0", "-0", "1234.56", ".5", "5.", "9007199254740992", "9007199254740993",
		"0.1", "-123456789012345.678", "1e5", "0.0000000000000000000001", "+7.25", "."} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		got, ok := fastDecimal(s)
		if !ok {
			return
		}
		want, err := strconv.ParseFloat(s, 64)
		if err != nil || math.Float64bits(got) != math.Float64bits(want) {
			t.Fatalf("fastDecimal(%q) = %v, ParseFloat = %v, %v", s, got, want, err)
		}
	})
}

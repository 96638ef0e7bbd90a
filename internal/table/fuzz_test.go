package table

import (
	"bytes"
	"errors"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"
)

// fuzzSeeds are the inputs every reading fuzz target starts from: the
// fixtures and a few hand-made edge cases.
func fuzzSeeds(f *testing.F) [][]byte {
	fixtures, _ := filepath.Glob("../../testdata/data/*")
	var out [][]byte
	for _, name := range fixtures {
		data, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		out = append(out, data)
	}
	return append(out,
		[]byte("a,b\n1,\"x\ny\"\n"),
		[]byte("a\tb\n1\t2\n"),
		[]byte(`[{"a": 1, "b": [1, {"c": null}]}, {"a": "NA"}]`),
		[]byte(`[{"a":1},{"a":2}]`),
		[]byte("a;b\r1,5;2\r3;4"),
		[]byte("a|b\n\"x|y\"|1\n"),
	)
}

// FuzzReadTable feeds arbitrary bytes as CSV, TSV and JSON. Whatever the
// input, Read and Numbers must not panic, every error must be a *DataError
// with a one-line message, and a table must be self-consistent: rows of a
// delimited file start on increasing lines; JSON objects may share a line
// ([{"a":1},{"a":2}]), so theirs only never go back.
func FuzzReadTable(f *testing.F) {
	for _, data := range fuzzSeeds(f) {
		for format := range uint8(3) {
			f.Add(data, format)
		}
	}
	formats := []string{"csv", "tsv", "json"}
	f.Fuzz(func(t *testing.T, data []byte, format uint8) {
		name := "fuzz." + formats[int(format)%len(formats)]
		tab, err := (&Reader{}).Read(bytes.NewReader(data), name)
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
			if line < prev || (line == prev && tab.Format != "json") || line < 1 {
				t.Fatalf("row %d on line %d after line %d", i, line, prev)
			}
			prev = line
		}
		for _, col := range tab.Header {
			if col == "" {
				continue
			}
			cells := tab.Strings(col)
			if len(cells) != tab.Len() {
				t.Fatalf("column %q has %d cells for %d rows", col, len(cells), tab.Len())
			}
			vals, missing, err := tab.Numbers(col)
			if err != nil {
				checkDataError(t, err)
			} else if len(vals) != tab.Len() || len(missing) > len(vals) {
				t.Fatalf("Numbers(%q): %d values, %d missing, %d rows", col, len(vals), len(missing), tab.Len())
			}
			if _, _, err := tab.Times(col, ""); err != nil {
				checkDataError(t, err)
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

// FuzzFastSlow reads every input twice, through the unquoted fast path and
// through encoding/csv alone, and requires the same table or the same
// error: the fast path is only a shortcut.
func FuzzFastSlow(f *testing.F) {
	for _, data := range fuzzSeeds(f) {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		compareFastSlow(t, data)
	})
}

// TestFastSlowAgree runs both paths on the fuzz seeds and the fuzz corpus.
func TestFastSlowAgree(t *testing.T) {
	inputs := fuzzSeeds(&testing.F{})
	for _, dir := range []string{"testdata/fuzz/FuzzFastSlow", "testdata/fuzz/FuzzReadTable"} {
		files, _ := filepath.Glob(filepath.Join(dir, "*"))
		for _, name := range files {
			if data, err := corpusBytes(name); err == nil {
				inputs = append(inputs, data)
			}
		}
	}
	for _, data := range inputs {
		compareFastSlow(t, data)
	}
}

// corpusBytes reads the first []byte value of a fuzz corpus file.
func corpusBytes(name string) ([]byte, error) {
	raw, err := os.ReadFile(name)
	if err != nil {
		return nil, err
	}
	for _, line := range strings.Split(string(raw), "\n") {
		if v, ok := strings.CutPrefix(line, "[]byte("); ok {
			s, err := strconv.Unquote(strings.TrimSuffix(v, ")"))
			return []byte(s), err
		}
	}
	return nil, os.ErrNotExist
}

func compareFastSlow(t *testing.T, data []byte) {
	t.Helper()
	fast, err1 := (&Reader{}).Read(bytes.NewReader(slices.Clone(data)), "f.csv")
	slow, err2 := (&Reader{slow: true}).Read(bytes.NewReader(slices.Clone(data)), "f.csv")
	if (err1 == nil) != (err2 == nil) || err1 != nil && err1.Error() != err2.Error() {
		t.Fatalf("%q: fast error %v, slow error %v", data, err1, err2)
	}
	if err1 != nil {
		return
	}
	if !slices.Equal(fast.Header, slow.Header) || fast.Len() != slow.Len() {
		t.Fatalf("%q: header %q/%q rows %d/%d", data, fast.Header, slow.Header, fast.Len(), slow.Len())
	}
	for i := range fast.Len() {
		if fast.Line(i) != slow.Line(i) {
			t.Fatalf("%q: row %d on line %d fast, %d slow", data, i, fast.Line(i), slow.Line(i))
		}
	}
	for _, col := range fast.Header {
		if col == "" {
			continue
		}
		if a, b := fast.Strings(col), slow.Strings(col); !slices.Equal(a, b) {
			t.Fatalf("%q: column %q reads %q fast, %q slow", data, col, a, b)
		}
		n1, e1 := fast.ReadNumbers(col)
		n2, e2 := slow.ReadNumbers(col)
		if (e1 == nil) != (e2 == nil) || e1 != nil && e1.Error() != e2.Error() {
			t.Fatalf("%q: column %q: fast error %v, slow error %v", data, col, e1, e2)
		}
		if e1 == nil && (!slices.EqualFunc(n1.Values, n2.Values, sameBits) || !slices.Equal(n1.Missing, n2.Missing)) {
			t.Fatalf("%q: column %q: fast %v, slow %v", data, col, n1.Values, n2.Values)
		}
	}
}

func sameBits(a, b float64) bool {
	return math.Float64bits(a) == math.Float64bits(b) || a != a && b != b
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

// FuzzScanDecimal checks that the fused scan accepts exactly the cells
// fastDecimal accepts, with the same value, and stops at the separator.
func FuzzScanDecimal(f *testing.F) {
	for _, s := range []string{"12.5,x", "-0", "1.2.3", "9007199254740993", "+.5;", "1e5", "..", "5."} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		cell, _, _ := strings.Cut(s, ",")
		want, wok := fastDecimal(cell)
		got, n, ok := scanDecimal([]byte(s), ',')
		if ok != wok || ok && (!sameBits(got, want) || n != len(cell)) {
			t.Fatalf("scanDecimal(%q) = %v, %d, %v; fastDecimal(%q) = %v, %v", s, got, n, ok, cell, want, wok)
		}
	})
}

// FuzzSniff checks the separator sniffer: it always answers one of the
// four separators, and a table written with a separator and consistent
// fields is sniffed back to it.
func FuzzSniff(f *testing.F) {
	f.Add([]byte("a;b\n1,5;2\n"), uint8(1), uint8(3), uint8(2))
	f.Add([]byte("x"), uint8(0), uint8(2), uint8(1))
	f.Fuzz(func(t *testing.T, data []byte, which, cols, rows uint8) {
		if c := sniffComma(data, true, ','); !strings.ContainsRune(",;\t|", c) || c == 0 {
			t.Fatalf("sniffed %q", c)
		}
		seps := []byte{',', ';', '\t', '|'}
		sep := seps[int(which)%len(seps)]
		nc, nr := 2+int(cols)%5, 1+int(rows)%6
		// Cells from the fuzz bytes, without any separator, quote or line end.
		clean := bytes.Map(func(r rune) rune {
			if strings.ContainsRune(",;\t|\"\r\n", r) || r == utf8.RuneError {
				return -1
			}
			return r
		}, data)
		var b bytes.Buffer
		for r := range nr + 1 {
			for c := range nc {
				if c > 0 {
					b.WriteByte(sep)
				}
				b.WriteString("v")
				b.Write(clean[:min(len(clean), r+c)])
			}
			b.WriteByte('\n')
		}
		if got := sniffComma(b.Bytes(), true, ','); got != rune(sep) {
			t.Fatalf("%q sniffed as %q, written with %q", b.Bytes(), got, sep)
		}
	})
}

// FuzzNumberCells checks the number reader on one cell: no panic, a
// finite value or an error, and a plain decimal read as ParseFloat reads it.
func FuzzNumberCells(f *testing.F) {
	for _, s := range []string{"1,234", "12,5", "$5", "5 €", "(5)", "−3", "12%", "1.234.567,5", "1'234", "NA", "..", "1e5"} {
		f.Add(s, false)
	}
	f.Fuzz(func(t *testing.T, s string, comma bool) {
		dec := byte('.')
		if comma {
			dec = ','
		}
		p, ok := splitCell(s)
		if !ok {
			return
		}
		v, _, ok := parseBody(p.body, dec)
		if !ok {
			return
		}
		if v != v {
			t.Fatalf("%q read as NaN", s)
		}
		if _, plain := fastDecimal(s); plain && dec == '.' {
			want, _ := strconv.ParseFloat(s, 64)
			if p.neg {
				v = -v
			}
			if !sameBits(v, want) {
				t.Fatalf("%q: %v, ParseFloat %v", s, v, want)
			}
		}
	})
}

// FuzzDates checks the date reader: no panic, and a date read under a
// pattern formats back to the same calendar day.
func FuzzDates(f *testing.F) {
	for _, s := range []string{"2021-Q1", "Q1 2021", "Jan 2021", "1 Jan 2021", "31/12/2020", "2024-03-17", "2024", "12.03.2021"} {
		f.Add(s, "DD.MM.YYYY")
	}
	f.Fuzz(func(t *testing.T, s, pattern string) {
		for _, form := range autoForms {
			form.read(s)
		}
		pat, err := parsePattern(pattern)
		if err != nil {
			return
		}
		if v, ok := matchPattern(s, pat); ok && (v != v || math.IsInf(v, 0)) {
			t.Fatalf("%q under %q read as %v", s, pattern, v)
		}
	})
}

// TestMappedAgrees reads every fixture from its file (mapped into memory
// where the system allows) and from a copy in memory: same table, same
// error.
func TestMappedAgrees(t *testing.T) {
	fixtures, _ := filepath.Glob("../../testdata/data/*")
	for _, name := range fixtures {
		f, err := os.Open(name)
		if err != nil {
			t.Fatal(err)
		}
		data, _ := os.ReadFile(name)
		a, err1 := (&Reader{}).Read(f, name)
		f.Close()
		b, err2 := (&Reader{}).Read(bytes.NewReader(data), name)
		if (err1 == nil) != (err2 == nil) || err1 != nil && err1.Error() != err2.Error() {
			t.Fatalf("%s: mapped error %v, read error %v", name, err1, err2)
		}
		if err1 != nil {
			continue
		}
		for _, col := range a.Header {
			if col != "" && !slices.Equal(a.Strings(col), b.Strings(col)) {
				t.Errorf("%s: column %q differs", name, col)
			}
		}
	}
}

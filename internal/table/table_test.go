package table

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
)

func openFixture(t *testing.T, name string) *os.File {
	t.Helper()
	f, err := os.Open(filepath.Join("../../testdata/data", name))
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { f.Close() })
	return f
}

// sameFloats compares with NaN equal to NaN, since missing cells are NaN.
func sameFloats(a, b []float64) bool {
	return slices.EqualFunc(a, b, func(x, y float64) bool {
		return x == y || math.IsNaN(x) && math.IsNaN(y)
	})
}

var nan = math.NaN()

// ReadTable reads with the zero Reader but for the format and columns.
func ReadTable(r io.Reader, file, format string, want []string) (*Table, error) {
	return (&Reader{Format: format, Columns: want}).Read(r, file)
}

func TestReadTableGood(t *testing.T) {
	tests := []struct {
		name     string
		file     string
		want     []string
		header   []string
		labels   []string
		lines    []int
		values   []float64
		missing  []int
		numErr   int // line of the expected Numbers error, 0 for none
		numsText string
	}{
		{
			name:   "csv with quoted commas, a label over two lines, NA, empty and spaced cells",
			file:   "good.csv",
			want:   []string{"region", "revenue"},
			header: []string{"region", "revenue", "note"},
			labels: []string{"North", "South, coast", "East", "West\nand beyond", "North", "Central", "Islands"},
			// "West\nand beyond" starts on line 5 and ends on line 6, so the
			// next row is line 7.
			lines:   []int{2, 3, 4, 5, 7, 8, 9},
			values:  []float64{120.5, 80, nan, 42, 7.5, nan, -300},
			missing: []int{2, 5},
		},
		{
			name:   "byte order mark and CRLF line ends",
			file:   "bom_crlf.csv",
			want:   []string{"region", "revenue"},
			header: []string{"region", "revenue"},
			labels: []string{"North", "South", "Long\nname", "East"},
			lines:  []int{2, 3, 4, 6},
			numErr: 6, numsText: "bad",
		},
		{
			name:    "tsv with a blank line and literal quotes",
			file:    "good.tsv",
			want:    []string{"region", "revenue"},
			header:  []string{"region", "revenue", "note"},
			labels:  []string{"North", "South", "East"},
			lines:   []int{2, 4, 5},
			values:  []float64{10, 20, nan},
			missing: []int{2},
		},
		{
			name:    "json objects on their own lines, one spread over four, keys in any order",
			file:    "good.json",
			want:    []string{"region", "revenue"},
			header:  []string{"region", "revenue", "ok", "extra"},
			labels:  []string{"North", "South", "East", "West"},
			lines:   []int{2, 3, 4, 8},
			values:  []float64{120.5, nan, 42, 100},
			missing: []int{1},
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			tab, err := ReadTable(openFixture(t, tc.file), tc.file, "", tc.want)
			if err != nil {
				t.Fatal(err)
			}
			if !slices.Equal(tab.Header, tc.header) {
				t.Errorf("Header = %q, want %q", tab.Header, tc.header)
			}
			if got := tab.Strings("region"); !slices.Equal(got, tc.labels) {
				t.Errorf("Strings = %q, want %q", got, tc.labels)
			}
			if tab.Len() != len(tc.labels) {
				t.Errorf("Len = %d, want %d", tab.Len(), len(tc.labels))
			}
			var lines []int
			for i := range tab.Len() {
				lines = append(lines, tab.Line(i))
			}
			if !slices.Equal(lines, tc.lines) {
				t.Errorf("lines = %v, want %v", lines, tc.lines)
			}
			vals, missing, err := tab.Numbers("revenue")
			if tc.numErr != 0 {
				var de *DataError
				if !errors.As(err, &de) || de.Line != tc.numErr || de.Text != tc.numsText {
					t.Fatalf("Numbers error = %v, want line %d text %q", err, tc.numErr, tc.numsText)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if !sameFloats(vals, tc.values) || !slices.Equal(missing, tc.missing) {
				t.Errorf("Numbers = %v, %v; want %v, %v", vals, missing, tc.values, tc.missing)
			}
		})
	}
}

func TestReadTableErrors(t *testing.T) {
	tests := []struct {
		name    string
		file    string // fixture in testdata/data, or the name shown for input
		input   string // used instead of the fixture when not ""
		format  string
		want    []string
		numbers string // column to parse; "" when ReadTable itself must fail
		err     error
		line    int
		column  string
		text    string
		hint    string
	}{
		{name: "bad number", file: "bad_number.csv", want: []string{"region", "revenue"}, numbers: "revenue",
			err: ErrBadNumber, line: 7, column: "revenue", text: "12,3x", hint: `write digits`},
		{name: "infinite", file: "bad_inf.csv", numbers: "revenue",
			err: ErrNotFinite, line: 3, column: "revenue", text: "Inf", hint: "write a finite number"},
		{name: "overflow to infinity", file: "big.csv", input: "a\n1\n1e999\n", numbers: "a",
			err: ErrNotFinite, line: 3, column: "a", text: "1e999", hint: "finite"},
		{name: "bad number after CRLF and BOM", file: "bom_crlf.csv", numbers: "revenue",
			err: ErrBadNumber, line: 6, column: "revenue", text: "bad", hint: "leave the cell empty"},
		{name: "invalid UTF-8", file: "bad_utf8.csv",
			err: ErrEncoding, line: 3, column: "region", text: "S\xffuth", hint: "save the file as UTF-8"},
		{name: "UTF-16", file: "u16.csv", input: "\xFF\xFEr\x00", format: "csv",
			err: ErrEncoding, line: 1, hint: "UTF-16"},
		{name: "duplicate header", file: "duplicate_header.csv",
			err: ErrDuplicateHeader, line: 1, column: "region", text: "region", hint: "columns 1 and 3"},
		{name: "ragged row", file: "ragged.csv",
			err: ErrFieldCount, line: 3, hint: "the header has 2 fields and this row 3"},
		{name: "ragged tsv row", file: "r.tsv", input: "a\tb\n1\t2\n\n3\n",
			err: ErrFieldCount, line: 4, hint: "the header has 2 fields and this row 1"},
		{name: "empty file", file: "empty.csv", err: ErrEmpty, hint: "header row and at least one data row"},
		{name: "header only", file: "header_only.csv", err: ErrEmpty, hint: "add rows below the header"},
		{name: "bare quote", file: "bad_quote.csv", err: ErrSyntax, line: 3, hint: `quoted in full`},
		{name: "unterminated quote", file: "q.csv", input: "a,b\n1,\"open\n2,3\n",
			err: ErrSyntax, line: 2, hint: `a quoted cell must end`},
		{name: "missing column", file: "good.csv", want: []string{"region", "revenu"},
			err: ErrMissingColumn, line: 1, column: "revenu", hint: `did you mean "revenue"? the columns are "region", "revenue", "note"`},
		{name: "missing column, nothing close", file: "good.csv", want: []string{"zzzzzz"},
			err: ErrMissingColumn, line: 1, column: "zzzzzz", hint: `the columns are "region"`},
		{name: "missing column asked of Numbers", file: "good.csv", numbers: "Revenue",
			err: ErrMissingColumn, line: 1, column: "Revenue", hint: `did you mean "revenue"?`},
		{name: "json syntax", file: "bad_syntax.json",
			err: ErrSyntax, line: 3, text: `{"region": "South" "revenue": 2}`, hint: "fix the JSON"},
		{name: "json number with a unit, on the value's own line", file: "bad_number.json", numbers: "revenue",
			err: ErrBadNumber, line: 4, column: "revenue", text: "12%", hint: `the cells above have no unit and this one "%"`},
		{name: "json nested value", file: "nested.json", want: []string{"revenue"},
			err: ErrSyntax, line: 2, column: "revenue", hint: "not an object or array"},
		{name: "json repeated key", file: "duplicate_key.json",
			err: ErrDuplicateHeader, line: 2, column: "revenue", text: "revenue", hint: "only once"},
		{name: "json empty array", file: "empty.json", err: ErrEmpty, line: 1, hint: "no objects"},
		{name: "json not an array", file: "o.json", input: "\n{\"a\": 1}",
			err: ErrSyntax, line: 2, text: "{", hint: "array of objects"},
		{name: "json element not an object", file: "e.json", input: "[{\"a\": 1},\n 2]",
			err: ErrSyntax, line: 2, text: "2", hint: "must be an object"},
		{name: "json cut short", file: "c.json", input: "[{\"a\": 1},\n{\"a\": ",
			err: ErrSyntax, line: 2, hint: "ends early"},
		{name: "json trailing data", file: "t.json", input: "[{\"a\": 1}]\n]",
			err: ErrSyntax, line: 2, text: "]", hint: "remove what follows"},
		{name: "json invalid UTF-8", file: "u.json", input: "[\n{\"a\": \"\xfe\"}]",
			err: ErrEncoding, line: 2, text: "{\"a\": \"\xfe\"}]", hint: "UTF-8"},
		{name: "json missing column", file: "m.json", input: `[{"region": 1}]`, want: []string{"regoin"},
			err: ErrMissingColumn, column: "regoin", hint: `did you mean "region"?`},
		{name: "standard input sniffed as CSV, then a ragged row", file: "-", input: "a;b\n1;2\n3\n",
			err: ErrFieldCount, line: 3, hint: "separated by semicolons"},
		{name: "a semicolon file read as commas is told so, not to quote", file: "s.csv", input: "a;b\n1,5;2\n3;4\n", format: "csv",
			err: ErrFieldCount, line: 2, hint: "looks separated by semicolons: say --format semicolon"},
		{name: "NUL bytes", file: "z.csv", input: "a,b\n\x00\x00\x00",
			err: ErrBinary, hint: "give a text file"},
		{name: "mixed units", file: "u.csv", input: "a\n12%\n$5\n",
			numbers: "a", err: ErrMixedNumbers, line: 3, column: "a", text: "$5", hint: `the cells above are in "%"`},
		{name: "mixed decimal marks", file: "d.csv", input: "a\n12.5\n\"3,25\"\n",
			numbers: "a", err: ErrMixedNumbers, line: 3, column: "a", text: "3,25", hint: "decimal point"},
		{name: "ambiguous 1,234 in a tab file", file: "t.tsv", input: "a\tb\nx\t1,234\ny\t2,500\n",
			numbers: "b", err: ErrMixedNumbers, line: 2, column: "b", text: "1,234", hint: "--decimal"},
		{name: "a date among numbers", file: "n.csv", input: "a\n1\n2024-03-17\n",
			numbers: "a", err: ErrBadNumber, line: 3, column: "a", text: "2024-03-17", hint: "looks like a date"}, {name: "unknown extension", file: "data.xlsx", input: "a\n1\n",
			err: ErrFormat, hint: "name the file .csv, .tsv or .json"},
		{name: "unknown format", file: "data.csv", input: "a\n1\n", format: "xml",
			err: ErrFormat, text: "xml", hint: "use --format"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			var err error
			var tab *Table
			if tc.input != "" {
				tab, err = ReadTable(strings.NewReader(tc.input), tc.file, tc.format, tc.want)
			} else {
				tab, err = ReadTable(openFixture(t, tc.file), tc.file, tc.format, tc.want)
			}
			if tc.numbers != "" {
				if err != nil {
					t.Fatalf("ReadTable: %v", err)
				}
				_, _, err = tab.Numbers(tc.numbers)
			}
			if !errors.Is(err, tc.err) {
				t.Fatalf("error = %v, want %v", err, tc.err)
			}
			var de *DataError
			if !errors.As(err, &de) {
				t.Fatalf("error %T is not a *DataError", err)
			}
			if de.Line != tc.line || de.Column != tc.column || de.Text != tc.text {
				t.Errorf("line %d, column %q, text %q; want line %d, column %q, text %q",
					de.Line, de.Column, de.Text, tc.line, tc.column, tc.text)
			}
			msg := err.Error()
			want := []string{DisplayName(tc.file) + ": ", tc.hint}
			if tc.line > 0 {
				want = append(want, fmt.Sprintf("line %d", tc.line))
			}
			if tc.column != "" {
				want = append(want, strconv.Quote(tc.column))
			}
			if tc.text != "" {
				want = append(want, strconv.Quote(tc.text))
			}
			for _, w := range want {
				if !strings.Contains(msg, w) {
					t.Errorf("message %q lacks %q", msg, w)
				}
			}
			if strings.ContainsAny(msg, "\n\r") {
				t.Errorf("message %q is not one line", msg)
			}
			if tc.err != ErrFieldCount && strings.Contains(msg, "quote any cell") {
				t.Errorf("message %q gives the quoting advice for another cause", msg)
			}
		})
	}
}

func TestDataErrorMessage(t *testing.T) {
	tests := []struct {
		err  *DataError
		want string
	}{
		{
			// The form the CLI promises, word for word.
			err: &DataError{File: "sales.csv", Line: 7, Column: "revenue", Text: "12,3x", Err: ErrBadNumber,
				Hint: `write digits with "." for decimals, or leave the cell empty to skip the row`},
			want: `sales.csv: line 7, column "revenue": cannot read "12,3x" as a number; write digits with "." for decimals, or leave the cell empty to skip the row`,
		},
		{
			err:  &DataError{File: "-", Err: ErrEmpty},
			want: `standard input: there are no data rows`,
		},
		{
			err:  &DataError{File: "a.csv", Column: "x", Err: ErrMissingColumn, Hint: `the columns are "y"`},
			want: `a.csv: column "x": there is no such column; the columns are "y"`,
		},
		{
			err:  &DataError{File: "two\nlines.csv", Line: 3, Text: "a\nb", Err: ErrBadNumber},
			want: `two\nlines.csv: line 3: cannot read "a\nb" as a number`,
		},
		{
			err:  &DataError{File: "a.csv", Err: os.ErrPermission},
			want: `a.csv: permission denied`,
		},
	}
	for _, tc := range tests {
		if got := tc.err.Error(); got != tc.want {
			t.Errorf("Error() =\n%s\nwant\n%s", got, tc.want)
		}
	}
}

// TestNumberCells reads one column of cells at a time, as every form of
// number the reader accepts, and the cells it must refuse.
func TestNumberCells(t *testing.T) {
	tests := []struct {
		name  string
		comma string // separator of the file
		cells []string
		want  []float64
		unit  string
		err   error
		notes []string // codes
	}{
		{name: "plain", cells: []string{"1", "-2.5", "+3", " 4 ", "1e3", ".5", "5.", "1e-400"}, want: []float64{1, -2.5, 3, 4, 1000, 0.5, 5, 0}},
		{name: "missing markers", cells: []string{"1", "", "NA", "n/a", "NaN", "null", "-", "–", ".", ".."},
			want: []float64{1, nan, nan, nan, nan, nan, nan, nan, nan, nan}, notes: []string{"missing"}},
		{name: "grouping with commas", cells: []string{"1,234,567", "12", "-1,000.5"}, want: []float64{1234567, 12, -1000.5}, notes: []string{"grouping"}},
		{name: "decimal comma proven", comma: ";", cells: []string{"12,5", "0,25", "3"}, want: []float64{12.5, 0.25, 3}, notes: []string{"decimal-comma"}},
		{name: "grouped points and a decimal comma", comma: ";", cells: []string{"1.234.567,5", "2,25"}, want: []float64{1234567.5, 2.25}, notes: []string{"decimal-comma", "grouping"}},
		{name: "1,234 in a semicolon file is a decimal comma", comma: ";", cells: []string{"1,234", "2,5"}, want: []float64{1.234, 2.5}, notes: []string{"decimal-comma"}},
		{name: "1,234 alone in a semicolon file", comma: ";", cells: []string{"1,234", "5,678"}, want: []float64{1.234, 5.678}, notes: []string{"decimal-comma"}},
		{name: "1,234 alone in a comma file groups", cells: []string{"1,234", "5,678"}, want: []float64{1234, 5678}, notes: []string{"grouping"}},
		{name: "1.234 alone keeps the point", comma: ";", cells: []string{"1.234", "5.678"}, want: []float64{1.234, 5.678}},
		{name: "spaces and apostrophes group", cells: []string{"1 234", "1 234 567", "1 000", "12"}, want: []float64{1234, 1234567, 1000, 12}, notes: []string{"grouping"}},
		{name: "apostrophe", cells: []string{"1'234", "5'000.5"}, want: []float64{1234, 5000.5}, notes: []string{"grouping"}},
		{name: "percent", cells: []string{"12%", "-3.5 %", "0%"}, want: []float64{12, -3.5, 0}, unit: "%", notes: []string{"unit"}},
		{name: "currency before", cells: []string{"$5", "-$1,200.50", "$-3"}, want: []float64{5, -1200.5, -3}, unit: "$", notes: []string{"grouping", "unit"}},
		{name: "currency after", comma: ";", cells: []string{"5 €", "7,63 €"}, want: []float64{5, 7.63}, unit: "€", notes: []string{"decimal-comma", "unit"}},
		{name: "pound", cells: []string{"£7.63", "£12"}, want: []float64{7.63, 12}, unit: "£", notes: []string{"unit"}},
		{name: "minus sign and accounting negatives", cells: []string{"−5", "(5)", "($1,000)", "7"}, want: []float64{-5, -5, -1000, 7}, unit: "", err: ErrMixedNumbers},
		{name: "accounting negatives", cells: []string{"(5)", "12", "(0.5)"}, want: []float64{-5, 12, -0.5}, notes: []string{"accounting"}},
		{name: "U+2212", cells: []string{"−5", "3"}, want: []float64{-5, 3}},
		{name: "a leading 0 group is a decimal", comma: "	", cells: []string{"0,123", "1,5"}, want: []float64{0.123, 1.5}, notes: []string{"decimal-comma"}},
		{name: "infinity", cells: []string{"1", "Inf"}, err: ErrNotFinite},
		{name: "overflow", cells: []string{"1", "1e999"}, err: ErrNotFinite},
		{name: "hex", cells: []string{"0x10"}, err: ErrBadNumber},
		{name: "underscores", cells: []string{"1_000"}, err: ErrBadNumber},
		{name: "two points", cells: []string{"1.2.3"}, err: ErrBadNumber},
		{name: "two signs", cells: []string{"--1"}, err: ErrBadNumber},
		{name: "a word", cells: []string{"abc"}, err: ErrBadNumber},
		{name: "kg", cells: []string{"3 kg"}, err: ErrBadNumber},
		{name: "bad grouping", cells: []string{"1,23,456"}, err: ErrBadNumber},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			comma := tc.comma
			if comma == "" {
				comma = ","
			}
			var b strings.Builder
			b.WriteString("k" + comma + "v\n")
			for i, c := range tc.cells {
				if strings.Contains(c, comma) || strings.Contains(c, "\"") {
					c = strconv.Quote(c)
				}
				fmt.Fprintf(&b, "r%d%s%s\n", i, comma, c)
			}
			tab, err := (&Reader{Comma: rune(comma[0])}).Read(strings.NewReader(b.String()), "n.csv")
			if err != nil {
				t.Fatal(err)
			}
			n, err := tab.ReadNumbers("v")
			if tc.err != nil {
				if !errors.Is(err, tc.err) {
					t.Fatalf("error = %v, want %v", err, tc.err)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if !sameFloats(n.Values, tc.want) || n.Unit != tc.unit {
				t.Errorf("values %v unit %q; want %v %q", n.Values, n.Unit, tc.want, tc.unit)
			}
			var codes []string
			for _, note := range n.Notes {
				codes = append(codes, note.Code)
			}
			if !slices.Equal(codes, tc.notes) {
				t.Errorf("notes %q, want %q", codes, tc.notes)
			}
		})
	}
}

// TestReadTableColumnForms covers a column that stays a dictionary and one
// that turns into plain text past the first checkpoint, and that both read
// back exactly.
func TestReadTableColumnForms(t *testing.T) {
	var b strings.Builder
	b.WriteString("label,value,id\n")
	const n = 20000
	for i := range n {
		fmt.Fprintf(&b, "L%d,%d.5,\"id\n%d\"\n", i%7, i, i)
	}
	tab, err := ReadTable(strings.NewReader(b.String()), "forms.csv", "", nil)
	if err != nil {
		t.Fatal(err)
	}
	if c := tab.cols[tab.index["label"]]; c.numeric || !c.text.dictionary() {
		t.Error("a column of 7 labels should stay a dictionary")
	}
	if c := tab.cols[tab.index["value"]]; !c.numeric {
		t.Error("a column of plain numbers should be parsed while reading")
	}
	if c := tab.cols[tab.index["id"]]; c.numeric || c.text.dictionary() {
		t.Error("a column of distinct texts should turn into plain text")
	}
	labels, ids := tab.Strings("label"), tab.Strings("id")
	vals, missing, err := tab.Numbers("value")
	if err != nil || len(missing) != 0 {
		t.Fatal(err, missing)
	}
	for i := range n {
		if labels[i] != fmt.Sprintf("L%d", i%7) || ids[i] != fmt.Sprintf("id\n%d", i) || vals[i] != float64(i)+0.5 {
			t.Fatalf("row %d reads %q %q %v", i, labels[i], ids[i], vals[i])
		}
		// Each record spans two lines, after the one header line.
		if tab.Line(i) != 2+2*i {
			t.Fatalf("row %d on line %d, want %d", i, tab.Line(i), 2+2*i)
		}
	}
	if tab.Line(-1) != 0 || tab.Line(n) != 0 || tab.Strings("nope") != nil {
		t.Error("out-of-range rows and unknown columns should read as zero values")
	}
}

// TestReadTableJSONKeys covers keys that appear late or not at all and the
// line of every cell.
func TestReadTableJSONKeys(t *testing.T) {
	in := "[{\"a\": 1},\n {\"b\": \"x\",\n  \"a\": 2},\n {\"a\": true, \"b\": null}]"
	tab, err := ReadTable(strings.NewReader(in), "k.json", "", nil)
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Equal(tab.Header, []string{"a", "b"}) {
		t.Errorf("Header = %q", tab.Header)
	}
	if got := tab.Strings("b"); !slices.Equal(got, []string{"", "x", ""}) {
		t.Errorf("b = %q", got)
	}
	if got := tab.Strings("a"); !slices.Equal(got, []string{"1", "2", "true"}) {
		t.Errorf("a = %q", got)
	}
	_, _, err = tab.Numbers("a")
	var de *DataError
	if !errors.As(err, &de) || de.Line != 4 || de.Text != "true" {
		t.Errorf("Numbers(a) error = %v, want line 4, text true", err)
	}
	vals, missing, err := tab.Numbers("b")
	if err == nil || len(vals) != 0 || missing != nil {
		t.Errorf("Numbers(b) = %v, %v, %v; want a bad number on line 2", vals, missing, err)
	}
	if errors.As(err, &de) && de.Line != 2 {
		t.Errorf("Numbers(b) error on line %d, want 2", de.Line)
	}
	if tab.cellLine(tab.index["a"], 1) != 3 || tab.Line(1) != 2 {
		t.Errorf("a value on its own line: cell line %d, row line %d", tab.cellLine(tab.index["a"], 1), tab.Line(1))
	}
}

func TestNilTable(t *testing.T) {
	var tab *Table
	if tab.Len() != 0 || tab.Line(0) != 0 || tab.Strings("a") != nil {
		t.Error("a nil table should read as empty")
	}
	if _, _, err := tab.Numbers("a"); !errors.Is(err, ErrMissingColumn) {
		t.Errorf("Numbers on nil table: %v", err)
	}
}

func ExampleReader() {
	data := "route,passengers\nNorth,120\nSouth,NA\nNorth,30\n"
	r := &Reader{Columns: []string{"route", "passengers"}}
	t, err := r.Read(strings.NewReader(data), "ferries.csv")
	if err != nil {
		fmt.Println(err)
		return
	}
	vals, missing, err := t.Numbers("passengers")
	fmt.Println(t.Strings("route"), vals, missing, err)
	fmt.Println("missing value on line", t.Line(missing[0]))
	// Output:
	// [North South North] [120 NaN 30] [1] <nil>
	// missing value on line 3
}

func ExampleDataError() {
	data := "route,passengers\nNorth,120\nSouth,1,5\n"
	_, err := ReadTable(strings.NewReader(data), "ferries.csv", "", nil)
	fmt.Println(err)
	// Output:
	// ferries.csv: line 3: the row has a different number of fields than the header; the header has 2 fields and this row 3, separated by commas; quote any cell that holds the separator, as "a,b"
}

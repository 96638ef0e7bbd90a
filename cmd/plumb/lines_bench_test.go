package main

import (
	"bytes"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"
)

// linesBenchRows is the size of the long-series benchmark: a million
// points, far more than any plot has pixel columns.
const linesBenchRows = 1_000_000

// linesCSV is the benchmark input: columns x,y, x the row number and y a
// random walk with two decimals, from a fixed PCG seed.
func linesCSV(n int) []byte {
	rng := rand.New(rand.NewPCG(2014, 7))
	var b bytes.Buffer
	b.Grow(n * 16)
	b.WriteString("x,y\n")
	y := 1000.0
	num := make([]byte, 0, 32)
	for i := range n {
		y += float64(rng.IntN(201)-100) / 100
		num = strconv.AppendInt(num[:0], int64(i), 10)
		b.Write(num)
		b.WriteByte(',')
		num = strconv.AppendFloat(num[:0], y, 'f', 2, 64)
		b.Write(num)
		b.WriteByte('\n')
	}
	return b.Bytes()
}

// BenchmarkLinesParseOnly is the floor the lines command is measured
// against: encoding/csv with a reused record and strconv.ParseFloat on both
// columns, keeping nothing.
func BenchmarkLinesParseOnly(b *testing.B) {
	parseOnly(b, linesCSV(linesBenchRows), 0, 1)
}

// BenchmarkLinesCLI is the whole lines command on the same bytes: load,
// sort check, M4 reduction, banking, layout and SVG. It reports the SVG
// size and the most vertices found in one pixel column.
func BenchmarkLinesCLI(b *testing.B) {
	data := linesCSV(linesBenchRows)
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	var out bytes.Buffer
	for b.Loop() {
		out.Reset()
		var errs bytes.Buffer
		if code := run([]string{"lines", "-", "--format", "csv", "--quiet"}, bytes.NewReader(data), &out, &errs); code != exitOK {
			b.Fatal(errs.String())
		}
	}
	b.ReportMetric(float64(out.Len())/1024, "svg-KB")
	b.ReportMetric(float64(columnsMax(out.String())), "max-vertices/column")
}

// columnsMax counts the data path's vertices per pixel column without the
// test helpers, which need a *testing.T.
func columnsMax(svg string) int {
	i := strings.Index(svg, `class="plumb-mark"`)
	if i < 0 {
		return -1
	}
	rest := svg[strings.LastIndex(svg[:i], "<path"):]
	d := rest[strings.Index(rest, ` d="`)+4:]
	d = d[:strings.IndexByte(d, '"')]
	cols := map[int]int{}
	most := 0
	for _, p := range strings.FieldsFunc(d, func(r rune) bool { return r == 'M' || r == 'L' }) {
		xs, _, _ := strings.Cut(p, ",")
		x, err := strconv.ParseFloat(xs, 64)
		if err != nil {
			return -1
		}
		c := int(x)
		cols[c]++
		most = max(most, cols[c])
	}
	return most
}

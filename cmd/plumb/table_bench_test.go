package main

import (
	"bytes"
	"encoding/csv"
	"io"
	"math/rand/v2"
	"strconv"
	"testing"

	"plumb/internal/table"
)

// benchRows and benchLabels size the load benchmark: a million raw rows
// over a thousand categories, the scale a report generator meets.
const (
	benchRows   = 1_000_000
	benchLabels = 1_000
)

// benchCSV builds the benchmark input: columns route,value with labels
// drawn from benchLabels routes and values with one or two decimals,
// from a fixed PCG seed so that every run parses the same bytes.
func benchCSV() []byte {
	rng := rand.New(rand.NewPCG(2024, 11))
	labels := make([]string, benchLabels)
	for i := range labels {
		labels[i] = "route-" + strconv.Itoa(1000+i)
	}
	var b bytes.Buffer
	b.Grow(benchRows * 20)
	b.WriteString("route,value\n")
	num := make([]byte, 0, 32)
	for range benchRows {
		b.WriteString(labels[rng.IntN(benchLabels)])
		b.WriteByte(',')
		num = strconv.AppendFloat(num[:0], float64(rng.IntN(1_000_000))/100, 'f', -1, 64)
		b.Write(num)
		b.WriteByte('\n')
	}
	return b.Bytes()
}

// BenchmarkParseOnly is the floor: encoding/csv with a reused record and
// strconv.ParseFloat on every value, keeping nothing.
func BenchmarkParseOnly(b *testing.B) {
	parseOnly(b, benchCSV(), 1)
}

// parseOnly times the cheapest honest reading of a CSV: encoding/csv with a
// reused record and strconv.ParseFloat on the given columns of every row.
// It is the baseline the CLI benchmarks are compared with.
func parseOnly(b *testing.B, data []byte, cols ...int) {
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		r := csv.NewReader(bytes.NewReader(data))
		r.ReuseRecord = true
		if _, err := r.Read(); err != nil {
			b.Fatal(err)
		}
		var sum float64
		for {
			rec, err := r.Read()
			if err == io.EOF {
				break
			}
			if err != nil {
				b.Fatal(err)
			}
			for _, c := range cols {
				v, err := strconv.ParseFloat(rec[c], 64)
				if err != nil {
					b.Fatal(err)
				}
				sum += v
			}
		}
		if sum == 0 {
			b.Fatal("no values parsed")
		}
	}
}

// BenchmarkLoadAggregate is what the CLI does before drawing bars: read
// the table, parse the value column, and sum by label code.
func BenchmarkLoadAggregate(b *testing.B) {
	data := benchCSV()
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		t, err := ReadTable(bytes.NewReader(data), "bench.csv", "", []string{"route", "value"})
		if err != nil {
			b.Fatal(err)
		}
		vals, missing, err := t.Numbers("value")
		if err != nil || len(missing) != 0 {
			b.Fatal(err, len(missing))
		}
		dict, codes := t.Codes("route")
		g, err := table.AggregateCodes(dict, codes, vals, "sum")
		if err != nil {
			b.Fatal(err)
		}
		if len(g.Labels) != benchLabels {
			b.Fatalf("got %d labels", len(g.Labels))
		}
	}
}

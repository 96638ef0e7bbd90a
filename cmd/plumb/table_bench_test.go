package main

import (
	"bytes"
	"encoding/csv"
	"errors"
	"io"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"testing"
	"time"

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
		if err := parseOnce(data, cols...); err != nil {
			b.Fatal(err)
		}
	}
}

// parseOnce reads data once with encoding/csv and strconv.ParseFloat.
func parseOnce(data []byte, cols ...int) error {
	r := csv.NewReader(bytes.NewReader(data))
	r.ReuseRecord = true
	if _, err := r.Read(); err != nil {
		return err
	}
	var sum float64
	for {
		rec, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return err
		}
		for _, c := range cols {
			v, err := strconv.ParseFloat(rec[c], 64)
			if err != nil {
				return err
			}
			sum += v
		}
	}
	if sum == 0 {
		return errors.New("no values parsed")
	}
	return nil
}

// BenchmarkVersusCSV measures the targets of the loader as ratios: the
// whole "plumb bars" on a million rows of 1,000 labels, and "plumb lines"
// on a million points, each against encoding/csv with strconv.ParseFloat
// alone on the same file, run alternately in the same loop so that the
// load of a shared machine falls on both alike. The target is a ratio
// under 0.6.
func BenchmarkVersusCSV(b *testing.B) {
	for _, tc := range []struct {
		name string
		data []byte
		cols []int
		args []string
	}{
		{"bars", benchCSV(), []int{1}, []string{"bars", "--label", "route", "--value", "value", "--quiet"}},
		{"lines", linesCSV(linesBenchRows), []int{0, 1}, []string{"lines", "--x", "x", "--y", "y", "--quiet"}},
	} {
		b.Run(tc.name, func(b *testing.B) {
			path := filepath.Join(b.TempDir(), "data.csv")
			if err := os.WriteFile(path, tc.data, 0o644); err != nil {
				b.Fatal(err)
			}
			args := append([]string{tc.args[0], path}, tc.args[1:]...)
			var base, cli time.Duration
			for b.Loop() {
				t0 := time.Now()
				if err := parseOnce(tc.data, tc.cols...); err != nil {
					b.Fatal(err)
				}
				t1 := time.Now()
				if code := run(args, nil, io.Discard, io.Discard); code != exitOK {
					b.Fatalf("exit %d", code)
				}
				base, cli = base+t1.Sub(t0), cli+time.Since(t1)
			}
			b.ReportMetric(float64(cli)/float64(base), "cli/csv")
		})
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

package table

import (
	"bytes"
	"math/rand/v2"
	"strconv"
	"testing"
)

// benchData is a million rows of route,value over 1,000 labels, the
// shape of cmd/plumb's BenchmarkBarsCLI input, from a fixed seed.
func benchData() []byte {
	rng := rand.New(rand.NewPCG(2024, 11))
	var b bytes.Buffer
	b.WriteString("route,value\n")
	num := make([]byte, 0, 32)
	for range 1_000_000 {
		b.WriteString("route-")
		b.WriteString(strconv.Itoa(1000 + rng.IntN(1000)))
		b.WriteByte(',')
		num = strconv.AppendFloat(num[:0], float64(rng.IntN(1_000_000))/100, 'f', -1, 64)
		b.Write(num)
		b.WriteByte('\n')
	}
	return b.Bytes()
}

// BenchmarkReadAggregate reads the labels and values and sums by code.
func BenchmarkReadAggregate(b *testing.B) {
	data := benchData()
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		t, err := (&Reader{}).Read(bytes.NewReader(data), "bench.csv")
		if err != nil {
			b.Fatal(err)
		}
		vals, _, err := t.Numbers("value")
		if err != nil {
			b.Fatal(err)
		}
		dict, codes := t.Codes("route")
		if _, err := AggregateCodes(dict, codes, vals, "sum"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkReadSlow is the same read through encoding/csv alone, the
// path every row takes after a quote: the fast path's gain.
func BenchmarkReadSlow(b *testing.B) {
	data := benchData()
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		t, err := (&Reader{slow: true}).Read(bytes.NewReader(data), "bench.csv")
		if err != nil {
			b.Fatal(err)
		}
		if _, _, err := t.Numbers("value"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkNumbersFull isolates the full number reader on a column that
// is not plain decimals (grouped thousands), which the fast path declines.
func BenchmarkNumbersFull(b *testing.B) {
	var buf bytes.Buffer
	buf.WriteString("k;v\n")
	for i := range 200_000 {
		buf.WriteString("a;")
		buf.WriteString(strconv.Itoa(i / 1000))
		buf.WriteString(".")
		buf.WriteString(strconv.Itoa(100 + i%900))
		buf.WriteString(",5\n")
	}
	data := buf.Bytes()
	b.ReportAllocs()
	for b.Loop() {
		t, err := (&Reader{}).Read(bytes.NewReader(data), "n.csv")
		if err != nil {
			b.Fatal(err)
		}
		if _, _, err := t.Numbers("v"); err != nil {
			b.Fatal(err)
		}
	}
}

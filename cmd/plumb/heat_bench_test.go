package main

import (
	"bytes"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
	"testing"
)

// heatCSV is a wide table of n rows and d sample columns from a fixed PCG
// seed: each row a smooth bump whose place drifts with a hidden row number,
// plus noise, rows shuffled (invented values shaped like expression data).
func heatCSV(n, d int) []byte {
	rng := rand.New(rand.NewPCG(1963, 11))
	var b bytes.Buffer
	b.WriteString("gene")
	for j := range d {
		b.WriteString(",s" + strconv.Itoa(j+1))
	}
	b.WriteByte('\n')
	perm := rng.Perm(n)
	num := make([]byte, 0, 32)
	for i := range n {
		b.WriteString("g" + strconv.Itoa(i+1))
		g := float64(perm[i]) / float64(n) * float64(d)
		for k := range d {
			x := float64(k) - g
			num = strconv.AppendFloat(num[:0], 10*math.Exp(-x*x/8)+rng.NormFloat64()*0.5, 'f', 3, 64)
			b.WriteByte(',')
			b.Write(num)
		}
		b.WriteByte('\n')
	}
	return b.Bytes()
}

// BenchmarkHeatCLI is issue 11's performance target: a 9,000 × 20 heat
// map with rows and columns clustered, through the whole command (load,
// Ward clustering, leaf order, image, labels, key, SVG). It reports the
// SVG size; the target is under 5 s, 3 MB and 500 MB peak memory.
func BenchmarkHeatCLI(b *testing.B) {
	data := heatCSV(9000, 20)
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	var out bytes.Buffer
	for b.Loop() {
		out.Reset()
		var errs bytes.Buffer
		if code := run([]string{"heat", "-", "--format", "csv", "--order", "cluster", "--col-order", "cluster", "--tree", "--quiet"}, bytes.NewReader(data), &out, &errs); code != exitOK {
			b.Fatal(errs.String())
		}
	}
	b.ReportMetric(float64(out.Len())/1024, "svg-KB")
	if dir := os.Getenv("PLUMB_BENCH_OUT"); dir != "" {
		_ = os.WriteFile(filepath.Join(dir, "heat-9000.svg"), out.Bytes(), 0o644)
		_ = os.WriteFile(filepath.Join(dir, "heat-9000.csv"), data, 0o644)
	}
}

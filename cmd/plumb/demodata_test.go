package main

import (
	"bytes"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"testing"
)

// TestDemoDataReproducible runs the generator into a fresh folder and checks
// that it writes exactly the embedded files, so that `go generate` is the
// whole story of where the demo data comes from.
func TestDemoDataReproducible(t *testing.T) {
	if testing.Short() {
		t.Skip("builds and runs the generator")
	}
	goTool, err := exec.LookPath("go")
	if err != nil {
		t.Skip("the go command is not on PATH")
	}
	dir := t.TempDir()
	cmd := exec.Command(goTool, "run", "../../testdata/ferrygen", "-o", dir)
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go run ferrygen: %v\n%s", err, out)
	}
	generated, err := filepath.Glob(filepath.Join(dir, "*.csv"))
	if err != nil {
		t.Fatal(err)
	}
	embedded, err := fs.Glob(demoFS, "demodata/*.csv")
	if err != nil {
		t.Fatal(err)
	}
	var genNames, embNames []string
	for _, p := range generated {
		genNames = append(genNames, filepath.Base(p))
	}
	for _, p := range embedded {
		embNames = append(embNames, filepath.Base(p))
	}
	if !slices.Equal(genNames, embNames) {
		t.Fatalf("generator writes %q, the binary embeds %q; run go generate ./cmd/plumb", genNames, embNames)
	}
	for _, name := range genNames {
		want, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil {
			t.Fatal(err)
		}
		got, err := demoFS.ReadFile("demodata/" + name)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(got, want) {
			t.Errorf("demodata/%s differs from the generator's output; run go generate ./cmd/plumb", name)
		}
	}
}

// TestDemoDataLoads reads every demo file through ReadTable and checks the
// shapes the gallery relies on.
func TestDemoDataLoads(t *testing.T) {
	tests := []struct {
		file    string
		rows    int
		numeric []string
	}{
		{"routes.csv", 20, []string{"passengers", "punctuality_pct", "fuel_per_trip", "crossing_minutes", "fare"}},
		{"change.csv", 9, []string{"change_pct"}},
		{"punctuality.csv", 72, []string{"on_time_pct"}},
		{"fuel.csv", 24, []string{"vessel_a", "vessel_b"}},
		{"daily.csv", 3653, []string{"passengers"}},
		{"loads.csv", 7 * 17, []string{"hour", "load_pct"}},
	}
	for _, tc := range tests {
		t.Run(tc.file, func(t *testing.T) {
			f, err := demoFS.Open("demodata/" + tc.file)
			if err != nil {
				t.Fatal(err)
			}
			defer f.Close()
			tab, err := ReadTable(f, tc.file, "", nil)
			if err != nil {
				t.Fatal(err)
			}
			if tab.Len() != tc.rows {
				t.Errorf("%d rows, want %d", tab.Len(), tc.rows)
			}
			for _, col := range tc.numeric {
				_, missing, err := tab.Numbers(col)
				if err != nil || len(missing) > 0 {
					t.Errorf("column %s: %v, %d missing", col, err, len(missing))
				}
			}
		})
	}
	info, err := fs.Stat(demoFS, "demodata/daily.csv")
	if err != nil || info.Size() >= 150<<10 {
		t.Errorf("daily.csv should stay under 150 KB: %v %v", info, err)
	}
	change, _ := demoFS.Open("demodata/change.csv")
	tab, _ := ReadTable(change, "change.csv", "", nil)
	vals, _, _ := tab.Numbers("change_pct")
	if slices.Min(vals) >= 0 || slices.Max(vals) <= 0 {
		t.Errorf("change.csv should hold rises and falls: %v", vals)
	}
}

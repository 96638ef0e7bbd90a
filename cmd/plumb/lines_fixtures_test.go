package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// lineFixtures are invented tables shaped like the real ones that misled
// the defaults (issue 7): daily readings with isolated values between gaps,
// annual whole-number years, four indices, two series that cross twice.
// Each is pinned as a golden figure, and checked like the gallery.
var lineFixtures = []struct {
	name string
	args []string
}{
	{"fixture-lines-gaps", []string{"lines", "daily_gaps.csv", "--title", "Ozone readings with gaps", "--subtitle", "Single readings between two gaps are drawn as dots"}},
	{"fixture-lines-years", []string{"lines", "annual_years.csv", "--title", "Births per 1,000 people by year"}},
	{"fixture-lines-indices", []string{"lines", "four_indices.csv", "--index", "--title", "Four share indices, first month = 100"}},
	{"fixture-lines-indices-slide", []string{"lines", "four_indices.csv", "--index", "--for", "slide", "--title", "Four share indices, first month = 100"}},
	{"fixture-diff-crossing", []string{"diff", "crossing.csv", "--title", "North and south routes cross twice"}},
	{"fixture-diff-crossing-context", []string{"diff", "crossing.csv", "--context", "--unit", "passengers", "--title", "North and south routes cross twice"}},
}

func TestLineFixturesGolden(t *testing.T) {
	dir := t.TempDir()
	for _, fx := range lineFixtures {
		t.Run(fx.name, func(t *testing.T) {
			args := append([]string{}, fx.args...)
			args[1] = filepath.Join("..", "..", "testdata", "lines", args[1])
			out := filepath.Join(dir, fx.name+".svg")
			var stderr bytes.Buffer
			if code := run(append(args, "-o", out), nil, &bytes.Buffer{}, &stderr); code != exitOK {
				t.Fatalf("exit %d: %s", code, stderr.String())
			}
			got, err := os.ReadFile(out)
			if err != nil {
				t.Fatal(err)
			}
			checkFigure(t, got)
			renderable(t, out)
			matchGolden(t, filepath.Join(goldenDir, fx.name+".svg"), got)
		})
	}
}

// TestLineFixturesHonest checks what each fixture is for, through the CLI.
func TestLineFixturesHonest(t *testing.T) {
	path := func(name string) string { return filepath.Join("..", "..", "testdata", "lines", name) }
	svgOf := func(args ...string) (*svgNode, string) {
		t.Helper()
		var out, stderr bytes.Buffer
		if code := run(args, nil, &out, &stderr); code != exitOK {
			t.Fatalf("%v: exit %d: %s", args, code, stderr.String())
		}
		return parseSVG(t, out.Bytes()), stderr.String()
	}
	t.Run("isolated readings are drawn", func(t *testing.T) {
		root, stderr := svgOf("lines", path("daily_gaps.csv"))
		dots := root.all("circle", "plumb-mark")
		if len(dots) == 0 {
			t.Fatal("no dots for the readings between gaps")
		}
		if !strings.Contains(stderr, "drawn as dots") {
			t.Errorf("the note does not say so: %s", stderr)
		}
	})
	t.Run("years are whole years", func(t *testing.T) {
		root, stderr := svgOf("lines", path("annual_years.csv"), "--explain")
		for _, n := range root.all("text", "plumb-tick") {
			if n.Attr["text-anchor"] == "middle" && (strings.ContainsAny(n.Text, ",.") || len(n.Text) != 4) {
				t.Errorf("x tick %q is not a year", n.Text)
			}
		}
		if !strings.Contains(stderr, "as years") {
			t.Errorf("no note on years: %s", stderr)
		}
	})
	t.Run("index charts carry a 100 line", func(t *testing.T) {
		root, _ := svgOf("lines", path("four_indices.csv"), "--index")
		refs := root.all("path", "plumb-ref")
		if len(refs) != 1 || refs[0].Attr["data-value"] != "100" {
			t.Fatalf("want one plumb-ref with data-value 100, got %d", len(refs))
		}
		found := false
		for _, n := range root.all("text", "plumb-tick") {
			found = found || n.Text == "100"
		}
		if !found {
			t.Error("no tick labelled 100")
		}
	})
	t.Run("fifty series are refused with alternatives", func(t *testing.T) {
		var out, stderr bytes.Buffer
		code := run([]string{"lines", path("fifty_series.csv"), "--series", "station"}, nil, &out, &stderr)
		if code != 1 {
			t.Fatalf("exit %d, want 1 (a refusal): %s", code, stderr.String())
		}
		for _, w := range []string{"highlight", "aggregate", "filter"} {
			if !strings.Contains(stderr.String(), w) {
				t.Errorf("the refusal does not offer %q: %s", w, stderr.String())
			}
		}
	})
}

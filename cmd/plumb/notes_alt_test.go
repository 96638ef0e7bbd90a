package main

import (
	"encoding/xml"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"plumb/palette"
)

// svgDesc is the <desc> of an SVG document.
func svgDesc(t *testing.T, svg []byte) string {
	t.Helper()
	var doc struct {
		Desc string `xml:"desc"`
	}
	if err := xml.Unmarshal(svg, &doc); err != nil {
		t.Fatal(err)
	}
	return doc.Desc
}

// TestAlt checks --alt: the description alone on standard output without
// -o; with -o the figure in the file and its <desc> on standard output,
// the same text, for SVG and PNG alike.
func TestAlt(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "regions.csv", eightRegions)

	code, stdout, stderr := plumb(t, "", "bars", data, "--alt")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if strings.Contains(stdout, "<svg") || !strings.HasPrefix(stdout, "Bar chart of revenue by region") || !strings.HasSuffix(stdout, ".\n") {
		t.Errorf("--alt without -o printed %q, want the description alone", stdout)
	}
	if !strings.Contains(stdout, "Largest: West at 410; smallest: Islands at 55") {
		t.Errorf("description %q lacks the extremes", stdout)
	}

	out := filepath.Join(dir, "out.svg")
	code, withFile, stderr := plumb(t, "", "bars", data, "--alt", "-o", out)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	svg, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	if got := svgDesc(t, svg); got+"\n" != withFile || withFile != stdout {
		t.Errorf("--alt -o printed %q; the file's desc is %q", withFile, got)
	}

	png := filepath.Join(dir, "out.png")
	code, withPNG, stderr := plumb(t, "", "bars", data, "--alt", "-o", png)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	head, err := os.ReadFile(png)
	if err != nil || !strings.HasPrefix(string(head), pngSignature) {
		t.Errorf("--alt -o out.png wrote no PNG (%v)", err)
	}
	if withPNG != stdout {
		t.Errorf("--alt with a PNG printed %q, want %q", withPNG, stdout)
	}
}

// TestColorsFlag checks --colors: the colours are used, a red/green pair
// is warned about on standard error with the distance package palette
// measures, and a value that is not a colour is a usage error naming it.
func TestColorsFlag(t *testing.T) {
	dir := t.TempDir()
	data := writeFile(t, dir, "fuel.csv", "month,north,south\n2024-01,10,12\n2024-02,11,12.5\n2024-03,13,12\n2024-04,12,14\n")
	out := filepath.Join(dir, "out.svg")
	code, _, stderr := plumb(t, "", "lines", data, "--colors", "#d62728, #2ca02c", "-o", out)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	svg, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	for _, hex := range []string{"#d62728", "#2ca02c"} {
		if !strings.Contains(string(svg), `stroke="`+hex+`"`) {
			t.Errorf("no line stroked %s", hex)
		}
	}
	red, _ := palette.ParseHex("#d62728")
	green, _ := palette.ParseHex("#2ca02c")
	r := palette.Check([]palette.SRGB{red, green}, palette.SRGB{R: 1, G: 1, B: 1})
	d := r.Pairs[0].Distance[palette.Deutan]
	if d >= palette.MinPairDistance {
		t.Fatalf("fixture: red and green are %.1f apart for deutan vision", d)
	}
	want := fmt.Sprintf("%.1f for deutan vision", float64(int(d*10))/10)
	if !strings.Contains(stderr, "note: the colours #d62728 and #2ca02c are hard to tell apart") || !strings.Contains(stderr, want) {
		t.Errorf("stderr %q lacks the warning with %q", stderr, want)
	}
	if !strings.Contains(string(svg), `code="colors-cvd" changed="true"`) {
		t.Error("the metadata lacks the colors-cvd note")
	}

	code, _, stderr = plumb(t, "", "bars", data, "--label", "month", "--value", "north", "--colors", "#1f5fa8,#12345g")
	if code != exitUsage || !strings.Contains(stderr, `"#12345g"`) || !strings.Contains(stderr, "--colors") {
		t.Errorf("bad hex: exit %d, %q; want a usage error naming the value", code, stderr)
	}

	code, _, stderr = plumb(t, "", "bars", data, "--label", "month", "--value", "north", "--colors", "#1f5fa8", "--quiet")
	if code != exitOK || stderr != "" {
		t.Errorf("a safe colour with --quiet: exit %d, stderr %q", code, stderr)
	}
}

// TestReadmeAltExample runs the README's --alt example and requires the
// text it shows.
func TestReadmeAltExample(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	const cmd = "$ plumb bars orders.csv --label product --value amount --alt -o orders.svg\n"
	_, after, ok := strings.Cut(string(readme), cmd)
	if !ok {
		t.Fatal("the README lacks its --alt example")
	}
	want, _, _ := strings.Cut(after, "\n")
	dir := t.TempDir()
	writeFile(t, dir, "orders.csv", "order,product,amount\n1,Tea,12\n2,Coffee,30\n3,Tea,8\n4,Cocoa,5\n5,Coffee,22\n6,Juice,9\n7,Water,4\n8,Tea,6\n")
	t.Chdir(dir)
	code, stdout, stderr := plumb(t, "", strings.Fields(cmd)[2:]...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if stdout != want+"\n" {
		t.Errorf("--alt printed %q; the README shows %q", stdout, want)
	}
}

// TestFigureAlt checks plumb figure --alt: one figure's description alone
// without -o, and the figure still written with -o.
func TestFigureAlt(t *testing.T) {
	file := filepath.Join("..", "..", "testdata", "figure", "slide.json")
	code, stdout, stderr := plumb(t, "", "figure", file, "--alt", "--quiet")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if !strings.HasPrefix(stdout, "4 panels. ") || strings.Contains(stdout, "<svg") {
		t.Errorf("figure --alt printed %q, want the description alone", stdout)
	}
	out := filepath.Join(t.TempDir(), "fig.svg")
	code, withFile, stderr := plumb(t, "", "figure", file, "--alt", "--quiet", "-o", out)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	svg, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	if withFile != stdout || svgDesc(t, svg)+"\n" != stdout {
		t.Errorf("figure --alt -o printed %q, the file's desc is %q", withFile, svgDesc(t, svg))
	}
}

package main

import (
	"encoding/xml"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"plumb/render"
)

// goldenNotes reads the notes of a figure's metadata.
func goldenNotes(t *testing.T, path string) []render.Note {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Notes []struct {
			Code    string `xml:"code,attr"`
			Changed bool   `xml:"changed,attr"`
			Text    string `xml:",chardata"`
		} `xml:"metadata>notes>note"`
	}
	if err := xml.Unmarshal(data, &doc); err != nil {
		t.Fatal(err)
	}
	out := make([]render.Note, len(doc.Notes))
	for i, n := range doc.Notes {
		out[i] = render.Note{Code: n.Code, Changed: n.Changed, Text: n.Text}
	}
	return out
}

// TestGoldenNoteCodes checks that every note in every golden figure's
// metadata carries a documented code (render.NoteCodes), and that a note
// marked changed has a code documented as one that reports changes.
func TestGoldenNoteCodes(t *testing.T) {
	doc := map[string]render.NoteCode{}
	for _, c := range render.NoteCodes {
		doc[c.Code] = c
	}
	files, _ := filepath.Glob(filepath.Join(goldenDir, "*.svg"))
	notes := 0
	for _, path := range files {
		for _, n := range goldenNotes(t, path) {
			notes++
			c, ok := doc[n.Code]
			switch {
			case !ok:
				t.Errorf("%s: note %q has code %q, not in render.NoteCodes", filepath.Base(path), n.Text, n.Code)
			case n.Changed && !c.Changed:
				t.Errorf("%s: note %q is marked changed, but code %q is documented as not", filepath.Base(path), n.Text, n.Code)
			}
		}
	}
	if notes < len(files) {
		t.Fatalf("only %d notes in %d golden figures: is the metadata read?", notes, len(files))
	}
}

// TestOtherInMetadata checks the Other grouping is recorded in the
// figure's metadata with its code, and that --quiet prints nothing while
// the metadata keeps it.
func TestOtherInMetadata(t *testing.T) {
	dir := t.TempDir()
	data := filepath.Join(dir, "sales.csv")
	var b strings.Builder
	b.WriteString("shop,units\n")
	for i, n := range []string{"Ash", "Birch", "Cedar", "Damson", "Elm", "Fir", "Gorse", "Hazel", "Ivy", "Juniper", "Larch", "Maple", "Nettle", "Oak", "Pine"} {
		b.WriteString(n + "," + strconv.Itoa(10+i) + "\n")
	}
	if err := os.WriteFile(data, []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "out.svg")
	_, _, stderr := plumb(t, "", "bars", data, "--agg", "sum", "--top", "5", "-o", out, "--quiet")
	if stderr != "" {
		t.Errorf("--quiet printed %q", stderr)
	}
	var other *render.Note
	for _, n := range goldenNotes(t, out) {
		if n.Code == "other" {
			other = &n
		}
	}
	if other == nil || !other.Changed || !strings.Contains(other.Text, "Other (11)") {
		t.Errorf("metadata lacks the Other grouping: %+v", other)
	}
}

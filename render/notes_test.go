package render

import (
	"go/ast"
	"go/parser"
	"go/token"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
)

// noteCall is one note code written in the source, with its Changed flag
// when the source gives it as a literal.
type noteCall struct {
	code    string
	changed string // "true", "false" or "" when not a literal
	pos     string
}

// sourceNoteCodes finds every note code written as a string literal in the
// packages that make notes: arguments of Note and note calls (Scene.Note,
// the line chart's note) and Code fields of Note literals (render.Note,
// table.Note).
func sourceNoteCodes(t *testing.T) []noteCall {
	t.Helper()
	var out []noteCall
	fset := token.NewFileSet()
	for _, dir := range []string{".", "../cmd/plumb", "../internal/table"} {
		files, err := filepath.Glob(filepath.Join(dir, "*.go"))
		if err != nil {
			t.Fatal(err)
		}
		for _, path := range files {
			if strings.HasSuffix(path, "_test.go") {
				continue
			}
			f, err := parser.ParseFile(fset, path, nil, 0)
			if err != nil {
				t.Fatal(err)
			}
			ast.Inspect(f, func(n ast.Node) bool {
				switch n := n.(type) {
				case *ast.CallExpr:
					sel, ok := n.Fun.(*ast.SelectorExpr)
					if !ok || (sel.Sel.Name != "Note" && sel.Sel.Name != "note") || len(n.Args) != 3 {
						return true
					}
					if code, ok := stringLit(n.Args[0]); ok {
						out = append(out, noteCall{code: code, changed: identName(n.Args[1]), pos: fset.Position(n.Pos()).String()})
					}
				case *ast.CompositeLit:
					var code, changed string
					for _, e := range n.Elts {
						kv, ok := e.(*ast.KeyValueExpr)
						if !ok {
							continue
						}
						switch identName(kv.Key) {
						case "Code":
							code, _ = stringLit(kv.Value)
						case "Changed":
							changed = identName(kv.Value)
						}
					}
					if code != "" {
						if changed == "" {
							changed = "false" // the zero value
						}
						out = append(out, noteCall{code: code, changed: changed, pos: fset.Position(n.Pos()).String()})
					}
				}
				return true
			})
		}
	}
	return out
}

func stringLit(e ast.Expr) (string, bool) {
	lit, ok := e.(*ast.BasicLit)
	if !ok || lit.Kind != token.STRING {
		return "", false
	}
	s, err := strconv.Unquote(lit.Value)
	return s, err == nil
}

func identName(e ast.Expr) string {
	if id, ok := e.(*ast.Ident); ok {
		return id.Name
	}
	return ""
}

// TestNoteCodesDocumented holds the source and NoteCodes together: every
// code a builder writes is in the table, with Changed true when any of its
// notes reports a change, and every code in the table is written somewhere.
func TestNoteCodesDocumented(t *testing.T) {
	calls := sourceNoteCodes(t)
	if len(calls) < 50 {
		t.Fatalf("found only %d note codes in the source: is the scan broken?", len(calls))
	}
	used := map[string]bool{}
	for _, c := range calls {
		used[c.code] = true
		doc, ok := noteCode(c.code)
		if !ok {
			t.Errorf("%s: note code %q is not in NoteCodes (render/notes.go)", c.pos, c.code)
			continue
		}
		if c.changed == "true" && !doc.Changed {
			t.Errorf("%s: a %q note reports a change, but NoteCodes says its notes do not", c.pos, c.code)
		}
	}
	for _, c := range NoteCodes {
		if !used[c.Code] {
			t.Errorf("NoteCodes lists %q, which no code writes", c.Code)
		}
	}
}

// TestNoteCodesTable keeps the table sorted, without duplicates, and every
// entry filled in.
func TestNoteCodesTable(t *testing.T) {
	codes := make([]string, len(NoteCodes))
	for i, c := range NoteCodes {
		codes[i] = c.Code
		if c.Where == "" || c.Meaning == "" || strings.ContainsAny(c.Code+c.Where+c.Meaning, "|\n") {
			t.Errorf("%q: fill in Where and Meaning, without | or newlines", c.Code)
		}
	}
	if !slices.IsSorted(codes) {
		t.Error("NoteCodes is not in alphabetical order")
	}
	if len(slices.Compact(slices.Clone(codes))) != len(codes) {
		t.Error("NoteCodes lists a code twice")
	}
}

// TestNoteCodesInDevelopers checks that DEVELOPERS.md carries the table
// generated from NoteCodes, so the documentation cannot drift from it.
func TestNoteCodesInDevelopers(t *testing.T) {
	doc, err := os.ReadFile("../DEVELOPERS.md")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(doc), NoteCodesMarkdown()) {
		t.Errorf("DEVELOPERS.md lacks the current table of note codes; paste NoteCodesMarkdown() into its \"Note codes\" section:\n%s", NoteCodesMarkdown())
	}
}

// TestSceneNoteCodes draws scenes that make many kinds of note and checks
// every code they record is documented.
func TestSceneNoteCodes(t *testing.T) {
	labels := make([]string, 20)
	values := make([]float64, 20)
	for i := range labels {
		labels[i] = "category " + strconv.Itoa(i+1)
		values[i] = float64(100 - 3*i)
	}
	red, green := mustColour(t, "#d62728"), mustColour(t, "#2ca02c")
	var scenes []*Scene
	add := func(s *Scene, err error) {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
		scenes = append(scenes, s)
	}
	add(BarsScene(labels, values, BarsOptions{Additive: true, Common: Common{Colors: []Colour{red, green}}}))
	add(DotsScene(labels, values, DotsOptions{}))
	x := []float64{1, 2, 3, 4, 5}
	add(LinesScene([]Series{{Name: "a", X: x, Y: []float64{1, 3, 2, 5, 4}}, {Name: "b", X: x, Y: []float64{2, 2, 3, 3, 4}}, {Name: "c", X: x, Y: []float64{5, 1, 2, 3, 1}}},
		LinesOptions{Common: Common{Colors: []Colour{red, green}}}))
	var domain string
	for _, n := range scenes[1].Notes {
		if n.Code == "dots-domain" {
			domain = n.Text
		}
	}
	// The dots run from 43 to 100: nice ends below and above, never zero.
	if !strings.HasPrefix(domain, "the value axis runs from 40 to 100, not from zero") {
		t.Errorf("dots-domain note %q", domain)
	}
	codes := 0
	for _, s := range scenes {
		for _, n := range s.Notes {
			codes++
			if _, ok := noteCode(n.Code); !ok {
				t.Errorf("note %q has code %q, not in NoteCodes", n.Text, n.Code)
			}
		}
	}
	if codes == 0 {
		t.Fatal("the scenes made no notes")
	}
}

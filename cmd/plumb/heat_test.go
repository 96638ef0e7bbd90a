package main

import (
	"bytes"
	"cmp"
	"encoding/xml"
	"io"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"

	"plumb/palette"
)

// The heat command reads the long and the wide form, and bad input gets an
// error naming the file, line and cells.
func TestHeatCLI(t *testing.T) {
	cases := []struct {
		name    string
		data    string
		args    []string
		code    int
		want    []string // in the SVG, or in the error
		notWant []string
	}{
		{"long form", "stop,day,load\nQuay,Mon,20\nQuay,Tue,25\nPoint,Mon,60\nPoint,Tue,\n",
			[]string{"--row", "stop", "--col", "day", "--value", "load"}, exitOK,
			[]string{`data-row="Quay" data-col="Tue" data-value="25"`, `class="plumb-mark plumb-missing"`, "no data"}, nil},
		{"wide form", "stop,Mon,Tue\nQuay,20,25\nPoint,60,61\n", nil, exitOK,
			[]string{`data-row="Point" data-col="Tue" data-value="61"`}, []string{"plumb-missing"}},
		{"both signs: diverging", "stop,Mon,Tue\nQuay,-20,25\nPoint,60,61\n", nil, exitOK,
			[]string{"colours part at 0"}, nil},
		{"text column left out", "stop,Mon,Tue,remark\nQuay,20,25,calm\nPoint,60,61,windy\n", nil, exitOK,
			[]string{`left out "remark"`}, []string{`data-col="remark"`}},
		{"given middle", "stop,Mon,Tue\nQuay,20,25\nPoint,60,61\n", []string{"--mid", "40"}, exitOK,
			[]string{"colours part at 40"}, nil},
		{"cell twice", "stop,day,load\nQuay,Mon,20\nQuay,Mon,25\n",
			[]string{"--row", "stop", "--col", "day", "--value", "load"}, 1,
			[]string{"line 3", "line 2", `"Quay"`, `"Mon"`}, nil},
		{"long form half given", "stop,day,load\nQuay,Mon,20\n", []string{"--row", "stop"}, 2,
			[]string{"--row, --col and --value"}, nil},
		{"missing column", "stop,day,load\nQuay,Mon,20\n", []string{"--row", "stop", "--col", "week", "--value", "load"}, 1,
			[]string{"week"}, nil},
		{"tree without clustering", "stop,Mon,Tue\nQuay,20,25\nPoint,60,61\nSands,1,2\n", []string{"--tree"}, 2,
			[]string{"--order cluster"}, nil},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var out, errs bytes.Buffer
			args := append([]string{"heat", "-", "--format", "csv"}, c.args...)
			code := run(args, strings.NewReader(c.data), &out, &errs)
			if code != c.code {
				t.Fatalf("exit %d, want %d: %s", code, c.code, errs.String())
			}
			got := out.String() + errs.String()
			for _, w := range c.want {
				if !strings.Contains(got, w) {
					t.Errorf("no %q in output:\n%s", w, errs.String())
				}
			}
			for _, w := range c.notWant {
				if strings.Contains(got, w) {
					t.Errorf("%q in output", w)
				}
			}
		})
	}
}

// FuzzHeat feeds arbitrary tables to plumb heat in both forms and with
// every order: it exits 0 with well-formed XML, 1 with a message, or 2 for
// a flag the data cannot serve, and never panics.
func FuzzHeat(f *testing.F) {
	for _, seed := range []string{
		"stop,Mon,Tue\nQuay,20,25\nPoint,60,61\nSands,,3\n",
		"r,c,v\na,x,1\na,y,2\nb,x,-3\nb,y,\n",
		"r,c,v\na,x,1\na,x,2\n",
		"k,v\n\"<b>\",1e308\nq,-1e308\n",
		"a,b\n,\n",
	} {
		for v := range uint8(5) {
			f.Add(seed, v)
		}
	}
	variants := [][]string{
		nil,
		{"--order", "cluster", "--col-order", "cluster", "--tree"},
		{"--row", "r", "--col", "c", "--value", "v", "--order", "value"},
		{"--order", "label", "--for", "print", "--mid", "2"},
		{"--order", "cluster", "--for", "slide", "--col-order", "value"},
	}
	f.Fuzz(func(t *testing.T, data string, variant uint8) {
		args := append([]string{"heat", "-", "--format", "csv", "--quiet"}, variants[int(variant)%len(variants)]...)
		var out, errs bytes.Buffer
		code := run(args, strings.NewReader(data), &out, &errs)
		switch code {
		case exitOK:
			dec := xml.NewDecoder(&out)
			for {
				_, err := dec.Token()
				if err == io.EOF {
					break
				}
				if err != nil {
					t.Fatalf("%v on %q: output is not XML: %v", args, data, err)
				}
			}
		case exitData, 2:
			if errs.Len() == 0 {
				t.Fatalf("%v on %q: exit %d without a message", args, data, code)
			}
		default:
			t.Fatalf("%v on %q: exit %d: %s", args, data, code, errs.String())
		}
	})
}

// Issue 11's check through the command line: a shuffled 60 × 12 table in
// cluster order is at least 3× smoother (sum of Euclidean distances between
// neighbouring rows, read back from the cells' data-value) than in the
// input order, and the cells' lightness never rises with their value.
func TestHeatCLIClusterSmoothAndDarkerForMore(t *testing.T) {
	data := heatCSV(60, 12)
	// heatCSV has noise around zero; lift it so that the scale is sequential.
	var lifted bytes.Buffer
	for i, line := range strings.Split(strings.TrimSpace(string(data)), "\n") {
		if i == 0 {
			lifted.WriteString(line + "\n")
			continue
		}
		f := strings.Split(line, ",")
		for j := 1; j < len(f); j++ {
			v, _ := strconv.ParseFloat(f[j], 64)
			f[j] = strconv.FormatFloat(v+3, 'f', 3, 64)
		}
		lifted.WriteString(strings.Join(f, ",") + "\n")
	}
	rows := func(args ...string) (order []string, vals [][]float64, cells []heatCell) {
		var out, errs bytes.Buffer
		if code := run(append([]string{"heat", "-", "--format", "csv"}, args...), bytes.NewReader(lifted.Bytes()), &out, &errs); code != exitOK {
			t.Fatal(errs.String())
		}
		cells = heatCells(t, out.String())
		for _, c := range cells {
			if len(order) == 0 || order[len(order)-1] != c.row {
				order = append(order, c.row)
				vals = append(vals, nil)
			}
			vals[len(vals)-1] = append(vals[len(vals)-1], c.value)
		}
		return order, vals, cells
	}
	path := func(vals [][]float64) float64 {
		var s float64
		for i := 1; i < len(vals); i++ {
			var d float64
			for j := range vals[i] {
				d += (vals[i][j] - vals[i-1][j]) * (vals[i][j] - vals[i-1][j])
			}
			s += math.Sqrt(d)
		}
		return s
	}
	inOrder, inVals, _ := rows()
	clOrder, clVals, cells := rows("--order", "cluster")
	if len(inOrder) != 60 || len(clOrder) != 60 {
		t.Fatalf("%d and %d rows drawn, want 60", len(inOrder), len(clOrder))
	}
	if in, cl := path(inVals), path(clVals); cl*3 > in {
		t.Errorf("cluster order path %.1f, input %.1f: %.2f× smoother, want ≥ 3×", cl, in, in/cl)
	}
	slices.SortFunc(cells, func(a, b heatCell) int { return cmp.Compare(a.value, b.value) })
	for i := 1; i < len(cells); i++ {
		if cells[i].lightness > cells[i-1].lightness+1e-9 {
			t.Fatalf("value %g has L* %.2f, lighter than %g at %.2f", cells[i].value, cells[i].lightness, cells[i-1].value, cells[i-1].lightness)
		}
	}
}

// heatCell is one <rect> cell read back from the SVG.
type heatCell struct {
	row       string
	value     float64
	lightness float64 // CIELAB L* of its fill
}

var heatRect = regexp.MustCompile(`<rect [^>]*fill="(#[0-9a-f]{6})" data-row="([^"]*)" data-col="[^"]*" data-value="([^"]+)"`)

func heatCells(t *testing.T, svg string) []heatCell {
	t.Helper()
	var out []heatCell
	for _, m := range heatRect.FindAllStringSubmatch(svg, -1) {
		c, err := palette.ParseHex(m[1])
		if err != nil {
			t.Fatal(err)
		}
		v, err := strconv.ParseFloat(m[3], 64)
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, heatCell{row: m[2], value: v, lightness: palette.SRGBToLab(c).L})
	}
	return out
}

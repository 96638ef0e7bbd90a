package main

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"io"
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"plumb/layout"
	"plumb/scale"
)

// svgNode is a parsed SVG element, enough to measure a figure from outside,
// the way a reviewer or an audit would.
type svgNode struct {
	Name     string
	Attr     map[string]string
	Text     string
	Children []*svgNode
	DX, DY   float64 // accumulated translate of the enclosing groups
}

func parseSVG(t *testing.T, data []byte) *svgNode {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(data))
	var stack []*svgNode
	var root *svgNode
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("SVG does not parse as XML: %v", err)
		}
		switch tok := tok.(type) {
		case xml.StartElement:
			n := &svgNode{Name: tok.Name.Local, Attr: map[string]string{}}
			for _, a := range tok.Attr {
				n.Attr[a.Name.Local] = a.Value
			}
			if len(stack) > 0 {
				p := stack[len(stack)-1]
				n.DX, n.DY = p.DX, p.DY
				p.Children = append(p.Children, n)
			} else {
				root = n
			}
			if tr := n.Attr["transform"]; tr != "" {
				var dx, dy float64
				if _, err := fmt.Sscanf(tr, "translate(%g,%g)", &dx, &dy); err != nil {
					t.Fatalf("transform %q is not a plain translate", tr)
				}
				n.DX += dx
				n.DY += dy
			}
			stack = append(stack, n)
		case xml.EndElement:
			stack = stack[:len(stack)-1]
		case xml.CharData:
			if len(stack) > 0 {
				stack[len(stack)-1].Text += string(tok)
			}
		}
	}
	if root == nil || root.Name != "svg" {
		t.Fatalf("no <svg> root")
	}
	return root
}

// walk visits every element below n in document order.
func (n *svgNode) walk(visit func(*svgNode)) {
	for _, c := range n.Children {
		visit(c)
		c.walk(visit)
	}
}

func (n *svgNode) all(name, class string) []*svgNode {
	var out []*svgNode
	n.walk(func(c *svgNode) {
		if c.Name == name && (class == "" || hasClass(c, class)) {
			out = append(out, c)
		}
	})
	return out
}

func hasClass(n *svgNode, class string) bool {
	for _, c := range strings.Fields(n.Attr["class"]) {
		if c == class {
			return true
		}
	}
	return false
}

func (n *svgNode) num(t *testing.T, attr string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(n.Attr[attr], 64)
	if err != nil {
		t.Fatalf("<%s %s=%q>: %v", n.Name, attr, n.Attr[attr], err)
	}
	return v
}

// textBoxes measures every <text> with the same fonts layout used.
func textBoxes(t *testing.T, root *svgNode) ([]layout.Box, []string) {
	var boxes []layout.Box
	var texts []string
	fonts := layout.Fonts{}
	for _, n := range root.all("text", "") {
		anchor := 0
		switch n.Attr["text-anchor"] {
		case "middle":
			anchor = 1
		case "end":
			anchor = 2
		}
		face := fonts.Face(n.Attr["font-weight"] == "bold")
		b := layout.TextBox(face, n.Text, n.num(t, "font-size"), n.num(t, "x")+n.DX, n.num(t, "y")+n.DY, anchor)
		boxes = append(boxes, b)
		texts = append(texts, n.Text)
	}
	return boxes, texts
}

// checkFigure asserts what every figure must satisfy: an accessible root,
// a description, no text overlapping other text or leaving the canvas.
// notFinite matches how Go writes numbers that are not finite ("NaN",
// "+Inf", "-Inf", and "−Inf" with the minus our number formats use), where
// no letter touches them, so that words like "Info" pass.
var notFinite = regexp.MustCompile(`(^|[^\pL])(NaN|[+\-−]Inf)([^\pL]|$)`)

// checkNoNaN fails when a figure carries a number that is not finite
// anywhere: an attribute such as width="+Inf", a path through NaN, a
// "NaN%" label, or a description or note quoting one.
func checkNoNaN(t *testing.T, data []byte) {
	t.Helper()
	if loc := notFinite.FindIndex(data); loc != nil {
		lo, hi := max(0, loc[0]-120), min(len(data), loc[1]+60)
		t.Errorf("the figure holds a number that is not finite: …%s…", data[lo:hi])
	}
}

func checkFigure(t *testing.T, data []byte) *svgNode {
	t.Helper()
	checkNoNaN(t, data)
	root := parseSVG(t, data)
	if root.Attr["role"] != "img" {
		t.Errorf(`root has role=%q, want "img"`, root.Attr["role"])
	}
	ids := strings.Fields(root.Attr["aria-labelledby"])
	if len(ids) != 2 {
		t.Errorf("aria-labelledby=%q, want the title and desc ids", root.Attr["aria-labelledby"])
	}
	titles, descs := 0, 0
	for _, c := range root.Children {
		switch c.Name {
		case "title":
			titles++
			if strings.TrimSpace(c.Text) == "" {
				t.Errorf("empty <title>: every figure needs an accessible name")
			}
		case "desc":
			descs++
			if strings.TrimSpace(c.Text) == "" {
				t.Errorf("empty <desc>")
			}
		}
	}
	if titles != 1 || descs != 1 {
		t.Errorf("root has %d <title> and %d <desc>, want one of each", titles, descs)
	}
	w, h := root.num(t, "width"), root.num(t, "height")
	canvas := layout.Box{X: 0, Y: 0, W: w, H: h}
	boxes, texts := textBoxes(t, root)
	for i, b := range boxes {
		if !b.Inside(canvas) {
			t.Errorf("text %q at %+v leaves the %gx%g canvas", texts[i], b, w, h)
		}
		for j := i + 1; j < len(boxes); j++ {
			if b.Overlaps(boxes[j]) {
				t.Errorf("text %q %+v overlaps %q %+v", texts[i], b, texts[j], boxes[j])
			}
		}
	}
	return root
}

// checkBars asserts the lie factor and the common baseline of bar marks:
// every bar's length is proportional to its value and starts at zero.
func checkBars(t *testing.T, root *svgNode) {
	t.Helper()
	bars := root.all("rect", "plumb-mark")
	if len(bars) == 0 {
		t.Fatal("no bars")
	}
	base := root.all("path", "plumb-baseline")
	if len(base) != 1 {
		t.Fatalf("%d baselines, want exactly one", len(base))
	}
	xs, ys := pathPoints(t, base[0].Attr["d"])
	vertical := xs[0] != xs[len(xs)-1]
	zero := xs[0]
	if vertical {
		zero = ys[0]
	}
	perUnit := math.NaN()
	for _, b := range bars {
		v := b.num(t, "data-value")
		x, y, bw, bh := b.num(t, "x"), b.num(t, "y"), b.num(t, "width"), b.num(t, "height")
		length, start, end := bw, x, x+bw
		if vertical {
			length, start, end = bh, y+bh, y
		}
		// A stacked segment starts where the segments before it end.
		if s, ok := b.Attr["data-start"]; ok && !vertical && v > 0 {
			from, err := strconv.ParseFloat(s, 64)
			// Each end is rounded to 0.005 px, which the short segment's
			// pixels per unit carry over the length before it.
			if err != nil || math.Abs(x-(zero+from*bw/v)) > 0.02+0.01*from/v {
				t.Errorf("segment %q/%q (value %g from %s) starts at x=%g", b.Attr["data-label"], b.Attr["data-series"], v, s, x)
			}
		} else if v >= 0 && math.Abs(start-zero) > 0.006 || v < 0 && math.Abs(end-zero) > 0.006 && !vertical || v < 0 && vertical && math.Abs(y-zero) > 0.006 {
			t.Errorf("bar %q (value %g) does not start at the baseline %g: x=%g y=%g w=%g h=%g", b.Attr["data-label"], v, zero, x, y, bw, bh)
		}
		if v == 0 {
			continue
		}
		k := length / math.Abs(v)
		if math.IsNaN(perUnit) {
			perUnit = k
			continue
		}
		// Tufte's lie factor between this bar and the first, within 0.5%:
		// at most 0.005 px of rounding on the shortest bar is allowed for.
		tol := 0.005 + 0.006/length
		if lf := k / perUnit; math.Abs(lf-1) > tol {
			t.Errorf("bar %q: lie factor %.4f (length %g for value %g)", b.Attr["data-label"], lf, length, v)
		}
	}
}

// pathPoints reads an absolute M/L path.
func pathPoints(t *testing.T, d string) (xs, ys []float64) {
	t.Helper()
	for _, cmd := range strings.FieldsFunc(d, func(r rune) bool { return r == 'M' || r == 'L' || r == 'Z' }) {
		a, b, ok := strings.Cut(cmd, ",")
		x, err1 := strconv.ParseFloat(a, 64)
		y, err2 := strconv.ParseFloat(b, 64)
		if !ok || err1 != nil || err2 != nil {
			t.Fatalf("path %q: bad point %q", d, cmd)
		}
		xs, ys = append(xs, x), append(ys, y)
	}
	return xs, ys
}

// checkValueLabels asserts that value labels tell values apart: two marks
// whose values differ at three significant digits never carry the same
// value label (issue 7, item 2). Each mark's value label follows it.
func checkValueLabels(t *testing.T, root *svgNode) {
	t.Helper()
	var vals []float64
	var labels []string
	pending := math.NaN()
	root.walk(func(n *svgNode) {
		switch {
		case n.Attr["class"] == "plumb-mark" && n.Attr["data-value"] != "":
			pending = n.num(t, "data-value")
		case n.Name == "text" && n.Attr["class"] == "plumb-value" && !math.IsNaN(pending):
			vals = append(vals, pending)
			labels = append(labels, n.Text)
			pending = math.NaN()
		}
	})
	r3 := func(v float64) string { return strconv.FormatFloat(v+0, 'g', 3, 64) }
	for i := range labels {
		for j := i + 1; j < len(labels); j++ {
			if labels[i] == labels[j] && r3(vals[i]) != r3(vals[j]) && !(vals[i] == 0 && vals[j] == 0) {
				t.Errorf("values %g and %g both labelled %q", vals[i], vals[j], labels[i])
			}
		}
	}
}

// checkTickFloor asserts that the value axis carries at least
// scale.MinTicks labelled ticks for its length (three beyond 150 px), and
// zero when the axis crosses it (issue 7, item 3).
func checkTickFloor(t *testing.T, root *svgNode, vertical bool) {
	t.Helper()
	ticks := root.all("text", "plumb-tick")
	if len(ticks) == 0 {
		t.Error("no labelled ticks")
		return
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	neg, pos, zero := false, false, false
	for _, n := range ticks {
		switch {
		case !strings.ContainsAny(n.Text, "123456789"):
			zero = true
		case strings.HasPrefix(n.Text, "\u2212"):
			neg = true
		default:
			pos = true
		}
		p := n.num(t, "x")
		if vertical {
			p = n.num(t, "y")
		}
		lo, hi = math.Min(lo, p), math.Max(hi, p)
	}
	if min := scale.MinTicks(hi - lo); len(ticks) < min {
		t.Errorf("%d labelled ticks on a %g px axis, want at least %d", len(ticks), hi-lo, min)
	}
	if neg && pos && !zero {
		t.Error("the axis crosses zero without labelling it")
	}
}

package render

import (
	"cmp"
	"math"
	"slices"

	"plumb/layout"
)

// This file places annotation text. Every label is measured as it will be
// set and tried at the places its annotation prefers (beside its line,
// along its reference line, above its bar); a callout, which a leader can
// join to its mark, is also tried anywhere in the plot, nearest first. It
// takes the first place where it overlaps no text the panel already drew
// (tick labels, value labels, direct labels, earlier annotations) and
// stays inside the plot, so that it never reaches the frame's title or
// notes. The whole text, wrapped if need be, comes before a shortened one
// (with the whole text as a tooltip); places clear of the data marks come
// before places crossing annotation lines, and only when there is no such
// place may a label lie over a mark, still never over text. Each placed
// box joins placed.text, so that later labels avoid it. The lines
// branch's label placer will take this over; until then this is built on
// layout's boxes and measuring only.

// spot is one place an annotation's text may take: the box its lines fill
// and the side they are aligned to.
type spot struct {
	box layout.Box
	a   Anchor
}

// noteText is an annotation's text and how it is drawn.
type noteText struct {
	text  string
	class string
	fill  Colour
	attrs []Attr
	// leader: the note may go anywhere in the plot, nearest to near
	// first, joined to near by a leader that crosses no text. Without
	// one a label stays at its own places, beside what it labels, where
	// no reader can take it for another line's.
	leader bool
}

// setting is one way of setting a text: its lines and the block they make.
type setting struct {
	lines []string
	cut   bool // shortened: the whole text goes in a tooltip
	w, h  float64
}

// settings are the ways of setting text in at most maxW px, in the order
// they are tried: one line; the whole text wrapped onto two lines, onto
// two of nine ems, onto three of six (a narrow block fits between marks);
// then shortened to three lines, to one line of ten ems and of five.
func (f *frame) settings(text string, maxW float64) []setting {
	sp := f.spec
	em := sp.text
	type try struct {
		w     float64
		lines int
		cut   bool // a shortened text is allowed
	}
	tries := []try{{maxW, 1, false}, {maxW, 2, false}, {math.Min(maxW, 9*em), 2, false}, {math.Min(maxW, 6*em), 3, false},
		{maxW, 3, true}, {math.Min(maxW, 10*em), 1, true}, {math.Min(maxW, 5*em), 1, true}}
	face := f.fonts.Face(false)
	asc, desc := face.Ascent(sp.text), face.Descent(sp.text)
	lh := lineHeight(sp.text)
	var out []setting
	for _, t := range tries {
		lines, cut := f.wrap(text, sp.text, false, t.w, t.lines)
		if len(lines) == 0 || (cut && !t.cut) {
			continue
		}
		s := setting{lines: lines, cut: cut, h: float64(len(lines)-1)*lh + asc + desc}
		for _, l := range lines {
			s.w = math.Max(s.w, math.Ceil(f.measure(l, sp.text, false)))
		}
		if !slices.ContainsFunc(out, func(o setting) bool { return slices.Equal(o.lines, s.lines) }) {
			out = append(out, s)
		}
	}
	return out
}

// placeText measures a note, finds it a free place inside bounds (the
// plot), clear of the panel's text and marks and of the boxes in avoid,
// preferably of the annotation lines in lines too, and draws it. spots gives the places the annotation prefers for a
// block w by h; after them, for a note with a leader, every place in
// bounds is tried, nearest to near first. It returns the place taken and whether it is one of the scanned
// places rather than the annotation's own (a moved note may need a
// leader). ok is false when no place is free in any setting: nothing is
// drawn.
func (f *frame) placeText(p *placed, avoid, lines []layout.Box, bounds layout.Box, n noteText, near Point, spots func(w, h float64) []spot) (_ spot, moved, ok bool) {
	sets := f.settings(n.text, math.Min(bounds.W, 24*f.spec.text))
	// Two tiers of free: clear of every mark; crossing annotation lines
	// but covering no mark. Text over a filled mark loses its contrast
	// and hides data, so it is never set there: a label with no free
	// place is left to its caller.
	const (
		clearAll = iota
		crossLines
	)
	free := func(b layout.Box, tier int) bool {
		// A hundredth of a pixel of margin: positions are written to two
		// decimals, which may move a box that much towards a neighbour.
		b = layout.Box{X: b.X - 0.01, Y: b.Y - 0.01, W: b.W + 0.02, H: b.H + 0.02}
		if !b.Inside(layout.Box{X: bounds.X - 0.02, Y: bounds.Y - 0.02, W: bounds.W + 0.04, H: bounds.H + 0.04}) {
			return false
		}
		for _, t := range p.text {
			if b.Overlaps(t) {
				return false
			}
		}
		for _, ms := range [2][]layout.Box{p.marks, avoid} {
			for _, m := range ms {
				if b.Overlaps(m) {
					return false
				}
			}
		}
		if tier == clearAll {
			for _, l := range lines {
				if b.Overlaps(l) {
					return false
				}
			}
		}
		return true
	}
	// The whole text crossing a dashed line reads better than a shortened
	// one clear of it.
	passes := []struct {
		tier int
		cut  bool
	}{{clearAll, false}, {crossLines, false}, {clearAll, true}, {crossLines, true}}
	for _, pass := range passes {
		tier := pass.tier
		for _, s := range sets {
			if s.cut && !pass.cut {
				continue
			}
			own := spots(s.w, s.h)
			cands := own
			if n.leader {
				cands = append(own, scan(bounds, s.w, s.h, near, maxLeader*f.spec.text)...)
			}
			for k, c := range cands {
				moved := k >= len(own)
				if !free(c.box, tier) {
					continue
				}
				// A leader crosses no text (the scan keeps it short
				// enough to read as a pointer).
				if moved && f.leaderCrosses(p, near, c.box) {
					continue
				}
				f.drawNote(p, n, s, c)
				return c, moved, true
			}
		}
	}
	return spot{}, false, false
}

// maxLeader is the longest leader, in ems, before notes may cover marks:
// a longer line reads as data rather than as a pointer (common practice).
const maxLeader = 6

func distance(a, b Point) float64 { return math.Hypot(a.X-b.X, a.Y-b.Y) }

// leaderCrosses reports whether a leader from the point to the box would
// cross text the panel drew: a leader must join a note to its mark
// without striking through another label.
func (f *frame) leaderCrosses(p *placed, from Point, b layout.Box) bool {
	to := nearestIn(b, from)
	for _, t := range p.text {
		if segmentHits(from, to, t) {
			return true
		}
	}
	return false
}

// nearestIn is the point of b nearest to q.
func nearestIn(b layout.Box, q Point) Point {
	return Point{math.Max(b.X, math.Min(q.X, b.X+b.W)), math.Max(b.Y, math.Min(q.Y, b.Y+b.H))}
}

// segmentHits reports whether the segment a-b passes through the inside
// of box r, by clipping the segment to the box (Liang & Barsky 1984).
func segmentHits(a, b Point, r layout.Box) bool {
	t0, t1 := 0.0, 1.0
	dx, dy := b.X-a.X, b.Y-a.Y
	for _, c := range [][2]float64{{-dx, a.X - r.X}, {dx, r.X + r.W - a.X}, {-dy, a.Y - r.Y}, {dy, r.Y + r.H - a.Y}} {
		p, q := c[0], c[1]
		if p == 0 {
			if q <= 0 {
				return false
			}
			continue
		}
		t := q / p
		if p < 0 {
			t0 = math.Max(t0, t)
		} else {
			t1 = math.Min(t1, t)
		}
	}
	return t1-t0 > 1e-9
}

// scan lists the places of a w by h block inside bounds, on a grid of
// half its size, that come within reach of near (a leader's length),
// nearest first. Only those could be joined to near, and leaving out the
// rest keeps placing fast: on a 30-row bar chart with eight annotations,
// sorting every place of the plot took 7 ms a figure, this takes under 1.
func scan(bounds layout.Box, w, h float64, near Point, reach float64) []spot {
	if w > bounds.W || h > bounds.H {
		return nil
	}
	type cand struct {
		s  spot
		d2 float64
		i  int
	}
	dx, dy := math.Max(w/2, 8), math.Max(h/2, 4)
	var cs []cand
	for y := bounds.Y; y+h <= bounds.Y+bounds.H; y += dy {
		for x := bounds.X; x+w <= bounds.X+bounds.W; x += dx {
			b := layout.Box{X: x, Y: y, W: w, H: h}
			q := nearestIn(b, near)
			d2 := (q.X-near.X)*(q.X-near.X) + (q.Y-near.Y)*(q.Y-near.Y)
			if d2 <= reach*reach {
				cs = append(cs, cand{spot{b, Start}, d2, len(cs)})
			}
		}
	}
	slices.SortFunc(cs, func(a, b cand) int {
		if c := cmp.Compare(a.d2, b.d2); c != 0 {
			return c
		}
		return a.i - b.i
	})
	out := make([]spot, len(cs))
	for i, c := range cs {
		out[i] = c.s
	}
	return out
}

// drawNote draws a placed note's lines, aligned to the spot's side, and
// records its box so that later labels avoid it.
func (f *frame) drawNote(p *placed, n noteText, s setting, c spot) {
	sp := f.spec
	asc := f.fonts.Face(false).Ascent(sp.text)
	lh := lineHeight(sp.text)
	x := c.box.X
	switch c.a {
	case Middle:
		x += c.box.W / 2
	case End:
		x += c.box.W
	}
	tip := ""
	if s.cut {
		tip = n.text
	}
	for i, l := range s.lines {
		f.scene.Add(Mark{Kind: Text, Class: n.class, X: round2(x), Y: round2(c.box.Y + asc + float64(i)*lh), Text: l, Size: sp.text, Fill: n.fill, Anchor: c.a, Attrs: n.attrs, Tooltip: tip})
	}
	p.text = append(p.text, c.box)
}

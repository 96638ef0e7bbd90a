package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"plumb/palette"
	"plumb/render"
)

// auditJSON runs plumb audit --json on files and decodes its findings.
func auditJSON(t *testing.T, files ...string) ([]finding, int) {
	t.Helper()
	var out, errs bytes.Buffer
	code := run(append([]string{"audit", "--json"}, files...), nil, &out, &errs)
	var got struct {
		Findings []finding `json:"findings"`
	}
	if code != exitUsage {
		if err := json.Unmarshal(out.Bytes(), &got); err != nil {
			t.Fatalf("audit --json %v: %v\n%s\n%s", files, err, out.String(), errs.String())
		}
		if got.Findings == nil {
			t.Fatalf("audit --json %v: findings is not a list: %s", files, out.String())
		}
	}
	return got.Findings, code
}

// byRule are the findings of one rule.
func byRule(fs []finding, rule string) []finding {
	var out []finding
	for _, f := range fs {
		if f.Rule == rule {
			out = append(out, f)
		}
	}
	return out
}

func auditFixture(name string) string { return filepath.Join("testdata", "audit", name) }

// TestAuditRulePairs: each rule fails a figure file built to break it and
// passes its honest twin, drawn from the same invented data.
func TestAuditRulePairs(t *testing.T) {
	tests := []struct {
		rule      string
		bad, good string
		panels    []string // panels of bad that break the rule
		severity  string
	}{
		{"aspect-not-banked", "aspect-bad.json", "aspect-good.json", []string{"panels[0]"}, sevWarning},
		{"too-many-series", "series-bad.json", "series-good.json", []string{"panels[0]"}, sevWarning},
		{"too-many-categories", "categories-bad.json", "categories-good.json", []string{"panels[0]"}, sevWarning},
		{"magnitudes-apart", "magnitudes-bad.json", "magnitudes-good.json", []string{"panels[0]"}, sevWarning},
		{"narrow-domain", "narrow-bad.json", "narrow-good.json", []string{"panels[0]", "panels[1]"}, sevWarning},
		{"honest-default-overridden", "override-bad.json", "override-good.json", []string{"panels[0]", "panels[1]"}, ""},
		{"honest-default-overridden", "aspect-bad.json", "aspect-good.json", []string{"panels[0]"}, sevWarning},
	}
	for _, tc := range tests {
		t.Run(tc.rule+"/"+tc.bad, func(t *testing.T) {
			bad, code := auditJSON(t, auditFixture(tc.bad))
			if code != exitData {
				t.Errorf("%s: exit %d, want %d", tc.bad, code, exitData)
			}
			got := byRule(bad, tc.rule)
			var panels []string
			for _, f := range got {
				panels = append(panels, f.Panel)
				if tc.severity != "" && f.Severity != tc.severity {
					t.Errorf("%s %s: severity %s, want %s", tc.rule, f.Panel, f.Severity, tc.severity)
				}
				if f.Message == "" || f.Suggestion == "" || f.File != auditFixture(tc.bad) {
					t.Errorf("%s: finding incomplete: %+v", tc.rule, f)
				}
			}
			if !slices.Equal(panels, tc.panels) {
				t.Errorf("%s: %s found on %v, want %v (all: %+v)", tc.bad, tc.rule, panels, tc.panels, bad)
			}
			good, code := auditJSON(t, auditFixture(tc.good))
			if g := byRule(good, tc.rule); len(g) != 0 {
				t.Errorf("%s: honest twin breaks %s: %+v", tc.good, tc.rule, g)
			}
			if code != exitOK {
				t.Errorf("%s: exit %d, want 0: %+v", tc.good, code, good)
			}
		})
	}
}

// TestAuditMeasuredFromFiles checks measured numbers of the figure-file
// rules against hand computation on the invented data.
func TestAuditMeasuredFromFiles(t *testing.T) {
	// narrow-bad.json panel 0: uptime_pct runs from 97.92 to 98.93 in
	// uptime.csv (by eye over the 24 rows); (98.93 - 97.92) / 98.93 =
	// 1.0209...%, rounded to 1.021. Panel 1: scores.csv runs from 98.1
	// to 99.3: 1.2 / 99.3 = 1.2084...%, rounded to 1.208.
	fs, _ := auditJSON(t, auditFixture("narrow-bad.json"))
	want := map[string]float64{"panels[0]": 1.021, "panels[1]": 1.208}
	for _, f := range byRule(fs, "narrow-domain") {
		if *f.Measured != want[f.Panel] || *f.Threshold != auditMinSpan {
			t.Errorf("narrow-domain %s: measured %v threshold %v, want %v and %v", f.Panel, *f.Measured, *f.Threshold, want[f.Panel], auditMinSpan)
		}
	}
	// categories-bad.json draws all 30 stops of stops.csv (30 data rows).
	fs, _ = auditJSON(t, auditFixture("categories-bad.json"))
	if f := byRule(fs, "too-many-categories"); len(f) != 1 || *f[0].Measured != 30 || *f[0].Threshold != 24 {
		t.Errorf("too-many-categories: %+v, want measured 30 threshold 24", f)
	}
	// series-bad.json: regions.csv has six regions on one plot.
	fs, _ = auditJSON(t, auditFixture("series-bad.json"))
	if f := byRule(fs, "too-many-series"); len(f) != 1 || *f[0].Measured != 6 || *f[0].Threshold != 4 {
		t.Errorf("too-many-series: %+v, want measured 6 threshold 4", f)
	}
	// override-bad.json: "other": "sum" on means is an error.
	fs, _ = auditJSON(t, auditFixture("override-bad.json"))
	if f := byRule(fs, "honest-default-overridden"); len(f) != 2 || f[0].Severity != sevError || f[0].Measured != nil || f[1].Severity != sevWarning {
		t.Errorf("honest-default-overridden: %+v, want an error without a measure first", f)
	}
}

// TestAuditMagnitudeByHand: the typical size is the median absolute value,
// so {100, 200, 300} (200) and {4, 5, 6} (5) are 200 / 5 = 40 times apart.
func TestAuditMagnitudeByHand(t *testing.T) {
	p := &auditPanel{chart: "lines", keys: map[string]string{}, series: []render.Series{
		{Name: "big", Y: []float64{300, 100, 200}},
		{Name: "small", Y: []float64{4, 6, math.NaN(), 5}},
	}}
	f := checkMagnitudes(p)
	if len(f) != 1 || *f[0].Measured != 40 {
		t.Fatalf("checkMagnitudes = %+v, want one finding measuring 40", f)
	}
	p.series[1].Y = []float64{40, 60} // median 50: 4 times, within 10
	if f := checkMagnitudes(p); len(f) != 0 {
		t.Errorf("4 times apart reported: %+v", f)
	}
}

// TestAuditAspectByHand draws one line of three segments 10 px wide
// rising 10·tan 10°, 10·tan 20° and 10·tan 60° px: the median orientation
// is 20°, 25° flatter than 45°. Banked by median slope its height grows
// by 1/tan 20° = 2.747; the drawn plot is 30 × 22.72 px (1.3:1), banked
// 30 × 62.43 (1:2.1).
func TestAuditAspectByHand(t *testing.T) {
	rise := func(deg float64) float64 { return 10 * math.Tan(deg*math.Pi/180) }
	y1 := rise(10)
	y2 := y1 + rise(20)
	y3 := y2 + rise(60)
	s := &render.Scene{Marks: []render.Mark{{Kind: render.Path, Class: "plumb-mark", Stroke: render.RGB(palette.Neutral()),
		Attrs: []render.Attr{{Name: "series", Value: "a"}},
		Lines: [][]render.Point{{{X: 0, Y: 0}, {X: 10, Y: -y1}, {X: 20, Y: -y2}, {X: 30, Y: -y3}}}}}}
	p := scenePanelForTest(s, render.Screen)
	p.keys["aspect"] = "6:1"
	f := checkAspect(p)
	if len(f) != 1 {
		t.Fatalf("checkAspect = %+v, want one finding", f)
	}
	if *f[0].Measured != 20 || *f[0].Threshold != 30 || f[0].Severity != sevWarning {
		t.Errorf("measured %v threshold %v severity %s, want 20, 30, warning", *f[0].Measured, *f[0].Threshold, f[0].Severity)
	}
	if !strings.Contains(f[0].Message, "drawn about 1.3:1, banked to 45° it would be about 1:2.1") {
		t.Errorf("message %q lacks the drawn and banked shapes", f[0].Message)
	}
	// Its honest twin: segments at 40°, 45° and 50° have the median 45°.
	y1, y2 = rise(40), rise(40)+rise(45)
	y3 = y2 + rise(50)
	s.Marks[0].Lines = [][]render.Point{{{X: 0, Y: 0}, {X: 10, Y: -y1}, {X: 20, Y: -y2}, {X: 30, Y: -y3}}}
	if f := checkAspect(scenePanelForTest(s, render.Screen)); len(f) != 0 {
		t.Errorf("a banked line reported: %+v", f)
	}
}

// scenePanelForTest makes the audit's view of a scene drawn as one
// untitled panel, as a Go caller's scene would be.
func scenePanelForTest(s *render.Scene, m render.Medium) *auditPanel {
	p := &auditPanel{path: "panels[0]", medium: m, keys: map[string]string{}}
	splitPanels(s, []*auditPanel{p}, &auditPanel{})
	return p
}

// lineScene is a scene of one line per colour, and bars in a fill.
func lineScene(strokes []string, bars string) *render.Scene {
	s := &render.Scene{}
	for i, c := range strokes {
		col, _ := render.ParseColour(c)
		s.Add(render.Mark{Kind: render.Path, Class: "plumb-mark", Stroke: col, StrokeWidth: 2,
			Attrs: []render.Attr{{Name: "series", Value: c}},
			Lines: [][]render.Point{{{X: 0, Y: float64(10 * i)}, {X: 10, Y: float64(10*i + 10)}}}})
	}
	if bars != "" {
		col, _ := render.ParseColour(bars)
		for i := range 3 {
			s.Add(render.Mark{Kind: render.Rect, Class: "plumb-mark", Fill: col, X: 0, Y: float64(20 * i), W: 50, H: 10,
				Attrs: []render.Attr{{Name: "label", Value: string(rune('a' + i))}, {Name: "value", Value: "1"}}})
		}
	}
	return s
}

// TestAuditColourRules tests the colour rules on scenes with chosen
// colours, as --colors will draw them: the measured distance and ratios
// come from the palette package (CIEDE2000 after Machado et al. 2009, WCAG
// 2.x contrast), and the contrast of #dddddd on white by hand:
// L = ((0xdd/255 + 0.055)/1.055)^2.4 = 0.7231, (1 + 0.05)/(0.7231 + 0.05)
// = 1.358 (WCAG 2.x relative luminance and contrast ratio).
func TestAuditColourRules(t *testing.T) {
	t.Run("colour-collision", func(t *testing.T) {
		// Colours as a scene holds them: eight bits a channel.
		rc, _ := render.ParseColour("#cc3333")
		gc, _ := render.ParseColour("#4d9933")
		red, green := rc.SRGB(), gc.SRGB()
		p := scenePanelForTest(lineScene([]string{red.Hex(), green.Hex()}, ""), render.Screen)
		f := checkCollision(dataColours(p.marks))
		if len(f) != 1 {
			t.Fatalf("red/green: %+v, want one finding", f)
		}
		d, v := palette.Check([]palette.SRGB{red, green}, white).Pairs[0].Min()
		if *f[0].Measured != *num(d) || *f[0].Threshold != palette.MinPairDistance || v == palette.Normal {
			t.Errorf("measured %v (want %v under %s), threshold %v", *f[0].Measured, d, v, *f[0].Threshold)
		}
		if !strings.Contains(f[0].Message, v.String()) || !strings.Contains(f[0].Message, red.Hex()) {
			t.Errorf("message %q names neither the vision nor the colours", f[0].Message)
		}
		// The honest twin: the first colours of plumb's categorical palette.
		cat, err := palette.Categorical(6)
		if err != nil {
			t.Fatal(err)
		}
		var hex []string
		for _, c := range cat {
			hex = append(hex, c.Hex())
		}
		if f := checkCollision(dataColours(scenePanelForTest(lineScene(hex, ""), render.Screen).marks)); len(f) != 0 {
			t.Errorf("the categorical palette collides: %+v", f)
		}
	})
	t.Run("mark-contrast", func(t *testing.T) {
		f := checkMarkContrast(dataColours(scenePanelForTest(lineScene(nil, "#dddddd"), render.Screen).marks))
		if len(f) != 1 || *f[0].Measured != 1.358 || *f[0].Threshold != 3 {
			t.Fatalf("light bars: %+v, want measured 1.358 threshold 3", f)
		}
		if f := checkMarkContrast(dataColours(scenePanelForTest(lineScene(nil, render.RGB(palette.Neutral()).Hex()), render.Screen).marks)); len(f) != 0 {
			t.Errorf("plumb's neutral bars: %+v", f)
		}
		// A dark colour drawn at 20% opacity is seen as faint, except as
		// a scatter plot's points, which build up where they overlap.
		s := lineScene(nil, "#333333")
		for i := range s.Marks {
			s.Marks[i].Opacity = 0.2
		}
		p := scenePanelForTest(s, render.Screen)
		if f := checkMarkContrast(panelColours(p)); len(f) != 1 {
			t.Errorf("faint bars passed: %+v", f)
		}
		p.chart = "scatter"
		if f := checkMarkContrast(panelColours(p)); len(f) != 0 {
			t.Errorf("translucent points judged faint: %+v", f)
		}
		// A heat map's lightest cells are light by design.
		p = scenePanelForTest(lineScene(nil, "#f4f8fb"), render.Screen)
		p.chart = "heat"
		if f := checkMarkContrast(panelColours(p)); len(f) != 0 {
			t.Errorf("heat cells judged as categories: %+v", f)
		}
	})
	t.Run("text-contrast", func(t *testing.T) {
		light, _ := render.ParseColour("#aaaaaa") // 2.323:1 on white by the same formulas
		dark := render.RGB(palette.Text())
		s := &render.Scene{Marks: []render.Mark{{Kind: render.Text, Text: "Label", Size: 12, Fill: light}}}
		f := checkTextContrast(scenePanelForTest(s, render.Screen).marks)
		if len(f) != 1 || *f[0].Measured != 2.323 || *f[0].Threshold != 4.5 {
			t.Fatalf("grey text: %+v, want measured 2.323 threshold 4.5", f)
		}
		s.Marks[0].Fill = dark
		if f := checkTextContrast(scenePanelForTest(s, render.Screen).marks); len(f) != 0 {
			t.Errorf("plumb's text colour: %+v", f)
		}
	})
	t.Run("text-too-small", func(t *testing.T) {
		s := &render.Scene{Marks: []render.Mark{{Kind: render.Text, Text: "tiny", Size: 10}, {Kind: render.Text, Text: "fine", Size: 12}}}
		f := checkTextSize(scenePanelForTest(s, render.Screen))
		if len(f) != 1 || *f[0].Measured != 10 || *f[0].Threshold != 12 {
			t.Fatalf("10 px text on screen: %+v, want measured 10 threshold 12 (the screen floor)", f)
		}
		// 10 px is above print's 7 pt = 9.33 px floor.
		if f := checkTextSize(scenePanelForTest(s, render.Print)); len(f) != 0 {
			t.Errorf("10 px in print: %+v", f)
		}
		// Around a grid, the frame's words are the figure's, not a panel's.
		g := &render.Scene{Marks: []render.Mark{
			{Kind: render.Text, Class: "plumb-title", Text: "Title", Size: 9},
			{Kind: render.GroupStart, Class: "plumb-panel"},
			{Kind: render.Text, Text: "label", Size: 12},
			{Kind: render.GroupEnd},
		}}
		panel, frame := &auditPanel{path: "panels[0]", keys: map[string]string{}}, &auditPanel{keys: map[string]string{}}
		splitPanels(g, []*auditPanel{panel}, frame)
		if f := checkTextSize(panel); len(f) != 0 {
			t.Errorf("the panel's 12 px text: %+v", f)
		}
		if f := checkTextSize(frame); len(f) != 1 || *f[0].Measured != 9 {
			t.Errorf("the frame's 9 px title: %+v", f)
		}
	})
}

// TestAuditIssueCheck is the issue's check: a figure with a 6:1 line
// chart, six series together and bars, then drawn with six saturated
// red, green, blue, ... series and very light bars as --colors will draw
// them, exits with findings on aspect (with the angle), colour vision,
// contrast and crowding; a clean figure exits 0.
func TestAuditIssueCheck(t *testing.T) {
	file := auditFixture("check.json")
	fs, code := auditJSON(t, file)
	if code != exitData {
		t.Errorf("check.json: exit %d, want 1", code)
	}
	for _, rule := range []string{"aspect-not-banked", "too-many-series"} {
		if len(byRule(fs, rule)) == 0 {
			t.Errorf("check.json: no %s finding in %+v", rule, fs)
		}
	}
	if a := byRule(fs, "aspect-not-banked"); len(a) > 0 && (a[0].Measured == nil || math.Abs(*a[0].Measured-45) <= auditAspectTolerance) {
		t.Errorf("aspect without a measured angle far from 45°: %+v", a[0])
	}
	// The same figure drawn with chosen colours.
	spec, err := readFigure(file)
	if err != nil {
		t.Fatal(err)
	}
	s, err := render.FigureScene(spec.opt, spec.panels...)
	if err != nil {
		t.Fatal(err)
	}
	loud := []string{"#e41a1c", "#4daf4a", "#377eb8", "#ff7f00", "#984ea3", "#a65628"}
	series := map[string]render.Colour{}
	for i := range s.Marks {
		m := &s.Marks[i]
		if m.Class != "plumb-mark" {
			continue
		}
		if name, ok := attr(*m, "series"); ok && !m.Stroke.IsNone() {
			if _, ok := series[name]; !ok {
				series[name], _ = render.ParseColour(loud[len(series)%len(loud)])
			}
			m.Stroke = series[name]
		}
		if m.Kind == render.Rect {
			m.Fill, _ = render.ParseColour("#e3eef8")
		}
	}
	fs, err = auditScene(file, spec, s)
	if err != nil {
		t.Fatal(err)
	}
	rules := map[string]bool{}
	for _, f := range fs {
		if f.Severity != sevInfo {
			rules[f.Rule] = true
		}
	}
	for _, rule := range []string{"aspect-not-banked", "colour-collision", "mark-contrast", "too-many-series"} {
		if !rules[rule] {
			t.Errorf("coloured check figure: no %s warning in %+v", rule, fs)
		}
	}
	if len(fs) < 4 {
		t.Errorf("%d findings, want at least 4", len(fs))
	}
	if fs, code := auditJSON(t, auditFixture("clean.json")); code != exitOK {
		t.Errorf("clean.json: exit %d: %+v", code, fs)
	}
}

// TestAuditCommand checks the exit statuses, the stable order and the
// human output grouped by file.
func TestAuditCommand(t *testing.T) {
	a, _ := auditJSON(t, auditFixture("check.json"), auditFixture("narrow-bad.json"))
	b, _ := auditJSON(t, auditFixture("check.json"), auditFixture("narrow-bad.json"))
	if !slices.Equal(fmtFindings(a), fmtFindings(b)) {
		t.Error("two runs differ")
	}
	for i := 1; i < len(a); i++ {
		if a[i-1].File == a[i].File && a[i].Panel != "" && len(a[i-1].Panel) == len(a[i].Panel) && a[i-1].Panel > a[i].Panel {
			t.Errorf("findings out of panel order: %s before %s", a[i-1].Panel, a[i].Panel)
		}
	}
	var out, errs bytes.Buffer
	code := run([]string{"audit", auditFixture("narrow-bad.json"), auditFixture("aspect-good.json")}, nil, &out, &errs)
	if code != exitData {
		t.Errorf("exit %d, want 1", code)
	}
	want := auditFixture("narrow-bad.json") + ":\n  warning narrow-domain panels[0]: "
	if !strings.HasPrefix(out.String(), want) || !strings.HasSuffix(out.String(), auditFixture("aspect-good.json")+":\n  no findings\n") {
		t.Errorf("human output:\n%s", out.String())
	}
	dir := t.TempDir()
	bad := filepath.Join(dir, "bad.json")
	os.WriteFile(bad, []byte(`{"panels": [{"chart": "bars"}]}`), 0o644)
	for _, args := range [][]string{
		{"audit"},
		{"audit", "--nope", auditFixture("clean.json")},
		{"audit", filepath.Join(dir, "missing.json")},
		{"audit", bad},
		{"audit", "-"},
	} {
		var out, errs bytes.Buffer
		if code := run(args, nil, &out, &errs); code != exitUsage || errs.Len() == 0 {
			t.Errorf("%v: exit %d, stderr %q; want 2 and a message", args, code, errs.String())
		}
	}
}

// fmtFindings is findings as comparable strings.
func fmtFindings(fs []finding) []string {
	var out []string
	for _, f := range fs {
		b, _ := json.Marshal(f)
		out = append(out, string(b))
	}
	return out
}

// TestAuditGalleryPairs: every "before" figure file of the gallery's
// audit pairs breaks its rule, and every "after" has nothing at warning
// level, so that the README's pairs show what they say.
func TestAuditGalleryPairs(t *testing.T) {
	pairs := []struct{ name, rule string }{
		{"aspect", "aspect-not-banked"},
		{"series", "too-many-series"},
		{"categories", "too-many-categories"},
		{"magnitudes", "magnitudes-apart"},
		{"narrow", "narrow-domain"},
		{"override", "honest-default-overridden"},
		{"colours", "colour-collision"},
		{"contrast", "mark-contrast"},
	}
	for _, p := range pairs {
		t.Run(p.name, func(t *testing.T) {
			for _, side := range []string{"before", "after"} {
				name := "audit-" + p.name + "-" + side + ".json"
				if _, ok := demoFigures[name]; !ok {
					if side == "before" {
						t.Fatalf("no gallery figure %s", name)
					}
					continue // the after is a chart of the gallery
				}
				dir, err := writeDemoFigure(name)
				if err != nil {
					t.Fatal(err)
				}
				defer os.RemoveAll(dir)
				fs, code := auditJSON(t, filepath.Join(dir, name))
				broke := len(byRule(fs, p.rule)) > 0
				if side == "before" && (!broke || code != exitData) {
					t.Errorf("%s: exit %d, no %s finding: %+v", name, code, p.rule, fs)
				}
				if side == "after" && (broke || code != exitOK) {
					t.Errorf("%s: exit %d: %+v", name, code, fs)
				}
			}
		})
	}
}

// TestAuditOwnColoursPass: plumb's own colours and type scale pass the
// colour and text rules in every figure file of the gallery.
func TestAuditOwnColoursPass(t *testing.T) {
	var names []string
	for name := range demoFigures {
		names = append(names, name)
	}
	slices.Sort(names)
	for _, name := range names {
		if strings.Contains(demoFigures[name], `"colors"`) {
			continue // the figure chooses its own colours (a "before" of the colour rules)
		}
		dir, err := writeDemoFigure(name)
		if err != nil {
			t.Fatal(err)
		}
		fs, code := auditJSON(t, filepath.Join(dir, name))
		os.RemoveAll(dir)
		if code == exitUsage {
			t.Fatalf("%s: not audited", name)
		}
		for _, rule := range []string{"colour-collision", "mark-contrast", "text-contrast", "text-too-small"} {
			if f := byRule(fs, rule); len(f) != 0 {
				t.Errorf("%s: %+v", name, f)
			}
		}
	}
}

// TestAuditIssueCheckInTheFilesColours is the issue's check made entirely
// of a figure file: the panels give their own colours (six saturated red,
// green, blue, ... series and very light bars), and audit --json exits 1
// with findings on aspect (with an angle), colour vision, contrast and
// crowding.
func TestAuditIssueCheckInTheFilesColours(t *testing.T) {
	fs, code := auditJSON(t, auditFixture("check-colours.json"))
	if code != exitData {
		t.Errorf("exit %d, want 1", code)
	}
	for _, rule := range []string{"aspect-not-banked", "colour-collision", "mark-contrast", "too-many-series"} {
		if len(byRule(fs, rule)) == 0 {
			t.Errorf("no %s finding in %+v", rule, fs)
		}
	}
	if a := byRule(fs, "aspect-not-banked"); len(a) > 0 && a[0].Measured == nil {
		t.Errorf("aspect finding without its angle: %+v", a[0])
	}
	// #e3eef8 on white: (1.05)/(L+0.05) with L = 0.8426 (WCAG 2.x relative
	// luminance, hand computation) is 1.175:1.
	if c := byRule(fs, "mark-contrast"); len(c) > 0 {
		last := c[len(c)-1]
		if last.Measured == nil || math.Abs(*last.Measured-1.176) > 0.01 {
			t.Errorf("light bars' contrast %+v, want about 1.176", last)
		}
	}
}

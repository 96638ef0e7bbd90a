package main

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"slices"
	"strconv"
	"strings"

	"plumb/render"
)

// plumb audit reviews figure files before publication without writing a
// figure: each file is read and planned exactly as plumb figure does, its
// scene is built, and the rules in audit_rules.go measure what would be
// drawn. A rule's finding says which panel, what was measured, the
// threshold it broke and what to do instead.

// auditSynopsis is the usage line of plumb audit.
const auditSynopsis = `[--json] FILE.json [FILE.json ...]

Reviews figure files (see plumb figure -h) for choices that mislead or
cannot be read, without writing any figure. Each finding names its rule,
its severity (info, warning or error), the panel, the measured value and
the threshold, and says what to do instead. Exit status: 0 when no finding
is a warning or an error, 1 otherwise, 2 on a usage or file error.`

// Severities of a finding, mildest first.
const (
	sevInfo    = "info"
	sevWarning = "warning"
	sevError   = "error"
)

// A finding is one rule broken by one panel (or by the whole figure, with
// an empty panel path). Measured and Threshold are nil for a rule that
// counts no quantity (an option given).
type finding struct {
	Rule       string   `json:"rule"`
	Severity   string   `json:"severity"`
	File       string   `json:"file"`
	Panel      string   `json:"panel"`
	Measured   *float64 `json:"measured"`
	Threshold  *float64 `json:"threshold"`
	Message    string   `json:"message"`
	Suggestion string   `json:"suggestion"`
}

// num makes a finding's number, rounded to what a reader compares (three
// decimals), so that the JSON does not carry float noise.
func num(v float64) *float64 {
	r := math.Round(v*1000) / 1000
	return &r
}

// auditPanel is one panel of a figure as the rules see it: what it draws
// (its marks, split by the innermost group they sit in, so that the plots
// of small multiples are counted apart), the keys the figure file gave it,
// and the numbers it plots.
type auditPanel struct {
	path   string            // JSON path, "panels[2]"
	chart  string            // the panel's chart command
	keys   map[string]string // keys given in the figure file, as flag text (lists joined by commas)
	medium render.Medium
	sized  bool            // the figure file fixed the canvas's height ("size": "WxH", H > 0)
	marks  []render.Mark   // every mark of the panel, groups left out
	plots  [][]render.Mark // the marks of each innermost group, in drawing order
	series []render.Series // lines and diff: the series as read from the data
	values []float64       // bars and dots: the values drawn, from the marks
	labels []string        // bars and dots: the categories drawn, from the marks
}

// given reports whether the figure file gave the panel a key.
func (p *auditPanel) given(key string) bool {
	_, ok := p.keys[key]
	return ok
}

// runAudit is plumb audit.
func runAudit(args []string, _ io.Reader, stdout, stderr io.Writer) int {
	var asJSON bool
	defs := []flagDef{
		{name: "json", usage: `print {"findings": [{"rule", "severity", "file", "panel", "measured", "threshold", "message", "suggestion"}]} instead of lines`, value: boolValue{&asJSON}},
	}
	fs := newTableFlagSet("audit", auditSynopsis, defs, stderr)
	files, err := parse(fs, args)
	if err != nil {
		return exitCode(err, stderr)
	}
	if len(files) == 0 {
		return exitCode(usagef("give one or more figure files (FILE.json); see plumb audit -h"), stderr)
	}
	var all []finding
	for _, f := range files {
		if f == "-" {
			return exitCode(usagef("give figure files by name: their data paths are relative to them, so standard input cannot be one"), stderr)
		}
		found, err := auditFile(f)
		if err != nil {
			printError(stderr, err)
			return exitUsage
		}
		all = append(all, found...)
	}
	code := exitOK
	for _, f := range all {
		if f.Severity != sevInfo {
			code = exitData
		}
	}
	if asJSON {
		if all == nil {
			all = []finding{}
		}
		b, _ := json.MarshalIndent(struct {
			Findings []finding `json:"findings"`
		}{all}, "", "  ") // plain strings and numbers: cannot fail
		fmt.Fprintf(stdout, "%s\n", b)
		return code
	}
	printFindings(stdout, files, all)
	return code
}

// printFindings writes one line per finding, under a line naming each
// file, and a file with nothing to say as "no findings".
func printFindings(w io.Writer, files []string, all []finding) {
	for _, file := range files {
		fmt.Fprintf(w, "%s:\n", terminalSafe(file))
		n := 0
		for _, f := range all {
			if f.File != file {
				continue
			}
			n++
			where := f.Panel
			if where == "" {
				where = "figure"
			}
			nums := ""
			if f.Measured != nil && f.Threshold != nil {
				nums = fmt.Sprintf(" (measured %s, threshold %s)", fmtAuditNum(*f.Measured), fmtAuditNum(*f.Threshold))
			}
			fmt.Fprintf(w, "  %s %s %s: %s%s; %s\n", f.Severity, f.Rule, where, terminalSafe(f.Message), nums, terminalSafe(f.Suggestion))
		}
		if n == 0 {
			fmt.Fprintln(w, "  no findings")
		}
	}
}

// fmtAuditNum writes a measured number without trailing zeros.
func fmtAuditNum(v float64) string {
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.3f", v), "0"), ".")
}

// auditFile reads and plans one figure file as plumb figure does, builds
// its scene and applies every rule, in a stable order: by panel, then by
// the order of auditRules.
func auditFile(file string) ([]finding, error) {
	spec, err := readFigure(file)
	if err != nil {
		return nil, err
	}
	s, err := render.FigureScene(spec.opt, spec.panels...)
	if err != nil {
		return nil, &figureError{fmt.Sprintf("%s: %s", file, figureWords(err, spec))}
	}
	return auditScene(file, spec, s)
}

// auditScene applies every rule to each panel of a figure file's scene.
func auditScene(file string, spec *figureSpec, s *render.Scene) ([]finding, error) {
	panels, err := auditPanels(file, spec, s)
	if err != nil {
		return nil, err
	}
	return applyRules(file, panels), nil
}

// applyRules checks every panel against every rule, in a stable order.
func applyRules(file string, panels []*auditPanel) []finding {
	var out []finding
	for _, p := range panels {
		for _, r := range auditRules {
			for _, f := range r.check(p) {
				f.Rule, f.File, f.Panel = r.name, file, p.path
				out = append(out, f)
			}
		}
	}
	return out
}

// auditPanels splits a figure's scene into its panels and reads what the
// rules need besides the marks: the keys each panel was given and the
// numbers it plots.
func auditPanels(file string, spec *figureSpec, s *render.Scene) ([]*auditPanel, error) {
	raw, err := readFigureFile(file)
	if err != nil {
		return nil, &figureError{fmt.Sprintf("%s: %v", file, err)}
	}
	var top struct {
		Panels []json.RawMessage `json:"panels"`
	}
	if err := json.Unmarshal(raw, &top); err != nil || len(top.Panels) != len(spec.panels) {
		return nil, &figureError{fmt.Sprintf("%s: changed while it was read", file)}
	}
	panels := make([]*auditPanel, len(spec.panels))
	for i, pr := range top.Panels {
		p := &auditPanel{path: fmt.Sprintf("panels[%d]", i), medium: spec.opt.Medium, sized: spec.opt.Height > 0, keys: map[string]string{}}
		if err := auditData(p, pr, filepath.Dir(file)); err != nil {
			return nil, &figureError{fmt.Sprintf("%s: %s: %v", file, p.path, err)}
		}
		panels[i] = p
	}
	frame := &auditPanel{medium: spec.opt.Medium, keys: map[string]string{}}
	splitPanels(s, panels, frame)
	for _, p := range panels {
		for _, m := range p.marks {
			if m.Class != "plumb-mark" {
				continue
			}
			if l, ok := attr(m, "label"); ok {
				if v, ok := attr(m, "value"); ok {
					if x, err := strconv.ParseFloat(v, 64); err == nil {
						p.labels = append(p.labels, l)
						p.values = append(p.values, x)
					}
				}
			}
		}
	}
	if len(frame.marks) > 0 {
		panels = append(panels, frame)
	}
	return panels, nil
}

// splitPanels gives each panel its marks: the marks inside the figure's
// k-th top-level plumb-panel group are panel k's, the rest (the title,
// subtitle, source and note around the grid) the frame's, whose text
// the text rules read as the figure's. A figure of one untitled panel
// draws no group: every mark is that panel's, the frame's words included.
func splitPanels(s *render.Scene, panels []*auditPanel, frame *auditPanel) {
	grouped := slices.ContainsFunc(s.Marks, func(m render.Mark) bool { return m.Kind == render.GroupStart && m.Class == "plumb-panel" })
	cur := -1
	if !grouped {
		cur = 0
	}
	depth := 0
	next := 0
	var stack []int // open groups, as indices into the current panel's plots
	for _, m := range s.Marks {
		switch m.Kind {
		case render.GroupStart:
			if grouped && depth == 0 && m.Class == "plumb-panel" {
				cur = min(next, len(panels)-1)
				next++
			}
			depth++
			if cur >= 0 {
				p := panels[cur]
				p.plots = append(p.plots, nil)
				stack = append(stack, len(p.plots)-1)
			}
			continue
		case render.GroupEnd:
			depth--
			if len(stack) > 0 {
				stack = stack[:len(stack)-1]
			}
			if grouped && depth == 0 {
				cur = -1
			}
			continue
		}
		if cur < 0 {
			frame.marks = append(frame.marks, m)
			continue
		}
		p := panels[cur]
		p.marks = append(p.marks, m)
		if len(stack) == 0 {
			if len(p.plots) == 0 {
				p.plots = append(p.plots, nil)
			}
			p.plots[0] = append(p.plots[0], m)
			continue
		}
		k := stack[len(stack)-1]
		p.plots[k] = append(p.plots[k], m)
	}
}

// attr is a mark's data-* attribute.
func attr(m render.Mark, name string) (string, bool) {
	for _, a := range m.Attrs {
		if a.Name == name {
			return a.Value, true
		}
	}
	return "", false
}

// auditData binds a panel's keys to a fresh run of its chart, as
// readPanel does, and reads the series a line or difference chart plots.
// readFigure has already checked the keys, so an error here is the file
// changing under us.
func auditData(p *auditPanel, raw json.RawMessage, dir string) error {
	members, err := jsonObject(raw, p.path)
	if err != nil {
		return err
	}
	var dataPath string
	for _, m := range members {
		if m.key == "chart" {
			json.Unmarshal(m.val, &p.chart) // a string: readFigure checked it
		}
		if m.key == "data" {
			json.Unmarshal(m.val, &dataPath)
		}
	}
	cmd, ok := lookup(p.chart)
	if !ok || cmd.chart == nil {
		return fmt.Errorf("unknown chart %q", p.chart)
	}
	ch, ok := cmd.chart().(panelChart)
	if !ok {
		return fmt.Errorf("%q cannot be a figure panel", p.chart)
	}
	defs := map[string]flagDef{}
	for _, d := range ch.flags() {
		defs[d.name] = d
	}
	for _, m := range members {
		d, ok := defs[m.key]
		if !ok {
			continue
		}
		texts, err := flagText(d, m.val)
		if err != nil {
			return err
		}
		p.keys[m.key] = strings.Join(texts, ",")
		if err := bindKey(d, m.key, m.val); err != nil {
			return err
		}
	}
	if !filepath.IsAbs(dataPath) {
		dataPath = filepath.Join(dir, dataPath)
	}
	var build func(t *Table) ([]render.Series, error)
	switch r := ch.(type) {
	case *linesRun:
		build = func(t *Table) ([]render.Series, error) {
			o := r.opt
			s, _, err := r.build(t, nil, &o)
			return s, err
		}
	case *diffRun:
		build = func(t *Table) ([]render.Series, error) {
			o := r.opt
			a, b, _, err := r.build(t, nil, &o)
			return []render.Series{a, b}, err
		}
	default:
		return nil
	}
	if err := ch.base().finish(); err != nil {
		return err
	}
	t, _, err := ch.readTable(dataPath, nil, nil)
	if err != nil {
		return err
	}
	p.series, err = build(t)
	return err
}

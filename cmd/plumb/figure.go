package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strings"

	"plumb/internal/suggest"
	"plumb/internal/table"
	"plumb/render"
)

// Figure files (DESIGN.md section 3): a JSON object of shared keys and a
// list of panels, each panel keyed by exactly its chart's flag names. The
// keys are never listed here: the figure's own come from the shared flags
// and each panel's from its chart's entry in the command table, bound by
// the same flag values the command line uses.

// figureSynopsis is the usage line of plumb figure.
const figureSynopsis = `FILE.json [FILE.json ...] [-o FILE|DIR] [flags]

A figure file is a JSON object:

  {"for": "slide", "title": "...", "subtitle": "...", "source": "...", "note": "...",
   "size": "WxH", "columns": 2,
   "panels": [{"chart": "bars", "data": "crops.csv", "label": "crop", "value": "tonnes", "title": "..."}, ...]}

Each panel takes "chart", "data" (a path relative to the figure file) and
the flags of its chart without dashes (see plumb CHART -h); a switch takes
true or false, a list a string or a list of strings. Several figure files
render in parallel into -o DIR, one NAME.svg per NAME.json.`

// figureKeys are the shared flags a figure file takes at its top level;
// "columns" and "panels" are the figure's own.
var figureKeys = []string{"for", "size", "title", "subtitle", "source", "note", "colors"}

// notPanelKeys are shared flags that mean nothing for one panel, with the
// reason a panel refuses them.
var notPanelKeys = map[string]string{
	"o":          "the output is the figure's: give -o to plumb figure",
	"quiet":      "a setting of the command: give --quiet to plumb figure",
	"alt":        "a setting of the command: the description is the whole figure's",
	"explain":    "a setting of the command: give --explain to plumb figure",
	"for":        "the medium is the whole figure's: give it at the top level of the file",
	"size":       "the canvas is the whole figure's: give it at the top level of the file",
	"font":       "the font is the whole figure's; plumb figure uses the Go fonts",
	"embed-font": "the font is the whole figure's; plumb figure uses the Go fonts",
	"subtitle":   "a panel has a title only: give the figure's subtitle at the top level of the file",
	"source":     "a panel has a title only: give the figure's source at the top level of the file",
	"note":       "a panel has a title only: give the figure's note at the top level of the file",
	"by":         "a panel is one chart; draw small multiples with plumb CHART --by, or give one panel per group",
	"by-order":   "a panel is one chart; draw small multiples with plumb CHART --by",
	"own-scales": "a panel is one chart; draw small multiples with plumb CHART --by",
	"scale":      "the pixel density is the whole figure's: plumb figure writes PNG at one pixel per unit",
}

// maxFigureFile bounds a figure file: a figure of a hundred panels is a
// few kilobytes, so anything near this is not a figure file.
const maxFigureFile = 4 << 20

// figureError is a mistake in a figure file: it names the file and the
// JSON path, and exits 1 like bad data (a usage error is the command
// line's).
type figureError struct{ msg string }

func (e *figureError) Error() string { return e.msg }

// member is one key of a JSON object, in file order.
type member struct {
	key string
	val json.RawMessage
}

// jsonObject reads a JSON object's members in file order, refusing a
// repeated key.
func jsonObject(raw json.RawMessage, path string) ([]member, error) {
	dec := json.NewDecoder(bytes.NewReader(raw))
	dec.UseNumber()
	tok, err := dec.Token()
	if d, ok := tok.(json.Delim); err != nil || !ok || d != '{' {
		return nil, fmt.Errorf("%s: give an object ({...}), not %s", path, jsonKind(raw))
	}
	var out []member
	for dec.More() {
		tok, err := dec.Token()
		if err != nil {
			return nil, fmt.Errorf("%s: %v", path, err)
		}
		key := tok.(string) // a valid object's keys are strings
		var v json.RawMessage
		if err := dec.Decode(&v); err != nil {
			return nil, fmt.Errorf("%s: %v", path, err)
		}
		if slices.ContainsFunc(out, func(m member) bool { return m.key == key }) {
			return nil, fmt.Errorf("%s: the key %q is given twice; keep one", joinPath(path, key), key)
		}
		out = append(out, member{key, v})
	}
	return out, nil
}

// joinPath is a JSON path one key further: "panels[2]" and "value" give
// "panels[2].value"; at the top level the key alone.
func joinPath(path, key string) string {
	if path == "" {
		return key
	}
	return path + "." + key
}

// jsonKind names a JSON value's type for messages.
func jsonKind(raw json.RawMessage) string {
	s := bytes.TrimSpace(raw)
	if len(s) == 0 {
		return "nothing"
	}
	switch s[0] {
	case '"':
		return "a string"
	case '{':
		return "an object"
	case '[':
		return "a list"
	case 't', 'f':
		return "true or false"
	case 'n':
		return "null"
	}
	return "a number"
}

// flagText turns a JSON value into the text a flag's Set takes, checking
// that its type suits the flag: a switch takes true or false, a number
// flag a number, a list flag a string or a list of strings, any other a
// string (or a number, written as in the file).
func flagText(d flagDef, raw json.RawMessage) ([]string, error) {
	kind := jsonKind(raw)
	want := "a string"
	switch d.value.(type) {
	case boolValue:
		want = "true or false"
	case intValue:
		want = "a whole number"
	case numberValue:
		want = "a number"
	case indexValue:
		want = "true, false or an x value"
	}
	if d.repeat {
		want = "a string or a list of strings"
	}
	bad := func() error { return fmt.Errorf("give %s, not %s", want, kind) }
	switch kind {
	case "true or false":
		if want != "true or false" && want != "true, false or an x value" {
			return nil, bad()
		}
		return []string{string(bytes.TrimSpace(raw))}, nil
	case "a number":
		if want == "true or false" || d.repeat {
			return nil, bad()
		}
		return []string{string(bytes.TrimSpace(raw))}, nil
	case "a string":
		if want == "true or false" || want == "a whole number" || want == "a number" {
			return nil, bad()
		}
		var s string
		if err := json.Unmarshal(raw, &s); err != nil {
			return nil, err
		}
		return []string{s}, nil
	case "a list":
		if !d.repeat {
			return nil, bad()
		}
		var items []json.RawMessage
		if err := json.Unmarshal(raw, &items); err != nil {
			return nil, err
		}
		out := make([]string, len(items))
		for i, it := range items {
			if jsonKind(it) != "a string" {
				return nil, fmt.Errorf("item %d: give a string, not %s", i, jsonKind(it))
			}
			json.Unmarshal(it, &out[i]) // a string, checked above
		}
		return out, nil
	}
	return nil, bad()
}

// bindKey sets one flag from its JSON value; the error names the path.
func bindKey(d flagDef, path string, raw json.RawMessage) error {
	texts, err := flagText(d, raw)
	if err != nil {
		return fmt.Errorf("%s: %v", path, err)
	}
	for _, s := range texts {
		if err := d.value.Set(s); err != nil {
			return fmt.Errorf("%s: %q: %v", path, s, err)
		}
	}
	return nil
}

// unknownKey is the message for a key no flag has, with the nearest one.
func unknownKey(path, key, where string, keys []string) error {
	if best, ok := suggest.Closest(key, keys); ok {
		return fmt.Errorf("%s: unknown key %s; did you mean %q?", path, where, best)
	}
	return fmt.Errorf("%s: unknown key %s; the keys are %s", path, where, strings.Join(keys, ", "))
}

// figureSpec is a figure file read and checked: the figure's options and
// its panels, planned from their data.
type figureSpec struct {
	opt    render.FigureOptions
	panels []render.Panel
	notes  []render.Note
}

// readFigure reads and checks a figure file and plans its panels. Every
// error names the file and the JSON path of what is wrong.
func readFigure(file string) (*figureSpec, error) {
	data, err := readFigureFile(file)
	if err != nil {
		return nil, &figureError{fmt.Sprintf("%s: %v", file, err)}
	}
	spec, err := parseFigure(data, filepath.Dir(file))
	if err != nil {
		return nil, &figureError{fmt.Sprintf("%s: %s", file, table.OneLine(err.Error()))}
	}
	return spec, nil
}

// readFigureFile reads at most maxFigureFile bytes of a figure file.
func readFigureFile(file string) ([]byte, error) {
	f, err := os.Open(file)
	if err != nil {
		return nil, bareCause(err)
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, maxFigureFile+1))
	if err != nil {
		return nil, bareCause(err)
	}
	if len(data) > maxFigureFile {
		return nil, fmt.Errorf("more than %d MB; is it a figure file?", maxFigureFile>>20)
	}
	return data, nil
}

// parseFigure checks a figure file's JSON and plans its panels; data paths
// are relative to dir.
func parseFigure(data []byte, dir string) (*figureSpec, error) {
	if err := json.Unmarshal(data, new(json.RawMessage)); err != nil {
		var se *json.SyntaxError
		if errors.As(err, &se) {
			return nil, fmt.Errorf("line %d: not valid JSON: %v", 1+bytes.Count(data[:min(int(se.Offset), len(data))], []byte("\n")), se)
		}
		return nil, fmt.Errorf("not valid JSON: %v", err)
	}
	top, err := jsonObject(data, "")
	if err != nil {
		return nil, fmt.Errorf("a figure file is a JSON object with \"panels\", not %s", jsonKind(data))
	}
	spec := &figureSpec{}
	sh := newShared(&spec.opt.Common)
	defs := map[string]flagDef{}
	keys := []string{}
	for _, d := range sh.flags() {
		if slices.Contains(figureKeys, d.name) {
			defs[d.name] = d
			keys = append(keys, d.name)
		}
	}
	keys = append(keys, "columns", "panels")
	names := render.OptionNames{"Columns": "columns"}
	for _, d := range defs {
		for _, o := range d.sets {
			names[o] = d.name
		}
	}
	var panels json.RawMessage
	for _, m := range top {
		switch d, ok := defs[m.key]; {
		case ok:
			if err := bindKey(d, m.key, m.val); err != nil {
				return nil, err
			}
		case m.key == "columns":
			if err := bindKey(flagDef{name: "columns", value: intValue{&spec.opt.Columns}}, m.key, m.val); err != nil {
				return nil, err
			}
			if spec.opt.Columns < 0 {
				return nil, fmt.Errorf("columns: %d: give 0 (chosen from the panel count) or more", spec.opt.Columns)
			}
		case m.key == "panels":
			panels = m.val
		default:
			return nil, unknownKey(m.key, m.key, "of a figure", keys)
		}
	}
	if panels == nil {
		return nil, errors.New(`no "panels": give a list of panel objects, each with "chart" and "data"`)
	}
	var list []json.RawMessage
	if jsonKind(panels) != "a list" || json.Unmarshal(panels, &list) != nil {
		return nil, fmt.Errorf("panels: give a list of panel objects, not %s", jsonKind(panels))
	}
	if len(list) == 0 {
		return nil, errors.New("panels: the list is empty; give at least one panel")
	}
	for i, raw := range list {
		path := fmt.Sprintf("panels[%d]", i)
		p, notes, err := readPanel(raw, path, dir, names)
		if err != nil {
			return nil, err
		}
		spec.panels = append(spec.panels, p)
		spec.notes = append(spec.notes, notes...)
	}
	spec.opt.Names = names
	spec.opt.Notes = spec.notes
	return spec, nil
}

// readPanel binds one panel's keys to its chart's flags, reads its data
// and plans it. names gathers the option names of every panel's flags.
func readPanel(raw json.RawMessage, path, dir string, names render.OptionNames) (render.Panel, []render.Note, error) {
	members, err := jsonObject(raw, path)
	if err != nil {
		return render.Panel{}, nil, err
	}
	var charts []string
	for _, c := range commandTable() {
		if c.chart != nil {
			if _, ok := c.chart().(panelChart); ok {
				charts = append(charts, c.name)
			}
		}
	}
	i := slices.IndexFunc(members, func(m member) bool { return m.key == "chart" })
	if i < 0 {
		return render.Panel{}, nil, fmt.Errorf("%s: no \"chart\" key; give one of %s", path, orList(charts))
	}
	var name string
	if err := json.Unmarshal(members[i].val, &name); err != nil || jsonKind(members[i].val) != "a string" {
		return render.Panel{}, nil, fmt.Errorf("%s.chart: give a string, not %s", path, jsonKind(members[i].val))
	}
	cmd, ok := lookup(name)
	if !ok || !slices.Contains(charts, name) {
		if ok && cmd.chart != nil {
			return render.Panel{}, nil, fmt.Errorf("%s.chart: %q cannot be a figure panel yet; use %s", path, name, orList(charts))
		}
		if best, ok := suggest.Closest(name, charts); ok {
			return render.Panel{}, nil, fmt.Errorf("%s.chart: unknown chart %q; did you mean %q?", path, name, best)
		}
		return render.Panel{}, nil, fmt.Errorf("%s.chart: unknown chart %q; use %s", path, name, orList(charts))
	}
	ch := cmd.chart().(panelChart)
	defs := map[string]flagDef{}
	keys := []string{"chart", "data"}
	for _, d := range ch.flags() {
		defs[d.name] = d
		if _, no := notPanelKeys[d.name]; !no {
			keys = append(keys, d.name)
			for _, o := range d.sets {
				if _, ok := names[o]; !ok {
					names[o] = d.name
				}
			}
		}
	}
	given := map[string]bool{}
	dataPath := ""
	for _, m := range members {
		kp := joinPath(path, m.key)
		switch d, ok := defs[m.key]; {
		case m.key == "chart":
		case m.key == "data":
			if jsonKind(m.val) != "a string" {
				return render.Panel{}, nil, fmt.Errorf("%s: give the data file's path as a string, not %s", kp, jsonKind(m.val))
			}
			json.Unmarshal(m.val, &dataPath) // a string, checked above
			if dataPath == "" || dataPath == "-" {
				return render.Panel{}, nil, fmt.Errorf("%s: give a data file (relative to the figure file); standard input cannot feed a figure's panels", kp)
			}
		case ok && notPanelKeys[m.key] != "":
			return render.Panel{}, nil, fmt.Errorf("%s: %s", kp, notPanelKeys[m.key])
		case ok:
			if err := bindKey(d, kp, m.val); err != nil {
				return render.Panel{}, nil, err
			}
			given[m.key] = true
		default:
			return render.Panel{}, nil, unknownKey(kp, m.key, "for a "+name+" panel", keys)
		}
	}
	if dataPath == "" {
		return render.Panel{}, nil, fmt.Errorf("%s: no \"data\" key; give the data file's path, relative to the figure file", path)
	}
	file := dataPath
	if !filepath.IsAbs(file) {
		file = filepath.Join(dir, file)
	}
	sh := ch.base()
	if err := sh.finish(); err != nil {
		return render.Panel{}, nil, fmt.Errorf("%s: %v", path, err)
	}
	t, notes, err := ch.readTable(file, nil, nil)
	if err == nil {
		var part panelPart
		part, err = ch.panel(t, nil, render.Common{Title: sh.c.Title, Annotations: sh.c.Annotations, Colors: sh.c.Colors}, func(f string) bool { return given[f] })
		if err == nil {
			notes = append(notes, part.notes...)
			for i := range notes {
				notes[i].Text = path + ": " + asKeys(notes[i].Text, "", ch.flags())
			}
			return part.panel, notes, nil
		}
	}
	return render.Panel{}, nil, panelWords(err, path, dataPath, members, ch.flags())
}

// flagMention is a flag named in a chart's message ("--series").
var flagMention = regexp.MustCompile(`--([a-z][a-z0-9-]*)`)

// panelWords says a panel's error in the figure file's words: a column
// the data lacks under the key that named it ("panels[2].value: no column
// "kg" in crops.csv; ..."), flags as keys, anything else under the panel.
func panelWords(err error, path, dataPath string, members []member, defs []flagDef) error {
	var de *DataError
	if errors.As(err, &de) && errors.Is(err, ErrMissingColumn) {
		for _, m := range members {
			if m.key == "chart" || m.key == "data" {
				continue
			}
			var s string
			var list []string
			json.Unmarshal(m.val, &s)
			json.Unmarshal(m.val, &list)
			if s == de.Column || slices.Contains(list, de.Column) {
				return fmt.Errorf("%s.%s: no column %q in %s; %s", path, m.key, de.Column, dataPath, de.Hint)
			}
		}
		return fmt.Errorf("%s.data: no column %q in %s; %s", path, de.Column, dataPath, de.Hint)
	}
	if de != nil {
		return fmt.Errorf("%s.data: %v", path, err)
	}
	var oe *render.OptionError
	if errors.As(err, &oe) {
		for _, d := range defs {
			if slices.Contains(d.sets, oe.Option) {
				return fmt.Errorf("%s.%s: %v", path, d.name, (&render.OptionError{Option: "", Value: oe.Value, Err: oe.Err}).Error())
			}
		}
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return fmt.Errorf("%s.data: cannot read %s: %v", path, dataPath, pe.Err)
	}
	if msg := asKeys(err.Error(), path, defs); msg != err.Error() {
		return errors.New(msg)
	}
	return fmt.Errorf("%s: %v", path, err)
}

// asKeys rewrites the flags a message names as the panel's keys: "--y"
// becomes "panels[2].y", or "y" for an empty path.
func asKeys(msg, path string, defs []flagDef) string {
	return flagMention.ReplaceAllStringFunc(msg, func(s string) string {
		name := s[2:]
		if slices.ContainsFunc(defs, func(d flagDef) bool { return d.name == name }) {
			return joinPath(path, name)
		}
		return s
	})
}

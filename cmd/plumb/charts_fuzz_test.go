package main

import (
	"bytes"
	"encoding/xml"
	"io"
	"strings"
	"testing"
)

// FuzzCharts feeds arbitrary data to every chart through the CLI: whatever
// the input, plumb exits 0 with well-formed XML or 1 with a message, and
// never panics.
func FuzzCharts(f *testing.F) {
	for _, seed := range []string{
		eightRegions,
		"x,y\n1,5\n2,7\n3,-2\n",
		"date,a,b\n2024-01,1,2\n2024-02,3,1\n2024-03,,4\n",
		"k,v\n\"<b>\",1e308\nq,-1e308\n",
		"t,y,s\n1,1,a\n2,2,a\n1,3,b\n2,1,b\n",
		"a,b\n,\n",
	} {
		for chart := range uint8(4) {
			f.Add(seed, chart, uint8(0))
			f.Add(seed, chart, uint8(1+chart))
		}
	}
	// Inputs that once panicked: a series with no values at all.
	f.Add("0,1,2\n0,0,", uint8(2), uint8(0))
	f.Add("0,2,1\n0,,0", uint8(3), uint8(0))
	charts := []string{"bars", "dots", "lines", "diff"}
	// Flags that change the layout the most, per chart; variant 0 is none.
	variants := [][][]string{
		{{"--percent"}, {"--vertical"}, {"--for", "print", "--top", "3"}, {"--order", "label", "--for", "slide"}},
		{{"--for", "print"}, {"--top", "2"}, {"--order", "data"}},
		{{"--index"}, {"--together", "--for", "print"}, {"--aspect", "orientation"}, {"--aspect", "3:1", "--for", "slide"}},
		{{"--context"}, {"--for", "print", "--context"}},
	}
	f.Fuzz(func(t *testing.T, data string, chart, variant uint8) {
		c := int(chart) % len(charts)
		name := charts[c]
		args := []string{name, "-", "--format", "csv", "--quiet"}
		if v := int(variant) % (len(variants[c]) + 1); v > 0 {
			args = append(args, variants[c][v-1]...)
		}
		var out, errs bytes.Buffer
		code := run(args, strings.NewReader(data), &out, &errs)
		switch code {
		case exitOK:
			// The figure may quote its input, so only input without such
			// words promises output without them.
			if !notFinite.MatchString(data) {
				checkNoNaN(t, out.Bytes())
			}
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
		case exitData:
			if errs.Len() == 0 {
				t.Fatalf("%v on %q: exit 1 without a message", args, data)
			}
		default:
			t.Fatalf("%v on %q: exit %d: %s", args, data, code, errs.String())
		}
	})
}

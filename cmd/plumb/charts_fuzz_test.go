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
			f.Add(seed, chart)
		}
	}
	charts := []string{"bars", "dots", "lines", "diff"}
	f.Fuzz(func(t *testing.T, data string, chart uint8) {
		name := charts[int(chart)%len(charts)]
		var out, errs bytes.Buffer
		code := run([]string{name, "-", "--format", "csv", "--quiet"}, strings.NewReader(data), &out, &errs)
		switch code {
		case exitOK:
			dec := xml.NewDecoder(&out)
			for {
				_, err := dec.Token()
				if err == io.EOF {
					break
				}
				if err != nil {
					t.Fatalf("%s on %q: output is not XML: %v", name, data, err)
				}
			}
		case exitData:
			if errs.Len() == 0 {
				t.Fatalf("%s on %q: exit 1 without a message", name, data)
			}
		default:
			t.Fatalf("%s on %q: exit %d: %s", name, data, code, errs.String())
		}
	})
}

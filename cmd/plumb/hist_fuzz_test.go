package main

import (
	"bytes"
	"encoding/xml"
	"io"
	"strings"
	"testing"
)

// FuzzDistributions feeds arbitrary data to span, box and hist through the
// CLI: whatever the input, plumb exits 0 with well-formed XML or 1 with a
// message, and never panics.
func FuzzDistributions(f *testing.F) {
	for _, seed := range []string{
		"g,v,k,a,b,c\nx,1,1,1,2,3\nx,2,0,0,1,2\ny,5,1,4,5,9\ny,7,0,1,1,1\nx,30,0,2,2,2\n",
		"g,v\na,1e308\nb,-1e308\na,5e-324\n",
		"g,v\n\"<b>\",3\n\"<b>\",3\n\"<b>\",3\n",
		"v\n0\n0\n0\n0\n1\n",
		"g,v,k\na,,1\n,2,1\n",
	} {
		for variant := range uint8(len(distributionArgs)) {
			f.Add(seed, variant)
		}
	}
	f.Fuzz(func(t *testing.T, data string, variant uint8) {
		args := append([]string(nil), distributionArgs[int(variant)%len(distributionArgs)]...)
		args = append(args, "--format", "csv", "--quiet")
		var out, errs bytes.Buffer
		code := run(args, strings.NewReader(data), &out, &errs)
		switch code {
		case exitOK:
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

// distributionArgs are the command lines FuzzDistributions runs.
var distributionArgs = [][]string{
	{"box", "-"},
	{"box", "-", "--group", "g", "--value", "v", "--for", "print"},
	{"hist", "-"},
	{"hist", "-", "--bins", "7", "--for", "slide"},
	{"hist", "-", "--width", "0.5", "--density"},
	{"span", "-", "--label", "g", "--value", "v", "--stat", "quartiles", "--mark-where", "k=1"},
	{"span", "-", "--label", "g", "--low", "a", "--mid", "b", "--high", "c", "--order", "label"},
}

package main

import (
	"bytes"
	"fmt"
	"strings"
	"testing"
)

func TestNotFinitePattern(t *testing.T) {
	tests := []struct {
		text string
		want bool
	}{
		{`<rect width="+Inf"`, true},
		{`<path d="M0,NaN L1,2"`, true},
		{`>NaN%<`, true},
		{`down 5 (-Inf%)`, true},
		{`−Inf`, true},
		{`Information desk`, false},
		{`Nantes, Banana`, false},
		{`1.7e+308`, false},
	}
	for _, tc := range tests {
		assert := notFinite.MatchString(tc.text)
		if assert != tc.want {
			t.Errorf("%q: matched %v, want %v", tc.text, assert, tc.want)
		}
	}
}

// TestExtremeTablesThroughCLI draws tables of extreme values with every
// chart and its layout-heavy flags: each gives exit 1 with a message or a
// figure without NaN or Inf anywhere (labels, paths, attributes, notes).
func TestExtremeTablesThroughCLI(t *testing.T) {
	tables := map[string]string{
		"near max float":  "label,value,other\nNorth,1.7e308,1\nSouth,1.7e308,2\nEast,8.5e307,3\n",
		"max both signs":  "label,value,other\nNorth,1.7976931348623157e308,1\nSouth,-1.7976931348623157e308,2\nEast,1,3\n",
		"tiny":            "label,value,other\nNorth,1e-300,1\nSouth,2e-300,2\nEast,3e-300,3\n",
		"subnormal":       "label,value,other\nNorth,5e-324,1\nSouth,1e-323,2\nEast,0,3\n",
		"huge range":      "label,value,other\nNorth,1e-300,1e300\nSouth,1e300,1\nEast,1,1e-300\n",
		"tiny base":       "x,a,b\n1,1e-300,1\n2,5,2\n3,1e10,3\n",
		"huge x":          "x,a,b\n1e307,1,2\n1.5e308,3,1\n1.7e308,2,2\n",
		"millisecond x":   "x,a,b\n1709251200000,1,2\n1709337600000,3,1\n1709424000000,2,2\n",
		"huge difference": "x,a,b\n1,1.7e308,-1.7e308\n2,1,2\n3,2,1\n",
	}
	charts := map[string][][]string{
		"bars":  {nil, {"--percent"}, {"--vertical"}, {"--from", "-1"}, {"--from", "-1e30"}},
		"dots":  {nil, {"--for", "print"}},
		"lines": {nil, {"--index"}, {"--together"}},
		"diff":  {nil, {"--context"}},
	}
	for name, data := range tables {
		for chart, variants := range charts {
			for _, v := range variants {
				args := append([]string{chart, "-", "--format", "csv", "--quiet"}, v...)
				t.Run(fmt.Sprintf("%s/%s", name, strings.Join(args, " ")), func(t *testing.T) {
					var out, errs bytes.Buffer
					switch code := run(args, strings.NewReader(data), &out, &errs); code {
					case exitOK:
						checkFigure(t, out.Bytes())
					case exitData:
						if errs.Len() == 0 {
							t.Fatal("exit 1 without a message")
						}
						if notFinite.Match(errs.Bytes()) {
							t.Errorf("the message holds a number that is not finite: %s", errs.String())
						}
					default:
						t.Fatalf("exit %d: %s", code, errs.String())
					}
				})
			}
		}
	}
}

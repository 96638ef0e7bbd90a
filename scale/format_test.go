package scale

import (
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
)

func TestFormat(t *testing.T) {
	tests := []struct {
		name string
		f    Format
		v    float64
		want string
	}{
		{"zero value prints integers", Format{}, 42, "42"},
		{"shared decimals", Format{Decimals: 1}, 1, "1.0"},
		{"rounds to decimals", Format{Decimals: 2}, 0.15000000000000002, "0.15"},
		{"group", Format{Group: true}, 12500, "12,500"},
		{"group applies to four digits too", Format{Group: true}, 2500, "2,500"},
		{"group keeps decimals", Format{Group: true, Decimals: 2}, 1234567.891, "1,234,567.89"},
		{"no group", Format{}, 12500, "12500"},
		{"abbreviation", Format{Decimals: 1, Divisor: 1e6, Suffix: "M"}, 2.5e6, "2.5M"},
		{"zero divisor is one", Format{Divisor: 0}, 7, "7"},
		{"percent without space", Format{Unit: "%"}, 40, "40%"},
		{"unit after a space", Format{Unit: "kg"}, 12, "12 kg"},
		{"suffix then unit", Format{Decimals: 1, Divisor: 1e3, Suffix: "k", Unit: "t"}, 12500, "12.5k t"},
		{"minus sign U+2212", Format{Decimals: 1}, -3.25, "\u22123.2"},
		{"negative grouped", Format{Group: true}, -12500, "\u221212,500"},
		{"negative abbreviated", Format{Decimals: 1, Divisor: 1e6, Suffix: "M"}, -2.5e6, "\u22122.5M"},
		{"never minus zero", Format{Decimals: 1}, -0.04, "0.0"},
		{"negative zero", Format{}, math.Copysign(0, -1), "0"},
		{"zero on an abbreviated axis", Format{Decimals: 1, Divisor: 1e6, Suffix: "M", Unit: "%"}, 0, "0%"},
		{"NaN", Format{}, math.NaN(), "NaN"},
		{"infinity", Format{Unit: "kg"}, math.Inf(-1), "\u2212∞ kg"},
		{"negative decimals are zero", Format{Decimals: -3}, 2.5, "2"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, tt.f.Format(tt.v))
		})
	}
}

// formatAll prints every value with TickFormat's or ValueFormat's choice.
func formatAll(f Format, vs []float64) []string {
	out := make([]string, len(vs))
	for i, v := range vs {
		out[i] = f.Format(v)
	}
	return out
}

func TestTickFormat(t *testing.T) {
	tests := []struct {
		name  string
		ticks []float64
		unit  string
		want  []string
	}{
		{"shared precision", []float64{0, 0.5, 1}, "", []string{"0.0", "0.5", "1.0"}},
		{"float noise ignored", []float64{0.1, 0.15000000000000002, 0.2, 0.25, 0.30000000000000004}, "",
			[]string{"0.10", "0.15", "0.20", "0.25", "0.30"}},
		{"integers", []float64{0, 25, 50, 75, 100}, "%", []string{"0%", "25%", "50%", "75%", "100%"}},
		{"years stay ungrouped", []float64{1980, 1990, 2000, 2010, 2020, 2030}, "",
			[]string{"1980", "1990", "2000", "2010", "2020", "2030"}},
		{"thousands", []float64{0, 2500, 5000, 7500, 10000, 12500}, "",
			[]string{"0", "2.5k", "5.0k", "7.5k", "10.0k", "12.5k"}},
		{"millions", []float64{0, 5e5, 1e6, 1.5e6, 2e6, 2.5e6}, "",
			[]string{"0", "0.5M", "1.0M", "1.5M", "2.0M", "2.5M"}},
		{"billions with unit", []float64{-2e9, 0, 2e9, 4e9}, "t",
			[]string{"\u22122B t", "0 t", "2B t", "4B t"}},
		{"in full when the abbreviation needs three decimals", []float64{1e6, 1.025e6, 1.05e6, 1.075e6, 1.1e6}, "",
			[]string{"1,000,000", "1,025,000", "1,050,000", "1,075,000", "1,100,000"}},
		{"small", []float64{0, 0.00025, 0.0005, 0.00075, 0.001}, "",
			[]string{"0.00000", "0.00025", "0.00050", "0.00075", "0.00100"}},
		{"very small", []float64{0, 1e-5, 2e-5, 3e-5}, "", []string{"0", "10×10⁻⁶", "20×10⁻⁶", "30×10⁻⁶"}},
		{"very large", []float64{-5e15, 0, 5e15}, "", []string{"\u22125×10¹⁵", "0", "5×10¹⁵"}},
		{"negatives", []float64{-1, -0.5, 0, 0.5, 1}, "", []string{"\u22121.0", "\u22120.5", "0.0", "0.5", "1.0"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, formatAll(TickFormat(tt.ticks, tt.unit), tt.ticks))
		})
	}
}

func TestTickFormatDistinctAndExact(t *testing.T) {
	// Every NiceDomain axis must print distinct labels that read back as the ticks.
	for _, c := range [][3]float64{{8.1, 14.1, 4}, {0.000123, 0.000987, 5}, {1e6, 1.1e6, 5}, {-3.7, 12.2, 6},
		{3, 3.0000001, 5}, {1e10, 1e10 + 1, 5}, {1e-300, 3e-300, 5}, {-1e300, 1e300, 5}, {123456, 123457, 3}} {
		tk := NiceDomain(c[0], c[1], int(c[2]))
		f := TickFormat(tk.Values, "")
		labels := formatAll(f, tk.Values)
		seen := map[string]bool{}
		for i, l := range labels {
			assert.False(t, seen[l], "%v: duplicate label %q in %q", c, l, labels)
			seen[l] = true
			// Read the label back: undo the minus sign, grouping and
			// abbreviation, and it must give the tick to a millionth of a step.
			num := strings.TrimSuffix(l, f.Suffix)
			num = strings.ReplaceAll(strings.ReplaceAll(num, "\u2212", "-"), ",", "")
			x, err := strconv.ParseFloat(num, 64)
			if !assert.NoError(t, err, "%v: label %q", c, l) {
				continue
			}
			div := f.Divisor
			if !(div > 0) {
				div = 1
			}
			assert.InDelta(t, tk.Values[i], x*div, 1e-6*tk.Step, "%v: label %q reads back wrong", c, l)
		}
	}
}

func TestValueFormat(t *testing.T) {
	tests := []struct {
		name   string
		values []float64
		unit   string
		want   []string
	}{
		{"integers get no decimals", []float64{3, 7, 12}, "", []string{"3", "7", "12"}},
		{"three significant digits", []float64{12.34, 7.1}, "", []string{"12.3", "7.1"}},
		{"small values", []float64{0.0123, 0.005}, "", []string{"0.0123", "0.0050"}},
		{"exact with fewer digits", []float64{2.5e6, 1e6}, "", []string{"2.5M", "1.0M"}},
		{"abbreviated to three digits", []float64{2461234, 1e6}, "", []string{"2.46M", "1.00M"}},
		{"no abbreviation that loses digits", []float64{2461234, 10}, "", []string{"2,461,234", "10"}},
		// The issue: a median of 118,750 among millions read "$0.12M".
		{"small among millions", []float64{3234567, 118750}, "$", []string{"$3,234,567", "$118,750"}},
		{"thousands abbreviated", []float64{118750, 95000, 102300}, "$", []string{"$119k", "$95k", "$102k"}},
		{"decimals the data shows", []float64{17.4, 17}, "", []string{"17.4", "17.0"}},
		{"differ at the third digit", []float64{0.5, 1200, 1201}, "", []string{"0", "1200", "1201"}},
		{"thousands", []float64{12500, 9800}, "", []string{"12.5k", "9.8k"}},
		{"percent", []float64{40, 12.5}, "%", []string{"40.0%", "12.5%"}},
		{"unit", []float64{12}, "kg", []string{"12 kg"}},
		{"negative", []float64{-1.5, 2}, "", []string{"\u22121.5", "2.0"}},
		{"rounds to zero without sign", []float64{-0.0001, 3}, "", []string{"0.00", "3.00"}},
		{"NaN ignored", []float64{math.NaN(), 3}, "", []string{"NaN", "3"}},
		{"all zero", []float64{0, 0}, "", []string{"0", "0"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, formatAll(ValueFormat(tt.values, tt.unit), tt.values))
		})
	}
}

func TestMagnitude(t *testing.T) {
	tests := []struct {
		a      float64
		div    float64
		suffix string
	}{
		{0, 1, ""}, {9999, 1, ""}, {1e4, 1e3, "k"}, {999999, 1e3, "k"}, {1e6, 1e6, "M"},
		{1e9, 1e9, "B"}, {1e12, 1e12, "T"}, {1e15, 1e15, "×10¹⁵"}, {3e17, 1e15, "×10¹⁵"},
		{1e-4, 1, ""}, {9e-5, 1e-6, "×10⁻⁶"}, {1e-6, 1e-6, "×10⁻⁶"}, {5e-7, 1e-9, "×10⁻⁹"},
		{math.Inf(1), 1, ""},
	}
	for _, tt := range tests {
		div, suffix := magnitude(tt.a)
		assert.Equal(t, tt.div, div, "magnitude(%g)", tt.a)
		assert.Equal(t, tt.suffix, suffix, "magnitude(%g)", tt.a)
	}
}

func FuzzFormat(f *testing.F) {
	f.Add(12500.0, 0, 1.0, "", "", true)
	f.Add(-2.5e6, 1, 1e6, "M", "%", false)
	f.Add(math.Copysign(0, -1), 2, 0.0, "", "kg", false)
	f.Add(1e308, 400, -1.0, "k", "", true)
	f.Fuzz(func(t *testing.T, v float64, decimals int, div float64, suffix, unit string, grp bool) {
		s := Format{Decimals: decimals, Divisor: div, Suffix: suffix, Unit: unit, Group: grp}.Format(v)
		if strings.HasPrefix(s, "-") || strings.Contains(s, "-0") && !strings.Contains(suffix+unit, "-") {
			t.Fatalf("ASCII minus in %q", s)
		}
		if utf8.ValidString(suffix) && utf8.ValidString(unit) && !utf8.ValidString(s) {
			t.Fatalf("invalid UTF-8 %q", s)
		}
		vs := []float64{v, v / 3, -v}
		TickFormat(vs, unit).Format(v)
		ValueFormat(vs, unit).Format(v)
	})
}

func BenchmarkTickFormat(b *testing.B) {
	ticks := []float64{0, 0.5e6, 1e6, 1.5e6, 2e6, 2.5e6}
	b.ReportAllocs()
	for b.Loop() {
		f := TickFormat(ticks, "")
		for _, v := range ticks {
			f.Format(v)
		}
	}
}

func TestCurrencyLeads(t *testing.T) {
	// Currency signs precede the amount in English usage (common practice).
	for _, tc := range []struct {
		f    Format
		v    float64
		want string
	}{
		{Format{Decimals: 2, Unit: "£"}, 24.2, "£24.20"},
		{Format{Decimals: 0, Unit: "$"}, -3, "\u2212$3"},
		{Format{Decimals: 1, Divisor: 1e6, Suffix: "M", Unit: "€"}, 2.5e6, "€2.5M"},
		{Format{Decimals: 1, Divisor: 1e6, Suffix: "M", Unit: "€"}, 0, "€0"},
		{Format{Decimals: 0, Unit: "kg"}, 12, "12 kg"},
	} {
		if got := tc.f.Format(tc.v); got != tc.want {
			t.Errorf("%+v.Format(%g) = %q, want %q", tc.f, tc.v, got, tc.want)
		}
	}
	if got := ValueFormat([]float64{24.2, 7.55}, "£").Format(24.2); got != "£24.20" {
		t.Errorf("money with a fraction shows whole cents: got %q", got)
	}
}

// TestValueFormatKeepsDistinctValuesApart is the property the issue asks
// for: no two values that differ at three significant digits print the same
// label, whatever their magnitudes, signs and units; and no abbreviated
// label keeps fewer than three significant digits unless it is exact.
func TestValueFormatKeepsDistinctValuesApart(t *testing.T) {
	r := rand.New(rand.NewPCG(11, 12))
	units := []string{"", "%", "$", "kg"}
	for range 3000 {
		n := 2 + r.IntN(30)
		vs := make([]float64, n)
		mag := math.Pow10(r.IntN(14) - 4)
		for i := range vs {
			switch r.IntN(4) {
			case 0: // medians: a few digits, some repeats of the leading ones
				vs[i] = math.Round(r.Float64()*mag*100) / 100
			case 1:
				vs[i] = math.Round(r.NormFloat64() * mag)
			case 2:
				vs[i] = r.Float64() * mag * math.Pow10(r.IntN(5)-2)
			default:
				vs[i] = float64(r.IntN(100000))
			}
		}
		unit := units[r.IntN(len(units))]
		for _, short := range []bool{false, true} {
			f := ValueFormat(vs, unit)
			if short {
				f = ShortValueFormat(vs, unit)
			}
			seen := map[string]float64{}
			for _, v := range vs {
				s := f.Format(v)
				if w, ok := seen[s]; ok && round3(v) != round3(w) {
					t.Fatalf("%v (short %v): %g and %g both print %q", vs, short, v, w, s)
				}
				seen[s] = v
			}
			if short || f.Suffix == "" || f.Divisor < 1 {
				continue
			}
			for _, v := range vs {
				x := math.Abs(v / f.Divisor)
				s := strconv.FormatFloat(x, 'f', f.Decimals, 64)
				if y, _ := strconv.ParseFloat(s, 64); v != 0 && math.Abs(y-x) > 1e-9*x && significantDigits(s) < 3 {
					t.Fatalf("%v: %g prints %q, fewer than three significant digits", vs, v, f.Format(v))
				}
			}
		}
	}
}

func TestShortValueFormat(t *testing.T) {
	for _, tc := range []struct {
		values []float64
		unit   string
		want   []string
	}{
		{[]float64{3234567, 118750, 95000, -999999}, "$", []string{"$3.23M", "$119k", "$95.0k", "\u2212$1.00M"}},
		{[]float64{9800, 1250, 17.4, 17, 0.01234, 0}, "", []string{"9.80k", "1.25k", "17.4", "17.0", "0.0123", "0"}},
		{[]float64{101.7, 55, 12}, "", []string{"102", "55.0", "12.0"}},
		{[]float64{12, 7}, "", []string{"12", "7"}},
		{[]float64{45.26}, "%", []string{"45.3%"}},
	} {
		assert.Equal(t, tc.want, formatAll(ShortValueFormat(tc.values, tc.unit), tc.values))
	}
}

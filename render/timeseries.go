package render

import (
	"fmt"
	"math"
	"time"
)

// TimeSeries makes a Series whose x values are instants: a line or
// difference chart drawn from it gets a calendar axis (in UTC) without the
// caller converting times to numbers or setting LinesOptions.Time. Times
// and y values pair by index, as X and Y do; a NaN in y is a missing value.
func TimeSeries(name string, t []time.Time, y []float64) Series {
	x := make([]float64, len(t))
	for i, ti := range t {
		x[i] = unixSeconds(ti)
	}
	return Series{Name: name, X: x, Y: y, times: true}
}

// IsTime reports whether the series' x values are instants (it was made by
// TimeSeries), held in X as seconds since 1970 UTC.
func (s Series) IsTime() bool { return s.times }

// Times returns the x values as instants, for a series made by TimeSeries or
// any X read as seconds since 1970 UTC.
func (s Series) Times() []time.Time {
	t := make([]time.Time, len(s.X))
	for i, x := range s.X {
		t[i] = unixTime(x)
	}
	return t
}

func unixSeconds(t time.Time) float64 {
	return float64(t.Unix()) + float64(t.Nanosecond())/1e9
}

// timeAxis decides whether the x values are instants: when the options say
// so (X already in Unix seconds), or when every series was made by
// TimeSeries. Mixing instants with plain numbers has no common axis.
func timeAxis(flag bool, series ...Series) (bool, error) {
	n := 0
	for _, s := range series {
		if s.times {
			n++
		}
	}
	if n > 0 && n < len(series) {
		return false, fmt.Errorf("%d of %d series have times for x and the others plain numbers: make every series with TimeSeries, or none", n, len(series))
	}
	return flag || n > 0, nil
}

// millisecondsFrom is where seconds since 1970 stop looking like seconds:
// 1e11 s is the year 5138, while milliseconds reach 1e11 in 1973 and
// 1.7e12 today (common practice: many systems count in milliseconds).
const millisecondsFrom = 1e11

// noteMilliseconds warns when x values read as seconds since 1970 lie so
// far from today that they are most likely milliseconds (or microseconds).
func (f *frame) noteMilliseconds(lo, hi float64, ok bool) {
	if !ok || math.Max(math.Abs(lo), math.Abs(hi)) < millisecondsFrom {
		return
	}
	year := unixTime(hi).Year()
	if math.Abs(lo) > math.Abs(hi) {
		year = unixTime(lo).Year()
	}
	f.scene.Note("milliseconds", false, fmt.Sprintf("the times, read as seconds since 1970, reach the year %d: if they are milliseconds, divide them by 1000", year))
}

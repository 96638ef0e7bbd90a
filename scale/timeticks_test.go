package scale

import (
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"
	_ "time/tzdata" // a daylight-saving zone for the tests, whatever the host has
)

var (
	isoDate   = regexp.MustCompile(`\d{4}-\d{2}`)
	longDigit = regexp.MustCompile(`\d{5,}`)
	yearWord  = regexp.MustCompile(`\b\d{4}\b`)
	dateWord  = regexp.MustCompile(`\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{1,2}\b`)
)

// checkTimeTicks asserts the properties every result must have; it returns
// a description of the alignment it found.
func checkTimeTicks(t *testing.T, name string, ticks []TimeTick, lo, hi time.Time, m int, loc *time.Location) string {
	t.Helper()
	// At most 2m ticks, or 7 for m < 4 when no calendar step fits (doc comment).
	if hiCount := max(2*m, 7); len(ticks) < 2 || len(ticks) > hiCount {
		t.Fatalf("%s: %d ticks, want 2..%d: %v", name, len(ticks), hiCount, ticks)
	}
	for i, k := range ticks {
		if k.T.Before(lo) || k.T.After(hi) {
			t.Errorf("%s: tick %v outside [%v, %v]", name, k.T, lo, hi)
		}
		if i > 0 && !k.T.After(ticks[i-1].T) {
			t.Errorf("%s: ticks not strictly increasing at %d", name, i)
		}
		if k.Label == "" || isoDate.MatchString(k.Label) || longDigit.MatchString(k.Label) {
			t.Errorf("%s: bad label %q", name, k.Label)
		}
	}
	unit := alignment(t, name, ticks, loc)
	// Context is printed on the first tick and where it changes, only there.
	for i, k := range ticks {
		lt := k.T.In(loc)
		newYear, newDay := i == 0, i == 0
		if i > 0 {
			p := ticks[i-1].T.In(loc)
			newYear = p.Year() != lt.Year()
			newDay = newYear || p.YearDay() != lt.YearDay()
		}
		hasYear := yearWord.MatchString(k.Label)
		switch unit {
		case "year":
			if k.Label != strconv.Itoa(lt.Year()) {
				t.Errorf("%s: year label %q", name, k.Label)
			}
		case "month", "day":
			if hasYear != newYear {
				t.Errorf("%s: label %q at %d: year printed %v, year changed %v", name, k.Label, i, hasYear, newYear)
			}
		default:
			if hasDate := dateWord.MatchString(k.Label); hasDate != newDay || hasYear != newYear {
				t.Errorf("%s: label %q at %d: date %v/%v year %v/%v (printed/changed)", name, k.Label, i, hasDate, newDay, hasYear, newYear)
			}
		}
	}
	return unit
}

// alignment checks that the ticks are evenly spaced multiples of one calendar
// unit on that unit's boundaries in loc, and names the unit.
func alignment(t *testing.T, name string, ticks []TimeTick, loc *time.Location) string {
	t.Helper()
	lt := make([]time.Time, len(ticks))
	for i, k := range ticks {
		lt[i] = k.T.In(loc)
	}
	all := func(f func(time.Time) bool) bool {
		return !slices.ContainsFunc(lt, func(x time.Time) bool { return !f(x) })
	}
	midnight := func(x time.Time) bool {
		return x.Hour() == 0 && x.Minute() == 0 && x.Second() == 0 && x.Nanosecond() == 0
	}
	even := func(idx func(time.Time) int64, allowed ...int64) bool {
		s := idx(lt[1]) - idx(lt[0])
		if !slices.Contains(allowed, s) {
			return false
		}
		for i := range lt {
			if i > 0 && idx(lt[i])-idx(lt[i-1]) != s {
				return false
			}
			if v := idx(lt[i]); ((v%s)+s)%s != 0 {
				return false
			}
		}
		return true
	}
	dayNum := func(x time.Time) int64 { return timeCivilDay(x.Date()) }
	switch {
	case all(func(x time.Time) bool { return midnight(x) && x.YearDay() == 1 }):
		if !even(func(x time.Time) int64 { return int64(x.Year()) }, 1, 2, 5, 10, 20, 25, 50, 100, 200, 250, 500, 1000) {
			t.Errorf("%s: years not evenly aligned: %v", name, ticks)
		}
		return "year"
	case all(func(x time.Time) bool { return midnight(x) && x.Day() == 1 }):
		if !even(func(x time.Time) int64 { return int64(x.Year())*12 + int64(x.Month()) - 1 }, 1, 2, 3, 4, 6) {
			t.Errorf("%s: months not evenly aligned: %v", name, ticks)
		}
		return "month"
	case all(midnight):
		weeks := even(func(x time.Time) int64 { return dayNum(x) - 4 }, 7, 14) // 1970-01-05 was a Monday
		if !weeks && !even(dayNum, 1, 2) {
			t.Errorf("%s: days not evenly aligned: %v", name, ticks)
		}
		if weeks && lt[0].Weekday() != time.Monday {
			t.Errorf("%s: weeks do not start on Monday", name)
		}
		return "day"
	case all(func(x time.Time) bool { return x.Minute() == 0 && x.Second() == 0 && x.Nanosecond() == 0 }):
		// Wall-clock hours: a daylight-saving change may stretch one step.
		s := (lt[1].Hour() - lt[0].Hour() + 24) % 24
		if !slices.Contains([]int{1, 2, 3, 6, 12}, s) {
			t.Errorf("%s: hour step %d: %v", name, s, ticks)
			s = 1
		}
		for _, x := range lt {
			if x.Hour()%s != 0 {
				t.Errorf("%s: hour %d not a multiple of %d", name, x.Hour(), s)
			}
		}
		return "hour"
	case all(func(x time.Time) bool { return x.Second() == 0 && x.Nanosecond() == 0 }):
		if !even(func(x time.Time) int64 { return x.Unix() / 60 }, 1, 2, 5, 10, 15, 30) {
			t.Errorf("%s: minutes not evenly aligned: %v", name, ticks)
		}
		return "minute"
	case all(func(x time.Time) bool { return x.Nanosecond() == 0 }):
		if !even(func(x time.Time) int64 { return x.Unix() }, 1, 2, 5, 10, 15, 30) {
			t.Errorf("%s: seconds not evenly aligned: %v", name, ticks)
		}
		return "second"
	default:
		if !even(func(x time.Time) int64 { return x.UnixNano() }, 1e8, 2e8, 2.5e8, 5e8, 1e7, 2e7, 2.5e7, 5e7) &&
			!even(func(x time.Time) int64 { return x.UnixNano() % 1e9 }, 1, 2, 5, 10, 20, 25, 50, 100, 1000) {
			// Coarse sub-second steps are checked exactly; finer ones only
			// for being positive.
			if lt[1].Sub(lt[0]) <= 0 {
				t.Errorf("%s: sub-second ticks not aligned: %v", name, ticks)
			}
		}
		return "subsecond"
	}
}

func TestTimeTicksSpans(t *testing.T) {
	day := 24 * time.Hour
	spans := []struct {
		name  string
		d     time.Duration
		unit  string // expected with m = 5 from the base start
		years int    // added with AddDate: a Duration saturates at 292 years
	}{
		{"2 minutes", 2 * time.Minute, "second", 0},
		{"6 hours", 6 * time.Hour, "hour", 0},
		{"3 days", 3 * day, "hour", 0},
		{"5 weeks", 35 * day, "day", 0},
		{"8 months", 243 * day, "month", 0},
		{"3 years", 1096 * day, "month", 0},
		{"10 years", 3653 * day, "year", 0},
		{"300 years", 0, "year", 300},
	}
	starts := []time.Time{
		time.Date(2024, 3, 17, 8, 30, 0, 0, time.UTC),
		time.Date(1999, 12, 31, 23, 59, 59, 999, time.UTC),
		time.Date(1700, 2, 28, 13, 7, 0, 0, time.UTC),
		time.Date(2024, 1, 1, 0, 0, 0, 0, time.UTC),
	}
	for _, s := range spans {
		for si, lo := range starts {
			for _, m := range []int{3, 5, 7, 10} {
				hi := lo.Add(s.d).AddDate(s.years, 0, 0)
				name := s.name + "/" + lo.Format(time.RFC3339Nano) + "/m=" + strconv.Itoa(m)
				ticks := TimeTicks(lo, hi, m, nil)
				unit := checkTimeTicks(t, name, ticks, lo, hi, m, time.UTC)
				if si == 0 && m == 5 && unit != s.unit {
					t.Errorf("%s: unit %s, want %s: %v", name, unit, s.unit, ticks)
				}
			}
		}
	}
}

func TestTimeTicksLabels(t *testing.T) {
	utc := func(y int, mo time.Month, d, h int) time.Time { return time.Date(y, mo, d, h, 0, 0, 0, time.UTC) }
	cases := []struct {
		name   string
		lo, hi time.Time
		m      int
		want   []string
	}{
		// The quarterly example of the design (issue 4, time axes): the year
		// printed on the first tick and where it changes.
		{"quarters", utc(2024, 1, 1, 0), utc(2025, 1, 1, 0), 5, []string{"Jan 2024", "Apr", "Jul", "Oct", "Jan 2025"}},
		// methods.md §10 [V]: extended(1980, 2024, 6) gives 1980 1990 2000 2010 2020
		// on the year number (R labeling 0.4.2).
		{"years 1980-2024", utc(1980, 1, 1, 0), utc(2024, 1, 1, 0), 6, []string{"1980", "1990", "2000", "2010", "2020"}},
		// Weeks start on Monday; 2024-03-04 was a Monday (ISO 8601 week 10).
		{"weeks", utc(2024, 3, 1, 0), utc(2024, 4, 5, 0), 5, []string{"Mar 4, 2024", "Mar 11", "Mar 18", "Mar 25", "Apr 1"}},
		{"across new year", utc(2024, 12, 20, 0), utc(2025, 1, 20, 0), 5,
			[]string{"Dec 23, 2024", "Dec 30", "Jan 6, 2025", "Jan 13", "Jan 20"}},
	}
	for _, c := range cases {
		ticks := TimeTicks(c.lo, c.hi, c.m, nil)
		checkTimeTicks(t, c.name, ticks, c.lo, c.hi, c.m, time.UTC)
		var got []string
		for _, k := range ticks {
			got = append(got, k.Label)
		}
		if len(c.want) > 0 && !slices.Equal(got, c.want) {
			t.Errorf("%s: labels %q, want %q", c.name, got, c.want)
		}
	}
}

func TestTimeTicksHourLabels(t *testing.T) {
	lo := time.Date(2024, 3, 17, 17, 0, 0, 0, time.UTC)
	ticks := TimeTicks(lo, lo.Add(12*time.Hour), 5, nil)
	checkTimeTicks(t, "hours", ticks, lo, lo.Add(12*time.Hour), 5, time.UTC)
	var got []string
	for _, k := range ticks {
		got = append(got, k.Label)
		if k.Major != (k.T.Hour() == 0) {
			t.Errorf("tick %v Major=%v; want Major exactly at midnight", k.T, k.Major)
		}
	}
	// Midnight carries the new date instead of "00:00"; other ticks only the clock.
	if !slices.Contains(got, "Mar 18") || !strings.HasPrefix(got[0], "Mar 17, 2024 ") {
		t.Errorf("hour labels %q", got)
	}
}

func TestTimeTicksThreeYearsDaily(t *testing.T) {
	// A three-year daily series: the axis must print years, never raw dates
	// (issue 4, "How it will be checked").
	lo := time.Date(2021, 1, 1, 0, 0, 0, 0, time.UTC)
	hi := time.Date(2023, 12, 31, 0, 0, 0, 0, time.UTC)
	for _, m := range []int{3, 5, 8, 12} {
		ticks := TimeTicks(lo, hi, m, nil)
		checkTimeTicks(t, "three years", ticks, lo, hi, m, time.UTC)
		years := map[string]bool{}
		for _, k := range ticks {
			for _, y := range yearWord.FindAllString(k.Label, -1) {
				years[y] = true
			}
		}
		if len(years) < 2 {
			t.Errorf("m=%d: labels name %d years: %v", m, len(years), ticks)
		}
	}
}

func TestTimeTicksLeapYears(t *testing.T) {
	day := 24 * time.Hour
	labels := func(lo, hi time.Time, m int) []string {
		ticks := TimeTicks(lo, hi, m, nil)
		checkTimeTicks(t, lo.String(), ticks, lo, hi, m, time.UTC)
		var s []string
		for _, k := range ticks {
			s = append(s, k.Label)
		}
		return s
	}
	// 2024 is a leap year, 2023 and 2100 are not (Gregorian rule, common practice).
	lo := time.Date(2024, 2, 27, 0, 0, 0, 0, time.UTC)
	if got := labels(lo, lo.Add(4*day), 5); !slices.Contains(got, "Feb 29") || !slices.Contains(got, "Mar 1") {
		t.Errorf("2024 daily ticks %q; want Feb 29 and Mar 1", got)
	}
	lo = time.Date(2023, 2, 27, 0, 0, 0, 0, time.UTC)
	if got := labels(lo, lo.Add(4*day), 5); slices.Contains(got, "Feb 29") || !slices.Contains(got, "Mar 1") {
		t.Errorf("2023 daily ticks %q", got)
	}
	lo = time.Date(2100, 2, 27, 0, 0, 0, 0, time.UTC)
	if got := labels(lo, lo.Add(3*day), 4); slices.Contains(got, "Feb 29") {
		t.Errorf("2100 daily ticks %q", got)
	}
	// Monthly ticks stay on the 1st through February of a leap year.
	lo = time.Date(2024, 1, 15, 0, 0, 0, 0, time.UTC)
	for _, k := range TimeTicks(lo, lo.Add(150*day), 6, nil) {
		if k.T.Day() != 1 || k.T.Hour() != 0 {
			t.Errorf("monthly tick %v not on the 1st", k.T)
		}
	}
}

func TestTimeTicksTimeZones(t *testing.T) {
	ist := time.FixedZone("+05:30", 5*3600+1800)
	lo := time.Date(2024, 3, 17, 0, 0, 0, 0, time.UTC)
	hi := lo.Add(5 * 24 * time.Hour)
	ticks := TimeTicks(lo, hi, 5, ist)
	checkTimeTicks(t, "+05:30", ticks, lo, hi, 5, ist)
	for _, k := range ticks {
		l := k.T.In(ist)
		if l.Hour() != 0 || l.Minute() != 0 {
			t.Errorf("tick %v is not local midnight in +05:30", l)
		}
		if k.T.UTC().Hour() != 18 || k.T.UTC().Minute() != 30 {
			t.Errorf("tick %v: local midnight at +05:30 is 18:30 UTC", k.T.UTC())
		}
	}

	// Daylight saving: New York sprang forward on 2024-03-10 (02:00 → 03:00)
	// and fell back on 2024-11-03, from the IANA tz database.
	ny, err := time.LoadLocation("America/New_York")
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		lo   time.Time
		d    time.Duration
		m    int
		name string
	}{
		{time.Date(2024, 3, 9, 12, 0, 0, 0, ny), 36 * time.Hour, 8, "spring hours"},
		{time.Date(2024, 11, 2, 12, 0, 0, 0, ny), 36 * time.Hour, 8, "autumn hours"},
		{time.Date(2024, 3, 5, 0, 0, 0, 0, ny), 10 * 24 * time.Hour, 10, "spring days"},
		{time.Date(2024, 11, 3, 0, 0, 0, 0, ny), 4 * time.Hour, 5, "autumn night"},
	} {
		hi := c.lo.Add(c.d)
		ticks := TimeTicks(c.lo, hi, c.m, ny)
		checkTimeTicks(t, c.name, ticks, c.lo, hi, c.m, ny)
		for _, k := range ticks {
			if l := k.T.In(ny); l.Minute() != 0 {
				t.Errorf("%s: tick %v not on a whole local hour", c.name, l)
			}
		}
	}
}

func TestTimeTicksDegenerate(t *testing.T) {
	lo := time.Date(2024, 3, 17, 8, 30, 0, 0, time.UTC)
	if got := TimeTicks(lo, lo, 5, nil); len(got) != 1 || !got[0].T.Equal(lo) || got[0].Label != "Mar 17, 2024 08:30" {
		t.Errorf("empty range: %v", got)
	}
	hi := lo.Add(48 * time.Hour)
	a, b := TimeTicks(lo, hi, 5, nil), TimeTicks(hi, lo, 5, nil)
	if !slices.EqualFunc(a, b, func(x, y TimeTick) bool { return x.T.Equal(y.T) && x.Label == y.Label }) {
		t.Errorf("swapped range differs: %v vs %v", a, b)
	}
	for _, m := range []int{-3, 0, 1, 2, 1 << 40} {
		checkTimeTicks(t, "m="+strconv.Itoa(m), TimeTicks(lo, hi, m, nil), lo, hi, min(max(m, 2), 1000), time.UTC)
	}
	// Spans shorter than a second use decimal fractions.
	short := lo.Add(3 * time.Millisecond)
	ticks := TimeTicks(lo, short, 4, nil)
	checkTimeTicks(t, "3ms", ticks, lo, short, 4, time.UTC)
	if ticks[1].Label != "08:30:00.001" {
		t.Errorf("3 ms labels: %v", ticks)
	}
	// Ranges beyond 292 years, where time.Duration saturates.
	far := time.Date(1, 1, 1, 0, 0, 0, 0, time.UTC)
	checkTimeTicks(t, "two millennia", TimeTicks(far, lo, 5, nil), far, lo, 5, time.UTC)
}

func FuzzTimeTicks(f *testing.F) {
	f.Add(int64(1710664200), int64(120), 5)
	f.Add(int64(-5e10), int64(1e10), 3)
	f.Add(int64(0), int64(1), 2)
	f.Add(int64(1710663958), int64(519), -38) // m = 2 with no step giving 2..4 ticks
	f.Fuzz(func(t *testing.T, start, span int64, m int) {
		start %= 1 << 37 // about ±4000 years around 1970
		span %= 1 << 36
		lo := time.Unix(start, 0).UTC()
		hi := time.Unix(start+span, int64(uint64(span)%1e9)).UTC()
		ticks := TimeTicks(lo, hi, m%50, nil)
		if lo.Equal(hi) {
			if len(ticks) != 1 {
				t.Fatalf("empty range: %v", ticks)
			}
			return
		}
		if hi.Before(lo) {
			lo, hi = hi, lo
		}
		checkTimeTicks(t, "fuzz", ticks, lo, hi, min(max(m%50, 2), 1000), time.UTC)
		// Every other tick, labelled again, still labels every tick and
		// names the date on the first.
		var kept []time.Time
		for i := 0; i < len(ticks); i += 2 {
			kept = append(kept, ticks[i].T)
		}
		relabelled := TimeLabels(kept, nil)
		if len(relabelled) != len(kept) {
			t.Fatalf("TimeLabels gave %d labels for %d instants", len(relabelled), len(kept))
		}
		for i, k := range relabelled {
			if k.Label == "" || !k.T.Equal(kept[i]) {
				t.Fatalf("TimeLabels(%v)[%d] = %+v", kept, i, k)
			}
		}
	})
}

func BenchmarkTimeTicks(b *testing.B) {
	lo := time.Date(2014, 3, 17, 8, 30, 0, 0, time.UTC)
	hi := time.Date(2024, 6, 1, 0, 0, 0, 0, time.UTC)
	b.ReportAllocs()
	for b.Loop() {
		TimeTicks(lo, hi, 7, nil)
	}
}

func TestTimeLabels(t *testing.T) {
	at := func(h, mi, s, ns int) time.Time { return time.Date(2024, 3, 17, h, mi, s, ns, time.UTC) }
	cases := []struct {
		name string
		ts   []time.Time
		want []string
	}{
		// Every other tick of a seconds axis that fell on whole minutes reads
		// as minutes; the date only on the first tick.
		{"minutes from seconds", []time.Time{at(8, 0, 0, 0), at(8, 1, 0, 0), at(8, 2, 0, 0)}, []string{"Mar 17, 2024 08:00", "08:01", "08:02"}},
		{"seconds", []time.Time{at(8, 0, 0, 0), at(8, 0, 30, 0)}, []string{"Mar 17, 2024 08:00:00", "08:00:30"}},
		{"fractions", []time.Time{at(8, 0, 0, 0), at(8, 0, 0, 250e6)}, []string{"Mar 17, 2024 08:00:00.00", "08:00:00.25"}},
		// A kept tick on a new day must say so, even when the tick that
		// carried the date was dropped.
		{"new day", []time.Time{at(12, 0, 0, 0), at(18, 0, 0, 0), at(30, 0, 0, 0)}, []string{"Mar 17, 2024 12:00", "18:00", "Mar 18 06:00"}},
		{"midnight", []time.Time{at(0, 0, 0, 0), at(24, 0, 0, 0), at(48, 0, 0, 0)}, []string{"Mar 17, 2024", "Mar 18", "Mar 19"}},
		{"years", []time.Time{time.Date(2020, 1, 1, 0, 0, 0, 0, time.UTC), time.Date(2030, 1, 1, 0, 0, 0, 0, time.UTC)}, []string{"2020", "2030"}},
		{"empty", nil, nil},
	}
	for _, c := range cases {
		var got []string
		for _, k := range TimeLabels(c.ts, nil) {
			got = append(got, k.Label)
		}
		if !slices.Equal(got, c.want) {
			t.Errorf("%s: labels %q, want %q", c.name, got, c.want)
		}
	}
}

func TestTimeTicksSecondLabels(t *testing.T) {
	// A few minutes at one-second resolution: the date and clock on the
	// first tick, only the clock after it.
	lo := time.Date(2009, 12, 22, 0, 0, 0, 0, time.UTC)
	ticks := TimeTicks(lo, lo.Add(200*time.Second), 5, nil)
	checkTimeTicks(t, "seconds", ticks, lo, lo.Add(200*time.Second), 5, time.UTC)
	if !strings.HasPrefix(ticks[0].Label, "Dec 22, 2009") {
		t.Errorf("first label %q lacks the date", ticks[0].Label)
	}
	for _, k := range ticks[1:] {
		if strings.Contains(k.Label, ",") || len(k.Label) > len("00:00:00") {
			t.Errorf("label %q repeats context", k.Label)
		}
	}
}

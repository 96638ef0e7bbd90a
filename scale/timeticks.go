package scale

import (
	"math"
	"strconv"
	"strings"
	"time"
)

// TimeTick is one tick of a time axis.
type TimeTick struct {
	// T is the tick's instant, on a calendar boundary in the axis's location.
	T time.Time
	// Label is the tick's text. It gives only what changed since the previous
	// tick, so the first tick and the ticks where the context changes are
	// longer: "Jan 2024", "Apr", "Jul", "Oct", "Jan 2025".
	Label string
	// Major marks a tick that starts a new period of the labels' context: a
	// new year for month and day ticks, a new day (local midnight) for ticks
	// within a day. Year ticks have no context and are never Major. A
	// renderer may draw these ticks or grid lines more strongly.
	Major bool
}

// The calendar units, coarsest first; candidates are visited in this order,
// so on equal scores the coarser unit wins.
const (
	unitYear = iota
	unitMonth
	unitDay
	unitHour
	unitMinute
	unitSecond
	unitSubsecond
)

// timeUnitMultiples lists the nice multiples of each unit, the preferred
// first (methods.md §10, a design of this project, not a published method).
// Years and sub-second steps use q·10^z with q from timeDecimalQ instead.
var timeUnitMultiples = [...][]int{
	unitMonth:  {1, 3, 6, 2, 4},
	unitDay:    {1, 7, 2, 14}, // 7 and 14 are weeks, starting on Monday (ISO 8601)
	unitHour:   {1, 6, 3, 12, 2},
	unitMinute: {1, 5, 15, 30, 10, 2},
	unitSecond: {1, 5, 15, 30, 10, 2},
}

// timeDecimalQ are the nice mantissas for years and fractions of a second,
// in Talbot, Lin & Hanrahan's (2010) order of preference, without 4 and 3,
// which give steps such as 3 or 40 years that no calendar reader expects.
var timeDecimalQ = [...]float64{1, 5, 2, 2.5}

// timeTicksSpare bounds the tick count when m is so small that no step gives
// 2m ticks or fewer. Neighbouring steps differ at most 3.5-fold (2 days to a
// week), and a step that leaves fewer than two ticks inside the range means
// the range is shorter than two steps, so the next finer step gives fewer
// than 2·3.5 + 1 = 8 ticks.
const timeTicksSpare = 7

// nominal unit lengths in seconds, used only to estimate tick counts before
// generating ticks.
var timeUnitSeconds = [...]float64{
	unitYear:      365.2425 * 86400,
	unitMonth:     30.436875 * 86400,
	unitDay:       86400,
	unitHour:      3600,
	unitMinute:    60,
	unitSecond:    1,
	unitSubsecond: 1e-9,
}

var timeMonthAbbrev = [...]string{"Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"}

// TimeTicks chooses about m calendar-aligned ticks for the time range
// [lo, hi] shown in loc (nil means UTC).
//
// Candidate steps are nice multiples of calendar units: years (1, 2, 5, 10,
// 25, 50, 100 … as for numbers), months (1, 3, 6, 2, 4), days (1, 2, and
// weeks of 7 or 14 days starting on Mondays), hours (1, 6, 3, 12, 2), minutes
// and seconds (1, 5, 15, 30, 10, 2) and decimal fractions of a second. Ticks
// fall on the unit's boundaries in loc's wall-clock time (Jan 1 for years,
// the 1st at midnight for months, local midnight for days, whole hours …),
// computed with calendar arithmetic so that months of 28–31 days, leap days
// and daylight-saving days of 23 or 25 hours land where a calendar says.
// Every candidate is scored like Talbot, Lin & Hanrahan's (2010) extended
// algorithm, with coverage and density measured in real time and a
// simplicity term that prefers the earlier multiples of each list (methods.md
// §10, this project's own design: no published calendar-tick algorithm
// exists); equal scores go to the coarser unit.
//
// Ticks are strictly increasing and all lie within [lo, hi] (the axis is not
// extended to a tick beyond the data). There are between 2 and 2m of them;
// only for m = 2 or 3, when no calendar step fits (nice steps may differ
// 3.5-fold, from 2 days to a week), there may be up to 7. A range shorter
// than two nanoseconds gets the single tick lo.
// m below 2 counts as 2, and above 1000 as 1000. lo and hi are swapped if
// out of order.
//
// Labels use English month abbreviations and a 24-hour clock, independent of
// any locale, and never repeat context: monthly ticks read "Jan 2024", "Apr",
// "Jul", "Oct", "Jan 2025" (the year on the first tick and where it changes);
// daily ticks "Mar 3, 2024", "Mar 10", …; hourly ticks "Mar 17, 2024", "06:00",
// "12:00", "18:00", "Mar 18" (the date on the first tick and where it changes).
func TimeTicks(lo, hi time.Time, m int, loc *time.Location) []TimeTick {
	if loc == nil {
		loc = time.UTC
	}
	if hi.Before(lo) {
		lo, hi = hi, lo
	}
	lo, hi = lo.In(loc), hi.In(loc)
	m = min(max(m, 2), 1000)
	span := timeSeconds(lo, hi)

	// best has between 2 and 2m ticks; spare, used only when no step gives
	// that, has up to timeTicksSpare (see the doc comment).
	var best, spare timeCandidate
	bestScore, spareScore := math.Inf(-1), math.Inf(-1)
	limit := max(2*m, timeTicksSpare)
	var buf []time.Time
	consider := func(c timeCandidate) {
		est := span / c.nominal
		if est > float64(limit+1) || est < 0.5 {
			return // far too many or too few ticks to compete
		}
		buf = c.generate(buf[:0], lo, hi, limit)
		k := len(buf)
		if k < 2 || k > limit {
			return
		}
		s := c.score(timeSeconds(lo, buf[0]), timeSeconds(lo, buf[k-1]), k, span, m)
		switch {
		case k <= 2*m && s > bestScore:
			bestScore, best = s, c
			best.ticks = append(best.ticks[:0], buf...)
		case k > 2*m && s > spareScore:
			spareScore, spare = s, c
			spare.ticks = append(spare.ticks[:0], buf...)
		}
	}
	// Years: q·10^z whole years, up to steps longer than the range.
	for z := 0; z < 19; z++ {
		for i, q := range timeDecimalQ {
			step := q * math.Pow10(z)
			if step != math.Trunc(step) {
				continue
			}
			consider(timeCandidate{unit: unitYear, step: int64(step), index: i, n: len(timeDecimalQ),
				nominal: step * timeUnitSeconds[unitYear]})
		}
		if math.Pow10(z)*timeUnitSeconds[unitYear] > span {
			break
		}
	}
	for unit := unitMonth; unit <= unitSecond; unit++ {
		list := timeUnitMultiples[unit]
		for i, s := range list {
			consider(timeCandidate{unit: unit, step: int64(s), index: i, n: len(list),
				nominal: float64(s) * timeUnitSeconds[unit]})
		}
	}
	// Fractions of a second: q·10^z nanoseconds below one second.
	for z := 8; z >= 0; z-- {
		for i, q := range timeDecimalQ {
			step := q * math.Pow10(z)
			if step != math.Trunc(step) || step >= 1e9 {
				continue
			}
			consider(timeCandidate{unit: unitSubsecond, step: int64(step), index: i, n: len(timeDecimalQ),
				nominal: step * 1e-9, decimals: 9 - z + timeBoolInt(q == 2.5)})
		}
	}
	switch {
	case best.ticks != nil:
		return best.label()
	case spare.ticks != nil:
		return spare.label()
	}
	return []TimeTick{{T: lo, Label: timeFullLabel(lo)}}
}

// timeCandidate is one step (a multiple of a calendar unit) and, once
// chosen, its ticks.
type timeCandidate struct {
	unit     int
	step     int64   // multiple of the unit (nanoseconds for unitSubsecond)
	index, n int     // position in the unit's list of multiples, and its length
	nominal  float64 // approximate step in seconds
	decimals int     // fractional digits of second labels (unitSubsecond)
	ticks    []time.Time
}

// timeSeconds returns b − a in seconds as a float64; unlike time.Sub it does
// not saturate beyond 292 years.
func timeSeconds(a, b time.Time) float64 {
	return float64(b.Unix()-a.Unix()) + float64(b.Nanosecond()-a.Nanosecond())*1e-9
}

// score is Talbot, Lin & Hanrahan's (2010) weighted sum (methods.md §1.2:
// weights 0.25, 0.2, 0.5, 0.05 for simplicity, coverage, density and
// legibility; legibility fixed at 1 as in the R reference), with lmin and
// lmax the first and last tick in seconds after lo and span the range.
func (c timeCandidate) score(lmin, lmax float64, k int, span float64, m int) float64 {
	simplicity := 1.0
	if c.n > 1 {
		simplicity = 1 - float64(c.index)/float64(c.n-1)
	}
	coverage := 1 - 0.5*((span-lmax)*(span-lmax)+lmin*lmin)/((0.1*span)*(0.1*span))
	rho := float64(k-1) / (lmax - lmin)
	rhoT := float64(m-1) / span // ticks lie inside the range
	density := 2 - max(rho/rhoT, rhoT/rho)
	return 0.25*simplicity + 0.2*coverage + 0.5*density + 0.05
}

// generate appends to dst the aligned ticks within [lo, hi] (both already in
// the display location), stopping once there are more than limit.
func (c timeCandidate) generate(dst []time.Time, lo, hi time.Time, limit int) []time.Time {
	loc := lo.Location()
	add := func(t time.Time) bool {
		if t.Before(lo) {
			return true
		}
		if t.After(hi) || len(dst) > limit {
			return false
		}
		// Daylight-saving gaps can map two wall-clock ticks to one instant.
		if n := len(dst); n == 0 || t.After(dst[n-1]) {
			dst = append(dst, t)
		}
		return true
	}
	s := c.step
	switch c.unit {
	case unitYear:
		for y := timeFloorDiv(int64(lo.Year()), s) * s; add(time.Date(int(y), 1, 1, 0, 0, 0, 0, loc)); y += s {
		}
	case unitMonth:
		for i := timeFloorDiv(int64(lo.Year())*12+int64(lo.Month())-1, s) * s; ; i += s {
			y, mo := timeFloorDiv(i, 12), i-12*timeFloorDiv(i, 12)
			if !add(time.Date(int(y), time.Month(mo+1), 1, 0, 0, 0, 0, loc)) {
				break
			}
		}
	case unitDay:
		// Day numbers count from 1970-01-01; 1970-01-05 (day 4) was a Monday.
		anchor := int64(0)
		if s%7 == 0 {
			anchor = 4
		}
		y, mo, d := lo.Date()
		dn := timeCivilDay(y, mo, d)
		for i := anchor + timeFloorDiv(dn-anchor, s)*s; add(time.Date(1970, 1, 1+int(i), 0, 0, 0, 0, loc)); i += s {
		}
	case unitHour:
		y, mo, d := lo.Date()
	days:
		for day := d; ; day++ {
			for h := int64(0); h < 24; h += s {
				if !add(time.Date(y, mo, day, int(h), 0, 0, 0, loc)) {
					break days
				}
			}
		}
	default:
		// Minutes, seconds and fractions divide the next larger unit, so
		// aligning the first tick on the wall clock aligns them all.
		y, mo, d := lo.Date()
		h, mi, sec := lo.Clock()
		var t time.Time
		var step time.Duration
		switch c.unit {
		case unitMinute:
			t = time.Date(y, mo, d, h, mi-mi%int(s), 0, 0, loc)
			step = time.Duration(s) * time.Minute
		case unitSecond:
			t = time.Date(y, mo, d, h, mi, sec-sec%int(s), 0, loc)
			step = time.Duration(s) * time.Second
		default:
			ns := int64(lo.Nanosecond())
			t = time.Date(y, mo, d, h, mi, sec, int(ns-ns%s), loc)
			step = time.Duration(s)
		}
		for ; add(t); t = t.Add(step) {
		}
	}
	return dst
}

// timeCivilDay returns the number of days from 1970-01-01 to the given date
// of the proleptic Gregorian calendar.
func timeCivilDay(y int, m time.Month, d int) int64 {
	return timeFloorDiv(time.Date(y, m, d, 0, 0, 0, 0, time.UTC).Unix(), 86400)
}

func timeFloorDiv(a, b int64) int64 {
	q := a / b
	if (a%b != 0) && ((a < 0) != (b < 0)) {
		q--
	}
	return q
}

func timeBoolInt(b bool) int {
	if b {
		return 1
	}
	return 0
}

// label turns the chosen candidate's ticks into TimeTicks.
func (c timeCandidate) label() []TimeTick {
	out := make([]TimeTick, len(c.ticks))
	for i, t := range c.ticks {
		y, mo, d := t.Date()
		h, mi, s := t.Clock()
		newYear, newDay := i == 0, i == 0
		if i > 0 {
			py, pm, pd := c.ticks[i-1].Date()
			newYear = py != y
			newDay = newYear || pm != mo || pd != d
		}
		var b strings.Builder
		switch c.unit {
		case unitYear:
			b.WriteString(strconv.Itoa(y))
		case unitMonth:
			b.WriteString(timeMonthAbbrev[mo-1])
			if newYear {
				b.WriteString(" " + strconv.Itoa(y))
			}
			out[i].Major = mo == time.January
		case unitDay:
			timeWriteDate(&b, y, mo, d, newYear)
			out[i].Major = mo == time.January && d == 1
		default:
			midnight := h == 0 && mi == 0 && s == 0 && t.Nanosecond() == 0
			out[i].Major = midnight
			if newDay {
				timeWriteDate(&b, y, mo, d, newYear)
				if midnight && c.unit <= unitMinute {
					break // "Mar 18" says 00:00
				}
				b.WriteByte(' ')
			}
			timeWriteClock(&b, t, c.unit, c.decimals)
		}
		out[i].T = t
		out[i].Label = b.String()
	}
	return out
}

// timeWriteDate writes "Mar 17", with ", 2024" when withYear.
func timeWriteDate(b *strings.Builder, y int, mo time.Month, d int, withYear bool) {
	b.WriteString(timeMonthAbbrev[mo-1])
	b.WriteByte(' ')
	b.WriteString(strconv.Itoa(d))
	if withYear {
		b.WriteString(", ")
		b.WriteString(strconv.Itoa(y))
	}
}

// timeWriteClock writes "08:30", "08:30:15" or "08:30:15.25" by unit.
func timeWriteClock(b *strings.Builder, t time.Time, unit, decimals int) {
	h, mi, s := t.Clock()
	two := func(v int) {
		b.WriteByte(byte('0' + v/10))
		b.WriteByte(byte('0' + v%10))
	}
	two(h)
	b.WriteByte(':')
	two(mi)
	if unit <= unitMinute {
		return
	}
	b.WriteByte(':')
	two(s)
	if unit == unitSubsecond && decimals > 0 {
		frac := strconv.Itoa(1e9 + t.Nanosecond())[1:] // nine digits
		b.WriteByte('.')
		b.WriteString(frac[:min(decimals, 9)])
	}
}

// TimeLabels labels instants the way TimeTicks labels its ticks, for ticks
// chosen elsewhere, such as every other tick of TimeTicks when their labels
// crowd an axis: each label gives only what changed since the previous
// instant, at the precision of the finest calendar unit that some instant
// does not fall on a boundary of ("08:30:15" only when some tick has
// seconds). ts must be in increasing order; they are shown in loc (nil
// means UTC).
func TimeLabels(ts []time.Time, loc *time.Location) []TimeTick {
	if loc == nil {
		loc = time.UTC
	}
	c := timeCandidate{unit: unitYear, ticks: make([]time.Time, len(ts))}
	for i, t := range ts {
		t = t.In(loc)
		c.ticks[i] = t
		_, mo, d := t.Date()
		h, mi, s := t.Clock()
		unit := unitYear
		switch {
		case t.Nanosecond() != 0:
			unit = unitSubsecond
			digits := 9
			for ns := t.Nanosecond(); ns%10 == 0; ns /= 10 {
				digits--
			}
			c.decimals = max(c.decimals, digits)
		case s != 0:
			unit = unitSecond
		case mi != 0:
			unit = unitMinute
		case h != 0:
			unit = unitHour
		case d != 1:
			unit = unitDay
		case mo != time.January:
			unit = unitMonth
		}
		c.unit = max(c.unit, unit)
	}
	return c.label()
}

// timeFullLabel labels a lone tick with as much as it needs.
func timeFullLabel(t time.Time) string {
	var b strings.Builder
	y, mo, d := t.Date()
	timeWriteDate(&b, y, mo, d, true)
	if h, mi, s := t.Clock(); h != 0 || mi != 0 || s != 0 || t.Nanosecond() != 0 {
		b.WriteByte(' ')
		unit := unitMinute
		if t.Nanosecond() != 0 {
			unit = unitSubsecond
		} else if s != 0 {
			unit = unitSecond
		}
		timeWriteClock(&b, t, unit, 9)
	}
	return b.String()
}

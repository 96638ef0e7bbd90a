package scale

import (
	"errors"
	"strings"
	"testing"
	"time"
)

func TestParseTime(t *testing.T) {
	utc := func(y int, mo time.Month, d, h, mi, s, ns int) time.Time {
		return time.Date(y, mo, d, h, mi, s, ns, time.UTC)
	}
	// Forms from ISO 8601-1:2019 (calendar dates, extended format) and RFC
	// 3339 §5.6, from memory; the offset arithmetic is checked independently
	// against time.Parse(time.RFC3339) in TestParseTimeMatchesRFC3339.
	cases := []struct {
		in   string
		want time.Time
		prec TimePrecision
	}{
		{"2024", utc(2024, 1, 1, 0, 0, 0, 0), PrecisionYear},
		{"2024-03", utc(2024, 3, 1, 0, 0, 0, 0), PrecisionMonth},
		{"2024-03-17", utc(2024, 3, 17, 0, 0, 0, 0), PrecisionDay},
		{"2024-03-17T08:30", utc(2024, 3, 17, 8, 30, 0, 0), PrecisionMinute},
		{"2024-03-17T08:30:00", utc(2024, 3, 17, 8, 30, 0, 0), PrecisionSecond},
		{"2024-03-17T08:30:00Z", utc(2024, 3, 17, 8, 30, 0, 0), PrecisionSecond},
		{"2024-03-17 08:30:00", utc(2024, 3, 17, 8, 30, 0, 0), PrecisionSecond},
		{"2024-03-17t08:30:00z", utc(2024, 3, 17, 8, 30, 0, 0), PrecisionSecond},
		// Offsets are subtracted to give UTC: 08:30 at +02:00 is 06:30Z.
		{"2024-03-17T08:30:00+02:00", utc(2024, 3, 17, 6, 30, 0, 0), PrecisionSecond},
		{"2024-03-17T08:30:00-05:30", utc(2024, 3, 17, 14, 0, 0, 0), PrecisionSecond},
		{"2024-03-17T08:30+0530", utc(2024, 3, 17, 3, 0, 0, 0), PrecisionMinute},
		{"2024-03-17T08:30-03", utc(2024, 3, 17, 11, 30, 0, 0), PrecisionMinute},
		// An offset can move the date across a day, month and year boundary.
		{"2024-01-01T01:00:00+02:00", utc(2023, 12, 31, 23, 0, 0, 0), PrecisionSecond},
		{"2024-12-31T23:30:00-01:00", utc(2025, 1, 1, 0, 30, 0, 0), PrecisionSecond},
		{"2024-03-17T08:30:00.5Z", utc(2024, 3, 17, 8, 30, 0, 500_000_000), PrecisionSubsecond},
		{"2024-03-17T08:30:00,25", utc(2024, 3, 17, 8, 30, 0, 250_000_000), PrecisionSubsecond},
		{"2024-03-17T08:30:00.123456789+01:00", utc(2024, 3, 17, 7, 30, 0, 123456789), PrecisionSubsecond},
		// 2024 is a leap year (divisible by 4, not by 100); 2000 is one
		// (divisible by 400): Gregorian calendar rule, common practice.
		{"2024-02-29", utc(2024, 2, 29, 0, 0, 0, 0), PrecisionDay},
		{"2000-02-29", utc(2000, 2, 29, 0, 0, 0, 0), PrecisionDay},
		{"  2024-03 \t", utc(2024, 3, 1, 0, 0, 0, 0), PrecisionMonth},
		{"0000-01-01", utc(0, 1, 1, 0, 0, 0, 0), PrecisionDay},
		{"9999-12-31T23:59:59Z", utc(9999, 12, 31, 23, 59, 59, 0), PrecisionSecond},
	}
	for _, c := range cases {
		got, prec, err := ParseTime(c.in)
		if err != nil || !got.Equal(c.want) || prec != c.prec || got.Location() != time.UTC {
			t.Errorf("ParseTime(%q) = %v, %v, %v; want %v, %v", c.in, got, prec, err, c.want, c.prec)
		}
	}
}

func TestParseTimeErrors(t *testing.T) {
	cases := []struct{ in, mention string }{
		{"", "four-digit year"},
		{"garbage", "four-digit year"},
		{"24", "four-digit year"},
		{"20245", "'-' after the year"},
		{"2024/03/17", "'-' after the year"},
		{"2024-3", "two-digit month"},
		{"2024-13", "month 13 out of range"},
		{"2024-00", "month 00 out of range"},
		// 2023 is not a leap year; 1900 is not (divisible by 100, not 400).
		{"2023-02-29", "day 29 out of range 01-28 for 2023-02"},
		{"1900-02-29", "day 29 out of range 01-28"},
		{"2024-04-31", "day 31 out of range 01-30"},
		{"2024-03-17X08:30", "'T' or a space"},
		{"2024-03-17T24:00", "hour 00-23"},
		{"2024-03-17T08", "':' after the hour"},
		{"2024-03-17T08:60", "minutes 00-59"},
		{"2024-03-17T08:30:60", "seconds 00-59"},
		{"2024-03-17T08:30:00.", "digits after the decimal mark"},
		{"2024-03-17T08:30:00.1234567890", "nine fractional digits"},
		{"2024-03-17T08:30:00+25:00", "offset hour"},
		{"2024-03-17T08:30:00+02:7", "offset minutes"},
		{"2024-03-17T08:30:00 UTC", "want Z or an offset"},
		{"2024-03-17T08:30:00Zjunk", "unexpected"},
		{"0000-01-01T00:30+01:00", "outside years 0000-9999"},
		{"1e3", "four-digit year"},
	}
	for _, c := range cases {
		_, p, err := ParseTime(c.in)
		if err == nil {
			t.Errorf("ParseTime(%q) succeeded; want an error", c.in)
			continue
		}
		msg := err.Error()
		if !errors.Is(err, ErrTime) || p != PrecisionNone ||
			!strings.Contains(msg, c.mention) || !strings.Contains(msg, "expected 2024, 2024-03") ||
			!strings.Contains(msg, `"`+c.in+`"`) {
			t.Errorf("ParseTime(%q) error %q (precision %v); want it to wrap ErrTime, quote the input and mention %q and the expected forms",
				c.in, msg, p, c.mention)
		}
	}
}

// TestParseTimeMatchesRFC3339 cross-checks the full RFC 3339 forms against
// the standard library's independent parser.
func TestParseTimeMatchesRFC3339(t *testing.T) {
	for _, s := range []string{
		"2024-03-17T08:30:00Z", "2024-03-17T08:30:00+02:00", "1999-12-31T23:59:59-11:45",
		"2024-02-29T12:00:00.000001+14:00", "1970-01-01T00:00:00Z",
	} {
		want, err := time.Parse(time.RFC3339Nano, s)
		if err != nil {
			t.Fatal(err)
		}
		got, _, err := ParseTime(s)
		if err != nil || !got.Equal(want) {
			t.Errorf("ParseTime(%q) = %v, %v; time.Parse gives %v", s, got, err, want)
		}
	}
}

func TestDetectTime(t *testing.T) {
	cases := []struct {
		name    string
		samples []string
		ok      bool
		prec    TimePrecision
	}{
		{"months", []string{"2024-01", "2024-02", "", "2024-03"}, true, PrecisionMonth},
		{"mixed precision reports the coarsest", []string{"2024-01-05", "2024-02", "2024-03-01T10:00Z"}, true, PrecisionMonth},
		{"days and years", []string{"2024", "2024-03-17"}, true, PrecisionYear},
		{"bare years are ambiguous", []string{"1999", "2000", " 2001 "}, false, PrecisionYear},
		{"numbers", []string{"1.5", "2"}, false, PrecisionNone},
		{"one bad value", []string{"2024-01-01", "soon"}, false, PrecisionNone},
		{"all empty", []string{"", " "}, false, PrecisionNone},
		{"nil", nil, false, PrecisionNone},
		{"timestamps", []string{"2024-03-17T08:30:00Z", "2024-03-17 09:30:00"}, true, PrecisionSecond},
	}
	for _, c := range cases {
		ok, p := DetectTime(c.samples)
		if ok != c.ok || p != c.prec {
			t.Errorf("%s: DetectTime = %v, %v; want %v, %v", c.name, ok, p, c.ok, c.prec)
		}
	}
}

func TestTimePrecisionString(t *testing.T) {
	if s := PrecisionMonth.String(); s != "month" {
		t.Errorf("PrecisionMonth = %q", s)
	}
	if s := TimePrecision(42).String(); s != "TimePrecision(42)" {
		t.Errorf("TimePrecision(42) = %q", s)
	}
}

func FuzzParseTime(f *testing.F) {
	for _, s := range []string{"2024", "2024-03", "2024-02-29", "2024-03-17T08:30", "2024-03-17 08:30:00",
		"2024-03-17T08:30:00.123+05:30", "0000-01-01T00:00-01:00", "9999-12-31T23:59:59.999999999Z", "x"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		got, p, err := ParseTime(s)
		if err != nil {
			if p != PrecisionNone || !errors.Is(err, ErrTime) {
				t.Fatalf("ParseTime(%q): error %v with precision %v", s, err, p)
			}
			return
		}
		if p < PrecisionYear || p > PrecisionSubsecond {
			t.Fatalf("ParseTime(%q): precision %v", s, p)
		}
		back, _, err := ParseTime(got.Format(time.RFC3339Nano))
		if err != nil || !back.Equal(got) {
			t.Fatalf("ParseTime(%q) = %v; RFC 3339 round trip gives %v, %v", s, got, back, err)
		}
	})
}

func BenchmarkParseTime(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, _, err := ParseTime("2024-03-17T08:30:00.25+02:00"); err != nil {
			b.Fatal(err)
		}
	}
}

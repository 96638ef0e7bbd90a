package layout

import (
	"encoding/binary"
	"math"
	"testing"
)

func FuzzParseFace(f *testing.F) {
	good := GoRegular().Data()
	f.Add(good)
	kerned, _ := kernedGoRegular(f)
	f.Add(kerned.Data())
	f.Add(good[:64])
	f.Add([]byte("OTTO\x00\x01\x00\x00\x00\x00\x00\x00"))
	f.Add([]byte("\x00\x01\x00\x00\x00\x10\x00\x00\x00\x00\x00\x00"))
	// The table directory of Go Regular, whose entries point past the end.
	f.Add(good[:12+16*14])
	f.Fuzz(func(t *testing.T, data []byte) {
		face, err := ParseFace(data)
		if err != nil {
			if face != nil {
				t.Fatal("ParseFace returned a face and an error")
			}
			return
		}
		// A font that parses must measure without trouble.
		for _, s := range []string{"", "Harbour Loop", "Ωμέγα 港口 🚢", "\xff"} {
			if w := face.Width(s, 12); math.IsNaN(w) || w < 0 {
				t.Fatalf("Width(%q) = %g", s, w)
			}
		}
		face.Ascent(12)
		face.Descent(12)
		_ = face.Family()
	})
}

func FuzzWidth(f *testing.F) {
	for _, s := range widthStrings {
		f.Add(s, s)
	}
	face, ref := kernedGoRegular(f)
	f.Fuzz(func(t *testing.T, a, b string) {
		got, want := face.Width(a+b, 12), ref.width(a+b, 12)
		if math.Abs(got-want) > 1e-6 {
			t.Fatalf("Width(%q) = %g, tables give %g", a+b, got, want)
		}
	})
}

func FuzzWrap(f *testing.F) {
	f.Add("Saint Brannock to Outer Gull Skerry", 12.0, 90.0, 2)
	f.Add("Ferry-Terminal/North 港口渡轮 🚢 Cafe\u0301", 10.0, 40.0, 3)
	f.Add("", 12.0, 0.0, 0)
	f.Fuzz(func(t *testing.T, text string, size, maxWidth float64, maxLines int) {
		if len(text) > 1000 || maxLines > 1000 {
			return // long inputs only slow the fuzzer down
		}
		if !(size > 0) || size > 1000 || math.IsNaN(maxWidth) {
			size = 12
		}
		checkWrap(t, GoRegular(), text, size, maxWidth, maxLines)
	})
}

func FuzzSpread(f *testing.F) {
	f.Add([]byte{}, 4.0, 0.0, 100.0)
	f.Add([]byte{10, 10, 10}, 4.0, 0.0, 100.0)
	f.Add([]byte{0, 255, 3, 3, 3, 3}, 30.0, -10.0, 50.0)
	f.Fuzz(func(t *testing.T, raw []byte, gap, lo, hi float64) {
		if len(raw) > 64 {
			raw = raw[:64]
		}
		want := make([]float64, 0, len(raw)/2)
		for i := 0; i+1 < len(raw); i += 2 {
			want = append(want, float64(int16(binary.BigEndian.Uint16(raw[i:])))/16)
		}
		got, ok := Spread(want, gap, lo, hi)
		if len(got) != len(want) {
			t.Fatalf("Spread returned %d positions for %d", len(got), len(want))
		}
		if !ok || math.IsNaN(gap) || math.Abs(gap) > 1e6 || math.Abs(lo) > 1e6 || math.Abs(hi) > 1e6 {
			return
		}
		if v := kktViolation(want, got, max(gap, 0), lo, hi); v != "" {
			t.Fatalf("Spread(%v, %g, %g, %g) = %v: %s", want, gap, lo, hi, got, v)
		}
	})
}

package suggest

import "testing"

func TestClosest(t *testing.T) {
	header := []string{"region", "revenue", "", "crossing_minutes"}
	tests := []struct {
		col  string
		want string // "" for no suggestion
	}{
		{"revenu", "revenue"},
		{"Revenue", "revenue"},
		{"regoin", "region"},
		{"crossing minutes", "crossing_minutes"},
		{"x", ""},
		{"passengers", ""},
	}
	for _, tc := range tests {
		got, ok := Closest(tc.col, header)
		if got != tc.want || ok != (tc.want != "") {
			t.Errorf("Closest(%q) = %q, %v; want %q", tc.col, got, ok, tc.want)
		}
	}
}

func TestDistance(t *testing.T) {
	for _, tc := range []struct {
		a, b string
		want int
	}{
		{"kitten", "sitting", 3}, // Levenshtein's textbook pair; from memory
		{"", "abc", 3},
		{"abc", "", 3},
		{"flaw", "lawn", 2},     // from memory
		{"Ørsted", "Orsted", 1}, // runes, not bytes
		{"same", "same", 0},
	} {
		if got := Distance([]rune(tc.a), []rune(tc.b)); got != tc.want {
			t.Errorf("Distance(%q, %q) = %d, want %d", tc.a, tc.b, got, tc.want)
		}
	}
}

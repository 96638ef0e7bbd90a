package render

import (
	"errors"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestOptionErrorsNameTheOption(t *testing.T) {
	labels := []string{"a", "b", "c"}
	values := []float64{3, 2, 1}
	to := 2.0
	series := []Series{{Name: "s", X: []float64{1, 2, 3}, Y: []float64{1, 3, 2}}}
	for _, tc := range []struct {
		name    string
		draw    func() error
		option  string
		value   string
		refused bool
	}{
		{"top 1", func() error {
			_, err := BarsScene(labels, values, BarsOptions{RowOptions: RowOptions{Top: 1}})
			return err
		}, "Top", "1", false},
		{"dots summed", func() error {
			_, err := DotsScene(labels, values, DotsOptions{RowOptions: RowOptions{Other: OtherSum}})
			return err
		}, "Other", "sum", false},
		{"unknown other", func() error {
			_, err := BarsScene(labels, values, BarsOptions{RowOptions: RowOptions{Other: "most"}})
			return err
		}, "Other", `"most"`, false},
		{"to cuts bars", func() error {
			_, err := BarsScene(labels, values, BarsOptions{RowOptions: RowOptions{To: &to}})
			return err
		}, "To", "2", true},
		{"from cuts bars", func() error {
			from := 2.5
			_, err := BarsScene(labels, values, BarsOptions{RowOptions: RowOptions{From: &from}})
			return err
		}, "From", "2.5", true},
		{"to hides dots", func() error {
			_, err := DotsScene(labels, values, DotsOptions{RowOptions: RowOptions{To: &to}})
			return err
		}, "To", "2", true},
		{"aspect", func() error {
			_, err := LinesScene(series, LinesOptions{Aspect: "wide"})
			return err
		}, "Aspect", `"wide"`, false},
	} {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.draw()
			var oe *OptionError
			require.True(t, errors.As(err, &oe), "%v", err)
			assert.Equal(t, tc.option, oe.Option)
			assert.Equal(t, tc.value, oe.Value)
			assert.True(t, strings.HasPrefix(err.Error(), tc.option+" "+tc.value+": "), err.Error())
			assert.Equal(t, tc.refused, errors.Is(err, ErrRefused))
			assert.NotContains(t, err.Error(), "--", "a library error names options, not flags")
		})
	}
}

// Notes and errors name an option by the caller's name for it when the
// caller gives one, and by the field name otherwise.
func TestOptionNamesInNotes(t *testing.T) {
	labels := []string{"a", "b", "c", "d", "e", "f"}
	values := []float64{6, 5, 4, 3, 2, 1}
	for _, tc := range []struct {
		names OptionNames
		want  string
	}{
		{nil, "show more with Top"},
		{OptionNames{"Top": "--top"}, "show more with --top"},
		{OptionNames{"Top": "top="}, "show more with top="},
	} {
		s, err := BarsScene(labels, values, BarsOptions{Common: Common{Names: tc.names}, RowOptions: RowOptions{Top: 3}, Additive: true})
		require.NoError(t, err)
		require.NotEmpty(t, s.Notes)
		var texts []string
		for _, n := range s.Notes {
			texts = append(texts, n.Text)
		}
		assert.Contains(t, strings.Join(texts, "\n"), tc.want)
	}

	_, err := BarsScene(labels, values, BarsOptions{Common: Common{Names: OptionNames{"Other": "--other"}}, RowOptions: RowOptions{Top: 4}})
	require.NoError(t, err)
	_, err = DotsScene(labels, values, DotsOptions{Common: Common{Names: OptionNames{"Other": "--other"}}, RowOptions: RowOptions{Other: OtherSum}})
	var oe *OptionError
	require.True(t, errors.As(err, &oe))
	assert.Equal(t, "Other", oe.Option, "the error's Option is always the field name")
	assert.Contains(t, err.Error(), "use --other mean or none")
}

// A Go caller's notes and errors never name a command-line flag.
func TestLibraryMessagesNameNoFlags(t *testing.T) {
	var labels []string
	var values []float64
	for i := range 30 {
		labels = append(labels, strings.Repeat("x", i%7+1)+string(rune('a'+i%26))+string(rune('A'+i/26)))
		values = append(values, float64((i*37)%101+1))
	}
	xs := []float64{1, 2, 3, 4, 5, 6}
	var many []Series
	for i := range 6 {
		many = append(many, Series{Name: string(rune('a' + i)), X: xs, Y: []float64{1, 2, float64(i), 4, 5, 6}})
	}
	big := []Series{{Name: "big", X: xs, Y: []float64{100, 200, 300, 400, 500, 600}}, {Name: "small", X: xs, Y: []float64{1, 2, 1, 2, 1, 2}}}
	small := Common{Width: 120, Height: 150}
	var msgs []string
	keep := func(s *Scene, err error) {
		if err != nil {
			msgs = append(msgs, err.Error())
			return
		}
		for _, n := range s.Notes {
			msgs = append(msgs, n.Text)
		}
	}
	keep(BarsScene(labels, values, BarsOptions{RowOptions: RowOptions{Top: 5}}))
	keep(BarsScene(labels, values, BarsOptions{Additive: true}))
	keep(BarsScene(labels, values, BarsOptions{Common: Common{Medium: Slide}}))
	keep(BarsScene(labels, values, BarsOptions{Common: small}))
	keep(BarsScene(labels, values, BarsOptions{Common: small, Vertical: true}))
	keep(BarsScene(labels, values, BarsOptions{Common: Common{Width: 300}, Vertical: true}))
	keep(BarsScene(labels, append([]float64{-1}, values[1:]...), BarsOptions{Percent: true}))
	keep(DotsScene(labels, values, DotsOptions{}))
	keep(DotsScene(labels, values, DotsOptions{Common: Common{Medium: Slide, Height: 400}}))
	keep(LinesScene(many, LinesOptions{}))
	keep(LinesScene(many, LinesOptions{Together: true}))
	keep(LinesScene(many, LinesOptions{Common: small}))
	keep(LinesScene(big, LinesOptions{}))
	keep(LinesScene(big, LinesOptions{Index: true, Aspect: "3:1"}))
	keep(LinesScene(big, LinesOptions{Common: Common{Width: 40}}))
	keep(DiffScene(Series{Name: "a", X: xs, Y: big[0].Y}, Series{Name: "b", X: xs, Y: big[1].Y}, DiffOptions{Common: small}))
	keep(DiffScene(Series{Name: "a", X: xs, Y: big[0].Y}, Series{Name: "b", X: xs, Y: big[1].Y}, DiffOptions{Common: Common{Width: 30}}))
	require.Greater(t, len(msgs), 15)
	for _, m := range msgs {
		assert.NotContains(t, m, "--", m)
	}
}

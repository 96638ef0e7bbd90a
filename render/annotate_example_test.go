package render_test

import (
	"errors"
	"fmt"
	"math"

	"plumb/render"
)

// A bad annotation is an option error naming its field, which a caller can
// tell from the data's errors with errors.As and errors.Is.
func ExampleAnnotations_optionError() {
	opt := render.BarsOptions{}
	opt.Refs = []render.Ref{{Value: math.NaN(), Text: "Target"}}
	_, err := render.FigureScene(render.FigureOptions{}, render.BarsPanel([]string{"Great Osk", "Little Osk"}, []float64{120, 80}, opt))
	var oe *render.OptionError
	if errors.As(err, &oe) && errors.Is(err, render.ErrAnnotation) {
		fmt.Println(oe.Option, oe.Value)
	}
	// Output: Refs NaN
}

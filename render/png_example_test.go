package render_test

import (
	"bytes"
	"fmt"
	"image/png"

	"plumb/render"
)

// A chart's scene is drawn as PNG by the same code for every chart; Scale
// 2 gives twice the pixels each way for high-density screens.
func ExamplePNGEncoder() {
	s, err := render.BarsScene([]string{"Tea", "Coffee", "Water"}, []float64{12, 30, 7}, render.BarsOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	var b bytes.Buffer
	if err := (render.PNGEncoder{Scale: 2}).Encode(&b, s); err != nil {
		fmt.Println(err)
		return
	}
	cfg, err := png.DecodeConfig(&b)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("SVG %g wide, PNG %d pixels wide\n", s.Width, cfg.Width)
	fmt.Println("twice as high:", cfg.Height == int(2*s.Height))
	// Output:
	// SVG 640 wide, PNG 1280 pixels wide
	// twice as high: true
}

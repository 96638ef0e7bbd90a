package main

import (
	"encoding/json"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strconv"
)

// island is one invented island of the Lantern Isles: where it lies, how
// large it is, and the districts it is cut into (from its centre outwards,
// like slices, so that neighbouring districts share whole borders).
type island struct {
	name      string
	lon, lat  float64 // centre, degrees
	radius    float64 // km
	districts []string
}

var archipelago = []island{
	{"Lantern", -9.0, 61.2, 62, []string{"Lanternquay", "Varrowick", "Saltmarrow", "Hobb's Reach", "Kestle Moor", "Glimmerside"}},
	{"Quill", -6.5, 62.35, 40, []string{"Quillhaven", "Oskmouth", "Tarn Edge"}},
	{"Brindle", -11.7, 60.15, 32, []string{"Brindle Holm", "Cairnfold"}},
	{"Wester Skerry", -12.2, 62.45, 16, []string{"Wester Skerry"}},
	{"Dunmere", -6.3, 60.05, 46, []string{"Dunmere Town", "Fallowgate", "Sorrelby", "Marrow Ness"}},
}

// islandsFiles writes islands.geojson (one Feature per district, property
// "district") and districts.csv (residents and ferry boardings per
// district, 2025).
func islandsFiles(dir string, rng *rand.Rand) error {
	type feature struct {
		Type       string            `json:"type"`
		Properties map[string]string `json:"properties"`
		Geometry   struct {
			Type        string             `json:"type"`
			Coordinates [][][2]json.Number `json:"coordinates"`
		} `json:"geometry"`
	}
	var feats []feature
	rows := [][]string{{"district", "island", "residents", "boardings"}}
	for _, is := range archipelago {
		// The coast: a wobbly closed curve around the centre.
		const n = 96
		p1, p2, p3 := rng.Float64()*2*math.Pi, rng.Float64()*2*math.Pi, rng.Float64()*2*math.Pi
		coast := make([][2]float64, n)
		for i := range coast {
			th := 2 * math.Pi * float64(i) / n
			r := is.radius * (1 + 0.22*math.Sin(3*th+p1) + 0.1*math.Sin(7*th+p2) + 0.05*math.Sin(13*th+p3))
			coast[i] = kmToDeg(is, r*math.Cos(th), r*math.Sin(th))
		}
		m := len(is.districts)
		for d, name := range is.districts {
			a, b := d*n/m, (d+1)*n/m
			var ring [][2]float64
			if m == 1 {
				ring = append(ring, coast...)
			} else {
				// Out along one radius, round the coast, back along the next.
				spoke := func(i int, out bool) {
					for s := 1; s < 8; s++ {
						t := float64(s) / 8
						if !out {
							t = 1 - t
						}
						c := coast[i%n]
						ring = append(ring, [2]float64{round5(is.lon + (c[0]-is.lon)*t), round5(is.lat + (c[1]-is.lat)*t)})
					}
				}
				ring = append(ring, [2]float64{is.lon, is.lat})
				spoke(a, true)
				for i := a; i <= b; i++ {
					ring = append(ring, coast[i%n])
				}
				spoke(b, false)
			}
			ring = append(ring, ring[0])
			var f feature
			f.Type = "Feature"
			f.Properties = map[string]string{"district": name, "island": is.name}
			f.Geometry.Type = "Polygon"
			coords := make([][2]json.Number, len(ring))
			for i, p := range ring {
				coords[i] = [2]json.Number{json.Number(strconv.FormatFloat(p[0], 'f', 5, 64)), json.Number(strconv.FormatFloat(p[1], 'f', 5, 64))}
			}
			f.Geometry.Coordinates = [][][2]json.Number{coords}
			feats = append(feats, f)
			residents := int(math.Round(400 + rng.ExpFloat64()*3000*is.radius/30))
			// Boardings grow with residents and are higher near the main port.
			rate := 6 + rng.Float64()*10
			if d == 0 {
				rate += 9
			}
			rows = append(rows, []string{name, is.name, strconv.Itoa(residents), strconv.Itoa(int(math.Round(float64(residents) * rate)))})
		}
	}
	fc := map[string]any{"type": "FeatureCollection", "features": feats}
	b, err := json.MarshalIndent(fc, "", " ")
	if err != nil {
		return err
	}
	if err := os.WriteFile(filepath.Join(dir, "islands.geojson"), append(b, '\n'), 0o644); err != nil {
		return err
	}
	return writeCSV(filepath.Join(dir, "districts.csv"), rows)
}

// kmToDeg places a point dx km east and dy km north of the island's centre.
func kmToDeg(is island, dx, dy float64) [2]float64 {
	const kmPerDeg = 111.195 // on a sphere of the authalic radius (common practice)
	return [2]float64{round5(is.lon + dx/(kmPerDeg*math.Cos(is.lat*math.Pi/180))), round5(is.lat + dy/kmPerDeg)}
}

func round5(v float64) float64 { return math.Round(v*1e5) / 1e5 }

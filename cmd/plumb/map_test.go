package main

import (
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// shapesFile writes an invented boundary file of unit squares in a row
// along 60°N, one per name, with the name in property "name" and a code in
// property "code".
func shapesFile(t *testing.T, names ...string) string {
	t.Helper()
	var feats []string
	for i, n := range names {
		x := float64(i)
		ring := []string{}
		for _, p := range [][2]float64{{x, 60}, {x + 1, 60}, {x + 1, 61}, {x, 61}, {x, 60}} {
			ring = append(ring, "["+strconv.FormatFloat(p[0], 'f', -1, 64)+","+strconv.FormatFloat(p[1], 'f', -1, 64)+"]")
		}
		feats = append(feats, `{"type":"Feature","properties":{"name":`+strconv.Quote(n)+`,"code":`+strconv.Itoa(100+i)+`},"geometry":{"type":"Polygon","coordinates":[[`+strings.Join(ring, ",")+`]]}}`)
	}
	path := filepath.Join(t.TempDir(), "shapes.geojson")
	require.NoError(t, os.WriteFile(path, []byte(`{"type":"FeatureCollection","features":[`+strings.Join(feats, ",")+`]}`), 0o644))
	return path
}

func TestMapJoinAndPer(t *testing.T) {
	shapes := shapesFile(t, "Alder", "Birch", "Cedar", "Damson")
	data := "place,count,people\nAlder,10,100\nBirch,40,200\nCedar,90,300\nElm,5,50\n"
	code, out, errs := plumb(t, data, "map", "-", "--format", "csv", "--region", "place", "--value", "count", "--per", "people", "--shapes", shapes, "--explain")
	require.Equal(t, 0, code, errs)
	marks := regexp.MustCompile(`<path[^>]*class="plumb-mark[^"]*"[^>]*data-label="([^"]+)"`).FindAllStringSubmatch(out, -1)
	assert.Len(t, marks, 4, "one region mark per shape")
	// --per divides: Birch 40/200 = 0.2.
	assert.Contains(t, out, `data-label="Birch" data-value="0.2"`)
	assert.Contains(t, errs, `joined rows to shapes on the property "name"`)
	assert.Contains(t, errs, `"Elm"`, "the row without a shape is named")
	assert.Contains(t, errs, `"Damson"`, "the shape without a row is named")
	assert.Contains(t, out, "plumb-nodata")
}

func TestMapJoinErrors(t *testing.T) {
	shapes := shapesFile(t, "Alder", "Birch")
	code, _, errs := plumb(t, "place,v\nOak,1\nPine,2\n", "map", "-", "--format", "csv", "--shapes", shapes)
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, `no region name matches a shape: rows have "Oak", "Pine"`)
	assert.Contains(t, errs, `"Alder"`)
	code, _, errs = plumb(t, "place,v\nAlder,1\n", "map", "-", "--format", "csv", "--shapes", shapes, "--key", "nom")
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, "properties are code, name")
	code, _, errs = plumb(t, "place,v\nAlder,1\n", "map", "-", "--format", "csv")
	assert.Equal(t, 2, code)
	assert.Contains(t, errs, "--shapes")
	code, _, errs = plumb(t, "place,v,n\nAlder,1,0\n", "map", "-", "--format", "csv", "--shapes", shapes, "--per", "n")
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, "line 2")
	assert.Contains(t, errs, "divide by zero")
	// Joining on a numeric property works as its text.
	code, out, errs := plumb(t, "code,v\n100,1\n101,3\n", "map", "-", "--format", "csv", "--shapes", shapes, "--breaks", "2", "--explain")
	require.Equal(t, 0, code, errs)
	assert.Contains(t, errs, `property "code"`)
	assert.Contains(t, out, `data-label="101"`)
}

// FuzzMap feeds arbitrary boundary files and tables to plumb map: it must
// draw or refuse with a message, never panic, never print NaN or Inf.
func FuzzMap(f *testing.F) {
	f.Add([]byte(`{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"name":"A"},"geometry":{"type":"Polygon","coordinates":[[[0,60],[1,60],[1,61],[0,61],[0,60]]]}}]}`), "name,v\nA,1\n")
	f.Add([]byte(`{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"name":"A"},"geometry":{"type":"MultiPolygon","coordinates":[[[[179,-16],[-179,-16],[-179,-19],[179,-19],[179,-16]]]]}}]}`), "name,v\nA,1e308\nB,-1\n")
	f.Add([]byte(`{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"name":"A"},"geometry":{"type":"Polygon","coordinates":[[[0,0],[0,0],[0,0]]]}}]}`), "name,v\nA,0\n")
	f.Fuzz(func(t *testing.T, shapes []byte, table string) {
		dir := t.TempDir()
		path := filepath.Join(dir, "s.geojson")
		if err := os.WriteFile(path, shapes, 0o644); err != nil {
			t.Fatal(err)
		}
		code, out, _ := plumb(t, table, "map", "-", "--format", "csv", "--shapes", path, "--labels")
		if code == 0 && (strings.Contains(out, "NaN") || strings.Contains(out, "Inf")) {
			t.Fatalf("NaN or Inf in the figure:\n%s", out)
		}
	})
}

// A boundary file in projected metres is refused, naming the file and the
// feature.
func TestMapShapesInMetres(t *testing.T) {
	path := filepath.Join(t.TempDir(), "m.geojson")
	require.NoError(t, os.WriteFile(path, []byte(`{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"name":"A"},"geometry":{"type":"Polygon","coordinates":[[[500000,6500000],[510000,6500000],[510000,6510000],[500000,6500000]]]}}]}`), 0o644))
	code, _, errs := plumb(t, "name,v\nA,1\n", "map", "-", "--format", "csv", "--shapes", path)
	assert.Equal(t, 1, code)
	assert.Contains(t, errs, path+": feature 1 (\"A\")")
	assert.Contains(t, errs, "metres")
}

package main

import "embed"

//go:generate go run ../../testdata/ferrygen -o demodata

// demoFS holds the demo data sets of the invented ferry operator, written by
// testdata/ferrygen from fixed seeds, so that `plumb demo` needs no files.
//
//go:embed demodata/*.csv demodata/*.geojson
var demoFS embed.FS

package suggest

import "flag"

// The -update flag rewrites golden files (see DEVELOPERS.md). It is defined
// in every package so that "go test ./... -update" runs everywhere; this
// package has no golden files of its own.
var _ = flag.Bool("update", false, "rewrite golden files (used by cmd/plumb)")

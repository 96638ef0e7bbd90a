//go:build !unix

package main

import (
	"io/fs"
	"os"
	"time"
)

// processAlive cannot ask the system here, so a leftover counts as held by
// a live run until it is a day old.
func processAlive(_ int, mod time.Time) bool { return time.Since(mod) < 24*time.Hour }

// keepOwner is a no-op where files have no Unix owner.
func keepOwner(*os.File, fs.FileInfo) {}

// interruptSignals are the signals after which plumb removes its temporary
// file and ends.
func interruptSignals() []os.Signal { return []os.Signal{os.Interrupt} }

// dieBy ends the process after an interrupt.
func dieBy(os.Signal) { os.Exit(exitData) }

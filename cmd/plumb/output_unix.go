//go:build unix

package main

import (
	"errors"
	"io/fs"
	"os"
	"os/signal"
	"syscall"
	"time"
)

// processAlive says whether pid names a live process on this machine. EPERM
// means it exists under another user.
func processAlive(pid int, _ time.Time) bool {
	err := syscall.Kill(pid, 0)
	return err == nil || errors.Is(err, syscall.EPERM)
}

// keepOwner gives the new file the owner and group of the one it replaces,
// where the system allows (root may; others may keep the group). Best
// effort: the mode is what protects the content.
func keepOwner(f *os.File, old fs.FileInfo) {
	if st, ok := old.Sys().(*syscall.Stat_t); ok {
		if f.Chown(int(st.Uid), int(st.Gid)) != nil {
			f.Chown(-1, int(st.Gid))
		}
	}
}

// interruptSignals are the signals after which plumb removes its temporary
// file and ends: Ctrl-C, kill's default, and a closed terminal.
func interruptSignals() []os.Signal {
	return []os.Signal{syscall.SIGINT, syscall.SIGTERM, syscall.SIGHUP}
}

// dieBy ends the process by sig with its default action, so that a shell or
// make sees a run killed by the signal rather than an ordinary failure.
func dieBy(sig os.Signal) {
	if s, ok := sig.(syscall.Signal); ok {
		signal.Reset(sig)
		syscall.Kill(os.Getpid(), s)
		time.Sleep(100 * time.Millisecond)
		os.Exit(128 + int(s))
	}
	os.Exit(exitData)
}

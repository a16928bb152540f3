package main

import (
	"io"
	"os"
)

// isTerminal reports whether w is a character device (a terminal), so that a
// progress bar is drawn only where a person is watching.
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	fi, err := f.Stat()
	if err != nil {
		return false
	}
	return fi.Mode()&os.ModeCharDevice != 0
}

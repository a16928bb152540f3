// Command turnpoint finds the turning points and Stokes geometry of a wave
// equation with a large parameter, applies WKB connection formulae and
// checks every result against direct numerical integration.
//
// Run "turnpoint help" for the list of commands.
package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
)

func main() {
	err := route(os.Args[1:], os.Stdout, os.Stderr)
	os.Exit(exitStatus(err, os.Stderr))
}

// Exit statuses of the command.
const (
	exitOK          = 0 // everything ran and every check passed
	exitCheckFailed = 1 // a check failed: WKB and numerics disagree, or an expectation regressed
	exitBadInput    = 2 // bad usage, unreadable or invalid case file, bad formula
)

// exitError carries an exit status with the error that caused it.
type exitError struct {
	code int
	err  error
}

func (e *exitError) Error() string { return e.err.Error() }
func (e *exitError) Unwrap() error { return e.err }

// badInput marks err as the user's input being wrong (exit status 2).
func badInput(err error) error { return &exitError{code: exitBadInput, err: err} }

// checkFailed marks err as a failed check (exit status 1).
func checkFailed(err error) error { return &exitError{code: exitCheckFailed, err: err} }

// errSilentFailure is returned when a failure has already been reported in
// the output and needs no further message.
var errSilentFailure = errors.New("one or more checks failed")

// exitStatus maps an error to the process exit status, printing it first.
func exitStatus(err error, stderr io.Writer) int {
	if err == nil {
		return exitOK
	}
	var ee *exitError
	code := exitBadInput
	if errors.As(err, &ee) {
		code = ee.code
	}
	if !errors.Is(err, errSilentFailure) {
		// Case-file errors carry an excerpt with a caret under the place.
		var d interface{ Detail() string }
		if errors.As(err, &d) {
			fmt.Fprintf(stderr, "turnpoint: %s\n", strings.TrimRight(d.Detail(), "\n"))
		} else {
			fmt.Fprintf(stderr, "turnpoint: %v\n", err)
		}
	}
	return code
}

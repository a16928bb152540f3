package study

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/turnpoint/turnpoint/cases"
)

// Change is one expectation rewritten by Rewrite.
type Change struct {
	Where    string  // file:line:col of the value
	Figure   string  // e.g. "T at 0.5 (numeric)"
	Old, New float64 // the recorded and the current value
}

// Rewrite returns c's source with the value of every expectation that left
// its tolerance replaced by the figure now computed (rep.Checks, in file
// order), and the changes made. Expectations that still hold are kept as
// written, so a closed-form reference is never overwritten by a computed
// value that agrees with it. Only the number itself is replaced, so comments
// and layout are preserved. Expectations whose figure could not be computed
// are left alone.
func Rewrite(c *cases.Case, rep *Report) ([]byte, []Change, error) {
	if len(rep.Checks) != len(c.Expect) {
		return nil, nil, fmt.Errorf("%s: %d expectations but %d checks", c.Path, len(c.Expect), len(rep.Checks))
	}
	lines := strings.SplitAfter(string(c.Source), "\n")
	var changes []Change
	for i := range c.Expect {
		e := &c.Expect[i]
		got := float64(rep.Checks[i].Got)
		if math.IsNaN(got) || math.IsInf(got, 0) {
			continue
		}
		if rep.Checks[i].Pass || got == e.Value {
			continue
		}
		line, col := e.Pos.Line, e.Pos.Column
		if line < 1 || line > len(lines) {
			return nil, nil, fmt.Errorf("%s: expectation %d has no position to rewrite", c.Path, i+1)
		}
		text := lines[line-1]
		start := runeOffset(text, col-1)
		if start < 0 {
			return nil, nil, fmt.Errorf("%s: cannot locate the value to rewrite", e.Pos)
		}
		end := start
		for end < len(text) && strings.IndexByte("0123456789+-.eE_infa", text[end]) >= 0 {
			end++
		}
		if end == start {
			return nil, nil, fmt.Errorf("%s: no number to rewrite", e.Pos)
		}
		lines[line-1] = text[:start] + formatValue(got) + text[end:]
		changes = append(changes, Change{Where: e.Pos.String(), Figure: figureName(e), Old: e.Value, New: got})
	}
	return []byte(strings.Join(lines, "")), changes, nil
}

// formatValue writes a float that TOML reads back as a float.
func formatValue(v float64) string {
	s := strconv.FormatFloat(v, 'g', 17, 64)
	if !strings.ContainsAny(s, ".eEn") {
		s += ".0"
	}
	return s
}

// runeOffset returns the byte offset of the n-th rune of s, or -1.
func runeOffset(s string, n int) int {
	i := 0
	for off := range s {
		if i == n {
			return off
		}
		i++
	}
	if i == n {
		return len(s)
	}
	return -1
}

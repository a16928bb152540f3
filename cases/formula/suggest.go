package formula

import "strings"

// suggest returns the candidate closest to name by edit distance, if it is
// close enough to be a plausible misspelling: a difference of letter case
// only, or at most one edit per three letters of the longer name (at least
// one edit, at most two). Ties go to the first candidate in the list.
func suggest(name string, candidates []string) string {
	best, bestDist := "", -1
	for _, c := range candidates {
		if strings.EqualFold(c, name) {
			return c
		}
		d := editDistance(strings.ToLower(name), strings.ToLower(c))
		limit := min(max(max(len(name), len(c))/3, 1), 2)
		if d <= limit && d < max(len(name), len(c)) && (bestDist < 0 || d < bestDist) {
			best, bestDist = c, d
		}
	}
	return best
}

// editDistance returns the Levenshtein distance between a and b (insertions,
// deletions and substitutions of bytes, each costing one), by the standard
// dynamic programme over one row.
func editDistance(a, b string) int {
	row := make([]int, len(b)+1)
	for j := range row {
		row[j] = j
	}
	for i := 1; i <= len(a); i++ {
		diag := row[0] // d(i-1, j-1)
		row[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			up := row[j] // d(i-1, j)
			row[j] = min(up+1, row[j-1]+1, diag+cost)
			diag = up
		}
	}
	return row[len(b)]
}

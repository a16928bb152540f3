package cases

import (
	"fmt"
	"testing"
)

// TestScanKeys checks the places the key scanner finds, "line:col" of the key
// and of its value, on the constructs of TOML a case file may use.
func TestScanKeys(t *testing.T) {
	t.Parallel()
	src := "# comment = 1\n" + // 1
		"title = \"a # b\" # c\n" + // 2
		"[graded]  # comment\n" + // 3
		"  index = '1 + x'\n" + // 4
		"\"k0\" = 2\n" + // 5
		"[ region ]\n" + // 6
		"x = [\n" + // 7
		"  -1, # lo\n" + // 8
		"   2, ]\n" + // 9
		"box = { re = [-2, 3], im = [-1, 1] }\n" + // 10
		"[[expect]]\n" + // 11
		"value = \"\"\"\n" + // 12
		"a = 1\n" + // 13
		"\"\"\"\n" + // 14
		"[[expect]]\n" + // 15
		"\"valué\".a = 3\n" + // 16
		"é = 1; x.y = 2\n" + // 17 (not TOML; the scanner must not stumble)
		"[scan]\n" + // 18
		"over = 'é'  ;  from = 1\n" // 19
	spans := scanKeys(src)
	for _, tc := range []struct{ path, key, value string }{
		{"title", "2:1", "2:9"},
		{"graded", "3:1", "3:1"},
		{"graded.index", "4:3", "4:11"},
		{"graded.k0", "5:1", "5:8"},
		{"region", "6:1", "6:1"},
		{"region.x", "7:1", "7:5"},
		{"region.x[0]", "8:3", "8:3"},
		{"region.x[1]", "9:4", "9:4"},
		{"region.box", "10:1", "10:7"},
		{"region.box.re", "10:9", "10:14"},
		{"region.box.re[1]", "10:19", "10:19"},
		{"region.box.im", "10:23", "10:28"},
		{"expect[0]", "11:1", "11:1"},
		{"expect[0].value", "12:1", "12:9"},
		{"expect[1]", "15:1", "15:1"},
		{"expect[1].valué", "16:1", "16:1"},
		{"expect[1].valué.a", "16:1", "16:13"},
		{"scan.over", "19:1", "19:8"},
	} {
		sp, ok := spans[tc.path]
		if !ok {
			t.Errorf("%s not found", tc.path)
			continue
		}
		key := fmt.Sprintf("%d:%d", sp.line, sp.col)
		value := fmt.Sprintf("%d:%d", sp.valLine, sp.valCol)
		if key != tc.key || value != tc.value {
			t.Errorf("%s: key at %s, value at %s; want %s and %s", tc.path, key, value, tc.key, tc.value)
		}
	}
	for _, path := range []string{"comment", "a", "expect[0].a", "graded.title"} {
		if _, ok := spans[path]; ok {
			t.Errorf("%s found, want it absent (comment or string contents)", path)
		}
	}
	if sp := spans["title"]; src[sp.valOff:sp.valEnd] != `"a # b"` {
		t.Errorf("title value spans %q, want %q", src[sp.valOff:sp.valEnd], `"a # b"`)
	}
}

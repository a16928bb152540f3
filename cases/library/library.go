// Package library holds the bundled case files: the demo and a regression
// suite of scenarios of the project's own, each with a comment saying what it
// models and where its check values come from.
package library

import (
	"embed"
	"fmt"
	"io/fs"
	"sort"
	"strings"
)

//go:embed *.toml
var files embed.FS

// Demo is the name of the case "turnpoint demo" runs.
const Demo = "graded-barrier"

// Names returns the names of the bundled cases (file names without .toml), sorted.
func Names() []string {
	entries, _ := fs.ReadDir(files, ".")
	var names []string
	for _, e := range entries {
		names = append(names, strings.TrimSuffix(e.Name(), ".toml"))
	}
	sort.Strings(names)
	return names
}

// Read returns the source of the bundled case name.
func Read(name string) ([]byte, error) {
	src, err := files.ReadFile(strings.TrimSuffix(name, ".toml") + ".toml")
	if err != nil {
		return nil, fmt.Errorf("no bundled case %q (see \"turnpoint cases\")", name)
	}
	return src, nil
}

// Summary returns the first comment line of a case, which says what it models.
func Summary(name string) string {
	src, err := Read(name)
	if err != nil {
		return ""
	}
	for _, line := range strings.Split(string(src), "\n") {
		line = strings.TrimSpace(line)
		if s, ok := strings.CutPrefix(line, "#"); ok {
			return strings.TrimSpace(s)
		}
		if line != "" {
			break
		}
	}
	return ""
}

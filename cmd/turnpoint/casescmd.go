package main

import (
	"fmt"

	"github.com/spf13/pflag"

	"github.com/turnpoint/turnpoint/cases/library"
)

var casesCommand = &command{
	Name:      "cases",
	UsageLine: "cases [NAME]",
	Short:     "list the bundled case library, or print one case file",
	Long: `Cases lists the bundled cases with what each models, or prints the case file NAME,
ready to copy and edit. Any command taking CASE.toml also takes lib:NAME.`,
}

func init() {
	casesCommand.Flags = func(fs *pflag.FlagSet) func(*env, []string) error {
		asJSON := fs.Bool("json", false, "list the cases as JSON (name, summary)")
		return func(e *env, args []string) error {
			switch len(args) {
			case 0:
				if *asJSON {
					type entry struct {
						Name    string `json:"name"`
						Summary string `json:"summary"`
					}
					var list []entry
					for _, n := range library.Names() {
						list = append(list, entry{n, library.Summary(n)})
					}
					return writeJSON(e.stdout, list)
				}
				for _, n := range library.Names() {
					fmt.Fprintf(e.stdout, "  %-22s %s\n", n, library.Summary(n))
				}
				return nil
			case 1:
				src, err := library.Read(args[0])
				if err != nil {
					return badInput(err)
				}
				_, err = e.stdout.Write(src)
				return err
			}
			return badInput(fmt.Errorf("cases: at most one name"))
		}
	}
}

var versionCommand = &command{
	Name:      "version",
	UsageLine: "version",
	Short:     "print the version",
	Long:      `Version prints turnpoint's version.`,
}

// version is set at release time.
var version = "0.1.0-dev"

func init() {
	versionCommand.Flags = func(fs *pflag.FlagSet) func(*env, []string) error {
		asJSON := fs.Bool("json", false, "print the version as JSON")
		return func(e *env, args []string) error {
			if *asJSON {
				return writeJSON(e.stdout, map[string]string{"version": version})
			}
			fmt.Fprintf(e.stdout, "turnpoint %s\n", version)
			return nil
		}
	}
	commands = []*command{demoCommand, runCommand, pointsCommand, stokesCommand, scatterCommand,
		levelsCommand, checkCommand, casesCommand, helpCommand, versionCommand}
}

package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/spf13/pflag"
)

// command is one subcommand of turnpoint. Its flags are declared by flags on
// a fresh FlagSet, so every invocation (and every test) starts clean.
type command struct {
	Name      string
	UsageLine string // "points [flags] CASE.toml"
	Short     string // one line for the command list
	Long      string // paragraph(s) for "turnpoint help NAME"
	// Flags declares the command's flags and returns the function that runs it
	// once the flags are parsed.
	Flags func(fs *pflag.FlagSet) func(env *env, args []string) error
}

// env is what a command may use of the outside world (shims for testing).
type env struct {
	stdout, stderr io.Writer
	stderrIsTTY    bool
}

// commands is the command table; help is generated from it.
var commands []*command

func lookup(name string) *command {
	for _, c := range commands {
		if c.Name == name {
			return c
		}
	}
	return nil
}

// route runs the subcommand named by args[0].
func route(args []string, stdout, stderr io.Writer) error {
	e := &env{stdout: stdout, stderr: stderr, stderrIsTTY: isTerminal(stderr)}
	if len(args) == 0 {
		printMainHelp(stderr)
		return badInput(fmt.Errorf("no command given"))
	}
	name := args[0]
	switch name {
	case "-h", "--help":
		printMainHelp(stdout)
		return nil
	case "help":
		return runHelp(e, args[1:])
	}
	c := lookup(name)
	if c == nil {
		printMainHelp(stderr)
		return badInput(fmt.Errorf("unknown command %q%s", name, suggestCommand(name)))
	}
	fs := newFlagSet(c)
	run := c.Flags(fs)
	if err := fs.Parse(args[1:]); err != nil {
		if err == pflag.ErrHelp {
			printCommandHelp(stdout, c)
			return nil
		}
		fmt.Fprintf(stderr, "usage: turnpoint %s\nrun \"turnpoint help %s\" for details\n", c.UsageLine, c.Name)
		return badInput(fmt.Errorf("%s: %v", c.Name, err))
	}
	return run(e, fs.Args())
}

func newFlagSet(c *command) *pflag.FlagSet {
	fs := pflag.NewFlagSet(c.Name, pflag.ContinueOnError)
	fs.SetOutput(io.Discard)
	fs.SortFlags = false
	return fs
}

func printMainHelp(w io.Writer) {
	fmt.Fprint(w, `turnpoint: WKB connection formulae at turning points, checked by direct integration.

usage: turnpoint COMMAND [flags] [arguments]

commands:
`)
	for _, c := range commands {
		fmt.Fprintf(w, "  %-8s %s\n", c.Name, c.Short)
	}
	fmt.Fprint(w, `
Run "turnpoint help COMMAND" for a command's flags and details.
Exit status: 0 all ran and every check passed, 1 a check failed, 2 bad input.
`)
}

func printCommandHelp(w io.Writer, c *command) {
	fmt.Fprintf(w, "usage: turnpoint %s\n\n%s\n", c.UsageLine, strings.TrimSpace(c.Long))
	fs := newFlagSet(c)
	c.Flags(fs)
	if fs.HasFlags() {
		fmt.Fprintf(w, "\nflags:\n%s", fs.FlagUsagesWrapped(100))
	}
}

var helpCommand = &command{
	Name:      "help",
	UsageLine: "help [COMMAND]",
	Short:     "show the command list or one command's help",
	Long:      `Help prints the list of commands, or the usage, details and flags of one command.`,
}

func init() {
	helpCommand.Flags = func(fs *pflag.FlagSet) func(*env, []string) error { return runHelp }
}

func runHelp(e *env, args []string) error {
	switch len(args) {
	case 0:
		printMainHelp(e.stdout)
		return nil
	case 1:
		if c := lookup(args[0]); c != nil {
			printCommandHelp(e.stdout, c)
			return nil
		}
		return badInput(fmt.Errorf("help: unknown command %q%s", args[0], suggestCommand(args[0])))
	}
	return badInput(fmt.Errorf("help: at most one command name, got %d", len(args)))
}

// suggestCommand returns `; did you mean "x"?` for the closest command name.
func suggestCommand(name string) string {
	best, bestD := "", 3
	for _, c := range commands {
		if d := editDistance(name, c.Name); d < bestD {
			best, bestD = c.Name, d
		}
	}
	if best == "" {
		return ""
	}
	return fmt.Sprintf("; did you mean %q?", best)
}

// editDistance is the Levenshtein distance between a and b.
func editDistance(a, b string) int {
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}

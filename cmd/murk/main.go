// Command murk predicts what light does in muddy water: sphere optics,
// particle mixtures, flocs, the estuary model and whole scenario runs.
//
// Each subcommand lives in its own file and registers itself; main only
// dispatches. All computation is in the packages under mie, floc, mixing and
// scenario.
package main

import (
	"fmt"
	"io"
	"os"
	"sort"
)

// Exit codes shared by every subcommand.
const (
	exitOK      = 0 // success
	exitFailure = 1 // the computation or an output failed
	exitUsage   = 2 // the command line was malformed
	exitInvalid = 3 // an input file or value was rejected by validation
)

// command is one murk subcommand.
type command struct {
	name    string
	summary string
	// run executes the subcommand with the arguments after its name and
	// returns the process exit code.
	run func(args []string, stdout, stderr io.Writer) int
}

var commands = map[string]command{}

// register adds a subcommand; it is called from init functions.
func register(c command) {
	if _, dup := commands[c.name]; dup {
		panic("murk: subcommand registered twice: " + c.name)
	}
	commands[c.name] = c
}

func main() {
	os.Exit(dispatch(os.Args[1:], os.Stdout, os.Stderr))
}

func dispatch(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 || args[0] == "-h" || args[0] == "-help" || args[0] == "--help" || args[0] == "help" {
		usage(stdout)
		if len(args) == 0 {
			return exitUsage
		}
		return exitOK
	}
	c, ok := commands[args[0]]
	if !ok {
		fmt.Fprintf(stderr, "murk: unknown subcommand %q\n", args[0])
		usage(stderr)
		return exitUsage
	}
	return c.run(args[1:], stdout, stderr)
}

func usage(w io.Writer) {
	fmt.Fprintln(w, "usage: murk <subcommand> [flags]")
	fmt.Fprintln(w, "\nsubcommands:")
	names := make([]string, 0, len(commands))
	for n := range commands {
		names = append(names, n)
	}
	sort.Strings(names)
	for _, n := range names {
		fmt.Fprintf(w, "  %-10s %s\n", n, commands[n].summary)
	}
	fmt.Fprintln(w, "\nRun 'murk <subcommand> -h' for the flags of one subcommand.")
}

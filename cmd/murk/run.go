package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"os/signal"

	"golang.org/x/term"

	"github.com/murk-optics/murk/scenario"
	"github.com/murk-optics/murk/scenario/spec"
)

func init() {
	register(command{
		name:    "run",
		summary: "run a scenario: estuary, flocs and optics from river to sea",
		run:     runRun,
	})
}

const runHelp = `usage: murk run scenario.yaml [-out DIR] [-quiet]

Runs the scenario end to end (estuary model coupled to the floc model,
optical kernels once per population, IOPs at every station, layer and output
time), writes the products it asks for into DIR (default: the scenario's
outputs.directory, relative to the file) and prints the summary.
Exit status 3 if the scenario is invalid, 1 if the run fails.
`

func runRun(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("run", flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, runHelp); fs.PrintDefaults() }
	out := fs.String("out", "", "output directory (overrides outputs.directory)")
	quiet := fs.Bool("quiet", false, "do not print the summary")
	pos, err := parseInterleaved(fs, args)
	if err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK
		}
		return exitUsage
	}
	if len(pos) != 1 {
		fmt.Fprintln(stderr, "murk run: want exactly one scenario file")
		fs.Usage()
		return exitUsage
	}
	s, err := spec.Load(pos[0])
	if err != nil {
		return reportLoadError("run", err, stderr)
	}
	dir := *out
	if dir == "" {
		dir = s.Outputs.Directory
	}
	return runScenario("run", s, dir, !*quiet, stdout, stderr)
}

// runScenario runs s, writes its products into dir ("" for none) and
// prints the summary. Interrupts cancel the run; files already renamed
// into place stay, none is left half-written.
func runScenario(name string, s spec.Scenario, dir string, summary bool, stdout, stderr io.Writer) int {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	opt := scenario.Options{}
	if isTerminal(stderr) {
		opt.Progress = stderr
	}
	r, err := scenario.Run(ctx, s, opt)
	if err != nil {
		fmt.Fprintf(stderr, "murk %s: %v\n", name, err)
		return exitFailure
	}
	if dir != "" {
		paths, err := r.WriteOutputs(dir)
		for _, p := range paths {
			fmt.Fprintf(stderr, "wrote %s\n", p)
		}
		if err != nil {
			fmt.Fprintf(stderr, "murk %s: %v\n", name, err)
			return exitFailure
		}
	}
	if summary {
		if err := r.WriteSummary(stdout); err != nil {
			fmt.Fprintf(stderr, "murk %s: %v\n", name, err)
			return exitFailure
		}
	}
	return exitOK
}

// reportLoadError prints a loader error: every validation problem on its
// own line (file:line:column: …) with exit status 3, or an I/O error with
// status 1.
func reportLoadError(name string, err error, stderr io.Writer) int {
	var list spec.ErrorList
	if errors.As(err, &list) {
		for _, e := range list {
			fmt.Fprintln(stderr, e.Error())
		}
		fmt.Fprintf(stderr, "murk %s: %d problem(s) found\n", name, len(list))
		return exitInvalid
	}
	fmt.Fprintf(stderr, "murk %s: %v\n", name, err)
	if spec.IsInvalid(err) {
		return exitInvalid
	}
	return exitFailure
}

// parseInterleaved parses flags that may come before or after the
// positional arguments ("murk run file.yaml -out dir").
func parseInterleaved(fs *flag.FlagSet, args []string) ([]string, error) {
	var pos []string
	for {
		if err := fs.Parse(args); err != nil {
			return nil, err
		}
		args = fs.Args()
		if len(args) == 0 {
			return pos, nil
		}
		pos = append(pos, args[0])
		args = args[1:]
	}
}

// isTerminal reports whether w is a terminal (progress goes only there).
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	return ok && term.IsTerminal(int(f.Fd()))
}

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
	"github.com/murk-optics/murk/scenario/products"
	"github.com/murk-optics/murk/scenario/spec"
	"github.com/murk-optics/murk/scenario/table"
)

// cli is the frame the scenario subcommands (check, run, demo, estuary,
// mixture) share: a flag set that prints the subcommand's help, flags
// before or after the file, messages prefixed "murk <name>:", and the exit
// codes of main.go (0 ok, 1 failure, 2 usage, 3 invalid input).
type cli struct {
	name   string
	fs     *flag.FlagSet
	stderr io.Writer
}

// newCLI returns the frame of subcommand name with its help text.
func newCLI(name, help string, stderr io.Writer) *cli {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() { fmt.Fprint(stderr, help); fs.PrintDefaults() }
	return &cli{name: name, fs: fs, stderr: stderr}
}

// parse parses args, flags anywhere among the positional arguments
// ("murk run file.yaml -out dir"), and wants exactly want positional
// arguments, each a what ("scenario file"). When ok is false the
// subcommand returns code: exitOK after -h, exitUsage otherwise.
func (c *cli) parse(args []string, want int, what string) (pos []string, code int, ok bool) {
	for {
		if err := c.fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				return nil, exitOK, false
			}
			return nil, exitUsage, false
		}
		args = c.fs.Args()
		if len(args) == 0 {
			break
		}
		pos = append(pos, args[0])
		args = args[1:]
	}
	switch {
	case len(pos) == want:
		return pos, exitOK, true
	case want == 0:
		fmt.Fprintf(c.stderr, "murk %s: unexpected argument %q\n", c.name, pos[0])
	case want == 1:
		fmt.Fprintf(c.stderr, "murk %s: want exactly one %s\n", c.name, what)
	default:
		fmt.Fprintf(c.stderr, "murk %s: want %d %ss, got %d\n", c.name, want, what, len(pos))
	}
	c.fs.Usage()
	return nil, exitUsage, false
}

// loadOne parses args for exactly one input file, a what ("scenario
// file"), and loads it with load. When ok is false the subcommand returns
// code (usage, invalid input or an unreadable file).
func loadOne[T any](c *cli, args []string, what string, load func(path string) (T, error)) (v T, path string, code int, ok bool) {
	pos, code, ok := c.parse(args, 1, what)
	if !ok {
		return v, "", code, false
	}
	v, err := load(pos[0])
	if err != nil {
		return v, pos[0], c.loadFailed(err), false
	}
	return v, pos[0], exitOK, true
}

// fail prints err and returns exitFailure.
func (c *cli) fail(err error) int {
	fmt.Fprintf(c.stderr, "murk %s: %v\n", c.name, err)
	return exitFailure
}

// formatFlag defines flag -format (table, csv or json, package table),
// checked while the flags are parsed: a bad value is a usage error.
func (c *cli) formatFlag() *table.Format {
	f := table.Text
	c.fs.Func("format", "output format: table, csv or json (default table)", func(s string) error {
		v, err := table.ParseFormat(s)
		f = v
		return err
	})
	return &f
}

// loadFailed prints a loader error: every validation problem on its own
// line (file:line:column: …) with exitInvalid, or an I/O error with
// exitFailure.
func (c *cli) loadFailed(err error) int {
	var list spec.ErrorList
	if errors.As(err, &list) {
		for _, e := range list {
			fmt.Fprintln(c.stderr, e.Error())
		}
		fmt.Fprintf(c.stderr, "murk %s: %d problem(s) found\n", c.name, len(list))
		return exitInvalid
	}
	fmt.Fprintf(c.stderr, "murk %s: %v\n", c.name, err)
	if spec.IsInvalid(err) {
		return exitInvalid
	}
	return exitFailure
}

// writeTable writes t to stdout in format f, or as CSV to the file path
// (atomically) when path is not empty.
func (c *cli) writeTable(t *table.Table, path string, f table.Format, stdout io.Writer) int {
	var err error
	if path == "" {
		err = t.Write(stdout, f)
	} else {
		err = products.WriteTable(path, t)
	}
	if err != nil {
		return c.fail(err)
	}
	return exitOK
}

// runScenario runs s, writes its products into dir ("" for none) and
// prints the summary. Interrupts cancel the run; files already renamed
// into place stay, none is left half-written. Progress goes to stderr
// only when it is a terminal.
func (c *cli) runScenario(s spec.Scenario, dir string, summary bool, stdout io.Writer) int {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	opt := scenario.Options{}
	if f, ok := c.stderr.(*os.File); ok && term.IsTerminal(int(f.Fd())) {
		opt.Progress = c.stderr
	}
	r, err := scenario.Run(ctx, s, opt)
	if err != nil {
		return c.fail(err)
	}
	if dir != "" {
		paths, err := products.WriteOutputs(r, dir)
		for _, p := range paths {
			fmt.Fprintf(c.stderr, "wrote %s\n", p)
		}
		if err != nil {
			return c.fail(err)
		}
	}
	if summary {
		if err := products.WriteSummary(r, stdout); err != nil {
			return c.fail(err)
		}
	}
	return exitOK
}

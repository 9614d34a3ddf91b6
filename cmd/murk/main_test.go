package main

import (
	"flag"
	"os"
	"testing"

	"github.com/rogpeppe/go-internal/testscript"
)

// update rewrites the golden files of the scripts (the second argument
// of failing cmp commands) from the actual output: go test -run TestScript -update.
var update = flag.Bool("update", false, "update testscript golden files")

func TestMain(m *testing.M) {
	testscript.Main(m, map[string]func(){
		"murk": func() { os.Exit(dispatch(os.Args[1:], os.Stdout, os.Stderr)) },
	})
}

// TestScript drives the murk binary with the scripts in testdata/script.
func TestScript(t *testing.T) {
	testscript.Run(t, testscript.Params{
		Dir:           "testdata/script",
		UpdateScripts: *update,
	})
}

package deps

import (
	_ "github.com/rogpeppe/go-internal/testscript"
	_ "golang.org/x/term"
	_ "gonum.org/v1/gonum/integrate/quad"
	_ "gonum.org/v1/gonum/mathext"
	_ "gonum.org/v1/plot"
	_ "gopkg.in/yaml.v3"
)

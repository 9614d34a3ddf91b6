package spec

import (
	"math"
	"os"
	"reflect"
	"strings"
	"testing"
)

// FuzzLoad feeds arbitrary bytes to the three loaders. They must never
// panic; a rejected document must come back as an ErrorList whose entries
// all say what is wrong, and an accepted one must hold only finite numbers
// (murk never returns NaN or Inf silently).
//
//	go test -run '^$' -fuzz FuzzLoad -fuzztime 60s ./scenario/spec
func FuzzLoad(f *testing.F) {
	for _, name := range []string{"testdata/quell.yaml", "testdata/quell_estuary.yaml", "testdata/quell_mixture.yaml"} {
		b, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b)
	}
	base := quellText(f)
	for _, c := range badCases {
		doc := base
		ok := true
		for _, e := range c.edits {
			if strings.Count(doc, e[0]) != 1 {
				ok = false
				break
			}
			doc = strings.Replace(doc, e[0], e[1], 1)
		}
		if c.doc != "" {
			doc = c.doc
		}
		if ok {
			f.Add([]byte(doc))
		}
	}
	for _, s := range []string{"", "---", "a: *b", "a: &a [*a]", "geometry: {length: \"1e308 km\"}", "{", "\t", "optics: {wavelengths: {from: \"400 nm\", to: \"900 nm\", step: \"0.1 nm\"}}"} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) > 1<<16 {
			return // the YAML parser's own cost grows with size; not what this target tests
		}
		check := func(v any, err error) {
			if err != nil {
				list, ok := err.(ErrorList)
				if !ok {
					t.Fatalf("error of type %T: %v", err, err)
				}
				if len(list) == 0 {
					t.Fatal("empty ErrorList returned as an error")
				}
				for _, e := range list {
					if e.Problem == "" || e.File != "fuzz.yaml" || e.Line < 0 || e.Column < 0 {
						t.Fatalf("incomplete error %+v", *e)
					}
				}
				return
			}
			if p := nonFinite(reflect.ValueOf(v), ""); p != "" {
				t.Fatalf("accepted document holds a non-finite number at %s", p)
			}
		}
		s, err := Parse("fuzz.yaml", data)
		check(s, err)
		e, err := ParseEstuary("fuzz.yaml", data)
		check(e, err)
		m, err := ParseMixture("fuzz.yaml", data)
		check(m, err)
		if err == nil {
			_ = EstimateMixture(m).String()
		}
	})
}

// nonFinite returns the path of the first NaN or Inf float in v, or "".
func nonFinite(v reflect.Value, path string) string {
	switch v.Kind() {
	case reflect.Float64:
		if math.IsNaN(v.Float()) || math.IsInf(v.Float(), 0) {
			return path
		}
	case reflect.Struct:
		for i := 0; i < v.NumField(); i++ {
			if p := nonFinite(v.Field(i), path+"."+v.Type().Field(i).Name); p != "" {
				return p
			}
		}
	case reflect.Slice:
		for i := 0; i < v.Len(); i++ {
			if p := nonFinite(v.Index(i), path+"["+itoa(i)+"]"); p != "" {
				return p
			}
		}
	}
	return ""
}

// TestAcceptedValuesFinite applies the fuzz target's check to the examples.
func TestAcceptedValuesFinite(t *testing.T) {
	s, err := Load("testdata/quell.yaml")
	if err != nil {
		t.Fatal(err)
	}
	if p := nonFinite(reflect.ValueOf(s), ""); p != "" {
		t.Errorf("non-finite at %s", p)
	}
	if p := nonFinite(reflect.ValueOf(Estimate(s)), ""); p != "" {
		t.Errorf("cost: non-finite at %s", p)
	}
}

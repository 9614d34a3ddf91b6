package csvrows

import (
	"reflect"
	"strings"
	"testing"
)

func TestRowsSkipsCommentsBlankAndHeader(t *testing.T) {
	data := []byte("# source: a table\n\nlambda,a\n400, 1.5\n# inline comment\n410,2\n")
	var lines []int
	var rows [][]string
	for line, f := range Rows(data) {
		lines, rows = append(lines, line), append(rows, f)
	}
	if !reflect.DeepEqual(lines, []int{4, 6}) || !reflect.DeepEqual(rows, [][]string{{"400", " 1.5"}, {"410", "2"}}) {
		t.Fatalf("lines %v rows %q", lines, rows)
	}
	if Err(data) != nil {
		t.Fatal(Err(data))
	}
}

func TestErrOnOverlongLine(t *testing.T) {
	if Err([]byte(strings.Repeat("x", 1<<17))) == nil {
		t.Fatal("want an error for a line over the scanner limit")
	}
}

package table

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"strings"
	"testing"
)

func sample() *Table {
	t := &Table{Columns: []Column{{"quantity", ""}, {"value", "m-1"}}}
	t.Add("a", 1.5)
	t.Add("bb", 0.000123)
	return t
}

func TestCSVHeaderUnits(t *testing.T) {
	var buf bytes.Buffer
	if err := sample().WriteCSV(&buf); err != nil {
		t.Fatal(err)
	}
	recs, err := csv.NewReader(&buf).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if recs[0][1] != "value [m-1]" || recs[2][1] != "0.000123" {
		t.Fatalf("unexpected CSV %v", recs)
	}
}

func TestJSONRoundTrip(t *testing.T) {
	var buf bytes.Buffer
	if err := sample().WriteJSON(&buf); err != nil {
		t.Fatal(err)
	}
	var got struct {
		Units map[string]string
		Rows  []map[string]any
	}
	if err := json.Unmarshal(buf.Bytes(), &got); err != nil {
		t.Fatalf("invalid JSON: %v\n%s", err, buf.String())
	}
	if got.Units["value"] != "m-1" || got.Rows[1]["value"].(float64) != 0.000123 {
		t.Fatalf("unexpected %+v", got)
	}
}

func TestTextAligned(t *testing.T) {
	var buf bytes.Buffer
	sample().WriteText(&buf)
	lines := strings.Split(strings.TrimSpace(buf.String()), "\n")
	if len(lines) != 3 || len(lines[1]) != len(lines[2]) {
		t.Fatalf("not aligned:\n%s", buf.String())
	}
}

func TestAddRejectsWrongLength(t *testing.T) {
	if err := sample().Add(1.0); err == nil {
		t.Fatal("expected error")
	}
}

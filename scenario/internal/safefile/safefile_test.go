package safefile

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"testing"
)

func TestWriteCompletes(t *testing.T) {
	p := filepath.Join(t.TempDir(), "out.txt")
	if err := Write(p, func(w io.Writer) error { _, err := fmt.Fprint(w, "hello"); return err }); err != nil {
		t.Fatal(err)
	}
	b, err := os.ReadFile(p)
	if err != nil || string(b) != "hello" {
		t.Fatalf("got %q, %v", b, err)
	}
}

// A failing writer must leave neither the target nor a temporary file.
func TestWriteFailureLeavesNothing(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "out.txt")
	boom := errors.New("boom")
	err := Write(p, func(w io.Writer) error { fmt.Fprint(w, "partial"); return boom })
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v, want boom", err)
	}
	ents, _ := os.ReadDir(dir)
	if len(ents) != 0 {
		t.Fatalf("directory not empty after failure: %v", ents)
	}
}

// A failure must not disturb an existing file of the same name.
func TestWriteFailureKeepsOld(t *testing.T) {
	p := filepath.Join(t.TempDir(), "out.txt")
	os.WriteFile(p, []byte("old"), 0o644)
	Write(p, func(w io.Writer) error { return errors.New("x") })
	b, _ := os.ReadFile(p)
	if string(b) != "old" {
		t.Fatalf("old content replaced: %q", b)
	}
}

// Package safefile writes output files so that a failure or an interrupt
// never leaves a partial file behind: content goes to a temporary file in the
// destination directory, is flushed to disk, and is renamed over the target
// only when complete (rename is atomic within one POSIX file system).
package safefile

import (
	"bufio"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// Write creates path by calling fill with a buffered writer on a temporary
// file beside it. If fill or any file operation fails, the temporary file is
// removed, path is left as it was, and the error is returned.
func Write(path string, fill func(w io.Writer) error) (err error) {
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		return fmt.Errorf("safefile: %w", err)
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	bw := bufio.NewWriterSize(tmp, 1<<16)
	if err = fill(bw); err != nil {
		return err
	}
	if err = bw.Flush(); err != nil {
		return fmt.Errorf("safefile: writing %s: %w", path, err)
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("safefile: syncing %s: %w", path, err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("safefile: closing %s: %w", path, err)
	}
	if err = os.Chmod(tmp.Name(), 0o644); err != nil {
		return fmt.Errorf("safefile: %w", err)
	}
	if err = os.Rename(tmp.Name(), path); err != nil {
		return fmt.Errorf("safefile: %w", err)
	}
	return nil
}

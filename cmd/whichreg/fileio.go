package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
)

// writeFileAtomic writes data to path through a temporary file in the same
// folder, so that a reader never sees half a file and a failure leaves
// nothing behind. Without force it refuses to replace an existing file.
func writeFileAtomic(path string, data []byte, force bool) error {
	if !force {
		if _, err := os.Lstat(path); err == nil {
			return inputError(fmt.Errorf("%s already exists; not overwritten", path), "use --force to replace it, or choose another name")
		} else if !errors.Is(err, fs.ErrNotExist) {
			return ioError(err)
		}
	}
	dir := filepath.Dir(path)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp*")
	if err != nil {
		return ioError(fmt.Errorf("writing %s: %v", path, err))
	}
	name := tmp.Name()
	cleanup := func(e error) error {
		tmp.Close()
		os.Remove(name)
		return ioError(fmt.Errorf("writing %s: %v", path, e))
	}
	if _, err := tmp.Write(data); err != nil {
		return cleanup(err)
	}
	if err := tmp.Sync(); err != nil {
		return cleanup(err)
	}
	if err := tmp.Close(); err != nil {
		return cleanup(err)
	}
	if err := os.Chmod(name, 0o644); err != nil {
		return cleanup(err)
	}
	if force {
		if err := os.Rename(name, path); err != nil {
			os.Remove(name)
			return ioError(fmt.Errorf("writing %s: %v", path, err))
		}
		return nil
	}
	// os.Link fails if path appeared meanwhile: never overwrite without --force.
	if err := os.Link(name, path); err != nil {
		os.Remove(name)
		if errors.Is(err, fs.ErrExist) {
			return inputError(fmt.Errorf("%s already exists; not overwritten", path), "use --force to replace it")
		}
		return ioError(fmt.Errorf("writing %s: %v", path, err))
	}
	os.Remove(name)
	return nil
}

// writeOut writes data to file atomically, or to stdout when file is "".
func writeOut(app *App, file string, data []byte, force bool) error {
	if file == "" || file == "-" {
		if _, err := app.IO.Out.Write(data); err != nil {
			return ioError(err)
		}
		return nil
	}
	if err := writeFileAtomic(file, data, force); err != nil {
		return err
	}
	fmt.Fprintf(app.IO.ErrOut, "wrote %s\n", file)
	return nil
}

// Package miptest holds test helpers for packages that build models for
// the mip engine: a cross-check of a model's optimum with an independent
// solver.
package miptest

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"testing"

	"github.com/rigmix/rigmix/optimizer/mip"
)

// CBCOptimum writes p as free MPS, solves it with COIN-OR CBC (Debian's
// coinor-cbc, an independent solver; cbc is its path) single thread to a
// zero gap, and returns CBC's optimum. The test fails when CBC does not
// report one.
func CBCOptimum(t testing.TB, cbc string, p *mip.Problem) float64 {
	t.Helper()
	file := filepath.Join(t.TempDir(), "model.mps")
	var b bytes.Buffer
	if err := mip.WriteMPS(&b, p); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(file, b.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command(cbc, file, "-ratio", "0", "-allowableGap", "0", "-threads", "1", "-solve", "-quit").CombinedOutput()
	if err != nil {
		t.Fatalf("cbc: %v\n%s", err, out)
	}
	m := regexp.MustCompile(`Objective value:\s+(\S+)`).FindSubmatch(out)
	if m == nil || !bytes.Contains(out, []byte("Optimal solution found")) {
		t.Fatalf("cbc did not report an optimum:\n%s", out)
	}
	v, err := strconv.ParseFloat(string(m[1]), 64)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

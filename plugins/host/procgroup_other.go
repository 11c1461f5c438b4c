//go:build !unix

package host

import "os/exec"

// ownProcessGroup does nothing where process groups are not available.
func ownProcessGroup(cmd *exec.Cmd) bool { return false }

// killGroup does nothing where process groups are not available; the
// plugin process itself is still killed by go-plugin.
func killGroup(pid int) {}

// startedChild is not known before go-plugin's start returns here; 0.
func startedChild(cmd *exec.Cmd) int { return 0 }

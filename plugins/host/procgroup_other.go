//go:build !unix

package host

import "os/exec"

// ownProcessGroup does nothing where process groups are not available.
func ownProcessGroup(cmd *exec.Cmd) bool { return false }

// killGroup does nothing where process groups are not available; the
// plugin process itself is still killed by go-plugin.
func killGroup(pid int) {}

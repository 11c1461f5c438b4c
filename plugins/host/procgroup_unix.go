//go:build unix && !linux

package host

import (
	"os/exec"
	"syscall"
)

// ownProcessGroup makes cmd's process the leader of a new process group,
// unless the caller already set process attributes; it reports whether it
// did.
func ownProcessGroup(cmd *exec.Cmd) bool {
	if cmd.SysProcAttr != nil {
		return false
	}
	cmd.SysProcAttr = &syscall.SysProcAttr{Setpgid: true}
	return true
}

// killGroup kills what is left of the process group led by pid: processes
// a plugin started and did not end. pid 0 means none.
func killGroup(pid int) {
	if pid > 0 {
		_ = syscall.Kill(-pid, syscall.SIGKILL)
	}
}

// startedChild is not known before go-plugin's start returns here; 0.
func startedChild(cmd *exec.Cmd) int { return 0 }

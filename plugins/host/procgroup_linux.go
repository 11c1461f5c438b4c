package host

import (
	"os/exec"
	"syscall"
)

// ownProcessGroup makes cmd's process the leader of a new process group,
// unless the caller already set process attributes; it reports whether it
// did. The process is also killed if rigmix dies without closing the fleet
// (killed with SIGKILL, say): go-plugin's server side does not watch its
// parent, so it would live on. Pdeathsig follows the thread that started
// the child (prctl(2), PR_SET_PDEATHSIG); Go ends a thread only when a
// goroutine locked to it exits, which nothing here does.
func ownProcessGroup(cmd *exec.Cmd) bool {
	if cmd.SysProcAttr != nil {
		return false
	}
	cmd.SysProcAttr = &syscall.SysProcAttr{Setpgid: true, Pdeathsig: syscall.SIGKILL}
	return true
}

// killGroup kills what is left of the process group led by pid: processes
// a plugin started and did not end. The plugin itself has been stopped by
// then. pid 0 means none.
func killGroup(pid int) {
	if pid > 0 {
		_ = syscall.Kill(-pid, syscall.SIGKILL)
	}
}

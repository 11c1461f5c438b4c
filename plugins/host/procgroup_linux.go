package host

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
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

// startedChild finds, from /proc, the child process of rigmix that runs
// cmd's arguments and leads a process group of its own: the plugin being
// started, whose id go-plugin gives only once its start returns. 0 when
// there is none (yet).
func startedChild(cmd *exec.Cmd) int {
	entries, err := os.ReadDir("/proc")
	if err != nil {
		return 0
	}
	me := strconv.Itoa(os.Getpid())
	want := []byte(strings.Join(cmd.Args, "\x00") + "\x00")
	for _, e := range entries {
		pid, err := strconv.Atoi(e.Name())
		if err != nil {
			continue
		}
		b, err := os.ReadFile(filepath.Join("/proc", e.Name(), "stat"))
		if err != nil {
			continue
		}
		s := string(b)
		f := strings.Fields(s[strings.LastIndexByte(s, ')')+1:])
		// state ppid pgrp ...
		if len(f) < 3 || f[1] != me || f[2] != e.Name() {
			continue
		}
		if line, err := os.ReadFile(filepath.Join("/proc", e.Name(), "cmdline")); err == nil && bytes.Equal(line, want) {
			return pid
		}
	}
	return 0
}

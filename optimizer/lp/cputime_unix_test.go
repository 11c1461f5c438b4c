//go:build unix

package lp

import (
	"syscall"
	"time"
)

// processCPU returns the user plus system CPU time of this process; the
// benchmarks report it per operation because wall time on a shared
// machine mostly measures the other processes.
func processCPU() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}

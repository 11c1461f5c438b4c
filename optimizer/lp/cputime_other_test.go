//go:build !unix

package lp

import "time"

func processCPU() time.Duration { return 0 }

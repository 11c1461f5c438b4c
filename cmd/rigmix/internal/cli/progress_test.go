package cli

import (
	"bytes"
	"strings"
	"sync"
	"testing"
	"time"
)

type lockedBuffer struct {
	mu sync.Mutex
	b  bytes.Buffer
}

func (l *lockedBuffer) Write(p []byte) (int, error) {
	l.mu.Lock()
	defer l.mu.Unlock()
	return l.b.Write(p)
}

func (l *lockedBuffer) String() string {
	l.mu.Lock()
	defer l.mu.Unlock()
	return l.b.String()
}

// TestProgress: off (not a terminal, or --quiet) it writes nothing; on, it
// redraws one line naming the command and its stage and clears it at the
// end, so what follows starts on a clean line.
func TestProgress(t *testing.T) {
	var off lockedBuffer
	p := startProgress(&off, "tradeoffs", false, time.Millisecond)
	p.set("analysing")
	time.Sleep(20 * time.Millisecond)
	p.end()
	if off.String() != "" {
		t.Errorf("progress off wrote %q", off.String())
	}

	var on lockedBuffer
	p = startProgress(&on, "tradeoffs", true, 5*time.Millisecond)
	p.set("loading the scenario")
	time.Sleep(30 * time.Millisecond)
	p.set("analysing")
	time.Sleep(30 * time.Millisecond)
	p.end()
	p.end()
	s := on.String()
	for _, w := range []string{"\r  tradeoffs: loading the scenario … ", "\r  tradeoffs: analysing … "} {
		if !strings.Contains(s, w) {
			t.Errorf("progress %q does not show %q", s, w)
		}
	}
	if strings.Contains(s, "\n") {
		t.Errorf("progress wrote a line break: %q", s)
	}
	last := s[strings.LastIndex(s[:len(s)-1], "\r"):]
	if strings.TrimSpace(last) != "" || !strings.HasSuffix(s, "\r") {
		t.Errorf("progress did not end by clearing its line: %q", last)
	}
	n := len(s)
	time.Sleep(20 * time.Millisecond)
	if len(on.String()) != n {
		t.Errorf("progress wrote after end")
	}
}

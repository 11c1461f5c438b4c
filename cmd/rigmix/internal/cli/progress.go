package cli

import (
	"fmt"
	"io"
	"strings"
	"sync"
	"time"
)

// progress shows, on a terminal only, which stage a long command is in and
// for how long it has run, on one line of stderr redrawn every second; it
// shows nothing for a run shorter than that, and clears its line at the
// end, before anything else is printed.
type progress struct {
	w     io.Writer
	name  string
	start time.Time

	mu    sync.Mutex
	stage string
	width int // of the line drawn last; 0: none

	stop, done chan struct{}
	endOnce    sync.Once
}

// startProgress starts showing progress for the command name on w when on
// (stderr is a terminal and --quiet is not given).
func startProgress(w io.Writer, name string, on bool, every time.Duration) *progress {
	p := &progress{w: w, name: name, start: time.Now()}
	if on {
		p.stop, p.done = make(chan struct{}), make(chan struct{})
		go p.loop(every)
	}
	return p
}

// set names the stage the command is in.
func (p *progress) set(stage string) {
	p.mu.Lock()
	p.stage = stage
	p.mu.Unlock()
}

func (p *progress) loop(every time.Duration) {
	defer close(p.done)
	t := time.NewTicker(every)
	defer t.Stop()
	for {
		select {
		case <-p.stop:
			return
		case <-t.C:
			p.draw()
		}
	}
}

func (p *progress) draw() {
	p.mu.Lock()
	defer p.mu.Unlock()
	line := fmt.Sprintf("  %s: %s … %s", p.name, p.stage, time.Since(p.start).Round(time.Second))
	pad := ""
	if n := len([]rune(line)); n < p.width {
		pad = strings.Repeat(" ", p.width-n)
	} else {
		p.width = n
	}
	fmt.Fprintf(p.w, "\r%s%s", line, pad)
}

// end stops the progress line and clears it. It is safe to call more than
// once.
func (p *progress) end() {
	p.endOnce.Do(func() {
		if p.stop == nil {
			return
		}
		close(p.stop)
		<-p.done
		if p.width > 0 {
			fmt.Fprintf(p.w, "\r%s\r", strings.Repeat(" ", p.width))
		}
	})
}

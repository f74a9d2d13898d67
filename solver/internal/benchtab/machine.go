package main

import (
	"bufio"
	"os"
	"os/exec"
	"runtime"
	"strings"
	"time"
)

// machine describes where and when the table was measured.
type machine struct {
	cpu       string
	cores     int
	goVersion string
	osArch    string
	date      string
	commit    string // the solver's commit, "+ changes" when the tree differs
	loadStart string // /proc/loadavg before and after the run
	loadEnd   string
}

func describeMachine(root string) machine {
	m := machine{
		cpu:       "unknown",
		cores:     runtime.NumCPU(),
		goVersion: runtime.Version(),
		osArch:    runtime.GOOS + "/" + runtime.GOARCH,
		date:      time.Now().UTC().Format("2006-01-02 15:04 UTC"),
		loadStart: loadAvg(),
	}
	if f, err := os.Open("/proc/cpuinfo"); err == nil {
		sc := bufio.NewScanner(f)
		for sc.Scan() {
			k, v, ok := strings.Cut(sc.Text(), ":")
			if ok && strings.TrimSpace(k) == "model name" {
				m.cpu = strings.TrimSpace(v)
				break
			}
		}
		f.Close()
	}
	// Read-only git queries; without git the commit is left out.
	if out, err := exec.Command("git", "-C", root, "rev-parse", "--short", "HEAD").Output(); err == nil {
		m.commit = strings.TrimSpace(string(out))
		diff := exec.Command("git", "-C", root, "--no-optional-locks", "diff", "--quiet", "HEAD", "--", "solver")
		if diff.Run() != nil {
			m.commit += " + uncommitted changes in solver/"
		}
	}
	return m
}

// loadAvg returns the 1-, 5- and 15-minute load averages, or "".
func loadAvg() string {
	b, err := os.ReadFile("/proc/loadavg")
	if err != nil {
		return ""
	}
	f := strings.Fields(string(b))
	if len(f) < 3 {
		return ""
	}
	return strings.Join(f[:3], " ")
}

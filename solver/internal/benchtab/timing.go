package main

import (
	"fmt"
	"runtime"
	"slices"
	"time"
)

// timing is the outcome of repeated runs of one piece of work.
type timing struct {
	best, median time.Duration
	runs         int             // timed runs
	per          int             // items of work per run (0 or 1: one)
	all          []time.Duration // every run, sorted, per item
}

// summarise returns the timing of the runs ds.
func summarise(ds []time.Duration) timing {
	ds = slices.Clone(ds)
	slices.Sort(ds)
	return timing{best: ds[0], median: ds[len(ds)/2], runs: len(ds), all: ds}
}

// merge returns the timing of the runs of t and u together.
func (t timing) merge(u timing) timing {
	if t.runs == 0 {
		return u
	}
	m := summarise(append(slices.Clone(t.all), u.all...))
	m.per = t.per
	return m
}

// each returns t for work done k times per run: every time divided by k.
// The runs stay the timed runs; per records k.
func (t timing) each(k int) timing {
	ds := make([]time.Duration, len(t.all))
	for i, d := range t.all {
		ds[i] = d / time.Duration(k)
	}
	s := summarise(ds)
	s.per = k
	return s
}

// runsText tells how many runs were timed, and of how many items each.
func (t timing) runsText() string {
	if t.per > 1 {
		return fmt.Sprintf("%d × %d", t.runs, t.per)
	}
	return fmt.Sprint(t.runs)
}

// measure runs f once to warm up and then repeatedly, at least minRuns
// times and until budget is spent (but at most maxRuns times), and returns
// the best and the median time. The best of several runs is the figure
// least disturbed by other work on a shared machine; the median shows how
// noisy it was. A garbage collection before each run keeps one run's
// garbage out of the next one's time.
func measure(f func(), minRuns, maxRuns int, budget time.Duration) timing {
	f()
	return measureCold(f, minRuns, maxRuns, budget)
}

// measureCold is measure without the warm-up run, for work that takes
// seconds: its first run warms up as it goes, and the best of two runs
// is kept.
func measureCold(f func(), minRuns, maxRuns int, budget time.Duration) timing {
	var ds []time.Duration
	start := time.Now()
	for len(ds) < minRuns || (len(ds) < maxRuns && time.Since(start) < budget) {
		runtime.GC()
		t0 := time.Now()
		f()
		ds = append(ds, time.Since(t0))
	}
	return summarise(ds)
}

// batch returns f repeated k times, for work too short to time alone.
func batch(k int, f func()) func() {
	return func() {
		for range k {
			f()
		}
	}
}

// per returns d divided by k.
func per(d time.Duration, k int) float64 { return float64(d) / float64(k) }

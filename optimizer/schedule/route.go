package schedule

import (
	"math"
	"math/rand/v2"
)

// ExactRouteMax is the largest number of points on one rig whose route is
// found exactly (Held–Karp: 2ⁿ·n² steps, about 0.6 million at 12).
const ExactRouteMax = 12

// ilsBudget bounds the iterated local search at about 10⁷ move
// evaluations (a few tenths of a second): each kick costs about ten passes
// of 2-opt and Or-opt, some 70·n² evaluations, so large routes get few or
// no kicks and keep their plain local optimum.
const ilsBudget = 10_000_000

// gainEps is the least improvement a local-search move must make to be
// taken; it keeps rounding noise from cycling the search.
const gainEps = 1e-9

// legs holds the travel hours between the route's nodes: node 0 is the start
// (the entrance, or a free start at zero cost to every point), nodes 1..n are
// the rig's jobs.
type legs struct {
	n int       // points
	h []float64 // (n+1)×(n+1) hours
}

func (l *legs) at(a, b int) float64 { return l.h[a*(l.n+1)+b] }

// legHours is the travel time between two positions: half the distance over
// the ground of each end at the rig's speed there. It is symmetric.
func legHours(ax, ay, bx, by, speedA, speedB float64) float64 {
	d := math.Hypot(bx-ax, by-ay)
	return d/2/speedA + d/2/speedB
}

func newLegs(rig *RigSpec, jobs []*Job) *legs {
	n := len(jobs)
	l := &legs{n: n, h: make([]float64, (n+1)*(n+1))}
	for a := 1; a <= n; a++ {
		ja := jobs[a-1]
		sa := rig.SpeedFtPerHr[ja.Surface]
		if rig.Entrance != nil {
			// The whole entrance leg is taken at the point's ground: the
			// entrance is a gate on a road, not a survey of the ground.
			v := legHours(rig.Entrance.XFt, rig.Entrance.YFt, ja.X, ja.Y, sa, sa)
			l.h[a] = v
			l.h[a*(n+1)] = v
		}
		for b := a + 1; b <= n; b++ {
			jb := jobs[b-1]
			v := legHours(ja.X, ja.Y, jb.X, jb.Y, sa, rig.SpeedFtPerHr[jb.Surface])
			l.h[a*(n+1)+b] = v
			l.h[b*(n+1)+a] = v
		}
	}
	return l
}

// pathHours is the cost of visiting nodes in order from node 0.
func (l *legs) pathHours(order []int) float64 {
	s, prev := 0.0, 0
	for _, v := range order {
		s += l.at(prev, v)
		prev = v
	}
	return s
}

// route returns the visiting order of nodes 1..n (as node numbers).
func (l *legs) route() []int {
	if l.n <= ExactRouteMax {
		return l.heldKarp()
	}
	return l.heuristic()
}

// heuristic is iterated local search (Lourenço, Martin & Stützle 2003,
// "Iterated local search", Handbook of Metaheuristics, ch. 11): local search
// from the nearest-neighbour path, then repeated double-bridge kicks (Martin,
// Otto & Felten 1991, Complex Systems 5:299–326) each followed by local
// search, keeping the best path. Kicks come from a PCG stream fixed by the
// number of points, so the route is deterministic.
func (l *legs) heuristic() []int {
	best := l.localSearch(l.nearestNeighbour())
	n := len(best)
	if n < 4 {
		return best
	}
	bestCost := l.pathHours(best)
	rng := rand.New(rand.NewPCG(0x7269676d6978, uint64(n)))
	kicks := min(20*n, 400, ilsBudget/(70*n*n))
	for k := 0; k < kicks; k++ {
		// Cut into A B C D at 0 < a < b < c < n and join as A C B D.
		a := 1 + rng.IntN(n-2)
		b := a + 1 + rng.IntN(n-a-1)
		c := b + rng.IntN(n-b+1)
		if c == b {
			c = n
		}
		cand := make([]int, 0, n)
		cand = append(cand, best[:a]...)
		cand = append(cand, best[b:c]...)
		cand = append(cand, best[a:b]...)
		cand = append(cand, best[c:]...)
		cand = l.localSearch(cand)
		if cc := l.pathHours(cand); cc < bestCost-gainEps {
			best, bestCost = cand, cc
		}
	}
	return best
}

// heldKarp finds the shortest open path from node 0 through all points.
// dp[S][j] is the least cost of a path from node 0 through the points of S
// ending at j ∈ S (Held & Karp 1962).
func (l *legs) heldKarp() []int {
	n := l.n
	if n == 0 {
		return nil
	}
	full := 1<<n - 1
	dp := make([]float64, (full+1)*n)
	par := make([]int8, (full+1)*n)
	for i := range dp {
		dp[i] = math.Inf(1)
	}
	for j := 0; j < n; j++ {
		dp[(1<<j)*n+j] = l.at(0, j+1)
		par[(1<<j)*n+j] = -1
	}
	for S := 1; S <= full; S++ {
		for j := 0; j < n; j++ {
			if S&(1<<j) == 0 {
				continue
			}
			c := dp[S*n+j]
			if math.IsInf(c, 1) {
				continue
			}
			for k := 0; k < n; k++ {
				if S&(1<<k) != 0 {
					continue
				}
				T := S | 1<<k
				if v := c + l.at(j+1, k+1); v < dp[T*n+k] {
					dp[T*n+k] = v
					par[T*n+k] = int8(j)
				}
			}
		}
	}
	best, end := math.Inf(1), 0
	for j := 0; j < n; j++ {
		if dp[full*n+j] < best {
			best, end = dp[full*n+j], j
		}
	}
	order := make([]int, n)
	S := full
	for i := n - 1; i >= 0; i-- {
		order[i] = end + 1
		p := int(par[S*n+end])
		S &^= 1 << end
		end = p
	}
	return order
}

// nearestNeighbour starts at node 0 and always goes to the nearest point not
// yet visited; ties go to the earlier point, so the result is deterministic.
func (l *legs) nearestNeighbour() []int {
	n := l.n
	used := make([]bool, n+1)
	order := make([]int, 0, n)
	cur := 0
	for len(order) < n {
		best, bv := -1, math.Inf(1)
		for v := 1; v <= n; v++ {
			if !used[v] && l.at(cur, v) < bv {
				best, bv = v, l.at(cur, v)
			}
		}
		used[best] = true
		order = append(order, best)
		cur = best
	}
	return order
}

// localSearch improves an open path with 2-opt and Or-opt moves until
// neither gains. Node 0 stays first; the last point is free.
func (l *legs) localSearch(order []int) []int {
	p := append([]int{0}, order...) // p[0] is the start
	for l.twoOpt(p) || l.orOpt(p) {
	}
	return p[1:]
}

// twoOpt reverses p[i..j] when that shortens the path (first improvement).
// With an open end, reversing a suffix (j = last) replaces one edge only.
func (l *legs) twoOpt(p []int) bool {
	m := len(p) - 1
	improved := false
	for i := 1; i < m; i++ {
		for j := i + 1; j <= m; j++ {
			before := l.at(p[i-1], p[i])
			after := l.at(p[i-1], p[j])
			if j < m {
				before += l.at(p[j], p[j+1])
				after += l.at(p[i], p[j+1])
			}
			if after < before-gainEps {
				reverse(p[i : j+1])
				improved = true
			}
		}
	}
	return improved
}

// orOpt moves a run of 1 to 3 consecutive points, kept in order or reversed,
// to the best other place in the path when that shortens it.
func (l *legs) orOpt(p []int) bool {
	m := len(p) - 1
	improved := false
	for k := 1; k <= 3 && k < m; k++ {
		for i := 1; i+k-1 <= m; i++ {
			j := i + k - 1 // run is p[i..j]
			// Cost removed by taking the run out and joining its neighbours.
			out := l.at(p[i-1], p[i])
			join := 0.0
			if j < m {
				out += l.at(p[j], p[j+1])
				join = l.at(p[i-1], p[j+1])
			}
			removeGain := out - join
			bestGain, bestPos, bestRev := gainEps, -1, false
			// Insert between q and q+1 (q+1 may be past the end), q outside the run.
			for q := 0; q <= m; q++ {
				if q >= i-1 && q <= j {
					continue
				}
				a := p[q]
				for _, rev := range []bool{false, true} {
					first, last := p[i], p[j]
					if rev {
						first, last = last, first
					}
					add := l.at(a, first)
					if q < m {
						b := p[q+1]
						add += l.at(last, b) - l.at(a, b)
					}
					if g := removeGain - add; g > bestGain {
						bestGain, bestPos, bestRev = g, q, rev
					}
				}
			}
			if bestPos < 0 {
				continue
			}
			run := append([]int(nil), p[i:j+1]...)
			if bestRev {
				reverse(run)
			}
			rest := append(append([]int(nil), p[:i]...), p[j+1:]...)
			q := bestPos
			if q > j {
				q -= k
			}
			np := append(append(append([]int(nil), rest[:q+1]...), run...), rest[q+1:]...)
			copy(p, np)
			improved = true
		}
	}
	return improved
}

func reverse(s []int) {
	for a, b := 0, len(s)-1; a < b; a, b = a+1, b-1 {
		s[a], s[b] = s[b], s[a]
	}
}

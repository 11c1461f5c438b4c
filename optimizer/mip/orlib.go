package mip

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
)

// ReadORLibSetCover reads a set-covering instance in the format of
// OR-Library (Beasley 1990, "OR-Library: distributing test problems by
// electronic mail", J. Oper. Res. Soc. 41:1069–1072): m and n, the n
// column costs, then for each row the number of columns covering it
// followed by those columns (1-based), all whitespace separated and
// wrapped across lines freely. The result is
//
//	minimize Σ c_j x_j  subject to  Σ_{j covers i} x_j ≥ 1,  x_j ∈ {0,1}.
func ReadORLibSetCover(r io.Reader) (*Problem, error) {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 64*1024), 16*1024*1024)
	sc.Split(bufio.ScanWords)
	count := 0
	next := func(what string) (int, error) {
		if !sc.Scan() {
			if err := sc.Err(); err != nil {
				return 0, err
			}
			return 0, fmt.Errorf("mip: set-cover data ends early: want %s (after %d numbers)", what, count)
		}
		count++
		v, err := strconv.Atoi(sc.Text())
		if err != nil {
			return 0, fmt.Errorf("mip: set-cover number %d (%s) is %q, not an integer", count, what, sc.Text())
		}
		return v, nil
	}
	m, err := next("row count m")
	if err != nil {
		return nil, err
	}
	n, err := next("column count n")
	if err != nil {
		return nil, err
	}
	if m < 0 || n < 0 || m > 1<<24 || n > 1<<24 {
		return nil, fmt.Errorf("mip: set-cover size %d × %d is out of range", m, n)
	}
	cost := make([]float64, n)
	for j := range cost {
		c, err := next(fmt.Sprintf("cost of column %d", j+1))
		if err != nil {
			return nil, err
		}
		cost[j] = float64(c)
	}
	cols := make([][]int, n)
	for i := 0; i < m; i++ {
		k, err := next(fmt.Sprintf("column count of row %d", i+1))
		if err != nil {
			return nil, err
		}
		if k < 0 || k > n {
			return nil, fmt.Errorf("mip: set-cover row %d has %d columns; want 0..%d", i+1, k, n)
		}
		for t := 0; t < k; t++ {
			j, err := next(fmt.Sprintf("column %d of row %d", t+1, i+1))
			if err != nil {
				return nil, err
			}
			if j < 1 || j > n {
				return nil, fmt.Errorf("mip: set-cover row %d names column %d; want 1..%d", i+1, j, n)
			}
			if l := len(cols[j-1]); l > 0 && cols[j-1][l-1] == i {
				continue // repeated column in one row
			}
			cols[j-1] = append(cols[j-1], i)
		}
	}
	rows := make([][]int, n)
	for j := range cols {
		rows[j] = cols[j]
		sort.Ints(rows[j])
	}
	return SetCover(cost, rows), nil
}

// SetCover builds the set-covering problem with the given column costs,
// where colRows[j] lists the rows that column j covers (0-based, sorted,
// no repeats).
func SetCover(cost []float64, colRows [][]int) *Problem {
	m := 0
	for _, rs := range colRows {
		for _, i := range rs {
			if i+1 > m {
				m = i + 1
			}
		}
	}
	return SetCoverRows(m, cost, colRows)
}

// SetCoverRows is SetCover with an explicit row count m (rows nobody
// covers make the problem infeasible).
func SetCoverRows(m int, cost []float64, colRows [][]int) *Problem {
	n := len(cost)
	p := &Problem{Integer: make([]bool, n)}
	q := &p.LP
	q.NumRows, q.NumCols = m, n
	q.Obj = append([]float64(nil), cost...)
	q.ColLo = make([]float64, n)
	q.ColUp = make([]float64, n)
	q.RowLo = make([]float64, m)
	q.RowUp = make([]float64, m)
	q.ColStart = make([]int, n+1)
	for j := 0; j < n; j++ {
		q.ColUp[j] = 1
		p.Integer[j] = true
		for _, i := range colRows[j] {
			q.RowIndex = append(q.RowIndex, i)
			q.Value = append(q.Value, 1)
		}
		q.ColStart[j+1] = len(q.RowIndex)
	}
	for i := 0; i < m; i++ {
		q.RowLo[i], q.RowUp[i] = 1, math.Inf(1)
	}
	return p
}

package mip

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"unicode"

	"github.com/rigmix/rigmix/optimizer/lp"
)

// ReadMPS reads a linear or mixed-integer program in free MPS format, the
// column-oriented format introduced with IBM's MPS/360 and documented for
// free (whitespace-separated) form in the CPLEX and GLPK manuals (GLPK
// reference manual, appendix "MPS format"). Supported sections: NAME,
// OBJSENSE (MIN or MAX, on the same or the next line), ROWS (N, L, G, E),
// COLUMNS with MARKER INTORG/INTEND blocks, RHS, RANGES, BOUNDS (UP, LO, FX,
// FR, MI, PL, BV, LI, UI) and ENDATA. Lines starting with '*' are comments.
//
// Conventions, as in CPLEX, CBC and GLPK:
//   - the first N row is the objective; a right-hand side given for it is
//     the objective constant with opposite sign (ObjOffset = -rhs, the
//     CPLEX and CBC reading; GLPK 5.0 reads +rhs); a column named
//     RIGMIX_OBJ_CONSTANT fixed at 1 with no matrix entries, as WriteMPS
//     writes the constant, is folded into ObjOffset; further
//     N rows are kept as free rows (both bounds infinite) so that a
//     problem written by WriteMPS reads back with the same rows;
//   - a column has bounds [0, +∞) unless BOUNDS says otherwise, integer
//     columns from MARKER blocks too; UP with a negative value on a column
//     whose lower bound is still the default 0 makes the lower bound -∞;
//   - RANGES R on an E row gives [rhs, rhs+|R|] when R > 0 and [rhs+R, rhs]
//     when R < 0; on an L row [rhs-|R|, rhs]; on a G row [rhs, rhs+|R|].
//
// Numbers, infinities and ranges, as CPLEX, CBC and HiGHS read them:
//   - a bound, right-hand side or range of magnitude lp.Infinity (1e20) or
//     more is infinite: UP 1e30 is no upper bound, an L row with RHS 1e30
//     is free, a range of 1e30 leaves that side of the row open; one that
//     leaves no feasible value (LO 1e30, an E row with RHS 1e30) is an
//     error. Finite bounds, right-hand sides and ranges must be at most
//     lp.MaxFinite (1e15) in magnitude;
//   - a coefficient (matrix or objective) must be zero or between MinCoef
//     (1e-15) and lp.MaxFinite (1e15) in magnitude; others are refused
//     with the row and column named, since the simplex tolerances (about
//     1e-9) cannot tell such values apart and the optimum would be wrong;
//   - numbers are MPS numbers only: [sign] digits [. digits] [e|E [sign]
//     digits], or Inf / Infinity in any case with an optional sign
//     (read as infinite, like 1e30); hexadecimal, digit separators (1_0)
//     and NaN are refused.
//
// Lexical details: a UTF-8 byte-order mark at the start is skipped;
// everything after ENDATA is ignored (MIPLIB's IMPORTANCES sections, for
// instance); a field starting with '$' begins a comment that runs to the
// end of its line, as in free MPS written by CPLEX or CBC (so names must
// not start with '$'). Features this engine does not solve are refused
// by name: SC and SI bounds (semi-continuous, semi-integer), the
// quadratic sections QUADOBJ, QMATRIX, QSECTION and QCMATRIX, SOS,
// INDICATORS and CSECTION.
//
// The result always minimizes: with OBJSENSE MAX the objective and its
// constant are negated and Problem.Maximize is set, so the optimal value
// read back is the negative of the maximum and Problem.Sense turns it
// back. Errors name the line number and what is wrong.
func ReadMPS(r io.Reader) (*Problem, error) {
	rd := &mpsReader{
		rowIndex: map[string]int{},
		colIndex: map[string]int{},
		objRow:   -1,
	}
	if err := rd.read(r); err != nil {
		return nil, err
	}
	return rd.problem()
}

type mpsCol struct {
	name    string
	integer bool
	obj     float64
	rows    []int
	vals    []float64
	lo, up  float64
	loSet   bool
	upSet   bool
}

type mpsReader struct {
	name     string
	maximize bool

	objName  string
	objRow   int // -1 until the first N row; objective is not in rowNames
	rowNames []string
	rowType  []byte
	rowIndex map[string]int // name → row (objective: -2)
	rhs      []float64
	rng      []float64
	rngSet   []bool
	objRHS   float64

	cols     []*mpsCol
	colIndex map[string]int
	// entries seen per column, to reject a row given twice for one column
	seen map[[2]int]bool

	inInt   bool
	ended   bool
	section string
	line    int
}

func (rd *mpsReader) errf(format string, args ...any) error {
	return fmt.Errorf("mip: MPS line %d: %s", rd.line, fmt.Sprintf(format, args...))
}

func (rd *mpsReader) read(r io.Reader) error {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 64*1024), 16*1024*1024)
	rd.seen = map[[2]int]bool{}
	for sc.Scan() {
		rd.line++
		raw := sc.Text()
		if rd.line == 1 {
			raw = strings.TrimPrefix(raw, "\uFEFF") // a UTF-8 byte-order mark
		}
		if len(raw) == 0 || raw[0] == '*' {
			continue
		}
		fields := strings.Fields(raw)
		// A field starting with '$' begins a comment that runs to the end
		// of the line (free MPS as CPLEX and CBC write it).
		for k, f := range fields {
			if f[0] == '$' {
				fields = fields[:k]
				break
			}
		}
		if len(fields) == 0 {
			continue
		}
		if !unicode.IsSpace(rune(raw[0])) {
			// A section header starts in the first column.
			if err := rd.header(fields); err != nil {
				return err
			}
			if rd.ended {
				// Anything after ENDATA (an IMPORTANCES section, notes)
				// is ignored, as other readers do.
				break
			}
			continue
		}
		if err := rd.data(fields); err != nil {
			return err
		}
	}
	if err := sc.Err(); err != nil {
		return fmt.Errorf("mip: MPS line %d: %w", rd.line+1, err)
	}
	if !rd.ended {
		return fmt.Errorf("mip: MPS: no ENDATA line at the end (read %d lines)", rd.line)
	}
	return nil
}

func (rd *mpsReader) header(f []string) error {
	key := strings.ToUpper(f[0])
	switch key {
	case "NAME":
		if len(f) > 1 {
			rd.name = strings.Join(f[1:], " ")
		}
	case "OBJSENSE":
		if len(f) > 1 {
			return rd.sense(f[1])
		}
	case "ROWS", "COLUMNS", "RHS", "RANGES", "BOUNDS":
		if len(f) > 1 {
			return rd.errf("section header %s takes no arguments, got %q", key, strings.Join(f[1:], " "))
		}
	case "ENDATA":
		rd.ended = true
	case "SOS":
		return rd.errf("section SOS: special ordered sets are not supported (rigmix solves linear MIPs only)")
	case "QUADOBJ", "QMATRIX", "QSECTION", "QCMATRIX":
		return rd.errf("section %s: quadratic objectives and constraints are not supported (rigmix solves linear MIPs only)", key)
	case "INDICATORS":
		return rd.errf("section INDICATORS: indicator constraints are not supported (rigmix solves linear MIPs only)")
	case "CSECTION":
		return rd.errf("section CSECTION: conic constraints are not supported (rigmix solves linear MIPs only)")
	case "OBJSENSE:", "OBJNAME", "OBJSENCE":
		return rd.errf("section %s is not supported", key)
	default:
		return rd.errf("unknown section header %q (want NAME, OBJSENSE, ROWS, COLUMNS, RHS, RANGES, BOUNDS or ENDATA; data lines must start with a space)", f[0])
	}
	if key == "COLUMNS" && rd.objRow < 0 && rd.objName == "" {
		return rd.errf("COLUMNS before any N (objective) row in ROWS")
	}
	rd.section = key
	return nil
}

func (rd *mpsReader) sense(s string) error {
	switch strings.ToUpper(s) {
	case "MAX", "MAXIMIZE":
		rd.maximize = true
	case "MIN", "MINIMIZE":
		rd.maximize = false
	default:
		return rd.errf("OBJSENSE %q: want MAX or MIN", s)
	}
	return nil
}

func (rd *mpsReader) number(s, what string) (float64, error) {
	v, ok := parseMPSNumber(s)
	if !ok {
		return 0, rd.errf("%s %q is not a number (want digits with an optional sign, decimal point and exponent, such as -1.5e3, or Inf)", what, s)
	}
	return v, nil
}

// parseMPSNumber reads a number as MPS writes them: an optional sign,
// digits with an optional decimal point (at least one digit), and an
// optional exponent e or E with an optional sign and digits; or, as
// CPLEX, CBC and HiGHS also read (from memory), Inf or Infinity in any
// case with an optional sign. Go's other forms (hexadecimal, digit
// separators "1_0", NaN) are refused.
func parseMPSNumber(s string) (float64, bool) {
	t := s
	if t != "" && (t[0] == '+' || t[0] == '-') {
		t = t[1:]
	}
	if strings.EqualFold(t, "inf") || strings.EqualFold(t, "infinity") {
		if s[0] == '-' {
			return math.Inf(-1), true
		}
		return math.Inf(1), true
	}
	k, digits := 0, 0
	for k < len(t) && t[k] >= '0' && t[k] <= '9' {
		k, digits = k+1, digits+1
	}
	if k < len(t) && t[k] == '.' {
		k++
		for k < len(t) && t[k] >= '0' && t[k] <= '9' {
			k, digits = k+1, digits+1
		}
	}
	if digits == 0 {
		return 0, false
	}
	if k < len(t) && (t[k] == 'e' || t[k] == 'E') {
		k++
		if k < len(t) && (t[k] == '+' || t[k] == '-') {
			k++
		}
		e := k
		for k < len(t) && t[k] >= '0' && t[k] <= '9' {
			k++
		}
		if k == e {
			return 0, false
		}
	}
	if k != len(t) {
		return 0, false
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil && !math.IsInf(v, 0) {
		return 0, false
	}
	// Overflow (1e999) is infinite, as the magnitude says.
	return v, true
}

// bound reads a bound, right-hand side or range value: magnitudes of
// lp.Infinity and beyond are infinite; finite ones must be at most
// lp.MaxFinite.
func (rd *mpsReader) bound(s, what string) (float64, error) {
	v, err := rd.number(s, what)
	if err != nil {
		return 0, err
	}
	v = lp.NormBound(v)
	if !math.IsInf(v, 0) && math.Abs(v) > lp.MaxFinite {
		return 0, rd.errf("%s is %s: finite values must be at most %g in magnitude; write %g or more for no bound, or rescale the model", what, s, lp.MaxFinite, lp.Infinity)
	}
	return v, nil
}

// coefficient reads a matrix or objective coefficient: its magnitude must
// lie in [MinCoef, lp.MaxFinite] unless it is zero.
func (rd *mpsReader) coefficient(s, what string) (float64, error) {
	v, err := rd.number(s, what)
	if err != nil {
		return 0, err
	}
	if a := math.Abs(v); a > lp.MaxFinite || (a != 0 && a < MinCoef) {
		return 0, rd.errf("%s is %s: coefficients must be zero or between %g and %g in magnitude; rescale the row or column", what, s, MinCoef, lp.MaxFinite)
	}
	return v, nil
}

// MinCoef is the smallest magnitude of a nonzero coefficient ReadMPS
// accepts. Below it a coefficient is lost in the solver's tolerances
// (about 1e-9): rather than drop it silently, the file is refused.
const MinCoef = 1e-15

func (rd *mpsReader) data(f []string) error {
	switch rd.section {
	case "OBJSENSE":
		return rd.sense(f[0])
	case "ROWS":
		return rd.rowLine(f)
	case "COLUMNS":
		return rd.columnLine(f)
	case "RHS":
		return rd.pairs(f, "RHS", rd.setRHS)
	case "RANGES":
		return rd.pairs(f, "RANGES", rd.setRange)
	case "BOUNDS":
		return rd.boundLine(f)
	case "":
		return rd.errf("data line before any section header")
	}
	return rd.errf("data line in section %s", rd.section)
}

func (rd *mpsReader) rowLine(f []string) error {
	if len(f) != 2 {
		return rd.errf("ROWS line wants a type and a name, got %d fields", len(f))
	}
	t := strings.ToUpper(f[0])
	name := f[1]
	if _, dup := rd.rowIndex[name]; dup || name == rd.objName {
		return rd.errf("row %q is defined twice", name)
	}
	switch t {
	case "N":
		if rd.objName == "" {
			rd.objName = name
			rd.rowIndex[name] = -2
			rd.objRow = 0
			return nil
		}
	case "L", "G", "E":
	default:
		return rd.errf("row %q has type %q; want N, L, G or E", name, f[0])
	}
	rd.rowIndex[name] = len(rd.rowNames)
	rd.rowNames = append(rd.rowNames, name)
	rd.rowType = append(rd.rowType, t[0])
	rd.rhs = append(rd.rhs, 0)
	rd.rng = append(rd.rng, 0)
	rd.rngSet = append(rd.rngSet, false)
	return nil
}

func (rd *mpsReader) columnLine(f []string) error {
	if len(f) == 3 && strings.EqualFold(f[1], "'MARKER'") {
		switch strings.ToUpper(f[2]) {
		case "'INTORG'":
			rd.inInt = true
		case "'INTEND'":
			rd.inInt = false
		default:
			return rd.errf("MARKER %q: want 'INTORG' or 'INTEND'", f[2])
		}
		return nil
	}
	if len(f) != 3 && len(f) != 5 {
		return rd.errf("COLUMNS line wants column, row, value [, row, value], got %d fields", len(f))
	}
	name := f[0]
	j, ok := rd.colIndex[name]
	if !ok {
		j = len(rd.cols)
		rd.colIndex[name] = j
		rd.cols = append(rd.cols, &mpsCol{name: name, integer: rd.inInt, up: math.Inf(1)})
	} else if j != len(rd.cols)-1 {
		return rd.errf("column %q appears again after other columns; its entries must be contiguous", name)
	}
	c := rd.cols[j]
	for k := 1; k+1 < len(f); k += 2 {
		i, ok := rd.rowIndex[f[k]]
		if !ok {
			return rd.errf("column %q names row %q, which ROWS does not define", name, f[k])
		}
		v, err := rd.coefficient(f[k+1], fmt.Sprintf("coefficient of column %q in row %q", name, f[k]))
		if err != nil {
			return err
		}
		key := [2]int{j, i}
		if rd.seen[key] {
			return rd.errf("column %q has row %q twice", name, f[k])
		}
		rd.seen[key] = true
		if i == -2 {
			c.obj = v
			continue
		}
		c.rows = append(c.rows, i)
		c.vals = append(c.vals, v)
	}
	return nil
}

// pairs handles "[setname] row value [row value]" lines of RHS and RANGES;
// the set name is optional in free MPS.
func (rd *mpsReader) pairs(f []string, sec string, set func(row string, v float64) error) error {
	switch len(f) {
	case 2, 4:
	case 3, 5:
		f = f[1:]
	default:
		return rd.errf("%s line wants [set] row value [row value], got %d fields", sec, len(f))
	}
	for k := 0; k+1 < len(f); k += 2 {
		v, err := rd.bound(f[k+1], fmt.Sprintf("%s value for row %q", sec, f[k]))
		if err != nil {
			return err
		}
		if err := set(f[k], v); err != nil {
			return err
		}
	}
	return nil
}

func (rd *mpsReader) setRHS(row string, v float64) error {
	i, ok := rd.rowIndex[row]
	if !ok {
		return rd.errf("RHS names row %q, which ROWS does not define", row)
	}
	if i == -2 {
		if math.IsInf(v, 0) {
			return rd.errf("RHS of the objective row %q (the objective constant) is infinite", row)
		}
		rd.objRHS = v
		return nil
	}
	rd.rhs[i] = v
	return nil
}

func (rd *mpsReader) setRange(row string, v float64) error {
	i, ok := rd.rowIndex[row]
	if !ok {
		return rd.errf("RANGES names row %q, which ROWS does not define", row)
	}
	if i == -2 || rd.rowType[i] == 'N' {
		return rd.errf("RANGES on the free row %q", row)
	}
	rd.rng[i] = v
	rd.rngSet[i] = true
	return nil
}

func (rd *mpsReader) boundLine(f []string) error {
	t := strings.ToUpper(f[0])
	needValue := true
	switch t {
	case "FR", "MI", "PL", "BV":
		needValue = false
	case "UP", "LO", "FX", "LI", "UI":
	case "SC":
		return rd.errf("bound type SC: semi-continuous bounds are not supported")
	case "SI":
		return rd.errf("bound type SI: semi-integer bounds are not supported")
	default:
		return rd.errf("bound type %q; want UP, LO, FX, FR, MI, PL, BV, LI or UI", f[0])
	}
	// Forms: type [set] column [value]
	var colName, valStr string
	switch {
	case needValue && len(f) == 4:
		colName, valStr = f[2], f[3]
	case needValue && len(f) == 3:
		colName, valStr = f[1], f[2]
	case !needValue && (len(f) == 3 || len(f) == 4):
		// A value after FR/MI/PL/BV is tolerated and ignored, as CBC does.
		colName = f[2]
		if len(f) == 3 {
			if _, ok := rd.colIndex[f[2]]; !ok {
				if _, ok := rd.colIndex[f[1]]; ok {
					colName = f[1]
				}
			}
		}
	case !needValue && len(f) == 2:
		colName = f[1]
	default:
		return rd.errf("BOUNDS %s line has %d fields; want type [set] column%s", t, len(f), map[bool]string{true: " value", false: ""}[needValue])
	}
	j, ok := rd.colIndex[colName]
	if !ok {
		return rd.errf("BOUNDS names column %q, which COLUMNS does not define", colName)
	}
	c := rd.cols[j]
	var v float64
	if needValue {
		var err error
		v, err = rd.bound(valStr, fmt.Sprintf("%s bound of column %q", t, colName))
		if err != nil {
			return err
		}
	}
	switch t {
	case "UP", "UI":
		c.up, c.upSet = v, true
		if v < 0 && !c.loSet && c.lo == 0 {
			c.lo = math.Inf(-1)
		}
		if t == "UI" {
			c.integer = true
		}
	case "LO", "LI":
		c.lo, c.loSet = v, true
		if t == "LI" {
			c.integer = true
		}
	case "FX":
		c.lo, c.up, c.loSet, c.upSet = v, v, true, true
	case "FR":
		c.lo, c.up, c.loSet, c.upSet = math.Inf(-1), math.Inf(1), true, true
	case "MI":
		c.lo, c.loSet = math.Inf(-1), true
	case "PL":
		c.up, c.upSet = math.Inf(1), true
	case "BV":
		c.lo, c.up, c.loSet, c.upSet, c.integer = 0, 1, true, true, true
	}
	if c.lo == math.Inf(1) || c.up == math.Inf(-1) {
		return rd.errf("BOUNDS %s %s gives column %q a lower bound of +∞ or an upper bound of -∞ (±%g and beyond count as infinite), which no value meets", t, valStr, colName, lp.Infinity)
	}
	return nil
}

func (rd *mpsReader) problem() (*Problem, error) {
	if rd.objName == "" {
		return nil, fmt.Errorf("mip: MPS: ROWS defines no N (objective) row")
	}
	m, n := len(rd.rowNames), len(rd.cols)
	p := &Problem{Name: rd.name, ObjOffset: -rd.objRHS}
	q := &p.LP
	q.NumRows, q.NumCols = m, n
	q.Obj = make([]float64, n)
	q.ColLo = make([]float64, n)
	q.ColUp = make([]float64, n)
	q.RowLo = make([]float64, m)
	q.RowUp = make([]float64, m)
	q.ColStart = make([]int, n+1)
	p.Integer = make([]bool, n)
	p.ColNames = make([]string, n)
	p.RowNames = append([]string(nil), rd.rowNames...)
	for i := 0; i < m; i++ {
		b, r := rd.rhs[i], rd.rng[i]
		lo, up := math.Inf(-1), math.Inf(1)
		switch rd.rowType[i] {
		case 'L':
			up = b
			if rd.rngSet[i] {
				lo = b - math.Abs(r)
			}
		case 'G':
			lo = b
			if rd.rngSet[i] {
				up = b + math.Abs(r)
			}
		case 'E':
			lo, up = b, b
			if rd.rngSet[i] {
				if r > 0 {
					up = b + r
				} else {
					lo = b + r
				}
			}
		}
		// Infinite right-hand sides and ranges (±lp.Infinity and
		// beyond) leave that side of the row free; one that leaves no
		// value is an error.
		lo, up = lp.NormBound(lo), lp.NormBound(up)
		if math.IsNaN(lo) || math.IsNaN(up) || math.IsInf(lo, 1) || math.IsInf(up, -1) {
			return nil, fmt.Errorf("mip: MPS: row %q (type %c) with right-hand side %g and range %g has no feasible value: an infinite right-hand side (±%g and beyond) is only meaningful as +∞ on an L row or -∞ on a G row", rd.rowNames[i], rd.rowType[i], b, r, lp.Infinity)
		}
		q.RowLo[i], q.RowUp[i] = lo, up
	}
	// Fold the objective-constant column written by WriteMPS back into
	// ObjOffset: named objConstCol, fixed at 1, no matrix entries.
	if j, ok := rd.colIndex[objConstCol]; ok {
		if c := rd.cols[j]; len(c.rows) == 0 && c.lo == 1 && c.up == 1 && !c.integer {
			p.ObjOffset += c.obj
			rd.cols = append(rd.cols[:j:j], rd.cols[j+1:]...)
			n--
			q.NumCols = n
			q.Obj, q.ColLo, q.ColUp = q.Obj[:n], q.ColLo[:n], q.ColUp[:n]
			q.ColStart, p.Integer, p.ColNames = q.ColStart[:n+1], p.Integer[:n], p.ColNames[:n]
		}
	}
	for j, c := range rd.cols {
		q.Obj[j] = c.obj
		q.ColLo[j], q.ColUp[j] = c.lo, c.up
		p.Integer[j] = c.integer
		p.ColNames[j] = c.name
		if c.lo > c.up {
			return nil, fmt.Errorf("mip: MPS: column %q has lower bound %g above its upper bound %g", c.name, c.lo, c.up)
		}
		// Sort each column's entries by row for a canonical layout.
		idx := make([]int, len(c.rows))
		for k := range idx {
			idx[k] = k
		}
		sort.Slice(idx, func(a, b int) bool { return c.rows[idx[a]] < c.rows[idx[b]] })
		for _, k := range idx {
			q.RowIndex = append(q.RowIndex, c.rows[k])
			q.Value = append(q.Value, c.vals[k])
		}
		q.ColStart[j+1] = len(q.RowIndex)
	}
	if rd.maximize {
		for j := range q.Obj {
			q.Obj[j] = -q.Obj[j]
		}
		p.ObjOffset = -p.ObjOffset
		p.Maximize = true
	}
	return p, nil
}

// WriteMPS writes p in free MPS format that CBC and GLPK (glpsol
// --freemps) read back. The output is deterministic. Bounds are always
// written explicitly for integer columns (readers differ on the default
// upper bound of a MARKER integer column). Names are taken from p when they
// are all present, non-empty, free of white space and unique; otherwise
// generated names C1..Cn and R1..Rm are used for all columns or rows.
// A nonzero ObjOffset is written as a column named objConstCol, fixed at
// 1, whose objective coefficient is the offset: CBC reads a right-hand
// side on the objective row as minus the constant (the CPLEX convention)
// while GLPK 5.0 reads it as plus the constant, so a fixed column is the
// only form both read alike. ReadMPS folds that column back into
// ObjOffset.
func WriteMPS(w io.Writer, p *Problem) error {
	if err := p.Validate(); err != nil {
		return err
	}
	q := &p.LP
	colNames := mpsNames(p.ColNames, q.NumCols, "C")
	rowNames := mpsNames(p.RowNames, q.NumRows, "R")
	objName := "OBJ"
	used := map[string]bool{}
	for _, s := range rowNames {
		used[s] = true
	}
	for k := 1; used[objName]; k++ {
		objName = "OBJ" + strconv.Itoa(k)
	}
	name := strings.Join(strings.Fields(p.Name), "_")
	if name == "" {
		name = "rigmix"
	}
	bw := bufio.NewWriter(w)
	num := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	fmt.Fprintf(bw, "NAME %s\nROWS\n  N  %s\n", name, objName)
	for i := 0; i < q.NumRows; i++ {
		lo, up := q.RowLo[i], q.RowUp[i]
		t := "G"
		switch {
		case math.IsInf(lo, -1) && math.IsInf(up, 1):
			t = "N"
		case lo == up:
			t = "E"
		case math.IsInf(lo, -1):
			t = "L"
		}
		fmt.Fprintf(bw, "  %s  %s\n", t, rowNames[i])
	}
	bw.WriteString("COLUMNS\n")
	inInt := false
	marker := 0
	for j := 0; j < q.NumCols; j++ {
		if p.Integer[j] != inInt {
			if p.Integer[j] {
				fmt.Fprintf(bw, "  MARKER%d  'MARKER'  'INTORG'\n", marker)
			} else {
				fmt.Fprintf(bw, "  MARKER%d  'MARKER'  'INTEND'\n", marker)
			}
			marker++
			inInt = p.Integer[j]
		}
		if q.Obj[j] != 0 || q.ColStart[j] == q.ColStart[j+1] {
			fmt.Fprintf(bw, "  %s  %s  %s\n", colNames[j], objName, num(q.Obj[j]))
		}
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			fmt.Fprintf(bw, "  %s  %s  %s\n", colNames[j], rowNames[q.RowIndex[k]], num(q.Value[k]))
		}
	}
	if inInt {
		fmt.Fprintf(bw, "  MARKER%d  'MARKER'  'INTEND'\n", marker)
	}
	if p.ObjOffset != 0 {
		fmt.Fprintf(bw, "  %s  %s  %s\n", objConstCol, objName, num(p.ObjOffset))
	}
	bw.WriteString("RHS\n")
	for i := 0; i < q.NumRows; i++ {
		lo, up := q.RowLo[i], q.RowUp[i]
		var b float64
		switch {
		case math.IsInf(lo, -1) && math.IsInf(up, 1):
			continue
		case math.IsInf(lo, -1):
			b = up
		default:
			b = lo
		}
		if b != 0 {
			fmt.Fprintf(bw, "  RHS  %s  %s\n", rowNames[i], num(b))
		}
	}
	wroteRanges := false
	for i := 0; i < q.NumRows; i++ {
		lo, up := q.RowLo[i], q.RowUp[i]
		if math.IsInf(lo, 0) || math.IsInf(up, 0) || lo == up {
			continue
		}
		if !wroteRanges {
			bw.WriteString("RANGES\n")
			wroteRanges = true
		}
		fmt.Fprintf(bw, "  RNG  %s  %s\n", rowNames[i], num(up-lo))
	}
	bw.WriteString("BOUNDS\n")
	for j := 0; j < q.NumCols; j++ {
		lo, up := q.ColLo[j], q.ColUp[j]
		c := colNames[j]
		switch {
		case lo == up:
			fmt.Fprintf(bw, "  FX  BND  %s  %s\n", c, num(lo))
			continue
		case math.IsInf(lo, -1) && math.IsInf(up, 1):
			fmt.Fprintf(bw, "  FR  BND  %s\n", c)
			continue
		}
		if math.IsInf(lo, -1) {
			fmt.Fprintf(bw, "  MI  BND  %s\n", c)
		} else if lo != 0 || p.Integer[j] {
			fmt.Fprintf(bw, "  LO  BND  %s  %s\n", c, num(lo))
		}
		if !math.IsInf(up, 1) {
			fmt.Fprintf(bw, "  UP  BND  %s  %s\n", c, num(up))
		} else if p.Integer[j] {
			fmt.Fprintf(bw, "  PL  BND  %s\n", c)
		}
	}
	if p.ObjOffset != 0 {
		fmt.Fprintf(bw, "  FX  BND  %s  1\n", objConstCol)
	}
	bw.WriteString("ENDATA\n")
	return bw.Flush()
}

// objConstCol names the fixed column that carries the objective constant
// in files written by WriteMPS.
const objConstCol = "RIGMIX_OBJ_CONSTANT"

// mpsNames returns names usable in free MPS: the given ones when all are
// valid and unique, otherwise prefix1..prefixN.
func mpsNames(given []string, n int, prefix string) []string {
	ok := len(given) == n
	seen := make(map[string]bool, n)
	for _, s := range given {
		if !ok {
			break
		}
		if s == "" || strings.IndexFunc(s, unicode.IsSpace) >= 0 || s[0] == '*' || seen[s] || strings.EqualFold(s, "'MARKER'") || s == objConstCol {
			ok = false
		}
		seen[s] = true
	}
	if ok {
		return given
	}
	out := make([]string, n)
	for i := range out {
		out[i] = prefix + strconv.Itoa(i+1)
	}
	return out
}

// Validate checks that p is well formed: sizes agree, the column-wise
// matrix is consistent, no value is NaN, bounds are ordered and not
// infinite on the wrong side.
func (p *Problem) Validate() error {
	q := &p.LP
	m, n := q.NumRows, q.NumCols
	if m < 0 || n < 0 {
		return fmt.Errorf("mip: problem size %d rows × %d columns is negative", m, n)
	}
	if len(q.Obj) != n || len(q.ColLo) != n || len(q.ColUp) != n {
		return fmt.Errorf("mip: Obj, ColLo, ColUp have lengths %d, %d, %d; want NumCols = %d", len(q.Obj), len(q.ColLo), len(q.ColUp), n)
	}
	if len(q.RowLo) != m || len(q.RowUp) != m {
		return fmt.Errorf("mip: RowLo, RowUp have lengths %d, %d; want NumRows = %d", len(q.RowLo), len(q.RowUp), m)
	}
	if len(p.Integer) != n {
		return fmt.Errorf("mip: Integer has length %d; want NumCols = %d", len(p.Integer), n)
	}
	if p.ColNames != nil && len(p.ColNames) != n {
		return fmt.Errorf("mip: ColNames has length %d; want nil or NumCols = %d", len(p.ColNames), n)
	}
	if p.RowNames != nil && len(p.RowNames) != m {
		return fmt.Errorf("mip: RowNames has length %d; want nil or NumRows = %d", len(p.RowNames), m)
	}
	if len(q.ColStart) != n+1 || q.ColStart[0] != 0 {
		return fmt.Errorf("mip: ColStart has length %d (want NumCols+1 = %d) or does not start at 0", len(q.ColStart), n+1)
	}
	nz := q.ColStart[n]
	if len(q.RowIndex) != nz || len(q.Value) != nz {
		return fmt.Errorf("mip: RowIndex and Value have lengths %d, %d; want ColStart[NumCols] = %d", len(q.RowIndex), len(q.Value), nz)
	}
	if math.IsNaN(p.ObjOffset) || math.IsInf(p.ObjOffset, 0) {
		return fmt.Errorf("mip: ObjOffset is %g; want a finite number", p.ObjOffset)
	}
	mark := make([]int, m)
	for i := range mark {
		mark[i] = -1
	}
	for j := 0; j < n; j++ {
		if q.ColStart[j+1] < q.ColStart[j] {
			return fmt.Errorf("mip: ColStart decreases at column %d", j)
		}
		if c := q.Obj[j]; math.IsNaN(c) || math.Abs(c) > lp.MaxFinite {
			return fmt.Errorf("mip: objective coefficient of column %d is %g; want a number of magnitude at most %g", j, c, lp.MaxFinite)
		}
		if err := checkBounds("column", j, q.ColLo[j], q.ColUp[j]); err != nil {
			return err
		}
		for k := q.ColStart[j]; k < q.ColStart[j+1]; k++ {
			i := q.RowIndex[k]
			if i < 0 || i >= m {
				return fmt.Errorf("mip: column %d has row index %d outside 0..%d", j, i, m-1)
			}
			if mark[i] == j {
				return fmt.Errorf("mip: column %d has row %d twice", j, i)
			}
			mark[i] = j
			if v := q.Value[k]; math.IsNaN(v) || math.Abs(v) > lp.MaxFinite {
				return fmt.Errorf("mip: coefficient of column %d in row %d is %g; want a number of magnitude at most %g", j, i, v, lp.MaxFinite)
			}
		}
	}
	for i := 0; i < m; i++ {
		if err := checkBounds("row", i, q.RowLo[i], q.RowUp[i]); err != nil {
			return err
		}
	}
	return nil
}

// checkBounds checks one pair of bounds read through lp.NormBound: each
// infinite or at most lp.MaxFinite in magnitude, lo < +∞, up > −∞,
// lo ≤ up.
func checkBounds(what string, k int, lo, up float64) error {
	lo, up = lp.NormBound(lo), lp.NormBound(up)
	switch {
	case math.IsNaN(lo) || math.IsNaN(up) || lo > up || math.IsInf(lo, 1) || math.IsInf(up, -1):
		return fmt.Errorf("mip: %s %d has bounds [%g, %g]; want lo ≤ up, lo < +∞, up > -∞ (±%g and beyond count as infinite)", what, k, lo, up, lp.Infinity)
	case !math.IsInf(lo, 0) && math.Abs(lo) > lp.MaxFinite, !math.IsInf(up, 0) && math.Abs(up) > lp.MaxFinite:
		return fmt.Errorf("mip: %s %d has bounds [%g, %g]; a finite bound must be at most %g in magnitude (write ±%g or beyond for none)", what, k, lo, up, lp.MaxFinite, lp.Infinity)
	}
	return nil
}

// normalized returns p, or a copy of p whose bounds of magnitude
// lp.Infinity and beyond are ±Inf.
func (p *Problem) normalized() *Problem {
	q := &p.LP
	need := false
	for _, v := range [][]float64{q.ColLo, q.ColUp, q.RowLo, q.RowUp} {
		for _, x := range v {
			if !math.IsInf(x, 0) && math.Abs(x) >= lp.Infinity {
				need = true
			}
		}
	}
	if !need {
		return p
	}
	c := *p
	norm := func(v []float64) []float64 {
		out := make([]float64, len(v))
		for k, x := range v {
			out[k] = lp.NormBound(x)
		}
		return out
	}
	c.LP.ColLo, c.LP.ColUp = norm(q.ColLo), norm(q.ColUp)
	c.LP.RowLo, c.LP.RowUp = norm(q.RowLo), norm(q.RowUp)
	return &c
}

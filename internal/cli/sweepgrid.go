package cli

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/quantity"
	"cloudwind/model"
)

// maxGridDefault is the largest grid sweep runs without --force.
const maxGridDefault = 10_000_000

// maxAxisPoints bounds one axis, so that a typo cannot allocate a huge
// slice before the grid-size check.
const maxAxisPoints = 10_000_000

// A sweepAxis is one swept input.
type sweepAxis struct {
	flag   string        // flag name, e.g. "radius"
	field  string        // model.Field…
	kind   quantity.Kind // for units
	spec   string        // as given
	values []float64
}

// parseAxis parses a single value, a comma list, or lin:A:B:N / log:A:B:N
// (N points, both ends included) into CGS values of kind k.
func parseAxis(flag string, k quantity.Kind, spec string) ([]float64, error) {
	spec = strings.TrimSpace(spec)
	bad := func(format string, args ...any) error {
		return usagef("--%s %s: %s", flag, quoteSpec(spec), fmt.Sprintf(format, args...))
	}
	if mode, rest, ok := strings.Cut(spec, ":"); ok && (mode == "lin" || mode == "log") {
		parts := strings.Split(rest, ":")
		if len(parts) != 3 {
			return nil, bad("want %s:A:B:N", mode)
		}
		a, err := quantity.ParseValue(k, parts[0])
		if err != nil {
			return nil, bad("A: %v", err)
		}
		b, err := quantity.ParseValue(k, parts[1])
		if err != nil {
			return nil, bad("B: %v", err)
		}
		n, err := strconv.Atoi(strings.TrimSpace(parts[2]))
		if err != nil {
			return nil, bad("N must be a whole number (got %q)", sanitizeArg(parts[2]))
		}
		if n < 2 {
			return nil, bad("N must be at least 2 (got %d): it counts the points, both ends included", n)
		}
		if n > maxAxisPoints {
			return nil, bad("N must not exceed %d (got %d)", maxAxisPoints, n)
		}
		if mode == "log" && !(a > 0 && b > 0) {
			return nil, bad("a log range needs A > 0 and B > 0 (got %s and %s)", quantity.Format(k, a), quantity.Format(k, b))
		}
		vs := make([]float64, n)
		for i := range vs {
			w := float64(i) / float64(n-1)
			if mode == "lin" {
				vs[i] = a + w*(b-a)
			} else {
				vs[i] = math.Exp(math.Log(a) + w*(math.Log(b)-math.Log(a)))
			}
		}
		vs[0], vs[n-1] = a, b // exact ends
		return vs, nil
	}
	var vs []float64
	for _, item := range strings.Split(spec, ",") {
		v, err := quantity.ParseValue(k, item)
		if err != nil {
			return nil, bad("%v", err)
		}
		if len(vs) == maxAxisPoints {
			return nil, bad("more than %d values", maxAxisPoints)
		}
		vs = append(vs, v)
	}
	return vs, nil
}

// quoteSpec quotes a spec for an error message.
func quoteSpec(s string) string { return strconv.Quote(sanitizeArg(s)) }

// sweepGrid is the Cartesian product of the axes. Point i decomposes in
// mixed radix with the last axis varying fastest.
type sweepGrid struct {
	axes  []sweepAxis // slowest first
	total int
}

// sweepAxisOrder lists the swept flags, slowest first. The radius and the
// Mach number vary fastest because nothing thermal depends on them, which
// lets the sweep reuse the cooling-time work (model.Result.Reevaluate).
var sweepAxisOrder = []string{"metallicity", "t-cloud", "pressure", "chi", "mach", "radius"}

// newSweepGrid builds the grid; total saturates at math.MaxInt.
func newSweepGrid(axes []sweepAxis) sweepGrid {
	g := sweepGrid{axes: axes, total: 1}
	for _, a := range axes {
		if g.total > math.MaxInt/len(a.values) {
			g.total = math.MaxInt
			continue
		}
		g.total *= len(a.values)
	}
	return g
}

// point fills idx with the axis indices of point i.
func (g *sweepGrid) point(i int, idx []int) {
	for k := len(g.axes) - 1; k >= 0; k-- {
		n := len(g.axes[k].values)
		idx[k] = i % n
		i /= n
	}
}

// apply sets the inputs of the point with axis indices idx in p.
func (g *sweepGrid) apply(p *model.Params, idx []int) {
	for k, a := range g.axes {
		setField(p, a.field, a.values[idx[k]])
	}
}

// setField sets one swept input of p from its CGS value.
func setField(p *model.Params, field string, v float64) {
	if !p.SetField(field, v) {
		panic("cloudwind: unknown swept field " + field)
	}
}

// validate checks every axis value on its own and every corner of the grid,
// so that no point fails halfway through a sweep (Validate's cross-field
// rules involve only extremes: T_hot = χ T_cl μ_hot/μ_cl and T_floor ≤ T_cl).
func (g *sweepGrid) validate(base model.Params) error {
	for _, a := range g.axes {
		for _, v := range a.values {
			p := base
			setField(&p, a.field, v)
			if err := p.Validate(); err != nil {
				return fieldUsage(err)
			}
		}
	}
	corners := 1 << len(g.axes)
	for c := 0; c < corners; c++ {
		p := base
		for k, a := range g.axes {
			lo, hi := minMax(a.values)
			v := lo
			if c&(1<<k) != 0 {
				v = hi
			}
			setField(&p, a.field, v)
		}
		if err := p.Validate(); err != nil {
			return fieldUsage(err)
		}
	}
	return nil
}

func minMax(vs []float64) (lo, hi float64) {
	lo, hi = vs[0], vs[0]
	for _, v := range vs {
		lo, hi = min(lo, v), max(hi, v)
	}
	return lo, hi
}

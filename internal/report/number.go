package report

import (
	"math"
	"math/big"
	"slices"
	"strconv"
)

// AppendNumber appends v with nine significant figures (enough for a
// 1e-6 cross-check after the reader's own rounding), "nan" or "inf" as
// numpy and astropy read them, or JSON null when json is set. The digits
// are those of strconv.AppendFloat(b, v, 'g', 9, 64), which are C's and
// Python's %.9g: appendG9 writes them faster, byte for byte the same.
func AppendNumber(b []byte, v float64, json bool) []byte {
	b, _, _ = AppendNumberRange(b, v, json)
	return b
}

// AppendNumberRange appends v as AppendNumber does and returns an
// interval [lo, hi] around v whose every value has the same text, so that
// a caller formatting a slowly varying series can keep the text while the
// value stays inside. The interval stops short of the rounding boundaries
// of the ninth digit by a safety margin; it is [v, v] when v is not
// finite, zero, a tie or outside 10^±280, and [±Inf, ±Inf] for ±Inf.
func AppendNumberRange(b []byte, v float64, json bool) (out []byte, lo, hi float64) {
	switch {
	case math.IsNaN(v):
		if json {
			return append(b, "null"...), v, v
		}
		return append(b, "nan"...), v, v
	case math.IsInf(v, 1):
		if json {
			return append(b, "null"...), v, v
		}
		return append(b, "inf"...), v, v
	case math.IsInf(v, -1):
		if json {
			return append(b, "null"...), v, v
		}
		return append(b, "-inf"...), v, v
	}
	return appendG9(b, v)
}

// The decimal exponents appendG9 handles itself; outside them (and for
// zero, ties and subnormals) it hands over to strconv. 10^(8−k) must stay
// a normal float64 with a normal low part for every k in the range.
const (
	g9MinExp = -280
	g9MaxExp = 280
	// The powers 10^(8−k) in the table: one more each way, since k may be
	// one off at the ends of the range before it is corrected.
	g9MinPow = 8 - g9MaxExp - 1
	g9MaxPow = 8 - g9MinExp + 1
)

// A g9Power is 10^j as a double-double hi + lo (|lo| ≤ ulp(hi)/2, about
// 106 bits) and its reciprocal 10^−j rounded to float64.
type g9Power struct{ hi, lo, inv float64 }

// g9Pow10 is the table of 10^j for j = g9MinPow … g9MaxPow, index
// j − g9MinPow, each the nearest double-double to the exact power. Built
// once at start-up with math/big (about 560 multiplications at 320 bits,
// well under a millisecond) and never changed after.
var g9Pow10 = func() *[g9MaxPow - g9MinPow + 1]g9Power {
	const prec = 320
	var t [g9MaxPow - g9MinPow + 1]g9Power
	one := new(big.Float).SetPrec(prec).SetInt64(1)
	ten := new(big.Float).SetPrec(prec).SetInt64(10)
	x := new(big.Float).SetPrec(prec).SetInt64(1)
	for range -g9MinPow {
		x.Mul(x, ten)
	}
	x.Quo(one, x) // 10^g9MinPow; each step after errs by 2^-320 relative at most
	r := new(big.Float).SetPrec(prec)
	for j := range t {
		h, _ := x.Float64()
		l, _ := r.Sub(x, r.SetFloat64(h)).Float64()
		inv, _ := r.Quo(one, x).Float64()
		t[j] = g9Power{h, l, inv}
		x.Mul(x, ten)
	}
	return &t
}()

// g9Margin is how far, in units of the ninth digit, appendG9's interval
// of equal text stays inside the rounding boundaries: well above the
// error of computing the interval's ends in float64 (an ulp of a value
// below 10^9 in those units, ~1.1e-7) and of the fraction (~1e-15).
const g9Margin = 1e-6

// g9Tie is how close to a half the scaled value's fraction may come before
// appendG9 leaves the rounding to strconv. The fraction's error is below
// 1e-15 (the scaled value carries ~1e-22 absolute error from the
// double-double product, then one rounding of a number below 2), so any
// fraction outside [0.5 − g9Tie, 0.5 + g9Tie] rounds as the exact value does.
const g9Tie = 1e-9

// appendG9 appends the finite v as strconv.AppendFloat(b, v, 'g', 9, 64)
// does, and returns an interval [lo, hi] of values with the same text (see
// AppendNumberRange). The text is v rounded to nine significant digits,
// trailing zeros removed, written as %f when its decimal exponent X after
// rounding is in [−4, 9) and as %e (d.ddde±XX) otherwise, as C's %.9g.
//
// Method: with 10^k ≤ |v| < 10^(k+1), s = |v| 10^(8−k) lies in [10^8, 10^9);
// it is computed as a double-double from the double-double 10^(8−k) and an
// exact product (FMA), and its integer part rounded by its fraction, which
// is known to ~1e-15. Fractions within g9Tie of a half, zero, subnormals
// and |v| outside 10^±280 go to strconv. The text stays the same while s
// stays inside the rounding boundaries n ± 1/2 of the nine digits n (and,
// for n = 10^8, above 10^8, where the digits of the decade below begin).
func appendG9(b []byte, v float64) ([]byte, float64, float64) {
	a := math.Abs(v)
	if !(a >= 1e-280 && a < 1e280) { // also zero; subnormals are far below
		return strconv.AppendFloat(b, v, 'g', 9, 64), v, v
	}
	// floor(log10 a) is k or k+1 for k = floor((e−1) log10 2), 2^(e−1) ≤ a < 2^e:
	// 78913/2^18 is log10 2 to 2e-7, exact enough over |e| ≤ 1024.
	e := int(math.Float64bits(a)>>52&0x7ff) - 1022
	k := ((e - 1) * 78913) >> 18
	tab := g9Pow10
	if j := k + 1 - g9MinPow; j >= 0 && j < len(tab) && a >= tab[j].hi {
		k++ // a ≥ 10^(k+1), to rounding: a hint the loop below confirms
	}
	var hi, lo float64
	var p *g9Power
	for dir := 0; ; { // k moves one way only, so the loop ends
		p = &tab[8-k-g9MinPow]
		hi = a * p.hi
		lo = math.FMA(a, p.hi, -hi) + a*p.lo
		if dir >= 0 && (hi > 1e9 || hi == 1e9 && lo >= 0) {
			k, dir = k+1, 1
			continue
		}
		if dir <= 0 && (hi < 1e8 || hi == 1e8 && lo < 0) {
			k, dir = k-1, -1
			continue
		}
		break
	}
	n := uint32(hi)                // hi > 0: the conversion truncates, as floor
	frac := (hi - float64(n)) + lo // hi − n is exact
	if frac < 0 {
		n--
		frac++
	} else if frac >= 1 {
		n++
		frac--
	}
	if frac >= 0.5-g9Tie && frac <= 0.5+g9Tie {
		return strconv.AppendFloat(b, v, 'g', 9, 64), v, v // a tie or nearly: strconv decides
	}
	// Round to nearest, without a branch: up is 1 when the fraction is above
	// a half. below and above are the distances from s = n0 + frac to the
	// boundaries of the text, in units of the ninth digit.
	n0 := n
	var up uint32
	if frac > 0.5 {
		up = 1
	}
	n += up
	below, above := frac+0.5-float64(up), 0.5-frac+float64(up)
	if n == 1e8 { // below 10^8 the decade below begins, with a finer ninth digit
		if d := float64(int64(n0)-1e8) + frac; d < below {
			below = d
		}
	}
	if n == 1e9 { // rounded up to the next power of ten
		n = 1e8
		k++
	}
	if n < 1e8 || n >= 1e9 { // cannot happen (s within ~1e-22 of [1e8, 1e9) rounds into it); strconv if it did
		return strconv.AppendFloat(b, v, 'g', 9, 64), v, v
	}
	// The interval in |v|: a ∓ (distance − margin) × a/s.
	u := p.inv // a/s to 1e-16
	below, above = below-g9Margin, above-g9Margin
	if below < 0 {
		below = 0
	}
	if above < 0 {
		above = 0
	}
	rlo, rhi := a-below*u, a+above*u
	if v < 0 {
		rlo, rhi = -rhi, -rlo
	}
	// The nine digits (and zeros after them, read by the fixed-size copies
	// below), and how many remain without trailing zeros.
	var d [17]byte
	for i := 8; i > 0; i -= 2 {
		r := n % 100
		n /= 100
		d[i], d[i-1] = g9Digits[2*r+1], g9Digits[2*r]
	}
	d[0] = byte('0' + n)
	nd := 9
	for nd > 1 && d[nd-1] == '0' {
		nd--
	}
	// The text is at most 16 bytes (−d.dddddddde−308). It is written in
	// place with fixed-size copies, which may write past its end into the
	// 24 bytes reserved: nothing reads those.
	b = slices.Grow(b, 24)
	o := b[len(b) : len(b)+24]
	w := 0
	if v < 0 {
		o[0] = '-'
		w = 1
	}
	switch {
	case k < -4 || k >= 9: // %e: d.ddde±XX
		o[w], o[w+1] = d[0], '.'
		*(*[8]byte)(o[w+2:]) = *(*[8]byte)(d[1:])
		if nd > 1 {
			w += nd + 1
		} else {
			w++
		}
		x := k
		o[w], o[w+1] = 'e', '+'
		if x < 0 {
			o[w+1] = '-'
			x = -x
		}
		w += 2
		if x >= 100 {
			o[w] = byte('0' + x/100)
			w++
			x %= 100
		}
		o[w], o[w+1] = g9Digits[2*x], g9Digits[2*x+1]
		w += 2
	case k < 0: // 0.000ddd
		*(*[5]byte)(o[w:]) = [5]byte{'0', '.', '0', '0', '0'}
		w += 1 - k
		*(*[9]byte)(o[w:]) = [9]byte(d[:9])
		w += nd
	case nd <= k+1: // ddd000: the digits, trailing zeros included, end before the point
		*(*[9]byte)(o[w:]) = [9]byte(d[:9])
		w += k + 1
	default: // ddd.ddd
		*(*[9]byte)(o[w:]) = [9]byte(d[:9])
		o[w+k+1] = '.'
		*(*[8]byte)(o[w+k+2:]) = *(*[8]byte)(d[k+1:])
		w += nd + 1
	}
	return b[:len(b)+w], rlo, rhi
}

// g9Digits holds "00" … "99".
var g9Digits = [200]byte([]byte("00010203040506070809" +
	"10111213141516171819" +
	"20212223242526272829" +
	"30313233343536373839" +
	"40414243444546474849" +
	"50515253545556575859" +
	"60616263646566676869" +
	"70717273747576777879" +
	"80818283848586878889" +
	"90919293949596979899"))

package model

import (
	"errors"
	"math"
	"strconv"
	"strings"
)

// FormatNumber writes v with sig significant figures as %g does, but
// without exponent padding or a plus sign: 1e8 and 2.5e-5, not 1e+08 and
// 2.5e-05. It is meant for messages; displays have their own formatter.
func FormatNumber(v float64, sig int) string {
	s := strconv.FormatFloat(v, 'g', sig, 64)
	if i := strings.IndexByte(s, 'e'); i >= 0 {
		mant, exp := s[:i], s[i+1:]
		sign := ""
		if exp[0] == '-' {
			sign = "-"
		}
		exp = strings.TrimLeft(exp[1:], "0")
		if exp == "" {
			exp = "0"
		}
		s = mant + "e" + sign + exp
	}
	return s
}

// Errors of ScanNumber.
var (
	// ErrNoNumber: the text does not start with a number.
	ErrNoNumber = errors.New("no number")
	// ErrNumberRange: the number does not fit a finite float64, or 10^x
	// underflows to 0.
	ErrNumberRange = errors.New("number out of range")
)

// ScanNumber reads the number at the start of s and returns its value and
// the count of bytes it took. A number is a decimal floating-point literal
// (sign, digits with an optional point, optional exponent: "30", "-2.5",
// "1e-14") or such a literal written as a power of ten, "10^4.2". Hex,
// "inf" and "nan" are not numbers here. Errors wrap ErrNoNumber (also for
// "10^" with nothing after it) or ErrNumberRange.
func ScanNumber(s string) (v float64, n int, err error) {
	num, skip := s, 0
	if rest, ok := strings.CutPrefix(s, "10^"); ok {
		num, skip = rest, 3
	}
	end := numberPrefix(num)
	if end == 0 {
		return 0, 0, ErrNoNumber
	}
	v, err = strconv.ParseFloat(num[:end], 64)
	if err != nil {
		if errors.Is(err, strconv.ErrRange) {
			return 0, 0, ErrNumberRange
		}
		return 0, 0, ErrNoNumber
	}
	if v == 0 && strings.ContainsAny(mantissa(num[:end]), "123456789") {
		return 0, 0, ErrNumberRange // underflow: 1e-400 is not 0
	}
	if skip > 0 {
		if v = math.Pow(10, v); math.IsInf(v, 0) || v == 0 {
			return 0, 0, ErrNumberRange
		}
	}
	return v, skip + end, nil
}

// mantissa returns the part of a decimal literal before its exponent.
func mantissa(lit string) string {
	if i := strings.IndexAny(lit, "eE"); i >= 0 {
		return lit[:i]
	}
	return lit
}

// numberPrefix returns the length of the decimal floating-point literal at
// the start of s (sign, digits, point, exponent); 0 if there is none.
func numberPrefix(s string) int {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' {
		i, digits = i+1, digits+1
	}
	if i < len(s) && s[i] == '.' {
		i++
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i, digits = i+1, digits+1
		}
	}
	if digits == 0 {
		return 0
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		k := j
		for k < len(s) && s[k] >= '0' && s[k] <= '9' {
			k++
		}
		if k > j {
			i = k
		}
	}
	return i
}

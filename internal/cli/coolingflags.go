package cli

import (
	"errors"
	"fmt"
	"io"
	"strings"

	"cloudwind/cooling"
)

// coolingHelp is the usage text of --cooling.
func coolingHelp() string {
	var b strings.Builder
	b.WriteString("cooling function Λ(T), per n_H² in erg cm3 s-1:\none of the names below; a table FILE ('-' for stdin), read with --table settings;\nconst:LAMBDA (10^x allowed); or powerlaw:L0,T0,SLOPE for Λ = L0 (T/T0)^SLOPE.\nNames:")
	for _, c := range cooling.Names() {
		fmt.Fprintf(&b, "\n  %-19s %s", c.Name, c.Summary)
	}
	return b.String()
}

// tableSettings collects repeated --table "key: value" settings.
type tableSettings []string

func (t *tableSettings) String() string { return strings.Join(*t, "; ") }
func (t *tableSettings) Set(v string) error {
	*t = append(*t, v)
	return nil
}

// registerCoolingFlags adds a cooling flag and its table flag.
func registerCoolingFlags(f *flagSet, spec *string, table *tableSettings, name, tableName string) {
	f.fs.StringVar(spec, name, cooling.DefaultSpec, coolingHelp())
	f.fs.Var(table, tableName, "how to read a table given to --"+name+", in the words of a table's directive lines;\nrepeat it: --"+tableName+" 'norm: nenH' --"+tableName+" 'columns: T=1 lambda=2' --"+tableName+" 'log: T=yes lambda=yes'\n(keys: norm, columns, log, Z, y, clip-below, header, skip)")
}

// coolingSource is the explorer's cooling source, shared with the commands.
type coolingSource = cooling.Source

// resolveCooling resolves a cooling flag; spec mistakes are usage errors.
func resolveCooling(e *env, flag, spec string, table tableSettings) (*coolingSource, error) {
	open := func(path string) (r io.Reader, name string, closeFn func(), err error) { return openInput(e, path) }
	src, err := cooling.Resolve(flag, spec, table, open)
	var se *cooling.SpecError
	if errors.As(err, &se) {
		return nil, usagef("%s", se.Error())
	}
	if err != nil {
		return nil, err // already names the flag
	}
	return src, nil
}

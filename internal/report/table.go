package report

import (
	"bytes"
	"encoding/json"
	"io"
	"math"
	"strconv"
	"strings"

	"cloudwind/internal/safetext"
)

// A Meta is one entry of the run's metadata, kept in order. A value is
// a string, float64, int, bool, []any, []Meta or nil.
type Meta struct {
	Key   string
	Value any
}

// Format writes one output format.
type Format struct {
	Name      string
	JSON      bool // numbers that do not exist are null, strings are quoted
	Header    func(w io.Writer, cols []Column, meta []Meta) error
	AppendRow func(b []byte, cols []Column, fields [][]byte, first bool) []byte
	Footer    string
}

// LookupFormat returns the writer of a --format name.
func LookupFormat(name string) (Format, bool) {
	switch name {
	case "csv":
		return Format{Name: name, Header: CSVHeader, AppendRow: delimitedRow(',')}, true
	case "ecsv":
		return Format{Name: name, Header: ECSVHeader, AppendRow: delimitedRow(' ')}, true
	case "json":
		return Format{Name: name, JSON: true, Header: JSONHeader, AppendRow: jsonRow(true), Footer: "\n]}\n"}, true
	case "jsonl":
		return Format{Name: name, JSON: true, Header: func(io.Writer, []Column, []Meta) error { return nil }, AppendRow: jsonRow(false)}, true
	}
	return Format{}, false
}

func CSVHeader(w io.Writer, cols []Column, _ []Meta) error {
	names := make([]string, len(cols))
	for i, c := range cols {
		names[i] = c.Name
	}
	_, err := io.WriteString(w, strings.Join(names, ",")+"\n")
	return err
}

// delimitedRow writes a CSV or ECSV data line from formatted fields. No
// field needs quoting: numbers, and verdict words without spaces or commas.
func delimitedRow(sep byte) func([]byte, []Column, [][]byte, bool) []byte {
	return func(b []byte, _ []Column, fields [][]byte, _ bool) []byte {
		for i, f := range fields {
			if i > 0 {
				b = append(b, sep)
			}
			b = append(b, f...)
		}
		return append(b, '\n')
	}
}

// jsonRow writes one row object from formatted fields (strings arrive
// quoted); in a JSON document (doc) rows after the first start with a comma.
func jsonRow(doc bool) func([]byte, []Column, [][]byte, bool) []byte {
	return func(b []byte, cols []Column, fields [][]byte, first bool) []byte {
		if doc && !first {
			b = append(b, ",\n"...)
		} else if doc {
			b = append(b, '\n')
		}
		b = append(b, '{')
		for i, f := range fields {
			if i > 0 {
				b = append(b, ',')
			}
			b = append(b, cols[i].JSONKey...)
			b = append(b, f...)
		}
		b = append(b, '}')
		if !doc {
			b = append(b, '\n')
		}
		return b
	}
}

// ECSVHeader writes the header of astropy's Enhanced Character Separated
// Values format (ECSV 1.0): a YAML block after "# %ECSV 1.0" and "# ---"
// with each column's name, unit, datatype and description, and the run's
// settings as ordered metadata, then the line of column names.
// Values are written as YAML flow collections with JSON-quoted strings and
// floats with a point and a signed exponent, so that YAML 1.1 readers
// (PyYAML, as astropy uses) read them as numbers.
func ECSVHeader(w io.Writer, cols []Column, meta []Meta) error {
	var b strings.Builder
	b.WriteString("# %ECSV 1.0\n# ---\n# delimiter: ' '\n# datatype:\n")
	for _, c := range cols {
		b.WriteString("# - {name: " + yamlString(c.Name))
		dt := c.datatype()
		if c.Unit != "" {
			b.WriteString(", unit: " + yamlString(c.Unit))
		}
		b.WriteString(", datatype: " + dt + ", description: " + yamlString(c.Description) + "}\n")
	}
	b.WriteString("# meta: !!omap\n")
	for _, m := range meta {
		b.WriteString("# - {" + yamlString(m.Key) + ": " + yamlValue(m.Value) + "}\n")
	}
	b.WriteString("# schema: astropy-2.0\n")
	for i, c := range cols {
		if i > 0 {
			b.WriteByte(' ')
		}
		b.WriteString(c.Name)
	}
	b.WriteByte('\n')
	_, err := io.WriteString(w, b.String())
	return err
}

// yamlString quotes s as a YAML double-quoted scalar (JSON's escapes are
// valid YAML escapes).
func yamlString(s string) string { return string(safetext.AppendJSON(nil, s)) }

// yamlValue writes v in YAML flow style.
func yamlValue(v any) string {
	switch x := v.(type) {
	case nil:
		return "null"
	case string:
		return yamlString(x)
	case bool:
		return strconv.FormatBool(x)
	case int:
		return strconv.Itoa(x)
	case float64:
		return yamlFloat(x)
	case []any:
		parts := make([]string, len(x))
		for i, e := range x {
			parts[i] = yamlValue(e)
		}
		return "[" + strings.Join(parts, ", ") + "]"
	case []Meta:
		parts := make([]string, len(x))
		for i, e := range x {
			parts[i] = yamlString(e.Key) + ": " + yamlValue(e.Value)
		}
		return "{" + strings.Join(parts, ", ") + "}"
	}
	panic("cloudwind: unsupported metadata value")
}

// yamlFloat writes a float that YAML 1.1 resolves as a float: a point in
// the mantissa and a signed exponent, or .inf/.nan.
func yamlFloat(v float64) string {
	switch {
	case math.IsNaN(v):
		return ".nan"
	case math.IsInf(v, 1):
		return ".inf"
	case math.IsInf(v, -1):
		return "-.inf"
	}
	s := strconv.FormatFloat(v, 'e', -1, 64) // e.g. 1e+06, -2.5e-22
	mant, exp, _ := strings.Cut(s, "e")
	if !strings.Contains(mant, ".") {
		mant += ".0"
	}
	return mant + "e" + exp
}

// jsonValue converts metadata to values encoding/json writes in order.
func jsonValue(v any) any {
	switch x := v.(type) {
	case float64:
		return JSONNumber(x)
	case []any:
		out := make([]any, len(x))
		for i, e := range x {
			out[i] = jsonValue(e)
		}
		return out
	case []Meta:
		return OrderedJSON(x)
	}
	return v
}

// OrderedJSON is a JSON object that keeps its keys in order.
type OrderedJSON []Meta

func (o OrderedJSON) MarshalJSON() ([]byte, error) {
	b := []byte{'{'}
	for i, m := range o {
		if i > 0 {
			b = append(b, ',')
		}
		k, _ := json.Marshal(m.Key)
		v, err := json.Marshal(jsonValue(m.Value))
		if err != nil {
			return nil, err
		}
		b = append(append(append(b, k...), ':'), v...)
	}
	return append(b, '}'), nil
}

func JSONHeader(w io.Writer, cols []Column, meta []Meta) error {
	colMeta := make([]any, len(cols))
	for i, c := range cols {
		colMeta[i] = []Meta{{"name", c.Name}, {"unit", c.Unit}, {"datatype", c.datatype()}, {"description", c.Description}}
	}
	head, err := json.Marshal(OrderedJSON{{"schema", "cloudwind.sweep/1"}, {"meta", meta}, {"columns", colMeta}})
	if err != nil {
		return err
	}
	head = safetext.EscapeJSON(head)
	// Leave the object open: the rows follow.
	head = append(head[:len(head)-1], `,"rows":[`...)
	_, err = w.Write(head)
	return err
}

// datatype returns the column's ECSV datatype.
func (c *Column) datatype() string {
	switch {
	case c.IsString:
		return "string"
	case c.IsBool:
		return "bool"
	}
	return "float64"
}

// KV returns the metadata entry key: value.
func KV(key string, value any) Meta { return Meta{Key: key, Value: value} }

// WriteJSON writes v as an indented JSON document followed by a newline.
// Strings keep their true text, but control, bidirectional and format
// characters are written as \u escapes (safetext.EscapeJSON), so that the
// document shown raw on a terminal cannot act on it. Every JSON document
// cloudwind writes goes through it.
func WriteJSON(w io.Writer, v any) error {
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetEscapeHTML(false) // "<" stays "<": the document is not embedded in HTML
	enc.SetIndent("", "  ")
	if err := enc.Encode(v); err != nil {
		return err
	}
	_, err := w.Write(safetext.EscapeJSON(buf.Bytes()))
	return err
}

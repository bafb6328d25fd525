package report

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strings"
	"sync"
	"testing"

	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/format"

	"cloudwind/model"
)

// The Parquet writer is checked against the format's own definitions
// (Apache Parquet format specification, parquet.thrift: physical types,
// repetition, encodings, codecs) as parquet-go decodes them, and against
// the requirements; the values are the test's own inputs, which
// must come back bit for bit (derived: a DOUBLE column stores the IEEE 754
// bits).

// testColumns are one column of each kind, with units and descriptions.
var testColumns = []Column{
	{Name: "chi", Description: "density contrast (input)"},
	{Name: "radius_pc", Unit: "pc", Description: "cloud radius (input)"},
	{Name: "adiabatic", IsBool: true, Description: "t_cool,wind > r/v"},
	{Name: "go18_verdict", IsString: true, Description: "survives-and-grows, transformed or destroyed"},
	{Name: "t_cc_myr", Unit: "Myr", Description: "cloud-crushing time"},
	{Name: "criterion", IsString: true, Description: "criterion id"},
}

// specialValues are the numbers that must survive unchanged: NaN, both
// infinities, both zeros, the smallest subnormal, the largest finite
// double, and ordinary values (IEEE 754-2008 special values; common
// practice, no source, for the choice).
var specialValues = []float64{math.NaN(), math.Inf(1), math.Inf(-1), 0, math.Copysign(0, -1),
	math.SmallestNonzeroFloat64, math.MaxFloat64, -math.MaxFloat64, 1e-300, 1e300, 3.0857e18, -2.5e-22, 1, 100}

var testVerdicts = []string{"survives-and-grows", "transformed", "destroyed"}

// testTable returns n rows of testColumns: the special numbers in turn,
// every verdict, both booleans, three criterion ids.
func testTable(n int) *Batch {
	num, str, bools := make([][]float64, 6), make([][]string, 6), make([][]bool, 6)
	ids := []string{"go18", "li20", "sparre20"}
	for i := 0; i < n; i++ {
		num[0] = append(num[0], specialValues[i%len(specialValues)])
		num[1] = append(num[1], float64(i)*0.25)
		bools[2] = append(bools[2], i%3 == 0)
		str[3] = append(str[3], testVerdicts[i%3])
		num[4] = append(num[4], specialValues[(i+5)%len(specialValues)])
		str[5] = append(str[5], ids[i/7%3])
	}
	return fromColumns(testColumns, n, num, str, bools)
}

// fromColumns returns a batch of the n rows given column by column: num[c]
// for a numeric column c, str[c] or bools[c] for the others.
func fromColumns(cols []Column, n int, num [][]float64, str [][]string, bools [][]bool) *Batch {
	b := NewBatch(cols, n)
	row, srow, brow := make([]float64, len(cols)), make([]string, len(cols)), make([]bool, len(cols))
	for i := 0; i < n; i++ {
		for c := range cols {
			switch {
			case cols[c].IsString:
				srow[c] = str[c][i]
			case cols[c].IsBool:
				brow[c] = bools[c][i]
			default:
				row[c] = num[c][i]
			}
		}
		b.AppendRow(row, srow, brow)
	}
	return b
}

// num returns row i's value in numeric column c.
func (b *Batch) num(i, c int) float64 { return b.Num[i*b.Width+c] }

// slice returns rows lo to hi of b as a batch sharing its memory.
func (b *Batch) slice(lo, hi int) *Batch {
	s := &Batch{Width: b.Width, Rows: hi - lo, Str: make([][]string, len(b.Str)), Bool: make([][]bool, len(b.Bool))}
	if b.Num != nil {
		s.Num = b.Num[lo*b.Width : hi*b.Width]
	}
	for c := range b.Str {
		if b.Str[c] != nil {
			s.Str[c] = b.Str[c][lo:hi]
		}
		if b.Bool[c] != nil {
			s.Bool[c] = b.Bool[c][lo:hi]
		}
	}
	return s
}

var testMeta = []Meta{
	KV("program", "cloudwind test"),
	KV("grid", []Meta{KV("--chi", "log:10:1e4:7"), KV("--radius", "1pc")}),
	KV("fixed_inputs", []Meta{KV("mach", 1.5), KV("pressure_kcm3", 1e3)}),
	KV("calibrated_range", []any{10.0, math.Inf(1)}),
	KV("verified", false),
	KV("count", 3),
	KV("none", nil),
}

// writeParquet writes the batches with cols and meta and returns the file.
func writeParquet(t *testing.T, cols []Column, meta []Meta, batches ...*Batch) []byte {
	t.Helper()
	var buf bytes.Buffer
	p, err := NewParquetWriter(&buf, cols, meta)
	if err != nil {
		t.Fatalf("NewParquetWriter: %v", err)
	}
	for i, b := range batches {
		if err := p.Write(b); err != nil {
			t.Fatalf("ParquetWriter.Write(batch %d of %d rows): %v", i, b.Rows, err)
		}
	}
	if err := p.Close(); err != nil {
		t.Fatalf("ParquetWriter.Close: %v", err)
	}
	return buf.Bytes()
}

func openParquet(t *testing.T, data []byte) *parquet.File {
	t.Helper()
	f, err := parquet.OpenFile(bytes.NewReader(data), int64(len(data)))
	if err != nil {
		t.Fatalf("parquet.OpenFile of %d bytes: %v", len(data), err)
	}
	return f
}

// readAll returns every row of f.
func readAll(t *testing.T, f *parquet.File) []parquet.Row {
	t.Helper()
	var out []parquet.Row
	for _, rg := range f.RowGroups() {
		rows := rg.Rows()
		buf := make([]parquet.Row, 100)
		for {
			n, err := rows.ReadRows(buf)
			for _, r := range buf[:n] {
				out = append(out, r.Clone())
			}
			if err == io.EOF {
				break
			}
			if err != nil {
				t.Fatalf("ReadRows: %v", err)
			}
		}
		rows.Close()
	}
	return out
}

func TestParquetRoundTrip(t *testing.T) {
	const n = 300
	b := testTable(n)
	// Uneven batches, one empty, so that Write's splitting is exercised.
	data := writeParquet(t, testColumns, testMeta, b.slice(0, 1), b.slice(1, 1), b.slice(1, 128), b.slice(128, n))
	f := openParquet(t, data)
	md := f.Metadata()

	// Schema: the root, then one required leaf per column, in order.
	if len(md.Schema) != len(testColumns)+1 {
		t.Fatalf("schema has %d elements, want root + %d columns", len(md.Schema), len(testColumns))
	}
	if k, _ := md.Schema[0].NumChildren.Get(); int(k) != len(testColumns) {
		t.Errorf("schema root has %d children, want %d", k, len(testColumns))
	}
	for i, c := range testColumns {
		e := md.Schema[i+1]
		typ, _ := e.Type.Get()
		rep, _ := e.RepetitionType.Get()
		want := format.Double
		switch {
		case c.IsString:
			want = format.ByteArray
			if _, ok := e.LogicalType.Value.(*format.StringType); !ok {
				t.Errorf("column %s: logical type %v, want STRING", c.Name, e.LogicalType.String())
			}
		case c.IsBool:
			want = format.Boolean
		}
		if e.Name != c.Name || typ != want || rep != format.Required {
			t.Errorf("schema element %d = %s %v %v, want %s %v REQUIRED", i+1, e.Name, typ, rep, c.Name, want)
		}
	}

	// Column chunks: strings dictionary-encoded, numbers plain; Snappy.
	for g, rg := range md.RowGroups {
		for c, cc := range rg.Columns {
			enc := cc.MetaData.Encoding
			dict := slices.Contains(enc, format.RLEDictionary) || slices.Contains(enc, format.PlainDictionary)
			if testColumns[c].IsString != dict {
				t.Errorf("row group %d column %s: encodings %v, dictionary %v, want %v", g, testColumns[c].Name, enc, dict, testColumns[c].IsString)
			}
			if testColumns[c].IsString && cc.MetaData.DictionaryPageOffset <= 0 {
				t.Errorf("row group %d column %s: no dictionary page", g, testColumns[c].Name)
			}
			if cc.MetaData.Codec != format.Snappy {
				t.Errorf("row group %d column %s: codec %v, want SNAPPY", g, testColumns[c].Name, cc.MetaData.Codec)
			}
		}
	}
	if md.CreatedBy != "cloudwind" {
		t.Errorf("created_by = %q, want %q", md.CreatedBy, "cloudwind")
	}

	// Values, bit for bit.
	rows := readAll(t, f)
	if len(rows) != n || f.NumRows() != n {
		t.Fatalf("read %d rows (footer %d), want %d", len(rows), f.NumRows(), n)
	}
	for i, r := range rows {
		if len(r) != len(testColumns) {
			t.Fatalf("row %d has %d values, want %d", i, len(r), len(testColumns))
		}
		for c, col := range testColumns {
			v := r[c]
			switch {
			case col.IsString:
				if got := string(v.ByteArray()); got != b.Str[c][i] {
					t.Errorf("row %d %s = %q, want %q", i, col.Name, got, b.Str[c][i])
				}
			case col.IsBool:
				if got := v.Boolean(); got != b.Bool[c][i] {
					t.Errorf("row %d %s = %v, want %v", i, col.Name, got, b.Bool[c][i])
				}
			default:
				if got, want := math.Float64bits(v.Double()), math.Float64bits(b.num(i, c)); got != want {
					t.Errorf("row %d %s = %g (%#x), want %g (%#x)", i, col.Name, v.Double(), got, b.num(i, c), want)
				}
			}
		}
	}

	// Key–value metadata: the run's metadata in order, and the columns.
	raw, ok := f.Lookup(ParquetMetaKey)
	if !ok || !json.Valid([]byte(raw)) {
		t.Fatalf("metadata %s = %q (present %v), want valid JSON", ParquetMetaKey, raw, ok)
	}
	// Derived: OrderedJSON writes the keys in order, NaN/Inf as null.
	wantMeta := `{"program":"cloudwind test","grid":{"--chi":"log:10:1e4:7","--radius":"1pc"},` +
		`"fixed_inputs":{"mach":1.5,"pressure_kcm3":1000},"calibrated_range":[10,null],"verified":false,"count":3,"none":null}`
	if raw != wantMeta {
		t.Errorf("metadata %s =\n%s\nwant\n%s", ParquetMetaKey, raw, wantMeta)
	}
	raw, ok = f.Lookup(ParquetColumnsKey)
	var got []struct{ Name, Unit, Datatype, Description string }
	if err := json.Unmarshal([]byte(raw), &got); !ok || err != nil {
		t.Fatalf("metadata %s = %q (present %v): %v", ParquetColumnsKey, raw, ok, err)
	}
	if len(got) != len(testColumns) {
		t.Fatalf("metadata %s has %d columns, want %d", ParquetColumnsKey, len(got), len(testColumns))
	}
	for i, c := range testColumns {
		g := got[i]
		if g.Name != c.Name || g.Unit != c.Unit || g.Datatype != c.datatype() || g.Description != c.Description {
			t.Errorf("metadata %s[%d] = %+v, want %s %q %s %q", ParquetColumnsKey, i, g, c.Name, c.Unit, c.datatype(), c.Description)
		}
	}
}

// TestParquetMetadataEscaped: text that could act on a terminal (a
// bidirectional override, an escape) is stored as JSON \u escapes, so the
// metadata printed raw is inert, and decodes to the true text.
func TestParquetMetadataEscaped(t *testing.T) {
	evil := "abc\u202edef\x1b[2J"
	cols := []Column{{Name: "x", Description: "from a criteria file: " + evil}}
	b := NewBatch(cols, 1)
	b.AppendRow([]float64{1}, nil, nil)
	f := openParquet(t, writeParquet(t, cols, []Meta{KV("label", evil)}, b))
	for _, key := range []string{ParquetMetaKey, ParquetColumnsKey} {
		raw, _ := f.Lookup(key)
		if strings.ContainsAny(raw, "\u202e\x1b") {
			t.Errorf("metadata %s holds raw control or bidi characters: %q", key, raw)
		}
		if !strings.Contains(raw, `\u202e`) || !strings.Contains(raw, `\u001b`) {
			t.Errorf("metadata %s = %q, want the characters as \\u escapes", key, raw)
		}
		var v any
		if err := json.Unmarshal([]byte(raw), &v); err != nil || !strings.Contains(fmt.Sprint(v), evil) {
			t.Errorf("metadata %s decodes to %v (%v), want it to hold %q", key, v, err, evil)
		}
	}
}

// TestParquetRowGroups: rows are cut into row groups of RowGroupRows, and
// each full group reaches w before Close (the file is streamed).
func TestParquetRowGroups(t *testing.T) {
	cols := []Column{{Name: "i"}, {Name: "v", IsString: true}}
	const n = 3*RowGroupRows + 5
	var streamed bytes.Buffer
	p, err := NewParquetWriter(&streamed, cols, nil)
	if err != nil {
		t.Fatal(err)
	}
	b := NewBatch(cols, 10007)
	written := 0
	for written < n {
		b.Reset()
		for k := 0; k < 10007 && written < n; k++ {
			b.AppendRow([]float64{float64(written), 0}, []string{"", testVerdicts[written/1000%3]}, nil)
			written++
		}
		before := written - b.Rows
		if err := p.Write(b); err != nil {
			t.Fatal(err)
		}
		switch w := streamed.Len(); {
		case written < RowGroupRows && w != 0:
			t.Fatalf("after %d rows, before a row group is full, %d bytes reached w, want 0", written, w)
		case before < RowGroupRows && written >= RowGroupRows && w == 0:
			t.Fatalf("after %d rows, a full row group, nothing reached w", written)
		}
	}
	if err := p.Close(); err != nil {
		t.Fatal(err)
	}

	// The same rows again, kept, to read back.
	b = NewBatch(cols, n)
	for i := 0; i < n; i++ {
		b.AppendRow([]float64{float64(i), 0}, []string{"", testVerdicts[i/1000%3]}, nil)
	}
	data := writeParquet(t, cols, nil, b)
	if !bytes.Equal(data, streamed.Bytes()) {
		t.Errorf("one batch of %d rows gave %d bytes, batches of 10007 rows %d bytes, want the same file", n, len(data), streamed.Len())
	}
	f := openParquet(t, data)
	var sizes []int64
	for _, rg := range f.RowGroups() {
		sizes = append(sizes, rg.NumRows())
	}
	want := []int64{RowGroupRows, RowGroupRows, RowGroupRows, 5}
	if !slices.Equal(sizes, want) {
		t.Errorf("row groups of %d rows: %v, want %v", n, sizes, want)
	}
	rows := readAll(t, f)
	for _, i := range []int{0, RowGroupRows - 1, RowGroupRows, 2 * RowGroupRows, n - 1} {
		if got := rows[i][0].Double(); got != float64(i) {
			t.Errorf("row %d: i = %g, want %d", i, got, i)
		}
	}
}

// TestParquetEmpty: a writer closed without rows writes a valid file with
// the schema, the metadata and 0 rows.
func TestParquetEmpty(t *testing.T) {
	data := writeParquet(t, testColumns, testMeta)
	f := openParquet(t, data)
	if f.NumRows() != 0 || len(f.RowGroups()) != 0 {
		t.Errorf("empty file: %d rows in %d row groups, want 0 and 0", f.NumRows(), len(f.RowGroups()))
	}
	if len(f.Metadata().Schema) != len(testColumns)+1 {
		t.Errorf("empty file: %d schema elements, want %d", len(f.Metadata().Schema), len(testColumns)+1)
	}
	if _, ok := f.Lookup(ParquetMetaKey); !ok {
		t.Errorf("empty file: no %s metadata", ParquetMetaKey)
	}
	// An empty batch of nil slices is no rows, not an error.
	data2 := writeParquet(t, testColumns, testMeta, &Batch{})
	if !bytes.Equal(data, data2) {
		t.Errorf("writing an empty batch changed the empty file")
	}
}

// TestParquetDeterministic: the same rows and metadata give the same bytes
// (no timestamp, no random identifier, metadata in a fixed order).
func TestParquetDeterministic(t *testing.T) {
	b := testTable(500)
	one := writeParquet(t, testColumns, testMeta, b)
	two := writeParquet(t, testColumns, testMeta, b.slice(0, 1), b.slice(1, 250), b.slice(250, 500))
	if !bytes.Equal(one, two) {
		t.Errorf("two writes of the same 500 rows differ (%d and %d bytes)", len(one), len(two))
	}
}

// errFull is the error of failWriter.
var errFull = errors.New("disk full")

// failWriter accepts n bytes, then fails.
type failWriter struct{ n int }

func (w *failWriter) Write(p []byte) (int, error) {
	if len(p) <= w.n {
		w.n -= len(p)
		return len(p), nil
	}
	k := w.n
	w.n = 0
	return k, errFull
}

// TestParquetWriterError: an error of w, wherever in the file it happens,
// is returned by Write or Close (wrapped or as is), never a panic, and
// again by every later call.
func TestParquetWriterError(t *testing.T) {
	b := testTable(RowGroupRows + 100)
	full := writeParquet(t, testColumns, testMeta, b)
	for _, limit := range []int{0, 3, 4, 100, 4096, 40000, len(full) / 2, len(full) - 9, len(full) - 1} {
		t.Run(fmt.Sprint(limit), func(t *testing.T) {
			defer func() {
				if r := recover(); r != nil {
					t.Fatalf("panic with w failing after %d bytes: %v", limit, r)
				}
			}()
			p, err := NewParquetWriter(&failWriter{limit}, testColumns, testMeta)
			if err != nil {
				t.Fatal(err)
			}
			err = p.Write(b)
			if err == nil {
				err = p.Close()
			}
			if !errors.Is(err, errFull) {
				t.Fatalf("w failing after %d of %d bytes: Write/Close returned %v, want %v", limit, len(full), err, errFull)
			}
			if err2 := p.Write(b.slice(0, 1)); !errors.Is(err2, errFull) {
				t.Errorf("Write after the error returned %v, want %v", err2, errFull)
			}
			if err2 := p.Close(); !errors.Is(err2, errFull) {
				t.Errorf("Close after the error returned %v, want %v", err2, errFull)
			}
		})
	}
}

// TestParquetBadInput: columns the file cannot hold and batches that do
// not match the columns are refused with a message naming the column.
func TestParquetBadInput(t *testing.T) {
	for _, tc := range []struct {
		cols []Column
		want string
	}{
		{nil, "no columns"},
		{[]Column{{Name: "a"}, {Name: ""}}, "column 2 has no name"},
		{[]Column{{Name: "a"}, {Name: "a", IsString: true}}, `"a" appears twice`},
		{[]Column{{Name: "a", IsString: true, IsBool: true}}, `"a" is both string and bool`},
	} {
		if _, err := NewParquetWriter(io.Discard, tc.cols, nil); err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("NewParquetWriter(%v) = %v, want an error with %q", tc.cols, err, tc.want)
		}
	}
	if _, err := NewParquetWriter(io.Discard, testColumns, []Meta{KV("bad", make(chan int))}); err == nil {
		t.Errorf("NewParquetWriter with metadata JSON cannot hold: no error")
	}

	p, err := NewParquetWriter(io.Discard, testColumns, nil)
	if err != nil {
		t.Fatal(err)
	}
	b := testTable(10)
	b.Str[3] = b.Str[3][:9]
	if err := p.Write(b); err == nil || !strings.Contains(err.Error(), `"go18_verdict" has 9 values in a batch of 10 rows`) {
		t.Errorf("Write of a short string column = %v, want the column named", err)
	}
	b = testTable(10)
	b.Num = b.Num[:len(b.Num)-1] // a number short
	if err := p.Write(b); err == nil || !strings.Contains(err.Error(), "a batch of 10 rows of 6 columns has 59 numbers, want 60") {
		t.Errorf("Write of a batch a number short = %v, want the count", err)
	}
	b = testTable(10)
	b.Width = 5
	if err := p.Write(b); err == nil || !strings.Contains(err.Error(), "batch rows have 5 columns, want 6") {
		t.Errorf("Write of rows of another width = %v, want the widths", err)
	}
	// A refused batch does not spoil the writer: the next good one is written.
	if err := p.Write(testTable(10)); err != nil {
		t.Errorf("Write after a refused batch: %v", err)
	}
	if err := p.Close(); err != nil {
		t.Fatal(err)
	}
	if err := p.Write(testTable(1)); err == nil {
		t.Errorf("Write after Close: no error")
	}
}

// TestParquetSweepColumns: the columns of a real sweep with every built-in
// criterion are a valid schema (no repeated name), and the kinds are kept.
func TestParquetSweepColumns(t *testing.T) {
	cols := SweepColumns(model.BuiltinCriteria())
	num, str, bools := make([][]float64, len(cols)), make([][]string, len(cols)), make([][]bool, len(cols))
	for c := range cols {
		num[c], str[c], bools[c] = []float64{float64(c), math.NaN()}, []string{"destroyed", "transformed"}, []bool{true, false}
	}
	b := fromColumns(cols, 2, num, str, bools)
	f := openParquet(t, writeParquet(t, cols, nil, b))
	fields := f.Schema().Fields()
	if len(fields) != len(cols) {
		t.Fatalf("sweep schema has %d fields, want %d", len(fields), len(cols))
	}
	strs := 0
	for i, fl := range fields {
		if fl.Name() != cols[i].Name {
			t.Errorf("sweep field %d = %s, want %s", i, fl.Name(), cols[i].Name)
		}
		if cols[i].IsString {
			strs++
		}
	}
	if want := len(model.BuiltinCriteria()); strs != want {
		t.Errorf("sweep has %d string columns, want one verdict per criterion, %d", strs, want)
	}
}

// TestBatchReset: Reset empties every column and keeps its memory.
func TestBatchReset(t *testing.T) {
	b := testTable(50)
	caps := []int{cap(b.Num), cap(b.Bool[2]), cap(b.Str[3])}
	b.Reset()
	if b.Rows != 0 || len(b.Num) != 0 || len(b.Bool[2]) != 0 || len(b.Str[3]) != 0 {
		t.Errorf("after Reset: Rows %d, lengths %d %d %d, want 0", b.Rows, len(b.Num), len(b.Bool[2]), len(b.Str[3]))
	}
	if got := []int{cap(b.Num), cap(b.Bool[2]), cap(b.Str[3])}; !slices.Equal(got, caps) {
		t.Errorf("after Reset: capacities %v, want %v", got, caps)
	}
	if b.Str[0] != nil || b.Bool[0] != nil {
		t.Errorf("after Reset: slices of other kinds are not nil")
	}
	b.AppendRow([]float64{1, 2, 0, 0, 5, 0}, []string{"", "", "", "destroyed", "", "li20"}, []bool{false, false, true, false, false, false})
	if b.Rows != 1 || !slices.Equal(b.Num, []float64{1, 2, 0, 0, 5, 0}) || b.Str[3][0] != "destroyed" || b.Str[5][0] != "li20" || !b.Bool[2][0] {
		t.Errorf("AppendRow after Reset: %+v", b)
	}
}

// TestParquetGroupRows: wide tables get shorter row groups so that a
// group's numbers stay near 16 MiB (cloudwind's bound): 2^24/(8·17) =
// 123361 → 481 × 256; 2^24/(8·58) = 36157 → 141 × 256 (arithmetic, no
// source).
func TestParquetGroupRows(t *testing.T) {
	for _, c := range []struct{ ncols, want int }{{1, RowGroupRows}, {16, RowGroupRows}, {17, 123136}, {58, 36096}, {100000, parquetValueChunk}} {
		got := GroupRows(c.ncols)
		if got != c.want || got%parquetValueChunk != 0 {
			t.Errorf("GroupRows(%d) = %d, want %d (a multiple of %d)", c.ncols, got, c.want, parquetValueChunk)
		}
	}
}

// TestParquetGroups: row groups filled on several goroutines at once and
// committed in order give the same file as Write of the same rows, and a
// committed group is empty and may be refilled.
func TestParquetGroups(t *testing.T) {
	cols := []Column{{Name: "i"}, {Name: "v", IsString: true}, {Name: "b", IsBool: true}, {Name: "x"}}
	const n = 2*RowGroupRows + 777
	num, str, bools := make([][]float64, 4), make([][]string, 4), make([][]bool, 4)
	for i := 0; i < n; i++ {
		num[0] = append(num[0], float64(i))
		str[1] = append(str[1], testVerdicts[i/1000%3])
		bools[2] = append(bools[2], i%5 == 0)
		num[3] = append(num[3], specialValues[i%len(specialValues)])
	}
	all := fromColumns(cols, n, num, str, bools)
	want := writeParquet(t, cols, testMeta, all)

	var got bytes.Buffer
	p, err := NewParquetWriter(&got, cols, testMeta)
	if err != nil {
		t.Fatal(err)
	}
	groups := []*ParquetGroup{p.NewGroup(), p.NewGroup(), p.NewGroup()}
	errs := make([]error, len(groups))
	var wg sync.WaitGroup
	for k, g := range groups {
		wg.Add(1)
		go func() {
			defer wg.Done()
			lo, hi := k*RowGroupRows, min(n, (k+1)*RowGroupRows)
			for i := lo; i < hi && errs[k] == nil; i += 1000 { // batches that do not divide the chunks
				errs[k] = g.Write(all.slice(i, min(hi, i+1000)))
			}
			if errs[k] == nil {
				errs[k] = g.Encode()
			}
		}()
	}
	wg.Wait()
	for k, g := range groups {
		if errs[k] != nil {
			t.Fatalf("group %d: %v", k, errs[k])
		}
		if err := p.Commit(g); err != nil {
			t.Fatalf("Commit(group %d): %v", k, err)
		}
		if g.Rows() != 0 {
			t.Errorf("group %d holds %d rows after Commit, want 0", k, g.Rows())
		}
	}
	if err := p.Close(); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got.Bytes(), want) {
		t.Errorf("groups filled concurrently gave %d bytes, Write %d bytes; want the same file", got.Len(), len(want))
	}
	// A group takes at most GroupRows rows.
	g := p.NewGroup()
	if err := g.Write(all.slice(0, RowGroupRows+1)); err == nil || !strings.Contains(err.Error(), "do not fit") {
		t.Errorf("Write of %d rows to one group = %v, want an error", RowGroupRows+1, err)
	}
}

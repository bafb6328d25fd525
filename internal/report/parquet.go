package report

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"reflect"
	"unsafe"

	"github.com/klauspost/compress/s2"
	"github.com/parquet-go/parquet-go"
	"github.com/parquet-go/parquet-go/compress"
	"github.com/parquet-go/parquet-go/encoding"
	"github.com/parquet-go/parquet-go/format"

	"cloudwind/internal/safetext"
)

// RowGroupRows is the number of rows in each row group of a Parquet file
// but the last. A row group's pages are held in memory, compressed, until
// the group is committed to w, and only a few groups are in flight at
// once, so memory stays flat whatever the number of rows. Groups of this
// size also let readers load a large file one group at a time (common
// practice, no source).
const RowGroupRows = 1 << 17

// rowGroupBytes bounds the numbers one row group holds: a table with more
// than 16 columns gets shorter row groups, a multiple of parquetValueChunk
// rows, so that a group's pages stay small even where the numbers do not
// compress. Measured on sweeps at 10⁷ rows: 16 columns peak near 36 MB of
// RSS; 58 columns near 80 MB, which grows with the rows, since parquet-go
// keeps every group's column chunk and page index entries (about 1.2 KB a
// column chunk) until Close; bounds of 4, 8 or 16 MiB trade buffered pages
// for that metadata and peak alike.
const rowGroupBytes = 16 << 20

// pageBytes returns the size of the data pages of a table of ncols
// columns: pageBudget shared by the columns, from 64 KiB (readers' usual
// lower bound, common practice, no source) to the library's 256 KiB. Each
// column fills one page in memory before it is encoded, in every row group
// in flight: measured on the 16-column sweep at 10⁷ rows, 64 KiB pages
// peaked at 36 MB of RSS and 256 KiB pages at 48 MB, at the same speed.
func pageBytes(ncols int) int {
	return max(64<<10, min(256<<10, pageBudget/max(ncols, 1)))
}

// pageBudget is the page memory of one row group, shared by its columns.
const pageBudget = 1 << 20

// GroupRows returns the rows of each row group but the last for a table
// of ncols columns: RowGroupRows up to 16 columns, fewer beyond so that a
// group holds at most about 16 MiB of numbers.
func GroupRows(ncols int) int {
	n := rowGroupBytes / (8 * max(ncols, 1))
	n -= n % parquetValueChunk
	return max(parquetValueChunk, min(RowGroupRows, n))
}

// Keys of the Parquet file's key–value metadata.
const (
	// ParquetMetaKey holds the run's metadata, the same ordered object as
	// the "meta" of the JSON document, as JSON.
	ParquetMetaKey = "cloudwind.meta"
	// ParquetColumnsKey holds a JSON array with one object per column:
	// name, unit (astropy string, "" when dimensionless), datatype and
	// description, as the "columns" of the JSON document.
	ParquetColumnsKey = "cloudwind.columns"
)

// parquetValueChunk is the number of values handed to a column writer at
// a time. The library cuts a page at the end of a call, once its buffer
// exceeds the page size (pageBytes), so calls of a fixed size that divides
// RowGroupRows, counted from the start of the row group, cut the pages at
// the same rows however the caller splits the rows into batches: the file
// depends on the rows alone. Each column stages one chunk (24 bytes a
// value, 6 KiB); of 256 to 4096, none measured faster than another, and
// 256 keeps a row group of 58 columns 2.5 MB smaller (measured: 79 MB of
// RSS against 95 MB for the widest sweep at 10⁷ rows).
const parquetValueChunk = 256

// A Batch is a run of consecutive rows of a table of Width columns. The
// numbers are held row by row: row i's value in numeric column c is
// Num[i*Width+c] (the slots of string and bool columns are ignored; Num is
// nil when there is no numeric column). Strings and booleans, a few
// columns at most, are held column by column: Str[c] holds the Rows values
// of string column c, Bool[c] those of bool column c, nil for the others.
// Numbers row by row because that is how a sweep computes its rows:
// AppendRow adds one with a single copy rather than a store per column
// (measured on the 16-column sweep, the stores per column took a sixth of
// the Parquet writing time).
type Batch struct {
	Width int
	Rows  int
	Num   []float64
	Str   [][]string
	Bool  [][]bool

	strCols, boolCols []int // the string and bool columns
}

// NewBatch returns an empty batch for cols with room for capacity rows.
func NewBatch(cols []Column, capacity int) *Batch {
	b := &Batch{Width: len(cols), Str: make([][]string, len(cols)), Bool: make([][]bool, len(cols))}
	for c := range cols {
		switch {
		case cols[c].IsString:
			b.Str[c] = make([]string, 0, capacity)
			b.strCols = append(b.strCols, c)
		case cols[c].IsBool:
			b.Bool[c] = make([]bool, 0, capacity)
			b.boolCols = append(b.boolCols, c)
		default:
			if b.Num == nil {
				b.Num = make([]float64, 0, capacity*len(cols))
			}
		}
	}
	return b
}

// AppendRow adds a row: num, str and bools hold its values by column (each
// with Width values, the slots of the other kinds ignored), or are nil for
// a kind the table has no column of.
func (b *Batch) AppendRow(num []float64, str []string, bools []bool) {
	if b.Num != nil {
		b.Num = append(b.Num, num[:b.Width]...)
	}
	for _, c := range b.strCols {
		b.Str[c] = append(b.Str[c], str[c])
	}
	for _, c := range b.boolCols {
		b.Bool[c] = append(b.Bool[c], bools[c])
	}
	b.Rows++
}

// Reset empties b and keeps the memory for the next rows.
func (b *Batch) Reset() {
	b.Rows = 0
	if b.Num != nil {
		b.Num = b.Num[:0]
	}
	for c := range b.Str {
		if b.Str[c] != nil {
			clear(b.Str[c]) // drop the references to the strings
			b.Str[c] = b.Str[c][:0]
		}
	}
	for c := range b.Bool {
		if b.Bool[c] != nil {
			b.Bool[c] = b.Bool[c][:0]
		}
	}
}

// A ParquetWriter writes rows as an Apache Parquet file: one required
// column per Column, named Column.Name, in order; numeric columns as
// DOUBLE (NaN and ±Inf kept as IEEE values), bool columns as BOOLEAN,
// string columns as dictionary-encoded UTF-8 strings; Snappy-compressed
// pages, row groups of GroupRows rows, and the units, descriptions and
// run metadata in the file's key–value metadata (ParquetMetaKey,
// ParquetColumnsKey). The same rows and metadata give the same bytes.
//
// Rows reach the file in one of two ways, which give the same bytes:
// Write, on one goroutine, or row groups (NewGroup) filled and encoded on
// several goroutines at once and handed to Commit in file order.
//
// A ParquetWriter is not safe for concurrent use: Write, Commit and Close
// are called by one goroutine. After an error every later call returns
// that error.
type ParquetWriter struct {
	pw        *parquet.Writer
	cols      []Column
	groupSize int           // rows of a full row group, GroupRows
	cur       *ParquetGroup // the row group Write fills; nil before the first Write
	err       error
	closed    bool
}

// NewParquetWriter returns a writer of cols to w with the run's metadata
// meta. Nothing reaches w before the first row group is complete or Close
// is called.
func NewParquetWriter(w io.Writer, cols []Column, meta []Meta) (*ParquetWriter, error) {
	if len(cols) == 0 {
		return nil, errors.New("parquet: no columns to write")
	}
	seen := make(map[string]bool, len(cols))
	fields := make([]parquet.Field, len(cols))
	for i := range cols {
		c := &cols[i]
		switch {
		case c.Name == "":
			return nil, fmt.Errorf("parquet: column %d has no name", i+1)
		case seen[c.Name]:
			// Readers index columns by name; a repeated name would be lost.
			return nil, fmt.Errorf("parquet: column name %s appears twice", safetext.AppendJSON(nil, c.Name))
		case c.IsString && c.IsBool:
			return nil, fmt.Errorf("parquet: column %s is both string and bool", safetext.AppendJSON(nil, c.Name))
		}
		seen[c.Name] = true
		var node parquet.Node
		switch {
		case c.IsString:
			// Verdicts and criterion ids take a handful of values: a
			// dictionary stores each once and the rows as small indices.
			node = parquet.Encoded(parquet.String(), &parquet.RLEDictionary)
		case c.IsBool:
			node = parquet.Leaf(parquet.BooleanType)
		default:
			node = parquet.Leaf(parquet.DoubleType)
		}
		fields[i] = orderedField{Node: node, name: c.Name}
	}
	metaJSON, err := json.Marshal(OrderedJSON(meta))
	if err != nil {
		return nil, fmt.Errorf("parquet: metadata: %w", err)
	}
	colMeta := make([]any, len(cols))
	for i := range cols {
		c := &cols[i]
		colMeta[i] = OrderedJSON{{"name", c.Name}, {"unit", c.Unit}, {"datatype", c.datatype()}, {"description", c.Description}}
	}
	colJSON, err := json.Marshal(colMeta)
	if err != nil {
		return nil, fmt.Errorf("parquet: column metadata: %w", err)
	}
	schema := parquet.NewSchema("cloudwind", orderedGroup(fields))
	opts := []parquet.WriterOption{schema,
		// A fixed creator instead of the library's default, which embeds
		// the module version and build hash of the binary.
		&parquet.WriterConfig{CreatedBy: "cloudwind"},
		// Snappy: on BenchmarkParquetWrite's sweep-like columns it took
		// 154 ns a row against 144 without compression, for a file three
		// times smaller (42 MB against 128 MB: the fixed inputs and the
		// quantities of one axis repeat); zstd took 166 ns for 37 MB.
		// Every Parquet reader decodes Snappy without an extra package.
		// The block format of Snappy written by s2's fast encoder
		// (fastSnappy) rather than the library's codec, which uses s2's
		// "better" mode: measured on the 16-column sweep, the better mode
		// took a quarter of the writer's time for files a few per cent
		// smaller.
		parquet.Compression(fastSnappy{}),
		// Version 1 data pages: the version every reader accepts (and
		// pyarrow's default, from memory); with required columns there
		// are no levels, so version 2 would save nothing.
		parquet.DataPageVersion(1),
		parquet.PageBufferSize(pageBytes(len(cols))),
		parquet.KeyValueMetadata(ParquetMetaKey, string(safetext.EscapeJSON(metaJSON))),
		parquet.KeyValueMetadata(ParquetColumnsKey, string(safetext.EscapeJSON(colJSON))),
	}
	for i := range cols {
		if cols[i].IsString {
			// No min/max of the verdict words: finding them takes a sixth
			// of the writing time, and no query narrows row groups by the
			// alphabetical range of three words.
			opts = append(opts, parquet.SkipPageBounds(cols[i].Name), parquet.SkipPageStatistics(cols[i].Name))
		}
	}
	return &ParquetWriter{pw: parquet.NewWriter(w, opts...), cols: cols, groupSize: GroupRows(len(cols))}, nil
}

// Write adds the rows of b. A full row group goes to w at once; the rest
// stays buffered until the next Write or Close. b may be reset and
// refilled once Write returns: numbers are copied, and strings, which Go
// never changes, are only referred to.
func (p *ParquetWriter) Write(b *Batch) error {
	if err := p.usable(); err != nil {
		return err
	}
	if p.cur == nil {
		p.cur = p.NewGroup()
	}
	if err := p.cur.check(b); err != nil {
		return err
	}
	for lo := 0; lo < b.Rows; {
		hi := min(b.Rows, lo+p.groupSize-p.cur.rows)
		if err := p.cur.writeRows(b, lo, hi); err != nil {
			p.err = err
			return err
		}
		lo = hi
		if p.cur.rows == p.groupSize {
			if err := p.Commit(p.cur); err != nil {
				return err
			}
		}
	}
	return nil
}

// usable returns the error that stops every call after a failure, or
// after Close.
func (p *ParquetWriter) usable() error {
	if p.err != nil {
		return p.err
	}
	if p.closed {
		return errors.New("parquet: write after close")
	}
	return nil
}

// NewGroup returns an empty row group of p's columns. It may be filled
// (ParquetGroup.Write) and encoded (ParquetGroup.Encode) on any goroutine
// while other groups are, and is then handed to Commit. A committed group
// is empty again and may be refilled.
func (p *ParquetWriter) NewGroup() *ParquetGroup {
	g := &ParquetGroup{rg: p.pw.BeginRowGroup(), cols: p.cols, size: p.groupSize, staged: make([][]parquet.Value, len(p.cols))}
	for c := range g.staged {
		g.staged[c] = make([]parquet.Value, parquetValueChunk)
		switch {
		case p.cols[c].IsString:
			g.str = append(g.str, c)
		case p.cols[c].IsBool:
			g.bool = append(g.bool, c)
		default:
			g.num = append(g.num, c)
		}
	}
	return g
}

// Commit encodes what g still holds and appends it to the file as its
// next row group; g is then empty, to be refilled or dropped. A group with
// no rows adds nothing. Groups are committed in the order of their rows.
func (p *ParquetWriter) Commit(g *ParquetGroup) error {
	if err := p.usable(); err != nil {
		return err
	}
	if g.rows == 0 {
		return nil
	}
	if err := g.Encode(); err != nil {
		p.err = err
		return err
	}
	if _, err := g.rg.Commit(); err != nil {
		p.err = err
		return err
	}
	g.rows = 0
	return nil
}

// Close writes the buffered rows and the file's footer. It does not close
// w. A writer given no rows writes a valid file with 0 rows. After an
// error w holds a truncated file without a footer, which readers refuse;
// callers write through internal/atomicfile, which then leaves no file.
func (p *ParquetWriter) Close() error {
	if p.err != nil {
		return p.err
	}
	if p.closed {
		return nil
	}
	if p.cur != nil {
		if err := p.Commit(p.cur); err != nil {
			return err
		}
	}
	p.closed = true
	if err := p.pw.Close(); err != nil {
		p.err = err
		return err
	}
	return nil
}

// A ParquetGroup holds the rows of one row group of a ParquetWriter's file
// while they are encoded: up to GroupRows rows, written in order. Encoding
// and compressing the pages, most of a file's cost, happens as the group
// fills and in Encode, on the goroutine that calls them; Commit then only
// copies the pages to the file. A group is used by one goroutine at a time.
type ParquetGroup struct {
	rg             *parquet.ConcurrentRowGroupWriter
	cols           []Column
	num, str, bool []int             // the numeric, string and bool columns
	size           int               // the most rows the group takes, GroupRows
	rows           int               // rows written since the group was begun or committed
	staged         [][]parquet.Value // per column, parquetValueChunk slots for the chunk being filled
	nstaged        int               // the values staged in each column
}

// Rows returns the number of rows the group holds.
func (g *ParquetGroup) Rows() int { return g.rows }

// Write adds the rows of b after those the group holds; they must fit
// (at most GroupRows rows in all). b may be reset and refilled once Write
// returns, as for ParquetWriter.Write.
func (g *ParquetGroup) Write(b *Batch) error {
	if err := g.check(b); err != nil {
		return err
	}
	if g.rows+b.Rows > g.size {
		return fmt.Errorf("parquet: %d rows do not fit a row group of %d rows holding %d", b.Rows, g.size, g.rows)
	}
	return g.writeRows(b, 0, b.Rows)
}

// Encode encodes and compresses the rows still staged, so that Commit has
// only to copy the group's pages.
func (g *ParquetGroup) Encode() error {
	if err := g.flushStaged(); err != nil {
		return err
	}
	if err := g.rg.Flush(); err != nil {
		return fmt.Errorf("parquet: %w", err)
	}
	return nil
}

// check reports a batch whose shape does not match the columns: a
// programming error, returned rather than panicking mid-file.
func (g *ParquetGroup) check(b *Batch) error {
	switch {
	case b.Rows < 0:
		return fmt.Errorf("parquet: batch has %d rows", b.Rows)
	case b.Rows == 0:
		return nil // nothing to write, whatever the shape
	}
	if b.Width != len(g.cols) {
		return fmt.Errorf("parquet: batch rows have %d columns, want %d", b.Width, len(g.cols))
	}
	if len(g.num) > 0 && len(b.Num) != b.Rows*b.Width {
		return fmt.Errorf("parquet: a batch of %d rows of %d columns has %d numbers, want %d", b.Rows, b.Width, len(b.Num), b.Rows*b.Width)
	}
	for c := range g.cols {
		col := &g.cols[c]
		var n int
		switch {
		case col.IsString:
			n = lenAt(b.Str, c)
		case col.IsBool:
			n = lenAt(b.Bool, c)
		default:
			continue
		}
		if n != b.Rows {
			return fmt.Errorf("parquet: column %s has %d values in a batch of %d rows", safetext.AppendJSON(nil, col.Name), n, b.Rows)
		}
	}
	return nil
}

// lenAt is len(s[i]), 0 when s has no element i.
func lenAt[T any](s [][]T, i int) int {
	if i >= len(s) {
		return 0
	}
	return len(s[i])
}

// writeRows stages rows lo to hi of b and hands each full chunk of
// parquetValueChunk values of every column to the column writers. The
// numbers are staged row by row, in the order b holds them.
func (g *ParquetGroup) writeRows(b *Batch, lo, hi int) error {
	w := b.Width
	for i := lo; i < hi; {
		n := g.nstaged
		k := min(hi-i, parquetValueChunk-n)
		for j := range k {
			row := b.Num[(i+j)*w : (i+j+1)*w]
			for _, c := range g.num {
				g.staged[c][n+j] = parquet.DoubleValue(row[c])
			}
		}
		for _, c := range g.str {
			vs := g.staged[c][n : n+k]
			for j, s := range b.Str[c][i : i+k] {
				// A read-only view of the string's bytes, without a copy;
				// the dictionary copies each new value it sees.
				vs[j] = parquet.ByteArrayValue(unsafe.Slice(unsafe.StringData(s), len(s)))
			}
		}
		for _, c := range g.bool {
			vs := g.staged[c][n : n+k]
			for j, v := range b.Bool[c][i : i+k] {
				vs[j] = parquet.BooleanValue(v)
			}
		}
		g.nstaged += k
		g.rows += k
		i += k
		if g.nstaged == parquetValueChunk {
			if err := g.flushStaged(); err != nil {
				return err
			}
		}
	}
	return nil
}

// flushStaged hands the staged values of every column to its writer.
func (g *ParquetGroup) flushStaged() error {
	if g.nstaged == 0 {
		return nil
	}
	cws := g.rg.ColumnWriters()
	for c := range g.cols {
		vs := g.staged[c][:g.nstaged]
		_, err := cws[c].WriteRowValues(vs)
		clear(vs) // drop the references to the caller's strings
		if err != nil {
			return fmt.Errorf("parquet: column %s: %w", safetext.AppendJSON(nil, g.cols[c].Name), err)
		}
	}
	g.nstaged = 0
	return nil
}

// orderedGroup is a Parquet group whose fields keep the order given:
// parquet.Group is a map and sorts its fields by name, but the file's
// columns must come in the order of the table's columns.
type orderedGroup []parquet.Field

func (g orderedGroup) ID() int                     { return 0 }
func (g orderedGroup) String() string              { return fmt.Sprintf("group(%d fields)", len(g)) }
func (g orderedGroup) Type() parquet.Type          { return parquet.Group{}.Type() }
func (g orderedGroup) Optional() bool              { return false }
func (g orderedGroup) Repeated() bool              { return false }
func (g orderedGroup) Required() bool              { return true }
func (g orderedGroup) Leaf() bool                  { return false }
func (g orderedGroup) Fields() []parquet.Field     { return g }
func (g orderedGroup) Encoding() encoding.Encoding { return nil }
func (g orderedGroup) Compression() compress.Codec { return nil }

// GoType is the struct a row would decode to; the writer never decodes
// rows into Go values, so a map type stands for it.
func (g orderedGroup) GoType() reflect.Type { return reflect.TypeFor[map[string]any]() }

// orderedField is one named column of an orderedGroup.
type orderedField struct {
	parquet.Node
	name string
}

func (f orderedField) Name() string { return f.name }

// Value returns the field's value in a row given as a map (GoType); the
// writer never calls it.
func (f orderedField) Value(base reflect.Value) reflect.Value {
	if base.Kind() == reflect.Map {
		return base.MapIndex(reflect.ValueOf(f.name))
	}
	return reflect.Value{}
}

// fastSnappy is the SNAPPY codec with s2's fast block encoder
// (s2.EncodeSnappy), whose output is plain Snappy that every Parquet
// reader decodes (s2's documentation: "compatible with Snappy").
type fastSnappy struct{}

func (fastSnappy) String() string                            { return "SNAPPY" }
func (fastSnappy) CompressionCodec() format.CompressionCodec { return format.Snappy }

func (fastSnappy) Encode(dst, src []byte) ([]byte, error) {
	return s2.EncodeSnappy(dst[:cap(dst)], src), nil
}

func (fastSnappy) Decode(dst, src []byte) ([]byte, error) {
	return s2.Decode(dst[:cap(dst)], src)
}

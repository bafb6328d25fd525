package cli

import (
	"context"
	"io"

	"cloudwind/internal/report"
)

// runSweepParquet evaluates the grid in parallel and writes the rows to w
// as one Parquet file (report.ParquetWriter). The unit of work is a whole
// row group (report.GroupRows rows, counted from the shard's first row):
// each worker evaluates its group's rows a batch of parquetBatchRows rows
// at a time and encodes and compresses them into the group, and this
// goroutine only commits the finished groups in grid order, copying their
// pages to w. Encoding, most of the writer's cost, is thus spread over the
// workers. The file is the same whatever the number of workers: the pages
// of a group are cut at the same rows however it is filled. At most
// parquetInFlight groups exist at once, so memory stays flat however large
// the grid.
func runSweepParquet(ctx context.Context, e *env, opt *sweepOptions, w io.Writer) error {
	plan, err := planSweep(opt)
	if err != nil {
		return err
	}
	pw, err := report.NewParquetWriter(w, opt.cols, sweepMeta(opt))
	if err != nil {
		return err
	}
	// The free groups: committed groups are refilled rather than begun
	// anew, which would allocate every column's page buffers again.
	free := make(chan *report.ParquetGroup, parquetInFlight(opt.workers))
	err = runChunks(ctx, e, opt, report.GroupRows(len(opt.cols)), parquetInFlight(opt.workers),
		func() func(lo, hi int) (*report.ParquetGroup, error) {
			sw := newSweepWorker(opt, plan)
			b := report.NewBatch(opt.cols, parquetBatchRows)
			return func(lo, hi int) (*report.ParquetGroup, error) {
				var g *report.ParquetGroup
				select {
				case g = <-free:
				default:
					g = pw.NewGroup()
				}
				return g, sw.group(g, b, lo, hi)
			}
		},
		pw.Commit,
		func(g *report.ParquetGroup) {
			if g.Rows() != 0 { // not committed: dropped after an error
				return
			}
			select {
			case free <- g:
			default:
			}
		})
	if err != nil {
		return err
	}
	return pw.Close()
}

// parquetInFlight returns how many row groups may be in flight, produced
// or being produced and not yet committed: one per worker and one more,
// so that a worker can start its next group while the last one is
// committed. Each group holds its rows' compressed pages and the page being
// filled of every column (report.GroupRows bounds both).
func parquetInFlight(workers int) int { return workers + 1 }

// group evaluates grid rows lo to hi (exclusive) into g, through b in
// batches of sweepChunk rows, and encodes them (report.ParquetGroup.Encode).
func (sw *sweepWorker) group(g *report.ParquetGroup, b *report.Batch, lo, hi int) error {
	for i := lo; i < hi; i += parquetBatchRows {
		if err := sw.batch(b, i, min(i+parquetBatchRows, hi)); err != nil {
			return err
		}
		if err := g.Write(b); err != nil {
			return err
		}
	}
	return g.Encode()
}

// batch fills b with grid rows lo to hi (exclusive).
func (sw *sweepWorker) batch(b *report.Batch, lo, hi int) error {
	b.Reset()
	return sw.eachRow(lo, hi, func(int) {
		sw.values()
		b.AppendRow(sw.num, sw.str, nil)
	})
}

// parquetBatchRows is the number of rows a worker evaluates into its batch
// before handing them to its row group: 256 rows of 16 columns, 96 KiB,
// stay in the core's cache while the group reads them column by column.
const parquetBatchRows = 256

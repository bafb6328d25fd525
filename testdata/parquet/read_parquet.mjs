// read_parquet.mjs reads a Parquet file that cloudwind wrote with hyparquet,
// an independent pure-JavaScript reader (https://github.com/hyparam/hyparquet),
// and compares every value with a CSV file of the same rows.
//
//	node read_parquet.mjs HYPARQUET_DIR FILE.parquet FILE.csv [RTOL]
//
// HYPARQUET_DIR is the unpacked npm package (the directory holding its
// package.json), as fetch-hyparquet.sh leaves it. The CSV has a header line of
// column names and one line per row, formatted as cloudwind's CSV: numbers
// with nine significant figures or nan, inf, -inf; true/false; bare strings.
//
// Checks: the Parquet columns are the CSV's, in order; each has the physical
// type of its kind (DOUBLE, BOOLEAN, or BYTE_ARRAY with the STRING logical
// type) and is required; string columns are dictionary-encoded; the
// key-value metadata "cloudwind.meta" and "cloudwind.columns" hold valid JSON
// and the latter names the columns in order; every value equals the CSV's:
// strings and booleans exactly, numbers as IEEE doubles, NaN matching nan and
// ±Infinity matching ±inf, finite numbers exactly or within 1e-15 relative
// (the caller writes values that have nine significant figures, so the CSV
// text is the exact double), or within RTOL relative when given (a sweep's
// CSV rounds full doubles to nine figures: 1e-8).
//
// It prints a summary and "ok", or the first mismatches and exits with 1.
import { readFile } from 'node:fs/promises'
import { join } from 'node:path'
import { pathToFileURL } from 'node:url'

const [dir, parquetPath, csvPath, rtolArg] = process.argv.slice(2)
const rtol = rtolArg === undefined ? 1e-15 : Number(rtolArg)
if (!csvPath) {
  console.error('usage: node read_parquet.mjs HYPARQUET_DIR FILE.parquet FILE.csv')
  process.exit(2)
}
const pkg = JSON.parse(await readFile(join(dir, 'package.json'), 'utf8'))
if (pkg.name !== 'hyparquet') {
  console.error(`${dir} holds the package ${JSON.stringify(pkg.name)}, not hyparquet`)
  process.exit(2)
}
const { asyncBufferFromFile, parquetMetadataAsync, parquetRead } = await import(pathToFileURL(join(dir, 'src', 'node.js')).href)

const problems = []
const problem = (msg) => { if (problems.length < 20) problems.push(msg) }

const file = await asyncBufferFromFile(parquetPath)
const metadata = await parquetMetadataAsync(file)
const leaves = metadata.schema.slice(1)
const names = leaves.map(e => e.name)

// The CSV: header, then rows; no field of cloudwind's CSV is quoted.
const lines = (await readFile(csvPath, 'utf8')).split('\n')
if (lines.at(-1) === '') lines.pop()
const header = lines.shift().split(',')
if (JSON.stringify(header) !== JSON.stringify(names)) {
  problem(`columns: parquet ${JSON.stringify(names)}, csv ${JSON.stringify(header)}`)
}
if (metadata.schema[0].num_children !== leaves.length) {
  problem(`schema root has ${metadata.schema[0].num_children} children for ${leaves.length} columns`)
}

// Kinds from the schema, checked against what cloudwind writes.
const kinds = leaves.map((e) => {
  if (e.repetition_type !== 'REQUIRED') problem(`column ${e.name}: repetition ${e.repetition_type}, want REQUIRED`)
  if (e.type === 'DOUBLE') return 'number'
  if (e.type === 'BOOLEAN') return 'bool'
  if (e.type === 'BYTE_ARRAY' && e.logical_type?.type === 'STRING') return 'string'
  problem(`column ${e.name}: type ${e.type} (${JSON.stringify(e.logical_type)}), want DOUBLE, BOOLEAN or a STRING`)
  return 'unknown'
})
for (const [g, rg] of metadata.row_groups.entries()) {
  for (const [c, chunk] of rg.columns.entries()) {
    const enc = chunk.meta_data.encodings
    if (kinds[c] === 'string' && !(enc.includes('RLE_DICTIONARY') || enc.includes('PLAIN_DICTIONARY'))) {
      problem(`row group ${g} column ${names[c]}: encodings ${enc}, want a dictionary`)
    }
  }
}

const kv = new Map((metadata.key_value_metadata ?? []).map(({ key, value }) => [key, value]))
for (const key of ['cloudwind.meta', 'cloudwind.columns']) {
  if (!kv.has(key)) { problem(`no key-value metadata ${key}`); continue }
  try {
    const v = JSON.parse(kv.get(key))
    if (key === 'cloudwind.columns' && JSON.stringify(v.map(c => c.name)) !== JSON.stringify(names)) {
      problem(`cloudwind.columns names ${JSON.stringify(v.map(c => c.name))}, want ${JSON.stringify(names)}`)
    }
  } catch (e) {
    problem(`key-value metadata ${key} is not JSON: ${e.message}`)
  }
}

let rows = []
await parquetRead({ file, metadata, onComplete: (data) => { rows = data } })
if (rows.length !== lines.length || Number(metadata.num_rows) !== lines.length) {
  problem(`rows: parquet ${rows.length} (footer ${metadata.num_rows}), csv ${lines.length}`)
}

// number parses a CSV field as cloudwind writes it.
const number = (s) => s === 'nan' ? NaN : s === 'inf' ? Infinity : s === '-inf' ? -Infinity : Number(s)
const sameNumber = (got, want) => {
  if (Number.isNaN(want)) return Number.isNaN(got)
  if (!Number.isFinite(want)) return got === want
  return Object.is(got, want) || Math.abs(got - want) <= rtol * Math.abs(want)
}
for (let i = 0; i < Math.min(rows.length, lines.length); i++) {
  const fields = lines[i].split(',')
  for (let c = 0; c < names.length; c++) {
    const got = rows[i][c]
    const text = fields[c]
    let ok
    switch (kinds[c]) {
      case 'number': ok = typeof got === 'number' && text !== '' && sameNumber(got, number(text)); break
      case 'bool': ok = typeof got === 'boolean' && String(got) === text; break
      case 'string': ok = got === text; break
      default: ok = false
    }
    if (!ok) problem(`row ${i + 1} column ${names[c]}: parquet ${JSON.stringify(String(got))}, csv ${JSON.stringify(text)}`)
  }
}

console.log(`hyparquet ${pkg.version}`)
console.log(`created_by ${JSON.stringify(metadata.created_by)}`)
console.log(`rows ${rows.length} in ${metadata.row_groups.length} row groups`)
console.log(`columns ${leaves.map((e, c) => `${e.name}:${kinds[c]}`).join(' ')}`)
console.log(`codecs ${[...new Set(metadata.row_groups.flatMap(rg => rg.columns.map(ch => ch.meta_data.codec)))].join(' ')}`)
console.log(`metadata keys ${[...kv.keys()].join(' ')}`)
if (problems.length > 0) {
  for (const p of problems) console.log(`mismatch: ${p}`)
  process.exit(1)
}
console.log('ok')

// Package config reads the files people write for cloudwind: criteria
// files now, scenario files later. Every error names the file and the line
// of the problem.
//
// # The TOML subset
//
// ParseTOML reads a strict subset of TOML v1.0.0 (https://toml.io/en/v1.0.0)
// with a reader of its own:
//
//   - UTF-8 text with LF or CRLF line endings and an optional byte-order
//     mark; invalid UTF-8 and control characters other than tab are errors
//     anywhere, comments included;
//   - # comments and blank lines;
//   - [table] and [table.sub] headers, and [[array]] headers for arrays of
//     tables, where [array.sub] is a sub-table of the array's last element;
//   - key = value with bare keys (A-Z, a-z, 0-9, '_', '-');
//   - basic strings "..." with the escapes \" \\ \n \t \r \uXXXX and
//     \UXXXXXXXX, and literal strings '...';
//   - integers (decimal with sign and '_' between digits, 0x, 0o, 0b),
//     floats (fraction, exponent, inf and nan), and true and false;
//   - arrays of those scalars, on one line or several, with a trailing
//     comma and comments allowed.
//
// Valid TOML outside the subset (quoted and dotted keys, inline tables,
// nested arrays, multi-line strings, the escapes \b and \f, dates and
// times) is refused with an error wrapping ErrUnsupported, which reads
// "... not supported by cloudwind's TOML reader". Invalid TOML (duplicate
// keys, a table defined twice, a key that is also a table) is refused too.
// Inputs beyond MaxInputSize, MaxTableDepth, MaxTables or MaxValues are
// refused with ErrTooLarge, so no file can exhaust memory.
//
// # Criteria files
//
// A criteria file corrects a constant of a built-in criterion or adds a
// criterion from a new paper, without recompiling. LoadCriteria reads one:
//
//	# cloudwind criteria file
//	[[criterion]]
//	id = "li-2020"          # an existing built-in id: only the keys given here change
//	alpha = 5
//	verified = true
//	status = "alpha checked against Li et al. 2020, Sec. 4"
//
//	[[criterion]]
//	id = "my-2026"           # a new id: every key down to alpha is required
//	label = "Me et al. 2026"
//	authors = "Me, You & Them"
//	year = 2026
//	journal = "MNRAS 999, 1" # "" when not known
//	arxiv = "2601.00001"     # "" when there is none
//	equation = "12"          # "" when not read from the paper
//	cooling_time = "mix"     # none | hot | mix | minmix | cold
//	dynamical_time = "t_cc"  # t_cc | t_shear
//	alpha = 1.0
//	beta = -0.5              # optional, default 0
//	verified = false         # optional, default false
//	status = "from memory — check the paper"
//	note = "one-line summary"
//	[criterion.range]        # optional: the calibrated range of the criterion above
//	chi = [100, 1000]        # [min, max]; omit a key for no limit
//	mach = [1, 10]
//	t_cloud = [1e4, 4e4]     # K
//	status = "from the paper's Table 1"
//
// The criterion tested is τ_cool,X / τ_dyn,Y < α (χ/100)^β, with X the
// cooling_time and Y the dynamical_time; see model.Criterion.
//
// Rules, checked with the line of the offending key or header:
//
//   - the only table is [[criterion]] with its [criterion.range]; no key
//     may stand outside them, and unknown keys are errors that suggest the
//     closest known key;
//   - an id may appear once per file;
//   - numbers must be finite, except in ranges, where -inf as min or inf
//     as max leaves that side open (omit the key to leave both open);
//   - strings are stored as written but may not hold control characters
//     (raw or escaped);
//   - year is an integer from 1 to 9999;
//   - the merged criterion must pass (*model.Criterion).Validate.
//
// Status texts written by the merge: an override that changes alpha, beta,
// cooling_time or dynamical_time without saying verified = true becomes
// unverified with Status "changed by criteria file NAME: " followed by the
// file's status or "not verified"; with verified = true but no status it
// gets "changed by criteria file NAME: marked verified, no status given".
// An override that changes a range interval without a range status gets
// Range.Status "changed by criteria file NAME". A new criterion without a
// status gets "from criteria file NAME, no status given", and without a
// range status "not given in criteria file NAME".
package config

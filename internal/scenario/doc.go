// Package scenario reads the files people write for cloudwind: criteria
// files and scenario files. Every error names the file and the line of the
// problem.
//
// # Reading TOML
//
// Files are TOML v1.0.0 (https://toml.io/en/v1.0.0), read by ParseTOML
// with go-toml v2 (github.com/pelletier/go-toml/v2, v2.4.3): comments,
// [table] and [[array]] headers, bare, quoted and dotted keys, inline
// tables, basic and literal strings on one line or several, with every
// escape, integers, floats, booleans, dates and times, and arrays of any
// of these, nested or mixed. A byte-order mark at the start is skipped. A
// table means the same however it is written: [inputs] followed by
// radius = 5, inputs.radius = 5 at the top, and inputs = {radius = 5} are
// one thing, and so are [[criterion]] tables and criterion = [{...}, ...].
// go-toml implements TOML v1.1.0, which adds to v1.0.0, so files using its
// additions (inline tables over several lines, the escapes \e and \xHH,
// times without seconds) are read too; other TOML v1.0.0 readers may refuse
// them.
//
// The rules that stay cloudwind's:
//
//   - every error is a *ParseError naming the file and the line, printed
//     "FILE:LINE: message" on one line; what go-toml finds wrong (syntax,
//     a duplicate key, a table defined twice) wraps ErrSyntax and reads
//     "invalid TOML: ...", on the line of the duplicate and, when known,
//     with the line of the first definition;
//   - files beyond MaxInputSize are refused before parsing, and beyond
//     MaxTableDepth, MaxTables, MaxKeys or MaxValues before go-toml decodes
//     them (its check for duplicates takes time quadratic in the number of
//     keys), with ErrTooLarge, so no file can take much memory or time;
//   - no key below the tables (chi, name, alpha, ...) takes a date, a time
//     or a table: such a value is refused on its line, naming the key, as
//     any value of the wrong type is ("name must be a string, not a local
//     date");
//   - strings are checked once decoded, whatever their form: no control
//     characters, raw or escaped (so \b, \f, \e and the line breaks of a
//     multi-line string are refused where a string is read), and in
//     scenario files no line separators or bidirectional overrides; text
//     of the file quoted back in a message passes through safetext.Clip.
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
//	cooling_time = "mix"     # none | hot | mix | minmix | cold | shocked | grow (t_grow, not a cooling time)
//	dynamical_time = "t_cc"  # t_cc | t_shear | t_cc,turb (t_cc/(1 + (M_turb/(f_mix M))²)^1/2)
//	alpha = 1.0
//	beta = -0.5              # optional, default 0
//	f_mix = 0.6              # optional, for t_cc,turb; default 0.6
//	warm_temperature = 1e4   # optional: a colder cloud failing the test is "transformed" when gas at this T passes
//	uncertainty = 2          # optional: the factor α may be off by; default 2 unverified, 1 verified
//	verified = false         # optional, default false
//	status = "from memory — check the paper"
//	note = "one-line summary"
//	[criterion.range]        # optional: the calibrated range of the criterion above
//	chi = [100, 1000]        # [min, max]; omit a key for no limit
//	mach = [1, 10]
//	t_cloud = [1e4, 4e4]     # K
//	mach_turb = [0.25, 0.75] # turbulent Mach number; omitted = calibrated without turbulence
//	status = "from the paper's Table 1"
//
// The criterion tested is τ_cool,X / τ_dyn,Y < α (χ/100)^β, with X the
// cooling_time and Y the dynamical_time; see model.Criterion.
//
// Rules, checked with the line of the offending key or header:
//
//   - the only table is [[criterion]] with its [criterion.range] (in any
//     form TOML allows, as criterion = [{id = "li-2020", alpha = 5}] or
//     range = {chi = [100, 1000]}); no key may stand outside them, and
//     unknown keys are errors that suggest the closest known key;
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
//
// # Scenario files
//
// A scenario file holds one problem as the explorer saves it: the inputs,
// the conventions and the cooling function. Parse reads one and
// Write writes one:
//
//	# cloudwind scenario
//	[scenario]
//	name = "Starburst outflow, inner kpc"  # shown in the explorer
//	description = "free text"
//	demo = false              # true only for cloudwind's fictional demo scenarios
//
//	[inputs]                  # a key left out takes the fiducial value of model.Fiducial()
//	chi = 300                 # rho_cl/rho_hot
//	mach = 1.5
//	pressure = 1e5            # P/k_B in K cm^-3
//	t_cloud = 1e4             # K
//	radius = 10               # pc
//	metallicity = 1           # Z/Z_sun
//	mach_turb = 0             # turbulent Mach number of the hot gas (optional, default 0)
//
//	[conventions]             # every key optional; left out = the model default
//	gamma = 1.6666666666666667
//	mu = 0.6
//	mu_cloud = 0.6
//	mu_hot = 0.6
//	mixture = "A09"           # A09, A09p, AG89, GS98 or A21 (model.Mixtures)
//	hydrogen_fraction = 0.7381
//	t_floor = 1e4             # K; left out = the cloud temperature
//	heat_capacity = "isochoric"  # or "isobaric"
//	density_product = "nh2"      # or "n2", "neni"
//	mix_cooling = "minmix"       # the growth model's cooling time: minmix (default), cold, mix or hot
//
//	[cooling]                 # optional; left out = the program's default
//	spec = "builtin"          # a name, const:LAMBDA, powerlaw:L0,T0,SLOPE or a table path
//	table = ["norm: nH2", "columns: T=1 lambda=2"]  # settings for a table path
//
// Rules, checked with the line of the offending key or table header:
//
//   - the tables are [scenario], [inputs], [conventions] and [cooling], each
//     at most once and all optional (in any form TOML allows); no key may
//     stand outside them, and unknown keys and tables are errors that
//     suggest the closest known one;
//   - numbers must be finite; integers and floats are both accepted;
//   - a convention number may not be 0 (which the model reads as "use the
//     default"): leave the key out for the default;
//   - mixture, heat_capacity, density_product and mix_cooling take the names above;
//   - strings may not hold control characters (raw or escaped), line
//     separators or bidirectional overrides (U+2028–U+202E,
//     U+2066–U+2069), so no file can disguise what the explorer shows;
//   - table needs spec; the program, not this package, resolves spec, and
//     reads a relative table path from the scenario file's directory;
//   - the inputs and conventions together must pass
//     (model.Params).Validate; its error is reported on the line of the key
//     it names (for the wind-temperature check on chi, on t_cloud or the
//     μ keys when chi is left out).
//
// Write writes every input and only the conventions that are set
// (non-zero in model.Params), with numbers in their shortest round-tripping
// form, so that reading the file back gives an equal Scenario.
package scenario

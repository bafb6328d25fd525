// Package assets holds the data files that cloudwind embeds, and nothing
// else: FS gives read access to them, and SOURCES.md states the provenance
// and licence of every file. Parsing lives with the code that uses each
// file (package cooling).
//
// Every data file starts with a header of "# key: value" comment lines
// naming at least its source, licence, units and log base; a test in
// package cooling checks that each embedded file parses and has them.
package assets

import "embed"

// FS is the embedded data: chianti_metals_fit.txt (the metal part of the
// built-in CIE cooling function as fit coefficients) and SOURCES.md.
//
//go:embed chianti_metals_fit.txt SOURCES.md
var FS embed.FS

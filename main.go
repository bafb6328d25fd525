// Command cloudwind tells whether a cold cloud in a hot wind survives and
// grows or is destroyed, according to each published criterion, and shows
// why: threshold radii, timescale ratios and verdicts, in a terminal
// explorer and from scripts.
//
// Usage:
//
//	cloudwind [explore]       open the explorer
//	cloudwind eval [flags]    evaluate one scenario
//	cloudwind sweep [flags]   evaluate a grid of scenarios
//	cloudwind help [COMMAND]  show help and the other commands
//
// The commands live in package cloudwind/internal/cli.
package main

import (
	"os"

	"cloudwind/internal/cli"
)

func main() { os.Exit(cli.Main(os.Args[1:])) }

// Command rigmix plans geotechnical subsurface exploration programs.
package main

import (
	"os"

	"github.com/rigmix/rigmix/cmd/rigmix/internal/cli"
)

func main() { os.Exit(cli.Main(os.Args[1:], os.Stdout, os.Stderr)) }

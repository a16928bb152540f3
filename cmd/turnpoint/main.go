package main

import (
	_ "github.com/BurntSushi/toml"
	_ "github.com/spf13/pflag"
	_ "gonum.org/v1/gonum/mat"
	_ "gonum.org/v1/gonum/mathext"
	_ "gonum.org/v1/plot"
)

func main() {}

// Package special provides the complex log-Gamma function and the phase
// φ(ε) of the parabolic-cylinder (Weber) connection used by the uniform
// barrier formulae.
package special

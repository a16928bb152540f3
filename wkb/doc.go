// Package wkb holds the canonical equation y″ + (λ²Q + Q1) y = 0 and the
// phase-integral (WKB) machinery built on it.
package wkb

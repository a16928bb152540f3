// Package validate holds no code: its tests run the whole turnpoint pipeline
// (cases.Parse, then study.Run) on cases of its own and compare every figure
// with independent high-precision references in testdata/references.txt,
// which reference/make_references.py computes with mpmath (Taylor-series
// integration at 40 digits and published closed forms).
//
// Each figure is judged twice: the numerical figure must agree with the
// reference within its own stated error estimate and to the accuracy the
// design promises, and the WKB figure's true error must lie within its
// stated estimate. Estimates that overstate the true error by more than a
// factor of 100 are logged, not failed.
package validate

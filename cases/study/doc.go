// Package study runs the studies a case file asks for — turning points,
// Stokes geometry, scattering scans and bound-state levels — computing each
// figure by WKB and by direct numerical integration and judging whether the
// two agree within their stated error estimates.
package study

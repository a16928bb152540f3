// Package eigen computes bound-state energies of a one-dimensional
// Schrödinger problem, −(ħ²/2m)ψ″ + Vψ = Eψ on [A, B], by direct numerical
// integration, identifying each level by its quantum number n, the number of
// interior nodes of its eigenfunction. It is the independent check of the
// WKB quantisation in wkb/levels.
//
// # Method
//
// The potential is replaced cell by cell by its mean and its slope, on a
// mesh adapted to V alone: a cell is a fraction of the local length
// min(|q′|^(-1/3), |q″|^(-1/4), |q‴|^(-1/5)), q = 2mV/ħ². The mean is
// propagated exactly in sin/cos or sinh/cosh (Pruess' piecewise-constant
// approximation; Pruess, SIAM J. Numer. Anal. 10, 55 (1973)) and the slope
// by its first-order effect in the interaction picture of the constant
// problem, a symmetric step in the spirit of Ixaru's constant-perturbation
// methods, which makes the eigenvalue error O(h⁴) at every energy. The step
// never depends on E, and a scaled Prüfer angle tan θ = kψ/ψ′ advances by
// exactly kh over each half cell, the slope only rescaling ψ and ψ′: the node
// count is exact for the discretised problem however many oscillations a
// cell holds (Sturm oscillation).
//
// Solutions are shot from both ends to a matching node in a classically
// allowed region (in the level's own well, chosen where the matching
// function is least steep); the number of levels below E is ⌈D/π⌉ with
// D = θ_L − θ_R there, which brackets E_n, and Brent's method solves
// D(E) = nπ to rounding. Open ends start from the decaying WKB solution with
// its first two corrections, ψ′/ψ = ±√q − q′/(4q) ± (q″/(8q^(3/2)) −
// 5q′²/(32q^(5/2))), as far as the terms decrease; where the forbidden-region
// action from the turning point exceeds 20 the shot starts there instead,
// the rest being below rounding.
//
// # Accuracy
//
// The error of the discretised eigenvalue is an expansion in even powers of
// the cell size h, from h⁴ on; the energies on nested meshes (every cell
// halved) are Richardson-extrapolated, and the error estimate Err of every
// level is the larger of the last correction and the change from the
// previous mesh, for the extrapolant where that is smallest. A
// mirror-symmetric potential gets a mirror-symmetric mesh, so that nearly
// degenerate doublets (splittings down to ~1e-13 of the level) stay exact
// doublets on every mesh and are told apart by their node counts n and n+1;
// on an asymmetric mesh a level within the discretisation error of another
// is flagged NearDegenerate. The decay factor exp(−∫√(2m(V−E))/ħ) from the
// outer turning point to each open end is reported, and an end closer than
// the tolerance flags the level IntervalShort. The decaying WKB start is
// exact only to its next term, so wherever the decay factor exceeds 1e-9
// the level is solved again on the finest mesh with the last of those terms
// dropped (ψ = 0 where only √q is used) and the change of E is added to
// Err: an open end inside a centrifugal barrier, where the WKB start is off
// by a fraction of a per cent, shows up in Err and not only in the warning.
//
// # Cost
//
// A sweep costs the same at every energy on a given mesh; the work per level
// is set by the cells of the classically allowed region (plus a fixed
// margin), not by the number of oscillations, apart from a halving or two
// more at large n (see BenchmarkLevelN).
package eigen

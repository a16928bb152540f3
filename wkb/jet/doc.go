// Package jet provides arithmetic on truncated complex Taylor series ("jets"),
// so that an analytic function built from elementary operations yields exact
// derivatives of any order at a point of the complex plane.
//
// A Series s of length n+1 stands for
//
//	f(z0 + h) = s[0] + s[1] h + s[2] h² + … + s[n] hⁿ + O(hⁿ⁺¹),
//
// so s[k] = f⁽ᵏ⁾(z0)/k!. All operations keep the length of their arguments;
// mixing series of different lengths panics (a programming error).
//
// The recurrences are the standard ones of automatic differentiation, see
// Griewank & Walther, Evaluating Derivatives (SIAM, 2nd ed. 2008), §13.2.
package jet

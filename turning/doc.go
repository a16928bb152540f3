// Package turning finds the turning points (zeros) and singularities (poles)
// of Q in a rectangle of the complex plane, by the argument principle with
// subdivision and Newton polishing on exact Taylor derivatives.
package turning

// Package cases loads TOML case files strictly, reporting every problem at
// its file:line:column, and builds the canonical problem
//
//	y″(x) + (λ² Q(x) + Q1(x)) y(x) = 0
//
// of a case at its own values or at any point of its scan.
//
// # The case file
//
// A case file is TOML. Every key is listed here; any other key is an error
// (with a suggestion when it looks like a misspelling), and so is a missing
// required key, a value of the wrong type, NaN or infinity anywhere, and a
// value no problem could have (a negative mass, a reversed interval).
//
//	# What the case models and where its check values come from.
//	title = "Graded anti-reflection layer"   # optional
//	form = "graded"                          # "schrodinger", "graded" or "general"
//
//	[parameters]     # optional: named real constants usable in every formula
//	w = 0.4
//
// Parameter names are identifiers (letters, digits and _, not starting with a
// digit) and may not be x (the variable), pi or i (constants), E (the
// energy) or the name of a function of the formula language.
//
// The equation comes from exactly one of three tables, the one form names;
// the tables of the other forms must be absent.
//
//	[schrodinger]    # −(ħ²/2m) ψ″ + V(x) ψ = E ψ:  λ = 1/ħ,  Q = 2m(E − V(x))
//	potential = "V0 / cosh(x/a)^2"   # required: V(x)
//	mass = 1.0                        # required, > 0
//	hbar = 0.05                       # required, > 0
//	energy = 0.8                      # optional base energy (needed for a single
//	                                  # scattering point and for the Stokes geometry)
//
//	[graded]         # waves in planar layers:  λ = k0,  Q = n(x)² − n_in² sin²θ
//	index = "1.25 + 0.25*tanh(x/w)"   # n(x), may be complex (absorption); or
//	                                  # permittivity = "..." for ε(x) = n(x)², then
//	                                  # Q = ε(x) − n_in² sin²θ (exactly one of the two)
//	wavelength = 0.55                 # vacuum wavelength in the user's length unit, > 0;
//	                                  # or k0 = 2π/wavelength, > 0 (exactly one of the two)
//	angle = 0.0                       # optional: incidence angle θ in degrees, in the
//	                                  # medium of index n_in, −90 < θ < 90 (default 0)
//	n_in = 1.0                        # optional: index of the incidence medium, > 0 (default 1)
//	polarization = "s"                # optional: "s" (TE, the default; also "TE", "te") or
//	                                  # "p" (TM; also "TM", "tm"), for which
//	                                  # Q1 = ε″/(2ε) − (3/4)(ε′/ε)² (see below)
//
// For s waves y is the tangential electric field. For p waves it is
// u = H/√ε, H the tangential magnetic field, which obeys
// (H′/ε)′ + k0²(1 − s²/ε)H = 0 (s = n_in sin θ); the substitution removes H′
// and leaves the λ-free term Q1 above (the derivation is in tm.go). For real
// ε the flux Im(u*u′) equals the TM power flux Im(H*H′/ε), so R and T are
// the TM power coefficients when ε is constant near both ends of
// region.x; where ε still varies at an end they hold only to the accuracy
// with which ε has settled. Q1 has double poles where ε = 0 (plasma
// resonance, epsilon-near-zero points): genuine singularities of the p
// equation, reported like any other.
//
//	[general]        # y″ + (λ² Q + Q1) y = 0 as written
//	Q = "x^2 - 1"                     # required
//	Q1 = "0"                          # optional λ-free term (default zero)
//	lambda = 20.0                     # required, > 0
//
// Formulas are strings in the language of package formula (+ − * / ^,
// parentheses, sin cos tan sinh cosh tanh sech exp log sqrt …, pi, i and the
// parameters). A mistake in one is reported at its column inside the TOML
// string; in a string with escapes or a multi-line string it is reported at
// the string's start with the formula's own excerpt.
//
//	[region]         # required
//	x = [-6.0, 6.0]                   # required: real interval [a, b], a < b
//	box = { re = [-6.0, 6.0], im = [-3.0, 3.0] }
//	                                  # optional complex search box for turning points and
//	                                  # poles; re must contain [a, b] and im must have 0
//	                                  # strictly inside (the real axis is not an edge);
//	                                  # default turning.DefaultBox(a, b)
//	left = "open"                     # "open" (default) or "wall": a hard wall, ψ(a) = 0
//	right = "open"                    # the same at b
//
//	[scan]           # optional: a study over one variable
//	over = "energy"                   # required: energy, hbar or mass (schrodinger);
//	                                  # wavelength, k0 or angle (graded); lambda (general);
//	                                  # or the name of a parameter (any form)
//	from = 0.2                        # required
//	to = 1.6                          # required (may be below from)
//	points = 57                       # required, 1 … 1000000; from and to are included
//	spacing = "linear"                # optional: "linear" (default) or "log" (from, to > 0)
//
//	[levels]         # optional, schrodinger form only: bound states
//	n = [0, 1, 2, 5]                  # quantum numbers ≥ 0 without repeats,
//	                                  # or count = 10 for n = 0 … 9 (exactly one of the two)
//	max_order = 6                     # optional: highest WKB order, even, 0 … 20 (default 6)
//
//	[[expect]]       # optional, repeatable: a value `turnpoint check` must reproduce
//	quantity = "T"                    # required: "R", "T", "E", "splitting" or
//	                                  # "turning_points" (the number of zeros of Q in the box)
//	at = 0.5                          # R, T and turning_points: a value of scan.over (needs
//	                                  # [scan]); absent means the base values of the file
//	n = 2                             # E and splitting (schrodinger form, with [levels]):
//	                                  # quantum number; for E one of the levels computed
//	method = "numeric"                # "wkb" or "numeric"; required except for turning_points
//	value = 0.123456                  # required; R and T in [0, 1], splitting > 0,
//	                                  # turning_points a whole number
//	rel_tol = 1e-6                    # rel_tol and/or abs_tol, ≥ 0, one of them positive
//	abs_tol = 0.0                     # (a turning_points count needs none: it must be equal)
//	source = "Landau & Lifshitz, QM §25, closed form"   # required: where value comes from
//
// Numbers may be written as TOML integers or floats; counts (points, n, count,
// max_order) must be integers.
//
// # Positions
//
// Every Error carries a Position whose Column counts characters, and an
// excerpt of the offending line with carets under the offending span. The
// TOML decoder reports syntax errors with their place; the places of keys and
// values are found by a scanner of the source in this package, because the
// decoder does not export them.
package cases

"""Fits the polynomials of `src/inverse_trig.rs` (run: `python3 fit_inverse_trig.py`; needs mpmath).

Each function is written as `f(u) = u + u^3 g(u^2)` and `g` is interpolated at Chebyshev nodes
(mpmath's `chebyfit`, 40 significant digits), which is within a small factor of the minimax
polynomial of the same degree:

* atan on [0, tan(pi/8)]: g of degree 9, error below 1e-16 before rounding;
* asin on [0, 1/2]: g of degree 11, error below 3e-17 before rounding.

Prints the coefficients lowest degree first, as the Rust constants take them.
"""

import mpmath as mp

mp.mp.dps = 40


def g_atan(w):
    if w == 0:
        return mp.mpf(-1) / 3
    r = mp.sqrt(w)
    return (mp.atan(r) / r - 1) / w


def g_asin(z):
    if z == 0:
        return mp.mpf(1) / 6
    r = mp.sqrt(z)
    return (mp.asin(r) / r - 1) / z


t8 = mp.sqrt(2) - 1
for name, g, hi, umax, deg in [
    ("ATAN", g_atan, t8**2, t8, 9),
    ("ASIN", g_asin, mp.mpf(1) / 4, mp.mpf(1) / 2, 11),
]:
    poly, err = mp.chebyfit(g, [0, hi], deg + 1, error=True)
    print(f"{name} (error {mp.nstr(err * umax**3, 3)}):")
    print("    " + ",\n    ".join(repr(float(c)) for c in reversed(poly)) + ",")

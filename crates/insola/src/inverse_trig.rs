//! `atan2` and `acos` written out as polynomials, for the hot loops (time series, insolation
//! grid).
//!
//! Why not the C library's: its functions are calls the compiler cannot see into, so a loop
//! that takes one per element can neither be inlined nor spread over the processor's vector
//! lanes; in the profiles they were a quarter of a time-series sample and 43 % of a grid
//! cell. These are branch-free (selects only), inline, and accurate to a few units in the last
//! place (tests below: ≤ 1e-15 rad absolute against the library over the whole domain), far
//! inside the 1e-9 rad the fast paths promise.
//!
//! Method: each is reduced to an odd function `u + u³ g(u²)` on a short interval, `g` a
//! polynomial interpolated at Chebyshev nodes (near minimax; coefficients from
//! `tools/fit_inverse_trig.py`, which prints them):
//! * `atan2`: octant reduction to `t = min/max ∈ [0, 1]`, then `atan t = π/4 + atan((t−1)/(t+1))`
//!   above tan(π/8), leaving `|u| ≤ tan(π/8)` with one division;
//! * `acos`: `π/2 − asin x` for `|x| ≤ 1/2` and `2 asin √((1−|x|)/2)` above, both with
//!   arguments in `[0, 1/2]`.

use std::f64::consts::{FRAC_PI_2, FRAC_PI_4, PI};

use crate::lanes::Lanes;

/// `g` of atan on `[0, tan²(π/8)]`, lowest degree first (error 6e-17 before rounding).
const ATAN_G: [f64; 10] = [
    -0.3333333333333325,
    0.19999999999898407,
    -0.1428571426609662,
    0.11111109636534361,
    -0.09090852557176049,
    0.0769105515839315,
    -0.06649613695291669,
    0.05736332165907643,
    -0.04483334622272886,
    0.02275052699336167,
];

/// `g` of asin on `[0, 1/4]` (of `z = u²`), lowest degree first (error 3e-17 before rounding).
const ASIN_G: [f64; 12] = [
    0.1666666666666665,
    0.07500000000020764,
    0.044642857103423646,
    0.03038194736709848,
    0.02237204763174451,
    0.017355259955786323,
    0.013929652902326633,
    0.011875494382636922,
    0.0078029494773533175,
    0.01603551434914882,
    -0.010749050339697808,
    0.028169218060881414,
];

/// tan(π/8) = √2 − 1.
const TAN_PI_8: f64 = std::f64::consts::SQRT_2 - 1.0;

/// A polynomial by Estrin's scheme, lowest coefficient first in `c`: pairs `c₀ + c₁x`, then
/// pairs of pairs with `x²`, `x⁴`, … — a dependency chain of depth log₂ N instead of Horner's
/// N, which is what a vector loop waits on.
#[inline(always)]
fn estrin<T: Lanes, const N: usize>(x: T, c: &[f64; N]) -> T {
    let mut terms = c.map(T::splat);
    let mut len = N;
    let mut power = x;
    while len > 1 {
        let half = len.div_ceil(2);
        for i in 0..half {
            terms[i] = if 2 * i + 1 < len {
                terms[2 * i] + terms[2 * i + 1] * power
            } else {
                terms[2 * i]
            };
        }
        len = half;
        power = power * power;
    }
    terms[0]
}

/// The angle of `(x, y)` from the +x axis, radians in `[−π, π]`, as `f64::atan2` (signed zeros
/// included; `(0, 0)` gives ±0 or ±π by the signs, as the library does).
#[inline(always)]
pub(crate) fn atan2<T: Lanes>(y: T, x: T) -> T {
    let (ax, ay) = (x.abs(), y.abs());
    let (mn, mx) = (ax.min(ay), ax.max(ay));
    let high = mn.gt(T::splat(TAN_PI_8) * mx);
    let num = T::select(high, mn - mx, mn);
    let den = T::select(high, mn + mx, mx);
    let zero = T::splat(0.0);
    let u = T::select(den.gt(zero), num / den, zero);
    let w = u * u;
    let mut r = u + u * w * estrin(w, &ATAN_G);
    r = r + T::select(high, T::splat(FRAC_PI_4), zero);
    r = T::select(ay.gt(ax), T::splat(FRAC_PI_2) - r, r);
    r = T::select(x.sign_negative(), T::splat(PI) - r, r);
    T::select(y.sign_negative(), -r, r)
}

/// `acos x`, radians in `[0, π]`, for `x ∈ [−1, 1]` (NaN outside, as the library).
#[inline(always)]
pub(crate) fn acos(x: f64) -> f64 {
    let a = x.abs();
    let high = a > 0.5;
    let z = if high { 0.5 * (1.0 - a) } else { a * a };
    let root = z.sqrt();
    let s = if high { root } else { a };
    // asin(s), s ∈ [0, 1/2].
    let p = s + s * z * estrin::<f64, 12>(z, &ASIN_G);
    // acos |x|.
    let r = if high { 2.0 * p } else { FRAC_PI_2 - p };
    if x < 0.0 { PI - r } else { r }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A small deterministic generator (splitmix64), so the tests need no dependency.
    fn uniform(seed: &mut u64) -> f64 {
        *seed = seed.wrapping_add(0x9E37_79B9_7F4A_7C15);
        let mut z = *seed;
        z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
        ((z ^ (z >> 31)) >> 11) as f64 / (1u64 << 53) as f64
    }

    // Reference: the platform's C library (`f64::atan2`, `f64::acos`), within an ulp or so.
    #[test]
    fn atan2_matches_the_library_everywhere() {
        let mut seed = 7;
        let mut worst = 0.0f64;
        for _ in 0..400_000 {
            let scale = 10f64.powf(40.0 * uniform(&mut seed) - 20.0);
            let y = (2.0 * uniform(&mut seed) - 1.0) * scale;
            let x = (2.0 * uniform(&mut seed) - 1.0) * 10f64.powf(4.0 * uniform(&mut seed) - 2.0);
            worst = worst.max((atan2::<f64>(y, x) - y.atan2(x)).abs());
        }
        assert!(worst < 1e-15, "worst {worst:e}");
        // The octant edges, the axes and signed zeros exactly as the library.
        for (y, x) in [
            (1.0, 1.0),
            (-1.0, 1.0),
            (1.0, -1.0),
            (TAN_PI_8, 1.0),
            (0.0, 1.0),
            (0.0, -1.0),
            (1.0, 0.0),
            (-1.0, 0.0),
            (0.0, 0.0),
            (-0.0, 0.0),
            (0.0, -0.0),
            (-0.0, -0.0),
        ] {
            let (ours, lib) = (atan2::<f64>(y, x), f64::atan2(y, x));
            assert!((ours - lib).abs() < 1e-15, "({y}, {x}): {ours} vs {lib}");
            assert_eq!(
                ours.is_sign_negative(),
                lib.is_sign_negative(),
                "({y}, {x})"
            );
        }
    }

    #[test]
    fn acos_matches_the_library_everywhere() {
        let mut seed = 11;
        let mut worst = 0.0f64;
        for k in 0..=400_000 {
            let x = if k % 2 == 0 {
                2.0 * uniform(&mut seed) - 1.0
            } else {
                // Crowd the ends, where acos is steepest.
                let d = 10f64.powf(-16.0 * uniform(&mut seed));
                if k % 4 == 1 { 1.0 - d } else { d - 1.0 }
            };
            worst = worst.max((acos(x) - x.acos()).abs());
        }
        assert!(worst < 1e-15, "worst {worst:e}");
        for x in [-1.0, -0.5, 0.0, 0.5, 1.0] {
            assert!((acos(x) - f64::acos(x)).abs() < 1e-15, "{x}");
        }
        assert!(acos(1.5).is_nan() && acos(f64::NAN).is_nan());
    }
}

//! Small angle helpers shared by the sky code.

use std::f64::consts::{PI, TAU};

/// Wraps an angle in radians to `[0, 2π)`.
#[inline]
pub fn wrap_tau(a: f64) -> f64 {
    // Fast paths for angles within a turn of the range (the common case in the sky code);
    // a floating-point remainder costs as much as a sine.
    if (0.0..TAU).contains(&a) {
        return a;
    }
    if (-TAU..0.0).contains(&a) {
        let r = a + TAU;
        return if r >= TAU { 0.0 } else { r };
    }
    if (TAU..2.0 * TAU).contains(&a) {
        return a - TAU;
    }
    let r = a.rem_euclid(TAU);
    // rem_euclid can return TAU itself for tiny negative inputs because of rounding.
    if r >= TAU { 0.0 } else { r }
}

/// Wraps an angle in radians to `[−π, π)`.
#[inline]
pub fn wrap_pi(a: f64) -> f64 {
    wrap_tau(a + PI) - PI
}

/// Beyond this magnitude every `f64` is a whole number (2⁵²).
const WHOLE_FROM: f64 = 4_503_599_627_370_496.0;

/// `x.floor()`, bit for bit (sign of zero and NaN included), without the library call that
/// `f64::floor` becomes on CPUs without a rounding instruction (the baseline x86-64 target):
/// below 2⁵² truncation by an integer conversion is exact, and one comparison corrects it for
/// negative fractions.
#[inline]
pub fn floor(x: f64) -> f64 {
    if x.abs() < WHOLE_FROM {
        let t = (x as i64 as f64).copysign(x);
        if t > x { t - 1.0 } else { t }
    } else {
        x
    }
}

/// `x.round()` (halves away from zero), bit for bit, without the library call (see [`floor`]).
/// The fraction `x − trunc(x)` is exact below 2⁵², so the halfway test is too.
#[inline]
pub fn round(x: f64) -> f64 {
    if x.abs() < WHOLE_FROM {
        let t = x as i64 as f64;
        let r = x - t;
        let t = if r >= 0.5 {
            t + 1.0
        } else if r <= -0.5 {
            t - 1.0
        } else {
            t
        };
        t.copysign(x)
    } else {
        x
    }
}

/// The fraction of a cycle of `period` elapsed at `t` (same units), in `[0, 1)`.
///
/// Why not a floating-point remainder: it is exact, but costs as much as a sine, and buys
/// nothing here, since `t` itself is only known to its last bit: the quotient's rounding adds
/// an error of the same size (one part in 2⁵² of `t / period` cycles).
#[inline]
pub fn cycle_fraction(t: f64, period: f64) -> f64 {
    let q = t / period;
    let f = q - floor(q);
    // `q − floor(q)` can round up to 1 for tiny negative q.
    if f < 1.0 { f } else { 0.0 }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn wraps() {
        assert!((wrap_tau(-0.5) - (TAU - 0.5)).abs() < 1e-15);
        assert_eq!(wrap_tau(-1e-20), 0.0);
        assert!((wrap_pi(3.0 * PI / 2.0) + PI / 2.0).abs() < 1e-15);
        assert!(wrap_pi(PI) < PI);
    }

    #[test]
    fn floor_and_round_match_the_library_bit_for_bit() {
        let mut xs = vec![
            0.0,
            -0.0,
            0.5,
            -0.5,
            1.5,
            -1.5,
            2.5,
            -2.5,
            0.49999999999999994,
            -0.49999999999999994,
            1e-300,
            -1e-300,
            4.5e15,
            -4.5e15,
            4503599627370495.5,
            -4503599627370495.5,
            9e15,
            -9e15,
            1e300,
            -1e300,
            f64::INFINITY,
            f64::NEG_INFINITY,
            f64::MAX,
            f64::MIN,
        ];
        // A spread of magnitudes and fractions, deterministic.
        let mut v = 0.123_456_789_f64;
        for k in 0..20_000 {
            v = (v * 3.7 + 0.31).fract();
            let mag = 10f64.powi(k % 34 - 17);
            xs.push((v - 0.5) * mag);
        }
        for x in xs {
            assert_eq!(floor(x).to_bits(), x.floor().to_bits(), "floor {x:e}");
            assert_eq!(round(x).to_bits(), x.round().to_bits(), "round {x:e}");
        }
        assert!(floor(f64::NAN).is_nan() && round(f64::NAN).is_nan());
    }

    #[test]
    fn cycle_fraction_matches_the_exact_remainder() {
        // Against the exact floating-point remainder, over ten thousand years of a 365-day
        // cycle and of a 2.5-hour one, and before time zero.
        for (period, span) in [
            (365.0 * 86_400.0, 3.2e11),
            (9_000.0, 3.2e11),
            (86_164.0, 1e9),
        ] {
            for k in -50..=50 {
                let t = span * k as f64 / 50.0 + 0.123;
                let exact = t.rem_euclid(period) / period;
                let f = cycle_fraction(t, period);
                assert!((0.0..1.0).contains(&f));
                let d = (f - exact).abs().min(1.0 - (f - exact).abs());
                // Both carry the rounding of t: one part in 2⁵² of t / period cycles.
                assert!(
                    d <= 4.0 * f64::EPSILON * (t / period).abs().max(1.0),
                    "{t} {period}"
                );
            }
        }
        assert_eq!(cycle_fraction(-1e-300, 1.0), 0.0);
    }
}

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
}

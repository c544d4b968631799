//! Arithmetic written once for one number or for a row of [`WIDTH`] numbers side by side.
//!
//! The hot loops that carry work from one sample to the next (the time series) are written
//! against [`Lanes`]; instantiated with [`F64s`], each operation is an element-wise loop over a
//! small array, which the compiler turns into vector instructions (the widest the build or the
//! run-time dispatch allows). Instantiated with `f64`, the same text is the scalar code. Only
//! the IEEE operations (+, −, ×, ÷, √, comparisons) appear, so every lane rounds as the scalar
//! code does. Why not a SIMD library: the standard library's portable SIMD is not stable, and
//! this much (a dozen operations) keeps the crate free of one more dependency and of `unsafe`.

use std::ops::{Add, BitAnd, Div, Mul, Neg, Sub};

/// Numbers per row.
pub(crate) const WIDTH: usize = 8;

/// The operations the lane-generic code uses.
pub(crate) trait Lanes:
    Copy
    + Add<Output = Self>
    + Sub<Output = Self>
    + Mul<Output = Self>
    + Div<Output = Self>
    + Neg<Output = Self>
{
    /// One flag per lane.
    type Mask: Copy + BitAnd<Output = Self::Mask>;
    /// Every lane `x`.
    fn splat(x: f64) -> Self;
    /// `|x|` per lane.
    fn abs(self) -> Self;
    /// `√x` per lane.
    fn sqrt(self) -> Self;
    /// `min(self, o)` per lane.
    fn min(self, o: Self) -> Self;
    /// `max(self, o)` per lane.
    fn max(self, o: Self) -> Self;
    /// `self < o` per lane (false with a NaN).
    fn lt(self, o: Self) -> Self::Mask;
    /// `self ≥ o` per lane (false with a NaN).
    fn ge(self, o: Self) -> Self::Mask;
    /// `self > o` per lane (false with a NaN).
    fn gt(self, o: Self) -> Self::Mask;
    /// Sign bit set, per lane (so −0 counts as negative).
    fn sign_negative(self) -> Self::Mask;
    /// `if m { a } else { b }` per lane.
    fn select(m: Self::Mask, a: Self, b: Self) -> Self;
}

impl Lanes for f64 {
    type Mask = bool;
    #[inline(always)]
    fn splat(x: f64) -> Self {
        x
    }
    #[inline(always)]
    fn abs(self) -> Self {
        f64::abs(self)
    }
    #[inline(always)]
    fn sqrt(self) -> Self {
        f64::sqrt(self)
    }
    #[inline(always)]
    fn min(self, o: Self) -> Self {
        f64::min(self, o)
    }
    #[inline(always)]
    fn max(self, o: Self) -> Self {
        f64::max(self, o)
    }
    #[inline(always)]
    fn lt(self, o: Self) -> bool {
        self < o
    }
    #[inline(always)]
    fn ge(self, o: Self) -> bool {
        self >= o
    }
    #[inline(always)]
    fn gt(self, o: Self) -> bool {
        self > o
    }
    #[inline(always)]
    fn sign_negative(self) -> bool {
        self.is_sign_negative()
    }
    #[inline(always)]
    fn select(m: bool, a: Self, b: Self) -> Self {
        if m { a } else { b }
    }
}

/// [`WIDTH`] numbers side by side.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct F64s(pub(crate) [f64; WIDTH]);

/// [`WIDTH`] flags side by side.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Flags(pub(crate) [bool; WIDTH]);

impl F64s {
    /// Lane `i` is `f(i)`.
    #[inline(always)]
    pub(crate) fn from_fn(mut f: impl FnMut(usize) -> f64) -> Self {
        let mut out = [0.0; WIDTH];
        for (i, o) in out.iter_mut().enumerate() {
            *o = f(i);
        }
        F64s(out)
    }

    #[inline(always)]
    fn map(self, f: impl Fn(f64) -> f64) -> Self {
        let mut out = self.0;
        for o in &mut out {
            *o = f(*o);
        }
        F64s(out)
    }

    #[inline(always)]
    fn zip(self, o: Self, f: impl Fn(f64, f64) -> f64) -> Self {
        let mut out = self.0;
        for (a, b) in out.iter_mut().zip(o.0) {
            *a = f(*a, b);
        }
        F64s(out)
    }

    #[inline(always)]
    fn test(self, o: Self, f: impl Fn(f64, f64) -> bool) -> Flags {
        let mut out = [false; WIDTH];
        for ((m, a), b) in out.iter_mut().zip(self.0).zip(o.0) {
            *m = f(a, b);
        }
        Flags(out)
    }
}

macro_rules! lane_op {
    ($trait:ident, $method:ident, $op:tt) => {
        impl $trait for F64s {
            type Output = F64s;
            #[inline(always)]
            fn $method(self, o: F64s) -> F64s {
                self.zip(o, |a, b| a $op b)
            }
        }
    };
}
lane_op!(Add, add, +);
lane_op!(Sub, sub, -);
lane_op!(Mul, mul, *);
lane_op!(Div, div, /);

impl Neg for F64s {
    type Output = F64s;
    #[inline(always)]
    fn neg(self) -> F64s {
        self.map(|a| -a)
    }
}

impl BitAnd for Flags {
    type Output = Flags;
    #[inline(always)]
    fn bitand(self, o: Flags) -> Flags {
        let mut out = self.0;
        for (a, b) in out.iter_mut().zip(o.0) {
            *a &= b;
        }
        Flags(out)
    }
}

impl Lanes for F64s {
    type Mask = Flags;
    #[inline(always)]
    fn splat(x: f64) -> Self {
        F64s([x; WIDTH])
    }
    #[inline(always)]
    fn abs(self) -> Self {
        self.map(f64::abs)
    }
    #[inline(always)]
    fn sqrt(self) -> Self {
        self.map(f64::sqrt)
    }
    #[inline(always)]
    fn min(self, o: Self) -> Self {
        self.zip(o, f64::min)
    }
    #[inline(always)]
    fn max(self, o: Self) -> Self {
        self.zip(o, f64::max)
    }
    #[inline(always)]
    fn lt(self, o: Self) -> Flags {
        self.test(o, |a, b| a < b)
    }
    #[inline(always)]
    fn ge(self, o: Self) -> Flags {
        self.test(o, |a, b| a >= b)
    }
    #[inline(always)]
    fn gt(self, o: Self) -> Flags {
        self.test(o, |a, b| a > b)
    }
    #[inline(always)]
    fn sign_negative(self) -> Flags {
        self.test(self, |a, _| a.is_sign_negative())
    }
    #[inline(always)]
    fn select(m: Flags, a: Self, b: Self) -> Self {
        let mut out = b.0;
        for ((o, a), m) in out.iter_mut().zip(a.0).zip(m.0) {
            if m {
                *o = a;
            }
        }
        F64s(out)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rows_compute_what_each_number_would() {
        let a = F64s::from_fn(|i| i as f64 - 3.5);
        let b = F64s::from_fn(|i| (i as f64 * 0.7).sin());
        let r = Lanes::select(a.lt(b), (a * b - a / b).abs().sqrt(), -a.min(b).max(b));
        for i in 0..WIDTH {
            let (x, y) = (a.0[i], b.0[i]);
            let want = if x < y {
                (x * y - x / y).abs().sqrt()
            } else {
                -x.min(y).max(y)
            };
            assert_eq!(r.0[i].to_bits(), want.to_bits(), "lane {i}");
        }
    }
}

//! Best rational approximations of a real number: the convergents and semiconvergents of its
//! continued fraction (Khinchin, *Continued Fractions*, 1964, §6: every best approximation is
//! a convergent or a semiconvergent; from memory).

use serde::{Deserialize, Serialize};

/// How an approximation arises from the continued fraction.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum ApproximationKind {
    /// A convergent `hₙ/kₙ`.
    Convergent,
    /// A semiconvergent `(hₙ₋₂ + j·hₙ₋₁)/(kₙ₋₂ + j·kₙ₋₁)`, `0 < j < aₙ`.
    Semiconvergent,
}

/// One rational approximation `numerator/denominator`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub struct Approximation {
    /// Numerator.
    pub numerator: u64,
    /// Denominator, at least 1.
    pub denominator: u64,
    /// Convergent or semiconvergent.
    pub kind: ApproximationKind,
}

impl Approximation {
    /// The fraction's value.
    pub fn value(&self) -> f64 {
        self.numerator as f64 / self.denominator as f64
    }
}

/// The best approximations of `x ≥ 0` with denominators up to `max_denominator`, by rising
/// denominator: each is closer to `x` than every fraction with a smaller denominator
/// (best approximations of the first kind). Empty for negative or non-finite `x`.
pub fn best_approximations(x: f64, max_denominator: u64) -> Vec<Approximation> {
    let mut out: Vec<Approximation> = Vec::new();
    if !(x.is_finite() && x >= 0.0) {
        return out;
    }
    // h₋₂/k₋₂ = 0/1, h₋₁/k₋₁ = 1/0.
    let (mut h2, mut k2, mut h1, mut k1) = (0u64, 1u64, 1u64, 0u64);
    let mut rest = x;
    for term in 0..64 {
        let a = rest.floor();
        if a > 1.0e12 {
            break;
        }
        let a = a as u64;
        // Semiconvergents below this term's convergent, kept when they beat every fraction
        // with a smaller denominator (always for j > a/2, sometimes for j = a/2).
        // (The first term's are whole numbers below the first convergent: never better.)
        let first_j = if term == 0 { a } else { a.div_ceil(2).max(1) };
        for j in first_j..a {
            let (h, k) = (h2 + j * h1, k2 + j * k1);
            if k > max_denominator {
                return out;
            }
            push_if_better(&mut out, x, h, k, ApproximationKind::Semiconvergent);
        }
        let (h, k) = (h2 + a * h1, k2 + a * k1);
        if k > max_denominator {
            return out;
        }
        push_if_better(&mut out, x, h, k, ApproximationKind::Convergent);
        let frac = rest - a as f64;
        if frac < 1.0e-12 || (x - h as f64 / k as f64).abs() < 1.0e-13 * x.max(1.0) {
            break;
        }
        rest = 1.0 / frac;
        (h2, k2, h1, k1) = (h1, k1, h, k);
    }
    out
}

fn push_if_better(out: &mut Vec<Approximation>, x: f64, h: u64, k: u64, kind: ApproximationKind) {
    let err = (x - h as f64 / k as f64).abs();
    if out.last().is_none_or(|last| err < (x - last.value()).abs()) {
        out.push(Approximation {
            numerator: h,
            denominator: k,
            kind,
        });
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn pairs(x: f64, max: u64) -> Vec<(u64, u64)> {
        best_approximations(x, max)
            .iter()
            .map(|a| (a.numerator, a.denominator))
            .collect()
    }

    #[test]
    fn pi_gives_its_textbook_approximations() {
        // π = [3; 7, 15, 1, 292, …]: convergents 3, 22/7, 333/106, 355/113 (any number-theory
        // text, from memory); the semiconvergents of the term 15 from j = 8 up lie between.
        let p = pairs(std::f64::consts::PI, 200);
        assert_eq!(p.first(), Some(&(3, 1)));
        for c in [(22, 7), (333, 106), (355, 113)] {
            assert!(p.contains(&c), "{p:?}");
        }
        assert!(p.contains(&(311, 99)), "semiconvergent j = 14: {p:?}");
    }

    #[test]
    fn each_is_better_than_every_smaller_denominator() {
        for x in [0.24219, 0.530589, 12.36827, 0.5, 0.0, 7.25] {
            let list = best_approximations(x, 500);
            for a in &list {
                let err = (x - a.value()).abs();
                for q in 1..a.denominator {
                    let p = (x * q as f64).round();
                    assert!(
                        err < (x - p / q as f64).abs() + 1e-15,
                        "{x}: {a:?} vs q {q}"
                    );
                }
            }
        }
    }
}

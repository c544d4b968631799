//! The planet's orbit: Kepler's equation, true anomaly, distance and the star's ecliptic longitude.
//!
//! Angles in radians, times in seconds since the world's time zero. The star's ecliptic
//! longitude λ is measured, as seen from the planet, from the northward equinox direction (the
//! direction where the star crosses the planet's equator going north) in the sense of the
//! orbital motion. The periapsis is fixed by `periapsis_longitude_rad` (ϖ): the star's ecliptic
//! longitude at the moment the planet passes periapsis, so `λ = v + ϖ` with `v` the true anomaly
//! (the convention of Berger 1978, where Earth's value is about 283°).

use std::f64::consts::{PI, TAU};

use crate::angle::{round, wrap_pi, wrap_tau};

/// Largest eccentricity the solver is specified for. Validation allows up to this value.
pub const MAX_ECCENTRICITY: f64 = 0.99;

/// Solves Kepler's equation `E − e sin E = M` for the eccentric anomaly `E` (radians).
///
/// Robust for `0 ≤ e ≤ 0.99` and any finite `M`: Newton's method from `E = M` (or `π` for
/// `e ≥ 0.8`, Meeus, *Astronomical Algorithms* ch. 30), kept inside a bracket so it cannot
/// diverge. The result is in the same turn as `M` (`E − M` lies in `[−e, e]`).
pub fn solve_kepler(mean_anomaly_rad: f64, e: f64) -> f64 {
    solve_kepler_sin_cos(mean_anomaly_rad, e).0
}

/// [`solve_kepler`] that also returns `sin E` and `cos E`, saving the caller a `sin_cos`.
pub fn solve_kepler_sin_cos(mean_anomaly_rad: f64, e: f64) -> (f64, f64, f64) {
    if e == 0.0 {
        let (s, c) = mean_anomaly_rad.sin_cos();
        return (mean_anomaly_rad, s, c);
    }
    // Work in [−π, π) and add the whole turns back at the end so large M keep full precision.
    let turns = round(mean_anomaly_rad / TAU);
    let m = wrap_pi(mean_anomaly_rad - turns * TAU);
    // f(E) = E − e sin E − M is increasing; the root lies in [M − e, M + e].
    let (mut lo, mut hi) = (m - e, m + e);
    // Small eccentricities: the second-order series start (Meeus ch. 30) leaves one or two
    // Newton steps; large ones start from π as Meeus advises.
    let mut ecc = if e < 0.8 {
        let (sm, cm) = m.sin_cos();
        m + e * sm * (1.0 + e * cm)
    } else {
        PI.copysign(m)
    };
    ecc = ecc.clamp(lo, hi);
    let (mut s, mut c) = ecc.sin_cos();
    for _ in 0..60 {
        let f = ecc - e * s - m;
        if f > 0.0 {
            hi = ecc;
        } else {
            lo = ecc;
        }
        let step = -f / (1.0 - e * c);
        if step.abs() < 1e-9 {
            // Newton converges quadratically: this last step leaves an error near step², far
            // below 1e-15, and sin/cos follow to first order (error step²/2).
            ecc += step;
            let (s0, c0) = (s, c);
            s = s0 + c0 * step;
            c = c0 - s0 * step;
            break;
        }
        if step.abs() < 1e-5 && ecc + step > lo && ecc + step < hi {
            // A small step: move sin/cos along by the angle-sum rule to second order (error
            // step³/6 < 2e-16) instead of evaluating them again; the next step is below 1e-9.
            ecc += step;
            let (s0, c0, half_sq) = (s, c, 0.5 * step * step);
            s = s0 + c0 * step - s0 * half_sq;
            c = c0 - s0 * step - c0 * half_sq;
            continue;
        }
        let mut next = ecc + step;
        if !(next > lo && next < hi) {
            next = 0.5 * (lo + hi);
        }
        ecc = next;
        (s, c) = ecc.sin_cos();
    }
    (ecc + turns * TAU, s, c)
}

/// True anomaly `v` (radians) from the eccentric anomaly, in the same turn:
/// `tan(v/2) = √((1+e)/(1−e)) tan(E/2)`.
pub fn true_anomaly_from_eccentric(eccentric_anomaly_rad: f64, e: f64) -> f64 {
    let turns = round(eccentric_anomaly_rad / TAU);
    let ecc = eccentric_anomaly_rad - turns * TAU;
    let half = ecc / 2.0;
    let v = 2.0 * ((1.0 + e).sqrt() * half.sin()).atan2((1.0 - e).sqrt() * half.cos());
    v + turns * TAU
}

/// Mean anomaly (radians, in `[−π, π)`) of a point of the orbit given by its true anomaly.
pub fn mean_anomaly_from_true(true_anomaly_rad: f64, e: f64) -> f64 {
    let v = wrap_pi(true_anomaly_rad);
    let half = v / 2.0;
    let ecc = 2.0 * ((1.0 - e).sqrt() * half.sin()).atan2((1.0 + e).sqrt() * half.cos());
    ecc - e * ecc.sin()
}

/// Where the planet is on its orbit at one instant.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OrbitState {
    /// Mean anomaly M, radians in `[0, 2π)`.
    pub mean_anomaly_rad: f64,
    /// True anomaly v, radians in `[0, 2π)`.
    pub true_anomaly_rad: f64,
    /// Distance in units of the semi-major axis, `r/a = 1 − e cos E`.
    pub distance_factor: f64,
    /// Ecliptic longitude of the star seen from the planet, `λ = v + ϖ`, radians in `[0, 2π)`.
    pub star_longitude_rad: f64,
    /// Mean longitude of the star, `L = M + ϖ`, radians in `[0, 2π)` (drives mean solar time).
    pub star_mean_longitude_rad: f64,
    /// Sine and cosine of [`OrbitState::star_longitude_rad`] (from the eccentric anomaly's, no
    /// further trigonometry).
    pub star_longitude_sin_cos: (f64, f64),
}

/// A Keplerian orbit with a fixed periapsis (no precession).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Orbit {
    /// Eccentricity, `0 ≤ e ≤ 0.99`.
    pub eccentricity: f64,
    /// Orbital period in seconds.
    pub period_s: f64,
    /// Star's ecliptic longitude at periapsis ϖ, radians.
    pub periapsis_longitude_rad: f64,
    /// Sine and cosine of ϖ (kept with it: set both or build with [`Orbit::new`]).
    pub periapsis_sin_cos: (f64, f64),
    /// Mean anomaly at time zero, radians.
    pub mean_anomaly_at_zero_rad: f64,
    /// `√(1 − e²)`, the semi-minor over the semi-major axis (kept with the eccentricity: set
    /// both or build with [`Orbit::new`]); every true anomaly needs it.
    pub axis_ratio: f64,
}

impl Orbit {
    /// Builds an orbit whose star stands at ecliptic longitude `star_longitude_at_zero_rad` at
    /// time zero.
    pub fn new(
        eccentricity: f64,
        period_s: f64,
        periapsis_longitude_rad: f64,
        star_longitude_at_zero_rad: f64,
    ) -> Self {
        let v0 = star_longitude_at_zero_rad - periapsis_longitude_rad;
        Orbit {
            eccentricity,
            period_s,
            periapsis_longitude_rad,
            periapsis_sin_cos: periapsis_longitude_rad.sin_cos(),
            mean_anomaly_at_zero_rad: mean_anomaly_from_true(v0, eccentricity),
            axis_ratio: (1.0 - eccentricity * eccentricity).sqrt(),
        }
    }

    /// Mean motion in radians per second.
    pub fn mean_motion_rad_s(&self) -> f64 {
        TAU / self.period_s
    }

    /// Mean anomaly at time `t_s`, radians in `[0, 2π)`. Whole orbits are removed in time
    /// before the angle is formed, so the angle keeps its precision at any `t_s`.
    pub fn mean_anomaly_rad(&self, t_s: f64) -> f64 {
        let frac = crate::angle::cycle_fraction(t_s, self.period_s);
        wrap_tau(self.mean_anomaly_at_zero_rad + TAU * frac)
    }

    /// The orbit state at time `t_s` (seconds since time zero).
    pub fn state_at(&self, t_s: f64) -> OrbitState {
        let m = self.mean_anomaly_rad(t_s);
        self.state_at_mean_anomaly(m)
    }

    /// The orbit state at a given mean anomaly (radians).
    pub fn state_at_mean_anomaly(&self, mean_anomaly_rad: f64) -> OrbitState {
        let e = self.eccentricity;
        let (_, se, ce) = solve_kepler_sin_cos(mean_anomaly_rad, e);
        // True anomaly from sin E and cos E (one atan2):
        // cos v = (cos E − e)/(1 − e cos E), sin v = √(1 − e²) sin E/(1 − e cos E).
        let (y, x) = (self.axis_ratio * se, ce - e);
        let v = y.atan2(x);
        // sin and cos of λ = v + ϖ by the angle-sum rule, from those of v and ϖ.
        let denominator = 1.0 - e * ce;
        let (sv, cv) = (y / denominator, x / denominator);
        let (sp, cp) = self.periapsis_sin_cos;
        OrbitState {
            mean_anomaly_rad: wrap_tau(mean_anomaly_rad),
            true_anomaly_rad: wrap_tau(v),
            distance_factor: 1.0 - e * ce,
            star_longitude_rad: wrap_tau(v + self.periapsis_longitude_rad),
            star_mean_longitude_rad: wrap_tau(mean_anomaly_rad + self.periapsis_longitude_rad),
            star_longitude_sin_cos: (sv * cp + cv * sp, cv * cp - sv * sp),
        }
    }

    /// The first time at or after `after_s` when the star reaches ecliptic longitude
    /// `longitude_rad`. Exact (inverts Kepler's equation), no search.
    pub fn time_of_star_longitude(&self, longitude_rad: f64, after_s: f64) -> f64 {
        let m = mean_anomaly_from_true(
            longitude_rad - self.periapsis_longitude_rad,
            self.eccentricity,
        );
        let dm = wrap_tau(m - self.mean_anomaly_at_zero_rad);
        let first = dm / TAU * self.period_s;
        let orbits = ((after_s - first) / self.period_s).ceil();
        let mut t = first + orbits * self.period_s;
        if t < after_s {
            t += self.period_s;
        }
        t
    }
}

/// Extremes of a Keplerian orbit, for bounding how fast things seen along it can change.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct OrbitExtremes {
    /// Periapsis distance, metres.
    pub(crate) closest_m: f64,
    /// Apoapsis distance, metres.
    pub(crate) farthest_m: f64,
    /// Speed at periapsis (the fastest), m/s: (2πa/P) √((1 + e)/(1 − e)).
    pub(crate) fastest_m_s: f64,
    /// Angular rate at periapsis (the fastest), rad/s: n (1 + e)² / (1 − e²)^{3/2}.
    pub(crate) fastest_rad_s: f64,
}

impl OrbitExtremes {
    /// For semi-major axis `a_m`, eccentricity `e` (below 1) and period `period_s` (standard
    /// two-body relations).
    pub(crate) fn of(a_m: f64, e: f64, period_s: f64) -> OrbitExtremes {
        let n = TAU / period_s;
        OrbitExtremes {
            closest_m: a_m * (1.0 - e),
            farthest_m: a_m * (1.0 + e),
            fastest_m_s: n * a_m * ((1.0 + e) / (1.0 - e)).sqrt(),
            fastest_rad_s: n * (1.0 + e).powi(2) / (1.0 - e * e).powf(1.5),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn star_longitude_sine_and_cosine_agree_with_the_longitude() {
        for e in [0.0, 0.0167, 0.3, 0.9] {
            let orbit = Orbit::new(e, 3.0e7, 1.3, 0.2);
            for k in 0..200 {
                let s = orbit.state_at_mean_anomaly(k as f64 * 0.07 - 3.0);
                let (sl, cl) = s.star_longitude_sin_cos;
                assert!(
                    (sl - s.star_longitude_rad.sin()).abs() < 1e-14,
                    "e {e} k {k}"
                );
                assert!(
                    (cl - s.star_longitude_rad.cos()).abs() < 1e-14,
                    "e {e} k {k}"
                );
            }
        }
    }

    #[test]
    fn kepler_sine_and_cosine_agree_with_the_anomaly() {
        // The solver carries sin E and cos E along its last steps instead of re-evaluating
        // them; they must still be those of the E it returns, and E must solve the equation.
        for e in [0.0, 0.0167, 0.1, 0.3, 0.6, 0.79, 0.81, 0.95, 0.99] {
            for k in 0..400 {
                let m = -7.0 + 14.0 * k as f64 / 399.0;
                let (ecc, s, c) = solve_kepler_sin_cos(m, e);
                assert!((s - ecc.sin()).abs() < 1e-14, "e {e} M {m}: sin");
                assert!((c - ecc.cos()).abs() < 1e-14, "e {e} M {m}: cos");
                assert!(
                    (ecc - e * ecc.sin() - m).abs() < 1e-12,
                    "e {e} M {m}: residual"
                );
            }
        }
    }

    fn deg(x: f64) -> f64 {
        x.to_radians()
    }

    #[test]
    fn meeus_example_30a() {
        // Meeus, Astronomical Algorithms 2nd ed., example 30.a: e = 0.1, M = 5° → E = 5.554589°,
        // v = 6.139762° (E read in the source; v also in public test suites of PyMeeus).
        let e = solve_kepler(deg(5.0), 0.1);
        assert!(
            (e.to_degrees() - 5.554589).abs() < 1e-6,
            "{}",
            e.to_degrees()
        );
        let v = true_anomaly_from_eccentric(e, 0.1);
        assert!(
            (v.to_degrees() - 6.139762).abs() < 1e-6,
            "{}",
            v.to_degrees()
        );
    }

    #[test]
    fn meeus_chapter_30_table() {
        // Meeus ch. 30 table of E for M = 5° (read in the source); e = 0.99 values read from
        // the same table for the first two entries.
        for (e, m, expected) in [
            (0.2, 5.0, 6.246908),
            (0.3, 5.0, 7.134960),
            (0.5, 5.0, 9.950063),
            (0.9, 5.0, 33.344447),
            (0.99, 5.0, 45.361023),
            (0.99, 1.0, 24.725822),
        ] {
            let got = solve_kepler(deg(m), e).to_degrees();
            assert!((got - expected).abs() < 1e-6, "e={e} M={m}: {got}");
        }
        // Meeus p. 196 worked case in radians: e = 0.99, M = 0.2 rad → E = 1.066997365282 rad.
        assert!((solve_kepler(0.2, 0.99) - 1.066_997_365_282).abs() < 1e-10);
    }

    #[test]
    fn kepler_residual_small_everywhere() {
        for e in [0.0, 0.01, 0.3, 0.7, 0.9, 0.95, 0.99] {
            for k in -400..=400 {
                let m = k as f64 * 0.0317;
                let ecc = solve_kepler(m, e);
                let r = ecc - e * ecc.sin() - m;
                assert!(r.abs() < 1e-12, "e={e} M={m} residual {r}");
            }
        }
    }

    #[test]
    fn mean_true_round_trip() {
        for e in [0.0, 0.2, 0.9, 0.99] {
            for k in 0..36 {
                let v = deg(k as f64 * 10.0 - 175.0);
                let m = mean_anomaly_from_true(v, e);
                let back = true_anomaly_from_eccentric(solve_kepler(m, e), e);
                assert!(wrap_pi(back - v).abs() < 1e-9, "e={e} v={v} back={back}");
            }
        }
    }

    #[test]
    fn star_longitude_at_zero_is_honoured_and_inverse_time_is_exact() {
        let orbit = Orbit::new(0.3, 1.0e7, deg(250.0), deg(40.0));
        assert!((orbit.state_at(0.0).star_longitude_rad - deg(40.0)).abs() < 1e-12);
        let t = orbit.time_of_star_longitude(deg(90.0), 0.0);
        assert!(t >= 0.0 && t < orbit.period_s);
        assert!((orbit.state_at(t).star_longitude_rad - deg(90.0)).abs() < 1e-9);
        let t2 = orbit.time_of_star_longitude(deg(90.0), t + 1.0);
        assert!((t2 - t - orbit.period_s).abs() < 1e-6);
    }

    #[test]
    fn meeus_25a_equation_of_centre_and_radius() {
        // Meeus example 25.a (1992 Oct 13.0 TD): M = 278.99397°, e = 0.016711668 give
        // C = −1.89732° and R = 0.99766 AU (values read in the source; R with a = 1.000001018).
        let e = 0.016_711_668;
        let m = deg(278.99397);
        let ecc = solve_kepler(m, e);
        let v = true_anomaly_from_eccentric(ecc, e);
        let c = wrap_pi(v - m).to_degrees();
        assert!((c - (-1.89732)).abs() < 1e-4, "C = {c}");
        let r = 1.000_001_018 * (1.0 - e * ecc.cos());
        assert!((r - 0.99766).abs() < 1e-5, "R = {r}");
    }
}

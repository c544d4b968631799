//! The walk along a time series at one place: per-place work done once, per-instant work
//! carried from one sample to the next, re-anchored on the scalar formulas every
//! [`ANCHOR_EVERY`] samples.
//!
//! What is carried, and why it stays exact:
//! * the eccentric anomaly: Newton's method on Kepler's equation starts from the previous
//!   sample's anomaly moved by the mean anomaly's change (first order), and its sine and cosine
//!   are moved along by the angle-sum rule with the step's sine and cosine from their series
//!   (no `sin_cos`); Newton runs until its step is below 1e-9 rad, leaving an error near
//!   step², as the scalar solver does;
//! * on evenly spaced samples, the rotation angle plus the longitude turns by the same angle
//!   every step: its sine and cosine are turned by one fixed rotation;
//! * the right ascension moves by a small angle per step: the arctangent of the cross over the
//!   dot product of two successive equatorial directions, by its series.
//!
//! Each carried step rounds at the level of 1e-16; re-anchoring every 64 samples keeps the
//! accumulated error near 1e-14 rad, far inside the 1e-9 rad the series promise. Steps too
//! large for the series (fast orbits, sparse samples, a star near the celestial pole) fall back
//! to the scalar formula for that sample.

use glam::DVec3;

use crate::angle::{wrap_pi, wrap_tau};
use crate::orbit::solve_kepler_sin_cos;
use crate::planet::Planet;
use crate::sky::{PreparedPlace, StarPosition};

/// Samples between two exact re-anchorings on the scalar formulas.
pub(crate) const ANCHOR_EVERY: usize = 64;

/// Largest angle moved by series instead of `sin_cos`, radians: the series below leave less
/// than 1e-20 there.
const MAX_SERIES_ANGLE_RAD: f64 = 0.05;

/// Largest right-ascension step taken by the arctangent's series (its argument), below which
/// the five terms leave less than 1e-23.
const MAX_RA_STEP: f64 = 0.01;

/// Newton steps below this end Kepler's iteration (as in [`solve_kepler_sin_cos`]).
const NEWTON_DONE_RAD: f64 = 1e-9;

/// Sine and cosine of a small angle (`|x| ≤ 0.05`) by their Taylor series to x¹¹ and x¹²
/// (the next terms are below 1e-20 there).
#[inline]
fn small_sin_cos(x: f64) -> (f64, f64) {
    let x2 = x * x;
    let s = x
        * (1.0
            - x2 / 6.0 * (1.0 - x2 / 20.0 * (1.0 - x2 / 42.0 * (1.0 - x2 / 72.0 * (1.0 - x2 / 110.0)))));
    let c = 1.0
        - x2 / 2.0
            * (1.0 - x2 / 12.0 * (1.0 - x2 / 30.0 * (1.0 - x2 / 56.0 * (1.0 - x2 / 90.0))));
    (s, c)
}

/// Turns `(sin a, cos a)` by the angle of `(sin b, cos b)`: the angle-sum rule.
#[inline]
fn turn((s, c): (f64, f64), (sb, cb): (f64, f64)) -> (f64, f64) {
    (s * cb + c * sb, c * cb - s * sb)
}

/// `atan(u)` for `|u| ≤ 0.01` by its series to u⁹.
#[inline]
fn small_atan(u: f64) -> f64 {
    let u2 = u * u;
    u * (1.0 - u2 * (1.0 / 3.0 - u2 * (1.0 / 5.0 - u2 * (1.0 / 7.0 - u2 / 9.0))))
}

/// One sample before its angles are formed.
#[derive(Debug, Clone, Copy)]
pub(crate) struct RawSample {
    /// Unit vector toward the star, east-north-up.
    pub(crate) enu: DVec3,
    /// Stellar flux at this instant's distance, W m⁻².
    pub(crate) toa_flux_w_m2: f64,
}

/// The walk's state: the place, the orbit's constants and what is carried between samples.
#[derive(Debug, Clone)]
pub(crate) struct Cursor<'p> {
    planet: &'p Planet,
    place: PreparedPlace,
    sense: f64,
    e: f64,
    /// Sine and cosine of the fixed turn of rotation angle per step (evenly spaced samples).
    spin_step: Option<(f64, f64)>,
    /// Mean anomaly of the previous sample, radians.
    m: f64,
    /// Eccentric minus mean anomaly, radians (in `[−e, e]`), with the eccentric anomaly's sine
    /// and cosine.
    e_minus_m: f64,
    sin_ecc: f64,
    cos_ecc: f64,
    /// Sine and cosine of rotation angle plus east longitude.
    sin_phi: f64,
    cos_phi: f64,
    /// Right ascension and the equatorial direction it was taken from (unnormalised).
    ra: f64,
    ra_x: f64,
    ra_y: f64,
}

impl<'p> Cursor<'p> {
    /// A walk at `place`; `step_s` is the spacing of evenly spaced samples (`None` for given
    /// instants).
    pub(crate) fn new(planet: &'p Planet, place: PreparedPlace, step_s: Option<f64>) -> Self {
        let spin = planet.spin();
        let spin_step = step_s.map(|dt| {
            let turn = crate::angle::cycle_fraction(dt, spin.sidereal_day_s);
            wrap_pi(spin.sense.sign() * std::f64::consts::TAU * turn).sin_cos()
        });
        Cursor {
            planet,
            place,
            sense: spin.sense.sign(),
            e: planet.orbit().eccentricity,
            spin_step,
            m: 0.0,
            e_minus_m: 0.0,
            sin_ecc: 0.0,
            cos_ecc: 1.0,
            sin_phi: 0.0,
            cos_phi: 1.0,
            ra: 0.0,
            ra_x: 1.0,
            ra_y: 0.0,
        }
    }

    /// Kepler's equation solved by the scalar solver.
    fn kepler_exact(&mut self, m: f64) {
        let (ecc, s, c) = solve_kepler_sin_cos(m, self.e);
        self.m = m;
        self.e_minus_m = ecc - m;
        self.sin_ecc = s;
        self.cos_ecc = c;
    }

    /// Kepler's equation solved by Newton's method from the previous sample (module docs).
    #[inline]
    fn kepler_follow(&mut self, m: f64) {
        let e = self.e;
        let dm = wrap_pi(m - self.m);
        let guess = dm / (1.0 - e * self.cos_ecc);
        if !(guess.abs() < MAX_SERIES_ANGLE_RAD) {
            return self.kepler_exact(m);
        }
        let (mut s, mut c) = turn((self.sin_ecc, self.cos_ecc), small_sin_cos(guess));
        let mut d = self.e_minus_m + (guess - dm);
        for _ in 0..6 {
            // f(E) = E − e sin E − M = d − e sin E.
            let step = -(d - e * s) / (1.0 - e * c);
            if !(step.abs() < MAX_SERIES_ANGLE_RAD) {
                break;
            }
            (s, c) = turn((s, c), small_sin_cos(step));
            d += step;
            if step.abs() < NEWTON_DONE_RAD {
                self.m = m;
                self.e_minus_m = d;
                self.sin_ecc = s;
                self.cos_ecc = c;
                return;
            }
        }
        self.kepler_exact(m)
    }

    /// The sample at world time `t_s`; `anchor` starts from the scalar formulas, otherwise the
    /// previous sample's state is carried. `ANGLES` also tracks the right ascension (needed for
    /// the hour angle only).
    #[inline]
    pub(crate) fn sample<const ANGLES: bool>(&mut self, t_s: f64, anchor: bool) -> RawSample {
        let p = self.planet;
        let orbit = p.orbit();
        let m = orbit.mean_anomaly_rad(t_s);
        if anchor {
            self.kepler_exact(m);
        } else {
            self.kepler_follow(m);
        }
        // The star's ecliptic longitude λ as sine and cosine (as `Orbit::state_at_mean_anomaly`).
        let e = self.e;
        let distance_factor = 1.0 - e * self.cos_ecc;
        let inv = 1.0 / distance_factor;
        let (sv, cv) = (orbit.axis_ratio * self.sin_ecc * inv, (self.cos_ecc - e) * inv);
        let (sp, cp) = orbit.periapsis_sin_cos;
        let (sl, cl) = (sv * cp + cv * sp, cv * cp - sv * sp);
        // Equatorial direction: (cos δ cos α, cos δ sin α, sin δ) = (cos λ, cos ε sin λ, sin ε sin λ).
        let (se, ce) = p.spin().tilt_sin_cos;
        let (x, y) = (cl, ce * sl);
        let sin_dec = (se * sl).clamp(-1.0, 1.0);
        if ANGLES {
            self.follow_right_ascension(x, y, anchor);
        }
        match self.spin_step {
            Some(r) if !anchor => (self.sin_phi, self.cos_phi) = turn((self.sin_phi, self.cos_phi), r),
            _ => {
                let phi = p.spin().sidereal_angle_rad(t_s) + self.place.place.longitude_rad;
                (self.sin_phi, self.cos_phi) = phi.sin_cos();
            }
        }
        // cos δ · sin H and cos δ · cos H for H = φ − α, with cos δ cos α = x, cos δ sin α = y.
        let cd_sh = self.sin_phi * x - self.cos_phi * y;
        let cd_ch = self.cos_phi * x + self.sin_phi * y;
        let (sa, ca) = (self.place.sin_lat, self.place.cos_lat);
        RawSample {
            enu: DVec3::new(-cd_sh, ca * sin_dec - sa * cd_ch, sa * sin_dec + ca * cd_ch),
            toa_flux_w_m2: p.flux_at_mean_distance_w_m2() * (inv * inv),
        }
    }

    /// Moves the right ascension to the direction `(x, y)` (module docs).
    #[inline]
    fn follow_right_ascension(&mut self, x: f64, y: f64, anchor: bool) {
        let cross = self.ra_x * y - self.ra_y * x;
        let dot = self.ra_x * x + self.ra_y * y;
        self.ra = if !anchor && dot > 0.0 && cross.abs() < MAX_RA_STEP * dot {
            wrap_tau(self.ra + small_atan(cross / dot))
        } else {
            wrap_tau(y.atan2(x))
        };
        (self.ra_x, self.ra_y) = (x, y);
    }

    /// The full position of a sample taken with `ANGLES` (as [`Planet::star_position`]).
    #[inline]
    pub(crate) fn position(&self, t_s: f64, raw: RawSample) -> StarPosition {
        let enu = raw.enu;
        let h_geo = self.planet.spin().sidereal_angle_rad(t_s) + self.place.place.longitude_rad
            - self.ra;
        StarPosition {
            altitude_rad: enu.z.clamp(-1.0, 1.0).asin(),
            azimuth_rad: wrap_tau(enu.x.atan2(enu.y)),
            hour_angle_rad: wrap_pi(self.sense * h_geo),
            direction_enu: enu,
            toa_insolation_w_m2: raw.toa_flux_w_m2 * enu.z.max(0.0),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn series_match_the_library() {
        for k in -500..=500 {
            let x = k as f64 * 1e-4;
            let (s, c) = small_sin_cos(x);
            assert!((s - x.sin()).abs() < 2e-17 && (c - x.cos()).abs() < 2e-16, "{x}");
            let u = x / 5.0;
            assert!((small_atan(u) - u.atan()).abs() < 2e-18, "{u}");
        }
    }
}

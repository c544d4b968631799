//! The walk along a time series at one place: per-place work done once, per-instant work
//! shared within blocks of [`ANCHOR_EVERY`] samples, each block anchored on the scalar
//! formulas at its first sample.
//!
//! Every other sample of a block is computed from its block's anchor alone, not from the
//! sample before it, so successive samples do not wait on each other and the processor
//! overlaps them; errors cannot accumulate beyond one block. What is shared, and why it stays
//! exact:
//! * the eccentric anomaly: Kepler's equation is solved from the anchor's anomaly by its
//!   second-order Taylor step in the mean anomaly and one Newton step; sines and cosines are
//!   moved along by the angle-sum rule with the step's sine and cosine from their series (no
//!   `sin_cos`). A Newton step below 1e-7 rad leaves an error near 10 step² ≤ 1e-13 rad;
//!   a larger one falls back to the scalar solver;
//! * on evenly spaced samples, the rotation angle plus the longitude turns by the same angle
//!   every step: sample `j` of a block is the anchor's turned by `j` steps, from a table of
//!   64 turns built once per walk;
//! * the right ascension: the anchor's plus the arctangent of the cross over the dot product of
//!   the two equatorial directions, by its series.
//!
//! Steps too large for the series (fast orbits, sparse samples, a star near the celestial
//! pole) fall back to the scalar formula for that sample.

use glam::DVec3;

use crate::angle::{wrap_pi, wrap_tau};
use crate::lanes::Lanes;
use crate::orbit::solve_kepler_sin_cos;
use crate::planet::Planet;
use crate::sky::{PreparedPlace, StarPosition};

mod even_lanes;

pub(crate) use even_lanes::LANES;

/// Samples per block: the first is anchored on the scalar formulas.
pub(crate) const ANCHOR_EVERY: usize = 64;

/// Largest angle moved by series instead of `sin_cos`, radians: the series below leave less
/// than 1e-20 there.
const MAX_SERIES_ANGLE_RAD: f64 = 0.05;

/// Largest right-ascension step taken by the arctangent's series (its argument), below which
/// the five terms leave less than 1e-23.
const MAX_RA_STEP: f64 = 0.01;

/// Largest Newton step accepted after the Taylor start, radians (see the module docs).
const MAX_NEWTON_STEP_RAD: f64 = 1e-7;

/// Sine and cosine of a small angle (`|x| ≤ 0.05`) by their Taylor series to x⁹ and x¹⁰ (the
/// next terms are below 1e-21 there). Coefficients as products, not divisions: a division
/// costs ten multiplications.
#[inline(always)]
fn small_sin_cos<T: Lanes>(x: T) -> (T, T) {
    const S: [f64; 4] = [-1.0 / 6.0, 1.0 / 120.0, -1.0 / 5040.0, 1.0 / 362_880.0];
    const C: [f64; 5] = [
        -0.5,
        1.0 / 24.0,
        -1.0 / 720.0,
        1.0 / 40_320.0,
        -1.0 / 3_628_800.0,
    ];
    let k = T::splat;
    let x2 = x * x;
    let s = x + x * x2 * (k(S[0]) + x2 * (k(S[1]) + x2 * (k(S[2]) + x2 * k(S[3]))));
    let c =
        k(1.0) + x2 * (k(C[0]) + x2 * (k(C[1]) + x2 * (k(C[2]) + x2 * (k(C[3]) + x2 * k(C[4])))));
    (s, c)
}

/// Turns `(sin a, cos a)` by the angle of `(sin b, cos b)`: the angle-sum rule.
#[inline(always)]
fn turn<T: Lanes>((s, c): (T, T), (sb, cb): (T, T)) -> (T, T) {
    (s * cb + c * sb, c * cb - s * sb)
}

/// `atan(u)` for `|u| ≤ 0.01` by its series to u⁹.
#[inline(always)]
fn small_atan<T: Lanes>(u: T) -> T {
    let k = T::splat;
    let u2 = u * u;
    u * (k(1.0) - u2 * (k(1.0 / 3.0) - u2 * (k(1.0 / 5.0) - u2 * (k(1.0 / 7.0) - u2 / k(9.0)))))
}

/// One sample before its angles are formed.
#[derive(Debug, Clone, Copy)]
pub(crate) struct RawSample {
    /// Unit vector toward the star, east-north-up.
    pub(crate) enu: DVec3,
    /// Stellar flux at this instant's distance, W m⁻².
    pub(crate) toa_flux_w_m2: f64,
    /// Right ascension, radians `[0, 2π)` (0 unless taken with angles).
    pub(crate) ra: f64,
    /// Rotation angle of the prime meridian, radians (0 unless taken with angles).
    pub(crate) rotation_rad: f64,
}

/// The eccentric anomaly of one instant.
#[derive(Debug, Clone, Copy)]
struct Anomaly {
    /// Mean anomaly, radians.
    m: f64,
    /// Eccentric minus mean anomaly, radians.
    e_minus_m: f64,
    sin: f64,
    cos: f64,
}

/// The walk's state: the place, the anchor of the current block and the spin's turns.
#[derive(Debug, Clone)]
pub(crate) struct Cursor<'p> {
    planet: &'p Planet,
    place: PreparedPlace,
    sense: f64,
    e: f64,
    /// `(sin, cos)` of `j` steps of the spin, `j = 0 … 63` (evenly spaced samples only).
    spin_turns: Option<[(f64, f64); ANCHOR_EVERY]>,
    /// Mean anomaly and rotation angle gained per step, radians (evenly spaced samples).
    mean_anomaly_step_rad: f64,
    rotation_step_rad: f64,
    anchor: Anomaly,
    /// Rotation angle at the anchor, radians.
    anchor_rotation_rad: f64,
    /// `1 / (1 − e cos E)` at the anchor.
    anchor_inv_d: f64,
    /// Sine and cosine of the anchor's rotation angle plus east longitude.
    anchor_phi: (f64, f64),
    /// The anchor's right ascension and the equatorial direction it was taken from
    /// (unnormalised).
    anchor_ra: f64,
    anchor_ra_xy: (f64, f64),
    /// `1 / (x² + y²)` of that direction.
    anchor_ra_inv_norm2: f64,
}

impl<'p> Cursor<'p> {
    /// A walk at `place`; `step_s` is the spacing of evenly spaced samples (`None` for given
    /// instants).
    pub(crate) fn new(planet: &'p Planet, place: PreparedPlace, step_s: Option<f64>) -> Self {
        let spin = planet.spin();
        let per_step = |period_s: f64| {
            step_s.map_or(0.0, |dt| {
                std::f64::consts::TAU * crate::angle::cycle_fraction(dt, period_s)
            })
        };
        let mean_anomaly_step_rad = wrap_pi(per_step(planet.orbit().period_s));
        let rotation_step_rad = wrap_pi(spin.sense.sign() * per_step(spin.sidereal_day_s));
        let spin_turns = step_s.map(|dt| {
            let turn_fraction = crate::angle::cycle_fraction(dt, spin.sidereal_day_s);
            let one = wrap_pi(spin.sense.sign() * std::f64::consts::TAU * turn_fraction).sin_cos();
            // Built by the angle-sum rule: 63 roundings at most, ~1e-14.
            let mut turns = [(0.0, 1.0); ANCHOR_EVERY];
            for j in 1..ANCHOR_EVERY {
                turns[j] = turn(turns[j - 1], one);
            }
            turns
        });
        Cursor {
            planet,
            place,
            sense: spin.sense.sign(),
            e: planet.orbit().eccentricity,
            spin_turns,
            mean_anomaly_step_rad,
            rotation_step_rad,
            anchor_rotation_rad: 0.0,
            anchor: Anomaly {
                m: 0.0,
                e_minus_m: 0.0,
                sin: 0.0,
                cos: 1.0,
            },
            anchor_inv_d: 1.0,
            anchor_phi: (0.0, 1.0),
            anchor_ra: 0.0,
            anchor_ra_xy: (1.0, 0.0),
            anchor_ra_inv_norm2: 1.0,
        }
    }

    /// Kepler's equation solved by the scalar solver (out of line: the common path stays small).
    #[cold]
    #[inline(never)]
    fn kepler_exact(&self, m: f64) -> Anomaly {
        let (ecc, sin, cos) = solve_kepler_sin_cos(m, self.e);
        Anomaly {
            m,
            e_minus_m: ecc - m,
            sin,
            cos,
        }
    }

    /// Kepler's equation solved from the anchor for a mean anomaly `dm` past the anchor's
    /// (module docs), with `1 / (1 − e cos E)`; `None` where the steps are too large for the
    /// series. Divisions are taken as corrections of the anchor's reciprocal while they stay
    /// small (`r` below 1e-4 leaves r³ ≤ 1e-12 relative), as true divisions otherwise.
    #[inline(always)]
    fn kepler_from_anchor(&self, dm: f64) -> Option<(Anomaly, f64)> {
        let (e, a, inv_a) = (self.e, &self.anchor, self.anchor_inv_d);
        // E(M) to second order: E' = 1/D, E'' = −e sin E / D³ with D = 1 − e cos E.
        let first = dm * inv_a;
        let guess = first - 0.5 * e * a.sin * first * first * inv_a;
        if guess.is_nan() || guess.abs() >= MAX_SERIES_ANGLE_RAD {
            return None;
        }
        let (s, c) = turn((a.sin, a.cos), small_sin_cos(guess));
        let d = a.e_minus_m + (guess - dm);
        let d_guess = 1.0 - e * c;
        let r = (d_guess - (1.0 - e * a.cos)) * inv_a;
        let inv_guess = if r.abs() < 1e-4 {
            inv_a * (1.0 - r * (1.0 - r))
        } else {
            1.0 / d_guess
        };
        // One Newton step on f(E) = E − e sin E − M = d − e sin E.
        let step = -(d - e * s) * inv_guess;
        if step.is_nan() || step.abs() >= MAX_NEWTON_STEP_RAD {
            return None;
        }
        let half_sq = 0.5 * step * step;
        let (sin, cos) = (s + c * step - s * half_sq, c - s * step - c * half_sq);
        // D changes by e (sin E · step + …), a relative ρ ≤ 2e-6: 1/D to ρ² ≤ 4e-12.
        let rho = (1.0 - e * cos - d_guess) * inv_guess;
        let anomaly = Anomaly {
            m: a.m + dm,
            e_minus_m: d + step,
            sin,
            cos,
        };
        Some((anomaly, inv_guess * (1.0 - rho)))
    }

    /// Sample `j` of its block (`j = 0` anchors the block) at world time `t_s`. `ANGLES` also
    /// forms the right ascension and the rotation angle (needed for the hour angle only).
    #[inline]
    pub(crate) fn sample<const ANGLES: bool>(&mut self, t_s: f64, j: usize) -> RawSample {
        let p = self.planet;
        let orbit = p.orbit();
        let anchor = j == 0;
        let even = self.spin_turns.is_some();
        let fast = if anchor {
            None
        } else {
            let dm = if even {
                j as f64 * self.mean_anomaly_step_rad
            } else {
                wrap_pi(orbit.mean_anomaly_rad(t_s) - self.anchor.m)
            };
            self.kepler_from_anchor(dm)
        };
        let (ecc, inv) = match fast {
            Some(found) => found,
            None => {
                let a = self.kepler_exact(orbit.mean_anomaly_rad(t_s));
                let inv = 1.0 / (1.0 - self.e * a.cos);
                if anchor {
                    self.anchor = a;
                    self.anchor_inv_d = inv;
                }
                (a, inv)
            }
        };
        // The star's ecliptic longitude λ as sine and cosine (as `Orbit::state_at_mean_anomaly`).
        let e = self.e;
        let (sv, cv) = (orbit.axis_ratio * ecc.sin * inv, (ecc.cos - e) * inv);
        let (sp, cp) = orbit.periapsis_sin_cos;
        let (sl, cl) = (sv * cp + cv * sp, cv * cp - sv * sp);
        // Equatorial direction: (cos δ cos α, cos δ sin α, sin δ) = (cos λ, cos ε sin λ, sin ε sin λ).
        let (se, ce) = p.spin().tilt_sin_cos;
        let (x, y) = (cl, ce * sl);
        let sin_dec = (se * sl).clamp(-1.0, 1.0);
        let (ra, rotation) = if ANGLES || anchor || !even {
            let rotation = if even && !anchor {
                wrap_tau(self.anchor_rotation_rad + j as f64 * self.rotation_step_rad)
            } else {
                p.spin().sidereal_angle_rad(t_s)
            };
            if anchor {
                self.anchor_rotation_rad = rotation;
            }
            let ra = if ANGLES {
                self.right_ascension(x, y, anchor)
            } else {
                0.0
            };
            (ra, rotation)
        } else {
            (0.0, 0.0)
        };
        let (sin_phi, cos_phi) = match &self.spin_turns {
            Some(turns) if !anchor => turn(self.anchor_phi, turns[j]),
            _ => {
                let sc = (rotation + self.place.place.longitude_rad).sin_cos();
                if anchor {
                    self.anchor_phi = sc;
                }
                sc
            }
        };
        // cos δ · sin H and cos δ · cos H for H = φ − α, with cos δ cos α = x, cos δ sin α = y.
        let cd_sh = sin_phi * x - cos_phi * y;
        let cd_ch = cos_phi * x + sin_phi * y;
        let (sa, ca) = (self.place.sin_lat, self.place.cos_lat);
        RawSample {
            enu: DVec3::new(-cd_sh, ca * sin_dec - sa * cd_ch, sa * sin_dec + ca * cd_ch),
            toa_flux_w_m2: p.flux_at_mean_distance_w_m2() * (inv * inv),
            ra,
            rotation_rad: rotation,
        }
    }

    /// The right ascension of the direction `(x, y)` (module docs).
    #[inline]
    fn right_ascension(&mut self, x: f64, y: f64, anchor: bool) -> f64 {
        let (xa, ya) = self.anchor_ra_xy;
        let cross = xa * y - ya * x;
        let dot = xa * x + ya * y;
        // 1/dot as a correction of the anchor's 1/|A|²: q below 1e-3 leaves q⁴ ≤ 1e-12.
        let inv = self.anchor_ra_inv_norm2;
        let q = (dot * inv) - 1.0;
        if !anchor && q.abs() < 1e-3 && cross.abs() < MAX_RA_STEP * dot {
            let inv_dot = inv * (1.0 - q * (1.0 - q * (1.0 - q)));
            return wrap_tau(self.anchor_ra + small_atan(cross * inv_dot));
        }
        if !anchor && dot > 0.0 && cross.abs() < MAX_RA_STEP * dot {
            return wrap_tau(self.anchor_ra + small_atan(cross / dot));
        }
        let ra = wrap_tau(y.atan2(x));
        if anchor {
            self.anchor_ra = ra;
            self.anchor_ra_xy = (x, y);
            self.anchor_ra_inv_norm2 = 1.0 / (x * x + y * y);
        }
        ra
    }

    /// The full position of a sample taken with `ANGLES` (as [`Planet::star_position`]).
    #[inline]
    pub(crate) fn position(&self, raw: RawSample) -> StarPosition {
        let enu = raw.enu;
        let h_geo = raw.rotation_rad + self.place.place.longitude_rad - raw.ra;
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
            assert!(
                (s - x.sin()).abs() < 2e-17 && (c - x.cos()).abs() < 2e-16,
                "{x}"
            );
            let u = x / 5.0;
            assert!((small_atan(u) - u.atan()).abs() < 2e-18, "{u}");
        }
    }
}

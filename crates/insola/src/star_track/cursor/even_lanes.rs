//! The evenly spaced samples of a block, [`LANES`] at a time: the formulas of
//! [`Cursor::sample`]'s series path written without branches or library calls, so the
//! compiler lays the lanes side by side on the processor's vector units.
//!
//! Each sample of a block depends on the block's anchor only (module docs of `cursor`), so a
//! group of samples is independent work. Where a lane's steps are too large for the series
//! (the conditions of the scalar path, evaluated as flags), that lane is redone by
//! [`Cursor::sample`], which takes the scalar fallbacks.

use std::f64::consts::{PI, TAU};

use super::{
    ANCHOR_EVERY, Cursor, MAX_NEWTON_STEP_RAD, MAX_RA_STEP, MAX_SERIES_ANGLE_RAD, small_atan,
    small_sin_cos, turn,
};
use crate::inverse_trig::atan2;
use crate::lanes::{F64s, Lanes, WIDTH};
use crate::sky::StarPosition;

/// Samples computed side by side: a row of the lane type.
pub(crate) const LANES: usize = WIDTH;

/// `a` in `[0, 2π)` for `a ∈ [−2π, 4π)`, by selects (as `wrap_tau` there, to rounding).
#[inline(always)]
fn wrap_tau_near<T: Lanes>(a: T) -> T {
    let (zero, tau) = (T::splat(0.0), T::splat(TAU));
    let r = T::select(a.lt(zero), a + tau, a);
    let r = T::select(r.ge(tau), r - tau, r);
    T::select(r.ge(tau), zero, r)
}

/// `a` in `[0, 2π)` for `|a| < 2⁵¹` (a whole number of turns taken off, then the near form
/// for its rounding). The whole number by adding and taking off 1.5 · 2⁵², which rounds to
/// an integer with IEEE operations alone (no library `floor`, which the baseline processor
/// lacks as an instruction).
#[inline(always)]
fn wrap_tau_far<T: Lanes>(a: T) -> T {
    const ROUNDER: f64 = 6_755_399_441_055_744.0;
    let turns = a * T::splat(1.0 / TAU);
    let nearest = (turns + T::splat(ROUNDER)) - T::splat(ROUNDER);
    wrap_tau_near(a - T::splat(TAU) * nearest)
}

/// One group's results, each a row of lanes.
struct LaneResults<T> {
    altitude_rad: T,
    azimuth_rad: T,
    hour_angle_rad: T,
    enu: (T, T, T),
    toa_insolation_w_m2: T,
}

impl Cursor<'_> {
    /// Samples `j0 … j0 + LANES − 1` of an evenly spaced block (`1 ≤ j0`, all within the
    /// block) into `out`, with a flag per lane in `ok`: `false` where the scalar path would fall
    /// back, and the caller must take [`Cursor::sample`] for that lane.
    #[inline(always)]
    pub(crate) fn even_lanes(
        &self,
        j0: usize,
        out: &mut [StarPosition; LANES],
        ok: &mut [bool; LANES],
    ) {
        let turns = self
            .spin_turns
            .as_ref()
            .map_or(&[(0.0, 1.0); ANCHOR_EVERY], |t| t);
        let jf = F64s::from_fn(|lane| (j0 + lane) as f64);
        let turn_sin = F64s::from_fn(|lane| turns[(j0 + lane) % ANCHOR_EVERY].0);
        let turn_cos = F64s::from_fn(|lane| turns[(j0 + lane) % ANCHOR_EVERY].1);
        let (r, flags) = self.even_lane(jf, (turn_sin, turn_cos));
        for lane in 0..LANES {
            out[lane] = StarPosition {
                altitude_rad: r.altitude_rad.0[lane],
                azimuth_rad: r.azimuth_rad.0[lane],
                hour_angle_rad: r.hour_angle_rad.0[lane],
                direction_enu: glam::DVec3::new(r.enu.0.0[lane], r.enu.1.0[lane], r.enu.2.0[lane]),
                toa_insolation_w_m2: r.toa_insolation_w_m2.0[lane],
            };
            ok[lane] = flags.0[lane];
        }
    }

    /// The samples `jf` steps past the anchor, with the spin's turn for each: the formulas of
    /// [`Cursor::sample`]'s series path, and the flags of its conditions.
    #[inline(always)]
    fn even_lane<T: Lanes>(&self, jf: T, spin_turn: (T, T)) -> (LaneResults<T>, T::Mask) {
        let k = T::splat;
        let p = self.planet;
        let orbit = p.orbit();
        let (e, a, inv_a) = (k(self.e), &self.anchor, k(self.anchor_inv_d));
        let (a_sin, a_cos) = (k(a.sin), k(a.cos));
        // Kepler's equation from the anchor (as `kepler_from_anchor`).
        let dm = jf * k(self.mean_anomaly_step_rad);
        let first = dm * inv_a;
        let guess = first - k(0.5) * e * a_sin * first * first * inv_a;
        let series_ok = guess.abs().lt(k(MAX_SERIES_ANGLE_RAD));
        let (s, c) = turn((a_sin, a_cos), small_sin_cos(guess));
        let d = k(a.e_minus_m) + (guess - dm);
        let d_guess = k(1.0) - e * c;
        let r = (d_guess - (k(1.0) - e * a_cos)) * inv_a;
        let inv_guess = T::select(
            r.abs().lt(k(1e-4)),
            inv_a * (k(1.0) - r * (k(1.0) - r)),
            k(1.0) / d_guess,
        );
        let step = -(d - e * s) * inv_guess;
        let newton_ok = step.abs().lt(k(MAX_NEWTON_STEP_RAD));
        let half_sq = k(0.5) * step * step;
        let (sin, cos) = (s + c * step - s * half_sq, c - s * step - c * half_sq);
        let rho = (k(1.0) - e * cos - d_guess) * inv_guess;
        let inv = inv_guess * (k(1.0) - rho);
        // The star's ecliptic longitude and equatorial direction (as `sample`).
        let (sv, cv) = (k(orbit.axis_ratio) * sin * inv, (cos - e) * inv);
        let (sp, cp) = (k(orbit.periapsis_sin_cos.0), k(orbit.periapsis_sin_cos.1));
        let (sl, cl) = (sv * cp + cv * sp, cv * cp - sv * sp);
        let (se, ce) = (k(p.spin().tilt_sin_cos.0), k(p.spin().tilt_sin_cos.1));
        let (x, y) = (cl, ce * sl);
        let sin_dec = (se * sl).max(k(-1.0)).min(k(1.0));
        // The right ascension by the series from the anchor's (as `right_ascension`).
        let (xa, ya) = (k(self.anchor_ra_xy.0), k(self.anchor_ra_xy.1));
        let cross = xa * y - ya * x;
        let dot = xa * x + ya * y;
        let inv_n2 = k(self.anchor_ra_inv_norm2);
        let q = (dot * inv_n2) - k(1.0);
        let ra_ok = q.abs().lt(k(1e-3)) & cross.abs().lt(k(MAX_RA_STEP) * dot);
        let inv_dot = inv_n2 * (k(1.0) - q * (k(1.0) - q * (k(1.0) - q)));
        let ra = wrap_tau_near(k(self.anchor_ra) + small_atan(cross * inv_dot));
        // The spin turned by `j` steps from the anchor.
        let (sin_phi, cos_phi) = turn((k(self.anchor_phi.0), k(self.anchor_phi.1)), spin_turn);
        let cd_sh = sin_phi * x - cos_phi * y;
        let cd_ch = cos_phi * x + sin_phi * y;
        let (sa, ca) = (k(self.place.sin_lat), k(self.place.cos_lat));
        let enu = (-cd_sh, ca * sin_dec - sa * cd_ch, sa * sin_dec + ca * cd_ch);
        // The angles (as `position`; the altitude as an arctangent, the same angle for a unit
        // vector, so both angles take the one inline function).
        let rotation = k(self.anchor_rotation_rad) + jf * k(self.rotation_step_rad);
        let h_geo = rotation + k(self.place.place.longitude_rad) - ra;
        let results = LaneResults {
            altitude_rad: atan2(enu.2, (enu.0 * enu.0 + enu.1 * enu.1).sqrt()),
            azimuth_rad: wrap_tau_near(atan2(enu.0, enu.1)),
            hour_angle_rad: wrap_tau_far(k(self.sense) * h_geo + k(PI)) - k(PI),
            enu,
            toa_insolation_w_m2: k(p.flux_at_mean_distance_w_m2())
                * (inv * inv)
                * enu.2.max(k(0.0)),
        };
        (results, series_ok & newton_ok & ra_ok)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::angle::{wrap_pi, wrap_tau};

    #[test]
    fn the_wraps_agree_with_the_general_one() {
        for k in -4000..=8000 {
            let a = k as f64 * 1.0e-3 * PI;
            if (-TAU..2.0 * TAU).contains(&a) {
                assert!((wrap_tau_near::<f64>(a) - wrap_tau(a)).abs() < 1e-14, "{a}");
            }
            let far = a * 977.0;
            // As angles: either side of 0 ≡ 2π they may round apart.
            assert!(
                wrap_pi(wrap_tau_far::<f64>(far) - wrap_tau(far)).abs() < 1e-11,
                "{far}"
            );
            assert!(
                (wrap_tau_far::<f64>(a + PI) - PI - wrap_pi(a)).abs() < 1e-14,
                "{a}"
            );
            assert!((0.0..TAU).contains(&wrap_tau_far::<f64>(far)));
        }
    }
}

//! Local temperature at a place and instant: the zonal seasonal temperature, a day-night
//! deviation and the elevation lapse rate.
//!
//! Day-night model: a thin surface layer of heat capacity `C_s` obeys
//! `C_s dT'/dt = a·(Q(t) − Q̄_day) − λ·T'`, with `Q(t)` the instantaneous insolation (a clipped
//! cosine of the hour angle), `Q̄_day` its daily mean (which the zonal model already holds),
//! `a` the co-albedo and `λ` the day-night damping. Declination and distance are held fixed over
//! the day. The periodic solution is computed exactly, piece by piece: during daylight the
//! forcing is `a + b cos H` (with `a = sin φ sin δ`, `b = cos φ cos δ`) and the response is a
//! particular cosine solution plus a decaying exponential; at night it relaxes exponentially
//! toward `−a·Q̄_day/λ`; the two constants follow from continuity at sunrise and sunset and
//! periodicity over one solar day. The only dimensionless number is `κ = λ/(ω C_s)`, `ω` the
//! solar-day angular rate: slow rotators (large `κ`) follow the sun closely and swing widely —
//! long hot days and long cold nights — while fast rotators (small `κ`) barely respond. The
//! deviation averages to zero over a day, so the zonal model's energy budget is unchanged.
//!
//! Limits: linear response (no σT⁴), no heat carried between day and night sides other than
//! through `λ`, the diurnal layer has no memory from one day to the next beyond the periodic
//! solution. The result is floored at absolute zero.

use std::f64::consts::{FRAC_PI_2, PI, TAU};

use super::cycle::ClimateCycle;
use super::forcing::periodic_index;
use crate::error::{QueryError, check_arg};

/// Absolute zero, °C.
const ABSOLUTE_ZERO_C: f64 = -273.15;

/// Places per parallel work item in the batch query.
const BATCH_CHUNK: usize = 4096;

/// Periodic day-night temperature deviation, K, of a surface layer at latitude `lat_rad` and
/// hour angle `hour_angle_rad` (0 at local noon), for the star at declination `decl_rad`.
///
/// `absorbed_peak_w_m2` is `a · S0/ρ²` (co-albedo times the flux at the planet), `kappa` is
/// `λ/(ω C_s)` and `damping_w_m2_per_k` is `λ`. See the module docs for the solution; for many
/// places at one instant use [`DiurnalResponse`].
pub fn diurnal_deviation_k(
    lat_rad: f64,
    decl_rad: f64,
    hour_angle_rad: f64,
    absorbed_peak_w_m2: f64,
    damping_w_m2_per_k: f64,
    kappa: f64,
) -> f64 {
    let (sp, cp) = lat_rad.sin_cos();
    DiurnalResponse::new(decl_rad, damping_w_m2_per_k, kappa).deviation_k(
        sp,
        cp,
        hour_angle_rad,
        absorbed_peak_w_m2,
    )
}

/// The place-independent constants of the day-night response at one instant.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DiurnalResponse {
    sin_decl: f64,
    cos_decl: f64,
    kappa: f64,
    /// `κ²/(κ² + 1)` and `κ/(κ² + 1)`, written to stay finite for κ → ∞ and κ → 0.
    r1: f64,
    r2: f64,
    /// `1/(1 − e^(−2πκ))`.
    inv_denom: f64,
    inv_damping: f64,
    /// False when the deviation is zero everywhere (κ not positive and finite, or negligible).
    active: bool,
}

impl DiurnalResponse {
    /// Constants for declination `decl_rad`, damping `λ` (W m⁻² K⁻¹) and `κ = λ/(ω C_s)`.
    pub fn new(decl_rad: f64, damping_w_m2_per_k: f64, kappa: f64) -> Self {
        let (sin_decl, cos_decl) = decl_rad.sin_cos();
        // Infinite surface heat capacity or rate, or bad input: no day-night deviation.
        let active = kappa.is_finite()
            && TAU * kappa >= 1e-12
            && damping_w_m2_per_k.is_finite()
            && damping_w_m2_per_k > 0.0;
        DiurnalResponse {
            sin_decl,
            cos_decl,
            kappa,
            r1: 1.0 / (1.0 + 1.0 / (kappa * kappa)),
            r2: 1.0 / (kappa + 1.0 / kappa),
            inv_denom: 1.0 / -(-kappa * TAU).exp_m1(),
            inv_damping: 1.0 / damping_w_m2_per_k,
            active,
        }
    }

    /// Deviation, K, at a place given by the sine and cosine of its latitude, at hour angle
    /// `hour_angle_rad`, for absorbed peak flux `absorbed_peak_w_m2` (co-albedo × S0/ρ²).
    pub fn deviation_k(
        &self,
        sin_lat: f64,
        cos_lat: f64,
        hour_angle_rad: f64,
        absorbed_peak_w_m2: f64,
    ) -> f64 {
        if !self.active {
            return 0.0;
        }
        let kappa = self.kappa;
        let (a, b) = (sin_lat * self.sin_decl, cos_lat * self.cos_decl);
        // Sunset hour angle h0 from cos h0 = −a/b (Berger 1978, eqs. 8–9), with its sine.
        let (h0, cos_h0, sin_h0) = if -a >= b {
            (0.0, 1.0, 0.0)
        } else if -a <= -b {
            (PI, -1.0, 0.0)
        } else {
            let c = -a / b;
            (c.acos(), c, (1.0 - c * c).max(0.0).sqrt())
        };
        let f0 = (a * h0 + b * sin_h0) / PI; // daily mean of max(0, a + b cos H)
        let g = absorbed_peak_w_m2 * self.inv_damping;
        // Daytime particular solution G[(a − f0) + b(r1 cos H + r2 sin H)].
        let day = |c: f64, s: f64| g * ((a - f0) + b * (self.r1 * c + self.r2 * s));
        let (day_set, day_rise) = (day(cos_h0, sin_h0), day(cos_h0, -sin_h0));
        let night = -g * f0;
        let e_day = (-2.0 * kappa * h0).exp();
        let one_minus_e_night = -(-kappa * (TAU - 2.0 * h0)).exp_m1();
        let a_s = day_set - e_day * day_rise;
        let t_rise = (night * one_minus_e_night + (1.0 - one_minus_e_night) * a_s) * self.inv_denom;
        let h = (hour_angle_rad + PI).rem_euclid(TAU) - PI;
        if h.abs() <= h0 {
            let (s, c) = h.sin_cos();
            day(c, s) + (t_rise - day_rise) * (-kappa * (h + h0)).exp()
        } else {
            let t_set = a_s + e_day * t_rise;
            let since_sunset = (h - h0).rem_euclid(TAU);
            night + (t_set - night) * (-kappa * since_sunset).exp()
        }
    }
}

/// The climate at one instant of the year, ready for many place queries (no allocation).
#[derive(Debug, Clone, Copy)]
pub struct ClimateInstant<'a> {
    cycle: &'a ClimateCycle,
    k0: usize,
    k1: usize,
    wt: f64,
    decl_rad: f64,
    /// Flux at the planet `S0/ρ²`, W m⁻² (0 without an orbit forcing).
    flux_w_m2: f64,
    response: DiurnalResponse,
}

impl ClimateCycle {
    /// Prepares queries at `year_fraction` for a world whose mean solar day lasts
    /// `solar_day_s` seconds (finite, > 0).
    pub fn instant(
        &self,
        year_fraction: f64,
        solar_day_s: f64,
    ) -> Result<ClimateInstant<'_>, QueryError> {
        check_arg(
            "year_fraction",
            year_fraction,
            f64::MIN,
            f64::MAX,
            "a finite number",
        )?;
        check_arg(
            "solar_day_s",
            solar_day_s,
            f64::MIN_POSITIVE,
            f64::MAX,
            "greater than 0, finite",
        )?;
        let (k0, k1, wt) = periodic_index(year_fraction, self.steps);
        let (decl_rad, flux_w_m2) = match &self.forcing {
            Some(f) => {
                let s = f.sample_at(year_fraction);
                (
                    s.declination_rad,
                    f.s0_w_m2 / (s.distance_factor * s.distance_factor),
                )
            }
            None => (0.0, 0.0),
        };
        let kappa = self.spec.diurnal_kappa(solar_day_s);
        let response = DiurnalResponse::new(decl_rad, self.spec.diurnal_damping_w_m2_per_k, kappa);
        Ok(ClimateInstant {
            cycle: self,
            k0,
            k1,
            wt,
            decl_rad,
            flux_w_m2,
            response,
        })
    }

    /// Local temperature, °C, at latitude `lat_rad`, `year_fraction`, local hour angle of the
    /// star `hour_angle_rad` (0 at local noon), elevation `elevation_m` above the reference
    /// level, on a world whose mean solar day lasts `solar_day_s` seconds.
    pub fn local_temperature_c(
        &self,
        lat_rad: f64,
        year_fraction: f64,
        hour_angle_rad: f64,
        elevation_m: f64,
        solar_day_s: f64,
    ) -> Result<f64, QueryError> {
        self.instant(year_fraction, solar_day_s)?.temperature_c(
            lat_rad,
            hour_angle_rad,
            elevation_m,
        )
    }
}

impl ClimateInstant<'_> {
    /// Star declination at this instant, radians.
    pub fn declination_rad(&self) -> f64 {
        self.decl_rad
    }

    /// Zonal seasonal temperature at `lat_rad` (no day-night part, no elevation), °C.
    pub fn zonal_temperature_c(&self, lat_rad: f64) -> f64 {
        self.zonal_at_x(lat_rad.sin())
    }

    fn zonal_at_x(&self, x: f64) -> f64 {
        let c = self.cycle;
        let nb = c.grid.len();
        let (i0, i1, wx) = c.grid.interpolation_x(x);
        let at = |k: usize| {
            let row = &c.temps_c[k * nb..(k + 1) * nb];
            (1.0 - wx) * row[i0] + wx * row[i1]
        };
        (1.0 - self.wt) * at(self.k0) + self.wt * at(self.k1)
    }

    /// Day-night deviation at `lat_rad` and hour angle `hour_angle_rad`, K (zero-mean over a day).
    pub fn diurnal_deviation_k(&self, lat_rad: f64, hour_angle_rad: f64) -> f64 {
        let (sp, cp) = lat_rad.sin_cos();
        self.deviation_with_zonal(sp, cp, hour_angle_rad, self.zonal_at_x(sp))
    }

    /// Day-night deviation when the zonal temperature (which sets the ice state) is known.
    fn deviation_with_zonal(
        &self,
        sin_lat: f64,
        cos_lat: f64,
        hour_angle_rad: f64,
        zonal: f64,
    ) -> f64 {
        if self.flux_w_m2 == 0.0 {
            return 0.0;
        }
        let spec = &self.cycle.spec;
        let iced = spec.ice_enabled && zonal < spec.ice_temperature_c;
        let coalbedo = if iced {
            1.0 - spec.ice_albedo
        } else {
            1.0 - self.cycle.ice_free_albedo_at_x(sin_lat)
        };
        self.response
            .deviation_k(sin_lat, cos_lat, hour_angle_rad, coalbedo * self.flux_w_m2)
    }

    /// Local temperature, °C: zonal + day-night deviation − lapse rate × elevation, floored at
    /// absolute zero. Errors on latitude outside ±π/2, non-finite hour angle, or elevation
    /// outside ±100 km.
    pub fn temperature_c(
        &self,
        lat_rad: f64,
        hour_angle_rad: f64,
        elevation_m: f64,
    ) -> Result<f64, QueryError> {
        check_arg("lat_rad", lat_rad, -FRAC_PI_2, FRAC_PI_2, "-π/2 to π/2")?;
        check_arg(
            "hour_angle_rad",
            hour_angle_rad,
            f64::MIN,
            f64::MAX,
            "a finite number",
        )?;
        check_arg("elevation_m", elevation_m, -1e5, 1e5, "-100000 to 100000")?;
        Ok(self.temperature_unchecked(lat_rad, hour_angle_rad, elevation_m))
    }

    fn temperature_unchecked(&self, lat_rad: f64, hour_angle_rad: f64, elevation_m: f64) -> f64 {
        let lapse = self.cycle.spec.lapse_rate_k_per_km * elevation_m / 1000.0;
        let (sp, cp) = lat_rad.sin_cos();
        let zonal = self.zonal_at_x(sp);
        let t = zonal + self.deviation_with_zonal(sp, cp, hour_angle_rad, zonal) - lapse;
        t.max(ABSOLUTE_ZERO_C)
    }

    /// Batch form of [`Self::temperature_c`] over many places, in parallel (rayon): writes
    /// `out[i]` for place `i`. All four slices must have the same length. The first bad input
    /// is returned as an error (and `out` is then partly written).
    pub fn temperatures_c(
        &self,
        lats_rad: &[f64],
        hour_angles_rad: &[f64],
        elevations_m: &[f64],
        out: &mut [f64],
    ) -> Result<(), QueryError> {
        let n = lats_rad.len();
        for (name, len) in [
            ("hour_angles_rad.len()", hour_angles_rad.len()),
            ("elevations_m.len()", elevations_m.len()),
            ("out.len()", out.len()),
        ] {
            if len != n {
                return Err(QueryError::OutOfRange {
                    name,
                    value: len as f64,
                    allowed: "the same length as lats_rad",
                });
            }
        }
        crate::parallel::try_for_each_chunk(out, BATCH_CHUNK, |c, chunk| {
            let start = c * BATCH_CHUNK;
            for (i, o) in chunk.iter_mut().enumerate() {
                let p = start + i;
                *o = self.temperature_c(lats_rad[p], hour_angles_rad[p], elevations_m[p])?;
            }
            Ok(())
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Direct time integration of the day-night equation over many days, for comparison.
    fn integrate(lat: f64, decl: f64, s: f64, lambda: f64, kappa: f64) -> Vec<f64> {
        let n = 20_000;
        let dh = TAU / n as f64;
        let mut t = 0.0;
        let qbar = s * crate::insolation::daily_mean_w_m2(1.0, lat, decl, 1.0);
        let mut out = vec![0.0; n];
        for _day in 0..200 {
            for (i, o) in out.iter_mut().enumerate() {
                let h = -PI + i as f64 * dh;
                *o = t;
                let q =
                    |hh: f64| s * crate::insolation::instantaneous_w_m2(1.0, lat, decl, hh, 1.0);
                // dT/dH = κ ((q − q̄)/λ − T), midpoint rule.
                let f = |hh: f64, tt: f64| kappa * ((q(hh) - qbar) / lambda - tt);
                let k1 = f(h, t);
                t += dh * f(h + 0.5 * dh, t + 0.5 * dh * k1);
            }
        }
        out
    }

    #[test]
    fn exact_periodic_solution_matches_direct_integration() {
        // Computed: forward integration of the same linear equation (regression of the formula).
        for (lat_deg, decl_deg, kappa) in [
            (0.0, 0.0, 0.1),
            (45.0, 20.0, 2.0),
            (70.0, 23.0, 0.5),
            (-30.0, 10.0, 8.0),
        ] {
            let (lat, decl) = (f64::to_radians(lat_deg), f64::to_radians(decl_deg));
            let series = integrate(lat, decl, 900.0, 10.0, kappa);
            for i in (0..series.len()).step_by(1000) {
                let h = -PI + i as f64 * TAU / series.len() as f64;
                let exact = diurnal_deviation_k(lat, decl, h, 900.0, 10.0, kappa);
                assert!(
                    (exact - series[i]).abs() < 2e-3 * (1.0 + exact.abs()),
                    "{lat_deg} {h}: {exact} vs {}",
                    series[i]
                );
            }
        }
    }

    #[test]
    fn slow_rotators_swing_more_and_the_mean_is_zero() {
        let (lat, decl) = (0.3, 0.1);
        let swing = |kappa: f64| {
            let v: Vec<f64> = (0..720)
                .map(|i| diurnal_deviation_k(lat, decl, i as f64 * TAU / 720.0, 900.0, 10.0, kappa))
                .collect();
            let mean = v.iter().sum::<f64>() / v.len() as f64;
            assert!(mean.abs() < 0.05, "mean {mean} at κ {kappa}");
            v.iter().copied().fold(f64::MIN, f64::max) - v.iter().copied().fold(f64::MAX, f64::min)
        };
        let (fast, earthlike, slow) = (swing(0.01), swing(0.1), swing(50.0));
        assert!(
            fast < earthlike && earthlike < slow,
            "{fast} {earthlike} {slow}"
        );
        // Slow limit: T' → a(Q − Q̄)/λ; swing = 900·(sin φ sin δ + cos φ cos δ)/10 (computed).
        let limit = 900.0 * (lat.sin() * decl.sin() + lat.cos() * decl.cos()) / 10.0;
        assert!((slow - limit).abs() < 0.05 * limit, "{slow} vs {limit}");
    }

    #[test]
    fn polar_night_has_no_deviation_and_polar_day_stays_finite() {
        let lat = f64::to_radians(85.0);
        assert_eq!(diurnal_deviation_k(lat, -0.3, 1.0, 900.0, 10.0, 1.0), 0.0);
        let v = diurnal_deviation_k(lat, 0.3, 1.0, 900.0, 10.0, 1.0);
        assert!(v.is_finite());
        assert!(diurnal_deviation_k(lat, 0.3, 1.0, 900.0, 10.0, 1e9).is_finite());
        assert_eq!(diurnal_deviation_k(lat, 0.3, 1.0, 900.0, 10.0, 0.0), 0.0);
    }
}

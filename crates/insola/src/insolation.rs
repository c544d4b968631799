//! Top-of-atmosphere insolation: instantaneous, daily mean (Berger 1978) and annual mean.
//!
//! All functions take the stellar flux at the mean distance `s0_w_m2` (W m⁻²), latitude and
//! declination in radians and the distance factor `rho = r / a` (dimensionless); they return
//! W m⁻² on a horizontal surface at the top of the atmosphere.

use std::f64::consts::PI;

/// Instantaneous insolation on a horizontal surface, W m⁻².
///
/// `Q = (S0/ρ²) max(0, sin φ sin δ + cos φ cos δ cos H)`, `H` the hour angle in radians.
pub fn instantaneous_w_m2(s0_w_m2: f64, lat_rad: f64, decl_rad: f64, hour_angle_rad: f64, rho: f64) -> f64 {
    let mu = lat_rad.sin() * decl_rad.sin() + lat_rad.cos() * decl_rad.cos() * hour_angle_rad.cos();
    s0_w_m2 / (rho * rho) * mu.max(0.0)
}

/// Hour angle of geometric sunset h0 in radians, in `[0, π]`.
///
/// `cos h0 = −tan φ tan δ`; π during polar day, 0 during polar night (Berger 1978, eqs. 8–9).
pub fn sunset_hour_angle_rad(lat_rad: f64, decl_rad: f64) -> f64 {
    // Written with sines and cosines so the poles (cos φ = 0) need no special case.
    let num = -lat_rad.sin() * decl_rad.sin();
    let den = lat_rad.cos() * decl_rad.cos();
    if num >= den {
        0.0
    } else if num <= -den {
        PI
    } else {
        (num / den).acos()
    }
}

/// Daily-mean insolation (24-hour average over one rotation), W m⁻².
///
/// `Q̄ = (S0/π)(1/ρ²)(h0 sin φ sin δ + cos φ cos δ sin h0)` — Berger (1978), J. Atmos. Sci. 35,
/// 2362. Assumes declination and distance are constant over the day.
pub fn daily_mean_w_m2(s0_w_m2: f64, lat_rad: f64, decl_rad: f64, rho: f64) -> f64 {
    let h0 = sunset_hour_angle_rad(lat_rad, decl_rad);
    let (sp, cp) = lat_rad.sin_cos();
    let (sd, cd) = decl_rad.sin_cos();
    let q = s0_w_m2 / (PI * rho * rho) * (h0 * sp * sd + cp * cd * h0.sin());
    q.max(0.0)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn d(x: f64) -> f64 {
        x.to_radians()
    }

    #[test]
    fn sunset_hour_angle_limits() {
        assert_eq!(sunset_hour_angle_rad(d(90.0), d(10.0)), PI);
        assert_eq!(sunset_hour_angle_rad(d(90.0), d(-10.0)), 0.0);
        assert!((sunset_hour_angle_rad(0.0, d(20.0)) - PI / 2.0).abs() < 1e-12);
    }

    #[test]
    fn pole_at_solstice_is_s0_sin_obliquity() {
        // Derived: at the pole h0 = π and Q = S0 sin δ (SCIENCE check "pole daily mean").
        let q = daily_mean_w_m2(1361.0, d(90.0), d(23.44), 1.0);
        assert!((q - 541.4).abs() < 0.1, "{q}");
    }
}

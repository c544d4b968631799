//! The ice-free albedo of each latitude band: from the world's own sky (the default) or from an
//! explicit latitude law.
//!
//! # The sky law
//!
//! Sunlight reflects more when it arrives at a slant, so a band's albedo follows how high its
//! star stands over the year. Each band gets one representative cosine of the solar zenith
//! angle: the insolation-weighted mean `μ̄ = ∫Q μ dt / ∫Q dt` over the year (with `Q ∝ μ/ρ²`
//! while the star is up), the choice Cronin (2014, J. Atmos. Sci. 71, 2994, "On the choice of
//! average solar zenith angle") shows comes closest to the mean absorbed sunlight.
//!
//! The surface (open ocean) reflects `α_s(μ̄) = 0.026/(μ̄^1.7 + 0.065) + 0.15(μ̄ − 0.1)(μ̄ −
//! 0.5)(μ̄ − 1)` (Briegleb, Minnis, Ramanathan & Harrison 1986, J. Clim. Appl. Meteor. 25, 214:
//! clear-sky ocean albedo for direct sunlight). Above it an atmosphere reflects a fraction `R`
//! (clouds, air, haze) and passes the rest both ways, with multiple reflections between the
//! two: `α = R + (1 − R)²·α_s/(1 − R·α_s)` — the single-layer model of Donohoe & Battisti (2011,
//! J. Climate 24, 4402) with its atmospheric absorption set to zero (the model counts absorbed
//! sunlight the same wherever it is absorbed). The result is capped at the ice albedo, so open
//! water is never brighter than ice.
//!
//! The default `R = 0.26` gives an Earth-like world (Sun-like star, 1 AU, 23.44° tilt) a
//! global ice-free albedo of about 0.28–0.29 (Earth's Bond albedo is about 0.3; from memory); its
//! latitude contrast comes from the sky alone, so a high-tilt world whose poles see a high
//! summer sun gets dark, warm poles.

use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range};

/// Default reflectance of the atmosphere above the surface in the sky law (dimensionless).
pub const DEFAULT_ATMOSPHERE_ALBEDO: f64 = 0.26;

/// `a0` of the explicit law used when a world file gives only `albedo_a2` (Earth's climlab
/// seasonal value; kept so older world files read as before).
pub const LEGACY_ALBEDO_A0: f64 = 0.33;

/// `a2` of the explicit law used when a world file gives only `albedo_a0` (Earth's climlab
/// seasonal value; kept so older world files read as before).
pub const LEGACY_ALBEDO_A2: f64 = 0.25;

/// How the ice-free albedo of each latitude band is set.
///
/// The sky law ([`IceFreeAlbedo::FromSky`], the default) gives each band the planetary albedo
/// [`sky_albedo`] at its insolation-weighted mean cosine of the solar zenith angle over the year
/// ([`insolation_weighted_cos_zenith`]; the choice Cronin 2014, J. Atmos. Sci. 71, 2994, shows
/// comes closest to the mean absorbed sunlight): the clear-sky ocean albedo of Briegleb et al.
/// (1986) seen through an atmosphere reflecting `atmosphere_albedo`, capped at the ice albedo.
/// The default 0.26 gives an Earth-like world (Sun-like star, 1 AU, 23.44° tilt) a global
/// ice-free albedo of about 0.28–0.29 (Earth's Bond albedo is about 0.3; from memory); the latitude
/// contrast comes from the sky alone, so a high-tilt world whose poles see a high summer sun
/// gets dark, warm poles.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub enum IceFreeAlbedo {
    /// From the world's own sky: the ocean albedo of Briegleb et al. (1986) at each band's
    /// insolation-weighted solar zenith angle, seen through an atmosphere that reflects
    /// `atmosphere_albedo` (0–1, default 0.26). The default.
    FromSky {
        /// Fraction of sunlight the atmosphere reflects before it reaches the surface (0–1).
        atmosphere_albedo: f64,
    },
    /// An explicit latitude law `a0 + a2·P2(sin φ)`, the same for every orbit (written
    /// `albedo_a0`/`albedo_a2` in a world file). `a2 > 0` makes the poles brighter, as Earth's
    /// low polar sun does.
    Legendre {
        /// Constant part (dimensionless).
        a0: f64,
        /// Latitude part, times `P2(x) = (3x² − 1)/2` (dimensionless).
        a2: f64,
    },
}

impl Default for IceFreeAlbedo {
    fn default() -> Self {
        IceFreeAlbedo::FromSky {
            atmosphere_albedo: DEFAULT_ATMOSPHERE_ALBEDO,
        }
    }
}

impl IceFreeAlbedo {
    /// The explicit latitude law `a0 + a2·P2(sin φ)`.
    pub fn legendre(a0: f64, a2: f64) -> Self {
        IceFreeAlbedo::Legendre { a0, a2 }
    }

    /// A short name for messages: `"sky"` or `"latitude"`.
    pub fn name(&self) -> &'static str {
        match self {
            IceFreeAlbedo::FromSky { .. } => "sky",
            IceFreeAlbedo::Legendre { .. } => "latitude",
        }
    }

    /// Ice-free albedo (dimensionless) of a band at `x = sin(latitude)` whose
    /// insolation-weighted mean cosine of the solar zenith angle is `mean_cos_zenith` (0–1;
    /// ignored by the explicit law), capped at `ice_albedo` for the sky law.
    pub fn albedo(&self, x: f64, mean_cos_zenith: f64, ice_albedo: f64) -> f64 {
        match *self {
            IceFreeAlbedo::FromSky { atmosphere_albedo } => {
                sky_albedo(mean_cos_zenith, atmosphere_albedo).min(ice_albedo)
            }
            IceFreeAlbedo::Legendre { a0, a2 } => a0 + a2 * 0.5 * (3.0 * x * x - 1.0),
        }
    }

    /// Checks the law's parameters; errors name `{field}` via `f`.
    pub(crate) fn validate(&self, f: impl Fn(&str) -> String) -> Result<(), SpecError> {
        match *self {
            IceFreeAlbedo::FromSky { atmosphere_albedo } => {
                check_range(&f("atmosphere_albedo"), atmosphere_albedo, 0.0, 1.0)?;
            }
            IceFreeAlbedo::Legendre { a0, a2 } => {
                check_range(&f("albedo_a0"), a0, 0.0, 1.0)?;
                check_range(&f("albedo_a2"), a2, -1.0, 1.0)?;
                // P2 spans [−1/2, 1]: the albedo must stay in [0, 1] at equator and pole.
                let (eq, pole) = (a0 - 0.5 * a2, a0 + a2);
                if !(0.0..=1.0).contains(&eq) || !(0.0..=1.0).contains(&pole) {
                    return Err(SpecError::inconsistent(
                        f("albedo_a2"),
                        format!(
                            "albedo a0 + a2·P2 is {eq:.3} at the equator and {pole:.3} at the poles; both must be within 0 to 1"
                        ),
                    ));
                }
            }
        }
        Ok(())
    }
}

/// Clear-sky ocean albedo for direct sunlight at cosine of zenith angle `mu` (clamped to 0–1),
/// dimensionless: `0.026/(μ^1.7 + 0.065) + 0.15(μ − 0.1)(μ − 0.5)(μ − 1)` (Briegleb et al.
/// 1986, J. Clim. Appl. Meteor. 25, 214; the form used in the NCAR community model's ocean
/// albedo routine).
pub fn ocean_albedo(mu: f64) -> f64 {
    let mu = mu.clamp(0.0, 1.0);
    0.026 / (mu.powf(1.7) + 0.065) + 0.15 * (mu - 0.1) * (mu - 0.5) * (mu - 1.0)
}

/// Planetary albedo of an ocean under an atmosphere reflecting `atmosphere_albedo` (0–1), at
/// cosine of zenith angle `mu`: `R + (1 − R)²·α_s/(1 − R·α_s)` with `α_s` from
/// [`ocean_albedo`] (single-layer model, Donohoe & Battisti 2011, without absorption).
pub fn sky_albedo(mu: f64, atmosphere_albedo: f64) -> f64 {
    let r = atmosphere_albedo.clamp(0.0, 1.0);
    let s = ocean_albedo(mu);
    r + (1.0 - r) * (1.0 - r) * s / (1.0 - r * s)
}

/// Integrals over one day of `μ` and `μ²` in hour angle (radians) at latitude `lat_rad` and
/// declination `decl_rad`, while the star is up: `μ = a + b cos h` for `|h| < h0`.
pub(crate) fn daily_cos_zenith_moments(lat_rad: f64, decl_rad: f64) -> (f64, f64) {
    let h0 = crate::insolation::sunset_hour_angle_rad(lat_rad, decl_rad);
    let a = lat_rad.sin() * decl_rad.sin();
    let b = lat_rad.cos() * decl_rad.cos();
    let (s, s2) = (h0.sin(), (2.0 * h0).sin());
    let m1 = 2.0 * (a * h0 + b * s);
    let m2 = 2.0 * (a * a * h0 + 2.0 * a * b * s + b * b * (0.5 * h0 + 0.25 * s2));
    (m1.max(0.0), m2.max(0.0))
}

/// Insolation-weighted mean cosine of the solar zenith angle over a year at `lat_rad`, from
/// `(declination_rad, distance_factor)` samples evenly spaced in time. Zero where the star
/// never rises.
pub fn insolation_weighted_cos_zenith(lat_rad: f64, samples: &[(f64, f64)]) -> f64 {
    let (mut num, mut den) = (0.0, 0.0);
    for &(decl, rho) in samples {
        let (m1, m2) = daily_cos_zenith_moments(lat_rad, decl);
        let w = 1.0 / (rho * rho);
        num += w * m2;
        den += w * m1;
    }
    if den > 0.0 {
        (num / den).clamp(0.0, 1.0)
    } else {
        0.0
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::f64::consts::FRAC_PI_4;

    #[test]
    fn equinox_equator_weighted_cosine_is_pi_over_four() {
        // μ = cos h over a 12 h day: ∫cos² / ∫cos = (π/2)/2 = π/4 (exact).
        let mu = insolation_weighted_cos_zenith(0.0, &[(0.0, 1.0)]);
        assert!((mu - FRAC_PI_4).abs() < 1e-12, "{mu}");
        // Polar day at the pole with declination δ: μ = sin δ all day.
        let d = 20f64.to_radians();
        let pole = insolation_weighted_cos_zenith(std::f64::consts::FRAC_PI_2, &[(d, 1.0)]);
        assert!((pole - d.sin()).abs() < 1e-9, "{pole}");
        // Polar night: no sunlight, zero.
        assert_eq!(
            insolation_weighted_cos_zenith(std::f64::consts::FRAC_PI_2, &[(-d, 1.0)]),
            0.0
        );
    }

    #[test]
    fn ocean_albedo_matches_briegleb_form() {
        // Briegleb et al. (1986) as coded in the NCAR community model: 0.024 with the sun
        // overhead (0.026/1.065, the cubic is zero at μ = 1) and 0.39 at the horizon
        // (0.026/0.065 = 0.4 less 0.15·0.1·0.5·1 = 0.0075) — arithmetic from the formula.
        assert!((ocean_albedo(1.0) - 0.026 / 1.065).abs() < 1e-12);
        assert!((ocean_albedo(0.0) - (0.4 - 0.0075)).abs() < 1e-12);
        // A lower sun reflects more, up to μ = 0.9 (the fitted cubic dips by under 0.001
        // between 0.9 and 1).
        let mut last = ocean_albedo(0.9);
        for i in (0..90).rev() {
            let a = ocean_albedo(i as f64 / 100.0);
            assert!(a >= last - 1e-12, "{i}");
            last = a;
        }
    }

    #[test]
    fn sky_albedo_limits_and_cap() {
        // No atmosphere: the surface alone; a fully reflecting one: 1.
        assert!((sky_albedo(0.7, 0.0) - ocean_albedo(0.7)).abs() < 1e-12);
        assert!((sky_albedo(0.7, 1.0) - 1.0).abs() < 1e-12);
        let law = IceFreeAlbedo::default();
        assert!(law.albedo(0.0, 0.0, 0.5) <= 0.5);
    }
}

//! A second star (`companion: (...)`): its own star section, how the two stars are arranged,
//! their mutual orbit, and the checks that make the arrangement a stable one.
//!
//! # Arrangements
//!
//! - [`CompanionArrangement::Circumbinary`] — the two stars orbit their barycentre on the
//!   Keplerian orbit of [`StellarOrbitSpec`], in the planet's orbital plane, and the world's
//!   `orbit` section is the planet's orbit about that barycentre (a "P-type" orbit).
//! - [`CompanionArrangement::Wide`] — the planet circles the primary (the world's `star`) as in
//!   a one-star world, and the companion circles the primary far outside, on the orbit of
//!   [`StellarOrbitSpec`] tilted by `inclination_deg` to the planet's orbital plane (an
//!   "S-type" orbit for the planet). The companion is a second sun whose direction, distance
//!   and brightness change over its long orbit.
//!
//! # Conventions of the stellar orbit
//!
//! The orbit is that of the companion relative to the primary (the relative orbit of the
//! two-body problem): semi-major axis `separation_au`, period from Kepler's third law with the
//! total mass `G (m₁ + m₂)`. Angles are in the planet's ecliptic frame (x toward the planet's
//! northward equinox direction, z along the planet's orbital angular momentum):
//! `periapsis_longitude_deg` is the ecliptic longitude of the companion's periapsis as seen
//! from the primary (for an inclined orbit: node longitude plus argument of periapsis, the
//! usual "longitude of periapsis"), `phase_at_zero_deg` the companion's mean anomaly at time
//! zero (0: at periapsis).
//!
//! # Stability (Holman & Wiegert 1999)
//!
//! Holman & Wiegert (1999, AJ 117, 621) integrated test particles in binaries and fitted the
//! critical semi-major axis `a_c` (in units of the binary's `a_b`) as polynomials in the binary
//! eccentricity `e` and mass ratio `μ = m₂/(m₁ + m₂)` (coefficients from memory):
//!
//! - S-type (planet about one star; their eq. 1):
//!   `a_c/a_b = 0.464 − 0.380μ − 0.631e + 0.586μe + 0.150e² − 0.198μe²`; the planet's
//!   semi-major axis must be *below* `a_c`. Here `μ` is the companion's share of the mass.
//! - P-type (planet about both; their eq. 3):
//!   `a_c/a_b = 1.60 + 5.10e − 2.22e² + 4.12μ − 4.27eμ − 5.09μ² + 4.61e²μ²`; the planet's
//!   semi-major axis must be *above* `a_c`. Here `μ` is the lighter star's share.
//!
//! The fits were made for `0.1 ≤ μ ≤ 0.9, e ≤ 0.8` (S-type) and `0.1 ≤ μ ≤ 0.5, e ≤ 0.7`
//! (P-type); outside that they are extrapolated (the P-type fit with `μ` clamped to 0.5, its
//! symmetric limit), which Insola accepts as a game-design rule.
//!
//! # The planet's period and Kepler's third law
//!
//! One-star files give the year and the semi-major axis independently and stay valid. A file
//! with a companion gives every mass, so the two can be compared: the planet's `period_days`
//! must agree within [`PLANET_PERIOD_TOLERANCE`] with Kepler's third law for its semi-major
//! axis and the mass it orbits (both stars for a circumbinary planet, the primary for a wide
//! pair; the planet's own mass neglected). Outside it the file contradicts itself and the
//! error names `orbit.period_days` with the period the law gives.

use serde::{Deserialize, Serialize};

use super::spec::{StarSpec, WorldSpec};
use super::validate::{MAX_STAR_TEMPERATURE_K, MIN_STAR_TEMPERATURE_K};
use crate::constants::{AU_M, SECONDS_PER_DAY};
use crate::error::{SpecError, check_range, check_range_open_min};

/// Nominal solar mass parameter `G M☉`, m³ s⁻² (IAU 2015 Resolution B3, from memory).
pub const SUN_GM_M3_S2: f64 = 1.327_124_4e20;

/// Largest relative difference between a companion world's `orbit.period_days` and the
/// period Kepler's third law gives for its semi-major axis (a design tolerance, so that
/// rounded published values pass; common practice, no source).
pub const PLANET_PERIOD_TOLERANCE: f64 = 0.02;

/// Largest eccentricity of the stars' mutual orbit (the stability fits stop at 0.8).
pub const MAX_STELLAR_ECCENTRICITY: f64 = 0.9;

/// How the two stars and the planet are arranged (see the module docs).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum CompanionArrangement {
    /// The stars orbit each other closely; the planet orbits both (P-type).
    Circumbinary,
    /// The planet orbits the primary; the companion orbits far outside (S-type).
    Wide,
}

/// The second star of a world.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct CompanionSpec {
    /// The companion star: temperature, radius, `luminosity_l_sun` (0 allowed: a dark
    /// companion that only hides the primary) and `mass_m_sun` (required). The flux form
    /// `flux_at_mean_distance_w_m2` is not accepted here (the companion has no fixed distance).
    pub star: StarSpec,
    /// Circumbinary or wide.
    pub arrangement: CompanionArrangement,
    /// The companion's orbit relative to the primary.
    pub orbit: StellarOrbitSpec,
}

/// The relative orbit of the two stars (companion about primary). Give exactly one of
/// `period_days` and `separation_au`; the other follows from Kepler's third law.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct StellarOrbitSpec {
    /// Orbital period of the pair, standard days of 86 400 s.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub period_days: Option<f64>,
    /// Semi-major axis of the relative orbit, astronomical units.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub separation_au: Option<f64>,
    /// Eccentricity, 0 up to 0.9. Default 0.
    #[serde(default)]
    pub eccentricity: f64,
    /// Ecliptic longitude of the companion's periapsis seen from the primary, degrees. Default 0.
    #[serde(default)]
    pub periapsis_longitude_deg: f64,
    /// The companion's mean anomaly at time zero, degrees (0: at periapsis). Default 0.
    #[serde(default)]
    pub phase_at_zero_deg: f64,
    /// Inclination to the planet's orbital plane, degrees 0–180; wide pairs only (a
    /// circumbinary pair is coplanar with its planet: 0). Default 0.
    #[serde(default)]
    pub inclination_deg: f64,
    /// Ecliptic longitude of the ascending node of an inclined orbit, degrees. Default 0.
    #[serde(default)]
    pub ascending_node_deg: f64,
}

/// The stellar orbit with both period and size known.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ResolvedStellarOrbit {
    /// Period of the pair, seconds.
    pub period_s: f64,
    /// Semi-major axis of the relative orbit, metres.
    pub separation_m: f64,
}

/// `G (m₁ + m₂)` in m³ s⁻² for masses in solar masses.
pub fn gm_m3_s2(total_mass_m_sun: f64) -> f64 {
    SUN_GM_M3_S2 * total_mass_m_sun
}

/// Kepler's third law, `P = 2π √(a³ / G M)`: period in seconds of an orbit of semi-major axis
/// `a_m` about total mass `mass_m_sun`.
pub fn kepler_period_s(a_m: f64, mass_m_sun: f64) -> f64 {
    std::f64::consts::TAU * (a_m.powi(3) / gm_m3_s2(mass_m_sun)).sqrt()
}

/// Kepler's third law inverted, `a = (G M P² / 4π²)^{1/3}`, metres.
pub fn kepler_semi_major_axis_m(period_s: f64, mass_m_sun: f64) -> f64 {
    (gm_m3_s2(mass_m_sun) * (period_s / std::f64::consts::TAU).powi(2)).cbrt()
}

/// Holman & Wiegert (1999) S-type critical semi-major axis over the binary's, for the
/// perturber's mass share `mu` and binary eccentricity `e` (their eq. 1; see the module docs).
pub fn holman_wiegert_s_type(mu: f64, e: f64) -> f64 {
    0.464 - 0.380 * mu - 0.631 * e + 0.586 * mu * e + 0.150 * e * e - 0.198 * mu * e * e
}

/// Holman & Wiegert (1999) P-type critical semi-major axis over the binary's, for the lighter
/// star's mass share `mu` (clamped to 0.5) and binary eccentricity `e` (their eq. 3).
pub fn holman_wiegert_p_type(mu: f64, e: f64) -> f64 {
    let mu = mu.min(1.0 - mu).min(0.5);
    1.60 + 5.10 * e - 2.22 * e * e + 4.12 * mu - 4.27 * e * mu - 5.09 * mu * mu
        + 4.61 * e * e * mu * mu
}

impl StellarOrbitSpec {
    /// Period and separation, one of them from Kepler's third law with `total_mass_m_sun`.
    pub fn resolve(&self, total_mass_m_sun: f64) -> ResolvedStellarOrbit {
        match (self.period_days, self.separation_au) {
            (Some(p), _) => {
                let period_s = p * SECONDS_PER_DAY;
                ResolvedStellarOrbit {
                    period_s,
                    separation_m: kepler_semi_major_axis_m(period_s, total_mass_m_sun),
                }
            }
            (None, Some(a)) => ResolvedStellarOrbit {
                period_s: kepler_period_s(a * AU_M, total_mass_m_sun),
                separation_m: a * AU_M,
            },
            // Rejected by validation; a harmless placeholder for unchecked specs.
            (None, None) => ResolvedStellarOrbit {
                period_s: f64::INFINITY,
                separation_m: f64::INFINITY,
            },
        }
    }

    fn validate(&self, path: &str, arrangement: CompanionArrangement) -> Result<(), SpecError> {
        match (self.period_days, self.separation_au) {
            (Some(p), None) => {
                check_range_open_min(&format!("{path}.period_days"), p, 0.0, 1.0e9)?;
            }
            (None, Some(a)) => {
                check_range_open_min(&format!("{path}.separation_au"), a, 0.0, 1.0e5)?;
            }
            (Some(_), Some(_)) => {
                return Err(SpecError::inconsistent(
                    format!("{path}.separation_au"),
                    "give either `period_days` or `separation_au`, not both (the other follows \
                     from Kepler's third law with both stars' masses)",
                ));
            }
            (None, None) => {
                return Err(SpecError::inconsistent(
                    format!("{path}.period_days"),
                    "missing: give `period_days` or `separation_au`",
                ));
            }
        }
        check_range(
            &format!("{path}.eccentricity"),
            self.eccentricity,
            0.0,
            MAX_STELLAR_ECCENTRICITY,
        )?;
        for (name, v) in [
            ("periapsis_longitude_deg", self.periapsis_longitude_deg),
            ("phase_at_zero_deg", self.phase_at_zero_deg),
            ("ascending_node_deg", self.ascending_node_deg),
        ] {
            check_range(&format!("{path}.{name}"), v, -360.0, 360.0)?;
        }
        check_range(
            &format!("{path}.inclination_deg"),
            self.inclination_deg,
            0.0,
            180.0,
        )?;
        if arrangement == CompanionArrangement::Circumbinary && self.inclination_deg != 0.0 {
            return Err(SpecError::inconsistent(
                format!("{path}.inclination_deg"),
                "a circumbinary pair orbits in its planet's plane here: inclination must be 0",
            ));
        }
        Ok(())
    }
}

impl CompanionSpec {
    /// Checks the companion against the rest of `world` (masses, stability, the planet's
    /// period); `path` is `companion`.
    pub fn validate(&self, path: &str, world: &WorldSpec) -> Result<(), SpecError> {
        let star = format!("{path}.star");
        check_range(
            &format!("{star}.temperature_k"),
            self.star.temperature_k,
            MIN_STAR_TEMPERATURE_K,
            MAX_STAR_TEMPERATURE_K,
        )?;
        check_range_open_min(
            &format!("{star}.radius_r_sun"),
            self.star.radius_r_sun,
            0.0,
            1000.0,
        )?;
        if self.star.flux_at_mean_distance_w_m2.is_some() {
            return Err(SpecError::inconsistent(
                format!("{star}.flux_at_mean_distance_w_m2"),
                "a companion has no fixed distance from the planet: give `luminosity_l_sun`",
            ));
        }
        let Some(l) = self.star.luminosity_l_sun else {
            return Err(SpecError::inconsistent(
                format!("{star}.luminosity_l_sun"),
                "missing: give the companion's luminosity (0 for a dark companion)",
            ));
        };
        check_range(&format!("{star}.luminosity_l_sun"), l, 0.0, 1.0e7)?;
        let m2 = required_mass(&self.star, &star)?;
        let m1 = required_mass(&world.star, "star")?;
        let orbit_path = format!("{path}.orbit");
        self.orbit.validate(&orbit_path, self.arrangement)?;
        let resolved = self.orbit.resolve(m1 + m2);
        let e = self.orbit.eccentricity;
        let a_b_au = resolved.separation_m / AU_M;
        let a_p = world.orbit.semi_major_axis_au;
        match self.arrangement {
            CompanionArrangement::Circumbinary => {
                let mu = m1.min(m2) / (m1 + m2);
                let limit_au = holman_wiegert_p_type(mu, e) * a_b_au;
                if a_p <= limit_au {
                    return Err(SpecError::inconsistent(
                        "orbit.semi_major_axis_au",
                        format!(
                            "{a_p} AU is inside the stable limit of a circumbinary planet: \
                             Holman & Wiegert (1999) put the innermost stable orbit about this \
                             pair at {limit_au:.4} AU; move the planet out or the stars closer"
                        ),
                    ));
                }
            }
            CompanionArrangement::Wide => {
                let mu = m2 / (m1 + m2);
                let limit_au = holman_wiegert_s_type(mu, e) * a_b_au;
                if a_p >= limit_au {
                    return Err(SpecError::inconsistent(
                        "orbit.semi_major_axis_au",
                        format!(
                            "{a_p} AU is beyond the stable limit of a planet about the primary: \
                             Holman & Wiegert (1999) put the outermost stable orbit at \
                             {limit_au:.4} AU with this companion; move the companion out \
                             (larger `{orbit_path}` separation) or the planet in"
                        ),
                    ));
                }
            }
        }
        let central = match self.arrangement {
            CompanionArrangement::Circumbinary => m1 + m2,
            CompanionArrangement::Wide => m1,
        };
        let expected_days = kepler_period_s(a_p * AU_M, central) / SECONDS_PER_DAY;
        let given = world.orbit.period_days;
        if ((given - expected_days) / expected_days).abs() > PLANET_PERIOD_TOLERANCE {
            return Err(SpecError::inconsistent(
                "orbit.period_days",
                format!(
                    "{given} d disagrees with Kepler's third law: an orbit of {a_p} AU about \
                     {central} solar masses takes {expected_days:.3} d (allowed ±{} %)",
                    100.0 * PLANET_PERIOD_TOLERANCE
                ),
            ));
        }
        Ok(())
    }
}

/// A star's `mass_m_sun`, which a world with a companion needs.
fn required_mass(star: &StarSpec, path: &str) -> Result<f64, SpecError> {
    match star.mass_m_sun {
        Some(m) => check_range_open_min(&format!("{path}.mass_m_sun"), m, 0.0, 1.0e3),
        None => Err(SpecError::inconsistent(
            format!("{path}.mass_m_sun"),
            "missing: a world with a companion needs both stars' masses",
        )),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn kepler_third_law_earth_and_sun_jupiter() {
        // One astronomical unit about one solar mass takes one sidereal year, 365.256 d
        // (IAU nominal GM☉ and the au; sidereal year from memory).
        let year_d = kepler_period_s(AU_M, 1.0) / SECONDS_PER_DAY;
        assert!((year_d - 365.256).abs() < 0.01, "{year_d}");
        // Jupiter: a = 5.2038 AU, P = 4332.59 d about Sun + Jupiter (NASA Jupiter fact sheet,
        // from memory; Jupiter/Sun mass ratio 1/1047.35).
        let p = kepler_period_s(5.2038 * AU_M, 1.0 + 1.0 / 1047.35) / SECONDS_PER_DAY;
        assert!((p / 4332.59 - 1.0).abs() < 2e-3, "{p}");
        let a = kepler_semi_major_axis_m(4332.59 * SECONDS_PER_DAY, 1.0 + 1.0 / 1047.35) / AU_M;
        assert!((a / 5.2038 - 1.0).abs() < 1e-3, "{a}");
    }

    #[test]
    fn kepler_16_separation_and_stability_limit() {
        // Doyle et al. 2011 (Science 333, 1602), Table 1: M_A 0.6897, M_B 0.20255 M☉,
        // P 41.079 d, a 0.22431 AU, e 0.15944 (from memory); the planet at 0.7048 AU lies
        // just outside the critical orbit, as the paper remarks (from memory).
        let total = 0.6897 + 0.20255;
        let a = kepler_semi_major_axis_m(41.079 * SECONDS_PER_DAY, total) / AU_M;
        assert!((a - 0.22431).abs() < 5e-4, "{a}");
        let mu = 0.20255 / total;
        let limit = holman_wiegert_p_type(mu, 0.15944) * a;
        assert!(limit > 0.6 && limit < 0.7048, "{limit}");
    }

    #[test]
    fn holman_wiegert_circular_equal_mass_values() {
        // The fits at e = 0: S-type 0.464 − 0.380μ (μ = 0.5: 0.274), P-type
        // 1.60 + 4.12μ − 5.09μ² (μ = 0.5: 2.3875) — the polynomials evaluated by hand.
        assert!((holman_wiegert_s_type(0.5, 0.0) - 0.274).abs() < 1e-12);
        assert!((holman_wiegert_p_type(0.5, 0.0) - 2.3875).abs() < 1e-12);
        // P-type is symmetric in which star is called the lighter.
        assert_eq!(
            holman_wiegert_p_type(0.3, 0.2),
            holman_wiegert_p_type(0.7, 0.2)
        );
    }
}

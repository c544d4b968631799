//! The planet's size and mass (`body: (...)`), and its sphere of influence.

use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range_open_min};

/// The planet's size and mass, for moons' eclipses, parallax and sphere of influence.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
pub struct BodySpec {
    /// Planet radius, kilometres. Default 6371.
    pub radius_km: f64,
    /// Planet mass in Earth masses. Default 1.
    pub mass_earth: f64,
    /// Star mass in solar masses. Default 1.
    pub star_mass_m_sun: f64,
}

impl Default for BodySpec {
    fn default() -> Self {
        BodySpec {
            radius_km: 6371.0,
            mass_earth: 1.0,
            star_mass_m_sun: 1.0,
        }
    }
}

/// Earth mass over solar mass (IAU 2015 nominal values; from memory: 3.003 × 10⁻⁶).
const EARTH_PER_SUN_MASS: f64 = 3.003_489e-6;

impl BodySpec {
    /// Checks the section.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        check_range_open_min(&format!("{path}.radius_km"), self.radius_km, 0.0, 1.0e6)?;
        check_range_open_min(&format!("{path}.mass_earth"), self.mass_earth, 0.0, 1.0e5)?;
        check_range_open_min(
            &format!("{path}.star_mass_m_sun"),
            self.star_mass_m_sun,
            0.0,
            1.0e3,
        )?;
        Ok(())
    }

    /// Radius of the planet's Hill sphere in km for an orbit of `semi_major_axis_au`:
    /// `a (m / 3M)^(1/3)` (Hill 1878; standard).
    pub fn hill_radius_km(&self, semi_major_axis_au: f64) -> f64 {
        let ratio = self.mass_earth * EARTH_PER_SUN_MASS / (3.0 * self.star_mass_m_sun);
        semi_major_axis_au * crate::constants::AU_M / 1000.0 * ratio.cbrt()
    }
}

//! One moon in the world file (`moons: [...]`) and its checks.

use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range, check_range_open_min};
use crate::world::WorldSpec;

/// One moon in the world file.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MoonSpec {
    /// Display name.
    pub name: String,
    /// Radius, kilometres.
    pub radius_km: f64,
    /// Semi-major axis of its orbit around the planet, kilometres.
    pub distance_km: f64,
    /// Orbital period relative to the stars, standard days.
    pub period_days: f64,
    /// Eccentricity, 0 to 0.9. Default 0.
    #[serde(default)]
    pub eccentricity: f64,
    /// Inclination to the planet's orbital plane, degrees 0–180 (above 90: orbits backwards).
    /// Default 0 (every new moon is a solar eclipse somewhere).
    #[serde(default)]
    pub inclination_deg: f64,
    /// Ecliptic longitude of the ascending node, degrees. Default 0.
    #[serde(default)]
    pub ascending_node_deg: f64,
    /// Argument of periapsis, degrees. Default 0.
    #[serde(default)]
    pub periapsis_argument_deg: f64,
    /// Phase at time zero: the moon's angle from the star, seen from the planet along its orbit,
    /// degrees: 0 new, 90 first quarter, 180 full. Default 180.
    #[serde(default = "default_phase")]
    pub phase_at_zero_deg: f64,
    /// Bond albedo, 0–1, for the Lambert-sphere light model. Default 0.12.
    #[serde(default = "default_albedo")]
    pub bond_albedo: f64,
    /// Use the measured phase law of Earth's Moon (Allen; Krisciunas & Schaefer 1991) instead
    /// of a Lambert sphere. For the Earth reference world. Default false.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub lunar_photometry: bool,
}

fn default_phase() -> f64 {
    180.0
}

fn default_albedo() -> f64 {
    0.12
}

impl MoonSpec {
    /// Checks the moon; `path` is its dotted name (`moons[0]`).
    pub fn validate(&self, path: &str, world: &WorldSpec) -> Result<(), SpecError> {
        if self.name.trim().is_empty() {
            return Err(SpecError::inconsistent(
                format!("{path}.name"),
                "must not be empty",
            ));
        }
        let body = world.body.unwrap_or_default();
        check_range_open_min(&format!("{path}.radius_km"), self.radius_km, 0.0, 1.0e6)?;
        check_range_open_min(&format!("{path}.period_days"), self.period_days, 0.0, 1.0e7)?;
        check_range(&format!("{path}.eccentricity"), self.eccentricity, 0.0, 0.9)?;
        check_range(
            &format!("{path}.inclination_deg"),
            self.inclination_deg,
            0.0,
            180.0,
        )?;
        check_range(
            &format!("{path}.ascending_node_deg"),
            self.ascending_node_deg,
            -360.0,
            360.0,
        )?;
        check_range(
            &format!("{path}.periapsis_argument_deg"),
            self.periapsis_argument_deg,
            -360.0,
            360.0,
        )?;
        check_range(
            &format!("{path}.phase_at_zero_deg"),
            self.phase_at_zero_deg,
            -360.0,
            360.0,
        )?;
        check_range(&format!("{path}.bond_albedo"), self.bond_albedo, 0.0, 1.0)?;
        let closest = self.distance_km * (1.0 - self.eccentricity);
        let min = body.radius_km + self.radius_km;
        if !(self.distance_km.is_finite() && closest > min) {
            return Err(SpecError::out_of_range(
                format!("{path}.distance_km"),
                self.distance_km,
                format!(
                    "periapsis above {min} km (planet radius + moon radius): the moon would be inside the planet"
                ),
            ));
        }
        let hill = body.hill_radius_km(world.orbit.semi_major_axis_au);
        let farthest = self.distance_km * (1.0 + self.eccentricity);
        if farthest > 0.5 * hill {
            return Err(SpecError::out_of_range(
                format!("{path}.distance_km"),
                self.distance_km,
                format!(
                    "apoapsis below {:.0} km, half the planet's sphere of influence (Hill radius {hill:.0} km); farther out the star would pull the moon away",
                    0.5 * hill
                ),
            ));
        }
        Ok(())
    }
}

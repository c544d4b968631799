//! Light of the sky (placeholder until the optics land).
use serde::{Deserialize, Serialize};

/// Placeholder atmosphere section.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, Default)]
#[serde(deny_unknown_fields, default)]
pub struct AtmosphereSpec {
    /// Surface pressure in kPa; 0 for an airless world.
    pub surface_pressure_kpa: f64,
    /// Whether refraction lifts the star near the horizon.
    pub refraction: bool,
}

impl AtmosphereSpec {
    /// Placeholder validation.
    pub fn validate(&self, _path: &str) -> Result<(), crate::SpecError> {
        Ok(())
    }
}

/// Placeholder twilight phase.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum TwilightPhase {
    /// Star above the standard rise altitude.
    Day,
    /// Down to −6°.
    Civil,
    /// Down to −12°.
    Nautical,
    /// Down to −18°.
    Astronomical,
    /// Below −18°.
    Night,
}

//! Moons (placeholder until the moon model lands).
use serde::{Deserialize, Serialize};

/// Placeholder moon section.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MoonSpec {
    /// Display name.
    pub name: String,
}

impl MoonSpec {
    /// Placeholder validation.
    pub fn validate(&self, _path: &str, _world: &crate::WorldSpec) -> Result<(), crate::SpecError> {
        Ok(())
    }
}

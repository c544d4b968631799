//! Seasonal climate (placeholder until the model lands).
use serde::{Deserialize, Serialize};

/// Placeholder climate section.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, Default)]
#[serde(deny_unknown_fields, default)]
pub struct ClimateSpec {
    /// Latitude bands.
    pub bands: usize,
}

impl ClimateSpec {
    /// Placeholder validation.
    pub fn validate(&self, _path: &str) -> Result<(), crate::SpecError> {
        Ok(())
    }
}

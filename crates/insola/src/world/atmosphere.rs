//! The world file's `atmosphere` section: what the air is made of, as far as light cares.

use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range};

/// Sea-level pressure of the Earth's standard atmosphere, in kilopascals (the pressure at which
/// the Rayleigh optical depths of Bodhaine et al. 1999 are given).
pub const REFERENCE_PRESSURE_KPA: f64 = 101.325;

/// Largest surface pressure accepted, in kilopascals (a thousand Earth atmospheres).
pub const MAX_SURFACE_PRESSURE_KPA: f64 = 101_325.0;

/// Optical make-up of a world's atmosphere, as read from the `atmosphere` section of a world file.
///
/// Every field has a default, so a partial section (or none) is allowed; the defaults describe a
/// clear, Earth-like sky and serve as the validation reference.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(default, deny_unknown_fields)]
pub struct AtmosphereSpec {
    /// Pressure at the surface, in kilopascals; 0 means an airless world (no extinction, no sky
    /// light, no refraction, no aerosol). Default 101.325 kPa. Allowed 0 to 101 325.
    pub surface_pressure_kpa: f64,
    /// Multiplier on the Earth-air Rayleigh optical depth at equal surface pressure
    /// (dimensionless). It stands for a gas that scatters more or less than air per unit of
    /// pressure (other molecules, other surface gravity). Default 1. Allowed 0 to 100.
    pub rayleigh_scale: f64,
    /// Ångström turbidity β: aerosol optical depth at 1 µm (dimensionless). Default 0.05 (clear).
    /// Allowed 0 to 5.
    pub aerosol_angstrom_beta: f64,
    /// Ångström exponent α of the aerosol optical depth τ = β λ^(−α), λ in µm (dimensionless).
    /// Default 1.3. Allowed −1 to 4.
    pub aerosol_angstrom_alpha: f64,
    /// Whether the air bends the star's light near the horizon (raising its apparent altitude).
    /// Ignored on airless worlds. Default true.
    pub refraction: bool,
}

impl Default for AtmosphereSpec {
    fn default() -> Self {
        Self {
            surface_pressure_kpa: REFERENCE_PRESSURE_KPA,
            rayleigh_scale: 1.0,
            aerosol_angstrom_beta: 0.05,
            aerosol_angstrom_alpha: 1.3,
            refraction: true,
        }
    }
}

impl AtmosphereSpec {
    /// An airless world: zero pressure, no aerosol, no refraction.
    pub fn airless() -> Self {
        Self {
            surface_pressure_kpa: 0.0,
            aerosol_angstrom_beta: 0.0,
            refraction: false,
            ..Self::default()
        }
    }

    /// True when the world has no air (surface pressure 0 kPa, or no scattering at all).
    pub fn is_airless(&self) -> bool {
        self.surface_pressure_kpa <= 0.0
    }

    /// Checks every field; `path` is the dotted path of the section (usually `atmosphere`), used
    /// to name the faulty field in the error, e.g. `atmosphere.surface_pressure_kpa`.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        let field = |name: &str| {
            if path.is_empty() {
                name.to_string()
            } else {
                format!("{path}.{name}")
            }
        };
        check_range(
            &field("surface_pressure_kpa"),
            self.surface_pressure_kpa,
            0.0,
            MAX_SURFACE_PRESSURE_KPA,
        )?;
        check_range(&field("rayleigh_scale"), self.rayleigh_scale, 0.0, 100.0)?;
        check_range(
            &field("aerosol_angstrom_beta"),
            self.aerosol_angstrom_beta,
            0.0,
            5.0,
        )?;
        check_range(
            &field("aerosol_angstrom_alpha"),
            self.aerosol_angstrom_alpha,
            -1.0,
            4.0,
        )?;
        Ok(())
    }

    /// Ratio of the surface pressure to [`REFERENCE_PRESSURE_KPA`] (dimensionless).
    pub fn pressure_ratio(&self) -> f64 {
        self.surface_pressure_kpa / REFERENCE_PRESSURE_KPA
    }

    /// Scale applied to Earth's refraction: the gas density (pressure ratio) times the
    /// refractivity ratio, which is √`rayleigh_scale` because the Rayleigh cross-section grows
    /// as the square of the refractivity. Zero when refraction is off or the world is airless.
    /// Capped at [`MAX_REFRACTION_SCALE`] so the apparent altitude stays monotonic.
    pub fn refraction_scale(&self) -> f64 {
        if !self.refraction || self.is_airless() {
            return 0.0;
        }
        (self.pressure_ratio() * self.rayleigh_scale.max(0.0).sqrt()).min(MAX_REFRACTION_SCALE)
    }
}

/// Largest multiple of Earth's refraction that is applied (dimensionless); stronger refraction
/// would need a ray-traced model and is capped here.
pub const MAX_REFRACTION_SCALE: f64 = 4.0;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn default_is_valid_and_partial_sections_parse() {
        AtmosphereSpec::default().validate("atmosphere").unwrap();
        AtmosphereSpec::airless().validate("atmosphere").unwrap();
        let a: AtmosphereSpec = ron::from_str("(surface_pressure_kpa: 50.0)").unwrap();
        assert_eq!(a.surface_pressure_kpa, 50.0);
        assert_eq!(a.rayleigh_scale, 1.0);
        assert!(a.refraction);
        let empty: AtmosphereSpec = ron::from_str("()").unwrap();
        assert_eq!(empty, AtmosphereSpec::default());
    }

    #[test]
    fn unknown_fields_are_rejected() {
        assert!(ron::from_str::<AtmosphereSpec>("(pressure: 1.0)").is_err());
    }

    #[test]
    fn errors_name_the_field_and_reject_non_finite() {
        let mut a = AtmosphereSpec {
            surface_pressure_kpa: -1.0,
            ..Default::default()
        };
        let e = a.validate("atmosphere").unwrap_err();
        assert_eq!(e.field(), Some("atmosphere.surface_pressure_kpa"));
        assert!(e.to_string().contains("-1"));
        a.surface_pressure_kpa = f64::NAN;
        assert!(a.validate("atmosphere").is_err());
        let b = AtmosphereSpec {
            aerosol_angstrom_beta: f64::INFINITY,
            ..Default::default()
        };
        assert_eq!(
            b.validate("atmosphere").unwrap_err().field(),
            Some("atmosphere.aerosol_angstrom_beta")
        );
        let c = AtmosphereSpec {
            rayleigh_scale: 1e9,
            ..Default::default()
        };
        assert_eq!(
            c.validate("atmosphere").unwrap_err().field(),
            Some("atmosphere.rayleigh_scale")
        );
        let d = AtmosphereSpec {
            aerosol_angstrom_alpha: 9.0,
            ..Default::default()
        };
        assert_eq!(
            d.validate("atmosphere").unwrap_err().field(),
            Some("atmosphere.aerosol_angstrom_alpha")
        );
    }

    #[test]
    fn refraction_scale() {
        assert_eq!(AtmosphereSpec::default().refraction_scale(), 1.0);
        assert_eq!(AtmosphereSpec::airless().refraction_scale(), 0.0);
        let off = AtmosphereSpec {
            refraction: false,
            ..Default::default()
        };
        assert_eq!(off.refraction_scale(), 0.0);
        let thick = AtmosphereSpec {
            surface_pressure_kpa: 9000.0,
            ..Default::default()
        };
        assert_eq!(thick.refraction_scale(), MAX_REFRACTION_SCALE);
    }
}

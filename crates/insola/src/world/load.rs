//! Reading world files: RON text to a validated [`WorldSpec`], with errors that carry line and
//! column.

use std::path::Path;

use super::spec::WorldSpec;
use crate::error::SpecError;

/// File-name suffix of world files.
pub const WORLD_FILE_SUFFIX: &str = ".world.ron";

impl WorldSpec {
    /// Parses RON text without validating the values (syntax, types and field names only).
    pub fn parse_unchecked(text: &str) -> Result<WorldSpec, SpecError> {
        parse_with_path(text, "")
    }

    /// Parses and validates RON text.
    ///
    /// ```
    /// let text = r#"(
    ///     name: "Ennavel",
    ///     star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
    ///     orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02,
    ///             periapsis_longitude_deg: 100, period_days: 300),
    ///     spin: (obliquity_deg: 20, solar_day_hours: 22),
    /// )"#;
    /// let world = insola::WorldSpec::from_ron_str(text).unwrap();
    /// assert_eq!(world.name, "Ennavel");
    /// ```
    pub fn from_ron_str(text: &str) -> Result<WorldSpec, SpecError> {
        let spec = parse_with_path(text, "")?;
        spec.validate()?;
        Ok(spec)
    }

    /// Reads, parses and validates a world file.
    pub fn from_path(path: impl AsRef<Path>) -> Result<WorldSpec, SpecError> {
        let path = path.as_ref();
        let text = std::fs::read_to_string(path).map_err(|e| SpecError::Io {
            path: path.display().to_string(),
            message: e.to_string(),
        })?;
        let spec = parse_with_path(&text, &format!("{}: ", path.display()))?;
        spec.validate()?;
        Ok(spec)
    }

    /// The world as RON text, in the same layout the loader reads.
    pub fn to_ron_string(&self) -> String {
        let config = ron::ser::PrettyConfig::new()
            .depth_limit(4)
            .struct_names(false)
            .extensions(ron::extensions::Extensions::IMPLICIT_SOME);
        // Serialising plain data structs cannot fail; fall back to the compact form anyway.
        ron::ser::to_string_pretty(self, config).unwrap_or_else(|e| format!("// {e}"))
    }
}

fn parse_with_path(text: &str, path: &str) -> Result<WorldSpec, SpecError> {
    ron::Options::default()
        // Optional fields are written plainly (`solar_day_hours: 24`), without `Some(..)`.
        .with_default_extension(ron::extensions::Extensions::IMPLICIT_SOME)
        .from_str::<WorldSpec>(text)
        .map_err(|e| {
            let line = e.span.start.line;
            let column = e.span.start.col;
            match e.code {
                ron::Error::NoSuchStructField {
                    expected,
                    found,
                    outer,
                } => SpecError::UnknownField {
                    path: path.to_string(),
                    line,
                    column,
                    section: outer.unwrap_or_else(|| "world".to_string()),
                    field: found,
                    known: expected.join(", "),
                },
                code => SpecError::Syntax {
                    path: path.to_string(),
                    line,
                    column,
                    message: code.to_string(),
                },
            }
        })
}

//! The world file's `ring` section: a flat ring system in the planet's equatorial plane, made
//! of one or more annuli, each with its own normal optical depth.
//!
//! ```ron
//! ring: (annuli: [
//!     (inner_radius_km: 9000, outer_radius_km: 12500, optical_depth: 0.4),
//!     // A faint outer band after a gap (a gap is simply a range no annulus covers).
//!     (inner_radius_km: 13000, outer_radius_km: 16000, optical_depth: 0.08),
//! ]),
//! ```
//!
//! The ring is treated as infinitely thin: what matters for the light is the normal optical
//! depth `τ` of the annulus a ray crosses (see [`crate::rings`]).

use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range};

/// Largest ring radius accepted, kilometres (common practice, no source: far beyond any ring
/// that could stay inside a planet's Roche zone, so only typing errors are refused).
pub const MAX_RING_RADIUS_KM: f64 = 1.0e7;

/// Largest normal optical depth accepted (dimensionless; common practice, no source: beyond
/// about 20 a ring passes less than 10⁻⁸ of the light at any angle, so larger values change
/// nothing).
pub const MAX_RING_OPTICAL_DEPTH: f64 = 1.0e3;

/// The ring system: annuli in the planet's equatorial plane, ordered from the inside out.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RingSpec {
    /// The annuli, from the inside out, not overlapping (one or more).
    pub annuli: Vec<AnnulusSpec>,
}

/// One annulus of the ring: a flat band between two radii with one normal optical depth.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct AnnulusSpec {
    /// Display name, optional (for designers and the almanac).
    #[serde(default, skip_serializing_if = "String::is_empty")]
    pub name: String,
    /// Inner radius from the planet's centre, kilometres; at least the planet's radius.
    pub inner_radius_km: f64,
    /// Outer radius from the planet's centre, kilometres; greater than the inner radius.
    pub outer_radius_km: f64,
    /// Normal optical depth τ (dimensionless, ≥ 0): a ray crossing the annulus at right
    /// angles keeps `exp(−τ)` of its light. 0 is a transparent band.
    pub optical_depth: f64,
}

impl RingSpec {
    /// Checks the section; `path` is its dotted name (`ring`) and `planet_radius_km` the
    /// planet's radius (the `body` section's, or its default).
    pub fn validate(&self, path: &str, planet_radius_km: f64) -> Result<(), SpecError> {
        if self.annuli.is_empty() {
            return Err(SpecError::inconsistent(
                format!("{path}.annuli"),
                "give at least one annulus (or leave the `ring` section out)",
            ));
        }
        let mut previous_outer: Option<f64> = None;
        for (i, a) in self.annuli.iter().enumerate() {
            let at = format!("{path}.annuli[{i}]");
            a.validate(&at, planet_radius_km)?;
            if let Some(outer) = previous_outer
                && a.inner_radius_km < outer
            {
                return Err(SpecError::out_of_range(
                    format!("{at}.inner_radius_km"),
                    a.inner_radius_km,
                    format!(
                        "at least {outer} km, the outer radius of annulus {}: annuli are listed \
                         from the inside out and must not overlap",
                        i - 1
                    ),
                ));
            }
            previous_outer = Some(a.outer_radius_km);
        }
        Ok(())
    }

    /// Outer radius of the outermost annulus, kilometres.
    pub fn outer_radius_km(&self) -> f64 {
        self.annuli
            .iter()
            .map(|a| a.outer_radius_km)
            .fold(0.0, f64::max)
    }

    /// `true` if some annulus has a positive optical depth (a ring that can cast a shadow).
    pub fn casts_shadow(&self) -> bool {
        self.annuli.iter().any(|a| a.optical_depth > 0.0)
    }
}

impl AnnulusSpec {
    fn validate(&self, at: &str, planet_radius_km: f64) -> Result<(), SpecError> {
        let inner = format!("{at}.inner_radius_km");
        let outer = format!("{at}.outer_radius_km");
        check_range(&inner, self.inner_radius_km, 0.0, MAX_RING_RADIUS_KM)?;
        if self.inner_radius_km <= 0.0 {
            return Err(SpecError::out_of_range(
                inner,
                self.inner_radius_km,
                "greater than 0",
            ));
        }
        check_range(&outer, self.outer_radius_km, 0.0, MAX_RING_RADIUS_KM)?;
        if self.inner_radius_km < planet_radius_km {
            return Err(SpecError::out_of_range(
                inner,
                self.inner_radius_km,
                format!(
                    "at least {planet_radius_km} km, the planet's radius (`body.radius_km`): \
                     a ring cannot lie inside the planet"
                ),
            ));
        }
        if self.outer_radius_km <= self.inner_radius_km {
            return Err(SpecError::out_of_range(
                outer,
                self.outer_radius_km,
                format!(
                    "greater than the inner radius ({} km)",
                    self.inner_radius_km
                ),
            ));
        }
        check_range(
            &format!("{at}.optical_depth"),
            self.optical_depth,
            0.0,
            MAX_RING_OPTICAL_DEPTH,
        )?;
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn annulus(inner: f64, outer: f64, tau: f64) -> AnnulusSpec {
        AnnulusSpec {
            name: String::new(),
            inner_radius_km: inner,
            outer_radius_km: outer,
            optical_depth: tau,
        }
    }

    fn field_of(ring: &RingSpec) -> Option<String> {
        ring.validate("ring", 6000.0)
            .err()
            .and_then(|e| e.field().map(str::to_owned))
    }

    #[test]
    fn good_rings_pass_and_each_bad_field_is_named() {
        let good = RingSpec {
            annuli: vec![annulus(7000.0, 9000.0, 0.5), annulus(9000.0, 12000.0, 0.0)],
        };
        assert_eq!(field_of(&good), None);
        assert!(good.casts_shadow());
        assert_eq!(good.outer_radius_km(), 12000.0);
        let cases = [
            (vec![], "ring.annuli"),
            (
                vec![annulus(-1.0, 9000.0, 0.5)],
                "ring.annuli[0].inner_radius_km",
            ),
            (
                vec![annulus(0.0, 9000.0, 0.5)],
                "ring.annuli[0].inner_radius_km",
            ),
            (
                vec![annulus(5000.0, 9000.0, 0.5)],
                "ring.annuli[0].inner_radius_km",
            ),
            (
                vec![annulus(7000.0, 7000.0, 0.5)],
                "ring.annuli[0].outer_radius_km",
            ),
            (
                vec![annulus(7000.0, f64::NAN, 0.5)],
                "ring.annuli[0].outer_radius_km",
            ),
            (
                vec![annulus(7000.0, 8000.0, -0.1)],
                "ring.annuli[0].optical_depth",
            ),
            (
                vec![annulus(7000.0, 8000.0, f64::INFINITY)],
                "ring.annuli[0].optical_depth",
            ),
            (
                vec![annulus(7000.0, 9000.0, 0.5), annulus(8500.0, 9500.0, 0.1)],
                "ring.annuli[1].inner_radius_km",
            ),
        ];
        for (annuli, field) in cases {
            let ring = RingSpec { annuli };
            assert_eq!(field_of(&ring).as_deref(), Some(field), "{ring:?}");
        }
        let clear = RingSpec {
            annuli: vec![annulus(7000.0, 9000.0, 0.0)],
        };
        assert!(!clear.casts_shadow());
    }
}

//! A place on the planet's surface: latitude and longitude, and their one normalisation.
//!
//! A leaf module (it needs only the error type), so that every other module can name places
//! without importing the sky computations.

use std::f64::consts::PI;

use crate::error::{QueryError, check_arg};

/// A place on the planet.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct Place {
    /// Latitude, radians in `[−π/2, π/2]`, positive toward the north pole (the pole on the
    /// orbit-normal side).
    pub latitude_rad: f64,
    /// Longitude, radians, positive east of the prime meridian.
    pub longitude_rad: f64,
}

impl Place {
    /// A place from degrees; latitude must lie in −90…90 and longitude in −360…360.
    pub fn from_degrees(latitude_deg: f64, longitude_deg: f64) -> Result<Place, QueryError> {
        check_arg("latitude_deg", latitude_deg, -90.0, 90.0, "-90 to 90")?;
        check_arg("longitude_deg", longitude_deg, -360.0, 360.0, "-360 to 360")?;
        Ok(Place {
            latitude_rad: latitude_deg.to_radians(),
            longitude_rad: longitude_deg.to_radians(),
        })
    }

    /// A place from any degrees, never failing: latitude clamped to −90…90, east longitude
    /// wrapped to −180…180 (−180 included), a non-finite coordinate taken as 0. The one rule
    /// for places typed by people or derived from scene positions (see [`Place::normalise`]).
    ///
    /// ```
    /// use insola::Place;
    /// let p = Place::normalised(95.0, 200.0);
    /// assert_eq!(p.latitude_rad, 90f64.to_radians());
    /// assert!((p.longitude_rad - (-160f64).to_radians()).abs() < 1e-12);
    /// assert_eq!(Place::normalised(f64::NAN, 0.0), Place::normalised(0.0, 0.0));
    /// ```
    pub fn normalised(latitude_deg: f64, longitude_deg: f64) -> Place {
        Place {
            latitude_rad: latitude_deg.to_radians(),
            longitude_rad: longitude_deg.to_radians(),
        }
        .normalise()
    }

    /// This place with its latitude clamped to `[−π/2, π/2]`, its longitude wrapped to
    /// `[−π, π)` and a non-finite coordinate taken as 0: the rule behind [`Place::normalised`].
    pub fn normalise(self) -> Place {
        use std::f64::consts::{FRAC_PI_2, TAU};
        let finite = |x: f64| if x.is_finite() { x } else { 0.0 };
        Place {
            latitude_rad: finite(self.latitude_rad).clamp(-FRAC_PI_2, FRAC_PI_2),
            longitude_rad: (finite(self.longitude_rad) + PI).rem_euclid(TAU) - PI,
        }
    }
}

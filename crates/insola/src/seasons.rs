//! Solstices, equinoxes, the length of each season, and the geometric climate zones.
//!
//! Seasons are named for the northern hemisphere: spring runs from the northward equinox (star
//! at ecliptic longitude 0°) to the northern solstice (90°), summer to the southward equinox
//! (180°), autumn to the southern solstice (270°), winter back to the northward equinox. On an
//! eccentric orbit they differ in length (Kepler's second law).

use serde::{Deserialize, Serialize};
use std::f64::consts::FRAC_PI_2;

use crate::planet::Planet;

/// One of the four turning points of the year, named for the north (see the module docs).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum SeasonMark {
    /// The star crosses the equator going north (ecliptic longitude 0°).
    NorthwardEquinox,
    /// The star stands farthest north (90°).
    NorthernSolstice,
    /// The star crosses the equator going south (180°).
    SouthwardEquinox,
    /// The star stands farthest south (270°).
    SouthernSolstice,
}

impl std::fmt::Display for SeasonMark {
    /// `northward equinox`, `northern solstice`, `southward equinox`, `southern solstice`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            SeasonMark::NorthwardEquinox => "northward equinox",
            SeasonMark::NorthernSolstice => "northern solstice",
            SeasonMark::SouthwardEquinox => "southward equinox",
            SeasonMark::SouthernSolstice => "southern solstice",
        })
    }
}

impl SeasonMark {
    /// All four, in the order of the year from the northward equinox.
    pub const ALL: [SeasonMark; 4] = [
        SeasonMark::NorthwardEquinox,
        SeasonMark::NorthernSolstice,
        SeasonMark::SouthwardEquinox,
        SeasonMark::SouthernSolstice,
    ];

    /// The star's ecliptic longitude at this mark, radians (0, π/2, π, 3π/2).
    pub fn ecliptic_longitude_rad(self) -> f64 {
        let quarter = match self {
            SeasonMark::NorthwardEquinox => 0.0,
            SeasonMark::NorthernSolstice => 1.0,
            SeasonMark::SouthwardEquinox => 2.0,
            SeasonMark::SouthernSolstice => 3.0,
        };
        quarter * FRAC_PI_2
    }
}

/// The four turning points of the year after a given time, world seconds.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SeasonMarks {
    /// Star at ecliptic longitude 0°: crosses the equator going north.
    pub northward_equinox_s: f64,
    /// Star at 90°: north pole tilted most toward the star.
    pub northern_solstice_s: f64,
    /// Star at 180°.
    pub southward_equinox_s: f64,
    /// Star at 270°.
    pub southern_solstice_s: f64,
}

/// Lengths of the four northern seasons, seconds.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SeasonLengths {
    /// Northward equinox to northern solstice.
    pub spring_s: f64,
    /// Northern solstice to southward equinox.
    pub summer_s: f64,
    /// Southward equinox to southern solstice.
    pub autumn_s: f64,
    /// Southern solstice to northward equinox.
    pub winter_s: f64,
}

/// Latitudes of the geometric zones, degrees. When the tilt exceeds 45° the tropics lie
/// poleward of the polar circles and the zones overlap.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct ZoneLatitudes {
    /// Tropics at ± this latitude: the star passes the zenith between them. Equals the tilt.
    pub tropic_lat_deg: f64,
    /// Polar circles at ± this latitude: poleward of them there is polar day and night
    /// (geometric, without refraction). Equals 90° minus the tilt.
    pub polar_circle_lat_deg: f64,
    /// `true` if the tropics lie poleward of the polar circles (tilt above 45°).
    pub overlapping: bool,
}

impl Planet {
    /// The next equinoxes and solstices at or after `after_s`. Exact (Kepler's equation
    /// inverted), no search.
    pub fn season_marks_after(&self, after_s: f64) -> SeasonMarks {
        let at = |mark: SeasonMark| self.time_of_season_mark(mark, after_s);
        SeasonMarks {
            northward_equinox_s: at(SeasonMark::NorthwardEquinox),
            northern_solstice_s: at(SeasonMark::NorthernSolstice),
            southward_equinox_s: at(SeasonMark::SouthwardEquinox),
            southern_solstice_s: at(SeasonMark::SouthernSolstice),
        }
    }

    /// The first instant at or after `after_s` at which the star stands at `mark`, world
    /// seconds. Exact (Kepler's equation inverted), no search.
    pub fn time_of_season_mark(&self, mark: SeasonMark, after_s: f64) -> f64 {
        self.orbit()
            .time_of_star_longitude(mark.ecliptic_longitude_rad(), after_s)
    }

    /// Lengths of the four northern seasons.
    pub fn season_lengths(&self) -> SeasonLengths {
        let t = |k: f64| self.orbit().time_of_star_longitude(k * FRAC_PI_2, 0.0);
        let year = self.year_s();
        let span = |a: f64, b: f64| (b - a).rem_euclid(year);
        let (e0, s1, e2, s3) = (t(0.0), t(1.0), t(2.0), t(3.0));
        SeasonLengths {
            spring_s: span(e0, s1),
            summer_s: span(s1, e2),
            autumn_s: span(e2, s3),
            winter_s: span(s3, e0),
        }
    }

    /// Latitudes of the tropics and polar circles.
    pub fn zone_latitudes(&self) -> ZoneLatitudes {
        let tilt = self.spin().tilt_rad.to_degrees();
        ZoneLatitudes {
            tropic_lat_deg: tilt,
            polar_circle_lat_deg: 90.0 - tilt,
            overlapping: tilt > 45.0,
        }
    }
}

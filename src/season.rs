//! Seasons of the year for either hemisphere, and the turning points that start them.

use bevy::prelude::*;
use serde::{Deserialize, Serialize};
use std::f64::consts::{FRAC_PI_2, TAU};

/// A season of the year at a place, by the star's position on its yearly path (astronomical
/// seasons): spring from the equinox when the star crosses into the place's hemisphere, summer
/// from the solstice when it stands farthest over it, and so on. In the southern hemisphere
/// the seasons are those of the north shifted by half a year.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub enum SeasonOfYear {
    /// From the equinox when the star crosses the equator toward this hemisphere. Default.
    #[default]
    Spring,
    /// From the solstice when the star stands farthest over this hemisphere.
    Summer,
    /// From the equinox when the star crosses the equator away from this hemisphere.
    Autumn,
    /// From the solstice when the star stands farthest over the other hemisphere.
    Winter,
}

impl std::fmt::Display for SeasonOfYear {
    /// Plain words: `spring`, `summer`, `autumn`, `winter`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            SeasonOfYear::Spring => "spring",
            SeasonOfYear::Summer => "summer",
            SeasonOfYear::Autumn => "autumn",
            SeasonOfYear::Winter => "winter",
        })
    }
}

impl SeasonOfYear {
    /// The season at latitude `latitude_rad` when the star is at ecliptic longitude
    /// `ecliptic_longitude_rad` (0 at the northward equinox). Latitude 0 counts as north.
    ///
    /// ```
    /// use bevy_insola::SeasonOfYear;
    /// use std::f64::consts::PI;
    /// assert_eq!(SeasonOfYear::at(0.6 * PI, 0.7), SeasonOfYear::Summer);
    /// assert_eq!(SeasonOfYear::at(0.6 * PI, -0.7), SeasonOfYear::Winter);
    /// ```
    pub fn at(ecliptic_longitude_rad: f64, latitude_rad: f64) -> SeasonOfYear {
        let quadrant = (ecliptic_longitude_rad.rem_euclid(TAU) / FRAC_PI_2).floor() as i64;
        let shift = if latitude_rad < 0.0 { 2 } else { 0 };
        SeasonOfYear::from_index((quadrant + shift).rem_euclid(4))
    }

    fn from_index(i: i64) -> SeasonOfYear {
        match i {
            0 => SeasonOfYear::Spring,
            1 => SeasonOfYear::Summer,
            2 => SeasonOfYear::Autumn,
            _ => SeasonOfYear::Winter,
        }
    }

    /// The season that begins at `mark` in the hemisphere of `latitude_rad`.
    pub fn beginning_at(mark: SeasonMark, latitude_rad: f64) -> SeasonOfYear {
        SeasonOfYear::at(mark.ecliptic_longitude_rad() + 1e-9, latitude_rad)
    }
}

/// A season by the local temperature cycle (from the climate model): the warmest quarter of the
/// cycle is summer, the coldest winter; a band where the temperature hardly varies is steady.
/// Tropical bands may have two summers a year.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Reflect, Serialize, Deserialize)]
#[reflect(Debug, PartialEq, Default, Clone)]
pub enum ThermalSeason {
    /// Warming quarter of the cycle.
    Spring,
    /// Warmest quarter.
    Summer,
    /// Cooling quarter.
    Autumn,
    /// Coldest quarter.
    Winter,
    /// No seasonal cycle to speak of.
    Steady,
    /// No climate (still being computed, or the world has none). Default.
    #[default]
    Unknown,
}

impl std::fmt::Display for ThermalSeason {
    /// Plain words: `spring`, `summer`, `autumn`, `winter`, `steady`, `unknown`.
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            ThermalSeason::Spring => "spring",
            ThermalSeason::Summer => "summer",
            ThermalSeason::Autumn => "autumn",
            ThermalSeason::Winter => "winter",
            ThermalSeason::Steady => "steady",
            ThermalSeason::Unknown => "unknown",
        })
    }
}

impl From<insola::climate::Season> for ThermalSeason {
    fn from(season: insola::climate::Season) -> ThermalSeason {
        use insola::climate::Season as S;
        match season {
            S::Spring => ThermalSeason::Spring,
            S::Summer => ThermalSeason::Summer,
            S::Autumn => ThermalSeason::Autumn,
            S::Winter => ThermalSeason::Winter,
            S::Steady => ThermalSeason::Steady,
        }
    }
}

/// The four turning points of the year: the core's one definition.
pub use insola::seasons::SeasonMark;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn plain_words() {
        assert_eq!(
            SeasonMark::NorthernSolstice.to_string(),
            "northern solstice"
        );
        assert_eq!(SeasonOfYear::Autumn.to_string(), "autumn");
        assert_eq!(ThermalSeason::Steady.to_string(), "steady");
        assert_eq!(
            SeasonOfYear::beginning_at(SeasonMark::SouthwardEquinox, 0.5),
            SeasonOfYear::Autumn
        );
    }

    #[test]
    fn hemispheres_are_half_a_year_apart() {
        for mark in SeasonMark::ALL {
            let n = SeasonOfYear::beginning_at(mark, 0.5);
            let s = SeasonOfYear::beginning_at(mark, -0.5);
            assert_ne!(n, s);
        }
        assert_eq!(
            SeasonOfYear::beginning_at(SeasonMark::NorthwardEquinox, 0.5),
            SeasonOfYear::Spring
        );
        assert_eq!(
            SeasonOfYear::beginning_at(SeasonMark::NorthwardEquinox, -0.5),
            SeasonOfYear::Autumn
        );
        assert_eq!(
            SeasonOfYear::beginning_at(SeasonMark::SouthernSolstice, -0.5),
            SeasonOfYear::Summer
        );
    }
}

//! Seasons, climate zones and plain-words band summaries derived from the temperature cycle.
//!
//! Season rule: for each band the annual temperature cycle is split into its first (one cycle a
//! year) and second (two cycles a year) Fourier harmonics. The larger one sets the band's
//! rhythm: one summer a year, or two (the equator of a world tilted beyond about 54°, warmed at
//! both equinoxes). Within that rhythm the season follows the harmonic's phase: the quarter cycle
//! centred on its warmest point is summer, the next (cooling) quarter autumn, the coldest
//! quarter winter and the warming quarter spring. Seasons are therefore equally long within a
//! rhythm and follow the band's own (lagged) temperature, not the calendar. A band whose cycle
//! is smaller than [`STEADY_SWING_K`] has no seasons ([`Season::Steady`]).

use std::f64::consts::TAU;

use serde::{Deserialize, Serialize};

use super::cycle::{BandStats, ClimateCycle};

/// Peak-to-peak swing of the leading harmonic below which a band is [`Season::Steady`], K.
pub const STEADY_SWING_K: f64 = 0.5;

/// The season at a place and time, following the local temperature cycle.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Season {
    /// Warming quarter of the cycle.
    Spring,
    /// Warmest quarter of the cycle.
    Summer,
    /// Cooling quarter of the cycle.
    Autumn,
    /// Coldest quarter of the cycle.
    Winter,
    /// No seasonal cycle to speak of (swing below [`STEADY_SWING_K`]).
    Steady,
}

/// Ice climate of a band over the year.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum ClimateZone {
    /// Below the ice temperature all year.
    PermanentIce,
    /// Below the ice temperature for part of the year.
    SeasonalIce,
    /// Never below the ice temperature.
    IceFree,
}

/// Leading harmonics of a band's annual temperature cycle.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct BandPhase {
    /// Amplitude of the once-a-year harmonic, K (half its peak-to-peak swing).
    pub annual_amplitude_k: f64,
    /// Year fraction at which the once-a-year harmonic peaks, [0, 1).
    pub annual_peak_year_fraction: f64,
    /// Amplitude of the twice-a-year harmonic, K.
    pub semiannual_amplitude_k: f64,
    /// First year fraction at which the twice-a-year harmonic peaks, [0, 0.5).
    pub semiannual_peak_year_fraction: f64,
}

impl BandPhase {
    /// Harmonics of one band's temperatures at evenly spaced year fractions `k / len`.
    pub fn from_column(temps_c: &[f64]) -> Self {
        Self::from_column_with(temps_c, &harmonic_table(temps_c.len()))
    }

    /// [`Self::from_column`] with the table of `(cos, sin)` of `2π k/len` precomputed.
    pub(crate) fn from_column_with(temps_c: &[f64], table: &[(f64, f64)]) -> Self {
        let n = temps_c.len().max(1) as f64;
        let (mut c1, mut s1, mut c2, mut s2) = (0.0, 0.0, 0.0, 0.0);
        for (t, &(c, s)) in temps_c.iter().zip(table) {
            c1 += t * c;
            s1 += t * s;
            // Double-angle forms for the twice-a-year harmonic.
            c2 += t * (c * c - s * s);
            s2 += t * (2.0 * s * c);
        }
        let finish = |c: f64, s: f64, m: f64| {
            let (c, s) = (2.0 * c / n, 2.0 * s / n);
            // T ≈ amp cos(2π m f − θ): peak at f = θ / (2π m).
            (c.hypot(s), (s.atan2(c) / (TAU * m)).rem_euclid(1.0 / m))
        };
        let (a1, p1) = finish(c1, s1, 1.0);
        let (a2, p2) = finish(c2, s2, 2.0);
        BandPhase {
            annual_amplitude_k: a1,
            annual_peak_year_fraction: p1,
            semiannual_amplitude_k: a2,
            semiannual_peak_year_fraction: p2,
        }
    }

    /// Number of warm seasons a year this band has: 1, 2, or 0 when steady.
    pub fn summers_per_year(&self) -> u32 {
        let lead = self.annual_amplitude_k.max(self.semiannual_amplitude_k);
        if 2.0 * lead < STEADY_SWING_K {
            0
        } else if self.semiannual_amplitude_k > self.annual_amplitude_k {
            2
        } else {
            1
        }
    }

    /// The season at `year_fraction` (see the module docs for the rule).
    pub fn season_at(&self, year_fraction: f64) -> Season {
        let f = if year_fraction.is_finite() {
            year_fraction
        } else {
            0.0
        };
        let cycle = match self.summers_per_year() {
            0 => return Season::Steady,
            1 => (f - self.annual_peak_year_fraction).rem_euclid(1.0),
            _ => (2.0 * (f - self.semiannual_peak_year_fraction)).rem_euclid(1.0),
        };
        match ((cycle + 0.125) * 4.0).floor() as u32 {
            1 => Season::Autumn,
            2 => Season::Winter,
            3 => Season::Spring,
            _ => Season::Summer,
        }
    }
}

/// `(cos, sin)` of `2π k / n` for `k = 0..n`.
pub(crate) fn harmonic_table(n: usize) -> Vec<(f64, f64)> {
    (0..n)
        .map(|k| {
            let (s, c) = (TAU * k as f64 / n as f64).sin_cos();
            (c, s)
        })
        .collect()
}

impl ClimateZone {
    /// The zone of a band from its fraction of the year under ice.
    pub fn from_ice_fraction(ice_fraction_of_year: f64) -> Self {
        if ice_fraction_of_year >= 1.0 {
            ClimateZone::PermanentIce
        } else if ice_fraction_of_year > 0.0 {
            ClimateZone::SeasonalIce
        } else {
            ClimateZone::IceFree
        }
    }
}

impl ClimateCycle {
    /// The season at latitude `lat_rad` and `year_fraction`, from the band containing it.
    pub fn season(&self, lat_rad: f64, year_fraction: f64) -> Season {
        self.phases[self.grid.band_of(lat_rad)].season_at(year_fraction)
    }

    /// The ice zone of the band containing `lat_rad`.
    pub fn zone(&self, lat_rad: f64) -> ClimateZone {
        ClimateZone::from_ice_fraction(self.stats[self.grid.band_of(lat_rad)].ice_fraction_of_year)
    }

    /// Ice zone per band, south to north.
    pub fn zones(&self) -> Vec<ClimateZone> {
        self.stats
            .iter()
            .map(|s| ClimateZone::from_ice_fraction(s.ice_fraction_of_year))
            .collect()
    }

    /// A short plain-words summary per band for designers, south to north, e.g.
    /// `"mild, ice-free, mean 12 °C, 14 °C swing, frost-free"`.
    pub fn band_summaries(&self) -> Vec<String> {
        self.stats
            .iter()
            .zip(&self.phases)
            .map(|(s, p)| describe(s, p))
            .collect()
    }
}

/// Plain-words description of one band.
pub fn describe(stats: &BandStats, phase: &BandPhase) -> String {
    let feel = match stats.mean_c {
        t if t < -25.0 => "frigid",
        t if t < -5.0 => "cold",
        t if t < 8.0 => "cool",
        t if t < 18.0 => "mild",
        t if t < 28.0 => "warm",
        t if t < 45.0 => "hot",
        _ => "scorching",
    };
    let ice = match ClimateZone::from_ice_fraction(stats.ice_fraction_of_year) {
        ClimateZone::PermanentIce => "ice all year".to_string(),
        ClimateZone::SeasonalIce => {
            format!("ice {:.0}% of the year", 100.0 * stats.ice_fraction_of_year)
        }
        ClimateZone::IceFree => "ice-free".to_string(),
    };
    let frost = if stats.min_c > 0.0 {
        ", frost-free"
    } else if stats.max_c < 0.0 {
        ", always below freezing"
    } else {
        ""
    };
    let rhythm = match phase.summers_per_year() {
        0 => ", no seasons",
        2 => ", two summers a year",
        _ => "",
    };
    format!(
        "{feel}, {ice}, mean {:.0} °C, {:.0} °C swing{frost}{rhythm}",
        stats.mean_c,
        stats.max_c - stats.min_c
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    fn column(f: impl Fn(f64) -> f64) -> Vec<f64> {
        (0..360).map(|k| f(k as f64 / 360.0)).collect()
    }

    #[test]
    fn one_summer_centred_on_the_warmest_time() {
        let p = BandPhase::from_column(&column(|f| 10.0 + 8.0 * (TAU * (f - 0.6)).cos()));
        assert!((p.annual_amplitude_k - 8.0).abs() < 1e-9);
        assert!((p.annual_peak_year_fraction - 0.6).abs() < 1e-9);
        assert_eq!(p.summers_per_year(), 1);
        assert_eq!(p.season_at(0.6), Season::Summer);
        assert_eq!(p.season_at(0.85), Season::Autumn);
        assert_eq!(p.season_at(0.1), Season::Winter);
        assert_eq!(p.season_at(0.4), Season::Spring);
    }

    #[test]
    fn two_summers_when_the_half_year_harmonic_leads() {
        let p = BandPhase::from_column(&column(|f| {
            5.0 + 6.0 * (2.0 * TAU * f).cos() + (TAU * f).cos()
        }));
        assert_eq!(p.summers_per_year(), 2);
        assert_eq!(p.season_at(0.0), Season::Summer);
        assert_eq!(p.season_at(0.5), Season::Summer);
        assert_eq!(p.season_at(0.25), Season::Winter);
        assert_eq!(p.season_at(0.75), Season::Winter);
    }

    #[test]
    fn flat_cycle_is_steady_and_zones_follow_ice_fraction() {
        let p = BandPhase::from_column(&column(|_| 3.0));
        assert_eq!(p.season_at(0.3), Season::Steady);
        assert_eq!(
            ClimateZone::from_ice_fraction(1.0),
            ClimateZone::PermanentIce
        );
        assert_eq!(
            ClimateZone::from_ice_fraction(0.2),
            ClimateZone::SeasonalIce
        );
        assert_eq!(ClimateZone::from_ice_fraction(0.0), ClimateZone::IceFree);
    }

    #[test]
    fn summary_reads_plainly() {
        let s = BandStats {
            lat_rad: 0.0,
            mean_c: 12.0,
            min_c: 5.0,
            max_c: 19.0,
            ice_fraction_of_year: 0.0,
        };
        let p = BandPhase::from_column(&column(|f| 12.0 + 7.0 * (TAU * f).cos()));
        assert_eq!(
            describe(&s, &p),
            "mild, ice-free, mean 12 °C, 14 °C swing, frost-free"
        );
    }
}

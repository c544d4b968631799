//! Thermal zones, growing seasons and habitability findings from the map model's own numbers.
//!
//! Zones per cell, from its surface temperature over the periodic year:
//!
//! | zone | rule |
//! |---|---|
//! | [`ThermalZone::NeverFreezes`] | coldest step at or above 0 °C |
//! | [`ThermalZone::WinterFrost`] | coldest step below 0 °C, annual mean at or above 0 °C |
//! | [`ThermalZone::FrozenGround`] | annual mean below 0 °C (permafrost), not ice all year |
//! | [`ThermalZone::LastingIce`] | ice (below the spec's ice temperature) every step, or under an ice sheet |
//!
//! The growing season is the number of standard days (86 400 s) the surface is above a
//! threshold, 5 °C by default (the usual base temperature of growing-degree counts; common
//! practice, no source). Days are standard days, not the world's own, so worlds compare.
//! Numbers here are for games and invented worlds, not for agriculture or any real decision.

use serde::{Deserialize, Serialize};

use super::cycle::MapClimate;
use crate::error::{SpecError, check_range};

/// Seconds in a standard day.
const STD_DAY_S: f64 = 86_400.0;

/// Thermal zone of a cell (see the module docs for the rules).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum ThermalZone {
    /// Never below 0 °C.
    NeverFreezes,
    /// Freezes in the cold season, thaws on average.
    WinterFrost,
    /// Below 0 °C on average over the year (permafrost), though not ice all year.
    FrozenGround,
    /// Ice all year.
    LastingIce,
}

impl ThermalZone {
    /// All zones, warmest first.
    pub const ALL: [ThermalZone; 4] = [
        ThermalZone::NeverFreezes,
        ThermalZone::WinterFrost,
        ThermalZone::FrozenGround,
        ThermalZone::LastingIce,
    ];

    /// Plain words for messages.
    pub fn words(self) -> &'static str {
        match self {
            ThermalZone::NeverFreezes => "never freezes",
            ThermalZone::WinterFrost => "winter frost",
            ThermalZone::FrozenGround => "frozen ground",
            ThermalZone::LastingIce => "lasting ice",
        }
    }

    fn index(self) -> usize {
        self as usize
    }
}

/// Thresholds of the zone and finding computations.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct ZoneOptions {
    /// Temperature above which a day counts toward the growing season, °C. Default 5.
    pub growing_threshold_c: f64,
    /// The mild range a place should stay in, °C. Default 0 to 30 (liquid water without heat
    /// stress; common practice, no source).
    pub mild_range_c: (f64, f64),
    /// A mild stretch shorter than this everywhere is a finding, standard days (at most the
    /// year: on a world whose year is shorter, a place mild all year passes). Default 60.
    pub mild_days_needed: f64,
    /// A growing season shorter than this on all land is a finding, standard days (at most the
    /// year, as the mild stretch). Default 30.
    pub growing_days_needed: f64,
}

impl Default for ZoneOptions {
    fn default() -> Self {
        ZoneOptions {
            growing_threshold_c: 5.0,
            mild_range_c: (0.0, 30.0),
            mild_days_needed: 60.0,
            growing_days_needed: 30.0,
        }
    }
}

impl ZoneOptions {
    /// Checks the thresholds; errors name `zones.*`.
    pub fn validate(&self) -> Result<(), SpecError> {
        check_range(
            "zones.growing_threshold_c",
            self.growing_threshold_c,
            -100.0,
            100.0,
        )?;
        check_range("zones.mild_range_c.0", self.mild_range_c.0, -100.0, 100.0)?;
        check_range(
            "zones.mild_range_c.1",
            self.mild_range_c.1,
            self.mild_range_c.0,
            200.0,
        )?;
        check_range("zones.mild_days_needed", self.mild_days_needed, 0.0, 1e9)?;
        check_range(
            "zones.growing_days_needed",
            self.growing_days_needed,
            0.0,
            1e9,
        )?;
        Ok(())
    }
}

/// Zone and season lengths of one cell.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct CellZone {
    /// The thermal zone.
    pub zone: ThermalZone,
    /// Days above the growing threshold, standard days.
    pub growing_days: f64,
    /// Fraction of the year above the growing threshold (0–1).
    pub growing_fraction_of_year: f64,
    /// Longest unbroken stretch within the mild range, standard days (the whole year when it
    /// never leaves it).
    pub longest_mild_days: f64,
}

/// Fractions of an area in each zone, indexed as [`ThermalZone::ALL`].
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct ZoneFractions {
    /// Fraction of the area in each zone, warmest first (sums to 1 when the area is not empty).
    pub fractions: [f64; 4],
}

impl ZoneFractions {
    /// Fraction of the area in `zone`.
    pub fn of(&self, zone: ThermalZone) -> f64 {
        self.fractions[zone.index()]
    }
}

/// Zones of every cell and their shares of the surface.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ZoneMap {
    /// Per cell, grid order.
    pub cells: Vec<CellZone>,
    /// Of the whole surface.
    pub everywhere: ZoneFractions,
    /// Of the land (cells weighted by land fraction).
    pub land: ZoneFractions,
    /// Of the sea.
    pub sea: ZoneFractions,
    /// The thresholds used.
    pub options: ZoneOptions,
}

/// A habitability warning computed from the map climate, with what it is computed from.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum HabitabilityFinding {
    /// No place stays within the mild range for as long as asked.
    NoLastingMildSpell {
        /// Longest mild stretch anywhere, standard days.
        longest_days: f64,
        /// The range, °C.
        range_c: (f64, f64),
        /// Days asked for.
        needed_days: f64,
    },
    /// No land has a growing season as long as asked (or the world has no land).
    ShortGrowingSeason {
        /// Longest growing season on land, standard days (0 without land).
        longest_days: f64,
        /// Threshold, °C.
        threshold_c: f64,
        /// Days asked for.
        needed_days: f64,
    },
    /// Lasting ice covers most of the surface.
    MostlyIce {
        /// Fraction of the surface under lasting ice.
        fraction: f64,
    },
    /// A large part of the land bakes: its warmest step is above 50 °C.
    ScorchingLand {
        /// Fraction of the land whose warmest step exceeds 50 °C.
        fraction: f64,
    },
}

/// Warmest step above which land counts as scorching, °C (common practice, no source: about
/// the hottest air temperatures people survive in the shade).
pub const SCORCHING_C: f64 = 50.0;

impl HabitabilityFinding {
    /// The warning in plain words.
    pub fn message(&self) -> String {
        match self {
            HabitabilityFinding::NoLastingMildSpell {
                longest_days,
                range_c,
                needed_days,
            } => format!(
                "no place stays between {:.0} and {:.0} °C for more than {longest_days:.0} days in a row (asked: {needed_days:.0})",
                range_c.0, range_c.1
            ),
            HabitabilityFinding::ShortGrowingSeason {
                longest_days,
                threshold_c,
                needed_days,
            } => format!(
                "no land stays above {threshold_c:.0} °C for more than {longest_days:.0} days a year (asked: {needed_days:.0})"
            ),
            HabitabilityFinding::MostlyIce { fraction } => {
                format!("{:.0}% of the surface is ice all year", fraction * 100.0)
            }
            HabitabilityFinding::ScorchingLand { fraction } => format!(
                "{:.0}% of the land passes {SCORCHING_C:.0} °C at the height of its year",
                fraction * 100.0
            ),
        }
    }

    /// What the warning is computed from.
    pub fn basis(&self) -> &'static str {
        match self {
            HabitabilityFinding::NoLastingMildSpell { .. } => {
                "the longest unbroken run of model steps within the range, per cell, of the periodic map climate"
            }
            HabitabilityFinding::ShortGrowingSeason { .. } => {
                "the model steps above the threshold per land cell over the periodic year"
            }
            HabitabilityFinding::MostlyIce { .. } => {
                "cells below the ice temperature at every step, or under an ice sheet"
            }
            HabitabilityFinding::ScorchingLand { .. } => {
                "each land cell's warmest model step over the periodic year"
            }
        }
    }
}

impl MapClimate {
    /// Zones, growing seasons and mild spells of every cell, and each zone's share of the
    /// surface, land and sea.
    pub fn zones(&self, options: &ZoneOptions) -> Result<ZoneMap, SpecError> {
        options.validate()?;
        let n = self.grid.len();
        let steps = self.steps;
        let day_per_step = self.year_s / steps as f64 / STD_DAY_S;
        let (lo, hi) = options.mild_range_c;
        let mut cells = Vec::with_capacity(n);
        let mut column = vec![0.0f32; steps];
        for c in 0..n {
            for (k, v) in column.iter_mut().enumerate() {
                *v = self.temps_c[k * n + c];
            }
            let st = self.stats[c];
            let zone = if st.ice_fraction_of_year >= 1.0 {
                ThermalZone::LastingIce
            } else if st.mean_c < 0.0 {
                ThermalZone::FrozenGround
            } else if st.min_c < 0.0 {
                ThermalZone::WinterFrost
            } else {
                ThermalZone::NeverFreezes
            };
            let growing = column
                .iter()
                .filter(|&&t| f64::from(t) > options.growing_threshold_c)
                .count();
            let mild = |t: f32| (lo..=hi).contains(&f64::from(t));
            let longest = longest_periodic_run(&column, mild);
            cells.push(CellZone {
                zone,
                growing_days: growing as f64 * day_per_step,
                growing_fraction_of_year: growing as f64 / steps as f64,
                longest_mild_days: longest as f64 * day_per_step,
            });
        }
        let land = &self.surface.land_fraction;
        let share = |w: &dyn Fn(usize) -> f64| {
            let mut f = [0.0; 4];
            let mut total = 0.0;
            for (c, z) in cells.iter().enumerate() {
                f[z.zone.index()] += w(c);
                total += w(c);
            }
            if total > 0.0 {
                f.iter_mut().for_each(|v| *v /= total);
            }
            ZoneFractions { fractions: f }
        };
        Ok(ZoneMap {
            everywhere: share(&|_| 1.0),
            land: share(&|c| land[c]),
            sea: share(&|c| 1.0 - land[c]),
            cells,
            options: *options,
        })
    }

    /// The habitability warnings that hold for this climate under `options` (see
    /// [`HabitabilityFinding`]); empty when none does.
    pub fn habitability_findings(
        &self,
        options: &ZoneOptions,
    ) -> Result<Vec<HabitabilityFinding>, SpecError> {
        let zones = self.zones(options)?;
        let land = &self.surface.land_fraction;
        let mut out = Vec::new();
        let longest_mild = zones
            .cells
            .iter()
            .map(|z| z.longest_mild_days)
            .fold(0.0, f64::max);
        // No stretch outlasts the year: on a short-year world the whole year is enough.
        let year_days = self.year_s / STD_DAY_S;
        let mild_needed = options.mild_days_needed.min(year_days);
        let short = |longest: f64, needed: f64| longest < needed - 1e-9 * year_days;
        if short(longest_mild, mild_needed) {
            out.push(HabitabilityFinding::NoLastingMildSpell {
                longest_days: longest_mild,
                range_c: options.mild_range_c,
                needed_days: mild_needed,
            });
        }
        let longest_growing = zones
            .cells
            .iter()
            .zip(land)
            .filter(|(_, f)| **f >= 0.5)
            .map(|(z, _)| z.growing_days)
            .fold(0.0, f64::max);
        let growing_needed = options.growing_days_needed.min(year_days);
        if short(longest_growing, growing_needed) {
            out.push(HabitabilityFinding::ShortGrowingSeason {
                longest_days: longest_growing,
                threshold_c: options.growing_threshold_c,
                needed_days: growing_needed,
            });
        }
        let ice = zones.everywhere.of(ThermalZone::LastingIce);
        if ice > 0.5 {
            out.push(HabitabilityFinding::MostlyIce { fraction: ice });
        }
        let land_total: f64 = land.iter().sum();
        if land_total > 0.0 {
            let hot: f64 = self
                .stats
                .iter()
                .zip(land)
                .filter(|(s, _)| s.max_c > SCORCHING_C)
                .map(|(_, f)| f)
                .sum();
            let fraction = hot / land_total;
            if fraction > 0.25 {
                out.push(HabitabilityFinding::ScorchingLand { fraction });
            }
        }
        Ok(out)
    }
}

/// Longest run of consecutive entries satisfying `pred` in a periodic sequence (the whole
/// length when all do).
fn longest_periodic_run(v: &[f32], pred: impl Fn(f32) -> bool) -> usize {
    let n = v.len();
    let (mut best, mut run) = (0, 0);
    for k in 0..2 * n {
        if pred(v[k % n]) {
            run += 1;
            best = usize::max(best, run);
        } else {
            run = 0;
        }
    }
    best.min(n)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn periodic_runs_wrap_around_the_year() {
        let v = [1.0, 1.0, 0.0, 0.0, 1.0, 1.0, 1.0];
        assert_eq!(longest_periodic_run(&v, |t| t > 0.5), 5);
        assert_eq!(longest_periodic_run(&v, |t| t < 0.5), 2);
        assert_eq!(longest_periodic_run(&[1.0; 4], |t| t > 0.5), 4);
        assert_eq!(longest_periodic_run(&[0.0; 4], |t| t > 0.5), 0);
    }

    #[test]
    fn bad_thresholds_name_the_field() {
        let o = ZoneOptions {
            growing_threshold_c: f64::NAN,
            ..ZoneOptions::default()
        };
        assert_eq!(
            o.validate().unwrap_err().field(),
            Some("zones.growing_threshold_c")
        );
    }
}

//! The calendar designer: leap rules, lunar months and lunisolar cycles that fit a world.
//!
//! Everything is computed from the world's **tropical year** (northward equinox to northward
//! equinox) in its own local solar days and each moon's **synodic month** (new moon to new
//! moon), not from sidereal figures. The model has no axial precession, so the tropical year
//! equals the orbital period; it is still measured here between two equinoxes so that the
//! figures follow the model if that changes.
//!
//! The leap cycles are the convergents and semiconvergents of the continued fraction of the
//! year's fraction of a day (the best rational approximations); Gregorian-style rules add
//! exceptions at round numbers of years. Each proposal carries its drift against the seasons
//! and the range of dates of the northward equinox over one period of the rule. Lunar and
//! lunisolar proposals become a calendar section with [`Planet::moon_months_of`].

mod lunar;
mod moon_calendar;
mod seasons;

pub use crate::leap_rules::{Approximation, ApproximationKind, best_approximations};
pub use crate::leap_rules::{
    BEST_DRIFT_DAYS_PER_KY, DateWander, MAX_CYCLE_YEARS, SolarFamily, SolarProposal, best_index,
    best_solar_rule, offset_range, solar_proposals,
};
pub use lunar::{LunarProposal, LunisolarProposal, lunar_proposals, lunisolar_proposals};
pub use moon_calendar::{BEST_LUNAR_DRIFT_DAYS_PER_KY, best_lunar_index};
pub use seasons::{SEASON_MARK_NAMES, SeasonDate, SeasonWander};

use serde::{Deserialize, Serialize};
use thiserror::Error;

use crate::moons::synodic_period_s;
use crate::planet::Planet;

/// Longest span a date wander is computed over, years.
pub const MAX_WANDER_YEARS: u32 = 20_000;

/// Why a world cannot have a calendar designed.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum DesignError {
    /// No solar days to count.
    #[error("the world is tidally locked: it has no solar days to build a calendar from")]
    TidallyLocked,
    /// A year shorter than two local days.
    #[error("the year lasts {year_days:.3} local days: too few to build a calendar of whole days")]
    YearTooShort {
        /// Tropical year in local solar days.
        year_days: f64,
    },
}

/// A moon's lunar and lunisolar schemes.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct MoonSchemes {
    /// Moon name.
    pub moon: String,
    /// Synodic month (new moon to new moon), local solar days.
    pub synodic_month_days: f64,
    /// Synodic months per tropical year.
    pub months_per_year: f64,
    /// Month cycles that follow the phases.
    pub lunar: Vec<LunarProposal>,
    /// Cycles of years of whole months.
    pub lunisolar: Vec<LunisolarProposal>,
    /// Index in `lunar` of the month rule a lunisolar proposal is written with (see
    /// [`best_lunar_index`]).
    pub best_lunar: Option<usize>,
}

/// Everything the designer proposes for one world.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CalendarDesign {
    /// Tropical year (equinox to equinox), local solar days.
    pub tropical_year_days: f64,
    /// Leap rules: cycles by rising length, then round-number rules.
    pub solar: Vec<SolarProposal>,
    /// Index of the best leap rule in `solar`.
    pub best: usize,
    /// Index in `solar` of the rule the world's calendar uses now, if it is one of them.
    pub current: Option<usize>,
    /// Each moon's schemes.
    pub moons: Vec<MoonSchemes>,
}

impl Planet {
    /// Tropical year: northward equinox to the next, seconds.
    pub fn tropical_year_s(&self) -> f64 {
        tropical_year_s_of(self.orbit())
    }

    /// Tropical year in local solar days (on a tidally locked world, in sidereal days).
    pub fn tropical_year_days(&self) -> f64 {
        self.tropical_year_s() / self.day_s()
    }

    /// Proposes leap rules, lunar months and lunisolar cycles for this world.
    pub fn design_calendar(&self) -> Result<CalendarDesign, DesignError> {
        if self.spin().is_tidally_locked() {
            return Err(DesignError::TidallyLocked);
        }
        let year_days = self.tropical_year_days();
        let mut solar = solar_proposals(year_days);
        if year_days < 2.0 || solar.is_empty() {
            return Err(DesignError::YearTooShort { year_days });
        }
        let first_offset = self.first_mark_offset_days(0);
        for p in &mut solar {
            let years = p.leap.period_years().min(MAX_WANDER_YEARS);
            let (lo, hi) = offset_range(first_offset, year_days, p.year_days, &p.leap, years);
            p.northward_equinox = Some(DateWander {
                earliest_day_of_year: lo,
                latest_day_of_year: hi,
                wander_days: hi - lo,
                over_years: years,
            });
        }
        let cal = self.calendar();
        let current = solar.iter().position(|p| {
            cal.moon_months.is_none() && p.year_days == cal.common_year_days && p.leap == cal.leap
        });
        let day_s = self.day_s();
        let moons = self
            .moon_orbits()
            .iter()
            .zip(&self.spec().moons)
            .map(|(orbit, spec)| {
                let synodic = synodic_period_s(orbit.period_s, self.tropical_year_s()) / day_s;
                let lunar = lunar_proposals(synodic, year_days);
                MoonSchemes {
                    moon: spec.name.clone(),
                    synodic_month_days: synodic,
                    months_per_year: year_days / synodic,
                    best_lunar: best_lunar_index(&lunar),
                    lunar,
                    lunisolar: lunisolar_proposals(synodic, year_days),
                }
            })
            .collect();
        Ok(CalendarDesign {
            tropical_year_days: year_days,
            best: best_index(&solar).unwrap_or(0),
            solar,
            current,
            moons,
        })
    }

    /// Days from the epoch (the first midnight of the first year) to the first time the star
    /// reaches season mark `mark` (0 northward equinox, 1 northern solstice, …) after it.
    fn first_mark_offset_days(&self, mark: usize) -> f64 {
        let epoch = self.calendar_day_start_s(0);
        let t = self
            .orbit()
            .time_of_star_longitude(mark as f64 * std::f64::consts::FRAC_PI_2, epoch);
        (t - epoch) / self.day_s()
    }
}

pub(crate) use crate::leap_rules::tropical_year_s_of;

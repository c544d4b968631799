//! The calendar dates of the equinoxes and solstices, and how far they wander over the leap
//! rule's period.

use serde::{Deserialize, Serialize};
use std::f64::consts::FRAC_PI_2;

use super::MAX_WANDER_YEARS;
use crate::calendar::CalendarDate;
use crate::leap_rules::offset_range;
use crate::planet::Planet;

/// Names of the four season marks, in the order of the year from the northward equinox
/// (star at ecliptic longitude 0°, 90°, 180°, 270°).
pub const SEASON_MARK_NAMES: [&str; 4] = [
    "northward equinox",
    "northern solstice",
    "southward equinox",
    "southern solstice",
];

/// One equinox or solstice on the calendar.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct SeasonDate {
    /// Which mark (see [`SEASON_MARK_NAMES`]).
    pub mark: String,
    /// World time, seconds.
    pub t_s: f64,
    /// Its calendar date.
    pub date: CalendarDate,
}

/// How far one mark's date moves over one period of the calendar's leap rule.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct SeasonWander {
    /// Which mark.
    pub mark: String,
    /// Earliest time of year, days since the year's first midnight (day of year from 0 plus
    /// the fraction of the day).
    pub earliest_day_of_year: f64,
    /// Latest time of year, days since the year's first midnight.
    pub latest_day_of_year: f64,
    /// Years looked at: one period of the leap rule from the first year (at most 20 000).
    pub over_years: u32,
}

impl Planet {
    /// The equinoxes and solstices of calendar year `year`: each mark's first time at or after
    /// the year's first midnight (the last may fall in the next year's first days when the
    /// calendar year runs short of the tropical year).
    pub fn season_dates(&self, year: i64) -> Vec<SeasonDate> {
        let start = self.year_start_s(year);
        let mut marks: Vec<SeasonDate> = (0..4)
            .map(|k| {
                let t = self
                    .orbit()
                    .time_of_star_longitude(k as f64 * FRAC_PI_2, start);
                SeasonDate {
                    mark: SEASON_MARK_NAMES[k].to_string(),
                    t_s: t,
                    date: self.date_at(t),
                }
            })
            .collect();
        marks.sort_by(|a, b| a.t_s.total_cmp(&b.t_s));
        marks
    }

    /// How far each equinox and solstice wanders in the calendar over one period of its leap
    /// rule (for months of a moon: see [`Planet::calendar_cycle_years`]), from the first year.
    pub fn season_wander(&self) -> Vec<SeasonWander> {
        let cal = self.calendar();
        if cal.moon_months.is_some() {
            return self.season_wander_by_years();
        }
        let years = cal.leap.period_years().min(MAX_WANDER_YEARS);
        let year_days = self.tropical_year_days();
        (0..4)
            .map(|k| {
                let epoch = self.calendar_day_start_s(0);
                let t = self
                    .orbit()
                    .time_of_star_longitude(k as f64 * FRAC_PI_2, epoch);
                let first = (t - epoch) / self.day_s();
                let (lo, hi) =
                    offset_range(first, year_days, cal.common_year_days, &cal.leap, years);
                SeasonWander {
                    mark: SEASON_MARK_NAMES[k].to_string(),
                    earliest_day_of_year: lo,
                    latest_day_of_year: hi,
                    over_years: years,
                }
            })
            .collect()
    }

    /// Years over which the calendar's dates of the seasons repeat, at most 20 000: one period
    /// of the leap rule; for months of a moon, the longer of the intercalary period and the
    /// month cycle in years, and for a lunar calendar the years its year takes to run once
    /// through the seasons.
    pub fn calendar_cycle_years(&self) -> u32 {
        let cal = self.calendar();
        let Some(m) = &cal.moon_months else {
            return cal.leap.period_years().min(MAX_WANDER_YEARS);
        };
        let month_cycle_years = (f64::from(m.cycle_months) / m.mean_year_months()).ceil();
        let years = if m.intercalary.is_some() {
            f64::from(m.intercalary_rule().period_years()).max(month_cycle_years)
        } else {
            let y = self.tropical_year_days();
            (y / (y - m.mean_year_days()).abs()).ceil()
        };
        if years.is_finite() {
            years.clamp(1.0, f64::from(MAX_WANDER_YEARS)) as u32
        } else {
            MAX_WANDER_YEARS
        }
    }

    /// Season wander found year by year: each mark's k-th time after the epoch read on the
    /// calendar (for calendars whose years are not whole-day leap cycles).
    fn season_wander_by_years(&self) -> Vec<SeasonWander> {
        let cal = self.calendar();
        let years = self.calendar_cycle_years();
        let year_days = self.tropical_year_days();
        let epoch = self.calendar_day_start_s(cal.year_start_day(cal.first_year));
        (0..4)
            .map(|k| {
                let t = self
                    .orbit()
                    .time_of_star_longitude(k as f64 * FRAC_PI_2, epoch);
                let first = (t - epoch) / self.day_s();
                let start = cal.year_start_day(cal.first_year);
                let mut range = (f64::INFINITY, f64::NEG_INFINITY);
                for j in 0..i64::from(years) {
                    let days = first + j as f64 * year_days;
                    let day = days.floor();
                    let (_, doy) = cal.year_and_day_of_year(start + day as i64);
                    let offset = f64::from(doy) + (days - day);
                    range = (range.0.min(offset), range.1.max(offset));
                }
                SeasonWander {
                    mark: SEASON_MARK_NAMES[k].to_string(),
                    earliest_day_of_year: range.0,
                    latest_day_of_year: range.1,
                    over_years: years,
                }
            })
            .collect()
    }
}

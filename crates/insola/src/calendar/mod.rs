//! Calendars: world time to year, month, day, weekday and clock time, and back, in whole days.
//!
//! Days are local mean solar days at the prime meridian: a day starts at local mean midnight
//! there, and day number 0 is the day that contains time zero. The **epoch** is the start of
//! day 0, the local midnight at or before time zero: year `first_year` begins then. Years have
//! `common_year_days` days, or one more in the leap years of the calendar's [`LeapRule`];
//! months have fixed lengths with the leap day in the leap month; weeks run on across years.
//! Everything is counted in whole numbers, so date → instant → date is exact; only the time of
//! day is a float (hours since the day's midnight).
//!
//! A calendar of months that follow a moon ([`MoonMonthsSpec`]) counts its years in whole
//! months instead: the first year begins with its first month, on `first_month_day`, and a
//! leap year has one month more (lunisolar) or one of the longer runs of months (lunar).
//!
//! A world file without a leap rule gets the designer's best rule (see
//! [`crate::calendar_design`] and [`CalendarSpec`]).

mod error;
mod leap;
mod lunar_months;
mod lunisolar;
mod parse;
mod resolved;

pub use crate::world::{CalendarSpec, LeapRule, MonthSpec, MoonMonthsSpec, WeekSpec};
pub use error::CalendarError;
pub use parse::{DateText, DayInYear};
pub use resolved::Calendar;

use serde::{Deserialize, Serialize};

/// Years before or after `first_year` a calendar reading may lie (±10⁹).
pub const MAX_YEARS_FROM_FIRST: i64 = 1_000_000_000;

/// A world instant read on the calendar.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CalendarDate {
    /// Year number (the year starting at the epoch is `first_year`).
    pub year: i64,
    /// Day within the year, from 0.
    pub day_of_year: u64,
    /// Month index into the calendar's months (from 0), if it has any.
    pub month: Option<usize>,
    /// Month name, if the calendar names its months.
    pub month_name: Option<String>,
    /// Day within the month, from 1 (equals `day_of_year + 1` without months).
    pub day_of_month: u64,
    /// Hours since local mean midnight at the prime meridian, `[0, day length in hours)`.
    pub hour_of_day: f64,
    /// Fraction of this calendar year elapsed, `[0, 1)`.
    pub year_fraction: f64,
    /// Day number since the epoch (day 0 contains time zero).
    pub day_number: i64,
    /// Weekday from 0, if the calendar has weeks.
    pub weekday: Option<u32>,
    /// Weekday name, if the week names its days.
    pub weekday_name: Option<String>,
    /// Days in this year.
    pub year_days: u32,
    /// `true` in a leap year: one day more (solar calendar), one month more (lunisolar), or
    /// one of the longer years (lunar).
    pub leap_year: bool,
}

impl CalendarDate {
    /// Clock time as `HH:MM` in hours of the world's day (which may have more than 24).
    pub fn clock(&self) -> String {
        let total_min = (self.hour_of_day * 60.0).floor().max(0.0) as i64;
        format!("{:02}:{:02}", total_min / 60, total_min % 60)
    }

    /// The date as text in the syntax [`DateText`] reads back: `year/Month/day` with named
    /// months, `year/3/day` with numbered ones (from 1), `year-day` (day of year from 1)
    /// without months.
    pub fn text(&self) -> String {
        match (&self.month_name, self.month) {
            (Some(m), _) => format!("{}/{m}/{}", self.year, self.day_of_month),
            (None, Some(i)) => format!("{}/{}/{}", self.year, i + 1, self.day_of_month),
            (None, None) => format!("{}-{}", self.year, self.day_of_year + 1),
        }
    }

    /// The date and time for people: `Emberday 3/Frostwane/12 13:30 (day 117 of 412)`.
    pub fn label(&self) -> String {
        let weekday = match (&self.weekday_name, self.weekday) {
            (Some(n), _) => format!("{n} "),
            (None, Some(w)) => format!("weekday {} ", w + 1),
            _ => String::new(),
        };
        format!(
            "{weekday}{} {} (day {} of {}{})",
            self.text(),
            self.clock(),
            self.day_of_year + 1,
            self.year_days,
            if self.leap_year { ", leap year" } else { "" }
        )
    }
}

#[cfg(test)]
mod tests;

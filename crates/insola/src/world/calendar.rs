//! The world file's `calendar` section: whole-day years with a leap rule, weeks and months.
//!
//! ```text
//! calendar: (
//!     first_year: 1,
//!     year_days: 365,                                   // days of a common year
//!     leap: (leap_years: 1, cycle_years: 4, exceptions: [100, 400]),
//!     leap_month: "Frostwane",                          // takes the leap day (default: last)
//!     week: (days: 7, names: ["Ember", ...]),           // optional
//!     months: [(name: "Frostwane", days: 30), ...],     // optional
//! )
//! ```
//!
//! Instead of `year_days`, `leap`, `leap_month` and `months`, a calendar may count its years
//! in months that follow a moon: `moon_months: (...)` (see [`MoonMonthsSpec`]).
//!
//! Every field is optional. Without `year_days` and `leap`, the calendar takes the rule
//! [`crate::calendar_design`] ranks best for the world's tropical year (what
//! `insola calendar --write` writes), so files written before leap rules existed still load and
//! their days no longer drift. With `year_days` but no `leap`, every year has `year_days` days.

use serde::{Deserialize, Serialize};

use super::MoonMonthsSpec;
use crate::error::{SpecError, check_range};

/// The calendar section of a world file.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
pub struct CalendarSpec {
    /// Number of the year that starts at the local midnight at or before time zero (at the
    /// prime meridian). Default 1.
    pub first_year: i64,
    /// Days in a common year, local solar days. Default: whole days of the tropical year.
    pub year_days: Option<u32>,
    /// Which years get one more day. Default: see the module docs.
    pub leap: Option<LeapRule>,
    /// Name of the month that takes the leap day. Default: the last month.
    pub leap_month: Option<String>,
    /// A week of named or numbered days running on across years. Default: no weeks.
    pub week: Option<WeekSpec>,
    /// Months in order, each with a name and a length in days of a common year. They should
    /// add up to `year_days`; if they fall short the last month takes the remaining days, if
    /// they run over the later months are cut short (`insola check` warns). Empty: no months.
    pub months: Vec<MonthSpec>,
    /// Months that follow a moon, in lunar or lunisolar years (see [`MoonMonthsSpec`]).
    /// Replaces `year_days`, `leap`, `leap_month` and `months`. Default: none (a solar
    /// calendar).
    pub moon_months: Option<MoonMonthsSpec>,
}

impl Default for CalendarSpec {
    fn default() -> Self {
        CalendarSpec {
            first_year: 1,
            year_days: None,
            leap: None,
            leap_month: None,
            week: None,
            months: Vec::new(),
            moon_months: None,
        }
    }
}

/// A leap rule: `leap_years` leap years spread evenly over each cycle of `cycle_years`
/// years, then the exceptions in turn: the years whose number in the count (1 for the first
/// year) is divisible by `exceptions[0]` lose their leap day, those divisible by
/// `exceptions[1]` get it back, and so on.
///
/// `(leap_years: 1, cycle_years: 4, exceptions: [100, 400])` is the Gregorian-style rule
/// (97 leap years in 400); `(leap_years: 8, cycle_years: 33)` puts 8 leap years in 33.
/// Within a cycle, year `k` (0 for the first year) is a leap year when
/// `⌊(k+1)·L/C⌋ − ⌊k·L/C⌋ = 1`, which puts the last year of every cycle among them.
#[derive(Debug, Clone, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LeapRule {
    /// Leap years per cycle, `0 ≤ L < C`.
    pub leap_years: u32,
    /// Cycle length in years, at least 1.
    pub cycle_years: u32,
    /// Exception steps in years: each a multiple of `cycle_years` and of the step before it.
    #[serde(default)]
    pub exceptions: Vec<u32>,
}

impl LeapRule {
    /// No leap years at all.
    pub const NONE: LeapRule = LeapRule {
        leap_years: 0,
        cycle_years: 1,
        exceptions: Vec::new(),
    };
}

/// A week: `days` weekdays running on without a break across months and years.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WeekSpec {
    /// Days per week, at least 1.
    pub days: u32,
    /// Weekday names (none, or exactly `days` of them).
    #[serde(default)]
    pub names: Vec<String>,
    /// Weekday (from 0) of the first day of `first_year`. Default 0.
    #[serde(default)]
    pub first_weekday: u32,
}

/// One month of a calendar.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MonthSpec {
    /// Display name.
    pub name: String,
    /// Length in days of a common year, at least 1.
    pub days: u32,
}

impl CalendarSpec {
    /// Checks the section; `path` is its dotted name in the file.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        check_range(
            &format!("{path}.first_year"),
            self.first_year as f64,
            -1.0e12,
            1.0e12,
        )?;
        if let Some(n) = self.year_days {
            check_range(&format!("{path}.year_days"), f64::from(n), 1.0, 1.0e7)?;
        }
        if let Some(rule) = &self.leap {
            rule.validate(&format!("{path}.leap"))?;
        }
        for (i, m) in self.months.iter().enumerate() {
            if m.name.trim().is_empty() {
                return Err(SpecError::inconsistent(
                    format!("{path}.months[{i}].name"),
                    "must not be empty",
                ));
            }
            if m.days == 0 {
                return Err(SpecError::out_of_range(
                    format!("{path}.months[{i}].days"),
                    0.0,
                    "1 or more",
                ));
            }
        }
        if let Some(name) = &self.leap_month
            && !self.months.iter().any(|m| &m.name == name)
        {
            return Err(SpecError::inconsistent(
                format!("{path}.leap_month"),
                format!("no month named `{name}` in {path}.months"),
            ));
        }
        if let Some(week) = &self.week {
            week.validate(&format!("{path}.week"))?;
        }
        if let Some(moon_months) = &self.moon_months {
            let solar = [
                ("year_days", self.year_days.is_some()),
                ("leap", self.leap.is_some()),
                ("leap_month", self.leap_month.is_some()),
                ("months", !self.months.is_empty()),
            ];
            if let Some((name, _)) = solar.iter().find(|(_, set)| *set) {
                return Err(SpecError::inconsistent(
                    format!("{path}.{name}"),
                    "a calendar of moon_months counts years in months: leave out year_days, leap, leap_month and months",
                ));
            }
            moon_months.validate(&format!("{path}.moon_months"))?;
        }
        Ok(())
    }
}

impl LeapRule {
    /// Checks the rule; `path` is its dotted name in the file.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        check_range(
            &format!("{path}.cycle_years"),
            f64::from(self.cycle_years),
            1.0,
            1.0e6,
        )?;
        if self.leap_years >= self.cycle_years {
            return Err(SpecError::out_of_range(
                format!("{path}.leap_years"),
                f64::from(self.leap_years),
                format!("0 to {} (fewer than cycle_years)", self.cycle_years - 1),
            ));
        }
        if !self.exceptions.is_empty() && self.leap_years == 0 {
            return Err(SpecError::inconsistent(
                format!("{path}.exceptions"),
                "exceptions need leap years to except (leap_years ≥ 1)",
            ));
        }
        let mut step = self.cycle_years;
        for (i, &s) in self.exceptions.iter().enumerate() {
            if s <= step || s % step != 0 || s > 100_000_000 {
                return Err(SpecError::inconsistent(
                    format!("{path}.exceptions[{i}]"),
                    format!("must be a multiple of {step} above it (and at most 100000000)"),
                ));
            }
            step = s;
        }
        Ok(())
    }
}

impl WeekSpec {
    /// Checks the week; `path` is its dotted name in the file.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        check_range(&format!("{path}.days"), f64::from(self.days), 1.0, 1.0e4)?;
        if !self.names.is_empty() && self.names.len() != self.days as usize {
            return Err(SpecError::inconsistent(
                format!("{path}.names"),
                format!("give none or exactly {} names", self.days),
            ));
        }
        if let Some(i) = self.names.iter().position(|n| n.trim().is_empty()) {
            return Err(SpecError::inconsistent(
                format!("{path}.names[{i}]"),
                "must not be empty",
            ));
        }
        if self.first_weekday >= self.days {
            return Err(SpecError::out_of_range(
                format!("{path}.first_weekday"),
                f64::from(self.first_weekday),
                format!("0 to {}", self.days - 1),
            ));
        }
        Ok(())
    }
}

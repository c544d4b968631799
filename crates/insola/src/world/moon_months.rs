//! The calendar section's `moon_months` entry: months that follow a moon's phases, grouped
//! into years of a fixed number of months (a lunar calendar) or of one month more in some
//! years (a lunisolar calendar).
//!
//! ```text
//! calendar: (
//!     first_year: 1,
//!     moon_months: (
//!         moon: "Ossel",
//!         short_month_days: 27,       // long months have one day more
//!         long_months: 11,            // long months in each cycle of `cycle_months`
//!         cycle_months: 14,
//!         first_month_day: -3,        // day number (day 0 holds time zero) of month 1 of first_year
//!         year_months: 13,            // months of a common year
//!         intercalary: (leap_years: 5, cycle_years: 16),  // optional: years of one month more
//!         month_names: ["Thaw", ...], // optional: none, or exactly `year_months`
//!         intercalary_month: "Deepmoon", // optional name of the extra month
//!         intercalary_after: "Reaping",  // optional: the month it follows (default: the last)
//!     ),
//! )
//! ```
//!
//! Month `m` (0 for the first month of `first_year`, negative before) begins on day
//! `first_month_day + m·short_month_days + ⌊m·long_months / cycle_months⌋`, so long months are
//! spread as evenly as whole days allow and the mean month is
//! `short_month_days + long_months / cycle_months` days. Years are whole months: year `k`
//! (0 for `first_year`) holds `year_months` months, plus one in the years the `intercalary`
//! rule marks (spread the same way as solar leap years).

use serde::{Deserialize, Serialize};

use super::LeapRule;
use crate::error::{SpecError, check_range};

/// Months that follow a moon, and years made of them.
#[derive(Debug, Clone, PartialEq, Eq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MoonMonthsSpec {
    /// Name of the moon whose phases the months follow (one of the world's `moons`).
    pub moon: String,
    /// Days of a short month, local solar days; long months have one more.
    pub short_month_days: u32,
    /// Long months in each cycle of `cycle_months`, `0 ≤ long_months < cycle_months`.
    pub long_months: u32,
    /// Months per cycle of long and short months, at least 1.
    pub cycle_months: u32,
    /// Calendar day number on which the first month of `first_year` begins (day 0 holds time
    /// zero). Default 0. `insola calendar --write` sets it to the day of a new moon.
    #[serde(default)]
    pub first_month_day: i64,
    /// Months of a common year, at least 1.
    pub year_months: u32,
    /// Which years hold one month more (a lunisolar calendar). Default: none (a lunar
    /// calendar, whose years run through the seasons).
    #[serde(default)]
    pub intercalary: Option<LeapRule>,
    /// Names of the months of a common year: none (months are numbered from 1), or exactly
    /// `year_months`.
    #[serde(default)]
    pub month_names: Vec<String>,
    /// Name of the extra month of a leap year. Default: the name of the month it follows with
    /// ` II` added (numbered months need none).
    #[serde(default)]
    pub intercalary_month: Option<String>,
    /// The month the extra month follows: a name from `month_names` or a number from 1.
    /// Default: the last month.
    #[serde(default)]
    pub intercalary_after: Option<String>,
}

/// Most months a year may have.
pub const MAX_YEAR_MONTHS: u32 = 1000;

impl MoonMonthsSpec {
    /// Mean month, days: `short_month_days + long_months / cycle_months`.
    pub fn mean_month_days(&self) -> f64 {
        f64::from(self.short_month_days)
            + f64::from(self.long_months) / f64::from(self.cycle_months.max(1))
    }

    /// Index (from 0, among the common year's months) of the month the extra month follows.
    pub fn intercalary_after_index(&self) -> usize {
        let last = self.year_months.max(1) as usize - 1;
        match &self.intercalary_after {
            None => last,
            Some(text) => match text.trim().parse::<usize>() {
                Ok(n) if (1..=last + 1).contains(&n) => n - 1,
                _ => self
                    .month_names
                    .iter()
                    .position(|m| m.eq_ignore_ascii_case(text.trim()))
                    .unwrap_or(last),
            },
        }
    }

    /// Checks the entry; `path` is its dotted name in the file.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        if self.moon.trim().is_empty() {
            return Err(SpecError::inconsistent(
                format!("{path}.moon"),
                "must name one of the world's moons",
            ));
        }
        check_range(
            &format!("{path}.short_month_days"),
            f64::from(self.short_month_days),
            1.0,
            1.0e6,
        )?;
        check_range(
            &format!("{path}.cycle_months"),
            f64::from(self.cycle_months),
            1.0,
            1.0e6,
        )?;
        if self.long_months >= self.cycle_months {
            return Err(SpecError::out_of_range(
                format!("{path}.long_months"),
                f64::from(self.long_months),
                format!("0 to {} (fewer than cycle_months)", self.cycle_months - 1),
            ));
        }
        check_range(
            &format!("{path}.first_month_day"),
            self.first_month_day as f64,
            -1.0e12,
            1.0e12,
        )?;
        check_range(
            &format!("{path}.year_months"),
            f64::from(self.year_months),
            1.0,
            f64::from(MAX_YEAR_MONTHS),
        )?;
        if let Some(rule) = &self.intercalary {
            rule.validate(&format!("{path}.intercalary"))?;
        }
        self.validate_names(path)
    }

    fn validate_names(&self, path: &str) -> Result<(), SpecError> {
        if !self.month_names.is_empty() && self.month_names.len() != self.year_months as usize {
            return Err(SpecError::inconsistent(
                format!("{path}.month_names"),
                format!("give none or exactly {} names", self.year_months),
            ));
        }
        let mut names: Vec<&str> = self.month_names.iter().map(String::as_str).collect();
        names.extend(self.intercalary_month.as_deref());
        for (i, name) in names.iter().enumerate() {
            let field = if i < self.month_names.len() {
                format!("{path}.month_names[{i}]")
            } else {
                format!("{path}.intercalary_month")
            };
            if name.trim().is_empty() || name.contains('/') {
                return Err(SpecError::inconsistent(
                    field,
                    "must not be empty nor hold a `/`",
                ));
            }
            if name.trim().parse::<u64>().is_ok() {
                return Err(SpecError::inconsistent(
                    field,
                    "a month name must not be a number (numbers count months)",
                ));
            }
            if names[..i].iter().any(|n| n.eq_ignore_ascii_case(name)) {
                return Err(SpecError::inconsistent(field, "names a month twice"));
            }
        }
        if self.intercalary.is_none()
            && (self.intercalary_month.is_some() || self.intercalary_after.is_some())
        {
            return Err(SpecError::inconsistent(
                format!("{path}.intercalary"),
                "intercalary_month and intercalary_after need an intercalary rule",
            ));
        }
        if let Some(after) = &self.intercalary_after {
            let t = after.trim();
            let by_number = t
                .parse::<u32>()
                .is_ok_and(|n| (1..=self.year_months).contains(&n));
            let by_name = self.month_names.iter().any(|m| m.eq_ignore_ascii_case(t));
            if !by_number && !by_name {
                return Err(SpecError::inconsistent(
                    format!("{path}.intercalary_after"),
                    format!(
                        "`{after}` is neither a month of month_names nor a number 1 to {}",
                        self.year_months
                    ),
                ));
            }
        }
        Ok(())
    }
}

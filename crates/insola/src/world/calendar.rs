//! The world file's `calendar` section: the number of the first year and named months.

use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range};

/// The calendar section of a world file.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
pub struct CalendarSpec {
    /// Number of the year that starts at time zero. Default 1.
    pub first_year: i64,
    /// Months in order, each with a name and a length in solar days. Empty: no months.
    pub months: Vec<MonthSpec>,
}

impl Default for CalendarSpec {
    fn default() -> Self {
        CalendarSpec {
            first_year: 1,
            months: Vec::new(),
        }
    }
}

/// One month of a calendar.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MonthSpec {
    /// Display name.
    pub name: String,
    /// Length in solar days, at least 1.
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
        Ok(())
    }
}

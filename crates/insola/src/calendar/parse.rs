//! Date text: `YEAR-DAY[THH:MM[:SS]]` (day of year from 1) or
//! `YEAR/MONTH/DAY[THH:MM[:SS]]` (month name or number from 1, day of month from 1).
//!
//! Years may be negative (`-40-12`). Hours may exceed 23 on worlds with long days; without a
//! time the reading is the day's midnight.

use super::CalendarError;

/// Which day of the year a [`DateText`] names.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum DayInYear {
    /// Day of the year, from 1.
    OfYear(u64),
    /// A day of a month.
    InMonth {
        /// Month name, or its number from 1, as written.
        month: String,
        /// Day of the month, from 1.
        day: u64,
    },
}

/// A calendar date and local time as written, not yet checked against a calendar.
#[derive(Debug, Clone, PartialEq)]
pub struct DateText {
    /// Year number.
    pub year: i64,
    /// The day within the year.
    pub day: DayInYear,
    /// Hours after midnight.
    pub hour_of_day: f64,
}

impl DateText {
    /// Reads `text`; see the module docs for the syntax.
    pub fn parse(text: &str) -> Result<DateText, CalendarError> {
        let bad = |reason: &str| CalendarError::BadDateText {
            text: text.to_string(),
            reason: reason.to_string(),
        };
        let trimmed = text.trim();
        // The time follows the last `T` (or space) that a digit follows, so month names may
        // hold a `T` of their own.
        let split = trimmed.char_indices().rev().find(|&(i, c)| {
            matches!(c, 'T' | 't' | ' ')
                && trimmed[i + 1..].starts_with(|d: char| d.is_ascii_digit())
        });
        let (date, time) = match split {
            Some((i, _)) => (&trimmed[..i], Some(&trimmed[i + 1..])),
            None => (trimmed, None),
        };
        let hour_of_day = match time {
            Some(t) => parse_time(t).ok_or_else(|| bad("the time is not HH:MM or HH:MM:SS"))?,
            None => 0.0,
        };
        let (sign, unsigned) = match date.strip_prefix('-') {
            Some(rest) => (-1, rest),
            None => (1, date),
        };
        let number = |s: &str, what: &str| -> Result<u64, CalendarError> {
            s.parse::<u64>()
                .map_err(|_| bad(&format!("{what} `{s}` is not a whole number")))
        };
        let year_of = |s: &str| -> Result<i64, CalendarError> {
            let y = number(s, "year")?;
            i64::try_from(y)
                .map(|y| sign * y)
                .map_err(|_| bad("year too large"))
        };
        if let Some((year, rest)) = unsigned.split_once('/') {
            let (month, day) = rest
                .split_once('/')
                .ok_or_else(|| bad("YEAR/MONTH/DAY needs two slashes"))?;
            if month.trim().is_empty() {
                return Err(bad("the month is empty"));
            }
            let day = number(day, "day of month")?;
            if day == 0 {
                return Err(bad("days of the month count from 1"));
            }
            return Ok(DateText {
                year: year_of(year)?,
                day: DayInYear::InMonth {
                    month: month.trim().to_string(),
                    day,
                },
                hour_of_day,
            });
        }
        let (year, day) = unsigned
            .split_once('-')
            .ok_or_else(|| bad("no `-` between year and day, nor `/` between year and month"))?;
        let day = number(day, "day of year")?;
        if day == 0 {
            return Err(bad("days of the year count from 1"));
        }
        Ok(DateText {
            year: year_of(year)?,
            day: DayInYear::OfYear(day),
            hour_of_day,
        })
    }
}

fn parse_time(t: &str) -> Option<f64> {
    let parts: Vec<&str> = t.split(':').collect();
    if !(2..=3).contains(&parts.len()) {
        return None;
    }
    let h: u32 = parts[0].parse().ok()?;
    let m: u32 = parts[1].parse().ok()?;
    let s: f64 = match parts.get(2) {
        Some(s) => s.parse().ok()?,
        None => 0.0,
    };
    (m < 60 && s.is_finite() && (0.0..60.0).contains(&s))
        .then(|| f64::from(h) + f64::from(m) / 60.0 + s / 3600.0)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reads_both_forms() {
        let d = DateText::parse("3-117T13:30").unwrap();
        assert_eq!((d.year, d.day.clone()), (3, DayInYear::OfYear(117)));
        assert!((d.hour_of_day - 13.5).abs() < 1e-12);
        let d = DateText::parse("-40/Frostwane/12T06:00:30").unwrap();
        assert_eq!(d.year, -40);
        assert_eq!(
            d.day,
            DayInYear::InMonth {
                month: "Frostwane".into(),
                day: 12
            }
        );
        assert!((d.hour_of_day - (6.0 + 30.0 / 3600.0)).abs() < 1e-12);
        assert_eq!(DateText::parse("5-1").unwrap().hour_of_day, 0.0);
        for bad in ["", "5", "5-0", "5/x", "5-3T25", "5-3T1:60", "x-3", "5/A/0"] {
            assert!(
                matches!(DateText::parse(bad), Err(CalendarError::BadDateText { .. })),
                "{bad}"
            );
        }
    }
}

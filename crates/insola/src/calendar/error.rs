//! [`CalendarError`]: a calendar reading that does not exist on the world's calendar.

use thiserror::Error;

/// A date, time or date text that the world's calendar does not have.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum CalendarError {
    /// A time that is not a finite number of seconds (or is beyond ±3·10¹⁶ s).
    #[error("`{what}` = {value} is not a usable world time")]
    NotFinite {
        /// Argument name.
        what: &'static str,
        /// The value given.
        value: f64,
    },
    /// A day of the year past the year's end.
    #[error(
        "day {} of year {year} does not exist: the year has {year_days} days",
        day_of_year + 1
    )]
    DayOutOfYear {
        /// Year number.
        year: i64,
        /// Day of year given, from 0.
        day_of_year: u64,
        /// Days in that year.
        year_days: u32,
    },
    /// A day past the month's end (or day 0).
    #[error(
        "{month} {day_of_month} of year {year} does not exist: the month has {month_days} days"
    )]
    DayOutOfMonth {
        /// Year number.
        year: i64,
        /// Month name.
        month: String,
        /// Day of month given, from 1.
        day_of_month: u64,
        /// Days in that month that year.
        month_days: u32,
    },
    /// A month the calendar does not have.
    #[error("no month `{month}` (months: {known})")]
    NoSuchMonth {
        /// The month given (name or number from 1).
        month: String,
        /// The calendar's months.
        known: String,
    },
    /// A month the calendar has, but not in this year (an intercalary month, or month 13, in a
    /// common year).
    #[error("month {month} is not in year {year}: that year has {year_months} months")]
    MonthOutOfYear {
        /// Year number.
        year: i64,
        /// The month given (name or number from 1).
        month: String,
        /// Months in that year.
        year_months: usize,
    },
    /// An hour outside the day.
    #[error("hour {hour_of_day} is outside the day: allowed 0 up to {day_hours} h")]
    HourOutOfDay {
        /// Hours given.
        hour_of_day: f64,
        /// Length of the world's day, hours.
        day_hours: f64,
    },
    /// A year too far from the calendar's first year.
    #[error("year {year} is more than 10⁹ years from the first year {first_year}")]
    YearOutOfRange {
        /// Year given.
        year: i64,
        /// The calendar's first year.
        first_year: i64,
    },
    /// Date text that does not follow the syntax.
    #[error(
        "cannot read date `{text}`: {reason} (write YEAR-DAY, day of year from 1, or YEAR/MONTH/DAY with a month name or number, each optionally followed by THH:MM or THH:MM:SS)"
    )]
    BadDateText {
        /// The text given.
        text: String,
        /// What is wrong.
        reason: String,
    },
}

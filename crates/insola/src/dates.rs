//! Dates of a world: its instants read on its calendar and back, as methods on
//! [`Planet`]. The calendar's own arithmetic (whole days, leap rules, months, weeks) is in
//! [`crate::calendar`], which knows nothing of planets; this module ties it to the world's day
//! and year.

use crate::calendar::{
    Calendar, CalendarDate, CalendarError, DateText, DayInYear, MAX_YEARS_FROM_FIRST,
};
use crate::planet::Planet;

/// Largest world time a calendar reading may have, seconds (about ±3·10¹⁶ s).
const MAX_ABS_TIME_S: f64 = 3.0e16;

impl Planet {
    /// The calendar of this world, with every default filled in.
    pub fn calendar(&self) -> &Calendar {
        self.calendar_ref()
    }

    /// Calendar day number (local solar day at the prime meridian, day 0 contains time zero)
    /// of world time `t_s`. Non-finite times read as day 0.
    pub fn calendar_day_number(&self, t_s: f64) -> i64 {
        let t = clamp_time(t_s);
        let mut day = self.local_day_count(t, 0.0).floor() as i64;
        // The float count can land a hair to either side of a midnight; the day's own start
        // decides.
        if self.calendar_day_start_s(day) > t {
            day -= 1;
        } else if self.calendar_day_start_s(day + 1) <= t {
            day += 1;
        }
        day
    }

    /// World time of the local mean midnight at the prime meridian that starts calendar day
    /// number `day`, seconds.
    pub fn calendar_day_start_s(&self, day: i64) -> f64 {
        self.local_day_start_s(day as f64, 0.0)
    }

    /// World time at which calendar year `year` begins (its first midnight), seconds.
    pub fn year_start_s(&self, year: i64) -> f64 {
        self.calendar_day_start_s(self.calendar().year_start_day(year))
    }

    /// Days in calendar year `year`.
    pub fn year_days(&self, year: i64) -> u32 {
        self.calendar().year_days(year)
    }

    /// The first calendar year starting after `t_s`, and its start time in seconds.
    pub fn next_year_start_after(&self, t_s: f64) -> (i64, f64) {
        let year = self.date_at(t_s).year.saturating_add(1);
        (year, self.year_start_s(year))
    }

    /// Reads world time `t_s` on the world's calendar. Non-finite times read as time zero and
    /// times beyond ±3·10¹⁶ s as that limit; see [`Planet::try_date_at`] for an error instead.
    pub fn date_at(&self, t_s: f64) -> CalendarDate {
        let t = clamp_time(t_s);
        let cal = self.calendar();
        let day = self.calendar_day_number(t);
        let day_s = self.day_s();
        let hour_of_day = ((t - self.calendar_day_start_s(day)) / 3600.0)
            .clamp(0.0, (day_s / 3600.0) * (1.0 - f64::EPSILON));
        let (year, day_of_year) = cal.year_and_day_of_year(day);
        let year_days = cal.year_days(year);
        let month = cal.month_and_day(year, day_of_year);
        let weekday = cal.weekday(day);
        let year_fraction = (t - self.year_start_s(year)) / (f64::from(year_days) * day_s);
        CalendarDate {
            year,
            day_of_year: u64::from(day_of_year),
            month: month.map(|(m, _)| m),
            month_name: month.and_then(|(m, _)| cal.month_name(year, m)),
            day_of_month: u64::from(month.map_or(day_of_year + 1, |(_, d)| d)),
            hour_of_day,
            year_fraction: year_fraction.clamp(0.0, 1.0 - f64::EPSILON),
            day_number: day,
            weekday,
            weekday_name: weekday.and_then(|w| cal.weekday_name(w).map(str::to_string)),
            year_days,
            leap_year: cal.is_leap_year(year),
        }
    }

    /// Reads world time `t_s` on the calendar, or says why it cannot (not finite, or beyond
    /// ±3·10¹⁶ s).
    pub fn try_date_at(&self, t_s: f64) -> Result<CalendarDate, CalendarError> {
        if !t_s.is_finite() || t_s.abs() > MAX_ABS_TIME_S {
            return Err(CalendarError::NotFinite {
                what: "t_s",
                value: t_s,
            });
        }
        Ok(self.date_at(t_s))
    }

    /// World time of a calendar reading: day `day_of_year` (from 0) of `year`, `hour_of_day`
    /// hours after its midnight (`[0, day length)`), seconds.
    pub fn time_of_date(
        &self,
        year: i64,
        day_of_year: u64,
        hour_of_day: f64,
    ) -> Result<f64, CalendarError> {
        self.check_year(year)?;
        let year_days = self.year_days(year);
        if day_of_year >= u64::from(year_days) {
            return Err(CalendarError::DayOutOfYear {
                year,
                day_of_year,
                year_days,
            });
        }
        let start_day = self.calendar().year_start_day(year) + day_of_year as i64;
        Ok(self.calendar_day_start_s(start_day) + self.check_hour(hour_of_day)? * 3600.0)
    }

    /// World time of day `day_of_month` (from 1) of month `month` (index from 0) of `year`,
    /// `hour_of_day` hours after midnight, seconds.
    pub fn time_of_month_date(
        &self,
        year: i64,
        month: usize,
        day_of_month: u64,
        hour_of_day: f64,
    ) -> Result<f64, CalendarError> {
        self.check_year(year)?;
        let cal = self.calendar();
        let lengths = cal.month_lengths(year);
        let Some(&month_days) = lengths.get(month) else {
            if month < cal.most_months() {
                return Err(CalendarError::MonthOutOfYear {
                    year,
                    month: (month + 1).to_string(),
                    year_months: lengths.len(),
                });
            }
            return Err(CalendarError::NoSuchMonth {
                month: (month + 1).to_string(),
                known: month_list(cal),
            });
        };
        let day = u32::try_from(day_of_month).unwrap_or(u32::MAX);
        match cal.day_of_year_of(year, month, day) {
            Some(d) => self.time_of_date(year, u64::from(d), hour_of_day),
            None => Err(CalendarError::DayOutOfMonth {
                year,
                month: cal
                    .month_name(year, month)
                    .unwrap_or_else(|| format!("month {}", month + 1)),
                day_of_month,
                month_days,
            }),
        }
    }

    /// World time of a date written as text (see [`DateText`]), seconds.
    pub fn time_of_date_text(&self, text: &str) -> Result<f64, CalendarError> {
        let d = DateText::parse(text)?;
        match d.day {
            DayInYear::OfYear(n) => self.time_of_date(d.year, n - 1, d.hour_of_day),
            DayInYear::InMonth { month, day } => {
                let cal = self.calendar();
                self.check_year(d.year)?;
                let index = match month.parse::<usize>() {
                    Ok(n) if n >= 1 => Some(n - 1),
                    _ => cal.month_index_in(d.year, &month),
                };
                match index {
                    Some(i) => self.time_of_month_date(d.year, i, day, d.hour_of_day),
                    None if cal.has_month_named(&month) => Err(CalendarError::MonthOutOfYear {
                        year: d.year,
                        month,
                        year_months: cal.month_lengths(d.year).len(),
                    }),
                    None => Err(CalendarError::NoSuchMonth {
                        month,
                        known: month_list(cal),
                    }),
                }
            }
        }
    }

    fn check_year(&self, year: i64) -> Result<(), CalendarError> {
        let first = self.calendar().first_year;
        if (i128::from(year) - i128::from(first)).abs() > i128::from(MAX_YEARS_FROM_FIRST) {
            return Err(CalendarError::YearOutOfRange {
                year,
                first_year: first,
            });
        }
        Ok(())
    }

    fn check_hour(&self, hour_of_day: f64) -> Result<f64, CalendarError> {
        let day_hours = self.day_s() / 3600.0;
        if hour_of_day.is_finite() && hour_of_day >= 0.0 && hour_of_day < day_hours {
            Ok(hour_of_day)
        } else {
            Err(CalendarError::HourOutOfDay {
                hour_of_day,
                day_hours,
            })
        }
    }
}

fn clamp_time(t_s: f64) -> f64 {
    if t_s.is_finite() {
        t_s.clamp(-MAX_ABS_TIME_S, MAX_ABS_TIME_S)
    } else {
        0.0
    }
}

fn month_list(cal: &Calendar) -> String {
    if let Some(m) = &cal.moon_months {
        return if m.month_names.is_empty() {
            format!(
                "numbered 1 to {}",
                m.year_months + u32::from(m.intercalary.is_some())
            )
        } else {
            m.month_names.join(", ")
        };
    }
    if cal.months.is_empty() {
        "none: this calendar has no months".into()
    } else {
        cal.months
            .iter()
            .map(|m| m.name.as_str())
            .collect::<Vec<_>>()
            .join(", ")
    }
}

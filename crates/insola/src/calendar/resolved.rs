//! [`Calendar`]: the world file's calendar section with every default filled in, and the
//! whole-day arithmetic of years, months and weeks.

use serde::{Deserialize, Serialize};

use crate::leap_rules::whole_days;
use crate::world::{CalendarSpec, LeapRule, MonthSpec, MoonMonthsSpec, WeekSpec};

/// A world's calendar, ready to count: years of `common_year_days` or one more day by the leap
/// rule, months and weeks. Day numbers count local solar days at the prime meridian; day 0
/// contains time zero and is the first day of `first_year`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Calendar {
    /// Number of the year whose first day is day 0.
    pub first_year: i64,
    /// Days of a common year.
    pub common_year_days: u32,
    /// Which years have one day more.
    pub leap: LeapRule,
    /// Index of the month that takes the leap day (the last month when not named).
    pub leap_month: Option<usize>,
    /// Months in order (empty: no months).
    pub months: Vec<MonthSpec>,
    /// The week, if any.
    pub week: Option<WeekSpec>,
    /// `true` when `year_days` or `leap` came from the world file, `false` when the calendar
    /// took the designer's best rule.
    pub rule_from_file: bool,
    /// Months that follow a moon, when the calendar counts its years in them. Then
    /// `common_year_days` is the shortest year's days, `leap` the rule of years with a month
    /// more ([`LeapRule::NONE`] for a lunar calendar) and `months` is empty; the methods below
    /// follow the moon's months.
    pub moon_months: Option<MoonMonthsSpec>,
}

impl Calendar {
    /// Fills in the defaults of `spec` (none: an empty section) for a world whose tropical
    /// year lasts `tropical_year_days` local solar days. See [`CalendarSpec`] for the rules.
    pub fn new(spec: Option<&CalendarSpec>, tropical_year_days: f64) -> Calendar {
        let default_spec = CalendarSpec::default();
        let spec = spec.unwrap_or(&default_spec);
        if let Some(moon) = &spec.moon_months {
            return Calendar::of_moon_months(spec, moon);
        }
        let (common_year_days, leap) = match (spec.year_days, &spec.leap) {
            (Some(n), Some(rule)) => (n, rule.clone()),
            (Some(n), None) => (n, LeapRule::NONE),
            (None, Some(rule)) => (whole_days(tropical_year_days), rule.clone()),
            (None, None) => crate::leap_rules::best_solar_rule(tropical_year_days),
        };
        let leap_month = if spec.months.is_empty() {
            None
        } else {
            Some(
                spec.leap_month
                    .as_ref()
                    .and_then(|name| spec.months.iter().position(|m| &m.name == name))
                    .unwrap_or(spec.months.len() - 1),
            )
        };
        Calendar {
            first_year: spec.first_year,
            common_year_days,
            leap,
            leap_month,
            months: spec.months.clone(),
            week: spec.week.clone(),
            rule_from_file: spec.year_days.is_some() || spec.leap.is_some(),
            moon_months: None,
        }
    }

    fn of_moon_months(spec: &CalendarSpec, moon: &MoonMonthsSpec) -> Calendar {
        let n = i128::from(moon.year_months);
        let fewest = n * i128::from(moon.short_month_days)
            + n * i128::from(moon.long_months) / i128::from(moon.cycle_months.max(1));
        Calendar {
            first_year: spec.first_year,
            common_year_days: u32::try_from(fewest).unwrap_or(u32::MAX),
            leap: moon.intercalary_rule(),
            leap_month: None,
            months: Vec::new(),
            week: spec.week.clone(),
            rule_from_file: true,
            moon_months: Some(moon.clone()),
        }
    }

    /// The calendar's year rule in words: `8 leap years in 33` for a solar calendar, the
    /// moon months' scheme otherwise (see [`MoonMonthsSpec::describe`]).
    pub fn describe(&self) -> String {
        match &self.moon_months {
            Some(m) => m.describe(),
            None => self.leap.describe(),
        }
    }

    /// Most months a year of this calendar has (0 without months).
    pub fn most_months(&self) -> usize {
        match &self.moon_months {
            Some(m) => m.year_months as usize + usize::from(m.intercalary.is_some()),
            None => self.months.len(),
        }
    }

    /// Mean calendar year in days: `common_year_days` plus the rule's mean leap fraction.
    pub fn mean_year_days(&self) -> f64 {
        if let Some(m) = &self.moon_months {
            return m.mean_year_days();
        }
        f64::from(self.common_year_days) + self.leap.mean_leap_fraction()
    }

    fn index_of(&self, year: i64) -> i64 {
        year.saturating_sub(self.first_year)
    }

    /// Day number of the first day of `year` (exact; saturates far outside ±10¹⁵ days).
    pub fn year_start_day(&self, year: i64) -> i64 {
        let k = self.index_of(year);
        if let Some(m) = &self.moon_months {
            return clamp_day(m.year_start_day(k));
        }
        let days = i128::from(k) * i128::from(self.common_year_days) + self.leap.leaps_before(k);
        clamp_day(days)
    }

    /// `true` if `year` has a leap day.
    pub fn is_leap_year(&self, year: i64) -> bool {
        if let Some(m) = &self.moon_months {
            return m.is_leap_year(self.index_of(year));
        }
        self.leap.is_leap(self.index_of(year))
    }

    /// Days in `year`.
    pub fn year_days(&self, year: i64) -> u32 {
        if let Some(m) = &self.moon_months {
            let k = self.index_of(year);
            return u32::try_from(m.year_start_day(k.saturating_add(1)) - m.year_start_day(k))
                .unwrap_or(u32::MAX);
        }
        self.common_year_days + u32::from(self.is_leap_year(year))
    }

    /// The year holding day number `day` and the day within it (from 0).
    pub fn year_and_day_of_year(&self, day: i64) -> (i64, u32) {
        if let Some(m) = &self.moon_months {
            let (k, doy) = m.year_and_day_of_year(i128::from(day));
            return (self.first_year.saturating_add(k), doy);
        }
        let mean = self.mean_year_days();
        // Estimate, then step: the estimate is off by at most a year or two.
        let estimate = (day as f64 / mean).floor();
        let mut k = estimate.clamp(-1.0e17, 1.0e17) as i64;
        let start =
            |k: i64| i128::from(k) * i128::from(self.common_year_days) + self.leap.leaps_before(k);
        let d = i128::from(day);
        while start(k) > d {
            k -= 1;
        }
        while start(k + 1) <= d {
            k += 1;
        }
        (self.first_year.saturating_add(k), (d - start(k)) as u32)
    }

    /// Month lengths of `year`: the months' own lengths, the leap day added to the leap
    /// month, then fitted to the year (the last month takes what is left; months past the
    /// year's end are cut short or dropped).
    pub fn month_lengths(&self, year: i64) -> Vec<u32> {
        if let Some(m) = &self.moon_months {
            return m.month_lengths_of_year(self.index_of(year));
        }
        let mut lengths: Vec<u32> = self.months.iter().map(|m| m.days).collect();
        if lengths.is_empty() {
            return lengths;
        }
        if self.is_leap_year(year)
            && let Some(i) = self.leap_month
        {
            lengths[i] += 1;
        }
        let mut left = self.year_days(year);
        let last = lengths.len() - 1;
        for (i, len) in lengths.iter_mut().enumerate() {
            *len = if i == last { left } else { (*len).min(left) };
            left -= *len;
        }
        lengths
    }

    /// Month index and day of month (from 1) of `day_of_year` in `year`; `None` without
    /// months.
    pub fn month_and_day(&self, year: i64, day_of_year: u32) -> Option<(usize, u32)> {
        let mut start = 0u32;
        for (i, len) in self.month_lengths(year).into_iter().enumerate() {
            if day_of_year < start + len {
                return Some((i, day_of_year - start + 1));
            }
            start += len;
        }
        None
    }

    /// Day of year (from 0) of day `day_of_month` (from 1) of month `month` in `year`;
    /// `None` if the month or the day is not in that year.
    pub fn day_of_year_of(&self, year: i64, month: usize, day_of_month: u32) -> Option<u32> {
        let lengths = self.month_lengths(year);
        let len = *lengths.get(month)?;
        (day_of_month >= 1 && day_of_month <= len)
            .then(|| lengths[..month].iter().sum::<u32>() + day_of_month - 1)
    }

    /// Weekday (from 0) of day number `day`, if the calendar has weeks.
    pub fn weekday(&self, day: i64) -> Option<u32> {
        // Counted from the first day of the first year (day 0 unless months of a moon start
        // the year elsewhere).
        let first = self
            .moon_months
            .as_ref()
            .map_or(0, |m| i128::from(m.first_month_day));
        self.week.as_ref().map(|w| {
            (i128::from(day) - first + i128::from(w.first_weekday)).rem_euclid(i128::from(w.days))
                as u32
        })
    }

    /// Name of weekday `weekday`, if the week names its days.
    pub fn weekday_name(&self, weekday: u32) -> Option<&str> {
        self.week
            .as_ref()
            .and_then(|w| w.names.get(weekday as usize))
            .map(String::as_str)
    }

    /// Name of month `month` (from 0) of `year`; `None` for numbered months or past the
    /// year's months.
    pub fn month_name(&self, year: i64, month: usize) -> Option<String> {
        match &self.moon_months {
            Some(m) => m.month_name(self.index_of(year), month),
            None => self.months.get(month).map(|m| m.name.clone()),
        }
    }

    /// Index of the month called `name` (ignoring case) in `year`, if that year has it.
    pub fn month_index_in(&self, year: i64, name: &str) -> Option<usize> {
        match &self.moon_months {
            Some(m) => m.month_index_in_year(self.index_of(year), name),
            None => self.month_index(name),
        }
    }

    /// `true` if some year of the calendar has a month called `name` (ignoring case).
    pub fn has_month_named(&self, name: &str) -> bool {
        match &self.moon_months {
            Some(m) => m.has_month_named(name),
            None => self.month_index(name).is_some(),
        }
    }

    /// Index of the month called `name` (ignoring case) among the solar months, if any.
    pub fn month_index(&self, name: &str) -> Option<usize> {
        self.months
            .iter()
            .position(|m| m.name.eq_ignore_ascii_case(name))
    }

    /// `Some(sum)` when the months' common-year lengths do not add up to the common year.
    pub fn months_mismatch(&self) -> Option<u32> {
        let sum: u32 = self.months.iter().map(|m| m.days).sum();
        (!self.months.is_empty() && sum != self.common_year_days).then_some(sum)
    }
}

/// A day number as `i64`, saturating far outside ±9·10¹⁸ days.
fn clamp_day(days: i128) -> i64 {
    days.clamp(i128::from(i64::MIN), i128::from(i64::MAX)) as i64
}

//! Calendars: world time to year, day of year, month and clock time, and back.
//!
//! A world year is one orbital period; it rarely holds a whole number of solar days. The
//! calendar here counts years from time zero (`first_year` is the number of the year that
//! starts at time zero), days within the year from the year's start, and the time of day from
//! local mean midnight at the prime meridian. Months, if named, split the days of the year; the
//! last month absorbs the fractional remainder, so no leap rules are needed.

use serde::{Deserialize, Serialize};

use crate::planet::Planet;
pub use crate::world::{CalendarSpec, MonthSpec};

/// A world instant read on the calendar.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CalendarDate {
    /// Year number (the year starting at time zero is `first_year`).
    pub year: i64,
    /// Solar day within the year, starting at 0.
    pub day_of_year: u64,
    /// Month index into the calendar's months, if it has any.
    pub month: Option<usize>,
    /// Month name, if the calendar has months.
    pub month_name: Option<String>,
    /// Day within the month, starting at 1 (equals `day_of_year + 1` without months).
    pub day_of_month: u64,
    /// Hours since local mean midnight at the prime meridian, `[0, day length in hours)`.
    pub hour_of_day: f64,
    /// Fraction of the year elapsed since the year's start, `[0, 1)`.
    pub year_fraction: f64,
}

impl CalendarDate {
    /// Clock time as `HH:MM` in hours of the world's day (which may have more than 24).
    pub fn clock(&self) -> String {
        let total_min = (self.hour_of_day * 60.0).floor() as i64;
        format!("{:02}:{:02}", total_min / 60, total_min % 60)
    }
}

impl Planet {
    /// The calendar of this world (the world file's, or a plain year/day count).
    pub fn calendar(&self) -> CalendarSpec {
        self.spec().calendar.clone().unwrap_or_default()
    }

    /// Reads world time `t_s` on the world's calendar.
    pub fn date_at(&self, t_s: f64) -> CalendarDate {
        let cal = self.calendar();
        let year_s = self.year_s();
        let years = (t_s / year_s).floor();
        let into_year = t_s - years * year_s;
        let day_s = self.day_s();
        // Days are counted from the year's start; the clock from mean midnight at the prime
        // meridian, so the clock and the day number change together once per solar day.
        let day_count_now = self.local_day_count(t_s, 0.0);
        let day_count_year_start = self.local_day_count(t_s - into_year, 0.0);
        let day_of_year = (day_count_now.floor() - day_count_year_start.floor()).max(0.0) as u64;
        let hour_of_day = day_count_now.rem_euclid(1.0) * day_s / 3600.0;
        let (month, month_name, day_of_month) = locate_month(&cal, day_of_year);
        CalendarDate {
            year: cal.first_year.saturating_add(years as i64),
            day_of_year,
            month,
            month_name,
            day_of_month,
            hour_of_day,
            year_fraction: (into_year / year_s).clamp(0.0, 1.0 - f64::EPSILON),
        }
    }

    /// World time of a calendar reading: the start of `year`, plus `day_of_year` whole days
    /// (to the local midnight), plus `hour_of_day` hours.
    pub fn time_of_date(&self, year: i64, day_of_year: u64, hour_of_day: f64) -> f64 {
        let cal = self.calendar();
        let year_start = (year - cal.first_year) as f64 * self.year_s();
        let first_day = self.local_day_count(year_start, 0.0).floor();
        self.local_day_start_s(first_day + day_of_year as f64, 0.0) + hour_of_day * 3600.0
    }
}

fn locate_month(cal: &CalendarSpec, day_of_year: u64) -> (Option<usize>, Option<String>, u64) {
    if cal.months.is_empty() {
        return (None, None, day_of_year + 1);
    }
    let mut start = 0u64;
    for (i, m) in cal.months.iter().enumerate() {
        let end = start + u64::from(m.days);
        if day_of_year < end || i + 1 == cal.months.len() {
            return (Some(i), Some(m.name.clone()), day_of_year - start + 1);
        }
        start = end;
    }
    (None, None, day_of_year + 1)
}

#[cfg(test)]
mod tests {
    use crate::{Planet, WorldSpec};

    fn planet() -> Planet {
        let text = r#"(name: "Cal", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
            orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 10.5),
            spin: (obliquity_deg: 10, solar_day_hours: 30),
            calendar: (first_year: 100, months: [(name: "Frostwane", days: 4), (name: "Greening", days: 4)]))"#;
        Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
    }

    #[test]
    fn dates_round_trip() {
        let p = planet();
        let d = p.date_at(0.0);
        assert_eq!(
            (d.year, d.day_of_year, d.month_name.as_deref()),
            (100, 0, Some("Frostwane"))
        );
        assert!(d.hour_of_day.abs() < 1e-9);
        let t = p.time_of_date(102, 5, 7.5);
        let d = p.date_at(t);
        assert_eq!(
            (d.year, d.day_of_year, d.month, d.day_of_month),
            (102, 5, Some(1), 2)
        );
        assert!((d.hour_of_day - 7.5).abs() < 1e-6, "{}", d.hour_of_day);
        assert_eq!(d.clock(), "07:30");
    }

    #[test]
    fn bad_month_is_named() {
        let text = r#"(name: "Cal", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
            orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 10.5),
            spin: (obliquity_deg: 10, solar_day_hours: 30),
            calendar: (months: [(name: "A", days: 0)]))"#;
        let err = WorldSpec::from_ron_str(text).unwrap_err();
        assert_eq!(err.field(), Some("calendar.months[0].days"));
    }
}

//! Years made of whole months that follow a moon: `year_months` months a year, plus one in the
//! years of the intercalary rule (a lunisolar calendar) or never (a lunar calendar). Exact
//! integer arithmetic on month and day numbers.

use crate::world::{LeapRule, MoonMonthsSpec};

impl MoonMonthsSpec {
    /// The rule of years with one month more (no such years in a lunar calendar).
    /// (A rule that would divide by zero, possible only without validation, counts as none.)
    pub fn intercalary_rule(&self) -> LeapRule {
        match &self.intercalary {
            Some(r) if r.cycle_years > 0 && !r.exceptions.contains(&0) => r.clone(),
            _ => LeapRule::NONE,
        }
    }

    /// Months of a common year, at least 1.
    fn common_months(&self) -> i128 {
        i128::from(self.year_months.max(1))
    }

    /// Month number (see [`MoonMonthsSpec::month_start_day`]) of the first month of year
    /// index `k` (0 for the first year): `k·year_months` plus the intercalary months before.
    pub fn first_month_of_year(&self, k: i64) -> i128 {
        i128::from(k) * self.common_months() + self.intercalary_rule().leaps_before(k)
    }

    /// Months in year index `k`.
    pub fn months_in_year(&self, k: i64) -> u32 {
        (self.first_month_of_year(k.saturating_add(1)) - self.first_month_of_year(k)) as u32
    }

    /// Day number of the first day of year index `k`.
    pub fn year_start_day(&self, k: i64) -> i128 {
        self.month_start_day(self.first_month_of_year(k))
    }

    /// Mean months per year.
    pub fn mean_year_months(&self) -> f64 {
        f64::from(self.year_months.max(1)) + self.intercalary_rule().mean_leap_fraction()
    }

    /// Mean year, days.
    pub fn mean_year_days(&self) -> f64 {
        self.mean_year_months() * self.mean_month_days()
    }

    /// Year index holding month number `m`.
    pub fn year_of_month(&self, m: i128) -> i64 {
        // Estimate from the mean, then step: the estimate is off by a year or two at most.
        let estimate = (m as f64 / self.mean_year_months()).floor();
        let mut k = estimate.clamp(-1.0e17, 1.0e17) as i64;
        while self.first_month_of_year(k) > m {
            k -= 1;
        }
        while self.first_month_of_year(k + 1) <= m {
            k += 1;
        }
        k
    }

    /// Year index holding day number `day`, and the day within it (from 0).
    pub fn year_and_day_of_year(&self, day: i128) -> (i64, u32) {
        let k = self.year_of_month(self.month_of_day(day));
        (k, (day - self.year_start_day(k)) as u32)
    }

    /// `true` when year index `k` is a leap year: it holds an intercalary month, or (in a
    /// lunar calendar) more long months than the fewest a year can hold.
    pub fn is_leap_year(&self, k: i64) -> bool {
        if self.intercalary.is_some() {
            return self.months_in_year(k) > self.year_months;
        }
        let fewest = i128::from(self.year_months) * i128::from(self.short_month_days)
            + i128::from(self.year_months) * i128::from(self.long_months)
                / i128::from(self.cycle_months.max(1));
        self.year_start_day(k + 1) - self.year_start_day(k) > fewest
    }

    /// Lengths of the months of year index `k`, days.
    pub fn month_lengths_of_year(&self, k: i64) -> Vec<u32> {
        let first = self.first_month_of_year(k);
        (0..i128::from(self.months_in_year(k)))
            .map(|i| self.month_days(first + i))
            .collect()
    }

    /// Name of month `i` (from 0) of year index `k`: from `month_names`, with the intercalary
    /// month after `intercalary_after` in a year of one month more; `None` for numbered months.
    pub fn month_name(&self, k: i64, i: usize) -> Option<String> {
        if self.month_names.is_empty() {
            return None;
        }
        let after = self.intercalary_after_index();
        if self.months_in_year(k) <= self.year_months || i <= after {
            return self.month_names.get(i).cloned();
        }
        if i == after + 1 {
            return Some(self.intercalary_month.clone().unwrap_or_else(|| {
                format!("{} II", self.month_names.get(after).map_or("", |s| s))
            }));
        }
        self.month_names.get(i - 1).cloned()
    }

    /// Index of the month called `name` (ignoring case) in year index `k`, if that year has it.
    pub fn month_index_in_year(&self, k: i64, name: &str) -> Option<usize> {
        (0..self.months_in_year(k) as usize).find(|&i| {
            self.month_name(k, i)
                .is_some_and(|n| n.eq_ignore_ascii_case(name.trim()))
        })
    }

    /// `true` if some year has a month called `name` (the intercalary month included).
    pub fn has_month_named(&self, name: &str) -> bool {
        let name = name.trim();
        self.month_names
            .iter()
            .any(|m| m.eq_ignore_ascii_case(name))
            || (self.intercalary.is_some()
                && !self.month_names.is_empty()
                && self.intercalary_name().eq_ignore_ascii_case(name))
    }

    fn intercalary_name(&self) -> String {
        self.intercalary_month.clone().unwrap_or_else(|| {
            let after = self.intercalary_after_index();
            format!("{} II", self.month_names.get(after).map_or("", |s| s))
        })
    }

    /// The scheme in words, e.g. `lunisolar: months of 29 and 30 days (26 long in 49) after
    /// Ossel, 12 months a year, 7 years in 19 with a 13th`.
    pub fn describe(&self) -> String {
        let months = format!(
            "months of {} and {} days ({} long in {}) after {}",
            self.short_month_days,
            self.short_month_days + 1,
            self.long_months,
            self.cycle_months,
            self.moon
        );
        match &self.intercalary {
            None => format!("lunar: {months}, {} months a year", self.year_months),
            Some(rule) => {
                let years = if rule.exceptions.is_empty() {
                    format!("{} years in {}", rule.leap_years, rule.cycle_years)
                } else {
                    format!("{} (leap years)", rule.describe())
                };
                format!(
                    "lunisolar: {months}, {} months a year, {years} with a month more",
                    self.year_months
                )
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use crate::world::{LeapRule, MoonMonthsSpec};

    fn metonic() -> MoonMonthsSpec {
        MoonMonthsSpec {
            moon: "Test".into(),
            short_month_days: 29,
            long_months: 125,
            cycle_months: 235,
            first_month_day: 0,
            year_months: 12,
            intercalary: Some(LeapRule {
                leap_years: 7,
                cycle_years: 19,
                exceptions: vec![],
            }),
            month_names: Vec::new(),
            intercalary_month: None,
            intercalary_after: None,
        }
    }

    #[test]
    fn metonic_cycle_holds_235_months_and_6940_days() {
        // The 19-year cycle of 235 months, 7 of its years with a 13th month, and its 125 full
        // months of 30 days and 110 hollow ones of 29, 6940 days in all (Meton's cycle as
        // Geminus gives it; Richards, *Mapping Time*, 1998, and Bickerman, *Chronology of the
        // Ancient World*, 1980; from memory).
        let s = metonic();
        assert_eq!(s.first_month_of_year(19), 235);
        assert_eq!((0..19).filter(|&k| s.months_in_year(k) == 13).count(), 7);
        let lengths: Vec<u32> = (0..19).flat_map(|k| s.month_lengths_of_year(k)).collect();
        assert_eq!(lengths.iter().filter(|&&d| d == 30).count(), 125);
        assert_eq!(lengths.iter().filter(|&&d| d == 29).count(), 110);
        assert_eq!(s.year_start_day(19) - s.year_start_day(0), 6940);
        assert_eq!(s.year_start_day(-19), -6940);
        // Its 6940 days exceed 235 synodic months of 29.530589 d (NASA Moon fact sheet; from
        // memory) by 0.31 d, why Callippus later dropped one day in four cycles (76 years of
        // 27 759 days; same sources).
        let excess = 235.0 * (s.mean_month_days() - 29.530589);
        assert!((excess - 0.31).abs() < 0.01, "{excess}");
    }

    #[test]
    fn tabular_lunar_years_have_354_or_355_days() {
        // The tabular lunar calendar's 30-year cycle: 360 months, years of 354 days and 11
        // leap years of 355 in each 30, 10 631 days (Reingold & Dershowitz, *Calendrical
        // Calculations*, 3rd ed. 2008, ch. 6; from memory). Its mean month 10631/360 =
        // 29.530556 d lies within 3 s of the synodic month 29.530589 d.
        let mut s = metonic();
        s.intercalary = None;
        s.long_months = 191;
        s.cycle_months = 360;
        let days: Vec<i128> = (0..30)
            .map(|k| s.year_start_day(k + 1) - s.year_start_day(k))
            .collect();
        assert!(days.iter().all(|&d| d == 354 || d == 355), "{days:?}");
        assert_eq!(days.iter().filter(|&&d| d == 355).count(), 11);
        assert_eq!((0..30).filter(|&k| s.is_leap_year(k)).count(), 11);
        assert_eq!(s.year_start_day(30), 10_631);
        assert!((s.mean_month_days() - 29.530589).abs() * 86_400.0 < 3.0);
        // Every 30 years repeat, backwards too.
        for k in -60..0 {
            assert_eq!(s.is_leap_year(k), s.is_leap_year(k + 90));
        }
    }

    #[test]
    fn years_and_days_invert() {
        let s = metonic();
        for day in -20_000i128..20_000 {
            let (k, doy) = s.year_and_day_of_year(day);
            assert_eq!(s.year_start_day(k) + i128::from(doy), day);
            let days = s.year_start_day(k + 1) - s.year_start_day(k);
            assert!(i128::from(doy) < days);
        }
    }

    #[test]
    fn intercalary_month_takes_its_place() {
        let mut s = metonic();
        s.month_names = (1..=12).map(|i| format!("M{i}x")).collect();
        s.intercalary_after = Some("M6x".into());
        let leap = (0..19).find(|&k| s.months_in_year(k) == 13).unwrap();
        let common = (0..19).find(|&k| s.months_in_year(k) == 12).unwrap();
        assert_eq!(s.month_name(leap, 6).as_deref(), Some("M6x II"));
        assert_eq!(s.month_name(leap, 7).as_deref(), Some("M7x"));
        assert_eq!(s.month_name(leap, 12).as_deref(), Some("M12x"));
        assert_eq!(s.month_name(common, 6).as_deref(), Some("M7x"));
        assert_eq!(s.month_index_in_year(leap, "m6x ii"), Some(6));
        assert_eq!(s.month_index_in_year(common, "M6x II"), None);
        assert!(s.has_month_named("M6x II"));
    }
}

//! Months that follow a moon: long and short months spread evenly over a cycle, counted in
//! whole days (exact integer arithmetic, negative month numbers included).

use super::leap::floor_div;
use crate::world::MoonMonthsSpec;

impl MoonMonthsSpec {
    /// Days of one cycle of `cycle_months` months.
    /// (At least 1, so that a section built without validation cannot divide by zero.)
    fn cycle_days(&self) -> i128 {
        (i128::from(self.short_month_days) * i128::from(self.cycle_months)
            + i128::from(self.long_months))
        .max(1)
    }

    /// Months per cycle, at least 1.
    fn cycle(&self) -> i128 {
        i128::from(self.cycle_months.max(1))
    }

    /// Day number on which month number `m` begins (month 0 is the first month of the first
    /// year; negative numbers count back): `first_month_day + ⌊m·P/C⌋` with `P` the days of
    /// a cycle of `C` months, which is `m·short + ⌊m·L/C⌋`.
    pub fn month_start_day(&self, m: i128) -> i128 {
        i128::from(self.first_month_day) + floor_div(m * self.cycle_days(), self.cycle())
    }

    /// Days of month number `m`: `short_month_days`, or one more for a long month.
    pub fn month_days(&self, m: i128) -> u32 {
        (self.month_start_day(m + 1) - self.month_start_day(m)) as u32
    }

    /// Month number holding day number `day`: the largest `m` with
    /// `⌊m·P/C⌋ ≤ x` (`x` days after the first month's start), which is
    /// `⌊((x + 1)·C − 1) / P⌋`.
    pub fn month_of_day(&self, day: i128) -> i128 {
        let x = day - i128::from(self.first_month_day);
        floor_div((x + 1) * self.cycle() - 1, self.cycle_days())
    }
}

#[cfg(test)]
mod tests {
    use crate::world::MoonMonthsSpec;

    pub(crate) fn months(short: u32, long: u32, cycle: u32, first: i64) -> MoonMonthsSpec {
        MoonMonthsSpec {
            moon: "Test".into(),
            short_month_days: short,
            long_months: long,
            cycle_months: cycle,
            first_month_day: first,
            year_months: 12,
            intercalary: None,
            month_names: Vec::new(),
            intercalary_month: None,
            intercalary_after: None,
        }
    }

    #[test]
    fn every_day_lies_in_the_month_that_holds_it() {
        for spec in [
            months(29, 1, 2, 0),
            months(29, 191, 360, -7),
            months(5, 0, 1, 3),
        ] {
            for day in -5000i128..5000 {
                let m = spec.month_of_day(day);
                assert!(spec.month_start_day(m) <= day, "{spec:?} {day}");
                assert!(spec.month_start_day(m + 1) > day, "{spec:?} {day}");
            }
        }
    }

    #[test]
    fn long_months_are_spread_evenly() {
        // 1 long month in 2: strict alternation of 29 and 30 days, a long month every
        // second month (the usual 29/30 alternation of lunar calendars; Richards, *Mapping
        // Time*, 1998; from memory).
        let spec = months(29, 1, 2, 0);
        let lengths: Vec<u32> = (-4..4).map(|m| spec.month_days(m)).collect();
        assert_eq!(lengths, [29, 30, 29, 30, 29, 30, 29, 30]);
        // 191 long months in 360: never two short months in a row and never three long.
        let spec = months(29, 191, 360, 0);
        let lengths: Vec<u32> = (0..720).map(|m| spec.month_days(m)).collect();
        assert_eq!(lengths[..360].iter().filter(|&&d| d == 30).count(), 191);
        for w in lengths.windows(2) {
            assert!(w != [29, 29], "{lengths:?}");
        }
        for w in lengths.windows(3) {
            assert!(w != [30, 30, 30], "{lengths:?}");
        }
    }
}

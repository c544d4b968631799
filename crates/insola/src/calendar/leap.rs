//! Leap-rule arithmetic in whole numbers: leap years before a year, and the mean year.

use crate::world::LeapRule;

/// `⌊a / b⌋` for `b > 0`, rounding toward −∞ (also for negative `a`).
pub(crate) fn floor_div(a: i128, b: i128) -> i128 {
    a.div_euclid(b)
}

impl LeapRule {
    /// Leap years among the years with index `0..k` (index 0 is the first year); negative `k`
    /// gives minus the leap years among `k..0`. Exact in whole numbers.
    pub fn leaps_before(&self, k: i64) -> i128 {
        let k = i128::from(k);
        let mut n = floor_div(
            k * i128::from(self.leap_years),
            i128::from(self.cycle_years),
        );
        for (i, &s) in self.exceptions.iter().enumerate() {
            let count = floor_div(k, i128::from(s));
            n += if i % 2 == 0 { -count } else { count };
        }
        n
    }

    /// `true` if year index `k` (0 for the first year) is a leap year.
    pub fn is_leap(&self, k: i64) -> bool {
        self.leaps_before(k.saturating_add(1)) - self.leaps_before(k) == 1
    }

    /// Mean number of leap days per year: `L/C − 1/s₁ + 1/s₂ − …`.
    pub fn mean_leap_fraction(&self) -> f64 {
        let mut f = f64::from(self.leap_years) / f64::from(self.cycle_years);
        for (i, &s) in self.exceptions.iter().enumerate() {
            let term = 1.0 / f64::from(s);
            f += if i % 2 == 0 { -term } else { term };
        }
        f
    }

    /// Years after which the pattern of leap years repeats: the last exception step, or the
    /// cycle.
    pub fn period_years(&self) -> u32 {
        self.exceptions.last().copied().unwrap_or(self.cycle_years)
    }

    /// Leap years in one full period ([`LeapRule::period_years`]).
    pub fn leaps_per_period(&self) -> i128 {
        self.leaps_before(i64::from(self.period_years()))
    }

    /// The rule in words, e.g. `8 leap years in 33` or
    /// `1 leap year in 4, except every 100th year, except every 400th (97 in 400)`.
    pub fn describe(&self) -> String {
        if self.leap_years == 0 {
            return "no leap years".into();
        }
        let plural = if self.leap_years == 1 { "" } else { "s" };
        let mut text = format!(
            "{} leap year{plural} in {}",
            self.leap_years, self.cycle_years
        );
        for (i, s) in self.exceptions.iter().enumerate() {
            text.push_str(if i % 2 == 0 {
                ", except every "
            } else {
                ", but again every "
            });
            text.push_str(&format!("{s}th year"));
        }
        if !self.exceptions.is_empty() {
            text.push_str(&format!(
                " ({} in {})",
                self.leaps_per_period(),
                self.period_years()
            ));
        }
        text
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rule(l: u32, c: u32, ex: &[u32]) -> LeapRule {
        LeapRule {
            leap_years: l,
            cycle_years: c,
            exceptions: ex.to_vec(),
        }
    }

    #[test]
    fn gregorian_style_rule_matches_the_divisibility_test() {
        // Gregorian rule (common knowledge, from memory): a year is a leap year if divisible by
        // 4, except centuries, except those divisible by 400. With first year 1, the count
        // `k + 1` is the year number.
        let r = rule(1, 4, &[100, 400]);
        for k in -2000i64..4000 {
            let y = k + 1;
            let expected = y % 4 == 0 && (y % 100 != 0 || y % 400 == 0);
            assert_eq!(r.is_leap(k), expected, "year {y}");
        }
        assert_eq!(r.leaps_per_period(), 97);
        assert!((r.mean_leap_fraction() - 0.2425).abs() < 1e-15);
    }

    #[test]
    fn cycles_spread_leap_years_evenly() {
        let r = rule(8, 33, &[]);
        let leaps: Vec<i64> = (0..33).filter(|&k| r.is_leap(k)).collect();
        assert_eq!(leaps.len(), 8);
        // Gaps of 4 or 5 years, never more, never fewer.
        for w in leaps.windows(2) {
            assert!((4..=5).contains(&(w[1] - w[0])), "{leaps:?}");
        }
        assert!(r.is_leap(32), "the cycle's last year is a leap year");
        // Negative indices continue the pattern backwards.
        for k in -100..0 {
            assert_eq!(r.is_leap(k), r.is_leap(k + 33 * 10));
        }
        assert_eq!(r.leaps_before(-33), -8);
    }
}

//! Leap rules for a solar calendar: the best approximations of the tropical year's fraction of
//! a day as leap cycles, and Gregorian-style rules with round-number exceptions.

use serde::{Deserialize, Serialize};

use super::fractions::{ApproximationKind, best_approximations};
use crate::world::LeapRule;

/// Longest leap cycle proposed, years.
pub const MAX_CYCLE_YEARS: u64 = 1000;

/// Cycles that drift more than this are not proposed (one day in 50 years), days per 1000 years.
const MAX_DRIFT_DAYS_PER_KY: f64 = 20.0;

/// A best rule drifts at most this much (one day in 2000 years), days per 1000 years.
pub const BEST_DRIFT_DAYS_PER_KY: f64 = 0.5;

/// Round-number rules are proposed when they drift at most this much, days per 1000 years.
const MAX_ROUND_DRIFT_DAYS_PER_KY: f64 = 1.0;

/// Round numbers a people might choose for exception steps (years).
const ROUND_STEPS: [u32; 16] = [
    10, 20, 25, 40, 50, 100, 200, 250, 400, 500, 1000, 2000, 2500, 4000, 5000, 10000,
];

/// Where a solar proposal comes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum SolarFamily {
    /// Leap years spread evenly over a cycle: a convergent of the year's fraction of a day.
    Convergent,
    /// The same from a semiconvergent.
    Semiconvergent,
    /// One leap year every few years with exceptions at round numbers of years.
    RoundExceptions,
}

/// How far a season mark's date moves over a span of years, in days of the year from 0
/// (fractional: 79.25 is a quarter past midnight starting day 80).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct DateWander {
    /// Earliest time of year, days since the year's first midnight.
    pub earliest_day_of_year: f64,
    /// Latest time of year, days since the year's first midnight.
    pub latest_day_of_year: f64,
    /// `latest − earliest`, days.
    pub wander_days: f64,
    /// Years looked at (one period of the leap rule, at most 20 000).
    pub over_years: u32,
}

/// One leap rule the designer proposes.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct SolarProposal {
    /// Days of a common year.
    pub year_days: u32,
    /// The leap rule.
    pub leap: LeapRule,
    /// Where it comes from.
    pub family: SolarFamily,
    /// Mean calendar year, days.
    pub mean_year_days: f64,
    /// Mean calendar year minus the tropical year, times 1000: days the calendar gains on the
    /// seasons per 1000 years (positive: the equinox comes earlier and earlier in the year).
    pub drift_days_per_1000_years: f64,
    /// Years until the seasons have moved one day (infinite for an exact rule).
    pub years_per_day_of_drift: f64,
    /// The northward equinox's time of year over one period of the rule, on this world's
    /// epoch (filled in by [`crate::Planet::design_calendar`]).
    pub northward_equinox: Option<DateWander>,
}

impl SolarProposal {
    fn new(tropical_year_days: f64, year_days: u32, leap: LeapRule, family: SolarFamily) -> Self {
        let mean_year_days = f64::from(year_days) + leap.mean_leap_fraction();
        let mut err = mean_year_days - tropical_year_days;
        // Rules that match the year to rounding are exact (the invented worlds' years are often
        // whole fractions of their days).
        if err.abs() < 1.0e-9 * tropical_year_days.max(1.0) {
            err = 0.0;
        }
        SolarProposal {
            year_days,
            leap,
            family,
            mean_year_days,
            drift_days_per_1000_years: 1000.0 * err,
            years_per_day_of_drift: if err == 0.0 {
                f64::INFINITY
            } else {
                1.0 / err.abs()
            },
            northward_equinox: None,
        }
    }
}

/// The leap rules for a tropical year of `tropical_year_days` local solar days: first the
/// leap cycles up to [`MAX_CYCLE_YEARS`] by rising cycle length (convergents and
/// semiconvergents of the fraction of a day), then up to three Gregorian-style rules with
/// round-number exceptions by rising drift. Empty for a year shorter than one day.
pub fn solar_proposals(tropical_year_days: f64) -> Vec<SolarProposal> {
    if !(tropical_year_days.is_finite() && tropical_year_days >= 1.0) {
        return Vec::new();
    }
    let whole = tropical_year_days.floor();
    let frac = tropical_year_days - whole;
    let whole = whole.min(1.0e7) as u32;
    let mut out: Vec<SolarProposal> = Vec::new();
    for a in best_approximations(frac, MAX_CYCLE_YEARS) {
        let family = match a.kind {
            ApproximationKind::Convergent => SolarFamily::Convergent,
            ApproximationKind::Semiconvergent => SolarFamily::Semiconvergent,
        };
        let (days, rule) = if a.numerator == 0 {
            (whole, LeapRule::NONE)
        } else if a.numerator >= a.denominator {
            (whole + 1, LeapRule::NONE)
        } else {
            (
                whole,
                LeapRule {
                    leap_years: a.numerator as u32,
                    cycle_years: a.denominator as u32,
                    exceptions: Vec::new(),
                },
            )
        };
        let p = SolarProposal::new(tropical_year_days, days, rule, family);
        let no_leaps_but_drifting =
            p.leap.leap_years == 0 && p.drift_days_per_1000_years.abs() > BEST_DRIFT_DAYS_PER_KY;
        if p.drift_days_per_1000_years.abs() <= MAX_DRIFT_DAYS_PER_KY && !no_leaps_but_drifting {
            out.push(p);
        }
    }
    if out.is_empty() {
        // A coarse year: offer the nearest whole-day rule anyway.
        if let Some(a) = best_approximations(frac, MAX_CYCLE_YEARS)
            .into_iter()
            .find(|a| a.numerator > 0 && a.numerator < a.denominator)
        {
            let rule = LeapRule {
                leap_years: a.numerator as u32,
                cycle_years: a.denominator as u32,
                exceptions: Vec::new(),
            };
            out.push(SolarProposal::new(
                tropical_year_days,
                whole,
                rule,
                SolarFamily::Convergent,
            ));
        }
    }
    out.extend(round_exception_rules(tropical_year_days, whole, frac));
    out
}

/// Gregorian-style rules: a leap year every `a` years (the whole number of years in which the
/// fraction adds up to at most one day), except every `b`th year, but again every `c`th, with
/// `b` and `c` round numbers. The three closest, when closer than the plain `1 in a` and
/// drifting at most one day in 1000 years (simpler ones first when two give the same mean).
fn round_exception_rules(tropical_year_days: f64, whole: u32, frac: f64) -> Vec<SolarProposal> {
    if !(frac > 1.0e-9 && frac < 0.5) {
        return Vec::new();
    }
    let a = (1.0 / frac).floor().min(1000.0) as u32;
    let base_err = (1.0 / f64::from(a) - frac).abs();
    if 1000.0 * base_err <= 0.05 {
        return Vec::new();
    }
    let mut rules: Vec<(f64, LeapRule)> = Vec::new();
    for &b in ROUND_STEPS.iter().filter(|&&b| b > a && b % a == 0) {
        let mut push = |exceptions: Vec<u32>| {
            let rule = LeapRule {
                leap_years: 1,
                cycle_years: a,
                exceptions,
            };
            let err = (rule.mean_leap_fraction() - frac).abs();
            let fraction = rule.mean_leap_fraction();
            let new = !rules
                .iter()
                .any(|(_, r)| (r.mean_leap_fraction() - fraction).abs() < 1e-12);
            if err < base_err && 1000.0 * err <= MAX_ROUND_DRIFT_DAYS_PER_KY && new {
                rules.push((err, rule));
            }
        };
        push(vec![b]);
        for &c in ROUND_STEPS.iter().filter(|&&c| c > b && c % b == 0) {
            push(vec![b, c]);
        }
    }
    rules.sort_by(|x, y| x.0.total_cmp(&y.0));
    rules
        .into_iter()
        .take(3)
        .map(|(_, rule)| {
            SolarProposal::new(
                tropical_year_days,
                whole,
                rule,
                SolarFamily::RoundExceptions,
            )
        })
        .collect()
}

/// Index of the best proposal: the shortest leap cycle whose drift is at most
/// [`BEST_DRIFT_DAYS_PER_KY`], else the cycle that drifts least. `None` for an empty list.
pub fn best_index(proposals: &[SolarProposal]) -> Option<usize> {
    let cycles = || {
        proposals
            .iter()
            .enumerate()
            .filter(|(_, p)| p.family != SolarFamily::RoundExceptions)
    };
    cycles()
        .find(|(_, p)| p.drift_days_per_1000_years.abs() <= BEST_DRIFT_DAYS_PER_KY)
        .or_else(|| {
            cycles().min_by(|a, b| {
                a.1.drift_days_per_1000_years
                    .abs()
                    .total_cmp(&b.1.drift_days_per_1000_years.abs())
            })
        })
        .map(|(i, _)| i)
}

/// The days of a common year and the leap rule the designer ranks best for a tropical year of
/// `tropical_year_days` local solar days (what a calendar section without a rule uses). A year
/// shorter than a day gets one-day years without leap days.
pub fn best_solar_rule(tropical_year_days: f64) -> (u32, LeapRule) {
    let proposals = solar_proposals(tropical_year_days);
    match best_index(&proposals) {
        Some(i) => (proposals[i].year_days, proposals[i].leap.clone()),
        None => (super::whole_days(tropical_year_days), LeapRule::NONE),
    }
}

/// The time of year (days since the year's first midnight) of an event that recurs every
/// `tropical_year_days`, first `first_offset_days` after the epoch, over `years` years of a
/// calendar of `year_days` and `rule`: the earliest and the latest.
pub fn offset_range(
    first_offset_days: f64,
    tropical_year_days: f64,
    year_days: u32,
    rule: &LeapRule,
    years: u32,
) -> (f64, f64) {
    let mut range = (f64::INFINITY, f64::NEG_INFINITY);
    for k in 0..i64::from(years.max(1)) {
        let start = k as f64 * f64::from(year_days) + rule.leaps_before(k) as f64;
        let offset = first_offset_days + k as f64 * tropical_year_days - start;
        range = (range.0.min(offset), range.1.max(offset));
    }
    range
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
    fn earth_year_gives_the_gregorian_and_the_33_year_rules() {
        // Earth's mean tropical year 365.24219 mean solar days (Explanatory Supplement to the
        // Astronomical Almanac, 1992, 365.2422 d; the figure of the issue; from memory).
        let list = solar_proposals(365.24219);
        let leaps: Vec<&LeapRule> = list.iter().map(|p| &p.leap).collect();
        // The 8-in-33 cycle (a convergent; used by the Persian solar calendar's arithmetic
        // variants — Richards, *Mapping Time*, 1998; from memory) among the first six.
        let i33 = leaps
            .iter()
            .position(|r| **r == rule(8, 33, &[]))
            .expect("8 in 33");
        assert!(i33 < 6, "{leaps:?}");
        // 97 in 400 by 4/100/400 (Gregorian rule), among the first three round-number rules.
        let first_round = list
            .iter()
            .position(|p| p.family == SolarFamily::RoundExceptions)
            .unwrap();
        let igreg = leaps
            .iter()
            .position(|r| **r == rule(1, 4, &[100, 400]))
            .expect("Gregorian rule");
        assert!(igreg < first_round + 3, "{leaps:?}");
        // Its drift: 365.2425 − 365.24219 = 0.00031 d a year, one day in about 3,200 years
        // (published as "one day in about 3,000 years" or 3,236 years against the 365.2422 d
        // year: Richards, *Mapping Time*, 1998; from memory).
        let greg = &list[igreg];
        assert!((greg.drift_days_per_1000_years - 0.31).abs() < 0.005);
        assert!((3000.0..3500.0).contains(&greg.years_per_day_of_drift));
        // The designer's best: the 33-year cycle (0.23 d per 1000 years).
        assert_eq!(best_solar_rule(365.24219), (365, rule(8, 33, &[])));
    }

    #[test]
    fn whole_and_coarse_years() {
        assert_eq!(best_solar_rule(400.0), (400, LeapRule::NONE));
        assert_eq!(best_solar_rule(0.3), (1, LeapRule::NONE));
        let (n, r) = best_solar_rule(14.4444);
        assert_eq!(n, 14);
        assert!(r.leap_years > 0);
        assert!(solar_proposals(f64::NAN).is_empty());
    }

    #[test]
    fn offset_range_of_an_exact_rule_is_flat_over_its_cycle() {
        // 365.25 with 1 in 4: the equinox returns to the same time every 4 years and wanders
        // by 0.75 day in between (common knowledge, Julian calendar).
        let (lo, hi) = offset_range(79.0, 365.25, 365, &rule(1, 4, &[]), 400);
        assert!(((hi - lo) - 0.75).abs() < 1e-9, "{lo} {hi}");
    }
}

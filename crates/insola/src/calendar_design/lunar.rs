//! Lunar and lunisolar schemes from a moon's synodic month: months of `n` and `n + 1` days in
//! a cycle that follows the phases, and cycles of `Y` years holding `M` months that keep the
//! months with the seasons.

use serde::{Deserialize, Serialize};

use crate::leap_rules::{ApproximationKind, best_approximations};

/// Longest month cycle proposed, months.
pub const MAX_CYCLE_MONTHS: u64 = 1000;

/// Longest lunisolar cycle proposed, years.
pub const MAX_CYCLE_YEARS: u64 = 500;

/// How many of each kind are proposed at most.
const MAX_PROPOSALS: usize = 6;

/// Months of two lengths alternating in a cycle, to follow the moon's phases.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LunarProposal {
    /// Days of a short month; long months have one more.
    pub short_month_days: u32,
    /// Long months per cycle.
    pub long_months: u64,
    /// Months per cycle.
    pub cycle_months: u64,
    /// Mean month, days.
    pub mean_month_days: f64,
    /// Days the months gain on the moon's phases per 1000 years (positive: the new moon comes
    /// earlier and earlier in the month).
    pub drift_days_per_1000_years: f64,
    /// Convergent or semiconvergent of the month's fraction of a day.
    pub kind: ApproximationKind,
}

/// A cycle of `years` years holding `months` months (some years with an intercalary month).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LunisolarProposal {
    /// Years per cycle.
    pub years: u64,
    /// Months per cycle.
    pub months: u64,
    /// Months of a common year.
    pub common_year_months: u64,
    /// Years of the cycle with one month more.
    pub leap_years: u64,
    /// Mean year of the cycle with months following the moon (`months × synodic month ÷
    /// years`), days.
    pub mean_year_days: f64,
    /// Days that year gains on the seasons per 1000 years (positive: the equinox comes earlier
    /// and earlier).
    pub drift_days_per_1000_years: f64,
    /// Convergent or semiconvergent of months per year.
    pub kind: ApproximationKind,
}

/// Lunar month cycles for a synodic month of `synodic_days` local days, in a world whose
/// tropical year is `tropical_year_days`; by rising cycle length: the first six, and more up
/// to the first drifting at most [`super::BEST_LUNAR_DRIFT_DAYS_PER_KY`]. Empty for months
/// under two days.
pub fn lunar_proposals(synodic_days: f64, tropical_year_days: f64) -> Vec<LunarProposal> {
    if !(synodic_days.is_finite() && synodic_days >= 2.0) {
        return Vec::new();
    }
    let short = synodic_days.floor();
    let frac = synodic_days - short;
    let months_per_ky = 1000.0 * tropical_year_days / synodic_days;
    let mut list = best_approximations(frac, MAX_CYCLE_MONTHS)
        .into_iter()
        .filter(|a| {
            (a.numerator > 0 || frac < 1.0e-9)
                && (a.numerator < a.denominator || frac > 1.0 - 1.0e-9)
        })
        .map(|a| {
            let mean = short + a.value();
            LunarProposal {
                short_month_days: short.min(1.0e7) as u32,
                long_months: a.numerator,
                cycle_months: a.denominator,
                mean_month_days: mean,
                drift_days_per_1000_years: (mean - synodic_days) * months_per_ky,
                kind: a.kind,
            }
        })
        .collect::<Vec<_>>();
    // The first few, and on to the first that keeps step with the phases if they do not.
    let good = list.iter().position(|p: &LunarProposal| {
        p.drift_days_per_1000_years.abs() <= super::BEST_LUNAR_DRIFT_DAYS_PER_KY
    });
    list.truncate(MAX_PROPOSALS.max(good.map_or(0, |i| i + 1)));
    list
}

/// Lunisolar cycles (years holding a whole number of months, some with one more), by rising
/// cycle length. Empty when a year holds fewer than two synodic months.
pub fn lunisolar_proposals(synodic_days: f64, tropical_year_days: f64) -> Vec<LunisolarProposal> {
    let ratio = tropical_year_days / synodic_days;
    if !(ratio.is_finite() && ratio >= 2.0) {
        return Vec::new();
    }
    let common = ratio.floor() as u64;
    best_approximations(ratio, MAX_CYCLE_YEARS)
        .into_iter()
        .filter(|a| a.numerator > common * a.denominator)
        .map(|a| {
            let mean_year = a.numerator as f64 * synodic_days / a.denominator as f64;
            LunisolarProposal {
                years: a.denominator,
                months: a.numerator,
                common_year_months: common,
                leap_years: a.numerator - common * a.denominator,
                mean_year_days: mean_year,
                drift_days_per_1000_years: 1000.0 * (mean_year - tropical_year_days),
                kind: a.kind,
            }
        })
        .take(MAX_PROPOSALS + 2)
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn earth_moon_gives_the_metonic_cycle() {
        // Synodic month 29.530589 d (NASA Moon fact sheet, from memory) and tropical year
        // 365.24219 d: 235 months in 19 years, 7 of them with a 13th month (the Metonic cycle,
        // Richards, *Mapping Time*, 1998; from memory). Its mean year, 235 × 29.530589 / 19 =
        // 365.2468 d, runs about a day in 219 years ahead of the seasons.
        let list = lunisolar_proposals(29.530589, 365.24219);
        let metonic = list
            .iter()
            .find(|p| (p.years, p.months) == (19, 235))
            .expect("19 years of 235 months");
        assert_eq!((metonic.common_year_months, metonic.leap_years), (12, 7));
        assert!((metonic.drift_days_per_1000_years - 4.6).abs() < 0.1);
        let index = list.iter().position(|p| p.years == 19).unwrap();
        // After the classic shorter cycles of 1, 2, 3, 5, 8 and 11 years.
        assert!(index <= 6, "{list:?}");
    }

    #[test]
    fn earth_moon_months_alternate_29_and_30() {
        // 29/30 alternation (1 long month in 2) first, then closer cycles; the 30-year
        // arithmetic cycle of 191 long months in 360 (tabular lunar calendars; Richards,
        // *Mapping Time*, 1998; from memory) lies beyond them.
        let list = lunar_proposals(29.530589, 365.24219);
        assert_eq!((list[0].long_months, list[0].cycle_months), (1, 2));
        assert!(list.iter().all(|p| p.short_month_days == 29));
        let drifts: Vec<f64> = list
            .iter()
            .map(|p| p.drift_days_per_1000_years.abs())
            .collect();
        assert!(drifts.windows(2).all(|w| w[1] < w[0]), "{drifts:?}");
    }
}

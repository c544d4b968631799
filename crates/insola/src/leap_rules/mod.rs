//! Leap rules from a year's length alone: the best rational approximations of the tropical
//! year's fraction of a day (continued-fraction convergents and semiconvergents) and the solar
//! leap cycles built on them.
//!
//! Pure arithmetic on numbers of days, below both the calendar (which picks a default rule
//! here) and the calendar designer (which adds the world's seasons and moons).

pub mod fractions;
pub mod solar;

pub use fractions::{Approximation, ApproximationKind, best_approximations};
pub use solar::{
    BEST_DRIFT_DAYS_PER_KY, DateWander, MAX_CYCLE_YEARS, SolarFamily, SolarProposal, best_index,
    best_solar_rule, offset_range, solar_proposals,
};

/// Tropical year of `orbit`: from one northward equinox to the next, seconds.
pub(crate) fn tropical_year_s_of(orbit: &crate::orbit::Orbit) -> f64 {
    let first = orbit.time_of_star_longitude(0.0, 0.0);
    orbit.time_of_star_longitude(0.0, first + 0.5 * orbit.period_s) - first
}

/// Whole days of a year of `days` (at least 1).
pub(crate) fn whole_days(days: f64) -> u32 {
    if days.is_finite() {
        days.floor().clamp(1.0, 1.0e7) as u32
    } else {
        1
    }
}

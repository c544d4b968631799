//! The planet's rotation: sidereal and solar day, spin sense, rotation angle.
//!
//! With the obliquity ε measured from the orbit's normal to the spin axis (0–180°), the planet
//! spins forwards (prograde) for ε ≤ 90° and backwards (retrograde) for ε > 90°. The mean solar
//! day `P_sol` and the sidereal day `P_sid` are related by `1/P_sol = 1/P_sid − s/P_orb` with
//! `s = +1` forwards and `s = −1` backwards (derived from the mean star's motion; reproduces
//! the published solar days of Mercury, Venus, Earth and Mars). ε = 90° exactly is taken as
//! the forward limit so nothing jumps as the tilt approaches it from below.

use std::f64::consts::TAU;

use crate::angle::wrap_tau;

/// Sense of rotation relative to the orbital motion.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize, serde::Deserialize)]
pub enum SpinSense {
    /// Forwards: obliquity 0–90°, the star rises in the east.
    Prograde,
    /// Backwards: obliquity above 90°, the star rises in the west.
    Retrograde,
}

impl SpinSense {
    /// From the obliquity in degrees.
    pub fn from_obliquity_deg(obliquity_deg: f64) -> Self {
        if obliquity_deg > 90.0 {
            SpinSense::Retrograde
        } else {
            SpinSense::Prograde
        }
    }

    /// `+1` for prograde, `−1` for retrograde.
    pub fn sign(self) -> f64 {
        match self {
            SpinSense::Prograde => 1.0,
            SpinSense::Retrograde => -1.0,
        }
    }
}

/// The rotation of the planet, derived from a valid spin section.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Spin {
    /// Obliquity as given, radians in `[0, π]`.
    pub obliquity_rad: f64,
    /// Geometric tilt of the north pole from the orbit's normal, `min(ε, π − ε)`, radians.
    pub tilt_rad: f64,
    /// `(sin, cos)` of the tilt, precomputed for the sky queries.
    pub tilt_sin_cos: (f64, f64),
    /// Forwards or backwards.
    pub sense: SpinSense,
    /// Rotation period relative to the stars, seconds (> 0).
    pub sidereal_day_s: f64,
    /// Mean solar day, seconds; `f64::INFINITY` on a tidally locked world.
    pub solar_day_s: f64,
    /// Rotation angle at time zero: angle from the northward equinox direction to the prime
    /// meridian, measured eastwards about the north pole, radians.
    pub sidereal_angle_at_zero_rad: f64,
}

/// Sidereal day from the solar day: `1/P_sid = 1/P_sol + s/P_orb`.
pub fn sidereal_from_solar_day(solar_day_s: f64, year_s: f64, sense: SpinSense) -> f64 {
    1.0 / (1.0 / solar_day_s + sense.sign() / year_s)
}

/// Solar day from the sidereal day: `1/P_sol = 1/P_sid − s/P_orb`; infinite when they cancel.
pub fn solar_from_sidereal_day(sidereal_day_s: f64, year_s: f64, sense: SpinSense) -> f64 {
    let rate = 1.0 / sidereal_day_s - sense.sign() / year_s;
    if rate.abs() <= 1e-15 / sidereal_day_s {
        f64::INFINITY
    } else {
        1.0 / rate
    }
}

impl Spin {
    /// Rotation angle (eastward angle from the equinox direction to the prime meridian) at
    /// `t_s`, radians in `[0, 2π)`. The planet turns eastwards when prograde and westwards when
    /// retrograde. Whole turns are removed in time first, so the angle stays exact for long runs.
    pub fn sidereal_angle_rad(&self, t_s: f64) -> f64 {
        let frac = crate::angle::cycle_fraction(t_s, self.sidereal_day_s);
        wrap_tau(self.sidereal_angle_at_zero_rad + self.sense.sign() * TAU * frac)
    }

    /// `true` when the mean solar day is infinite (one face always to the star).
    pub fn is_tidally_locked(&self) -> bool {
        self.solar_day_s.is_infinite()
    }

    /// The world's "day" unit in seconds: the mean solar day, or the sidereal day (equal to
    /// the year) on a tidally locked world.
    pub fn day_s(&self) -> f64 {
        if self.solar_day_s.is_finite() {
            self.solar_day_s
        } else {
            self.sidereal_day_s
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const DAY: f64 = 86_400.0;
    const HOUR: f64 = 3_600.0;

    #[test]
    fn earth_sidereal_to_solar() {
        // Sidereal day 0.99726968 d and sidereal year 365.256363 d give a 24.000 h solar day
        // (NASA planetary fact sheet: length of day 24.0 h; sidereal year from the same sheet).
        let p = solar_from_sidereal_day(0.997_269_68 * DAY, 365.256_363 * DAY, SpinSense::Prograde);
        assert!((p / HOUR - 24.0).abs() < 1e-4, "{}", p / HOUR);
    }

    #[test]
    fn mars_solar_day() {
        // NASA Mars fact sheet: sidereal rotation 24.6229 h, orbit 686.980 d, length of day
        // 24.6597 h.
        let p = solar_from_sidereal_day(24.6229 * HOUR, 686.980 * DAY, SpinSense::Prograde);
        assert!((p / HOUR - 24.6597).abs() < 2e-4, "{}", p / HOUR);
    }

    #[test]
    fn venus_retrograde_solar_day() {
        // NASA Venus fact sheet: sidereal rotation −5832.6 h (243.025 d retrograde), orbit
        // 224.701 d, length of day 2802.0 h = 116.75 d; obliquity 177.36° (fact sheet, from
        // memory).
        let sense = SpinSense::from_obliquity_deg(177.36);
        assert_eq!(sense, SpinSense::Retrograde);
        let p = solar_from_sidereal_day(243.025 * DAY, 224.701 * DAY, sense);
        assert!((p / DAY - 116.75).abs() < 0.01, "{}", p / DAY);
        // 1.92 solar days per Venus year (published figure).
        assert!((224.701 * DAY / p - 1.92).abs() < 0.01);
    }

    #[test]
    fn mercury_solar_day() {
        // NASA Mercury fact sheet: sidereal rotation 58.646 d, orbit 87.969 d, length of day
        // 4222.6 h ≈ 175.94 d; the 3:2 spin-orbit resonance.
        let p = solar_from_sidereal_day(58.646 * DAY, 87.969 * DAY, SpinSense::Prograde);
        assert!((p / DAY - 175.94).abs() < 0.05, "{}", p / DAY);
        assert!((87.969_f64 / 58.646 - 1.5).abs() < 1e-3);
    }

    #[test]
    fn solar_sidereal_round_trip_and_lock() {
        for sense in [SpinSense::Prograde, SpinSense::Retrograde] {
            let sid = sidereal_from_solar_day(30.0 * HOUR, 400.0 * DAY, sense);
            let sol = solar_from_sidereal_day(sid, 400.0 * DAY, sense);
            assert!((sol - 30.0 * HOUR).abs() < 1e-6);
        }
        assert!(
            solar_from_sidereal_day(400.0 * DAY, 400.0 * DAY, SpinSense::Prograde).is_infinite()
        );
    }
}

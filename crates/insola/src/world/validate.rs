//! Validation of a [`WorldSpec`]: every field in range, every combination possible.

use super::spec::{EpochSpec, OrbitSpec, SpinSpec, StarSpec, WorldSpec};
use crate::error::{SpecError, check_range, check_range_open_min};
use crate::orbit::MAX_ECCENTRICITY;

/// Coolest star the light and colour models accept, kelvin.
pub const MIN_STAR_TEMPERATURE_K: f64 = 1000.0;
/// Hottest star the light and colour models accept, kelvin.
pub const MAX_STAR_TEMPERATURE_K: f64 = 40_000.0;

impl WorldSpec {
    /// Checks every field and returns the first problem found, naming the field, the value and
    /// the allowed range.
    pub fn validate(&self) -> Result<(), SpecError> {
        if self.name.trim().is_empty() {
            return Err(SpecError::inconsistent("name", "must not be empty"));
        }
        self.star.validate()?;
        self.orbit.validate()?;
        self.spin.validate(self.orbit.period_days)?;
        self.epoch.validate(&self.spin)?;
        if let Some(atmosphere) = &self.atmosphere {
            atmosphere.validate("atmosphere")?;
        }
        if let Some(climate) = &self.climate {
            climate.validate("climate")?;
        }
        if let Some(body) = &self.body {
            body.validate("body")?;
        }
        for (i, moon) in self.moons.iter().enumerate() {
            moon.validate(&format!("moons[{i}]"), self)?;
        }
        if let Some(companion) = &self.companion {
            companion.validate("companion", self)?;
        }
        if let Some(calendar) = &self.calendar {
            calendar.validate("calendar")?;
            if let Some(m) = &calendar.moon_months
                && !self.moons.iter().any(|moon| moon.name == m.moon)
            {
                return Err(SpecError::inconsistent(
                    "calendar.moon_months.moon",
                    format!("no moon named `{}` in moons", m.moon),
                ));
            }
        }
        Ok(())
    }
}

impl StarSpec {
    fn validate(&self) -> Result<(), SpecError> {
        check_range(
            "star.temperature_k",
            self.temperature_k,
            MIN_STAR_TEMPERATURE_K,
            MAX_STAR_TEMPERATURE_K,
        )?;
        check_range_open_min("star.radius_r_sun", self.radius_r_sun, 0.0, 1000.0)?;
        match (self.luminosity_l_sun, self.flux_at_mean_distance_w_m2) {
            (Some(l), None) => {
                check_range_open_min("star.luminosity_l_sun", l, 0.0, 1.0e7)?;
            }
            (None, Some(f)) => {
                check_range_open_min("star.flux_at_mean_distance_w_m2", f, 0.0, 1.0e7)?;
            }
            (Some(_), Some(_)) => {
                return Err(SpecError::inconsistent(
                    "star.flux_at_mean_distance_w_m2",
                    "give either `luminosity_l_sun` or `flux_at_mean_distance_w_m2`, not both",
                ));
            }
            (None, None) => {
                return Err(SpecError::inconsistent(
                    "star.luminosity_l_sun",
                    "missing: give `luminosity_l_sun` or `flux_at_mean_distance_w_m2`",
                ));
            }
        }
        if let Some(m) = self.mass_m_sun {
            check_range_open_min("star.mass_m_sun", m, 0.0, 1.0e3)?;
        }
        Ok(())
    }
}

impl OrbitSpec {
    fn validate(&self) -> Result<(), SpecError> {
        check_range_open_min(
            "orbit.semi_major_axis_au",
            self.semi_major_axis_au,
            0.0,
            1.0e4,
        )?;
        check_range(
            "orbit.eccentricity",
            self.eccentricity,
            0.0,
            MAX_ECCENTRICITY,
        )?;
        check_range(
            "orbit.periapsis_longitude_deg",
            self.periapsis_longitude_deg,
            -360.0,
            360.0,
        )?;
        check_range_open_min("orbit.period_days", self.period_days, 0.0, 1.0e8)?;
        Ok(())
    }
}

impl SpinSpec {
    fn validate(&self, period_days: f64) -> Result<(), SpecError> {
        check_range("spin.obliquity_deg", self.obliquity_deg, 0.0, 180.0)?;
        let year_h = period_days * 24.0;
        let given = [
            self.solar_day_hours.is_some(),
            self.sidereal_day_hours.is_some(),
            self.tidally_locked,
        ]
        .iter()
        .filter(|g| **g)
        .count();
        if given != 1 {
            return Err(SpecError::inconsistent(
                "spin.solar_day_hours",
                "give exactly one of `solar_day_hours`, `sidereal_day_hours` or `tidally_locked: true`",
            ));
        }
        let retrograde = self.obliquity_deg > 90.0;
        if let Some(h) = self.solar_day_hours {
            check_range_open_min("spin.solar_day_hours", h, 0.0, 1.0e9)?;
            if retrograde && h >= year_h {
                return Err(SpecError::inconsistent(
                    "spin.solar_day_hours",
                    format!(
                        "{h} h is not shorter than the year ({year_h} h): a backward-spinning world \
                         (obliquity above 90) always has a solar day shorter than its year"
                    ),
                ));
            }
        }
        if let Some(h) = self.sidereal_day_hours {
            check_range_open_min("spin.sidereal_day_hours", h, 0.0, 1.0e9)?;
            if !retrograde && (h - year_h).abs() <= 1e-9 * year_h {
                return Err(SpecError::inconsistent(
                    "spin.sidereal_day_hours",
                    "equals the year: the world is tidally locked; write `tidally_locked: true`",
                ));
            }
            if !retrograde && h > year_h {
                return Err(SpecError::inconsistent(
                    "spin.sidereal_day_hours",
                    format!(
                        "{h} h is longer than the year ({year_h} h) on a forward-spinning world, \
                         which would drive the star backwards across the sky; shorten it, or set \
                         the obliquity above 90 for a backward spin"
                    ),
                ));
            }
        }
        if self.tidally_locked && retrograde {
            return Err(SpecError::inconsistent(
                "spin.tidally_locked",
                "a tidally locked world spins forwards: obliquity must be at most 90",
            ));
        }
        Ok(())
    }
}

impl EpochSpec {
    fn validate(&self, spin: &SpinSpec) -> Result<(), SpecError> {
        check_range(
            "epoch.star_longitude_deg",
            self.star_longitude_deg,
            -360.0,
            360.0,
        )?;
        let day_h = spin
            .solar_day_hours
            .or(spin.sidereal_day_hours)
            .unwrap_or(f64::INFINITY);
        let t = self.prime_meridian_solar_time_hours;
        if !(t.is_finite() && t >= 0.0 && (t < day_h || day_h.is_infinite() && t <= 1.0e9)) {
            return Err(SpecError::out_of_range(
                "epoch.prime_meridian_solar_time_hours",
                t,
                format!("0 up to the day length ({day_h} h)"),
            ));
        }
        if let Some(a) = self.sidereal_angle_deg {
            check_range("epoch.sidereal_angle_deg", a, -360.0, 360.0)?;
        }
        if let Some(utc) = &self.utc {
            super::utc::parse_utc_unix_s(utc).map_err(|reason| {
                SpecError::inconsistent("epoch.utc", format!("`{utc}`: {reason}"))
            })?;
        }
        Ok(())
    }
}

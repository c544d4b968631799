//! [`Planet`]: a validated world in the precomputed form every sky query uses.

use std::f64::consts::{PI, TAU};

use crate::angle::wrap_tau;
use crate::calendar::Calendar;
use crate::constants::{
    AU_M, HORIZON_REFRACTION_EARTH_RAD, SECONDS_PER_DAY, SECONDS_PER_HOUR, SUN_LUMINOSITY_W,
    SUN_RADIUS_M, flux_at_distance_w_m2,
};
use crate::error::SpecError;
use crate::light::{AtmosphereSpec, StarLightModel};
use crate::moon_orbit::MoonOrbit;
use crate::orbit::Orbit;
use crate::spin::{Spin, SpinSense, sidereal_from_solar_day, solar_from_sidereal_day};
use crate::world::{BodySpec, WorldSpec, parse_utc_unix_s};

/// A world ready for sky queries: orbit, spin and star, with every derived constant computed.
///
/// Build one with [`Planet::new`] from a [`WorldSpec`]; it is cheap to clone and `Send + Sync`,
/// so one instance can serve many threads.
///
/// ```
/// use insola::{Planet, WorldSpec, Place};
/// let spec = WorldSpec::from_ron_str(r#"(
///     name: "Ennavel",
///     star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
///     orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02,
///             periapsis_longitude_deg: 100, period_days: 300),
///     spin: (obliquity_deg: 20, solar_day_hours: 22),
/// )"#).unwrap();
/// let planet = Planet::new(&spec).unwrap();
/// let noon = planet.time_of_solar_days(0.5);
/// let star = planet.star_position(noon, Place::from_degrees(0.0, 0.0).unwrap());
/// assert!(star.altitude_rad.to_degrees() > 60.0);
/// ```
#[derive(Debug, Clone)]
pub struct Planet {
    spec: WorldSpec,
    orbit: Orbit,
    spin: Spin,
    flux_at_mean_distance_w_m2: f64,
    semi_major_axis_m: f64,
    star_radius_m: f64,
    horizon_refraction_rad: f64,
    utc_at_zero_unix_s: Option<f64>,
    atmosphere: AtmosphereSpec,
    body: BodySpec,
    moon_orbits: Vec<MoonOrbit>,
    light_model: StarLightModel,
    calendar: Calendar,
    companion: Option<crate::binary_orbit::CompanionStar>,
}

impl Planet {
    /// Validates `spec` and precomputes the planet.
    pub fn new(spec: &WorldSpec) -> Result<Planet, SpecError> {
        spec.validate()?;
        let year_s = spec.orbit.period_days * SECONDS_PER_DAY;
        let obliquity_rad = spec.spin.obliquity_deg.to_radians();
        let sense = SpinSense::from_obliquity_deg(spec.spin.obliquity_deg);
        let tilt_rad = obliquity_rad.min(PI - obliquity_rad);
        let (sidereal_day_s, solar_day_s) = if spec.spin.tidally_locked {
            (year_s, f64::INFINITY)
        } else if let Some(h) = spec.spin.solar_day_hours {
            let sol = h * SECONDS_PER_HOUR;
            (sidereal_from_solar_day(sol, year_s, sense), sol)
        } else {
            let sid = spec.spin.sidereal_day_hours.unwrap_or(24.0) * SECONDS_PER_HOUR;
            (sid, solar_from_sidereal_day(sid, year_s, sense))
        };
        let orbit = Orbit::new(
            spec.orbit.eccentricity,
            year_s,
            spec.orbit.periapsis_longitude_deg.to_radians(),
            spec.epoch.star_longitude_deg.to_radians(),
        );
        let mean_longitude_0 = orbit.state_at(0.0).star_mean_longitude_rad;
        let day_s = if solar_day_s.is_finite() {
            solar_day_s
        } else {
            sidereal_day_s
        };
        let sidereal_angle_at_zero_rad = match spec.epoch.sidereal_angle_deg {
            Some(a) => wrap_tau(a.to_radians()),
            None => {
                // Mean solar hour angle at the prime meridian, in the sense the sky turns:
                // H = s (θ − L) = 2π T0/P_day − π (T0 = 0 is midnight).
                let h = TAU * spec.epoch.prime_meridian_solar_time_hours * SECONDS_PER_HOUR / day_s
                    - PI;
                wrap_tau(mean_longitude_0 + sense.sign() * h)
            }
        };
        let spin = Spin {
            obliquity_rad,
            tilt_rad,
            tilt_sin_cos: tilt_rad.sin_cos(),
            sense,
            sidereal_day_s,
            solar_day_s,
            sidereal_angle_at_zero_rad,
        };
        let flux = match (
            spec.star.flux_at_mean_distance_w_m2,
            spec.star.luminosity_l_sun,
        ) {
            (Some(f), _) => f,
            (None, Some(l)) => {
                flux_at_distance_w_m2(l * SUN_LUMINOSITY_W, spec.orbit.semi_major_axis_au)
            }
            (None, None) => {
                return Err(SpecError::inconsistent(
                    "star.luminosity_l_sun",
                    "give exactly one of luminosity_l_sun and flux_at_mean_distance_w_m2",
                ));
            }
        };
        let atmosphere = spec.atmosphere.unwrap_or_default();
        // Earth's 34′ at the horizon, scaled with the air's density and refractivity (see
        // `AtmosphereSpec::refraction_scale`).
        let horizon_refraction_rad = HORIZON_REFRACTION_EARTH_RAD * atmosphere.refraction_scale();
        let utc_at_zero_unix_s = match &spec.epoch.utc {
            Some(text) => {
                Some(parse_utc_unix_s(text).map_err(|r| SpecError::inconsistent("epoch.utc", r))?)
            }
            None => None,
        };
        let semi_major_axis_m = spec.orbit.semi_major_axis_au * AU_M;
        let star_radius_m = spec.star.radius_r_sun * SUN_RADIUS_M;
        // The spectral light model takes milliseconds; building it here means every query
        // after construction is cheap and a world it cannot describe is rejected up front.
        let star_angular_radius_rad = (star_radius_m / semi_major_axis_m).min(0.5).asin();
        let light_model = StarLightModel::new(spec.star.temperature_k, &atmosphere)
            .and_then(|m| m.with_star_angular_radius(star_angular_radius_rad))
            .map_err(|e| match e.field() {
                Some("star.angular_radius_rad") => SpecError::out_of_range(
                    "star.radius_r_sun",
                    spec.star.radius_r_sun,
                    "a star disc seen from the orbit at most 45° in radius",
                ),
                _ => e,
            })?;
        // Calendar days are the local days the clock counts: mean solar days, or sidereal days
        // on a tidally locked world.
        let tropical_year_days = crate::leap_rules::tropical_year_s_of(&orbit) / day_s;
        let calendar = Calendar::new(spec.calendar.as_ref(), tropical_year_days);
        let companion = match &spec.companion {
            Some(c) => Some(crate::binary_orbit::CompanionStar::new(
                c,
                &spec.star,
                &atmosphere,
                semi_major_axis_m,
            )?),
            None => None,
        };
        Ok(Planet {
            companion,
            calendar,
            spec: spec.clone(),
            orbit,
            spin,
            flux_at_mean_distance_w_m2: flux,
            semi_major_axis_m,
            star_radius_m,
            horizon_refraction_rad,
            utc_at_zero_unix_s,
            atmosphere,
            body: spec.body.unwrap_or_default(),
            moon_orbits: spec
                .moons
                .iter()
                .enumerate()
                .map(|(i, m)| MoonOrbit::new(i, m, spec.epoch.star_longitude_deg.to_radians()))
                .collect(),
            light_model,
        })
    }

    /// The world description this planet was built from.
    pub fn spec(&self) -> &WorldSpec {
        &self.spec
    }

    /// The orbit around the star.
    pub fn orbit(&self) -> &Orbit {
        &self.orbit
    }

    /// The rotation.
    pub fn spin(&self) -> &Spin {
        &self.spin
    }

    /// Stellar flux at the mean distance (the semi-major axis), W m⁻².
    pub fn flux_at_mean_distance_w_m2(&self) -> f64 {
        self.flux_at_mean_distance_w_m2
    }

    /// Semi-major axis of the orbit, metres.
    pub fn semi_major_axis_m(&self) -> f64 {
        self.semi_major_axis_m
    }

    /// Radius of the star, metres.
    pub fn star_radius_m(&self) -> f64 {
        self.star_radius_m
    }

    /// Refraction lifting a body at the horizon, radians (0 without air or refraction): Earth's
    /// 34′ scaled with the air's density and refractivity.
    pub fn horizon_refraction_rad(&self) -> f64 {
        self.horizon_refraction_rad
    }

    /// Seconds since the Unix epoch of time zero, for reference worlds tied to UTC.
    pub fn utc_at_zero_unix_s(&self) -> Option<f64> {
        self.utc_at_zero_unix_s
    }

    /// The atmosphere in effect: the world file's, or the documented default of
    /// [`WorldSpec::atmosphere`] (a clear Earth-like sky) when the section is absent.
    pub fn atmosphere(&self) -> &AtmosphereSpec {
        &self.atmosphere
    }

    /// The planet's size and mass: the world file's, or the documented Earth-like default of
    /// [`WorldSpec::body`] when the section is absent.
    pub fn body(&self) -> &BodySpec {
        &self.body
    }

    /// Precomputed orbits of the world's moons, in world-file order.
    pub fn moon_orbits(&self) -> &[MoonOrbit] {
        &self.moon_orbits
    }

    /// The spectral light model of this star and atmosphere (built with the planet).
    pub fn light_model(&self) -> &StarLightModel {
        &self.light_model
    }

    /// The second star, if the world has one (see [`crate::binary_orbit`]).
    pub fn companion(&self) -> Option<&crate::binary_orbit::CompanionStar> {
        self.companion.as_ref()
    }

    /// The calendar with its defaults filled in (see [`Planet::calendar`]).
    pub(crate) fn calendar_ref(&self) -> &Calendar {
        &self.calendar
    }

    /// The year (orbital period) in seconds.
    pub fn year_s(&self) -> f64 {
        self.orbit.period_s
    }

    /// The world's day in seconds: the mean solar day, or the sidereal day on a tidally locked
    /// world.
    pub fn day_s(&self) -> f64 {
        self.spin.day_s()
    }

    /// World time (seconds since time zero) of a fractional count of days since time zero.
    pub fn time_of_solar_days(&self, days: f64) -> f64 {
        days * self.day_s()
    }

    /// Fractional days (of [`Planet::day_s`]) since time zero.
    pub fn solar_days_since_zero(&self, t_s: f64) -> f64 {
        t_s / self.day_s()
    }

    /// World time of a UTC instant, for worlds tied to UTC; `None` otherwise.
    pub fn time_of_utc(&self, unix_s: f64) -> Option<f64> {
        self.utc_at_zero_unix_s.map(|zero| unix_s - zero)
    }

    /// `true` if the star rises in the west (obliquity above 90°).
    pub fn is_retrograde(&self) -> bool {
        self.spin.sense == SpinSense::Retrograde
    }

    /// Number of mean solar days in a year (infinite on a tidally locked world, where it is 0
    /// days of sunrise; reported as `f64::INFINITY`).
    pub fn year_in_solar_days(&self) -> f64 {
        self.orbit.period_s / self.spin.solar_day_s
    }

    /// Local mean solar time at `t_s` and east longitude `lon_rad`, as a fraction of the day in
    /// `[0, 1)` (0 is midnight, 0.5 is mean noon).
    pub fn local_mean_time_fraction(&self, t_s: f64, lon_rad: f64) -> f64 {
        let instant = self.star_instant(t_s);
        let h = self.spin.sense.sign()
            * (instant.sidereal_angle_rad + lon_rad - instant.star_mean_longitude_rad);
        wrap_tau(h + PI) / TAU
    }

    /// The continuous local day count at east longitude `lon_rad`: its integer part is the
    /// local day number (day 0 contains time zero at the prime meridian), its fraction the local
    /// mean solar time as a fraction of the day.
    pub fn local_day_count(&self, t_s: f64, lon_rad: f64) -> f64 {
        let zero_fraction = self.local_mean_time_fraction(0.0, 0.0);
        t_s / self.day_s() + zero_fraction + self.spin.sense.sign() * lon_rad / TAU
    }

    /// World time at which local day `day` starts (local mean midnight) at `lon_rad`.
    pub fn local_day_start_s(&self, day: f64, lon_rad: f64) -> f64 {
        let zero_fraction = self.local_mean_time_fraction(0.0, 0.0);
        (day - zero_fraction - self.spin.sense.sign() * lon_rad / TAU) * self.day_s()
    }

    /// Standard altitude of rise and set for the star's centre, radians: the geometric
    /// altitude at which the upper limb of the star's disc (at the mean distance) touches the
    /// refracted horizon (Earth: −0.84°). The one definition used by the events, the twilight
    /// phase, the sky light and the "is up" flag of the star's light.
    pub fn standard_rise_altitude_rad(&self) -> f64 {
        self.light_model.rise_altitude_rad()
    }
}

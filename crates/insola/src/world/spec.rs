//! The world description as written in `*.world.ron` files.
//!
//! Every numeric field carries its unit in its name. Angles are in degrees, durations in hours
//! (spin) or standard days of 86 400 s (orbit), distances in astronomical units, stellar size and
//! power in nominal solar units (IAU 2015 Resolution B3). [`WorldSpec::validate`] checks every
//! field and names the first bad one; [`crate::Planet::new`] turns a valid spec into the
//! precomputed form the sky queries use.

use serde::{Deserialize, Serialize};

/// A whole world: its star, orbit, spin and where time zero sits.
///
/// Sections added by later capabilities (atmosphere, climate, moons, calendar) are optional so
/// that a world file stays small.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WorldSpec {
    /// Display name of the world.
    pub name: String,
    /// Free text for designers.
    #[serde(default, skip_serializing_if = "String::is_empty")]
    pub description: String,
    /// `true` for validation reference worlds (such as Earth), never for game content.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub reference: bool,
    /// The star the planet orbits.
    pub star: StarSpec,
    /// The planet's orbit around the star.
    pub orbit: OrbitSpec,
    /// The planet's rotation.
    pub spin: SpinSpec,
    /// Where the planet and its rotation stand at time zero. Default: star at the northward
    /// equinox, prime meridian at local midnight.
    #[serde(default)]
    pub epoch: EpochSpec,
    /// The air, if any. Absent: an Earth-like clear atmosphere.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub atmosphere: Option<super::AtmosphereSpec>,
    /// Parameters of the seasonal climate model. Absent: Earth-calibrated defaults.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub climate: Option<crate::climate::ClimateSpec>,
    /// The planet's radius and mass, and the star's mass (for moons). Absent: Earth-like.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub body: Option<super::BodySpec>,
    /// Natural satellites, zero or more.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub moons: Vec<super::MoonSpec>,
    /// Names and lengths of months, and the number of the first year.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub calendar: Option<super::CalendarSpec>,
    /// A second star, circumbinary or wide (see [`super::CompanionSpec`]). Absent: one star.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub companion: Option<super::CompanionSpec>,
}

/// The star. Give exactly one of `luminosity_l_sun` and `flux_at_mean_distance_w_m2`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct StarSpec {
    /// Effective temperature in kelvin; sets the colour and luminous efficacy of its light.
    pub temperature_k: f64,
    /// Radius in nominal solar radii (6.957×10⁸ m); sets the apparent disc.
    pub radius_r_sun: f64,
    /// Luminosity in nominal solar luminosities (3.828×10²⁶ W).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub luminosity_l_sun: Option<f64>,
    /// Flux at the planet's mean distance (the semi-major axis), W m⁻². Earth: 1361.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub flux_at_mean_distance_w_m2: Option<f64>,
    /// Mass in nominal solar masses; required for both stars when the world has a
    /// `companion`, otherwise unused.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub mass_m_sun: Option<f64>,
}

/// The orbit around the star (Keplerian, periapsis fixed).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct OrbitSpec {
    /// Semi-major axis in astronomical units.
    pub semi_major_axis_au: f64,
    /// Eccentricity, 0 (circle) to 0.99.
    pub eccentricity: f64,
    /// The star's ecliptic longitude, seen from the planet, when the planet passes periapsis,
    /// degrees 0–360. 90 puts the closest approach at the northern summer solstice; Earth ≈ 283.
    pub periapsis_longitude_deg: f64,
    /// Orbital period (the year) in standard days of 86 400 s.
    pub period_days: f64,
}

/// The rotation of the planet. Give exactly one of `solar_day_hours`, `sidereal_day_hours`
/// or `tidally_locked: true`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SpinSpec {
    /// Angle between the orbit's normal and the spin axis, degrees 0–180. Above 90 the planet
    /// spins backwards (retrograde) and its star rises in the west.
    pub obliquity_deg: f64,
    /// Mean solar day (noon to noon) in hours.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub solar_day_hours: Option<f64>,
    /// Rotation period relative to the distant stars, in hours.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub sidereal_day_hours: Option<f64>,
    /// The planet keeps one face to its star (sidereal day = year, obliquity at most 90).
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub tidally_locked: bool,
}

/// Where the world stands at time zero.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
pub struct EpochSpec {
    /// The star's ecliptic longitude at time zero, degrees 0–360: 0 is the northward equinox,
    /// 90 the northern summer solstice. Default 0.
    pub star_longitude_deg: f64,
    /// Local mean solar time on the prime meridian at time zero, hours from 0 up to the solar
    /// day. Default 0 (midnight). On a tidally locked world it fixes where the star stands
    /// (half a day puts it over the prime meridian). Ignored when `sidereal_angle_deg` is given.
    pub prime_meridian_solar_time_hours: f64,
    /// Alternative to the solar time: angle from the northward equinox direction to the prime
    /// meridian at time zero, degrees (Earth: Greenwich mean sidereal time).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub sidereal_angle_deg: Option<f64>,
    /// For reference worlds: the UTC instant (RFC 3339, e.g. `2000-01-01T12:00:00Z`) that time
    /// zero corresponds to, so the world can be checked against real almanacs.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub utc: Option<String>,
}

impl Default for EpochSpec {
    fn default() -> Self {
        EpochSpec {
            star_longitude_deg: 0.0,
            prime_meridian_solar_time_hours: 0.0,
            sidereal_angle_deg: None,
            utc: None,
        }
    }
}

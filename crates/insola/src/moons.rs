//! Moons: orbits around the planet, where they stand in the local sky, their phase, light and
//! eclipses.
//!
//! Each moon follows a fixed Keplerian orbit around the planet's centre (no perturbations, no
//! precession of its node), with its inclination and node measured from the planet's orbital
//! plane (the ecliptic frame, see [`crate::frames`]). Positions are topocentric: the observer's
//! offset from the planet's centre is included, so a moon's parallax, and therefore where a
//! solar eclipse is seen, comes out right.

use std::f64::consts::TAU;

use glam::DVec3;
use serde::{Deserialize, Serialize};

use crate::error::{SpecError, check_range, check_range_open_min};
use crate::frames::{altitude_azimuth, enu_from_equatorial, equatorial_from_ecliptic};
use crate::light::{
    angular_radius, covered_fraction, earth_moon_magnitude, illuminated_fraction,
    lambert_geometric_albedo, magnitude_to_lux, moon_illuminance_lux, moon_shadow_dimming,
};
use crate::lighting::{BodyLight, LightMode, MoonLighting};
use crate::orbit::{solve_kepler, true_anomaly_from_eccentric};
use crate::planet::Planet;
use crate::sky::{Place, StarInstant};
use crate::world::WorldSpec;

/// One moon in the world file.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MoonSpec {
    /// Display name.
    pub name: String,
    /// Radius, kilometres.
    pub radius_km: f64,
    /// Semi-major axis of its orbit around the planet, kilometres.
    pub distance_km: f64,
    /// Orbital period relative to the stars, standard days.
    pub period_days: f64,
    /// Eccentricity, 0 to 0.9. Default 0.
    #[serde(default)]
    pub eccentricity: f64,
    /// Inclination to the planet's orbital plane, degrees 0–180 (above 90: orbits backwards).
    /// Default 0 (every new moon is a solar eclipse somewhere).
    #[serde(default)]
    pub inclination_deg: f64,
    /// Ecliptic longitude of the ascending node, degrees. Default 0.
    #[serde(default)]
    pub ascending_node_deg: f64,
    /// Argument of periapsis, degrees. Default 0.
    #[serde(default)]
    pub periapsis_argument_deg: f64,
    /// Phase at time zero: the moon's angle from the star, seen from the planet along its orbit,
    /// degrees: 0 new, 90 first quarter, 180 full. Default 180.
    #[serde(default = "default_phase")]
    pub phase_at_zero_deg: f64,
    /// Bond albedo, 0–1, for the Lambert-sphere light model. Default 0.12.
    #[serde(default = "default_albedo")]
    pub bond_albedo: f64,
    /// Use the measured phase law of Earth's Moon (Allen; Krisciunas & Schaefer 1991) instead
    /// of a Lambert sphere. For the Earth reference world. Default false.
    #[serde(default, skip_serializing_if = "std::ops::Not::not")]
    pub lunar_photometry: bool,
}

fn default_phase() -> f64 {
    180.0
}

fn default_albedo() -> f64 {
    0.12
}

/// The planet's size and mass, for moons' eclipses, parallax and sphere of influence.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
pub struct BodySpec {
    /// Planet radius, kilometres. Default 6371.
    pub radius_km: f64,
    /// Planet mass in Earth masses. Default 1.
    pub mass_earth: f64,
    /// Star mass in solar masses. Default 1.
    pub star_mass_m_sun: f64,
}

impl Default for BodySpec {
    fn default() -> Self {
        BodySpec {
            radius_km: 6371.0,
            mass_earth: 1.0,
            star_mass_m_sun: 1.0,
        }
    }
}

/// Earth mass over solar mass (IAU 2015 nominal values; from memory: 3.003 × 10⁻⁶).
const EARTH_PER_SUN_MASS: f64 = 3.003_489e-6;

impl BodySpec {
    /// Checks the section.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        check_range_open_min(&format!("{path}.radius_km"), self.radius_km, 0.0, 1.0e6)?;
        check_range_open_min(&format!("{path}.mass_earth"), self.mass_earth, 0.0, 1.0e5)?;
        check_range_open_min(
            &format!("{path}.star_mass_m_sun"),
            self.star_mass_m_sun,
            0.0,
            1.0e3,
        )?;
        Ok(())
    }

    /// Radius of the planet's Hill sphere in km for an orbit of `semi_major_axis_au`:
    /// `a (m / 3M)^(1/3)` (Hill 1878; standard).
    pub fn hill_radius_km(&self, semi_major_axis_au: f64) -> f64 {
        let ratio = self.mass_earth * EARTH_PER_SUN_MASS / (3.0 * self.star_mass_m_sun);
        semi_major_axis_au * crate::constants::AU_M / 1000.0 * ratio.cbrt()
    }
}

impl MoonSpec {
    /// Checks the moon; `path` is its dotted name (`moons[0]`).
    pub fn validate(&self, path: &str, world: &WorldSpec) -> Result<(), SpecError> {
        if self.name.trim().is_empty() {
            return Err(SpecError::inconsistent(
                format!("{path}.name"),
                "must not be empty",
            ));
        }
        let body = world.body.unwrap_or_default();
        check_range_open_min(&format!("{path}.radius_km"), self.radius_km, 0.0, 1.0e6)?;
        check_range_open_min(&format!("{path}.period_days"), self.period_days, 0.0, 1.0e7)?;
        check_range(&format!("{path}.eccentricity"), self.eccentricity, 0.0, 0.9)?;
        check_range(
            &format!("{path}.inclination_deg"),
            self.inclination_deg,
            0.0,
            180.0,
        )?;
        check_range(
            &format!("{path}.ascending_node_deg"),
            self.ascending_node_deg,
            -360.0,
            360.0,
        )?;
        check_range(
            &format!("{path}.periapsis_argument_deg"),
            self.periapsis_argument_deg,
            -360.0,
            360.0,
        )?;
        check_range(
            &format!("{path}.phase_at_zero_deg"),
            self.phase_at_zero_deg,
            -360.0,
            360.0,
        )?;
        check_range(&format!("{path}.bond_albedo"), self.bond_albedo, 0.0, 1.0)?;
        let closest = self.distance_km * (1.0 - self.eccentricity);
        let min = body.radius_km + self.radius_km;
        if !(self.distance_km.is_finite() && closest > min) {
            return Err(SpecError::out_of_range(
                format!("{path}.distance_km"),
                self.distance_km,
                format!(
                    "periapsis above {min} km (planet radius + moon radius): the moon would be inside the planet"
                ),
            ));
        }
        let hill = body.hill_radius_km(world.orbit.semi_major_axis_au);
        let farthest = self.distance_km * (1.0 + self.eccentricity);
        if farthest > 0.5 * hill {
            return Err(SpecError::out_of_range(
                format!("{path}.distance_km"),
                self.distance_km,
                format!(
                    "apoapsis below {:.0} km, half the planet's sphere of influence (Hill radius {hill:.0} km); farther out the star would pull the moon away",
                    0.5 * hill
                ),
            ));
        }
        Ok(())
    }
}

/// Precomputed orbit of one moon.
#[derive(Debug, Clone, PartialEq)]
pub struct MoonOrbit {
    /// Index in the world file.
    pub index: usize,
    /// Semi-major axis, metres.
    pub distance_m: f64,
    /// Radius, metres.
    pub radius_m: f64,
    /// Period, seconds.
    pub period_s: f64,
    /// Eccentricity.
    pub eccentricity: f64,
    /// Mean anomaly at time zero, radians.
    pub mean_anomaly_at_zero_rad: f64,
    /// Orbital-plane basis in the ecliptic frame: toward periapsis and 90° ahead of it.
    pub p_axis: DVec3,
    /// Second basis vector of the orbital plane (in the direction of motion at periapsis).
    pub q_axis: DVec3,
}

impl MoonOrbit {
    /// Builds the orbit of moon `index`; the phase at zero is taken against the star's
    /// ecliptic longitude at time zero, `star_longitude_0`.
    pub fn new(index: usize, spec: &MoonSpec, star_longitude_0: f64) -> MoonOrbit {
        let (i, node, w) = (
            spec.inclination_deg.to_radians(),
            spec.ascending_node_deg.to_radians(),
            spec.periapsis_argument_deg.to_radians(),
        );
        let (sn, cn) = node.sin_cos();
        let (si, ci) = i.sin_cos();
        let (sw, cw) = w.sin_cos();
        // Standard perifocal-to-ecliptic rotation R_z(Ω) R_x(i) R_z(ω).
        let p = DVec3::new(cn * cw - sn * sw * ci, sn * cw + cn * sw * ci, sw * si);
        let q = DVec3::new(-cn * sw - sn * cw * ci, -sn * sw + cn * cw * ci, cw * si);
        let mut orbit = MoonOrbit {
            index,
            distance_m: spec.distance_km * 1000.0,
            radius_m: spec.radius_km * 1000.0,
            period_s: spec.period_days * crate::constants::SECONDS_PER_DAY,
            eccentricity: spec.eccentricity,
            mean_anomaly_at_zero_rad: 0.0,
            p_axis: p,
            q_axis: q,
        };
        // The phase is counted along the orbit: orbit longitude Ω + ω + v equals the star's
        // longitude plus the phase (the ecliptic longitude for small inclinations).
        let v0 = star_longitude_0 + spec.phase_at_zero_deg.to_radians() - node - w;
        orbit.mean_anomaly_at_zero_rad =
            crate::orbit::mean_anomaly_from_true(v0, spec.eccentricity);
        orbit
    }

    /// Position relative to the planet's centre, ecliptic frame, metres.
    pub fn position_at_mean_anomaly(&self, mean_anomaly_rad: f64) -> DVec3 {
        let e = self.eccentricity;
        let ecc = solve_kepler(mean_anomaly_rad, e);
        let v = true_anomaly_from_eccentric(ecc, e);
        let r = self.distance_m * (1.0 - e * ecc.cos());
        let (sv, cv) = v.sin_cos();
        (self.p_axis * cv + self.q_axis * sv) * r
    }

    /// Position relative to the planet's centre at world time `t_s`, ecliptic frame, metres.
    pub fn position_at(&self, t_s: f64) -> DVec3 {
        let frac = crate::angle::cycle_fraction(t_s, self.period_s);
        self.position_at_mean_anomaly(self.mean_anomaly_at_zero_rad + TAU * frac)
    }
}

/// Geometry of a moon seen from one place at one instant.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MoonView {
    /// Unit vector toward the moon, local east-north-up.
    pub direction_enu: DVec3,
    /// Altitude of the moon's centre, radians.
    pub altitude_rad: f64,
    /// Azimuth clockwise from north, radians.
    pub azimuth_rad: f64,
    /// Distance from the observer, metres.
    pub distance_m: f64,
    /// Angular radius of the moon, radians.
    pub angular_radius_rad: f64,
    /// Phase angle star–moon–observer, radians (0 full, π new).
    pub phase_angle_rad: f64,
    /// Angular separation of the moon from the star as seen by the observer, radians.
    pub elongation_rad: f64,
    /// Fraction of the star's disc this moon covers for the observer.
    pub star_covered_fraction: f64,
    /// Fraction of the star's light on the moon removed by the planet's shadow.
    pub shadow_fraction: f64,
}

impl Planet {
    /// Precomputed orbits of the world's moons.
    pub fn moon_orbits(&self) -> &[MoonOrbit] {
        &self.moon_orbits
    }

    /// Observer position relative to the planet's centre, ecliptic frame, metres.
    fn observer_offset(&self, instant: &StarInstant, place: Place) -> DVec3 {
        let r = self.body.radius_km * 1000.0;
        let lst = instant.sidereal_angle_rad + place.longitude_rad;
        let (sp, cp) = place.latitude_rad.sin_cos();
        let eq = DVec3::new(cp * lst.cos(), cp * lst.sin(), sp) * r;
        // Equatorial → ecliptic is the inverse rotation about x.
        equatorial_from_ecliptic(eq, -self.spin.tilt_rad)
    }

    /// Star position relative to the planet's centre, ecliptic frame, metres.
    fn star_offset(&self, instant: &StarInstant) -> DVec3 {
        let (s, c) = instant.ecliptic_longitude_rad.sin_cos();
        DVec3::new(c, s, 0.0) * (instant.distance_factor * self.semi_major_axis_m)
    }

    /// Where moon `index` stands for `place` at a precomputed instant; `None` for a bad index.
    pub fn moon_view(&self, instant: &StarInstant, index: usize, place: Place) -> Option<MoonView> {
        let orbit = self.moon_orbits.get(index)?;
        let moon = orbit.position_at(instant.t_s);
        let obs = self.observer_offset(instant, place);
        let star = self.star_offset(instant);
        let to_moon = moon - obs;
        let dist = to_moon.length();
        let u = to_moon / dist;
        let lst = instant.sidereal_angle_rad + place.longitude_rad;
        let (sp, cp) = place.latitude_rad.sin_cos();
        let enu = enu_from_equatorial(equatorial_from_ecliptic(u, self.spin.tilt_rad), sp, cp, lst);
        let (alt, az) = altitude_azimuth(enu);
        let to_star_obs = (star - obs).normalize();
        let elongation = u.dot(to_star_obs).clamp(-1.0, 1.0).acos();
        let moon_to_star = (star - moon).normalize();
        let moon_to_obs = -u;
        let phase = moon_to_star.dot(moon_to_obs).clamp(-1.0, 1.0).acos();
        let moon_r = angular_radius(orbit.radius_m, dist);
        let covered = covered_fraction(instant.angular_radius_rad, moon_r, elongation);
        // Seen from the moon: the planet's disc against the star's.
        let moon_to_planet = -moon;
        let sep = moon_to_planet
            .normalize()
            .dot(moon_to_star)
            .clamp(-1.0, 1.0)
            .acos();
        let star_r_at_moon = angular_radius(self.star_radius_m, (star - moon).length());
        let planet_r_at_moon = angular_radius(self.body.radius_km * 1000.0, moon.length());
        let shadow = moon_shadow_dimming(star_r_at_moon, planet_r_at_moon, sep);
        Some(MoonView {
            direction_enu: enu,
            altitude_rad: alt,
            azimuth_rad: az,
            distance_m: dist,
            angular_radius_rad: moon_r,
            phase_angle_rad: phase,
            elongation_rad: elongation,
            star_covered_fraction: covered,
            shadow_fraction: shadow,
        })
    }

    /// Fraction of the star's disc hidden by moons for `place` (the largest single moon's
    /// cover; overlapping moons are not combined), 0–1.
    pub fn star_eclipse_fraction(&self, instant: &StarInstant, place: Place) -> f64 {
        (0..self.moon_orbits.len())
            .filter_map(|i| self.moon_view(instant, i, place))
            .map(|v| v.star_covered_fraction)
            .fold(0.0, f64::max)
    }

    /// Light of every moon for `place` at a precomputed instant.
    pub fn moon_lighting(
        &self,
        instant: &StarInstant,
        place: Place,
        mode: LightMode,
    ) -> Vec<MoonLighting> {
        let model = self.light_model();
        self.moon_orbits
            .iter()
            .enumerate()
            .filter_map(|(i, orbit)| {
                let view = self.moon_view(instant, i, place)?;
                let spec = &self.spec.moons[i];
                let star_lux_at_moon = model
                    .top_of_atmosphere(instant.toa_flux_w_m2)
                    .illuminance_lux
                    * (1.0 - view.shadow_fraction);
                let toa_lux = if spec.lunar_photometry {
                    // Measured lunar law, scaled for the star's brightness relative to the Sun
                    // at 1 AU (the law is calibrated for the Sun's light).
                    let sun_lux = 1361.0
                        * crate::light::blackbody_luminous_efficacy(
                            crate::constants::SUN_TEMPERATURE_K,
                        );
                    magnitude_to_lux(earth_moon_magnitude(view.phase_angle_rad, view.distance_m))
                        * star_lux_at_moon
                        / sun_lux
                } else {
                    moon_illuminance_lux(
                        star_lux_at_moon,
                        lambert_geometric_albedo(spec.bond_albedo),
                        orbit.radius_m,
                        view.distance_m,
                        view.phase_angle_rad,
                    )
                };
                // Moonlight is reflected starlight: at the ground it has the same extinction
                // as the star's beam at the moon's altitude.
                let beam = model.direct_beam(view.altitude_rad, 1.0);
                let toa = model.top_of_atmosphere(1.0);
                let ground_lux =
                    toa_lux * beam.illuminance_lux / toa.illuminance_lux.max(f64::MIN_POSITIVE);
                let (lux, colour) = match mode {
                    LightMode::TopOfAtmosphere => {
                        let fade = crate::light::disc_fraction_above_horizon(
                            model.apparent_altitude_rad(view.altitude_rad),
                            view.angular_radius_rad,
                        );
                        (toa_lux * fade, toa.colour)
                    }
                    LightMode::Ground => (ground_lux, beam.colour),
                };
                let finite = |x: f64| if x.is_finite() { x.max(0.0) } else { 0.0 };
                Some(MoonLighting {
                    name: spec.name.clone(),
                    light: BodyLight {
                        direction_enu: view.direction_enu,
                        altitude_rad: view.altitude_rad,
                        azimuth_rad: view.azimuth_rad,
                        illuminance_lux: finite(lux),
                        color_linear_rgb: colour.linear_srgb,
                        cct_k: colour.cct_k,
                        angular_radius_rad: view.angular_radius_rad,
                    },
                    phase_angle_rad: view.phase_angle_rad,
                    illuminated_fraction: illuminated_fraction(view.phase_angle_rad),
                    eclipse_fraction: view.shadow_fraction,
                    ground_illuminance_lux: finite(ground_lux),
                })
            })
            .collect()
    }
}

impl Planet {
    /// Standard altitude of moonrise and moonset for moon `index`, radians: minus the horizon
    /// refraction and the moon's mean angular radius (parallax is already in the topocentric
    /// position).
    pub fn moon_rise_altitude_rad(&self, index: usize) -> f64 {
        let r = self
            .moon_orbits
            .get(index)
            .map_or(0.0, |o| angular_radius(o.radius_m, o.distance_m));
        -(self.horizon_refraction_rad + r)
    }

    /// Every crossing of `threshold_rad` by moon `index`'s centre in `(t0_s, t1_s]` at
    /// `place`, in time order (moonrise when `rising`). Samples at most every 1/96 of the
    /// shortest of the day, the moon's period and the moon's own day over this place.
    pub fn moon_altitude_crossings_into(
        &self,
        index: usize,
        place: Place,
        t0_s: f64,
        t1_s: f64,
        threshold_rad: f64,
        out: &mut Vec<crate::events::Crossing>,
    ) {
        let Some(orbit) = self.moon_orbits.get(index) else {
            return;
        };
        // The moon's sky period over a place: 1/P = |1/P_rotation − 1/P_moon| (standard).
        let rot = self.spin.sense.sign() / self.spin.sidereal_day_s;
        let rel = (rot - 1.0 / orbit.period_s).abs();
        let moon_day = if rel > 0.0 { 1.0 / rel } else { f64::INFINITY };
        let max_step = self
            .day_s()
            .min(orbit.period_s)
            .min(moon_day)
            .min(self.year_s())
            / 96.0;
        let f = |t: f64| {
            let i = self.star_instant(t);
            self.moon_view(&i, index, place)
                .map_or(-1.0, |v| v.altitude_rad)
                - threshold_rad
        };
        crate::events::crossings_of(&f, t0_s, t1_s, max_step, out);
    }
}

/// Synodic period (new moon to new moon) of a moon of sidereal period `moon_period_s` around
/// a planet of year `year_s`, seconds: `1/P_syn = 1/P_moon − 1/P_year` (standard; prograde
/// orbits). Infinite when the two match.
pub fn synodic_period_s(moon_period_s: f64, year_s: f64) -> f64 {
    let rate = 1.0 / moon_period_s - 1.0 / year_s;
    if rate.abs() < 1e-18 {
        f64::INFINITY
    } else {
        (1.0 / rate).abs()
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::lighting::LightMode;

    fn world(moon: &str) -> Planet {
        let text = format!(
            r#"(name: "Moonlit", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
               orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
               spin: (obliquity_deg: 0, solar_day_hours: 24),
               moons: [{moon}])"#
        );
        Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
    }

    #[test]
    fn full_moon_at_midnight_overhead_and_lit() {
        // Phase 180 at time zero, prime meridian at midnight: the full moon stands at the zenith
        // of the equator (parallax of ~1° at this distance).
        let p = world(r#"(name: "Pale", radius_km: 1700, distance_km: 380000, period_days: 27)"#);
        let place = Place::from_degrees(0.0, 0.0).unwrap();
        let i = p.star_instant(0.0);
        let v = p.moon_view(&i, 0, place).unwrap();
        assert!(
            v.altitude_rad.to_degrees() > 88.0,
            "{}",
            v.altitude_rad.to_degrees()
        );
        assert!(v.phase_angle_rad.to_degrees() < 1.5);
        // In the planet's shadow: a total lunar eclipse (orbit in the ecliptic).
        assert!(v.shadow_fraction > 0.99, "{}", v.shadow_fraction);
        let l = p.moon_lighting(&i, place, LightMode::TopOfAtmosphere);
        assert!(l[0].light.illuminance_lux < 1e-3);
        assert!(l[0].illuminated_fraction > 0.999);
    }

    #[test]
    fn new_moon_eclipses_the_star_at_noon() {
        // Phase 0 and a moon as large in the sky as the star: at local noon on the equator the
        // star's disc is covered.
        let p = world(
            r#"(name: "Shade", radius_km: 1800, distance_km: 380000, period_days: 27, phase_at_zero_deg: 0)"#,
        );
        let place = Place::from_degrees(0.0, 180.0).unwrap();
        let i = p.star_instant(0.0);
        let v = p.moon_view(&i, 0, place).unwrap();
        assert!(
            v.elongation_rad.to_degrees() < 0.3,
            "{}",
            v.elongation_rad.to_degrees()
        );
        assert!(
            v.star_covered_fraction > 0.99,
            "{}",
            v.star_covered_fraction
        );
        let light = p.lighting(0.0, place, LightMode::Ground);
        assert!(light.star_eclipse_fraction > 0.99);
        assert!(
            light.star.illuminance_lux
                < 0.01 * p.light_model().direct_beam(1.5, 1361.0).illuminance_lux
        );
        // Far from the shadow's path the star is whole.
        let far = p.star_eclipse_fraction(&i, Place::from_degrees(60.0, 180.0).unwrap());
        assert_eq!(far, 0.0);
    }

    #[test]
    fn quarter_moon_is_half_lit() {
        let p = world(
            r#"(name: "Half", radius_km: 1700, distance_km: 380000, period_days: 27, phase_at_zero_deg: 90)"#,
        );
        let v = p
            .moon_view(
                &p.star_instant(0.0),
                0,
                Place::from_degrees(0.0, 0.0).unwrap(),
            )
            .unwrap();
        let k = illuminated_fraction(v.phase_angle_rad);
        assert!((k - 0.5).abs() < 0.02, "{k}");
    }

    #[test]
    fn moon_inside_planet_or_too_far_is_rejected() {
        let text = |d: f64| {
            format!(
                r#"(name: "M", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
                   orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
                   spin: (obliquity_deg: 0, solar_day_hours: 24),
                   moons: [(name: "X", radius_km: 100, distance_km: {d}, period_days: 3)])"#
            )
        };
        let inside = WorldSpec::from_ron_str(&text(5000.0)).unwrap_err();
        assert_eq!(inside.field(), Some("moons[0].distance_km"));
        let far = WorldSpec::from_ron_str(&text(5.0e6)).unwrap_err();
        assert_eq!(far.field(), Some("moons[0].distance_km"));
        assert!(far.to_string().contains("Hill"));
    }

    #[test]
    fn moon_rises_and_sets_about_once_a_day() {
        let p = world(r#"(name: "Pale", radius_km: 1700, distance_km: 380000, period_days: 27)"#);
        let place = Place::from_degrees(20.0, 0.0).unwrap();
        let mut out = Vec::new();
        p.moon_altitude_crossings_into(
            0,
            place,
            0.0,
            10.0 * 86_400.0,
            p.moon_rise_altitude_rad(0),
            &mut out,
        );
        // A moon of 27 days over a 24-hour day rises once per 1/(1/24 h − 1/27 d) ≈ 24.9 h.
        let rises = out.iter().filter(|c| c.rising).count();
        assert!((9..=10).contains(&rises), "{rises}");
        for w in out.windows(2) {
            assert!(w[0].t_s < w[1].t_s && w[0].rising != w[1].rising);
        }
    }

    #[test]
    fn earth_hill_radius() {
        // Earth's Hill sphere is about 1.5 million km (standard figure; from memory).
        let h = BodySpec::default().hill_radius_km(1.0);
        assert!((h - 1.5e6).abs() < 0.05e6, "{h}");
    }

    #[test]
    fn synodic_month() {
        // Earth's Moon: sidereal 27.321661 d, year 365.256363 d → synodic 29.530589 d (published
        // mean synodic month; from memory).
        let p = synodic_period_s(27.321_661, 365.256_363);
        assert!((p - 29.530_589).abs() < 1e-3, "{p}");
    }
}

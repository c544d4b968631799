//! Where the star stands: per-instant state and per-place position.
//!
//! Conventions: see the crate docs. The hour angle reported here is measured from the local
//! meridian in the direction the sky turns, so it is negative before transit, positive after
//! it, and grows with time on forward- and backward-spinning worlds alike (on a forward world it
//! equals the astronomer's westward hour angle).

use std::f64::consts::PI;

use glam::DVec3;

use crate::angle::{wrap_pi, wrap_tau};
use crate::frames::altitude_azimuth;
use crate::insolation;
pub use crate::place::Place;
use crate::planet::Planet;

/// Everything about the star at one instant that does not depend on the place.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StarInstant {
    /// World time, seconds since time zero.
    pub t_s: f64,
    /// Ecliptic longitude of the star, radians `[0, 2π)`.
    pub ecliptic_longitude_rad: f64,
    /// Mean longitude of the star (drives mean solar time), radians `[0, 2π)`.
    pub star_mean_longitude_rad: f64,
    /// Declination, radians, positive north.
    pub declination_rad: f64,
    /// Right ascension, radians `[0, 2π)`, eastward from the northward equinox.
    pub right_ascension_rad: f64,
    /// Distance in units of the semi-major axis.
    pub distance_factor: f64,
    /// Distance in astronomical units.
    pub distance_au: f64,
    /// Rotation angle of the prime meridian from the equinox direction, radians `[0, 2π)`.
    pub sidereal_angle_rad: f64,
    /// Equation of time as an angle (apparent minus mean solar hour angle), radians in
    /// `[−π, π)`.
    pub equation_of_time_rad: f64,
    /// Stellar flux on a surface facing the star at the top of the atmosphere, W m⁻².
    pub toa_flux_w_m2: f64,
    /// Angular radius of the star's disc, radians.
    pub angular_radius_rad: f64,
    /// Which star: 0 the primary (the world's `star`), 1 the companion.
    pub star: usize,
    /// Ecliptic latitude of the star seen from the planet, radians (0 for a star in the
    /// planet's orbital plane: the primary, a circumbinary companion).
    pub ecliptic_latitude_rad: f64,
    /// Sine of the declination (kept so per-place queries need no trigonometry of it).
    pub sin_declination: f64,
    /// Cosine of the declination.
    pub cos_declination: f64,
}

/// The star seen from one place at one instant.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StarPosition {
    /// Geometric altitude of the star's centre (no refraction), radians.
    pub altitude_rad: f64,
    /// Azimuth, radians clockwise from north, `[0, 2π)`.
    pub azimuth_rad: f64,
    /// Hour angle in the sense the sky turns (see module docs), radians `[−π, π)`.
    pub hour_angle_rad: f64,
    /// Unit vector toward the star in the local east-north-up frame.
    pub direction_enu: DVec3,
    /// Top-of-atmosphere insolation on a horizontal surface, W m⁻².
    pub toa_insolation_w_m2: f64,
}

/// A place with its latitude's sine and cosine worked out once, for many star queries there
/// ([`Planet::star_position_prepared`]); the time series ([`crate::star_track`]) use it too.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PreparedPlace {
    /// The place.
    pub place: Place,
    /// Sine of the latitude.
    pub sin_lat: f64,
    /// Cosine of the latitude (≥ 0).
    pub cos_lat: f64,
}

impl PreparedPlace {
    /// Prepares `place` (one `sin_cos`).
    pub fn new(place: Place) -> PreparedPlace {
        let (sin_lat, cos_lat) = place.latitude_rad.sin_cos();
        PreparedPlace {
            place,
            sin_lat,
            cos_lat,
        }
    }
}

/// `asin(x)` for `0 ≤ x ≤ 1`; below 0.01 (every star seen from a planet, in practice) by its
/// series `x + x³/6 + 3x⁵/40 + 5x⁷/112`, whose next term, `35x⁹/1152`, is below 10⁻¹⁷ of `x`
/// there (the series of arcsine; standard).
#[inline]
pub(crate) fn small_asin(x: f64) -> f64 {
    if x < 0.01 {
        let x2 = x * x;
        x * (1.0 + x2 * (1.0 / 6.0 + x2 * (3.0 / 40.0 + x2 * (5.0 / 112.0))))
    } else {
        x.asin()
    }
}

impl Planet {
    /// The place-independent state of the star at world time `t_s` (seconds since zero).
    ///
    /// On a circumbinary world this is the primary, off the barycentre by its share of the
    /// pair's orbit ([`Planet::star_instant_of`]); elsewhere the star at the orbit's focus.
    pub fn star_instant(&self, t_s: f64) -> StarInstant {
        if self.primary_is_off_focus() {
            return self.paired_star_instant(0, t_s);
        }
        let o = self.orbit().state_at(t_s);
        // Equatorial coordinates from sin/cos of λ with the tilt's sine and cosine precomputed
        // (same formula as `frames::equatorial_from_ecliptic_longitude`).
        let (sl, cl) = o.star_longitude_sin_cos;
        let (se, ce) = self.spin().tilt_sin_cos;
        let ra = wrap_tau((ce * sl).atan2(cl));
        let sin_dec = (se * sl).clamp(-1.0, 1.0);
        let cos_dec = (1.0 - sin_dec * sin_dec).sqrt();
        let dec = sin_dec.asin();
        let eot = wrap_pi(self.spin().sense.sign() * (o.star_mean_longitude_rad - ra));
        let distance_m = self.semi_major_axis_m() * o.distance_factor;
        StarInstant {
            t_s,
            ecliptic_longitude_rad: o.star_longitude_rad,
            star_mean_longitude_rad: o.star_mean_longitude_rad,
            declination_rad: dec,
            right_ascension_rad: ra,
            distance_factor: o.distance_factor,
            distance_au: self.spec().orbit.semi_major_axis_au * o.distance_factor,
            sidereal_angle_rad: self.spin().sidereal_angle_rad(t_s),
            equation_of_time_rad: eot,
            toa_flux_w_m2: self.flux_at_mean_distance_w_m2()
                / (o.distance_factor * o.distance_factor),
            angular_radius_rad: small_asin((self.star_radius_m() / distance_m).min(1.0)),
            star: 0,
            ecliptic_latitude_rad: 0.0,
            sin_declination: sin_dec,
            cos_declination: cos_dec,
        }
    }

    /// The star seen from `place` at a precomputed instant.
    #[inline]
    pub fn star_position_at(&self, instant: &StarInstant, place: Place) -> StarPosition {
        star_position_from(instant, place, self.spin().sense.sign())
    }

    /// [`Planet::star_position_at`] for a place prepared once: the same numbers bit for bit,
    /// without the latitude's `sin_cos` on every call.
    #[inline]
    pub fn star_position_prepared(
        &self,
        instant: &StarInstant,
        place: &PreparedPlace,
    ) -> StarPosition {
        star_position_trig(instant, place, self.spin().sense.sign())
    }

    /// The star seen from `place` at world time `t_s`.
    pub fn star_position(&self, t_s: f64, place: Place) -> StarPosition {
        self.star_position_at(&self.star_instant(t_s), place)
    }

    /// Equation of time at `t_s` in minutes of the world's clock (apparent minus mean solar
    /// time; sundial ahead of the clock when positive). Zero on a tidally locked world.
    pub fn equation_of_time_min(&self, t_s: f64) -> f64 {
        if self.spin().is_tidally_locked() {
            return 0.0;
        }
        self.star_instant(t_s).equation_of_time_rad / (2.0 * PI) * self.spin().solar_day_s / 60.0
    }

    /// Daily-mean top-of-atmosphere insolation at `latitude_rad` on the day containing `t_s`,
    /// W m⁻² (Berger 1978; declination and distance taken at `t_s`). On a world with a
    /// shining companion, by quadrature over the day centred on `t_s`
    /// ([`Planet::two_star_daily_mean_insolation_w_m2`]); under a ring that casts a shadow, by
    /// quadrature over the hour angle with the ring's transmission
    /// ([`Planet::ring_daily_mean_insolation_w_m2`]).
    pub fn daily_mean_insolation_w_m2(&self, t_s: f64, latitude_rad: f64) -> f64 {
        if self.has_shining_companion() {
            return self.two_star_daily_mean_insolation_w_m2(t_s, latitude_rad);
        }
        if self.has_ring_shadow() {
            return self.ring_daily_mean_insolation_w_m2(t_s, latitude_rad);
        }
        let i = self.star_instant(t_s);
        insolation::daily_mean_w_m2(
            self.flux_at_mean_distance_w_m2(),
            latitude_rad,
            i.declination_rad,
            i.distance_factor,
        )
    }
}

/// The star seen from `place` at a precomputed instant on a world spinning in `sense` (+1
/// forward, −1 backward): the one formula behind [`Planet::star_position_at`] and the star
/// frames ([`crate::star_frame`]).
#[inline]
pub(crate) fn star_position_from(instant: &StarInstant, place: Place, sense: f64) -> StarPosition {
    star_position_trig(instant, &PreparedPlace::new(place), sense)
}

/// [`star_position_from`] with the latitude's sine and cosine given.
#[inline]
fn star_position_trig(instant: &StarInstant, place: &PreparedPlace, sense: f64) -> StarPosition {
    let (sl, cl) = (place.sin_lat, place.cos_lat);
    let h_geo =
        instant.sidereal_angle_rad + place.place.longitude_rad - instant.right_ascension_rad;
    let (sd, cd) = (instant.sin_declination, instant.cos_declination);
    let (sh, ch) = h_geo.sin_cos();
    let enu = DVec3::new(-cd * sh, cl * sd - sl * cd * ch, sl * sd + cl * cd * ch);
    let (alt, az) = altitude_azimuth(enu);
    StarPosition {
        altitude_rad: alt,
        azimuth_rad: az,
        hour_angle_rad: wrap_pi(sense * h_geo),
        direction_enu: enu,
        toa_insolation_w_m2: instant.toa_flux_w_m2 * enu.z.max(0.0),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn small_angle_arcsine_matches_the_library() {
        for k in 0..=400 {
            let x = k as f64 * 5e-5;
            assert!((small_asin(x) - x.asin()).abs() <= x * 4e-16, "{x}");
        }
        assert_eq!(small_asin(1.0), std::f64::consts::FRAC_PI_2);
    }
    use crate::WorldSpec;

    fn world(obliquity: f64, day: &str) -> Planet {
        let text = format!(
            r#"(name: "Test", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
               orbit: (semi_major_axis_au: 1, eccentricity: 0.05, periapsis_longitude_deg: 30, period_days: 200),
               spin: (obliquity_deg: {obliquity}, {day}))"#
        );
        Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
    }

    #[test]
    fn midnight_and_noon_at_the_prime_meridian() {
        let p = world(20.0, "solar_day_hours: 20");
        let place = Place::from_degrees(0.0, 0.0).unwrap();
        // At time zero it is local mean midnight, the star is below the horizon, hour angle ≈ π.
        let s0 = p.star_position(0.0, place);
        assert!(s0.altitude_rad < -1.0);
        assert!((p.local_mean_time_fraction(0.0, 0.0)).abs() < 1e-9);
        // Half a day later it is mean noon: hour angle equals the equation of time.
        let t = p.time_of_solar_days(0.5);
        let s = p.star_position(t, place);
        let eot = p.star_instant(t).equation_of_time_rad;
        assert!(
            (s.hour_angle_rad - eot).abs() < 1e-9,
            "{} {}",
            s.hour_angle_rad,
            eot
        );
    }

    #[test]
    fn retrograde_star_rises_in_the_west() {
        for (obliquity, west) in [(20.0, false), (160.0, true)] {
            let p = world(obliquity, "solar_day_hours: 20");
            let place = Place::from_degrees(10.0, 0.0).unwrap();
            // Morning: a quarter day after midnight.
            let morning = p.star_position(p.time_of_solar_days(0.25), place);
            assert!(morning.altitude_rad.abs() < 0.5);
            assert_eq!(morning.direction_enu.x < 0.0, west, "obliquity {obliquity}");
        }
    }

    #[test]
    fn supplementary_obliquities_share_declination() {
        let a = world(30.0, "solar_day_hours: 20");
        let b = world(150.0, "solar_day_hours: 20");
        for k in 0..50 {
            let t = k as f64 * 3.3e5;
            let (ia, ib) = (a.star_instant(t), b.star_instant(t));
            assert!((ia.declination_rad - ib.declination_rad).abs() < 1e-12);
        }
    }

    #[test]
    fn direction_is_unit_and_poles_are_fine() {
        let p = world(90.0, "solar_day_hours: 20");
        for lat in [-90.0, -45.0, 0.0, 60.0, 90.0] {
            for k in 0..100 {
                let s =
                    p.star_position(k as f64 * 12345.6, Place::from_degrees(lat, 17.0).unwrap());
                assert!((s.direction_enu.length() - 1.0).abs() < 1e-12);
                assert!(s.altitude_rad.is_finite() && s.azimuth_rad.is_finite());
            }
        }
    }

    #[test]
    fn tidally_locked_star_stays_put_on_a_circular_orbit() {
        let text = r#"(name: "Lock", star: (temperature_k: 3500, radius_r_sun: 0.3, luminosity_l_sun: 0.01),
               orbit: (semi_major_axis_au: 0.05, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 10),
               spin: (obliquity_deg: 0, tidally_locked: true),
               epoch: (prime_meridian_solar_time_hours: 120))"#;
        let p = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let place = Place::from_degrees(0.0, 0.0).unwrap();
        for k in 0..20 {
            let s = p.star_position(k as f64 * 77_777.0, place);
            assert!(
                (s.altitude_rad - PI / 2.0).abs() < 1e-6,
                "{}",
                s.altitude_rad
            );
        }
        assert_eq!(p.equation_of_time_min(1000.0), 0.0);
    }
}

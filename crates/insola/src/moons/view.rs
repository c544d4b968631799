//! Where a moon stands for a place: topocentric direction, distance, phase, the part of the
//! star's disc it covers and the planet's shadow on it.

use glam::DVec3;

use crate::frames::{altitude_azimuth, enu_from_equatorial, equatorial_from_ecliptic};
use crate::light::{angular_radius, covered_fraction, moon_shadow_dimming};
use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

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
    /// Observer position relative to the planet's centre, ecliptic frame, metres.
    fn observer_offset(&self, instant: &StarInstant, place: Place) -> DVec3 {
        let r = self.body().radius_km * 1000.0;
        let lst = instant.sidereal_angle_rad + place.longitude_rad;
        let (sp, cp) = place.latitude_rad.sin_cos();
        let eq = DVec3::new(cp * lst.cos(), cp * lst.sin(), sp) * r;
        // Equatorial → ecliptic is the inverse rotation about x.
        equatorial_from_ecliptic(eq, -self.spin().tilt_rad)
    }

    /// Star position relative to the planet's centre, ecliptic frame, metres.
    fn star_offset(&self, instant: &StarInstant) -> DVec3 {
        let (s, c) = instant.ecliptic_longitude_rad.sin_cos();
        DVec3::new(c, s, 0.0) * (instant.distance_factor * self.semi_major_axis_m())
    }

    /// Where moon `index` stands for `place` at a precomputed instant; `None` for a bad index.
    pub fn moon_view(&self, instant: &StarInstant, index: usize, place: Place) -> Option<MoonView> {
        let orbit = self.moon_orbits().get(index)?;
        let moon = orbit.position_at(instant.t_s);
        let obs = self.observer_offset(instant, place);
        let star = self.star_offset(instant);
        let to_moon = moon - obs;
        let dist = to_moon.length();
        let u = to_moon / dist;
        let lst = instant.sidereal_angle_rad + place.longitude_rad;
        let (sp, cp) = place.latitude_rad.sin_cos();
        let enu = enu_from_equatorial(
            equatorial_from_ecliptic(u, self.spin().tilt_rad),
            sp,
            cp,
            lst,
        );
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
        let star_r_at_moon = angular_radius(self.star_radius_m(), (star - moon).length());
        let planet_r_at_moon = angular_radius(self.body().radius_km * 1000.0, moon.length());
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
}

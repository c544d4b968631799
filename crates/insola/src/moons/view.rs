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

/// Angles seen from a moon that decide its eclipse: it is in the planet's shadow while the
/// separation is below the sum of the radii.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct ShadowGeometry {
    /// Angle between the planet's centre and the star's, radians.
    pub(crate) separation_rad: f64,
    /// Angular radius of the star, radians.
    pub(crate) star_radius_rad: f64,
    /// Angular radius of the planet, radians.
    pub(crate) planet_radius_rad: f64,
}

/// Angle between two vectors (any length), radians in `[0, π]`; accurate for small angles too,
/// where the arccosine of the dot product loses half its digits.
pub(crate) fn angle_between(a: DVec3, b: DVec3) -> f64 {
    a.cross(b).length().atan2(a.dot(b))
}

impl Planet {
    /// Observer position relative to the planet's centre, ecliptic frame, metres.
    pub(crate) fn observer_offset(&self, instant: &StarInstant, place: Place) -> DVec3 {
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
        // A star off the orbital plane (a wide companion) by its ecliptic latitude; exactly
        // the in-plane vector when that is 0.
        let (sb, cb) = instant.ecliptic_latitude_rad.sin_cos();
        DVec3::new(cb * c, cb * s, sb) * (instant.distance_factor * self.semi_major_axis_m())
    }

    /// The planet's disc against the star's, seen from a moon at `moon` (planet-centred,
    /// ecliptic frame, metres): the one geometry of a moon's eclipse.
    pub(crate) fn shadow_geometry(&self, instant: &StarInstant, moon: DVec3) -> ShadowGeometry {
        let star = self.star_offset(instant);
        ShadowGeometry {
            separation_rad: angle_between(-moon, star - moon),
            star_radius_rad: angular_radius(
                self.star_radius_of_m(instant.star)
                    .unwrap_or(self.star_radius_m()),
                (star - moon).length(),
            ),
            planet_radius_rad: angular_radius(self.body().radius_km * 1000.0, moon.length()),
        }
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
        let elongation = angle_between(u, to_star_obs);
        let moon_to_star = (star - moon).normalize();
        let moon_to_obs = -u;
        let phase = angle_between(moon_to_star, moon_to_obs);
        let moon_r = angular_radius(orbit.radius_m, dist);
        let covered = covered_fraction(instant.angular_radius_rad, moon_r, elongation);
        let shade = self.shadow_geometry(instant, moon);
        let shadow = moon_shadow_dimming(
            shade.star_radius_rad,
            shade.planet_radius_rad,
            shade.separation_rad,
        );
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

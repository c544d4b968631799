//! Reference frames and the rotations between them.
//!
//! * Ecliptic frame of the planet: x toward the northward equinox direction, z along the orbit's
//!   normal (the orbital angular momentum), y completing a right-handed set.
//! * Equatorial frame: z toward the planet's north pole (the pole on the orbit-normal side),
//!   x toward the northward equinox, right-handed. It is the ecliptic frame turned about x by
//!   the tilt `min(ε, π − ε)`.
//! * Local frame east-north-up (ENU) at a place: right-handed, `east × north = up`.
//!
//! Directions are unit vectors pointing from the observer toward the body.

use glam::DVec3;

/// Right ascension and declination (radians) of a direction on the ecliptic at longitude
/// `lambda_rad`, for a north pole tilted by `tilt_rad` from the orbit's normal:
/// `α = atan2(cos ε sin λ, cos λ)`, `δ = asin(sin ε sin λ)`.
#[inline]
pub fn equatorial_from_ecliptic_longitude(lambda_rad: f64, tilt_rad: f64) -> (f64, f64) {
    let (sl, cl) = lambda_rad.sin_cos();
    let (se, ce) = tilt_rad.sin_cos();
    let ra = (ce * sl).atan2(cl);
    let dec = (se * sl).clamp(-1.0, 1.0).asin();
    (ra, dec)
}

/// A vector given in the ecliptic frame, expressed in the equatorial frame (rotation about x).
#[inline]
pub fn equatorial_from_ecliptic(v: DVec3, tilt_rad: f64) -> DVec3 {
    let (s, c) = tilt_rad.sin_cos();
    DVec3::new(v.x, c * v.y - s * v.z, s * v.y + c * v.z)
}

/// Unit vector of right ascension `ra_rad` and declination `dec_rad` in the equatorial frame.
#[inline]
pub fn equatorial_unit(ra_rad: f64, dec_rad: f64) -> DVec3 {
    let (sa, ca) = ra_rad.sin_cos();
    let (sd, cd) = dec_rad.sin_cos();
    DVec3::new(cd * ca, cd * sa, sd)
}

/// Direction in the local east-north-up frame of a body at declination `dec` and geometric hour
/// angle `hour_angle` (westward from the meridian), seen from latitude `lat` (all radians).
///
/// Valid at the poles too: there "north" is the direction of the prime meridian's longitude
/// line continued over the pole, as for any longitude.
#[inline]
pub fn enu_from_hour_angle(sin_lat: f64, cos_lat: f64, dec_rad: f64, hour_angle_rad: f64) -> DVec3 {
    let (sd, cd) = dec_rad.sin_cos();
    let (sh, ch) = hour_angle_rad.sin_cos();
    DVec3::new(
        -cd * sh,
        cos_lat * sd - sin_lat * cd * ch,
        sin_lat * sd + cos_lat * cd * ch,
    )
}

/// Direction in the local ENU frame of a body whose equatorial unit vector is `v`, seen from a
/// place whose meridian has right ascension `local_sidereal_rad` (rotation angle plus east
/// longitude) at latitude `lat`.
#[inline]
pub fn enu_from_equatorial(v: DVec3, sin_lat: f64, cos_lat: f64, local_sidereal_rad: f64) -> DVec3 {
    let (sl, cl) = local_sidereal_rad.sin_cos();
    // Components along the local meridian's outward direction (m) and eastward (e) in the
    // equatorial plane.
    let m = v.x * cl + v.y * sl;
    let e = -v.x * sl + v.y * cl;
    DVec3::new(e, cos_lat * v.z - sin_lat * m, sin_lat * v.z + cos_lat * m)
}

/// Altitude (radians) and azimuth (radians clockwise from north, `[0, 2π)`) of an ENU vector.
#[inline]
pub fn altitude_azimuth(enu: DVec3) -> (f64, f64) {
    let alt = enu.z.clamp(-1.0, 1.0).asin();
    let az = crate::angle::wrap_tau(enu.x.atan2(enu.y));
    (alt, az)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn meeus_25a_right_ascension_and_declination() {
        // Meeus, Astronomical Algorithms, example 25.a: apparent λ = 199.90895°, ε = 23.43999°
        // give α = 198.38083°, δ = −7.78507° (read in the source; also in the R `oce` docs).
        let (ra, dec) =
            equatorial_from_ecliptic_longitude(199.90895f64.to_radians(), 23.43999f64.to_radians());
        let ra = crate::angle::wrap_tau(ra).to_degrees();
        assert!((ra - 198.38083).abs() < 1e-4, "{ra}");
        assert!(
            (dec.to_degrees() - (-7.78507)).abs() < 1e-4,
            "{}",
            dec.to_degrees()
        );
    }

    #[test]
    fn both_enu_forms_agree() {
        let lat = 0.7f64;
        let (ra, dec, lst) = (1.1f64, -0.3f64, 2.5f64);
        let a = enu_from_hour_angle(lat.sin(), lat.cos(), dec, lst - ra);
        let b = enu_from_equatorial(equatorial_unit(ra, dec), lat.sin(), lat.cos(), lst);
        assert!((a - b).length() < 1e-14);
        assert!((a.length() - 1.0).abs() < 1e-14);
    }

    #[test]
    fn rotation_matches_formula() {
        let (lam, eps) = (2.0f64, 0.4f64);
        let v = equatorial_from_ecliptic(DVec3::new(lam.cos(), lam.sin(), 0.0), eps);
        let (ra, dec) = equatorial_from_ecliptic_longitude(lam, eps);
        assert!((v - equatorial_unit(ra, dec)).length() < 1e-14);
    }
}

//! The star's disc at the horizon: rise/set altitude and how much of the disc is up.

use super::airmass::apparent_altitude;

/// Geometric altitude, in radians, at which a star disc of angular radius `radius_rad` has its
/// upper limb on the apparent horizon, with Earth's refraction × `refraction_scale` (≈ −0.84°
/// for the Sun on Earth; −radius without refraction). The refraction is taken at the limb.
pub fn rise_altitude_rad(refraction_scale: f64, radius_rad: f64) -> f64 {
    find_rise_altitude(refraction_scale, radius_rad)
}

pub(crate) fn find_rise_altitude(refraction_scale: f64, radius_rad: f64) -> f64 {
    // Solve apparent(upper limb) = 0, then step down to the centre.
    let (mut lo, mut hi) = (-0.2, 0.0f64);
    for _ in 0..64 {
        let mid = 0.5 * (lo + hi);
        if apparent_altitude(mid, refraction_scale) < 0.0 {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi) - radius_rad
}

/// Fraction (0–1) of a body's disc counted as up, for a geometric altitude of its centre and its
/// standard rise altitude (both radians) and its angular radius: 0 at and below the rise
/// altitude, rising across one disc diameter above it, 1 from there on. This is the one fade
/// rule for every body's light, so a light is on exactly while its body is up (centre above
/// the rise altitude) and its rise and set events fall where the light switches.
pub fn disc_fraction_above_rise(
    geometric_altitude_rad: f64,
    rise_altitude_rad: f64,
    radius_rad: f64,
) -> f64 {
    if geometric_altitude_rad.is_nan() {
        return 0.0;
    }
    let above = geometric_altitude_rad - rise_altitude_rad;
    if radius_rad.is_nan() || radius_rad <= 0.0 {
        return if above > 0.0 { 1.0 } else { 0.0 };
    }
    disc_fraction_above_horizon(above - radius_rad, radius_rad)
}

/// Fraction (0–1) of a uniform disc of angular radius `radius_rad` above a straight horizon when
/// its centre is at apparent altitude `apparent_altitude_rad` (both radians): 1 − [acos u −
/// u √(1 − u²)]/π with u = altitude/radius clamped to ±1. A point star (radius 0) is a step.
pub fn disc_fraction_above_horizon(apparent_altitude_rad: f64, radius_rad: f64) -> f64 {
    let a = apparent_altitude_rad;
    if radius_rad.is_nan() || radius_rad <= 0.0 {
        return if a >= 0.0 { 1.0 } else { 0.0 };
    }
    let d = (a / radius_rad).clamp(-1.0, 1.0);
    if d.is_nan() {
        return 0.0;
    }
    (1.0 - (d.acos() - d * (1.0 - d * d).sqrt()) / std::f64::consts::PI).clamp(0.0, 1.0)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn disc_fraction() {
        let r = 0.01;
        assert_eq!(disc_fraction_above_horizon(r, r), 1.0);
        assert_eq!(disc_fraction_above_horizon(-r, r), 0.0);
        assert!((disc_fraction_above_horizon(0.0, r) - 0.5).abs() < 1e-15);
        // Segment area: chord at half the radius leaves 1/3 − √3/(4π) ≈ 0.1955 of the disc
        // beyond it (standard geometry, computed).
        let beyond = 1.0 / 3.0 - 3f64.sqrt() / (4.0 * std::f64::consts::PI);
        assert!((disc_fraction_above_horizon(-0.5 * r, r) - beyond).abs() < 1e-12);
        assert_eq!(disc_fraction_above_horizon(0.001, 0.0), 1.0);
        assert_eq!(disc_fraction_above_horizon(f64::NAN, r), 0.0);
    }

    #[test]
    fn rise_altitude() {
        // Explanatory Supplement: standard altitude −0.8333° = −(34′ + 16′); the Sæmundsson
        // refraction at the limb gives within 0.02° of it for a 16′ disc.
        let h = rise_altitude_rad(1.0, f64::to_radians(16.0 / 60.0)).to_degrees();
        assert!((h + 0.8333).abs() < 0.02, "{h}");
        assert!((rise_altitude_rad(0.0, 0.01) + 0.01).abs() < 1e-12);
    }
}

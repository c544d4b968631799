//! Eclipses: how much of a star's disc another disc hides.
//!
//! Both bodies are treated as flat uniform discs in the sky (small angles, no limb darkening).
//! The overlap of two circles of radii r₁, r₂ with centres d apart is
//! A = r₁² acos((d² + r₁² − r₂²)/(2dr₁)) + r₂² acos((d² + r₂² − r₁²)/(2dr₂))
//!   − ½ √((−d + r₁ + r₂)(d + r₁ − r₂)(d − r₁ + r₂)(d + r₁ + r₂)),
//! with A = 0 for d ≥ r₁ + r₂ and A = π min(r₁, r₂)² for d ≤ |r₁ − r₂| (standard geometry).
//!
//! A moon in its planet's shadow: seen *from the moon*, the planet's disc covers part of the
//! star's disc; the fraction hidden is the fraction by which the moon's sunlight is dimmed
//! (umbra: all of it; penumbra: part). Light bent into the shadow by the planet's air (the red
//! eclipsed Moon) is not modelled.

/// Overlap area of two discs of radii `r1`, `r2` whose centres are `d` apart (any one length or
/// angle unit; area in that unit squared). Negative radii count as 0; never NaN for finite input.
pub fn disc_overlap_area(r1: f64, r2: f64, d: f64) -> f64 {
    let (r1, r2, d) = (r1.max(0.0), r2.max(0.0), d.abs());
    if r1 == 0.0 || r2 == 0.0 || d >= r1 + r2 {
        return 0.0;
    }
    if d <= (r1 - r2).abs() {
        return std::f64::consts::PI * r1.min(r2).powi(2);
    }
    let c1 = ((d * d + r1 * r1 - r2 * r2) / (2.0 * d * r1)).clamp(-1.0, 1.0);
    let c2 = ((d * d + r2 * r2 - r1 * r1) / (2.0 * d * r2)).clamp(-1.0, 1.0);
    let k = ((-d + r1 + r2) * (d + r1 - r2) * (d - r1 + r2) * (d + r1 + r2)).max(0.0);
    (r1 * r1 * c1.acos() + r2 * r2 * c2.acos() - 0.5 * k.sqrt()).max(0.0)
}

/// Fraction (0–1) of a star's disc of radius `star_radius` hidden by a disc of radius
/// `occulter_radius` whose centre is `separation` from the star's (same unit, e.g. angular
/// radians). 0 when the star's radius is not positive.
pub fn covered_fraction(star_radius: f64, occulter_radius: f64, separation: f64) -> f64 {
    if star_radius.is_nan() || star_radius <= 0.0 {
        return 0.0;
    }
    (disc_overlap_area(star_radius, occulter_radius, separation)
        / (std::f64::consts::PI * star_radius * star_radius))
        .clamp(0.0, 1.0)
}

/// Angular radius, in radians, of a sphere of radius `radius` at centre distance `distance`
/// (same unit): asin(R/d); π/2 when the distance is at most the radius; 0 for a non-positive
/// radius or distance.
pub fn angular_radius(radius: f64, distance: f64) -> f64 {
    if (radius.is_nan() || radius <= 0.0) || (distance.is_nan() || distance <= 0.0) {
        return 0.0;
    }
    (radius / distance).min(1.0).asin()
}

/// Dimming of a moon by its planet's shadow: the fraction (0–1) of the star's disc hidden by the
/// planet *as seen from the moon*. Arguments are angles in radians seen from the moon: the
/// star's angular radius, the planet's angular radius, and the angle between the star's and
/// the planet's centres (0 = planet dead in front of the star, deepest eclipse). 1 in the umbra,
/// between 0 and 1 in the penumbra.
pub fn moon_shadow_dimming(
    star_angular_radius_rad: f64,
    planet_angular_radius_rad: f64,
    separation_rad: f64,
) -> f64 {
    covered_fraction(
        star_angular_radius_rad,
        planet_angular_radius_rad,
        separation_rad,
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::f64::consts::PI;

    #[test]
    fn overlap_check_values() {
        // Computed from the circle-overlap formula (regression), tolerance 1e-5; the d = 1 case
        // equals 2π/3 − √3/2 exactly.
        assert!((disc_overlap_area(1.0, 1.0, 1.0) - 1.22837).abs() < 1e-5);
        assert!(
            (disc_overlap_area(1.0, 1.0, 1.0) - (2.0 * PI / 3.0 - 3f64.sqrt() / 2.0)).abs() < 1e-12
        );
        assert!((disc_overlap_area(1.0, 1.0, 0.5) - 2.15211).abs() < 1e-5);
        assert!((covered_fraction(1.0, 1.0, 1.0) - 0.39100).abs() < 1e-5);
        assert!((covered_fraction(1.0, 1.0, 0.5) - 0.68504).abs() < 1e-5);
        assert!((disc_overlap_area(1.0, 1.0, 0.0) - PI).abs() < 1e-12);
        assert!((disc_overlap_area(1.0, 0.5, 0.5) - PI / 4.0).abs() < 1e-5);
        assert!((covered_fraction(1.0, 0.5, 0.5) - 0.25).abs() < 1e-12);
        assert!((disc_overlap_area(1.0, 1.05, 0.2) - 2.88031).abs() < 1e-5);
        assert!((covered_fraction(1.0, 1.05, 0.2) - 0.91683).abs() < 1e-5);
        assert_eq!(disc_overlap_area(1.0, 1.0, 2.5), 0.0);
    }

    #[test]
    fn continuous_at_contacts() {
        for (r1, r2) in [(1.0, 0.3), (1.0, 1.0), (0.4, 1.0)] {
            let outer = r1 + r2;
            let inner = f64::abs(r1 - r2);
            assert!(disc_overlap_area(r1, r2, outer - 1e-9) < 1e-10);
            let full = PI * f64::min(r1, r2).powi(2);
            assert!((disc_overlap_area(r1, r2, inner + 1e-9) - full).abs() < 1e-6);
        }
    }

    #[test]
    fn lunar_eclipse_dimming() {
        // Validation reference (Earth and Moon, from memory): from the Moon the Sun is ~0.267°
        // in radius and the Earth ~1.9°: centred → umbra, fully dimmed.
        let (sun, earth) = (f64::to_radians(0.267), f64::to_radians(1.9));
        assert_eq!(moon_shadow_dimming(sun, earth, 0.0), 1.0);
        let half = moon_shadow_dimming(sun, earth, earth);
        assert!(half > 0.4 && half < 0.6);
        assert_eq!(moon_shadow_dimming(sun, earth, f64::to_radians(3.0)), 0.0);
        assert!((angular_radius(1.0, 2.0) - PI / 6.0).abs() < 1e-12);
        assert_eq!(angular_radius(1.0, 0.0), 0.0);
    }
}

//! Light reflected by moons: phase, phase laws, magnitudes and illuminance.
//!
//! * Illuminated fraction k = (1 + cos i)/2, i the phase angle star–moon–observer (Meeus,
//!   *Astronomical Algorithms*, eq. 48.1), and the phase angle from the elongation ψ:
//!   tan i = R sin ψ / (Δ − R cos ψ) (Meeus 48.3), R star–moon and Δ observer–moon distances.
//! * Any moon: E = E★,moon · p · (R_moon/d)² · Φ(α), with the Lambert-sphere phase law
//!   Φ(α) = [sin α + (π − α) cos α]/π and, for a Lambert sphere, geometric albedo p = (2/3)·A_Bond.
//!   Real regolith moons are far from Lambertian (the Earth's Moon at quarter phase gives about
//!   1/11 of full-moon light, Lambert 0.32); use [`earth_moon_magnitude`] for that reference.
//! * The Earth's Moon (validation reference): V(α) = −12.73 + 0.026|α| + 4 × 10⁻⁹ α⁴, α in
//!   degrees, plus 5 log₁₀(Δ/384 400 km) (Allen, *Astrophysical Quantities*; Krisciunas &
//!   Schaefer 1991, PASP 103, 1033, eq. 9); magnitude → illuminance outside the atmosphere
//!   E = 10^(−0.4(V + 13.99)) lx (Krisciunas & Schaefer 1991 eq. 8, from foot-candles).

/// Mean Earth–Moon distance used by the lunar magnitude law, in metres.
pub const EARTH_MOON_MEAN_DISTANCE_M: f64 = 384_400e3;

/// Illuminated fraction of a moon's disc (0–1) for a phase angle in radians.
pub fn illuminated_fraction(phase_angle_rad: f64) -> f64 {
    ((1.0 + phase_angle_rad.cos()) / 2.0).clamp(0.0, 1.0)
}

/// Phase angle (radians, 0–π) from the moon's elongation from the star as seen by the observer
/// (radians), the star–moon distance and the observer–moon distance (same unit).
pub fn phase_angle_from_elongation(
    elongation_rad: f64,
    star_moon_distance: f64,
    observer_moon_distance: f64,
) -> f64 {
    let r = star_moon_distance;
    (r * elongation_rad.sin())
        .atan2(observer_moon_distance - r * elongation_rad.cos())
        .abs()
}

/// Lambert-sphere phase law Φ(α) = [sin α + (π − α) cos α]/π (dimensionless, 1 at full, 0 at
/// new) for a phase angle in radians (|α| clamped to 0–π).
pub fn lambert_phase_law(phase_angle_rad: f64) -> f64 {
    let a = phase_angle_rad.abs().min(std::f64::consts::PI);
    ((a.sin() + (std::f64::consts::PI - a) * a.cos()) / std::f64::consts::PI).max(0.0)
}

/// Geometric albedo of a Lambert sphere of the given Bond albedo: p = (2/3) A (dimensionless).
pub fn lambert_geometric_albedo(bond_albedo: f64) -> f64 {
    2.0 / 3.0 * bond_albedo.clamp(0.0, 1.0)
}

/// Illuminance at the observer from a moon, in lux (outside the atmosphere):
/// E★,moon · p · (R/d)² · Φ(α) with the Lambert phase law.
///
/// `star_lux_at_moon`: the star's illuminance at the moon, normal to the beam (lux);
/// `geometric_albedo` (dimensionless); `moon_radius` and `observer_distance` in the same unit;
/// `phase_angle_rad` in radians. Negative or non-finite input gives 0.
pub fn moon_illuminance_lux(
    star_lux_at_moon: f64,
    geometric_albedo: f64,
    moon_radius: f64,
    observer_distance: f64,
    phase_angle_rad: f64,
) -> f64 {
    if (observer_distance.is_nan() || observer_distance <= 0.0)
        || (moon_radius.is_nan() || moon_radius < 0.0)
    {
        return 0.0;
    }
    let v = star_lux_at_moon.max(0.0)
        * geometric_albedo.max(0.0)
        * (moon_radius / observer_distance).powi(2)
        * lambert_phase_law(phase_angle_rad);
    if v.is_finite() { v } else { 0.0 }
}

/// V magnitude of the Earth's Moon (validation reference) at a phase angle in radians and an
/// observer distance in metres: Allen / Krisciunas & Schaefer 1991 law.
pub fn earth_moon_magnitude(phase_angle_rad: f64, observer_distance_m: f64) -> f64 {
    let a = phase_angle_rad.to_degrees().abs().min(180.0);
    let d = if observer_distance_m > 0.0 {
        observer_distance_m
    } else {
        EARTH_MOON_MEAN_DISTANCE_M
    };
    -12.73 + 0.026 * a + 4e-9 * a.powi(4) + 5.0 * (d / EARTH_MOON_MEAN_DISTANCE_M).log10()
}

/// Illuminance, in lux outside the atmosphere, of a source of V magnitude `v`:
/// 10^(−0.4(V + 13.99)) (Krisciunas & Schaefer 1991 eq. 8).
pub fn magnitude_to_lux(v: f64) -> f64 {
    10f64.powf(-0.4 * (v + 13.99))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn meeus_48a() {
        // Meeus, Astronomical Algorithms, example 48.a (1992 Apr 12): i = 69.0756° → k = 0.6786
        // (read in public test suites citing Meeus p. 347), tolerance 1e-4.
        assert!((illuminated_fraction(f64::to_radians(69.0756)) - 0.6786).abs() < 1e-4);
        // Same example, from memory: ψ = 110.7929°, R = 149 971 520 km, Δ = 368 410 km give
        // i = 69.0756°.
        let i = phase_angle_from_elongation(f64::to_radians(110.7929), 149_971_520.0, 368_410.0);
        assert!(
            (i.to_degrees() - 69.0756).abs() < 1e-3,
            "{}",
            i.to_degrees()
        );
    }

    #[test]
    fn full_moon_illuminance() {
        // Allen / Krisciunas & Schaefer 1991: V = −12.73 at full, mean distance → 0.313 lx
        // outside the atmosphere (computed from their formulas), 1 %.
        let v = earth_moon_magnitude(0.0, EARTH_MOON_MEAN_DISTANCE_M);
        assert!((v + 12.73).abs() < 1e-12);
        assert!((magnitude_to_lux(v) / 0.313 - 1.0).abs() < 0.01);
        // The Sun, V = −26.74 (Mamajek), through the same conversion: 1.26e5 lx, 3 %.
        assert!((magnitude_to_lux(-26.74) / 1.26e5 - 1.0).abs() < 0.03);
        // From albedo: p = 0.12 (from memory), R 1737.4 km, d 384 400 km, 128 klx → 0.314 lx,
        // 2 % (computed; agrees with Allen / K&S).
        let e = moon_illuminance_lux(128_000.0, 0.12, 1737.4, 384_400.0, 0.0);
        assert!((e / 0.314 - 1.0).abs() < 0.02, "{e}");
    }

    #[test]
    fn phase_law_ratios() {
        // Computed from the two laws (regression), relative to full, tolerance 1e-3.
        // (Lambert at 90° is exactly 1/π ≈ 0.318.)
        let lambert = [0.881, 0.609, std::f64::consts::FRAC_1_PI, 0.109, 0.015];
        let allen = [0.486, 0.227, 0.091, 0.026, 0.004];
        let full = magnitude_to_lux(earth_moon_magnitude(0.0, 0.0));
        for (k, a) in [30.0f64, 60.0, 90.0, 120.0, 150.0].into_iter().enumerate() {
            let r = a.to_radians();
            assert!(
                (lambert_phase_law(r) - lambert[k]).abs() < 1e-3,
                "lambert {a}"
            );
            let ak = magnitude_to_lux(earth_moon_magnitude(r, EARTH_MOON_MEAN_DISTANCE_M)) / full;
            assert!((ak - allen[k]).abs() < 1e-3, "allen {a}: {ak}");
        }
        // Allen's phase table (mag below full, read via a satellite-observers list): 30° 0.79,
        // 60° 1.62, 90° 2.63, 120° 3.93; the formula within 0.05 mag.
        for (a, dm) in [(30.0f64, 0.79), (60.0, 1.62), (90.0, 2.63), (120.0, 3.93)] {
            let m = earth_moon_magnitude(a.to_radians(), EARTH_MOON_MEAN_DISTANCE_M) + 12.73;
            assert!((m - dm).abs() < 0.05, "{a}: {m}");
        }
        assert_eq!(lambert_phase_law(0.0), 1.0);
        assert!(lambert_phase_law(std::f64::consts::PI).abs() < 1e-15);
    }

    #[test]
    fn safe_on_bad_input() {
        assert_eq!(moon_illuminance_lux(1e5, 0.1, 1.0, 0.0, 0.0), 0.0);
        assert_eq!(moon_illuminance_lux(f64::NAN, 0.1, 1.0, 10.0, 0.0), 0.0);
        assert!((lambert_geometric_albedo(0.3) - 0.2).abs() < 1e-12);
    }
}

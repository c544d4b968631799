//! Relative air mass (the slant path through the air relative to the vertical path) and
//! atmospheric refraction near the horizon.
//!
//! * Kasten & Young 1989 (Appl. Opt. 28, 4735): takes the *apparent* zenith angle; 0.9997 at the
//!   zenith, 37.92 at the horizon.
//! * Young 1994 (Appl. Opt. 33, 1108): takes the *true* (geometric) zenith angle.
//! * Refraction: Sæmundsson 1986 (as given in Meeus, *Astronomical Algorithms*, ch. 16), true
//!   altitude in, refraction out.
//!
//! Both air-mass fits are for the Earth's air (its scale height relative to the planet's radius);
//! on other worlds they are used as they are — a stated limit of the model.
//!
//! Below the horizon the fits are not meant to be used. Here the air mass is held at its horizon
//! value (apparent altitude 0) for every lower altitude: continuous, finite and monotonic. The
//! direct beam is anyway hidden there by the horizon (see `star_light`).

/// Kasten & Young 1989 relative air mass at apparent altitude 0 (dimensionless).
pub const HORIZON_AIR_MASS_KY89: f64 = 37.919_608_2;

/// Kasten & Young 1989 relative air mass for an apparent zenith angle in degrees
/// (dimensionless): m = 1/[cos z + 0.50572 (96.07995° − z)^(−1.6364)].
///
/// Zenith angles beyond 90° (star below the apparent horizon) return the horizon value; negative
/// angles are folded (|z|); NaN gives NaN.
pub fn kasten_young_1989(apparent_zenith_deg: f64) -> f64 {
    let z = apparent_zenith_deg.abs().min(90.0);
    1.0 / (z.to_radians().cos() + 0.50572 * (96.07995 - z).powf(-1.6364))
}

/// Young 1994 relative air mass for a true (geometric) zenith angle in degrees
/// (dimensionless), a rational fit in c = cos z. Beyond 90° the horizon value (≈ 38.1) is
/// returned.
pub fn young_1994(true_zenith_deg: f64) -> f64 {
    let c = true_zenith_deg.abs().min(90.0).to_radians().cos().max(0.0);
    (1.002432 * c * c + 0.148386 * c + 0.0096467)
        / (c * c * c + 0.149864 * c * c + 0.0102963 * c + 0.000303978)
}

/// Absolute (pressure-corrected) air mass: relative air mass × pressure / 101.325 kPa
/// (dimensionless).
pub fn absolute_air_mass(relative_air_mass: f64, pressure_kpa: f64) -> f64 {
    relative_air_mass * pressure_kpa / super::REFERENCE_PRESSURE_KPA
}

/// Relative air mass (Kasten & Young 1989) for an apparent altitude in radians, held at the
/// horizon value below the apparent horizon (dimensionless).
pub fn relative_air_mass(apparent_altitude_rad: f64) -> f64 {
    kasten_young_1989(90.0 - apparent_altitude_rad.to_degrees().max(0.0))
}

/// Lowest true altitude, in degrees, at which the Sæmundsson formula is evaluated; below it the
/// refraction is held at its value there (the formula's pole is at −5.11°).
pub const REFRACTION_FLOOR_DEG: f64 = -1.0;

/// Earth's atmospheric refraction, in radians, for a true (geometric) altitude in radians:
/// Sæmundsson 1986, R = 1.02′ / tan(h + 10.3°/(h + 5.11°)) with h in degrees, for 10 °C and
/// 101 kPa; ≈ 29′ at the horizon. Held at its −1° value for lower altitudes and tends to 0 at
/// the zenith; never negative.
pub fn refraction_saemundsson(true_altitude_rad: f64) -> f64 {
    let h = true_altitude_rad
        .to_degrees()
        .clamp(REFRACTION_FLOOR_DEG, 90.0);
    let arg = (h + 10.3 / (h + 5.11)).to_radians();
    let r_arcmin = 1.02 / arg.tan() - 1.02 / (90.0 + 10.3 / 95.11f64).to_radians().tan();
    (r_arcmin / 60.0).to_radians().max(0.0)
}

/// Apparent altitude in radians for a true altitude in radians, with Earth's refraction
/// multiplied by `refraction_scale` (0 = no refraction; see
/// [`super::AtmosphereSpec::refraction_scale`]). Monotonic in the true altitude for scales up to
/// [`crate::world::MAX_REFRACTION_SCALE`].
pub fn apparent_altitude(true_altitude_rad: f64, refraction_scale: f64) -> f64 {
    if refraction_scale <= 0.0 {
        return true_altitude_rad;
    }
    true_altitude_rad + refraction_scale * refraction_saemundsson(true_altitude_rad)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn kasten_young_pvlib_values() {
        // pvlib test_atmosphere.py (Kasten & Young 1989): z = 89.9 → 36.467, 80 → 5.586, 0 → 1.000.
        assert!((kasten_young_1989(89.9) - 36.467).abs() < 1e-3);
        assert!((kasten_young_1989(80.0) - 5.586).abs() < 1e-3);
        assert!((kasten_young_1989(0.0) - 1.000).abs() < 1e-3);
    }

    #[test]
    fn kasten_young_table() {
        // Computed from the Kasten & Young 1989 formula (regression).
        let cases = [
            (0.0, 0.9997),
            (30.0, 1.1540),
            (45.0, 1.4126),
            (60.0, 1.9943),
            (70.0, 2.9031),
            (75.0, 3.8129),
            (80.0, 5.5860),
            (85.0, 10.306),
            (88.0, 19.433),
            (90.0, 37.920),
        ];
        for (z, m) in cases {
            assert!(
                (kasten_young_1989(z) - m).abs() < 1e-3,
                "z {z}: {}",
                kasten_young_1989(z)
            );
        }
        assert!((kasten_young_1989(90.0) - HORIZON_AIR_MASS_KY89).abs() < 1e-6);
    }

    #[test]
    fn young_1994_pvlib_values() {
        // pvlib test_atmosphere.py (Young 1994): z = 89.9 → 30.733, 80 → 5.541.
        assert!((young_1994(89.9) - 30.733).abs() < 1e-3);
        assert!((young_1994(80.0) - 5.541).abs() < 1e-3);
    }

    #[test]
    fn below_horizon_is_held_and_finite() {
        let h = relative_air_mass(0.0);
        for deg in [-0.5, -1.0, -5.0, -30.0, -90.0] {
            assert_eq!(relative_air_mass(f64::to_radians(deg)), h);
        }
        assert!(kasten_young_1989(120.0).is_finite());
        assert!(young_1994(150.0).is_finite());
    }

    #[test]
    fn pressure_scaling() {
        // PVLIB docs: absolute air mass = relative × p / 101325 Pa.
        assert!((absolute_air_mass(2.0, 50.6625) - 1.0).abs() < 1e-12);
    }

    #[test]
    fn refraction_values_and_monotonic_apparent_altitude() {
        // Computed from Sæmundsson's formula (regression): R(0) = 28.98′; the zenith offset
        // that makes R(90°) = 0 adds only 0.002′.
        let r0 = refraction_saemundsson(0.0).to_degrees() * 60.0;
        assert!((r0 - 28.98).abs() < 0.01, "{r0}");
        assert!(refraction_saemundsson(std::f64::consts::FRAC_PI_2).abs() < 1e-12);
        let mut last = f64::NEG_INFINITY;
        for i in 0..=2000 {
            let h = f64::to_radians(-10.0 + 100.0 * i as f64 / 2000.0);
            let a = apparent_altitude(h, crate::world::MAX_REFRACTION_SCALE);
            assert!(a > last, "not monotonic at {h}");
            last = a;
        }
    }
}

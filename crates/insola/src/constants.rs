//! Physical constants and unit conversions, each with its source.

/// Seconds in a standard day of 86 400 SI seconds (the unit "days" in world files).
pub const SECONDS_PER_DAY: f64 = 86_400.0;

/// Stefan–Boltzmann constant σ, in W m⁻² K⁻⁴ (CODATA 2018, exact from the SI's defined h, k
/// and c; from memory).
pub const STEFAN_BOLTZMANN_W_M2_K4: f64 = 5.670_374_419e-8;

/// Seconds in an hour.
pub const SECONDS_PER_HOUR: f64 = 3_600.0;

/// Astronomical unit in metres (IAU 2012 Resolution B2, exact by definition; from memory).
pub const AU_M: f64 = 1.495_978_707e11;

/// Nominal solar luminosity in watts (IAU 2015 Resolution B3).
pub const SUN_LUMINOSITY_W: f64 = 3.828e26;

/// Nominal solar radius in metres (IAU 2015 Resolution B3).
pub const SUN_RADIUS_M: f64 = 6.957e8;

/// Nominal total solar irradiance at 1 AU in W m⁻² (IAU 2015 Resolution B3).
pub const SOLAR_CONSTANT_W_M2: f64 = 1361.0;

/// Nominal effective temperature of the Sun in kelvin (IAU 2015 Resolution B3).
pub const SUN_TEMPERATURE_K: f64 = 5772.0;

/// Standard atmosphere at sea level in kPa (ISO 2533 / ICAO standard atmosphere; from memory).
pub const STANDARD_PRESSURE_KPA: f64 = 101.325;

/// Refraction at the horizon for Earth's standard atmosphere, radians: 34′
/// (Explanatory Supplement to the Astronomical Almanac, §9.33, as used by almanac offices).
pub const HORIZON_REFRACTION_EARTH_RAD: f64 = 34.0 / 60.0 * std::f64::consts::PI / 180.0;

/// Stellar flux in W m⁻² at `distance_au` from a star of `luminosity_w`.
pub fn flux_at_distance_w_m2(luminosity_w: f64, distance_au: f64) -> f64 {
    let d = distance_au * AU_M;
    luminosity_w / (4.0 * std::f64::consts::PI * d * d)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn nominal_sun_gives_nominal_solar_constant() {
        // IAU 2015 B3: L = 3.828e26 W and S = 1361 W m⁻² are stated as consistent at 1 AU.
        let s = flux_at_distance_w_m2(SUN_LUMINOSITY_W, 1.0);
        assert!((s - SOLAR_CONSTANT_W_M2).abs() < 1.0, "{s}");
    }
}

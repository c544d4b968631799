//! Daylight from the clear sky: published Earth models, and how they are carried over to
//! another world.
//!
//! * Sky (diffuse, horizontal) illuminance by day: the IES Daylighting Committee 1984 clear-sky
//!   model, E_kh = A + B (sin h)^C with A = 0.8 klx, B = 15.5 klx, C = 0.5, for a solar
//!   illuminance constant E_sc = 127.5 klx ("Recommended practice for the calculation of
//!   daylight availability", J. IES 13(4) 381, 1984). Its direct-normal part
//!   E_dn = E_sc exp(−0.21 m) is given too, for checks.
//! * USNO Circular 171 (Janiczek & DeYoung 1987) whole-sky formula for the Sun, also for checks.
//! * Another world: the Earth curve is multiplied by the star's top-of-atmosphere illuminance
//!   over E_sc and by [`sky_brightness_scale`], a simple estimate of how much light a column of
//!   optical depth τ sends down as diffuse light relative to Earth's column.
//! * Sky colour: light scattered once in a plane-parallel, exponentially stratified atmosphere
//!   and seen at the zenith, the star at relative air mass m:
//!   S(λ) = E★(λ) [e^(−τ(λ)) − e^(−τ(λ) m)] / (m − 1) (→ E★ τ e^(−τ) for m → 1), scattering and
//!   extinction both τ(λ) (non-absorbing aerosol). For a high star this is E★ τ(λ) — blue; for a
//!   low one every photon is scattered somewhere and the sky tends to E★ e^(−τ(λ)) — paler. A
//!   documented simple approach, not a radiative-transfer solution: it ignores the phase
//!   function, multiple scattering, ground reflection and ozone.

use super::extinction::Extinction;
use crate::world::AtmosphereSpec;

/// Solar illuminance constant of the IES 1984 daylight model, in lux.
pub const IES_SOLAR_ILLUMINANCE_LUX: f64 = 127_500.0;

/// IES 1984 clear-sky diffuse horizontal illuminance for the Sun at altitude `altitude_deg`
/// (degrees), in lux: 800 + 15 500 (sin h)^0.5. At and below the horizon it returns 800 lx; the
/// model is not meant for negative altitudes (the twilight curve takes over there).
pub fn ies_clear_sky_diffuse_lux(altitude_deg: f64) -> f64 {
    let s = altitude_deg.to_radians().sin().max(0.0);
    800.0 + 15_500.0 * s.sqrt()
}

/// IES 1984 clear-sky direct-normal illuminance for a relative air mass (dimensionless), in lux:
/// E_sc exp(−0.21 m).
pub fn ies_clear_sky_direct_normal_lux(air_mass: f64) -> f64 {
    IES_SOLAR_ILLUMINANCE_LUX * (-0.21 * air_mass).exp()
}

/// USNO Circular 171 (Janiczek & DeYoung 1987) horizontal illuminance from the Sun and the clear
/// sky for an apparent altitude in degrees, in lux (Earth reference, valid from −5° up):
/// 133 775 lx · [exp(−0.21 m) sin h + 0.0289 exp(−0.042 m)(1 + (h + 90°) sin h / 57.29578°)], with
/// the spherical-shell air mass of the same circular.
pub fn usno_sun_illuminance_lux(apparent_altitude_deg: f64) -> f64 {
    let h = apparent_altitude_deg.clamp(-5.0, 90.0);
    let (x, hr) = (753.66156, h.to_radians());
    let s = (x * hr.cos() / (x + 1.0)).asin();
    let m = x * (s.cos() - hr.sin()) + s.cos();
    let v = 133_775.0
        * ((-0.21 * m).exp() * hr.sin()
            + 0.0289 * (-0.042 * m).exp() * (1.0 + (h + 90.0) * hr.sin() / 57.29578));
    v.max(0.0)
}

/// Diffuse fraction of a beam sent down through a non-absorbing layer of vertical optical depth
/// `tau` (dimensionless): D(τ) = 1/(1 + 3τ/4) − e^(−τ), a two-stream estimate for isotropic
/// scatterers (from memory). Grows as τ/4 for thin layers, peaks near τ ≈ 1.5 and falls as
/// 4/(3τ) for thick ones.
pub fn diffuse_fraction_two_stream(tau: f64) -> f64 {
    let t = tau.max(0.0);
    (1.0 / (1.0 + 0.75 * t) - (-t).exp()).max(0.0)
}

/// Brightness of a world's clear sky relative to Earth's for the same star illuminance
/// (dimensionless): D(τ)/D(τ_Earth), τ the vertical optical depth at 550 nm (Rayleigh +
/// aerosol) and D [`diffuse_fraction_two_stream`]. 1 for the default atmosphere, 0 when airless.
pub fn sky_brightness_scale(atmosphere: &AtmosphereSpec) -> f64 {
    let tau = Extinction::new(atmosphere).total_at(550.0);
    let tau_ref = Extinction::new(&AtmosphereSpec::default()).total_at(550.0);
    diffuse_fraction_two_stream(tau) / diffuse_fraction_two_stream(tau_ref)
}

/// Relative spectral weight of skylight, ln S(λ) − ln E★(λ), on the spectrum grid, for the star
/// at relative air mass `air_mass`: ln{[e^(−τ) − e^(−τ m)]/(m − 1)} (see the module notes).
/// Entries are −∞ where nothing scatters.
pub fn ln_sky_weight(extinction: &Extinction, air_mass: f64) -> Vec<f64> {
    let x = air_mass.max(0.0) - 1.0;
    extinction
        .rayleigh()
        .iter()
        .zip(extinction.aerosol())
        .map(|(r, a)| {
            let tau = r + a;
            if tau <= 0.0 {
                return f64::NEG_INFINITY;
            }
            // (1 − e^(−τx))/x, written to stay exact for x near 0.
            let g = if x.abs() < 1e-12 {
                tau
            } else {
                -(-tau * x).exp_m1() / x
            };
            -tau + g.ln()
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::light::kasten_young_1989;

    fn air_mass_deg(apparent_altitude_deg: f64) -> f64 {
        kasten_young_1989(90.0 - apparent_altitude_deg.max(0.0))
    }

    #[test]
    fn ies_clear_sky_values() {
        // Computed from the IES 1984 clear-sky model with E_sc 127.5 klx and the Kasten & Young
        // air mass (regression), tolerance 0.1 klx.
        let cases = [
            (10.0, 39.5, 7.3),
            (30.0, 83.9, 11.8),
            (60.0, 100.1, 15.2),
            (90.0, 103.4, 16.3),
        ];
        for (h, dn, kh) in cases {
            let m = air_mass_deg(h);
            assert!(
                (ies_clear_sky_direct_normal_lux(m) / 1e3 - dn).abs() < 0.1,
                "dn {h}"
            );
            assert!(
                (ies_clear_sky_diffuse_lux(h) / 1e3 - kh).abs() < 0.1,
                "kh {h}"
            );
        }
    }

    #[test]
    fn usno_values() {
        // USNO Circular 171 program certification value, sun at the zenith: 123 786 lx, 5 lx
        // (Circ. 171 Table A, via the skylight R package test).
        assert!((usno_sun_illuminance_lux(90.0) - 123_786.0).abs() < 5.0);
        // Computed from the same formula (regression).
        for (h, want) in [
            (60.0, 102_945.0),
            (30.0, 51_263.0),
            (10.0, 11_080.0),
            (5.0, 4085.0),
            (0.0, 757.0),
        ] {
            assert!(
                (usno_sun_illuminance_lux(h) / want - 1.0).abs() < 2e-3,
                "{h}"
            );
        }
    }

    #[test]
    fn brightness_scale() {
        assert!((sky_brightness_scale(&AtmosphereSpec::default()) - 1.0).abs() < 1e-12);
        assert_eq!(sky_brightness_scale(&AtmosphereSpec::airless()), 0.0);
        let thin = AtmosphereSpec {
            surface_pressure_kpa: 10.0,
            aerosol_angstrom_beta: 0.0,
            ..Default::default()
        };
        assert!(sky_brightness_scale(&thin) < 0.2);
        // Thin-layer limit: D(τ) → τ/4.
        assert!((diffuse_fraction_two_stream(1e-4) / 2.5e-5 - 1.0).abs() < 1e-3);
    }
}

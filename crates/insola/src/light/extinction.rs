//! Extinction of a beam by the air: Rayleigh scattering by the gas, aerosol (Ångström law) and
//! the direct-beam transmission exp(−τ(λ) m).
//!
//! * Rayleigh optical depth: Bodhaine et al. 1999 (J. Atmos. Oceanic Technol. 16, 1854) eq. 30,
//!   for Earth's air at 1013.25 hPa and 360 ppm CO₂, scaled linearly by the surface pressure and
//!   by [`AtmosphereSpec::rayleigh_scale`].
//! * Aerosol: Ångström's law τ_a = β λ^(−α), λ in µm. An airless world has no aerosol.
//! * No gaseous absorption (ozone, water vapour) is modelled.

use super::spectrum::{SPECTRUM_LEN, Spectrum, wavelength_nm};
use crate::world::AtmosphereSpec;

/// Rayleigh optical depth of a vertical column of Earth's air at sea level (1013.25 hPa), for a
/// wavelength in micrometres (dimensionless): Bodhaine et al. 1999 eq. 30,
/// τ = 0.0021520 (1.0455996 − 341.29061 λ⁻² − 0.90230850 λ²)/(1 + 0.0027059889 λ⁻² − 85.968563 λ²).
/// Meant for 0.25–4 µm; non-positive input gives 0.
pub fn rayleigh_optical_depth_bodhaine(wavelength_um: f64) -> f64 {
    if wavelength_um.is_nan() || wavelength_um <= 0.0 {
        return 0.0;
    }
    let l2 = wavelength_um * wavelength_um;
    let l_2 = 1.0 / l2;
    let num = 1.0455996 - 341.29061 * l_2 - 0.90230850 * l2;
    let den = 1.0 + 0.0027059889 * l_2 - 85.968563 * l2;
    (0.0021520 * num / den).max(0.0)
}

/// Aerosol optical depth by Ångström's law, τ = β λ^(−α), for a wavelength in micrometres
/// (dimensionless).
pub fn angstrom_optical_depth(wavelength_um: f64, beta: f64, alpha: f64) -> f64 {
    if wavelength_um.is_nan() || wavelength_um <= 0.0 {
        return 0.0;
    }
    (beta * wavelength_um.powf(-alpha)).max(0.0)
}

/// Vertical optical depths of one atmosphere on the spectrum grid (1 nm, 360–830 nm).
#[derive(Debug, Clone, PartialEq)]
pub struct Extinction {
    rayleigh: Vec<f64>,
    aerosol: Vec<f64>,
}

impl Extinction {
    /// The zenith optical depths of `atmosphere`. The spec is assumed valid (see
    /// [`AtmosphereSpec::validate`]); negative numbers are treated as 0.
    pub fn new(atmosphere: &AtmosphereSpec) -> Self {
        let airless = atmosphere.is_airless();
        let ray_scale = if airless {
            0.0
        } else {
            (atmosphere.pressure_ratio() * atmosphere.rayleigh_scale).max(0.0)
        };
        let beta = if airless {
            0.0
        } else {
            atmosphere.aerosol_angstrom_beta
        };
        let (mut rayleigh, mut aerosol) = (
            Vec::with_capacity(SPECTRUM_LEN),
            Vec::with_capacity(SPECTRUM_LEN),
        );
        for i in 0..SPECTRUM_LEN {
            let um = wavelength_nm(i) * 1e-3;
            rayleigh.push(ray_scale * rayleigh_optical_depth_bodhaine(um));
            aerosol.push(angstrom_optical_depth(
                um,
                beta,
                atmosphere.aerosol_angstrom_alpha,
            ));
        }
        Self { rayleigh, aerosol }
    }

    /// Vertical Rayleigh optical depth at grid sample `i`.
    pub fn rayleigh(&self) -> &[f64] {
        &self.rayleigh
    }

    /// Vertical aerosol optical depth at each grid sample.
    pub fn aerosol(&self) -> &[f64] {
        &self.aerosol
    }

    /// Total vertical optical depth at each grid sample, as a spectrum (dimensionless).
    pub fn total(&self) -> Spectrum {
        let mut i = 0;
        Spectrum::from_fn(|_| {
            let v = self.rayleigh[i] + self.aerosol[i];
            i += 1;
            v
        })
    }

    /// Total vertical optical depth at the grid wavelength nearest to `wavelength_nm`.
    pub fn total_at(&self, wavelength_nm: f64) -> f64 {
        let i = ((wavelength_nm - 360.0).round().max(0.0) as usize).min(SPECTRUM_LEN - 1);
        self.rayleigh[i] + self.aerosol[i]
    }

    /// Spectral transmission of the direct beam, exp(−τ(λ) m), for a relative air mass `m`
    /// (dimensionless; pressure is already in τ).
    pub fn transmission(&self, air_mass: f64) -> Spectrum {
        self.total().map(|_, tau| (-tau * air_mass.max(0.0)).exp())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn bodhaine_values() {
        // Computed from Bodhaine et al. 1999 eq. 30 (regression); Hansen & Travis 1974 and
        // Bucholtz 1995 agree within 0.3 %. Tolerance 0.5 %.
        let cases = [
            (0.400, 0.3602),
            (0.450, 0.2211),
            (0.500, 0.1434),
            (0.550, 0.0971),
            (0.600, 0.0681),
            (0.650, 0.0492),
            (0.700, 0.0364),
        ];
        for (l, tau) in cases {
            let v = rayleigh_optical_depth_bodhaine(l);
            assert!((v / tau - 1.0).abs() < 5e-3, "{l}: {v}");
            // Hansen & Travis 1974 (Space Sci. Rev. 16, 527) as an independent check.
            let ht = 0.008569 * l.powi(-4) * (1.0 + 0.0113 * l.powi(-2) + 0.00013 * l.powi(-4));
            assert!((v / ht - 1.0).abs() < 5e-3, "H&T {l}: {ht}");
        }
    }

    #[test]
    fn scaling_and_airless() {
        let earth = Extinction::new(&AtmosphereSpec::default());
        let half = Extinction::new(&AtmosphereSpec {
            surface_pressure_kpa: 101.325 / 2.0,
            ..Default::default()
        });
        let i = 190; // 550 nm
        assert!((half.rayleigh()[i] * 2.0 - earth.rayleigh()[i]).abs() < 1e-12);
        assert_eq!(half.aerosol()[i], earth.aerosol()[i]);
        // Ångström: β 0.05, α 1.3 at 0.55 µm → 0.05 × 0.55^−1.3 = 0.1087 (computed).
        assert!((earth.aerosol()[i] - 0.1087).abs() < 1e-3);
        let none = Extinction::new(&AtmosphereSpec::airless());
        assert!(none.transmission(38.0).values().iter().all(|&t| t == 1.0));
        assert_eq!(rayleigh_optical_depth_bodhaine(-1.0), 0.0);
    }

    #[test]
    fn transmission_reddens() {
        let e = Extinction::new(&AtmosphereSpec::default());
        let t = e.transmission(5.0);
        assert!(t.values()[40] < t.values()[300]);
        assert!((e.total_at(550.0) - (0.0971 + 0.1087)).abs() < 2e-3);
    }
}

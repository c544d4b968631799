//! Spectra sampled on the wavelength grid of the CIE 1931 table (1 nm, 360–830 nm), and Planck's
//! law for a star's light.

use super::cie1931::{CMF_FIRST_NM, CMF_LEN, CMF_STEP_NM};

/// Number of samples of a [`Spectrum`] (one per nanometre from 360 to 830 nm).
pub const SPECTRUM_LEN: usize = CMF_LEN;

/// First radiation constant for spectral exitance, c₁ = 2πhc², in W m² (CODATA exact h and c).
pub const PLANCK_C1_W_M2: f64 = 3.741_771_852e-16;

/// Second radiation constant c₂ = hc/k, in m K (CODATA exact; CIE 015 rounds it to 1.4388e-2).
pub const PLANCK_C2_M_K: f64 = 1.438_776_877e-2;

pub use crate::constants::STEFAN_BOLTZMANN_W_M2_K4;

/// Wavelength of sample `i` of a [`Spectrum`], in nanometres.
pub fn wavelength_nm(i: usize) -> f64 {
    CMF_FIRST_NM + CMF_STEP_NM * i as f64
}

/// Planck spectral exitance of a black body, M(λ, T) = c₁ λ⁻⁵ / (exp(c₂/(λT)) − 1), in
/// W m⁻² per metre of wavelength, for a wavelength in metres and a temperature in kelvin.
/// Returns 0 for non-positive or non-finite input, and never overflows (exp of large arguments
/// gives +∞ and the result 0).
pub fn planck_spectral_exitance(wavelength_m: f64, temperature_k: f64) -> f64 {
    if !(wavelength_m > 0.0 && temperature_k > 0.0 && wavelength_m.is_finite()) {
        return 0.0;
    }
    let x = PLANCK_C2_M_K / (wavelength_m * temperature_k);
    let v = PLANCK_C1_W_M2 / wavelength_m.powi(5) / x.exp_m1();
    if v.is_finite() { v } else { 0.0 }
}

/// A spectral distribution (any radiometric quantity per nanometre) sampled at 1 nm from 360 to
/// 830 nm. Values are in whatever unit the maker chose; colour only uses their ratios.
#[derive(Debug, Clone, PartialEq)]
pub struct Spectrum {
    values: Vec<f64>,
}

impl Spectrum {
    /// A spectrum from a function of wavelength in nanometres.
    pub fn from_fn(mut f: impl FnMut(f64) -> f64) -> Self {
        Self {
            values: (0..SPECTRUM_LEN).map(|i| f(wavelength_nm(i))).collect(),
        }
    }

    /// The Planck spectral exitance of a black body at `temperature_k`, in W m⁻² nm⁻¹.
    pub fn blackbody(temperature_k: f64) -> Self {
        Self::from_fn(|nm| planck_spectral_exitance(nm * 1e-9, temperature_k) * 1e-9)
    }

    /// The samples, index `i` at [`wavelength_nm`]`(i)`.
    pub fn values(&self) -> &[f64] {
        &self.values
    }

    /// This spectrum multiplied sample by sample by `f(wavelength_nm, value)`.
    pub fn map(&self, mut f: impl FnMut(f64, f64) -> f64) -> Self {
        Self {
            values: self
                .values
                .iter()
                .enumerate()
                .map(|(i, &v)| f(wavelength_nm(i), v))
                .collect(),
        }
    }

    /// This spectrum multiplied sample by sample by another one.
    pub fn product(&self, other: &Spectrum) -> Self {
        Self {
            values: self
                .values
                .iter()
                .zip(&other.values)
                .map(|(a, b)| a * b)
                .collect(),
        }
    }

    /// Integral over 360–830 nm as the plain sum × 1 nm that CIE 015 prescribes for
    /// tristimulus values, in (unit of the samples) × nm.
    pub fn integral(&self) -> f64 {
        self.values.iter().sum::<f64>() * CMF_STEP_NM
    }
}

/// Total exitance of a black body, σT⁴, in W m⁻² (all wavelengths).
pub fn blackbody_total_exitance(temperature_k: f64) -> f64 {
    STEFAN_BOLTZMANN_W_M2_K4 * temperature_k.powi(4)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn grid() {
        assert_eq!(wavelength_nm(0), 360.0);
        assert_eq!(wavelength_nm(SPECTRUM_LEN - 1), 830.0);
    }

    #[test]
    fn planck_peak_follows_wien() {
        // Wien's displacement law (b = 2.897771955e-3 m K, CODATA): peak of M(λ) for 5772 K at
        // 502.0 nm.
        let s = Spectrum::blackbody(5772.0);
        let (imax, _) =
            s.values().iter().enumerate().fold(
                (0, 0.0),
                |acc, (i, &v)| if v > acc.1 { (i, v) } else { acc },
            );
        assert!((wavelength_nm(imax) - 502.0).abs() <= 1.0);
    }

    #[test]
    fn planck_integrates_to_stefan_boltzmann() {
        // Integrating Planck's law over a wide range must give σT⁴ (Stefan–Boltzmann law).
        let t = 3000.0;
        let mut sum = 0.0;
        let n = 200_000;
        let (a, b) = (50e-9, 200e-6);
        let dl = (b - a) / n as f64;
        for i in 0..n {
            sum += planck_spectral_exitance(a + (i as f64 + 0.5) * dl, t) * dl;
        }
        assert!((sum / blackbody_total_exitance(t) - 1.0).abs() < 1e-3);
    }

    #[test]
    fn planck_is_safe_on_bad_input() {
        for (l, t) in [
            (0.0, 5000.0),
            (-1.0, 5000.0),
            (5e-7, 0.0),
            (5e-7, f64::NAN),
            (1e-9, 1.0),
        ] {
            let v = planck_spectral_exitance(l, t);
            assert!(v.is_finite() && v >= 0.0);
        }
    }

    #[test]
    fn summed_integral_of_constant() {
        let s = Spectrum::from_fn(|_| 2.0);
        assert!((s.integral() - 942.0).abs() < 1e-9);
    }
}

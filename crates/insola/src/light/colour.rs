//! From a spectrum to colour: CIE 1931 XYZ, chromaticity, linear sRGB, correlated colour
//! temperature and luminous efficacy.
//!
//! * XYZ: CIE 015 summation at 1 nm over 360–830 nm with the CIE 1931 2° observer.
//! * Linear sRGB: the XYZ → RGB matrix of IEC 61966-2-1:1999 (D65 white).
//! * Correlated colour temperature (CCT): the temperature of the nearest point of the Planckian
//!   locus in the CIE 1960 (u, v) diagram, as CIE 015 defines it; the locus is computed from this
//!   module's own Planck × CMF sums and searched directly (not Robertson's table). McCamy's 1992
//!   cubic (Color Res. Appl. 17, 142) is offered as a quick approximation, and the Kim et al. 2002
//!   cubic spline of the locus as an independent check.
//! * Luminous efficacy: 683 lm/W × ∫ȳE dλ / ∫E dλ, the denominator over the whole spectrum.

use std::sync::OnceLock;

use serde::{Deserialize, Serialize};

use super::cie1931::CIE1931_2DEG;
use super::spectrum::{Spectrum, blackbody_total_exitance};

/// Maximum luminous efficacy of radiation K_m, in lumens per watt (the SI definition of the
/// candela fixes 683 lm/W at 540 THz).
pub const MAX_LUMINOUS_EFFICACY_LM_PER_W: f64 = 683.0;

/// CIE 1931 tristimulus values, in the unit of the spectrum × nm (Y is proportional to
/// luminance or illuminance).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Xyz {
    /// Tristimulus X.
    pub x: f64,
    /// Tristimulus Y (luminous).
    pub y: f64,
    /// Tristimulus Z.
    pub z: f64,
}

impl Xyz {
    /// Chromaticity (x, y) = (X, Y)/(X + Y + Z), dimensionless; `None` for a black spectrum.
    pub fn chromaticity(&self) -> Option<[f64; 2]> {
        let s = self.x + self.y + self.z;
        if s > 0.0 && s.is_finite() {
            Some([self.x / s, self.y / s])
        } else {
            None
        }
    }

    /// Linear sRGB (IEC 61966-2-1, D65) in the same scale as Y (so Y = 1 ↦ white (1, 1, 1) for
    /// a D65 source); channels may be negative or above 1 for colours outside the gamut.
    pub fn to_linear_srgb(&self) -> [f64; 3] {
        let (x, y, z) = (self.x, self.y, self.z);
        [
            3.2406 * x - 1.5372 * y - 0.4986 * z,
            -0.9689 * x + 1.8758 * y + 0.0415 * z,
            0.0557 * x - 0.2040 * y + 1.0570 * z,
        ]
    }
}

/// Tristimulus values of a spectrum (CIE 015 summation at 1 nm), in its unit × nm.
pub fn tristimulus(spectrum: &Spectrum) -> Xyz {
    let mut out = Xyz::default();
    for (s, c) in spectrum.values().iter().zip(CIE1931_2DEG.iter()) {
        out.x += s * c[0];
        out.y += s * c[1];
        out.z += s * c[2];
    }
    out
}

/// Normalised light colour in linear sRGB: negative channels (outside the sRGB gamut) clamped
/// to 0, then divided by the largest channel so that it is 1. A black or non-finite input
/// gives white (1, 1, 1), so that colour × illuminance is still 0.
pub fn normalised_colour(xyz: &Xyz) -> [f64; 3] {
    let rgb = xyz
        .to_linear_srgb()
        .map(|c| if c.is_finite() { c.max(0.0) } else { 0.0 });
    let m = rgb[0].max(rgb[1]).max(rgb[2]);
    if m > 0.0 {
        rgb.map(|c| c / m)
    } else {
        [1.0; 3]
    }
}

/// Normalised linear-sRGB colour of chromaticity (x, y); see [`normalised_colour`].
pub fn normalised_colour_xy(xy: [f64; 2]) -> [f64; 3] {
    if xy[1] <= 0.0 {
        return [1.0; 3];
    }
    let xyz = Xyz {
        x: xy[0] / xy[1],
        y: 1.0,
        z: (1.0 - xy[0] - xy[1]) / xy[1],
    };
    normalised_colour(&xyz)
}

/// The sRGB transfer function (IEC 61966-2-1; constants from memory): linear channel in, encoded
/// channel out, both 0–1 (input clamped to that range).
pub fn srgb_encode(linear: f64) -> f64 {
    let c = linear.clamp(0.0, 1.0);
    if c <= 0.0031308 {
        12.92 * c
    } else {
        1.055 * c.powf(1.0 / 2.4) - 0.055
    }
}

/// Luminous efficacy of a spectrum, in lm/W: 683 lm/W × ∫ȳE dλ / `total_power`, where
/// `total_power` is the integral of the same spectrum over *all* wavelengths (same unit as the
/// spectrum × nm). Returns 0 when the total is not positive.
pub fn luminous_efficacy(spectrum: &Spectrum, total_power: f64) -> f64 {
    if total_power > 0.0 && total_power.is_finite() {
        MAX_LUMINOUS_EFFICACY_LM_PER_W * tristimulus(spectrum).y / total_power
    } else {
        0.0
    }
}

/// Luminous efficacy of a black body's radiation at `temperature_k`, in lm/W (visible part by
/// 1-nm summation, total by σT⁴). About 92 lm/W at 5772 K; 0 for non-positive temperatures.
pub fn blackbody_luminous_efficacy(temperature_k: f64) -> f64 {
    luminous_efficacy(
        &Spectrum::blackbody(temperature_k),
        blackbody_total_exitance(temperature_k),
    )
}

/// Chromaticity (x, y) of a black body at `temperature_k` from the CIE 1931 table.
pub fn planckian_xy(temperature_k: f64) -> [f64; 2] {
    tristimulus(&Spectrum::blackbody(temperature_k))
        .chromaticity()
        .unwrap_or([1.0 / 3.0; 2])
}

/// Kim et al. 2002 cubic-spline approximation of the Planckian locus (valid 1667–25 000 K):
/// chromaticity (x, y) for a temperature in kelvin; `None` outside the valid range.
pub fn planckian_xy_kim(temperature_k: f64) -> Option<[f64; 2]> {
    if !(1667.0..=25000.0).contains(&temperature_k) {
        return None;
    }
    let t = 1e3 / temperature_k;
    let x = if temperature_k < 4000.0 {
        -0.2661239 * t.powi(3) - 0.2343589 * t * t + 0.8776956 * t + 0.179910
    } else {
        -3.0258469 * t.powi(3) + 2.1070379 * t * t + 0.2226347 * t + 0.240390
    };
    let y = if temperature_k < 2222.0 {
        -1.1063814 * x.powi(3) - 1.34811020 * x * x + 2.18555832 * x - 0.20219683
    } else if temperature_k < 4000.0 {
        -0.9549476 * x.powi(3) - 1.37418593 * x * x + 2.09137015 * x - 0.16748867
    } else {
        3.0817580 * x.powi(3) - 5.87338670 * x * x + 3.75112997 * x - 0.37001483
    };
    Some([x, y])
}

/// McCamy's 1992 cubic approximation of the correlated colour temperature, in kelvin, from
/// chromaticity (x, y): n = (x − 0.3320)/(y − 0.1858), CCT = −449n³ + 3525n² − 6823.3n + 5520.33.
/// Good to a few kelvin between about 2850 and 6500 K; worse outside.
pub fn cct_mccamy(xy: [f64; 2]) -> f64 {
    let n = (xy[0] - 0.3320) / (xy[1] - 0.1858);
    -449.0 * n.powi(3) + 3525.0 * n * n - 6823.3 * n + 5520.33
}

/// Lowest temperature on the searched Planckian locus, in kelvin.
pub const CCT_MIN_K: f64 = 500.0;
/// Highest temperature on the searched Planckian locus, in kelvin.
pub const CCT_MAX_K: f64 = 1.0e6;

/// CIE 1960 UCS coordinates (u, v) of chromaticity (x, y).
pub fn xy_to_uv1960(xy: [f64; 2]) -> [f64; 2] {
    let d = -2.0 * xy[0] + 12.0 * xy[1] + 3.0;
    [4.0 * xy[0] / d, 6.0 * xy[1] / d]
}

/// Planckian locus sampled in reciprocal temperature: (mired, u, v), from 2000 mired (500 K) to
/// 1 mired (10⁶ K) in 2-mired steps plus the 1-mired end.
fn locus() -> &'static [(f64, f64, f64)] {
    static LOCUS: OnceLock<Vec<(f64, f64, f64)>> = OnceLock::new();
    LOCUS.get_or_init(|| {
        let mut mireds: Vec<f64> = (0..1000).map(|k| 2000.0 - 2.0 * k as f64).collect();
        mireds.push(1.0);
        mireds
            .into_iter()
            .map(|mired| {
                let [u, v] = xy_to_uv1960(planckian_xy(1e6 / mired));
                (mired, u, v)
            })
            .collect()
    })
}

/// Correlated colour temperature, in kelvin, of chromaticity (x, y): the temperature of the
/// nearest point on the Planckian locus in the CIE 1960 (u, v) diagram (CIE 015 definition),
/// found on a 2-mired table with projection onto the nearest segment. Clamped to
/// [`CCT_MIN_K`]–[`CCT_MAX_K`]; non-finite input gives NaN.
pub fn cct_from_xy(xy: [f64; 2]) -> f64 {
    if !(xy[0].is_finite() && xy[1].is_finite()) {
        return f64::NAN;
    }
    let [u, v] = xy_to_uv1960(xy);
    let pts = locus();
    // Coarse pass over every 8th vertex, then the exact segment search around the nearest one.
    let d2 = |p: &(f64, f64, f64)| (u - p.1).powi(2) + (v - p.2).powi(2);
    let mut near = 0;
    for k in (0..pts.len()).step_by(8) {
        if d2(&pts[k]) < d2(&pts[near]) {
            near = k;
        }
    }
    let lo = near.saturating_sub(24);
    let hi = (near + 24).min(pts.len() - 1);
    let mut best = (f64::INFINITY, pts[near].0);
    for w in pts[lo..=hi].windows(2) {
        let (m0, u0, v0) = w[0];
        let (m1, u1, v1) = w[1];
        let (du, dv) = (u1 - u0, v1 - v0);
        let len2 = du * du + dv * dv;
        let t = if len2 > 0.0 {
            (((u - u0) * du + (v - v0) * dv) / len2).clamp(0.0, 1.0)
        } else {
            0.0
        };
        let (pu, pv) = (u0 + t * du, v0 + t * dv);
        let d2 = (u - pu).powi(2) + (v - pv).powi(2);
        if d2 < best.0 {
            best = (d2, m0 + t * (m1 - m0));
        }
    }
    (1e6 / best.1).clamp(CCT_MIN_K, CCT_MAX_K)
}

/// Colour of a light: normalised linear sRGB (max channel 1) and correlated colour temperature.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct LightColour {
    /// Linear sRGB, negative channels clamped to 0, largest channel 1 (see
    /// [`normalised_colour`]).
    pub linear_srgb: [f64; 3],
    /// Correlated colour temperature, in kelvin (see [`cct_from_xy`]).
    pub cct_k: f64,
}

impl LightColour {
    /// Colour of tristimulus values; `None` for a black spectrum.
    pub fn from_xyz(xyz: &Xyz) -> Option<Self> {
        let xy = xyz.chromaticity()?;
        Some(Self {
            linear_srgb: normalised_colour(xyz),
            cct_k: cct_from_xy(xy),
        })
    }
}

/// Colour and ln Y of a spectrum given as natural logarithms of its samples on the spectrum grid
/// (−∞ allowed for zeros). Working in logarithms keeps the colour of a beam that is dimmed by a
/// huge optical depth well defined. Returns `None` when every sample is zero or not finite.
pub fn light_colour_of_ln_spectrum(ln_values: &[f64]) -> Option<(LightColour, f64)> {
    let top = ln_values
        .iter()
        .copied()
        .filter(|v| !v.is_nan())
        .fold(f64::NEG_INFINITY, f64::max);
    if !top.is_finite() {
        return None;
    }
    let mut xyz = Xyz::default();
    for (v, c) in ln_values.iter().zip(CIE1931_2DEG.iter()) {
        let s = if v.is_nan() { 0.0 } else { (v - top).exp() };
        xyz.x += s * c[0];
        xyz.y += s * c[1];
        xyz.z += s * c[2];
    }
    let colour = LightColour::from_xyz(&xyz)?;
    Some((colour, top + xyz.y.ln()))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn cmf_table_spot_values() {
        // CIE 1931 2° observer (colour-science copy of the CIE tables).
        let at = |nm: usize| CIE1931_2DEG[nm - 360];
        assert_eq!(at(450), [0.3362, 0.038, 1.77211]);
        assert_eq!(at(555)[1], 1.0);
        assert_eq!(at(600), [1.0622, 0.631, 0.0008]);
    }

    #[test]
    fn illuminant_a() {
        // CIE 015: illuminant A (Planckian at 2856 K) x = 0.44757, y = 0.40745; tolerance 2e-4
        // (the 1-nm sum over 360–830 nm gives 0.44754, 0.40743).
        let [x, y] = planckian_xy(2856.0);
        assert!(
            (x - 0.44757).abs() < 2e-4 && (y - 0.40745).abs() < 2e-4,
            "{x} {y}"
        );
    }

    #[test]
    fn planckian_table() {
        // Computed from Planck × CIE 1931 1-nm sums, 360–830 nm (regression); tolerance 2e-4.
        let cases = [
            (1000.0, 0.65275, 0.34446),
            (2000.0, 0.52668, 0.41330),
            (2856.0, 0.44754, 0.40743),
            (4000.0, 0.38044, 0.37675),
            (5772.0, 0.32655, 0.33584),
            (6500.0, 0.31353, 0.32363),
            (10000.0, 0.28063, 0.28829),
        ];
        for (t, x, y) in cases {
            let [cx, cy] = planckian_xy(t);
            assert!(
                (cx - x).abs() < 2e-4 && (cy - y).abs() < 2e-4,
                "{t}: {cx} {cy}"
            );
            // Kim et al. 2002 spline as an independent check (within 6e-4 of the table sums).
            if let Some([kx, ky]) = planckian_xy_kim(t) {
                assert!(
                    (kx - cx).abs() < 6e-4 && (ky - cy).abs() < 6e-4,
                    "kim {t}: {kx} {ky}"
                );
            }
        }
    }

    #[test]
    fn srgb_colours_of_black_bodies() {
        // Computed from the IEC 61966-2-1 matrix on the 1-nm sums (regression), max channel 1.
        let cases = [
            (2000.0, [1.0, 0.257, 0.008]),
            (2856.0, [1.0, 0.448, 0.127]),
            (4000.0, [1.0, 0.654, 0.377]),
            (5772.0, [1.0, 0.877, 0.820]),
            (6500.0, [1.0, 0.943, 0.992]),
            (10000.0, [0.609, 0.695, 1.0]),
        ];
        for (t, want) in cases {
            let c = normalised_colour(&tristimulus(&Spectrum::blackbody(t)));
            for k in 0..3 {
                assert!((c[k] - want[k]).abs() < 2e-3, "{t}: {c:?}");
            }
        }
        // Near 6500 K a black body is close to sRGB white (common practice, no source).
        let w = normalised_colour(&tristimulus(&Spectrum::blackbody(6500.0)));
        assert!(w.iter().all(|&c| c > 0.93));
        // 1000 K has a negative blue channel, clamped to 0.
        let r = normalised_colour(&tristimulus(&Spectrum::blackbody(1000.0)));
        assert_eq!(r[2], 0.0);
        assert_eq!(normalised_colour(&Xyz::default()), [1.0; 3]);
    }

    #[test]
    fn cct_round_trip_and_d65() {
        for t in [
            800.0, 1500.0, 2856.0, 4000.0, 5772.0, 6500.0, 12000.0, 30000.0,
        ] {
            let c = cct_from_xy(planckian_xy(t));
            assert!((c / t - 1.0).abs() < 2e-3, "{t} -> {c}");
        }
        // D65 x = 0.31271, y = 0.32902 (CIE 015) has CCT ≈ 6504 K (CIE 015; from memory).
        let d65 = cct_from_xy([0.31271, 0.32902]);
        assert!((d65 - 6504.0).abs() < 15.0, "{d65}");
        // McCamy 1992 agrees within about 15 K at 2856–6500 K (tolerance common practice, no
        // source).
        for t in [2856.0, 4000.0, 5772.0, 6500.0] {
            let m = cct_mccamy(planckian_xy(t));
            assert!((m - t).abs() < 15.0, "mccamy {t}: {m}");
        }
        assert!(cct_from_xy([f64::NAN, 0.3]).is_nan());
    }

    #[test]
    fn efficacy() {
        // Computed from this formula for a 5772 K black body (regression): 92.0 lm/W, i.e. about
        // 125 klx at 1361 W m⁻².
        let k = blackbody_luminous_efficacy(5772.0);
        assert!((k - 92.0).abs() < 0.5, "{k}");
        assert!(blackbody_luminous_efficacy(3000.0) < k);
        assert_eq!(blackbody_luminous_efficacy(0.0), 0.0);
    }

    #[test]
    fn srgb_transfer() {
        assert_eq!(srgb_encode(0.0), 0.0);
        assert!((srgb_encode(1.0) - 1.0).abs() < 1e-12);
        assert!((srgb_encode(0.0031308) - 0.04045).abs() < 1e-4);
    }
}

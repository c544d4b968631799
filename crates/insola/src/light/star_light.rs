//! The star's light at the ground: the main entry of the light module.
//!
//! [`StarLightModel`] is built once from the star's effective temperature and the world's
//! atmosphere. It works out the star's black-body spectrum, its luminous efficacy and colour,
//! and a table of the direct beam's transmission and colour over air mass (256 rows, uniform in
//! ln m from the zenith to the horizon). A query then costs one air-mass formula and one table
//! look-up.
//!
//! Direct beam: spectral transmission exp(−τ(λ) m) (see `extinction`) with the Kasten & Young
//! air mass at the refracted (apparent) altitude, times the fraction of the star's disc above
//! the horizon (a uniform disc cut by a straight horizon), so the light fades out continuously
//! at rise and set. Limb darkening, the flattening of the disc by refraction and the planet's
//! curvature at the horizon are not modelled.

use serde::{Deserialize, Serialize};

use super::airmass::{HORIZON_AIR_MASS_KY89, apparent_altitude, relative_air_mass};
use super::colour::{LightColour, blackbody_luminous_efficacy, light_colour_of_ln_spectrum};
use super::extinction::Extinction;
use super::horizon::{disc_fraction_above_rise, find_rise_altitude};
use super::sky_light::{SkyLight, SkyModel};
use super::spectrum::{SPECTRUM_LEN, planck_spectral_exitance, wavelength_nm};
use super::twilight::TwilightPhase;
use crate::error::{SpecError, check_range};
use crate::world::AtmosphereSpec;

/// Lowest star effective temperature accepted, in kelvin.
pub const MIN_STAR_TEMPERATURE_K: f64 = 500.0;
/// Highest star effective temperature accepted, in kelvin.
pub const MAX_STAR_TEMPERATURE_K: f64 = 100_000.0;
/// Default angular radius of the star's disc, in radians: the Sun seen from 1 au (validation
/// reference, R☉ = 6.957 × 10⁸ m over 1.496 × 10¹¹ m); set the world's own with
/// [`StarLightModel::with_star_angular_radius`].
pub const DEFAULT_STAR_ANGULAR_RADIUS_RAD: f64 = 4.65e-3;

const TABLE_LEN: usize = 256;

/// Light of the star's disc: illuminance on a surface facing the star, and its colour.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct BeamLight {
    /// Illuminance on a surface normal to the beam, in lux.
    pub illuminance_lux: f64,
    /// Colour of the beam.
    pub colour: LightColour,
}

/// Precomputed light of one star through one atmosphere.
#[derive(Debug, Clone, PartialEq)]
pub struct StarLightModel {
    star_temperature_k: f64,
    atmosphere: AtmosphereSpec,
    refraction_scale: f64,
    star_angular_radius_rad: f64,
    rise_altitude_rad: f64,
    efficacy_lm_per_w: f64,
    toa_colour: LightColour,
    ln_m_low: f64,
    ln_m_step: f64,
    /// Rows: ln(illuminance transmission), r, g, b, CCT.
    beam: Vec<[f64; 5]>,
    ln_star_spectrum: Vec<f64>,
    sky: SkyModel,
}

impl StarLightModel {
    /// Builds the model for a star of effective temperature `star_temperature_k` (kelvin,
    /// 500 to 100 000; error field `star.temperature_k`) seen through `atmosphere` (validated;
    /// errors name `atmosphere.<field>`). Takes about a millisecond.
    pub fn new(star_temperature_k: f64, atmosphere: &AtmosphereSpec) -> Result<Self, SpecError> {
        check_range(
            "star.temperature_k",
            star_temperature_k,
            MIN_STAR_TEMPERATURE_K,
            MAX_STAR_TEMPERATURE_K,
        )?;
        atmosphere.validate("atmosphere")?;
        let ln_star: Vec<f64> = (0..SPECTRUM_LEN)
            .map(|i| planck_spectral_exitance(wavelength_nm(i) * 1e-9, star_temperature_k).ln())
            .collect();
        let (toa_colour, ln_y0) = light_colour_of_ln_spectrum(&ln_star).ok_or_else(|| {
            SpecError::out_of_range(
                "star.temperature_k",
                star_temperature_k,
                "a star with visible light",
            )
        })?;
        let extinction = Extinction::new(atmosphere);
        let tau = extinction.total();
        let ln_m_low = relative_air_mass(std::f64::consts::FRAC_PI_2).ln();
        let ln_m_step = (HORIZON_AIR_MASS_KY89.ln() - ln_m_low) / (TABLE_LEN - 1) as f64;
        let mut ln = vec![0.0; SPECTRUM_LEN];
        let beam = (0..TABLE_LEN)
            .map(|k| {
                let m = (ln_m_low + ln_m_step * k as f64).exp();
                for ((out, e), t) in ln.iter_mut().zip(&ln_star).zip(tau.values()) {
                    *out = e - t * m;
                }
                let (c, ln_y) =
                    light_colour_of_ln_spectrum(&ln).unwrap_or((toa_colour, f64::NEG_INFINITY));
                [
                    (ln_y - ln_y0).min(0.0),
                    c.linear_srgb[0],
                    c.linear_srgb[1],
                    c.linear_srgb[2],
                    c.cct_k,
                ]
            })
            .collect();
        let refraction_scale = atmosphere.refraction_scale();
        let rise_altitude_rad =
            find_rise_altitude(refraction_scale, DEFAULT_STAR_ANGULAR_RADIUS_RAD);
        let sky = SkyModel::new(&ln_star, toa_colour, atmosphere, rise_altitude_rad);
        Ok(Self {
            star_temperature_k,
            atmosphere: *atmosphere,
            refraction_scale,
            star_angular_radius_rad: DEFAULT_STAR_ANGULAR_RADIUS_RAD,
            rise_altitude_rad,
            efficacy_lm_per_w: blackbody_luminous_efficacy(star_temperature_k),
            toa_colour,
            ln_m_low,
            ln_m_step,
            beam,
            ln_star_spectrum: ln_star,
            sky,
        })
    }

    /// The same model for a star disc of angular radius `radius_rad` (radians, 0 to π/4; 0 is a
    /// point star whose light switches off at the horizon). Error field
    /// `star.angular_radius_rad`.
    pub fn with_star_angular_radius(mut self, radius_rad: f64) -> Result<Self, SpecError> {
        check_range(
            "star.angular_radius_rad",
            radius_rad,
            0.0,
            std::f64::consts::FRAC_PI_4,
        )?;
        self.star_angular_radius_rad = radius_rad;
        self.rise_altitude_rad = find_rise_altitude(self.refraction_scale, radius_rad);
        self.sky = SkyModel::new(
            &self.ln_star_spectrum,
            self.toa_colour,
            &self.atmosphere,
            self.rise_altitude_rad,
        );
        Ok(self)
    }

    /// Star effective temperature, in kelvin.
    pub fn star_temperature_k(&self) -> f64 {
        self.star_temperature_k
    }

    /// The atmosphere the model was built for.
    pub fn atmosphere(&self) -> &AtmosphereSpec {
        &self.atmosphere
    }

    /// Angular radius of the star's disc used for the horizon fade, radians.
    pub fn star_angular_radius_rad(&self) -> f64 {
        self.star_angular_radius_rad
    }

    /// Luminous efficacy of the star's black-body light, in lm/W (≈ 92 lm/W at 5772 K).
    pub fn luminous_efficacy_lm_per_w(&self) -> f64 {
        self.efficacy_lm_per_w
    }

    /// Geometric altitude of the star's centre at rise and set, in radians (upper limb on the
    /// apparent horizon).
    pub fn rise_altitude_rad(&self) -> f64 {
        self.rise_altitude_rad
    }

    /// Apparent (refracted) altitude, in radians, of a geometric altitude in radians.
    pub fn apparent_altitude_rad(&self, geometric_altitude_rad: f64) -> f64 {
        apparent_altitude(geometric_altitude_rad, self.refraction_scale)
    }

    /// Twilight phase for the star's geometric altitude (radians).
    pub fn phase(&self, geometric_altitude_rad: f64) -> TwilightPhase {
        TwilightPhase::from_altitude(geometric_altitude_rad, self.rise_altitude_rad)
    }

    /// Light above the atmosphere (no extinction) for a top-of-atmosphere irradiance normal to
    /// the beam (W m⁻², distance already included): irradiance × luminous efficacy, and the
    /// star's own colour. Non-finite or negative irradiance counts as 0.
    pub fn top_of_atmosphere(&self, toa_irradiance_w_m2: f64) -> BeamLight {
        BeamLight {
            illuminance_lux: self.toa_lux(toa_irradiance_w_m2),
            colour: self.toa_colour,
        }
    }

    fn toa_lux(&self, irradiance: f64) -> f64 {
        if irradiance.is_finite() {
            irradiance.max(0.0) * self.efficacy_lm_per_w
        } else {
            0.0
        }
    }

    /// Direct beam at the ground for the star's geometric altitude (radians) and the
    /// top-of-atmosphere irradiance normal to the beam (W m⁻²): illuminance on a surface facing
    /// the star (lux), colour and CCT. Zero at and below the star's rise altitude
    /// ([`StarLightModel::rise_altitude_rad`]), faded across its disc above it
    /// ([`disc_fraction_above_rise`]). A NaN altitude counts as −90°.
    pub fn direct_beam(&self, geometric_altitude_rad: f64, toa_irradiance_w_m2: f64) -> BeamLight {
        self.direct_beam_of_disc(
            geometric_altitude_rad,
            toa_irradiance_w_m2,
            self.star_angular_radius_rad,
            self.rise_altitude_rad,
        )
    }

    /// The star's light reaching the ground along the path of another disc (a moon's
    /// reflected starlight): the same extinction at `geometric_altitude_rad`, faded across a
    /// disc of `radius_rad` above `rise_altitude_rad` (all radians).
    pub fn direct_beam_of_disc(
        &self,
        geometric_altitude_rad: f64,
        toa_irradiance_w_m2: f64,
        radius_rad: f64,
        rise_altitude_rad: f64,
    ) -> BeamLight {
        let h = if geometric_altitude_rad.is_nan() {
            -std::f64::consts::FRAC_PI_2
        } else {
            geometric_altitude_rad
        };
        let a = self.apparent_altitude_rad(h);
        let f = ((relative_air_mass(a).ln() - self.ln_m_low) / self.ln_m_step)
            .clamp(0.0, (TABLE_LEN - 1) as f64);
        let i = (f as usize).min(TABLE_LEN - 2);
        let t = f - i as f64;
        let (p, q) = (&self.beam[i], &self.beam[i + 1]);
        let v: [f64; 5] = std::array::from_fn(|k| p[k] + t * (q[k] - p[k]));
        let mx = v[1].max(v[2]).max(v[3]).max(f64::MIN_POSITIVE);
        let lux = self.toa_lux(toa_irradiance_w_m2)
            * v[0].exp()
            * disc_fraction_above_rise(h, rise_altitude_rad, radius_rad);
        BeamLight {
            illuminance_lux: lux,
            colour: LightColour {
                linear_srgb: [v[1] / mx, v[2] / mx, v[3] / mx],
                cct_k: v[4],
            },
        }
    }

    /// Light of the clear sky on a horizontal surface for the star's geometric altitude
    /// (radians) and top-of-atmosphere irradiance (W m⁻²); see [`SkyLight`].
    pub fn sky(&self, geometric_altitude_rad: f64, toa_irradiance_w_m2: f64) -> SkyLight {
        self.sky
            .sky_light(geometric_altitude_rad, self.toa_lux(toa_irradiance_w_m2))
    }

    /// Total illuminance on a horizontal surface, in lux: direct beam × sin(apparent altitude)
    /// + sky light + night floor.
    pub fn horizontal_illuminance_lux(
        &self,
        geometric_altitude_rad: f64,
        toa_irradiance_w_m2: f64,
    ) -> f64 {
        let direct = self
            .direct_beam(geometric_altitude_rad, toa_irradiance_w_m2)
            .illuminance_lux;
        let sin_a = self
            .apparent_altitude_rad(geometric_altitude_rad)
            .sin()
            .max(0.0);
        let sin_a = if sin_a.is_nan() { 0.0 } else { sin_a };
        direct * sin_a
            + self
                .sky(geometric_altitude_rad, toa_irradiance_w_m2)
                .total_lux()
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::light::{
        IES_SOLAR_ILLUMINANCE_LUX, NIGHT_SKY_FLOOR_LUX, normalised_colour, tristimulus,
    };
    use crate::light::{
        Spectrum, ies_clear_sky_direct_normal_lux, kasten_young_1989, usno_sun_illuminance_lux,
    };
    use proptest::prelude::*;

    /// Validation reference: the Sun (T_eff 5772 K, IAU 2015 Resolution B3) under the default
    /// Earth-like sky, with the nominal 1361 W m⁻² (IAU 2015 B3).
    fn earth() -> StarLightModel {
        StarLightModel::new(5772.0, &AtmosphereSpec::default()).unwrap()
    }
    const S0: f64 = 1361.0;

    #[test]
    fn top_of_atmosphere_light() {
        let m = earth();
        // Computed from 683 lm/W × ∫ȳM dλ / σT⁴ for 5772 K (regression): 92.0 lm/W → 125 klx.
        assert!((m.luminous_efficacy_lm_per_w() - 92.0).abs() < 0.5);
        let toa = m.top_of_atmosphere(S0);
        assert!(
            (toa.illuminance_lux / 125_200.0 - 1.0).abs() < 5e-3,
            "{}",
            toa.illuminance_lux
        );
        let bb = normalised_colour(&tristimulus(&Spectrum::blackbody(5772.0)));
        assert!((0..3).all(|k| (toa.colour.linear_srgb[k] - bb[k]).abs() < 1e-9));
        assert!((toa.colour.cct_k - 5772.0).abs() < 10.0);
        // A cooler star gives fewer lux per W m⁻².
        let red = StarLightModel::new(3000.0, &AtmosphereSpec::default()).unwrap();
        assert!(red.top_of_atmosphere(S0).illuminance_lux < 0.6 * toa.illuminance_lux);
        assert_eq!(m.top_of_atmosphere(f64::NAN).illuminance_lux, 0.0);
    }

    #[test]
    fn direct_beam_matches_clear_sky_models() {
        let m = earth();
        let scale = m.top_of_atmosphere(S0).illuminance_lux / IES_SOLAR_ILLUMINANCE_LUX;
        for h in [10.0, 30.0, 60.0, 90.0] {
            let ours = m.direct_beam(f64::to_radians(h), S0).illuminance_lux;
            // IES 1984 clear sky E_dn = E_sc exp(−0.21 m), rescaled to our top-of-atmosphere
            // illuminance; tolerance 8 % (common practice, no source).
            let ies = scale * ies_clear_sky_direct_normal_lux(kasten_young_1989(90.0 - h));
            assert!((ours / ies - 1.0).abs() < 0.08, "{h}: {ours} vs {ies}");
            // USNO Circular 171 horizontal sun + sky (both Earth models, compared as they are):
            // tolerance 6 % from 30° up; at 10° its sky term is about half the IES one, so 35 %
            // (tolerances common practice, no source).
            let usno = usno_sun_illuminance_lux(h);
            let horiz = m.horizontal_illuminance_lux(f64::to_radians(h), S0);
            let tol = if h < 20.0 { 0.35 } else { 0.06 };
            assert!((horiz / usno - 1.0).abs() < tol, "{h}: {horiz} vs {usno}");
        }
    }

    #[test]
    fn sunlight_reddens_as_the_sun_sinks() {
        let m = earth();
        let mut last = m.direct_beam(std::f64::consts::FRAC_PI_2, S0);
        // Noon sun through clear air: CCT a few hundred kelvin below the 5772 K star.
        assert!(last.colour.cct_k < 5772.0 && last.colour.cct_k > 4500.0);
        for i in (0..180).rev() {
            let b = m.direct_beam(f64::to_radians(i as f64 * 0.5), S0);
            assert!(
                b.colour.cct_k < last.colour.cct_k,
                "CCT not falling at {}",
                i as f64 * 0.5
            );
            let ratio = |c: &LightColour| c.linear_srgb[2] / c.linear_srgb[0];
            assert!(
                ratio(&b.colour) <= ratio(&last.colour),
                "not reddening at {}",
                i as f64 * 0.5
            );
            last = b;
        }
        // At the horizon the beam is deep orange-red (common practice, no source).
        assert!(last.colour.cct_k < 2000.0);
    }

    #[test]
    fn sky_light_and_twilight_through_the_model() {
        let m = earth();
        // A 127.5 klx star reproduces the reference curve: handbook twilight values (AMS
        // Glossary; "Lux") and the IES 1984 clear-sky diffuse light by day.
        let irr = IES_SOLAR_ILLUMINANCE_LUX / m.luminous_efficacy_lm_per_w();
        let sky = |d: f64| m.sky(f64::to_radians(d), irr);
        assert!((sky(-6.0).illuminance_lux / 3.4 - 1.0).abs() < 0.01);
        assert!((sky(-12.0).illuminance_lux / 0.008 - 1.0).abs() < 0.01);
        assert!((sky(-18.0).illuminance_lux / 6e-4 - 1.0).abs() < 0.01);
        assert!((sky(30.0).illuminance_lux - 11_800.0).abs() < 100.0);
        assert_eq!(sky(-30.0).night_floor_lux, NIGHT_SKY_FLOOR_LUX);
        // Day sky is blue; twilight deepens to blue after a paler sunset sky.
        assert!(sky(45.0).colour.cct_k > 8000.0);
        assert!(sky(-6.0).colour.cct_k > sky(-1.0).colour.cct_k);
        assert!(sky(-12.0).colour.cct_k > sky(-6.0).colour.cct_k);
        let c = sky(-10.0).colour.linear_srgb;
        assert!(c[2] >= c[0]);
        assert_eq!(sky(-3.0).phase, TwilightPhase::Civil);
        // Rise altitude ≈ −0.833° (Explanatory Supplement: 34′ + 16′), within 0.02°.
        assert!((m.rise_altitude_rad().to_degrees() + 0.8333).abs() < 0.02);
    }

    #[test]
    fn airless_world() {
        let m = StarLightModel::new(5772.0, &AtmosphereSpec::airless()).unwrap();
        let toa = m.top_of_atmosphere(S0).illuminance_lux;
        for d in [90.0, 10.0, 1.0] {
            let b = m.direct_beam(f64::to_radians(d), S0);
            assert!((b.illuminance_lux / toa - 1.0).abs() < 1e-9);
        }
        let s = m.sky(f64::to_radians(30.0), S0);
        assert_eq!(s.illuminance_lux, 0.0);
        assert_eq!(s.total_lux(), NIGHT_SKY_FLOOR_LUX);
        assert_eq!(m.apparent_altitude_rad(0.1), 0.1);
        assert!((m.rise_altitude_rad() + DEFAULT_STAR_ANGULAR_RADIUS_RAD).abs() < 1e-9);
        // Half the disc is up when its centre is on the horizon.
        assert!((m.direct_beam(0.0, S0).illuminance_lux / toa - 0.5).abs() < 1e-9);
        let point = m.clone().with_star_angular_radius(0.0).unwrap();
        assert_eq!(point.direct_beam(-1e-9, S0).illuminance_lux, 0.0);
    }

    #[test]
    fn bad_input_is_a_typed_error() {
        let e = StarLightModel::new(f64::NAN, &AtmosphereSpec::default()).unwrap_err();
        assert_eq!(e.field(), Some("star.temperature_k"));
        let bad = AtmosphereSpec {
            rayleigh_scale: -1.0,
            ..Default::default()
        };
        let e = StarLightModel::new(5000.0, &bad).unwrap_err();
        assert_eq!(e.field(), Some("atmosphere.rayleigh_scale"));
        let e = earth().with_star_angular_radius(3.0).unwrap_err();
        assert_eq!(e.field(), Some("star.angular_radius_rad"));
    }

    #[test]
    #[ignore = "timing; run by hand with --release --ignored --nocapture"]
    fn query_cost() {
        let m = earth();
        let t0 = std::time::Instant::now();
        let m2 = StarLightModel::new(4000.0, &AtmosphereSpec::default()).unwrap();
        let build = t0.elapsed();
        let n = 200_000;
        let t1 = std::time::Instant::now();
        let mut acc = 0.0;
        for i in 0..n {
            let h = -0.3 + 1.8 * i as f64 / n as f64;
            acc += m.direct_beam(h, S0).illuminance_lux + m.sky(h, S0).illuminance_lux;
        }
        let q = t1.elapsed() / n;
        println!(
            "build {build:?}, direct+sky query {q:?} ({acc} {})",
            m2.star_temperature_k()
        );
    }

    fn atmospheres() -> impl Strategy<Value = AtmosphereSpec> {
        prop_oneof![
            Just(AtmosphereSpec::airless()),
            Just(AtmosphereSpec::default()),
            (
                0.0..20_000.0f64,
                0.0..10.0f64,
                0.0..2.0f64,
                -1.0..4.0f64,
                any::<bool>()
            )
                .prop_map(|(p, r, b, a, refr)| AtmosphereSpec {
                    surface_pressure_kpa: p,
                    rayleigh_scale: r,
                    aerosol_angstrom_beta: b,
                    aerosol_angstrom_alpha: a,
                    refraction: refr,
                }),
        ]
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(48))]

        #[test]
        fn outputs_finite_monotonic_continuous(
            t in 2000.0..12_000.0f64,
            atm in atmospheres(),
            d1 in -90.0..90.0f64,
            d2 in -90.0..90.0f64,
            irr in 0.0..5000.0f64,
        ) {
            let m = StarLightModel::new(t, &atm).unwrap();
            let (lo, hi) = (d1.min(d2).to_radians(), d1.max(d2).to_radians());
            let all = |h: f64| {
                let b = m.direct_beam(h, irr);
                let s = m.sky(h, irr);
                (b, s, m.horizontal_illuminance_lux(h, irr))
            };
            for h in [lo, hi] {
                let (b, s, g) = all(h);
                for v in [b.illuminance_lux, s.illuminance_lux, s.total_lux(), g, b.colour.cct_k, s.colour.cct_k]
                    .into_iter()
                    .chain(b.colour.linear_srgb)
                    .chain(s.colour.linear_srgb)
                {
                    prop_assert!(v.is_finite() && v >= 0.0, "{v} at {h}");
                }
                prop_assert!(b.colour.linear_srgb.iter().all(|&c| c <= 1.0 + 1e-12));
            }
            let (bl, sl, gl) = all(lo);
            let (bh, sh, gh) = all(hi);
            prop_assert!(bl.illuminance_lux <= bh.illuminance_lux * (1.0 + 1e-12) + 1e-300);
            prop_assert!(sl.illuminance_lux <= sh.illuminance_lux * (1.0 + 1e-12) + 1e-300);
            prop_assert!(gl <= gh * (1.0 + 1e-12) + 1e-300);
            // Continuity: a 1 µrad step changes nothing by more than 0.1 %.
            let dh = 1e-6;
            let (b2, s2, g2) = all(lo + dh);
            let close = |a: f64, b: f64| (a - b).abs() <= 1e-3 * a.abs().max(b.abs()) + 1e-12;
            prop_assert!(close(bl.illuminance_lux, b2.illuminance_lux), "direct jump at {lo}");
            prop_assert!(close(sl.illuminance_lux, s2.illuminance_lux), "sky jump at {lo}");
            prop_assert!(close(gl, g2), "global jump at {lo}");
        }
    }
}

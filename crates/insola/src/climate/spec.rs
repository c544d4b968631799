//! The `climate` section of a world file: parameters of the energy balance model.

use serde::{Deserialize, Serialize};

use super::albedo::{IceFreeAlbedo, LEGACY_ALBEDO_A0, LEGACY_ALBEDO_A2};
use crate::error::{SpecError, check_range, check_range_open_min};

/// Density of liquid water, kg m⁻³ (climlab `utils/constants.py`: `rho_w = 1000`).
pub const WATER_DENSITY_KG_M3: f64 = 1000.0;
/// Specific heat of liquid water, J kg⁻¹ K⁻¹ (climlab `utils/constants.py`: `cw = 4181.3`).
pub const WATER_SPECIFIC_HEAT_J_KG_K: f64 = 4181.3;

/// Parameters of the seasonal diffusive energy balance model (see the [module docs](super)).
///
/// Read from the `climate` section of a world file. Every field has a default (see
/// [`ClimateSpec::default`]) so a world file may give only the fields it changes. Temperatures
/// are in °C, fluxes in W m⁻², heat capacities in J m⁻² K⁻¹.
///
/// # Tuning a world's climate
///
/// Start with no `climate` section: the ice-free albedo then follows the world's own sky
/// ([`IceFreeAlbedo::FromSky`]: each band's albedo from how high its star stands over the
/// year), so a high-tilt world gets the warm poles its sunlight implies. Then, one knob at a
/// time, checking with `insola climate WORLD`:
///
/// * warmer or colder everywhere: `atmosphere_albedo` (default 0.26; 0.01 less is roughly
///   +1.5 °C in global mean before ice feedback) or `olr_a_w_m2` (default 210; 2 W m⁻² less is
///   about +1 °C, as `B` is 2 W m⁻² K⁻¹);
/// * smaller or larger pole–equator contrast: `diffusion_w_m2_per_k` (default 0.555; larger
///   evens temperatures out);
/// * milder or harsher seasons: `mixed_layer_depth_m` (deeper water stores more heat) and
///   `land_fraction`;
/// * more or less ice: `ice_temperature_c` and `ice_albedo`, or `ice_enabled: false`.
///
/// An explicit latitude law (`albedo_a0`, `albedo_a2` in the file, [`IceFreeAlbedo::Legendre`]
/// in code) replaces the sky law; it is the same for any orbit, so its `a2` should only make
/// the poles brighter (`a2 > 0`) where the poles' sun is low, as on Earth. `insola check` warns
/// when it contradicts the world's tilt. A world file gives either `atmosphere_albedo` or the
/// `albedo_a0`/`albedo_a2` pair, not both; a file giving only one of the pair takes the other
/// from Earth's climlab set (a0 0.33, a2 0.25), as older files expect.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "ClimateSection", into = "ClimateSection")]
pub struct ClimateSpec {
    /// Number of latitude bands, uniform in sin(latitude). Default 90.
    pub bands: usize,
    /// Model time steps per orbital year. Default 180.
    pub steps_per_year: usize,
    /// Depth of the ocean mixed layer, m; sets the heat capacity of the ocean part of each band.
    /// Default 50: the ocean heat capacity of Williams & Kasting (1997), 40 times their land
    /// value (2.1×10⁸ J m⁻² K⁻¹, from memory). The climlab seasonal EBM's 10 m
    /// ([`ClimateSpec::climlab_seasonal`]) gives a high-tilt world's polar winters seasonal ice
    /// that tips it into a snowball.
    pub mixed_layer_depth_m: f64,
    /// Fraction of each band that is land, 0–1 (same in every band). Default 0.
    pub land_fraction: f64,
    /// Effective seasonal heat capacity of land, J m⁻² K⁻¹. Default 5.25×10⁶
    /// (Williams & Kasting 1997, from memory).
    pub land_heat_capacity_j_m2_per_k: f64,
    /// Outgoing longwave radiation at 0 °C, `A` in `OLR = A + B·T`, W m⁻². Default 210.
    pub olr_a_w_m2: f64,
    /// Outgoing longwave radiation slope, `B` in `OLR = A + B·T` (T in °C), W m⁻² K⁻¹. Default 2.
    pub olr_b_w_m2_per_k: f64,
    /// Meridional heat diffusion coefficient `D`, W m⁻² K⁻¹. Default 0.555.
    pub diffusion_w_m2_per_k: f64,
    /// How ice-free bands reflect sunlight. Default [`IceFreeAlbedo::FromSky`] with an
    /// atmosphere albedo of 0.26; in a world file `atmosphere_albedo: 0.26`, or
    /// `albedo_a0`/`albedo_a2` for the explicit latitude law.
    pub ice_free_albedo: IceFreeAlbedo,
    /// Whether surfaces colder than `ice_temperature_c` take the ice albedo. Default true.
    pub ice_enabled: bool,
    /// Albedo of ice-covered bands. Default 0.62.
    pub ice_albedo: f64,
    /// Temperature below which a band is ice covered, °C. Default −10.
    pub ice_temperature_c: f64,
    /// Heat capacity of the thin surface layer that follows the day-night cycle, J m⁻² K⁻¹.
    /// Default 6×10⁵: with the default damping a 24 h day then gives a land-like day-night
    /// range of roughly 10–15 K peaking in the afternoon (common practice, no source).
    pub surface_heat_capacity_j_m2_per_k: f64,
    /// Damping of the day-night temperature deviation (radiation plus local air exchange),
    /// W m⁻² K⁻¹. Default 30 (common practice, no source). Lower values give slow rotators
    /// larger day-night swings.
    pub diurnal_damping_w_m2_per_k: f64,
    /// Temperature decrease with elevation, K per km. Default 6.5 (standard atmosphere).
    pub lapse_rate_k_per_km: f64,
    /// Largest number of model years run while looking for the periodic state. Default 400.
    pub max_years: u32,
    /// Periodic-state tolerance, K: largest allowed change over one year. Default 0.01.
    pub tolerance_k: f64,
}

impl Default for ClimateSpec {
    /// The climlab seasonal EBM parameter set (climlab `model/ebm.py`, `EBM_seasonal`: A 210,
    /// B 2, D 0.555, ice 0.62 below −10 °C) with the ice-free albedo from the world's own sky
    /// ([`IceFreeAlbedo::FromSky`]) in place of Earth's latitude term, and a 50 m mixed layer
    /// (see [`ClimateSpec::mixed_layer_depth_m`]) in place of 10 m.
    fn default() -> Self {
        ClimateSpec {
            bands: 90,
            steps_per_year: 180,
            mixed_layer_depth_m: 50.0,
            land_fraction: 0.0,
            land_heat_capacity_j_m2_per_k: 5.25e6,
            olr_a_w_m2: 210.0,
            olr_b_w_m2_per_k: 2.0,
            diffusion_w_m2_per_k: 0.555,
            ice_free_albedo: IceFreeAlbedo::default(),
            ice_enabled: true,
            ice_albedo: 0.62,
            ice_temperature_c: -10.0,
            surface_heat_capacity_j_m2_per_k: 6e5,
            diurnal_damping_w_m2_per_k: 30.0,
            lapse_rate_k_per_km: 6.5,
            max_years: 400,
            tolerance_k: 0.01,
        }
    }
}

impl ClimateSpec {
    /// The climlab seasonal EBM as climlab sets it (climlab `model/ebm.py`, `EBM_seasonal`):
    /// the defaults with Earth's latitude term, albedo 0.33 + 0.25·P2, and a 10 m mixed layer.
    /// Validation reference.
    pub fn climlab_seasonal() -> Self {
        ClimateSpec {
            ice_free_albedo: IceFreeAlbedo::legendre(0.33, 0.25),
            mixed_layer_depth_m: 10.0,
            ..ClimateSpec::default()
        }
    }

    /// The North, Cahalan & Coakley (1981, Rev. Geophys. 19, 91, eq. 25) parameter set (10 m
    /// mixed layer):
    /// A 203.3 W m⁻², B 2.09 W m⁻² K⁻¹, D 0.649 W m⁻² K⁻¹, co-albedo 0.697 − 0.0779·P2 (albedo
    /// 0.303 + 0.0779·P2), ice co-albedo 0.38 below −10 °C. Values as read in published
    /// EBM code that cites that equation (journal details from memory).
    pub fn north_1981() -> Self {
        ClimateSpec {
            mixed_layer_depth_m: 10.0,
            olr_a_w_m2: 203.3,
            olr_b_w_m2_per_k: 2.09,
            diffusion_w_m2_per_k: 0.649,
            ice_free_albedo: IceFreeAlbedo::legendre(0.303, 0.0779),
            ice_albedo: 0.62,
            ice_temperature_c: -10.0,
            ..ClimateSpec::default()
        }
    }

    /// The climlab annual EBM defaults (climlab `model/ebm.py`): A 210, B 2, D 0.555,
    /// albedo 0.3 + 0.078·P2, ice albedo 0.62 below −10 °C, 10 m water mixed layer.
    pub fn climlab_defaults() -> Self {
        ClimateSpec {
            olr_a_w_m2: 210.0,
            olr_b_w_m2_per_k: 2.0,
            diffusion_w_m2_per_k: 0.555,
            ice_free_albedo: IceFreeAlbedo::legendre(0.3, 0.078),
            ice_albedo: 0.62,
            ice_temperature_c: -10.0,
            mixed_layer_depth_m: 10.0,
            ..ClimateSpec::default()
        }
    }

    /// The day-night layer's dimensionless relaxation rate `κ = λ / (ω C)` for a mean solar day
    /// of `solar_day_s` seconds: `λ` the diurnal damping (W m⁻² K⁻¹), `C` the thin surface
    /// layer's heat capacity (J m⁻² K⁻¹), `ω = 2π / solar_day_s` the rotation rate (rad s⁻¹).
    /// Large κ: the surface follows the star through the day; small κ: it barely swings. The
    /// one definition the zonal model's local temperatures and the map model's share.
    pub fn diurnal_kappa(&self, solar_day_s: f64) -> f64 {
        let omega = std::f64::consts::TAU / solar_day_s;
        self.diurnal_damping_w_m2_per_k / (omega * self.surface_heat_capacity_j_m2_per_k)
    }

    /// Column heat capacity of a band, J m⁻² K⁻¹: ocean mixed layer and land by area fraction.
    pub fn heat_capacity_j_m2_per_k(&self) -> f64 {
        let ocean = WATER_DENSITY_KG_M3 * WATER_SPECIFIC_HEAT_J_KG_K * self.mixed_layer_depth_m;
        (1.0 - self.land_fraction) * ocean + self.land_fraction * self.land_heat_capacity_j_m2_per_k
    }

    /// Checks every field; errors name the field as `{path}.{field}` (or just the field when
    /// `path` is empty), the value and the allowed range. NaN and infinities are rejected.
    pub fn validate(&self, path: &str) -> Result<(), SpecError> {
        let f = |name: &str| {
            if path.is_empty() {
                name.to_string()
            } else {
                format!("{path}.{name}")
            }
        };
        check_range(&f("bands"), self.bands as f64, 4.0, 2000.0)?;
        check_range(
            &f("steps_per_year"),
            self.steps_per_year as f64,
            8.0,
            100_000.0,
        )?;
        check_range(
            &f("mixed_layer_depth_m"),
            self.mixed_layer_depth_m,
            0.0,
            10_000.0,
        )?;
        check_range(&f("land_fraction"), self.land_fraction, 0.0, 1.0)?;
        check_range(
            &f("land_heat_capacity_j_m2_per_k"),
            self.land_heat_capacity_j_m2_per_k,
            0.0,
            1e11,
        )?;
        check_range(&f("olr_a_w_m2"), self.olr_a_w_m2, 0.0, 2000.0)?;
        check_range(&f("olr_b_w_m2_per_k"), self.olr_b_w_m2_per_k, 0.1, 50.0)?;
        check_range(
            &f("diffusion_w_m2_per_k"),
            self.diffusion_w_m2_per_k,
            0.0,
            100.0,
        )?;
        self.ice_free_albedo.validate(f)?;
        check_range(&f("ice_albedo"), self.ice_albedo, 0.0, 1.0)?;
        check_range(
            &f("ice_temperature_c"),
            self.ice_temperature_c,
            -150.0,
            100.0,
        )?;
        check_range_open_min(
            &f("surface_heat_capacity_j_m2_per_k"),
            self.surface_heat_capacity_j_m2_per_k,
            0.0,
            1e11,
        )?;
        check_range_open_min(
            &f("diurnal_damping_w_m2_per_k"),
            self.diurnal_damping_w_m2_per_k,
            0.0,
            1000.0,
        )?;
        check_range(
            &f("lapse_rate_k_per_km"),
            self.lapse_rate_k_per_km,
            0.0,
            30.0,
        )?;
        check_range(&f("max_years"), f64::from(self.max_years), 1.0, 100_000.0)?;
        check_range_open_min(&f("tolerance_k"), self.tolerance_k, 0.0, 10.0)?;
        // With no sunlight at all a band settles at −A/B; keep that above absolute zero.
        if self.olr_a_w_m2 / self.olr_b_w_m2_per_k > 273.15 {
            return Err(SpecError::inconsistent(
                f("olr_a_w_m2"),
                format!(
                    "olr_a_w_m2 / olr_b_w_m2_per_k = {:.1} K must be at most 273.15 so that an unlit band stays above absolute zero",
                    self.olr_a_w_m2 / self.olr_b_w_m2_per_k
                ),
            ));
        }
        Ok(())
    }
}

/// The `climate` section as written in a world file: the fields of [`ClimateSpec`] with the
/// ice-free albedo spelt as flat optional fields, so files that set `albedo_a0`/`albedo_a2`
/// keep reading as before.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
struct ClimateSection {
    bands: usize,
    steps_per_year: usize,
    mixed_layer_depth_m: f64,
    land_fraction: f64,
    land_heat_capacity_j_m2_per_k: f64,
    olr_a_w_m2: f64,
    olr_b_w_m2_per_k: f64,
    diffusion_w_m2_per_k: f64,
    #[serde(
        skip_serializing_if = "Option::is_none",
        serialize_with = "plain_number_out",
        deserialize_with = "plain_number"
    )]
    atmosphere_albedo: Option<f64>,
    #[serde(
        skip_serializing_if = "Option::is_none",
        serialize_with = "plain_number_out",
        deserialize_with = "plain_number"
    )]
    albedo_a0: Option<f64>,
    #[serde(
        skip_serializing_if = "Option::is_none",
        serialize_with = "plain_number_out",
        deserialize_with = "plain_number"
    )]
    albedo_a2: Option<f64>,
    ice_enabled: bool,
    ice_albedo: f64,
    ice_temperature_c: f64,
    surface_heat_capacity_j_m2_per_k: f64,
    diurnal_damping_w_m2_per_k: f64,
    lapse_rate_k_per_km: f64,
    max_years: u32,
    tolerance_k: f64,
    /// A land file (PNG mask or RON layout) for tools that map the climate, relative to the
    /// world file: the `insola` CLI's `map`, `climate` and `check` take it as their `--land`.
    /// Not a model parameter: [`ClimateSpec`] leaves it out, and a spec written back has none.
    #[serde(
        skip_serializing_if = "Option::is_none",
        deserialize_with = "plain_text"
    )]
    land: Option<String>,
}

/// An optional text written as a plain string (`"a.png"`, not `Some("a.png")`).
fn plain_text<'de, D: serde::Deserializer<'de>>(d: D) -> Result<Option<String>, D::Error> {
    String::deserialize(d).map(Some)
}

/// An optional number written as a plain number (`0.3`, not `Some(0.3)`), whatever the RON
/// options of the reader.
fn plain_number<'de, D: serde::Deserializer<'de>>(d: D) -> Result<Option<f64>, D::Error> {
    f64::deserialize(d).map(Some)
}

/// Writes what [`plain_number`] reads (the `None` case is skipped before it gets here).
fn plain_number_out<S: serde::Serializer>(v: &Option<f64>, s: S) -> Result<S::Ok, S::Error> {
    match v {
        Some(x) => s.serialize_f64(*x),
        None => s.serialize_none(),
    }
}

impl Default for ClimateSection {
    /// The defaults with no albedo field given (so a file may give either law).
    fn default() -> Self {
        ClimateSection {
            atmosphere_albedo: None,
            ..ClimateSpec::default().into()
        }
    }
}

impl From<ClimateSpec> for ClimateSection {
    fn from(s: ClimateSpec) -> Self {
        let (atmosphere_albedo, albedo_a0, albedo_a2) = match s.ice_free_albedo {
            IceFreeAlbedo::FromSky { atmosphere_albedo } => (Some(atmosphere_albedo), None, None),
            IceFreeAlbedo::Legendre { a0, a2 } => (None, Some(a0), Some(a2)),
        };
        ClimateSection {
            bands: s.bands,
            steps_per_year: s.steps_per_year,
            mixed_layer_depth_m: s.mixed_layer_depth_m,
            land_fraction: s.land_fraction,
            land_heat_capacity_j_m2_per_k: s.land_heat_capacity_j_m2_per_k,
            olr_a_w_m2: s.olr_a_w_m2,
            olr_b_w_m2_per_k: s.olr_b_w_m2_per_k,
            diffusion_w_m2_per_k: s.diffusion_w_m2_per_k,
            atmosphere_albedo,
            albedo_a0,
            albedo_a2,
            ice_enabled: s.ice_enabled,
            ice_albedo: s.ice_albedo,
            ice_temperature_c: s.ice_temperature_c,
            surface_heat_capacity_j_m2_per_k: s.surface_heat_capacity_j_m2_per_k,
            diurnal_damping_w_m2_per_k: s.diurnal_damping_w_m2_per_k,
            lapse_rate_k_per_km: s.lapse_rate_k_per_km,
            max_years: s.max_years,
            tolerance_k: s.tolerance_k,
            land: None,
        }
    }
}

impl TryFrom<ClimateSection> for ClimateSpec {
    type Error = String;

    fn try_from(s: ClimateSection) -> Result<Self, String> {
        let ice_free_albedo = match (s.atmosphere_albedo, s.albedo_a0, s.albedo_a2) {
            (Some(_), Some(_), _) | (Some(_), _, Some(_)) => {
                return Err("climate: give either atmosphere_albedo (the sky law) or albedo_a0/albedo_a2 (an explicit latitude law), not both".to_string());
            }
            (None, None, None) => IceFreeAlbedo::default(),
            (Some(atmosphere_albedo), None, None) => IceFreeAlbedo::FromSky { atmosphere_albedo },
            (None, a0, a2) => IceFreeAlbedo::legendre(
                a0.unwrap_or(LEGACY_ALBEDO_A0),
                a2.unwrap_or(LEGACY_ALBEDO_A2),
            ),
        };
        Ok(ClimateSpec {
            bands: s.bands,
            steps_per_year: s.steps_per_year,
            mixed_layer_depth_m: s.mixed_layer_depth_m,
            land_fraction: s.land_fraction,
            land_heat_capacity_j_m2_per_k: s.land_heat_capacity_j_m2_per_k,
            olr_a_w_m2: s.olr_a_w_m2,
            olr_b_w_m2_per_k: s.olr_b_w_m2_per_k,
            diffusion_w_m2_per_k: s.diffusion_w_m2_per_k,
            ice_free_albedo,
            ice_enabled: s.ice_enabled,
            ice_albedo: s.ice_albedo,
            ice_temperature_c: s.ice_temperature_c,
            surface_heat_capacity_j_m2_per_k: s.surface_heat_capacity_j_m2_per_k,
            diurnal_damping_w_m2_per_k: s.diurnal_damping_w_m2_per_k,
            lapse_rate_k_per_km: s.lapse_rate_k_per_km,
            max_years: s.max_years,
            tolerance_k: s.tolerance_k,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn diurnal_kappa_is_damping_over_rotation_times_capacity() {
        // κ = λ / (ω C) with the defaults λ = 30 W m⁻² K⁻¹, C = 6×10⁵ J m⁻² K⁻¹ and a 24 h day:
        // ω = 2π / 86 400 s = 7.2722×10⁻⁵ rad/s, κ = 30 / 43.633 = 0.68755.
        let k = ClimateSpec::default().diurnal_kappa(86_400.0);
        assert!((k - 0.687_55).abs() < 1e-5, "{k}");
        // Twice the day, twice κ: the layer has twice as long to follow the star.
        let k2 = ClimateSpec::default().diurnal_kappa(172_800.0);
        assert!((k2 - 2.0 * k).abs() < 1e-12);
    }

    #[test]
    fn a_land_file_is_accepted_and_left_to_tools() {
        // `land` names a file for the CLI; the model spec is the same with or without it.
        let with: ClimateSpec = ron::from_str("(land: \"world.land.png\")").unwrap();
        assert_eq!(with, ClimateSpec::default());
        assert!(ron::from_str::<ClimateSpec>("(land: 3)").is_err());
    }

    #[test]
    fn presets_are_valid() {
        ClimateSpec::default().validate("climate").unwrap();
        ClimateSpec::north_1981().validate("climate").unwrap();
        ClimateSpec::climlab_defaults().validate("climate").unwrap();
        ClimateSpec::climlab_seasonal().validate("climate").unwrap();
    }

    #[test]
    fn albedo_fields_in_files_choose_the_law() {
        let sky: ClimateSpec = ron::from_str("()").unwrap();
        assert_eq!(sky.ice_free_albedo, IceFreeAlbedo::default());
        let tuned: ClimateSpec = ron::from_str("(atmosphere_albedo: 0.2)").unwrap();
        assert_eq!(
            tuned.ice_free_albedo,
            IceFreeAlbedo::FromSky {
                atmosphere_albedo: 0.2
            }
        );
        let both: ClimateSpec = ron::from_str("(albedo_a0: 0.31, albedo_a2: 0.1)").unwrap();
        assert_eq!(both.ice_free_albedo, IceFreeAlbedo::legendre(0.31, 0.1));
        // One of the pair alone: the other keeps its former default, as older files expect.
        let a2_only: ClimateSpec = ron::from_str("(albedo_a2: 0.0)").unwrap();
        assert_eq!(a2_only.ice_free_albedo, IceFreeAlbedo::legendre(0.33, 0.0));
        let err = ron::from_str::<ClimateSpec>("(atmosphere_albedo: 0.2, albedo_a0: 0.3)")
            .unwrap_err()
            .to_string();
        assert!(err.contains("not both"), "{err}");
    }

    #[test]
    fn spec_round_trips_through_ron_and_json() {
        for spec in [ClimateSpec::default(), ClimateSpec::north_1981()] {
            let ron_text = ron::to_string(&spec).unwrap();
            assert_eq!(ron::from_str::<ClimateSpec>(&ron_text).unwrap(), spec);
            let json = serde_json::to_string(&spec).unwrap();
            assert_eq!(serde_json::from_str::<ClimateSpec>(&json).unwrap(), spec);
        }
    }

    #[test]
    fn bad_value_names_field_value_and_range() {
        let spec = ClimateSpec {
            diffusion_w_m2_per_k: -1.0,
            ..ClimateSpec::default()
        };
        let err = spec.validate("climate").unwrap_err();
        assert_eq!(err.field(), Some("climate.diffusion_w_m2_per_k"));
        let text = err.to_string();
        assert!(text.contains("-1") && text.contains("0 to 100"), "{text}");
    }

    #[test]
    fn nan_and_infinity_are_rejected() {
        for v in [f64::NAN, f64::INFINITY, f64::NEG_INFINITY] {
            let spec = ClimateSpec {
                olr_b_w_m2_per_k: v,
                ..ClimateSpec::default()
            };
            let err = spec.validate("climate").unwrap_err();
            assert_eq!(err.field(), Some("climate.olr_b_w_m2_per_k"));
        }
    }

    #[test]
    fn albedo_out_of_unit_range_is_inconsistent() {
        let spec = ClimateSpec {
            ice_free_albedo: IceFreeAlbedo::legendre(0.9, 0.5),
            ..ClimateSpec::default()
        };
        let err = spec.validate("").unwrap_err();
        assert_eq!(err.field(), Some("albedo_a2"));
    }

    #[test]
    fn ron_partial_section_uses_defaults_and_rejects_unknown_fields() {
        let spec: ClimateSpec =
            ron::from_str("(mixed_layer_depth_m: 50.0, ice_enabled: false)").unwrap();
        assert_eq!(spec.mixed_layer_depth_m, 50.0);
        assert!(!spec.ice_enabled);
        assert_eq!(spec.bands, 90);
        assert!(ron::from_str::<ClimateSpec>("(depth: 3.0)").is_err());
    }

    #[test]
    fn heat_capacity_of_ten_metres_of_water() {
        // ρ c h = 1000 × 4181.3 × 10 (climlab constants).
        let c = ClimateSpec::climlab_seasonal().heat_capacity_j_m2_per_k();
        assert!((c - 4.1813e7).abs() < 1.0);
    }
}

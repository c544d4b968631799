//! The `climate` section of a world file: parameters of the energy balance model.

use serde::{Deserialize, Serialize};

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
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields, default)]
pub struct ClimateSpec {
    /// Number of latitude bands, uniform in sin(latitude). Default 90.
    pub bands: usize,
    /// Model time steps per orbital year. Default 180.
    pub steps_per_year: usize,
    /// Depth of the ocean mixed layer, m; sets the heat capacity of the ocean part of each band.
    /// Default 10 (climlab seasonal EBM).
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
    /// Ice-free albedo, constant part `a0` of `a0 + a2·P2(sin φ)`. Default 0.33.
    pub albedo_a0: f64,
    /// Ice-free albedo, latitude part `a2` of `a0 + a2·P2(sin φ)`. Default 0.25.
    pub albedo_a2: f64,
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
    /// Earth-calibrated defaults: the climlab seasonal EBM parameter set (climlab
    /// `model/ebm.py`, `EBM_seasonal`: A 210, B 2, D 0.555, a0 0.33, a2 0.25, ice 0.62 below
    /// −10 °C, 10 m water), used here as a validation reference only.
    fn default() -> Self {
        ClimateSpec {
            bands: 90,
            steps_per_year: 180,
            mixed_layer_depth_m: 10.0,
            land_fraction: 0.0,
            land_heat_capacity_j_m2_per_k: 5.25e6,
            olr_a_w_m2: 210.0,
            olr_b_w_m2_per_k: 2.0,
            diffusion_w_m2_per_k: 0.555,
            albedo_a0: 0.33,
            albedo_a2: 0.25,
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
    /// The North, Cahalan & Coakley (1981, Rev. Geophys. 19, 91, eq. 25) parameter set:
    /// A 203.3 W m⁻², B 2.09 W m⁻² K⁻¹, D 0.649 W m⁻² K⁻¹, co-albedo 0.697 − 0.0779·P2 (albedo
    /// 0.303 + 0.0779·P2), ice co-albedo 0.38 below −10 °C. Values as read in published
    /// EBM code that cites that equation (journal details from memory). The mixed layer keeps
    /// the default 10 m.
    pub fn north_1981() -> Self {
        ClimateSpec {
            olr_a_w_m2: 203.3,
            olr_b_w_m2_per_k: 2.09,
            diffusion_w_m2_per_k: 0.649,
            albedo_a0: 0.303,
            albedo_a2: 0.0779,
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
            albedo_a0: 0.3,
            albedo_a2: 0.078,
            ice_albedo: 0.62,
            ice_temperature_c: -10.0,
            mixed_layer_depth_m: 10.0,
            ..ClimateSpec::default()
        }
    }

    /// Column heat capacity of a band, J m⁻² K⁻¹: ocean mixed layer and land by area fraction.
    pub fn heat_capacity_j_m2_per_k(&self) -> f64 {
        let ocean = WATER_DENSITY_KG_M3 * WATER_SPECIFIC_HEAT_J_KG_K * self.mixed_layer_depth_m;
        (1.0 - self.land_fraction) * ocean + self.land_fraction * self.land_heat_capacity_j_m2_per_k
    }

    /// Ice-free albedo at `x = sin(latitude)`: `a0 + a2·P2(x)` (dimensionless).
    pub fn ice_free_albedo(&self, x: f64) -> f64 {
        self.albedo_a0 + self.albedo_a2 * 0.5 * (3.0 * x * x - 1.0)
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
        check_range(&f("albedo_a0"), self.albedo_a0, 0.0, 1.0)?;
        check_range(&f("albedo_a2"), self.albedo_a2, -1.0, 1.0)?;
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
        // P2 spans [−1/2, 1]: the ice-free albedo must stay in [0, 1] at equator and pole.
        let (eq, pole) = (self.ice_free_albedo(0.0), self.ice_free_albedo(1.0));
        if !(0.0..=1.0).contains(&eq) || !(0.0..=1.0).contains(&pole) {
            return Err(SpecError::inconsistent(
                f("albedo_a2"),
                format!(
                    "albedo a0 + a2·P2 is {eq:.3} at the equator and {pole:.3} at the poles; both must be within 0 to 1"
                ),
            ));
        }
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn presets_are_valid() {
        ClimateSpec::default().validate("climate").unwrap();
        ClimateSpec::north_1981().validate("climate").unwrap();
        ClimateSpec::climlab_defaults().validate("climate").unwrap();
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
            albedo_a0: 0.9,
            albedo_a2: 0.5,
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
        let c = ClimateSpec::default().heat_capacity_j_m2_per_k();
        assert!((c - 4.1813e7).abs() < 1.0);
    }
}

//! Sky light of one world and one star: the continuous sky-illuminance curve of `twilight`,
//! scaled for the star and the atmosphere, with a precomputed sky colour over altitude.

use serde::{Deserialize, Serialize};

use super::airmass::{HORIZON_AIR_MASS_KY89, apparent_altitude, relative_air_mass};
use super::colour::{LightColour, light_colour_of_ln_spectrum};
use super::daylight::{IES_SOLAR_ILLUMINANCE_LUX, ln_sky_weight, sky_brightness_scale};
use super::extinction::Extinction;
use super::twilight::{
    EarthSkyCurve, NAUTICAL_TWILIGHT_DEG, NIGHT_SKY_FLOOR_LUX, TWILIGHT_BLUE_POWER, TwilightPhase,
};
use crate::world::AtmosphereSpec;

/// Light from the clear sky (not the star's disc) on a horizontal surface.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SkyLight {
    /// Horizontal illuminance from the star's light scattered by the sky, in lux (0 on airless
    /// worlds).
    pub illuminance_lux: f64,
    /// Night-sky floor (airglow and starlight), in lux; add it to get the total.
    pub night_floor_lux: f64,
    /// Colour of the scattered star light.
    pub colour: LightColour,
    /// Twilight phase for the star's altitude.
    pub phase: TwilightPhase,
}

impl SkyLight {
    /// Sky illuminance plus the night floor, in lux.
    pub fn total_lux(&self) -> f64 {
        self.illuminance_lux + self.night_floor_lux
    }
}

/// Lowest geometric altitude of the sky-colour table, in degrees (held below).
const COLOUR_TABLE_LOW_DEG: f64 = -20.0;
/// Step of the sky-colour table, in degrees.
const COLOUR_TABLE_STEP_DEG: f64 = 0.25;
/// Number of rows of the sky-colour table (−20° to +90°).
const COLOUR_TABLE_LEN: usize = 441;

/// Precomputed sky light for one star and one atmosphere.
#[derive(Debug, Clone, PartialEq)]
pub struct SkyModel {
    curve: EarthSkyCurve,
    brightness_scale: f64,
    rise_altitude_rad: f64,
    colours: Vec<[f64; 4]>,
}

impl SkyModel {
    /// Builds the model. `ln_star_spectrum` is ln of the star's spectrum on the spectrum grid,
    /// `star_colour` the colour used where the sky has no light of its own (airless worlds),
    /// `rise_altitude_rad` the geometric altitude of rise/set used for [`TwilightPhase`].
    pub fn new(
        ln_star_spectrum: &[f64],
        star_colour: LightColour,
        atmosphere: &AtmosphereSpec,
        rise_altitude_rad: f64,
    ) -> Self {
        let extinction = Extinction::new(atmosphere);
        let refraction = atmosphere.refraction_scale();
        let ray = extinction.rayleigh();
        let ray_ref = ray[190];
        let colours = (0..COLOUR_TABLE_LEN)
            .map(|i| {
                let h_deg = COLOUR_TABLE_LOW_DEG + COLOUR_TABLE_STEP_DEG * i as f64;
                let m = if h_deg >= 0.0 {
                    relative_air_mass(apparent_altitude(h_deg.to_radians(), refraction))
                } else {
                    HORIZON_AIR_MASS_KY89
                };
                let n = TWILIGHT_BLUE_POWER * (h_deg.min(0.0) / NAUTICAL_TWILIGHT_DEG).min(1.0);
                let w = ln_sky_weight(&extinction, m);
                let ln: Vec<f64> = ln_star_spectrum
                    .iter()
                    .zip(&w)
                    .zip(ray)
                    .map(|((e, w), r)| {
                        let blue = if n > 0.0 && ray_ref > 0.0 {
                            n * (r / ray_ref).ln()
                        } else {
                            0.0
                        };
                        e + w + blue
                    })
                    .collect();
                let c = light_colour_of_ln_spectrum(&ln).map_or(star_colour, |(c, _)| c);
                [
                    c.linear_srgb[0],
                    c.linear_srgb[1],
                    c.linear_srgb[2],
                    c.cct_k,
                ]
            })
            .collect();
        Self {
            curve: EarthSkyCurve::new(),
            brightness_scale: sky_brightness_scale(atmosphere),
            rise_altitude_rad,
            colours,
        }
    }

    /// Brightness of this sky relative to Earth's for equal star illuminance (dimensionless).
    pub fn brightness_scale(&self) -> f64 {
        self.brightness_scale
    }

    /// Sky light for the star's geometric altitude (radians) and the star's top-of-atmosphere
    /// illuminance normal to the beam (lux). Non-finite or negative illuminance counts as 0; a
    /// NaN altitude as −90°.
    pub fn sky_light(&self, geometric_altitude_rad: f64, toa_illuminance_lux: f64) -> SkyLight {
        let h_deg = if geometric_altitude_rad.is_nan() {
            -90.0
        } else {
            geometric_altitude_rad.to_degrees()
        };
        let toa = if toa_illuminance_lux.is_finite() {
            toa_illuminance_lux.max(0.0)
        } else {
            0.0
        };
        let lux = if self.brightness_scale > 0.0 {
            self.curve.lux(h_deg) * self.brightness_scale * toa / IES_SOLAR_ILLUMINANCE_LUX
        } else {
            0.0
        };
        SkyLight {
            illuminance_lux: lux,
            night_floor_lux: NIGHT_SKY_FLOOR_LUX,
            colour: self.colour_at(h_deg),
            phase: TwilightPhase::from_altitude(h_deg.to_radians(), self.rise_altitude_rad),
        }
    }

    fn colour_at(&self, h_deg: f64) -> LightColour {
        let f = ((h_deg - COLOUR_TABLE_LOW_DEG) / COLOUR_TABLE_STEP_DEG)
            .clamp(0.0, (COLOUR_TABLE_LEN - 1) as f64);
        let i = (f as usize).min(COLOUR_TABLE_LEN - 2);
        let t = f - i as f64;
        let (a, b) = (self.colours[i], self.colours[i + 1]);
        let v: [f64; 4] = std::array::from_fn(|k| a[k] + t * (b[k] - a[k]));
        let m = v[0].max(v[1]).max(v[2]).max(f64::MIN_POSITIVE);
        LightColour {
            linear_srgb: [v[0] / m, v[1] / m, v[2] / m],
            cct_k: v[3],
        }
    }
}

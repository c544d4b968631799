//! The light of each star after the primary (a world's companion): its own direct beam, and
//! how its sky light and twilight join the primary's.
//!
//! Each star's beam is that star's Planck spectrum through the world's atmosphere
//! ([`crate::light::StarLightModel`] of its own temperature), dimmed by whatever the occlusion
//! seam says hides it (moons, the other star). The sky dome is lit by both: illuminances add
//! (scattering is linear in the light that enters the air), the colour is the
//! illuminance-weighted mean of the two skies' colours, and the night floor is counted once.
//! The twilight phase is the lighter of the stars' phases, so it is night only when every
//! star is down.

use glam::DVec3;
use serde::{Deserialize, Serialize};

use super::{BodyLight, LightMode};
use crate::light::{SkyLight as ModelSkyLight, TwilightPhase};
use crate::planet::Planet;
use crate::sky::{Place, StarInstant};

/// One star other than the primary, as seen from the observer.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct StarLighting {
    /// Index of the star (1: the companion).
    pub star: usize,
    /// Direction and light of its beam (already dimmed by `eclipse_fraction`).
    pub light: BodyLight,
    /// Fraction of its disc hidden (by a moon or the other star), 0–1.
    pub eclipse_fraction: f64,
    /// What hides the most of it, if anything.
    pub occluded_by: Option<crate::occlusion::Occluder>,
    /// Its top-of-atmosphere insolation on a horizontal surface, W m⁻² (included in
    /// [`super::LightingState::toa_insolation_w_m2`]).
    pub toa_insolation_w_m2: f64,
    /// Its beam at the ground on a horizontal surface, after the atmosphere, lux (included
    /// in [`super::LightingState::ground_horizontal_illuminance_lux`]).
    pub ground_horizontal_lux: f64,
}

/// A star's light for the lighting state, and the sky light it feeds.
pub(super) struct OtherStar {
    pub(super) lighting: StarLighting,
    pub(super) sky: ModelSkyLight,
    pub(super) twilight: TwilightPhase,
}

/// Brightness rank of a twilight phase (day brightest).
fn rank(p: TwilightPhase) -> u8 {
    match p {
        TwilightPhase::Day => 4,
        TwilightPhase::Civil => 3,
        TwilightPhase::Nautical => 2,
        TwilightPhase::Astronomical => 1,
        TwilightPhase::Night => 0,
    }
}

/// The lighter of two twilight phases.
pub(crate) fn lighter(a: TwilightPhase, b: TwilightPhase) -> TwilightPhase {
    if rank(b) > rank(a) { b } else { a }
}

/// Sky illuminance of `extra` added to `base` (night floor once, colour weighted by the
/// scattered illuminance); `base` unchanged when `extra` scatters nothing.
pub(super) fn add_sky(base: ModelSkyLight, extra: &ModelSkyLight) -> ModelSkyLight {
    if extra.illuminance_lux <= 0.0 {
        return base;
    }
    let (w0, w1) = (base.illuminance_lux, extra.illuminance_lux);
    let mix = (DVec3::from_array(base.colour.linear_srgb) * w0
        + DVec3::from_array(extra.colour.linear_srgb) * w1)
        / (w0 + w1);
    let top = mix.max_element();
    let mut out = base;
    out.illuminance_lux = w0 + w1;
    if top > 0.0 {
        out.colour.linear_srgb = (mix / top).to_array();
        out.colour.cct_k = (base.colour.cct_k * w0 + extra.colour.cct_k * w1) / (w0 + w1);
    }
    out
}

impl Planet {
    /// Star `instant.star`'s beam, sky light and twilight at `place` (for stars after the
    /// primary; the primary's are built in [`Planet::lighting`]).
    pub(super) fn other_star_light(
        &self,
        instant: &StarInstant,
        place: Place,
        mode: LightMode,
    ) -> Option<OtherStar> {
        let k = instant.star;
        let model = self.light_model_of(k)?;
        let rise = model.rise_altitude_rad();
        let pos = self.star_position_at(instant, place);
        let occlusion = self.star_occlusion(instant, place);
        let eclipse = occlusion.hidden_fraction;
        let flux = instant.toa_flux_w_m2;
        let ground = model.direct_beam(pos.altitude_rad, flux);
        let beam = match mode {
            LightMode::Ground => ground,
            LightMode::TopOfAtmosphere => {
                let mut b = model.top_of_atmosphere(flux);
                b.illuminance_lux *= crate::light::disc_fraction_above_rise(
                    pos.altitude_rad,
                    rise,
                    model.star_angular_radius_rad(),
                );
                b
            }
        };
        let sky = model.sky(pos.altitude_rad, flux * (1.0 - eclipse));
        let twilight = if flux > 0.0 {
            TwilightPhase::from_altitude(pos.altitude_rad, rise)
        } else {
            TwilightPhase::Night
        };
        Some(OtherStar {
            lighting: StarLighting {
                star: k,
                light: BodyLight {
                    direction_enu: pos.direction_enu,
                    altitude_rad: pos.altitude_rad,
                    azimuth_rad: pos.azimuth_rad,
                    illuminance_lux: beam.illuminance_lux * (1.0 - eclipse),
                    colour_linear_srgb: beam.colour.linear_srgb,
                    cct_k: beam.colour.cct_k,
                    angular_radius_rad: instant.angular_radius_rad,
                    is_up: pos.altitude_rad > rise,
                },
                eclipse_fraction: eclipse,
                occluded_by: occlusion.by,
                toa_insolation_w_m2: pos.toa_insolation_w_m2 * occlusion.transmitted_fraction(),
                ground_horizontal_lux: ground.illuminance_lux
                    * (1.0 - eclipse)
                    * pos.direction_enu.z.max(0.0),
            },
            sky,
            twilight,
        })
    }
}

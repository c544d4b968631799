//! One place to ask: the full lighting state for a world, a time and a place.
//!
//! [`Planet::lighting`] gathers the star's direction, light and colour, the sky's ambient
//! light, each moon's direction, phase and light, eclipses and the twilight phase. Two modes:
//! [`LightMode::Ground`] gives the light as it arrives at the ground (for scenes without a sky
//! renderer), [`LightMode::TopOfAtmosphere`] the light above the air (for engines whose
//! atmosphere attenuates the light itself, so extinction is never counted twice).

mod mean;
mod moon;
mod stars;

pub use mean::MeanLighting;
pub use stars::StarLighting;

use glam::DVec3;
use serde::{Deserialize, Serialize};

use crate::light::TwilightPhase;
use crate::planet::Planet;
use crate::sky::Place;

/// Which light to report for the star and moons.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
pub enum LightMode {
    /// After the atmosphere's extinction: what a surface on the ground receives.
    #[default]
    Ground,
    /// Above the atmosphere: for renderers that apply their own atmospheric extinction.
    TopOfAtmosphere,
}

/// The light of one body (the star or a moon) at the observer.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct BodyLight {
    /// Unit vector toward the body, local east-north-up frame.
    pub direction_enu: DVec3,
    /// Geometric altitude of the body's centre, radians.
    pub altitude_rad: f64,
    /// Azimuth clockwise from north, radians.
    pub azimuth_rad: f64,
    /// Illuminance on a surface facing the body, lux (0 when below the horizon).
    pub illuminance_lux: f64,
    /// Colour of the light, linear sRGB with the largest channel 1.
    pub colour_linear_srgb: [f64; 3],
    /// Correlated colour temperature of the light, kelvin.
    pub cct_k: f64,
    /// Angular radius of the disc, radians.
    pub angular_radius_rad: f64,
    /// `true` while the body is up: its centre at or above its standard rise altitude (the
    /// upper limb on the refracted horizon; [`Planet::standard_rise_altitude_rad`],
    /// [`Planet::moon_rise_altitude_rad`]). Rise and set events fall exactly where this
    /// changes, and renderers switch the body's light by it.
    pub is_up: bool,
}

/// Diffuse light of the whole sky dome.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct SkyLight {
    /// Illuminance on a horizontal surface from the sky (not the star's beam), lux.
    pub illuminance_lux: f64,
    /// Colour, linear sRGB with the largest channel 1.
    pub colour_linear_srgb: [f64; 3],
}

/// One moon as seen from the observer.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct MoonLighting {
    /// The moon's name from the world file.
    pub name: String,
    /// Direction and light of the moon.
    pub light: BodyLight,
    /// Phase angle (star–moon–observer), radians: 0 full, π new.
    pub phase_angle_rad: f64,
    /// Illuminated fraction of the disc, 0–1.
    pub illuminated_fraction: f64,
    /// Fraction of the moon's light removed by the planet's shadow (lunar eclipse), 0–1.
    pub eclipse_fraction: f64,
    /// The moon's light at the ground, after the atmosphere, lux (in
    /// [`LightMode::Ground`] equal to `light.illuminance_lux`).
    pub ground_illuminance_lux: f64,
}

/// Everything that lights a scene at one instant and place.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LightingState {
    /// World time, seconds since time zero.
    pub t_s: f64,
    /// Mode the light values are in.
    pub mode: LightMode,
    /// The star.
    pub star: BodyLight,
    /// Fraction of the star's disc covered by moons (solar eclipse), 0–1; already applied to
    /// `star.illuminance_lux`, the sky light and `toa_insolation_w_m2` (see
    /// [`crate::occlusion`]).
    pub star_eclipse_fraction: f64,
    /// The occluder hiding the most of the star, if any.
    pub star_occluded_by: Option<crate::occlusion::Occluder>,
    /// Top-of-atmosphere insolation on a horizontal surface from every star, W m⁻² (each
    /// star's share dimmed by what hides it).
    pub toa_insolation_w_m2: f64,
    /// Diffuse sky light (always as at the ground: it is the atmosphere's own light).
    pub sky: SkyLight,
    /// Each moon, in world-file order.
    pub moons: Vec<MoonLighting>,
    /// Day, civil, nautical or astronomical twilight, or night: of the combined light of the
    /// stars (the lighter of their phases; night only when every star is down).
    pub twilight: TwilightPhase,
    /// Every star after the primary (`star`), by index: empty on a one-star world. Their
    /// light is included in the sky light, `toa_insolation_w_m2` and the ground total.
    #[serde(default, skip_serializing_if = "Vec::is_empty")]
    pub other_stars: Vec<StarLighting>,
    /// What a light meter lying on the ground reads: star, sky and moons on a horizontal
    /// surface at the ground, after the atmosphere, lux — in either mode (for exposure).
    pub ground_horizontal_illuminance_lux: f64,
}

impl Planet {
    /// The full lighting state at world time `t_s` and `place`.
    ///
    /// Star: Planck spectrum through the world's atmosphere (see [`crate::light`]); in
    /// [`LightMode::TopOfAtmosphere`] the star keeps its full top-of-atmosphere light and colour
    /// while above the horizon. Sky: the clear-sky and twilight model plus the night floor.
    pub fn lighting(&self, t_s: f64, place: Place, mode: LightMode) -> LightingState {
        let instant = self.star_instant(t_s);
        let pos = self.star_position_at(&instant, place);
        let model = self.light_model();
        let occlusion = self.star_occlusion(&instant, place);
        let eclipse = occlusion.hidden_fraction;
        let beam = match mode {
            LightMode::Ground => model.direct_beam(pos.altitude_rad, instant.toa_flux_w_m2),
            LightMode::TopOfAtmosphere => {
                let mut b = model.top_of_atmosphere(instant.toa_flux_w_m2);
                // Fade across the star's own disc above its rise altitude so the light does not
                // switch off in one frame, exactly as the ground beam does.
                b.illuminance_lux *= crate::light::disc_fraction_above_rise(
                    pos.altitude_rad,
                    self.standard_rise_altitude_rad(),
                    model.star_angular_radius_rad(),
                );
                b
            }
        };
        let mut sky = model.sky(pos.altitude_rad, instant.toa_flux_w_m2 * (1.0 - eclipse));
        let mut twilight =
            TwilightPhase::from_altitude(pos.altitude_rad, self.standard_rise_altitude_rad());
        let others: Vec<_> = (1..self.star_count())
            .filter_map(|k| self.star_instant_of(k, t_s))
            .filter_map(|i| self.other_star_light(&i, place, mode))
            .collect();
        for other in &others {
            sky = stars::add_sky(sky, &other.sky);
            twilight = stars::lighter(twilight, other.twilight);
        }
        let moons = self.moon_lighting(&instant, place, mode);
        let ground_star_lux = match mode {
            LightMode::Ground => beam.illuminance_lux,
            LightMode::TopOfAtmosphere => {
                model
                    .direct_beam(pos.altitude_rad, instant.toa_flux_w_m2)
                    .illuminance_lux
            }
        } * (1.0 - eclipse);
        let on_ground = |lux: f64, direction: DVec3| lux * direction.z.max(0.0);
        let ground_horizontal = on_ground(ground_star_lux, pos.direction_enu)
            + sky.total_lux()
            + moons
                .iter()
                .map(|m| on_ground(m.ground_illuminance_lux, m.light.direction_enu))
                .sum::<f64>()
            + others
                .iter()
                .map(|o| o.lighting.ground_horizontal_lux)
                .sum::<f64>();
        let toa_insolation = pos.toa_insolation_w_m2 * occlusion.transmitted_fraction()
            + others
                .iter()
                .map(|o| o.lighting.toa_insolation_w_m2)
                .sum::<f64>();
        LightingState {
            t_s,
            mode,
            star: BodyLight {
                direction_enu: pos.direction_enu,
                altitude_rad: pos.altitude_rad,
                azimuth_rad: pos.azimuth_rad,
                illuminance_lux: beam.illuminance_lux * (1.0 - eclipse),
                colour_linear_srgb: beam.colour.linear_srgb,
                cct_k: beam.colour.cct_k,
                angular_radius_rad: instant.angular_radius_rad,
                is_up: pos.altitude_rad > self.standard_rise_altitude_rad(),
            },
            star_eclipse_fraction: eclipse,
            star_occluded_by: occlusion.by,
            toa_insolation_w_m2: toa_insolation,
            sky: SkyLight {
                illuminance_lux: sky.total_lux(),
                colour_linear_srgb: sky.colour.linear_srgb,
            },
            moons,
            twilight,
            ground_horizontal_illuminance_lux: ground_horizontal,
            other_stars: others.into_iter().map(|o| o.lighting).collect(),
        }
    }
}

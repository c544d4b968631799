//! The engine-atmosphere part: Bevy's `Atmosphere` and the star's disc made from the world.
//!
//! Needs the `engine-atmosphere` cargo feature. Bevy's atmosphere renders the sky and dims
//! directional lights on their way through the air; this part keeps one `Atmosphere` entity
//! matching the active world's air, and sizes each [`StarLight`]'s `SunDisk` to the star as the
//! world sees it. Together with [`LightAttenuation::ByEngineAtmosphere`] (set by
//! [`InsolaPlugins::with_engine_atmosphere_from_world`](crate::InsolaPlugins::with_engine_atmosphere_from_world))
//! the lights then carry the light above the air and the engine does the rest.

use bevy::light::atmosphere::ScatteringMedium;
use bevy::light::{Atmosphere, SunDisk};
use bevy::prelude::*;
use insola::Planet;

use crate::{ActiveWorld, InsolaSystems, SkyState, StarLight, WorldChanged};

/// Keeps Bevy's [`Atmosphere`] and the star lights' [`SunDisk`] in step with the active world,
/// in [`InsolaSystems::WriteLights`].
#[derive(Debug, Clone, Default)]
pub struct InsolaEngineAtmospherePlugin;

/// Marks the entity holding the world's [`Atmosphere`] (spawned and replaced by the part).
#[derive(Component, Debug, Default)]
pub struct WorldAir;

/// Height of the top of Bevy's atmosphere above the ground, metres (the engine's Earth-like
/// medium is laid out over 100 km).
const ATMOSPHERE_DEPTH_M: f32 = 100_000.0;

/// Ground albedo Bevy's atmosphere uses for light scattered back up (common practice, no source:
/// a mid-grey land surface).
const GROUND_ALBEDO: f32 = 0.3;

/// Turbidity that Bevy's Earth haze stands for: a clear sky (Ångström β about 0.05, common
/// practice, no source).
const ENGINE_HAZE_ANGSTROM_BETA: f64 = 0.05;

impl Plugin for InsolaEngineAtmospherePlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        app.add_systems(
            PostUpdate,
            (follow_world_air, size_star_disc).in_set(InsolaSystems::WriteLights),
        );
    }
}

/// Bevy's scattering medium for a world's air: the engine's Earth-like medium with the Rayleigh
/// terms scaled by the surface pressure and the world's Rayleigh factor, and the haze by its
/// turbidity. `None` for an airless world.
pub fn scattering_medium(planet: &Planet) -> Option<ScatteringMedium> {
    let air = planet.atmosphere();
    if air.is_airless() {
        return None;
    }
    let rayleigh = (air.surface_pressure_kpa / insola::light::REFERENCE_PRESSURE_KPA
        * air.rayleigh_scale) as f32;
    let haze = (air.aerosol_angstrom_beta / ENGINE_HAZE_ANGSTROM_BETA) as f32;
    let mut medium = ScatteringMedium::earth(256, 256);
    // The engine's Earth medium: term 0 Rayleigh scattering, 1 haze (Mie), 2 ozone absorption
    // (which scales with the column of air).
    if let Some(term) = medium.terms.get_mut(0) {
        term.scattering *= rayleigh;
    }
    if let Some(term) = medium.terms.get_mut(1) {
        term.scattering *= haze;
        term.absorption *= haze;
    }
    if let Some(term) = medium.terms.get_mut(2) {
        term.absorption *= rayleigh;
    }
    Some(medium.with_label("insola_world_air"))
}

/// Replaces the [`Atmosphere`] entity whenever the world changes (removed on an airless world).
/// Without the engine's atmosphere renderer (no `Assets<ScatteringMedium>`) it does nothing.
fn follow_world_air(
    mut commands: Commands,
    mut changed: MessageReader<WorldChanged>,
    world: Res<ActiveWorld>,
    air: Query<Entity, With<WorldAir>>,
    media: Option<ResMut<Assets<ScatteringMedium>>>,
) {
    if changed.read().count() == 0 {
        return;
    }
    let (Some(planet), Some(mut media)) = (world.planet(), media) else {
        return;
    };
    for entity in &air {
        commands.entity(entity).despawn();
    }
    if let Some(medium) = scattering_medium(planet) {
        let radius_m = (planet.body().radius_km * 1000.0) as f32;
        commands.spawn((
            Atmosphere {
                inner_radius: radius_m,
                outer_radius: radius_m + ATMOSPHERE_DEPTH_M,
                ground_albedo: Vec3::splat(GROUND_ALBEDO),
                medium: media.add(medium),
            },
            WorldAir,
        ));
    }
}

/// Gives star lights a visible disc the size of their star as seen from the world.
fn size_star_disc(sky: Res<SkyState>, mut discs: Query<(&StarLight, &mut SunDisk)>) {
    if !sky.ready {
        return;
    }
    for (marker, mut disc) in &mut discs {
        let radius = match marker.star {
            0 => Some(sky.star.angular_radius_rad),
            k => sky
                .other_stars
                .get(k - 1)
                .map(|o| o.body.angular_radius_rad),
        };
        let Some(radius) = radius else { continue };
        let size = (2.0 * radius) as f32;
        if disc.angular_size != size {
            disc.angular_size = size;
        }
    }
}

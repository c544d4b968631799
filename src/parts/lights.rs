//! The lights part: star and moon lights, the global ambient light, sky-following exposure.

use bevy::prelude::*;

use crate::exposure::follow_sky_exposure;
use crate::flash_guard::{DisplayedSky, update_displayed_sky};
use crate::lights::{write_ambient_light, write_body_lights};
use crate::{ExposureFollowsSky, InsolaSettings, InsolaSystems, MoonLight, StarLight};

/// Writes [`StarLight`] and [`MoonLight`] directional lights, Bevy's `GlobalAmbientLight` and
/// [`ExposureFollowsSky`] cameras from the [`SkyState`](crate::SkyState), through the
/// [flash guard](crate::flash_guard) ([`DisplayedSky`]), in [`InsolaSystems::WriteLights`].
/// Needs the sky part.
#[derive(Debug, Clone, Default)]
pub struct InsolaLightsPlugin {
    /// Settings shared by every part (the first part to build inserts them).
    pub settings: InsolaSettings,
}

impl Plugin for InsolaLightsPlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        super::insert_settings_once(app, &self.settings);
        app.register_type::<StarLight>()
            .register_type::<MoonLight>()
            .register_type::<ExposureFollowsSky>()
            .register_type::<DisplayedSky>()
            .init_resource::<GlobalAmbientLight>()
            .init_resource::<DisplayedSky>()
            .add_systems(
                PostUpdate,
                (
                    update_displayed_sky,
                    (write_body_lights, write_ambient_light, follow_sky_exposure),
                )
                    .chain()
                    .in_set(InsolaSystems::WriteLights),
            );
    }
}

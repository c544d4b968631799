//! The plugin's parts: one Bevy plugin per job, gathered by [`InsolaPlugins`].
//!
//! | Part | Adds | Needs |
//! |---|---|---|
//! | [`InsolaClockPlugin`] | [`WorldClock`](crate::WorldClock) and its advance | — |
//! | [`InsolaWorldPlugin`] | [`ActiveWorld`](crate::ActiveWorld), world files, change reports | — |
//! | [`InsolaSkyPlugin`] | [`SkyState`](crate::SkyState) and [`SkyNotice`](crate::SkyNotice)s | clock, world |
//! | [`InsolaLightsPlugin`] | star, moon and ambient light, exposure | sky |
//! | [`InsolaClimatePlugin`] | [`SeasonalClimate`](crate::SeasonalClimate) | world |
//! | [`InsolaObserversPlugin`] | [`LocalConditions`](crate::LocalConditions) of places | clock, world (climate optional) |
//! | `InsolaEngineAtmospherePlugin` (feature `engine-atmosphere`, not in the default group) | Bevy's `Atmosphere` and sun disc from the world | sky |
//!
//! Leave a part out with Bevy's plugin-group builder, e.g. a server that wants only time and
//! notices: `InsolaPlugins::new().build().disable::<InsolaLightsPlugin>()
//! .disable::<InsolaClimatePlugin>().disable::<InsolaObserversPlugin>()`.

mod climate;
mod clock;
#[cfg(feature = "engine-atmosphere")]
mod engine_atmosphere;
mod group;
mod lights;
mod observers;
mod sky;
mod world;

pub use climate::InsolaClimatePlugin;
pub use clock::InsolaClockPlugin;
#[cfg(feature = "engine-atmosphere")]
pub use engine_atmosphere::{InsolaEngineAtmospherePlugin, WorldAir, scattering_medium};
pub use group::InsolaPlugins;
pub use lights::InsolaLightsPlugin;
pub use observers::InsolaObserversPlugin;
pub use sky::InsolaSkyPlugin;
pub use world::{InsolaWorldPlugin, WorldSource};

use bevy::prelude::*;
use bevy::transform::TransformSystems;

use crate::{InsolaSettings, InsolaSystems};

/// Orders the plugin's sets in `PostUpdate`; every part calls it, so any subset is ordered.
fn configure_sets(app: &mut App) {
    app.configure_sets(
        PostUpdate,
        (
            InsolaSystems::AdvanceClock,
            InsolaSystems::ComputeSky,
            InsolaSystems::WriteLights,
            InsolaSystems::UpdateObservers,
        )
            .chain()
            .before(TransformSystems::Propagate),
    );
}

/// Inserts the settings unless an earlier part (or the app) already did: the parts share one
/// [`InsolaSettings`] resource.
fn insert_settings_once(app: &mut App, settings: &InsolaSettings) {
    if !app.world().contains_resource::<InsolaSettings>() {
        app.register_type::<InsolaSettings>()
            .insert_resource(settings.clone());
    }
}

//! [`InsolaPlugins`]: every part, configured in one place.

use bevy::app::PluginGroupBuilder;
use bevy::prelude::*;
use insola::WorldSpec;

use super::{
    InsolaClimatePlugin, InsolaClockPlugin, InsolaLightsPlugin, InsolaObserversPlugin,
    InsolaSkyPlugin, InsolaWorldPlugin, WorldSource,
};
use crate::{InsolaSettings, LightAttenuation, SceneCompass, WorldClock, WorldInstant};

/// All of Insola's parts, added with one line and configured with the `with_*` builders.
///
/// Works with `DefaultPlugins` and with `MinimalPlugins`. World files need Bevy's
/// `AssetPlugin`, added before these plugins; without it give the world with
/// [`InsolaPlugins::with_world_spec`] or [`ActiveWorld::set_spec`](crate::ActiveWorld::set_spec).
/// Leave out or replace a part with Bevy's group builder (see [`crate::parts`]):
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::prelude::*;
/// use bevy_insola::parts::{InsolaClimatePlugin, InsolaLightsPlugin, InsolaObserversPlugin};
///
/// // A server that wants only world time and sky notices: no lights, no climate is built.
/// App::new().add_plugins(MinimalPlugins).add_plugins(
///     InsolaPlugins::new()
///         .build()
///         .disable::<InsolaLightsPlugin>()
///         .disable::<InsolaClimatePlugin>()
///         .disable::<InsolaObserversPlugin>(),
/// );
/// ```
#[derive(Debug, Clone, Default)]
pub struct InsolaPlugins {
    world: WorldSource,
    settings: InsolaSettings,
    clock: WorldClock,
    real_seconds_per_day: Option<f64>,
    /// Add the engine-atmosphere part (only with the `engine-atmosphere` feature).
    engine_atmosphere_from_world: bool,
}

impl InsolaPlugins {
    /// Every part, with no world yet and default settings.
    pub fn new() -> InsolaPlugins {
        InsolaPlugins::default()
    }

    /// Loads the world from this asset path (e.g. `"worlds/verdance.world.ron"`), and
    /// follows the file's hot reloads.
    pub fn with_world_file(mut self, asset_path: impl Into<String>) -> InsolaPlugins {
        self.world = WorldSource::File(asset_path.into());
        self
    }

    /// Uses this world directly (no asset server needed).
    pub fn with_world_spec(mut self, spec: WorldSpec) -> InsolaPlugins {
        self.world = WorldSource::Spec(Box::new(spec));
        self
    }

    /// The scene's compass. Default: +Y up, −Z north, +X east.
    pub fn with_compass(mut self, compass: SceneCompass) -> InsolaPlugins {
        self.settings.compass = compass;
        self
    }

    /// `true` when the engine's atmosphere dims the lights (Bevy's `Atmosphere` is in the
    /// scene): lights then carry the light above the air. Default `false`.
    pub fn with_engine_atmosphere(mut self, engine_atmosphere: bool) -> InsolaPlugins {
        self.settings.attenuation = if engine_atmosphere {
            LightAttenuation::ByEngineAtmosphere
        } else {
            LightAttenuation::ByInsola
        };
        self
    }

    /// Lights for Bevy's atmosphere, and that atmosphere made from the world: sets
    /// [`LightAttenuation::ByEngineAtmosphere`] and adds the
    /// [`InsolaEngineAtmospherePlugin`](super::InsolaEngineAtmospherePlugin) part, which keeps
    /// an `Atmosphere` entity matching the world's air and sizes the star's disc. (Feature
    /// `engine-atmosphere`; the camera still needs Bevy's atmosphere rendering enabled.)
    #[cfg(feature = "engine-atmosphere")]
    pub fn with_engine_atmosphere_from_world(mut self) -> InsolaPlugins {
        self = self.with_engine_atmosphere(true);
        self.engine_atmosphere_from_world = true;
        self
    }

    /// The scene's reference place, degrees (latitude −90…90, east longitude, any finite
    /// value). Default 40° N, 0° E.
    pub fn with_reference_place(mut self, latitude_deg: f64, longitude_deg: f64) -> InsolaPlugins {
        self.settings.reference_latitude_deg = latitude_deg;
        self.settings.reference_longitude_deg = longitude_deg;
        self
    }

    /// All runtime settings at once.
    pub fn with_settings(mut self, settings: InsolaSettings) -> InsolaPlugins {
        self.settings = settings;
        self
    }

    /// The clock's rate, world seconds per real second. Default 60.
    pub fn with_clock_rate(mut self, rate: f64) -> InsolaPlugins {
        self.clock = self.clock.with_rate(rate);
        self.real_seconds_per_day = None;
        self
    }

    /// One world day (the local solar day) passes in `real_s` real seconds, whatever world is
    /// loaded, including worlds loaded or reloaded later: the rate follows the world's day.
    /// Non-positive or non-finite values are ignored (the rate stays as it is).
    pub fn with_real_seconds_per_day(mut self, real_s: f64) -> InsolaPlugins {
        self.real_seconds_per_day = (real_s.is_finite() && real_s > 0.0).then_some(real_s);
        self
    }

    /// Starts the clock at this instant. Default: time zero.
    pub fn with_start(mut self, start: WorldInstant) -> InsolaPlugins {
        let rate = self.clock.rate();
        self.clock = WorldClock::starting_at(start).with_rate(rate);
        self
    }
}

impl PluginGroup for InsolaPlugins {
    fn build(self) -> PluginGroupBuilder {
        let mut clock = self.clock;
        clock.real_seconds_per_day = self.real_seconds_per_day;
        let with_air = self.engine_atmosphere_from_world;
        let group = PluginGroupBuilder::start::<Self>()
            .add(InsolaClockPlugin { clock })
            .add(InsolaWorldPlugin { source: self.world })
            .add(InsolaSkyPlugin {
                settings: self.settings.clone(),
            })
            .add(InsolaLightsPlugin {
                settings: self.settings.clone(),
            })
            .add(InsolaClimatePlugin)
            .add(InsolaObserversPlugin {
                settings: self.settings,
            });
        add_engine_atmosphere(group, with_air)
    }
}

#[cfg(feature = "engine-atmosphere")]
fn add_engine_atmosphere(group: PluginGroupBuilder, on: bool) -> PluginGroupBuilder {
    if on {
        group.add(super::InsolaEngineAtmospherePlugin)
    } else {
        group
    }
}

#[cfg(not(feature = "engine-atmosphere"))]
fn add_engine_atmosphere(group: PluginGroupBuilder, _on: bool) -> PluginGroupBuilder {
    group
}

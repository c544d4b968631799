//! # bevy_insola
//!
//! Sky, light and seasons for any planet, as a Bevy plugin. [`InsolaPlugin`] runs a world
//! clock, computes where the star and moons stand for the scene's reference place, drives the
//! scene's directional lights and ambient light in physical units, keeps a seasonal climate,
//! updates any number of observers on the planet, and sends notifications (sunrise, twilight,
//! solstices, new day…) as Bevy messages. The science lives in the engine-free core crate
//! [`insola`]; this crate is the glue.
//!
//! ## Quick start
//!
//! ```no_run
//! use bevy::prelude::*;
//! use bevy_insola::prelude::*;
//!
//! App::new()
//!     .add_plugins(DefaultPlugins)
//!     .add_plugins(InsolaPlugin::new().with_world_file("worlds/verdance.world.ron"))
//!     .add_systems(Startup, |mut commands: Commands| {
//!         commands.spawn((StarLight, DirectionalLight { shadow_maps_enabled: true, ..default() }));
//!         commands.spawn((Camera3d::default(), ExposureFollowsSky::default()));
//!     })
//!     .run();
//! ```
//!
//! A headless server needs no asset server or renderer:
//!
//! ```
//! use bevy::prelude::*;
//! use bevy_insola::prelude::*;
//!
//! let spec = insola::WorldSpec::from_ron_str(r#"(name: "Pellucid",
//!     star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
//!     orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02, periapsis_longitude_deg: 100, period_days: 300),
//!     spin: (obliquity_deg: 20, solar_day_hours: 22))"#).unwrap();
//! let mut app = App::new();
//! app.add_plugins(MinimalPlugins).add_plugins(InsolaPlugin::new().with_world_spec(spec));
//! app.update();
//! assert!(app.world().resource::<SkyState>().ready);
//! ```
//!
//! ## Order of work each frame
//!
//! All systems run in `PostUpdate`, in the chained sets of [`InsolaSystems`], before transform
//! propagation: the clock advances, the sky is computed and notifications sent, lights are
//! written, then the climate and the observers are updated. Gameplay in `Update` reads the
//! state of the previous frame and its messages.
//!
//! ## Conventions
//!
//! World time is seconds since the world's time zero ([`WorldInstant`], exact). Angles are
//! radians unless the name says `_deg`. Light is in lux, ambient light in cd/m², insolation in
//! W m⁻², temperature in °C. Scene axes come from the [`SceneCompass`] (default +Y up, −Z
//! north, +X east).

mod climate;
mod clock;
mod exposure;
mod lights;
mod map;
mod messages;
mod observer_table;
mod observers;
mod season;
mod settings;
mod sky_state;
mod world_asset;

pub use climate::*;
pub use clock::*;
pub use exposure::*;
pub use lights::*;
pub use map::*;
pub use messages::*;
pub use observers::*;
pub use season::*;
pub use settings::*;
pub use sky_state::*;
pub use world_asset::*;

use bevy::asset::{AssetApp, AssetPlugin, AssetServer};
use bevy::prelude::*;
use bevy::transform::TransformSystems;
use insola::WorldSpec;

/// The most used types: `use bevy_insola::prelude::*;`.
pub mod prelude {
    pub use crate::{
        ActiveWorld, DaylightPhase, ExposureFollowsSky, InsolaPlugin, InsolaSettings,
        InsolaSystems, LightAttenuation, LocalConditions, MoonLight, ObserverInstant, SceneCompass,
        SeasonOfYear, SeasonalClimate, SkyNotice, SkyNoticeKind, SkyState, StarLight, SurfacePlace,
        ThermalSeason, WorldClock, WorldInstant,
    };
}

/// The plugin's systems, in the order they run in `PostUpdate` (chained, before
/// `TransformSystems::Propagate`). Each variant says what holds after it.
#[derive(SystemSet, Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum InsolaSystems {
    /// World files loaded or reloaded this frame are active (or reported as rejected), and the
    /// [`WorldClock`] holds this frame's instant; [`WorldChanged`] / [`WorldRejected`] are sent.
    AdvanceClock,
    /// [`SkyState`] is this frame's, and every [`SkyNotice`] between the previous and the
    /// current instant has been sent, in time order.
    ComputeSky,
    /// Star and moon lights, the global ambient light and sky-following exposures are written.
    WriteLights,
    /// The [`SeasonalClimate`] has picked up a finished rebuild (or started one for a new
    /// world), map-placed observers have their places, and due [`LocalConditions`] are current.
    UpdateObservers,
}

#[derive(Debug, Clone)]
enum WorldChoice {
    None,
    File(String),
    Spec(Box<WorldSpec>),
}

/// The plugin. Add it with one line; configure it with the `with_*` builders.
///
/// Works with `DefaultPlugins` and with `MinimalPlugins`. World files need Bevy's
/// `AssetPlugin`, added before this plugin; without it set the world with
/// [`InsolaPlugin::with_world_spec`] or [`ActiveWorld::set_spec`].
#[derive(Debug, Clone)]
pub struct InsolaPlugin {
    world: WorldChoice,
    settings: InsolaSettings,
    clock: WorldClock,
}

impl Default for InsolaPlugin {
    fn default() -> Self {
        InsolaPlugin {
            world: WorldChoice::None,
            settings: InsolaSettings::default(),
            clock: WorldClock::default(),
        }
    }
}

impl InsolaPlugin {
    /// A plugin with no world yet and default settings.
    pub fn new() -> InsolaPlugin {
        InsolaPlugin::default()
    }

    /// Loads the world from this asset path (e.g. `"worlds/verdance.world.ron"`), and
    /// follows the file's hot reloads.
    pub fn with_world_file(mut self, asset_path: impl Into<String>) -> InsolaPlugin {
        self.world = WorldChoice::File(asset_path.into());
        self
    }

    /// Uses this world directly (no asset server needed).
    pub fn with_world_spec(mut self, spec: WorldSpec) -> InsolaPlugin {
        self.world = WorldChoice::Spec(Box::new(spec));
        self
    }

    /// The scene's compass. Default: +Y up, −Z north, +X east.
    pub fn with_compass(mut self, compass: SceneCompass) -> InsolaPlugin {
        self.settings.compass = compass;
        self
    }

    /// `true` when the engine's atmosphere dims the lights (Bevy's `Atmosphere` is in the
    /// scene): lights then carry the light above the air. Default `false`.
    pub fn with_engine_atmosphere(mut self, engine_atmosphere: bool) -> InsolaPlugin {
        self.settings.attenuation = if engine_atmosphere {
            LightAttenuation::ByEngineAtmosphere
        } else {
            LightAttenuation::ByInsola
        };
        self
    }

    /// The scene's reference place, degrees (latitude −90…90, east longitude −360…360).
    /// Default 40° N, 0° E.
    pub fn with_reference_place(mut self, latitude_deg: f64, longitude_deg: f64) -> InsolaPlugin {
        self.settings.reference_latitude_deg = latitude_deg;
        self.settings.reference_longitude_deg = longitude_deg;
        self
    }

    /// All runtime settings at once.
    pub fn with_settings(mut self, settings: InsolaSettings) -> InsolaPlugin {
        self.settings = settings;
        self
    }

    /// The clock's rate, world seconds per real second. Default 60.
    pub fn with_clock_rate(mut self, rate: f64) -> InsolaPlugin {
        self.clock = self.clock.with_rate(rate);
        self
    }

    /// Starts the clock at this instant. Default: time zero.
    pub fn with_start(mut self, start: WorldInstant) -> InsolaPlugin {
        let rate = self.clock.rate();
        self.clock = WorldClock::starting_at(start).with_rate(rate);
        self
    }
}

impl Plugin for InsolaPlugin {
    fn build(&self, app: &mut App) {
        app.register_type::<WorldClock>()
            .register_type::<InsolaSettings>()
            .register_type::<SkyState>()
            .register_type::<StarLight>()
            .register_type::<MoonLight>()
            .register_type::<SurfacePlace>()
            .register_type::<LocalConditions>()
            .register_type::<ObserverInstant>()
            .register_type::<ExposureFollowsSky>()
            .register_type::<MapProjection>()
            .register_type::<PlaceFromPosition>()
            .register_type::<SkyNotice>();

        app.insert_resource(self.clock.clone())
            .insert_resource(self.settings.clone())
            .init_resource::<SkyState>()
            .init_resource::<SeasonalClimate>()
            .init_resource::<ObserverInstant>()
            .init_resource::<GlobalAmbientLight>()
            .add_message::<SkyNotice>()
            .add_message::<WorldChanged>()
            .add_message::<WorldRejected>();

        let mut active = ActiveWorld::default();
        let assets = app.is_plugin_added::<AssetPlugin>();
        if assets {
            app.init_asset::<WorldFile>()
                .register_asset_loader(WorldFileLoader);
        }
        match &self.world {
            WorldChoice::None => {}
            WorldChoice::Spec(spec) => {
                // An invalid spec is logged and reported with a `WorldRejected` message.
                let _ = active.set_spec(spec);
            }
            WorldChoice::File(path) => match app.world().get_resource::<AssetServer>() {
                Some(server) if assets => active.follow(server.load(path.clone())),
                _ => error!(
                    "Insola: cannot load `{path}` without Bevy's AssetPlugin (add it before InsolaPlugin, or use `with_world_spec`)"
                ),
            },
        }
        app.insert_resource(active);

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
        if assets {
            app.add_systems(
                PostUpdate,
                apply_world_files
                    .in_set(InsolaSystems::AdvanceClock)
                    .before(advance_world_clock),
            );
        }
        app.add_systems(
            PostUpdate,
            (
                (advance_world_clock, report_world_changes)
                    .chain()
                    .in_set(InsolaSystems::AdvanceClock),
                (compute_sky_state, send_sky_notices).in_set(InsolaSystems::ComputeSky),
                (write_body_lights, write_ambient_light, follow_sky_exposure)
                    .in_set(InsolaSystems::WriteLights),
                (update_climate, places_from_positions, update_observers)
                    .chain()
                    .in_set(InsolaSystems::UpdateObservers),
            ),
        );
    }
}

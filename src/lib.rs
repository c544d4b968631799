//! # bevy_insola
//!
//! Sky, light and seasons for any planet, as a Bevy plugin. [`InsolaPlugins`] runs a world
//! clock, computes where the star and moons stand for the scene's reference place, drives the
//! scene's directional lights and ambient light in physical units, keeps a seasonal climate,
//! updates any number of observers on the planet, and sends notifications (sunrise, twilight,
//! solstices, new day…) as Bevy messages. The science lives in the engine-free core crate
//! [`insola`]; this crate is the glue.
//!
//! ## Set-up
//!
//! `Cargo.toml` of a game with a window:
//!
//! ```toml
//! [dependencies]
//! bevy_insola = "0.1"     # re-exports the core as `bevy_insola::insola`
//! bevy = { version = "0.19", default-features = false, features = [
//!     "default_app", "std", "multi_threaded", "3d_bevy_render", "bevy_winit", "x11",
//!     "tonemapping_luts", "png",
//!     "file_watcher",     # hot reload of *.world.ron files while the game runs
//! ] }
//! ```
//!
//! A headless server needs only `features = ["std", "multi_threaded", "bevy_asset"]`.
//!
//! ## Quick start
//!
//! ```no_run
//! use bevy::prelude::*;
//! use bevy_insola::prelude::*;
//!
//! fn main() {
//!     App::new()
//!         .add_plugins(DefaultPlugins)
//!         .add_plugins(InsolaPlugins::new().with_world_file("worlds/verdance.world.ron"))
//!         .add_systems(Startup, |mut commands: Commands| {
//!             commands.spawn((StarLight::PRIMARY, DirectionalLight { shadow_maps_enabled: true, ..default() }));
//!             commands.spawn((Camera3d::default(), ExposureFollowsSky::default()));
//!         })
//!         .run();
//! }
//! ```
//!
//! [`InsolaPlugins`] is a group of [`parts`]; leave any out with Bevy's group builder.
//!
//! A headless server needs no asset server or renderer:
//!
//! ```
//! use bevy::prelude::*;
//! use bevy_insola::prelude::*;
//!
//! let spec = insola::WorldSpec::from_ron_str(r#"(name: "Ennavel",
//!     star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
//!     orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02, periapsis_longitude_deg: 100, period_days: 300),
//!     spin: (obliquity_deg: 20, solar_day_hours: 22))"#).unwrap();
//! let mut app = App::new();
//! app.add_plugins(MinimalPlugins).add_plugins(InsolaPlugins::new().with_world_spec(spec));
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
pub mod flash_guard;
mod lights;
mod map;
mod map_climate;
mod messages;
mod observers;
pub mod parts;
mod season;
mod settings;
mod sky_state;
mod world_asset;

pub use climate::*;
pub use clock::*;
pub use exposure::*;
pub use flash_guard::{DisplayedSky, FlashGuard, SkyHold};
pub use lights::*;
pub use map::*;
pub use map_climate::ClimateSurface;
pub use messages::*;
pub use observers::*;
pub use season::*;
pub use settings::*;
pub use sky_state::*;
pub use world_asset::*;

use bevy::prelude::*;

/// The engine-free core, re-exported so that `bevy_insola::insola::WorldSpec` (or a plain
/// `insola::…` with `use bevy_insola::insola;`) needs no second dependency line.
pub use insola;
pub use parts::InsolaPlugins;

/// The most used types: `use bevy_insola::prelude::*;`.
pub mod prelude {
    pub use crate::{
        ActiveWorld, ExposureFollowsSky, InsolaPlugins, InsolaSettings, InsolaSystems,
        LightAttenuation, LocalConditions, MoonLight, ObserverInstant, SceneCompass, SeasonOfYear,
        SeasonalClimate, SkyBody, SkyEventKind, SkyNotice, SkyState, StarLight, SurfacePlace,
        ThermalSeason, TwilightPhase, WorldChanged, WorldClock, WorldInstant, WorldRejected,
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

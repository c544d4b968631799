//! The world part: the active world, world files and their hot reloads, change reports.

use bevy::asset::{AssetApp, AssetPlugin, AssetServer};
use bevy::prelude::*;
use insola::WorldSpec;

use crate::clock::advance_world_clock;
use crate::world_asset::{apply_world_files, report_world_changes};
use crate::{ActiveWorld, InsolaSystems, WorldChanged, WorldFile, WorldFileLoader, WorldRejected};

/// Where the world comes from at start-up.
#[derive(Debug, Clone, Default)]
pub enum WorldSource {
    /// No world yet: set one later with [`ActiveWorld::set_spec`].
    #[default]
    None,
    /// A world file, by asset path (needs Bevy's `AssetPlugin`, added before Insola); hot
    /// reloads are followed.
    File(String),
    /// A world given in code.
    Spec(Box<WorldSpec>),
}

/// Adds [`ActiveWorld`], the [`WorldChanged`] and [`WorldRejected`] messages, and (when Bevy's
/// `AssetPlugin` is present) the `*.world.ron` asset loader.
///
/// A world file asked for without an `AssetPlugin` is reported as rejected (a
/// [`WorldRejected`] message on the first frame and [`ActiveWorld::last_error`]).
#[derive(Debug, Clone, Default)]
pub struct InsolaWorldPlugin {
    /// The world to start with.
    pub source: WorldSource,
}

impl Plugin for InsolaWorldPlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        app.add_message::<WorldChanged>()
            .add_message::<WorldRejected>();
        let assets = app.is_plugin_added::<AssetPlugin>();
        if assets {
            app.init_asset::<WorldFile>()
                .register_asset_loader(WorldFileLoader);
            app.add_systems(
                PostUpdate,
                apply_world_files
                    .in_set(InsolaSystems::AdvanceClock)
                    .before(advance_world_clock)
                    .before(report_world_changes),
            );
        }
        let mut active = ActiveWorld::default();
        match &self.source {
            WorldSource::None => {}
            WorldSource::Spec(spec) => {
                // An invalid spec is logged and reported with a `WorldRejected` message.
                let _ = active.set_spec(spec);
            }
            WorldSource::File(path) => match app.world().get_resource::<AssetServer>() {
                Some(server) if assets => active.follow(server.load(path.clone())),
                _ => active.reject(
                    path.clone(),
                    "cannot load a world file without Bevy's AssetPlugin: add it (or \
                     DefaultPlugins) before Insola's plugins, or give the world with \
                     `with_world_spec`"
                        .to_string(),
                    None,
                ),
            },
        }
        app.insert_resource(active);
        app.add_systems(
            PostUpdate,
            report_world_changes
                .in_set(InsolaSystems::AdvanceClock)
                .after(advance_world_clock),
        );
    }
}

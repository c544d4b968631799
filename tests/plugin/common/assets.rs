//! Apps that load world files through Bevy's asset server, and helpers to drive them.

use std::path::PathBuf;
use std::time::Duration;

use bevy::asset::AssetPlugin;
use bevy::prelude::*;
use bevy::time::TimeUpdateStrategy;
use bevy_insola::prelude::*;
use bevy_insola::{WorldChanged, WorldRejected};

/// Every world change and rejection seen, in order.
#[derive(Resource, Default)]
pub struct Reports {
    pub changed: Vec<WorldChanged>,
    pub rejected: Vec<WorldRejected>,
}

fn record(
    mut c: MessageReader<WorldChanged>,
    mut r: MessageReader<WorldRejected>,
    mut reports: ResMut<Reports>,
) {
    reports.changed.extend(c.read().cloned());
    reports.rejected.extend(r.read().cloned());
}

pub fn asset_app(root: &std::path::Path, world_file: &str) -> App {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(AssetPlugin {
            file_path: root.display().to_string(),
            watch_for_changes_override: Some(false),
            ..default()
        })
        .add_plugins(InsolaPlugins::new().with_world_file(world_file))
        .insert_resource(TimeUpdateStrategy::ManualDuration(Duration::from_millis(
            16,
        )))
        .init_resource::<Reports>()
        .add_systems(Last, record);
    app
}

/// Updates until `done` holds (at most about ten seconds of waiting on the loader's threads).
pub fn update_until(app: &mut App, done: impl Fn(&App) -> bool) {
    for _ in 0..2000 {
        app.update();
        if done(app) {
            return;
        }
        std::thread::sleep(Duration::from_millis(5));
    }
    panic!("condition not reached");
}

/// Writes `text` to `file` in the asset folder `dir` and asks the asset server to reload it
/// (the apps do not watch the folder).
pub fn rewrite_and_reload(app: &mut App, dir: &std::path::Path, file: &str, text: &str) {
    std::fs::write(dir.join(file), text).unwrap();
    app.world()
        .resource::<bevy::asset::AssetServer>()
        .reload(file.to_string());
}

pub fn temp_dir(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("insola-{name}-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

pub fn world_name(app: &App) -> Option<String> {
    app.world()
        .resource::<ActiveWorld>()
        .planet()
        .map(|p| p.spec().name.clone())
}

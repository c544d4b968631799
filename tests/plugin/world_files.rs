//! World files through the asset loader, hot reload, and a bad file keeping the last good world.

use std::path::PathBuf;

use crate::common::assets::*;
use crate::common::*;
use bevy::asset::{AssetServer, Assets};
use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{WorldChangeCause, WorldFile};

#[test]
fn the_shipped_worlds_load_through_the_asset_loader() {
    let assets = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("assets");
    let mut app = asset_app(&assets, "worlds/verdance.world.ron");
    update_until(&mut app, |app| world_name(app).is_some());
    assert_eq!(world_name(&app).as_deref(), Some("Verdance"));
    assert_eq!(
        app.world().resource::<Reports>().changed[0].cause,
        WorldChangeCause::Loaded
    );
    assert!(app.world().resource::<SkyState>().ready);
    // Every world file in the folder parses and validates through the loader.
    let mut handles = Vec::new();
    for entry in std::fs::read_dir(assets.join("worlds")).unwrap() {
        let name = entry.unwrap().file_name().into_string().unwrap();
        if name.ends_with(".world.ron") {
            handles.push(
                app.world()
                    .resource::<AssetServer>()
                    .load::<WorldFile>(format!("worlds/{name}")),
            );
        }
    }
    assert!(handles.len() >= 3);
    update_until(&mut app, |app| {
        let server = app.world().resource::<AssetServer>();
        handles
            .iter()
            .all(|h| server.is_loaded(h.id()) || server.load_state(h.id()).is_failed())
    });
    let files = app.world().resource::<Assets<WorldFile>>();
    for h in &handles {
        let file = files
            .get(h.id())
            .unwrap_or_else(|| panic!("{:?} failed to load", h.path()));
        assert!(insola::Planet::new(&file.spec).is_ok());
    }
}

#[test]
fn a_broken_reload_keeps_the_last_good_world() {
    let dir = temp_dir("reload");
    std::fs::write(dir.join("brindle.world.ron"), BRINDLE).unwrap();
    let mut app = asset_app(&dir, "brindle.world.ron");
    app.world_mut().spawn(StarLight::PRIMARY);
    update_until(&mut app, |app| world_name(app).is_some());
    assert_eq!(world_name(&app).as_deref(), Some("Brindle"));
    let generation = app.world().resource::<ActiveWorld>().generation();

    // A syntax error: the reload fails, the old world stays, the error is reported.
    rewrite_and_reload(
        &mut app,
        &dir,
        "brindle.world.ron",
        &BRINDLE.replace("eccentricity: 0.02,", "eccentricity: 0.02"),
    );
    update_until(&mut app, |app| {
        !app.world().resource::<Reports>().rejected.is_empty()
    });
    let rejected = app.world().resource::<Reports>().rejected[0].clone();
    assert!(rejected.kept_world);
    assert!(rejected.reason.contains("line"), "{}", rejected.reason);
    assert_eq!(world_name(&app).as_deref(), Some("Brindle"));
    assert_eq!(
        app.world().resource::<ActiveWorld>().generation(),
        generation
    );
    assert!(app.world().resource::<ActiveWorld>().last_error().is_some());
    for _ in 0..5 {
        app.update();
    }
    assert!(app.world().resource::<SkyState>().ready);

    // A value out of range is rejected by the loader's validation too.
    rewrite_and_reload(
        &mut app,
        &dir,
        "brindle.world.ron",
        &BRINDLE.replace("obliquity_deg: 23", "obliquity_deg: 230"),
    );
    update_until(&mut app, |app| {
        app.world().resource::<Reports>().rejected.len() >= 2
    });
    assert_eq!(world_name(&app).as_deref(), Some("Brindle"));

    // A good edit: the new world is active on the next frame after the reload.
    rewrite_and_reload(
        &mut app,
        &dir,
        "brindle.world.ron",
        &BRINDLE.replace("\"Brindle\"", "\"Brindle Revised\""),
    );
    update_until(&mut app, |app| {
        world_name(app).as_deref() == Some("Brindle Revised")
    });
    let last = app
        .world()
        .resource::<Reports>()
        .changed
        .last()
        .cloned()
        .unwrap();
    app.update();
    let last = app
        .world()
        .resource::<Reports>()
        .changed
        .last()
        .cloned()
        .unwrap_or(last);
    assert_eq!(last.cause, WorldChangeCause::Reloaded);
    assert!(app.world().resource::<ActiveWorld>().last_error().is_none());
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn an_invalid_edit_in_memory_keeps_the_last_good_world() {
    let dir = temp_dir("memory");
    std::fs::write(dir.join("brindle.world.ron"), BRINDLE).unwrap();
    let mut app = asset_app(&dir, "brindle.world.ron");
    update_until(&mut app, |app| world_name(app).is_some());
    // An editor tool changes the asset in memory to an impossible world (Modified event).
    let id = app.world().resource::<ActiveWorld>().handle().unwrap().id();
    app.world_mut()
        .resource_mut::<Assets<WorldFile>>()
        .get_mut(id)
        .unwrap()
        .spec
        .spin
        .obliquity_deg = -5.0;
    update_until(&mut app, |app| {
        !app.world().resource::<Reports>().rejected.is_empty()
    });
    let rejected = &app.world().resource::<Reports>().rejected[0];
    assert_eq!(rejected.field.as_deref(), Some("spin.obliquity_deg"));
    assert_eq!(world_name(&app).as_deref(), Some("Brindle"));
    let _ = std::fs::remove_dir_all(&dir);
}

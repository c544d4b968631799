//! The whole broken-world corpus through the plugin's hot reload: each broken file is rejected
//! with a message that names what is wrong, the last good world keeps running, and a good file
//! afterwards is taken up again.

mod common;

use std::path::{Path, PathBuf};

use bevy::asset::AssetServer;
use bevy::prelude::*;
use bevy_insola::ActiveWorld;
use bevy_insola::prelude::*;
use common::assets::*;
use common::*;

/// The corpus shared with the core's tests: `(file name, expectation, text)`.
fn corpus() -> Vec<(String, String, String)> {
    let dir = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("crates/insola/tests/bad-worlds");
    let mut files: Vec<(String, String, String)> = std::fs::read_dir(&dir)
        .expect("corpus folder")
        .map(|entry| entry.expect("corpus entry").path())
        .filter(|path| path.to_string_lossy().ends_with(".world.ron"))
        .map(|path| {
            let text = std::fs::read_to_string(&path).expect("readable corpus file");
            let expect = text
                .lines()
                .next()
                .and_then(|l| l.strip_prefix("// expect:"))
                .expect("first line says what to expect")
                .trim()
                .to_string();
            let name = path.file_name().unwrap().to_string_lossy().into_owned();
            (name, expect, text)
        })
        .collect();
    files.sort();
    files
}

fn reload(app: &mut App, dir: &Path, text: &str) {
    std::fs::write(dir.join("live.world.ron"), text).unwrap();
    app.world()
        .resource::<AssetServer>()
        .reload("live.world.ron");
}

#[test]
fn every_broken_world_is_rejected_on_reload_and_the_last_good_world_keeps_running() {
    let files = corpus();
    assert!(files.len() >= 30, "the corpus has {} files", files.len());
    let dir = temp_dir("bad-corpus");
    std::fs::write(dir.join("live.world.ron"), BRINDLE).unwrap();
    let mut app = asset_app(&dir, "live.world.ron");
    app.world_mut().spawn(StarLight);
    update_until(&mut app, |app| world_name(app).is_some());
    let generation = app.world().resource::<ActiveWorld>().generation();

    for (name, expect, text) in &files {
        let seen = app.world().resource::<Reports>().rejected.len();
        reload(&mut app, &dir, text);
        update_until(&mut app, |app| {
            app.world().resource::<Reports>().rejected.len() > seen
        });
        let rejected = app.world().resource::<Reports>().rejected[seen].clone();
        let said = format!("{} {:?}", rejected.reason, rejected.field);
        assert!(
            !rejected.reason.contains('\n'),
            "{name}: one line, no backtrace"
        );
        if let Some(field) = expect.strip_prefix("field:") {
            assert_eq!(rejected.field.as_deref(), Some(field), "{name}: {said}");
        } else if let Some(unknown) = expect.strip_prefix("unknown:") {
            assert!(
                said.contains(unknown),
                "{name}: `{said}` does not name `{unknown}`"
            );
        } else {
            assert_eq!(expect, "syntax", "{name}: unreadable expectation");
            assert!(said.contains("line"), "{name}: `{said}` gives no line");
        }
        assert!(rejected.kept_world, "{name}");
        // Reported once, although Bevy retries a failed reload.
        for _ in 0..5 {
            app.update();
            std::thread::sleep(std::time::Duration::from_millis(2));
        }
        assert_eq!(
            app.world().resource::<Reports>().rejected.len(),
            seen + 1,
            "{name}"
        );
        // The last good world is still the one running, and the sky keeps being computed.
        assert_eq!(world_name(&app).as_deref(), Some("Brindle"), "{name}");
        assert_eq!(
            app.world().resource::<ActiveWorld>().generation(),
            generation,
            "{name}"
        );
        let before = app.world().resource::<WorldClock>().elapsed_s();
        app.update();
        assert!(app.world().resource::<WorldClock>().elapsed_s() > before);
        assert!(app.world().resource::<SkyState>().ready, "{name}");
    }
    assert_eq!(
        app.world().resource::<Reports>().rejected.len(),
        files.len(),
        "one rejection per broken file"
    );

    // A good file afterwards is taken up.
    reload(
        &mut app,
        &dir,
        &BRINDLE.replace("\"Brindle\"", "\"Brindle Mended\""),
    );
    update_until(&mut app, |app| {
        world_name(app).as_deref() == Some("Brindle Mended")
    });
    let _ = std::fs::remove_dir_all(&dir);
}

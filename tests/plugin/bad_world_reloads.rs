//! The whole broken-world corpus through the plugin's hot reload: each broken file is rejected
//! with a message that names what is wrong, the last good world keeps running, and a good file
//! afterwards is taken up again.

use crate::common::assets::*;
use crate::common::*;
use bevy::prelude::*;
use bevy_insola::ActiveWorld;
use bevy_insola::prelude::*;

use insola_test_support::bad_worlds::{Expected, corpus};

#[test]
fn every_broken_world_is_rejected_on_reload_and_the_last_good_world_keeps_running() {
    let files = corpus();
    assert!(files.len() >= 30, "the corpus has {} files", files.len());
    let dir = temp_dir("bad-corpus");
    std::fs::write(dir.join("live.world.ron"), BRINDLE).unwrap();
    let mut app = asset_app(&dir, "live.world.ron");
    app.world_mut().spawn(StarLight::PRIMARY);
    update_until(&mut app, |app| world_name(app).is_some());
    let generation = app.world().resource::<ActiveWorld>().generation();

    for bad in &files {
        let name = &bad.name;
        let seen = app.world().resource::<Reports>().rejected.len();
        rewrite_and_reload(&mut app, &dir, "live.world.ron", &bad.text);
        update_until(&mut app, |app| {
            app.world().resource::<Reports>().rejected.len() > seen
        });
        let rejected = app.world().resource::<Reports>().rejected[seen].clone();
        let said = format!("{} {:?}", rejected.reason, rejected.field);
        assert!(
            !rejected.reason.contains('\n'),
            "{name}: one line, no backtrace"
        );
        match &bad.expected {
            Expected::Field(field) => {
                assert_eq!(rejected.field.as_ref(), Some(field), "{name}: {said}")
            }
            Expected::Unknown(unknown) => assert!(
                said.contains(unknown.as_str()),
                "{name}: `{said}` does not name `{unknown}`"
            ),
            Expected::Syntax => assert!(said.contains("line"), "{name}: `{said}` gives no line"),
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
        let before = app.world().resource::<WorldClock>().world_time_s();
        app.update();
        assert!(app.world().resource::<WorldClock>().world_time_s() > before);
        assert!(app.world().resource::<SkyState>().ready, "{name}");
    }
    assert_eq!(
        app.world().resource::<Reports>().rejected.len(),
        files.len(),
        "one rejection per broken file"
    );

    // A good file afterwards is taken up.
    rewrite_and_reload(
        &mut app,
        &dir,
        "live.world.ron",
        &BRINDLE.replace("\"Brindle\"", "\"Brindle Mended\""),
    );
    update_until(&mut app, |app| {
        world_name(app).as_deref() == Some("Brindle Mended")
    });
    let _ = std::fs::remove_dir_all(&dir);
}

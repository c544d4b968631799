//! The plugin as parts: a server can take only what it needs, and a missing asset server is
//! reported rather than only logged.

use std::time::Duration;

use bevy::prelude::*;
use bevy::time::TimeUpdateStrategy;
use bevy_insola::parts::{InsolaClimatePlugin, InsolaLightsPlugin, InsolaObserversPlugin};
use bevy_insola::prelude::*;

use crate::common::*;

#[test]
fn a_clock_and_notices_server_builds_no_climate() {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec(BRINDLE))
                .with_clock_rate(3_600.0)
                .build()
                .disable::<InsolaLightsPlugin>()
                .disable::<InsolaClimatePlugin>()
                .disable::<InsolaObserversPlugin>(),
        )
        .insert_resource(TimeUpdateStrategy::ManualDuration(Duration::from_secs(1)))
        .init_resource::<Collected>()
        .add_systems(Last, collect);
    // An observer entity is ignored without the observers part, and nothing panics.
    app.world_mut().spawn((
        SurfacePlace::from_degrees(10.0, 20.0).unwrap(),
        LocalConditions::default(),
    ));
    for _ in 0..200 {
        app.update();
    }
    assert!(app.world().get_resource::<SeasonalClimate>().is_none());
    assert!(app.world().resource::<SkyState>().ready);
    assert!(
        count(&app, SkyEventKind::Rise(SkyBody::Star(0))) >= 5,
        "200 h of a 20 h day has sunrises: {:?}",
        notices(&app).len()
    );
}

#[test]
fn observers_without_the_climate_part_report_the_sky() {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(
            InsolaPlugins::new()
                .with_world_spec(spec(BRINDLE))
                .build()
                .disable::<InsolaClimatePlugin>(),
        )
        .insert_resource(TimeUpdateStrategy::ManualDuration(Duration::from_millis(
            16,
        )));
    let e = app
        .world_mut()
        .spawn((
            SurfacePlace::from_degrees(10.0, 20.0).unwrap(),
            LocalConditions::default(),
        ))
        .id();
    app.update();
    app.update();
    let c = app.world().get::<LocalConditions>(e).unwrap();
    assert!(c.toa_insolation_w_m2.is_finite());
    assert!(c.temperature_c.is_nan(), "no climate, no temperature");
}

#[test]
fn a_world_file_without_an_asset_server_is_rejected() {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .add_plugins(InsolaPlugins::new().with_world_file("worlds/verdance.world.ron"));
    app.update();
    let world = app.world().resource::<ActiveWorld>();
    assert!(world.planet().is_none());
    let error = world
        .last_error()
        .expect("the missing asset server is an error");
    assert!(error.contains("AssetPlugin"), "{error}");
    let rejected: Vec<_> = app
        .world_mut()
        .resource_mut::<Messages<WorldRejected>>()
        .drain()
        .collect();
    assert_eq!(rejected.len(), 1, "{rejected:?}");
}

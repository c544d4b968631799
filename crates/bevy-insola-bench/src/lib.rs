//! Headless apps for the plugin's benchmarks: each measured app next to the baseline app it is
//! compared with, built the same way (MinimalPlugins, manual 60 Hz frame time) so the only
//! difference is the work being measured.
//!
//! Run the benchmarks with `cargo bench -p bevy_insola_bench`; figures are in DEVELOPERS.md.

use std::hint::black_box;
use std::time::Duration;

use bevy::prelude::*;
use bevy::time::TimeUpdateStrategy;
use bevy_insola::prelude::*;
use insola::WorldSpec;

/// Real time per frame: 60 frames per second.
pub const FRAME: Duration = Duration::from_micros(16_667);

/// World seconds per real second in the measured apps: a minute of world time per second.
pub const CLOCK_RATE: f64 = 60.0;

/// The demo world Verdance (one star and two moons), from the core's list of shipped worlds.
pub fn verdance() -> WorldSpec {
    insola::built_in_worlds::built_in_world("verdance")
        .expect("Verdance ships with the core")
        .spec()
        .expect("the demo world is valid")
}

/// An app with MinimalPlugins and a manual 60 Hz clock, nothing else.
pub fn bare_app() -> App {
    let mut app = App::new();
    app.add_plugins(MinimalPlugins)
        .insert_resource(TimeUpdateStrategy::ManualDuration(FRAME));
    app
}

/// Baseline of the per-frame row: a bare app whose only work is one system turning one
/// directional light a little each frame (what a game without Insola would do).
pub fn light_turning_app() -> App {
    let mut app = bare_app();
    app.world_mut()
        .spawn((DirectionalLight::default(), Transform::default()));
    app.add_systems(Update, turn_the_light);
    app.update();
    app
}

fn turn_the_light(time: Res<Time>, mut lights: Query<&mut Transform, With<DirectionalLight>>) {
    for mut transform in &mut lights {
        transform.rotation = Quat::from_rotation_x(time.elapsed_secs() * 0.01);
    }
}

/// The measured app of the per-frame row: the plugin on Verdance driving the star's light, a
/// light for each of its two moons, the ambient light and the climate, and one observer; run
/// until the climate is ready, so its per-frame cost is included.
pub fn insola_scene_app() -> App {
    let mut app = bare_app();
    app.add_plugins(
        InsolaPlugins::new()
            .with_world_spec(verdance())
            .with_reference_place(35.0, 0.0)
            .with_clock_rate(CLOCK_RATE),
    );
    app.world_mut().spawn(StarLight::PRIMARY);
    app.world_mut().spawn(MoonLight { moon: 0 });
    app.world_mut().spawn(MoonLight { moon: 1 });
    app.world_mut()
        .spawn(SurfacePlace::from_degrees(35.0, 12.0).expect("valid place"));
    wait_for_climate(&mut app);
    app
}

/// The built-in two-sun world Ambrivane with the built-in ringed world Thalcary's ring added:
/// a world with both a companion star and a ring, for the per-frame row's second case. The
/// ring's inner edge (9,500 km) lies outside Ambrivane's default radius, and the whole spec is
/// validated here so the bench measures a world the plugin accepts.
pub fn two_suns_and_a_ring() -> WorldSpec {
    let world = |name: &str| {
        insola::built_in_worlds::built_in_world(name)
            .expect("the world ships with the core")
            .spec()
            .expect("a shipped world is valid")
    };
    let mut spec = world("ambrivane");
    spec.name = "Ambrivane with Thalcary's ring (bench)".to_string();
    spec.ring = world("thalcary").ring;
    spec.validate()
        .expect("Ambrivane with Thalcary's ring is a valid world");
    spec
}

/// The measured app of the two-suns-and-a-ring row: the plugin on [`two_suns_and_a_ring`]
/// driving a light for each star (`StarLight::PRIMARY`, `StarLight::of(1)`), the ambient
/// light and the climate, and one observer, at a reference place in the southern hemisphere
/// where the ring's shadow falls while the stars stand north of the ring plane; run until the
/// climate is ready, as [`insola_scene_app`].
pub fn two_suns_ring_app() -> App {
    let mut app = bare_app();
    app.add_plugins(
        InsolaPlugins::new()
            .with_world_spec(two_suns_and_a_ring())
            .with_reference_place(-25.0, 0.0)
            .with_clock_rate(CLOCK_RATE),
    );
    app.world_mut().spawn(StarLight::PRIMARY);
    app.world_mut().spawn(StarLight::of(1));
    app.world_mut()
        .spawn(SurfacePlace::from_degrees(-25.0, 12.0).expect("valid place"));
    wait_for_climate(&mut app);
    // The row measures both extras: make sure the sky has them.
    let sky = app.world().resource::<SkyState>();
    assert!(sky.ring.is_some() && sky.other_stars.len() == 1);
    app
}

/// Places spread over the globe (a deterministic, well-mixed pattern).
pub fn places(n: usize) -> impl Iterator<Item = SurfacePlace> {
    (0..n).map(move |i| {
        let lat = -89.0 + 178.0 * ((i * 7919) % n.max(1)) as f64 / n.max(1) as f64;
        let lon = -180.0 + 360.0 * i as f64 / n.max(1) as f64;
        SurfacePlace::from_degrees(lat, lon).expect("valid place")
    })
}

/// Baseline of the observer row: `n` observer entities (the same components the plugin's
/// observers have) visited each frame by a query that does nothing with them.
pub fn empty_query_app(n: usize) -> App {
    observers_without_plugin(n, visit_observers)
}

/// A bare app with `n` observer entities and `system` in `Update`, run once.
fn observers_without_plugin<M>(
    n: usize,
    system: impl bevy::ecs::schedule::IntoScheduleConfigs<bevy::ecs::system::ScheduleSystem, M>,
) -> App {
    let mut app = bare_app();
    app.world_mut()
        .spawn_batch(places(n).map(|p| (p, LocalConditions::default())));
    app.add_systems(Update, system);
    app.update();
    app
}

fn visit_observers(observers: Query<(&SurfacePlace, &mut LocalConditions)>) {
    observers.par_iter().for_each(|item| {
        black_box(item);
    });
}

/// A second baseline for the observer row: the same entities, each place read and its
/// conditions written with a trivial value, the way the plugin walks them (component columns
/// as slices). It shows how much of the plugin's update is the memory traffic itself.
pub fn touching_app(n: usize) -> App {
    observers_without_plugin(n, touch_observers)
}

fn touch_observers(mut observers: Query<(&SurfacePlace, &mut LocalConditions)>) {
    let Ok(columns) = observers.contiguous_iter_mut() else {
        return;
    };
    // Made once: a place's constructor takes sines and cosines, which is not memory traffic.
    let origin = SurfacePlace::default();
    for (places, mut conditions) in columns {
        for (place, out) in places.iter().zip(conditions.iter_mut()) {
            // Reads the whole place, writes the whole conditions.
            *out = LocalConditions {
                star_is_up: *black_box(place) == origin,
                ..LocalConditions::default()
            };
        }
    }
}

/// The measured app of the observer row: the plugin updating `n` observers every frame.
pub fn observers_app(n: usize) -> App {
    let mut app = bare_app();
    app.add_plugins(
        InsolaPlugins::new()
            .with_world_spec(verdance())
            .with_clock_rate(CLOCK_RATE),
    );
    app.world_mut().spawn_batch(places(n));
    wait_for_climate(&mut app);
    app
}

/// Updates until the background climate build has been installed (bounded: gives up after a
/// few seconds, so a bench never hangs).
pub fn wait_for_climate(app: &mut App) {
    for _ in 0..2000 {
        app.update();
        if app.world().resource::<SeasonalClimate>().is_ready() {
            return;
        }
        std::thread::sleep(Duration::from_millis(2));
    }
    warn!("the climate was not ready; measuring without it");
}

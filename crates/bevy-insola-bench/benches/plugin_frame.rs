//! The plugin's cost per frame, against an app that only turns a light.
//!
//! Run with `cargo bench -p bevy_insola_bench --bench plugin_frame`. Both apps are headless
//! (MinimalPlugins, manual 60 Hz time): the baseline's only system turns one directional
//! light; the measured app runs Insola on the demo world (star, two moons, ambient light,
//! climate, one observer) and nothing else. Target: under 1.3× the baseline's update.
//!
//! A second measured app runs the plugin on a world with both a companion star and a ring
//! (the shipped Ambrivane with the shipped Thalcary's ring; `two_suns_and_a_ring`): a light
//! for each star, ambient light, climate, one observer, at a place the ring's shadow can
//! reach. Same target: under 1.3× the same run's baseline.

use bevy_insola_bench::{insola_scene_app, light_turning_app, two_suns_ring_app};
use criterion::{Criterion, criterion_main};

fn frame(c: &mut Criterion) {
    let mut g = c.benchmark_group("frame");
    let mut baseline = light_turning_app();
    g.bench_function("baseline_light_turning_app", |b| {
        b.iter(|| baseline.update())
    });
    let mut insola = insola_scene_app();
    g.bench_function("insola_star_2_moons_ambient_climate_1_observer", |b| {
        b.iter(|| insola.update())
    });
    let mut two_suns_ring = two_suns_ring_app();
    g.bench_function("insola_2_stars_ring_ambient_climate_1_observer", |b| {
        b.iter(|| two_suns_ring.update())
    });
    g.finish();
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    criterion::criterion_group!(benches, super::frame);
}
criterion_main!(group::benches);

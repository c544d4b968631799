//! Measurement, not a check: the cost of one observer update for a million places.
//!
//! Ignored by default (it is slow in debug builds and timings belong to measurements, not to
//! pass/fail tests). Run it with
//! `cargo test --release -p bevy_insola --test observer_scale -- --ignored --nocapture`.
//! It prints the time per update of the whole system and per place of the inner computation.

mod common;

use std::time::{Duration, Instant};

use bevy::prelude::*;
use bevy_insola::StarFrame;
use bevy_insola::prelude::*;
use common::*;

const PLACES: usize = 1_000_000;

#[test]
#[ignore = "measurement; run with --release --ignored --nocapture"]
fn million_observers() {
    let mut app = app(
        BRINDLE,
        settings_at(0.0, 0.0),
        600.0,
        Duration::from_millis(16),
    );
    let places: Vec<SurfacePlace> = (0..PLACES)
        .map(|i| {
            let lat = -89.0 + 178.0 * ((i * 7919) % PLACES) as f64 / PLACES as f64;
            let lon = -180.0 + 360.0 * i as f64 / PLACES as f64;
            SurfacePlace::from_degrees(lat, lon).unwrap()
        })
        .collect();
    app.world_mut().spawn_batch(places.clone());
    // Let the climate finish so the temperature lookup is part of the cost.
    for _ in 0..2000 {
        app.update();
        if app.world().resource::<SeasonalClimate>().is_ready() {
            break;
        }
        std::thread::sleep(Duration::from_millis(5));
    }
    let frames = 20;
    let start = Instant::now();
    for _ in 0..frames {
        app.update();
    }
    let per_frame = start.elapsed() / frames;
    println!(
        "app update with {PLACES} observers: {per_frame:?} per frame (all plugin systems, {} threads)",
        bevy::tasks::ComputeTaskPool::get().thread_num()
    );

    let planet = planet(BRINDLE);
    let climate = app.world().resource::<SeasonalClimate>();
    let frame = StarFrame::new(&planet, 12_345.0, Some(climate));
    let start = Instant::now();
    let mut sum = 0.0f32;
    for p in &places {
        let c = frame.conditions(p);
        sum += c.star_altitude_rad + c.temperature_c;
    }
    let elapsed = start.elapsed();
    println!(
        "inner computation, one thread: {:.1} ns per place (checksum {sum})",
        elapsed.as_nanos() as f64 / PLACES as f64
    );
}

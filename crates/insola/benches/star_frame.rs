//! The single-precision star frame over 1,000,000 places on one thread: the common path (no
//! occluder within reach of the planet), the eclipse path (a moon in front of the star, every
//! sunlit place computing its cover), the ring path (a ringed world at a solstice, every
//! sunlit place computing the ring's shadow), and a baseline loop that reads the same places
//! and writes the same bytes. Invented world (Umbrel: a moon as large in the sky as the star, on an
//! orbit in the ecliptic, new at time zero).
//!
//! Run with `cargo bench -p insola --bench star_frame`; the summary prints each path as a
//! multiple of the baseline and the share of places that took the eclipse path.

use std::hint::black_box;

use criterion::{Criterion, Throughput, criterion_main};
use insola::{Place, PlaceF32, PlaceSkyF32, Planet, WorldSpec};

const PLACES: usize = 1_000_000;

fn umbrel() -> Planet {
    let text = r#"(name: "Umbrel", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
        orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
        spin: (obliquity_deg: 0, solar_day_hours: 24),
        moons: [(name: "Shade", radius_km: 1800, distance_km: 380000, period_days: 27, phase_at_zero_deg: 0)])"#;
    Planet::new(&WorldSpec::from_ron_str(text).expect("valid")).expect("valid")
}

/// Umbrel with a tilt and a ring instead of the moon (invented).
fn ringed_umbrel() -> Planet {
    let text = r#"(name: "Umbrel", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
        orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 360),
        spin: (obliquity_deg: 25, solar_day_hours: 24),
        ring: (annuli: [(inner_radius_km: 8000, outer_radius_km: 11000, optical_depth: 0.2),
                        (inner_radius_km: 11000, outer_radius_km: 16000, optical_depth: 0.8)]))"#;
    Planet::new(&WorldSpec::from_ron_str(text).expect("valid")).expect("valid")
}

/// Places spread over the globe (a deterministic, well-mixed pattern).
fn places() -> Vec<PlaceF32> {
    (0..PLACES)
        .map(|i| {
            let lat = -89.0 + 178.0 * ((i * 7919) % PLACES) as f64 / PLACES as f64;
            let lon = -180.0 + 360.0 * i as f64 / PLACES as f64;
            PlaceF32::new(Place::normalised(lat, lon))
        })
        .collect()
}

fn star_frame(c: &mut Criterion) {
    let planet = umbrel();
    let input = places();
    let mut output = vec![PlaceSkyF32::default(); PLACES];
    // Time zero: the moon is new and within reach; a week later it is far from the star.
    let eclipse = planet.star_frame(0.0).to_f32();
    let clear = planet.star_frame(7.0 * 86_400.0).to_f32();
    assert!(eclipse.eclipse_possible() && !clear.eclipse_possible());
    // A quarter year in: the northern solstice, the ring's shadow across the south.
    let ringed = ringed_umbrel().star_frame(90.0 * 86_400.0).to_f32();
    assert!(ringed.eclipse_possible());
    let mut g = c.benchmark_group("star_frame_f32_one_thread");
    g.sample_size(20);
    g.throughput(Throughput::Elements(PLACES as u64));
    g.bench_function("baseline_copy_loop", |b| {
        b.iter(|| {
            for (p, out) in input.iter().zip(&mut output) {
                let p = black_box(p);
                out.sin_altitude = p.sin_lat + p.cos_lon;
                out.is_up = p.cos_lat > p.sin_lon;
            }
        })
    });
    for (name, frame) in [
        ("no_occluder_in_reach", &clear),
        ("eclipse_path", &eclipse),
        ("ring_path", &ringed),
    ] {
        g.bench_function(name, |b| {
            b.iter(|| {
                for (p, out) in input.iter().zip(&mut output) {
                    *out = frame.at(p);
                }
            })
        });
    }
    g.finish();
    let sunlit = input
        .iter()
        .filter(|p| eclipse.at(p).sin_altitude > 0.0)
        .count();
    let dimmed = input
        .iter()
        .filter(|p| eclipse.at(p).star_hidden_fraction > 0.0)
        .count();
    println!(
        "eclipse frame: {sunlit} of {PLACES} places sunlit (each computes its cover), {dimmed} dimmed"
    );
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    criterion::criterion_group!(benches, super::star_frame);
}
criterion_main!(group::benches);

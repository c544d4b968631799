//! Many observer entities updated each frame, against the same entities visited by an empty
//! query, and how the cost grows with their number.
//!
//! Run with `cargo bench -p bevy_insola_bench --bench observer_entities`. Target: the plugin's
//! update of 1,000,000 observers within 4× the empty query's frame; cost linear in the count.

use std::hint::black_box;

use bevy_insola::{LocalConditions, ObserverFrame, SurfacePlace};
use bevy_insola_bench::{empty_query_app, observers_app, places, touching_app, verdance};
use criterion::{BenchmarkId, Criterion, Throughput, criterion_main};

fn observers(c: &mut Criterion) {
    let mut g = c.benchmark_group("observers");
    g.sample_size(20);
    for n in [10_000, 100_000, 1_000_000] {
        g.throughput(Throughput::Elements(n as u64));
        let mut baseline = empty_query_app(n);
        g.bench_with_input(BenchmarkId::new("baseline_empty_query", n), &n, |b, _| {
            b.iter(|| baseline.update())
        });
        drop(baseline);
        let mut touching = touching_app(n);
        g.bench_with_input(
            BenchmarkId::new("baseline_read_write_query", n),
            &n,
            |b, _| b.iter(|| touching.update()),
        );
        drop(touching);
        let mut insola = observers_app(n);
        g.bench_with_input(BenchmarkId::new("insola_update", n), &n, |b, _| {
            b.iter(|| insola.update())
        });
    }
    g.finish();
}

/// Where the time goes: the per-place work alone on one thread over plain vectors, against a
/// loop that reads the same places and writes the same conditions.
fn per_place(c: &mut Criterion) {
    let n = 1_000_000;
    let mut g = c.benchmark_group("per_place_one_thread");
    g.sample_size(20);
    g.throughput(Throughput::Elements(n as u64));
    let input: Vec<SurfacePlace> = places(n).collect();
    let mut output = vec![LocalConditions::default(); n];
    // Made once: a place's constructor takes sines and cosines, which is not memory traffic.
    let origin = SurfacePlace::default();
    g.bench_function("baseline_copy_loop", |b| {
        b.iter(|| {
            for (p, out) in input.iter().zip(&mut output) {
                // Reads the whole place, writes one field of the conditions.
                out.star_is_up = *black_box(p) == origin;
            }
        })
    });
    let planet = insola::Planet::new(&verdance()).expect("valid world");
    let app = observers_app(1);
    let climate = app.world().resource::<bevy_insola::SeasonalClimate>();
    let model = climate.model().expect("climate ready");
    let snapshot = model.snapshot(0.3);
    let no_climate = ObserverFrame::new(&planet, 1.0e6, None);
    let with_table = ObserverFrame::with_table(&planet, 1.0e6, &snapshot);
    for (name, frame) in [
        ("star_only", &no_climate),
        ("star_and_climate_table", &with_table),
    ] {
        g.bench_function(name, |b| b.iter(|| frame.fill(&input, &mut output)));
    }
    g.finish();
    println!(
        "compute threads: {}",
        bevy::tasks::ComputeTaskPool::get().thread_num()
    );
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    criterion::criterion_group!(benches, super::observers, super::per_place);
}
criterion_main!(group::benches);

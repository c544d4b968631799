//! Time series at one place against the scalar loop, in the same run.
//!
//! Run with `cargo bench -p insola --bench time_series`. Rows (figures in DEVELOPERS.md):
//! * star positions for 100,000 instants a minute apart on the Earth reference world: the
//!   scalar loop (`star_position` per instant), the series serial and parallel;
//! * the same instants given as a slice (no even spacing to exploit);
//! * top-of-atmosphere insolation alone, serial.
//!
//! `INSOLA_BENCH_QUICK=1` shortens the measurement (used by the side-by-side script in
//! `benches/reference`).

use criterion::{Criterion, Throughput, black_box, criterion_main};
use insola::star_track::TrackTimes;
use insola::{Place, Planet, StarPosition, WorldSpec};

/// Instants per series: the count the reference comparison uses.
const N: usize = 100_000;

fn earth() -> Planet {
    let text = include_str!("../../../assets/reference-worlds/earth.world.ron");
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

fn series(c: &mut Criterion) {
    let p = earth();
    let place = Place::from_degrees(47.3, 8.5).unwrap();
    let times = TrackTimes::Even {
        start_s: 7.3e8,
        step_s: 60.0,
        count: N,
    };
    let instants: Vec<f64> = (0..N).map(|k| times.time_s(k)).collect();
    let mut out = vec![p.star_position(0.0, place); N];
    let mut q = vec![0.0; N];
    let mut g = c.benchmark_group("time_series_100k");
    g.throughput(Throughput::Elements(N as u64));
    if std::env::var_os("INSOLA_BENCH_QUICK").is_some() {
        g.sample_size(10);
        g.warm_up_time(std::time::Duration::from_millis(300));
        g.measurement_time(std::time::Duration::from_secs(1));
    } else {
        g.sample_size(30);
    }
    g.bench_function("baseline_scalar_loop", |b| {
        b.iter(|| {
            for (o, &t) in out.iter_mut().zip(&instants) {
                *o = p.star_position(t, place);
            }
            black_box(&out);
        })
    });
    g.bench_function("star_track_serial", |b| {
        b.iter(|| p.star_track_into(place, black_box(times), &mut out))
    });
    g.bench_function("star_track_parallel", |b| {
        b.iter(|| p.star_track_par(place, black_box(times), &mut out))
    });
    g.bench_function("star_track_given_serial", |b| {
        b.iter(|| p.star_track_into(place, TrackTimes::Given(black_box(&instants)), &mut out))
    });
    g.bench_function("insolation_track_serial", |b| {
        b.iter(|| p.toa_insolation_track_into(place, black_box(times), &mut q))
    });
    g.finish();
    black_box(
        out.iter()
            .map(|s: &StarPosition| s.altitude_rad)
            .sum::<f64>(),
    );
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    criterion::criterion_group!(benches, super::series);
}
criterion_main!(group::benches);

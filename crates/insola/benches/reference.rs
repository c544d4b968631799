//! The Insola side of the side-by-side with the reference libraries
//! (`benches/reference/compare.sh` runs both and prints the ratios).
//!
//! Rows, each the work the reference library does in its row:
//! * `star_100k/*`: the star's altitude and azimuth at one place for 100,000 instants a minute
//!   apart on the Earth reference world (pvlib's `solar_position` with `nrel_numpy`), as the
//!   scalar loop, the time series serial and the time series parallel;
//! * `daily_insolation/*`: the daily-mean insolation on 180 latitudes × 365 days and on
//!   1800 × 3650 (climlab's `daily_insolation`), including the declination and distance of
//!   every day from the orbit.
//!
//! Short measurements (the script interleaves several rounds and takes medians).

use std::time::Duration;

use criterion::{Criterion, black_box, criterion_main};
use insola::insolation::daily_mean_grid_w_m2;
use insola::star_track::TrackTimes;
use insola::{Place, Planet, WorldSpec};

fn earth() -> Planet {
    let text = include_str!("../../../assets/reference-worlds/earth.world.ron");
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

fn quick<'a>(
    c: &'a mut Criterion,
    name: &str,
) -> criterion::BenchmarkGroup<'a, criterion::measurement::WallTime> {
    let mut g = c.benchmark_group(name);
    g.sample_size(10);
    g.warm_up_time(Duration::from_millis(300));
    g.measurement_time(Duration::from_secs(2));
    g
}

fn star(c: &mut Criterion) {
    let p = earth();
    let place = Place::from_degrees(47.3, 8.5).unwrap();
    let n = 100_000;
    let times = TrackTimes::Even {
        start_s: 7.3e8,
        step_s: 60.0,
        count: n,
    };
    let mut out = vec![p.star_position(0.0, place); n];
    let mut g = quick(c, "star_100k");
    g.bench_function("scalar_loop", |b| {
        b.iter(|| {
            for (k, o) in out.iter_mut().enumerate() {
                *o = p.star_position(times.time_s(k), place);
            }
            black_box(&out);
        })
    });
    g.bench_function("track_serial", |b| {
        b.iter(|| p.star_track_into(place, black_box(times), &mut out))
    });
    g.bench_function("track_parallel", |b| {
        b.iter(|| p.star_track_par(place, black_box(times), &mut out))
    });
    g.finish();
}

fn grid(c: &mut Criterion) {
    let p = earth();
    let mut g = quick(c, "daily_insolation");
    for (rows, days) in [(180usize, 365usize), (1800, 3650)] {
        let lats: Vec<f64> = (0..rows)
            .map(|j| (-90.0 + (j as f64 + 0.5) * 180.0 / rows as f64).to_radians())
            .collect();
        let mut table = vec![(0.0, 0.0); days];
        let mut out = vec![0.0; rows * days];
        let year_s = p.year_s();
        g.bench_function(format!("{rows}x{days}"), |b| {
            b.iter(|| {
                for (d, day) in table.iter_mut().enumerate() {
                    let s = p.star_instant(d as f64 / days as f64 * year_s);
                    *day = (s.declination_rad, s.distance_factor);
                }
                daily_mean_grid_w_m2(1361.0, &lats, &table, black_box(&mut out));
            })
        });
    }
    g.finish();
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    criterion::criterion_group!(benches, super::star, super::grid);
}
criterion_main!(group::benches);

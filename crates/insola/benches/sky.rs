//! Benchmarks of the sky core, each against a baseline measured in the same run.
//!
//! Run with `cargo bench -p insola --bench sky`. Rows (see DEVELOPERS.md for figures):
//! * one star position on the Earth reference world (absolute; target < 150 ns);
//! * star directions for 1,000,000 places vs a plain loop reading and writing the same bytes;
//! * daily-mean insolation on 1800 latitudes × 3650 days vs the straightforward per-cell loop;
//! * scaling: batch directions for 10k / 100k / 1M places, serial and parallel (the parallel
//!   form must never be the slower), and the grid for 450 / 900 / 1800 latitudes (both should
//!   be linear).

use criterion::{BenchmarkId, Criterion, Throughput, black_box, criterion_main};
use glam::DVec3;
use insola::batch::PlaceBatch;
use insola::insolation::{daily_mean_grid_w_m2, daily_mean_w_m2};
use insola::{Place, Planet, WorldSpec};

fn earth() -> Planet {
    let text = include_str!("../../../assets/reference-worlds/earth.world.ron");
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

fn star_position(c: &mut Criterion) {
    let p = earth();
    let place = Place::from_degrees(47.3, 8.5).unwrap();
    let mut t = 7.3e8;
    // Same-run unit of cost on this machine: one f64 sin_cos.
    let mut x = 0.1f64;
    c.bench_function("star_position/baseline_one_sin_cos", |b| {
        b.iter(|| {
            x += 1e-3;
            black_box(black_box(x).sin_cos())
        })
    });
    c.bench_function("star_position/earth_reference", |b| {
        b.iter(|| {
            t += 61.0;
            black_box(p.star_position(black_box(t), place))
        })
    });
}

fn places(n: usize) -> PlaceBatch {
    let mut b = PlaceBatch::with_capacity(n);
    for k in 0..n {
        let lat = -90.0 + 180.0 * ((k * 7919) % n) as f64 / n as f64;
        let lon = -180.0 + 360.0 * ((k * 104_729) % n) as f64 / n as f64;
        b.push(Place::from_degrees(lat, lon).unwrap());
    }
    b
}

fn batch_directions(c: &mut Criterion) {
    let p = earth();
    let i = p.star_instant(7.3e8);
    let n = 1_000_000;
    let batch = places(n);
    // Baseline: read four f64 per place (what a batch place holds) and write one DVec3, with
    // trivial arithmetic.
    let columns: Vec<Vec<f64>> = (0..4)
        .map(|c| (0..n).map(|k| (k + c) as f64 * 1e-6).collect())
        .collect();
    let mut out = vec![DVec3::ZERO; n];
    let mut g = c.benchmark_group("batch_1m");
    g.throughput(Throughput::Elements(n as u64));
    g.sample_size(20);
    g.bench_function("baseline_copy_loop", |b| {
        b.iter(|| {
            let [a, b2, c2, d] = [&columns[0], &columns[1], &columns[2], &columns[3]];
            for k in 0..n {
                out[k] = DVec3::new(a[k] + b2[k], c2[k], d[k]);
            }
            black_box(&out);
        })
    });
    g.bench_function("star_directions_serial", |b| {
        b.iter(|| p.star_directions_into(&i, &batch, black_box(&mut out)))
    });
    g.bench_function("star_directions_parallel", |b| {
        b.iter(|| p.star_directions_par(&i, &batch, black_box(&mut out)))
    });
    g.finish();

    let mut g = c.benchmark_group("batch_scaling");
    for n in [10_000usize, 100_000, 1_000_000] {
        let batch = places(n);
        let mut out = vec![DVec3::ZERO; n];
        g.throughput(Throughput::Elements(n as u64));
        // The serial form is the same-run baseline: the parallel one must never be slower.
        g.bench_with_input(BenchmarkId::new("serial", n), &n, |b, _| {
            b.iter(|| p.star_directions_into(&i, &batch, black_box(&mut out)))
        });
        g.bench_with_input(BenchmarkId::new("parallel", n), &n, |b, _| {
            b.iter(|| p.star_directions_par(&i, &batch, black_box(&mut out)))
        });
    }
    g.finish();
}

fn insolation_grid(c: &mut Criterion) {
    let p = earth();
    let lats: Vec<f64> = (0..1800)
        .map(|j| (-90.0 + (j as f64 + 0.5) * 0.1f64).to_radians())
        .collect();
    let days: Vec<(f64, f64)> = (0..3650)
        .map(|d| {
            let s = p.star_instant(d as f64 * 0.1 * 86_400.0);
            (s.declination_rad, s.distance_factor)
        })
        .collect();
    let mut out = vec![0.0; lats.len() * days.len()];
    let mut g = c.benchmark_group("insolation_grid_1800x3650");
    g.sample_size(10);
    g.bench_function("baseline_scalar_loop", |b| {
        b.iter(|| {
            for (d, &(decl, rho)) in days.iter().enumerate() {
                for (j, &lat) in lats.iter().enumerate() {
                    out[d * lats.len() + j] = daily_mean_w_m2(1361.0, lat, decl, rho);
                }
            }
            black_box(&out);
        })
    });
    g.bench_function("grid_precomputed_parallel", |b| {
        b.iter(|| daily_mean_grid_w_m2(1361.0, &lats, &days, black_box(&mut out)))
    });
    g.finish();
    // Scaling with the grid's size: 450, 900 and 1800 latitudes over the same days.
    let mut g = c.benchmark_group("insolation_grid_scaling");
    g.sample_size(10);
    for rows in [450, 900, 1800] {
        let lats: Vec<f64> = (0..rows)
            .map(|j| (-90.0 + (j as f64 + 0.5) * 180.0 / rows as f64).to_radians())
            .collect();
        let mut out = vec![0.0; rows * days.len()];
        g.throughput(Throughput::Elements((rows * days.len()) as u64));
        g.bench_function(BenchmarkId::from_parameter(rows), |b| {
            b.iter(|| daily_mean_grid_w_m2(1361.0, &lats, &days, black_box(&mut out)))
        });
    }
    g.finish();
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    criterion::criterion_group!(
        benches,
        super::star_position,
        super::batch_directions,
        super::insolation_grid
    );
}
criterion_main!(group::benches);

//! Climate model timings: one model year, a full cold-start equilibrium, and a batch of local
//! temperature queries. Invented demo world (not Earth): tilt 31°, e 0.05, S0 1300 W m⁻².

use std::hint::black_box;

use criterion::{Criterion, criterion_main};
use insola::climate::{
    AnnualForcing, BandInsolation, ClimateGrid, ClimateSpec, EnergyBalanceModel, SeasonSample,
    equilibrate,
};

/// Forcing of an invented world on a Keplerian orbit, 360 samples from perihelion.
fn demo_forcing() -> AnnualForcing {
    let (e, eps, peri) = (0.05f64, 31f64.to_radians(), 1.2f64);
    let samples = (0..360)
        .map(|i| {
            let m = std::f64::consts::TAU * i as f64 / 360.0;
            let mut ea = m;
            for _ in 0..8 {
                ea -= (ea - e * ea.sin() - m) / (1.0 - e * ea.cos());
            }
            let v = 2.0 * (((1.0 + e) / (1.0 - e)).sqrt() * (ea / 2.0).tan()).atan();
            SeasonSample {
                declination_rad: (eps.sin() * (v + peri).sin()).asin(),
                distance_factor: (1.0 - e * e) / (1.0 + e * v.cos()),
            }
        })
        .collect();
    AnnualForcing {
        s0_w_m2: 1300.0,
        year_s: 400.0 * 86400.0,
        samples,
    }
}

fn bench(c: &mut Criterion) {
    let spec = ClimateSpec::default();
    let forcing = demo_forcing();
    let grid = ClimateGrid::new(spec.bands).unwrap();
    let ins = BandInsolation::from_forcing(&forcing, &grid, spec.steps_per_year).unwrap();
    let model = EnergyBalanceModel::new(&spec, ins).unwrap();
    let nb = grid.len();
    let mut state = model.steady_annual_mean();
    let mut traj = vec![0.0; spec.steps_per_year * nb];
    let mut scratch = vec![0.0; nb];
    c.bench_function("climate/one_model_year_90_bands", |b| {
        b.iter(|| model.run_year(black_box(&mut state), &mut traj, &mut scratch))
    });
    c.bench_function("climate/equilibrate_cold_start_90_bands", |b| {
        b.iter(|| equilibrate(black_box(&spec), black_box(&forcing)).unwrap())
    });
    let cycle = equilibrate(&spec, &forcing).unwrap();
    let n = 1_000_000;
    let lats: Vec<f64> = (0..n).map(|i| -1.5 + 3.0 * i as f64 / n as f64).collect();
    let has: Vec<f64> = (0..n).map(|i| i as f64 * 0.001).collect();
    let elev = vec![250.0; n];
    let mut out = vec![0.0; n];
    let inst = cycle.instant(0.3, 86400.0).unwrap();
    c.bench_function("climate/local_temperatures_1e6_places", |b| {
        b.iter(|| {
            inst.temperatures_c(&lats, &has, &elev, black_box(&mut out))
                .unwrap()
        })
    });
}

/// The benchmark group (in a private module so the macro's generated function needs no docs).
mod group {
    use std::time::Duration;

    use criterion::{Criterion, criterion_group};

    criterion_group! {
        name = benches;
        config = Criterion::default()
            .sample_size(10)
            .measurement_time(Duration::from_secs(2))
            .warm_up_time(Duration::from_millis(500));
        targets = super::bench
    }
}
criterion_main!(group::benches);

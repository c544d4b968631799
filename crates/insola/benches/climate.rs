//! Climate model timings: one model year, a full equilibrium (from the annual-mean steady
//! state, the default start), the same for the shipped invented worlds, and a batch of one
//! million local temperature queries. Invented demo world (not Earth): tilt 31°, e 0.05,
//! S0 1300 W m⁻². After the criterion groups a summary prints the equilibrium time as a
//! multiple of one model year measured in the same run, against the 16.7 ms of a 60 fps frame.

use std::hint::black_box;

use std::time::Instant;

use criterion::Criterion;
use insola::climate::{
    AnnualForcing, BandInsolation, ClimateGrid, ClimateSpec, EnergyBalanceModel, SeasonSample,
    equilibrate,
};
use insola::{Planet, WorldSpec};

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

/// One model year of the demo forcing, ready to run again and again from its own state.
struct ModelYear {
    model: EnergyBalanceModel,
    state: Vec<f64>,
    trajectory: Vec<f64>,
    scratch: Vec<f64>,
}

impl ModelYear {
    fn new(spec: &ClimateSpec, forcing: &AnnualForcing) -> ModelYear {
        let grid = ClimateGrid::new(spec.bands).unwrap();
        let ins = BandInsolation::from_forcing(forcing, &grid, spec.steps_per_year).unwrap();
        let model = EnergyBalanceModel::new(spec, ins).unwrap();
        ModelYear {
            state: model.steady_annual_mean(),
            trajectory: vec![0.0; spec.steps_per_year * spec.bands],
            scratch: vec![0.0; spec.bands],
            model,
        }
    }

    fn run(&mut self) {
        self.model.run_year(
            black_box(&mut self.state),
            &mut self.trajectory,
            &mut self.scratch,
        )
    }
}

fn bench(c: &mut Criterion) {
    let spec = ClimateSpec::default();
    let forcing = demo_forcing();
    let mut year = ModelYear::new(&spec, &forcing);
    c.bench_function("climate/one_model_year_90_bands", |b| b.iter(|| year.run()));
    // The insolation table of 90 bands x 180 steps: the grid path (`from_forcing`) against the
    // per-cell formulas it replaced, in the same run.
    let grid = ClimateGrid::new(spec.bands).unwrap();
    let steps = spec.steps_per_year;
    c.bench_function("forcing_table/baseline_per_cell_formulas", |b| {
        b.iter(|| {
            let lats = grid.lat_centres_rad();
            let mut q = Vec::with_capacity(steps * lats.len());
            let mut days = Vec::with_capacity(steps);
            for k in 0..steps {
                let s = forcing.sample_at(k as f64 / steps as f64);
                days.push((s.declination_rad, s.distance_factor));
                q.extend(lats.iter().map(|&lat| {
                    insola::insolation::daily_mean_w_m2(
                        forcing.s0_w_m2,
                        lat,
                        s.declination_rad,
                        s.distance_factor,
                    )
                }));
            }
            let mu: Vec<f64> = lats
                .iter()
                .map(|&lat| insola::climate::insolation_weighted_cos_zenith(lat, &days))
                .collect();
            black_box((q, mu))
        })
    });
    c.bench_function("forcing_table/grid_path", |b| {
        b.iter(|| BandInsolation::from_forcing(black_box(&forcing), &grid, steps).unwrap())
    });
    // Scaling with the number of bands: one model year (the implicit diffusion step is a
    // tridiagonal solve, so the cost should grow linearly).
    let mut g = c.benchmark_group("climate_scaling/one_model_year");
    for bands in [45, 90, 180, 360] {
        let spec = ClimateSpec {
            bands,
            ..ClimateSpec::default()
        };
        let mut year = ModelYear::new(&spec, &forcing);
        g.throughput(criterion::Throughput::Elements(bands as u64));
        g.bench_function(criterion::BenchmarkId::from_parameter(bands), |b| {
            b.iter(|| year.run())
        });
    }
    g.finish();
    c.bench_function("climate/equilibrate_90_bands", |b| {
        b.iter(|| equilibrate(black_box(&spec), black_box(&forcing)).unwrap())
    });
    for name in ["verdance", "calvenne", "oromar"] {
        let p = world(name);
        c.bench_function(&format!("climate/equilibrate_world_{name}"), |b| {
            b.iter(|| black_box(&p).equilibrate_climate().unwrap())
        });
    }
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

/// A shipped invented world.
fn world(name: &str) -> Planet {
    let path = format!(
        "{}/../../assets/worlds/{name}.world.ron",
        env!("CARGO_MANIFEST_DIR")
    );
    Planet::new(&WorldSpec::from_path(&path).unwrap()).unwrap()
}

/// Median wall time of `f` over `runs` calls, seconds.
fn median_s(runs: usize, mut f: impl FnMut()) -> f64 {
    let mut t: Vec<f64> = (0..runs)
        .map(|_| {
            let start = Instant::now();
            f();
            start.elapsed().as_secs_f64()
        })
        .collect();
    t.sort_by(f64::total_cmp);
    t[runs / 2]
}

/// Equilibrium time against one model year, and the million-place batch, in one run.
fn summary() {
    let spec = ClimateSpec::default();
    let forcing = demo_forcing();
    let mut one_year = ModelYear::new(&spec, &forcing);
    let nb = spec.bands;
    let year = median_s(201, || one_year.run());
    println!("\nclimate summary (median of repeated runs, this machine, one thread):");
    println!(
        "  one model year, {nb} bands x {} steps: {:.1} us",
        spec.steps_per_year,
        year * 1e6
    );
    let cycle = equilibrate(&spec, &forcing).unwrap();
    let eq = median_s(51, || {
        black_box(equilibrate(black_box(&spec), black_box(&forcing)).unwrap());
    });
    println!(
        "  equilibrium, demo forcing: {:.3} ms = {:.1} model years of time ({} years run), {:.1}% of a 60 fps frame",
        eq * 1e3,
        eq / year,
        cycle.years_to_equilibrium(),
        eq / (1.0 / 60.0) * 100.0
    );
    for name in ["verdance", "calvenne", "oromar"] {
        let p = world(name);
        let c = p.equilibrate_climate().unwrap();
        let t = median_s(21, || {
            black_box(black_box(&p).equilibrate_climate().unwrap());
        });
        println!(
            "  equilibrium, {name}: {:.3} ms = {:.1} model years of time ({} years run)",
            t * 1e3,
            t / year,
            c.years_to_equilibrium()
        );
    }
    let n = 1_000_000;
    let lats: Vec<f64> = (0..n).map(|i| -1.5 + 3.0 * i as f64 / n as f64).collect();
    let has: Vec<f64> = (0..n).map(|i| i as f64 * 0.001).collect();
    let elev = vec![250.0; n];
    let mut out = vec![0.0; n];
    let inst = cycle.instant(0.3, 86400.0).unwrap();
    let batch = median_s(11, || {
        inst.temperatures_c(&lats, &has, &elev, black_box(&mut out))
            .unwrap()
    });
    println!(
        "  local temperature, 1,000,000 places: {:.2} ms ({:.1} ns per place)",
        batch * 1e3,
        batch * 1e9 / n as f64
    );
}

/// Criterion's groups, then the summary.
fn main() {
    group::benches();
    Criterion::default().configure_from_args().final_summary();
    summary();
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

//! Determinism: the same world and inputs give bit-identical results across runs and across
//! thread counts. (Exception, documented in DEVELOPERS.md: results may differ in the last bits
//! between CPU architectures or compiler versions, because `sin`, `cos` and `acos` come from
//! the platform's math library.)

use glam::DVec3;
use insola::batch::PlaceBatch;
use insola::insolation::daily_mean_grid_w_m2;
use insola::lighting::LightMode;
use insola::{Place, Planet, WorldSpec};

fn verdance() -> Planet {
    let text = include_str!("../../../assets/worlds/verdance.world.ron");
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

fn with_threads<T: Send>(n: usize, f: impl FnOnce() -> T + Send) -> T {
    rayon::ThreadPoolBuilder::new()
        .num_threads(n)
        .build()
        .unwrap()
        .install(f)
}

#[test]
fn lighting_is_identical_twice() {
    let (a, b) = (verdance(), verdance());
    for k in 0..200 {
        let t = k as f64 * 12_345.678;
        let place = Place::from_degrees(-60.0 + k as f64 * 0.6, k as f64).unwrap();
        assert_eq!(
            a.lighting(t, place, LightMode::Ground),
            b.lighting(t, place, LightMode::Ground)
        );
    }
}

#[test]
fn batches_and_grids_do_not_depend_on_thread_count() {
    let p = verdance();
    let places: Vec<Place> = (0..50_000)
        .map(|k| Place::from_degrees((k % 181) as f64 - 90.0, (k % 360) as f64 - 180.0).unwrap())
        .collect();
    let batch = PlaceBatch::new(&places);
    let i = p.star_instant(9.9e6);
    let run = |n: usize| {
        with_threads(n, || {
            let mut out = vec![DVec3::ZERO; places.len()];
            p.star_directions_par(&i, &batch, &mut out);
            out
        })
    };
    assert_eq!(run(1), run(2));
    let lats: Vec<f64> = (0..180)
        .map(|j| (j as f64 - 89.5f64).to_radians())
        .collect();
    let days: Vec<(f64, f64)> = (0..400)
        .map(|d| (0.4 * (d as f64 * 0.0157).sin(), 1.0))
        .collect();
    let grid = |n: usize| {
        with_threads(n, || {
            let mut out = vec![0.0; lats.len() * days.len()];
            daily_mean_grid_w_m2(1361.0, &lats, &days, &mut out);
            out
        })
    };
    assert_eq!(grid(1), grid(3));
}

#[test]
fn climate_is_identical_across_runs_and_threads() {
    let p = verdance();
    let a = with_threads(1, || p.equilibrate_climate().unwrap());
    let b = with_threads(2, || p.equilibrate_climate().unwrap());
    for k in 0..a.steps() {
        assert_eq!(a.temperatures_c(k), b.temperatures_c(k));
    }
    let lats: Vec<f64> = (0..20_000)
        .map(|k| ((k % 179) as f64 - 89.0f64).to_radians())
        .collect();
    let hours: Vec<f64> = (0..20_000)
        .map(|k| (k as f64 * 0.001).sin() * 3.0)
        .collect();
    let elev = vec![250.0; lats.len()];
    let temps = |n: usize| {
        with_threads(n, || {
            let inst = a.instant(0.3, p.day_s()).unwrap();
            let mut out = vec![0.0; lats.len()];
            inst.temperatures_c(&lats, &hours, &elev, &mut out).unwrap();
            out
        })
    };
    assert_eq!(temps(1), temps(2));
}

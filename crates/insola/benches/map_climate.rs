//! Map climate timings on one core: the zonal model's periodic equilibrium at the same
//! latitude count (the same-run baseline), and the map model's on 128 × 64 and 256 × 128 grids
//! over Verdance's invented continents (set-up, resampling and equilibrium). After the
//! criterion groups a summary prints each map time as a multiple of its baseline.

use std::hint::black_box;
use std::time::{Duration, Instant};

use criterion::Criterion;
use insola::climate::{ClimateSpec, equilibrate};
use insola::map_climate::{MapGrid, Resampling, SurfaceLayout, SurfaceMap};
use insola::{Planet, WorldSpec};

fn asset(name: &str) -> String {
    std::fs::read_to_string(format!(
        "{}/../../assets/worlds/{name}",
        env!("CARGO_MANIFEST_DIR")
    ))
    .unwrap()
}

fn zonal(p: &Planet, bands: usize) {
    let spec = ClimateSpec {
        bands,
        ..p.climate_spec()
    };
    let f = p.annual_forcing(spec.steps_per_year);
    black_box(equilibrate(&spec, &f).unwrap());
}

fn map(p: &Planet, land: &SurfaceMap, cols: usize, rows: usize) {
    let g = MapGrid::new(cols, rows).unwrap();
    black_box(
        p.equilibrate_map_climate(land, &g, Resampling::AreaFraction)
            .unwrap(),
    );
}

fn median(mut f: impl FnMut(), n: usize) -> Duration {
    let mut t: Vec<Duration> = (0..n)
        .map(|_| {
            let s = Instant::now();
            f();
            s.elapsed()
        })
        .collect();
    t.sort();
    t[n / 2]
}

fn main() {
    // One core: the map model is serial; keep rayon's pools (the zonal forcing) to one thread.
    rayon::ThreadPoolBuilder::new()
        .num_threads(1)
        .build_global()
        .ok();
    let p = Planet::new(&WorldSpec::from_ron_str(&asset("verdance.world.ron")).unwrap()).unwrap();
    let land = SurfaceLayout::from_ron_str(&asset("verdance.land.ron"))
        .unwrap()
        .rasterise(720, 360)
        .unwrap();
    let mut c = Criterion::default()
        .sample_size(10)
        .measurement_time(Duration::from_secs(8))
        .configure_from_args();
    let mut g = c.benchmark_group("map_climate");
    g.bench_function("zonal_64_bands", |b| b.iter(|| zonal(&p, 64)));
    g.bench_function("map_128x64", |b| b.iter(|| map(&p, &land, 128, 64)));
    g.bench_function("zonal_128_bands", |b| b.iter(|| zonal(&p, 128)));
    g.bench_function("map_256x128", |b| b.iter(|| map(&p, &land, 256, 128)));
    g.finish();
    c.final_summary();
    let z64 = median(|| zonal(&p, 64), 9);
    let m128 = median(|| map(&p, &land, 128, 64), 5);
    let z128 = median(|| zonal(&p, 128), 9);
    let m256 = median(|| map(&p, &land, 256, 128), 3);
    println!(
        "summary (one thread, medians): zonal 64 bands {z64:.2?}; map 128×64 {m128:.1?} = {:.0}× the zonal model at 64 bands (target under 200 ms); zonal 128 bands {z128:.2?}; map 256×128 {m256:.1?} = {:.0}× the zonal model at 128 bands (target under 1 s)",
        m128.as_secs_f64() / z64.as_secs_f64(),
        m256.as_secs_f64() / z128.as_secs_f64()
    );
}

//! Outside checks of the map climate's two-star forcing on slow rotators and locked worlds: a
//! dark companion changes nothing, each cell's sunlight is the sum of the stars' own
//! top-of-atmosphere insolation from the core's per-star sky, and a locked world lit by two
//! suns still balances its energy over the year.

use super::validation::coalbedo_of;
use super::*;
use crate::climate::ClimateSpec;
use crate::{Place, Planet, WorldSpec};

/// A planet's year in standard days for semi-major axis `a_au` about `m_sun` solar masses:
/// Kepler's third law in solar units, `P = 365.25 d · √(a³ / M)` (standard; one solar mass
/// and 1 AU give a year of 365.25 d, from memory). The world check then holds the file to the
/// law within 2 % (`PLANET_PERIOD_TOLERANCE`).
fn kepler_year_days(a_au: f64, m_sun: f64) -> f64 {
    365.25 * (a_au.powi(3) / m_sun).sqrt()
}

/// An invented world and its twin with `companion`, as the two-star sky checks build them
/// (`star_pair` tests): the same star, orbit, spin and climate, one with a second star.
fn lone_and_paired(body: &str, companion: &str) -> (Planet, Planet) {
    let lone = Planet::new(&WorldSpec::from_ron_str(&format!("({body})")).unwrap()).unwrap();
    let paired = Planet::new(
        &WorldSpec::from_ron_str(&format!("({body}, companion: {companion})")).unwrap(),
    )
    .unwrap();
    (lone, paired)
}

/// Invented slow rotator "Harrowdune": a Sun-like star at 1 AU, a solar day of exactly a
/// tenth of the year (so the model's day is not stretched and its hour angles are the sky's).
fn slow_body() -> String {
    let year = kepler_year_days(1.0, 1.0);
    format!(
        r#"name: "Harrowdune",
        star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0, mass_m_sun: 1.0),
        orbit: (semi_major_axis_au: 1.0, eccentricity: 0.03, periapsis_longitude_deg: 70, period_days: {year}),
        spin: (obliquity_deg: 12, solar_day_hours: {day_h}),
        climate: (albedo_a0: 0.3, albedo_a2: 0.05, steps_per_year: 200)"#,
        day_h = year * 24.0 / 10.0
    )
}

/// Invented locked world "Ostrevel": 0.08 AU from a red dwarf of 0.3 solar masses.
fn locked_body() -> String {
    format!(
        r#"name: "Ostrevel",
        star: (temperature_k: 2800, radius_r_sun: 0.3, luminosity_l_sun: 0.005, mass_m_sun: 0.3),
        orbit: (semi_major_axis_au: 0.08, eccentricity: 0.02, periapsis_longitude_deg: 40, period_days: {}),
        spin: (obliquity_deg: 3, tidally_locked: true),
        climate: (albedo_a0: 0.3, albedo_a2: 0.0, mixed_layer_depth_m: 30, steps_per_year: 96)"#,
        kepler_year_days(0.08, 0.3)
    )
}

/// A dark (luminosity 0) wide companion far out and inclined, as the sky's own dark-companion
/// check uses.
const DARK_WIDE: &str = r#"(star: (temperature_k: 3000, radius_r_sun: 0.3, luminosity_l_sun: 0, mass_m_sun: 0.3),
    arrangement: Wide, orbit: (separation_au: 60, eccentricity: 0.2, inclination_deg: 25,
    ascending_node_deg: 40, periapsis_longitude_deg: 100, phase_at_zero_deg: 30))"#;

/// A bright wide companion 6 AU out (about 75 W m⁻² at the slow rotator), inside the
/// Holman & Wiegert (1999) S-type limit the world check applies.
const BRIGHT_WIDE_FAR: &str = r#"(star: (temperature_k: 6270, radius_r_sun: 1.2, luminosity_l_sun: 2.0, mass_m_sun: 1.2),
    arrangement: Wide, orbit: (separation_au: 6, eccentricity: 0.1, inclination_deg: 15,
    ascending_node_deg: 40, periapsis_longitude_deg: 100, phase_at_zero_deg: 30))"#;

/// A bright wide companion 1.5 AU out (about 240 W m⁻² at the locked world), which lights
/// the night side as it circles the locked world's sky once a year or so.
const BRIGHT_WIDE_NEAR: &str = r#"(star: (temperature_k: 5200, radius_r_sun: 0.78, luminosity_l_sun: 0.4, mass_m_sun: 0.8),
    arrangement: Wide, orbit: (separation_au: 1.5, eccentricity: 0.1, inclination_deg: 10,
    ascending_node_deg: 200, periapsis_longitude_deg: 250, phase_at_zero_deg: 120))"#;

/// Invented circumbinary slow rotator "Pellicar": a Sun-like star and an orange dwarf on a
/// 20-day orbit, the planet at 1.3 AU about both.
fn circumbinary_slow() -> Planet {
    let year = kepler_year_days(1.3, 1.7);
    let text = format!(
        r#"(name: "Pellicar",
        star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0, mass_m_sun: 1.0),
        orbit: (semi_major_axis_au: 1.3, eccentricity: 0.01, periapsis_longitude_deg: 200, period_days: {year}),
        spin: (obliquity_deg: 20, solar_day_hours: {day_h}),
        climate: (steps_per_year: 200),
        companion: (star: (temperature_k: 4300, radius_r_sun: 0.7, luminosity_l_sun: 0.25, mass_m_sun: 0.7),
            arrangement: Circumbinary, orbit: (period_days: 20, eccentricity: 0.1,
            periapsis_longitude_deg: 30, phase_at_zero_deg: 75)))"#,
        day_h = year * 24.0 / 10.0
    );
    Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
}

/// Invented circumbinary locked world "Vessarine": two red dwarfs on a 2-day orbit, the planet
/// at 0.14 AU about both, locked (to the pair's mean motion about it).
fn circumbinary_locked() -> Planet {
    let text = format!(
        r#"(name: "Vessarine",
        star: (temperature_k: 3300, radius_r_sun: 0.35, luminosity_l_sun: 0.012, mass_m_sun: 0.35),
        orbit: (semi_major_axis_au: 0.14, eccentricity: 0.0, periapsis_longitude_deg: 0, period_days: {}),
        spin: (obliquity_deg: 0, tidally_locked: true),
        climate: (albedo_a0: 0.3, albedo_a2: 0.0, mixed_layer_depth_m: 30, steps_per_year: 96),
        companion: (star: (temperature_k: 3100, radius_r_sun: 0.25, luminosity_l_sun: 0.005, mass_m_sun: 0.2),
            arrangement: Circumbinary, orbit: (period_days: 2, eccentricity: 0.05,
            periapsis_longitude_deg: 10, phase_at_zero_deg: 0)))"#,
        kepler_year_days(0.14, 0.55)
    );
    Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
}

fn close(a: f64, b: f64, what: &str) {
    assert!(
        (a - b).abs() <= 1e-12 * (1.0 + a.abs().max(b.abs())),
        "{what}: {a} vs {b}"
    );
}

/// Land in one quarter of the map, so cells differ in heat capacity.
fn patchy_land() -> SurfaceMap {
    SurfaceMap::from_fn(72, 36, |lat, lon| {
        if (-30.0..50.0).contains(&lat) && (-60.0..40.0).contains(&lon) {
            SurfaceKind::Land
        } else {
            SurfaceKind::Sea
        }
    })
    .unwrap()
}

#[test]
fn a_dark_companion_leaves_the_map_climate_unchanged() {
    // A companion of luminosity 0 gives no light: the slow rotator's and the locked world's
    // forcing, its annual means and the periodic climate must be the one-star world's.
    let grid = MapGrid::new(16, 8).unwrap();
    for (body, mode) in [
        (
            slow_body(),
            ForcingMode::Instantaneous {
                solar_days_per_year: 10,
            },
        ),
        (locked_body(), ForcingMode::Locked),
    ] {
        let (lone, paired) = lone_and_paired(&body, DARK_WIDE);
        assert_eq!(paired.star_count(), 2);
        assert!(!paired.has_shining_companion());
        let steps = lone.climate_spec().steps_per_year;
        let a = MapForcing::from_planet(&lone, &grid, steps).unwrap();
        let b = MapForcing::from_planet(&paired, &grid, steps).unwrap();
        assert_eq!(a.mode(), mode);
        assert_eq!(b.mode(), mode);
        for k in 0..steps {
            for (x, y) in a
                .insolation_w_m2(k, &grid)
                .iter()
                .zip(b.insolation_w_m2(k, &grid))
            {
                close(*x, y, "insolation");
            }
        }
        let ((qa, ma), (qb, mb)) = (
            a.annual_mean_and_cos_zenith(&grid),
            b.annual_mean_and_cos_zenith(&grid),
        );
        for c in 0..grid.len() {
            close(qa[c], qb[c], "annual mean");
            close(ma[c], mb[c], "mean cos zenith");
        }
        let land = patchy_land();
        let ca = lone
            .equilibrate_map_climate(&land, &grid, Resampling::AreaFraction)
            .unwrap();
        let cb = paired
            .equilibrate_map_climate(&land, &grid, Resampling::AreaFraction)
            .unwrap();
        assert_eq!(ca.steps(), cb.steps());
        close(ca.global_mean_c(), cb.global_mean_c(), "global mean");
        for k in 0..ca.steps() {
            for (x, y) in ca.temperatures_c(k).iter().zip(cb.temperatures_c(k)) {
                close(f64::from(*x), f64::from(*y), "cell temperature");
            }
        }
    }
}

#[test]
fn each_cell_gets_the_sum_of_every_stars_own_insolation() {
    // The forcing must be Σ_j F_j max(0, cos z_j) with each star's flux and direction from the
    // core's per-star sky (`Planet::star_position_of`, whose top-of-atmosphere insolation is
    // the same law, derived independently per place): to 1e-9 relative, 1 W m⁻² floor. The
    // slow rotators' solar days fit their years exactly, so the model's hour angles are the
    // sky's. Wide and circumbinary pairs, slow and locked; no ring, so no transmission.
    let grid = MapGrid::new(24, 12).unwrap();
    let worlds = [
        lone_and_paired(&slow_body(), BRIGHT_WIDE_FAR).1,
        lone_and_paired(&locked_body(), BRIGHT_WIDE_NEAR).1,
        circumbinary_slow(),
        circumbinary_locked(),
    ];
    for p in &worlds {
        assert!(p.has_shining_companion());
        let steps = p.climate_spec().steps_per_year;
        let forcing = MapForcing::from_planet(p, &grid, steps).unwrap();
        assert_ne!(forcing.mode(), ForcingMode::DailyMean, "{}", p.spec().name);
        // The same instants the forcing samples.
        let dt = p.year_s() / steps as f64;
        let mut companion_max: f64 = 0.0;
        for k in 0..steps {
            let t = k as f64 * dt;
            let q = forcing.insolation_w_m2(k, &grid);
            for (c, &qc) in q.iter().enumerate() {
                let place = Place {
                    latitude_rad: grid.rows().lat_centres_rad()[c / grid.columns()],
                    longitude_rad: grid.lon_centres_rad()[c % grid.columns()],
                };
                let per_star: Vec<f64> = p
                    .shining_stars()
                    .map(|j| p.star_position_of(j, t, place).unwrap().toa_insolation_w_m2)
                    .collect();
                companion_max = companion_max.max(per_star[1]);
                let expected: f64 = per_star.iter().sum();
                assert!(
                    (qc - expected).abs() <= (1e-9 * expected.abs()).max(1.0),
                    "{} step {k} cell {c}: {qc} vs {expected}",
                    p.spec().name
                );
            }
        }
        // The companion's light is large enough that leaving it out would fail the check.
        assert!(companion_max > 10.0, "{}: {companion_max}", p.spec().name);
    }
}

/// Global annual imbalance of a periodic map climate, W m⁻²: the same sum as the one-star
/// Verdance check (absorbed sunlight minus outgoing longwave over every cell and step, the
/// sunlight at each step's end as the model takes it; the grid's cells have equal areas).
fn global_imbalance_w_m2(model: &MapEnergyBalanceModel, map: &MapClimate) -> f64 {
    let grid = model.grid();
    let n = grid.len();
    let (mut absorbed, mut emitted) = (0.0, 0.0);
    for k in 0..map.steps() {
        let q = model.forcing().insolation_w_m2(k + 1, grid);
        for (c, (&qc, &tc)) in q.iter().zip(map.temperatures_c(k)).enumerate() {
            let t = f64::from(tc) + model.lapse_k[c];
            absorbed += qc * coalbedo_of(model, c, t);
            emitted += model.longwave.olr_w_m2(t);
        }
    }
    (absorbed - emitted) / (n * map.steps()) as f64
}

#[test]
fn a_two_star_locked_world_balances_its_energy() {
    // Global annual energy balance of a periodic state (derived: the heat stored over a
    // repeating year is zero, so absorbed sunlight equals outgoing longwave in the global
    // annual mean) to 0.1 W m⁻², as for the one-star world; a wide companion that sweeps the
    // night side and a close circumbinary pair.
    let grid = MapGrid::new(32, 16).unwrap();
    let worlds = [
        lone_and_paired(&locked_body(), BRIGHT_WIDE_NEAR).1,
        circumbinary_locked(),
    ];
    for p in &worlds {
        let spec = ClimateSpec {
            tolerance_k: 1e-4,
            ..p.climate_spec()
        };
        let forcing = MapForcing::from_planet(p, &grid, spec.steps_per_year).unwrap();
        assert_eq!(forcing.mode(), ForcingMode::Locked);
        let surface = patchy_land().resample(&grid, Resampling::AreaFraction);
        let model = MapEnergyBalanceModel::new(&spec, &grid, surface, forcing).unwrap();
        let map = equilibrate_map(&model, &MapStart::SteadyAnnualMean).unwrap();
        let imbalance = global_imbalance_w_m2(&model, &map);
        assert!(imbalance.abs() < 0.1, "{}: {imbalance} W/m²", p.spec().name);
    }
    // The wide companion reaches the primary's night side: some antistellar cell is lit.
    let p = &worlds[0];
    let forcing = MapForcing::from_planet(p, &grid, 96).unwrap();
    let q0 = forcing.insolation_w_m2(0, &grid);
    let sub = (0..q0.len())
        .max_by(|&a, &b| q0[a].total_cmp(&q0[b]))
        .unwrap();
    let cols = grid.columns();
    let anti = grid.cell_of(0.0, 0.0) / cols * cols + (sub % cols + cols / 2) % cols;
    let lit = (0..96).any(|k| forcing.insolation_w_m2(k, &grid)[anti] > 10.0);
    assert!(lit, "the companion never lit the night side");
}

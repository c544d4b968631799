//! Checks of the whole climate model against published results and physical expectations.

use std::f64::consts::TAU;

use proptest::prelude::*;

use super::forcing::kepler_forcing;
use super::*;

const YEAR_S: f64 = 365.25 * 86400.0;

fn earth_like_forcing(obliquity_deg: f64) -> AnnualForcing {
    // Validation reference only: present-day orbit as used in climlab's tests
    // (e 0.017236, ϖ 281.37°, S0 1365.2 W m⁻²; climlab `tests/test_insolation.py`).
    kepler_forcing(1365.2, 0.017236, obliquity_deg, 281.37, YEAR_S, 360)
}

fn model(spec: &ClimateSpec, forcing: &AnnualForcing) -> EnergyBalanceModel {
    let grid = ClimateGrid::new(spec.bands).unwrap();
    EnergyBalanceModel::new(
        spec,
        BandInsolation::from_forcing(forcing, &grid, spec.steps_per_year).unwrap(),
    )
    .unwrap()
}

/// Amplitude (K) and lag (days) of the first-Legendre-mode temperature under the forcing
/// `Q (1 + s11 cos(2π f) x)`, constant co-albedo 0.7, no ice.
fn p1_response(depth_m: f64) -> (f64, f64) {
    let spec = ClimateSpec {
        ice_free_albedo: IceFreeAlbedo::legendre(0.3, 0.0),
        ice_enabled: false,
        olr_a_w_m2: 210.0,
        olr_b_w_m2_per_k: 2.0,
        diffusion_w_m2_per_k: 0.555,
        mixed_layer_depth_m: depth_m,
        steps_per_year: 365,
        ..ClimateSpec::climlab_seasonal()
    };
    let grid = ClimateGrid::new(spec.bands).unwrap();
    let s11 = 2.0 * 23.44f64.to_radians().sin();
    let ins = BandInsolation::from_fn(&grid, spec.steps_per_year, YEAR_S, |x, f| {
        340.25 * (1.0 + s11 * (TAU * f).cos() * x)
    })
    .unwrap();
    let m = EnergyBalanceModel::new(&spec, ins).unwrap();
    let cycle = equilibrate_model(&m, None, &Start::SteadyAnnualMean).unwrap();
    let xs = grid.x_centres();
    let sxx: f64 = xs.iter().map(|x| x * x).sum();
    let t1: Vec<f64> = (0..cycle.steps())
        .map(|k| {
            cycle
                .temperatures_c(k)
                .iter()
                .zip(xs)
                .map(|(t, x)| t * x)
                .sum::<f64>()
                / sxx
        })
        .collect();
    let phase = BandPhase::from_column(&t1);
    (
        phase.annual_amplitude_k,
        phase.annual_peak_year_fraction * 365.25,
    )
}

#[test]
fn linear_seasonal_response_of_the_first_legendre_mode() {
    // Expected values computed from the linear-response formula amplitude =
    // Q a0 s11 / √((B + 2D)² + (ωC)²), lag = atan(ωC/(B + 2D))/ω (regression; same structure as
    // T11/Φ11 in Rose, Cronin & Bitz 2017, ApJ 846:28, code `ebm_analytical.py`), which gives
    // 21.3 K / 70.5 d for 10 m, 53.7 K / 28.6 d for 2 m and 4.5 K / 87 d for 50 m of water.
    // Tolerance: backward Euler with one-day steps adds about Cω²Δt/2 of damping (< 1 %) and
    // about half a step of lag, so 2 % and 1.5 days.
    for (depth, want_amp, want_lag) in [(10.0, 21.3, 70.5), (2.0, 53.7, 28.6), (50.0, 4.5, 87.0)] {
        let c = 1000.0 * 4181.3 * depth;
        let w = TAU / YEAR_S;
        let k = 2.0 + 2.0 * 0.555;
        let amp =
            340.25 * 0.7 * 2.0 * 23.44f64.to_radians().sin() / (k * k + (w * c) * (w * c)).sqrt();
        let lag_d = (w * c / k).atan() / w / 86400.0;
        assert!(
            (amp - want_amp).abs() < 0.06 && (lag_d - want_lag).abs() < 0.6,
            "formula {amp} {lag_d}"
        );
        let (got_amp, got_lag) = p1_response(depth);
        assert!(
            (got_amp / amp - 1.0).abs() < 0.02,
            "{depth} m: amplitude {got_amp} vs {amp}"
        );
        assert!(
            (got_lag - lag_d).abs() < 1.5,
            "{depth} m: lag {got_lag} vs {lag_d}"
        );
    }
}

#[test]
fn step_ice_albedo_edges_near_seventy_degrees_and_snowball_at_1200() {
    // climlab `tests/test_ebm.py`: annual-mean EBM with climlab defaults has its ice edge at
    // ±70° (on a 2° grid, so ±2°), and with S0 = 1200 W m⁻² it freezes over (ice edge 0°).
    let spec = ClimateSpec::climlab_defaults();
    let grid = ClimateGrid::new(spec.bands).unwrap();
    let annual =
        BandInsolation::from_forcing(&earth_like_forcing(23.446), &grid, spec.steps_per_year)
            .unwrap()
            .annual_mean();
    // The ice-free branch also exists for these values (its pole sits just above −10 °C), so
    // start, like climlab, from the cold-pole state 12 − 40·P2(x) °C (climlab's default initial
    // temperature, from memory); the ice cap then holds itself by the ice-albedo feedback.
    let start: Vec<f64> = grid
        .x_centres()
        .iter()
        .map(|x| 12.0 - 40.0 * 0.5 * (3.0 * x * x - 1.0))
        .collect();
    let cycle = equilibrate_model(
        &EnergyBalanceModel::new(&spec, annual).unwrap(),
        None,
        &Start::Given(start),
    )
    .unwrap();
    let edges = cycle.ice_edges();
    let (n, s) = (
        edges.north_lat_rad.unwrap().to_degrees(),
        edges.south_lat_rad.unwrap().to_degrees(),
    );
    assert!(
        (n - 70.0).abs() < 2.5 && (s + 70.0).abs() < 2.5,
        "edges {n} {s}"
    );

    let dim = kepler_forcing(1200.0, 0.017236, 23.446, 281.37, YEAR_S, 360);
    let annual = BandInsolation::from_forcing(&dim, &grid, spec.steps_per_year)
        .unwrap()
        .annual_mean();
    let m = EnergyBalanceModel::new(&spec, annual).unwrap();
    let cold = match equilibrate_model(&m, None, &Start::Uniform(10.0)) {
        Ok(c) => c,
        Err(e) => panic!("{e}"),
    };
    assert_eq!(cold.ice_area_fraction(), 1.0);
    assert_eq!(
        cold.ice_edges(),
        IceEdges {
            north_lat_rad: None,
            south_lat_rad: None
        }
    );
}

#[test]
fn seasonal_default_world_converges_and_repeats() {
    let spec = ClimateSpec::climlab_seasonal();
    let forcing = earth_like_forcing(23.446);
    let cycle = equilibrate(&spec, &forcing).unwrap();
    assert!(cycle.converged() && cycle.residual_k() < 0.01);
    assert!(
        cycle.years_to_equilibrium() >= 1 && cycle.years_to_equilibrium() < 40,
        "{}",
        cycle.years_to_equilibrium()
    );
    // Run one more year from the stored start and compare at every phase.
    let m = model(&spec, &forcing);
    let nb = m.grid().len();
    let mut state = cycle.temperatures_c(0).to_vec();
    let mut traj = vec![0.0; spec.steps_per_year * nb];
    let mut scratch = vec![0.0; nb];
    m.run_year(&mut state, &mut traj, &mut scratch);
    m.run_year(&mut state, &mut traj, &mut scratch);
    let max_diff = (0..spec.steps_per_year)
        .flat_map(|k| (0..nb).map(move |j| (k, j)))
        .map(|(k, j)| (traj[k * nb + j] - cycle.temperatures_c(k)[j]).abs())
        .fold(0.0, f64::max);
    assert!(max_diff < 0.01, "{max_diff}");
    // Earth-like sanity check: global mean 14–15 °C observed (Kramm et al. 2020, read in the
    // abstract); the simple model is accepted within ±5 °C (from memory, common practice).
    let g = cycle.global_mean_c();
    assert!((g - 14.5).abs() < 5.0, "global {g}");
    // Poles colder than the equator; seasonal ice at high latitudes; summers opposite.
    let eq = cycle.temperature_c(0.0, 0.0);
    assert!(cycle.temperature_c(1.4, 0.3) < eq);
    let n = cycle.season(1.0, 0.5);
    let s = cycle.season(-1.0, 0.5);
    assert_ne!(n, s);
    assert_eq!(cycle.band_summaries().len(), nb);
}

#[test]
fn high_tilt_warm_poles_and_two_equatorial_summers() {
    // Rose, Cronin & Bitz (2017) and Ward (1974, from memory): beyond about 54° of tilt the
    // poles receive more sunlight over a year than the equator; the equator is lit most at both
    // equinoxes, so its temperature cycle has two peaks a year.
    for tilt in [60.0, 90.0] {
        // Constant ice-free albedo: the default a2 term brightens the poles as on Earth, which
        // is tied to Earth's own sunlight geometry and would hide the effect.
        let spec = ClimateSpec {
            ice_enabled: false,
            ice_free_albedo: IceFreeAlbedo::legendre(0.33, 0.0),
            ..ClimateSpec::climlab_seasonal()
        };
        let cycle =
            equilibrate(&spec, &kepler_forcing(1365.2, 0.0, tilt, 0.0, YEAR_S, 360)).unwrap();
        let stats = cycle.band_stats();
        let eq = &stats[stats.len() / 2];
        assert!(
            stats[0].mean_c > eq.mean_c && stats[stats.len() - 1].mean_c > eq.mean_c,
            "tilt {tilt}"
        );
        let phase = cycle.band_phases()[stats.len() / 2];
        assert_eq!(phase.summers_per_year(), 2, "tilt {tilt}: {phase:?}");
        // Sun longitude λ = v at perihelion 0: equinoxes at year fractions 0 and 0.5.
        let summers = (0..8)
            .filter(|&i| cycle.season(0.0, i as f64 / 8.0) == Season::Summer)
            .count();
        assert_eq!(summers, 2, "tilt {tilt}");
    }
}

#[test]
fn any_tilt_and_an_eccentric_orbit_work() {
    let spec = ClimateSpec::climlab_seasonal();
    for tilt in [0.0, 90.0, 180.0] {
        let c = equilibrate(&spec, &kepler_forcing(1365.2, 0.0, tilt, 0.0, YEAR_S, 360)).unwrap();
        assert!(c.converged());
        if tilt != 90.0 {
            // No tilt, circular orbit: no seasons at all.
            assert_eq!(c.season(0.5, 0.3), Season::Steady);
        }
    }
    // Tilt ε and 180° − ε give the same sunlight (sin δ = sin ε sin λ), so the same climate.
    let a = equilibrate(&spec, &kepler_forcing(1365.2, 0.1, 30.0, 40.0, YEAR_S, 360)).unwrap();
    let b = equilibrate(
        &spec,
        &kepler_forcing(1365.2, 0.1, 150.0, 40.0, YEAR_S, 360),
    )
    .unwrap();
    for k in 0..a.steps() {
        for (x, y) in a.temperatures_c(k).iter().zip(b.temperatures_c(k)) {
            assert!((x - y).abs() < 1e-6);
        }
    }
    // e = 0.3: converges; the year's mean sunlight is larger by (1 − e²)^(−1/2), so warmer.
    let round = equilibrate(&spec, &kepler_forcing(1365.2, 0.0, 23.0, 90.0, YEAR_S, 360)).unwrap();
    let ecc = equilibrate(&spec, &kepler_forcing(1365.2, 0.3, 23.0, 90.0, YEAR_S, 360)).unwrap();
    assert!(ecc.converged());
    assert!(ecc.global_mean_c() > round.global_mean_c());
}

#[test]
fn circular_orbit_hemispheres_mirror_half_a_year_apart() {
    let spec = ClimateSpec {
        bands: 60,
        ..ClimateSpec::climlab_seasonal()
    };
    let c = equilibrate(&spec, &kepler_forcing(1365.2, 0.0, 23.44, 0.0, YEAR_S, 360)).unwrap();
    for lat in [0.2, 0.7, 1.2] {
        for f in [0.0, 0.25, 0.6] {
            let (n, s) = (c.temperature_c(lat, f), c.temperature_c(-lat, f + 0.5));
            assert!((n - s).abs() < 0.02, "{lat} {f}: {n} vs {s}");
        }
    }
}

#[test]
fn bad_spec_is_an_error_naming_the_field() {
    let spec = ClimateSpec {
        mixed_layer_depth_m: f64::NAN,
        ..ClimateSpec::climlab_seasonal()
    };
    match equilibrate(&spec, &earth_like_forcing(23.44)) {
        Err(ClimateError::Spec(e)) => assert_eq!(e.field(), Some("climate.mixed_layer_depth_m")),
        other => panic!("{other:?}"),
    }
    let mut bad = earth_like_forcing(23.44);
    bad.s0_w_m2 = -5.0;
    match equilibrate(&ClimateSpec::climlab_seasonal(), &bad) {
        Err(ClimateError::Spec(e)) => assert_eq!(e.field(), Some("forcing.s0_w_m2")),
        other => panic!("{other:?}"),
    }
}

#[test]
fn not_converging_within_the_year_cap_is_a_typed_error() {
    let spec = ClimateSpec {
        max_years: 1,
        mixed_layer_depth_m: 200.0,
        ..ClimateSpec::climlab_seasonal()
    };
    match equilibrate(&spec, &earth_like_forcing(23.44)) {
        Err(ClimateError::NotConverged { years, last, .. }) => {
            assert_eq!(years, 1);
            assert!(!last.converged());
        }
        other => panic!("{other:?}"),
    }
}

#[test]
fn local_temperatures_day_night_and_elevation() {
    let spec = ClimateSpec::climlab_seasonal();
    let c = equilibrate(&spec, &earth_like_forcing(23.44)).unwrap();
    let day_s = 86400.0;
    let noon = c.local_temperature_c(0.3, 0.4, 0.0, 0.0, day_s).unwrap();
    let midnight = c
        .local_temperature_c(0.3, 0.4, std::f64::consts::PI, 0.0, day_s)
        .unwrap();
    let zonal = c.temperature_c(0.3, 0.4);
    assert!(noon > zonal && midnight < zonal);
    // Default surface layer: a few kelvin of day-night range for a 24 h day (common practice).
    assert!(
        noon - midnight > 2.0 && noon - midnight < 20.0,
        "{}",
        noon - midnight
    );
    // A slow rotator (60-day solar day) swings far more.
    let slow = c
        .local_temperature_c(0.3, 0.4, 0.0, 0.0, 60.0 * day_s)
        .unwrap()
        - c.local_temperature_c(0.3, 0.4, std::f64::consts::PI, 0.0, 60.0 * day_s)
            .unwrap();
    assert!(slow > 3.0 * (noon - midnight), "{slow}");
    // 2 km up: 13 K colder at the default 6.5 K/km.
    let high = c.local_temperature_c(0.3, 0.4, 0.0, 2000.0, day_s).unwrap();
    assert!((noon - high - 13.0).abs() < 1e-9);
    // Batch equals single queries; bad input is a typed error.
    let inst = c.instant(0.4, day_s).unwrap();
    let lats: Vec<f64> = (0..10_000)
        .map(|i| -1.5 + 3.0 * i as f64 / 10_000.0)
        .collect();
    let has: Vec<f64> = (0..10_000).map(|i| i as f64 * 0.37).collect();
    let elev = vec![100.0; 10_000];
    let mut out = vec![0.0; 10_000];
    inst.temperatures_c(&lats, &has, &elev, &mut out).unwrap();
    for i in (0..10_000).step_by(997) {
        assert_eq!(out[i], inst.temperature_c(lats[i], has[i], 100.0).unwrap());
    }
    assert!(inst.temperature_c(2.0, 0.0, 0.0).is_err());
    assert!(
        inst.temperatures_c(&lats, &has, &elev[..5], &mut out)
            .is_err()
    );
    assert!(c.instant(0.1, 0.0).is_err());
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(48))]
    #[test]
    fn random_worlds_stay_finite_and_within_energy_bounds(
        depth in 0.0f64..150.0,
        land in 0.0f64..1.0,
        a in 150.0f64..260.0,
        b in 1.0f64..3.0,
        d in 0.0f64..1.5,
        a0 in 0.2f64..0.4,
        a2 in -0.1f64..0.3,
        ice in any::<bool>(),
        e in 0.0f64..0.6,
        tilt in 0.0f64..180.0,
        peri in 0.0f64..360.0,
        s0 in 600.0f64..2500.0,
        year_days in 20.0f64..2000.0,
        day_h in 1.0f64..5000.0,
    ) {
        let spec = ClimateSpec {
            bands: 24, steps_per_year: 60, mixed_layer_depth_m: depth, land_fraction: land,
            olr_a_w_m2: a, olr_b_w_m2_per_k: b, diffusion_w_m2_per_k: d,
            ice_free_albedo: IceFreeAlbedo::legendre(a0, a2), ice_enabled: ice, max_years: 300, ..ClimateSpec::climlab_seasonal()
        };
        let forcing = kepler_forcing(s0, e, tilt, peri, year_days * 86400.0, 72);
        let cycle = match equilibrate(&spec, &forcing) {
            Ok(c) => c,
            Err(ClimateError::NotConverged { last, .. }) => *last,
            Err(other) => panic!("{other}"),
        };
        // Maximum principle of the implicit scheme: every band stays between absolute zero
        // (an unlit band on the gray-body limb cools toward it; the linear law alone would
        // stop at −A/B, where it emits nothing) and the linear-law equilibrium under the
        // strongest sunlight S0/ρ_min² (the limb only adds emission, so it is lower still).
        let rho_min = 1.0 - e;
        let t_max = (s0 / (rho_min * rho_min) - a) / b + 1e-6;
        let t_min = -273.15;
        for k in 0..cycle.steps() {
            for &t in cycle.temperatures_c(k) {
                prop_assert!(t.is_finite() && t >= t_min && t <= t_max, "{t} not in {t_min}..{t_max}");
            }
        }
        let inst = cycle.instant(0.37, day_h * 3600.0).unwrap();
        for (lat, ha) in [(-1.5, 0.0), (0.0, 3.0), (0.9, -1.0), (1.57, 2.0)] {
            let t = inst.temperature_c(lat, ha, 500.0).unwrap();
            prop_assert!(t.is_finite() && t >= -273.15);
        }
    }
}

#[test]
fn presets_run_on_the_validation_orbit() {
    // Earth orbit as a marked validation reference; the presets must settle to a climate with
    // a global mean within the broad range of simple EBMs (common practice, no source).
    for spec in [
        ClimateSpec::climlab_seasonal(),
        ClimateSpec::north_1981(),
        ClimateSpec::climlab_defaults(),
    ] {
        let c = equilibrate(&spec, &earth_like_forcing(23.446)).unwrap();
        let g = c.global_mean_c();
        assert!(c.converged() && g > -10.0 && g < 30.0, "{g}");
    }
}

#[test]
fn hysteresis_snowball_persists_where_a_warm_climate_also_exists() {
    // Budyko (1969) and Sellers (1969) found that the step ice albedo gives several equilibria
    // for one stellar flux; North (1975) and North, Cahalan & Coakley (1981) show the S-shaped
    // ice-edge curve with a hysteresis loop (from memory). Sweep the flux down from a warm
    // start until the planet freezes over, then back up, each step starting from the previous
    // state (climlab defaults, annual-mean insolation of the validation orbit).
    let spec = ClimateSpec::climlab_defaults();
    let grid = ClimateGrid::new(spec.bands).unwrap();
    let run = |s0: f64, start: Vec<f64>| {
        let f = kepler_forcing(s0, 0.017236, 23.446, 281.37, YEAR_S, 90);
        let ins = BandInsolation::from_forcing(&f, &grid, spec.steps_per_year)
            .unwrap()
            .annual_mean();
        let m = EnergyBalanceModel::new(&spec, ins).unwrap();
        equilibrate_model(&m, None, &Start::Given(start)).unwrap()
    };
    let fluxes: Vec<f64> = (0..=10).map(|i| 1400.0 - 25.0 * i as f64).collect();
    let mut state = vec![15.0; grid.len()];
    let mut down = Vec::new();
    for &s0 in &fluxes {
        let c = run(s0, state);
        state = c.temperatures_c(0).to_vec();
        down.push((s0, c.ice_area_fraction()));
    }
    // The bottom of the sweep (1150 W m⁻²) is a snowball.
    assert_eq!(down.last().unwrap().1, 1.0, "{down:?}");
    let mut up = Vec::new();
    for &s0 in fluxes.iter().rev() {
        let c = run(s0, state);
        state = c.temperatures_c(0).to_vec();
        up.push((s0, c.ice_area_fraction()));
    }
    // At a flux where the downward sweep still had open water, the upward sweep is frozen.
    let both = fluxes.iter().any(|&s0| {
        let d = down.iter().find(|p| p.0 == s0).unwrap().1;
        let u = up.iter().find(|p| p.0 == s0).unwrap().1;
        d < 0.5 && u == 1.0
    });
    assert!(both, "down {down:?} up {up:?}");
    // The snowball melts only at a much larger flux (ice co-albedo 0.38: the equator reaches
    // −10 °C only when 0.38·Q_eq > A − 10 B), so at 1400 W m⁻² it is still frozen.
    assert_eq!(up.last().unwrap(), &(1400.0, 1.0));
    // The same fluxes from a warm start are not all frozen: two equilibria.
    let warm = run(1325.0, vec![15.0; grid.len()]);
    assert!(warm.ice_area_fraction() < 0.5);
}

#[test]
fn energy_is_conserved_over_the_periodic_year() {
    // First law: over a periodic year the stored heat returns to its start, and the diffusion
    // term only moves heat between bands (zero flux at the poles), so the area- and time-mean
    // absorbed sunlight must equal the outgoing longwave (standard EBM energy budget,
    // e.g. North, Cahalan & Coakley 1981). Evaluated with the scheme's own step pairing:
    // sunlight at the step end with co-albedo from the step start, longwave at the step end.
    for (spec, tilt, e) in [
        (ClimateSpec::climlab_seasonal(), 23.446, 0.017236),
        (ClimateSpec::north_1981(), 60.0, 0.2),
        (
            ClimateSpec {
                land_fraction: 0.6,
                mixed_layer_depth_m: 50.0,
                ..ClimateSpec::climlab_seasonal()
            },
            35.0,
            0.05,
        ),
    ] {
        let forcing = kepler_forcing(1365.2, e, tilt, 281.37, YEAR_S, 360);
        let m = model(&spec, &forcing);
        let cycle = equilibrate_model(&m, Some(&forcing), &Start::SteadyAnnualMean).unwrap();
        let (nb, steps) = (m.grid().len(), m.steps_per_year());
        let (mut absorbed, mut olr) = (0.0, 0.0);
        for k in 0..steps {
            let now = cycle.temperatures_c(k);
            let next = cycle.temperatures_c((k + 1) % steps);
            let q = m.insolation.row((k + 1) % steps);
            for j in 0..nb {
                absorbed += q[j] * m.coalbedo(j, now[j]);
                olr += spec.olr_a_w_m2 + spec.olr_b_w_m2_per_k * next[j];
            }
        }
        let n = (steps * nb) as f64;
        let (absorbed, olr) = (absorbed / n, olr / n);
        assert!(
            (absorbed - olr).abs() < 0.1,
            "tilt {tilt}: absorbed {absorbed:.3} vs outgoing {olr:.3} W/m²"
        );
        // And the budget is a real one: about 240 W m⁻² for an Earth-like planet.
        assert!(absorbed > 150.0 && absorbed < 320.0, "{absorbed}");
    }
}

#[test]
fn seasonal_swing_at_high_latitudes_grows_with_tilt() {
    // Common practice, no source: more tilt, stronger seasons, most at high latitudes.
    // Constant ice-free albedo so the ice line does not blur the trend.
    let spec = ClimateSpec {
        ice_enabled: false,
        ice_free_albedo: IceFreeAlbedo::legendre(0.33, 0.0),
        ..ClimateSpec::climlab_seasonal()
    };
    let swing_at = |tilt: f64, lat_deg: f64| {
        let c = equilibrate(&spec, &kepler_forcing(1365.2, 0.0, tilt, 0.0, YEAR_S, 360)).unwrap();
        let s = c.band_stats()[c.grid().band_of(lat_deg.to_radians())];
        s.max_c - s.min_c
    };
    let mut last = 0.0;
    for tilt in [5.0, 15.0, 23.44, 35.0, 50.0, 70.0] {
        let high = swing_at(tilt, 70.0);
        let low = swing_at(tilt, 10.0);
        assert!(high > last, "tilt {tilt}: swing {high} not above {last}");
        assert!(
            high > low,
            "tilt {tilt}: 70° swing {high} vs 10° swing {low}"
        );
        last = high;
    }
}

#[test]
fn poles_warmer_than_the_equator_only_above_about_54_degrees() {
    // Common practice (the "about 54°" crossover usually credited to Ward 1974, from memory):
    // the annual-mean insolation of the poles overtakes the equator's at 53.9° of tilt, and an
    // ice-free model with constant albedo follows the sunlight.
    let spec = ClimateSpec {
        ice_enabled: false,
        ice_free_albedo: IceFreeAlbedo::legendre(0.33, 0.0),
        ..ClimateSpec::climlab_seasonal()
    };
    let pole_minus_equator = |tilt: f64| {
        let c = equilibrate(&spec, &kepler_forcing(1365.2, 0.0, tilt, 0.0, YEAR_S, 360)).unwrap();
        let s = c.band_stats();
        s[s.len() - 1].mean_c - s[s.len() / 2].mean_c
    };
    for tilt in [23.44, 45.0, 51.0] {
        assert!(pole_minus_equator(tilt) < 0.0, "tilt {tilt}");
    }
    for tilt in [57.0, 65.0, 80.0] {
        assert!(pole_minus_equator(tilt) > 0.0, "tilt {tilt}");
    }
}

#[test]
fn bad_climate_parameters_name_the_field() {
    let cases: Vec<(ClimateSpec, &str)> = vec![
        (
            ClimateSpec {
                mixed_layer_depth_m: -5.0,
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.mixed_layer_depth_m",
        ),
        (
            ClimateSpec {
                land_heat_capacity_j_m2_per_k: -1e6,
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.land_heat_capacity_j_m2_per_k",
        ),
        (
            ClimateSpec {
                surface_heat_capacity_j_m2_per_k: -1.0,
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.surface_heat_capacity_j_m2_per_k",
        ),
        (
            ClimateSpec {
                ice_free_albedo: IceFreeAlbedo::legendre(1.5, 0.25),
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.albedo_a0",
        ),
        (
            ClimateSpec {
                ice_albedo: -0.1,
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.ice_albedo",
        ),
        (
            ClimateSpec {
                diffusion_w_m2_per_k: f64::NAN,
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.diffusion_w_m2_per_k",
        ),
        (
            ClimateSpec {
                olr_a_w_m2: f64::NAN,
                ..ClimateSpec::climlab_seasonal()
            },
            "climate.olr_a_w_m2",
        ),
    ];
    for (spec, field) in cases {
        match equilibrate(&spec, &earth_like_forcing(23.44)) {
            Err(ClimateError::Spec(e)) => {
                assert_eq!(e.field(), Some(field));
                assert!(e.to_string().contains(field), "{e}");
            }
            other => panic!("{field}: {other:?}"),
        }
    }
}

#[test]
fn bad_climate_section_in_a_world_file_names_the_field() {
    // A world file whose climate section has an albedo above one.
    let text = r#"(
        name: "Pellmire",
        star: (temperature_k: 5600, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
        orbit: (semi_major_axis_au: 1.0, eccentricity: 0.02, periapsis_longitude_deg: 100,
                period_days: 300),
        spin: (obliquity_deg: 20, solar_day_hours: 22),
        climate: (albedo_a0: 1.5),
    )"#;
    let err = crate::WorldSpec::from_ron_str(text).unwrap_err();
    assert_eq!(err.field(), Some("climate.albedo_a0"), "{err}");
    for (field, value) in [
        ("mixed_layer_depth_m", "-3.0"),
        ("diffusion_w_m2_per_k", "NaN"),
    ] {
        let t = text.replace("albedo_a0: 1.5", &format!("{field}: {value}"));
        let err = crate::WorldSpec::from_ron_str(&t).unwrap_err();
        let want = format!("climate.{field}");
        assert_eq!(err.field(), Some(want.as_str()), "{err}");
    }
}

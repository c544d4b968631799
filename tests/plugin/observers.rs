//! Observers at many places, their cadence, the map projection and the climate.

use std::time::Duration;

use crate::common::*;
use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{MapProjection, ObserverInstant, ObserverInterval, PlaceFromPosition};

const FRAME: Duration = Duration::from_millis(16);

fn wait_for_climate(app: &mut App) {
    for _ in 0..2000 {
        app.update();
        if app.world().resource::<SeasonalClimate>().is_ready() {
            app.update();
            return;
        }
        std::thread::sleep(Duration::from_millis(5));
    }
    panic!("the climate did not become ready");
}

/// One observer entity per `(latitude, longitude)` in degrees.
fn spawn_places(app: &mut App, places: &[(f64, f64)]) -> Vec<Entity> {
    places
        .iter()
        .map(|&(lat, lon)| {
            app.world_mut()
                .spawn(SurfacePlace::from_degrees(lat, lon).unwrap())
                .id()
        })
        .collect()
}

/// The world time the observers describe.
fn observed_at(app: &App) -> f64 {
    app.world()
        .resource::<ObserverInstant>()
        .world_time_s
        .expect("observers have been updated")
}

#[test]
fn observers_get_the_cores_star_and_a_temperature() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 500.0, FRAME);
    let places = [(0.0, 0.0), (35.0, 120.0), (-60.0, -45.0), (80.0, 10.0)];
    let ids = spawn_places(&mut app, &places);
    wait_for_climate(&mut app);
    for _ in 0..10 {
        app.update();
    }
    let t = app.world().resource::<WorldClock>().world_time_s();
    assert_eq!(observed_at(&app), t);
    for (id, &(lat, lon)) in ids.iter().zip(&places) {
        let c = *app.world().get::<LocalConditions>(*id).unwrap();
        let core = planet.star_position(t, insola::Place::from_degrees(lat, lon).unwrap());
        // Single precision: the sine to 1e-6 (the angle loses digits near the zenith).
        assert_approx_eq!(c.sin_star_altitude, core.altitude_rad.sin(), 1e-6);
        assert_approx_eq!(c.star_altitude_rad(), core.altitude_rad, 2e-3);
        assert_approx_eq!(c.toa_insolation_w_m2, core.toa_insolation_w_m2, 0.01);
        assert!(c.temperature_c.is_finite(), "temperature at {lat}");
        assert_ne!(c.thermal_season, bevy_insola::ThermalSeason::Unknown);
        let direct = app
            .world()
            .resource::<SeasonalClimate>()
            .local_temperature_c(&planet, insola::Place::from_degrees(lat, lon).unwrap(), t);
        // The per-place table agrees with the direct query to its interpolation error.
        assert_approx_eq!(c.temperature_c, direct.unwrap(), 1.0);
        let expected_season = SeasonOfYear::at(
            planet.star_instant(t).ecliptic_longitude_rad,
            lat.to_radians(),
        );
        assert_eq!(c.season, expected_season);
    }
    let equator = app
        .world()
        .get::<LocalConditions>(ids[0])
        .unwrap()
        .temperature_c;
    let polar = app
        .world()
        .get::<LocalConditions>(ids[3])
        .unwrap()
        .temperature_c;
    assert!(equator > polar, "equator {equator} °C, 80° N {polar} °C");
    let climate = app.world().resource::<SeasonalClimate>();
    let zonal = climate.zonal_temperature_c(0.0, t).unwrap();
    assert!((-50.0..60.0).contains(&zonal), "{zonal}");
}

#[test]
fn cadence_in_world_seconds_and_moved_places() {
    let settings = InsolaSettings {
        observer_interval: ObserverInterval::WorldSeconds(3600.0),
        ..settings_at(0.0, 0.0)
    };
    // 60 world seconds per frame: an update every 60 frames.
    let mut app = app(BRINDLE, settings, 60.0 / FRAME.as_secs_f64(), FRAME);
    let still = app
        .world_mut()
        .spawn(SurfacePlace::from_degrees(10.0, 0.0).unwrap())
        .id();
    let moved = app
        .world_mut()
        .spawn(SurfacePlace::from_degrees(20.0, 0.0).unwrap())
        .id();
    // The climate's arrival forces an update; let it happen first.
    wait_for_climate(&mut app);
    let first = observed_at(&app);
    let still_then = *app.world().get::<LocalConditions>(still).unwrap();
    for _ in 0..10 {
        app.update();
    }
    assert_eq!(observed_at(&app), first);
    assert_eq!(
        *app.world().get::<LocalConditions>(still).unwrap(),
        still_then
    );
    *app.world_mut().get_mut::<SurfacePlace>(moved).unwrap() =
        SurfacePlace::from_degrees(-20.0, 0.0).unwrap();
    app.update();
    let now = app.world().resource::<WorldClock>().world_time_s();
    assert_eq!(observed_at(&app), first);
    assert_eq!(
        *app.world().get::<LocalConditions>(still).unwrap(),
        still_then
    );
    // A moved place is recomputed at once, with the star as of the last update (all places
    // share one instant).
    let moved_now = *app.world().get::<LocalConditions>(moved).unwrap();
    let core =
        planet(BRINDLE).star_position(first, insola::Place::from_degrees(-20.0, 0.0).unwrap());
    assert_approx_eq!(moved_now.sin_star_altitude, core.altitude_rad.sin(), 1e-6);
    for _ in 0..60 {
        app.update();
    }
    let later = observed_at(&app);
    assert_ne!(
        *app.world().get::<LocalConditions>(still).unwrap(),
        still_then
    );
    assert!(
        later >= first + 3600.0 && later <= now + 3700.0,
        "{first} {later}"
    );
}

#[test]
fn map_positions_become_places() {
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 0.0, FRAME);
    app.insert_resource(MapProjection {
        origin_latitude_deg: 40.0,
        origin_longitude_deg: 5.0,
        metres_per_degree: 1000.0,
    });
    // Default compass: north is −Z, east is +X.
    let e = app
        .world_mut()
        .spawn((PlaceFromPosition, Transform::from_xyz(0.0, 0.0, -3000.0)))
        .id();
    app.update();
    let p = *app.world().get::<SurfacePlace>(e).unwrap();
    // Places are kept in single precision (1e-5° is about a metre).
    assert_approx_eq!(p.latitude_rad().to_degrees(), 43.0, 1e-5);
    assert_approx_eq!(p.longitude_rad().to_degrees(), 5.0, 1e-5);
    app.world_mut().get_mut::<Transform>(e).unwrap().translation = Vec3::new(2000.0, 0.0, 0.0);
    app.update();
    let p = *app.world().get::<SurfacePlace>(e).unwrap();
    assert_approx_eq!(p.latitude_rad().to_degrees(), 40.0, 1e-5);
    assert_approx_eq!(
        p.longitude_rad().to_degrees(),
        5.0 + 2.0 / 40f64.to_radians().cos(),
        1e-4
    );
    let c = *app.world().get::<LocalConditions>(e).unwrap();
    let t = app.world().resource::<WorldClock>().world_time_s();
    assert_approx_eq!(
        c.sin_star_altitude,
        planet(BRINDLE)
            .star_position(t, p.place())
            .altitude_rad
            .sin(),
        1e-6
    );
}

#[test]
fn climate_is_rebuilt_when_the_world_changes() {
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 0.0, FRAME);
    wait_for_climate(&mut app);
    let first = app
        .world()
        .resource::<SeasonalClimate>()
        .zonal_temperature_c(0.0, 0.0)
        .unwrap();
    // A much hotter star: the old climate keeps answering until the new one is ready.
    let mut hotter = spec(BRINDLE);
    hotter.star.luminosity_l_sun = Some(1.6);
    app.world_mut()
        .resource_mut::<ActiveWorld>()
        .set_spec(&hotter)
        .unwrap();
    app.update();
    assert!(app.world().resource::<SeasonalClimate>().is_ready());
    let generation = app.world().resource::<ActiveWorld>().generation();
    for _ in 0..2000 {
        app.update();
        if app
            .world()
            .resource::<SeasonalClimate>()
            .is_current(generation)
        {
            break;
        }
        std::thread::sleep(Duration::from_millis(5));
    }
    let climate = app.world().resource::<SeasonalClimate>();
    assert!(climate.is_current(generation));
    assert!(climate.zonal_temperature_c(0.0, 0.0).unwrap() > first + 5.0);
}

#[test]
fn many_observers_share_a_table_that_agrees_with_direct_queries() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 500.0, FRAME);
    // Enough places for the shared table, over all latitudes and longitudes.
    let n = bevy_insola::TABLE_MIN_PLACES * 2;
    let places: Vec<(f64, f64)> = (0..n)
        .map(|i| {
            let lat = -88.0 + 176.0 * ((i * 37) % n) as f64 / n as f64;
            (lat, -180.0 + 360.0 * i as f64 / n as f64)
        })
        .collect();
    let ids = spawn_places(&mut app, &places);
    wait_for_climate(&mut app);
    let t = observed_at(&app);
    let climate = app.world().resource::<SeasonalClimate>();
    let mut errors = Vec::new();
    for (id, &(lat, lon)) in ids.iter().zip(&places) {
        let c = *app.world().get::<LocalConditions>(*id).unwrap();
        let at = |lat: f64| {
            let place = insola::Place::from_degrees(lat.clamp(-90.0, 90.0), lon).unwrap();
            climate.local_temperature_c(&planet, place, t).unwrap()
        };
        let direct = at(lat);
        errors.push((f64::from(c.temperature_c) - direct).abs());
        // The table interpolates between its 2° rows, so next to a step of the model (the
        // seasonal ice edge, where albedo jumps) it lies between the rows' values.
        let (below, above) = (at((lat / 2.0).floor() * 2.0), at((lat / 2.0).ceil() * 2.0));
        let (lo, hi) = (direct.min(below).min(above), direct.max(below).max(above));
        let table = f64::from(c.temperature_c);
        assert!(
            (lo - 0.5..=hi + 0.5).contains(&table),
            "{lat}° {lon}°: table {table} outside {lo}..{hi}"
        );
        let season = climate.season(lat.to_radians(), t).unwrap();
        // The table's season is that of the nearest 2° row.
        if season != c.thermal_season {
            let near = [-1.0, 1.0].map(|d: f64| climate.season((lat + d).to_radians(), t).unwrap());
            assert!(
                near.contains(&c.thermal_season),
                "{lat}: {season:?} vs {:?}",
                c.thermal_season
            );
        }
    }
    errors.sort_by(f64::total_cmp);
    let p95 = errors[errors.len() * 95 / 100];
    // Away from the model's steps, bilinear in a 2° × 3.75° table up to 1e-3 year old.
    assert!(p95 < 0.3, "95th percentile of table vs direct: {p95} K");
}

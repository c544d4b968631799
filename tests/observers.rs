//! Observers at many places, their cadence, the map projection and the climate.

mod common;

use std::time::Duration;

use bevy::prelude::*;
use bevy_insola::prelude::*;
use bevy_insola::{MapProjection, ObserverInterval, PlaceFromPosition};
use common::*;

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

#[test]
fn observers_get_the_cores_star_and_a_temperature() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 500.0, FRAME);
    let places = [(0.0, 0.0), (35.0, 120.0), (-60.0, -45.0), (80.0, 10.0)];
    let ids: Vec<Entity> = places
        .iter()
        .map(|&(lat, lon)| {
            app.world_mut()
                .spawn(SurfacePlace::from_degrees(lat, lon).unwrap())
                .id()
        })
        .collect();
    wait_for_climate(&mut app);
    for _ in 0..10 {
        app.update();
    }
    let t = app.world().resource::<WorldClock>().elapsed_s();
    for (id, &(lat, lon)) in ids.iter().zip(&places) {
        let c = *app.world().get::<LocalConditions>(*id).unwrap();
        let core = planet.star_position(t, insola::Place::from_degrees(lat, lon).unwrap());
        assert_eq!(c.updated_at_s, t);
        assert_approx_eq!(c.star_altitude_rad, core.altitude_rad, 1e-5);
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
    let first = app
        .world()
        .get::<LocalConditions>(still)
        .unwrap()
        .updated_at_s;
    for _ in 0..10 {
        app.update();
    }
    assert_eq!(
        app.world()
            .get::<LocalConditions>(still)
            .unwrap()
            .updated_at_s,
        first
    );
    *app.world_mut().get_mut::<SurfacePlace>(moved).unwrap() =
        SurfacePlace::from_degrees(-20.0, 0.0).unwrap();
    app.update();
    let now = app.world().resource::<WorldClock>().elapsed_s();
    assert_eq!(
        app.world()
            .get::<LocalConditions>(still)
            .unwrap()
            .updated_at_s,
        first
    );
    // A moved place is recomputed at once, with the star as of the last update (all places
    // share one instant).
    let moved_now = *app.world().get::<LocalConditions>(moved).unwrap();
    let core =
        planet(BRINDLE).star_position(first, insola::Place::from_degrees(-20.0, 0.0).unwrap());
    assert_eq!(moved_now.updated_at_s, first);
    assert_approx_eq!(moved_now.star_altitude_rad, core.altitude_rad, 1e-5);
    for _ in 0..60 {
        app.update();
    }
    let later = app
        .world()
        .get::<LocalConditions>(still)
        .unwrap()
        .updated_at_s;
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
    assert_approx_eq!(p.latitude_rad().to_degrees(), 43.0, 1e-6);
    assert_approx_eq!(p.longitude_rad().to_degrees(), 5.0, 1e-6);
    app.world_mut().get_mut::<Transform>(e).unwrap().translation = Vec3::new(2000.0, 0.0, 0.0);
    app.update();
    let p = *app.world().get::<SurfacePlace>(e).unwrap();
    assert_approx_eq!(p.latitude_rad().to_degrees(), 40.0, 1e-6);
    assert_approx_eq!(
        p.longitude_rad().to_degrees(),
        5.0 + 2.0 / 40f64.to_radians().cos(),
        1e-4
    );
    let c = *app.world().get::<LocalConditions>(e).unwrap();
    let t = app.world().resource::<WorldClock>().elapsed_s();
    assert_approx_eq!(
        c.star_altitude_rad,
        planet(BRINDLE).star_position(t, p.place()).altitude_rad,
        1e-5
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

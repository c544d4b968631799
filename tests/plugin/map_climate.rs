//! The climate on a designer's map: built in the background from a `ClimateSurface`, read by
//! `SeasonalClimate` queries and by observers, few and many.

use std::time::Duration;

use crate::common::*;
use bevy::prelude::*;
use bevy_insola::ClimateSurface;
use bevy_insola::insola::map_climate::{MapGrid, SurfaceKind, SurfaceMap};
use bevy_insola::prelude::*;

const FRAME: Duration = Duration::from_millis(16);

/// One broad invented continent from 30° W to 90° E between 65° S and 65° N; sea elsewhere.
fn one_continent() -> ClimateSurface {
    let land = SurfaceMap::from_fn(144, 72, |lat, lon| {
        if (-30.0..90.0).contains(&lon) && lat.abs() < 65.0 {
            SurfaceKind::Land
        } else {
            SurfaceKind::Sea
        }
    })
    .unwrap();
    ClimateSurface::new(land).with_grid(MapGrid::new(64, 32).unwrap())
}

fn wait_for_map(app: &mut App) {
    for _ in 0..4000 {
        app.update();
        // Both models: the map and the zonal one are built apart, and the queries below need
        // the zonal model's time of year too (the map could come first).
        let climate = app.world().resource::<SeasonalClimate>();
        if climate.map_model().is_some() && climate.is_ready() {
            app.update();
            return;
        }
        std::thread::sleep(Duration::from_millis(5));
    }
    panic!("the map climate did not become ready");
}

#[test]
fn map_climate_is_built_in_the_background_and_observers_read_it() {
    let planet = planet(BRINDLE);
    let mut app = app(BRINDLE, settings_at(0.0, 0.0), 500.0, FRAME);
    // Few places first: each asks the map model directly.
    let interior = insola::Place::from_degrees(45.0, 30.0).unwrap();
    let ocean = insola::Place::from_degrees(45.0, -150.0).unwrap();
    let few: Vec<Entity> = [interior, ocean]
        .iter()
        .map(|p| app.world_mut().spawn(SurfacePlace::from_place(*p)).id())
        .collect();
    app.insert_resource(one_continent());
    wait_for_map(&mut app);
    let climate = app.world().resource::<SeasonalClimate>();
    assert!(climate.map_error().is_none());
    let map = climate.map_model().unwrap();
    // The continent's interior swings through the seasons several times as far as the ocean at
    // its latitude (the published continentality of seasonal EBMs with land; common practice
    // for a 60 m ocean against a thin land layer, no source for the factor).
    let range = |p: insola::Place| {
        let lo = map.annual_min_c(p.latitude_rad, p.longitude_rad).unwrap();
        let hi = map.annual_max_c(p.latitude_rad, p.longitude_rad).unwrap();
        hi - lo
    };
    assert!(
        range(interior) > 2.0 * range(ocean),
        "{} vs {}",
        range(interior),
        range(ocean)
    );
    let t = app.world().resource::<WorldClock>().world_time_s();
    for _ in 0..3 {
        app.update();
    }
    let t_obs = app
        .world()
        .resource::<bevy_insola::ObserverInstant>()
        .world_time_s
        .unwrap();
    assert!(t_obs >= t);
    let climate = app.world().resource::<SeasonalClimate>();
    for (id, place) in few.iter().zip([interior, ocean]) {
        let c = *app.world().get::<LocalConditions>(*id).unwrap();
        let want = climate.local_temperature_c(&planet, place, t_obs).unwrap();
        assert_approx_eq!(f64::from(c.temperature_c), want, 1e-3);
    }

    // Many places: the shared table laid out by latitude and longitude agrees with the direct
    // queries to a fraction of a kelvin away from the coast.
    let n = bevy_insola::TABLE_MIN_PLACES * 2;
    let places: Vec<insola::Place> = (0..n)
        .map(|i| {
            let lat = -60.0 + 120.0 * ((i * 37) % n) as f64 / n as f64;
            insola::Place::from_degrees(lat, 10.0 + 40.0 * (i % 3) as f64).unwrap()
        })
        .collect();
    let ids: Vec<Entity> = places
        .iter()
        .map(|p| app.world_mut().spawn(SurfacePlace::from_place(*p)).id())
        .collect();
    // Let the cadence pick them up (every place is updated on the next due update).
    for _ in 0..3 {
        app.update();
    }
    let t_obs = app
        .world()
        .resource::<bevy_insola::ObserverInstant>()
        .world_time_s
        .unwrap();
    let climate = app.world().resource::<SeasonalClimate>();
    let mut errors: Vec<f64> = ids
        .iter()
        .zip(&places)
        .map(|(id, p)| {
            let c = *app.world().get::<LocalConditions>(*id).unwrap();
            let want = climate.local_temperature_c(&planet, *p, t_obs).unwrap();
            (f64::from(c.temperature_c) - want).abs()
        })
        .collect();
    errors.sort_by(f64::total_cmp);
    let p95 = errors[errors.len() * 95 / 100];
    assert!(p95 < 0.5, "95th percentile of map table vs direct: {p95} K");

    // Without the surface, the zonal climate answers again.
    app.world_mut().remove_resource::<ClimateSurface>();
    app.update();
    let climate = app.world().resource::<SeasonalClimate>();
    assert!(climate.map_model().is_none());
    let zonal = climate.model().unwrap();
    let t = app.world().resource::<WorldClock>().world_time_s();
    let h = planet.star_position(t, interior).hour_angle_rad;
    assert_approx_eq!(
        climate.local_temperature_c(&planet, interior, t).unwrap(),
        zonal.temperature_c(interior.latitude_rad, zonal.year_fraction(t), h),
        1e-9
    );
}

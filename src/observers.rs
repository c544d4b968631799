//! Observers at scale: many places on the planet, each with its own star altitude,
//! insolation, temperature and season.
//!
//! Give an entity a [`SurfacePlace`] (latitude and longitude) and it gets [`LocalConditions`],
//! updated in [`InsolaSystems::UpdateObservers`](crate::InsolaSystems) at the cadence of
//! [`InsolaSettings::observer_interval`]; [`ObserverInstant`] says which world time they
//! describe. The maths is the core's: the star's single-precision frame
//! ([`insola::StarFrameF32`], eclipses included) and the climate's turned table
//! ([`insola::climate::PlaceTable`]); this file keeps the components, the cadence and the walk
//! over the component columns, run in parallel, so a million places stay cheap.
//!
//! Both components are kept small (28 and 16 bytes) because at a million places the update is
//! bound by memory traffic and latency: a place is stored as the single-precision sines and
//! cosines of its latitude and longitude (about 0.3 m on an Earth-sized planet) and where it
//! reads the temperature table, and the star's altitude is kept as its sine (the angle is
//! [`LocalConditions::star_altitude_rad`]). Altitudes agree with the core to about 1e-6 rad,
//! and to 0.05° within a degree of the zenith; an observer at the reference place sees the
//! [`SkyState`](crate::SkyState)'s star, insolation and eclipse to single precision.
//!
//! Temperatures: with fewer than [`TABLE_MIN_PLACES`] observers each place asks the climate
//! model directly; with more, they share a [`ClimateSnapshot`] that is rebuilt when the time of
//! year has moved by [`TABLE_REFRESH_YEAR_FRACTION`], turned each update to the star's hour
//! angle (so the day-night swing is current) and read bilinearly. Places whose position
//! changed are updated on every frame in between. With a map climate
//! ([`ClimateSurface`](crate::ClimateSurface)) the table is laid out by latitude and longitude
//! from the map model at each update instead ([`MapClimate::place_table`]); a place's cost is
//! the same.

use std::sync::Arc;

use bevy::prelude::*;
use insola::climate::{
    ClimateSnapshot, PlaceCell, PlaceTable, season_key_is_south, season_key_row,
};
use insola::error::QueryError;
use insola::map_climate::MapClimate;
use insola::{Place, PlaceF32, Planet, StarFrameF32, WorldClimate};

use crate::climate::SeasonalClimate;
use crate::clock::WorldClock;
use crate::season::{SeasonOfYear, ThermalSeason};
use crate::settings::{InsolaSettings, ObserverInterval};
use crate::world_asset::ActiveWorld;

/// From this many observers on, temperatures come from a shared [`ClimateSnapshot`] instead of
/// one climate query per place (a table costs about as much as this many direct queries).
pub const TABLE_MIN_PLACES: usize = 256;

/// The shared temperature table is rebuilt when the time of year has moved by this fraction of
/// a year (about a third of a day in a 365-day year; a seasonal swing of 30 K then moves by at
/// most 0.1 K between rebuilds).
pub const TABLE_REFRESH_YEAR_FRACTION: f64 = 1e-3;

/// A place on the planet: latitude and longitude, kept as the core's single-precision
/// [`PlaceF32`] and the place's [`PlaceCell`] in the observers' temperature table (reflected
/// as an opaque value).
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::SurfacePlace;
/// fn spawn_villages(mut commands: Commands) {
///     for (lat, lon) in [(12.0, 40.0), (-33.5, 151.0)] {
///         commands.spawn(SurfacePlace::from_degrees(lat, lon).unwrap());
///     }
/// }
/// # App::new().add_systems(Startup, spawn_villages).update();
/// ```
#[derive(Component, Debug, Clone, Copy, PartialEq, Reflect)]
#[reflect(opaque)]
#[reflect(Component, Debug, Default, Clone, PartialEq)]
#[require(LocalConditions)]
pub struct SurfacePlace {
    place: PlaceF32,
    cell: PlaceCell,
}

impl Default for SurfacePlace {
    /// Latitude 0, longitude 0.
    fn default() -> Self {
        SurfacePlace::from_place(Place::normalised(0.0, 0.0))
    }
}

impl SurfacePlace {
    /// A place from degrees: latitude −90…90 (positive toward the north pole), east longitude
    /// −360…360 ([`Place::from_degrees`]).
    pub fn from_degrees(latitude_deg: f64, longitude_deg: f64) -> Result<SurfacePlace, QueryError> {
        Ok(SurfacePlace::from_place(Place::from_degrees(
            latitude_deg,
            longitude_deg,
        )?))
    }

    /// A place from the core's [`Place`], normalised by the core's rule ([`Place::normalise`]:
    /// latitude clamped to ±π/2, longitude wrapped to −π…π, a non-finite coordinate as 0).
    pub fn from_place(place: Place) -> SurfacePlace {
        SurfacePlace {
            place: PlaceF32::new(place),
            cell: PlaceCell::new(place),
        }
    }

    /// The place as the core's [`Place`].
    pub fn place(&self) -> Place {
        self.place.place()
    }

    /// Latitude, radians.
    pub fn latitude_rad(&self) -> f64 {
        self.place.latitude_rad()
    }

    /// East longitude, radians, −π…π.
    pub fn longitude_rad(&self) -> f64 {
        self.place.longitude_rad()
    }
}

/// What an observer at a [`SurfacePlace`] has, as of the world time in [`ObserverInstant`].
/// Laid out in field order (16 bytes).
#[derive(Component, Debug, Clone, Copy, PartialEq, Default, Reflect)]
#[reflect(Component, Debug, Default, Clone)]
#[repr(C)]
pub struct LocalConditions {
    /// Sine of the geometric altitude of the star's centre (−1 to 1).
    pub sin_star_altitude: f32,
    /// Top-of-atmosphere insolation on a horizontal surface, W m⁻², with the star's eclipse
    /// applied (as [`SkyState::toa_insolation_w_m2`](crate::SkyState)).
    pub toa_insolation_w_m2: f32,
    /// Surface air temperature, °C (zonal seasonal mean plus the day-night swing; `NaN` until
    /// the climate is ready).
    pub temperature_c: f32,
    /// `true` while the star is up (above the standard rise altitude).
    pub star_is_up: bool,
    /// The astronomical season in the place's hemisphere.
    pub season: SeasonOfYear,
    /// The season by the local temperature cycle (from the climate model).
    pub thermal_season: ThermalSeason,
}

impl LocalConditions {
    /// Geometric altitude of the star's centre, radians (−π/2 to π/2).
    #[inline]
    pub fn star_altitude_rad(&self) -> f32 {
        self.sin_star_altitude.clamp(-1.0, 1.0).asin()
    }
}

/// The world time that every observer's [`LocalConditions`] describes (all places share one
/// instant per update), seconds since time zero; `None` before the first update.
#[derive(Resource, Debug, Clone, Copy, Default, PartialEq, Reflect)]
#[reflect(Resource, Debug, Default, Clone)]
pub struct ObserverInstant {
    /// World time of the last observer update, seconds since time zero.
    pub world_time_s: Option<f64>,
}

/// Where a frame's temperatures come from.
#[derive(Debug, Clone, Default)]
enum FrameClimate {
    /// No climate yet: temperatures are `NaN`.
    #[default]
    None,
    /// One climate query per place.
    Direct {
        model: Arc<WorldClimate>,
        year_fraction: f64,
    },
    /// A shared table turned to this instant (many places), and both seasons by
    /// [`PlaceCell::season_key`].
    Table(Box<PlaceTable>, Box<SeasonsByKey>),
    /// One map-climate query per place (the zonal climate gives the season).
    DirectMap {
        map: Arc<MapClimate>,
        zonal: Arc<WorldClimate>,
        year_fraction: f64,
        solar_day_s: f64,
    },
}

/// The astronomical and thermal season of a [`PlaceCell::season_key`], in the order
/// [`LocalConditions`] keeps them (so a place's pair is one two-byte copy).
#[derive(Debug, Clone, Copy, Default)]
#[repr(C)]
struct SeasonPair {
    season: SeasonOfYear,
    thermal_season: ThermalSeason,
}

/// Both seasons of every season key at one instant: 256 entries, so indexing by the one-byte
/// key needs no bounds test (keys from [`insola::climate::SEASON_KEYS`] on are never made).
type SeasonsByKey = [SeasonPair; 256];

/// One observer update: the core's star frame of the instant, the seasons of both
/// hemispheres and the climate source (built once per update).
#[derive(Debug, Clone, Default)]
pub struct ObserverFrame {
    star: StarFrameF32,
    season_north: SeasonOfYear,
    season_south: SeasonOfYear,
    climate: FrameClimate,
}

impl ObserverFrame {
    /// The frame of `planet` at `t_s`; temperatures are asked of `climate`'s model place by
    /// place (see [`ObserverFrame::with_table`] for many places).
    pub fn new(planet: &Planet, t_s: f64, climate: Option<&SeasonalClimate>) -> ObserverFrame {
        let mut frame = ObserverFrame::star_only(planet, t_s);
        let map = climate.and_then(SeasonalClimate::map_model_arc);
        if let Some(model) = climate.and_then(SeasonalClimate::model_arc) {
            let year_fraction = model.year_fraction(t_s);
            frame.climate = match map {
                Some(map) => FrameClimate::DirectMap {
                    map,
                    zonal: model,
                    year_fraction,
                    solar_day_s: planet.day_s(),
                },
                None => FrameClimate::Direct {
                    year_fraction,
                    model,
                },
            };
        }
        frame
    }

    /// The frame of `planet` at `t_s`, with temperatures from the map climate `map` laid on a
    /// shared latitude × longitude table for this instant ([`MapClimate::place_table`]); the
    /// seasons come from the zonal `snapshot`.
    pub fn with_map_table(
        planet: &Planet,
        t_s: f64,
        map: &MapClimate,
        year_fraction: f64,
        snapshot: &ClimateSnapshot,
    ) -> ObserverFrame {
        let mut frame = ObserverFrame::star_only(planet, t_s);
        let Some(seasons) = snapshot.seasons() else {
            return frame;
        };
        let star = &frame.star;
        let table = map.place_table(
            year_fraction,
            |lon| star.hour_angle_at_rad(lon),
            planet.day_s(),
            *seasons,
        );
        if let Ok(table) = table {
            frame.climate = frame.table_climate(table);
        }
        frame
    }

    /// The frame of `planet` at `t_s`, with temperatures from a shared table of the climate at
    /// this time of year (see [`WorldClimate::snapshot`]).
    pub fn with_table(planet: &Planet, t_s: f64, snapshot: &ClimateSnapshot) -> ObserverFrame {
        let mut frame = ObserverFrame::star_only(planet, t_s);
        if let Some(table) = PlaceTable::turned(
            snapshot,
            frame.star.hour_angle_0_rad(),
            frame.star.spin_sign(),
        ) {
            frame.climate = frame.table_climate(table);
        }
        frame
    }

    /// Temperatures from `table`, with each season key's pair of seasons for this instant.
    fn table_climate(&self, table: PlaceTable) -> FrameClimate {
        let seasons = std::array::from_fn(|key| SeasonPair {
            season: if season_key_is_south(key) {
                self.season_south
            } else {
                self.season_north
            },
            thermal_season: table.row_season(season_key_row(key)).into(),
        });
        FrameClimate::Table(Box::new(table), Box::new(seasons))
    }

    fn star_only(planet: &Planet, t_s: f64) -> ObserverFrame {
        let star = planet.star_frame(t_s);
        let ecliptic_longitude = star.instant().ecliptic_longitude_rad;
        ObserverFrame {
            star: star.to_f32(),
            season_north: SeasonOfYear::at(ecliptic_longitude, 1.0),
            season_south: SeasonOfYear::at(ecliptic_longitude, -1.0),
            climate: FrameClimate::None,
        }
    }

    /// World time of this frame, seconds since time zero.
    pub fn world_time_s(&self) -> f64 {
        self.star.t_s()
    }

    /// The core's star frame.
    pub fn star(&self) -> &StarFrameF32 {
        &self.star
    }

    /// The conditions at `place`.
    #[inline(always)]
    pub fn conditions(&self, place: &SurfacePlace) -> LocalConditions {
        let sky = self.star.at(&place.place);
        let (temperature_c, thermal_season) = self.climate_at(place);
        self.assemble(place, &sky, temperature_c, thermal_season)
    }

    /// A place's conditions from its sky and temperature (the hemisphere picks the season).
    #[inline(always)]
    fn assemble(
        &self,
        place: &SurfacePlace,
        sky: &insola::PlaceSkyF32,
        temperature_c: f32,
        thermal_season: ThermalSeason,
    ) -> LocalConditions {
        let season = if place.place.sin_lat < 0.0 {
            self.season_south
        } else {
            self.season_north
        };
        conditions_of(
            sky,
            temperature_c,
            SeasonPair {
                season,
                thermal_season,
            },
        )
    }

    /// The conditions of every place of `places` into `out` (pairs up to the shorter):
    /// [`ObserverFrame::conditions`] for each, with the common case (nothing can hide the
    /// star, temperatures from the shared table) decided once for the whole slice, so its loop
    /// has no branch per place.
    pub fn fill(&self, places: &[SurfacePlace], out: &mut [LocalConditions]) {
        match &self.climate {
            FrameClimate::Table(table, seasons) if self.star.is_clear() => {
                for (place, out) in places.iter().zip(out) {
                    let sky = self.star.at_clear(&place.place);
                    let seasons = seasons[usize::from(place.cell.season_key())];
                    *out = conditions_of(&sky, table.temperature_at(&place.cell), seasons);
                }
            }
            _ => {
                for (place, out) in places.iter().zip(out) {
                    *out = self.conditions(place);
                }
            }
        }
    }

    #[inline(always)]
    fn climate_at(&self, place: &SurfacePlace) -> (f32, ThermalSeason) {
        match &self.climate {
            FrameClimate::None => (f32::NAN, ThermalSeason::Unknown),
            FrameClimate::Table(table, seasons) => (
                table.temperature_at(&place.cell),
                seasons[usize::from(place.cell.season_key())].thermal_season,
            ),
            FrameClimate::Direct {
                model,
                year_fraction,
            } => {
                let lat = place.latitude_rad();
                let h = self.star.hour_angle_at_rad(place.longitude_rad());
                (
                    model.temperature_c(lat, *year_fraction, h) as f32,
                    model.season(lat, *year_fraction).into(),
                )
            }
            FrameClimate::DirectMap {
                map,
                zonal,
                year_fraction,
                solar_day_s,
            } => {
                let (lat, lon) = (place.latitude_rad(), place.longitude_rad());
                let h = self.star.hour_angle_at_rad(lon);
                let t = map.local_temperature_c(lat, lon, *year_fraction, h, *solar_day_s);
                (
                    t.map_or(f32::NAN, |t| t as f32),
                    zonal.season(lat, *year_fraction).into(),
                )
            }
        }
    }
}

/// The conditions of a place with sky `sky`, temperature `temperature_c` and `seasons`.
#[inline(always)]
fn conditions_of(
    sky: &insola::PlaceSkyF32,
    temperature_c: f32,
    seasons: SeasonPair,
) -> LocalConditions {
    LocalConditions {
        sin_star_altitude: sky.sin_altitude,
        toa_insolation_w_m2: sky.toa_insolation_w_m2,
        temperature_c,
        star_is_up: sky.is_up,
        season: seasons.season,
        thermal_season: seasons.thermal_season,
    }
}

/// When observers were last updated, and the shared temperature table.
#[derive(Default)]
pub(crate) struct ObserverCadence {
    last_real_s: Option<f64>,
    last_world_s: f64,
    generation: u64,
    /// Whether the zonal climate was ready, and which map climate was current (by address).
    climate_ready: (bool, Option<usize>),
    frame: ObserverFrame,
    /// The shared table, the climate model it came from and its year fraction.
    table: Option<(Arc<ClimateSnapshot>, Arc<WorldClimate>, f64)>,
}

impl ObserverCadence {
    /// The shared table for `model` at `year_fraction`, rebuilt if it belongs to another model
    /// or time of year.
    fn table(&mut self, model: Arc<WorldClimate>, year_fraction: f64) -> Arc<ClimateSnapshot> {
        let fresh = self.table.as_ref().is_some_and(|(_, m, f)| {
            let moved = (year_fraction - f).rem_euclid(1.0);
            Arc::ptr_eq(m, &model) && moved.min(1.0 - moved) < TABLE_REFRESH_YEAR_FRACTION
        });
        if !fresh {
            let table = Arc::new(model.snapshot(year_fraction));
            self.table = Some((table, model, year_fraction));
        }
        self.table
            .as_ref()
            .map(|(t, _, _)| t.clone())
            .unwrap_or_default()
    }
}

/// Updates [`LocalConditions`] of every [`SurfacePlace`] when due, and of moved places every
/// frame.
#[allow(
    clippy::too_many_arguments,
    reason = "a Bevy system's parameters are its data access"
)]
pub(crate) fn update_observers(
    world: Res<ActiveWorld>,
    clock: Res<WorldClock>,
    settings: Res<InsolaSettings>,
    climate: Option<Res<SeasonalClimate>>,
    real: Res<Time<Real>>,
    mut instant: ResMut<ObserverInstant>,
    mut cadence: Local<ObserverCadence>,
    mut observers: Query<(Ref<SurfacePlace>, &mut LocalConditions)>,
) {
    let Some(planet) = world.planet() else {
        return;
    };
    // Without the climate part, observers report the sky and no temperature.
    let climate = climate.as_deref();
    let map = climate.and_then(SeasonalClimate::map_model_arc);
    let climate_ready = (
        climate.is_some_and(SeasonalClimate::is_ready),
        map.as_ref().map(|m| Arc::as_ptr(m) as usize),
    );
    let now_real = real.elapsed_secs_f64();
    let now_world = clock.world_time_s();
    let forced = cadence.last_real_s.is_none()
        || cadence.generation != world.generation()
        || cadence.climate_ready != climate_ready
        || clock.jumped_this_frame();
    let due = forced
        || match settings.observer_interval {
            ObserverInterval::EveryFrame => true,
            ObserverInterval::RealSeconds(s) => {
                now_real - cadence.last_real_s.unwrap_or(0.0) >= s as f64
            }
            ObserverInterval::WorldSeconds(s) => (now_world - cadence.last_world_s).abs() >= s,
        };
    if due {
        // Counting stops at the threshold: a full count visits every entity.
        let many = observers.iter().take(TABLE_MIN_PLACES).count() == TABLE_MIN_PLACES;
        cadence.frame = match climate.and_then(SeasonalClimate::model_arc) {
            Some(model) if many && map.is_some() => {
                let year_fraction = model.year_fraction(now_world);
                let snapshot = cadence.table(model.clone(), year_fraction);
                let map = map.as_deref().expect("checked above");
                ObserverFrame::with_map_table(planet, now_world, map, year_fraction, &snapshot)
            }
            Some(model) if many => {
                let snapshot = cadence.table(model.clone(), model.year_fraction(now_world));
                ObserverFrame::with_table(planet, now_world, &snapshot)
            }
            _ => ObserverFrame::new(planet, now_world, climate),
        };
        cadence.last_real_s = Some(now_real);
        cadence.last_world_s = now_world;
        cadence.generation = world.generation();
        cadence.climate_ready = climate_ready;
        instant.world_time_s = Some(now_world);
    }
    let frame = &cadence.frame;
    if !due {
        // Only places that moved since the last run.
        observers
            .par_iter_mut()
            .for_each(|(place, mut conditions)| {
                if place.is_changed() {
                    *conditions = frame.conditions(&place);
                }
            });
        return;
    }
    // Every place: walk the component columns as slices (no per-entity bookkeeping), split
    // across the compute threads. A layout that is not dense falls back to entity iteration.
    match observers.contiguous_iter_mut() {
        Ok(columns) => {
            for (places, mut conditions) in columns {
                update_columns(frame, &places, &mut conditions);
            }
        }
        Err(_) => observers
            .par_iter_mut()
            .for_each(|(place, mut conditions)| *conditions = frame.conditions(&place)),
    }
}

/// Places per task when a column is split across threads.
const PLACES_PER_TASK: usize = 16_384;

/// Writes `conditions[i]` for `places[i]`, in parallel on the compute task pool if there is one.
fn update_columns(
    frame: &ObserverFrame,
    places: &[SurfacePlace],
    conditions: &mut [LocalConditions],
) {
    let fill = |places: &[SurfacePlace], conditions: &mut [LocalConditions]| {
        frame.fill(places, conditions);
    };
    let pool = bevy::tasks::ComputeTaskPool::try_get();
    match pool {
        Some(pool) if places.len() > PLACES_PER_TASK => {
            // One chunk per thread, the calling thread included.
            let chunk = places
                .len()
                .div_ceil(pool.thread_num() + 1)
                .max(PLACES_PER_TASK);
            pool.scope(|scope| {
                for (p, c) in places.chunks(chunk).zip(conditions.chunks_mut(chunk)) {
                    scope.spawn(async move { fill(p, c) });
                }
            });
        }
        _ => fill(places, conditions),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use insola::WorldSpec;

    #[test]
    fn places_wrap_longitude_and_keep_bad_numbers_out() {
        let p = SurfacePlace::from_place(Place {
            latitude_rad: 2.0,
            longitude_rad: 7.0,
        });
        assert!((p.latitude_rad() - std::f64::consts::FRAC_PI_2).abs() < 1e-6);
        assert!((p.longitude_rad() - (7.0 - std::f64::consts::TAU)).abs() < 1e-6);
        let bad = SurfacePlace::from_place(Place {
            latitude_rad: f64::NAN,
            longitude_rad: f64::INFINITY,
        });
        assert_eq!(bad, SurfacePlace::default());
        assert!(SurfacePlace::from_degrees(f64::NAN, 0.0).is_err());
    }

    #[test]
    fn filling_a_slice_gives_each_place_its_conditions() {
        let text = r#"(name: "Brindle", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.05, periapsis_longitude_deg: 40, period_days: 300),
            spin: (obliquity_deg: 130, solar_day_hours: 20))"#;
        let planet = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let snapshot = ClimateSnapshot::from_fn(
            |lat, h| 10.0 * lat.cos() + 3.0 * h.cos(),
            |lat| {
                if lat < 0.0 {
                    insola::climate::Season::Steady
                } else {
                    insola::climate::Season::Summer
                }
            },
        );
        let places: Vec<SurfacePlace> = (0..500)
            .map(|i| {
                SurfacePlace::from_degrees(
                    -89.5 + 0.358 * i as f64,
                    (7.3 * i as f64) % 360.0 - 180.0,
                )
                .unwrap()
            })
            .collect();
        for t in [0.0, 4.0e5, 9.1e6] {
            for frame in [
                ObserverFrame::with_table(&planet, t, &snapshot),
                ObserverFrame::new(&planet, t, None),
            ] {
                let mut out = vec![LocalConditions::default(); places.len()];
                frame.fill(&places, &mut out);
                for (p, c) in places.iter().zip(&out) {
                    let want = frame.conditions(p);
                    assert!(
                        c == &want || (c.temperature_c.is_nan() && want.temperature_c.is_nan()),
                        "{c:?} vs {want:?}"
                    );
                }
            }
        }
    }

    #[test]
    fn fast_path_matches_the_core() {
        let text = r#"(name: "Brindle", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.05, periapsis_longitude_deg: 40, period_days: 300),
            spin: (obliquity_deg: 130, solar_day_hours: 20))"#;
        let planet = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        for k in 0..40 {
            let t = k as f64 * 98_765.4;
            let frame = ObserverFrame::new(&planet, t, None);
            for (lat, lon) in [(0.0, 0.0), (45.0, 100.0), (-70.0, -30.0), (89.0, 200.0)] {
                let p = SurfacePlace::from_degrees(lat, lon).unwrap();
                let c = frame.conditions(&p);
                let s = planet.star_position(t, p.place());
                assert!((c.star_altitude_rad() as f64 - s.altitude_rad).abs() < 1e-5);
                assert!((c.toa_insolation_w_m2 as f64 - s.toa_insolation_w_m2).abs() < 1e-2);
            }
        }
    }
}

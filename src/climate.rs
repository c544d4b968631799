//! The seasonal climate: temperature by latitude, time of year and time of day, rebuilt in the
//! background whenever the world changes.
//!
//! [`SeasonalClimate`] holds the climate of the [`ActiveWorld`]. When the world changes, the new
//! climate is equilibrated on Bevy's async compute pool; until it is ready the previous one (if
//! any) keeps answering, so no frame stalls. Queries: [`SeasonalClimate::zonal_temperature_c`]
//! for any latitude and time, [`SeasonalClimate::local_temperature_c`] with the day-night
//! swing, and [`ClimateSnapshot`], a table of one instant that observers read with a few flops.
//!
//! The model is the core's seasonal energy-balance model ([`insola::climate`]), equilibrated
//! with [`Planet::equilibrate_climate`]. A climate that does not settle to a repeating year
//! (a world near an ice tipping point) uses the last year computed, with a warning; a world
//! whose climate cannot be built at all has no climate (logged, and readable through
//! [`SeasonalClimate::error`]), and temperature queries answer `None`.

use std::sync::Arc;

use bevy::prelude::*;
use bevy::tasks::{AsyncComputeTaskPool, Task, block_on, futures_lite::future};
use insola::climate::{ClimateCycle, ClimateError, Season};
use insola::{Place, Planet};

use crate::season::ThermalSeason;
use crate::world_asset::ActiveWorld;

/// Latitude rows of a [`ClimateSnapshot`] (every 2°, pole to pole).
pub const SNAPSHOT_LATITUDES: usize = 91;
/// Hour-angle columns of a [`ClimateSnapshot`] (every 3.75°, fine enough for the kink of the sunrise minimum, −180° to 180°).
pub const SNAPSHOT_HOUR_ANGLES: usize = 97;

/// A world's seasonal climate, ready for queries.
#[derive(Debug, Clone)]
pub struct ClimateModel {
    cycle: Box<ClimateCycle>,
    year_s: f64,
    day_s: f64,
}

impl ClimateModel {
    /// Equilibrates the climate of `planet` with the core's energy-balance model (milliseconds
    /// to tens of milliseconds; the plugin runs it in the background). A climate that does not
    /// settle uses its last computed year (logged).
    ///
    /// # Errors
    /// [`ClimateError::Spec`] if the world's climate section or forcing is unusable.
    pub fn build(planet: &Planet) -> Result<ClimateModel, ClimateError> {
        let cycle = match planet.equilibrate_climate() {
            Ok(cycle) => Box::new(cycle),
            Err(ClimateError::NotConverged { last, years, .. }) => {
                warn!(
                    "Insola: the climate of `{}` did not settle to a repeating year in {years} years; using the last year computed",
                    planet.spec().name
                );
                last
            }
            Err(error) => return Err(error),
        };
        let day_s = planet.day_s();
        Ok(ClimateModel {
            cycle,
            year_s: planet.year_s(),
            // A tidally locked world has no day-night cycle apart from the year.
            day_s: if day_s.is_finite() && day_s > 0.0 {
                day_s
            } else {
                planet.year_s()
            },
        })
    }

    /// The core's climate cycle: band statistics, ice edges, zones, summaries.
    pub fn cycle(&self) -> &ClimateCycle {
        &self.cycle
    }

    /// Fraction of the climate year at world time `t_s`, `[0, 1)` (years start at whole
    /// multiples of the orbital period, as on the calendar).
    pub fn year_fraction(&self, t_s: f64) -> f64 {
        (t_s / self.year_s).rem_euclid(1.0)
    }

    /// Zonal-mean surface temperature, °C, at latitude `lat_rad` and `year_fraction`.
    pub fn zonal_temperature_c(&self, lat_rad: f64, year_fraction: f64) -> f64 {
        self.cycle.temperature_c(lat_rad, year_fraction)
    }

    /// Local temperature, °C, at the reference elevation: zonal mean plus the day-night
    /// deviation at the star's local hour angle `hour_angle_rad` (0 at local noon, growing with
    /// time). `NaN` for a latitude outside ±π/2 or a non-finite input.
    pub fn temperature_c(&self, lat_rad: f64, year_fraction: f64, hour_angle_rad: f64) -> f64 {
        self.cycle
            .instant(year_fraction, self.day_s)
            .and_then(|i| i.temperature_c(lat_rad, hour_angle_rad, 0.0))
            .unwrap_or(f64::NAN)
    }

    /// The season, following the local temperature cycle, at `lat_rad` and `year_fraction`.
    pub fn season(&self, lat_rad: f64, year_fraction: f64) -> Season {
        self.cycle.season(lat_rad, year_fraction)
    }

    /// The table of one instant for fast per-place lookups.
    pub fn snapshot(&self, year_fraction: f64) -> ClimateSnapshot {
        let Ok(instant) = self.cycle.instant(year_fraction, self.day_s) else {
            return ClimateSnapshot::default();
        };
        let mut snapshot = ClimateSnapshot::from_fn(|lat, h| {
            instant.temperature_c(lat, h, 0.0).unwrap_or(f64::NAN)
        });
        for (i, season) in snapshot.seasons.iter_mut().enumerate() {
            *season = self
                .season(ClimateSnapshot::row_latitude(i), year_fraction)
                .into();
        }
        snapshot
    }
}

/// Temperatures of one instant on a latitude × hour-angle grid, for many places at once.
///
/// Rows run from the south pole to the north pole every 2°, columns over the star's local hour
/// angle from −180° to 180° every 3.75°; lookups are bilinear in single precision (the table is
/// 35 KB and stays in the second-level cache while a million places read it).
#[derive(Debug, Clone, PartialEq)]
pub struct ClimateSnapshot {
    /// Temperatures, °C, by row (latitude) and column (hour angle); `None` when empty. Fixed
    /// sizes let the per-place lookup go without bounds checks.
    rows: Option<Box<[[f32; SNAPSHOT_HOUR_ANGLES]; SNAPSHOT_LATITUDES]>>,
    seasons: [ThermalSeason; SNAPSHOT_LATITUDES],
}

impl Default for ClimateSnapshot {
    /// An empty snapshot: temperatures `NaN`, seasons unknown.
    fn default() -> Self {
        ClimateSnapshot {
            rows: None,
            seasons: [ThermalSeason::Unknown; SNAPSHOT_LATITUDES],
        }
    }
}

impl ClimateSnapshot {
    /// Latitude of table row `i`, radians.
    fn row_latitude(i: usize) -> f64 {
        -std::f64::consts::FRAC_PI_2
            + std::f64::consts::PI * i as f64 / (SNAPSHOT_LATITUDES - 1) as f64
    }

    /// A table of `temperature_c(latitude_rad, hour_angle_rad)` with unknown seasons.
    pub(crate) fn from_fn(temperature_c: impl Fn(f64, f64) -> f64) -> ClimateSnapshot {
        use std::f64::consts::{PI, TAU};
        let mut rows = Box::new([[f32::NAN; SNAPSHOT_HOUR_ANGLES]; SNAPSHOT_LATITUDES]);
        for (i, row) in rows.iter_mut().enumerate() {
            for (j, cell) in row.iter_mut().enumerate() {
                let h = -PI + TAU * j as f64 / (SNAPSHOT_HOUR_ANGLES - 1) as f64;
                *cell = temperature_c(Self::row_latitude(i), h) as f32;
            }
        }
        ClimateSnapshot {
            rows: Some(rows),
            ..ClimateSnapshot::default()
        }
    }

    /// The temperature rows, °C (latitude × hour angle), unless empty.
    pub(crate) fn rows(&self) -> Option<&[[f32; SNAPSHOT_HOUR_ANGLES]; SNAPSHOT_LATITUDES]> {
        self.rows.as_deref()
    }

    /// The season of each row.
    pub(crate) fn seasons(&self) -> &[ThermalSeason; SNAPSHOT_LATITUDES] {
        &self.seasons
    }

    /// The fractional table row of latitude `lat_rad`, `[0, SNAPSHOT_LATITUDES − 1]`.
    fn row(lat_rad: f64) -> f64 {
        ((lat_rad + std::f64::consts::FRAC_PI_2) / std::f64::consts::PI
            * (SNAPSHOT_LATITUDES - 1) as f64)
            .clamp(0.0, (SNAPSHOT_LATITUDES - 1) as f64)
    }

    /// The season by the temperature cycle at latitude `lat_rad` (nearest table row).
    pub fn season(&self, lat_rad: f64) -> ThermalSeason {
        self.seasons[(Self::row(lat_rad).round() as usize).min(SNAPSHOT_LATITUDES - 1)]
    }

    /// Temperature, °C, at latitude `lat_rad` and the star's local hour angle `hour_angle_rad`
    /// (bilinear in the table; `NaN` for an empty snapshot or a non-finite input).
    pub fn temperature_c(&self, lat_rad: f64, hour_angle_rad: f64) -> f32 {
        let Some(rows) = self.rows() else {
            return f32::NAN;
        };
        if !(lat_rad.is_finite() && hour_angle_rad.is_finite()) {
            return f32::NAN;
        }
        let row = Self::row(lat_rad);
        let column = (hour_angle_rad / std::f64::consts::TAU + 0.5).rem_euclid(1.0)
            * (SNAPSHOT_HOUR_ANGLES - 1) as f64;
        let i0 = (row as usize).min(SNAPSHOT_LATITUDES - 2);
        let j0 = (column as usize).min(SNAPSHOT_HOUR_ANGLES - 2);
        let (fu, fv) = ((row - i0 as f64) as f32, (column - j0 as f64) as f32);
        let (near, far) = (&rows[i0], &rows[i0 + 1]);
        let a = near[j0] + fv * (near[j0 + 1] - near[j0]);
        let b = far[j0] + fv * (far[j0 + 1] - far[j0]);
        a + fu * (b - a)
    }
}

/// The climate of the active world.
///
/// ```
/// use bevy::prelude::*;
/// use bevy_insola::{SeasonalClimate, SurfacePlace};
/// fn frost_warning(climate: Res<SeasonalClimate>, clock: Res<bevy_insola::WorldClock>, world: Res<bevy_insola::ActiveWorld>) {
///     let (Some(planet), true) = (world.planet(), climate.is_ready()) else { return };
///     let farm = SurfacePlace::from_degrees(52.0, 10.0).unwrap().place();
///     if climate.local_temperature_c(planet, farm, clock.world_time_s()).is_some_and(|t| t < 0.0) {
///         info!("frost on the farm");
///     }
/// }
/// ```
#[derive(Resource, Default)]
pub struct SeasonalClimate {
    model: Option<Arc<ClimateModel>>,
    generation: u64,
    task: Option<(u64, Task<Result<ClimateModel, ClimateError>>)>,
    /// Why the climate of world `generation` could not be built.
    error: Option<(u64, String)>,
}

impl SeasonalClimate {
    /// `true` once a climate is available (possibly still the previous world's while the new
    /// one is computed; see [`SeasonalClimate::is_current`]).
    pub fn is_ready(&self) -> bool {
        self.model.is_some()
    }

    /// `true` if the climate belongs to the world of `generation` ([`ActiveWorld::generation`]).
    pub fn is_current(&self, generation: u64) -> bool {
        self.model.is_some() && self.generation == generation
    }

    /// `true` while a new climate is being computed in the background.
    pub fn is_rebuilding(&self) -> bool {
        self.task.is_some()
    }

    /// The model, once ready.
    pub fn model(&self) -> Option<&ClimateModel> {
        self.model.as_deref()
    }

    /// The model, shared.
    pub(crate) fn model_arc(&self) -> Option<Arc<ClimateModel>> {
        self.model.clone()
    }

    /// Why the current world has no climate, if its model could not be built (the plugin also
    /// logs it as an error).
    pub fn error(&self) -> Option<&str> {
        self.error.as_ref().map(|(_, e)| e.as_str())
    }

    /// Installs a model computed elsewhere (for tests or tools), for world `generation`.
    pub fn set_model(&mut self, model: ClimateModel, generation: u64) {
        self.model = Some(Arc::new(model));
        self.generation = generation;
        self.task = None;
        self.error = None;
    }

    /// Installs the outcome of a build for world `generation`. A failed build leaves no
    /// climate: the previous world's would answer for the wrong planet.
    fn install(&mut self, built: Result<ClimateModel, ClimateError>, generation: u64, name: &str) {
        match built {
            Ok(model) => self.set_model(model, generation),
            Err(e) => {
                error!("Insola: no climate for `{name}`: {e}");
                self.model = None;
                self.task = None;
                self.generation = generation;
                self.error = Some((generation, e.to_string()));
            }
        }
    }

    /// Zonal-mean temperature, °C, at `lat_rad` and world time `t_s`.
    pub fn zonal_temperature_c(&self, lat_rad: f64, t_s: f64) -> Option<f64> {
        let m = self.model()?;
        Some(m.zonal_temperature_c(lat_rad, m.year_fraction(t_s)))
    }

    /// The season by the temperature cycle at `lat_rad` and world time `t_s`.
    pub fn season(&self, lat_rad: f64, t_s: f64) -> Option<ThermalSeason> {
        let m = self.model()?;
        Some(m.season(lat_rad, m.year_fraction(t_s)).into())
    }

    /// Local temperature, °C, at `place` and world time `t_s`, with the day-night swing.
    pub fn local_temperature_c(&self, planet: &Planet, place: Place, t_s: f64) -> Option<f64> {
        let m = self.model()?;
        let h = planet.star_position(t_s, place).hour_angle_rad;
        Some(m.temperature_c(place.latitude_rad, m.year_fraction(t_s), h))
    }
}

/// Starts a background rebuild when the world changes and installs it when done.
pub(crate) fn update_climate(world: Res<ActiveWorld>, mut climate: ResMut<SeasonalClimate>) {
    let generation = world.generation();
    let Some(planet) = world.planet_arc() else {
        return;
    };
    if let Some((task_generation, task)) = climate.task.as_mut()
        && let Some(built) = block_on(future::poll_once(task))
    {
        let g = *task_generation;
        climate.task = None;
        if g == generation {
            climate.install(built, g, &planet.spec().name);
        }
    }
    let up_to_date =
        climate.generation == generation && (climate.model.is_some() || climate.error.is_some());
    let building = climate.task.as_ref().is_some_and(|(g, _)| *g == generation);
    if up_to_date || building {
        return;
    }
    match AsyncComputeTaskPool::try_get() {
        Some(pool) => {
            let for_task = planet.clone();
            climate.task = Some((
                generation,
                pool.spawn(async move { ClimateModel::build(&for_task) }),
            ))
        }
        // No task pools (an app without `TaskPoolPlugin`): compute in place.
        None => climate.install(
            ClimateModel::build(&planet),
            generation,
            &planet.spec().name,
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use insola::WorldSpec;

    fn planet() -> Planet {
        let text = r#"(name: "Brindle", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.01, periapsis_longitude_deg: 0, period_days: 360),
            spin: (obliquity_deg: 25, solar_day_hours: 24))"#;
        Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
    }

    #[test]
    fn warm_equator_cold_poles_and_seasons_in_phase() {
        let m = ClimateModel::build(&planet()).unwrap();
        let eq = m.zonal_temperature_c(0.0, 0.3);
        let pole = m.zonal_temperature_c(1.5, 0.3);
        assert!(eq > pole + 20.0, "{eq} {pole}");
        // Northern summer (after the northern solstice at 0.25) is warmer than northern winter.
        let lat = 50f64.to_radians();
        assert!(m.zonal_temperature_c(lat, 0.35) > m.zonal_temperature_c(lat, 0.85));
        // Afternoon warmer than before dawn.
        assert!(m.temperature_c(lat, 0.35, 0.5) > m.temperature_c(lat, 0.35, -2.5));
        // The snapshot agrees with direct queries to within its interpolation error.
        let snap = m.snapshot(0.35);
        let direct = m.temperature_c(lat, 0.35, 0.3);
        assert!((snap.temperature_c(lat, 0.3) as f64 - direct).abs() < 0.5);
    }
}

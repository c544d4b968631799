//! The seasonal climate: temperature by latitude, time of year and time of day, rebuilt in the
//! background whenever the world changes.
//!
//! [`SeasonalClimate`] holds the climate of the [`ActiveWorld`]. When the world changes, the new
//! climate is equilibrated on Bevy's async compute pool; until it is ready the previous one (if
//! any) keeps answering, so no frame stalls. Queries: [`SeasonalClimate::zonal_temperature_c`]
//! for any latitude and time, [`SeasonalClimate::local_temperature_c`] with the day-night
//! swing; the model itself is the core's [`WorldClimate`], whose
//! [`WorldClimate::snapshot`] is the table observers read with a few flops.
//!
//! The model is the core's seasonal energy-balance model ([`insola::climate`]), equilibrated
//! with [`Planet::equilibrate_climate`]; this file only keeps it current in the background. A climate that does not settle to a repeating year
//! (a world near an ice tipping point) uses the last year computed, with a warning; a world
//! whose climate cannot be built at all has no climate (logged, and readable through
//! [`SeasonalClimate::error`]), and temperature queries answer `None`.

use std::sync::Arc;

use bevy::prelude::*;
use bevy::tasks::{AsyncComputeTaskPool, Task, block_on, futures_lite::future};
use insola::climate::ClimateError;
use insola::map_climate::MapClimate;
use insola::{Place, Planet, WorldClimate};

use crate::map_climate::{ClimateSurface, MapClimateSlot, MapKey};
use crate::season::ThermalSeason;
use crate::world_asset::ActiveWorld;

/// Equilibrates the climate of `planet` with the core's energy-balance model (milliseconds to
/// tens of milliseconds; the plugin runs it in the background). A climate that does not settle
/// uses its last computed year (logged).
fn build_climate(planet: &Planet) -> Result<WorldClimate, ClimateError> {
    match planet.equilibrate_climate() {
        Ok(cycle) => Ok(WorldClimate::from_cycle(planet, cycle)),
        Err(ClimateError::NotConverged { last, years, .. }) => {
            warn!(
                "Insola: the climate of `{}` did not settle to a repeating year in {years} years; using the last year computed",
                planet.spec().name
            );
            Ok(WorldClimate::from_cycle(planet, *last))
        }
        Err(error) => Err(error),
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
    model: Option<Arc<WorldClimate>>,
    generation: u64,
    task: Option<(u64, Task<Result<WorldClimate, ClimateError>>)>,
    /// Why the climate of world `generation` could not be built.
    error: Option<(u64, String)>,
    /// The map climate, when a [`ClimateSurface`] is given.
    map: MapClimateSlot,
    /// The world and surface the map climate must belong to (`None`: no surface).
    map_key: Option<MapKey>,
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

    /// The map climate of the current world and [`ClimateSurface`], once ready (`None`
    /// without a surface, while it is computed, or if it could not be built).
    pub fn map_model(&self) -> Option<&MapClimate> {
        self.map.current(self.map_key).map(|m| m.as_ref())
    }

    /// The map climate, shared.
    pub(crate) fn map_model_arc(&self) -> Option<Arc<MapClimate>> {
        self.map.current(self.map_key).cloned()
    }

    /// `true` while the map climate is computed in the background.
    pub fn is_map_rebuilding(&self) -> bool {
        self.map.is_rebuilding()
    }

    /// Why the map climate of the current world and surface could not be built (the zonal
    /// climate answers meanwhile; the plugin also logs it).
    pub fn map_error(&self) -> Option<&str> {
        self.map.error(self.map_key)
    }

    /// The model, once ready.
    pub fn model(&self) -> Option<&WorldClimate> {
        self.model.as_deref()
    }

    /// The model, shared.
    pub(crate) fn model_arc(&self) -> Option<Arc<WorldClimate>> {
        self.model.clone()
    }

    /// Why the current world has no climate, if its model could not be built (the plugin also
    /// logs it as an error).
    pub fn error(&self) -> Option<&str> {
        self.error.as_ref().map(|(_, e)| e.as_str())
    }

    /// Installs a model computed elsewhere (for tests or tools), for world `generation`.
    pub fn set_model(&mut self, model: WorldClimate, generation: u64) {
        self.model = Some(Arc::new(model));
        self.generation = generation;
        self.task = None;
        self.error = None;
    }

    /// Installs the outcome of a build for world `generation`. A failed build leaves no
    /// climate: the previous world's would answer for the wrong planet.
    fn install(&mut self, built: Result<WorldClimate, ClimateError>, generation: u64, name: &str) {
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

    /// Local temperature, °C, at `place` and world time `t_s`, with the day-night swing: from
    /// the map climate when one is ready ([`ClimateSurface`]), else from the zonal climate.
    pub fn local_temperature_c(&self, planet: &Planet, place: Place, t_s: f64) -> Option<f64> {
        let m = self.model()?;
        let h = planet.star_position(t_s, place).hour_angle_rad;
        let year_fraction = m.year_fraction(t_s);
        if let Some(map) = self.map_model() {
            return map
                .local_temperature_c(
                    place.latitude_rad,
                    place.longitude_rad,
                    year_fraction,
                    h,
                    planet.day_s(),
                )
                .ok();
        }
        Some(m.temperature_c(place.latitude_rad, year_fraction, h))
    }
}

/// Starts a background rebuild when the world (or the [`ClimateSurface`]) changes and installs
/// it when done.
pub(crate) fn update_climate(
    world: Res<ActiveWorld>,
    surface: Option<Res<ClimateSurface>>,
    mut climate: ResMut<SeasonalClimate>,
) {
    let generation = world.generation();
    let Some(planet) = world.planet_arc() else {
        return;
    };
    climate.map_key = surface
        .as_ref()
        .map(|s| (generation, s.last_changed().get()));
    match (&surface, climate.map_key) {
        (Some(surface), Some(key)) => climate.map.update(&planet, key, surface),
        _ => climate.map.clear(),
    }
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
                pool.spawn(async move { build_climate(&for_task) }),
            ))
        }
        // No task pools (an app without `TaskPoolPlugin`): compute in place.
        None => climate.install(build_climate(&planet), generation, &planet.spec().name),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use insola::WorldSpec;

    #[test]
    fn warm_equator_cold_poles_and_seasons_in_phase() {
        let text = r#"(name: "Brindle", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
            orbit: (semi_major_axis_au: 1, eccentricity: 0.01, periapsis_longitude_deg: 0, period_days: 360),
            spin: (obliquity_deg: 25, solar_day_hours: 24))"#;
        let planet = Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap();
        let m = build_climate(&planet).unwrap();
        let eq = m.zonal_temperature_c(0.0, 0.3);
        let pole = m.zonal_temperature_c(1.5, 0.3);
        assert!(eq > pole + 20.0, "{eq} {pole}");
        // Northern summer (after the northern solstice at 0.25) is warmer than northern winter.
        let lat = 50f64.to_radians();
        assert!(m.zonal_temperature_c(lat, 0.35) > m.zonal_temperature_c(lat, 0.85));
        // Afternoon warmer than before dawn.
        assert!(m.temperature_c(lat, 0.35, 0.5) > m.temperature_c(lat, 0.35, -2.5));
    }
}

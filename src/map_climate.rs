//! Climate on the designer's map: the core's two-dimensional model over land and sea, rebuilt
//! in the background when the world or the map changes.
//!
//! Insert a [`ClimateSurface`] (a land/sea [`SurfaceMap`] and the model grid) and the climate
//! part equilibrates [`insola::map_climate`]'s model on Bevy's async compute pool, as it does the
//! zonal model. Until the map climate is ready (and for a world whose map climate cannot be
//! built) the zonal climate keeps answering, so no frame stalls and no query goes dark. Once it
//! is ready, [`SeasonalClimate::local_temperature_c`] and every
//! [`SurfacePlace`](crate::SurfacePlace) observer read the map model: the interior of a
//! continent against its coast, a locked world's day side against its night side.
//!
//! The map model takes tens to hundreds of milliseconds (128 × 64 cells about 0.15 s on one
//! core of a small machine), so it is never built on the main thread when task pools exist.

use std::sync::Arc;

use bevy::prelude::*;
use bevy::tasks::{AsyncComputeTaskPool, Task, block_on, futures_lite::future};
use insola::Planet;
use insola::map_climate::{
    DEFAULT_MAP_GRID, MapClimate, MapClimateError, MapGrid, Resampling, SurfaceMap,
};

/// The land and sea the map climate is computed over, and its grid. Insert it (or change it)
/// to build the map climate; remove it to go back to the zonal climate.
///
/// ```
/// use bevy_insola::ClimateSurface;
/// use bevy_insola::insola::map_climate::{SurfaceKind, SurfaceMap};
/// // One continent between 20° W and 60° E, 50° S and 50° N, on an equirectangular raster.
/// let land = SurfaceMap::from_fn(144, 72, |lat, lon| {
///     if (-20.0..60.0).contains(&lon) && lat.abs() < 50.0 { SurfaceKind::Land } else { SurfaceKind::Sea }
/// }).unwrap();
/// let surface = ClimateSurface::new(land);
/// assert_eq!(surface.grid().columns(), 128);
/// ```
#[derive(Resource, Debug, Clone)]
pub struct ClimateSurface {
    surface: Arc<SurfaceMap>,
    grid: MapGrid,
    resampling: Resampling,
}

impl ClimateSurface {
    /// `surface` on the default grid ([`DEFAULT_MAP_GRID`]: 128 columns × 64 rows), resampled by
    /// area fraction.
    pub fn new(surface: SurfaceMap) -> ClimateSurface {
        let (columns, rows) = DEFAULT_MAP_GRID;
        ClimateSurface {
            surface: Arc::new(surface),
            grid: MapGrid::new(columns, rows).expect("the default grid is valid"),
            resampling: Resampling::AreaFraction,
        }
    }

    /// The same surface on another grid (`MapGrid::new` checks its size).
    pub fn with_grid(mut self, grid: MapGrid) -> ClimateSurface {
        self.grid = grid;
        self
    }

    /// The surface map.
    pub fn surface(&self) -> &SurfaceMap {
        &self.surface
    }

    /// The model grid.
    pub fn grid(&self) -> &MapGrid {
        &self.grid
    }
}

/// What a map climate was built from: the world's generation and the surface's change tick.
pub(crate) type MapKey = (u64, u32);

/// The map climate's state inside [`SeasonalClimate`](crate::SeasonalClimate).
#[derive(Default)]
pub(crate) struct MapClimateSlot {
    model: Option<(MapKey, Arc<MapClimate>)>,
    task: Option<(MapKey, Task<Result<MapClimate, MapClimateError>>)>,
    error: Option<(MapKey, String)>,
}

impl MapClimateSlot {
    /// The model if it belongs to the current world and surface.
    pub(crate) fn current(&self, key: Option<MapKey>) -> Option<&Arc<MapClimate>> {
        let key = key?;
        self.model
            .as_ref()
            .filter(|(k, _)| *k == key)
            .map(|(_, m)| m)
    }

    /// `true` while a map climate is being computed.
    pub(crate) fn is_rebuilding(&self) -> bool {
        self.task.is_some()
    }

    /// Why the map climate of the current world and surface could not be built.
    pub(crate) fn error(&self, key: Option<MapKey>) -> Option<&str> {
        let key = key?;
        self.error
            .as_ref()
            .filter(|(k, _)| *k == key)
            .map(|(_, e)| e.as_str())
    }

    fn install(&mut self, key: MapKey, built: Result<MapClimate, MapClimateError>, name: &str) {
        self.task = None;
        match built {
            Ok(model) => {
                if !model.converged() {
                    warn!(
                        "Insola: the map climate of `{name}` did not settle to a repeating year; using the last year computed"
                    );
                }
                self.model = Some((key, Arc::new(model)));
                self.error = None;
            }
            Err(e) => {
                error!("Insola: no map climate for `{name}` (the zonal climate answers): {e}");
                self.model = None;
                self.error = Some((key, e.to_string()));
            }
        }
    }

    /// Polls the running build, and starts one when the world or the surface changed.
    pub(crate) fn update(&mut self, planet: &Arc<Planet>, key: MapKey, surface: &ClimateSurface) {
        if let Some((task_key, task)) = self.task.as_mut()
            && let Some(built) = block_on(future::poll_once(task))
        {
            let k = *task_key;
            self.task = None;
            if k == key {
                self.install(k, built, &planet.spec().name);
            }
        }
        let done = self.model.as_ref().is_some_and(|(k, _)| *k == key)
            || self.error.as_ref().is_some_and(|(k, _)| *k == key);
        let building = self.task.as_ref().is_some_and(|(k, _)| *k == key);
        if done || building {
            return;
        }
        let build = {
            let (planet, surface) = (planet.clone(), surface.clone());
            move || {
                planet.equilibrate_map_climate(&surface.surface, &surface.grid, surface.resampling)
            }
        };
        match AsyncComputeTaskPool::try_get() {
            Some(pool) => self.task = Some((key, pool.spawn(async move { build() }))),
            None => self.install(key, build(), &planet.spec().name),
        }
    }

    /// Forgets the map climate (the surface was removed).
    pub(crate) fn clear(&mut self) {
        *self = MapClimateSlot::default();
    }
}

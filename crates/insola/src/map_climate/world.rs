//! The map climate of a [`Planet`]: its climate parameters, its orbit and spin, a surface map.

use super::cycle::MapClimate;
use super::equilibrium::{MapStart, equilibrate_map};
use super::error::MapClimateError;
use super::forcing::MapForcing;
use super::grid::MapGrid;
use super::model::MapEnergyBalanceModel;
use super::resample::Resampling;
use super::surface::SurfaceMap;
use crate::Planet;

/// Default model grid: 128 columns of longitude by 64 rows of latitude.
pub const DEFAULT_MAP_GRID: (usize, usize) = (128, 64);

impl Planet {
    /// The map model of this planet over `surface` (resampled to `grid` by `how`), set up but
    /// not run: the world's `climate` parameters (or the defaults) with the land taken from the
    /// surface, sunlight from its orbit and spin (daily mean, instantaneous or locked; see
    /// [`MapForcing::from_planet`]).
    pub fn map_climate_model(
        &self,
        surface: &SurfaceMap,
        grid: &MapGrid,
        how: Resampling,
    ) -> Result<MapEnergyBalanceModel, MapClimateError> {
        let spec = self.climate_spec();
        let forcing = MapForcing::from_planet(self, grid, spec.steps_per_year)?;
        MapEnergyBalanceModel::new(&spec, grid, surface.resample(grid, how), forcing)
    }

    /// The periodic map climate of this planet over `surface` on `grid` (see
    /// [`Planet::map_climate_model`]); tens to hundreds of milliseconds on one core.
    pub fn equilibrate_map_climate(
        &self,
        surface: &SurfaceMap,
        grid: &MapGrid,
        how: Resampling,
    ) -> Result<MapClimate, MapClimateError> {
        let model = self.map_climate_model(surface, grid, how)?;
        equilibrate_map(&model, &MapStart::SteadyAnnualMean)
    }
}

//! The climate set-up every command shares: one equilibrium per world, with the same warning
//! when the climate never settles.

use insola::Planet;
use insola::climate::{ClimateCycle, ClimateError};

/// Equilibrates, turning "not converged" into the last year plus a warning on stderr.
pub fn cycle_of(p: &Planet) -> Result<ClimateCycle, String> {
    match p.equilibrate_climate() {
        Ok(c) => Ok(c),
        Err(ClimateError::NotConverged {
            years,
            residual_k,
            last,
            ..
        }) => {
            eprintln!(
                "insola: warning: {}: the climate did not settle into a repeating year after {years} model years (last change {residual_k:.3} K); showing the last year. The world may sit near an ice tipping point; try a larger climate.max_years.",
                p.spec().name
            );
            Ok(*last)
        }
        Err(e) => Err(e.to_string()),
    }
}

/// The map model's periodic year over `surface` on `grid`, with the same warning as
/// [`cycle_of`] when it does not settle.
pub fn map_cycle_of(
    p: &Planet,
    surface: &insola::map_climate::SurfaceMap,
    grid: &insola::map_climate::MapGrid,
) -> Result<insola::map_climate::MapClimate, String> {
    use insola::map_climate::{MapClimateError, Resampling};
    match p.equilibrate_map_climate(surface, grid, Resampling::AreaFraction) {
        Ok(c) => Ok(c),
        Err(MapClimateError::NotConverged {
            years,
            residual_k,
            last,
            ..
        }) => {
            eprintln!(
                "insola: warning: {}: the map climate did not settle into a repeating year after {years} model years (last change {residual_k:.3} K); showing the last year.",
                p.spec().name
            );
            Ok(*last)
        }
        Err(e) => Err(e.to_string()),
    }
}

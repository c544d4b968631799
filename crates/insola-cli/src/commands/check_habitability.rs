//! The habitability warnings of `insola check`: computed from the map climate's zones and
//! findings ([`MapClimate::habitability_findings`]), each with what it is computed from, in
//! place of a bare threshold on the tilt.
//!
//! With `--land FILE` the model runs over the designer's land; without it over a planet-wide
//! sea, where the growing-season finding (about land) is left out. A fast rotator over a
//! uniform sea has no east–west structure, so 4 columns suffice; slow rotators and locked
//! worlds get 64.

use insola::Planet;
use insola::map_climate::{
    HabitabilityFinding, MapClimate, MapGrid, SLOW_DAY_STEPS, SurfaceKind, SurfaceMap, ZoneOptions,
};
use serde::Serialize;

/// One habitability warning.
#[derive(Debug, Serialize)]
pub struct Habitability {
    /// The warning in words.
    pub message: String,
    /// What it is computed from.
    pub basis: String,
    /// The finding with its numbers.
    pub finding: HabitabilityFinding,
}

/// The map climate's findings for `p` over `land` (a PNG mask or RON layout) or a planet-wide
/// sea, with the surface in words.
pub fn findings(
    p: &Planet,
    land: Option<&str>,
    grid: &str,
) -> Result<(Vec<Habitability>, String), String> {
    let (surface, surface_name, grid) = match land {
        Some(path) => {
            let l = super::land::load(path)?;
            (l.map, l.name, super::land::parse_grid(grid)?)
        }
        None => {
            let spec = p.climate_spec();
            let step_s = p.year_s() / spec.steps_per_year as f64;
            let daily_mean = !p.spin().is_tidally_locked() && p.day_s() < SLOW_DAY_STEPS * step_s;
            let columns = if daily_mean { 4 } else { 64 };
            let grid = MapGrid::new(columns, 64).map_err(|e| e.to_string())?;
            (
                SurfaceMap::uniform(SurfaceKind::Sea),
                "all sea".to_string(),
                grid,
            )
        }
    };
    let c: MapClimate = crate::climate_setup::map_cycle_of(p, &surface, &grid)?;
    let found = c
        .habitability_findings(&ZoneOptions::default())
        .map_err(|e| e.to_string())?;
    let from = format!(
        "map climate over {surface_name}, {} × {} cells",
        grid.columns(),
        grid.row_count()
    );
    let out = found
        .into_iter()
        .filter(|f| land.is_some() || !matches!(f, HabitabilityFinding::ShortGrowingSeason { .. }))
        .map(|f| Habitability {
            message: f.message(),
            basis: format!("{}; {from}", f.basis()),
            finding: f,
        })
        .collect();
    Ok((out, from))
}

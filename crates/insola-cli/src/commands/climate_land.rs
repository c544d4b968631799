//! `insola climate WORLD --land FILE`: land and sea apart, from the map climate over the
//! designer's land (`insola::map_climate`, [`MapClimate::land_sea_summary`]).

use insola::Planet;
use insola::map_climate::{AreaSummary, MapClimate};
use serde::Serialize;

/// Land and sea of the map climate.
#[derive(Debug, Serialize)]
pub struct LandSeaReport {
    /// The land file's name.
    pub surface: String,
    /// Model grid, columns and rows.
    pub grid: [usize; 2],
    /// Area-weighted global annual mean of the map model, °C.
    pub global_mean_c: f64,
    /// Cells weighted by their land fraction.
    pub land: AreaSummary,
    /// Cells weighted by their sea fraction.
    pub sea: AreaSummary,
    /// Model years run.
    pub years_to_equilibrium: u32,
    /// Whether the map model's year repeated within the tolerance.
    pub converged: bool,
}

/// Runs the map model over `land_path` on `grid` (`COLUMNSxROWS`).
pub fn report(p: &Planet, land_path: &str, grid: &str) -> Result<LandSeaReport, String> {
    let land = super::land::load(land_path)?;
    let grid = super::land::parse_grid(grid)?;
    let c: MapClimate = crate::climate_setup::map_cycle_of(p, &land.map, &grid)?;
    let s = c.land_sea_summary();
    Ok(LandSeaReport {
        surface: land.name,
        grid: [grid.columns(), grid.row_count()],
        global_mean_c: c.global_mean_c(),
        land: s.land,
        sea: s.sea,
        years_to_equilibrium: c.years_to_equilibrium(),
        converged: c.converged(),
    })
}

/// Prints the report as a small table.
pub fn print(r: &LandSeaReport) {
    say!(
        "  land and sea (map model over {}, {} × {} cells, global mean {:.1} °C{}):",
        r.surface,
        r.grid[0],
        r.grid[1],
        r.global_mean_c,
        if r.converged { "" } else { ", NOT settled" }
    );
    say!(
        "  {:<5} {:>6} {:>7} {:>9} {:>9} {:>8} {:>8} {:>9}",
        "",
        "area %",
        "mean °C",
        "mean min",
        "mean max",
        "coldest",
        "warmest",
        "range K"
    );
    for (name, a) in [("land", &r.land), ("sea", &r.sea)] {
        if a.area_fraction <= 0.0 {
            say!("  {name:<5} {:>6.1}  (none)", 0.0);
            continue;
        }
        say!(
            "  {name:<5} {:>6.1} {:>7.1} {:>9.1} {:>9.1} {:>8.1} {:>8.1} {:>9.1}",
            100.0 * a.area_fraction,
            a.mean_c,
            a.mean_min_c,
            a.mean_max_c,
            a.coldest_c,
            a.warmest_c,
            a.largest_range_k
        );
    }
    say!(
        "  (mean min/max: area means of each cell's coldest and warmest step; coldest/warmest and range: cells mostly land or mostly sea)"
    );
}

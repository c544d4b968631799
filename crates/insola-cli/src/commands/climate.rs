//! `insola climate WORLD [--json] [--all-bands] [--sweep-obliquity FROM:TO:STEP]`: the periodic
//! seasonal climate of a world from the energy balance model.
//!
//! A climate that does not settle within the world's `climate.max_years` is not an error: the
//! last year run is reported with `converged: false`, and a warning naming the remaining
//! year-to-year change goes to standard error. Exit status stays 0 so scripts still get numbers;
//! they should check `converged`.

use std::io::IsTerminal;

use insola::Planet;
use insola::climate::{ClimateCycle, describe};
use serde::Serialize;

/// Arguments of `insola climate`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// A `*.world.ron` file or the name of a built-in world.
    world: String,
    /// Print JSON instead of text.
    #[arg(long)]
    json: bool,
    /// Show every latitude band in the text table (default: about 18 rows).
    #[arg(long)]
    all_bands: bool,
    /// Instead of one climate, sweep the tilt: `FROM:TO:STEP` in degrees (e.g. `0:90:10`),
    /// printing the global mean and ice edges for each tilt.
    #[arg(long, value_name = "FROM:TO:STEP", conflicts_with = "land")]
    sweep_obliquity: Option<String>,
    /// Also run the map climate over this land file (a PNG mask, dark pixels land, or a RON
    /// layout of shapes) and print land and sea apart. Default: the land file the world file
    /// names (`climate: (land: "…")`), if any.
    #[arg(long, value_name = "FILE")]
    land: Option<String>,
    /// With --land: the map model's grid, COLUMNSxROWS.
    #[arg(long, default_value = "128x64", value_name = "COLUMNSxROWS")]
    grid: String,
}

/// One latitude band over the year.
#[derive(Debug, Serialize)]
pub struct BandReport {
    /// Band centre latitude, degrees.
    pub lat_deg: f64,
    /// Annual mean temperature, °C.
    pub mean_c: f64,
    /// Coldest temperature of the year, °C.
    pub min_c: f64,
    /// Warmest temperature of the year, °C.
    pub max_c: f64,
    /// Fraction of the year the band is ice covered, 0–1.
    pub ice_fraction: f64,
    /// Warm seasons a year: 0 (no seasons), 1 or 2.
    pub summers_per_year: u32,
    /// Plain-words summary for designers.
    pub summary: String,
}

/// Ice-edge latitudes in degrees; null when a hemisphere is all ice or ice-free.
#[derive(Debug, Serialize)]
pub struct IceEdgeReport {
    /// Northern ice edge, degrees.
    pub north: Option<f64>,
    /// Southern ice edge, degrees.
    pub south: Option<f64>,
}

/// The climate of a world.
#[derive(Debug, Serialize)]
pub struct ClimateReport {
    /// World name.
    pub name: String,
    /// Tilt, degrees.
    pub obliquity_deg: f64,
    /// Bands south to north.
    pub bands: Vec<BandReport>,
    /// Area-weighted global annual mean, °C.
    pub global_mean_c: f64,
    /// Fraction of area × year under ice, 0–1.
    pub ice_area_fraction: f64,
    /// Ice edges from the annual-mean temperature.
    pub ice_edge_lat_deg: IceEdgeReport,
    /// Per hemisphere, the latitude of the band nearest the equator that is iced for any part
    /// of the year (the table's `ice%` above zero), degrees; null when the hemisphere never
    /// ices.
    pub seasonal_ice_reach_lat_deg: IceEdgeReport,
    /// Ice-free albedo law: `"sky"` (from the world's sky) or `"latitude"` (explicit
    /// `albedo_a0`/`albedo_a2`).
    pub albedo_law: String,
    /// Model years run until the year repeated (or until giving up).
    pub years_to_equilibrium: u32,
    /// Whether the year repeated within the tolerance.
    pub converged: bool,
    /// Largest change of any band over the last year, K.
    pub residual_k: f64,
    /// With `--land`: land and sea apart from the map climate.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub land_sea: Option<super::climate_land::LandSeaReport>,
}

/// One tilt of an obliquity sweep.
#[derive(Debug, Serialize)]
pub struct SweepRow {
    /// Tilt, degrees.
    pub obliquity_deg: f64,
    /// Global annual mean, °C.
    pub global_mean_c: f64,
    /// Fraction of area × year under ice, 0–1.
    pub ice_area_fraction: f64,
    /// Ice edges, degrees.
    pub ice_edge_lat_deg: IceEdgeReport,
    /// Warmest band's annual mean, °C.
    pub warmest_band_mean_c: f64,
    /// Coldest band's annual mean, °C.
    pub coldest_band_mean_c: f64,
    /// Model years run.
    pub years_to_equilibrium: u32,
    /// Whether the year repeated within the tolerance.
    pub converged: bool,
}

/// Per hemisphere, the band nearest the equator with any ice over the year, degrees.
fn seasonal_reach(c: &ClimateCycle) -> IceEdgeReport {
    let iced = |north: bool| {
        c.band_stats()
            .iter()
            .filter(|s| s.ice_fraction_of_year > 0.0 && (s.lat_rad >= 0.0) == north)
            .map(|s| s.lat_rad.to_degrees())
            .min_by(|a, b| a.abs().total_cmp(&b.abs()))
    };
    IceEdgeReport {
        north: iced(true),
        south: iced(false),
    }
}

fn edges(c: &ClimateCycle) -> IceEdgeReport {
    let e = c.ice_edges();
    IceEdgeReport {
        north: e.north_lat_rad.map(f64::to_degrees),
        south: e.south_lat_rad.map(f64::to_degrees),
    }
}

/// The report of one climate.
pub fn report(p: &Planet, c: &ClimateCycle) -> ClimateReport {
    let bands = c
        .band_stats()
        .iter()
        .zip(c.band_phases())
        .map(|(s, ph)| BandReport {
            lat_deg: s.lat_rad.to_degrees(),
            mean_c: s.mean_c,
            min_c: s.min_c,
            max_c: s.max_c,
            ice_fraction: s.ice_fraction_of_year,
            summers_per_year: ph.summers_per_year(),
            summary: describe(s, ph),
        })
        .collect();
    ClimateReport {
        name: p.spec().name.clone(),
        obliquity_deg: p.spec().spin.obliquity_deg,
        bands,
        global_mean_c: c.global_mean_c(),
        ice_area_fraction: c.ice_area_fraction(),
        ice_edge_lat_deg: edges(c),
        seasonal_ice_reach_lat_deg: seasonal_reach(c),
        albedo_law: c.spec().ice_free_albedo.name().to_string(),
        years_to_equilibrium: c.years_to_equilibrium(),
        converged: c.converged(),
        residual_k: c.residual_k(),
        land_sea: None,
    }
}

/// Parses `FROM:TO:STEP` into the list of tilts (degrees, within 0–180, at most 1000 values).
pub fn parse_sweep(text: &str) -> Result<Vec<f64>, String> {
    let bad = |why: &str| {
        format!(
            "--sweep-obliquity `{text}`: {why} (expected FROM:TO:STEP in degrees, e.g. 0:90:10)"
        )
    };
    let parts: Vec<&str> = text.split(':').collect();
    if parts.len() != 3 {
        return Err(bad("three numbers separated by colons are needed"));
    }
    let mut v = [0.0; 3];
    for (slot, part) in v.iter_mut().zip(&parts) {
        *slot = part
            .trim()
            .parse::<f64>()
            .map_err(|_| bad(&format!("`{part}` is not a number")))?;
        if !slot.is_finite() {
            return Err(bad(&format!("`{part}` is not a finite number")));
        }
    }
    let [from, to, step] = v;
    for x in [from, to] {
        if !(0.0..=180.0).contains(&x) {
            return Err(bad(&format!("tilt {x} is outside 0 to 180")));
        }
    }
    if step <= 0.0 {
        return Err(bad("STEP must be positive"));
    }
    if to < from {
        return Err(bad("TO must not be below FROM"));
    }
    let n = ((to - from) / step + 1e-9).floor() as usize + 1;
    if n > 1000 {
        return Err(bad(&format!("{n} tilts; at most 1000")));
    }
    Ok((0..n).map(|i| from + step * i as f64).collect())
}

fn sweep(args: &Args, p: &Planet, text: &str) -> Result<(), String> {
    let tilts = parse_sweep(text)?;
    let bar = if std::io::stderr().is_terminal() {
        indicatif::ProgressBar::new(tilts.len() as u64)
    } else {
        indicatif::ProgressBar::hidden()
    };
    bar.set_style(
        indicatif::ProgressStyle::with_template("{msg:>12} [{bar:30}] {pos}/{len} tilts")
            .map_err(|e| e.to_string())?
            .progress_chars("=> "),
    );
    let mut rows = Vec::with_capacity(tilts.len());
    for &tilt in &tilts {
        bar.set_message(format!("tilt {tilt:.1}°"));
        let mut spec = p.spec().clone();
        spec.spin.obliquity_deg = tilt;
        let world = Planet::new(&spec).map_err(|e| format!("tilt {tilt}°: {e}"))?;
        let c = bar.suspend(|| crate::climate_setup::cycle_of(&world))?;
        let means = c.band_stats().iter().map(|s| s.mean_c);
        rows.push(SweepRow {
            obliquity_deg: tilt,
            global_mean_c: c.global_mean_c(),
            ice_area_fraction: c.ice_area_fraction(),
            ice_edge_lat_deg: edges(&c),
            warmest_band_mean_c: means.clone().fold(f64::NEG_INFINITY, f64::max),
            coldest_band_mean_c: means.fold(f64::INFINITY, f64::min),
            years_to_equilibrium: c.years_to_equilibrium(),
            converged: c.converged(),
        });
        bar.inc(1);
    }
    bar.finish_and_clear();
    if args.json {
        return super::output::print_json(&rows);
    }
    say!("{} — climate against tilt", p.spec().name);
    say!(
        "{:>7} {:>9} {:>8} {:>9} {:>9} {:>8} {:>8} {:>6}",
        "tilt °",
        "global °C",
        "ice %",
        "edge N °",
        "edge S °",
        "warm °C",
        "cold °C",
        "years"
    );
    for r in &rows {
        say!(
            "{:>7.1} {:>9.1} {:>8.1} {:>9} {:>9} {:>8.1} {:>8.1} {:>6}{}",
            r.obliquity_deg,
            r.global_mean_c,
            100.0 * r.ice_area_fraction,
            opt_deg(r.ice_edge_lat_deg.north),
            opt_deg(r.ice_edge_lat_deg.south),
            r.warmest_band_mean_c,
            r.coldest_band_mean_c,
            r.years_to_equilibrium,
            if r.converged { "" } else { " (not settled)" }
        );
    }
    Ok(())
}

fn opt_deg(x: Option<f64>) -> String {
    x.map_or_else(|| "none".to_string(), |v| format!("{v:.1}"))
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let p = crate::worlds::load(&args.world)?;
    if let Some(text) = &args.sweep_obliquity {
        return sweep(&args, &p, text);
    }
    let c = crate::climate_setup::cycle_of(&p)?;
    let mut r = report(&p, &c);
    let land = match &args.land {
        Some(path) => Some(path.clone()),
        None => crate::worlds::land_file(&args.world)?,
    };
    if let Some(path) = &land {
        r.land_sea = Some(super::climate_land::report(&p, path, &args.grid)?);
    }
    if args.json {
        return super::output::print_json(&r);
    }
    say!(
        "{} — seasonal climate (tilt {:.1}°)",
        r.name,
        r.obliquity_deg
    );
    say!(
        "  global mean {:.1} °C, ice {:.0}% of area-year ({} albedo law)",
        r.global_mean_c,
        100.0 * r.ice_area_fraction,
        r.albedo_law
    );
    say!(
        "  ice some of the year from N {} S {} (band nearest the equator); annual-mean ice edge N {} S {}",
        opt_deg(r.seasonal_ice_reach_lat_deg.north),
        opt_deg(r.seasonal_ice_reach_lat_deg.south),
        opt_deg(r.ice_edge_lat_deg.north),
        opt_deg(r.ice_edge_lat_deg.south)
    );
    say!(
        "  {} after {} model years (last change {:.4} K)",
        if r.converged {
            "repeating year reached"
        } else {
            "NOT settled"
        },
        r.years_to_equilibrium,
        r.residual_k
    );
    say!(
        "{:>7} {:>7} {:>7} {:>7} {:>5}  summary",
        "lat °",
        "mean",
        "min",
        "max",
        "ice%"
    );
    // North at the top, as on a map; every band with --all-bands, else the bands nearest
    // every 10° of latitude.
    let n = r.bands.len();
    let rows: Vec<&BandReport> = if args.all_bands {
        r.bands.iter().rev().collect()
    } else {
        let mut picked: Vec<usize> = (0..=18)
            .map(|i| c.grid().band_of(f64::to_radians(90.0 - 10.0 * i as f64)))
            .collect();
        picked.dedup();
        picked.iter().map(|&j| &r.bands[j]).collect()
    };
    let shown = rows.len();
    for b in rows {
        say!(
            "{:>7.1} {:>7.1} {:>7.1} {:>7.1} {:>5.0}  {}",
            b.lat_deg,
            b.mean_c,
            b.min_c,
            b.max_c,
            100.0 * b.ice_fraction,
            b.summary
        );
    }
    if shown < n {
        say!("  ({shown} of {n} bands shown, nearest every 10°; --all-bands for all)");
    }
    if let Some(ls) = &r.land_sea {
        super::climate_land::print(ls);
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::parse_sweep;

    #[test]
    fn sweep_ranges_parse_and_reject_nonsense() {
        assert_eq!(parse_sweep("0:90:30").unwrap(), vec![0.0, 30.0, 60.0, 90.0]);
        assert_eq!(parse_sweep("10:10:5").unwrap(), vec![10.0]);
        for bad in [
            "", "1:2", "a:2:3", "0:90:0", "0:200:10", "50:10:5", "0:90:-1", "0:NaN:1",
        ] {
            assert!(parse_sweep(bad).is_err(), "{bad}");
        }
        assert!(parse_sweep("0:180:0.001").is_err());
    }
}

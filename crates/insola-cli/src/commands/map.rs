//! `insola map WORLD --quantity insolation|daylight|temperature --png FILE [--csv FILE]`:
//! a latitude × time-of-year heat map; with `--land FILE` or `--all-sea`, a latitude ×
//! longitude map of the two-dimensional climate instead (see [`super::map_land`]).
//!
//! The picture (PNG or SVG by the file's extension, drawn by [`super::plot::heat_map`]) is
//! always 960 × 540 px: title, a 720 × 370 px map (latitude −90° at the bottom, +90° at the top;
//! time of year left to right from the world's time zero), the equinoxes and solstices marked
//! along the top, the tropics and polar circles as labelled dashed lines, and a colour scale
//! with units on the right. `--lats` and `--days` set the sample grid (each sample is drawn as a
//! block of pixels), not the picture size.
//!
//! Quantities:
//! * `insolation` — daily-mean sunlight at the top of the atmosphere, W/m² (Berger 1978).
//! * `daylight` — hours of the solar day with the star's centre above the standard rise
//!   altitude, from `cos H0 = (sin h0 − sin φ sin δ)/(cos φ cos δ)` with the declination held for
//!   the whole day. For slow rotators whose day is a sizeable part of the year the declination
//!   moves during the day and the real value differs (use `insola day` for exact events).
//! * `temperature` — zonal-mean surface temperature of the energy balance model, °C
//!   (`insola climate` gives the numbers).
//!
//! CSV (`--csv FILE`): one row per sample, header
//! `lat_deg,year_fraction,day,<quantity>_<unit>`; `day` counts the world's solar days from time
//! zero (standard days of 86 400 s for tidally locked worlds). Rows run north to south within
//! each time column, columns in time order.

use insola::Planet;
use insola::constants::SECONDS_PER_DAY;

use super::map_zonal::{heat_map, sample, style, write_csv};

/// What to draw.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum Quantity {
    /// Daily-mean top-of-atmosphere insolation, W/m².
    Insolation,
    /// Daylight (time the star is up), hours.
    Daylight,
    /// Surface temperature, °C: zonal mean over the year, or with a surface the map model's
    /// at one time of year (`--day`).
    Temperature,
    /// With a surface: annual-mean surface temperature, °C.
    AnnualMean,
    /// With a surface: coldest surface temperature of the year, °C.
    AnnualMin,
    /// With a surface: warmest surface temperature of the year, °C.
    AnnualMax,
    /// With a surface: thermal zones (never freezes, winter frost, frozen ground, lasting ice).
    Zones,
    /// With a surface: standard days a year above 5 °C.
    GrowingDays,
}

/// Arguments of `insola map`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// A `*.world.ron` file or the name of a built-in world.
    world: String,
    /// Quantity to map.
    #[arg(long, value_enum)]
    quantity: Quantity,
    /// Latitude samples from pole to pole (2–2000).
    #[arg(long, default_value_t = 180)]
    lats: usize,
    /// Time samples over one year (2–5000).
    #[arg(long, default_value_t = 365)]
    days: usize,
    /// Write the picture to this file, PNG or SVG by the extension (960 × 540 px; with a
    /// surface 960 × 560 px).
    #[arg(long, value_name = "FILE")]
    png: Option<String>,
    /// Map the two-dimensional climate over this land file: a PNG mask in equirectangular
    /// projection (dark pixels are land) or a RON layout of shapes (`*.land.ron`). Default for
    /// the temperature and land quantities: the land file the world file names
    /// (`climate: (land: "…")`), if any.
    #[arg(long, value_name = "FILE", conflicts_with = "all_sea")]
    land: Option<String>,
    /// Map the two-dimensional climate over a planet-wide sea (no land file).
    #[arg(long)]
    all_sea: bool,
    /// Ignore the land file the world file names (`climate: (land: "…")`): the zonal map.
    #[arg(long, conflicts_with_all = ["land", "all_sea"])]
    no_land: bool,
    /// With a surface and `--quantity temperature`: the time of year, in local days since time
    /// zero (standard days on a tidally locked world). Default: the northern solstice.
    #[arg(long, allow_hyphen_values = true)]
    day: Option<f64>,
    /// With a surface: the model grid, COLUMNSxROWS (4–4096 by 4–2000).
    #[arg(long, default_value = "128x64", value_name = "COLUMNSxROWS")]
    grid: String,
    /// Write the samples to this CSV file (one row per sample).
    #[arg(long)]
    csv: Option<String>,
    /// Print a JSON summary (files written, value range) instead of text.
    #[arg(long)]
    json: bool,
}

/// A chart's footnote: `note`, and on a validation reference world the caution that its
/// real-world numbers are not for real decisions.
pub fn footnote(p: &Planet, note: &str) -> String {
    if p.spec().reference {
        format!(
            "{note}\nA validation reference world. Insola's numbers are for games and invented worlds: not for navigation, solar engineering or sun-exposure decisions."
        )
    } else {
        note.to_string()
    }
}

/// The world's numbers under a chart's title.
pub fn subtitle(p: &Planet) -> String {
    let s = &p.spec();
    let mut out = format!(
        "tilt {:.1}°, eccentricity {:.3}, year {:.1} standard days",
        s.spin.obliquity_deg,
        s.orbit.eccentricity,
        p.year_s() / SECONDS_PER_DAY
    );
    if p.spin().is_tidally_locked() {
        out.push_str(", tidally locked");
    } else {
        out.push_str(&format!(
            ", solar day {:.1} h",
            p.spin().solar_day_s / 3600.0
        ));
    }
    if s.reference {
        out.push_str("  (validation reference, not game content)");
    }
    out
}

/// JSON summary of what was drawn.
#[derive(Debug, serde::Serialize)]
pub struct MapReport {
    /// World name.
    pub name: String,
    /// Quantity drawn.
    pub quantity: String,
    /// Unit of the values.
    pub unit: String,
    /// Smallest sampled value.
    pub min: f64,
    /// Largest sampled value.
    pub max: f64,
    /// Latitude samples (model rows for a latitude × longitude map).
    pub lats: usize,
    /// Time samples (0 for a latitude × longitude map, which shows one time or the year's
    /// statistics).
    pub days: usize,
    /// PNG written, if any.
    pub png: Option<String>,
    /// CSV written, if any.
    pub csv: Option<String>,
    /// The surface of a latitude × longitude map (land file name or "all sea"); null for the
    /// zonal latitude × time map.
    pub surface: Option<String>,
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    if !(2..=2000).contains(&args.lats) {
        return Err(format!(
            "--lats {} is out of range: allowed 2 to 2000",
            args.lats
        ));
    }
    if !(2..=5000).contains(&args.days) {
        return Err(format!(
            "--days {} is out of range: allowed 2 to 5000",
            args.days
        ));
    }
    if args.png.is_none() && args.csv.is_none() {
        return Err("nothing to write: give --png FILE and/or --csv FILE".into());
    }
    let p = crate::worlds::load(&args.world)?;
    // The world file's own land file counts as --land for the quantities that need a surface
    // or depend on one (not for sunlight and daylight, which do not).
    let world_land = if args.land.is_none()
        && !args.all_sea
        && !args.no_land
        && !matches!(args.quantity, Quantity::Insolation | Quantity::Daylight)
    {
        crate::worlds::land_file(&args.world)?
    } else {
        None
    };
    let land = args.land.clone().or(world_land);
    if land.is_some() || args.all_sea {
        return run_surface(&args, &p, land.as_deref());
    }
    if !matches!(
        args.quantity,
        Quantity::Insolation | Quantity::Daylight | Quantity::Temperature
    ) {
        return Err(format!(
            "--quantity {} needs a surface: give --land FILE or --all-sea",
            super::map_land::quantity_name(args.quantity)
        ));
    }
    if args.day.is_some() {
        return Err(
            "--day picks the time of a latitude × longitude map: give --land FILE or --all-sea"
                .into(),
        );
    }
    let field = sample(&p, args.quantity, args.lats, args.days)?;
    let st = style(&p, args.quantity, &field);
    if let Some(path) = &args.png {
        super::plot::save(&heat_map(&p, args.quantity, &field), path)?;
    }
    if let Some(path) = &args.csv {
        let day_len = if p.spin().is_tidally_locked() {
            SECONDS_PER_DAY
        } else {
            p.day_s()
        };
        write_csv(path, &field, st.column, day_len, p.year_s())?;
    }
    let min = field.values.iter().copied().fold(f64::INFINITY, f64::min);
    let max = field
        .values
        .iter()
        .copied()
        .fold(f64::NEG_INFINITY, f64::max);
    let quantity = super::map_land::quantity_name(args.quantity);
    if args.json {
        return super::output::print_json(&MapReport {
            name: p.spec().name.clone(),
            quantity: quantity.into(),
            unit: st.unit.into(),
            min,
            max,
            lats: args.lats,
            days: args.days,
            png: args.png.clone(),
            csv: args.csv.clone(),
            surface: None,
        });
    }
    say!(
        "{}: {quantity} from {min:.1} to {max:.1} {} on {} latitudes × {} times",
        p.spec().name,
        st.unit,
        args.lats,
        args.days
    );
    for f in [&args.png, &args.csv].into_iter().flatten() {
        say!("  wrote {f}");
    }
    Ok(())
}

/// `insola map --land FILE` / `--all-sea`: the map climate on a latitude × longitude map.
fn run_surface(args: &Args, p: &Planet, land: Option<&str>) -> Result<(), String> {
    let req = super::map_land::Request {
        quantity: args.quantity,
        land,
        day: args.day,
        grid: super::land::parse_grid(&args.grid)?,
    };
    let d = super::map_land::run(p, &req, args.png.as_deref(), args.csv.as_deref())?;
    if args.json {
        return super::output::print_json(&MapReport {
            name: p.spec().name.clone(),
            quantity: d.quantity.into(),
            unit: d.unit.into(),
            min: d.min,
            max: d.max,
            lats: req.grid.row_count(),
            days: 0,
            png: args.png.clone(),
            csv: args.csv.clone(),
            surface: Some(d.surface),
        });
    }
    say!(
        "{}: {} from {:.1} to {:.1} {} over {} on a {} × {} model grid",
        p.spec().name,
        d.quantity,
        d.min,
        d.max,
        d.unit,
        d.surface,
        req.grid.columns(),
        req.grid.row_count()
    );
    for f in [&args.png, &args.csv].into_iter().flatten() {
        say!("  wrote {f}");
    }
    Ok(())
}

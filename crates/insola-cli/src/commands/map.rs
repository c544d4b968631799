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

use std::f64::consts::PI;
use std::io::Write;

use insola::Planet;
use insola::constants::SECONDS_PER_DAY;
use insola::insolation::daily_mean_grid_w_m2;

use super::colour_map::{DAYLIGHT, SUNLIGHT, Scale};
use super::plot::field::zone_lines;
use super::plot::heat_map::HeatMap;

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
    /// projection (dark pixels are land) or a RON layout of shapes (`*.land.ron`).
    #[arg(long, value_name = "FILE", conflicts_with = "all_sea")]
    land: Option<String>,
    /// Map the two-dimensional climate over a planet-wide sea (no land file).
    #[arg(long)]
    all_sea: bool,
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

/// Sampled values: `values[k * lats.len() + i]` at latitude `lats_deg[i]` (south to north) and
/// year fraction `fractions[k]`.
pub struct Field {
    /// Latitudes, degrees, south to north.
    pub lats_deg: Vec<f64>,
    /// Year fractions of the time samples.
    pub fractions: Vec<f64>,
    /// Values, time-major.
    pub values: Vec<f64>,
}

impl Field {
    /// The value at time sample `k` and latitude sample `i`.
    pub fn at(&self, k: usize, i: usize) -> f64 {
        self.values[k * self.lats_deg.len() + i]
    }
}

/// Samples a quantity on the latitude × time grid.
pub fn sample(p: &Planet, q: Quantity, n_lat: usize, n_time: usize) -> Result<Field, String> {
    let lats_deg: Vec<f64> = (0..n_lat)
        .map(|i| -90.0 + (i as f64 + 0.5) * 180.0 / n_lat as f64)
        .collect();
    let fractions: Vec<f64> = (0..n_time)
        .map(|k| (k as f64 + 0.5) / n_time as f64)
        .collect();
    let lats_rad: Vec<f64> = lats_deg.iter().map(|l| l.to_radians()).collect();
    let mut values = vec![0.0; n_lat * n_time];
    match q {
        Quantity::Insolation => {
            let days: Vec<(f64, f64)> = fractions
                .iter()
                .map(|f| {
                    let s = p.star_instant(f * p.year_s());
                    (s.declination_rad, s.distance_factor)
                })
                .collect();
            daily_mean_grid_w_m2(
                p.flux_at_mean_distance_w_m2(),
                &lats_rad,
                &days,
                &mut values,
            );
        }
        Quantity::Daylight => {
            let h0 = p.standard_rise_altitude_rad();
            let day_h = if p.spin().is_tidally_locked() {
                // No solar day: the star stays where it is; show 24 h or 0 as up or down.
                f64::NAN
            } else {
                p.spin().solar_day_s / 3600.0
            };
            for (k, f) in fractions.iter().enumerate() {
                let d = p.star_instant(f * p.year_s()).declination_rad;
                for (i, &lat) in lats_rad.iter().enumerate() {
                    let frac = up_fraction(lat, d, h0);
                    values[k * n_lat + i] = if day_h.is_nan() {
                        24.0 * frac.round()
                    } else {
                        frac * day_h
                    };
                }
            }
        }
        _ => {
            let c = crate::climate_setup::cycle_of(p)?;
            for (k, f) in fractions.iter().enumerate() {
                for (i, &lat) in lats_rad.iter().enumerate() {
                    values[k * n_lat + i] = c.temperature_c(lat, *f);
                }
            }
        }
    }
    Ok(Field {
        lats_deg,
        fractions,
        values,
    })
}

/// Fraction of a rotation with the star's centre above altitude `h0` at latitude `lat` and
/// declination `d` (standard hour-angle formula; 1 for polar day, 0 for polar night).
pub fn up_fraction(lat: f64, d: f64, h0: f64) -> f64 {
    let den = lat.cos() * d.cos();
    let num = h0.sin() - lat.sin() * d.sin();
    if num >= den {
        0.0
    } else if num <= -den {
        1.0
    } else {
        (num / den).acos() / PI
    }
}

struct Style {
    title: String,
    unit: &'static str,
    column: &'static str,
    note: &'static str,
    scale: Scale,
}

fn style(p: &Planet, q: Quantity, field: &Field) -> Style {
    let lo = field.values.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = field
        .values
        .iter()
        .copied()
        .fold(f64::NEG_INFINITY, f64::max);
    let name = &p.spec().name;
    match q {
        Quantity::Insolation => Style {
            title: format!("{name}: daily sunlight"),
            unit: "W/m²",
            column: "insolation_w_m2",
            note: "Daily mean at the top of the atmosphere (Berger 1978).",
            scale: Scale::Linear {
                ramp: SUNLIGHT,
                lo: 0.0,
                hi: round_up(hi.max(1.0), 50.0),
            },
        },
        Quantity::Daylight => {
            let day_h = if p.spin().is_tidally_locked() {
                24.0
            } else {
                p.spin().solar_day_s / 3600.0
            };
            Style {
                title: format!("{name}: length of daylight"),
                unit: "hours",
                column: "daylight_h",
                note: "Star above the standard rise altitude; declination held over each day (rough for slow rotators).",
                scale: Scale::Linear {
                    ramp: DAYLIGHT,
                    lo: 0.0,
                    hi: day_h,
                },
            }
        }
        _ => {
            let scale = super::map_land::temperature_scale(lo, hi);
            Style {
                title: format!("{name}: surface temperature"),
                unit: "°C",
                column: "temperature_c",
                note: "Zonal mean of the seasonal energy balance model; blue below 0 °C, black line at 0 °C.",
                scale,
            }
        }
    }
}

fn round_up(v: f64, step: f64) -> f64 {
    (v / step).ceil() * step
}

/// The heat map of a sampled field.
fn heat_map<'a>(p: &Planet, q: Quantity, field: &'a Field) -> HeatMap<'a> {
    let st = style(p, q, field);
    let (day_len_s, day_word) = if p.spin().is_tidally_locked() {
        (SECONDS_PER_DAY, "standard days")
    } else {
        (p.day_s(), "local days")
    };
    let year_days = p.year_s() / day_len_s;
    let z = p.zone_latitudes();
    let marks = p.season_marks_after(0.0);
    let year = p.year_s();
    let season_marks = [
        (marks.northward_equinox_s, "equinox (N spring)"),
        (marks.northern_solstice_s, "N solstice"),
        (marks.southward_equinox_s, "equinox (S spring)"),
        (marks.southern_solstice_s, "S solstice"),
    ]
    .map(|(t, name)| (t.rem_euclid(year) / year, name))
    .to_vec();
    HeatMap {
        field,
        title: st.title,
        subtitle: subtitle(p),
        note: st.note.to_string(),
        unit: st.unit.to_string(),
        scale: st.scale,
        zero_line: q == Quantity::Temperature,
        year_days,
        x_desc: format!(
            "time of year: {day_word} since time zero (year = {year_days:.1} days of {:.1} h)",
            day_len_s / 3600.0
        ),
        lat_lines: zone_lines(z.tropic_lat_deg, z.polar_circle_lat_deg),
        season_marks,
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

fn write_csv(
    path: &str,
    field: &Field,
    column: &str,
    day_len_s: f64,
    year_s: f64,
) -> Result<(), String> {
    let file = std::fs::File::create(path).map_err(|e| format!("cannot write {path}: {e}"))?;
    let mut w = std::io::BufWriter::new(file);
    let err = |e: std::io::Error| format!("cannot write {path}: {e}");
    writeln!(w, "lat_deg,year_fraction,day,{column}").map_err(err)?;
    for (k, f) in field.fractions.iter().enumerate() {
        for i in (0..field.lats_deg.len()).rev() {
            writeln!(
                w,
                "{:.4},{:.6},{:.4},{:.4}",
                field.lats_deg[i],
                f,
                f * year_s / day_len_s,
                field.at(k, i)
            )
            .map_err(err)?;
        }
    }
    w.flush().map_err(err)
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
    if args.land.is_some() || args.all_sea {
        return run_surface(&args, &p);
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
fn run_surface(args: &Args, p: &Planet) -> Result<(), String> {
    let req = super::map_land::Request {
        quantity: args.quantity,
        land: args.land.as_deref(),
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

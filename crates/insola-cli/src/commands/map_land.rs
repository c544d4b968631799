//! `insola map WORLD --land FILE` (or `--all-sea`): the two-dimensional seasonal climate on a
//! latitude × longitude map, the coastline of the land file drawn.
//!
//! Quantities (the map model of `insola::map_climate`, land and sea apart by heat capacity):
//! * `temperature` — surface temperature at one time of year (`--day`, default the northern
//!   solstice), °C; a daily mean on fast rotators.
//! * `annual-mean`, `annual-min`, `annual-max` — over the periodic year, °C.
//! * `zones` — thermal zones (never freezes, winter frost, frozen ground, lasting ice).
//! * `growing-days` — standard days a year above 5 °C.
//!
//! CSV (`--csv FILE`): one row per model cell, header `lat_deg,lon_deg,<quantity>_<unit>`
//! (zones as their words), rows north to south, west to east within a row.

use std::f64::consts::PI;
use std::io::Write;

use insola::Planet;
use insola::constants::SECONDS_PER_DAY;
use insola::map_climate::{MapClimate, MapGrid, SurfaceKind, SurfaceMap, ThermalZone, ZoneOptions};

use super::colour_map::{Colour, FROST, GROWTH, Ramp, Scale, WARMTH, ZONE_COLOURS};
use super::map::Quantity;
use super::plot::field::zone_lines;
use super::plot::world_map::{Key, WorldMap};

/// What `insola map` was asked to draw over a surface.
pub struct Request<'a> {
    /// Quantity.
    pub quantity: Quantity,
    /// `--land FILE`, or `None` for `--all-sea`.
    pub land: Option<&'a str>,
    /// `--day`: time of year in the heat map's days since time zero.
    pub day: Option<f64>,
    /// Model grid.
    pub grid: MapGrid,
}

/// What was drawn, for the summary line and JSON.
pub struct Drawn {
    /// Quantity name as on the command line.
    pub quantity: &'static str,
    /// Unit.
    pub unit: &'static str,
    /// Smallest value over the model cells.
    pub min: f64,
    /// Largest value over the model cells.
    pub max: f64,
    /// The surface in words (file name or "all sea").
    pub surface: String,
}

/// A quantity of the map climate at a latitude and longitude in degrees.
type Value<'a> = Box<dyn Fn(f64, f64) -> f64 + 'a>;

/// Draws (`png`) and/or tabulates (`csv`) the request.
pub fn run(
    p: &Planet,
    req: &Request<'_>,
    png: Option<&str>,
    csv: Option<&str>,
) -> Result<Drawn, String> {
    let (surface, surface_name) = match req.land {
        Some(path) => {
            let land = super::land::load(path)?;
            (land.map, land.name)
        }
        None => (SurfaceMap::uniform(SurfaceKind::Sea), "all sea".to_string()),
    };
    let c = crate::climate_setup::map_cycle_of(p, &surface, &req.grid)?;
    let zones = c
        .zones(&ZoneOptions::default())
        .map_err(|e| e.to_string())?;
    let rad = |lat: f64, lon: f64| (lat.to_radians(), lon.to_radians());
    let (day_len_s, day_word) = if p.spin().is_tidally_locked() {
        (SECONDS_PER_DAY, "standard day")
    } else {
        (p.day_s(), "local day")
    };
    let (fraction, when) = match req.day {
        Some(d) if d.is_finite() => {
            let f = (d * day_len_s / p.year_s()).rem_euclid(1.0);
            (f, format!("{day_word} {d} ({})", season_words(p, f)))
        }
        Some(d) => return Err(format!("--day {d} is not a finite number")),
        None => {
            let t = p.season_marks_after(0.0).northern_solstice_s;
            (
                (t / p.year_s()).rem_euclid(1.0),
                format!("the northern solstice ({day_word} {:.1})", t / day_len_s),
            )
        }
    };
    let name = &p.spec().name;
    let q = req.quantity;
    let (value, what, unit, column): (Value<'_>, String, &'static str, &'static str) = match q {
        Quantity::Temperature => (
            Box::new(|lat, lon| {
                let (a, b) = rad(lat, lon);
                c.temperature_c(a, b, fraction).unwrap_or(f64::NAN)
            }),
            format!("surface temperature at {when}"),
            "°C",
            "temperature_c",
        ),
        Quantity::AnnualMean => (
            Box::new(|lat, lon| {
                let (a, b) = rad(lat, lon);
                c.annual_mean_c(a, b).unwrap_or(f64::NAN)
            }),
            "annual mean surface temperature".into(),
            "°C",
            "annual_mean_c",
        ),
        Quantity::AnnualMin => (
            Box::new(|lat, lon| {
                let (a, b) = rad(lat, lon);
                c.annual_min_c(a, b).unwrap_or(f64::NAN)
            }),
            "coldest surface temperature of the year".into(),
            "°C",
            "annual_min_c",
        ),
        Quantity::AnnualMax => (
            Box::new(|lat, lon| {
                let (a, b) = rad(lat, lon);
                c.annual_max_c(a, b).unwrap_or(f64::NAN)
            }),
            "warmest surface temperature of the year".into(),
            "°C",
            "annual_max_c",
        ),
        Quantity::GrowingDays => (
            Box::new(|lat, lon| {
                let (a, b) = rad(lat, lon);
                c.interpolate(|k| zones.cells[k].growing_days, a, b)
            }),
            format!(
                "growing season (days above {:.0} °C)",
                zones.options.growing_threshold_c
            ),
            "days",
            "growing_days",
        ),
        Quantity::Zones => (
            Box::new(|lat, lon| {
                let (a, b) = rad(lat, lon);
                let z = zones.cells[c.grid().cell_of(a, b)].zone;
                ThermalZone::ALL.iter().position(|x| *x == z).unwrap_or(0) as f64
            }),
            "thermal zones".into(),
            "zone",
            "zone",
        ),
        Quantity::Insolation | Quantity::Daylight => {
            return Err(format!(
                "--quantity {} is drawn over latitude and time of year; drop --land/--all-sea, or map temperature, annual-mean, annual-min, annual-max, zones or growing-days",
                quantity_name(q)
            ));
        }
    };
    let cells = cell_centres(c.grid());
    let values: Vec<f64> = cells.iter().map(|&(lat, lon)| value(lat, lon)).collect();
    let (min, max) = min_max(&values);
    if let Some(path) = png {
        let key = if q == Quantity::Zones {
            Key::Swatches(
                ThermalZone::ALL
                    .iter()
                    .zip(ZONE_COLOURS)
                    .map(|(z, col)| (col, z.words().to_string()))
                    .collect(),
            )
        } else {
            Key::Bar {
                scale: scale(q, min, max, p.year_s() / SECONDS_PER_DAY),
                unit: unit.to_string(),
            }
        };
        let bar = match &key {
            Key::Bar { scale, .. } => Some(*scale),
            Key::Swatches(_) => None,
        };
        let colour_at = |lat: f64, lon: f64| -> Colour {
            let v = value(lat, lon);
            match &bar {
                Some(scale) => scale.colour(v),
                None => ZONE_COLOURS[(v as usize).min(3)],
            }
        };
        let land_at = |lat: f64, lon: f64| super::land::is_land(&surface, lat, lon);
        let z = p.zone_latitudes();
        let chart = WorldMap {
            title: format!("{name}: {what}"),
            subtitle: format!(
                "{}; {}",
                super::map::subtitle(p),
                land_words(&c, &surface_name)
            ),
            note: super::map::footnote(p, &note(&c, req.land.is_some())),
            colour_at: &colour_at,
            land_at: req
                .land
                .is_some()
                .then_some(&land_at as &dyn Fn(f64, f64) -> bool),
            key,
            lat_lines: zone_lines(z.tropic_lat_deg, z.polar_circle_lat_deg),
        };
        super::plot::save(&chart, path)?;
    }
    if let Some(path) = csv {
        write_csv(path, &cells, &values, column, q == Quantity::Zones)?;
    }
    Ok(Drawn {
        quantity: quantity_name(q),
        unit,
        min,
        max,
        surface: surface_name,
    })
}

/// The northern season at year fraction `f`, from the star's ecliptic longitude (0° at the
/// northward equinox).
fn season_words(p: &Planet, f: f64) -> &'static str {
    let lon = p
        .star_instant(f * p.year_s())
        .ecliptic_longitude_rad
        .to_degrees()
        .rem_euclid(360.0);
    [
        "northern spring",
        "northern summer",
        "northern autumn",
        "northern winter",
    ][((lon / 90.0) as usize).min(3)]
}

/// The name of a quantity on the command line.
pub fn quantity_name(q: Quantity) -> &'static str {
    match q {
        Quantity::Insolation => "insolation",
        Quantity::Daylight => "daylight",
        Quantity::Temperature => "temperature",
        Quantity::AnnualMean => "annual-mean",
        Quantity::AnnualMin => "annual-min",
        Quantity::AnnualMax => "annual-max",
        Quantity::Zones => "zones",
        Quantity::GrowingDays => "growing-days",
    }
}

fn land_words(c: &MapClimate, surface: &str) -> String {
    format!(
        "land {:.0}% ({surface}), model grid {} × {}",
        100.0 * c.surface().land_area_fraction(),
        c.grid().columns(),
        c.grid().row_count()
    )
}

fn note(c: &MapClimate, coast: bool) -> String {
    let mode = match c.forcing_mode() {
        insola::map_climate::ForcingMode::DailyMean => "daily-mean sunlight",
        insola::map_climate::ForcingMode::Instantaneous { .. } => "the day resolved",
        insola::map_climate::ForcingMode::Locked => "star fixed in each column's sky",
    };
    format!(
        "Seasonal energy balance model on the map (land and sea differ by heat capacity; {mode}){}.",
        if coast { "; coastline in black" } else { "" }
    )
}

/// Cell centres of the grid, degrees, north to south, west to east.
fn cell_centres(grid: &MapGrid) -> Vec<(f64, f64)> {
    let lats = grid.rows().lat_centres_rad();
    let lons = grid.lon_centres_rad();
    lats.iter()
        .rev()
        .flat_map(|lat| {
            lons.iter()
                .map(move |lon| (lat * 180.0 / PI, lon * 180.0 / PI))
        })
        .collect()
}

fn min_max(v: &[f64]) -> (f64, f64) {
    v.iter()
        .filter(|x| x.is_finite())
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), &x| {
            (lo.min(x), hi.max(x))
        })
}

/// Colours of a continuous quantity from `lo` to `hi`; growing days over a year of `year_days`
/// standard days.
fn scale(q: Quantity, lo: f64, hi: f64, year_days: f64) -> Scale {
    if q == Quantity::GrowingDays {
        return Scale::Linear {
            ramp: GROWTH,
            lo: 0.0,
            hi: year_days.max(1.0),
        };
    }
    temperature_scale(lo, hi)
}

/// Blue below 0 °C, warm above, in steps of 5 °C (as the zonal maps).
pub fn temperature_scale(lo: f64, hi: f64) -> Scale {
    let (lo, hi) = ((lo / 5.0).floor() * 5.0, (hi / 5.0).ceil() * 5.0);
    let one = |ramp: Ramp| Scale::Linear {
        ramp,
        lo,
        hi: hi.max(lo + 5.0),
    };
    if lo < 0.0 && hi > 0.0 {
        Scale::Split {
            below: FROST,
            above: WARMTH,
            lo,
            mid: 0.0,
            hi,
        }
    } else if hi <= 0.0 {
        one(FROST)
    } else {
        one(WARMTH)
    }
}

fn write_csv(
    path: &str,
    cells: &[(f64, f64)],
    values: &[f64],
    column: &str,
    zones: bool,
) -> Result<(), String> {
    let file = std::fs::File::create(path).map_err(|e| format!("cannot write {path}: {e}"))?;
    let mut w = std::io::BufWriter::new(file);
    let err = |e: std::io::Error| format!("cannot write {path}: {e}");
    writeln!(w, "lat_deg,lon_deg,{column}").map_err(err)?;
    for (&(lat, lon), &v) in cells.iter().zip(values) {
        if zones {
            let z = ThermalZone::ALL[(v as usize).min(3)].words();
            writeln!(w, "{lat:.4},{lon:.4},{z}").map_err(err)?;
        } else {
            writeln!(w, "{lat:.4},{lon:.4},{v:.4}").map_err(err)?;
        }
    }
    w.flush().map_err(err)
}

//! `insola map WORLD --quantity insolation|daylight|temperature --png FILE [--csv FILE]`:
//! a latitude × time-of-year heat map.
//!
//! The picture is always 960 × 540 px: title, a 720 × 380 px map (latitude −90° at the bottom,
//! +90° at the top; time of year left to right from the world's time zero), the equinoxes and
//! solstices marked along the top, the tropics and polar circles as labelled dashed lines, and a
//! colour scale with units on the right. `--lats` and `--days` set the sample grid (each sample
//! is drawn as a block of pixels), not the picture size.
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

use super::colour_map::{
    Canvas, Colour, DAYLIGHT, FROST, SUNLIGHT, Scale, WARMTH, nice_ticks, text_width,
};

/// What to draw.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum Quantity {
    /// Daily-mean top-of-atmosphere insolation, W/m².
    Insolation,
    /// Daylight (time the star is up), hours.
    Daylight,
    /// Zonal-mean surface temperature from the climate model, °C.
    Temperature,
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
    /// Write the heat map to this PNG file (960 × 540 px).
    #[arg(long)]
    png: Option<String>,
    /// Write the samples to this CSV file (one row per sample).
    #[arg(long)]
    csv: Option<String>,
    /// Print a JSON summary (files written, value range) instead of text.
    #[arg(long)]
    json: bool,
}

/// Picture size, px.
pub const WIDTH: u32 = 960;
/// Picture height, px.
pub const HEIGHT: u32 = 540;
const PLOT_X: i64 = 86;
const PLOT_Y: i64 = 86;
const PLOT_W: i64 = 720;
const PLOT_H: i64 = 380;
const BG: Colour = [250, 249, 246];
const INK: Colour = [28, 28, 32];
const SOFT: Colour = [96, 96, 104];
const WHITE: Colour = [255, 255, 255];
const BLACK: Colour = [0, 0, 0];

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
    fn at(&self, k: usize, i: usize) -> f64 {
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
        Quantity::Temperature => {
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
        Quantity::Temperature => {
            let (lo, hi) = (round_down(lo, 5.0), round_up(hi, 5.0));
            let scale = if lo < 0.0 && hi > 0.0 {
                Scale::Split {
                    below: FROST,
                    above: WARMTH,
                    lo,
                    mid: 0.0,
                    hi,
                }
            } else if hi <= 0.0 {
                Scale::Linear {
                    ramp: FROST,
                    lo,
                    hi: hi.max(lo + 5.0),
                }
            } else {
                Scale::Linear {
                    ramp: WARMTH,
                    lo,
                    hi: hi.max(lo + 5.0),
                }
            };
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

fn round_down(v: f64, step: f64) -> f64 {
    (v / step).floor() * step
}

/// Draws the heat map.
pub fn render(p: &Planet, q: Quantity, field: &Field) -> image::RgbImage {
    let st = style(p, q, field);
    let mut cv = Canvas::new(WIDTH, HEIGHT, BG);
    let (n_lat, n_time) = (field.lats_deg.len(), field.fractions.len());

    // Cells: each pixel takes the nearest sample.
    let mut cell = vec![0.0; (PLOT_W * PLOT_H) as usize];
    for py in 0..PLOT_H {
        let lat_frac = 1.0 - (py as f64 + 0.5) / PLOT_H as f64; // 0 south .. 1 north
        let i = ((lat_frac * n_lat as f64) as usize).min(n_lat - 1);
        for px in 0..PLOT_W {
            let k = (((px as f64 + 0.5) / PLOT_W as f64 * n_time as f64) as usize).min(n_time - 1);
            let v = field.at(k, i);
            cell[(py * PLOT_W + px) as usize] = v;
            cv.put(PLOT_X + px, PLOT_Y + py, st.scale.colour(v));
        }
    }
    // Freezing line for temperature maps: pixels where 0 °C is crossed to the right or below.
    if q == Quantity::Temperature {
        for py in 0..PLOT_H {
            for px in 0..PLOT_W {
                let v = cell[(py * PLOT_W + px) as usize];
                let r = if px + 1 < PLOT_W {
                    cell[(py * PLOT_W + px + 1) as usize]
                } else {
                    v
                };
                let d = if py + 1 < PLOT_H {
                    cell[((py + 1) * PLOT_W + px) as usize]
                } else {
                    v
                };
                if (v < 0.0) != (r < 0.0) || (v < 0.0) != (d < 0.0) {
                    cv.put(PLOT_X + px, PLOT_Y + py, BLACK);
                }
            }
        }
    }
    cv.frame(PLOT_X - 1, PLOT_Y - 1, PLOT_W + 2, PLOT_H + 2, INK);

    // Title and subtitle.
    cv.text(PLOT_X, 14, &st.title, 2, INK);
    let sub = subtitle(p);
    cv.text(PLOT_X, 38, &sub, 1, SOFT);

    // Latitude axis.
    let y_of = |lat: f64| PLOT_Y + ((90.0 - lat) / 180.0 * PLOT_H as f64).round() as i64;
    for lat in [-90.0, -60.0, -30.0, 0.0, 30.0, 60.0, 90.0] {
        let y = y_of(lat).min(PLOT_Y + PLOT_H - 1);
        cv.hline(PLOT_X - 6, PLOT_X - 2, y, INK);
        let s = lat_text(lat);
        cv.text(PLOT_X - 10 - text_width(&s, 1), y - 4, &s, 1, INK);
    }
    let ylab = "latitude";
    cv.text_up(16, PLOT_Y + PLOT_H / 2 + text_width(ylab, 1) / 2, ylab, INK);

    // Tropics and polar circles.
    let z = p.zone_latitudes();
    let mut lines = Vec::new();
    if z.tropic_lat_deg > 0.3 && z.tropic_lat_deg < 89.7 {
        lines.push((z.tropic_lat_deg, "tropic"));
    }
    if z.polar_circle_lat_deg > 0.3 && z.polar_circle_lat_deg < 89.7 {
        lines.push((z.polar_circle_lat_deg, "polar circle"));
    }
    for &(lat, what) in &lines {
        for sign in [1.0, -1.0] {
            let y = y_of(sign * lat);
            cv.dashed_hline(PLOT_X, PLOT_X + PLOT_W - 1, y, 6, WHITE, BLACK);
            let s = format!("{what} {}", lat_text(sign * lat));
            let w = text_width(&s, 1);
            // Label just above the line (below it for the southern lines), at the right.
            let ly = if sign > 0.0 { y - 13 } else { y + 4 };
            cv.label(PLOT_X + PLOT_W - w - 6, ly, &s, INK, WHITE);
        }
    }

    // Time axis: ticks in the world's days, plus the equinoxes and solstices.
    let (day_len_s, day_word) = if p.spin().is_tidally_locked() {
        (SECONDS_PER_DAY, "standard days")
    } else {
        (p.day_s(), "local days")
    };
    let year_days = p.year_s() / day_len_s;
    let x_of = |f: f64| PLOT_X + (f * PLOT_W as f64).round() as i64;
    let ticks = nice_ticks(0.0, year_days, 8);
    for d in ticks {
        let x = x_of(d / year_days).min(PLOT_X + PLOT_W - 1);
        cv.vline(x, PLOT_Y + PLOT_H + 1, PLOT_Y + PLOT_H + 5, INK);
        let s = format!("{d}");
        cv.text(x - text_width(&s, 1) / 2, PLOT_Y + PLOT_H + 9, &s, 1, INK);
    }
    let xlab = format!(
        "time of year: {day_word} since time zero (year = {year_days:.1} days of {:.1} h)",
        day_len_s / 3600.0
    );
    cv.text(
        PLOT_X + PLOT_W / 2 - text_width(&xlab, 1) / 2,
        PLOT_Y + PLOT_H + 24,
        &xlab,
        1,
        INK,
    );
    let marks = p.season_marks_after(0.0);
    let year = p.year_s();
    let mut row_alt = false;
    let season_marks = [
        (marks.northward_equinox_s, "equinox (N spring)"),
        (marks.northern_solstice_s, "N solstice"),
        (marks.southward_equinox_s, "equinox (S spring)"),
        (marks.southern_solstice_s, "S solstice"),
    ];
    for (t_s, name) in season_marks {
        let t = t_s.rem_euclid(year) / year;
        let x = x_of(t);
        cv.dashed_vline(x, PLOT_Y, PLOT_Y + PLOT_H - 1, 3, WHITE, BLACK);
        cv.vline(x, PLOT_Y - 8, PLOT_Y - 2, INK);
        let w = text_width(name, 1);
        let lx = (x - w / 2).clamp(PLOT_X, PLOT_X + PLOT_W - w);
        // Alternate two rows so neighbouring marks cannot overlap.
        let ly = if row_alt { PLOT_Y - 30 } else { PLOT_Y - 19 };
        row_alt = !row_alt;
        cv.text(lx, ly, name, 1, INK);
    }

    // Colour scale.
    let bx = PLOT_X + PLOT_W + 34;
    let (lo, hi) = st.scale.range();
    for py in 0..PLOT_H {
        let v = hi - (py as f64 + 0.5) / PLOT_H as f64 * (hi - lo);
        cv.rect(bx, PLOT_Y + py, 18, 1, st.scale.colour(v));
    }
    cv.frame(bx - 1, PLOT_Y - 1, 20, PLOT_H + 2, INK);
    for v in nice_ticks(lo, hi, 8) {
        let y = PLOT_Y + ((hi - v) / (hi - lo) * PLOT_H as f64).round() as i64;
        let y = y.clamp(PLOT_Y, PLOT_Y + PLOT_H - 1);
        cv.hline(bx + 18, bx + 22, y, INK);
        let s = format!("{v}");
        cv.text(bx + 26, y - 4, &s, 1, INK);
    }
    let uw = text_width(st.unit, 1);
    cv.text(bx + 9 - uw / 2, PLOT_Y - 16, st.unit, 1, INK);

    // Footnote.
    cv.text(PLOT_X, HEIGHT as i64 - 24, st.note, 1, SOFT);
    cv.img
}

fn subtitle(p: &Planet) -> String {
    let s = &p.spec();
    let mut out = format!(
        "tilt {:.1}°, eccentricity {:.3}, year {:.1} standard days",
        s.spin.obliquity_deg,
        s.orbit.eccentricity,
        p.year_s() / SECONDS_PER_DAY
    );
    if !p.spin().is_tidally_locked() {
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

fn lat_text(lat: f64) -> String {
    let a = lat.abs();
    let a = if (a - a.round()).abs() < 0.05 {
        format!("{:.0}", a)
    } else {
        format!("{:.1}", a)
    };
    if lat > 0.05 {
        format!("{a}°N")
    } else if lat < -0.05 {
        format!("{a}°S")
    } else {
        "0°".to_string()
    }
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
    /// Latitude samples.
    pub lats: usize,
    /// Time samples.
    pub days: usize,
    /// PNG written, if any.
    pub png: Option<String>,
    /// CSV written, if any.
    pub csv: Option<String>,
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
    let field = sample(&p, args.quantity, args.lats, args.days)?;
    let st = style(&p, args.quantity, &field);
    if let Some(path) = &args.png {
        let img = render(&p, args.quantity, &field);
        img.save_with_format(path, image::ImageFormat::Png)
            .map_err(|e| format!("cannot write {path}: {e}"))?;
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
    let quantity = match args.quantity {
        Quantity::Insolation => "insolation",
        Quantity::Daylight => "daylight",
        Quantity::Temperature => "temperature",
    };
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

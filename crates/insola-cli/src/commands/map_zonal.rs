//! The zonal latitude × time-of-year map of `insola map` (without `--land`): sampling the
//! quantity, its colours and labels, the heat map chart and the CSV (see [`super::map`] for the
//! quantities and the CSV layout).

use std::f64::consts::PI;
use std::io::Write;

use insola::Planet;
use insola::constants::SECONDS_PER_DAY;
use insola::insolation::daily_mean_grid_w_m2;

use super::colour_map::{DAYLIGHT, SUNLIGHT, Scale};
use super::map::{Quantity, subtitle};
use super::plot::field::zone_lines;
use super::plot::heat_map::HeatMap;

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
        // Under a ring or two suns the closed form does not hold: each cell by the core's
        // quadrature.
        Quantity::Insolation if p.daily_mean_needs_quadrature() => {
            for (k, f) in fractions.iter().enumerate() {
                for (i, &lat) in lats_rad.iter().enumerate() {
                    values[k * n_lat + i] = p.daily_mean_insolation_w_m2(f * p.year_s(), lat);
                }
            }
        }
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

/// Title, unit, CSV column, footnote and colours of a quantity.
pub struct Style {
    /// Title.
    pub title: String,
    /// Unit of the values.
    pub unit: &'static str,
    /// CSV column name.
    pub column: &'static str,
    /// Footnote.
    pub note: &'static str,
    /// Colours.
    pub scale: Scale,
}

/// The style of quantity `q` for a sampled field.
pub fn style(p: &Planet, q: Quantity, field: &Field) -> Style {
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
            note: if p.has_ring_shadow() {
                "Daily mean at the top of the atmosphere, after the ring's shadow (quadrature over the day)."
            } else if p.has_shining_companion() {
                "Daily mean at the top of the atmosphere from both stars (quadrature over the day)."
            } else {
                "Daily mean at the top of the atmosphere (Berger 1978)."
            },
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
pub fn heat_map<'a>(p: &Planet, q: Quantity, field: &'a Field) -> HeatMap<'a> {
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
        note: super::map::footnote(p, st.note),
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

/// Writes the samples as CSV (see the layout in [`super::map`]).
pub fn write_csv(
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

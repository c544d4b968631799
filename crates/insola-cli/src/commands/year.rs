//! `insola year WORLD --lat DEG`: one row per local day of the first year.

use insola::star_track::TrackTimes;
use insola::{Place, Planet};
use serde::Serialize;

/// Arguments of `insola year`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// The world and the place on it.
    #[command(flatten)]
    at: super::output::WorldPlace,
    /// Print JSON instead of text.
    #[arg(long, conflicts_with = "csv")]
    json: bool,
    /// Print CSV instead of text.
    #[arg(long)]
    csv: bool,
}

/// One local day.
#[derive(Debug, Serialize)]
pub struct YearRow {
    /// Local day number.
    pub day: i64,
    /// The world calendar's date of the local day's middle (see [`day_date`]).
    pub date: String,
    /// Fraction of the year at the day's start.
    pub year_fraction: f64,
    /// Daylight: time the star is up, hours.
    pub daylight_h: f64,
    /// Altitude at transit (or the highest sampled altitude when there is no transit), degrees.
    pub noon_altitude_deg: f64,
    /// Mean top-of-atmosphere insolation over the local day, W m⁻² (from the primary on a
    /// world of two stars).
    pub insolation_w_m2: f64,
    /// Mean top-of-atmosphere insolation from the companion over the local day, W m⁻², on a
    /// world with a shining companion (each star's share dimmed by what hides it).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub companion_insolation_w_m2: Option<f64>,
}

/// Mean top-of-atmosphere insolation from star 1 over `INSOLATION_SAMPLES` instants from
/// `start_s` at `step_s`, W m⁻².
fn companion_mean(p: &Planet, place: Place, start_s: f64, step_s: f64) -> Option<f64> {
    if !p.has_shining_companion() {
        return None;
    }
    let sum: f64 = (0..INSOLATION_SAMPLES)
        .filter_map(|i| p.star_instant_of(1, start_s + i as f64 * step_s))
        .map(|instant| p.top_of_atmosphere_insolation_w_m2(&instant, place))
        .sum();
    Some(sum / INSOLATION_SAMPLES as f64)
}

/// Samples per day for the daily insolation average.
const INSOLATION_SAMPLES: usize = 96;

/// The rows of the first year (at most 100 000).
pub fn rows(p: &Planet, place: Place) -> Vec<YearRow> {
    let first = p.local_day_count(0.0, place.longitude_rad).floor() as i64;
    let n = (p.year_s() / p.day_s()).ceil().clamp(1.0, 100_000.0) as i64;
    // One buffer for every day's samples, filled by the core's time series.
    let mut samples = vec![p.star_position(0.0, place); INSOLATION_SAMPLES];
    (0..n)
        .map(|k| {
            let day = first + k;
            let ev = p.day_events(day, place);
            let step_s = ev.day_length_s / INSOLATION_SAMPLES as f64;
            let times = TrackTimes::Even {
                start_s: ev.day_start_s + 0.5 * step_s,
                step_s,
                count: INSOLATION_SAMPLES,
            };
            if p.star_track_into(place, times, &mut samples).is_err() {
                // Only non-finite instants are refused; the scalar path gives the same answer.
                for (i, s) in samples.iter_mut().enumerate() {
                    *s = p.star_position(times.time_s(i), place);
                }
            }
            let sum: f64 = samples.iter().map(|s| s.toa_insolation_w_m2).sum();
            let best = samples
                .iter()
                .map(|s| s.altitude_rad)
                .fold(f64::MIN, f64::max);
            YearRow {
                day,
                date: day_date(p, ev.day_start_s, ev.day_length_s),
                year_fraction: (ev.day_start_s / p.year_s()).rem_euclid(1.0),
                daylight_h: ev.sunlight.time_above_s / 3600.0,
                noon_altitude_deg: ev.transit_altitude_rad.unwrap_or(best).to_degrees(),
                insolation_w_m2: sum / INSOLATION_SAMPLES as f64,
                companion_insolation_w_m2: companion_mean(
                    p,
                    place,
                    ev.day_start_s + 0.5 * step_s,
                    step_s,
                ),
            }
        })
        .collect()
}

/// The calendar date (`CalendarDate::text`) of a local day starting at `start_s` and lasting
/// `length_s` seconds: calendar days run from midnight to midnight at the prime meridian, so a
/// local day elsewhere is dated by the calendar day holding its middle.
fn day_date(p: &Planet, start_s: f64, length_s: f64) -> String {
    p.date_at(start_s + 0.5 * length_s).text()
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let (p, place) = args.at.load()?;
    let lat = args.at.lat;
    let rows = rows(&p, place);
    if args.json {
        return super::output::print_json(&rows);
    }
    let two = p.has_shining_companion();
    let extra = |r: &YearRow, width: usize| match r.companion_insolation_w_m2 {
        Some(q) if width == 0 => format!(",{q:.3}"),
        Some(q) => format!(" {q:>width$.1}"),
        None => String::new(),
    };
    if args.csv {
        say!(
            "day,date,year_fraction,daylight_h,noon_altitude_deg,insolation_w_m2{}",
            if two {
                ",companion_insolation_w_m2"
            } else {
                ""
            }
        );
        for r in &rows {
            say!(
                "{},{},{:.6},{:.4},{:.4},{:.3}{}",
                r.day,
                r.date,
                r.year_fraction,
                r.daylight_h,
                r.noon_altitude_deg,
                r.insolation_w_m2,
                extra(r, 0)
            );
        }
        return Ok(());
    }
    say!("{} at {:.3}°, {:.3}°", p.spec().name, lat, args.at.lon);
    super::output::caution(&p);
    say!(
        "{:>6} {:>16} {:>8} {:>10} {:>12} {:>12}{}",
        "day",
        "date",
        "year",
        "daylight",
        "noon alt °",
        "insol W/m²",
        if two { "  star 1 W/m²" } else { "" }
    );
    for r in &rows {
        say!(
            "{:>6} {:>16} {:>8.4} {:>10} {:>12.2} {:>12.1}{}",
            r.day,
            r.date,
            r.year_fraction,
            super::output::hm(Some(r.daylight_h)),
            r.noon_altitude_deg,
            r.insolation_w_m2,
            extra(r, 12)
        );
    }
    Ok(())
}

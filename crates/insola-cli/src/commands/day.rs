//! `insola day WORLD --lat DEG [--lon DEG] (--day N | --date DATE | --utc YYYY-MM-DD)`: events of
//! a local day.

use insola::Planet;
use insola::events::{Crossings, DayEvents, Polar};
use serde::Serialize;

/// Arguments of `insola day`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// The world and the place on it.
    #[command(flatten)]
    at: super::output::WorldPlace,
    /// Local day number (day 0 contains time zero).
    #[arg(
        long,
        conflicts_with_all = ["utc", "date"],
        required_unless_present_any = ["utc", "date"],
        allow_hyphen_values = true
    )]
    day: Option<i64>,
    /// A date on the world's calendar: YEAR-DAY (day of the year from 1) or YEAR/MONTH/DAY
    /// (month name or number from 1); a time (THH:MM) may follow and picks the observer's local
    /// day holding that instant, otherwise the local day holding the calendar day's noon at the
    /// prime meridian. Examples: 3-117, 3/Frostwane/12.
    #[arg(long, conflicts_with = "utc", allow_hyphen_values = true)]
    date: Option<String>,
    /// A UTC date (YYYY-MM-DD), for worlds tied to UTC: the local mean solar day of that date.
    #[arg(long)]
    utc: Option<String>,
    /// Print JSON instead of text.
    #[arg(long)]
    json: bool,
}

/// Events of a local day, in hours of local mean solar time.
#[derive(Debug, Serialize)]
pub struct DayReport {
    /// Local day number.
    pub day: i64,
    /// The calendar date (at the prime meridian) at this local day's noon, as text
    /// (YEAR/MONTH/DAY or YEAR-DAY).
    pub date: String,
    /// Weekday name or number from 1, if the calendar has weeks.
    pub weekday: Option<String>,
    /// Length of the local (mean solar) day, hours.
    pub day_length_h: f64,
    /// Rise of the star's upper limb (standard altitude), local hours; null if none.
    pub sunrise_h: Option<f64>,
    /// Set, local hours; null if none.
    pub sunset_h: Option<f64>,
    /// Upper transit, local hours; null if none this day.
    pub transit_h: Option<f64>,
    /// Altitude at transit, degrees.
    pub transit_altitude_deg: Option<f64>,
    /// Daylight: time the star is up during this local day, hours.
    pub daylight_h: f64,
    /// "day" (never sets), "night" (never rises) or null.
    pub polar: Option<Polar>,
    /// Civil dawn (−6°), local hours.
    pub civil_dawn_h: Option<f64>,
    /// Civil dusk, local hours.
    pub civil_dusk_h: Option<f64>,
    /// Nautical dawn (−12°), local hours.
    pub nautical_dawn_h: Option<f64>,
    /// Nautical dusk, local hours.
    pub nautical_dusk_h: Option<f64>,
    /// Astronomical dawn (−18°), local hours.
    pub astronomical_dawn_h: Option<f64>,
    /// Astronomical dusk, local hours.
    pub astronomical_dusk_h: Option<f64>,
    /// Each star after the primary (the fields above are the primary's); empty on a one-star
    /// world.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub other_stars: Vec<DayStarReport>,
}

/// Rise, transit and set of one star after the primary during the local day.
#[derive(Debug, Serialize)]
pub struct DayStarReport {
    /// Index of the star (1: the companion).
    pub star: usize,
    /// First rise this day, local hours; null if none.
    pub rise_h: Option<f64>,
    /// First upper transit this day, local hours; null if none.
    pub transit_h: Option<f64>,
    /// First set this day, local hours; null if none.
    pub set_h: Option<f64>,
}

/// Rise, transit and set of each star after the primary during the local day of `ev`.
fn other_stars(p: &Planet, place: insola::Place, ev: &DayEvents) -> Vec<DayStarReport> {
    use insola::sky_events::{EventFilter, EventGroup, SkyBody, SkyEventKind};
    let filter = EventFilter::only([EventGroup::RiseSet, EventGroup::Transit]);
    let events = p
        .sky_events_between(
            place,
            ev.day_start_s,
            ev.day_start_s + ev.day_length_s,
            &filter,
        )
        .unwrap_or_default();
    p.shining_stars()
        .skip(1)
        .map(|k| {
            let first = |want: fn(SkyBody) -> SkyEventKind| {
                events
                    .iter()
                    .find(|e| e.kind == want(SkyBody::Star(k)))
                    .map(|e| ev.local_hours(e.at_s))
            };
            DayStarReport {
                star: k,
                rise_h: first(SkyEventKind::Rise),
                transit_h: first(SkyEventKind::Transit),
                set_h: first(SkyEventKind::Set),
            }
        })
        .collect()
}

/// Builds the report from the core's events.
pub fn report(p: &Planet, day: i64, ev: &DayEvents) -> DayReport {
    let date = p.date_at(ev.day_start_s + 0.5 * ev.day_length_s);
    let h = |t: Option<f64>| t.map(|t| ev.local_hours(t));
    let pair = |c: &Crossings| (h(c.rise_s), h(c.set_s));
    let (civil_dawn_h, civil_dusk_h) = pair(&ev.civil);
    let (nautical_dawn_h, nautical_dusk_h) = pair(&ev.nautical);
    let (astronomical_dawn_h, astronomical_dusk_h) = pair(&ev.astronomical);
    DayReport {
        day,
        weekday: date
            .weekday_name
            .clone()
            .or_else(|| date.weekday.map(|w| (w + 1).to_string())),
        date: date.text(),
        day_length_h: ev.day_length_s / 3600.0,
        sunrise_h: h(ev.sunlight.rise_s),
        sunset_h: h(ev.sunlight.set_s),
        transit_h: h(ev.transit_s),
        transit_altitude_deg: ev.transit_altitude_rad.map(f64::to_degrees),
        daylight_h: ev.sunlight.time_above_s / 3600.0,
        polar: ev.sunlight.polar,
        civil_dawn_h,
        civil_dusk_h,
        nautical_dawn_h,
        nautical_dusk_h,
        astronomical_dawn_h,
        astronomical_dusk_h,
        other_stars: Vec::new(),
    }
}

/// The local day number for `--day` or `--utc`.
pub fn resolve_day(
    p: &Planet,
    day: Option<i64>,
    date: Option<&str>,
    utc: Option<&str>,
    lon_deg: f64,
) -> Result<i64, String> {
    if let Some(text) = date {
        let mut t = super::sky::resolve_date(p, text)?;
        if !text.contains(['T', 't', ' ']) || !text.contains(':') {
            t += 0.5 * p.day_s();
        }
        return Ok(p.local_day_count(t, lon_deg.to_radians()).floor() as i64);
    }
    match (day, utc) {
        (Some(d), _) => Ok(d),
        (None, Some(text)) => {
            let midnight =
                insola::world::parse_utc_unix_s(text).map_err(|e| format!("--utc {text}: {e}"))?;
            // Local mean noon of that date at the observer's longitude.
            let noon = midnight + 43_200.0 - lon_deg / 15.0 * 3600.0;
            let t = p.time_of_utc(noon).ok_or_else(|| {
                format!(
                    "world `{}` is not tied to UTC (no epoch.utc); use --day",
                    p.spec().name
                )
            })?;
            Ok(p.local_day_count(t, lon_deg.to_radians()).floor() as i64)
        }
        (None, None) => Err("give --day, --date or --utc".into()),
    }
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let (p, place) = args.at.load()?;
    let lat = args.at.lat;
    let day = resolve_day(
        &p,
        args.day,
        args.date.as_deref(),
        args.utc.as_deref(),
        args.at.lon,
    )?;
    let ev = p.day_events(day, place);
    let mut r = report(&p, day, &ev);
    r.other_stars = other_stars(&p, place, &ev);
    if args.json {
        return super::output::print_json(&r);
    }
    use super::output::hm;
    say!(
        "{} at {:.3}°, {:.3}° — local day {} ({:.2} h long)",
        p.spec().name,
        lat,
        args.at.lon,
        day,
        r.day_length_h
    );
    super::output::caution(&p);
    say!(
        "  date {}{}",
        r.date,
        r.weekday
            .as_ref()
            .map_or(String::new(), |w| format!(", weekday {w}"))
    );
    if !r.other_stars.is_empty() {
        say!(
            "  primary (star 0); twilight below is the primary's, `insola events` gives the combined light's"
        );
    }
    match r.polar {
        Some(Polar::Day) => say!("  the star never sets (polar day)"),
        Some(Polar::Night) => say!("  the star never rises (polar night)"),
        None => say!(
            "  rise {}   transit {}   set {}",
            hm(r.sunrise_h),
            hm(r.transit_h),
            hm(r.sunset_h)
        ),
    }
    for o in &r.other_stars {
        say!(
            "  star {}: rise {}   transit {}   set {}",
            o.star,
            hm(o.rise_h),
            hm(o.transit_h),
            hm(o.set_h)
        );
    }
    if let Some(a) = r.transit_altitude_deg {
        say!("  transit altitude {a:.2}°");
    }
    say!("  daylight {} (star up)", hm(Some(r.daylight_h)));
    say!(
        "  civil twilight        {} – {}",
        hm(r.civil_dawn_h),
        hm(r.civil_dusk_h)
    );
    say!(
        "  nautical twilight     {} – {}",
        hm(r.nautical_dawn_h),
        hm(r.nautical_dusk_h)
    );
    say!(
        "  astronomical twilight {} – {}",
        hm(r.astronomical_dawn_h),
        hm(r.astronomical_dusk_h)
    );
    Ok(())
}

//! `insola events WORLD --lat DEG [--lon DEG] (--from DAYS | --from-utc ISO) (--to DAYS |
//! --to-utc ISO) [--kinds LIST] [--json | --csv]`: every event of the sky in an interval, in
//! time order.

use insola::occlusion::Occluder;
use insola::sky_events::{EclipseStage, EventFilter, EventGroup, SkyBody, SkyEvent, SkyEventKind};
use insola::{Place, Planet};
use serde::Serialize;

use super::output::CAUTION;

/// Arguments of `insola events`.
#[derive(Debug, clap::Args)]
#[command(after_help = CAUTION)]
pub struct Args {
    /// The world and the place on it.
    #[command(flatten)]
    at: super::output::WorldPlace,
    /// Start: solar days since the world's time zero (fractional; default 0).
    #[arg(long, conflicts_with = "from_utc", allow_hyphen_values = true)]
    from: Option<f64>,
    /// Start as a UTC instant or date (RFC 3339 or YYYY-MM-DD), for worlds tied to UTC.
    #[arg(long, conflicts_with = "from_date")]
    from_utc: Option<String>,
    /// Start as a date of the world's calendar: `YEAR-DAY` (day of year from 1) or
    /// `YEAR/MONTH/DAY`, optionally with `THH:MM`.
    #[arg(long, conflicts_with = "from", allow_hyphen_values = true)]
    from_date: Option<String>,
    /// End (not included): solar days since time zero.
    #[arg(
        long,
        conflicts_with = "to_utc",
        conflicts_with = "to_date",
        required_unless_present_any = ["to_utc", "to_date"],
        allow_hyphen_values = true
    )]
    to: Option<f64>,
    /// End (not included) as a UTC instant or date, for worlds tied to UTC.
    #[arg(long, conflicts_with = "to_date")]
    to_utc: Option<String>,
    /// End (not included) as a date of the world's calendar (syntax as for `--from-date`).
    #[arg(long, allow_hyphen_values = true)]
    to_date: Option<String>,
    /// Which events, comma-separated: rise-set, transit, twilight, day, year, season,
    /// moon-phase, star-eclipse, moon-eclipse; `eclipse` for both eclipse kinds; `all`
    /// (default: all but day).
    #[arg(long, value_delimiter = ',')]
    kinds: Vec<String>,
    /// Print JSON instead of a table.
    #[arg(long, conflicts_with = "csv")]
    json: bool,
    /// Print CSV instead of a table (the caution goes to standard error).
    #[arg(long)]
    csv: bool,
}

/// One event, as printed.
#[derive(Debug, Serialize)]
pub struct EventRow {
    /// World time, seconds since time zero.
    pub t_s: f64,
    /// Solar days since time zero.
    pub day: f64,
    /// The instant in UTC, for worlds tied to UTC.
    pub utc: Option<String>,
    /// The calendar date and clock at the prime meridian.
    pub date: String,
    /// Local mean solar time at the place, hours.
    pub local_time_h: f64,
    /// The event's group (the `--kinds` name).
    pub group: String,
    /// The event in words, with the moons' names.
    pub text: String,
    /// The event as the core gives it.
    pub kind: SkyEventKind,
}

/// The whole listing.
#[derive(Debug, Serialize)]
pub struct EventsReport {
    /// World name.
    pub world: String,
    /// Latitude, degrees.
    pub lat_deg: f64,
    /// Longitude, degrees.
    pub lon_deg: f64,
    /// Start, world seconds.
    pub from_s: f64,
    /// End (not included), world seconds.
    pub to_s: f64,
    /// The events, in time order.
    pub events: Vec<EventRow>,
    /// Read this before using the numbers.
    pub caution: &'static str,
}

/// The filter for `--kinds`.
pub fn parse_kinds(kinds: &[String]) -> Result<EventFilter, String> {
    if kinds.is_empty() {
        return Ok(EventFilter::only(
            EventGroup::ALL
                .into_iter()
                .filter(|g| *g != EventGroup::NewDay),
        ));
    }
    let mut groups = Vec::new();
    for name in kinds.iter().map(|k| k.trim()) {
        match name {
            "all" => groups.extend(EventGroup::ALL),
            "eclipse" => groups.extend([EventGroup::StarEclipse, EventGroup::MoonEclipse]),
            _ => groups.push(EventGroup::from_name(name).ok_or_else(|| {
                let known: Vec<&str> = EventGroup::ALL.iter().map(|g| g.name()).collect();
                format!(
                    "--kinds: unknown kind `{name}`; known: {}, eclipse, all",
                    known.join(", ")
                )
            })?),
        }
    }
    Ok(EventFilter::only(groups))
}

/// A moon's name from the world file, or `moon N`.
fn moon_name(p: &Planet, i: usize) -> String {
    p.spec()
        .moons
        .get(i)
        .map_or_else(|| format!("moon {i}"), |m| m.name.clone())
}

/// `star` on a one-star world; `primary` and `companion` on a world of two.
fn star_name(p: &Planet, k: usize) -> String {
    match (p.star_count(), k) {
        (1, _) => SkyBody::Star(k).to_string(),
        (_, 0) => "primary".into(),
        (_, 1) => "companion".into(),
        _ => SkyBody::Star(k).to_string(),
    }
}

fn body_name(p: &Planet, body: SkyBody) -> String {
    match body {
        SkyBody::Star(k) => star_name(p, k),
        SkyBody::Moon(i) => moon_name(p, i),
    }
}

/// The event in words, moons by name.
pub fn describe(p: &Planet, kind: &SkyEventKind) -> String {
    let stage = |s: &EclipseStage| s.to_string();
    match kind {
        SkyEventKind::Rise(b) => format!("{} rises", body_name(p, *b)),
        SkyEventKind::Set(b) => format!("{} sets", body_name(p, *b)),
        SkyEventKind::Transit(b) => format!("{} transits", body_name(p, *b)),
        SkyEventKind::MoonPhase { moon, phase } => format!("{} {phase}", moon_name(p, *moon)),
        SkyEventKind::StarEclipse { star, by, stage: s } => {
            let by = match by {
                Occluder::Moon(i) => moon_name(p, *i),
                Occluder::Star(k) => format!("the {}", star_name(p, *k)),
            };
            format!(
                "eclipse of the {} by {by} {}",
                star_name(p, *star),
                stage(s)
            )
        }
        SkyEventKind::MoonEclipse { moon, stage: s } => {
            format!("eclipse of {} {}", moon_name(p, *moon), stage(s))
        }
        other => other.to_string(),
    }
}

fn row(p: &Planet, place: Place, e: &SkyEvent) -> EventRow {
    let date = p.date_at(e.at_s);
    let month = match &date.month_name {
        Some(m) => format!("{m} {}", date.day_of_month),
        None => format!("day {}", date.day_of_month),
    };
    EventRow {
        t_s: e.at_s,
        day: p.solar_days_since_zero(e.at_s),
        utc: p
            .utc_at_zero_unix_s()
            .map(|zero| insola::world::format_utc(zero + e.at_s)),
        date: format!(
            "year {}, {month}, {}",
            date.year,
            super::output::hm(Some(date.hour_of_day))
        ),
        local_time_h: p.local_mean_time_fraction(e.at_s, place.longitude_rad) * p.day_s() / 3600.0,
        group: e.kind.group().name().to_string(),
        text: describe(p, &e.kind),
        kind: e.kind,
    }
}

/// Builds the report.
pub fn report(
    p: &Planet,
    place: Place,
    from_s: f64,
    to_s: f64,
    filter: &EventFilter,
) -> Result<EventsReport, String> {
    let events = p
        .sky_events_between(place, from_s, to_s, filter)
        .map_err(|e| e.to_string())?;
    Ok(EventsReport {
        world: p.spec().name.clone(),
        lat_deg: place.latitude_rad.to_degrees(),
        lon_deg: place.longitude_rad.to_degrees(),
        from_s,
        to_s,
        events: events.iter().map(|e| row(p, place, e)).collect(),
        caution: CAUTION,
    })
}

/// Quotes a CSV field when it needs it (RFC 4180).
fn csv_field(text: &str) -> String {
    if text.contains([',', '"', '\n']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let (p, place) = args.at.load()?;
    let from_s = match (
        args.from,
        args.from_date.as_deref(),
        args.from_utc.as_deref(),
    ) {
        (None, None, None) => 0.0,
        (day, date, utc) => super::sky::resolve_time(&p, day, date, utc).map_err(|e| {
            e.replace("--day", "--from")
                .replace("--date", "--from-date")
                .replace("--utc", "--from-utc")
        })?,
    };
    let to_s =
        super::sky::resolve_time(&p, args.to, args.to_date.as_deref(), args.to_utc.as_deref())
            .map_err(|e| {
                e.replace("--day", "--to")
                    .replace("--date", "--to-date")
                    .replace("--utc", "--to-utc")
            })?;
    let filter = parse_kinds(&args.kinds)?;
    let r = report(&p, place, from_s, to_s, &filter)?;
    if args.json {
        return super::output::print_json(&r);
    }
    if args.csv {
        eprintln!("insola: {CAUTION}");
        say!("t_s,day,utc,date,local_time_h,group,event");
        for e in &r.events {
            say!(
                "{:.3},{:.6},{},{},{:.4},{},{}",
                e.t_s,
                e.day,
                e.utc.as_deref().unwrap_or(""),
                csv_field(&e.date),
                e.local_time_h,
                e.group,
                csv_field(&e.text)
            );
        }
        return Ok(());
    }
    say!(
        "{} at {:.3}°, {:.3}° — days {:.3} to {:.3}: {} events",
        r.world,
        args.at.lat,
        args.at.lon,
        p.solar_days_since_zero(from_s),
        p.solar_days_since_zero(to_s),
        r.events.len()
    );
    let utc = p.utc_at_zero_unix_s().is_some();
    if utc {
        say!(
            "  {:>12}  {:<24}  {:>6}  event",
            "world day",
            "UTC",
            "local"
        );
    } else {
        say!(
            "  {:>12}  {:<34}  {:>6}  event",
            "world day",
            "calendar (prime meridian)",
            "local"
        );
    }
    for e in &r.events {
        let when = if utc {
            format!("{:<24}", e.utc.as_deref().unwrap_or(""))
        } else {
            format!("{:<34}", e.date)
        };
        say!(
            "  {:>12.5}  {when}  {}  {}",
            e.day,
            super::output::hm(Some(e.local_time_h)),
            e.text
        );
    }
    say!("");
    say!("{CAUTION}");
    Ok(())
}

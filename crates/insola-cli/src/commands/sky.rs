//! `insola sky WORLD --lat DEG [--lon DEG] (--day DAYS | --date DATE | --utc ISO8601)`.

use insola::calendar::CalendarDate;
use insola::lighting::LightMode;
use insola::{Place, Planet};
use serde::Serialize;

/// Arguments of `insola sky`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// The world and the place on it.
    #[command(flatten)]
    at: super::output::WorldPlace,
    /// Solar days since the world's time zero (fractional).
    #[arg(
        long,
        conflicts_with_all = ["utc", "date"],
        required_unless_present_any = ["utc", "date"],
        allow_hyphen_values = true
    )]
    day: Option<f64>,
    /// A date and time on the world's calendar: YEAR-DAY (day of the year from 1) or
    /// YEAR/MONTH/DAY (month name or number from 1), optionally followed by THH:MM[:SS] in
    /// local mean time at the prime meridian (midnight if left out). Examples: 3-117T13:30,
    /// 3/Frostwane/12T06:00, -40-1.
    #[arg(long, conflicts_with = "utc", allow_hyphen_values = true)]
    date: Option<String>,
    /// A UTC instant (RFC 3339), for worlds tied to UTC.
    #[arg(long)]
    utc: Option<String>,
    /// Light above the atmosphere instead of at the ground.
    #[arg(long)]
    top_of_atmosphere: bool,
    /// Print JSON instead of text.
    #[arg(long)]
    json: bool,
}

/// The sky at one place and time.
#[derive(Debug, Serialize)]
pub struct SkyReport {
    /// Fractional solar days since time zero.
    pub day: f64,
    /// The instant on the world's calendar (at the prime meridian).
    pub date: CalendarDate,
    /// World time in seconds since time zero.
    pub t_s: f64,
    /// Geometric altitude of the star's centre, without refraction, degrees.
    pub altitude_deg: f64,
    /// Azimuth clockwise from north, degrees.
    pub azimuth_deg: f64,
    /// Declination, degrees.
    pub declination_deg: f64,
    /// Right ascension, degrees.
    pub right_ascension_deg: f64,
    /// Hour angle in the sense the sky turns (positive after transit), degrees.
    pub hour_angle_deg: f64,
    /// The star's ecliptic longitude, degrees.
    pub ecliptic_longitude_deg: f64,
    /// Distance to the star, AU.
    pub distance_au: f64,
    /// Equation of time, minutes of the world's clock.
    pub equation_of_time_min: f64,
    /// Top-of-atmosphere insolation on a horizontal surface, W m⁻².
    pub toa_insolation_w_m2: f64,
    /// Unit vector toward the star, [east, north, up].
    pub direction_enu: [f64; 3],
    /// Local mean solar time, hours.
    pub local_mean_time_h: f64,
    /// Direct-beam illuminance on a surface facing the star, lux.
    pub direct_illuminance_lux: f64,
    /// Diffuse sky illuminance on a horizontal surface, lux.
    pub sky_illuminance_lux: f64,
    /// Colour of the star's light, linear sRGB (max 1).
    pub light_rgb_linear: [f64; 3],
    /// Correlated colour temperature of the star's light, kelvin.
    pub light_cct_k: f64,
    /// Sky colour, linear sRGB (max 1).
    pub sky_rgb_linear: [f64; 3],
    /// Fraction of the star's disc covered by moons.
    pub star_eclipse_fraction: f64,
    /// Twilight phase: day, civil, nautical, astronomical or night.
    pub twilight: String,
    /// Each moon.
    pub moons: Vec<MoonReport>,
    /// Each star after the primary (the fields above are the primary's, except the twilight,
    /// which is of the combined light); empty on a one-star world.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub other_stars: Vec<StarReport>,
}

/// One star after the primary in the sky report.
#[derive(Debug, Serialize)]
pub struct StarReport {
    /// Index of the star (1: the companion).
    pub star: usize,
    /// Geometric altitude of its centre, degrees.
    pub altitude_deg: f64,
    /// Azimuth, degrees.
    pub azimuth_deg: f64,
    /// Distance, AU.
    pub distance_au: f64,
    /// Top-of-atmosphere insolation from it on a horizontal surface, W m⁻².
    pub toa_insolation_w_m2: f64,
    /// Direct-beam illuminance on a surface facing it, lux.
    pub direct_illuminance_lux: f64,
    /// Correlated colour temperature of its light, kelvin.
    pub light_cct_k: f64,
    /// Fraction of its disc hidden (by a moon or the other star).
    pub eclipse_fraction: f64,
}

/// One moon in the sky report.
#[derive(Debug, Serialize)]
pub struct MoonReport {
    /// Name.
    pub name: String,
    /// Altitude of the moon's centre, degrees.
    pub altitude_deg: f64,
    /// Azimuth, degrees.
    pub azimuth_deg: f64,
    /// Phase angle, degrees (0 full).
    pub phase_angle_deg: f64,
    /// Illuminated fraction of the disc.
    pub illuminated_fraction: f64,
    /// Illuminance from the moon on a surface facing it, lux.
    pub illuminance_lux: f64,
    /// Fraction of the moon's light lost to the planet's shadow.
    pub eclipse_fraction: f64,
}

/// Resolves `--date` (a calendar date and time) to world seconds.
pub fn resolve_date(p: &Planet, text: &str) -> Result<f64, String> {
    p.time_of_date_text(text)
        .map_err(|e| format!("--date {text}: {e}"))
}

/// Resolves `--day` / `--date` / `--utc` to world seconds.
pub fn resolve_time(
    p: &Planet,
    day: Option<f64>,
    date: Option<&str>,
    utc: Option<&str>,
) -> Result<f64, String> {
    if let Some(text) = date {
        return resolve_date(p, text);
    }
    match (day, utc) {
        (Some(d), _) if d.is_finite() => Ok(p.time_of_solar_days(d)),
        (Some(d), _) => Err(format!("--day {d} is not a finite number")),
        (None, Some(text)) => {
            let unix =
                insola::world::parse_utc_unix_s(text).map_err(|e| format!("--utc {text}: {e}"))?;
            p.time_of_utc(unix).ok_or_else(|| {
                format!(
                    "world `{}` is not tied to UTC (no epoch.utc); use --day",
                    p.spec().name
                )
            })
        }
        (None, None) => Err("give --day, --date or --utc".into()),
    }
}

/// Builds the report.
pub fn report(p: &Planet, t: f64, place: Place, mode: LightMode) -> SkyReport {
    let i = p.star_instant(t);
    let s = p.star_position_at(&i, place);
    let l = p.lighting(t, place, mode);
    let d = s.direction_enu;
    SkyReport {
        day: p.solar_days_since_zero(t),
        date: p.date_at(t),
        t_s: t,
        altitude_deg: s.altitude_rad.to_degrees(),
        azimuth_deg: s.azimuth_rad.to_degrees(),
        declination_deg: i.declination_rad.to_degrees(),
        right_ascension_deg: i.right_ascension_rad.to_degrees(),
        hour_angle_deg: s.hour_angle_rad.to_degrees(),
        ecliptic_longitude_deg: i.ecliptic_longitude_rad.to_degrees(),
        distance_au: i.distance_au,
        equation_of_time_min: p.equation_of_time_min(t),
        toa_insolation_w_m2: s.toa_insolation_w_m2,
        direction_enu: [d.x, d.y, d.z],
        local_mean_time_h: p.local_mean_time_fraction(t, place.longitude_rad) * p.day_s() / 3600.0,
        direct_illuminance_lux: l.star.illuminance_lux,
        sky_illuminance_lux: l.sky.illuminance_lux,
        light_rgb_linear: l.star.colour_linear_srgb,
        light_cct_k: l.star.cct_k,
        sky_rgb_linear: l.sky.colour_linear_srgb,
        star_eclipse_fraction: l.star_eclipse_fraction,
        twilight: format!("{:?}", l.twilight).to_lowercase(),
        moons: l
            .moons
            .iter()
            .map(|m| MoonReport {
                name: m.name.clone(),
                altitude_deg: m.light.altitude_rad.to_degrees(),
                azimuth_deg: m.light.azimuth_rad.to_degrees(),
                phase_angle_deg: m.phase_angle_rad.to_degrees(),
                illuminated_fraction: m.illuminated_fraction,
                illuminance_lux: m.light.illuminance_lux,
                eclipse_fraction: m.eclipse_fraction,
            })
            .collect(),
        other_stars: l
            .other_stars
            .iter()
            .map(|o| StarReport {
                star: o.star,
                altitude_deg: o.light.altitude_rad.to_degrees(),
                azimuth_deg: o.light.azimuth_rad.to_degrees(),
                distance_au: p
                    .star_instant_of(o.star, t)
                    .map_or(f64::NAN, |i| i.distance_au),
                toa_insolation_w_m2: o.toa_insolation_w_m2,
                direct_illuminance_lux: o.light.illuminance_lux,
                light_cct_k: o.light.cct_k,
                eclipse_fraction: o.eclipse_fraction,
            })
            .collect(),
    }
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let (p, place) = args.at.load()?;
    let lat = args.at.lat;
    let t = resolve_time(&p, args.day, args.date.as_deref(), args.utc.as_deref())?;
    let mode = if args.top_of_atmosphere {
        LightMode::TopOfAtmosphere
    } else {
        LightMode::Ground
    };
    let r = report(&p, t, place, mode);
    if args.json {
        return super::output::print_json(&r);
    }
    say!(
        "{} at {:.3}°, {:.3}° — day {:.4} (local mean time {:.2} h)",
        p.spec().name,
        lat,
        args.at.lon,
        r.day,
        r.local_mean_time_h
    );
    super::output::caution(&p);
    say!("  date      {} at the prime meridian", r.date.label());
    say!(
        "  star      altitude {:8.3}°  azimuth {:8.3}°  hour angle {:8.3}°",
        r.altitude_deg,
        r.azimuth_deg,
        r.hour_angle_deg
    );
    say!(
        "            declination {:.3}°  right ascension {:.3}°  ecliptic longitude {:.3}°",
        r.declination_deg,
        r.right_ascension_deg,
        r.ecliptic_longitude_deg
    );
    say!(
        "            distance {:.5} AU  equation of time {:+.2} min",
        r.distance_au,
        r.equation_of_time_min
    );
    say!(
        "  light     direct {:.4e} lx  sky {:.4e} lx  CCT {:.0} K  twilight: {}",
        r.direct_illuminance_lux,
        r.sky_illuminance_lux,
        r.light_cct_k,
        r.twilight
    );
    say!(
        "            top-of-atmosphere insolation {:.1} W/m²",
        r.toa_insolation_w_m2
    );
    for o in &r.other_stars {
        say!(
            "  star {}    altitude {:8.3}°  azimuth {:8.3}°  distance {:.5} AU  direct {:.4e} lx  CCT {:.0} K  insolation {:.1} W/m²{}",
            o.star,
            o.altitude_deg,
            o.azimuth_deg,
            o.distance_au,
            o.direct_illuminance_lux,
            o.light_cct_k,
            o.toa_insolation_w_m2,
            if o.eclipse_fraction > 0.0 {
                format!("  eclipsed {:.0} %", 100.0 * o.eclipse_fraction)
            } else {
                String::new()
            }
        );
    }
    for m in &r.moons {
        say!(
            "  moon {:<10} altitude {:7.2}°  azimuth {:7.2}°  lit {:5.1} %  {:.3e} lx{}",
            m.name,
            m.altitude_deg,
            m.azimuth_deg,
            100.0 * m.illuminated_fraction,
            m.illuminance_lux,
            if m.eclipse_fraction > 0.0 {
                format!("  eclipsed {:.0} %", 100.0 * m.eclipse_fraction)
            } else {
                String::new()
            }
        );
    }
    Ok(())
}

//! `insola sky WORLD --lat DEG [--lon DEG] (--day DAYS | --date DATE | --utc ISO8601)`, and
//! with `--analemma --png FILE` the star at that clock time on every day of the following year
//! (PNG or SVG by the file's extension; see [`analemma`]).

use insola::calendar::CalendarDate;
use insola::constants::SECONDS_PER_DAY;
use insola::lighting::LightMode;
use insola::star_track::TrackTimes;
use insola::{Place, Planet};
use serde::Serialize;

use super::plot::analemma::Analemma;
use super::plot::{lat_text, lon_text};

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
    /// Draw the analemma: the star at the same clock time every day for one year from the
    /// given instant (needs --png).
    #[arg(long, requires = "png")]
    analemma: bool,
    /// With --analemma: the picture file (`.png` or `.svg`, 960 × 640 px).
    #[arg(long, value_name = "FILE", requires = "analemma")]
    png: Option<String>,
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
    /// Fraction of the star's light removed by moons covering its disc and by the ring's
    /// shadow.
    pub star_eclipse_fraction: f64,
    /// Twilight phase: day, civil, nautical, astronomical or night.
    pub twilight: String,
    /// Each moon.
    pub moons: Vec<MoonReport>,
    /// The ring in the sky and its shadow here (left out on worlds without a ring).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub ring: Option<super::ring::RingSkyReport>,
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
        ring: super::ring::sky(p, t, place),
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

/// The analemma from `t0_s`: one sample per mean solar day (per standard day on a locked
/// world, where the sky barely moves) over one year, from the core's time series.
pub fn analemma(p: &Planet, t0_s: f64, place: Place) -> Result<Analemma, String> {
    let locked = p.spin().is_tidally_locked();
    let step_s = if locked { SECONDS_PER_DAY } else { p.day_s() };
    let count = (p.year_s() / step_s).round().clamp(2.0, 100_000.0) as usize;
    let times = TrackTimes::Even {
        start_s: t0_s,
        step_s,
        count,
    };
    let mut track = vec![p.star_position(t0_s, place); count];
    p.star_track_into(place, times, &mut track)
        .map_err(|e| e.to_string())?;
    // Azimuths unwrapped around their circular mean, so a figure across north stays whole.
    let (sy, sx) = track.iter().fold((0.0, 0.0), |(y, x), s| {
        let (sa, ca) = s.azimuth_rad.sin_cos();
        (y + sa, x + ca)
    });
    let mid = f64::atan2(sy, sx).to_degrees();
    let samples: Vec<_> = track
        .iter()
        .map(|s| {
            let az = s.azimuth_rad.to_degrees();
            let rel = (az - mid + 180.0).rem_euclid(360.0) - 180.0;
            (mid + rel, s.altitude_rad.to_degrees())
        })
        .collect();
    let m = p.season_marks_after(t0_s);
    let nearest = |t: f64| ((t - t0_s) / step_s).round().rem_euclid(count as f64) as usize;
    let marks = [
        (m.northward_equinox_s, "equinox (N spring)"),
        (m.northern_solstice_s, "N solstice"),
        (m.southward_equinox_s, "equinox (S spring)"),
        (m.southern_solstice_s, "S solstice"),
    ]
    .map(|(t, name)| (samples[nearest(t).min(count - 1)], name))
    .to_vec();
    let lat = place.latitude_rad.to_degrees();
    let lon = place.longitude_rad.to_degrees();
    let lmt_h = p.local_mean_time_fraction(t0_s, place.longitude_rad) * p.day_s() / 3600.0;
    let when = if locked {
        format!(
            "every standard day (24 h) for one year from day {:.2}",
            p.solar_days_since_zero(t0_s)
        )
    } else {
        format!(
            "at local mean time {} every day for one year from day {:.2}",
            super::output::hm(Some(lmt_h)),
            p.solar_days_since_zero(t0_s)
        )
    };
    Ok(Analemma {
        title: format!("{}: the star {when}", p.spec().name),
        subtitle: format!(
            "seen from {}, {}; {}",
            lat_text(lat),
            lon_text(lon),
            super::map::subtitle(p)
        ),
        note: super::map::footnote(
            p,
            &format!(
                "{count} samples, dark to pale through the year; geometric altitude without refraction. Circled: the days nearest the equinoxes and solstices."
            ),
        ),
        samples,
        marks,
    })
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
    if let (true, Some(path)) = (args.analemma, &args.png) {
        let chart = analemma(&p, t, place)?;
        super::plot::save(&chart, path)?;
    }
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
    if let Some(ring) = &r.ring {
        super::ring::print_sky(ring);
    }
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn earth_noon_analemma_spans_twice_the_obliquity() {
        // Outside check: at local noon the star's altitude is 90° − φ + δ, and over a year δ
        // runs between ±ε, so the noon analemma is 2ε tall and tops out at 90° − φ + ε
        // (textbook spherical astronomy, e.g. Meeus, Astronomical Algorithms, ch. 13; from
        // memory). ε is the Earth reference world's obliquity, 23.4392911° (84381.448″, the
        // J2000 value of the IAU 1976 precession; from memory).
        // Mean noon differs from true noon by the equation of time (under 17 min), which
        // lowers the altitude by well under 0.3° at 40° N.
        let p = crate::worlds::load("earth-reference").unwrap();
        let eps = p.spec().spin.obliquity_deg;
        let place = Place::from_degrees(40.0, 0.0).unwrap();
        let frac0 = p.local_mean_time_fraction(0.0, 0.0);
        let noon = (0.5 - frac0).rem_euclid(1.0) * p.day_s();
        let a = analemma(&p, noon, place).unwrap();
        let alt = |f: fn(f64, f64) -> f64, start: f64| a.samples.iter().map(|s| s.1).fold(start, f);
        let (lo, hi) = (alt(f64::min, 90.0), alt(f64::max, -90.0));
        assert!((hi - lo - 2.0 * eps).abs() < 0.3, "{lo} {hi}");
        assert!((hi - (50.0 + eps)).abs() < 0.3, "{hi}");
        // One sample a day for a year.
        assert!((a.samples.len() as f64 - 365.25).abs() < 1.0);
        // The figure stays around the south at noon in the north.
        assert!(a.samples.iter().all(|s| (s.0 - 180.0).abs() < 10.0));
    }
}

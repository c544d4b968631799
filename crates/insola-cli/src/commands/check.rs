//! `insola check WORLD`: validate and print derived facts and warnings.

use insola::Planet;
use insola::constants::SECONDS_PER_DAY;
use serde::Serialize;

/// Arguments of `insola check`.
#[derive(Debug, clap::Args)]
pub struct Args {
    /// A `*.world.ron` file or the name of a built-in world (see `insola worlds`).
    world: String,
    /// Print JSON instead of text.
    #[arg(long)]
    json: bool,
}

/// Derived facts about a world.
#[derive(Debug, Serialize)]
pub struct Facts {
    /// World name.
    pub name: String,
    /// Mean solar day in hours (null when tidally locked).
    pub solar_day_h: Option<f64>,
    /// Sidereal day in hours.
    pub sidereal_day_h: f64,
    /// Year in standard days of 86 400 s.
    pub year_days: f64,
    /// Mean solar days per year (null when tidally locked).
    pub year_solar_days: Option<f64>,
    /// Star rises in the west.
    pub retrograde: bool,
    /// One face always toward the star.
    pub tidally_locked: bool,
    /// Latitude of the tropics, degrees.
    pub tropic_lat_deg: f64,
    /// Latitude of the polar circles, degrees.
    pub polar_circle_lat_deg: f64,
    /// Tropics poleward of the polar circles.
    pub zones_overlap: bool,
    /// Lengths of the northern spring, summer, autumn and winter in standard days.
    pub season_lengths_days: [f64; 4],
    /// Flux at the mean distance, W m⁻².
    pub flux_at_mean_distance_w_m2: f64,
    /// Ratio of the flux at periapsis to the flux at apoapsis.
    pub flux_swing_ratio: f64,
    /// Angular diameter of the star at the mean distance, degrees.
    pub star_angular_diameter_deg: f64,
    /// Altitude of the star's centre at standard rise and set, degrees.
    pub standard_rise_altitude_deg: f64,
    /// Things a designer may want to know.
    pub warnings: Vec<String>,
}

/// Computes the facts of a planet.
pub fn facts(p: &Planet) -> Facts {
    let spec = &p.spec();
    let locked = p.spin().is_tidally_locked();
    let z = p.zone_latitudes();
    let s = p.season_lengths();
    let e = spec.orbit.eccentricity;
    let swing = ((1.0 + e) / (1.0 - e)).powi(2);
    let mut warnings = Vec::new();
    if spec.spin.obliquity_deg > 80.0 && spec.spin.obliquity_deg < 100.0 {
        warnings.push(format!(
            "tilt {:.1}° is near 90°: seasons this extreme are commonly held too harsh for people (common practice, no source)",
            spec.spin.obliquity_deg
        ));
    }
    if z.overlapping {
        warnings.push("tilt above 45°: the tropics lie poleward of the polar circles".into());
    }
    if p.flux_at_mean_distance_w_m2() < 0.5 * 1361.0
        || p.flux_at_mean_distance_w_m2() > 2.0 * 1361.0
    {
        warnings.push(format!(
            "flux {:.0} W/m² is far from Earth's 1361 W/m²: expect a frozen or scorched world without a tuned climate",
            p.flux_at_mean_distance_w_m2()
        ));
    }
    if swing > 2.0 {
        warnings.push(format!(
            "eccentric orbit: the star is {swing:.1}× brighter at periapsis than at apoapsis"
        ));
    }
    if !locked && p.spin().solar_day_s > p.year_s() {
        warnings.push("the solar day is longer than the year".into());
    }
    if locked {
        warnings.push(
            "tidally locked: the star stands still in the sky apart from a small wobble".into(),
        );
    }
    let days = |x: f64| x / SECONDS_PER_DAY;
    Facts {
        name: spec.name.clone(),
        solar_day_h: (!locked).then(|| p.spin().solar_day_s / 3600.0),
        sidereal_day_h: p.spin().sidereal_day_s / 3600.0,
        year_days: days(p.year_s()),
        year_solar_days: (!locked).then(|| p.year_in_solar_days()),
        retrograde: p.is_retrograde(),
        tidally_locked: locked,
        tropic_lat_deg: z.tropic_lat_deg,
        polar_circle_lat_deg: z.polar_circle_lat_deg,
        zones_overlap: z.overlapping,
        season_lengths_days: [
            days(s.spring_s),
            days(s.summer_s),
            days(s.autumn_s),
            days(s.winter_s),
        ],
        flux_at_mean_distance_w_m2: p.flux_at_mean_distance_w_m2(),
        flux_swing_ratio: swing,
        star_angular_diameter_deg: 2.0
            * (p.star_radius_m() / p.semi_major_axis_m())
                .asin()
                .to_degrees(),
        standard_rise_altitude_deg: p.standard_rise_altitude_rad().to_degrees(),
        warnings,
    }
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let p = crate::worlds::load(&args.world)?;
    let f = facts(&p);
    if args.json {
        return super::output::print_json(&f);
    }
    say!("{} — valid", f.name);
    if p.spec().reference {
        say!("  (validation reference world, not game content)");
    }
    match f.solar_day_h {
        Some(h) => say!("  solar day        {h:.4} h"),
        None => say!("  solar day        none (tidally locked)"),
    }
    say!("  sidereal day     {:.4} h", f.sidereal_day_h);
    say!("  year             {:.3} standard days", f.year_days);
    if let Some(n) = f.year_solar_days {
        say!("  solar days/year  {n:.3}");
    }
    say!(
        "  spin             {}",
        if f.retrograde {
            "backwards (star rises in the west)"
        } else {
            "forwards (star rises in the east)"
        }
    );
    say!("  tropics          ±{:.2}°", f.tropic_lat_deg);
    say!("  polar circles    ±{:.2}°", f.polar_circle_lat_deg);
    let [a, b, c, d] = f.season_lengths_days;
    say!("  seasons (north)  spring {a:.1} d, summer {b:.1} d, autumn {c:.1} d, winter {d:.1} d");
    say!(
        "  flux             {:.1} W/m² at mean distance ({:.2}× swing over the orbit)",
        f.flux_at_mean_distance_w_m2,
        f.flux_swing_ratio
    );
    say!(
        "  star disc        {:.3}° across; rises at {:.3}°",
        f.star_angular_diameter_deg,
        f.standard_rise_altitude_deg
    );
    for w in &f.warnings {
        say!("  warning: {w}");
    }
    Ok(())
}

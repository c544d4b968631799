//! `insola check WORLD`: validate and print derived facts and warnings.

use insola::Planet;
use insola::climate::{IceFreeAlbedo, insolation_weighted_cos_zenith};
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
    /// The same in the world's own mean solar days (null when tidally locked).
    pub season_lengths_local_days: Option<[f64; 4]>,
    /// Ice-free albedo law of the climate: `"sky"` (from the world's own sky, the default) or
    /// `"latitude"` (explicit `albedo_a0`/`albedo_a2`).
    pub albedo_law: String,
    /// Ice-free albedo the sky law gives this world at the equator and at the poles, whatever
    /// law the world uses (dimensionless).
    pub sky_albedo_equator_pole: [f64; 2],
    /// Ice-free albedo the world's own law gives at the equator and at the poles.
    pub albedo_equator_pole: [f64; 2],
    /// Flux at the mean distance, W m⁻².
    pub flux_at_mean_distance_w_m2: f64,
    /// Ratio of the flux at periapsis to the flux at apoapsis.
    pub flux_swing_ratio: f64,
    /// Angular diameter of the star at the mean distance, degrees.
    pub star_angular_diameter_deg: f64,
    /// Altitude of the star's centre at standard rise and set, degrees.
    pub standard_rise_altitude_deg: f64,
    /// The world's calendar.
    pub calendar: CalendarFacts,
    /// Equinoxes and solstices of the year of time zero on the calendar.
    pub season_dates: Vec<insola::calendar_design::SeasonDate>,
    /// How far each wanders over the leap rule's period.
    pub season_wander: Vec<insola::calendar_design::SeasonWander>,
    /// The second star, on a world with a companion.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub companion: Option<CompanionFacts>,
    /// Things a designer may want to know.
    pub warnings: Vec<String>,
}

/// The second star in a few numbers.
#[derive(Debug, Serialize)]
pub struct CompanionFacts {
    /// `circumbinary` (the planet orbits both) or `wide` (the planet orbits the primary).
    pub arrangement: String,
    /// Period of the pair, standard days.
    pub period_days: f64,
    /// Semi-major axis of the pair's relative orbit, AU.
    pub separation_au: f64,
    /// Eccentricity of the pair's orbit.
    pub eccentricity: f64,
    /// The companion's flux at the planet's mean distance, W m⁻².
    pub flux_at_mean_distance_w_m2: f64,
    /// Effective temperature of the companion, kelvin.
    pub temperature_k: f64,
    /// The Holman & Wiegert (1999) stability limit on the planet's semi-major axis, AU
    /// (innermost stable orbit for circumbinary, outermost for wide).
    pub stability_limit_au: f64,
}

/// The companion's facts, if the world has one.
fn companion_facts(p: &Planet) -> Option<CompanionFacts> {
    use insola::world::{CompanionArrangement, holman_wiegert_p_type, holman_wiegert_s_type};
    let c = p.companion()?;
    let spec = p.spec().companion.as_ref()?;
    let pair = &c.pair;
    let total = pair.primary_mass_m_sun + pair.companion_mass_m_sun;
    let a_b = pair.separation_m / insola::constants::AU_M;
    let (arrangement, limit) = match pair.arrangement {
        CompanionArrangement::Circumbinary => (
            "circumbinary",
            holman_wiegert_p_type(
                pair.primary_mass_m_sun.min(pair.companion_mass_m_sun) / total,
                pair.eccentricity,
            ) * a_b,
        ),
        CompanionArrangement::Wide => (
            "wide",
            holman_wiegert_s_type(pair.companion_mass_m_sun / total, pair.eccentricity) * a_b,
        ),
    };
    Some(CompanionFacts {
        arrangement: arrangement.into(),
        period_days: pair.period_s / SECONDS_PER_DAY,
        separation_au: a_b,
        eccentricity: pair.eccentricity,
        flux_at_mean_distance_w_m2: c.flux_at_mean_distance_w_m2,
        temperature_k: spec.star.temperature_k,
        stability_limit_au: limit,
    })
}

/// The calendar in a few numbers.
#[derive(Debug, Serialize)]
pub struct CalendarFacts {
    /// Days of a common year (local solar days).
    pub year_days: u32,
    /// The leap rule in words.
    pub leap_rule: String,
    /// `true` if the world file names the rule, `false` for the designer's default.
    pub rule_from_file: bool,
    /// Mean calendar year, local days.
    pub mean_year_days: f64,
    /// Tropical year, local days.
    pub tropical_year_days: f64,
    /// Days the calendar gains on the seasons per 1000 years.
    pub drift_days_per_1000_years: f64,
    /// The moon whose phases the months follow, for a lunar or lunisolar calendar.
    pub moon: Option<String>,
    /// Days the months gain on that moon's phases per 1000 years.
    pub month_drift_days_per_1000_years: Option<f64>,
    /// `true` for a lunar calendar: years of whole months that run through the seasons.
    pub lunar: bool,
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
    let albedo = albedo_facts(p);
    if let Some(w) = &albedo.warning {
        warnings.push(w.clone());
    }
    let cal = p.calendar();
    let tropical = p.tropical_year_days();
    let mut drift = 1000.0 * (cal.mean_year_days() - tropical);
    if drift.abs() < 1e-6 * tropical {
        drift = 0.0;
    }
    let moon_months = cal.moon_months.as_ref();
    let lunar = moon_months.is_some_and(|m| m.intercalary.is_none());
    let month_drift = moon_months.and_then(|m| {
        let i = p.spec().moons.iter().position(|moon| moon.name == m.moon)?;
        let orbit = p.moon_orbits().get(i)?;
        let synodic =
            insola::moons::synodic_period_s(orbit.period_s, p.tropical_year_s()) / p.day_s();
        Some(1000.0 * tropical / synodic * (m.mean_month_days() - synodic))
    });
    if let (Some(d), Some(m)) = (month_drift, moon_months)
        && d.abs() > 10.0
    {
        warnings.push(format!(
            "calendar: the months drift {d:+.1} days per 1000 years against the phases of {}; `insola calendar` proposes closer month rules",
            m.moon
        ));
    }
    if drift.abs() > 10.0 && !lunar {
        warnings.push(format!(
            "calendar: the mean calendar year drifts {drift:+.1} days per 1000 years against the seasons; `insola calendar` proposes closer rules"
        ));
    }
    if let Some(sum) = cal.months_mismatch() {
        warnings.push(format!(
            "calendar: the months add up to {sum} days but a common year has {}; the last month {} the difference",
            cal.common_year_days,
            if sum < cal.common_year_days { "takes" } else { "loses" }
        ));
    }
    let first_year = p.date_at(0.0).year;
    let days = |x: f64| x / SECONDS_PER_DAY;
    let local = |x: f64| x / p.spin().solar_day_s;
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
        season_lengths_local_days: (!locked).then(|| {
            [
                local(s.spring_s),
                local(s.summer_s),
                local(s.autumn_s),
                local(s.winter_s),
            ]
        }),
        albedo_law: albedo.law.to_string(),
        sky_albedo_equator_pole: albedo.sky,
        albedo_equator_pole: albedo.own,
        flux_at_mean_distance_w_m2: p.flux_at_mean_distance_w_m2(),
        flux_swing_ratio: swing,
        star_angular_diameter_deg: 2.0
            * (p.star_radius_m() / p.semi_major_axis_m())
                .asin()
                .to_degrees(),
        standard_rise_altitude_deg: p.standard_rise_altitude_rad().to_degrees(),
        calendar: CalendarFacts {
            year_days: cal.common_year_days,
            leap_rule: cal.describe(),
            rule_from_file: cal.rule_from_file,
            mean_year_days: cal.mean_year_days(),
            tropical_year_days: tropical,
            drift_days_per_1000_years: drift,
            moon: moon_months.map(|m| m.moon.clone()),
            month_drift_days_per_1000_years: month_drift,
            lunar,
        },
        season_dates: p.season_dates(first_year),
        season_wander: p.season_wander(),
        companion: companion_facts(p),
        warnings,
    }
}

/// What `check` says about the ice-free albedo.
struct AlbedoFacts {
    law: &'static str,
    /// The sky law's albedo at the equator and at the poles.
    sky: [f64; 2],
    /// The world's own law's albedo at the equator and at the poles.
    own: [f64; 2],
    warning: Option<String>,
}

/// The sky law at the equator and the poles of `p`, and a warning when an explicit latitude
/// law makes the poles brighter where the sky makes them darker (or the reverse).
fn albedo_facts(p: &Planet) -> AlbedoFacts {
    let spec = p.climate_spec();
    let forcing = p.annual_forcing(360);
    let days: Vec<(f64, f64)> = forcing
        .samples
        .iter()
        .map(|s| (s.declination_rad, s.distance_factor))
        .collect();
    let mu = |lat: f64| insolation_weighted_cos_zenith(lat, &days);
    let (mu_eq, mu_pole) = (mu(0.0), mu(std::f64::consts::FRAC_PI_2));
    let sky_law = match spec.ice_free_albedo {
        IceFreeAlbedo::FromSky { .. } => spec.ice_free_albedo,
        IceFreeAlbedo::Legendre { .. } => IceFreeAlbedo::default(),
    };
    let at = |law: IceFreeAlbedo| {
        [
            law.albedo(0.0, mu_eq, spec.ice_albedo),
            law.albedo(1.0, mu_pole, spec.ice_albedo),
        ]
    };
    let (sky, own) = (at(sky_law), at(spec.ice_free_albedo));
    // Differences under 0.02 in albedo change a band's sunlight by under 3%: not worth a word.
    let (sky_diff, own_diff) = (sky[1] - sky[0], own[1] - own[0]);
    let contradicts = own_diff.abs() > 0.02 && own_diff * sky_diff < 0.0;
    let warning = match spec.ice_free_albedo {
        IceFreeAlbedo::Legendre { a2, .. } if contradicts => Some(format!(
            "climate: albedo_a2 = {a2} makes the poles {} than the equator (albedo {:.2} against {:.2}), but at {:.1}° tilt this world's poles see a {} sun over the year than its equator (its sky gives {:.2} against {:.2}); expect poles too {}. Remove albedo_a0/albedo_a2 to let the albedo follow the sky.",
            if own_diff > 0.0 { "brighter" } else { "darker" },
            own[1],
            own[0],
            p.spec().spin.obliquity_deg,
            if sky_diff < 0.0 { "higher" } else { "lower" },
            sky[1],
            sky[0],
            if own_diff > 0.0 { "cold" } else { "warm" },
        )),
        _ => None,
    };
    AlbedoFacts {
        law: spec.ice_free_albedo.name(),
        sky,
        own,
        warning,
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
    super::output::caution(&p);
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
    say!(
        "  seasons (north)  spring {a:.1} d, summer {b:.1} d, autumn {c:.1} d, winter {d:.1} d (standard days of 24 h)"
    );
    if let Some([a, b, c, d]) = f.season_lengths_local_days {
        say!(
            "                   spring {a:.1}, summer {b:.1}, autumn {c:.1}, winter {d:.1} local days"
        );
    }
    let ([eq, pole], [sky_eq, sky_pole]) = (f.albedo_equator_pole, f.sky_albedo_equator_pole);
    match f.albedo_law.as_str() {
        "sky" => say!(
            "  albedo law       from the sky (ice-free albedo {eq:.2} at the equator, {pole:.2} at the poles)"
        ),
        _ => say!(
            "  albedo law       explicit latitude term albedo_a0/albedo_a2 ({eq:.2} at the equator, {pole:.2} at the poles; the sky law would give {sky_eq:.2} and {sky_pole:.2})"
        ),
    }
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
    if let Some(c) = &f.companion {
        say!(
            "  second star      {} pair: {:.0} K, {:.1} W/m² at mean distance; the stars orbit each other every {:.3} d, {:.4} AU apart (e {:.3}); stability limit {:.4} AU",
            c.arrangement,
            c.temperature_k,
            c.flux_at_mean_distance_w_m2,
            c.period_days,
            c.separation_au,
            c.eccentricity,
            c.stability_limit_au
        );
    }
    let c = &f.calendar;
    let days = if c.moon.is_some() {
        String::new()
    } else {
        format!("{} days, ", c.year_days)
    };
    say!(
        "  calendar         {days}{} ({}); mean year {:.5} against the tropical year {:.5} local days, drift {:+.3} days per 1000 years",
        c.leap_rule,
        if c.rule_from_file {
            "world file"
        } else {
            "designer's default"
        },
        c.mean_year_days,
        c.tropical_year_days,
        c.drift_days_per_1000_years
    );
    if let (Some(moon), Some(d)) = (&c.moon, c.month_drift_days_per_1000_years) {
        say!(
            "  months           follow {moon}'s phases, drift {d:+.3} days per 1000 years against them{}",
            if c.lunar {
                format!(
                    "; a lunar year runs through the seasons once in {:.1} years",
                    c.tropical_year_days / (c.tropical_year_days - c.mean_year_days).abs()
                )
            } else {
                String::new()
            }
        );
    }
    if let Some(first) = f.season_dates.first() {
        say!("  seasons of year {}:", first.date.year);
    }
    for line in super::calendar::season_lines(&f.season_dates, &f.season_wander) {
        say!("  {line}");
    }
    for w in &f.warnings {
        say!("  warning: {w}");
    }
    Ok(())
}

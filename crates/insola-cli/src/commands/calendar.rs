//! `insola calendar WORLD [--json] [--write [N]]`: leap rules, lunar and lunisolar schemes
//! that fit the world, the season dates of a year, and writing the chosen rule to the file.

use insola::Planet;
use insola::calendar::CalendarSpec;
use insola::calendar_design::{
    CalendarDesign, SeasonDate, SeasonWander, SolarFamily, SolarProposal,
};
use serde::Serialize;

/// Arguments of `insola calendar`.
#[derive(Debug, clap::Args)]
#[command(
    after_help = "Leap rules are numbered from 1; `--write` alone writes the best one (marked *). \
Lunar and lunisolar schemes are printed for design work; the world file's calendar section holds a \
solar leap rule. Writing keeps the rest of the file as it is and replaces only its `calendar:` entry \
(with the `// Calendar…` comment lines right above it), or adds one at the end."
)]
pub struct Args {
    /// A `*.world.ron` file or the name of a built-in world (see `insola worlds`).
    world: String,
    /// Calendar year whose equinox and solstice dates are printed (default: the year of time
    /// zero).
    #[arg(long, allow_hyphen_values = true)]
    year: Option<i64>,
    /// Write leap rule N (default: the best) into the world file's calendar section.
    #[arg(long, num_args = 0..=1, default_missing_value = "best", value_name = "N")]
    write: Option<String>,
    /// Print JSON instead of text.
    #[arg(long)]
    json: bool,
}

/// The designer's report.
#[derive(Debug, Serialize)]
pub struct CalendarReport {
    /// World name.
    pub name: String,
    /// The proposals.
    pub design: CalendarDesign,
    /// The world's calendar now: days of a common year.
    pub year_days: u32,
    /// The world's leap rule now, in words.
    pub leap_rule: String,
    /// `true` when the rule comes from the world file, `false` when it is the default.
    pub rule_from_file: bool,
    /// The year of `seasons`.
    pub year: i64,
    /// Equinoxes and solstices of that year on the world's calendar.
    pub seasons: Vec<SeasonDate>,
    /// How far each wanders over the leap rule's period.
    pub wander: Vec<SeasonWander>,
}

/// Builds the report.
pub fn report(p: &Planet, year: Option<i64>) -> Result<CalendarReport, String> {
    let design = p.design_calendar().map_err(|e| e.to_string())?;
    let cal = p.calendar();
    let year = year.unwrap_or_else(|| p.date_at(0.0).year);
    Ok(CalendarReport {
        name: p.spec().name.clone(),
        design,
        year_days: cal.common_year_days,
        leap_rule: cal.leap.describe(),
        rule_from_file: cal.rule_from_file,
        year,
        seasons: p.season_dates(year),
        wander: p.season_wander(),
    })
}

/// One line of the solar table.
fn solar_line(i: usize, p: &SolarProposal, best: bool, current: bool) -> String {
    let wander = p.northward_equinox.map_or("-".to_string(), |w| {
        format!(
            "day {:.1}–{:.1}",
            w.earliest_day_of_year + 1.0,
            w.latest_day_of_year + 1.0
        )
    });
    let every = if p.years_per_day_of_drift.is_finite() {
        format!("{:.0} y", p.years_per_day_of_drift)
    } else {
        "never".into()
    };
    format!(
        "{}{:>3} {:>7}  {:<58} {:>11.5} {:>+9.3} {:>10}  {}{}",
        if best { "*" } else { " " },
        i + 1,
        p.year_days,
        p.leap.describe(),
        p.mean_year_days,
        p.drift_days_per_1000_years,
        every,
        wander,
        if current { "  (in use)" } else { "" }
    )
}

/// Text lines for the season dates and their wander (shared with `insola check`).
pub fn season_lines(seasons: &[SeasonDate], wander: &[SeasonWander]) -> Vec<String> {
    let mut lines = Vec::new();
    for s in seasons {
        lines.push(format!("  {:<18} {}", s.mark, s.date.label()));
    }
    if let Some(w) = wander.first() {
        lines.push(format!(
            "  over the leap rule's {} years each mark moves within its window:",
            w.over_years
        ));
    }
    for w in wander {
        lines.push(format!(
            "    {:<18} day {:.2} to {:.2} of the year ({:.2} days)",
            w.mark,
            w.earliest_day_of_year + 1.0,
            w.latest_day_of_year + 1.0,
            w.latest_day_of_year - w.earliest_day_of_year
        ));
    }
    lines
}

/// Runs the command.
pub fn run(args: Args) -> Result<(), String> {
    let p = crate::worlds::load(&args.world)?;
    let r = report(&p, args.year)?;
    if let Some(choice) = &args.write {
        return write(&args.world, &p, &r.design, choice);
    }
    if args.json {
        return super::output::print_json(&r);
    }
    let d = &r.design;
    say!("{} — calendar designer", r.name);
    super::output::caution(&p);
    say!(
        "  tropical year   {:.5} local days (northward equinox to northward equinox; days of {:.4} h)",
        d.tropical_year_days,
        p.day_s() / 3600.0
    );
    say!(
        "  calendar now    {} days, {} ({})",
        r.year_days,
        r.leap_rule,
        if r.rule_from_file {
            "from the world file"
        } else {
            "the designer's best: the world file names no rule"
        }
    );
    say!("");
    say!(
        "Leap rules (drift: days the calendar year gains on the seasons per 1000 years; equinox: its time of year over one period)"
    );
    say!(
        "{:>4} {:>7}  {:<58} {:>11} {:>9} {:>10}  equinox",
        "#",
        "days",
        "rule",
        "mean year",
        "drift/ky",
        "1 day in"
    );
    let mut shown_round = false;
    for (i, s) in d.solar.iter().enumerate() {
        if s.family == SolarFamily::RoundExceptions && !shown_round {
            say!("     round-number rules:");
            shown_round = true;
        }
        say!("{}", solar_line(i, s, i == d.best, d.current == Some(i)));
    }
    say!(
        "  best: #{} (the shortest cycle drifting at most 1 day in 2000 years); write it with `insola calendar FILE --write {}`",
        d.best + 1,
        d.best + 1
    );
    for m in &d.moons {
        say!("");
        say!(
            "Moon {}: synodic month {:.5} local days, {:.4} months a year",
            m.moon,
            m.synodic_month_days,
            m.months_per_year
        );
        for l in &m.lunar {
            say!(
                "  lunar      months of {} and {} days, {} long in {}: mean {:.5} d, drift {:+.2} d per 1000 years against the phases",
                l.short_month_days,
                l.short_month_days + 1,
                l.long_months,
                l.cycle_months,
                l.mean_month_days,
                l.drift_days_per_1000_years
            );
        }
        for s in &m.lunisolar {
            say!(
                "  lunisolar  {} months in {} ({} of {} months, {} of {}): mean year {:.4} d, drift {:+.1} d per 1000 years against the seasons",
                s.months,
                years(s.years),
                s.years - s.leap_years,
                s.common_year_months,
                s.leap_years,
                s.common_year_months + 1,
                s.mean_year_days,
                s.drift_days_per_1000_years
            );
        }
    }
    say!("");
    say!("Equinoxes and solstices of year {}", r.year);
    for line in season_lines(&r.seasons, &r.wander) {
        say!("{line}");
    }
    Ok(())
}

/// `1 year`, `19 years`.
fn years(n: u64) -> String {
    if n == 1 {
        "1 year".into()
    } else {
        format!("{n} years")
    }
}

/// Writes proposal `choice` ("best" or a number from 1) into the world file.
fn write(world: &str, p: &Planet, design: &CalendarDesign, choice: &str) -> Result<(), String> {
    let index = if choice == "best" {
        design.best
    } else {
        match choice.parse::<usize>() {
            Ok(n) if (1..=design.solar.len()).contains(&n) => n - 1,
            _ => {
                return Err(format!(
                    "--write {choice}: give a leap rule's number, 1 to {}",
                    design.solar.len()
                ));
            }
        }
    };
    let path = std::path::Path::new(world);
    if !path.is_file() {
        return Err(format!(
            "--write needs a world file; `{world}` is a built-in world (copy it from assets/ first)"
        ));
    }
    let text = std::fs::read_to_string(path).map_err(|e| format!("{world}: {e}"))?;
    let chosen = &design.solar[index];
    let mut spec: CalendarSpec = p.spec().calendar.clone().unwrap_or_default();
    spec.year_days = Some(chosen.year_days);
    spec.leap = Some(chosen.leap.clone());
    let drift = if chosen.drift_days_per_1000_years == 0.0 {
        "none: the rule matches this world's year exactly".to_string()
    } else {
        format!(
            "{:+.3} days per 1000 years (one day in {:.0} years)",
            chosen.drift_days_per_1000_years, chosen.years_per_day_of_drift
        )
    };
    let comment = vec![
        format!(
            "Calendar chosen with `insola calendar`: {} days, {}.",
            chosen.year_days,
            chosen.leap.describe()
        ),
        format!(
            "Mean calendar year {:.5} local days against the tropical year {:.5}.",
            chosen.mean_year_days, design.tropical_year_days
        ),
        format!("Drift against the seasons: {drift}."),
    ];
    let new_text = super::calendar_file::with_section(
        &text,
        &super::calendar_file::section_text(&spec, &comment),
    )?;
    insola::WorldSpec::from_ron_str(&new_text)
        .map_err(|e| format!("the rewritten file would not load, nothing written: {e}"))?;
    std::fs::write(path, new_text).map_err(|e| format!("{world}: {e}"))?;
    say!(
        "wrote calendar #{}: {} days, {} to {world}",
        index + 1,
        chosen.year_days,
        chosen.leap.describe()
    );
    Ok(())
}

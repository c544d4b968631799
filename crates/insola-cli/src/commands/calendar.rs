//! `insola calendar WORLD [--json] [--write [N]]`: leap rules, lunar and lunisolar schemes
//! that fit the world, the season dates of a year, and writing the chosen rule to the file.

use super::calendar_write::{Choice, choices, number_of};
use insola::Planet;
use insola::calendar_design::{
    CalendarDesign, LunarProposal, LunisolarProposal, SeasonDate, SeasonWander, SolarFamily,
    SolarProposal,
};
use serde::Serialize;

/// Arguments of `insola calendar`.
#[derive(Debug, clap::Args)]
#[command(
    after_help = "Proposals are numbered from 1: leap rules, then each moon's lunar and lunisolar \
schemes; `--write` alone writes the best leap rule (marked *). A lunar scheme makes years of whole \
months that run through the seasons; a lunisolar one adds a month in some years to keep them in \
place (its months follow the moon's best month rule, marked +). Writing keeps the rest of the file as it is and replaces only its `calendar:` entry \
(with the `// Calendar…` comment lines right above it), or adds one at the end."
)]
pub struct Args {
    /// A `*.world.ron` file or the name of a built-in world (see `insola worlds`).
    world: String,
    /// Calendar year whose equinox and solstice dates are printed (default: the year of time
    /// zero).
    #[arg(long, allow_hyphen_values = true)]
    year: Option<i64>,
    /// Write proposal N (default: the best leap rule) into the world file's calendar section.
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
    /// Every proposal `--write` takes, numbered from 1 in this order.
    pub choices: Vec<Choice>,
    /// The world's calendar now: days of a common year (of the shortest year for months of a
    /// moon).
    pub year_days: u32,
    /// The world's year rule now, in words.
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
        choices: choices(&design),
        design,
        year_days: cal.common_year_days,
        leap_rule: cal.describe(),
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
            "  over the calendar's cycle of {} years each mark moves within its window:",
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
        return super::calendar_write::write(&args.world, &p, &r.design, choice);
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
    let days = if p.calendar().moon_months.is_some() {
        String::new()
    } else {
        format!("{} days, ", r.year_days)
    };
    say!(
        "  calendar now    {days}{} ({})",
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
    for (moon, m) in d.moons.iter().enumerate() {
        say!("");
        say!(
            "Moon {}: synodic month {:.5} local days, {:.4} months a year",
            m.moon,
            m.synodic_month_days,
            m.months_per_year
        );
        for (index, l) in m.lunar.iter().enumerate() {
            say!(
                "{}{:>3} lunar      months of {} and {} days, {} long in {}: mean {:.5} d, drift {:+.2} d per 1000 years against the phases{}",
                if m.best_lunar == Some(index) {
                    "+"
                } else {
                    " "
                },
                number_of(d, Choice::Lunar { moon, index }),
                l.short_month_days,
                l.short_month_days + 1,
                l.long_months,
                l.cycle_months,
                l.mean_month_days,
                l.drift_days_per_1000_years,
                in_use(lunar_in_use(&p, &m.moon, l))
            );
        }
        for (index, s) in m.lunisolar.iter().enumerate() {
            say!(
                " {:>3} lunisolar  {} months in {} ({} of {} months, {} of {}): mean year {:.4} d, drift {:+.1} d per 1000 years against the seasons{}",
                number_of(d, Choice::Lunisolar { moon, index }),
                s.months,
                years(s.years),
                s.years - s.leap_years,
                s.common_year_months,
                s.leap_years,
                s.common_year_months + 1,
                s.mean_year_days,
                s.drift_days_per_1000_years,
                in_use(lunisolar_in_use(&p, &m.moon, s))
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

/// `  (in use)` when `used`.
fn in_use(used: bool) -> &'static str {
    if used { "  (in use)" } else { "" }
}

/// `true` when the world's calendar counts months of `moon` by the month rule of `l` in years
/// of a fixed number of months.
fn lunar_in_use(p: &Planet, moon: &str, l: &LunarProposal) -> bool {
    p.calendar().moon_months.as_ref().is_some_and(|m| {
        m.moon == moon
            && m.intercalary.is_none()
            && m.short_month_days == l.short_month_days
            && u64::from(m.long_months) == l.long_months
            && u64::from(m.cycle_months) == l.cycle_months
    })
}

/// `true` when the world's calendar counts months of `moon` in the years of cycle `s`.
fn lunisolar_in_use(p: &Planet, moon: &str, s: &LunisolarProposal) -> bool {
    p.calendar().moon_months.as_ref().is_some_and(|m| {
        m.moon == moon
            && u64::from(m.year_months) == s.common_year_months
            && m.intercalary.as_ref().is_some_and(|r| {
                r.exceptions.is_empty()
                    && u64::from(r.leap_years) == s.leap_years
                    && u64::from(r.cycle_years) == s.years
            })
    })
}

/// `1 year`, `19 years`.
fn years(n: u64) -> String {
    if n == 1 {
        "1 year".into()
    } else {
        format!("{n} years")
    }
}

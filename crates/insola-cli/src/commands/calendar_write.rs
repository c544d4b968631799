//! `insola calendar WORLD --write N`: the numbered proposals (leap rules, then each moon's
//! lunar and lunisolar schemes) and writing the chosen one into the world file.

use insola::Planet;
use insola::calendar::CalendarSpec;
use insola::calendar_design::CalendarDesign;
use serde::Serialize;

/// One proposal `--write` can take; numbered from 1 in the order of [`choices`].
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum Choice {
    /// Leap rule `index` of the design's `solar` list.
    Solar {
        /// Index in `solar`.
        index: usize,
    },
    /// Lunar scheme `index` of moon `moon`.
    Lunar {
        /// Index in the design's `moons`.
        moon: usize,
        /// Index in that moon's `lunar`.
        index: usize,
    },
    /// Lunisolar scheme `index` of moon `moon` (months by the moon's best month rule).
    Lunisolar {
        /// Index in the design's `moons`.
        moon: usize,
        /// Index in that moon's `lunisolar`.
        index: usize,
    },
}

/// Every proposal of `design` in the order they are numbered: leap rules, then for each moon
/// its lunar schemes and its lunisolar ones (the latter only when the moon has a month rule).
pub fn choices(design: &CalendarDesign) -> Vec<Choice> {
    let mut out: Vec<Choice> = (0..design.solar.len())
        .map(|index| Choice::Solar { index })
        .collect();
    for (moon, m) in design.moons.iter().enumerate() {
        out.extend((0..m.lunar.len()).map(|index| Choice::Lunar { moon, index }));
        if m.best_lunar.is_some() {
            out.extend((0..m.lunisolar.len()).map(|index| Choice::Lunisolar { moon, index }));
        }
    }
    out
}

/// Number (from 1) of `choice` in [`choices`].
pub fn number_of(design: &CalendarDesign, choice: Choice) -> usize {
    choices(design)
        .iter()
        .position(|&c| c == choice)
        .map_or(0, |i| i + 1)
}

/// The calendar section for `choice`, with the comment lines that state its drift.
fn section_for(
    p: &Planet,
    design: &CalendarDesign,
    choice: Choice,
) -> Result<(CalendarSpec, Vec<String>), String> {
    let mut spec: CalendarSpec = p.spec().calendar.clone().unwrap_or_default();
    match choice {
        Choice::Solar { index } => {
            let chosen = &design.solar[index];
            spec.year_days = Some(chosen.year_days);
            spec.leap = Some(chosen.leap.clone());
            spec.moon_months = None;
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
            Ok((spec, comment))
        }
        Choice::Lunar { moon, index } | Choice::Lunisolar { moon, index } => {
            let schemes = &design.moons[moon];
            let (lunar, lunisolar) = match choice {
                Choice::Lunar { .. } => (&schemes.lunar[index], None),
                _ => {
                    let best = schemes.best_lunar.ok_or("this moon has no month rule")?;
                    (&schemes.lunar[best], Some(&schemes.lunisolar[index]))
                }
            };
            let months = p
                .moon_months_of(moon, lunar, lunisolar)
                .ok_or("this scheme does not fit a calendar section")?;
            spec.year_days = None;
            spec.leap = None;
            spec.leap_month = None;
            spec.months = Vec::new();
            let mean_month = months.mean_month_days();
            let mean_year = months.mean_year_days();
            let year_drift = 1000.0 * (mean_year - design.tropical_year_days);
            let seasons = if months.intercalary.is_some() {
                format!("drift against the seasons {year_drift:+.1} days per 1000 years")
            } else {
                format!(
                    "a lunar year: it runs through the seasons once in {:.1} years",
                    design.tropical_year_days / (design.tropical_year_days - mean_year).abs()
                )
            };
            let comment = vec![
                format!(
                    "Calendar chosen with `insola calendar`: {}.",
                    months.describe()
                ),
                format!(
                    "Mean month {mean_month:.5} local days against {}'s synodic month {:.5}: drift {:+.2} days per 1000 years against the phases.",
                    schemes.moon, schemes.synodic_month_days, lunar.drift_days_per_1000_years
                ),
                format!(
                    "Mean year {mean_year:.4} local days against the tropical year {:.4}: {seasons}.",
                    design.tropical_year_days
                ),
                format!(
                    "Months begin on day {}, the midnight nearest half a day after a mean new moon of {}; name them with month_names.",
                    months.first_month_day, schemes.moon
                ),
            ];
            let mut months = months;
            // Keep the names of a moon calendar of as many months.
            if let Some(old) = &spec.moon_months
                && old.year_months == months.year_months
            {
                months.month_names = old.month_names.clone();
                if months.intercalary.is_some() {
                    months.intercalary_month = old.intercalary_month.clone();
                    months.intercalary_after = old.intercalary_after.clone();
                }
            }
            spec.moon_months = Some(months);
            Ok((spec, comment))
        }
    }
}

/// Writes proposal `choice_text` ("best" or a number from 1) into the world file `world`.
pub fn write(
    world: &str,
    p: &Planet,
    design: &CalendarDesign,
    choice_text: &str,
) -> Result<(), String> {
    let all = choices(design);
    let choice = if choice_text == "best" {
        Choice::Solar { index: design.best }
    } else {
        match choice_text.parse::<usize>() {
            Ok(n) if (1..=all.len()).contains(&n) => all[n - 1],
            _ => {
                return Err(format!(
                    "--write {choice_text}: give a proposal's number, 1 to {}",
                    all.len()
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
    let had_months = p
        .spec()
        .calendar
        .as_ref()
        .is_some_and(|c| !c.months.is_empty() || c.moon_months.is_some());
    let (spec, comment) = section_for(p, design, choice)?;
    let new_text = super::calendar_file::with_section(
        &text,
        &super::calendar_file::section_text(&spec, &comment),
    )?;
    let written = insola::WorldSpec::from_ron_str(&new_text)
        .map_err(|e| format!("the rewritten file would not load, nothing written: {e}"))?;
    std::fs::write(path, new_text).map_err(|e| format!("{world}: {e}"))?;
    let words = Planet::new(&written)
        .map(|w| {
            let cal = w.calendar();
            match cal.moon_months {
                Some(_) => cal.describe(),
                None => format!("{} days, {}", cal.common_year_days, cal.describe()),
            }
        })
        .unwrap_or_default();
    say!(
        "wrote calendar #{}: {words} to {world}",
        number_of(design, choice)
    );
    let has_names = spec
        .moon_months
        .as_ref()
        .is_some_and(|m| !m.month_names.is_empty());
    if had_months && spec.moon_months.is_some() && !has_names {
        say!("  the calendar's months now follow the moon: the old month names were left out");
    }
    Ok(())
}

//! Calendars of months that follow a moon, on whole worlds: months begin at new moons, the
//! seasons stay in place in a lunisolar calendar and run through a lunar one, bad dates and bad
//! calendar sections are typed errors, and the designer's Earth proposal keeps Meton's 235
//! months in 19 years (Earth only as a marked validation reference).

use insola::calendar::CalendarError;
use insola::calendar_design::{SeasonDate, best_lunar_index};
use insola::sky_events::{EventFilter, EventGroup, MoonPhase, SkyEventKind};
use insola::{Place, Planet, WorldSpec};

fn test_world_text(file: &str) -> String {
    let path = format!(
        "{}/tests/calendar-worlds/{file}",
        env!("CARGO_MANIFEST_DIR")
    );
    std::fs::read_to_string(path).unwrap()
}

fn planet_of(text: &str) -> Planet {
    Planet::new(&WorldSpec::from_ron_str(text).unwrap()).unwrap()
}

fn lunar() -> Planet {
    planet_of(&test_world_text("tamsarrow-lunar.world.ron"))
}

fn lunisolar() -> Planet {
    planet_of(&test_world_text("orvessin-lunisolar.world.ron"))
}

/// Earth (validation reference) with the designer's lunisolar proposal of 235 months in 19
/// years, months by its best month rule.
fn earth_metonic() -> Planet {
    let path = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/../../assets/reference-worlds/earth.world.ron"
    );
    let p = Planet::new(&WorldSpec::from_path(path).unwrap()).unwrap();
    let design = p.design_calendar().unwrap();
    let moon = &design.moons[0];
    let metonic = moon
        .lunisolar
        .iter()
        .find(|s| (s.years, s.months) == (19, 235))
        .unwrap();
    let lunar = &moon.lunar[best_lunar_index(&moon.lunar).unwrap()];
    let months = p.moon_months_of(0, lunar, Some(metonic)).unwrap();
    let mut spec = p.spec().clone();
    let mut calendar = spec.calendar.clone().unwrap_or_default();
    calendar.year_days = None;
    calendar.leap = None;
    calendar.moon_months = Some(months);
    spec.calendar = Some(calendar);
    spec.validate().unwrap();
    Planet::new(&spec).unwrap()
}

/// New moons of moon 0 over `years` calendar years from the first.
fn new_moons(p: &Planet, years: i64) -> Vec<f64> {
    let first = p.calendar().first_year;
    let filter = EventFilter::only([EventGroup::MoonPhase]).with_moons([0]);
    let place = Place::from_degrees(0.0, 0.0).unwrap();
    p.sky_events_between(
        place,
        p.year_start_s(first),
        p.year_start_s(first + years),
        &filter,
    )
    .unwrap()
    .into_iter()
    .filter(|e| {
        matches!(
            e.kind,
            SkyEventKind::MoonPhase {
                phase: MoonPhase::New,
                ..
            }
        )
    })
    .map(|e| e.at_s)
    .collect()
}

#[test]
fn months_begin_at_new_moons() {
    // Each new moon (the model's own, from its moon orbit) falls within 1.75 days of a month's
    // first midnight: whole days (±1), the orbits' eccentricities (up to about ±0.65 d for
    // Earth's Moon) and the month rule's drift (under a day per 1000 years) allow no more.
    for (p, years) in [(lunar(), 300), (lunisolar(), 300), (earth_metonic(), 300)] {
        let name = &p.spec().name;
        let news = new_moons(&p, years);
        assert!(news.len() > 100, "{name}");
        for t in news {
            let d = p.date_at(t);
            let start_day = d.day_number - (d.day_of_month as i64 - 1);
            let month_days = p.calendar().month_lengths(d.year)[d.month.unwrap()];
            let mut offset = (t - p.calendar_day_start_s(start_day)) / p.day_s();
            if offset > 0.5 * f64::from(month_days) {
                offset -= f64::from(month_days);
            }
            assert!(
                offset.abs() < 1.75,
                "{name}: new moon {offset:.2} days from {d:?}"
            );
        }
    }
}

#[test]
fn earth_proposal_keeps_metons_cycle() {
    // 235 months in 19 years, 7 of them with a 13th month (the Metonic cycle; Richards,
    // *Mapping Time*, 1998; from memory), and a mean month within a minute of the synodic month
    // 29.530589 d (NASA Moon fact sheet; from memory; the model's Keplerian moon gives
    // 29.53068 d).
    let p = earth_metonic();
    let m = p.calendar().moon_months.clone().unwrap();
    assert_eq!(
        (m.year_months, m.intercalary.clone().unwrap().leap_years),
        (12, 7)
    );
    let first = p.calendar().first_year;
    let months: usize = (first..first + 19)
        .map(|y| p.calendar().month_lengths(y).len())
        .sum();
    assert_eq!(months, 235);
    assert!((m.mean_month_days() - 29.530589).abs() * 1440.0 < 1.0);
    for y in first..first + 19 {
        let days = p.year_days(y);
        assert!(
            (353..=355).contains(&days) || (383..=385).contains(&days),
            "{y}: {days}"
        );
    }
}

fn northward_equinox(p: &Planet, year: i64) -> SeasonDate {
    p.season_dates(year)
        .into_iter()
        .find(|s| s.mark == "northward equinox")
        .unwrap()
}

#[test]
fn lunisolar_years_keep_the_seasons_lunar_years_do_not() {
    // Lunisolar: over 160 years (ten intercalary cycles) the northward equinox stays within
    // one month (28 days) plus the scheme's drift (15 days per 1000 years) of its first date.
    let p = lunisolar();
    let doy: Vec<u64> = (1..161)
        .map(|y| northward_equinox(&p, y).date.day_of_year)
        .collect();
    let (lo, hi) = (doy.iter().min().unwrap(), doy.iter().max().unwrap());
    assert!(hi - lo <= 31, "{lo}..{hi}");
    // Lunar: 13 months of Ithren (361 days) against a 380-day year: the equinox comes 19 days
    // later each year and visits every month within 20 years.
    let p = lunar();
    let months: std::collections::BTreeSet<usize> = (1..21)
        .map(|y| northward_equinox(&p, y).date.month.unwrap())
        .collect();
    assert_eq!(months.len(), 13, "{months:?}");
    let wander = &p.season_wander()[0];
    assert!(wander.latest_day_of_year - wander.earliest_day_of_year > 300.0);
}

#[test]
fn bad_dates_are_typed_errors() {
    let p = lunisolar();
    let cal = p.calendar();
    let common = (1..40).find(|&y| cal.month_lengths(y).len() == 13).unwrap();
    let leap = (1..40).find(|&y| cal.month_lengths(y).len() == 14).unwrap();
    assert!(matches!(
        p.time_of_date_text(&format!("{common}/14/1")),
        Err(CalendarError::MonthOutOfYear {
            year_months: 13,
            ..
        })
    ));
    assert!(p.time_of_date_text(&format!("{leap}/14/1")).is_ok());
    assert!(matches!(
        p.time_of_date_text(&format!("{leap}/15/1")),
        Err(CalendarError::NoSuchMonth { .. })
    ));
    let lengths = cal.month_lengths(common);
    let short = lengths.iter().position(|&d| d == 27).unwrap();
    assert!(matches!(
        p.time_of_month_date(common, short, 28, 0.0),
        Err(CalendarError::DayOutOfMonth { month_days: 27, .. })
    ));
    assert!(p.time_of_month_date(common, short, 27, 0.0).is_ok());
    // Negative years read as well as positive ones.
    let t = p.time_of_date_text("-250/3/5T10:30").unwrap();
    let d = p.date_at(t);
    assert_eq!((d.year, d.month, d.day_of_month), (-250, Some(2), 5));
    assert_eq!(d.text(), "-250/3/5");
    let p = lunar();
    assert!(matches!(
        p.time_of_date_text("7/Emberfall/1"),
        Err(CalendarError::NoSuchMonth { .. })
    ));
    assert!(matches!(
        p.time_of_date_text("7/reedmoon/0"),
        Err(CalendarError::BadDateText { .. })
    ));
    let d = p.date_at(p.time_of_date_text("7/nettlemoon/3T02:00").unwrap());
    assert_eq!(d.month_name.as_deref(), Some("Nettlemoon"));
}

#[test]
fn bad_moon_month_sections_name_their_field() {
    let text = test_world_text("orvessin-lunisolar.world.ron");
    let field = |from: &str, to: &str| {
        assert!(text.contains(from), "{from}");
        WorldSpec::from_ron_str(&text.replace(from, to))
            .unwrap_err()
            .field()
            .map(str::to_string)
    };
    assert_eq!(
        field("moon: \"Ithren\"", "moon: \"Nobody\"").as_deref(),
        Some("calendar.moon_months.moon")
    );
    assert_eq!(
        field("long_months: 127", "long_months: 162").as_deref(),
        Some("calendar.moon_months.long_months")
    );
    assert_eq!(
        field("first_year: 1,", "first_year: 1, year_days: 380,").as_deref(),
        Some("calendar.year_days")
    );
    assert_eq!(
        field("intercalary_after: \"6\"", "intercalary_after: \"Thaw\"").as_deref(),
        Some("calendar.moon_months.intercalary_after")
    );
    assert_eq!(
        field("year_months: 13,", "year_months: 13, month_names: [\"A\"],").as_deref(),
        Some("calendar.moon_months.month_names")
    );
    assert_eq!(
        field("cycle_years: 16", "cycle_years: 11").as_deref(),
        Some("calendar.moon_months.intercalary.leap_years")
    );
    assert_eq!(
        field("short_month_days: 27", "short_month_days: 0").as_deref(),
        Some("calendar.moon_months.short_month_days")
    );
}

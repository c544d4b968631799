use super::*;
use crate::{Planet, WorldSpec};

fn planet_with(calendar: &str) -> Planet {
    let text = format!(
        r#"(name: "Cal", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
        orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 10.5),
        spin: (obliquity_deg: 10, solar_day_hours: 30),
        calendar: {calendar})"#
    );
    Planet::new(&WorldSpec::from_ron_str(&text).unwrap()).unwrap()
}

fn planet() -> Planet {
    planet_with(
        r#"(first_year: 100, months: [(name: "Frostwane", days: 4), (name: "Greening", days: 4)])"#,
    )
}

#[test]
fn dates_round_trip() {
    let p = planet();
    // 10.5 standard days of 30 h: 8.4 local days a year; the designer's rule is 2 leap
    // years in 5.
    assert_eq!(p.calendar().common_year_days, 8);
    assert_eq!(
        p.calendar().leap,
        LeapRule {
            leap_years: 2,
            cycle_years: 5,
            exceptions: vec![]
        }
    );
    let d = p.date_at(0.0);
    assert_eq!(
        (d.year, d.day_of_year, d.month_name.as_deref()),
        (100, 0, Some("Frostwane"))
    );
    assert!(d.hour_of_day.abs() < 1e-9);
    let t = p.time_of_date(102, 5, 7.5).unwrap();
    let d = p.date_at(t);
    assert_eq!(
        (d.year, d.day_of_year, d.month, d.day_of_month),
        (102, 5, Some(1), 2)
    );
    assert!((d.hour_of_day - 7.5).abs() < 1e-6, "{}", d.hour_of_day);
    assert_eq!(d.clock(), "07:30");
    // Year 102 (the third) is a leap year: its leap day goes to the last month.
    assert!(d.leap_year);
    assert_eq!(p.calendar().month_lengths(102), vec![4, 5]);
    assert_eq!(
        p.time_of_month_date(102, 1, 2, 7.5).unwrap(),
        t,
        "month and day of month give the same instant"
    );
    assert_eq!(p.time_of_date_text("102/greening/2T07:30").unwrap(), t);
    assert_eq!(p.time_of_date_text("102-6T07:30").unwrap(), t);
}

#[test]
fn out_of_calendar_readings_are_typed_errors() {
    let p = planet();
    assert_eq!(
        p.time_of_date(100, 8, 0.0),
        Err(CalendarError::DayOutOfYear {
            year: 100,
            day_of_year: 8,
            year_days: 8
        })
    );
    assert!(matches!(
        p.time_of_date(100, 0, 30.0),
        Err(CalendarError::HourOutOfDay { .. })
    ));
    assert!(matches!(
        p.time_of_date(100, 0, f64::NAN),
        Err(CalendarError::HourOutOfDay { .. })
    ));
    assert!(matches!(
        p.time_of_month_date(100, 1, 5, 0.0),
        Err(CalendarError::DayOutOfMonth { month_days: 4, .. })
    ));
    assert!(matches!(
        p.time_of_date_text("100/Thaw/1"),
        Err(CalendarError::NoSuchMonth { .. })
    ));
    assert!(matches!(
        p.time_of_date(i64::MAX, 0, 0.0),
        Err(CalendarError::YearOutOfRange { .. })
    ));
    assert!(p.try_date_at(f64::INFINITY).is_err());
    assert_eq!(p.date_at(f64::NAN).day_number, 0);
}

#[test]
fn weeks_run_on_across_years() {
    let p = planet_with(r#"(week: (days: 3, names: ["Ash", "Birch", "Cedar"], first_weekday: 1))"#);
    let names: Vec<String> = (0..20)
        .map(|d| {
            p.date_at(p.calendar_day_start_s(d) + 10.0)
                .weekday_name
                .unwrap()
        })
        .collect();
    assert_eq!(&names[..4], ["Birch", "Cedar", "Ash", "Birch"]);
    assert_eq!(p.date_at(p.calendar_day_start_s(-1)).weekday, Some(0));
}

#[test]
fn explicit_rules_and_fixed_years() {
    let p = planet_with("(year_days: 8)");
    assert_eq!(p.calendar().leap, LeapRule::NONE);
    assert!((0..50).all(|y| p.year_days(y) == 8));
    let p = planet_with("(leap: (leap_years: 1, cycle_years: 3))");
    assert_eq!(p.calendar().common_year_days, 8);
    assert_eq!(
        (1..=6).map(|y| p.year_days(y)).collect::<Vec<_>>(),
        [8, 8, 9, 8, 8, 9]
    );
}

#[test]
fn bad_calendar_sections_are_named() {
    let bad = |cal: &str| {
        let text = format!(
            r#"(name: "Cal", star: (temperature_k: 5772, radius_r_sun: 1, flux_at_mean_distance_w_m2: 1361),
            orbit: (semi_major_axis_au: 1, eccentricity: 0, periapsis_longitude_deg: 0, period_days: 10.5),
            spin: (obliquity_deg: 10, solar_day_hours: 30), calendar: {cal})"#
        );
        WorldSpec::from_ron_str(&text)
            .unwrap_err()
            .field()
            .map(str::to_string)
    };
    assert_eq!(
        bad(r#"(months: [(name: "A", days: 0)])"#).as_deref(),
        Some("calendar.months[0].days")
    );
    assert_eq!(
        bad("(leap: (leap_years: 5, cycle_years: 4))").as_deref(),
        Some("calendar.leap.leap_years")
    );
    assert_eq!(
        bad("(leap: (leap_years: 1, cycle_years: 4, exceptions: [50]))").as_deref(),
        Some("calendar.leap.exceptions[0]")
    );
    assert_eq!(
        bad(r#"(leap_month: "B", months: [(name: "A", days: 3)])"#).as_deref(),
        Some("calendar.leap_month")
    );
    assert_eq!(
        bad(r#"(week: (days: 2, names: ["x"]))"#).as_deref(),
        Some("calendar.week.names")
    );
    assert_eq!(bad("(year_days: 0)").as_deref(), Some("calendar.year_days"));
}

#[test]
fn every_day_number_lands_in_exactly_one_year() {
    let p = planet_with("(leap: (leap_years: 1, cycle_years: 4, exceptions: [100, 400]))");
    let cal = p.calendar();
    for day in (-5000..5000).chain([i64::from(i32::MAX), -i64::from(i32::MAX)]) {
        let (year, doy) = cal.year_and_day_of_year(day);
        assert!(doy < cal.year_days(year));
        assert_eq!(cal.year_start_day(year) + i64::from(doy), day);
    }
}

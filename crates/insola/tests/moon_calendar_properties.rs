//! Property tests for calendars of moon months: for random month rules and intercalary rules,
//! every day number lies in exactly one month and one year, and on a random world with such a
//! calendar, date → instant → date is exact over ±10,000 years.

use insola::calendar::{Calendar, CalendarSpec, LeapRule, MoonMonthsSpec};
use insola::{Planet, WorldSpec};
use proptest::prelude::*;

prop_compose! {
    fn any_moon_months()(
        short in 1u32..60,
        cycle in 1u32..400,
        long_frac in 0.0f64..1.0,
        first in -100i64..100,
        year_months in 1u32..30,
        leap in prop_oneof![Just(None), (1u32..50, 0.0f64..1.0).prop_map(Some)],
    ) -> MoonMonthsSpec {
        let long = ((long_frac * f64::from(cycle)) as u32).min(cycle - 1);
        MoonMonthsSpec {
            moon: "Dot".into(),
            short_month_days: short,
            long_months: long,
            cycle_months: cycle,
            first_month_day: first,
            year_months,
            intercalary: leap.map(|(c, f)| LeapRule {
                leap_years: ((f * f64::from(c)) as u32).min(c - 1),
                cycle_years: c,
                exceptions: vec![],
            }),
            month_names: Vec::new(),
            intercalary_month: None,
            intercalary_after: None,
        }
    }
}

proptest! {
    #[test]
    fn days_months_and_years_partition_the_count(m in any_moon_months(), day in -10_000_000i64..10_000_000) {
        let spec = CalendarSpec { moon_months: Some(m), ..CalendarSpec::default() };
        let cal = Calendar::new(Some(&spec), 365.0);
        let (year, doy) = cal.year_and_day_of_year(day);
        prop_assert!(doy < cal.year_days(year));
        prop_assert_eq!(cal.year_start_day(year) + i64::from(doy), day);
        let (month, dom) = cal.month_and_day(year, doy).unwrap();
        prop_assert_eq!(cal.day_of_year_of(year, month, dom), Some(doy));
        let lengths = cal.month_lengths(year);
        prop_assert_eq!(lengths.iter().sum::<u32>(), cal.year_days(year));
        let n = lengths.len() as u32;
        let base = spec.moon_months.as_ref().unwrap().year_months;
        prop_assert!(n == base || n == base + 1);
    }

    #[test]
    fn instants_round_trip_on_a_world_with_moon_months(
        m in any_moon_months(),
        year_days in 30.0f64..800.0,
        day_h in 5.0f64..60.0,
        u in -1.0f64..1.0,
    ) {
        let calendar = CalendarSpec { moon_months: Some(m), ..CalendarSpec::default() };
        let text = format!(
            r#"(name: "Random", star: (temperature_k: 5800, radius_r_sun: 1, luminosity_l_sun: 1),
               orbit: (semi_major_axis_au: 1, eccentricity: 0.02, periapsis_longitude_deg: 10, period_days: {year_days}),
               spin: (obliquity_deg: 20, solar_day_hours: {day_h}),
               moons: [(name: "Dot", radius_km: 900, distance_km: 200000, period_days: 9)])"#
        );
        let mut spec = WorldSpec::from_ron_str(&text).unwrap();
        spec.calendar = Some(calendar);
        spec.validate().unwrap();
        let p = Planet::new(&spec).unwrap();
        let t = u * 10_000.0 * p.year_s();
        let d = p.date_at(t);
        let back = p.time_of_date(d.year, d.day_of_year, d.hour_of_day).unwrap();
        prop_assert!((back - t).abs() < 1e-3, "{} → {:?} → {}", t, d, back);
        let via_text = p.time_of_date_text(&d.text()).unwrap();
        prop_assert_eq!(via_text, p.calendar_day_start_s(d.day_number));
        let via_month = p
            .time_of_month_date(d.year, d.month.unwrap(), d.day_of_month, d.hour_of_day)
            .unwrap();
        prop_assert_eq!(via_month, back);
    }
}

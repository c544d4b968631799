//! Calendar round trips on every shipped world and on the test worlds with lunar and lunisolar
//! calendars: random instants over ±10,000 years, date → instant → date exact to the second,
//! and day and year boundaries at local midnight.

use insola::{Planet, WorldSpec};

fn shipped_worlds() -> Vec<Planet> {
    let root = concat!(env!("CARGO_MANIFEST_DIR"), "/../../assets");
    let mut paths: Vec<std::path::PathBuf> = std::fs::read_dir(format!("{root}/worlds"))
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.to_string_lossy().ends_with(".world.ron"))
        .collect();
    paths.sort();
    assert!(paths.len() >= 3, "{paths:?}");
    paths.push(format!("{root}/reference-worlds/earth.world.ron").into());
    // Test worlds with lunar and lunisolar calendars (months of a moon).
    let moon = concat!(env!("CARGO_MANIFEST_DIR"), "/tests/calendar-worlds");
    let mut moon_paths: Vec<std::path::PathBuf> = std::fs::read_dir(moon)
        .unwrap()
        .map(|e| e.unwrap().path())
        .collect();
    moon_paths.sort();
    assert_eq!(moon_paths.len(), 2, "{moon_paths:?}");
    paths.extend(moon_paths);
    paths
        .iter()
        .map(|p| Planet::new(&WorldSpec::from_path(p).unwrap()).unwrap())
        .collect()
}

/// A small deterministic generator (xorshift64*, Vigna 2016), uniform in `[0, 1)`.
struct Uniform(u64);

impl Uniform {
    fn next(&mut self) -> f64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        (self.0.wrapping_mul(0x2545_F491_4F6C_DD1D) >> 11) as f64 / (1u64 << 53) as f64
    }
}

#[test]
fn random_instants_round_trip_over_ten_thousand_years() {
    for p in shipped_worlds() {
        let name = &p.spec().name;
        let mut rng = Uniform(0x9E37_79B9_7F4A_7C15);
        let span = 10_000.0 * p.year_s();
        for _ in 0..20_000 {
            let t = (2.0 * rng.next() - 1.0) * span;
            let d = p.date_at(t);
            let back = p
                .time_of_date(d.year, d.day_of_year, d.hour_of_day)
                .unwrap();
            assert!((back - t).abs() < 1e-3, "{name}: {t} → {d:?} → {back}");
            let again = p.date_at(back);
            assert_eq!(
                (again.year, again.day_of_year, again.day_number),
                (d.year, d.day_of_year, d.day_number),
                "{name}: {t}"
            );
            if let Some(m) = d.month {
                let via_month = p
                    .time_of_month_date(d.year, m, d.day_of_month, d.hour_of_day)
                    .unwrap();
                assert_eq!(via_month, back, "{name}: {d:?}");
            }
            // The date's text reads back to the same day.
            let text = format!("{}T00:00", d.text());
            let midnight = p.time_of_date_text(&text).unwrap();
            assert_eq!(
                midnight,
                p.calendar_day_start_s(d.day_number),
                "{name}: {text}"
            );
        }
    }
}

#[test]
fn days_and_years_start_at_local_midnight() {
    for p in shipped_worlds() {
        let name = &p.spec().name;
        let first = p.calendar().first_year;
        // The epoch is the midnight at or before time zero; a calendar of moon months starts
        // its first year with a month, at most a month before.
        let epoch = p.year_start_s(first);
        let before = match &p.calendar().moon_months {
            Some(m) => f64::from(m.short_month_days + 1),
            None => 1.0,
        };
        assert!(
            epoch <= 0.0 && epoch > -before * p.day_s(),
            "{name}: {epoch}"
        );
        for year in (first - 10_000..first + 10_000).step_by(97) {
            let start = p.year_start_s(year);
            // Local mean time at the prime meridian is midnight (fraction 0, or a hair under 1).
            let f = p.local_mean_time_fraction(start, 0.0);
            assert!(f.min(1.0 - f) * p.day_s() < 1e-3, "{name} {year}: {f}");
            let d = p.date_at(start);
            assert_eq!((d.year, d.day_of_year), (year, 0), "{name}");
            let before = p.date_at(start - 1.0);
            assert_eq!(before.year, year - 1, "{name}");
            assert_eq!(before.day_of_year + 1, u64::from(p.year_days(year - 1)));
            let end = p.year_start_s(year + 1);
            let days = ((end - start) / p.day_s()).round();
            assert_eq!(days as u32, p.year_days(year), "{name} {year}");
        }
    }
}

#[test]
fn calendars_keep_the_equinox_in_place() {
    // Over 10,000 years the northward equinox stays within a few days of its date: the leap
    // rule keeps the mean calendar year on the tropical year.
    for p in shipped_worlds() {
        if p.calendar().moon_months.is_some() {
            continue; // years of whole months: see tests/moon_calendars.rs
        }
        let name = &p.spec().name;
        let first = p.calendar().first_year;
        let mut doy = Vec::new();
        for year in (first..first + 10_000).step_by(37) {
            let eq = &p.season_dates(year)[0..4];
            let e = eq.iter().find(|s| s.mark == "northward equinox").unwrap();
            doy.push(e.t_s - p.year_start_s(year));
        }
        let (lo, hi) = doy
            .iter()
            .fold((f64::MAX, f64::MIN), |(a, b), &x| (a.min(x), b.max(x)));
        assert!(
            (hi - lo) / p.day_s() < 6.0,
            "{name}: equinox moves {} days",
            (hi - lo) / p.day_s()
        );
    }
}

//! End-to-end checks of the `insola` binary: JSON fields, files written, exit status 2 with a
//! message (and no panic) on bad input.

use std::path::PathBuf;
use std::process::{Command, Output};

use insola_test_support::bad_worlds::{Expected, corpus};

fn insola(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_insola"))
        .args(args)
        .output()
        .expect("runs")
}

fn json(args: &[&str]) -> serde_json::Value {
    let out = insola(args);
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).expect("valid JSON")
}

fn fails_cleanly(args: &[&str]) -> String {
    let out = insola(args);
    let err = String::from_utf8_lossy(&out.stderr).to_string();
    assert_eq!(out.status.code(), Some(2), "{args:?}: {err}");
    assert!(!err.is_empty(), "{args:?}: empty stderr");
    assert!(!err.contains("panicked"), "{args:?}: {err}");
    err
}

fn tmp(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("insola-cli-tests-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    dir.join(name)
}

fn has(v: &serde_json::Value, fields: &[&str]) {
    for f in fields {
        assert!(v.get(f).is_some(), "missing `{f}` in {v}");
    }
}

#[test]
fn climate_json_has_sane_bands() {
    let v = json(&["climate", "verdance", "--json"]);
    has(
        &v,
        &[
            "bands",
            "global_mean_c",
            "ice_edge_lat_deg",
            "years_to_equilibrium",
            "converged",
        ],
    );
    let bands = v["bands"].as_array().unwrap();
    assert_eq!(bands.len(), 90);
    let mut last_lat = -91.0;
    for b in bands {
        has(
            b,
            &[
                "lat_deg",
                "mean_c",
                "min_c",
                "max_c",
                "ice_fraction",
                "summary",
            ],
        );
        let lat = b["lat_deg"].as_f64().unwrap();
        let (mean, lo, hi) = (
            b["mean_c"].as_f64().unwrap(),
            b["min_c"].as_f64().unwrap(),
            b["max_c"].as_f64().unwrap(),
        );
        let ice = b["ice_fraction"].as_f64().unwrap();
        assert!(lat > last_lat && lat.abs() < 90.0);
        last_lat = lat;
        assert!(lo <= mean && mean <= hi && lo > -100.0 && hi < 100.0, "{b}");
        assert!((0.0..=1.0).contains(&ice));
    }
    let g = v["global_mean_c"].as_f64().unwrap();
    assert!(g > -20.0 && g < 40.0);
    let edges = &v["ice_edge_lat_deg"];
    has(edges, &["north", "south"]);
    assert!(v["years_to_equilibrium"].as_u64().unwrap() >= 1);
    // Calvenne (tilt 62°): poles warmer than the equator over the year.
    let t = json(&["climate", "calvenne", "--json"]);
    let tb = t["bands"].as_array().unwrap();
    assert!(tb[89]["mean_c"].as_f64().unwrap() > tb[45]["mean_c"].as_f64().unwrap());
}

#[test]
fn climate_text_and_sweep() {
    let out = insola(&["climate", "oromar"]);
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("global mean") && text.contains("summary"),
        "{text}"
    );
    let v = json(&[
        "climate",
        "verdance",
        "--json",
        "--sweep-obliquity",
        "0:60:30",
    ]);
    let rows = v.as_array().unwrap();
    assert_eq!(rows.len(), 3);
    for r in rows {
        has(
            r,
            &[
                "obliquity_deg",
                "global_mean_c",
                "ice_edge_lat_deg",
                "years_to_equilibrium",
            ],
        );
    }
    // No terminal here: no progress bar drawn on stderr.
    let out = insola(&["climate", "verdance", "--sweep-obliquity", "10:20:10"]);
    assert!(out.status.success());
    assert!(
        out.stderr.is_empty(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    fails_cleanly(&["climate", "verdance", "--sweep-obliquity", "0:90"]);
    fails_cleanly(&["climate", "verdance", "--sweep-obliquity", "0:400:10"]);
}

#[test]
fn map_writes_png_and_csv() {
    for (world, q) in [
        ("verdance", "temperature"),
        ("oromar", "daylight"),
        ("calvenne", "insolation"),
    ] {
        let png = tmp(&format!("{world}-{q}.png"));
        let csv = tmp(&format!("{world}-{q}.csv"));
        let out = insola(&[
            "map",
            world,
            "--quantity",
            q,
            "--lats",
            "36",
            "--days",
            "48",
            "--png",
            png.to_str().unwrap(),
            "--csv",
            csv.to_str().unwrap(),
        ]);
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
        let img = image::open(&png).expect("a PNG");
        assert_eq!((img.width(), img.height()), (960, 540));
        let text = std::fs::read_to_string(&csv).unwrap();
        let mut lines = text.lines();
        assert!(
            lines
                .next()
                .unwrap()
                .starts_with("lat_deg,year_fraction,day,")
        );
        assert_eq!(lines.count(), 36 * 48);
    }
}

#[test]
fn map_rejects_bad_arguments() {
    let png = tmp("never.png");
    let p = png.to_str().unwrap();
    fails_cleanly(&["map", "verdance", "--quantity", "rainfall", "--png", p]);
    fails_cleanly(&[
        "map",
        "verdance",
        "--quantity",
        "insolation",
        "--lats",
        "1",
        "--png",
        p,
    ]);
    fails_cleanly(&[
        "map",
        "verdance",
        "--quantity",
        "insolation",
        "--days",
        "0",
        "--png",
        p,
    ]);
    fails_cleanly(&["map", "verdance", "--quantity", "insolation"]);
    fails_cleanly(&[
        "map",
        "verdance",
        "--quantity",
        "insolation",
        "--png",
        "/nonexistent-folder/x.png",
    ]);
    fails_cleanly(&[
        "map",
        "no-such-world",
        "--quantity",
        "insolation",
        "--png",
        p,
    ]);
}

#[test]
fn bad_world_files_exit_2_naming_the_field() {
    // The corpus of broken worlds in the core crate; the first line says what is expected.
    let mut n = 0;
    for bad in corpus() {
        let err = fails_cleanly(&["check", bad.path.to_str().unwrap()]);
        let name = &bad.name;
        match &bad.expected {
            Expected::Field(field) => assert!(err.contains(field.as_str()), "{name}: {err}"),
            Expected::Unknown(unknown) => assert!(err.contains(unknown.as_str()), "{name}: {err}"),
            Expected::Syntax => assert!(err.contains("line"), "{name}: {err}"),
        }
        n += 1;
    }
    assert!(n >= 30);
    // A climate section with a bad value, through every command that loads a world.
    let world = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/../insola/tests/bad-worlds/climate-albedo-over-one.world.ron"
    );
    let err = fails_cleanly(&["climate", world]);
    assert!(err.contains("climate.albedo_a0"), "{err}");
    let png = tmp("bad.png");
    let err = fails_cleanly(&[
        "map",
        world,
        "--quantity",
        "temperature",
        "--png",
        png.to_str().unwrap(),
    ]);
    assert!(err.contains("climate.albedo_a0"), "{err}");
}

#[test]
fn check_sky_and_day_json_fields() {
    let c = json(&["check", "verdance", "--json"]);
    has(
        &c,
        &[
            "solar_day_h",
            "sidereal_day_h",
            "year_solar_days",
            "retrograde",
            "tropic_lat_deg",
            "polar_circle_lat_deg",
        ],
    );
    assert_eq!(json(&["check", "oromar", "--json"])["retrograde"], true);
    let s = json(&[
        "sky", "verdance", "--lat", "35", "--lon", "-20", "--day", "100.4", "--json",
    ]);
    has(
        &s,
        &[
            "altitude_deg",
            "azimuth_deg",
            "declination_deg",
            "right_ascension_deg",
            "hour_angle_deg",
            "ecliptic_longitude_deg",
            "distance_au",
            "equation_of_time_min",
            "toa_insolation_w_m2",
            "direction_enu",
            "day",
            "direct_illuminance_lux",
            "sky_illuminance_lux",
            "light_rgb_linear",
            "light_cct_k",
            "twilight",
            "moons",
        ],
    );
    let moons = s["moons"].as_array().unwrap();
    assert_eq!(moons.len(), 2);
    for m in moons {
        has(
            m,
            &[
                "altitude_deg",
                "azimuth_deg",
                "illuminated_fraction",
                "illuminance_lux",
                "eclipse_fraction",
            ],
        );
    }
    let d = json(&["day", "verdance", "--lat", "50", "--day", "20", "--json"]);
    has(
        &d,
        &[
            "sunrise_h",
            "sunset_h",
            "transit_h",
            "day_length_h",
            "daylight_h",
            "polar",
        ],
    );
    // One name each: `day_length_h` is the local solar day (Verdance: 26 h), `daylight_h`
    // the time the star is up.
    assert!(
        (d["day_length_h"].as_f64().unwrap() - 26.0).abs() < 0.01,
        "{d}"
    );
    assert!(d["daylight_h"].as_f64().unwrap() < 26.0, "{d}");
    fails_cleanly(&["sky", "verdance", "--lat", "95", "--day", "1"]);
    fails_cleanly(&["day", "verdance", "--lat", "10"]);
}

#[test]
fn year_csv_names_daylight() {
    let out = insola(&["year", "verdance", "--lat", "40", "--csv"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout);
    let header = text.lines().next().unwrap();
    assert!(
        header.contains("daylight_h") && !header.contains("day_length"),
        "{header}"
    );
    // Each row carries the calendar date.
    assert!(header.starts_with("day,date,"), "{header}");
    let first = text.lines().nth(1).unwrap();
    assert!(first.starts_with("0,1/Thawing/1,"), "{first}");
}

#[test]
fn check_names_the_albedo_law_and_local_season_lengths() {
    let v = json(&["check", "calvenne", "--json"]);
    has(
        &v,
        &[
            "albedo_law",
            "season_lengths_local_days",
            "season_lengths_days",
        ],
    );
    assert_eq!(v["albedo_law"], "sky", "{v}");
    // Calvenne: 290 standard days, 21 h solar day: a season in local days is the
    // standard-day length × 24/21 (arithmetic).
    let std0 = v["season_lengths_days"][0].as_f64().unwrap();
    let local0 = v["season_lengths_local_days"][0].as_f64().unwrap();
    assert!((local0 - std0 * 24.0 / 21.0).abs() < 1e-6, "{v}");
    let earth = json(&["check", "earth-reference", "--json"]);
    assert_eq!(earth["albedo_law"], "latitude", "{earth}");
    assert!(
        earth["warnings"]
            .as_array()
            .unwrap()
            .iter()
            .all(|w| !w.as_str().unwrap().contains("albedo_a2")),
        "{earth}"
    );
}

#[test]
fn every_eclipse_of_ten_years_in_order() {
    let v = json(&[
        "events",
        "earth-reference",
        "--lat",
        "51.5",
        "--lon",
        "0",
        "--from-utc",
        "2000-01-01",
        "--to-utc",
        "2010-01-01",
        "--kinds",
        "eclipse",
        "--json",
    ]);
    has(&v, &["world", "events", "caution", "from_s", "to_s"]);
    assert!(
        v["caution"]
            .as_str()
            .unwrap()
            .contains("not for navigation")
    );
    let events = v["events"].as_array().unwrap();
    assert!(events.len() >= 30, "{}", events.len());
    let (from, to) = (v["from_s"].as_f64().unwrap(), v["to_s"].as_f64().unwrap());
    let mut last = f64::NEG_INFINITY;
    for e in events {
        has(e, &["t_s", "day", "utc", "date", "group", "text", "kind"]);
        let t = e["t_s"].as_f64().unwrap();
        assert!(t >= last && t >= from && t < to, "{e}");
        last = t;
        let group = e["group"].as_str().unwrap();
        assert!(group == "star-eclipse" || group == "moon-eclipse", "{e}");
    }
    // The total lunar eclipse of 2000 January 21 (NASA eclipse catalogue; from memory) is on
    // the list, by the moon's name.
    assert!(
        events
            .iter()
            .any(|e| e["utc"].as_str().unwrap().starts_with("2000-01-21")
                && e["text"]
                    .as_str()
                    .unwrap()
                    .contains("eclipse of Moon greatest")),
        "{:?}",
        &events[..3]
    );
}

#[test]
fn check_warns_when_the_latitude_term_contradicts_the_tilt() {
    // An invented 64°-tilt world given Earth's latitude term (poles brighter): its poles see
    // a higher sun over the year than its equator, so the term is the wrong way round.
    let path = tmp("brackwater.world.ron");
    std::fs::write(
        &path,
        r#"(name: "Brackwater", star: (temperature_k: 5772, radius_r_sun: 1.0, luminosity_l_sun: 1.0),
            orbit: (semi_major_axis_au: 1.0, eccentricity: 0.16, periapsis_longitude_deg: 0, period_days: 300),
            spin: (obliquity_deg: 64, solar_day_hours: 30),
            climate: (albedo_a0: 0.33, albedo_a2: 0.25))"#,
    )
    .unwrap();
    let out = insola(&["check", path.to_str().unwrap()]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(out.status.success(), "{text}");
    assert!(text.contains("explicit latitude term"), "{text}");
    assert!(
        text.contains("warning: climate: albedo_a2 = 0.25"),
        "{text}"
    );
}

#[test]
fn climate_header_ice_summary_agrees_with_the_table() {
    for world in ["verdance", "earth-reference", "oromar", "calvenne"] {
        let v = json(&["climate", world, "--json"]);
        let bands = v["bands"].as_array().unwrap();
        for (north, key) in [(true, "north"), (false, "south")] {
            let iced = bands.iter().any(|b| {
                (b["lat_deg"].as_f64().unwrap() >= 0.0) == north
                    && b["ice_fraction"].as_f64().unwrap() > 0.0
            });
            let reach = &v["seasonal_ice_reach_lat_deg"][key];
            assert_eq!(iced, !reach.is_null(), "{world} {key}: {reach}");
        }
    }
}

#[test]
fn events_table_csv_and_help_carry_the_caution() {
    let out = insola(&["events", "verdance", "--lat", "40", "--to", "2"]);
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("star rises") && text.contains("dusk: civil twilight ends"),
        "{text}"
    );
    assert!(text.contains("not for navigation"), "{text}");
    let out = insola(&[
        "events",
        "verdance",
        "--lat",
        "40",
        "--from",
        "10",
        "--to",
        "12",
        "--kinds",
        "rise-set,day",
        "--csv",
    ]);
    assert!(out.status.success());
    let csv = String::from_utf8_lossy(&out.stdout);
    let mut lines = csv.lines();
    assert_eq!(
        lines.next(),
        Some("t_s,day,utc,date,local_time_h,group,event")
    );
    let rows: Vec<&str> = lines.collect();
    // Two days: two new days, and the star and both moons rising and setting.
    assert!(
        rows.iter().filter(|r| r.contains(",day,")).count() == 2,
        "{csv}"
    );
    assert!(rows.iter().any(|r| r.ends_with("star rises")), "{csv}");
    assert!(String::from_utf8_lossy(&out.stderr).contains("not for navigation"));
    let help = insola(&["events", "--help"]);
    assert!(String::from_utf8_lossy(&help.stdout).contains("not for navigation"));
}

#[test]
fn events_reject_bad_input_cleanly() {
    let err = fails_cleanly(&[
        "events", "verdance", "--lat", "0", "--to", "1", "--kinds", "comets",
    ]);
    assert!(
        err.contains("comets") && err.contains("moon-phase"),
        "{err}"
    );
    let err = fails_cleanly(&[
        "events", "verdance", "--lat", "0", "--from", "5", "--to", "1",
    ]);
    assert!(err.contains("before the start"), "{err}");
    fails_cleanly(&["events", "verdance", "--lat", "0", "--to-utc", "2000-01-01"]);
    fails_cleanly(&["events", "verdance", "--lat", "0", "--to", "1e15"]);
}

#[test]
fn calendar_proposes_and_writes_a_rule() {
    let v = json(&["calendar", "earth-reference", "--json"]);
    let solar = v["design"]["solar"].as_array().unwrap();
    let has_rule = |l: u64, c: u64, ex: &[u64]| {
        solar.iter().any(|p| {
            p["leap"]["leap_years"] == l
                && p["leap"]["cycle_years"] == c
                && p["leap"]["exceptions"].as_array().unwrap().len() == ex.len()
        })
    };
    // Gregorian 97 in 400 and the 8-in-33 cycle (see the core's designer tests for sources).
    assert!(has_rule(1, 4, &[100, 400]) && has_rule(8, 33, &[]), "{v}");
    assert_eq!(v["seasons"].as_array().unwrap().len(), 4);
    let text = String::from_utf8(insola(&["calendar", "earth-reference"]).stdout).unwrap();
    assert!(text.contains("not for navigation"), "{text}");

    let path = tmp("calendar-write.world.ron");
    let original = include_str!("../../../assets/worlds/calvenne.world.ron");
    let bare = original
        .split("    // Calendar chosen")
        .next()
        .unwrap()
        .to_string()
        + ")\n";
    std::fs::write(&path, &bare).unwrap();
    let p = path.to_str().unwrap();
    let out = insola(&["calendar", p, "--write", "1"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let written = std::fs::read_to_string(&path).unwrap();
    assert!(
        written.starts_with(bare.trim_end_matches(")\n")),
        "{written}"
    );
    assert!(
        written.contains("leap: (leap_years: 3, cycle_years: 7)"),
        "{written}"
    );
    // Writing again replaces the section instead of adding a second one.
    assert!(insola(&["calendar", p, "--write"]).status.success());
    let again = std::fs::read_to_string(&path).unwrap();
    assert_eq!(again.matches("calendar: (").count(), 1, "{again}");
    fails_cleanly(&["calendar", p, "--write", "99"]);
    fails_cleanly(&["calendar", "verdance", "--write"]);
}

#[test]
fn calendar_writes_lunar_and_lunisolar_schemes() {
    let path = tmp("calendar-moon.world.ron");
    let original = include_str!("../../../assets/worlds/verdance.world.ron");
    std::fs::write(&path, original).unwrap();
    let p = path.to_str().unwrap();
    let v = json(&["calendar", p, "--json"]);
    let choices = v["choices"].as_array().unwrap();
    let number = |kind: &str, pick: &dyn Fn(&serde_json::Value) -> bool| {
        let list = if kind == "lunar" {
            "lunar"
        } else {
            "lunisolar"
        };
        1 + choices
            .iter()
            .position(|c| {
                c["kind"] == kind
                    && c["moon"] == 0
                    && pick(&v["design"]["moons"][0][list][c["index"].as_u64().unwrap() as usize])
            })
            .unwrap()
    };
    // Ossel: 219 months in 16 years, 11 of them with a 14th month.
    let n = number("lunisolar", &|s| s["years"] == 16 && s["months"] == 219);
    let out = insola(&["calendar", p, "--write", &n.to_string()]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let written = std::fs::read_to_string(&path).unwrap();
    assert!(
        written.contains("moon_months: (")
            && written.contains("intercalary: (leap_years: 11, cycle_years: 16)"),
        "{written}"
    );
    let after = json(&["calendar", p, "--json"]);
    assert!(
        after["leap_rule"]
            .as_str()
            .unwrap()
            .starts_with("lunisolar"),
        "{after}"
    );
    // Dates follow the months: year 1 has 13 months, year 2 (a leap year) 14.
    let d = json(&["sky", p, "--lat", "10", "--date", "2/14/3T06:00", "--json"]);
    assert_eq!(d["date"]["month"], 13);
    assert_eq!(d["date"]["day_of_month"], 3);
    let err = fails_cleanly(&["sky", p, "--lat", "10", "--date", "1/14/1"]);
    assert!(err.contains("13 months"), "{err}");
    let err = fails_cleanly(&["sky", p, "--lat", "10", "--date", "1/1/29"]);
    assert!(err.contains("days"), "{err}");
    let check = String::from_utf8(insola(&["check", p]).stdout).unwrap();
    assert!(check.contains("follow Ossel's phases"), "{check}");
    // A lunar scheme replaces it: years of whole months, no intercalary rule.
    let n = number("lunar", &|s| s["cycle_months"] == 162);
    assert!(
        insola(&["calendar", p, "--write", &n.to_string()])
            .status
            .success()
    );
    let lunar = std::fs::read_to_string(&path).unwrap();
    assert_eq!(lunar.matches("calendar: (").count(), 1, "{lunar}");
    assert!(
        lunar.contains("long_months: 127") && !lunar.contains("intercalary"),
        "{lunar}"
    );
    // And a leap rule brings back a solar calendar.
    assert!(insola(&["calendar", p, "--write"]).status.success());
    let solar = std::fs::read_to_string(&path).unwrap();
    assert!(!solar.contains("moon_months"), "{solar}");
    assert!(
        solar.contains("leap: (leap_years: 4, cycle_years: 13)"),
        "{solar}"
    );
}

#[test]
fn check_and_calendar_print_season_dates_and_their_wander() {
    // Earth (validation reference): year 1 of its calendar starts at 2000-01-01 00:00 UT. The
    // seasons of 2000 fell on 20 March 07:35, 21 June 01:48, 22 September 17:27 and
    // 21 December 13:37 UT (USNO, "Earth's Seasons: Equinoxes, Solstices, Perihelion, and
    // Aphelion, 2000–2025"; from memory): days 80, 173, 266 and 356 of that leap year.
    let v = json(&["check", "earth-reference", "--json"]);
    let seasons = v["season_dates"].as_array().unwrap();
    let expected = [(80, 7.58), (173, 1.80), (266, 17.45), (356, 13.62)];
    for (s, (day, hour)) in seasons.iter().zip(expected) {
        assert_eq!(s["date"]["year"], 1, "{s}");
        assert_eq!(s["date"]["day_of_year"].as_u64().unwrap() + 1, day, "{s}");
        let h = s["date"]["hour_of_day"].as_f64().unwrap();
        // The model's Keplerian orbit (no perturbations) lands within half an hour.
        assert!((h - hour).abs() < 0.5, "{s}: {h} h");
    }
    // Over the 4-in-13 rule's period the dates move by under a day on Verdance.
    let text = String::from_utf8(insola(&["check", "verdance"]).stdout).unwrap();
    assert!(
        text.contains("northward equinox") && text.contains("cycle of 13 years"),
        "{text}"
    );
    let v = json(&["calendar", "verdance", "--year", "5", "--json"]);
    assert!(
        v["seasons"]
            .as_array()
            .unwrap()
            .iter()
            .all(|s| s["date"]["year"] == 5)
    );
    for w in v["wander"].as_array().unwrap() {
        let span =
            w["latest_day_of_year"].as_f64().unwrap() - w["earliest_day_of_year"].as_f64().unwrap();
        assert!(span < 1.0 && w["over_years"] == 13, "{w}");
    }
}

#[test]
fn times_can_be_calendar_dates() {
    let v = json(&[
        "sky",
        "verdance",
        "--lat",
        "10",
        "--date",
        "3/Highsun/12T06:00",
        "--json",
    ]);
    assert_eq!(v["date"]["year"], 3);
    assert_eq!(v["date"]["month_name"], "Highsun");
    assert_eq!(v["date"]["day_of_month"], 12);
    assert_eq!(v["date"]["weekday_name"], "Hearthday");
    let by_day_of_year = json(&[
        "sky",
        "verdance",
        "--lat",
        "10",
        "--date",
        "3-164T06:00",
        "--json",
    ]);
    assert_eq!(v["t_s"], by_day_of_year["t_s"]);
    let d = json(&["day", "verdance", "--lat", "10", "--date", "2-5", "--json"]);
    assert_eq!(d["date"], "2/Thawing/5");
    let err = fails_cleanly(&["sky", "verdance", "--lat", "10", "--date", "1/Highsun/39"]);
    assert!(err.contains("38 days"), "{err}");
    fails_cleanly(&["sky", "verdance", "--lat", "10", "--date", "soon"]);
}

#[test]
fn help_and_reference_world_output_carry_the_caution() {
    let out = insola(&["--help"]);
    assert!(out.status.success());
    let help = String::from_utf8_lossy(&out.stdout);
    assert!(help.contains("not for navigation"), "{help}");
    let out = insola(&["sky", "earth-reference", "--lat", "51.5", "--day", "10.5"]);
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("not for navigation"), "{text}");
}

#[test]
fn two_star_worlds_show_each_star() {
    // Ambrivane (invented, two suns): `check` names the pair, `sky` and `day` give the second
    // star a line, `events` names the primary and the companion and finds their eclipses.
    let v = json(&["check", "ambrivane", "--json"]);
    assert_eq!(v["companion"]["arrangement"], "circumbinary");
    assert!(v["companion"]["stability_limit_au"].as_f64().unwrap() < 1.19);
    let v = json(&["sky", "ambrivane", "--lat", "20", "--day", "10.4", "--json"]);
    assert_eq!(v["other_stars"][0]["star"], 1);
    let text =
        String::from_utf8_lossy(&insola(&["day", "ambrivane", "--lat", "20", "--day", "3"]).stdout)
            .to_string();
    assert!(text.contains("star 1: rise"), "{text}");
    let v = json(&[
        "events",
        "ambrivane",
        "--lat",
        "10",
        "--from",
        "0",
        "--to",
        "40",
        "--kinds",
        "eclipse,rise-set",
        "--json",
    ]);
    let texts: Vec<&str> = v["events"]
        .as_array()
        .unwrap()
        .iter()
        .map(|e| e["text"].as_str().unwrap())
        .collect();
    assert!(texts.iter().any(|t| t.starts_with("companion rises")));
    assert!(
        texts
            .iter()
            .any(|t| t.starts_with("eclipse of the primary by the companion"))
    );
    assert!(
        texts
            .iter()
            .any(|t| t.starts_with("eclipse of the companion by the primary"))
    );
    let csv =
        String::from_utf8_lossy(&insola(&["year", "ambrivane", "--lat", "30", "--csv"]).stdout)
            .to_string();
    assert!(
        csv.lines()
            .next()
            .unwrap()
            .ends_with(",companion_insolation_w_m2")
    );
    // The real two-star system is a marked reference: its output carries the caution.
    for cmd in ["sky", "day", "year"] {
        let day = if cmd == "sky" { "10.5" } else { "3" };
        let mut args = vec![cmd, "kepler-16-reference", "--lat", "10"];
        if cmd != "year" {
            args.extend(["--day", day]);
        }
        let text = String::from_utf8_lossy(&insola(&args).stdout).to_string();
        assert!(text.contains("not for navigation"), "{cmd}: {text}");
    }
}

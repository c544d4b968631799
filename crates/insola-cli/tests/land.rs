//! The designer's land in the `insola` binary: `map --land` over a PNG mask the test draws and
//! over the RON layout of the demo world, `climate --land` with land and sea apart, and `check`'s
//! habitability warnings from the map climate.

use std::path::PathBuf;
use std::process::{Command, Output};

fn insola(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_insola"))
        .args(args)
        .output()
        .expect("runs")
}

fn ok(args: &[&str]) -> String {
    let out = insola(args);
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8_lossy(&out.stdout).into_owned()
}

fn json(args: &[&str]) -> serde_json::Value {
    serde_json::from_str(&ok(args)).expect("valid JSON")
}

fn fails_cleanly(args: &[&str]) -> String {
    let out = insola(args);
    let err = String::from_utf8_lossy(&out.stderr).to_string();
    assert_eq!(out.status.code(), Some(2), "{args:?}: {err}");
    assert!(
        !err.is_empty() && !err.contains("panicked"),
        "{args:?}: {err}"
    );
    err
}

fn tmp(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("insola-land-tests-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    dir.join(name)
}

/// A 72 × 36 mask (5° pixels): one black continent from 60° W to 0°, 20° N to 60° N, on a white
/// sea; a fully transparent black patch in the south, which counts as sea.
fn mask() -> PathBuf {
    let path = tmp("mask.png");
    let img = image::RgbaImage::from_fn(72, 36, |x, y| {
        let lon = -180.0 + (f64::from(x) + 0.5) * 5.0;
        let lat = 90.0 - (f64::from(y) + 0.5) * 5.0;
        if (20.0..60.0).contains(&lat) && (-60.0..0.0).contains(&lon) {
            image::Rgba([0, 0, 0, 255])
        } else if (-40.0..-20.0).contains(&lat) {
            image::Rgba([0, 0, 0, 0])
        } else {
            image::Rgba([255, 255, 255, 255])
        }
    });
    img.save(&path).unwrap();
    path
}

/// The exact area fraction of the mask's continent: (sin 60° − sin 20°)/2 × 60°/360°.
fn continent_fraction() -> f64 {
    (60f64.to_radians().sin() - 20f64.to_radians().sin()) / 2.0 / 6.0
}

fn csv_value(path: &PathBuf, lat: f64, lon: f64) -> f64 {
    let text = std::fs::read_to_string(path).unwrap();
    text.lines()
        .skip(1)
        .map(|l| {
            let v: Vec<f64> = l.split(',').map(|x| x.parse().unwrap()).collect();
            (v[0], v[1], v[2])
        })
        .min_by(|a, b| {
            let d = |p: &(f64, f64, f64)| (p.0 - lat).powi(2) + (p.1 - lon).powi(2);
            d(a).total_cmp(&d(b))
        })
        .unwrap()
        .2
}

#[test]
fn map_over_a_png_mask_draws_the_coast_and_the_continent_swings_more_than_the_sea() {
    let mask = mask();
    let m = mask.to_str().unwrap();
    let (png, hot, cold) = (tmp("land.png"), tmp("hot.csv"), tmp("cold.csv"));
    for (q, csv) in [("annual-max", &hot), ("annual-min", &cold)] {
        let v = json(&[
            "map",
            "verdance",
            "--land",
            m,
            "--quantity",
            q,
            "--grid",
            "48x24",
            "--png",
            png.to_str().unwrap(),
            "--csv",
            csv.to_str().unwrap(),
            "--json",
        ]);
        assert_eq!(v["surface"], "mask.png");
        let text = std::fs::read_to_string(csv).unwrap();
        assert!(text.starts_with("lat_deg,lon_deg,"));
        assert_eq!(text.lines().count(), 1 + 48 * 24);
    }
    // Continentality (North, Mengel & Short 1983, J. Geophys. Res. 88, 6576: land's small heat
    // capacity gives it the larger seasonal range): the continent's middle against open sea
    // at the same latitude.
    let range = |lon: f64| csv_value(&hot, 40.0, lon) - csv_value(&cold, 40.0, lon);
    assert!(
        range(-30.0) > 2.0 * range(120.0),
        "land {} sea {}",
        range(-30.0),
        range(120.0)
    );
    // The coastline: near-black pixels at the continent's west edge (60° W) at 40° N, none in
    // open sea at the same latitude.
    let img = image::open(&png).unwrap().to_rgb8();
    assert_eq!(img.dimensions(), (960, 560));
    let dark = |x0: u32, x1: u32| (x0..x1).any(|x| img.get_pixel(x, 196).0.iter().all(|&c| c < 40));
    assert!(dark(322, 330), "coast at 60° W");
    assert!(!dark(600, 640), "no coast at 80°–100° E");
}

#[test]
fn map_over_the_demo_layout_and_the_all_sea_map() {
    let layout = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/../../assets/worlds/verdance.land.ron"
    );
    let csv = tmp("zones.csv");
    ok(&[
        "map",
        "verdance",
        "--land",
        layout,
        "--quantity",
        "zones",
        "--grid",
        "32x16",
        "--csv",
        csv.to_str().unwrap(),
    ]);
    let text = std::fs::read_to_string(&csv).unwrap();
    // The Pale Cap ice sheet over the south pole, and sea that never freezes.
    assert!(text.contains("lasting ice") && text.contains("never freezes"));
    // A locked world over a planet-wide sea: hot under the star, frozen behind it.
    let locked = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/worlds/tethmoor.world.ron"
    );
    let svg = tmp("locked.svg");
    let mean = tmp("locked.csv");
    ok(&[
        "map",
        locked,
        "--all-sea",
        "--quantity",
        "annual-mean",
        "--grid",
        "32x16",
        "--png",
        svg.to_str().unwrap(),
        "--csv",
        mean.to_str().unwrap(),
    ]);
    assert!(csv_value(&mean, 0.0, 0.0) > csv_value(&mean, 0.0, 180.0) + 50.0);
    let s = std::fs::read_to_string(&svg).unwrap();
    assert!(s.starts_with("<svg") && s.contains("longitude"));
}

#[test]
fn bad_land_arguments_fail_cleanly() {
    let png = tmp("never.png");
    let p = png.to_str().unwrap();
    let m = mask();
    let m = m.to_str().unwrap();
    let e = fails_cleanly(&[
        "map",
        "verdance",
        "--land",
        "/no/such.png",
        "--quantity",
        "temperature",
        "--png",
        p,
    ]);
    assert!(e.contains("--land"), "{e}");
    fails_cleanly(&[
        "map",
        "verdance",
        "--land",
        "mask.txt",
        "--quantity",
        "temperature",
        "--png",
        p,
    ]);
    let garbage = tmp("garbage.png");
    std::fs::write(&garbage, b"not a picture").unwrap();
    let g = garbage.to_str().unwrap();
    fails_cleanly(&[
        "map",
        "verdance",
        "--land",
        g,
        "--quantity",
        "temperature",
        "--png",
        p,
    ]);
    let bad_ron = tmp("bad.land.ron");
    std::fs::write(
        &bad_ron,
        "(shapes: [(kind: Land, outline: Polygon([(0, 0), (1, 1)]))])",
    )
    .unwrap();
    let e = fails_cleanly(&[
        "map",
        "verdance",
        "--land",
        bad_ron.to_str().unwrap(),
        "--quantity",
        "temperature",
        "--png",
        p,
    ]);
    assert!(e.contains("3 points"), "{e}");
    let e = fails_cleanly(&["map", "verdance", "--quantity", "zones", "--png", p]);
    assert!(e.contains("--land"), "{e}");
    fails_cleanly(&[
        "map",
        "verdance",
        "--land",
        m,
        "--quantity",
        "insolation",
        "--png",
        p,
    ]);
    fails_cleanly(&[
        "map",
        "verdance",
        "--land",
        m,
        "--quantity",
        "temperature",
        "--grid",
        "2x2",
        "--png",
        p,
    ]);
    fails_cleanly(&[
        "map",
        "verdance",
        "--quantity",
        "temperature",
        "--day",
        "10",
        "--png",
        p,
    ]);
    fails_cleanly(&["climate", "verdance", "--land", "/no/such.ron"]);
}

#[test]
fn climate_prints_land_and_sea_apart() {
    let mask = mask();
    let m = mask.to_str().unwrap();
    let v = json(&[
        "climate", "verdance", "--land", m, "--grid", "48x24", "--json",
    ]);
    let ls = &v["land_sea"];
    let land = ls["land"]["area_fraction"].as_f64().unwrap();
    // Area fractions are exact for a mask whose pixels line up with the grid's longitudes
    // (the transparent patch is sea).
    assert!((land - continent_fraction()).abs() < 2e-3, "{land}");
    let sea = ls["sea"]["area_fraction"].as_f64().unwrap();
    assert!((land + sea - 1.0).abs() < 1e-9);
    let swing = |part: &str| {
        ls[part]["mean_max_c"].as_f64().unwrap() - ls[part]["mean_min_c"].as_f64().unwrap()
    };
    assert!(swing("land") > swing("sea"), "{ls}");
    let text = ok(&["climate", "verdance", "--land", m, "--grid", "48x24"]);
    assert!(text.contains("land and sea") && text.contains("  land ") && text.contains("  sea "));
    // Without --land the JSON has no land_sea field, as before.
    let v = json(&["climate", "verdance", "--json"]);
    assert!(v.get("land_sea").is_none());
}

#[test]
fn check_warns_from_the_map_climate_saying_what_from() {
    let locked = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/worlds/tethmoor.world.ron"
    );
    let v = json(&["check", locked, "--json"]);
    let h = v["habitability"].as_array().unwrap();
    assert!(!h.is_empty(), "{v}");
    for f in h {
        assert!(!f["message"].as_str().unwrap().is_empty());
        assert!(
            f["basis"]
                .as_str()
                .unwrap()
                .contains("map climate over all sea")
        );
    }
    // Lasting ice on the night side.
    assert!(
        h.iter().any(|f| f["finding"].get("MostlyIce").is_some()),
        "{h:?}"
    );
    let text = ok(&["check", locked]);
    assert!(text.contains("warning: habitability:") && text.contains("(from "));
    // A side-rolling world no longer gets a bare warning for its tilt; a temperate one, none.
    let text = ok(&["check", "oromar"]);
    assert!(!text.contains("near 90"), "{text}");
    let text = ok(&["check", "verdance"]);
    assert!(text.contains("habitability     no warnings from the map climate over all sea"));
    // Over land: the growing season counts too, and the land file is named.
    let m = mask();
    let v = json(&[
        "check",
        "verdance",
        "--land",
        m.to_str().unwrap(),
        "--grid",
        "48x24",
        "--json",
    ]);
    assert!(
        v["habitability_from"]
            .as_str()
            .unwrap()
            .contains("mask.png")
    );
}

#[test]
fn a_world_file_may_name_its_land() {
    // A copy of Tethmoor whose climate section names its land file, beside it.
    let dir = tmp("own-land");
    std::fs::create_dir_all(&dir).unwrap();
    let src = concat!(env!("CARGO_MANIFEST_DIR"), "/tests/worlds/");
    let world = std::fs::read_to_string(format!("{src}tethmoor.world.ron")).unwrap();
    let world = world.replace(
        "climate: (albedo_a0",
        "climate: (land: \"continents.land.ron\", albedo_a0",
    );
    assert!(world.contains("continents.land.ron"));
    std::fs::write(dir.join("tethmoor.world.ron"), world).unwrap();
    std::fs::copy(
        format!("{src}tethmoor.land.ron"),
        dir.join("continents.land.ron"),
    )
    .unwrap();
    let w = dir.join("tethmoor.world.ron");
    let w = w.to_str().unwrap();
    let csv = tmp("own-land.csv");
    let v = json(&[
        "map",
        w,
        "--quantity",
        "zones",
        "--grid",
        "32x16",
        "--csv",
        csv.to_str().unwrap(),
        "--json",
    ]);
    assert_eq!(v["surface"], "continents.land.ron");
    let v = json(&["climate", w, "--grid", "32x16", "--json"]);
    assert_eq!(v["land_sea"]["surface"], "continents.land.ron");
    let v = json(&["check", w, "--grid", "32x16", "--json"]);
    assert!(
        v["habitability_from"]
            .as_str()
            .unwrap()
            .contains("continents.land.ron")
    );
    // --no-land draws the zonal heat map; sunlight maps never take the land.
    let png = tmp("own-land.png");
    let p = png.to_str().unwrap();
    let v = json(&[
        "map",
        w,
        "--quantity",
        "temperature",
        "--no-land",
        "--lats",
        "18",
        "--days",
        "12",
        "--png",
        p,
        "--json",
    ]);
    assert!(v["surface"].is_null());
    let v = json(&[
        "map",
        w,
        "--quantity",
        "insolation",
        "--lats",
        "18",
        "--days",
        "12",
        "--png",
        p,
        "--json",
    ]);
    assert!(v["surface"].is_null());
    // A land file that is not there is an error naming it.
    let broken = dir.join("broken.world.ron");
    std::fs::write(
        &broken,
        std::fs::read_to_string(dir.join("tethmoor.world.ron"))
            .unwrap()
            .replace("continents.land.ron", "missing.land.ron"),
    )
    .unwrap();
    let e = fails_cleanly(&["check", broken.to_str().unwrap()]);
    assert!(e.contains("missing.land.ron"), "{e}");
}

//! The charts of the `insola` binary: PNG decoded and looked into (size, legend and axis labels
//! drawn, different quantities giving different pictures), SVG well-formed with its text as text.

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
    let dir = std::env::temp_dir().join(format!("insola-chart-tests-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    dir.join(name)
}

/// The page background of every chart.
const BACKGROUND: [u8; 3] = [250, 249, 246];

/// Pixels in the box `(x0, y0)–(x1, y1)` that differ from the page background.
fn inked(img: &image::RgbImage, (x0, y0): (u32, u32), (x1, y1): (u32, u32)) -> usize {
    (y0..y1)
        .flat_map(|y| (x0..x1).map(move |x| (x, y)))
        .filter(|&(x, y)| img.get_pixel(x, y).0 != BACKGROUND)
        .count()
}

fn heat_map(world: &str, quantity: &str, file: &str) -> image::RgbImage {
    let png = tmp(file);
    ok(&[
        "map",
        world,
        "--quantity",
        quantity,
        "--lats",
        "36",
        "--days",
        "48",
        "--png",
        png.to_str().unwrap(),
    ]);
    image::open(&png).expect("a PNG").to_rgb8()
}

#[test]
fn heat_map_png_has_its_legend_and_labels_and_differs_by_quantity() {
    let temp = heat_map("verdance", "temperature", "t.png");
    let sun = heat_map("verdance", "insolation", "i.png");
    for img in [&temp, &sun] {
        assert_eq!(img.dimensions(), (960, 540));
        // Title, latitude labels left of the field, time labels under it, the colour bar and
        // its ticks right of it, the footnote at the bottom.
        assert!(inked(img, (86, 10), (600, 34)) > 200, "title");
        assert!(inked(img, (10, 96), (80, 466)) > 300, "latitude labels");
        assert!(
            inked(img, (86, 470), (806, 510)) > 300,
            "time labels and description"
        );
        assert!(inked(img, (840, 96), (858, 466)) > 18 * 360, "colour bar");
        assert!(inked(img, (860, 96), (950, 466)) > 100, "colour bar ticks");
        assert!(inked(img, (86, 516), (700, 540)) > 100, "footnote");
    }
    let differ = temp
        .pixels()
        .zip(sun.pixels())
        .filter(|(a, b)| a != b)
        .count();
    assert!(differ > 100_000, "{differ} pixels differ");
}

#[test]
fn svg_is_well_formed_with_text_and_an_embedded_field() {
    let svg = tmp("m.svg");
    ok(&[
        "map",
        "calvenne",
        "--quantity",
        "temperature",
        "--lats",
        "36",
        "--days",
        "48",
        "--png",
        svg.to_str().unwrap(),
    ]);
    let text = std::fs::read_to_string(&svg).unwrap();
    assert!(text.starts_with("<svg"), "{}", &text[..60]);
    assert!(text.trim_end().ends_with("</svg>"));
    assert!(text.contains("<text") && text.contains("Calvenne: surface temperature"));
    assert!(text.contains("°C") && text.contains("latitude"));
    // The field and the colour bar are PNG images, not one rectangle per pixel.
    assert_eq!(text.matches("<image").count(), 2);
    assert!(text.contains("href=\"data:image/png;base64,"));
    assert!(text.matches("<rect").count() < 100);
    // Every element that opens is closed: as many `<text` as `</text>`.
    assert_eq!(
        text.matches("<text").count(),
        text.matches("</text>").count()
    );
    fails_cleanly(&[
        "map",
        "calvenne",
        "--quantity",
        "temperature",
        "--png",
        tmp("m.jpg").to_str().unwrap(),
    ]);
}

#[test]
fn year_chart_draws_three_panels() {
    let png = tmp("year.png");
    let table = ok(&[
        "year",
        "verdance",
        "--lat",
        "52",
        "--png",
        png.to_str().unwrap(),
    ]);
    assert!(table.contains("daylight"), "the table still prints");
    let img = image::open(&png).unwrap().to_rgb8();
    assert_eq!(img.dimensions(), (960, 720));
    // Each panel has its series' colour in it (day length amber, altitude blue, sunlight red).
    let has = |c: [u8; 3], y0: u32, y1: u32| {
        (y0..y1).any(|y| (96..896).any(|x| img.get_pixel(x, y).0 == c))
    };
    assert!(has([196, 128, 24], 96, 246));
    assert!(has([52, 96, 168], 280, 430));
    assert!(has([176, 52, 60], 464, 614));
    assert!(
        inked(&img, (10, 96), (90, 614)) > 500,
        "value labels and units"
    );
    let svg = tmp("year.svg");
    ok(&[
        "year",
        "oromar",
        "--lat",
        "30",
        "--png",
        svg.to_str().unwrap(),
    ]);
    let text = std::fs::read_to_string(&svg).unwrap();
    assert!(text.starts_with("<svg") && text.contains("noon altitude, degrees"));
    let locked = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/worlds/tethmoor.world.ron"
    );
    let err = fails_cleanly(&["year", locked, "--lat", "0", "--png", png.to_str().unwrap()]);
    assert!(err.contains("tidally locked"), "{err}");
}

#[test]
fn analemma_is_a_closed_figure_in_the_sky() {
    let png = tmp("analemma.png");
    ok(&[
        "sky",
        "verdance",
        "--lat",
        "52",
        "--day",
        "0.5",
        "--analemma",
        "--png",
        png.to_str().unwrap(),
    ]);
    let img = image::open(&png).unwrap().to_rgb8();
    assert_eq!(img.dimensions(), (960, 640));
    assert!(inked(&img, (100, 566), (900, 610)) > 300, "azimuth labels");
    assert!(inked(&img, (10, 80), (96, 560)) > 300, "altitude labels");
    // A locked world's star only wobbles: still a figure, one sample per standard day.
    let locked = concat!(
        env!("CARGO_MANIFEST_DIR"),
        "/tests/worlds/tethmoor.world.ron"
    );
    let svg = tmp("analemma.svg");
    ok(&[
        "sky",
        locked,
        "--lat",
        "10",
        "--lon",
        "20",
        "--day",
        "0",
        "--analemma",
        "--png",
        svg.to_str().unwrap(),
    ]);
    let text = std::fs::read_to_string(&svg).unwrap();
    assert!(text.starts_with("<svg") && text.contains("every standard day"));
    // --png and --analemma need each other.
    let p = png.to_str().unwrap();
    fails_cleanly(&["sky", "verdance", "--lat", "52", "--day", "0", "--png", p]);
    fails_cleanly(&["sky", "verdance", "--lat", "52", "--day", "0", "--analemma"]);
}

#[test]
fn charts_of_the_reference_world_carry_the_caution() {
    let svg = tmp("earth.svg");
    let s = svg.to_str().unwrap();
    for args in [
        vec![
            "map",
            "earth-reference",
            "--quantity",
            "insolation",
            "--lats",
            "18",
            "--days",
            "24",
            "--png",
            s,
        ],
        vec!["year", "earth-reference", "--lat", "40", "--png", s],
        vec![
            "sky",
            "earth-reference",
            "--lat",
            "40",
            "--day",
            "0.5",
            "--analemma",
            "--png",
            s,
        ],
    ] {
        ok(&args);
        let text = std::fs::read_to_string(&svg).unwrap();
        assert!(text.contains("not for navigation"), "{args:?}");
    }
    // Invented worlds' charts do not.
    ok(&["year", "verdance", "--lat", "40", "--png", s]);
    assert!(
        !std::fs::read_to_string(&svg)
            .unwrap()
            .contains("not for navigation")
    );
}

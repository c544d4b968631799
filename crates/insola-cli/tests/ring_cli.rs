//! The ringed demo world through the almanac: `check`, `sky`, `day`, `events` and `climate`
//! show the ring, and ringless worlds' JSON has no ring fields.

use std::process::Command;

fn json(args: &[&str]) -> serde_json::Value {
    let out = Command::new(env!("CARGO_BIN_EXE_insola"))
        .args(args)
        .output()
        .expect("runs");
    assert!(
        out.status.success(),
        "{args:?}: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout).expect("valid JSON")
}

#[test]
fn check_lists_the_annuli_and_their_solstice_noon_shadow() {
    let c = json(&["check", "thalcary", "--json"]);
    let annuli = c["ring"].as_array().unwrap();
    assert_eq!(annuli.len(), 3);
    // Closed form on the noon meridian at the solstice (δ = 28°, R = 7200 km, ρ = 9500 km):
    // φ = δ − asin((ρ/R) sin δ).
    let d = 28f64.to_radians();
    let want = (d - (9500.0 / 7200.0 * d.sin()).asin()).to_degrees();
    let got = annuli[0]["solstice_noon_shadow_lat_deg"][0]
        .as_f64()
        .unwrap();
    assert!((got - want).abs() < 1e-9, "{got} vs {want}");
    let t = annuli[1]["solstice_transmission"].as_f64().unwrap();
    assert!((t - (-0.9 / d.sin()).exp()).abs() < 1e-12);
    assert!(json(&["check", "verdance", "--json"]).get("ring").is_none());
}

#[test]
fn events_day_and_sky_agree_on_the_shadow() {
    let e = json(&[
        "events",
        "thalcary",
        "--lat",
        "-30",
        "--from",
        "95",
        "--to",
        "97",
        "--kinds",
        "ring-shadow",
        "--json",
    ]);
    let events = e["events"].as_array().unwrap();
    assert_eq!(events.len(), 4, "{e}");
    assert!(events[0]["text"].as_str().unwrap().contains("Broadband"));
    // A little after the shadow arrives, the sky report has the place in it.
    let inside = events[0]["day"].as_f64().unwrap() + 0.05;
    let s = json(&[
        "sky",
        "thalcary",
        "--lat",
        "-30",
        "--day",
        &inside.to_string(),
        "--json",
    ]);
    assert_eq!(s["ring"]["in_shadow"], true, "{s}");
    assert_eq!(s["ring"]["annulus"], 1);
    assert_eq!(s["ring"]["lit_face"], "north");
    assert_eq!(s["ring"]["seen_face"], "south");
    let d = json(&["day", "thalcary", "--lat", "-30", "--day", "96", "--json"]);
    let spans = d["ring_shadow"].as_array().unwrap();
    assert_eq!(spans.len(), 1, "{d}");
    let (a, b) = (
        spans[0]["enters_h"].as_f64().unwrap(),
        spans[0]["leaves_h"].as_f64().unwrap(),
    );
    let noon = d["transit_h"].as_f64().unwrap();
    assert!(a < noon && noon < b, "{a} {noon} {b}");
    // Ringless worlds say nothing of rings.
    let v = json(&["sky", "verdance", "--lat", "-30", "--day", "96.5", "--json"]);
    assert!(v.get("ring").is_none());
    let vd = json(&["day", "verdance", "--lat", "-30", "--day", "96", "--json"]);
    assert!(vd.get("ring_shadow").is_none());
}

#[test]
fn ring_plane_crossings_and_the_climate_note() {
    let e = json(&[
        "events",
        "thalcary",
        "--lat",
        "10",
        "--from",
        "0",
        "--to",
        "400",
        "--kinds",
        "ring-plane",
        "--json",
    ]);
    let events = e["events"].as_array().unwrap();
    assert_eq!(events.len(), 3, "{e}");
    let c = json(&["climate", "thalcary", "--json"]);
    let loss = c["ring"]["global_loss_w_m2"].as_f64().unwrap();
    assert!(loss > 1.0 && loss < 200.0, "{loss}");
    assert!(
        json(&["climate", "verdance", "--json"])
            .get("ring")
            .is_none()
    );
}

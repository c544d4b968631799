//! Shared output helpers.

use serde::Serialize;

/// The caution every output that shows real-world numbers carries (help text, tables, JSON).
pub const CAUTION: &str = "Insola's numbers are for games and invented worlds. They are not for navigation, \
solar-energy engineering, or decisions about health and sun exposure. For real places, use \
official almanacs and local professional practice.";

/// Prints a value as pretty JSON on standard output.
pub fn print_json<T: Serialize>(value: &T) -> Result<(), String> {
    let text = serde_json::to_string_pretty(value).map_err(|e| e.to_string())?;
    say!("{text}");
    Ok(())
}

/// Formats hours as `HHhMMm`, or `-` when absent.
pub fn hm(hours: Option<f64>) -> String {
    match hours {
        Some(h) if h.is_finite() => {
            let total = (h * 60.0).round() as i64;
            format!("{:02}h{:02}m", total / 60, total % 60)
        }
        _ => "-".into(),
    }
}

/// Checks a latitude argument in degrees.
pub fn check_lat(lat: f64) -> Result<f64, String> {
    if lat.is_finite() && (-90.0..=90.0).contains(&lat) {
        Ok(lat)
    } else {
        Err(format!("--lat {lat} is out of range: allowed -90 to 90"))
    }
}

/// The world and place arguments shared by the per-place commands.
#[derive(Debug, clap::Args)]
pub struct WorldPlace {
    /// A `*.world.ron` file or the name of a built-in world.
    pub world: String,
    /// Latitude in degrees, positive north.
    #[arg(long, allow_hyphen_values = true)]
    pub lat: f64,
    /// Longitude in degrees, positive east.
    #[arg(long, default_value_t = 0.0, allow_hyphen_values = true)]
    pub lon: f64,
}

impl WorldPlace {
    /// Loads the world and checks the place.
    pub fn load(&self) -> Result<(insola::Planet, insola::Place), String> {
        let planet = crate::worlds::load(&self.world)?;
        let lat = check_lat(self.lat)?;
        let place = insola::Place::from_degrees(lat, self.lon).map_err(|e| e.to_string())?;
        Ok((planet, place))
    }
}

/// The one-line caution printed with the text output of a reference world.
pub const REFERENCE_CAUTION: &str = "caution: a validation reference world.";

/// Prints [`REFERENCE_CAUTION`] when `p` is a reference world.
pub fn caution(p: &insola::Planet) {
    if p.spec().reference {
        say!("  {REFERENCE_CAUTION} {CAUTION}");
    }
}

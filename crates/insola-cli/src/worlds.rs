//! Finding a world: a path to a `*.world.ron` file, or the name of a built-in invented world.

use insola::built_in_worlds::{BUILT_IN_WORLDS, built_in_world};
use insola::{Planet, WorldSpec};

/// Loads and validates a world given as a path or a built-in name.
pub fn load(world: &str) -> Result<Planet, String> {
    let spec = if std::path::Path::new(world).is_file() {
        WorldSpec::from_path(world).map_err(|e| e.to_string())?
    } else if let Some(built_in) = built_in_world(world) {
        built_in
            .spec()
            .map_err(|e| format!("built-in world {world}: {e}"))?
    } else {
        let names: Vec<&str> = BUILT_IN_WORLDS.iter().map(|w| w.name).collect();
        return Err(format!(
            "no world file `{world}` and no built-in world of that name (built-in: {})",
            names.join(", ")
        ));
    };
    Planet::new(&spec).map_err(|e| e.to_string())
}

/// The land file a world file names in `climate: (land: "…")`, resolved against the world
/// file's folder; `None` for built-in worlds and worlds without one.
///
/// The core accepts the field and leaves it to tools; this reads only that field (other
/// fields are the core's to check).
pub fn land_file(world: &str) -> Result<Option<String>, String> {
    // Both written plainly, not as `Some(…)`, as the core reads them.
    #[derive(Default, serde::Deserialize)]
    struct Climate {
        #[serde(default, deserialize_with = "plain_text")]
        land: Option<String>,
    }
    #[derive(serde::Deserialize)]
    struct World {
        #[serde(default)]
        climate: Climate,
    }
    fn plain_text<'de, D: serde::Deserializer<'de>>(d: D) -> Result<Option<String>, D::Error> {
        <String as serde::Deserialize>::deserialize(d).map(Some)
    }
    let path = std::path::Path::new(world);
    if !path.is_file() {
        return Ok(None);
    }
    let text = std::fs::read_to_string(path).map_err(|e| format!("cannot read {world}: {e}"))?;
    // The core has read the file already; a form this reader does not follow names no land.
    let Ok(parsed) = ron::from_str::<World>(&text) else {
        return Ok(None);
    };
    Ok(parsed.climate.land.map(|land| {
        let base = path.parent().unwrap_or(std::path::Path::new("."));
        base.join(land).to_string_lossy().into_owned()
    }))
}

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

//! Finding a world: a path to a `*.world.ron` file, or the name of a built-in invented world.

use insola::{Planet, WorldSpec};

/// The invented worlds shipped in `assets/worlds`, built into the binary so that
/// `insola check verdance` works from anywhere.
pub const BUILT_IN: &[(&str, &str)] = &[
    (
        "verdance",
        include_str!("../../../assets/worlds/verdance.world.ron"),
    ),
    (
        "calvenne",
        include_str!("../../../assets/worlds/calvenne.world.ron"),
    ),
    (
        "oromar",
        include_str!("../../../assets/worlds/oromar.world.ron"),
    ),
    (
        "earth-reference",
        include_str!("../../../assets/reference-worlds/earth.world.ron"),
    ),
];

/// Loads and validates a world given as a path or a built-in name.
pub fn load(world: &str) -> Result<Planet, String> {
    let spec = if std::path::Path::new(world).is_file() {
        WorldSpec::from_path(world).map_err(|e| e.to_string())?
    } else if let Some((_, text)) = BUILT_IN.iter().find(|(name, _)| *name == world) {
        WorldSpec::from_ron_str(text).map_err(|e| format!("built-in world {world}: {e}"))?
    } else {
        let names: Vec<&str> = BUILT_IN.iter().map(|(n, _)| *n).collect();
        return Err(format!(
            "no world file `{world}` and no built-in world of that name (built-in: {})",
            names.join(", ")
        ));
    };
    Planet::new(&spec).map_err(|e| e.to_string())
}

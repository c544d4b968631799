//! The invented worlds that ship with Insola, built into the crate (feature `built-in-worlds`,
//! on by default), so that tools, examples and benches find them by name without a file system.
//!
//! This is the one list of them: the command-line almanac, the scenes and the benches all read
//! it. The files themselves live in the crate (`worlds/`), and the repository's `assets/worlds`
//! links to them for Bevy's asset server.

use crate::{SpecError, WorldSpec};

/// One shipped world: its name on the command line and its world file's text.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct BuiltInWorld {
    /// Name used on the command line and in examples (`"verdance"`).
    pub name: &'static str,
    /// The `*.world.ron` text.
    pub ron: &'static str,
    /// True for validation references (a real planet, marked as such), false for invented
    /// worlds meant for play; the same as the file's own `reference` field (tested), kept here
    /// so a list of names needs no parsing.
    pub is_reference: bool,
}

impl BuiltInWorld {
    /// Parses and validates the world file.
    pub fn spec(&self) -> Result<WorldSpec, SpecError> {
        WorldSpec::from_ron_str(self.ron)
    }
}

/// Every shipped world: the invented demo worlds (Ambrivane has two suns), then the
/// validation references (Earth; Kepler-16, a real planet of two stars).
pub const BUILT_IN_WORLDS: &[BuiltInWorld] = &[
    BuiltInWorld {
        name: "verdance",
        ron: include_str!("../worlds/verdance.world.ron"),
        is_reference: false,
    },
    BuiltInWorld {
        name: "calvenne",
        ron: include_str!("../worlds/calvenne.world.ron"),
        is_reference: false,
    },
    BuiltInWorld {
        name: "oromar",
        ron: include_str!("../worlds/oromar.world.ron"),
        is_reference: false,
    },
    BuiltInWorld {
        name: "ambrivane",
        ron: include_str!("../worlds/ambrivane.world.ron"),
        is_reference: false,
    },
    BuiltInWorld {
        name: "earth-reference",
        ron: include_str!("../worlds/reference/earth.world.ron"),
        is_reference: true,
    },
    BuiltInWorld {
        name: "kepler-16-reference",
        ron: include_str!("../worlds/reference/kepler-16.world.ron"),
        is_reference: true,
    },
];

/// The shipped world of this name, if there is one.
pub fn built_in_world(name: &str) -> Option<&'static BuiltInWorld> {
    BUILT_IN_WORLDS.iter().find(|w| w.name == name)
}

/// The names of the invented (non-reference) shipped worlds, in list order.
pub fn invented_world_names() -> impl Iterator<Item = &'static str> {
    BUILT_IN_WORLDS
        .iter()
        .filter(|w| !w.is_reference)
        .map(|w| w.name)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_shipped_world_is_valid_and_named_once() {
        for (i, w) in BUILT_IN_WORLDS.iter().enumerate() {
            let spec = w.spec().unwrap_or_else(|e| panic!("{}: {e}", w.name));
            assert_eq!(spec.reference, w.is_reference, "{}", w.name);
            assert!(
                BUILT_IN_WORLDS[..i].iter().all(|o| o.name != w.name),
                "{} listed twice",
                w.name
            );
        }
        assert_eq!(
            invented_world_names().collect::<Vec<_>>(),
            ["verdance", "calvenne", "oromar", "ambrivane"]
        );
        assert!(built_in_world("earth-reference").unwrap().is_reference);
        assert!(built_in_world("kepler-16-reference").unwrap().is_reference);
        assert!(built_in_world("nowhere").is_none());
    }
}

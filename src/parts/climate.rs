//! The climate part: the seasonal climate model, rebuilt off the main thread for each world.

use bevy::prelude::*;

use crate::climate::update_climate;
use crate::{InsolaSystems, SeasonalClimate};

/// Adds [`SeasonalClimate`], rebuilt in the background whenever the world changes, in
/// [`InsolaSystems::UpdateObservers`]. Leave it out and no climate is ever built; observers
/// then report no temperature.
#[derive(Debug, Clone, Default)]
pub struct InsolaClimatePlugin;

impl Plugin for InsolaClimatePlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        app.init_resource::<SeasonalClimate>().add_systems(
            PostUpdate,
            update_climate.in_set(InsolaSystems::UpdateObservers),
        );
    }
}

//! The observers part: local conditions for any number of places on the planet.

use bevy::prelude::*;

use crate::climate::update_climate;
use crate::map::places_from_positions;
use crate::observers::update_observers;
use crate::{
    InsolaSettings, InsolaSystems, LocalConditions, MapProjection, ObserverInstant,
    PlaceFromPosition, SurfacePlace,
};

/// Updates the [`LocalConditions`] of every entity with a [`SurfacePlace`] (and places
/// entities marked [`PlaceFromPosition`] by their transform), in
/// [`InsolaSystems::UpdateObservers`]. Uses the climate part when present.
#[derive(Debug, Clone, Default)]
pub struct InsolaObserversPlugin {
    /// Settings shared by every part (the first part to build inserts them).
    pub settings: InsolaSettings,
}

impl Plugin for InsolaObserversPlugin {
    fn build(&self, app: &mut App) {
        super::configure_sets(app);
        super::insert_settings_once(app, &self.settings);
        app.register_type::<SurfacePlace>()
            .register_type::<LocalConditions>()
            .register_type::<ObserverInstant>()
            .register_type::<MapProjection>()
            .register_type::<PlaceFromPosition>()
            .init_resource::<ObserverInstant>()
            .add_systems(
                PostUpdate,
                (places_from_positions, update_observers)
                    .chain()
                    .after(update_climate)
                    .in_set(InsolaSystems::UpdateObservers),
            );
    }
}

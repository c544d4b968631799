//! The plugin's App-level tests, in one binary: each test binary links the engine, so one
//! binary instead of five keeps a cold build and the target directory small.
//!
//! The long runs (memory and drift over simulated years) are a binary of their own,
//! `tests/long_runs.rs`, because they install a counting allocator.

#[macro_use]
mod common;

mod bad_world_reloads;
mod clock_and_notices;
mod flash_guard;
mod lights;
mod map_climate;
mod observers;
mod parts;
mod reference_observer;
mod ring;
mod save_games;
mod two_suns;
mod world_files;

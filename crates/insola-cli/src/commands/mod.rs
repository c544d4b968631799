//! One module per subcommand.

pub mod calendar;
pub mod calendar_file;
pub mod calendar_write;
pub mod check;
pub mod check_habitability;
pub mod climate;
pub mod climate_land;
pub mod colour_map;
pub mod day;
pub mod events;
pub mod land;
pub mod list;
pub mod map;
pub mod map_land;
pub mod map_zonal;
pub mod output;
pub mod plot;
pub mod sky;
pub mod year;

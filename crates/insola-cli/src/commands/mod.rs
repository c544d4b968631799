//! One module per subcommand.

pub mod calendar;
pub mod calendar_file;
pub mod calendar_write;
pub mod check;
pub mod climate;
pub mod colour_map;
pub mod day;
pub mod events;
pub mod list;
pub mod map;
pub mod output;
pub mod ring;
pub mod sky;
pub mod year;

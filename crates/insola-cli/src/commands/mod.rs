//! One module per subcommand.

pub mod check;
pub mod day;
pub mod list;
pub mod output;
pub mod sky;
pub mod year;

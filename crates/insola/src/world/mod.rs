//! World files: the description of a planet, its star and its sky, and their validation.

mod load;
mod spec;
mod utc;
mod validate;

pub use load::*;
pub use spec::*;
pub use utc::*;
pub use validate::*;

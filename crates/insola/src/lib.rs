//! Placeholder lib; being written.
pub mod climate;
pub mod error;
pub mod insolation;
pub mod light;
pub use error::{QueryError, SpecError};

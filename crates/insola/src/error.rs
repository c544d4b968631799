//! Typed errors for world files and for queries on bad input.
//!
//! Every validation error names the field (as a dotted path such as `orbit.eccentricity`), the
//! value that was given and the range that is allowed, so that a modder can fix a file without
//! reading the source.

use thiserror::Error;

/// An error found while reading or validating a world description.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum SpecError {
    /// The text is not valid RON, or a value has the wrong type.
    #[error("{path}line {line}, column {column}: {message}")]
    Syntax {
        /// File name followed by `: `, or empty when parsing a string.
        path: String,
        /// 1-based line of the error.
        line: usize,
        /// 1-based column of the error.
        column: usize,
        /// What the parser expected or found.
        message: String,
    },
    /// A field the format does not know.
    #[error(
        "{path}line {line}, column {column}: unknown field `{field}` in `{section}`; known fields: {known}"
    )]
    UnknownField {
        /// File name followed by `: `, or empty when parsing a string.
        path: String,
        /// 1-based line of the field.
        line: usize,
        /// 1-based column of the field.
        column: usize,
        /// The section (dotted path) holding the field.
        section: String,
        /// The unknown field name.
        field: String,
        /// Comma-separated list of the allowed names.
        known: String,
    },
    /// A numeric field outside its allowed range (NaN and infinities are always outside).
    #[error("`{field}` = {value} is out of range: allowed {allowed}")]
    OutOfRange {
        /// Dotted path of the field, e.g. `spin.obliquity_deg`.
        field: String,
        /// The value given.
        value: f64,
        /// Human-readable allowed range, e.g. `0 to 180`.
        allowed: String,
    },
    /// Fields that are each valid but contradict each other.
    #[error("`{field}`: {reason}")]
    Inconsistent {
        /// Dotted path of the field judged wrong.
        field: String,
        /// Why the combination is impossible.
        reason: String,
    },
    /// The file could not be read.
    #[error("cannot read {path}: {message}")]
    Io {
        /// File path.
        path: String,
        /// The operating system's message.
        message: String,
    },
}

impl SpecError {
    /// Builds [`SpecError::OutOfRange`].
    pub fn out_of_range(field: impl Into<String>, value: f64, allowed: impl Into<String>) -> Self {
        SpecError::OutOfRange {
            field: field.into(),
            value,
            allowed: allowed.into(),
        }
    }

    /// Builds [`SpecError::Inconsistent`].
    pub fn inconsistent(field: impl Into<String>, reason: impl Into<String>) -> Self {
        SpecError::Inconsistent {
            field: field.into(),
            reason: reason.into(),
        }
    }

    /// The dotted field path the error is about, if it concerns one field.
    pub fn field(&self) -> Option<&str> {
        match self {
            SpecError::UnknownField { field, .. }
            | SpecError::OutOfRange { field, .. }
            | SpecError::Inconsistent { field, .. } => Some(field),
            SpecError::Syntax { .. } | SpecError::Io { .. } => None,
        }
    }
}

/// Checks that `value` is finite and within `[min, max]`; otherwise an [`SpecError::OutOfRange`].
pub fn check_range(field: &str, value: f64, min: f64, max: f64) -> Result<f64, SpecError> {
    if value.is_finite() && value >= min && value <= max {
        Ok(value)
    } else {
        Err(SpecError::out_of_range(
            field,
            value,
            format!("{min} to {max}"),
        ))
    }
}

/// Checks that `value` is finite and strictly greater than `min` and at most `max`.
pub fn check_range_open_min(field: &str, value: f64, min: f64, max: f64) -> Result<f64, SpecError> {
    if value.is_finite() && value > min && value <= max {
        Ok(value)
    } else {
        Err(SpecError::out_of_range(
            field,
            value,
            format!("greater than {min}, up to {max}"),
        ))
    }
}

/// An error from a query with bad arguments (latitude out of range, non-finite time…).
#[derive(Debug, Clone, PartialEq, Error)]
pub enum QueryError {
    /// An argument outside its allowed range.
    #[error("argument `{name}` = {value} is out of range: allowed {allowed}")]
    OutOfRange {
        /// Argument name with unit, e.g. `latitude_deg`.
        name: &'static str,
        /// The value given.
        value: f64,
        /// Allowed range in words.
        allowed: &'static str,
    },
    /// A time interval that does not run forward: an end not finite, or `to` before `from`.
    #[error("interval from {from_s} s to {to_s} s is not valid: {reason}")]
    BadInterval {
        /// Start given, world seconds.
        from_s: f64,
        /// End given, world seconds.
        to_s: f64,
        /// What is wrong with it.
        reason: &'static str,
    },
    /// An interval too long to search: it would take more samples than the search allows.
    #[error(
        "interval of {length_s:.4e} s is too long for this search: at most {max_s:.4e} s on this world (ask for fewer event groups or split it)"
    )]
    IntervalTooLong {
        /// Length given, seconds.
        length_s: f64,
        /// Longest interval allowed for this world and filter, seconds.
        max_s: f64,
    },
    /// An output buffer whose length does not match the number of results.
    #[error("output buffer holds {given} elements, {needed} are needed")]
    BufferLength {
        /// Number of results.
        needed: usize,
        /// Length of the buffer given.
        given: usize,
    },
}

/// Checks a query argument; see [`QueryError`].
pub fn check_arg(
    name: &'static str,
    value: f64,
    min: f64,
    max: f64,
    allowed: &'static str,
) -> Result<f64, QueryError> {
    if value.is_finite() && value >= min && value <= max {
        Ok(value)
    } else {
        Err(QueryError::OutOfRange {
            name,
            value,
            allowed,
        })
    }
}

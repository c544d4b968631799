//! Light of the sky (placeholder, being written).

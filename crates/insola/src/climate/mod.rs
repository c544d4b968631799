//! Seasonal climate (placeholder, being written).

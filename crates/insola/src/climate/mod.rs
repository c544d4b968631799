//! Seasonal climate: a latitude-resolved diffusive energy balance model driven by the orbit's
//! insolation, with day-night and elevation corrections for single places.
//!
//! # Model
//!
//! Zonal-mean surface temperature `T(x, t)` in °C on equal-area bands in `x = sin φ`
//! (North 1975, J. Atmos. Sci. 32, 2033; North, Cahalan & Coakley 1981, Rev. Geophys. 19, 91;
//! the diffusive form goes back to Sellers 1969 and the ice-albedo step to Budyko 1969):
//!
//! ```text
//! C ∂T/∂t = Q(x,t)·a(x,T) − (A + B·T) + D ∂/∂x[(1 − x²) ∂T/∂x]
//! ```
//!
//! | symbol | meaning | unit | spec field |
//! |---|---|---|---|
//! | `C` | column heat capacity: `ρ_w c_w h` over ocean, land value over land, by area | J m⁻² K⁻¹ | `mixed_layer_depth_m`, `land_fraction`, `land_heat_capacity_j_m2_per_k` |
//! | `Q` | daily-mean top-of-atmosphere insolation (Berger 1978) | W m⁻² | from [`AnnualForcing`] |
//! | `a` | co-albedo: `1 − α(x)`, or `1 − ice_albedo` where `T < ice_temperature_c`; `α` from the world's sky (the band's insolation-weighted solar zenith angle, see [`IceFreeAlbedo`]) or an explicit `a0 + a2·P2(x)` | — | `ice_free_albedo` (`atmosphere_albedo` or `albedo_a0`, `albedo_a2` in a file), `ice_*` |
//! | `A + B·T` | outgoing longwave radiation, T in °C (a gray body matched at 60 °C takes over where it emits more: above 60 °C and on very cold bands) | W m⁻² | `olr_a_w_m2`, `olr_b_w_m2_per_k` |
//! | `D` | meridional diffusion | W m⁻² K⁻¹ | `diffusion_w_m2_per_k` |
//!
//! Numerics ([`EnergyBalanceModel`]): finite volumes in `x` (energy conserving, zero flux at the
//! poles), backward Euler on diffusion and `B·T`, co-albedo from the previous step
//! (semi-implicit ice albedo), one constant tridiagonal matrix factorised once. Stable for any
//! heat capacity and step. The periodic year is found by [`equilibrate`] (see
//! [Convergence](#convergence) below), giving a [`ClimateCycle`].
//!
//! # Convergence
//!
//! Years are run from the steady annual-mean state until one year ends within `tolerance_k`
//! (0.01 K) of where it began in every band; the two slowest linear modes are extrapolated to
//! their fixed point between years. Failure to settle within `max_years` is
//! [`ClimateError::NotConverged`] carrying the last year.
//!
//! # Places
//!
//! [`ClimateInstant`] adds to the zonal temperature a day-night deviation of a thin surface layer
//! (exact periodic solution of a linear equation; large for slow rotators, small for fast ones)
//! and subtracts `lapse_rate_k_per_km × elevation`. [`Season`], [`ClimateZone`] and
//! [`ClimateCycle::band_summaries`] turn the cycle into words for gameplay and designers.
//! For many places at once, [`ClimateSnapshot`] tabulates one time of year on a
//! latitude × hour-angle grid and [`PlaceTable`] turns it to one instant.
//!
//! # Limits
//!
//! Zonal means only (no continents, no east–west structure), one uniform land fraction, linear
//! longwave law (too cold for very hot bands, acceptable from about −60 to +60 °C), no
//! clouds, water vapour, sea-ice thermodynamics or heat-capacity change under ice. The daily mean
//! insolation assumes the day is short compared with the year; for slow rotators with days
//! approaching the year the zonal model still uses daily means and the day-night layer carries
//! the rest. Tidally locked worlds are outside the model. Earth parameter sets appear only as
//! marked validation references.

mod albedo;
mod band_table;
mod cycle;
mod ebm;
mod equilibrium;
mod forcing;
mod grid;
mod local;
mod place_table;
mod seasons;
mod snapshot;
mod spec;
#[cfg(test)]
mod validation;

pub use albedo::*;
pub use cycle::*;
pub use ebm::*;
pub use equilibrium::*;
pub use forcing::*;
pub use grid::*;
pub use local::*;
pub use place_table::*;
pub use seasons::*;
pub use snapshot::*;
pub use spec::*;

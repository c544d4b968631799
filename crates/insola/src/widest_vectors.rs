//! One place for the run-time choice of vector width: a macro that turns a loop written once
//! into the function callers use, compiled for AVX-512F, AVX2 and the baseline x86-64, with the
//! widest the processor supports chosen at each call (the standard library's detection, cached
//! after its first use).
//!
//! Why: the crate is built for the baseline x86-64 that every player's machine runs, yet its
//! bulk loops (time series, insolation grid rows) go about twice as fast on wider lanes.
//! Fused multiply-adds are not enabled, so every build rounds as the baseline does: the same
//! numbers bit for bit on every machine (the time-series and grid tests check it). The
//! expansion holds the crate's one kind of `unsafe`: calling a build after the processor has
//! been seen to support it.

/// `widest_vectors!(fn name(arg: Type, …) => body_fn);` defines `fn name(arg: Type, …)` that
/// calls `body_fn(arg, …)` compiled for the widest vector unit this processor has. `body_fn`
/// should be `#[inline(always)]`, so that it is compiled into each build.
macro_rules! widest_vectors {
    ($(#[$doc:meta])* $vis:vis fn $name:ident($($arg:ident: $ty:ty),* $(,)?) => $body:path;) => {
        $(#[$doc])*
        #[allow(unsafe_code)]
        $vis fn $name($($arg: $ty),*) {
            /// The body compiled with 512-bit lanes.
            #[cfg(target_arch = "x86_64")]
            #[target_feature(enable = "avx512f")]
            fn on_avx512($($arg: $ty),*) {
                $body($($arg),*)
            }
            /// The body compiled with 256-bit lanes.
            #[cfg(target_arch = "x86_64")]
            #[target_feature(enable = "avx2")]
            fn on_avx2($($arg: $ty),*) {
                $body($($arg),*)
            }
            #[cfg(target_arch = "x86_64")]
            {
                if std::arch::is_x86_feature_detected!("avx512f") {
                    // SAFETY: the processor has just been seen to support AVX-512F.
                    return unsafe { on_avx512($($arg),*) };
                }
                if std::arch::is_x86_feature_detected!("avx2") {
                    // SAFETY: the processor has just been seen to support AVX2.
                    return unsafe { on_avx2($($arg),*) };
                }
            }
            $body($($arg),*)
        }
    };
}

pub(crate) use widest_vectors;

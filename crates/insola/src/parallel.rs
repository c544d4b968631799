//! The one place the core decides whether work runs on threads.
//!
//! With the default feature `parallel`, chunks run on rayon's global pool; without it (targets
//! without threads, such as a plain web build) the same chunks run in order on the calling
//! thread. Every caller splits its work into chunks whose results depend only on their own
//! inputs and position, so both builds give the same numbers bit for bit (tested in each
//! caller beside its serial form, and here).

#[cfg(feature = "parallel")]
use rayon::prelude::*;

/// Calls `f(index, chunk)` for every `chunk`-long piece of `out` (the last may be shorter),
/// on the thread pool when the `parallel` feature is on. `chunk` must be positive.
pub(crate) fn for_each_chunk<T: Send>(
    out: &mut [T],
    chunk: usize,
    f: impl Fn(usize, &mut [T]) + Sync + Send,
) {
    #[cfg(feature = "parallel")]
    out.par_chunks_mut(chunk)
        .enumerate()
        .for_each(|(i, c)| f(i, c));
    #[cfg(not(feature = "parallel"))]
    out.chunks_mut(chunk).enumerate().for_each(|(i, c)| f(i, c));
}

/// [`for_each_chunk`] for work that can fail: returns an error of one failing chunk (the first
/// in order when serial; any one of them when parallel), and `Ok` when none fails.
pub(crate) fn try_for_each_chunk<T: Send, E: Send>(
    out: &mut [T],
    chunk: usize,
    f: impl Fn(usize, &mut [T]) -> Result<(), E> + Sync + Send,
) -> Result<(), E> {
    #[cfg(feature = "parallel")]
    return out
        .par_chunks_mut(chunk)
        .enumerate()
        .try_for_each(|(i, c)| f(i, c));
    #[cfg(not(feature = "parallel"))]
    out.chunks_mut(chunk)
        .enumerate()
        .try_for_each(|(i, c)| f(i, c))
}

/// [`for_each_chunk`] over three equally long buffers cut at the same places:
/// `f(index, a_chunk, b_chunk, c_chunk)`.
pub(crate) fn for_each_chunk3<T: Send>(
    a: &mut [T],
    b: &mut [T],
    c: &mut [T],
    chunk: usize,
    f: impl Fn(usize, &mut [T], &mut [T], &mut [T]) + Sync + Send,
) {
    #[cfg(feature = "parallel")]
    a.par_chunks_mut(chunk)
        .zip(b.par_chunks_mut(chunk))
        .zip(c.par_chunks_mut(chunk))
        .enumerate()
        .for_each(|(i, ((a, b), c))| f(i, a, b, c));
    #[cfg(not(feature = "parallel"))]
    a.chunks_mut(chunk)
        .zip(b.chunks_mut(chunk))
        .zip(c.chunks_mut(chunk))
        .enumerate()
        .for_each(|(i, ((a, b), c))| f(i, a, b, c));
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Chunked work gives what one loop in order gives, in either build.
    #[test]
    fn chunks_equal_one_serial_loop_bit_for_bit() {
        let work = |i: usize| ((i as f64) * 0.37).sin() * 1e3 + (i as f64).sqrt();
        let want: Vec<f64> = (0..10_007).map(work).collect();
        let mut got = vec![0.0; want.len()];
        for_each_chunk(&mut got, 512, |c, chunk| {
            for (k, o) in chunk.iter_mut().enumerate() {
                *o = work(c * 512 + k);
            }
        });
        assert!(
            got.iter()
                .zip(&want)
                .all(|(a, b)| a.to_bits() == b.to_bits())
        );

        let (mut a, mut b, mut d) = (vec![0.0; 1000], vec![0.0; 1000], vec![0.0; 1000]);
        for_each_chunk3(&mut a, &mut b, &mut d, 64, |c, a, b, d| {
            for k in 0..a.len() {
                a[k] = work(c * 64 + k);
                b[k] = 2.0 * a[k];
                d[k] = -a[k];
            }
        });
        assert!((0..1000).all(|i| a[i] == want[i] && b[i] == 2.0 * want[i] && d[i] == -want[i]));
    }

    #[test]
    fn a_failing_chunk_is_reported() {
        let mut out = vec![0u32; 100];
        let r = try_for_each_chunk(&mut out, 10, |c, _| if c == 3 { Err(c) } else { Ok(()) });
        assert_eq!(r, Err(3));
        assert_eq!(
            try_for_each_chunk(&mut out, 10, |_, _| Ok::<(), ()>(())),
            Ok(())
        );
    }
}

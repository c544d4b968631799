//! The two line solvers of the split (alternating-direction) implicit step: tridiagonal
//! systems along every longitude column, solved for all columns at once, and cyclic
//! tridiagonal systems along every latitude row (longitude is periodic).
//!
//! Hand-written: Thomas's algorithm and its cyclic form by the Sherman–Morrison formula (as in
//! Press et al., *Numerical Recipes*, §2.7 "cyclic tridiagonal systems") are a few dozen lines,
//! and a general sparse-matrix dependency would be far larger than the need. The matrices are
//! strictly diagonally dominant (a positive heat capacity on the diagonal), so no pivoting is
//! needed.

// Grid loops index several arrays by the same cell or row number, as the stencil is written.
#![allow(clippy::needless_range_loop)]

/// Factorised tridiagonal systems along every column of a `rows × cols` grid (row-major), with
/// the off-diagonal couplings the same in every column and the diagonal per cell. The sweeps
/// run over rows with the columns as the inner, contiguous loop, so they vectorise.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct ColumnSystems {
    cols: usize,
    /// Sub-diagonal of row `j` (coupling to row `j − 1`), per row.
    lower: Vec<f64>,
    /// `1 / (d − l·c')` per cell.
    inv: Vec<f64>,
    /// Modified super-diagonal `c'` per cell.
    c_prime: Vec<f64>,
}

impl ColumnSystems {
    /// Factorises `diag` (per cell) with couplings `−k[j]` between rows `j − 1` and `j`
    /// (`k` has `rows + 1` entries, the first and last zero).
    pub(crate) fn factorise(cols: usize, k: &[f64], diag: &[f64]) -> Self {
        let rows = k.len() - 1;
        let mut s = ColumnSystems {
            cols,
            lower: (0..rows).map(|j| -k[j]).collect(),
            inv: vec![0.0; rows * cols],
            c_prime: vec![0.0; rows * cols],
        };
        s.refactorise(k, diag);
        s
    }

    /// Factorises again with a new diagonal (same couplings).
    pub(crate) fn refactorise(&mut self, k: &[f64], diag: &[f64]) {
        let cols = self.cols;
        let rows = self.lower.len();
        for j in 0..rows {
            let (l, u) = (-k[j], -k[j + 1]);
            for i in 0..cols {
                let idx = j * cols + i;
                let prev = if j == 0 {
                    0.0
                } else {
                    self.c_prime[idx - cols]
                };
                let inv = 1.0 / (diag[idx] - l * prev);
                self.inv[idx] = inv;
                self.c_prime[idx] = u * inv;
            }
        }
    }

    /// Solves in place (`rhs` becomes the solution).
    pub(crate) fn solve(&self, rhs: &mut [f64]) {
        let cols = self.cols;
        let rows = self.lower.len();
        for i in 0..cols {
            rhs[i] *= self.inv[i];
        }
        for j in 1..rows {
            let l = self.lower[j];
            let (done, rest) = rhs.split_at_mut(j * cols);
            let prev = &done[(j - 1) * cols..];
            let row = &mut rest[..cols];
            let inv = &self.inv[j * cols..(j + 1) * cols];
            for ((r, &p), &v) in row.iter_mut().zip(prev).zip(inv) {
                *r = (*r - l * p) * v;
            }
        }
        for j in (0..rows.saturating_sub(1)).rev() {
            let (head, tail) = rhs.split_at_mut((j + 1) * cols);
            let row = &mut head[j * cols..];
            let next = &tail[..cols];
            let cp = &self.c_prime[j * cols..(j + 1) * cols];
            for ((r, &n), &c) in row.iter_mut().zip(next).zip(cp) {
                *r -= c * n;
            }
        }
    }
}

/// Factorised cyclic tridiagonal systems along every row: diagonal per cell, the same coupling
/// `−e[j]` to both neighbours within row `j`, the first and last cells neighbours too.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct CyclicRows {
    cols: usize,
    /// Coupling per row.
    e: Vec<f64>,
    inv: Vec<f64>,
    c_prime: Vec<f64>,
    /// Solution of the reduced system for the Sherman–Morrison vector `u`, per cell.
    z: Vec<f64>,
    /// `β/γ` per row (weight of the last cell in `v · y`).
    v_last: Vec<f64>,
    /// `1 / (1 + v · z)` per row.
    scale: Vec<f64>,
}

impl CyclicRows {
    /// Factorises rows of `cols` cells (at least 3) with diagonal `diag` (per cell) and
    /// coupling `e[j]` (per row, ≥ 0).
    pub(crate) fn factorise(cols: usize, e: &[f64], diag: &[f64]) -> Self {
        let rows = e.len();
        let n = rows * cols;
        let mut s = CyclicRows {
            cols,
            e: e.to_vec(),
            inv: vec![0.0; n],
            c_prime: vec![0.0; n],
            z: vec![0.0; n],
            v_last: vec![0.0; rows],
            scale: vec![0.0; rows],
        };
        for j in 0..rows {
            let d = &diag[j * cols..(j + 1) * cols];
            let off = -e[j];
            // Numerical Recipes' choice γ = −b₀ keeps the reduced system diagonally dominant.
            let gamma = -d[0];
            let (alpha, beta) = (off, off);
            let inv = &mut s.inv[j * cols..(j + 1) * cols];
            let cp = &mut s.c_prime[j * cols..(j + 1) * cols];
            let mut prev = 0.0;
            for i in 0..cols {
                let mut di = d[i];
                if i == 0 {
                    di -= gamma;
                }
                if i == cols - 1 {
                    di -= alpha * beta / gamma;
                }
                let l = if i == 0 { 0.0 } else { off };
                let v = 1.0 / (di - l * prev);
                inv[i] = v;
                cp[i] = if i + 1 < cols { off * v } else { 0.0 };
                prev = cp[i];
            }
            let mut z = vec![0.0; cols];
            z[0] = gamma;
            z[cols - 1] = alpha;
            Self::thomas(off, inv, cp, &mut z);
            let v_last = beta / gamma;
            s.v_last[j] = v_last;
            s.scale[j] = 1.0 / (1.0 + z[0] + v_last * z[cols - 1]);
            s.z[j * cols..(j + 1) * cols].copy_from_slice(&z);
        }
        s
    }

    fn thomas(off: f64, inv: &[f64], cp: &[f64], r: &mut [f64]) {
        let n = r.len();
        let mut prev = 0.0;
        for i in 0..n {
            let y = (r[i] - off * prev) * inv[i];
            r[i] = y;
            prev = y;
        }
        for i in (0..n - 1).rev() {
            r[i] -= cp[i] * r[i + 1];
        }
    }

    /// Solves in place, row by row.
    pub(crate) fn solve(&self, rhs: &mut [f64]) {
        let cols = self.cols;
        for (j, row) in rhs.chunks_exact_mut(cols).enumerate() {
            let span = j * cols..(j + 1) * cols;
            Self::thomas(
                -self.e[j],
                &self.inv[span.clone()],
                &self.c_prime[span.clone()],
                row,
            );
            let f = (row[0] + self.v_last[j] * row[cols - 1]) * self.scale[j];
            for (r, &z) in row.iter_mut().zip(&self.z[span]) {
                *r -= f * z;
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn column_and_cyclic_solves_invert_their_matrices() {
        let (rows, cols) = (5, 4);
        let k = [0.0, 1.5, 0.7, 2.0, 0.3, 0.0];
        let diag: Vec<f64> = (0..rows * cols).map(|c| 5.0 + (c % 3) as f64).collect();
        let x: Vec<f64> = (0..rows * cols).map(|c| (c as f64 * 0.7).sin()).collect();
        // b = M x for the column systems.
        let mut b = vec![0.0; rows * cols];
        for j in 0..rows {
            for i in 0..cols {
                let c = j * cols + i;
                b[c] = diag[c] * x[c];
                if j > 0 {
                    b[c] -= k[j] * x[c - cols];
                }
                if j + 1 < rows {
                    b[c] -= k[j + 1] * x[c + cols];
                }
            }
        }
        ColumnSystems::factorise(cols, &k, &diag).solve(&mut b);
        for (a, e) in b.iter().zip(&x) {
            assert!((a - e).abs() < 1e-12);
        }
        // Cyclic rows.
        let e = [0.5, 1.0, 2.0, 0.0, 1.2];
        let mut b = vec![0.0; rows * cols];
        for j in 0..rows {
            for i in 0..cols {
                let c = j * cols + i;
                let w = j * cols + (i + cols - 1) % cols;
                let east = j * cols + (i + 1) % cols;
                b[c] = diag[c] * x[c] - e[j] * (x[w] + x[east]);
            }
        }
        CyclicRows::factorise(cols, &e, &diag).solve(&mut b);
        for (a, want) in b.iter().zip(&x) {
            assert!((a - want).abs() < 1e-12, "{a} {want}");
        }
    }
}

//! Small one-dimensional root finders: Brent's method on a bracket, and a
//! warm-started secant that falls back to Brent when it strays.

use crate::error::SolverError;

/// Options for the root finders.
#[derive(Debug, Clone, Copy)]
pub struct SolveOptions {
    /// Absolute tolerance on x.
    pub x_tol: f64,
    /// Absolute tolerance on f(x).
    pub f_tol: f64,
    /// Maximum iterations.
    pub max_iter: usize,
}

impl Default for SolveOptions {
    fn default() -> Self {
        SolveOptions {
            x_tol: 1e-10,
            f_tol: 1e-13,
            max_iter: 100,
        }
    }
}

/// A root and how it was found.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Root {
    /// The root.
    pub x: f64,
    /// f at the root.
    pub f: f64,
    /// Function evaluations used.
    pub evaluations: usize,
    /// Slope of f near the root (secant of the last two points; NaN if unknown).
    pub slope: f64,
}

/// Brent's method (Brent 1973, Algorithms for Minimization without
/// Derivatives, ch. 4) on `[a, b]`, given f(a) and f(b) of opposite sign.
///
/// # Errors
/// [`SolverError::NoBracket`] when f(a) and f(b) have the same sign,
/// [`SolverError::NonFinite`] when f returns NaN or ±∞,
/// [`SolverError::NotConverged`] after `max_iter` iterations.
pub fn brent(
    mut f: impl FnMut(f64) -> f64,
    a: f64,
    b: f64,
    fa: f64,
    fb: f64,
    opts: SolveOptions,
) -> Result<Root, SolverError> {
    let (mut a, mut b, mut fa, mut fb) = (a, b, fa, fb);
    if !fa.is_finite() || !fb.is_finite() {
        return Err(SolverError::NonFinite {
            x: if fa.is_finite() { b } else { a },
        });
    }
    if fa == 0.0 {
        return Ok(Root {
            x: a,
            f: 0.0,
            evaluations: 0,
            slope: f64::NAN,
        });
    }
    if fb == 0.0 {
        return Ok(Root {
            x: b,
            f: 0.0,
            evaluations: 0,
            slope: f64::NAN,
        });
    }
    if fa.signum() == fb.signum() {
        return Err(SolverError::NoBracket {
            lo: a,
            hi: b,
            f_lo: fa,
            f_hi: fb,
        });
    }
    let mut c = a;
    let mut fc = fa;
    let mut d = b - a;
    let mut e = d;
    for evals in 0..opts.max_iter {
        if fb.signum() == fc.signum() {
            c = a;
            fc = fa;
            d = b - a;
            e = d;
        }
        if fc.abs() < fb.abs() {
            a = b;
            b = c;
            c = a;
            fa = fb;
            fb = fc;
            fc = fa;
        }
        let tol = 2.0 * f64::EPSILON * b.abs() + 0.5 * opts.x_tol;
        let m = 0.5 * (c - b);
        if m.abs() <= tol || fb.abs() <= opts.f_tol {
            return Ok(Root {
                x: b,
                f: fb,
                evaluations: evals,
                slope: if c != b {
                    (fc - fb) / (c - b)
                } else {
                    f64::NAN
                },
            });
        }
        if e.abs() >= tol && fa.abs() > fb.abs() {
            let s = fb / fa;
            let (mut p, mut q);
            if a == c {
                p = 2.0 * m * s;
                q = 1.0 - s;
            } else {
                let qq = fa / fc;
                let r = fb / fc;
                p = s * (2.0 * m * qq * (qq - r) - (b - a) * (r - 1.0));
                q = (qq - 1.0) * (r - 1.0) * (s - 1.0);
            }
            if p > 0.0 {
                q = -q;
            } else {
                p = -p;
            }
            if 2.0 * p < (3.0 * m * q - (tol * q).abs()).min((e * q).abs()) {
                e = d;
                d = p / q;
            } else {
                d = m;
                e = m;
            }
        } else {
            d = m;
            e = m;
        }
        a = b;
        fa = fb;
        b += if d.abs() > tol { d } else { tol.copysign(m) };
        fb = f(b);
        if !fb.is_finite() {
            return Err(SolverError::NonFinite { x: b });
        }
    }
    Err(SolverError::NotConverged {
        iterations: opts.max_iter,
        x: b,
        f: fb,
    })
}

/// Root of a monotonic `f` on `[lo, hi]`, starting from a guess `x0` (a
/// previous answer) and a slope estimate `slope0` (0 when unknown). Takes
/// secant steps while they stay inside what is known to bracket the root
/// and keep shrinking |f|; otherwise brackets and hands over to [`brent`].
/// The root's `slope` is the last finite slope seen, to warm-start the
/// next call.
///
/// # Errors
/// As [`brent`]; `NoBracket` when f has one sign on all of `[lo, hi]`;
/// `EmptyInterval` when `lo < hi` does not hold between finite ends.
pub fn solve_warm(
    mut f: impl FnMut(f64) -> f64,
    lo: f64,
    hi: f64,
    x0: f64,
    slope0: f64,
    opts: SolveOptions,
) -> Result<Root, SolverError> {
    let mut evals = 0;
    let mut eval = |x: f64, evals: &mut usize| {
        *evals += 1;
        f(x)
    };
    // Keeps the most recent point on each side of the root.
    let record = |p: (f64, f64), neg: &mut Option<(f64, f64)>, pos: &mut Option<(f64, f64)>| {
        if p.1 < 0.0 {
            *neg = Some(p);
        } else {
            *pos = Some(p);
        }
    };
    if !(lo.is_finite() && hi.is_finite() && lo < hi) {
        return Err(SolverError::EmptyInterval { lo, hi });
    }
    let x0 = if x0.is_finite() { x0 } else { 0.5 * (lo + hi) };
    let mut x = x0.clamp(lo, hi);
    let mut fx = eval(x, &mut evals);
    if !fx.is_finite() {
        return Err(SolverError::NonFinite { x });
    }
    // Most recent points on each side of the root.
    let mut neg: Option<(f64, f64)> = None;
    let mut pos: Option<(f64, f64)> = None;
    let mut slope = slope0;
    let mut prev: Option<(f64, f64)> = None;
    for _ in 0..12 {
        if fx.abs() <= opts.f_tol {
            break;
        }
        record((x, fx), &mut neg, &mut pos);
        if let Some((px, pf)) = prev {
            let s = (fx - pf) / (x - px);
            if s.is_finite() && s != 0.0 {
                slope = s;
            }
        }
        if slope == 0.0 || !slope.is_finite() {
            // No slope yet: probe a small step towards the wider side.
            let h = 1e-4 * (hi - lo) * if hi - x > x - lo { 1.0 } else { -1.0 };
            let fp = eval(x + h, &mut evals);
            if !fp.is_finite() {
                break;
            }
            slope = (fp - fx) / h;
            if slope == 0.0 || !slope.is_finite() {
                break;
            }
            record((x + h, fp), &mut neg, &mut pos);
        }
        let next = x - fx / slope;
        let (blo, bhi) = match (neg, pos) {
            (Some(n), Some(p)) => (n.0.min(p.0), n.0.max(p.0)),
            _ => (lo, hi),
        };
        if !(next >= blo && next <= bhi) {
            break;
        }
        if (next - x).abs() <= opts.x_tol {
            // A step this small changes f by less than the tolerance
            // allows to matter; f at `next` is its linear estimate.
            return Ok(Root {
                x: next,
                f: fx + slope * (next - x),
                evaluations: evals,
                slope,
            });
        }
        let fnext = eval(next, &mut evals);
        if !fnext.is_finite() {
            break;
        }
        let stalled = fnext.abs() > 0.5 * fx.abs();
        prev = Some((x, fx));
        x = next;
        fx = fnext;
        if stalled {
            record((x, fx), &mut neg, &mut pos);
            break;
        }
    }
    if fx.abs() <= opts.f_tol {
        return Ok(Root {
            x,
            f: fx,
            evaluations: evals,
            slope,
        });
    }
    let (a, fa, b, fb) = match (neg, pos) {
        (Some(n), Some(p)) => (n.0, n.1, p.0, p.1),
        _ => {
            // One side is unknown: look at the end of the interval on the
            // far side of what we have.
            let flo = eval(lo, &mut evals);
            let fhi = eval(hi, &mut evals);
            let mut pts = vec![(lo, flo), (hi, fhi)];
            pts.extend(neg);
            pts.extend(pos);
            pts.retain(|p| p.1.is_finite());
            pts.sort_by(|p, q| p.0.total_cmp(&q.0));
            match pts.windows(2).find(|w| w[0].1.signum() != w[1].1.signum()) {
                Some(w) => (w[0].0, w[0].1, w[1].0, w[1].1),
                None => {
                    return Err(SolverError::NoBracket {
                        lo,
                        hi,
                        f_lo: flo,
                        f_hi: fhi,
                    });
                }
            }
        }
    };
    let root = brent(
        &mut f,
        a.min(b),
        a.max(b),
        if a < b { fa } else { fb },
        if a < b { fb } else { fa },
        opts,
    )?;
    let slope = if root.slope.is_finite() && root.slope != 0.0 {
        root.slope
    } else {
        slope
    };
    Ok(Root {
        evaluations: root.evaluations + evals,
        slope,
        ..root
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn brent_finds_cubic_root() {
        let f = |x: f64| x * x * x - 2.0;
        let r = brent(f, 0.0, 2.0, f(0.0), f(2.0), SolveOptions::default())
            .unwrap_or_else(|e| panic!("{e}"));
        assert!((r.x - 2f64.cbrt()).abs() < 1e-9);
        assert!(r.evaluations < 20, "{}", r.evaluations);
    }

    #[test]
    fn brent_reports_missing_bracket() {
        let f = |x: f64| x * x + 1.0;
        let e = brent(f, -1.0, 1.0, f(-1.0), f(1.0), SolveOptions::default());
        assert!(matches!(e, Err(SolverError::NoBracket { .. })));
    }

    #[test]
    fn brent_reports_nan() {
        let f = |x: f64| if x > 0.5 { f64::NAN } else { x - 0.7 };
        let e = brent(f, 0.0, 1.0, f(0.0), 1.0, SolveOptions::default());
        assert!(matches!(e, Err(SolverError::NonFinite { .. })));
    }

    #[test]
    fn warm_start_converges_in_few_steps() {
        let f = |x: f64| (x - 0.3).exp() - 1.0;
        let r = solve_warm(f, -5.0, 5.0, 0.29, 1.0, SolveOptions::default())
            .unwrap_or_else(|e| panic!("{e}"));
        assert!((r.x - 0.3).abs() < 1e-9);
        assert!(r.evaluations <= 5, "{}", r.evaluations);
    }

    #[test]
    fn warm_start_survives_a_bad_guess() {
        let f = |x: f64| x.atan() - 1.2;
        let r = solve_warm(f, -50.0, 50.0, -40.0, 0.0, SolveOptions::default())
            .unwrap_or_else(|e| panic!("{e}"));
        assert!((r.x - 1.2f64.tan()).abs() < 1e-8);
    }

    #[test]
    fn warm_start_refuses_an_empty_or_nan_interval() {
        let f = |x: f64| x - 1.0;
        for (lo, hi) in [
            (2.0, 1.0),
            (f64::NAN, 1.0),
            (0.0, f64::INFINITY),
            (1.0, 1.0),
        ] {
            let e = solve_warm(f, lo, hi, 0.5, 1.0, SolveOptions::default());
            assert!(
                matches!(e, Err(SolverError::EmptyInterval { .. })),
                "{lo}..{hi}: {e:?}"
            );
        }
        let r = solve_warm(f, 0.0, 2.0, f64::NAN, 1.0, SolveOptions::default())
            .unwrap_or_else(|e| panic!("{e}"));
        assert!((r.x - 1.0).abs() < 1e-9);
    }

    #[test]
    fn warm_start_reports_no_root() {
        let f = |x: f64| x * x + 1.0;
        let e = solve_warm(f, -1.0, 1.0, 0.0, 1.0, SolveOptions::default());
        assert!(matches!(e, Err(SolverError::NoBracket { .. })));
    }
}

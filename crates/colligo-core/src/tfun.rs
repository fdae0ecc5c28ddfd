//! Temperature correlations for model parameters.
//!
//! Each variant is one published functional form; the data file names which
//! form a parameter uses, the coefficients, and the paper they come from.

use serde::{Deserialize, Serialize};

/// A model parameter as a function of temperature (and, for one form, pressure).
///
/// `T` is the thermodynamic temperature in K; `P` the pressure in MPa.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum TempFn {
    /// A constant: `value`.
    Constant(f64),
    /// `a + b / T` — the form a parameter takes when its excess enthalpy is
    /// constant (regular-solution behaviour).
    ReciprocalT {
        /// Constant term.
        a: f64,
        /// Coefficient of 1/T, K.
        b: f64,
    },
    /// A Taylor expansion about a reference temperature from tabulated
    /// temperature derivatives: `value + d1 (T − T_r) + d2/2 (T − T_r)²`
    /// (the form of Silvester & Pitzer 1977 and Pitzer 1991, ch. 3).
    Taylor {
        /// Reference temperature, K (usually 298.15).
        t_ref_k: f64,
        /// Value at the reference temperature.
        value: f64,
        /// First derivative, 1/K.
        d1: f64,
        /// Second derivative, 1/K².
        #[serde(default)]
        d2: f64,
    },
    /// Møller (1988), Geochim. Cosmochim. Acta 52:821, eq. 13 (also
    /// Greenberg & Møller 1989, eq. 3):
    /// `a1 + a2 T + a3/T + a4 ln T + a5/(T − 263) + a6 T² + a7/(680 − T) + a8/(T − 227)`.
    Moller1988([f64; 8]),
    /// Archer (1999), J. Phys. Chem. Ref. Data 28:1, eq. 22, T_r = 298.15 K:
    /// `a1 + a2 (T − T_r)/100 + a3 (T − T_r)²/10⁵ + a4·100/(T − 225) + a5·1000/T + a6·10⁶/(T − 225)³`.
    Archer1999([f64; 6]),
    /// Archer (1992), J. Phys. Chem. Ref. Data 21:793, eq. 36 (P in MPa),
    /// with the corrected multipliers of the 6th and 7th terms as
    /// transcribed in pytzer 0.6.0.
    Archer1992(Vec<f64>),
    /// Spencer, Møller & Weare (1990), Geochim. Cosmochim. Acta 54:575, eq. 2,
    /// the terms used for the Mg–Cl and Mg–SO4 parameters, as transcribed in
    /// pytzer 0.6.0 (`SMW90_eq2`):
    /// `a[0] + a[1] T + a[2] T² + a[3] T³ + a[4]/T + a[5] ln T`.
    /// The coefficients are in pytzer's order (its names: a1, a2, a6, a9, a3, a4).
    Spencer1990([f64; 6]),
    /// Hovey, Pitzer & Rard (1993), J. Chem. Thermodyn. 25:173, eq. 36:
    /// `a + b (1/T − 1/T_r) + c ln(T/T_r)`.
    Hovey1993 {
        /// Reference temperature T_r, K (298.15 in the paper).
        t_ref_k: f64,
        /// Value at T_r.
        a: f64,
        /// Coefficient of (1/T − 1/T_r), K.
        b: f64,
        /// Coefficient of ln(T/T_r).
        c: f64,
    },
}

impl TempFn {
    /// Value at temperature `t_k` (K) and pressure `p_mpa` (MPa).
    pub fn eval(&self, t_k: f64, p_mpa: f64) -> f64 {
        let t = t_k;
        match self {
            TempFn::Constant(v) => *v,
            TempFn::ReciprocalT { a, b } => a + b / t,
            TempFn::Taylor {
                t_ref_k,
                value,
                d1,
                d2,
            } => {
                let dt = t - t_ref_k;
                value + d1 * dt + 0.5 * d2 * dt * dt
            }
            TempFn::Moller1988(a) => {
                a[0] + a[1] * t
                    + a[2] / t
                    + a[3] * t.ln()
                    + a[4] / (t - 263.0)
                    + a[5] * t * t
                    + a[6] / (680.0 - t)
                    + a[7] / (t - 227.0)
            }
            TempFn::Archer1999(a) => {
                let dt = t - 298.15;
                let u = t - 225.0;
                a[0] + a[1] * dt * 1e-2
                    + a[2] * dt * dt * 1e-5
                    + a[3] * 1e2 / u
                    + a[4] * 1e3 / t
                    + a[5] * 1e6 / (u * u * u)
            }
            TempFn::Archer1992(a) => archer1992_eq36(t, p_mpa, a),
            TempFn::Spencer1990(a) => {
                a[0] + a[1] * t + a[2] * t * t + a[3] * t * t * t + a[4] / t + a[5] * t.ln()
            }
            TempFn::Hovey1993 { t_ref_k, a, b, c } => {
                a + b * (1.0 / t - 1.0 / t_ref_k) + c * (t / t_ref_k).ln()
            }
        }
    }

    /// True when the value does not depend on temperature.
    pub fn is_constant(&self) -> bool {
        matches!(self, TempFn::Constant(_))
    }

    /// Checks the coefficient count of the variable-length forms.
    pub fn check(&self) -> Result<(), String> {
        match self {
            TempFn::Archer1992(a) if a.len() != 24 => {
                Err(format!("Archer1992 needs 24 coefficients, got {}", a.len()))
            }
            _ => Ok(()),
        }
    }
}

fn archer1992_eq36(t: f64, p: f64, a: &[f64]) -> f64 {
    let c = |i: usize| a.get(i).copied().unwrap_or(0.0);
    let u = t - 200.0;
    let v = 650.0 - t;
    let w = t - 225.0;
    let v3 = v * v * v;
    c(0) + c(1) * 1e-3 * t
        + c(2) * 4e-6 * t * t
        + c(3) / u
        + c(4) / t
        + c(5) * 100.0 / (u * u)
        + c(6) * 200.0 / (t * t)
        + c(7) * 8e-9 * t * t * t
        + c(8) / v.sqrt()
        + c(9) * 1e-5 * p
        + c(10) * 2e-4 * p / w
        + c(11) * 100.0 * p / v3
        + c(12) * 2e-8 * p * t
        + c(13) * 2e-4 * p / v
        + c(14) * 1e-7 * p * p
        + c(15) * 2e-6 * p * p / w
        + c(16) * p * p / v3
        + c(17) * 2e-10 * p * p * t
        + c(18) * 4e-13 * p * p * t * t
        + c(19) * 0.04 * p / (w * w)
        + c(20) * 4e-11 * p * t * t
        + c(21) * 2e-8 * p * p * p / w
        + c(22) * 0.01 * p * p * p / v3
        + c(23) * 200.0 / v3
}

/// A tabulated curve `(x, y)` interpolated linearly, with the x range kept
/// so callers can say when they extrapolate.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Table(pub Vec<(f64, f64)>);

impl Table {
    /// Linear interpolation; beyond the ends, linear extrapolation from the
    /// last two points (the caller warns when it happens).
    pub fn eval(&self, x: f64) -> f64 {
        let p = &self.0;
        match p.len() {
            0 => f64::NAN,
            1 => p[0].1,
            n => {
                let i = p.partition_point(|q| q.0 < x).clamp(1, n - 1);
                let (x0, y0) = p[i - 1];
                let (x1, y1) = p[i];
                y0 + (y1 - y0) * (x - x0) / (x1 - x0)
            }
        }
    }

    /// The x range covered by the table.
    pub fn range(&self) -> (f64, f64) {
        match (self.0.first(), self.0.last()) {
            (Some(a), Some(b)) => (a.0, b.0),
            _ => (f64::NAN, f64::NAN),
        }
    }

    /// Checks that the table has points with strictly increasing, finite x.
    pub fn check(&self) -> Result<(), String> {
        if self.0.is_empty() {
            return Err("empty table".into());
        }
        for w in self.0.windows(2) {
            if !(w[1].0 > w[0].0) {
                return Err(format!("x values not increasing at {}", w[1].0));
            }
        }
        if self.0.iter().any(|p| !p.0.is_finite() || !p.1.is_finite()) {
            return Err("non-finite value".into());
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn table_interpolates_and_extrapolates() {
        let t = Table(vec![(0.0, 1.0), (10.0, 2.0), (20.0, 4.0)]);
        assert_eq!(t.eval(5.0), 1.5);
        assert_eq!(t.eval(15.0), 3.0);
        assert_eq!(t.eval(-10.0), 0.0);
        assert_eq!(t.eval(30.0), 6.0);
        assert!(Table(vec![(1.0, 0.0), (1.0, 1.0)]).check().is_err());
    }

    #[test]
    fn taylor_is_exact_at_reference() {
        let f = TempFn::Taylor {
            t_ref_k: 298.15,
            value: 0.0765,
            d1: 7.159e-4,
            d2: 0.0,
        };
        assert_eq!(f.eval(298.15, 0.1), 0.0765);
        assert!((f.eval(308.15, 0.1) - (0.0765 + 7.159e-3)).abs() < 1e-12);
    }
}

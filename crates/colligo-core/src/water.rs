//! Pure water and ice: saturation pressures, the ice-equilibrium water
//! activity, liquid density and molar volume.
//!
//! All functions take the thermodynamic temperature in kelvin and return SI
//! values (Pa, kg/m³). Each equation names its published source; the
//! validity range is the one stated there.

/// Molar mass of water, kg/mol (IAPWS-95, Wagner & Pruss 2002: 18.015268 g/mol).
pub const M_W: f64 = 0.018_015_268;
/// Molar gas constant, J/(mol K) (CODATA 2018, exact).
pub const R: f64 = 8.314_462_618;
/// Temperature of the triple point of water, K.
pub const T_TRIPLE: f64 = 273.16;
/// Pressure of the triple point of water, Pa (IAPWS 2011).
pub const P_TRIPLE: f64 = 611.657;
/// 0 °C in kelvin.
pub const T_ZERO_C: f64 = 273.15;
/// Critical temperature of water, K (IAPWS-95).
pub const T_CRIT: f64 = 647.096;
/// Critical pressure of water, Pa (IAPWS-95).
pub const P_CRIT: f64 = 22.064e6;
/// Critical density of water, kg/m³ (IAPWS-95).
pub const RHO_CRIT: f64 = 322.0;
/// Standard atmosphere, Pa.
pub const P_STD: f64 = 101_325.0;

/// Lowest temperature of the supercooled-liquid equation (Murphy & Koop 2005, eq. 10), K.
pub const T_MIN_LIQUID: f64 = 123.0;
/// Lowest temperature of the IAPWS 2011 sublimation equation, K.
pub const T_MIN_ICE: f64 = 50.0;

/// Saturation (vapour) pressure of liquid water over a flat surface, Pa.
///
/// At and above the triple point: the IAPWS saturation-pressure equation of
/// Wagner & Pruss (2002), J. Phys. Chem. Ref. Data 31:387, eq. 2.5,
/// consistent with IAPWS-95 to the accuracy of that formulation:
///
/// ln(p/p_c) = (T_c/T)(a1 τ + a2 τ^1.5 + a3 τ³ + a4 τ^3.5 + a5 τ⁴ + a6 τ^7.5), τ = 1 − T/T_c.
///
/// Below the triple point (supercooled liquid): Murphy & Koop (2005),
/// Q. J. R. Meteorol. Soc. 131:1539, eq. 10, valid 123–332 K, scaled by the
/// ratio of the two equations at 273.16 K so that the curve is continuous
/// (the ratio differs from 1 by 7e-8).
pub fn p_sat_liquid(t_k: f64) -> f64 {
    if t_k >= T_TRIPLE {
        wagner_pruss_p_sat(t_k)
    } else {
        murphy_koop_p_liquid(t_k) * (wagner_pruss_p_sat(T_TRIPLE) / murphy_koop_p_liquid(T_TRIPLE))
    }
}

/// d ln p_sat / dT of liquid water, 1/K (analytic derivative of [`p_sat_liquid`]).
pub fn dln_p_sat_liquid_dt(t_k: f64) -> f64 {
    if t_k >= T_TRIPLE {
        let tau = 1.0 - t_k / T_CRIT;
        let s = wp_series(tau);
        let ds = wp_series_dtau(tau);
        // ln p = ln p_c + (T_c/T) s(τ);  d/dT = −T_c/T² s − (1/T) s'(τ)
        -T_CRIT / (t_k * t_k) * s - ds / t_k
    } else {
        murphy_koop_dln_p_liquid_dt(t_k)
    }
}

const WP_A: [f64; 6] = [
    -7.859_517_83,
    1.844_082_59,
    -11.786_649_7,
    22.680_741_1,
    -15.961_871_9,
    1.801_225_02,
];

fn wp_series(tau: f64) -> f64 {
    let s = tau.sqrt();
    let t3 = tau * tau * tau;
    WP_A[0] * tau
        + WP_A[1] * tau * s
        + WP_A[2] * t3
        + WP_A[3] * t3 * s
        + WP_A[4] * t3 * tau
        + WP_A[5] * t3 * t3 * tau * s
}

fn wp_series_dtau(tau: f64) -> f64 {
    let s = tau.sqrt();
    let t2 = tau * tau;
    WP_A[0]
        + 1.5 * WP_A[1] * s
        + 3.0 * WP_A[2] * t2
        + 3.5 * WP_A[3] * t2 * s
        + 4.0 * WP_A[4] * t2 * tau
        + 7.5 * WP_A[5] * t2 * t2 * t2 * s
}

/// Wagner & Pruss (2002) eq. 2.5 on its own (valid 273.16 K to T_c), Pa.
pub fn wagner_pruss_p_sat(t_k: f64) -> f64 {
    let tau = 1.0 - t_k / T_CRIT;
    P_CRIT * (T_CRIT / t_k * wp_series(tau)).exp()
}

/// Saturated-liquid density of water, kg/m³: Wagner & Pruss (2002) eq. 2.6,
/// valid 273.16 K to T_c. Below the triple point the same equation is
/// extrapolated; it stays within 0.1 % of the measured supercooled density
/// to −20 °C (Hare & Sorensen 1987, J. Chem. Phys. 87:4840), which is
/// more than enough for the molar volume in an osmotic pressure.
pub fn rho_sat_liquid(t_k: f64) -> f64 {
    const B: [f64; 6] = [
        1.992_740_64,
        1.099_653_42,
        -0.510_839_303,
        -1.754_934_79,
        -45.517_035_2,
        -6.746_944_50e5,
    ];
    let tau = 1.0 - t_k.min(T_CRIT) / T_CRIT;
    let c = tau.cbrt();
    let c2 = c * c;
    let c5 = c2 * c2 * c;
    let c16 = c5 * c5 * c5 * c;
    let c43 = c16 * c16 * c5 * c5 * c;
    let c110 = c43 * c43 * c16 * c5 * c2 * c;
    RHO_CRIT * (1.0 + B[0] * c + B[1] * c2 + B[2] * c5 + B[3] * c16 + B[4] * c43 + B[5] * c110)
}

/// Molar volume of liquid water, m³/mol, from [`rho_sat_liquid`].
pub fn molar_volume_liquid(t_k: f64) -> f64 {
    M_W / rho_sat_liquid(t_k)
}

/// Sublimation pressure of ice Ih, Pa: IAPWS (2011) Revised Release on the
/// Pressure along the Melting and Sublimation Curves of Ordinary Water
/// Substance (Wagner, Riethmann, Feistel & Harvey 2011, J. Phys. Chem. Ref.
/// Data 40:043103), eq. 6, valid 50–273.16 K:
///
/// ln(p/p_t) = θ⁻¹ Σ a_i θ^{b_i}, θ = T/T_t.
pub fn p_sublimation_ice(t_k: f64) -> f64 {
    const A: [f64; 3] = [-21.214_400_6, 27.320_381_9, -6.105_981_30];
    const B: [f64; 3] = [0.333_333_333e-2, 1.206_666_67, 1.703_333_33];
    let theta = t_k / T_TRIPLE;
    let s: f64 = A.iter().zip(B).map(|(a, b)| a * theta.powf(b)).sum();
    P_TRIPLE * (s / theta).exp()
}

/// Vapour pressure of ice, Pa: Murphy & Koop (2005) eq. 7, valid above 110 K.
pub fn murphy_koop_p_ice(t_k: f64) -> f64 {
    (9.550_426 - 5723.265 / t_k + 3.530_68 * t_k.ln() - 0.007_283_32 * t_k).exp()
}

fn murphy_koop_dln_p_ice_dt(t_k: f64) -> f64 {
    5723.265 / (t_k * t_k) + 3.530_68 / t_k - 0.007_283_32
}

/// Vapour pressure of (supercooled) liquid water, Pa: Murphy & Koop (2005)
/// eq. 10, valid 123–332 K.
pub fn murphy_koop_p_liquid(t_k: f64) -> f64 {
    let (a, b, tanh, _) = mk_liquid_parts(t_k);
    (a + tanh * b).exp()
}

fn mk_liquid_parts(t: f64) -> (f64, f64, f64, f64) {
    let ln_t = t.ln();
    let a = 54.842_763 - 6763.22 / t - 4.210 * ln_t + 0.000_367 * t;
    let b = 53.878 - 1331.22 / t - 9.445_23 * ln_t + 0.014_025 * t;
    let arg = 0.0415 * (t - 218.8);
    (a, b, arg.tanh(), arg)
}

fn murphy_koop_dln_p_liquid_dt(t: f64) -> f64 {
    let (_, b, tanh, _) = mk_liquid_parts(t);
    let da = 6763.22 / (t * t) - 4.210 / t + 0.000_367;
    let db = 1331.22 / (t * t) - 9.445_23 / t + 0.014_025;
    let dtanh = 0.0415 * (1.0 - tanh * tanh);
    da + dtanh * b + tanh * db
}

/// Water activity of an aqueous solution in equilibrium with ice Ih at `t_k`:
/// the ratio p_ice(T)/p_liquid(T) of the vapour pressures of ice and of
/// supercooled liquid water, both from Murphy & Koop (2005), eqs. 7 and 10.
/// Returns 0 (a_w = 1) at and above 273.15 K (no ice can form there at 0.1 MPa).
///
/// The ratio agrees with the Gibbs-energy route (IAPWS-06 ice, IAPWS-95
/// liquid) within 3.1e-4 to −20 °C (see the reference checks).
pub fn ice_equilibrium_ln_aw(t_k: f64) -> f64 {
    if t_k >= T_ZERO_C {
        return 0.0;
    }
    let (a, b, tanh, _) = mk_liquid_parts(t_k);
    let ln_ice = 9.550_426 - 5723.265 / t_k + 3.530_68 * t_k.ln() - 0.007_283_32 * t_k;
    // The two vapour-pressure equations cross at the triple point (273.16 K,
    // 612 Pa); at 0.1 MPa ice melts at 273.15 K. Shifting ln(p_ice/p_liq) by
    // its value at 273.15 K (−9.67e-5) puts the melting point of pure water at
    // 0 °C and brings the ratio closer to the Gibbs-energy route at 0.1 MPa.
    ln_ice - (a + tanh * b) - ICE_OFFSET_AT_ZERO_C
}

/// d/dT of [`ice_equilibrium_ln_aw`], 1/K.
pub fn ice_equilibrium_dln_aw_dt(t_k: f64) -> f64 {
    if t_k >= T_ZERO_C {
        return 0.0;
    }
    murphy_koop_dln_p_ice_dt(t_k) - murphy_koop_dln_p_liquid_dt(t_k)
}

/// ln(p_ice/p_liq) of Murphy & Koop (2005) eqs. 7 and 10 at exactly 273.15 K.
const ICE_OFFSET_AT_ZERO_C: f64 = -9.670_816_045_215_247e-5;

/// IAPWS-IF97 region 4 (the saturation line), Revised Release 2007, eqs. 29–31.
pub mod if97 {
    const N: [f64; 10] = [
        0.116_705_214_527_67e4,
        -0.724_213_167_032_06e6,
        -0.170_738_469_400_92e2,
        0.120_208_247_024_70e5,
        -0.323_255_503_223_33e7,
        0.149_151_086_135_30e2,
        -0.482_326_573_615_91e4,
        0.405_113_405_420_57e6,
        -0.238_555_575_678_49,
        0.650_175_348_447_98e3,
    ];

    /// Saturation pressure, Pa, 273.15 K to 647.096 K (IF97 eq. 30).
    pub fn p_sat(t_k: f64) -> f64 {
        let v = t_k + N[8] / (t_k - N[9]);
        let a = v * v + N[0] * v + N[1];
        let b = N[2] * v * v + N[3] * v + N[4];
        let c = N[5] * v * v + N[6] * v + N[7];
        let x = 2.0 * c / (-b + (b * b - 4.0 * a * c).sqrt());
        x.powi(4) * 1.0e6
    }

    /// Saturation temperature, K, 611.213 Pa to 22.064 MPa (IF97 eq. 31).
    pub fn t_sat(p_pa: f64) -> f64 {
        let beta = (p_pa / 1.0e6).powf(0.25);
        let e = beta * beta + N[2] * beta + N[5];
        let f = N[0] * beta * beta + N[3] * beta + N[6];
        let g = N[1] * beta * beta + N[4] * beta + N[7];
        let d = 2.0 * g / (-f - (f * f - 4.0 * e * g).sqrt());
        (N[9] + d - ((N[9] + d).powi(2) - 4.0 * (N[8] + N[9] * d)).sqrt()) / 2.0
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ice_ratio_is_one_at_zero_celsius() {
        assert!(ice_equilibrium_ln_aw(T_ZERO_C - 1e-9).abs() < 1e-10);
    }

    #[test]
    fn derivatives_match_finite_differences() {
        for t in [250.0, 268.0, 273.0, 300.0, 373.0, 450.0] {
            let h = 1e-4;
            let fd = (p_sat_liquid(t + h).ln() - p_sat_liquid(t - h).ln()) / (2.0 * h);
            assert!(
                (fd - dln_p_sat_liquid_dt(t)).abs() < 1e-7 * fd.abs().max(1.0),
                "{t}"
            );
        }
        for t in [230.0, 250.0, 270.0] {
            let h = 1e-4;
            let fd = (ice_equilibrium_ln_aw(t + h) - ice_equilibrium_ln_aw(t - h)) / (2.0 * h);
            assert!((fd - ice_equilibrium_dln_aw_dt(t)).abs() < 1e-7, "{t}");
        }
    }

    #[test]
    fn liquid_pressure_continuous_at_triple_point() {
        let below = p_sat_liquid(T_TRIPLE - 1e-9);
        let above = p_sat_liquid(T_TRIPLE);
        assert!((below / above - 1.0).abs() < 1e-9);
    }
}

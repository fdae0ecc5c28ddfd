//! The pieces of the Pitzer equations shared by single salts and mixtures:
//! the Debye–Hückel slope A_φ(T), the Debye–Hückel term, and the
//! unsymmetrical-mixing functions J, J′ (Harvie's method) behind Eθ.

/// Pitzer's b, kg^½ mol^-½.
pub const B: f64 = 1.2;

/// Debye–Hückel osmotic limiting slope A_φ, kg^½ mol^-½, at 0.1 MPa.
///
/// 234.15–363.15 K: Clegg, Rard & Pitzer (1994), J. Chem. Soc. Faraday
/// Trans. 90:1875, Appendix II, Chebyshev fit (as transcribed in pytzer
/// 0.6.0, `Aosm_CRP94`). 373.15–573.15 K: Møller (1988), Geochim.
/// Cosmochim. Acta 52:821, eq. 13 fit. Between 363.15 and 373.15 K the two
/// are blended linearly (they differ by 6e-4 at 100 °C).
pub fn aphi(t_k: f64) -> f64 {
    const LO: f64 = 363.15;
    const HI: f64 = 373.15;
    if t_k <= LO {
        aphi_crp94(t_k)
    } else if t_k >= HI {
        aphi_m88(t_k)
    } else {
        let w = (t_k - LO) / (HI - LO);
        (1.0 - w) * aphi_crp94(t_k) + w * aphi_m88(t_k)
    }
}

/// A_φ of Clegg, Rard & Pitzer (1994), Appendix II (valid 234.15–373.15 K).
pub fn aphi_crp94(t_k: f64) -> f64 {
    const A: [f64; 19] = [
        0.797_256_081_240 / 2.0,
        0.573_389_669_896e-1,
        0.977_632_177_788e-3,
        0.489_973_732_417e-2,
        -0.313_151_784_342e-2,
        0.179_145_971_002e-2,
        -0.920_584_241_844e-3,
        0.443_862_726_879e-3,
        -0.203_661_129_991e-3,
        0.900_924_147_948e-4,
        -0.388_189_392_385e-4,
        0.164_245_088_592e-4,
        -0.686_031_972_567e-5,
        0.283_455_806_377e-5,
        -0.115_641_433_004e-5,
        0.461_489_672_579e-6,
        -0.177_069_754_948e-6,
        0.612_464_488_231e-7,
        -0.175_689_013_085e-7,
    ];
    let x = (2.0 * t_k - 607.3) / 139.0;
    let (mut t0, mut t1) = (1.0, x);
    let mut sum = A[0] * t0 + A[1] * t1;
    for a in &A[2..] {
        let t2 = 2.0 * x * t1 - t0;
        sum += a * t2;
        t0 = t1;
        t1 = t2;
    }
    sum
}

/// A_φ of Møller (1988) eq. 13 (valid 273.15–573.15 K).
pub fn aphi_m88(t_k: f64) -> f64 {
    crate::correlations::moller1988_eq13(
        t_k,
        &[
            3.369_015_32e-1,
            -6.321_004_30e-4,
            9.142_523_59,
            -1.351_439_86e-2,
            2.260_894_88e-3,
            1.921_185_97e-6,
            4.525_864_64e1,
            0.0,
        ],
    )
}

/// Harvie's approximation of Pitzer's J(x) and J′(x) (Pitzer 1991,
/// appendix B, eqs. B-21 to B-30, Table B-1).
pub fn harvie_j(x: f64) -> (f64, f64) {
    const AK1: [f64; 21] = [
        1.925_154_014_814_667,
        -0.060_076_477_753_119,
        -0.029_779_077_456_514,
        -0.007_299_499_690_937,
        0.000_388_260_636_404,
        0.000_636_874_599_598,
        0.000_036_583_601_823,
        -0.000_045_036_975_204,
        -0.000_004_537_895_710,
        0.000_002_937_706_971,
        0.000_000_396_566_462,
        -0.000_000_202_099_617,
        -0.000_000_025_267_769,
        0.000_000_013_522_610,
        0.000_000_001_229_405,
        -0.000_000_000_821_969,
        -0.000_000_000_050_847,
        0.000_000_000_046_333,
        0.000_000_000_001_943,
        -0.000_000_000_002_563,
        -0.000_000_000_010_991,
    ];
    const AK2: [f64; 21] = [
        0.628_023_320_520_852,
        0.462_762_985_338_493,
        0.150_044_637_187_895,
        -0.028_796_057_604_906,
        -0.036_552_745_910_311,
        -0.001_668_087_945_272,
        0.006_519_840_398_744,
        0.001_130_378_079_086,
        -0.000_887_171_310_131,
        -0.000_242_107_641_309,
        0.000_087_294_451_594,
        0.000_034_682_122_751,
        -0.000_004_583_768_938,
        -0.000_003_548_684_306,
        -0.000_000_250_453_880,
        0.000_000_216_991_779,
        0.000_000_080_779_570,
        0.000_000_004_558_555,
        -0.000_000_006_944_757,
        -0.000_000_002_849_257,
        0.000_000_000_237_816,
    ];
    if x <= 0.0 {
        return (0.0, 0.0);
    }
    let (ak, z, dz) = if x < 1.0 {
        (&AK1, 4.0 * x.powf(0.2) - 2.0, 0.8 * x.powf(-0.8))
    } else {
        (
            &AK2,
            40.0 / 9.0 * x.powf(-0.1) - 22.0 / 9.0,
            -4.0 / 9.0 * x.powf(-1.1),
        )
    };
    let (mut b0, mut b1, mut b2) = (0.0, 0.0, 0.0);
    let (mut d0, mut d1, mut d2) = (0.0, 0.0, 0.0);
    // Clenshaw recurrence, highest order first (Table B-1 lists a_20 … a_0).
    for a in ak.iter().rev() {
        b2 = b1;
        b1 = b0;
        d2 = d1;
        d1 = d0;
        b0 = z * b1 - b2 + a;
        d0 = b1 + z * d1 - d2;
    }
    (
        0.25 * x - 1.0 + 0.5 * (b0 - b2),
        0.25 + 0.5 * dz * (d0 - d2),
    )
}

/// Debye–Hückel term −A_φ I^{3/2}/(1 + b√I).
#[inline]
pub(super) fn dh(aphi: f64, i: f64, s: f64) -> f64 {
    -aphi * i * s / (1.0 + B * s)
}

/// Eθ + I Eθ′ for ions of charges `zi`, `zj` (Pitzer 1975; Pitzer 1991
/// eqs. B-15, B-16): (z_i z_j / 8I) [x_ij J′(x_ij) − ½ x_ii J′(x_ii) − ½ x_jj J′(x_jj)].
pub(super) fn etheta_phi(zi: f64, zj: f64, aphi: f64, i: f64, s: f64) -> f64 {
    let k = 6.0 * aphi * s;
    let xij = k * zi * zj;
    let xii = k * zi * zi;
    let xjj = k * zj * zj;
    let term = |x: f64| x * harvie_j(x).1;
    zi * zj / (8.0 * i) * (term(xij) - 0.5 * term(xii) - 0.5 * term(xjj))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn aphi_at_25c() {
        // 0.3915 at 25 °C: Pitzer (1991), ch. 3.
        assert!((aphi(298.15) - 0.3915).abs() < 2e-4, "{}", aphi(298.15));
    }

    #[test]
    fn aphi_blend_is_continuous() {
        for t in [363.15, 373.15] {
            let d = (aphi(t - 1e-6) - aphi(t + 1e-6)).abs();
            assert!(d < 1e-8, "{t}: {d}");
        }
    }

    #[test]
    fn harvie_j_matches_its_limits_and_derivative() {
        // J(x) → x/4 − 1 + … for large x; J is small and positive for small x.
        let (j, _) = harvie_j(0.01);
        assert!(j > 0.0 && j < 1e-3, "{j}");
        for x in [0.05, 0.5, 0.99, 1.01, 3.0, 20.0] {
            let h = 1e-6 * x;
            let fd = (harvie_j(x + h).0 - harvie_j(x - h).0) / (2.0 * h);
            assert!(
                (fd - harvie_j(x).1).abs() < 1e-6,
                "{x}: {fd} vs {}",
                harvie_j(x).1
            );
        }
        // Continuity at the switch between the two Chebyshev series.
        assert!((harvie_j(1.0 - 1e-12).0 - harvie_j(1.0).0).abs() < 1e-9);
    }
}

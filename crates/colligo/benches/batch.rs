//! Wall time of `colligo batch` on 20,000 invented brines, water activity
//! only, including process start (the release binary is spawned).

use std::fmt::Write as _;
use std::process::Command;

use criterion::{Criterion, criterion_group, criterion_main};

/// 20,000 invented brines of NaCl, KCl, CaCl2 and MgCl2 in 1 kg of water
/// (a fixed linear congruential sequence, so every run is the same).
fn brines() -> String {
    let mut state: u64 = 0x2545_f491_4f6c_dd1d;
    let mut next = move || {
        state = state
            .wrapping_mul(6_364_136_223_846_793_005)
            .wrapping_add(1_442_695_040_888_963_407);
        (state >> 11) as f64 / (1u64 << 53) as f64
    };
    let mut s = String::from(
        "name,water,sodium_chloride,potassium_chloride,calcium_chloride,magnesium_chloride\n",
    );
    for i in 0..20_000 {
        let _ = writeln!(
            s,
            "brine {i},1000,{:.2},{:.2},{:.2},{:.2}",
            300.0 * next(),
            40.0 * next(),
            30.0 * next(),
            20.0 * next()
        );
    }
    s
}

fn bench(c: &mut Criterion) {
    let dir = std::env::temp_dir().join(format!("colligo-bench-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let csv = dir.join("brines.csv");
    std::fs::write(&csv, brines()).unwrap_or_else(|e| panic!("{e}"));
    let exe = env!("CARGO_BIN_EXE_colligo");
    c.bench_function(
        "colligo batch, 20,000 brines, water activity only (process wall time)",
        |b| {
            b.iter(|| {
                let out = Command::new(exe)
                    .args([
                        "batch",
                        csv.to_str().unwrap_or_default(),
                        "--properties",
                        "water_activity",
                    ])
                    .output()
                    .unwrap_or_else(|e| panic!("{e}"));
                assert!(
                    out.status.success(),
                    "{}",
                    String::from_utf8_lossy(&out.stderr)
                );
                assert_eq!(out.stdout.iter().filter(|&&b| b == b'\n').count(), 20_001);
            })
        },
    );
    let _ = std::fs::remove_dir_all(&dir);
}

criterion_group! {
    name = batch;
    config = Criterion::default().sample_size(20).measurement_time(std::time::Duration::from_secs(4));
    targets = bench
}
criterion_main!(batch);

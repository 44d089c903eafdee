//! A deterministic generator of large synthetic catalogs: hollow-core
//! sections of varied depth, core size and count, each with strand patterns
//! of increasing strand count. Used by the benchmarks and the memory script.

/// A catalog of `sections` sections with `patterns` patterns each.
pub fn catalog(sections: usize, patterns: usize) -> String {
    let mut s = String::from(
        "[catalog]\nname = \"synthetic benchmark catalog\"\n\n[[mix]]\nid = \"m\"\nfc = \"6000 psi\"\nfci = \"4000 psi\"\nunit_weight = \"150 pcf\"\naggregate = \"carbonate\"\n",
    );
    // a small linear congruential generator: the same catalog every time
    let mut seed: u64 = 0x2545_f491_4f6c_dd1d;
    let mut next = || {
        seed = seed.wrapping_mul(6_364_136_223_846_793_005).wrapping_add(1_442_695_040_888_963_407);
        (seed >> 33) as f64 / (1u64 << 31) as f64
    };
    for i in 0..sections {
        let depth = 8.0 + (i % 5) as f64 * 2.0;
        let count = 5 + (i % 2);
        let spacing = 48.0 / count as f64 - 0.25;
        let dia = (spacing - 1.75 - 0.5 * next()).min(depth - 2.5);
        s.push_str(&format!(
            "\n[[section]]\nid = \"s{i}\"\nmix = \"m\"\n[section.hollow_core]\nwidth = \"48 in\"\ndepth = \"{depth} in\"\ncores = {{ shape = \"circle\", count = {count}, diameter = \"{dia:.3} in\", spacing = \"{spacing:.3} in\" }}\n"
        ));
        for p in 0..patterns {
            let n = (3 + p).min(count + 1);
            s.push_str(&format!(
                "[[section.pattern]]\nid = \"p{p}\"\nstrand = \"{}\"\nrow = [{{ count = {n}, height = \"1.75 in\" }}]\n",
                if p % 2 == 0 { "1/2 in" } else { "3/8 in" }
            ));
        }
    }
    s
}

/// A job of `bays` bays for the demo catalog: hollow-core floors of varied
/// span and load (the streaming target: 20 000 bays in ≤ 50 MB).
#[allow(dead_code)]
pub fn job(bays: usize) -> String {
    let mut s = String::from("[job]\nproject = \"synthetic job\"\n\n[defaults]\nfamilies = [\"hollow-core\"]\n");
    for i in 0..bays {
        s.push_str(&format!(
            "\n[[bay]]\nname = \"Bay {i}\"\nspan = \"{} ft\"\nsdl = \"{} psf\"\nlive = \"{} psf\"\n",
            16 + i % 20,
            10 + i % 15,
            40 + (i % 4) * 20
        ));
    }
    s
}

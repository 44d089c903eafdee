//! The check engine against hand calculations and facts of the trade.

use approx::assert_relative_eq;
use plankwise::case::{DesignCase, LossMethod, Topping};
use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::checks::{Candidate, analyse, evaluate};
use plankwise::units::{AreaLoad, Length, Stress};

fn demo() -> Catalog {
    Catalog::from_str(DEMO_US, "demo-us.toml").unwrap()
}

fn case(span_ft: f64, sdl: f64, live: f64) -> DesignCase {
    let mut c = DesignCase::new(Length::from_unit(span_ft, "ft"));
    c.sdl = AreaLoad::from_unit(sdl, "psf");
    c.live = AreaLoad::from_unit(live, "psf");
    c
}

fn cand<'c>(cat: &'c Catalog, s: &str, p: &str) -> Candidate<'c> {
    let section = cat.section(s).unwrap();
    Candidate {
        section,
        pattern: section.patterns.iter().find(|x| x.id == p).unwrap(),
        mix: section.mix(cat),
    }
}

/// Hand calculation (elastic mechanics and ACI 318-19 as cited) of the 8 in
/// plank with six 1/2 in strands over 25 ft, 15 psf SDL, 50 psf live.
#[test]
fn eight_inch_plank_by_hand() {
    let cat = demo();
    let c = cand(&cat, "plank-8in-4ft", "6x1/2");
    let k = case(25.0, 15.0, 50.0);
    let an = analyse(&c, &k);
    let ev = evaluate(&c, &k);
    let p = &c.section.props;
    let l = 300.0;
    let w_self = p.area_in2 * 150.0 / 1728.0; // lbf/in
    let w_d = w_self + 15.0 / 144.0 * 48.0;
    let w_l = 50.0 / 144.0 * 48.0;
    // ASCE 7-16 2.3.1 combination 2 governs: Mu = (1.2 wD + 1.6 wL) L²/8
    let mu = (1.2 * w_d + 1.6 * w_l) * l * l / 8.0;
    let mid = an.stations.iter().find(|s| (s.x_in - 150.0).abs() < 1e-9).unwrap();
    assert_relative_eq!(mid.mu_lbin, mu, max_relative = 1e-12);
    assert_eq!(mid.mu_combo, "1.2D+1.6L+0.5(Lr or S)");
    // effective prestress and Mcr = Sb (fr + Pe/A + Pe e/Sb), ACI 19.2.3.1 fr = 7.5√f'c
    let pe = ev.history.pe_lbf;
    let e = p.yb_in - 1.75;
    let fr = 7.5 * 5000f64.sqrt();
    let mcr = p.sb_in3 * (fr + pe / p.area_in2 + pe * e / p.sb_in3);
    assert_relative_eq!(mid.flexure.mcr_lbin, mcr, max_relative = 1e-12);
    // service, total load D + L at midspan on the gross section
    let m = (w_d + w_l) * l * l / 8.0;
    assert_relative_eq!(
        mid.service.bottom_total_psi,
        pe / p.area_in2 + pe * e / p.sb_in3 - m / p.sb_in3,
        max_relative = 1e-12
    );
    assert_relative_eq!(
        mid.service.top_total_psi,
        pe / p.area_in2 - pe * e / p.st_in3 + m / p.st_in3,
        max_relative = 1e-12
    );
    // release at midspan: Po after elastic shortening, self-weight on the member length
    let lm = 304.0;
    let po = ev.history.po_lbf;
    let mg = w_self * lm * lm / 8.0;
    let (top, bot) = mid.release_psi;
    let dmid = an.member.end_distance(150.0);
    assert_relative_eq!(dmid, 152.0);
    assert_relative_eq!(bot, po / p.area_in2 + po * e / p.sb_in3 - mg / p.sb_in3, max_relative = 1e-9);
    assert_relative_eq!(top, po / p.area_in2 - po * e / p.st_in3 + mg / p.st_in3, max_relative = 1e-9);
    // transfer length (fse/3000) db
    assert_relative_eq!(ev.transfer_length_in, ev.history.fse_psi / 3000.0 * 0.5, max_relative = 1e-12);
    // Zia ES = Es fcir / Eci with fcir = 0.9(Pi/A + Pi e²/I) − Mg e/I at midspan of the span
    let pi = 0.75 * 270_000.0 * 0.918;
    let mg_span = w_self * l * l / 8.0;
    let fcir = 0.9 * (pi / p.area_in2 + pi * e * e / p.ix_in4) - mg_span * e / p.ix_in4;
    let eci = 150f64.powf(1.5) * 33.0 * 3500f64.sqrt();
    assert_relative_eq!(ev.history.losses.es_psi, 28.5e6 * fcir / eci, max_relative = 1e-9);
    assert!(ev.viable, "{:#?}", ev.first_failure());
}

#[test]
fn every_demo_entry_gives_a_full_finite_table() {
    let cat = demo();
    for s in &cat.sections {
        for p in &s.patterns {
            let c = Candidate {
                section: s,
                pattern: p,
                mix: s.mix(&cat),
            };
            let mut k = case(if s.id.starts_with("tee") { 50.0 } else { 22.0 }, 10.0, 40.0);
            if s.id.starts_with("tee-24in-8ft") {
                k.topping = Some(Topping {
                    thickness: Length::new(2.0),
                    mix: cat.mixes[3].clone(),
                });
            }
            let ev = evaluate(&c, &k);
            assert!(ev.checks.len() >= 11, "{} {}", s.id, p.id);
            for ch in &ev.checks {
                assert!(
                    ch.demand.is_finite() && ch.ratio.is_finite(),
                    "{} {} {}: {:?}",
                    s.id,
                    p.id,
                    ch.info.id,
                    ch
                );
                assert!(
                    ch.info.clause.starts_with("ACI") || ch.info.clause.starts_with("catalog"),
                    "{}",
                    ch.info.clause
                );
            }
            for st in &ev.stations {
                assert!(st.flexure.phi_mn_lbin.is_finite() && st.release_psi.0.is_finite() && st.service.bottom_total_psi.is_finite());
            }
        }
    }
}

/// Common practice, no source: prestress raises the cracking moment of a
/// small rectangular beam with its strands low in the section to about
/// twice that of the same beam without prestress.
#[test]
fn prestress_roughly_doubles_the_cracking_moment_of_a_small_beam() {
    let text = format!(
        "{}\n[[section]]\nid = \"beam\"\nmix = \"plank-5000\"\n[section.generic]\noutline = [[\"0 in\", \"0 in\"], [\"12 in\", \"0 in\"], [\"12 in\", \"20 in\"], [\"0 in\", \"20 in\"]]\n[[section.pattern]]\nid = \"two\"\nstrand = \"1/2 in\"\nrow = [{{ count = 2, height = \"3 in\", x = [\"4 in\", \"8 in\"] }}]\n",
        DEMO_US
    );
    let cat = Catalog::from_str(&text, "beam.toml").unwrap();
    let c = cand(&cat, "beam", "two");
    let k = case(20.0, 0.0, 0.0);
    let an = analyse(&c, &k);
    let mid = an.stations.iter().find(|s| (s.x_in - 120.0).abs() < 1e-9).unwrap();
    let plain = c.mix.fr().get() * c.section.props.sb_in3;
    let ratio = mid.flexure.mcr_lbin / plain;
    assert!((1.7..=2.8).contains(&ratio), "Mcr with prestress / without = {ratio}");
}

/// Common practice, no source: once the strand yields, the level of
/// prestress barely changes the flexural strength.
#[test]
fn prestress_level_barely_changes_flexural_strength() {
    let cat = demo();
    let c = cand(&cat, "plank-8in-4ft", "6x1/2");
    let mut p = c.pattern.clone();
    let mut mn = Vec::new();
    for j in [0.55, 0.65, 0.75] {
        p.jacking = j;
        let cj = Candidate { pattern: &p, ..c };
        let k = case(25.0, 15.0, 50.0);
        let an = analyse(&cj, &k);
        mn.push(an.stations.iter().map(|s| s.flexure.mn_lbin).fold(0.0, f64::max));
    }
    assert!((mn[2] - mn[0]).abs() / mn[2] < 0.03, "{mn:?}");
    // while a lump-sum loss changes fse a lot, φMn moves little
    let mut k = case(25.0, 15.0, 50.0);
    k.losses = LossMethod::LumpSum(Stress::from_unit(60.0, "ksi"));
    let low = evaluate(&c, &k).check("flexure").unwrap().capacity;
    let normal = evaluate(&c, &case(25.0, 15.0, 50.0)).check("flexure").unwrap().capacity;
    assert!((normal - low).abs() / normal < 0.03, "{low} vs {normal}");
}

/// Common practice, no source: a longer span never raises a member's
/// capacity — every load-driven ratio grows with the span. (Bottom-fibre
/// compression near the ends comes from prestress and is relieved by load,
/// so the compression checks, which include that fibre, are not among them.)
#[test]
fn longer_spans_never_relieve_a_check() {
    let cat = demo();
    for (s, p) in [
        ("plank-8in-4ft", "6x1/2"),
        ("plank-12in-4ft", "10x1/2"),
        ("tee-32in-10ft", "12-depressed"),
    ] {
        let c = cand(&cat, s, p);
        let mut last: Vec<f64> = Vec::new();
        for span in (16..=48).step_by(4) {
            let ev = evaluate(&c, &case(span as f64, 15.0, 50.0));
            let now: Vec<f64> = ["flexure", "service_tension", "defl_live", "shear"]
                .iter()
                .map(|id| ev.check(id).unwrap().ratio)
                .collect();
            if !last.is_empty() {
                for (k, (a, b)) in last.iter().zip(&now).enumerate() {
                    assert!(b >= &(a - 1e-9), "{s} {p} check {k}: ratio fell from {a} to {b} at {span} ft");
                }
            }
            last = now;
        }
    }
}

/// Common practice, no source: adding strands never lowers φMn while the
/// section stays tension-controlled.
#[test]
fn more_strands_never_lower_phi_mn_while_tension_controlled() {
    let cat = demo();
    let k = case(25.0, 15.0, 50.0);
    let mut last = 0.0;
    for p in ["4x1/2", "6x1/2", "7x1/2"] {
        let ev = evaluate(&cand(&cat, "plank-8in-4ft", p), &k);
        let mid = ev.stations.iter().find(|s| (s.x_in - 150.0).abs() < 1e-9).unwrap();
        assert!(mid.flexure.eps_t >= 0.005, "{p} not tension-controlled");
        assert!(mid.flexure.phi_mn_lbin > last, "{p}");
        last = mid.flexure.phi_mn_lbin;
    }
}

#[test]
fn strand_is_not_developed_near_the_ends() {
    // ACI 318-19 25.4.8.3: at the critical shear section the strand stress is
    // limited, so φMn there is well below midspan's; φ is 0.75 within ℓtr (21.2.3).
    let cat = demo();
    let k = case(25.0, 15.0, 50.0);
    let an = analyse(&cand(&cat, "plank-8in-4ft", "6x1/2"), &k);
    let first = &an.stations[0];
    let mid = an.stations.iter().find(|s| (s.x_in - 150.0).abs() < 1e-9).unwrap();
    assert!(!first.flexure.developed && mid.flexure.developed);
    assert_relative_eq!(first.flexure.phi, 0.75);
    assert!(first.flexure.phi_mn_lbin < 0.2 * mid.flexure.phi_mn_lbin);
}

#[test]
fn a_topping_adds_its_checks_and_strength() {
    let cat = demo();
    let c = cand(&cat, "plank-8in-4ft", "6x1/2");
    let mut k = case(25.0, 15.0, 50.0);
    let bare = evaluate(&c, &k);
    k.topping = Some(Topping {
        thickness: Length::new(2.0),
        mix: cat.mixes[3].clone(),
    });
    let topped = evaluate(&c, &k);
    assert!(bare.check("horizontal_shear").is_none() && topped.check("horizontal_shear").is_some());
    assert!(topped.check("topping_compression").is_some());
    assert!(topped.check("flexure").unwrap().capacity > bare.check("flexure").unwrap().capacity);
    // topping weight on the bare section: 2 in × 48 in × 150 pcf
    let an = analyse(&c, &k);
    assert_relative_eq!(an.member.w[1], 2.0 * 48.0 * 150.0 / 1728.0, max_relative = 1e-12);
}

#[test]
fn deep_untopped_hollow_core_gets_the_half_vcw_rule() {
    let cat = demo();
    let ev = evaluate(&cand(&cat, "plank-16in-4ft", "6x1/2"), &case(30.0, 15.0, 50.0));
    assert!(ev.check("shear_deep_hollow_core").is_some());
    let ev = evaluate(&cand(&cat, "plank-12in-4ft", "6x1/2"), &case(30.0, 15.0, 50.0));
    assert!(ev.check("shear_deep_hollow_core").is_none(), "12 in ≤ 12.5 in");
}

#[test]
fn fire_rating_worked_by_hand() {
    // 8 in plank, carbonate, unrestrained: te = A/b = 236.76/48 = 4.93 in → 2 h
    // by IBC Table 722.2.2.1 (4.6 ≤ 4.93 < 5.7, floor values from memory, high);
    // strands 1/2 in at 1.75 in → 1.5 in cover → 1½ h by IBC Table 722.2.3(1)
    // (1.375 ≤ 1.5 < 1.625, from memory, medium). Overall 1½ h.
    let cat = demo();
    let c = cand(&cat, "plank-8in-4ft", "6x1/2");
    let mut k = case(25.0, 15.0, 50.0);
    k.fire_rating = Some(2.0);
    let ev = evaluate(&c, &k);
    assert_relative_eq!(ev.fire.equiv_thickness_in, c.section.props.area_in2 / 48.0, max_relative = 1e-12);
    assert_eq!(ev.fire.rating_thickness_h, 2.0);
    assert_eq!(ev.fire.rating_cover_h, Some(1.5));
    assert_eq!(ev.fire.rating_h, Some(1.5));
    assert!(!ev.check("fire").unwrap().pass);
    // restrained: 3/4 in suffices for every rating, so heat transmission governs: 2 h
    k.restrained = true;
    let ev = evaluate(&c, &k);
    assert_eq!(ev.fire.rating_h, Some(2.0));
    assert!(ev.check("fire").unwrap().pass);
    // a 2 in carbonate topping adds its thickness: 6.93 in ≥ 6.6 in → 4 h by heat transmission
    k.topping = Some(Topping {
        thickness: Length::new(2.0),
        mix: cat.mixes[3].clone(),
    });
    assert_eq!(evaluate(&c, &k).fire.rating_thickness_h, 4.0);
}

#[test]
fn camber_by_hand_for_the_eight_inch_plank() {
    // PCI Design Handbook design-aid forms (mechanics): straight strand
    // camber P e L²/8EI and self-weight 5wL⁴/384EI on the member length with
    // Eci; Martin (1977) multipliers 1.80/1.85 at erection (from memory, high).
    let cat = demo();
    let c = cand(&cat, "plank-8in-4ft", "6x1/2");
    let k = case(25.0, 15.0, 50.0);
    let ev = evaluate(&c, &k);
    let p = &c.section.props;
    let eci_i = c.mix.eci().get() * p.ix_in4;
    let lm = 304.0;
    let cam = ev.history.po_lbf * (p.yb_in - 1.75) * lm * lm / (8.0 * eci_i);
    let w = p.area_in2 * 150.0 / 1728.0;
    let sw = 5.0 * w * lm.powi(4) / (384.0 * eci_i);
    assert_relative_eq!(ev.camber.prestress_release_in, cam, max_relative = 1e-12);
    assert_relative_eq!(ev.camber.self_release_in, sw, max_relative = 1e-12);
    assert_relative_eq!(ev.camber.camber_erection_in, 1.80 * cam - 1.85 * sw, max_relative = 1e-12);
    // live: 5 wL L⁴/384 Ec I on the span
    let wl = 50.0 / 144.0 * 48.0;
    assert_relative_eq!(
        ev.camber.defl_live_in,
        5.0 * wl * 300f64.powi(4) / (384.0 * c.mix.ec().get() * p.ix_in4),
        max_relative = 1e-12
    );
    assert!(ev.check("defl_live").unwrap().pass);
    // ACI 318-19 Table 24.2.2 (published text): floors l/360; with attached
    // elements l/240 (not likely damaged) or l/480 (likely); flat roofs l/180
    assert_relative_eq!(ev.check("defl_live").unwrap().capacity, 300.0 / 360.0, max_relative = 1e-12);
    let mut k2 = k.clone();
    k2.attachment = plankwise::case::Attachment::Sensitive;
    assert_relative_eq!(
        evaluate(&c, &k2).check("defl_after_attach").unwrap().capacity,
        300.0 / 480.0,
        max_relative = 1e-12
    );
    k2.attachment = plankwise::case::Attachment::Tolerant;
    assert_relative_eq!(
        evaluate(&c, &k2).check("defl_after_attach").unwrap().capacity,
        300.0 / 240.0,
        max_relative = 1e-12
    );
    k2.member_use = plankwise::case::Use::Roof;
    assert_relative_eq!(
        evaluate(&c, &k2).check("defl_live").unwrap().capacity,
        300.0 / 180.0,
        max_relative = 1e-12
    );
}

#[test]
fn debonded_strand_camber_is_integrated() {
    // The debonded pattern's two shielded strands give less camber than the
    // same seven strands fully bonded, by the M/EI of the shielded lengths.
    let cat = demo();
    let k = case(30.0, 15.0, 50.0);
    let db = evaluate(&cand(&cat, "plank-10in-4ft", "5+2x1/2-db"), &k);
    let full = evaluate(&cand(&cat, "plank-10in-4ft", "7x1/2"), &k);
    assert!(db.camber.prestress_release_in < full.camber.prestress_release_in);
    assert!(db.camber.prestress_release_in > 0.9 * full.camber.prestress_release_in);
}

#[test]
fn frequency_is_reported_and_checked_on_request() {
    let cat = demo();
    let c = cand(&cat, "plank-8in-4ft", "6x1/2");
    let mut k = case(25.0, 15.0, 50.0);
    let ev = evaluate(&c, &k);
    assert!(ev.check("frequency").is_none());
    let p = &c.section.props;
    let w = p.area_in2 * 150.0 / 1728.0 + 15.0 / 144.0 * 48.0 + 0.1 * 50.0 / 144.0 * 48.0;
    let f = std::f64::consts::FRAC_PI_2 * (386.0886 * c.mix.ec().get() * p.ix_in4 / (w * 300f64.powi(4))).sqrt();
    assert_relative_eq!(ev.frequency_hz, f, max_relative = 1e-6);
    k.min_frequency_hz = Some(8.0);
    assert!(!evaluate(&c, &k).check("frequency").unwrap().pass);
}

/// A symmetric member is analysed on its left half and mirrored; the same
/// member made asymmetric by a weightless line load on an existing station
/// is analysed at every station. Both must give the same states and checks
/// (mechanics: a simply supported member under symmetric load).
#[test]
fn mirrored_half_agrees_with_every_station() {
    use plankwise::case::{LineLoadSpec, LoadKind};
    use plankwise::units::LineLoad;
    let cat = demo();
    // straight, debonded, and depressed strand with a topping
    for (s, p, topped) in [
        ("plank-8in-4ft", "6x1/2", false),
        ("plank-10in-4ft", "5+2x1/2-db", false),
        ("tee-24in-8ft", "8-depressed", true),
    ] {
        let c = cand(&cat, s, p);
        let mut sym = case(30.0, 15.0, 50.0);
        if topped {
            sym.topping = Some(Topping {
                thickness: Length::from_unit(2.0, "in"),
                mix: cat.mixes[0].clone(),
            });
        }
        let mut asym = sym.clone();
        asym.line_loads.push(LineLoadSpec {
            w: LineLoad::from_unit(0.0, "klf"),
            at: Length::from_unit(30.0 * 3.0 / 20.0, "ft"),
            kind: LoadKind::Dead,
        });
        let a = analyse(&c, &sym);
        // every station of the mirrored half worked out afresh on the
        // asymmetric member, at the same places
        let xs: Vec<f64> = a.stations.iter().map(|s| s.x_in).collect();
        let b = plankwise::checks::evaluate_on_stations(&c, &asym, &xs);
        assert_eq!(a.stations.len(), b.stations.len(), "{s}");
        for (x, y) in a.stations.iter().zip(&b.stations) {
            assert_relative_eq!(x.x_in, y.x_in);
            assert_relative_eq!(x.mu_lbin, y.mu_lbin, max_relative = 1e-9, epsilon = 1e-6);
            assert_relative_eq!(x.vu_lbf, y.vu_lbf, max_relative = 1e-9, epsilon = 1e-6);
            assert_relative_eq!(x.effects.v_live, y.effects.v_live, max_relative = 1e-9, epsilon = 1e-6);
            assert_relative_eq!(x.flexure.phi_mn_lbin, y.flexure.phi_mn_lbin, max_relative = 1e-9);
            assert_relative_eq!(
                x.service.bottom_total_psi,
                y.service.bottom_total_psi,
                max_relative = 1e-9,
                epsilon = 1e-6
            );
        }
        // the line load adds its two sides as stations
        let bs = analyse(&c, &asym);
        for x in [54.0 - 1e-3, 54.0 + 1e-3] {
            assert!(bs.stations.iter().any(|s| (s.x_in - x).abs() < 1e-9), "{s}: {x}");
        }
        let (ea, eb) = (evaluate(&c, &sym), evaluate(&c, &asym));
        assert_eq!(ea.checks.len(), eb.checks.len());
        for (x, y) in ea.checks.iter().zip(&eb.checks) {
            assert_eq!(x.info.id, y.info.id);
            assert_relative_eq!(x.ratio, y.ratio, max_relative = 1e-9, epsilon = 1e-12);
        }
    }
}

/// The brief evaluation (ranking, envelope) reads only the left half of a
/// symmetric member and skips the notes: it must give the full evaluation's
/// numbers for every demo entry on every demo bay; a governing station may
/// be reported at its mirror image.
#[test]
fn brief_and_full_evaluations_agree() {
    use plankwise::checks::evaluate_brief;
    use plankwise::job::{DEMO_JOB, Job};
    use plankwise::select::{case_for, entries, topping_mix};
    let cat = demo();
    let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
    let mut n = 0;
    for bay in &job.bays {
        for e in entries(&cat, bay) {
            let k = case_for(bay, e.topping, &topping_mix(&cat, bay));
            let (full, brief) = (evaluate(&e.candidate(), &k), evaluate_brief(&e.candidate(), &k));
            assert_eq!(full.viable, brief.viable);
            assert_eq!(full.governing, brief.governing);
            assert_eq!(full.checks.len(), brief.checks.len());
            for (a, b) in full.checks.iter().zip(&brief.checks) {
                assert_eq!(a.info.id, b.info.id);
                assert_eq!(a.pass, b.pass, "{}", a.info.id);
                // the right half's own search may land a rounding away
                for (x, y) in [(a.demand, b.demand), (a.capacity, b.capacity), (a.ratio, b.ratio)] {
                    assert_relative_eq!(x, y, max_relative = 1e-9, epsilon = 1e-12);
                }
                let l = k.span.get() / 12.0;
                if let (Some(x), Some(y)) = (a.station_ft, b.station_ft) {
                    assert!((x - y).abs() < 1e-9 || (x - (l - y)).abs() < 1e-9, "{}: {x} vs {y}", a.info.id);
                }
            }
            n += 1;
        }
    }
    assert!(n > 100, "{n}");
}

/// A prepared analysis tried at other live loads gives exactly what a fresh
/// brief evaluation at that live load gives (every demo entry and bay, four
/// loads from none to heavy): the envelope relies on it.
#[test]
fn prepared_live_trials_equal_fresh_evaluations() {
    use plankwise::checks::{Prepared, evaluate_brief};
    use plankwise::job::{DEMO_JOB, Job};
    use plankwise::select::{case_for, entries, topping_mix};
    let cat = demo();
    let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
    for bay in &job.bays {
        for e in entries(&cat, bay) {
            let k = case_for(bay, e.topping, &topping_mix(&cat, bay));
            let prep = Prepared::new(&e.candidate(), &k);
            assert_eq!(prep.evaluation(), evaluate_brief(&e.candidate(), &k), "{}", e.label());
            for q in [0.0, 40.0, 125.0, 400.0] {
                // the load the bay's use names: floor live, or roof live and snow
                let kq = k.with_varied(AreaLoad::from_unit(q, "psf"));
                let (a, b) = (prep.with_live(AreaLoad::from_unit(q, "psf")), evaluate_brief(&e.candidate(), &kq));
                assert_eq!(a, b, "{} at {q} psf", e.label());
                let ids: Vec<&'static str> = b.checks.iter().map(|c| c.info.id).filter(|id| id.len() % 2 == 0).collect();
                let want: Vec<(&str, f64)> = b
                    .checks
                    .iter()
                    .filter(|c| ids.contains(&c.info.id))
                    .map(|c| (c.info.id, c.ratio))
                    .collect();
                assert_eq!(prep.ratios_with_live(AreaLoad::from_unit(q, "psf"), &ids), want);
            }
        }
    }
}

/// The checks `varies_with_load` calls independent of the load (release
/// stresses, handling, cover, fire, strand sanity, bearing and production
/// length, camber at erection across units) give the same result at every
/// varied load, on every demo entry and bay, the roof with placed loads and
/// an opening among them, and on a bay with an overhang: the envelope runs
/// them once per span and relies on it.
#[test]
fn checks_that_do_not_vary_ignore_the_varied_load() {
    use plankwise::checks::{REGISTRY, evaluate_brief, varies_with_load};
    use plankwise::job::{DEMO_JOB, Job};
    use plankwise::select::{case_for, entries, topping_mix};
    let cat = demo();
    let job = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
    let mut bays = job.bays.clone();
    let mut eave = job.bays[0].clone();
    eave.case.overhang = (Length::new(0.0), Length::from_unit(4.0, "ft"));
    bays.push(eave);
    let fixed: Vec<&str> = REGISTRY
        .iter()
        .map(|c| c.info)
        .filter(|i| !varies_with_load(i))
        .map(|i| i.id)
        .collect();
    assert!(
        fixed.contains(&"handling") && fixed.contains(&"fire") && !fixed.contains(&"min_strength"),
        "{fixed:?}"
    );
    let mut seen = 0;
    for bay in &bays {
        for e in entries(&cat, bay) {
            let k = case_for(bay, e.topping, &topping_mix(&cat, bay));
            let at = |q: f64| evaluate_brief(&e.candidate(), &k.with_varied(AreaLoad::from_unit(q, "psf")));
            let none = at(0.0);
            for q in [60.0, 250.0, 900.0] {
                let loaded = at(q);
                for c in none.checks.iter().filter(|c| fixed.contains(&c.info.id)) {
                    let d = loaded.check(c.info.id).expect("the same checks run");
                    // the load's turning points move the stations: rounding aside
                    assert_eq!(c.pass, d.pass, "{} {} at {q} psf", e.label(), c.info.id);
                    for (x, y) in [(c.demand, d.demand), (c.capacity, d.capacity), (c.ratio, d.ratio)] {
                        assert_relative_eq!(x, y, max_relative = 1e-9, epsilon = 1e-12);
                    }
                    seen += 1;
                }
            }
        }
    }
    assert!(seen > 1000, "{seen}");
}

/// Where minimum strength fails because φ falls to 0.75 within a cut
/// strand's transfer length (ACI 318-19 §21.2.3), the note says so: a
/// short opening over one strand of six, 8 in plank, 30 ft.
#[test]
fn a_minimum_strength_failure_from_undeveloped_strand_says_why() {
    use plankwise::case::Opening;
    let cat = demo();
    let s = cat.section("plank-8in-4ft").unwrap();
    let cand = Candidate {
        section: s,
        pattern: s.patterns.iter().find(|p| p.id == "6x1/2").unwrap(),
        mix: s.mix(&cat),
    };
    let mut k = DesignCase::new(Length::from_unit(30.0, "ft"));
    k.live = AreaLoad::from_unit(50.0, "psf");
    k.openings.push(Opening {
        from: Length::from_unit(10.0, "ft"),
        to: Length::from_unit(10.01, "ft"),
        across: (Length::new(12.0), Length::new(24.0)),
        header: None,
    });
    let ev = evaluate(&cand, &k);
    let c = ev.check("min_strength").unwrap();
    assert!(!c.pass, "{}", c.note);
    assert!(c.note.contains("takes φ = 0.75: strand not fully developed there"), "{}", c.note);
    // the same bay without the opening: met, and no such words
    k.openings.clear();
    let c = evaluate(&cand, &k).check("min_strength").unwrap().clone();
    assert!(c.pass && !c.note.contains("not fully developed"), "{}", c.note);
}

// ---------------------------------------------------------------------------
// Verdicts an engineer can sign: one case per defect, each built so that
// the code before the fix fails it (checked against that build).

/// A 48 × 8 in solid strip (generic outline) of 5000 psi concrete with
/// `fci`, and `count` 0.6 in strands at 2.75 in: nearly concentric
/// prestress, so the bottom fibre near the ends is heavily compressed
/// while the top stays in compression.
fn strip(fci: f64, count: u32) -> Catalog {
    let text = format!(
        r#"[catalog]
name = "strip (test)"
[[mix]]
id = "m"
fc = "5000 psi"
fci = "{fci} psi"
unit_weight = "150 pcf"
aggregate = "carbonate"
modulus = "unit-weight"
[[section]]
id = "strip"
mix = "m"
[section.generic]
outline = [["0 in", "0 in"], ["48 in", "0 in"], ["48 in", "8 in"], ["0 in", "8 in"]]
[[section.pattern]]
id = "p"
strand = "0.6 in"
row = [{{ count = {count}, height = "2.75 in" }}]
"#
    );
    Catalog::from_str(&text, "strip.toml").unwrap()
}

/// ACI 318-19 Table 24.5.4.1 limits prestress + sustained load to 0.45 f′c
/// in every extreme fibre. Near the ends the bottom fibre carries the full
/// prestress and little moment. Hand calculation at d = ℓtr (elastic
/// theory, §24.5.1.2): f = Pe/A + Pe·e/Sb − Msus/Sb with A = 384 in²,
/// Sb = 48·8²/6 = 512 in³, e = 1.25 in, Msus = (wself + wSDL + 0.3 wL)·x(ℓ − x)/2.
/// The code before the fix checked the top fibre only and called the
/// member viable.
#[test]
fn sustained_compression_is_checked_in_the_bottom_fibre_near_the_ends() {
    let cat = strip(4900.0, 15);
    let c = cand(&cat, "strip", "p");
    let k = case(24.0, 10.0, 40.0);
    let ev = evaluate(&c, &k);
    let pe = ev.history.pe_lbf;
    let half = 2.0; // half the 4 in bearing
    let x = ev.transfer_length_in - half;
    let w = 384.0 * 150.0 / 1728.0 + 10.0 / 144.0 * 48.0 + 0.3 * 40.0 / 144.0 * 48.0;
    let msus = w * x * (288.0 - x) / 2.0;
    let hand = pe / 384.0 + pe * 1.25 / 512.0 - msus / 512.0;
    let r = ev.check("service_compression_sustained").unwrap();
    assert_relative_eq!(r.demand, hand, max_relative = 1e-9);
    assert_relative_eq!(r.capacity, 0.45 * 5000.0);
    assert!(hand > 2250.0 && !r.pass && !ev.viable, "{r:?}");
    assert!(r.note.contains("bottom fibre"), "{}", r.note);
    // the same fibre under total load, against 0.60 f′c, is checked too
    assert!(ev.check("service_compression_total").unwrap().note.contains("bottom fibre"));
    // release passes: the failure is the sustained check's own
    assert!(ev.check("release_compression").unwrap().pass);
}

/// Table 24.5.3.1: 0.70 f′ci within the end region, 0.60 f′ci beyond it.
/// The stress just beyond ℓtr equals the stress at ℓtr, so the boundary is
/// held to 0.60 f′ci. Hand: f = Po/A + Po·e/Sb − Mg/Sb at d = ℓtr, with the
/// self-weight moment on the member length resting on its ends.
#[test]
fn release_limits_apply_the_stricter_side_at_the_end_of_the_end_region() {
    let cat = strip(4000.0, 13);
    let c = cand(&cat, "strip", "p");
    let ev = evaluate(&c, &case(24.0, 10.0, 40.0));
    let po = ev.history.po_lbf;
    let (d, lm) = (ev.transfer_length_in, 292.0);
    let mg = 384.0 * 150.0 / 1728.0 * d * (lm - d) / 2.0;
    let hand = po / 384.0 + po * 1.25 / 512.0 - mg / 512.0;
    let r = ev.check("release_compression").unwrap();
    assert_relative_eq!(r.demand, hand, max_relative = 1e-9);
    assert_relative_eq!(r.capacity, 0.60 * 4000.0);
    assert!(hand > 0.60 * 4000.0 && hand < 0.70 * 4000.0, "{hand}");
    assert!(!r.pass && !ev.viable);
}

/// A line load just inside a support steps the shear up beyond it; the
/// station at the load saw only the smaller side. Found by the dense-station
/// comparison (tests/stations.rs): the normal set now holds both sides of
/// every line load and matches 1200 even stations. Statics: just right of
/// a load P at a, V = −(w(ℓ/2 − x)... ) — here checked against the dense set.
#[test]
fn a_line_load_near_a_support_is_checked_on_its_worse_side() {
    use plankwise::case::{LineLoadSpec, LoadKind};
    use plankwise::units::LineLoad;
    let cat = demo();
    let c = cand(&cat, "solid-slab-6in-4ft", "6x3/8");
    let mut k = case(23.3, 47.4, 84.6);
    k.line_loads.push(LineLoadSpec {
        w: LineLoad::from_unit(2.508708, "klf"),
        at: Length::from_unit(22.585156229807996, "ft"),
        kind: LoadKind::Dead,
    });
    let l = k.span.get();
    let xs: Vec<f64> = (0..=1200).map(|i| l * i as f64 / 1200.0).collect();
    let dense = plankwise::checks::evaluate_on_stations(&c, &k, &xs);
    let normal = evaluate(&c, &k);
    let (n, d) = (normal.check("shear").unwrap(), dense.check("shear").unwrap());
    assert!(n.ratio >= d.ratio * 0.995, "{} vs {}", n.ratio, d.ratio);
    // beyond the load (toward the right support) the shear is the reaction
    // less nothing: |V| = R_right, by statics (1.2D + 1.6L governs)
    let b = 48.0;
    let w = 1.2 * (288.0 * 150.0 / 1728.0 + 47.4 / 144.0 * b) + 1.6 * 84.6 / 144.0 * b;
    let p = 1.2 * 2508.708 / 12.0 * b;
    let a = 22.585156229807996 * 12.0;
    let x = n.station_ft.unwrap() * 12.0;
    assert!(x > a, "the worse side is beyond the load: {x} vs {a}");
    let r_right = w * l / 2.0 + p * a / l;
    assert_relative_eq!(n.demand * 1000.0, r_right - w * (l - x), max_relative = 1e-6);
}

/// ACI 318-19 §7.6.2.2: φMn ≥ 1.2 Mcr is not required where φMn ≥ 2Mu and
/// φVn ≥ 2Vu. A waived check reports the waiver's own demand and capacity
/// and says so; a check met outright does not govern (it does not limit
/// the load). Before the fix the waived check printed 1.2 Mcr above φMn
/// beside "yes", and a met requirement governed most members.
#[test]
fn minimum_strength_says_which_rule_applied_and_governs_only_as_a_load_limit() {
    let cat = demo();
    // met outright: the 8 in plank over 25 ft (1.2 Mcr = 89.3 ≤ φMn = 101.3 kip-ft)
    let ev = evaluate(&cand(&cat, "plank-8in-4ft", "6x1/2"), &case(25.0, 15.0, 50.0));
    let m = ev.check("min_strength").unwrap();
    assert!(m.pass && m.demand <= m.capacity && m.note.contains("met outright"));
    assert_eq!(ev.governing().info.id, "flexure");
    // waived: the 6 in plank with four 3/8 in strands over 14 ft
    let ev = evaluate(&cand(&cat, "plank-6in-4ft", "4x3/8"), &case(14.0, 10.0, 40.0));
    let m = ev.check("min_strength").unwrap();
    assert!(m.pass && m.note.contains("waived"), "{}", m.note);
    assert!(m.demand <= m.capacity, "{m:?}");
    // its demand is 2Mu or 2Vu at the worst point: the ratio is twice the
    // larger of the flexure and shear ratios
    let twice = 2.0 * ev.check("flexure").unwrap().ratio.max(ev.check("shear").unwrap().ratio);
    assert_relative_eq!(m.ratio, twice, max_relative = 1e-9);
    assert_eq!(ev.governing().info.id, "min_strength", "a waiver ends with more load");
}

/// One sign convention: compression positive, tension negative, in every
/// output; a tension check on a fibre in compression has ratio 0; no ratio
/// is negative (before the fix a compressed fibre gave a negative ratio).
#[test]
fn tension_checks_keep_the_sign_convention_and_never_go_negative() {
    let cat = demo();
    let ev = evaluate(&cand(&cat, "plank-8in-4ft", "6x1/2"), &case(25.0, 15.0, 50.0));
    for id in ["release_tension", "service_tension"] {
        let r = ev.check(id).unwrap();
        // both fibres stay in compression: the stress shown is positive
        assert!(r.demand > 0.0 && r.capacity < 0.0 && r.ratio == 0.0, "{r:?}");
        assert!(r.note.contains("compression"), "{}", r.note);
    }
    for s in &cat.sections {
        for p in &s.patterns {
            let c = Candidate {
                section: s,
                pattern: p,
                mix: s.mix(&cat),
            };
            for span in [12.0, 30.0, 60.0] {
                for ch in &evaluate(&c, &case(span, 20.0, 80.0)).checks {
                    assert!(ch.ratio >= 0.0, "{} {} {}: {}", s.id, p.id, ch.info.id, ch.ratio);
                }
            }
        }
    }
    // a fibre in tension shows a negative stress against a negative limit
    let ev = evaluate(&cand(&cat, "plank-8in-4ft", "4x1/2"), &case(30.0, 20.0, 100.0));
    let r = ev.check("service_tension").unwrap();
    assert!(r.demand < 0.0 && r.capacity < 0.0 && r.ratio > 0.0);
    assert_relative_eq!(r.ratio, r.demand / r.capacity, max_relative = 1e-12);
}

/// The fire probe of next-capabilities §1.7 (invented): a 24 in double tee
/// with 8–10 in stems and a 5 in siliceous flange.
fn fire_probe() -> Catalog {
    let text = r#"[catalog]
name = "fire cover probe (invented)"
[[mix]]
id = "tee-6000"
fc = "6000 psi"
fci = "4000 psi"
unit_weight = "150 pcf"
aggregate = "siliceous"
modulus = "unit-weight"
[[section]]
id = "dt-wide"
mix = "tee-6000"
[section.double_tee]
flange_width = "96 in"
flange_thickness = "5 in"
depth = "24 in"
stems = 2
stem_spacing = "48 in"
stem_width_top = "10 in"
stem_width_bottom = "8 in"
[[section.pattern]]
id = "cl-low"
strand = "1/2 in"
row = [{ count = 2, height = "1.4 in" }, { count = 2, height = "7.6 in" }]
[[section.pattern]]
id = "side"
strand = "1/2 in"
row = [{ count = 4, height = "3 in", x = ["20.6 in", "24 in", "72 in", "75.4 in"] }]
"#;
    Catalog::from_str(text, "wide-stem.toml").unwrap()
}

/// IBC 2021 §722.2.3.3.1: every tendon needs the greater of half the table
/// value and 1 in to any fire-exposed face, the stem side included. The
/// `side` pattern has a strand 0.51 in from the stem side: not rated
/// (before the fix: 1 h, from its average cover).
#[test]
fn fire_rating_needs_each_strand_s_own_cover_to_any_exposed_face() {
    let cat = fire_probe();
    let mut k = case(40.0, 10.0, 40.0);
    k.fire_rating = Some(2.0);
    let ev = evaluate(&cand(&cat, "dt-wide", "side"), &k);
    // the strand at (75.4, 3) in the stem centred at 72 in: the side face
    // runs from x = 76 at the soffit to 77 at 19 in, so at 3 in up it lies
    // 0.7579 in away horizontally, 0.7579 × 19/√(19² + 1) = 0.7569 in square
    // to the face; less the strand radius: 0.5068 in
    assert_relative_eq!(
        ev.fire.least_strand_cover_in,
        0.7579 * 19.0 / 362f64.sqrt() - 0.25,
        max_relative = 1e-4
    );
    assert_eq!(ev.fire.rating_h, Some(0.0));
    let f = ev.check("fire").unwrap();
    assert!(!f.pass && f.note.contains("x = 75.40 in"), "{}", f.note);
}

/// IBC 2021 Tables 722.2.3(4) and 722.2.3(5) — values from memory, verify
/// against the code in force. next-capabilities §1.7 and §8: `cl-low` has
/// two strands per stem on the centre line at 1.4 and 7.6 in, so the
/// average cover is their centroid, 4.5 in; the stem is 171 in² and with a
/// flange strip of 3 × 9 in × 5 in = 135 in² it is 306 in² > 300, where
/// Table (5) asks 2 in for 2 h; the smaller of the tables governs, so each
/// strand needs max(½ × 2, 1) = 1 in and the lowest has 1.15 in: 2 h. The
/// demo's 5¾ in stems are now rated too (before the fix: "not rated").
#[test]
fn double_tee_stems_are_rated_by_both_beam_tables() {
    let cat = fire_probe();
    let mut k = case(40.0, 10.0, 40.0);
    k.fire_rating = Some(2.0);
    let ev = evaluate(&cand(&cat, "dt-wide", "cl-low"), &k);
    assert_relative_eq!(ev.fire.cover_in, 4.5, max_relative = 1e-12);
    assert_eq!(ev.fire.rating_h, Some(2.0));
    assert!(ev.fire.from_memory);
    let f = ev.check("fire").unwrap();
    assert!(
        f.pass && f.note.contains("306 in²") && f.note.contains("values from memory"),
        "{}",
        f.note
    );
    // a narrow demo stem with a 2 in topping of the same aggregate: heat
    // transmission 4 in siliceous (1 h, Table 722.2.2.1) and Table (5) 1 h
    let demo = demo();
    let mut k = case(40.0, 10.0, 40.0);
    k.fire_rating = Some(1.0);
    k.topping = Some(Topping {
        thickness: Length::new(2.0),
        mix: demo.mixes[1].clone(),
    });
    let ev = evaluate(&cand(&demo, "tee-24in-8ft", "8-depressed"), &k);
    assert_eq!(ev.fire.rating_h, Some(1.0), "{}", ev.fire.note);
    assert!(ev.check("fire").unwrap().pass);
}

/// ACI 318-19 §22.5.1.1, §22.5.8.5.3: a double-tee pattern that gives its
/// stem reinforcement is credited Vs = Av fyt d / s per stem; one that does
/// not is taken to get ordinary stem reinforcement (Vs ≤ 4√f′c bw d) and the
/// note names the Av/s needed. Before the fix every double tee whose Vu
/// exceeded φVc was rejected.
#[test]
fn double_tee_stems_count_their_shear_reinforcement() {
    let text = format!(
        "{}\n[[section]]\nid = \"tee-web\"\nmix = \"tee-6000\"\n[section.double_tee]\nflange_width = \"96 in\"\nflange_thickness = \"2 in\"\ndepth = \"24 in\"\nstem_spacing = \"48 in\"\nstem_width_top = \"7.75 in\"\nstem_width_bottom = \"5.75 in\"\n[[section.pattern]]\nid = \"with\"\nstrand = \"1/2 in\"\nrow = [{{ count = 2, height = \"3 in\" }}, {{ count = 2, height = \"5 in\" }}, {{ count = 2, height = \"7 in\" }}]\nweb_steel = {{ area = \"0.22 in2\", spacing = \"12 in\", fy = \"60 ksi\" }}\n[[section.pattern]]\nid = \"without\"\nstrand = \"1/2 in\"\nrow = [{{ count = 2, height = \"3 in\" }}, {{ count = 2, height = \"5 in\" }}, {{ count = 2, height = \"7 in\" }}]\n",
        DEMO_US
    );
    let cat = Catalog::from_str(&text, "tee.toml").unwrap();
    let k = case(24.0, 20.0, 500.0);
    let with = analyse(&cand(&cat, "tee-web", "with"), &k);
    let s = with.stations.iter().find_map(|s| s.shear).unwrap();
    let c = s.gov();
    // two stems × 0.22 in² × 60 ksi × dp / 12 in
    assert_relative_eq!(c.vs_lbf, 2.0 * 0.22 * 60_000.0 * c.dp_in / 12.0, max_relative = 1e-12);
    assert_relative_eq!(c.phi_vn_lbf, 0.75 * (c.phi_vc_lbf / 0.75 + c.vs_lbf), max_relative = 1e-12);
    let ev = evaluate(&cand(&cat, "tee-web", "with"), &k);
    let shear = ev.check("shear").unwrap();
    assert!(shear.pass, "{shear:?}");
    assert!(ev.check("web_steel").unwrap().pass, "{:?}", ev.check("web_steel"));
    // concrete alone would not do: Vu > φVc somewhere
    assert!(
        with.stations
            .iter()
            .filter_map(|s| s.shear)
            .any(|a| a.gov().vu_lbf > a.gov().phi_vc_lbf)
    );
    let ev = evaluate(&cand(&cat, "tee-web", "without"), &k);
    let shear = ev.check("shear").unwrap();
    assert!(shear.pass && shear.note.contains("need Av/s"), "{}", shear.note);
    assert!(ev.check("web_steel").is_none());
}

/// A fire rating reads in hours, not as a percentage (before the fix the
/// failure read "33 % over").
#[test]
fn a_missed_fire_rating_reads_in_hours() {
    let cat = demo();
    let mut k = case(25.0, 15.0, 50.0);
    k.fire_rating = Some(2.0);
    let ev = evaluate(&cand(&cat, "plank-8in-4ft", "6x1/2"), &k);
    assert_eq!(ev.check("fire").unwrap().shortfall(), "needs 2 h, reaches 1½ h");
    let f = ev.check("cover").unwrap();
    assert!(f.shortfall().starts_with("needs "), "{}", f.shortfall());
}

/// ACI 318-19 Eq. 22.5.6.3.2 with a composite topping: fpc is the stress at
/// the composite centroid from prestress and the moments the precast
/// carries alone. A solid plank has no flange apart from its web, so the
/// web–flange junction rule does not apply. Before the fix it took the
/// junction at the soffit (the bottom-fibre stress): Vcw too high near the
/// supports and near zero on long spans.
#[test]
fn web_shear_of_a_topped_solid_plank_uses_the_composite_centroid() {
    let cat = demo();
    let c = cand(&cat, "solid-slab-6in-4ft", "6x3/8");
    let mut k = case(20.0, 10.0, 40.0);
    k.topping = Some(Topping {
        thickness: Length::new(2.0),
        mix: cat.mixes[3].clone(),
    });
    let an = analyse(&c, &k);
    let comp = an.member.comp.unwrap();
    let b = &c.section.props;
    for s in an.stations.iter().filter(|s| s.shear.is_some()).take(4) {
        let (pe, y) = (s.prestress.pe_shear, s.prestress.y_shear);
        let e = b.yb_in - y;
        let yr = comp.yb_in - b.yb_in;
        let mnc = s.effects.m_self + s.effects.m_topping;
        let fpc = pe / b.area_in2 - pe * e * yr / b.ix_in4 + mnc * yr / b.ix_in4;
        let dp = (8.0 - y).max(0.8 * 8.0);
        let vcw = (3.5 * 5000f64.sqrt() + 0.3 * fpc) * 48.0 * dp;
        assert_relative_eq!(s.shear.unwrap().gov().vcw_lbf, vcw, max_relative = 1e-12);
    }
}

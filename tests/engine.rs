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
fn narrow_double_tee_stems_are_not_rated_and_say_so() {
    let cat = demo();
    let mut k = case(50.0, 10.0, 40.0);
    k.fire_rating = Some(1.0);
    let ev = evaluate(&cand(&cat, "tee-32in-10ft", "12-depressed"), &k);
    assert_eq!(ev.fire.rating_h, None);
    // strands on the stem centre line: average cover = centroid height (IBC 722.2.3.3)
    assert_relative_eq!(ev.fire.cover_in, (3.0 + 5.0 + 7.0 + 9.0 + 11.0 + 13.0) / 6.0, max_relative = 1e-12);
    let f = ev.check("fire").unwrap();
    assert!(!f.pass && f.note.contains("722.2.3(5)") && f.ratio.is_finite());
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
        let (a, b) = (analyse(&c, &sym), analyse(&c, &asym));
        // the line load adds its two sides as stations, and their mirrors
        assert_eq!(a.stations.len() + 4, b.stations.len(), "{s}");
        for x in &a.stations {
            let y = b.stations.iter().find(|y| (x.x_in - y.x_in).abs() < 1e-9).expect("the same station");
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
                let mut kq = k.clone();
                kq.live = AreaLoad::from_unit(q, "psf");
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

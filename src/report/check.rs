//! The report of one evaluation: a table for people, JSON for scripts.

use std::io::{self, Write};

use serde::Serialize;

use crate::case::DesignCase;
use crate::checks::{Candidate, CheckResult, Evaluation, kip, kipft};
use crate::units::{System, display};

/// The sign convention, printed with every stress.
pub const SIGN_CONVENTION: &str = "stresses: compression positive, tension negative (psi); a tension check shows the fibre stress against its limit written as a stress (both negative), ratio = tension / limit, 0 when the fibre is in compression; no ratio is ever negative";

/// One station of the JSON output, units in the key names.
#[derive(Debug, Clone, Serialize)]
pub struct StationJson {
    /// Distance from the left bearing centre, ft.
    pub x_ft: f64,
    /// Factored moment, kip-ft.
    pub mu_kipft: f64,
    /// Design flexural strength, kip-ft.
    pub phi_mn_kipft: f64,
    /// Cracking moment, kip-ft.
    pub mcr_kipft: f64,
    /// Factored shear, kip.
    pub vu_kip: f64,
    /// Design shear strength φVn = φ(Vc + Vs), kip (absent inside the critical section).
    pub phi_vn_kip: Option<f64>,
    /// Top fibre at release, psi.
    pub f_top_release_psi: f64,
    /// Bottom fibre at release, psi.
    pub f_bottom_release_psi: f64,
    /// Precast top fibre at service (total), psi.
    pub f_top_service_psi: f64,
    /// Precast bottom fibre at service (total), psi.
    pub f_bottom_service_psi: f64,
    /// Topping top fibre at service (total), psi.
    pub f_topping_service_psi: f64,
}

/// One strand at midspan.
#[derive(Debug, Clone, Serialize)]
pub struct StrandJson {
    /// From the left edge, in.
    pub x_in: f64,
    /// Above the soffit, in.
    pub y_in: f64,
    /// Area, in².
    pub area_in2: f64,
}

/// The precast concrete as used.
#[derive(Debug, Clone, Serialize)]
pub struct ConcreteJson {
    /// f′c, psi.
    pub fc_psi: f64,
    /// Ec, psi.
    pub ec_psi: f64,
    /// fr, psi.
    pub fr_psi: f64,
    /// β1.
    pub beta1: f64,
    /// λ (ACI 318-19 Table 19.2.4.2).
    pub lambda: f64,
    /// Unit weight wc, pcf.
    pub wc_pcf: f64,
    /// How Ec is found: "unit-weight", "normalweight" or "given".
    pub ec_from: &'static str,
}

/// The prestress at the section of the greatest factored moment, for the
/// calculation sheet's stress and cracking-moment equations.
#[derive(Debug, Clone, Serialize)]
pub struct AtMuJson {
    /// Where, from the left bearing centre, ft.
    pub x_ft: f64,
    /// Effective prestress force there (after transfer length), kip.
    pub pe_kip: f64,
    /// Its eccentricity below the precast centroid, in.
    pub e_in: f64,
    /// Moment on the precast section alone (self-weight and topping), kip-ft.
    pub m_precast_kipft: f64,
    /// Precast area there (the net section over an opening), in².
    pub area_in2: f64,
    /// Precast bottom section modulus there, in³.
    pub sb_in3: f64,
    /// Composite bottom section modulus there (topped members), in³.
    pub sbc_in3: Option<f64>,
    /// Precast top section modulus there, in³.
    pub st_in3: f64,
    /// Composite section modulus at the precast top there (topped members), in³.
    pub stc_in3: Option<f64>,
}

/// The terms of the natural frequency f = (π/2)√(g Ec I / (w ℓ⁴)).
#[derive(Debug, Clone, Serialize)]
pub struct FrequencyTermsJson {
    /// Weight carried: self-weight, topping, superimposed dead load and 10 % of the live load, lb/ft.
    pub w_plf: f64,
    /// Moment of inertia (the composite section when topped), in⁴.
    pub i_in4: f64,
    /// Modulus of the precast concrete, psi.
    pub ec_psi: f64,
    /// Span, ft.
    pub span_ft: f64,
}

/// The stresses at release at one point, with the terms of
/// f = P/A ∓ P e/S ± Mg/S.
#[derive(Debug, Clone, Serialize)]
pub struct AtReleaseJson {
    /// Where, from the left bearing centre, ft.
    pub x_ft: f64,
    /// Prestress force there just after transfer, kip.
    pub po_kip: f64,
    /// Its eccentricity, in.
    pub e_in: f64,
    /// Self-weight moment at release, kip-ft.
    pub mg_kipft: f64,
    /// Area, in².
    pub area_in2: f64,
    /// Sb, in³.
    pub sb_in3: f64,
    /// St, in³.
    pub st_in3: f64,
    /// Top fibre, psi (compression positive).
    pub f_top_psi: f64,
    /// Bottom fibre, psi.
    pub f_bottom_psi: f64,
}

/// The shear strength at one point with the terms of ACI 318-19 Eqs.
/// 22.5.6.3.1a–c (Vci) and 22.5.6.3.2 (Vcw).
#[derive(Debug, Clone, Serialize)]
pub struct AtShearJson {
    /// Where, from the left bearing centre, ft.
    pub x_ft: f64,
    /// The governing combination there.
    pub combination: &'static str,
    /// λ.
    pub lambda: f64,
    /// √f′c used, psi.
    pub sqrt_fc_psi: f64,
    /// bw, in.
    pub bw_in: f64,
    /// dp, in.
    pub dp_in: f64,
    /// fpc, psi.
    pub fpc_psi: f64,
    /// Vp, kip.
    pub vp_kip: f64,
    /// Vcw, kip.
    pub vcw_kip: f64,
    /// fpe, psi.
    pub fpe_psi: f64,
    /// fd, psi.
    pub fd_psi: f64,
    /// Section modulus to the tension fibre, in³.
    pub s_in3: f64,
    /// Mcre (floored at 0), kip-ft.
    pub mcre_kipft: f64,
    /// Vd, kip.
    pub vd_kip: f64,
    /// Vi = Vu − Vd, kip.
    pub vi_kip: f64,
    /// Mmax = Mu − Md, kip-ft.
    pub mmax_kipft: f64,
    /// Vci by Eq. 22.5.6.3.1a, kip.
    pub vci_raw_kip: f64,
    /// Its lower bound 1.7λ√f′c bw dp, kip.
    pub vci_min_kip: f64,
    /// Vci, kip.
    pub vci_kip: f64,
    /// Vs counted, kip.
    pub vs_kip: f64,
    /// Vu, kip.
    pub vu_kip: f64,
    /// φVn, kip.
    pub phi_vn_kip: f64,
}

/// The camber multipliers and the deflections they scale, in.
#[derive(Debug, Clone, Serialize)]
pub struct CamberTermsJson {
    /// Multipliers (PCI Design Handbook, after Martin 1977; values from memory).
    pub multipliers: crate::camber::Multipliers,
    /// Deflection from the composite topping, in.
    pub topping_in: f64,
    /// The live-load deflection's terms, when the loads are uniform.
    pub live: Option<crate::camber::LiveTerms>,
    /// Deflection from the superimposed dead load, in.
    pub sdl_in: f64,
}

/// The terms of the loss estimate as put into its equations (Zia et al.
/// 1979, written in psi and in), for the calculation sheet.
#[derive(Debug, Clone, Serialize)]
pub struct LossTermsJson {
    /// Pi = fpj·Aps, kip.
    pub pi_kip: f64,
    /// Aps, in².
    pub aps_in2: f64,
    /// Gross area, in².
    pub area_in2: f64,
    /// Gross second moment, in⁴.
    pub ix_in4: f64,
    /// Strand eccentricity at the critical section, in.
    pub e_in: f64,
    /// Self-weight moment there, kip-ft.
    pub mg_kipft: f64,
    /// fcir, psi.
    pub fcir_psi: f64,
    /// fcds, psi.
    pub fcds_psi: f64,
    /// Eci, psi.
    pub eci_psi: f64,
    /// Ec, psi.
    pub ec_psi: f64,
    /// Kcr.
    pub kcr: f64,
    /// Volume-to-surface ratio, in.
    pub vs_in: f64,
    /// Relative humidity, %.
    pub rh_pct: f64,
    /// Kre, psi.
    pub kre_psi: f64,
    /// J.
    pub j: f64,
    /// C.
    pub c: f64,
}

/// The bay's inputs the checks read, as numbers.
#[derive(Debug, Clone, Serialize)]
pub struct InputsJson {
    /// Superimposed dead load, psf.
    pub sdl_psf: f64,
    /// Live load, psf.
    pub live_psf: f64,
    /// Roof live load, psf.
    pub roof_live_psf: f64,
    /// Snow load, psf.
    pub snow_psf: f64,
    /// Sustained share of the live load.
    pub sustained_live: f64,
    /// Bearing length, in.
    pub bearing_in: f64,
    /// Relative humidity, %.
    pub humidity_pct: f64,
    /// f′ci, psi.
    pub fci_psi: f64,
    /// Strand tensile strength fpu, ksi.
    pub fpu_ksi: f64,
    /// Strand modulus, ksi.
    pub eps_ksi: f64,
    /// Strand diameter, in.
    pub strand_diameter_in: f64,
    /// Strands in the pattern.
    pub strand_count: usize,
}

/// The JSON of `plankwise check`.
#[derive(Debug, Clone, Serialize)]
pub struct CheckJson {
    /// Section id.
    pub section: String,
    /// Pattern id.
    pub pattern: String,
    /// Span, ft.
    pub span_ft: f64,
    /// Member length, ft.
    pub member_length_ft: f64,
    /// Topping thickness, in (0 when none).
    pub topping_in: f64,
    /// The bay's inputs the checks read.
    pub inputs: InputsJson,
    /// The precast section's exact properties (bare).
    pub section_props: crate::section::Properties,
    /// Every check passes.
    pub viable: bool,
    /// Id of the check with the highest ratio.
    pub governing: String,
    /// Its ratio.
    pub governing_ratio: f64,
    /// Id of the first failing check in order of importance, if any.
    pub first_failure: Option<String>,
    /// Service class reached.
    pub service_class: String,
    /// Jacking stress, ksi.
    pub fpj_ksi: f64,
    /// Stress after transfer, ksi.
    pub fpo_ksi: f64,
    /// Effective stress after losses, ksi.
    pub fse_ksi: f64,
    /// Effective force, kip.
    pub pe_kip: f64,
    /// Elastic shortening, ksi.
    pub loss_es_ksi: f64,
    /// Creep, ksi.
    pub loss_cr_ksi: f64,
    /// Shrinkage, ksi.
    pub loss_sh_ksi: f64,
    /// Relaxation, ksi.
    pub loss_re_ksi: f64,
    /// Total loss, ksi.
    pub loss_total_ksi: f64,
    /// Loss method.
    pub loss_method: String,
    /// Transfer length (fse/3000)·db, in.
    pub transfer_length_in: f64,
    /// Greatest factored moment, kip-ft.
    pub mu_kipft: f64,
    /// φMn at that station, kip-ft.
    pub phi_mn_kipft: f64,
    /// Mn at that station (strain compatibility), kip-ft.
    pub mn_kipft: f64,
    /// Mcr at that station, kip-ft.
    pub mcr_kipft: f64,
    /// Factored shear at the governing shear station, kip.
    pub vu_kip: f64,
    /// φVn = φ(Vc + Vs) there, kip.
    pub phi_vn_kip: f64,
    /// Precast bottom fibre at service, at the greatest moment, psi.
    pub f_bottom_service_psi: f64,
    /// Precast top fibre at service, at the greatest moment, psi.
    pub f_top_service_psi: f64,
    /// Prestress camber at release (upward), in.
    pub camber_prestress_release_in: f64,
    /// Self-weight deflection at release (downward), in.
    pub defl_self_release_in: f64,
    /// Net camber at release (upward positive), in.
    pub camber_release_in: f64,
    /// Camber at erection (upward positive), in.
    pub camber_erection_in: f64,
    /// Final camber under permanent loads (upward positive), in.
    pub camber_final_in: f64,
    /// Final position with the full live load (upward positive), in.
    pub net_final_with_live_in: f64,
    /// Immediate live-load deflection (downward), in.
    pub defl_live_in: f64,
    /// Deflection after attachment of nonstructural elements (downward), in.
    pub defl_after_attach_in: f64,
    /// Camber with age (ACI 209R-92 creep, age-adjusted effective modulus):
    /// release, erection, topping placed and final, in, with the ages in days.
    pub aged_camber: crate::camber::AgedCamber,
    /// Fire rating reached, h (null when a criterion is not rated).
    pub fire_rating_h: Option<f64>,
    /// Rating by heat transmission, h.
    pub fire_rating_thickness_h: f64,
    /// Equivalent thickness (with a topping of the same aggregate), in.
    pub equiv_thickness_in: f64,
    /// Cover used for the fire rating, in.
    pub fire_cover_in: f64,
    /// The least cover of any one strand to a fire-exposed face, in.
    pub fire_least_strand_cover_in: f64,
    /// Whether the fire rating rests on tables held from memory.
    pub fire_tables_from_memory: bool,
    /// Rating by strand cover, h (null when not rated by plankwise's tables).
    pub fire_rating_cover_h: Option<f64>,
    /// What decided the rating: the tables read and the values found.
    pub fire_basis: String,
    /// Natural frequency, Hz.
    pub frequency_hz: f64,
    /// Service moment (total) at the section of greatest factored moment, kip-ft.
    pub m_service_total_kipft: f64,
    /// Strands at midspan: position and area.
    pub strands: Vec<StrandJson>,
    /// Precast concrete: f′c, Ec, fr (psi) and β1.
    pub concrete: ConcreteJson,
    /// The terms of the camber by multipliers (at midspan between the
    /// supports; none with an overhang, where the deflections are found on
    /// the in-place supports).
    pub camber_terms: Option<CamberTermsJson>,
    /// The loss estimate's terms (zero with a lump-sum total).
    pub loss_terms: LossTermsJson,
    /// The prestress at the section of the greatest factored moment.
    pub at_mu: AtMuJson,
    /// The terms of the natural frequency.
    pub frequency_terms: Option<FrequencyTermsJson>,
    /// The stresses at release where the release compression check finds
    /// its worst point, with their terms.
    pub at_release: Option<AtReleaseJson>,
    /// The shear strength where the shear check finds its worst point,
    /// with its terms.
    pub at_shear: Option<AtShearJson>,
    /// Sign convention.
    pub sign_convention: &'static str,
    /// The bay's placed loads and openings (US; an SI run converts them).
    pub items: Vec<String>,
    /// Each unit analysed, with the shares it takes.
    pub units: Vec<crate::checks::UnitReport>,
    /// What each opening does to the units.
    pub openings: Vec<String>,
    /// Every check.
    pub checks: Vec<CheckResult>,
    /// Stations.
    pub stations: Vec<StationJson>,
    /// Cautions.
    pub cautions: Vec<&'static str>,
}

/// Every load and opening of a case as "kind n: parts", in the system's units.
pub fn items_text(case: &DesignCase, sys: System) -> Vec<String> {
    crate::items::all(case)
        .into_iter()
        .map(|(k, i, v)| format!("{} {}: {}", k.key, i + 1, k.describe(&v, sys)))
        .collect()
}

/// The sign convention in the stress unit of the system.
pub fn sign_convention(sys: System) -> String {
    SIGN_CONVENTION.replace("(psi)", &format!("({})", display::unit("psi", sys)))
}

/// Build the JSON view.
pub fn to_json(cand: &Candidate, case: &DesignCase, ev: &Evaluation) -> CheckJson {
    let (section, pattern) = (cand.section.id.as_str(), cand.pattern.id.as_str());
    let h = &ev.history;
    let mid = ev.stations.iter().max_by(|a, b| a.mu_lbin.total_cmp(&b.mu_lbin)).expect("stations");
    let shear = ev.check("shear");
    CheckJson {
        section: section.to_string(),
        pattern: pattern.to_string(),
        span_ft: case.span.get() / 12.0,
        member_length_ft: ev.member_length_in / 12.0,
        topping_in: case.topping.as_ref().map_or(0.0, |t| t.thickness.get()),
        inputs: InputsJson {
            sdl_psf: case.sdl.in_unit("psf"),
            live_psf: case.live.in_unit("psf"),
            roof_live_psf: case.roof_live.in_unit("psf"),
            snow_psf: case.snow.in_unit("psf"),
            sustained_live: case.sustained_live,
            bearing_in: case.bearing.get(),
            humidity_pct: case.humidity,
            fci_psi: cand.mix.fci.get(),
            fpu_ksi: cand.pattern.strand.fpu.get() / 1000.0,
            eps_ksi: cand.pattern.strand.eps.get() / 1000.0,
            strand_diameter_in: cand.pattern.strand.diameter.get(),
            strand_count: cand.pattern.rows.iter().map(|r| r.x.len()).sum(),
        },
        section_props: cand.section.props.clone(),
        viable: ev.viable,
        governing: ev.governing().info.id.to_string(),
        governing_ratio: ev.governing().ratio,
        first_failure: ev.first_failure().map(|c| c.info.id.to_string()),
        service_class: ev.service_class.name().to_string(),
        fpj_ksi: h.fpj_psi / 1000.0,
        fpo_ksi: h.fpo_psi / 1000.0,
        fse_ksi: h.fse_psi / 1000.0,
        pe_kip: h.pe_lbf / 1000.0,
        loss_es_ksi: h.losses.es_psi / 1000.0,
        loss_cr_ksi: h.losses.cr_psi / 1000.0,
        loss_sh_ksi: h.losses.sh_psi / 1000.0,
        loss_re_ksi: h.losses.re_psi / 1000.0,
        loss_total_ksi: h.losses.total_psi / 1000.0,
        loss_method: if h.lump_sum {
            "lump sum (ES computed)".into()
        } else {
            "Zia et al. 1979".into()
        },
        transfer_length_in: ev.transfer_length_in,
        mu_kipft: kipft(mid.mu_lbin),
        phi_mn_kipft: kipft(mid.flexure.phi_mn_lbin),
        mn_kipft: kipft(mid.flexure.mn_lbin),
        mcr_kipft: kipft(mid.flexure.mcr_lbin),
        vu_kip: shear.map_or(0.0, |c| c.demand),
        phi_vn_kip: shear.map_or(0.0, |c| c.capacity),
        f_bottom_service_psi: mid.service.bottom_total_psi,
        f_top_service_psi: mid.service.top_total_psi,
        camber_prestress_release_in: ev.camber.prestress_release_in,
        defl_self_release_in: ev.camber.self_release_in,
        camber_release_in: ev.camber.camber_release_in,
        camber_erection_in: ev.camber.camber_erection_in,
        camber_final_in: ev.camber.camber_final_in,
        net_final_with_live_in: ev.camber.net_final_with_live_in,
        defl_live_in: ev.camber.defl_live_in,
        defl_after_attach_in: ev.camber.defl_after_attach_in,
        aged_camber: ev.aged,
        fire_rating_h: ev.fire.rating_h,
        fire_rating_thickness_h: ev.fire.rating_thickness_h,
        equiv_thickness_in: ev.fire.equiv_thickness_in,
        fire_cover_in: ev.fire.cover_in,
        fire_least_strand_cover_in: ev.fire.least_strand_cover_in,
        fire_tables_from_memory: ev.fire.from_memory,
        fire_rating_cover_h: ev.fire.rating_cover_h,
        fire_basis: ev.fire.note.clone(),
        frequency_hz: ev.frequency_hz,
        m_service_total_kipft: kipft(crate::case::service_moments(&mid.effects, case.sustained_live).1),
        strands: cand
            .pattern
            .rows
            .iter()
            .flat_map(|r| {
                r.x.iter().map(move |&x| StrandJson {
                    x_in: x,
                    y_in: r.height.get(),
                    area_in2: cand.pattern.strand.area.get(),
                })
            })
            .collect(),
        concrete: ConcreteJson {
            fc_psi: cand.mix.fc.get(),
            ec_psi: cand.mix.ec().get(),
            fr_psi: cand.mix.fr().get(),
            beta1: cand.mix.beta1(),
            lambda: cand.mix.aggregate.lambda(),
            wc_pcf: cand.mix.unit_weight.in_unit("pcf"),
            ec_from: match cand.mix.modulus {
                crate::material::Modulus::UnitWeight => "unit-weight",
                crate::material::Modulus::Normalweight => "normalweight",
                crate::material::Modulus::Given(_) => "given",
            },
        },
        at_shear: ev.shear_at.map(|(x, t, c, mu)| AtShearJson {
            x_ft: x / 12.0,
            combination: c.name(),
            lambda: t.lambda,
            sqrt_fc_psi: t.sqrt_fc_psi,
            bw_in: t.bw_in,
            dp_in: t.dp_in,
            fpc_psi: t.fpc_psi,
            vp_kip: t.vp_lbf / 1000.0,
            vcw_kip: t.vcw_lbf / 1000.0,
            fpe_psi: t.fpe_psi,
            fd_psi: t.fd_psi,
            s_in3: t.s_in3,
            mcre_kipft: kipft(t.mcre_lbin),
            vd_kip: t.vd_lbf / 1000.0,
            vi_kip: (c.vu_lbf - t.vd_lbf).max(0.0) / 1000.0,
            mmax_kipft: kipft(mu - t.md_lbin),
            vci_raw_kip: c.vci_raw_lbf / 1000.0,
            vci_min_kip: c.vci_min_lbf / 1000.0,
            vci_kip: c.vci_lbf / 1000.0,
            vs_kip: c.vs_lbf / 1000.0,
            vu_kip: c.vu_lbf / 1000.0,
            phi_vn_kip: c.phi_vn_lbf / 1000.0,
        }),
        at_release: ev.release_at.map(|t| AtReleaseJson {
            x_ft: t.x_in / 12.0,
            po_kip: t.p_lbf / 1000.0,
            e_in: t.e_in,
            mg_kipft: kipft(t.mg_lbin),
            area_in2: t.area_in2,
            sb_in3: t.sb_in3,
            st_in3: t.st_in3,
            f_top_psi: t.top_psi,
            f_bottom_psi: t.bottom_psi,
        }),
        camber_terms: (ev.camber.tip_left.is_none() && ev.camber.tip_right.is_none()).then_some(CamberTermsJson {
            multipliers: ev.camber.multipliers,
            topping_in: ev.camber.topping_in,
            sdl_in: ev.camber.sdl_in,
            live: ev.camber.live_terms,
        }),
        frequency_terms: ev.frequency_terms.map(|t| FrequencyTermsJson {
            w_plf: t.w_lbf_per_in * 12.0,
            i_in4: t.i_in4,
            ec_psi: t.ec_psi,
            span_ft: t.l_in / 12.0,
        }),
        at_mu: AtMuJson {
            x_ft: mid.x_in / 12.0,
            pe_kip: mid.prestress.pe / 1000.0,
            e_in: cand.section.props.yb_in - mid.prestress.y,
            m_precast_kipft: kipft(mid.effects.m_self + mid.effects.m_topping),
            area_in2: ev.mcr_at.map_or(cand.section.props.area_in2, |t| t.area_in2),
            sb_in3: ev.mcr_at.map_or(cand.section.props.sb_in3, |t| t.sb_in3),
            sbc_in3: ev.mcr_at.and_then(|t| t.sbc_in3),
            st_in3: ev.mcr_at.map_or(cand.section.props.st_in3, |t| t.st_in3),
            stc_in3: ev.mcr_at.and_then(|t| t.stc_in3),
        },
        loss_terms: {
            let (l, t) = (&h.losses, &h.losses.terms);
            LossTermsJson {
                pi_kip: t.pi_lbf / 1000.0,
                aps_in2: h.pj_lbf / h.fpj_psi.max(1e-9),
                area_in2: t.area_in2,
                ix_in4: t.inertia_in4,
                e_in: t.e_in,
                mg_kipft: t.mg_lbin / 12000.0,
                fcir_psi: l.fcir_psi,
                fcds_psi: l.fcds_psi,
                eci_psi: t.eci_psi,
                ec_psi: t.ec_psi,
                kcr: t.kcr,
                vs_in: t.vs_in,
                rh_pct: t.rh_pct,
                kre_psi: t.kre_psi,
                j: t.j,
                c: l.c_factor,
            }
        },
        sign_convention: SIGN_CONVENTION,
        items: items_text(case, System::Us),
        units: ev.units.clone(),
        openings: ev.openings.clone(),
        checks: ev.checks.clone(),
        stations: ev
            .stations
            .iter()
            .map(|s| StationJson {
                x_ft: s.x_in / 12.0,
                mu_kipft: kipft(s.mu_lbin),
                phi_mn_kipft: kipft(s.flexure.phi_mn_lbin),
                mcr_kipft: kipft(s.flexure.mcr_lbin),
                vu_kip: kip(s.vu_lbf),
                phi_vn_kip: s.shear.map(|v| kip(v.phi_vn_lbf())),
                f_top_release_psi: s.release_psi.0,
                f_bottom_release_psi: s.release_psi.1,
                f_top_service_psi: s.service.top_total_psi,
                f_bottom_service_psi: s.service.bottom_total_psi,
                f_topping_service_psi: s.service.topping_total_psi,
            })
            .collect(),
        cautions: super::CAUTIONS.to_vec(),
    }
}

/// Write the evaluation as a table, in the display system `sys`.
pub fn write_table(w: &mut impl Write, title: &str, case: &DesignCase, ev: &Evaluation, sys: System) -> io::Result<()> {
    let h = &ev.history;
    let l = &h.losses;
    let q = |v: f64, us: &'static str, places: usize| display::with_unit(v, us, places, sys);
    let n = |v: f64, us: &'static str, places: usize| display::num(v, us, places, sys);
    let signed = |v: f64| {
        let s = n(v, "in", 2);
        if v >= 0.0 { format!("+{s}") } else { s }
    };
    let ksi = display::unit("ksi", sys);
    let len_u = display::unit("in", sys);
    writeln!(w, "{title}")?;
    writeln!(
        w,
        "span {}, member length {} (span + {} bearing), {}",
        display::span(case.span.get(), sys),
        display::span(ev.member_length_in, sys),
        q(case.bearing.get(), "in", 1),
        match &case.topping {
            Some(t) => format!(
                "{} composite topping, unshored: topping weight on the bare member",
                q(t.thickness.get(), "in", 2)
            ),
            None => "no topping".into(),
        }
    )?;
    writeln!(
        w,
        "loads: SDL {}, L {} (sustained {:.0} %), Lr {}, S {}, {} line load(s); class allowed {}, RH {:.0} %",
        q(case.sdl.in_unit("psf"), "psf", 1),
        q(case.live.in_unit("psf"), "psf", 1),
        case.sustained_live * 100.0,
        q(case.roof_live.in_unit("psf"), "psf", 1),
        q(case.snow.in_unit("psf"), "psf", 1),
        case.line_loads.len(),
        case.class_allowed.name(),
        case.humidity
    )?;
    if case.has_overhang() {
        writeln!(
            w,
            "overhangs: left {}, right {} (bearing centre to tip); top bars {} Grade 60",
            display::span(case.overhang.0.get(), sys),
            display::span(case.overhang.1.get(), sys),
            q(case.top_bars.in_unit("in2"), "in²", 2)
        )?;
    }
    let shares = ev.units.first().map(|u| u.shares.as_slice()).unwrap_or(&[]);
    for line in items_text(case, sys) {
        let what = line.split(':').next().unwrap_or("");
        match shares.iter().find(|s| s.what() == what) {
            Some(s) => writeln!(w, "{line}\n    share: {}", display::localize(&s.how(), sys))?,
            None => writeln!(w, "{line}")?,
        }
    }
    for o in &ev.openings {
        writeln!(w, "{}", display::localize(o, sys))?;
    }
    if ev.units.len() > 1 || ev.units.iter().any(|u| u.unit != "the loaded unit") {
        writeln!(
            w,
            "units checked: {}; each check shows its worst",
            display::localize(&ev.units.iter().map(|u| u.unit.as_str()).collect::<Vec<_>>().join("; "), sys)
        )?;
    }
    writeln!(w)?;
    writeln!(
        w,
        "Prestress  fpj {} -> after transfer fpo {} -> effective fse {} (Pe {})",
        q(h.fpj_psi / 1000.0, "ksi", 1),
        q(h.fpo_psi / 1000.0, "ksi", 1),
        q(h.fse_psi / 1000.0, "ksi", 1),
        q(h.pe_lbf / 1000.0, "kip", 1)
    )?;
    let k = |v: f64| n(v / 1000.0, "ksi", 2);
    if h.lump_sum {
        writeln!(
            w,
            "Losses     ES {} {ksi}; total {} {ksi} given as a lump sum",
            k(l.es_psi),
            k(l.total_psi)
        )?;
    } else {
        writeln!(
            w,
            "Losses     ES {} + CR {} + SH {} + RE {} = {} {ksi} ({:.1} % of fpj), Zia et al. 1979{}",
            k(l.es_psi),
            k(l.cr_psi),
            k(l.sh_psi),
            k(l.re_psi),
            k(l.total_psi),
            100.0 * l.total_psi / h.fpj_psi,
            if l.c_clamped {
                "; fpi/fpu outside the C table, clamped"
            } else {
                ""
            }
        )?;
    }
    writeln!(
        w,
        "Transfer   {} = (fse/3000) db; service class reached: {}",
        q(ev.transfer_length_in, "in", 1),
        ev.service_class.name()
    )?;
    let c = &ev.camber;
    writeln!(
        w,
        "Camber     release {} {len_u} (prestress {}, self-weight {}); erection {} {len_u}; final {} {len_u}; with live {} {len_u}",
        signed(c.camber_release_in),
        signed(c.prestress_release_in),
        signed(-c.self_release_in),
        signed(c.camber_erection_in),
        signed(c.camber_final_in),
        signed(c.net_final_with_live_in)
    )?;
    writeln!(
        w,
        "           upward positive; Martin (1977) multipliers, PCI Design Handbook{}",
        if c.cracked {
            "; live deflection on the bilinear cracked stiffness"
        } else {
            ""
        }
    )?;
    let a = &ev.aged;
    writeln!(
        w,
        "With age   release {} {len_u}; erection at {:.0} d {} {len_u} (multipliers {}, {}); topping placed {} {len_u}; final {} {len_u} (multipliers {}, {})",
        signed(a.release_in),
        a.erection_age_days,
        signed(a.erection_in),
        signed(c.camber_erection_in),
        signed(c.camber_erection_in - a.erection_in) + " apart",
        signed(a.topping_placed_in),
        signed(a.final_in),
        signed(c.camber_final_in),
        signed(c.camber_final_in - a.final_in) + " apart"
    )?;
    writeln!(
        w,
        "           ACI 209R-92 creep (steam cured, released at {:.0} d, RH {:.0} %; φ {:.2} at erection, {:.2} final) by the age-adjusted effective modulus (χ 0.8, from memory); loss reached {:.1} % then {:.1} % of fpo",
        a.release_age_days,
        case.humidity,
        a.creep_erection,
        a.creep_final,
        100.0 * a.loss_erection,
        100.0 * a.loss_final
    )?;
    let f = &ev.fire;
    writeln!(
        w,
        "Fire       {} (heat transmission {} h, te {}; cover {}) — IBC 2021 722.2",
        f.rating_h.map_or("not rated by plankwise's tables".to_string(), |r| format!(
            "{} h reached",
            crate::checks::fire::fmt_h(r)
        )),
        crate::checks::fire::fmt_h(f.rating_thickness_h),
        q(f.equiv_thickness_in, "in", 2),
        q(f.cover_in, "in", 2)
    )?;
    writeln!(
        w,
        "Vibration  f = {:.2} Hz (dead + 10 % live); about 3–4 Hz is commonly sought for walking comfort",
        ev.frequency_hz
    )?;
    writeln!(w)?;
    let at = format!("at {}", display::unit("ft", sys));
    writeln!(
        w,
        "{:<40} {:>10} {:>10} {:>7} {:>6} {:<5} {:>7}",
        "check", "demand", "capacity", "unit", "ratio", "ok", at
    )?;
    for c in &ev.checks {
        let (demand, unit) = display::convert(c.demand, c.unit, sys);
        let (capacity, _) = display::convert(c.capacity, c.unit, sys);
        writeln!(
            w,
            "{:<40} {:>10.2} {:>10} {:>7} {:>6.3} {:<5} {:>7}",
            c.info.title,
            demand,
            if capacity.is_finite() {
                format!("{capacity:.2}")
            } else {
                "none".into()
            },
            unit,
            c.ratio,
            if c.pass { "yes" } else { "NO" },
            c.station_ft.map_or("-".into(), |x| n(x, "ft", 2))
        )?;
        writeln!(w, "    {} — {}", c.info.clause, display::localize(&c.note, sys))?;
    }
    writeln!(w)?;
    let g = ev.governing();
    match ev.first_failure() {
        None => writeln!(w, "Result     VIABLE; governing: {} (ratio {:.3})", g.info.title, g.ratio)?,
        Some(f) => writeln!(
            w,
            "Result     NOT VIABLE; first failure: {} (ratio {:.3}, {})",
            f.info.title, f.ratio, f.info.clause
        )?,
    }
    writeln!(
        w,
        "Note       {}; moments {}, forces {}",
        sign_convention(sys),
        display::unit("kip-ft", sys),
        display::unit("kip", sys)
    )?;
    writeln!(w)?;
    super::write_cautions(w)
}

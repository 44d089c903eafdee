//! The calculation sheet of one entry in one bay: every number the checks
//! use, in the order an engineer checks them — inputs, section properties,
//! prestress and losses, stresses at release and in service, strength,
//! shear, camber and deflection, fire — each with the key it has in
//! `plankwise check --json` in brackets, so the engineer of record can find
//! any number in the data and a test can prove the two agree.
//!
//! A printer over [`super::check::CheckJson`]: it computes nothing.

use std::io::{self, Write};

use super::check::CheckJson;
use crate::units::{System, display};

struct Sheet<'w, W: Write> {
    w: &'w mut W,
    sys: System,
    md: bool,
}

impl<W: Write> Sheet<'_, W> {
    fn head(&mut self, title: &str) -> io::Result<()> {
        if self.md {
            writeln!(self.w, "\n## {title}\n")
        } else {
            writeln!(self.w, "\n{title}\n{}", "-".repeat(title.chars().count()))
        }
    }

    /// One number: its label, value in the display units and its JSON key.
    fn num(&mut self, label: &str, v: f64, us: &'static str, places: usize, key: &str) -> io::Result<()> {
        let shown = if us.is_empty() {
            format!("{v:.places$}")
        } else {
            display::with_unit(v, us, places, self.sys)
        };
        let key = display::key(key, self.sys);
        if self.md {
            writeln!(self.w, "- {label}: **{shown}** `[{key}]`")
        } else {
            writeln!(self.w, "  {label:<44} {shown:>18}   [{key}]")
        }
    }

    /// The line under a number: its equation with the values put into it
    /// (in the psi-inch form the clause writes it) and the clause.
    fn eq(&mut self, with_values: &str, clause: &str) -> io::Result<()> {
        if self.md {
            writeln!(self.w, "  - {with_values} — {clause}")
        } else {
            writeln!(self.w, "      {with_values} — {clause}")
        }
    }

    fn text(&mut self, line: &str) -> io::Result<()> {
        let line = display::localize(line, self.sys);
        if self.md {
            writeln!(self.w, "{line}  ")
        } else {
            writeln!(self.w, "  {line}")
        }
    }
}

/// A value put into an equation, as written: `places` decimals, trailing
/// zeros kept so the reader can see the precision carried.
fn g(v: f64, places: usize) -> String {
    format!("{v:.places$}")
}

/// Write the sheet (`md`: Markdown, else text) in the display system.
pub fn write(w: &mut impl Write, title: &str, j: &CheckJson, sys: System, md: bool) -> io::Result<()> {
    let mut s = Sheet { w, sys, md };
    if md {
        writeln!(s.w, "# Calculation sheet — {title}")?;
    } else {
        writeln!(s.w, "CALCULATION SHEET — {title}")?;
        writeln!(s.w, "{}", "=".repeat(78))?;
    }
    s.text(&format!(
        "ACI 318-19; entry {} / {}; numbers as `plankwise check --json` gives them, its key in brackets; under a computed number its equation with the values put into it, in the psi-inch form the clause writes it{}",
        j.section,
        j.pattern,
        if sys == System::Si { " (the result in SI)" } else { "" }
    ))?;

    s.head("1. Inputs")?;
    s.num("span, bearing centre to bearing centre", j.span_ft, "ft", 3, "span_ft")?;
    s.num("member length (span + bearing)", j.member_length_ft, "ft", 3, "member_length_ft")?;
    s.num("bearing length", j.inputs.bearing_in, "in", 2, "inputs.bearing_in")?;
    s.num("composite topping", j.topping_in, "in", 2, "topping_in")?;
    s.num("superimposed dead load SDL", j.inputs.sdl_psf, "psf", 1, "inputs.sdl_psf")?;
    s.num("live load L", j.inputs.live_psf, "psf", 1, "inputs.live_psf")?;
    s.num("roof live load Lr", j.inputs.roof_live_psf, "psf", 1, "inputs.roof_live_psf")?;
    s.num("snow load S", j.inputs.snow_psf, "psf", 1, "inputs.snow_psf")?;
    s.num("sustained share of L", j.inputs.sustained_live, "", 2, "inputs.sustained_live")?;
    s.num("relative humidity, %", j.inputs.humidity_pct, "", 0, "inputs.humidity_pct")?;
    for item in &j.items {
        s.text(item)?;
    }
    s.num("f′c", j.concrete.fc_psi, "psi", 0, "concrete.fc_psi")?;
    s.num("f′ci", j.inputs.fci_psi, "psi", 0, "inputs.fci_psi")?;
    let c = &j.concrete;
    s.num("Ec", c.ec_psi, "psi", 0, "concrete.ec_psi")?;
    match c.ec_from {
        "unit-weight" => s.eq(
            &format!("Ec = 33 wc^1.5 √f′c = 33 × {}^1.5 × √{} psi", g(c.wc_pcf, 1), g(c.fc_psi, 0)),
            "ACI 318-19 19.2.2.1(a)",
        )?,
        "normalweight" => s.eq(
            &format!("Ec = 57000 √f′c = 57000 × √{} psi", g(c.fc_psi, 0)),
            "ACI 318-19 19.2.2.1(b)",
        )?,
        _ => s.eq("Ec given by the producer (the catalog's mix)", "ACI 318-19 19.2.2.1")?,
    }
    s.num("modulus of rupture fr", c.fr_psi, "psi", 0, "concrete.fr_psi")?;
    s.eq(
        &format!("fr = 7.5 λ √f′c = 7.5 × {} × √{} psi", g(c.lambda, 2), g(c.fc_psi, 0)),
        "ACI 318-19 19.2.3.1; λ Table 19.2.4.2",
    )?;
    s.num("β1", c.beta1, "", 3, "concrete.beta1")?;
    s.eq(
        &format!(
            "β1 = 0.85 − 0.05 (f′c − 4000)/1000 = 0.85 − 0.05 × ({} − 4000)/1000, within 0.65 to 0.85",
            g(c.fc_psi, 0)
        ),
        "ACI 318-19 Table 22.2.2.4.3",
    )?;
    s.num("strand diameter", j.inputs.strand_diameter_in, "in", 3, "inputs.strand_diameter_in")?;
    s.num("strands", j.inputs.strand_count as f64, "", 0, "inputs.strand_count")?;
    s.num("fpu", j.inputs.fpu_ksi, "ksi", 0, "inputs.fpu_ksi")?;
    s.num("Eps", j.inputs.eps_ksi, "ksi", 0, "inputs.eps_ksi")?;

    s.head("2. Section (exact, bare precast)")?;
    let p = &j.section_props;
    s.num("net area A", p.area_in2, "in²", 1, "section_props.area_in2")?;
    s.num("centroid above soffit yb", p.yb_in, "in", 3, "section_props.yb_in")?;
    s.num("centroid to top yt", p.yt_in, "in", 3, "section_props.yt_in")?;
    s.num("second moment I", p.ix_in4, "in⁴", 0, "section_props.ix_in4")?;
    s.num("Sb", p.sb_in3, "in³", 1, "section_props.sb_in3")?;
    s.eq(
        &format!("Sb = I/yb = {} / {} in³", g(p.ix_in4, 0), g(p.yb_in, 3)),
        "section modulus, bottom fibre",
    )?;
    s.num("St", p.st_in3, "in³", 1, "section_props.st_in3")?;
    s.eq(
        &format!("St = I/yt = {} / {} in³", g(p.ix_in4, 0), g(p.yt_in, 3)),
        "section modulus, top fibre",
    )?;
    s.num(
        "least summed web width bw",
        p.web_width_min_in,
        "in",
        2,
        "section_props.web_width_min_in",
    )?;
    s.num("volume-to-surface ratio", p.vs_ratio_in, "in", 3, "section_props.vs_ratio_in")?;

    s.head("3. Prestress and losses (Zia et al. 1979)")?;
    let t = &j.loss_terms;
    let zia = t.pi_kip > 0.0 && !j.loss_method.to_ascii_lowercase().contains("lump");
    s.num("jacking stress fpj", j.fpj_ksi, "ksi", 2, "fpj_ksi")?;
    s.eq(
        &format!(
            "fpj = {} fpu = {} × {} ksi",
            g(j.fpj_ksi / j.inputs.fpu_ksi, 3),
            g(j.fpj_ksi / j.inputs.fpu_ksi, 3),
            g(j.inputs.fpu_ksi, 0)
        ),
        "the pattern's jacking ratio; limit ACI 318-19 Table 20.3.2.5.1",
    )?;
    if zia {
        s.num("force at jacking Pi", t.pi_kip, "kip", 2, "loss_terms.pi_kip")?;
        s.eq(
            &format!("Pi = fpj Aps = {} ksi × {} in²", g(j.fpj_ksi, 2), g(t.aps_in2, 3)),
            "Zia et al. 1979",
        )?;
        s.num(
            "concrete stress at the strand, transfer fcir",
            t.fcir_psi,
            "psi",
            1,
            "loss_terms.fcir_psi",
        )?;
        s.eq(
            &format!(
                "fcir = 0.9 (Pi/A + Pi e²/I) − Mg e/I = 0.9 ({} / {} + {} × {}² / {}) − {} × {} / {} psi (lbf, in)",
                g(t.pi_kip * 1000.0, 0),
                g(t.area_in2, 1),
                g(t.pi_kip * 1000.0, 0),
                g(t.e_in, 3),
                g(t.ix_in4, 0),
                g(t.mg_kipft * 12000.0, 0),
                g(t.e_in, 3),
                g(t.ix_in4, 0)
            ),
            "Zia et al. 1979 (Kcir 0.9, pretensioned)",
        )?;
        s.num("... from superimposed dead load fcds", t.fcds_psi, "psi", 1, "loss_terms.fcds_psi")?;
    }
    s.num("elastic shortening ES", j.loss_es_ksi, "ksi", 2, "loss_es_ksi")?;
    if zia {
        s.eq(
            &format!(
                "ES = Kes Eps fcir/Eci = 1.0 × {} × {} / {} psi",
                g(j.inputs.eps_ksi * 1000.0, 0),
                g(t.fcir_psi, 1),
                g(t.eci_psi, 0)
            ),
            "Zia et al. 1979",
        )?;
    }
    s.num("after transfer fpo", j.fpo_ksi, "ksi", 2, "fpo_ksi")?;
    s.eq(
        &format!("fpo = fpj − ES = {} − {} ksi", g(j.fpj_ksi, 2), g(j.loss_es_ksi, 2)),
        "strand stress after transfer",
    )?;
    s.num("creep CR", j.loss_cr_ksi, "ksi", 2, "loss_cr_ksi")?;
    if zia {
        s.eq(
            &format!(
                "CR = Kcr (Eps/Ec)(fcir − fcds) = {} × ({} / {}) × ({} − {}) psi",
                g(t.kcr, 1),
                g(j.inputs.eps_ksi * 1000.0, 0),
                g(t.ec_psi, 0),
                g(t.fcir_psi, 1),
                g(t.fcds_psi, 1)
            ),
            "Zia et al. 1979 (Kcr 2.0; 1.6 lightweight)",
        )?;
    }
    s.num("shrinkage SH", j.loss_sh_ksi, "ksi", 2, "loss_sh_ksi")?;
    if zia {
        s.eq(
            &format!(
                "SH = 8.2×10⁻⁶ Ksh Eps (1 − 0.06 V/S)(100 − RH) = 8.2×10⁻⁶ × 1.0 × {} × (1 − 0.06 × {}) × (100 − {}) psi",
                g(j.inputs.eps_ksi * 1000.0, 0),
                g(t.vs_in, 3),
                g(t.rh_pct, 0)
            ),
            "Zia et al. 1979 (Ksh 1.0, pretensioned; V/S in in)",
        )?;
    }
    s.num("relaxation RE", j.loss_re_ksi, "ksi", 2, "loss_re_ksi")?;
    if zia {
        s.eq(
            &format!(
                "RE = [Kre − J (SH + CR + ES)] C = [{} − {} × ({} + {} + {})] × {} psi",
                g(t.kre_psi, 0),
                g(t.j, 3),
                g(j.loss_sh_ksi * 1000.0, 0),
                g(j.loss_cr_ksi * 1000.0, 0),
                g(j.loss_es_ksi * 1000.0, 0),
                g(t.c, 3)
            ),
            "Zia et al. 1979 (Kre, J by strand class; C from fpi/fpu, table from memory)",
        )?;
    }
    s.num("total loss", j.loss_total_ksi, "ksi", 2, "loss_total_ksi")?;
    if zia {
        s.eq(
            &format!(
                "total = ES + CR + SH + RE = {} + {} + {} + {} ksi",
                g(j.loss_es_ksi, 2),
                g(j.loss_cr_ksi, 2),
                g(j.loss_sh_ksi, 2),
                g(j.loss_re_ksi, 2)
            ),
            "Zia et al. 1979",
        )?;
    }
    s.num("effective fse", j.fse_ksi, "ksi", 2, "fse_ksi")?;
    s.eq(
        &format!("fse = fpj − total = {} − {} ksi", g(j.fpj_ksi, 2), g(j.loss_total_ksi, 2)),
        "effective prestress",
    )?;
    s.num("effective force Pe", j.pe_kip, "kip", 2, "pe_kip")?;
    s.eq(
        &format!(
            "Pe = fse Aps = {} ksi × {} in²",
            g(j.fse_ksi, 2),
            g(t.aps_in2.max(j.pe_kip / j.fse_ksi.max(1e-9)), 3)
        ),
        "effective force",
    )?;
    s.num("transfer length ℓtr", j.transfer_length_in, "in", 2, "transfer_length_in")?;
    s.eq(
        &format!(
            "ℓtr = (fse/3000) db = ({} / 3000) × {} in",
            g(j.fse_ksi * 1000.0, 0),
            g(j.inputs.strand_diameter_in, 3)
        ),
        "ACI 318-19 25.4.8.1 (first term); 21.2.3",
    )?;
    s.text(&format!("loss method: {}", j.loss_method))?;

    if let Some(r) = &j.at_release {
        s.head("4. Stresses at release, where compression is worst")?;
        s.num("where, from the left bearing centre", r.x_ft, "ft", 3, "at_release.x_ft")?;
        s.num("force just after transfer there Po", r.po_kip, "kip", 2, "at_release.po_kip")?;
        s.num("its eccentricity e", r.e_in, "in", 3, "at_release.e_in")?;
        s.num(
            "self-weight moment, member on its ends Mg",
            r.mg_kipft,
            "kip-ft",
            2,
            "at_release.mg_kipft",
        )?;
        let (po, e, mg) = (g(r.po_kip * 1000.0, 0), g(r.e_in, 3), g(r.mg_kipft * 12000.0, 0));
        s.num("bottom fibre", r.f_bottom_psi, "psi", 0, "at_release.f_bottom_psi")?;
        s.eq(
            &format!(
                "fb = Po/A + Po e/Sb − Mg/Sb = {po} / {} + {po} × {e} / {} − {mg} / {} psi (compression +)",
                g(r.area_in2, 1),
                g(r.sb_in3, 1),
                g(r.sb_in3, 1)
            ),
            "ACI 318-19 24.5.3 (gross section, 24.5.1.2)",
        )?;
        s.num("top fibre", r.f_top_psi, "psi", 0, "at_release.f_top_psi")?;
        s.eq(
            &format!(
                "ft = Po/A − Po e/St + Mg/St = {po} / {} − {po} × {e} / {} + {mg} / {} psi (compression +)",
                g(r.area_in2, 1),
                g(r.st_in3, 1),
                g(r.st_in3, 1)
            ),
            "ACI 318-19 24.5.3 (gross section, 24.5.1.2)",
        )?;
        s.text("limits: 0.60 f′ci, 0.70 f′ci within ℓtr of an end (the release checks of section 8)")?;
    }
    s.head("5. At the section of the greatest factored moment")?;
    s.num("factored moment Mu", j.mu_kipft, "kip-ft", 2, "mu_kipft")?;
    s.num("nominal strength Mn (strain compatibility)", j.mn_kipft, "kip-ft", 2, "mn_kipft")?;
    s.num("design strength φMn", j.phi_mn_kipft, "kip-ft", 2, "phi_mn_kipft")?;
    s.eq(
        &format!(
            "φMn = φ Mn = {} × {} kip-ft",
            g(j.phi_mn_kipft / j.mn_kipft.max(1e-9), 3),
            g(j.mn_kipft, 2)
        ),
        "ACI 318-19 21.2.2 (φ by εt), 21.2.3 (within ℓd)",
    )?;
    let m = &j.at_mu;
    s.num("where, from the left bearing centre", m.x_ft, "ft", 3, "at_mu.x_ft")?;
    s.num("effective prestress force there Pe", m.pe_kip, "kip", 2, "at_mu.pe_kip")?;
    s.num("its eccentricity e", m.e_in, "in", 3, "at_mu.e_in")?;
    let (pe, e) = (g(m.pe_kip * 1000.0, 0), g(m.e_in, 3));
    s.num("cracking moment Mcr", j.mcr_kipft, "kip-ft", 2, "mcr_kipft")?;
    // the precast section there (the net section over an opening)
    let (a, sb) = (g(m.area_in2, 1), g(m.sb_in3, 1));
    let fr = g(j.concrete.fr_psi, 1);
    if let Some(sbc) = m.sbc_in3 {
        s.num("composite bottom section modulus Sbc", sbc, "in³", 1, "at_mu.sbc_in3")?;
        s.num(
            "moment on the precast alone Mnc",
            m.m_precast_kipft,
            "kip-ft",
            2,
            "at_mu.m_precast_kipft",
        )?;
        let mnc = g(m.m_precast_kipft * 12000.0, 0);
        s.eq(
            &format!(
                "Mcr = Sbc (fr + Pe/A + Pe e/Sb − Mnc/Sb) + Mnc = {} × ({fr} + {pe} / {a} + {pe} × {e} / {sb} − {mnc} / {sb}) + {mnc} lbf·in",
                g(sbc, 1)
            ),
            "ACI 318-19 24.2.3.5 (unshored topping); fr 19.2.3.1",
        )?;
    } else {
        s.eq(
            &format!("Mcr = Sb (fr + Pe/A + Pe e/Sb) = {sb} × ({fr} + {pe} / {a} + {pe} × {e} / {sb}) lbf·in"),
            "ACI 318-19 24.2.3.5; fr 19.2.3.1",
        )?;
    }
    s.num(
        "service moment (total)",
        j.m_service_total_kipft,
        "kip-ft",
        2,
        "m_service_total_kipft",
    )?;
    let ms = g(j.m_service_total_kipft * 12000.0, 0);
    let st = g(m.st_in3, 1);
    s.num("bottom fibre at service", j.f_bottom_service_psi, "psi", 0, "f_bottom_service_psi")?;
    match m.sbc_in3 {
        Some(sbc) => {
            let mnc = g(m.m_precast_kipft * 12000.0, 0);
            s.eq(
                &format!(
                    "fb = Pe/A + Pe e/Sb − Mnc/Sb − (M − Mnc)/Sbc = {pe} / {a} + {pe} × {e} / {sb} − {mnc} / {sb} − ({ms} − {mnc}) / {} psi (compression +)",
                    g(sbc, 1)
                ),
                "ACI 318-19 24.5.2 (service stresses, gross sections; unshored topping)",
            )?;
        }
        None => s.eq(
            &format!("fb = Pe/A + Pe e/Sb − M/Sb = {pe} / {a} + {pe} × {e} / {sb} − {ms} / {sb} psi (compression +)"),
            "ACI 318-19 24.5.2 (service stresses, gross section)",
        )?,
    }
    s.num("top fibre at service", j.f_top_service_psi, "psi", 0, "f_top_service_psi")?;
    match m.stc_in3 {
        Some(stc) => {
            let mnc = g(m.m_precast_kipft * 12000.0, 0);
            s.eq(
                &format!(
                    "ft = Pe/A − Pe e/St + Mnc/St + (M − Mnc)/Stc = {pe} / {a} − {pe} × {e} / {st} + {mnc} / {st} + ({ms} − {mnc}) / {} psi (compression +)",
                    g(stc, 1)
                ),
                "ACI 318-19 24.5.2 (service stresses, gross sections; unshored topping)",
            )?;
        }
        None => s.eq(
            &format!("ft = Pe/A − Pe e/St + M/St = {pe} / {a} − {pe} × {e} / {st} + {ms} / {st} psi (compression +)"),
            "ACI 318-19 24.5.2 (service stresses, gross section)",
        )?,
    }
    s.num("factored shear Vu at the shear station", j.vu_kip, "kip", 2, "vu_kip")?;
    s.num("φVn there", j.phi_vn_kip, "kip", 2, "phi_vn_kip")?;
    if let Some(v) = &j.at_shear {
        s.head("5a. Shear where Vu/φVn is greatest")?;
        s.num("where, from the left bearing centre", v.x_ft, "ft", 3, "at_shear.x_ft")?;
        s.text(&format!("combination {} (at_shear.combination)", v.combination))?;
        s.num("web width bw", v.bw_in, "in", 2, "at_shear.bw_in")?;
        s.num("depth dp (at least 0.8h)", v.dp_in, "in", 2, "at_shear.dp_in")?;
        s.num("prestress stress at the centroid fpc", v.fpc_psi, "psi", 1, "at_shear.fpc_psi")?;
        s.num("web-shear strength Vcw", v.vcw_kip, "kip", 2, "at_shear.vcw_kip")?;
        let (l, r, bw, dp) = (g(v.lambda, 2), g(v.sqrt_fc_psi, 2), g(v.bw_in, 2), g(v.dp_in, 2));
        s.eq(
            &format!(
                "Vcw = (3.5λ√f′c + 0.3 fpc) bw dp + Vp = (3.5 × {l} × {r} + 0.3 × {}) × {bw} × {dp} + {} lbf",
                g(v.fpc_psi, 1),
                g(v.vp_kip * 1000.0, 0)
            ),
            "ACI 318-19 22.5.6.3.2",
        )?;
        s.num("cracking moment for shear Mcre", v.mcre_kipft, "kip-ft", 2, "at_shear.mcre_kipft")?;
        s.eq(
            &format!(
                "Mcre = S (6λ√f′c + fpe − fd) = {} × (6 × {l} × {r} + {} − {}) lbf·in, not below 0",
                g(v.s_in3, 1),
                g(v.fpe_psi, 1),
                g(v.fd_psi, 1)
            ),
            "ACI 318-19 22.5.6.3.1c",
        )?;
        s.num("Vci by Eq. 22.5.6.3.1a", v.vci_raw_kip, "kip", 2, "at_shear.vci_raw_kip")?;
        if v.mmax_kipft > 0.0 {
            s.eq(
                &format!(
                    "Vci = 0.6λ√f′c bw dp + Vd + Vi Mcre/Mmax = 0.6 × {l} × {r} × {bw} × {dp} + {} + {} × {} / {} lbf",
                    g(v.vd_kip * 1000.0, 0),
                    g(v.vi_kip * 1000.0, 0),
                    g(v.mcre_kipft * 12000.0, 0),
                    g(v.mmax_kipft * 12000.0, 0)
                ),
                "ACI 318-19 22.5.6.3.1a (Vi = Vu − Vd, Mmax = Mu − Md of the combination)",
            )?;
        } else {
            s.eq(
                "the moment does not sag here: Vci taken at 1.7λ√f′c bw (0.8h) (common practice, no source)",
                "ACI 318-19 22.5.6.3.1",
            )?;
        }
        s.num("lower bound 1.7λ√f′c bw dp", v.vci_min_kip, "kip", 2, "at_shear.vci_min_kip")?;
        s.num("Vci", v.vci_kip, "kip", 2, "at_shear.vci_kip")?;
        s.num("stem reinforcement counted Vs", v.vs_kip, "kip", 2, "at_shear.vs_kip")?;
        s.num("φVn", v.phi_vn_kip, "kip", 2, "at_shear.phi_vn_kip")?;
        s.eq(
            &format!(
                "φVn = φ (min(Vci, Vcw) + Vs) = {} × (min({}, {}) + {}) kip",
                g(crate::checks::shear::PHI, 2),
                g(v.vci_kip, 2),
                g(v.vcw_kip, 2),
                g(v.vs_kip, 2)
            ),
            "ACI 318-19 22.5.1.1, 22.5.6.3; φ Table 21.2.1",
        )?;
        s.num("Vu", v.vu_kip, "kip", 2, "at_shear.vu_kip")?;
    }

    s.head("6. Camber and deflection (upward positive)")?;
    s.num(
        "prestress camber at release",
        j.camber_prestress_release_in,
        "in",
        3,
        "camber_prestress_release_in",
    )?;
    s.num(
        "self-weight deflection at release",
        j.defl_self_release_in,
        "in",
        3,
        "defl_self_release_in",
    )?;
    s.num("camber at release", j.camber_release_in, "in", 3, "camber_release_in")?;
    s.eq(
        &format!(
            "Δrel = Δp − Δsw = {} − {} in (curvature of Po·e/(Eci I) and of the self-weight integrated along the member on its ends)",
            g(j.camber_prestress_release_in, 3),
            g(j.defl_self_release_in, 3)
        ),
        "PCI Design Handbook method; Eci ACI 318-19 19.2.2.1",
    )?;
    s.num(
        "camber at erection (multipliers)",
        j.camber_erection_in,
        "in",
        3,
        "camber_erection_in",
    )?;
    let ct = j.camber_terms.as_ref();
    if let Some(t) = ct {
        let k = &t.multipliers;
        s.eq(
            &format!(
                "Δe = {} Δp − {} Δsw = {} × {} − {} × {} in",
                g(k.erection_prestress, 2),
                g(k.erection_self, 2),
                g(k.erection_prestress, 2),
                g(j.camber_prestress_release_in, 3),
                g(k.erection_self, 2),
                g(j.defl_self_release_in, 3)
            ),
            "PCI Design Handbook multipliers after Martin 1977 (values from memory)",
        )?;
    }
    s.num("final camber (multipliers)", j.camber_final_in, "in", 3, "camber_final_in")?;
    if let Some(t) = ct {
        let k = &t.multipliers;
        s.num("deflection from topping Δtop", t.topping_in, "in", 3, "camber_terms.topping_in")?;
        s.num("deflection from SDL Δsdl", t.sdl_in, "in", 3, "camber_terms.sdl_in")?;
        s.eq(
            &format!(
                "Δf = {} Δp − {} Δsw − {} Δtop − {} Δsdl = {} × {} − {} × {} − {} × {} − {} × {} in",
                g(k.final_prestress, 2),
                g(k.final_self, 2),
                g(k.final_topping, 2),
                g(k.final_sdl, 2),
                g(k.final_prestress, 2),
                g(j.camber_prestress_release_in, 3),
                g(k.final_self, 2),
                g(j.defl_self_release_in, 3),
                g(k.final_topping, 2),
                g(t.topping_in, 3),
                g(k.final_sdl, 2),
                g(t.sdl_in, 3)
            ),
            "PCI Design Handbook multipliers after Martin 1977 (values from memory)",
        )?;
    }
    let a = &j.aged_camber;
    s.num("erection age, days", a.erection_age_days, "", 0, "aged_camber.erection_age_days")?;
    s.num(
        "camber at erection (ACI 209R-92)",
        a.erection_in,
        "in",
        3,
        "aged_camber.erection_in",
    )?;
    if ct.is_some() {
        s.num(
            "ultimate creep coefficient νu",
            a.creep_ultimate,
            "",
            3,
            "aged_camber.creep_ultimate",
        )?;
        s.num(
            "creep coefficient at erection φ",
            a.creep_erection,
            "",
            3,
            "aged_camber.creep_erection",
        )?;
        let t = a.erection_age_days - a.release_age_days;
        s.eq(
            &format!(
                "φ = (t − ti)^0.6 / (10 + (t − ti)^0.6) νu = {}^0.6 / (10 + {}^0.6) × {}",
                g(t, 0),
                g(t, 0),
                g(a.creep_ultimate, 3)
            ),
            "ACI 209R-92 creep-time ratio, Eq. 2-8 (equation number from memory); steam cured, released at 1 d (common practice, no source)",
        )?;
        s.num(
            "loss reached at erection η (share of Po)",
            a.loss_erection,
            "",
            4,
            "aged_camber.loss_erection",
        )?;
        s.eq(
            &format!(
                "Δe = Δp (1 + φ) − η Δp (1 + χφ) − Δsw (1 + φ) = {} × (1 + {}) − {} × {} × (1 + {} × {}) − {} × (1 + {}) in",
                g(j.camber_prestress_release_in, 3),
                g(a.creep_erection, 3),
                g(a.loss_erection, 4),
                g(j.camber_prestress_release_in, 3),
                g(crate::camber::AGING_CHI, 1),
                g(a.creep_erection, 3),
                g(j.defl_self_release_in, 3),
                g(a.creep_erection, 3)
            ),
            &format!(
                "age-adjusted effective modulus, χ = {} (from memory, high); ACI 209R-92 creep",
                crate::camber::AGING_CHI
            ),
        )?;
    }
    s.num("final camber (ACI 209R-92)", a.final_in, "in", 3, "aged_camber.final_in")?;
    if let Some(t) = ct {
        s.num("final age, days", a.final_age_days, "", 0, "aged_camber.final_age_days")?;
        s.num("creep coefficient, final φf", a.creep_final, "", 3, "aged_camber.creep_final")?;
        let topped = t.topping_in != 0.0;
        if topped {
            s.num("bare over composite inertia r", a.inertia_ratio, "", 4, "aged_camber.inertia_ratio")?;
        }
        let phi_f = if topped {
            a.creep_erection + (a.creep_final - a.creep_erection) * a.inertia_ratio
        } else {
            a.creep_final
        };
        s.num("final loss η (share of Po)", a.loss_final, "", 4, "aged_camber.loss_final")?;
        s.num(
            "Ec at erection over the 28-day Ec k",
            a.ec_ratio_erection,
            "",
            4,
            "aged_camber.ec_ratio_erection",
        )?;
        s.num(
            "νu of loads placed at erection",
            a.creep_ultimate_erection,
            "",
            3,
            "aged_camber.creep_ultimate_erection",
        )?;
        s.num(
            "their creep coefficient to the final age φℓ",
            a.creep_after_erection,
            "",
            3,
            "aged_camber.creep_after_erection",
        )?;
        let tl = a.final_age_days - a.erection_age_days;
        s.eq(
            &format!(
                "φℓ = (tf − te)^0.6 / (10 + (tf − te)^0.6) νu(te) = {}^0.6 / (10 + {}^0.6) × {}",
                g(tl, 0),
                g(tl, 0),
                g(a.creep_ultimate_erection, 3)
            ),
            "ACI 209R-92 creep-time ratio (equation number from memory)",
        )?;
        let (dp, dsw) = (g(j.camber_prestress_release_in, 3), g(j.defl_self_release_in, 3));
        let (pf, chi) = (g(phi_f, 4), g(crate::camber::AGING_CHI, 1));
        let (k, eta) = (g(a.ec_ratio_erection, 4), g(a.loss_final, 4));
        let (top, sdl, r, pl) = (
            g(t.topping_in, 3),
            g(t.sdl_in, 3),
            g(a.inertia_ratio, 4),
            g(a.creep_after_erection, 3),
        );
        let creep = if topped {
            format!(
                "φ′ = φe + (φf − φe) r = {} + ({} − {}) × {r} = {pf}; ",
                g(a.creep_erection, 3),
                g(a.creep_final, 3),
                g(a.creep_erection, 3)
            )
        } else {
            format!("φ′ = φf = {pf}; ")
        };
        s.eq(
            &format!(
                "{creep}Δf = Δp (1 + φ′) − η Δp (1 + χφ′) − Δsw (1 + φ′) − Δtop/k (1 + φℓ r) − Δsdl/k (1 + φℓ) = {dp} × (1 + {pf}) − {eta} × {dp} × (1 + {chi} × {pf}) − {dsw} × (1 + {pf}) − {top} / {k} × (1 + {pl} × {r}) − {sdl} / {k} × (1 + {pl}) in"
            ),
            "age-adjusted effective modulus (χ from memory, high); ACI 209R-92 creep; topping and finishes placed at erection (common practice, no source)",
        )?;
    }
    s.num("immediate live-load deflection", j.defl_live_in, "in", 3, "defl_live_in")?;
    if let Some(t) = ct.and_then(|t| t.live.as_ref()) {
        s.eq(
            &format!(
                "Δℓ = (Ig/Ie) 5wℓ⁴/(384 Ec Ig) = {} × 5 × {} × {}⁴ / (384 × {} × {}) in (w in lbf/in, ℓ in in)",
                g(t.ig_over_ie, 3),
                g(t.w_plf / 12.0, 3),
                g(t.l_in, 1),
                g(t.ec_psi, 0),
                g(t.ig_in4, 0)
            ),
            if t.ig_over_ie > 1.0 {
                "ACI 318-19 24.2.3.5 (bilinear, class T or C); 24.2.2"
            } else {
                "ACI 318-19 24.2.3 (gross section, class U); 24.2.2"
            },
        )?;
    }
    s.num(
        "deflection after attachment",
        j.defl_after_attach_in,
        "in",
        3,
        "defl_after_attach_in",
    )?;
    s.num("natural frequency, Hz", j.frequency_hz, "", 2, "frequency_hz")?;
    if let Some(t) = &j.frequency_terms {
        s.num("weight carried w (dead + 10 % of live)", t.w_plf, "plf", 1, "frequency_terms.w_plf")?;
        s.num("moment of inertia I", t.i_in4, "in⁴", 0, "frequency_terms.i_in4")?;
        s.eq(
            &format!(
                "f = (π/2) √(g Ec I / (w ℓ⁴)) = (π/2) × √({} × {} × {} / ({} × {}⁴)) Hz, w in lb/in, ℓ in in",
                g(crate::units::G_IN_PER_S2, 2),
                g(t.ec_psi, 0),
                g(t.i_in4, 0),
                g(t.w_plf / 12.0, 3),
                g(t.span_ft * 12.0, 1)
            ),
            "first mode of a uniform simply supported beam (structural dynamics texts); w and I common practice, no source",
        )?;
    }

    s.head("7. Fire (IBC 2021 722.2)")?;
    if let Some(h) = j.fire_rating_h {
        s.num("rating reached, h", h, "", 1, "fire_rating_h")?;
    } else {
        s.text("rating: not rated by plankwise's tables [fire_rating_h]")?;
    }
    s.num(
        "rating by heat transmission, h",
        j.fire_rating_thickness_h,
        "",
        1,
        "fire_rating_thickness_h",
    )?;
    s.num("equivalent thickness te", j.equiv_thickness_in, "in", 2, "equiv_thickness_in")?;
    s.num("cover used for the rating", j.fire_cover_in, "in", 2, "fire_cover_in")?;
    match j.fire_rating_cover_h {
        Some(h) => s.num("rating by strand cover, h", h, "", 1, "fire_rating_cover_h")?,
        None => s.text("rating by strand cover: not rated by plankwise's tables (fire_rating_cover_h)")?,
    }
    if !j.fire_basis.is_empty() {
        s.eq(
            &format!("rating = the lesser of the two: {}", j.fire_basis),
            "IBC 2021 722.2.2.1 (te), 722.2.3 (cover); ACI 216.1",
        )?;
    }

    s.head("8. Every check (demand against capacity)")?;
    for c in &j.checks {
        let (d, u) = display::convert(c.demand, c.unit, sys);
        let (cap, _) = display::convert(c.capacity, c.unit, sys);
        if md {
            writeln!(
                s.w,
                "- **{}** ({}): {d:.2} / {cap:.2} {u}, ratio {:.3}, {} `[checks.{}]`  \n  {}",
                c.info.title,
                c.info.clause,
                c.ratio,
                if c.pass { "passes" } else { "FAILS" },
                c.info.id,
                display::localize(&c.note, sys)
            )?;
        } else {
            writeln!(
                s.w,
                "  {:<44} {d:>9.2} / {cap:>9.2} {u:<6} ratio {:.3} {}   [checks.{}]",
                c.info.title,
                c.ratio,
                if c.pass { "ok" } else { "FAILS" },
                c.info.id
            )?;
            writeln!(s.w, "      {} — {}", c.info.clause, display::localize(&c.note, sys))?;
        }
    }
    s.head("Result")?;
    s.text(&format!(
        "{}; governing {} (ratio {:.3})",
        if j.viable { "VIABLE" } else { "NOT VIABLE" },
        j.governing,
        j.governing_ratio
    ))?;
    s.text(&super::check::sign_convention(sys))?;
    if !md {
        writeln!(s.w)?;
    }
    for c in super::CAUTIONS {
        s.text(&format!("! {c}"))?;
    }
    Ok(())
}

/// The sheet as a PDF: the text sheet set on pages with the running head,
/// the cautions and page numbers, section titles as headings.
pub fn pdf(title: &str, j: &CheckJson, sys: System) -> Result<Vec<u8>, String> {
    use super::pdf::{Block, Doc, Paper};
    let mut buf = Vec::new();
    write(&mut buf, title, j, sys, false).map_err(|e| e.to_string())?;
    let text = String::from_utf8_lossy(&buf);
    let mut blocks = Vec::new();
    let mut lines: Vec<String> = Vec::new();
    let mut after_heading = false;
    for l in text.lines() {
        // the text's underline of a title: the heading is bold instead
        if after_heading && !l.is_empty() && l.chars().all(|c| c == '-' || c == '=') {
            after_heading = false;
            continue;
        }
        after_heading = false;
        if l.starts_with("CALCULATION SHEET") {
            blocks.push(Block::Heading(l.to_string()));
            after_heading = true;
            continue;
        }
        // a numbered section title ("3. Losses …") starts a heading
        let heading = l.chars().next().is_some_and(|c| c.is_ascii_digit()) && l.contains(". ");
        if heading {
            blocks.push(Block::Lines(std::mem::take(&mut lines)));
            blocks.push(Block::Heading(l.to_string()));
            after_heading = true;
        } else {
            lines.push(l.to_string());
        }
    }
    blocks.push(Block::Lines(lines));
    blocks.push(Block::Signatures(vec!["Prepared by".into(), "Checked by".into()]));
    super::pdf::render(&Doc {
        title: "plankwise — calculation sheet (preliminary)".into(),
        head_right: title.to_string(),
        paper: Paper::of(sys),
        blocks,
    })
}
